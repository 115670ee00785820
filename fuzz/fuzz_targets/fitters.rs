//! Every fitter and the model choice on arbitrary point sets (NaN, infinities, zeros,
//! duplicates, huge and tiny values): a fit or a refusal, never a panic, never a NaN shown.
#![no_main]
use libfuzzer_sys::fuzz_target;
use rheoside::rheology::{FitOptions, ModelKind, Point, Weighting, choose, fit};

#[path = "bytes.rs"]
mod bytes;
use bytes::{Bytes, assert_finite};

fuzz_target!(|data: &[u8]| {
    let mut b = Bytes(data);
    let weighting = match b.byte() % 3 {
        0 => Weighting::Unweighted,
        1 => Weighting::Relative,
        _ => Weighting::Log,
    };
    let mut points = Vec::new();
    while !b.is_empty() && points.len() < 24 {
        points.push(Point::new(b.sized(), b.sized()));
    }
    let opts = FitOptions {
        weighting,
        ..FitOptions::default()
    };
    for kind in ModelKind::ALL {
        if let Ok(f) = fit(kind, &points, &opts) {
            for e in &f.estimates {
                assert_finite("estimate", e.value);
            }
            assert_finite("rmse", f.rmse_pa);
        }
    }
    let _ = choose(&points, &opts);
});
