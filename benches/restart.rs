//! Restart answer speed: the gel fit on six rested-gel readings, and the whole restart
//! answer on the demo's paste line (now and at the coldest, each with the safe stop's band).
//! Run with `cargo bench --bench restart`. Readings are invented.

use divan::black_box;
use rheoside::line::restart::{GelFitOptions, GelReading, fit_gel};
use rheoside::session::restart::{self, GelSource};

fn main() {
    divan::main();
}

/// τ = 520 − 400·e^(−t/7200) Pa with a fixed ±2 % pattern, at six rest times.
fn readings() -> Vec<GelReading> {
    let scatter = [0.8, -1.5, 1.9, -0.6, -1.2, 1.1];
    [10.0, 600.0, 1800.0, 3600.0, 7200.0, 14_400.0]
        .iter()
        .zip(scatter)
        .map(|(&t, s)| GelReading {
            rest_s: t,
            stress_pa: (520.0 - 400.0 * (-t / 7200.0f64).exp()) * (1.0 + 0.01 * s),
        })
        .collect()
}

#[divan::bench]
fn gel_fit_6(bencher: divan::Bencher) {
    let rows = readings();
    let opts = GelFitOptions::default();
    bencher.bench(|| fit_gel(black_box(&rows), black_box(&opts)));
}

#[divan::bench]
fn restart_answer_with_band(bencher: divan::Bencher) {
    let site = rheoside::site::demo().expect("the demo loads");
    let rows = readings();
    bencher.bench(|| {
        let input = restart::from_site(
            black_box(&site),
            ("L-2", "P-2", "filler-paste"),
            GelSource::Readings(rows.clone(), None),
            Some(62.0 * 3600.0),
        )
        .expect("demo input");
        restart::analyse(input)
    });
}
