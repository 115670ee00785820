//! Model choice: lowest AICc, then the simpler nested model while the extra parameter's 95 % CI
//! includes the value that turns it off (τ0 = 0, n = 1). The step-down rule is common practice,
//! no source; the intervals it reads are checked against scipy in tests/rheology.rs, and each
//! test below also confirms the deciding interval from scipy's own values (fit_refs.json).

use rheoside::rheology::{FitOptions, ModelKind, Point, Weighting, choose};
use serde_json::Value;

fn refs() -> Value {
    serde_json::from_str(include_str!("reference/fit_refs.json")).expect("fit_refs.json parses")
}

fn points(refs: &Value, dataset: &str) -> Vec<Point> {
    let d = &refs["datasets"][dataset];
    let xs = d["shear_rate"].as_array().unwrap();
    let ys = d["shear_stress"].as_array().unwrap();
    xs.iter()
        .zip(ys)
        .map(|(x, y)| Point::new(x.as_f64().unwrap(), y.as_f64().unwrap()))
        .collect()
}

/// scipy's 95 % CI of one parameter for one unweighted case.
fn scipy_ci(refs: &Value, dataset: &str, model: &str, param: &str) -> (f64, f64) {
    let case = refs["cases"]
        .as_array()
        .unwrap()
        .iter()
        .find(|c| c["dataset"] == dataset && c["model"] == model && c["weighting"] == "unweighted")
        .unwrap();
    let ci = &case["ci95"][param];
    (ci[0].as_f64().unwrap(), ci[1].as_f64().unwrap())
}

/// The reason the rule gives, worded by the presentation layer in SI.
fn why(c: &rheoside::rheology::Choice) -> String {
    rheoside::present::reason::explain(c, rheoside::present::Style::SI)
}

#[test]
fn newtonian_data_picks_newtonian() {
    let refs = refs();
    for weighting in [Weighting::Unweighted, Weighting::Relative] {
        let c = choose(&points(&refs, "s1-syrup"), &FitOptions { weighting }).unwrap();
        assert_eq!(c.best.model.kind(), ModelKind::Newtonian, "{}", why(&c));
        assert!(
            why(&c).starts_with("Newtonian: lowest AICc ("),
            "{}",
            why(&c)
        );
    }
}

#[test]
fn clear_yield_stress_picks_herschel_bulkley() {
    let refs = refs();
    let (lo, _) = scipy_ci(&refs, "px2-paste", "herschel-bulkley", "tau0");
    assert!(lo > 0.0, "scipy: τ0 CI clear of zero");
    let c = choose(&points(&refs, "px2-paste"), &FitOptions::default()).unwrap();
    assert_eq!(c.best.model.kind(), ModelKind::HerschelBulkley);
    assert_eq!(c.lowest_aicc, None);
    assert_eq!(
        why(&c),
        "Herschel–Bulkley: lowest AICc (25.0 vs 53.3 for power law); yield stress 91.7 Pa, \
         95 % interval 80.7 to 103 Pa, clearly above zero; n 0.398, 95 % interval 0.371 to \
         0.425, clearly below 1."
    );
    assert_eq!(c.candidates.len(), 5);
    assert!(c.candidates.iter().all(|k| k.outcome.is_ok()));
}

#[test]
fn power_law_data_picks_power_law_although_hb_fits_it() {
    let refs = refs();
    let (lo, hi) = scipy_ci(&refs, "p9-dispersion", "herschel-bulkley", "tau0");
    assert!(lo < 0.0 && hi > 0.0, "scipy: HB τ0 CI includes zero");
    let c = choose(&points(&refs, "p9-dispersion"), &FitOptions::default()).unwrap();
    assert_eq!(c.best.model.kind(), ModelKind::PowerLaw);
    assert_eq!(c.lowest_aicc, Some(ModelKind::HerschelBulkley));
    assert_eq!(
        why(&c),
        "Power law: Herschel–Bulkley had the lowest AICc (-7.9 vs -7.4 for power law), but the \
         Herschel–Bulkley yield stress (95 % interval -0.0444 to 1.82 Pa) includes zero, so the \
         simpler power law model is used."
    );
}

#[test]
fn yield_stress_at_its_bound_loses_to_the_power_law() {
    let refs = refs();
    let c = choose(&points(&refs, "c7-coating"), &FitOptions::default()).unwrap();
    assert_eq!(c.best.model.kind(), ModelKind::PowerLaw);
    let hb = c
        .candidates
        .iter()
        .find(|k| k.kind == ModelKind::HerschelBulkley)
        .unwrap();
    let hb = hb.outcome.as_ref().unwrap();
    assert!(
        hb.estimates[0].at_bound,
        "scipy also puts τ0 < 0 here (fit_refs.json)"
    );
    assert!(
        why(&c).starts_with("Power law: lowest AICc (-4.4 vs 0.4 for Herschel–Bulkley); n 0.547")
    );
}

#[test]
fn hb_with_n_near_one_steps_down_to_bingham() {
    let refs = refs();
    let (lo, hi) = scipy_ci(&refs, "t3b-slurry", "herschel-bulkley", "n");
    assert!(lo < 1.0 && hi > 1.0, "scipy: HB n CI includes 1");
    let c = choose(&points(&refs, "t3b-slurry"), &FitOptions::default()).unwrap();
    assert_eq!(c.best.model.kind(), ModelKind::Bingham);
    assert_eq!(c.lowest_aicc, Some(ModelKind::HerschelBulkley));
    assert!(
        why(&c).ends_with("but the Herschel–Bulkley n (95 % interval 0.997 to 1.072) includes 1, so the simpler Bingham model is used."),
        "{}",
        why(&c)
    );
}

// Source for the count: AICc needs m − k − 1 > 0, so Herschel–Bulkley (k = 3) needs 5 readings.
#[test]
fn candidates_that_cannot_be_compared_are_listed_with_the_reason() {
    let four: Vec<Point> = [(10.0, 20.0), (50.0, 31.0), (200.0, 52.0), (800.0, 98.0)]
        .iter()
        .map(|&(x, y)| Point::new(x, y))
        .collect();
    let c = choose(&four, &FitOptions::default()).unwrap();
    let hb = c
        .candidates
        .iter()
        .find(|k| k.kind == ModelKind::HerschelBulkley)
        .unwrap();
    assert_eq!(
        hb.outcome.as_ref().unwrap_err().to_string(),
        "the Herschel–Bulkley model needs at least 5 readings to be compared by AICc \
         (readings − parameters − 1 must be above zero); got 4"
    );
    assert!(
        why(&c).ends_with(
            " Not compared: Herschel–Bulkley (needs at least 5 readings for AICc, got 4)."
        ),
        "{}",
        why(&c)
    );
    assert_eq!(c.candidates.len(), 5);
}
