//! The `fit` CSV reader, then the flow-curve analysis on whatever it accepts: never a panic,
//! and every number of an accepted curve finite.
#![no_main]
use libfuzzer_sys::fuzz_target;
use rheoside::cli::fit_csv::Readings;
use rheoside::instrument::Geometry;
use rheoside::session::{FlowCurveInput, FlowCurveOptions, analyse};

fuzz_target!(|data: &[u8]| {
    let Ok(text) = std::str::from_utf8(data) else {
        return;
    };
    let Ok(csv) = rheoside::cli::fit_csv::parse(text) else {
        return;
    };
    let geometry = Geometry::from_name("standard-six-speed").expect("built-in geometry");
    let input = match &csv.readings {
        Readings::Dial(readings) => FlowCurveInput::Dial {
            geometry: &geometry,
            readings,
        },
        Readings::Direct(points) => FlowCurveInput::Direct { points },
    };
    if let Ok(curve) = analyse(input, &FlowCurveOptions::default()) {
        for e in &curve.fit.estimates {
            assert!(e.value.is_finite(), "{e:?}");
        }
        assert!(curve.fit.rmse_pa.is_finite());
    }
});
