//! One logarithmic axis: its span (in log10 units, fitted to the data) and where its
//! labelled ticks go. Values ≤ 0 have no place on a log axis and are left out.

/// An axis from 10^lo to 10^hi.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LogRange {
    pub lo: f64,
    pub hi: f64,
}

/// Margin added at each end, as a fraction of the data's span (so end points are not on
/// the frame), and the least span an axis gets, in decades.
const PAD_FRACTION: f64 = 0.04;
const MIN_SPAN_DECADES: f64 = 0.3;

impl LogRange {
    /// The span of the positive, finite values with a small margin.
    pub fn covering(values: impl Iterator<Item = f64>) -> Option<LogRange> {
        let logs: Vec<f64> = values
            .filter(|v| *v > 0.0 && v.is_finite())
            .map(f64::log10)
            .collect();
        let min = logs.iter().copied().reduce(f64::min)?;
        let max = logs.iter().copied().reduce(f64::max)?;
        let mid = (min + max) / 2.0;
        let half = ((max - min) * (0.5 + PAD_FRACTION)).max(MIN_SPAN_DECADES / 2.0);
        Some(LogRange {
            lo: mid - half,
            hi: mid + half,
        })
    }

    /// Position of `v` along the axis, 0..=1; `None` if off the axis or not positive.
    pub fn fraction(self, v: f64) -> Option<f64> {
        if !(v > 0.0 && v.is_finite()) || self.hi <= self.lo {
            return None;
        }
        let f = (v.log10() - self.lo) / (self.hi - self.lo);
        (0.0..=1.0).contains(&f).then_some(f)
    }

    /// Labelled values: whole decades when two or more fall inside, else the 1–2–5 steps,
    /// else the two ends.
    pub fn ticks(self) -> Vec<f64> {
        let decades: Vec<f64> = (self.lo.ceil() as i32..=self.hi.floor() as i32)
            .map(|e| 10f64.powi(e))
            .collect();
        if decades.len() >= 2 {
            return decades;
        }
        let steps: Vec<f64> = (self.lo.floor() as i32..=self.hi.ceil() as i32)
            .flat_map(|e| [1.0, 2.0, 5.0].map(|m| m * 10f64.powi(e)))
            .filter(|v| self.fraction(*v).is_some())
            .collect();
        if steps.len() >= 2 {
            return steps;
        }
        vec![10f64.powf(self.lo), 10f64.powf(self.hi)]
    }
}

/// A tick value as plain text: "0.02", "0.5", "20", "5000", "2e4".
pub fn tick_label(v: f64) -> String {
    if !(v > 0.0 && v.is_finite()) {
        return String::new();
    }
    if !(1e-3..1e4).contains(&v) {
        return format!("{v:.0e}");
    }
    let is_step = {
        let m = v / 10f64.powi(v.log10().floor() as i32);
        [1.0, 2.0, 5.0].iter().any(|s| (m - s).abs() < 1e-9)
    };
    if is_step {
        let decimals = (-v.log10().floor()).max(0.0) as usize;
        format!("{v:.decimals$}")
    } else {
        crate::units::significant(v)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_axis_spans_the_data_with_a_margin() {
        let r = LogRange::covering([10.0, 1000.0, 0.0, -3.0].into_iter());
        let r = r.unwrap_or(LogRange { lo: 0.0, hi: 0.0 });
        // log10 10 = 1 and log10 1000 = 3; 4 % of the 2-decade span added at each end.
        assert!(
            (r.lo - 0.92).abs() < 1e-12 && (r.hi - 3.08).abs() < 1e-12,
            "{r:?}"
        );
        assert_eq!(LogRange::covering([0.0].into_iter()), None);
        let one = LogRange::covering([10.0].into_iter()).unwrap_or(r);
        assert!((one.hi - one.lo - MIN_SPAN_DECADES).abs() < 1e-12);
    }

    #[test]
    fn ticks_are_decades_or_one_two_five_steps() {
        let wide = LogRange { lo: 0.6, hi: 3.1 };
        assert_eq!(wide.ticks(), [10.0, 100.0, 1000.0]);
        // 7 to 60 Pa holds only the decade 10: label 10, 20, 50.
        let narrow = LogRange {
            lo: 7f64.log10(),
            hi: 60f64.log10(),
        };
        let labels: Vec<String> = narrow.ticks().into_iter().map(tick_label).collect();
        assert_eq!(labels, ["10", "20", "50"]);
    }

    #[test]
    fn labels_read_as_plain_numbers() {
        let labels: Vec<String> = [0.02, 0.5, 1.0, 20.0, 5000.0, 2e4, 7.3]
            .into_iter()
            .map(tick_label)
            .collect();
        assert_eq!(labels, ["0.02", "0.5", "1", "20", "5000", "2e4", "7.30"]);
    }
}
