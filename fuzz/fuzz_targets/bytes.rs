//! Numbers drawn from the fuzzer's bytes: raw f64 bit patterns (so NaN, infinities, zeros,
//! subnormals and huge values all occur), or small choices.

pub struct Bytes<'a>(pub &'a [u8]);

impl Bytes<'_> {
    pub fn f64(&mut self) -> f64 {
        let mut b = [0u8; 8];
        let n = self.0.len().min(8);
        b[..n].copy_from_slice(&self.0[..n]);
        self.0 = &self.0[n..];
        f64::from_le_bytes(b)
    }

    /// A plant-sized positive number more often than not: a byte picks a decade.
    pub fn sized(&mut self) -> f64 {
        match self.byte() {
            0..=31 => self.f64(),
            b => 10f64.powi(i32::from(b % 24) - 12) * (1.0 + f64::from(self.byte()) / 64.0),
        }
    }

    pub fn byte(&mut self) -> u8 {
        let Some((&b, rest)) = self.0.split_first() else {
            return 0;
        };
        self.0 = rest;
        b
    }

    #[allow(dead_code)] // used by some targets only
    pub fn is_empty(&self) -> bool {
        self.0.is_empty()
    }
}

/// Every number a result carries must be finite (or the result refused).
pub fn assert_finite(what: &str, x: f64) {
    assert!(x.is_finite(), "{what} is {x}");
}
