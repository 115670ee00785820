//! Fit speed: one Herschel–Bulkley fit and one full model choice on 12 readings.
//! Run with `cargo bench --bench fit`. Readings are invented (an HB-like paste with ±1 % scatter).

use divan::black_box;
use rheoside::rheology::{FitOptions, ModelKind, Point, choose, fit};

fn main() {
    divan::main();
}

/// 12 rates over 5–1000 1/s; τ = 20 + 8·γ̇^0.4 with a fixed ±1 % pattern.
fn readings() -> Vec<Point> {
    let scatter = [
        0.6, -0.9, 0.3, 1.0, -0.4, -0.8, 0.7, 0.1, -0.6, 0.9, -0.2, -0.5,
    ];
    (0..12)
        .map(|i| {
            let rate = 5.0 * 200.0_f64.powf(i as f64 / 11.0);
            let stress = (20.0 + 8.0 * rate.powf(0.4)) * (1.0 + 0.01 * scatter[i]);
            Point::new(rate, stress)
        })
        .collect()
}

#[divan::bench]
fn herschel_bulkley_fit_12(bencher: divan::Bencher) {
    let points = readings();
    let opts = FitOptions::default();
    bencher.bench(|| {
        fit(
            ModelKind::HerschelBulkley,
            black_box(&points),
            black_box(&opts),
        )
    });
}

#[divan::bench]
fn choose_12(bencher: divan::Bencher) {
    let points = readings();
    let opts = FitOptions::default();
    bencher.bench(|| choose(black_box(&points), black_box(&opts)));
}

/// The Student t quantile behind every interval (one per fit).
#[divan::bench]
fn student_t_975(bencher: divan::Bencher) {
    bencher.bench(|| rheoside::rheology::stats::t975(black_box(9)));
}
