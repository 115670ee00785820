//! Where a line answer's flow curve comes from (session::rheology_source): flags, a journal's
//! latest fitted set, or the site's nominal constants, and the Arrhenius shift to the line's
//! temperature, checked by hand from K(T) = K_ref·exp[(Ea/R)(1/T − 1/T_ref)] (Steffe 1996,
//! *Rheological Methods in Food Process Engineering*, §1.10).

use chrono::{DateTime, Duration, FixedOffset, Utc};
use rheoside::journal::*;
use rheoside::rheology::{Model, ParamName};
use rheoside::session::rheology_source::{Origin, Shift, SourceError, SourceRequest, resolve};
use std::path::{Path, PathBuf};

fn demo() -> rheoside::site::Site {
    rheoside::site::demo().expect("demo")
}

fn rel(a: f64, b: f64) -> f64 {
    (a - b).abs() / b.abs()
}

#[test]
fn flags_are_taken_at_the_line_temperature() {
    let req = SourceRequest {
        flags: Some(Model::PowerLaw { k: 10.0, n: 0.3 }),
        product: Some("chilli-sauce".into()),
        temperature_k: Some(300.0),
        ..Default::default()
    };
    let r = resolve(&demo(), &req).unwrap();
    assert_eq!(r.shift, Shift::NotNeeded);
    assert_eq!(r.model, r.measured);
    assert_eq!(r.origin, Origin::Flags);
}

#[test]
fn site_nominal_is_shifted_to_the_line_temperature() {
    // Demo chilli sauce: nominal K = 15 Pa·sⁿ at 25 °C, Ea = 30 kJ/mol. At 15 °C, by hand:
    // (30000/8.314462618)·(1/288.15 − 1/298.15) = 3608.171·1.163 983×10⁻⁴ = 0.419 985;
    // exp(0.419 985) = 1.521 94, so K = 15·1.521 94 = 22.829; n stays 0.38.
    let req = SourceRequest {
        product: Some("chilli-sauce".into()),
        temperature_k: Some(288.15),
        ..Default::default()
    };
    let r = resolve(&demo(), &req).unwrap();
    assert!(matches!(r.origin, Origin::SiteNominal { .. }));
    assert!(rel(r.shift.factor(), 1.521_94) < 1e-5, "{:?}", r.shift);
    let Model::PowerLaw { k, n } = r.model else {
        panic!("{:?}", r.model)
    };
    assert!(rel(k, 22.829) < 1e-4 && n == 0.38, "{k} {n}");
    assert!(
        r.describe().contains("K shifted from 25.0 °C to 15.0 °C"),
        "{}",
        r.describe()
    );
}

#[test]
fn without_activation_energy_nothing_is_shifted_and_it_says_so() {
    // The demo chalk slurry has no activation energy.
    let req = SourceRequest {
        product: Some("chalk-slurry".into()),
        temperature_k: Some(303.15),
        ..Default::default()
    };
    let r = resolve(&demo(), &req).unwrap();
    assert!(matches!(r.shift, Shift::NoActivationEnergy { .. }));
    assert_eq!(
        r.model,
        Model::Bingham {
            tau0: 35.0,
            mu_p: 0.25
        }
    );
    assert!(
        r.describe().contains("no activation energy"),
        "{}",
        r.describe()
    );
}

#[test]
fn refusals_say_what_is_accepted() {
    let site = demo();
    let both = SourceRequest {
        flags: Some(Model::Newtonian { mu: 1.0 }),
        journal: Some("x.jsonl".into()),
        ..Default::default()
    };
    assert!(matches!(
        resolve(&site, &both),
        Err(SourceError::FlagsAndJournal)
    ));
    let msg = resolve(&site, &SourceRequest::default())
        .unwrap_err()
        .to_string();
    assert!(
        msg.contains("--tau0 --k --n") && msg.contains("--journal"),
        "{msg}"
    );
    let unknown = SourceRequest {
        product: Some("ketchup".into()),
        ..Default::default()
    };
    let msg = resolve(&site, &unknown).unwrap_err().to_string();
    assert!(
        msg.contains("chilli-sauce, filler-paste, chalk-slurry"),
        "{msg}"
    );
}

/// A journal with one chilli-sauce set at 30 °C on the standard viscometer
/// (dial = 6.966·rpm^0.4, a power-law-like sauce; invented readings).
pub(crate) fn sauce_journal(dir: &Path) -> PathBuf {
    let new = NewSession {
        log_dir: dir.to_path_buf(),
        site_id: "marrowdale-u4".into(),
        site_source: "bundled demo site (invented plant)".into(),
        operator: "T. Oduya".into(),
    };
    let start = Stamp {
        utc: "2026-03-10T05:00:00Z".parse::<DateTime<Utc>>().unwrap(),
        offset: FixedOffset::east_opt(0).unwrap(),
    };
    let clock = StepClock::new(start, Duration::seconds(60));
    let mut w = JournalWriter::create(&new, Box::new(clock)).unwrap();
    let rows = [600.0, 300.0, 200.0, 100.0, 6.0, 3.0]
        .iter()
        .map(|&rpm: &f64| {
            let dial = (6.966 * rpm.powf(0.4) * 10.0).round() / 10.0;
            DialRow {
                rpm_raw: format!("{rpm}"),
                rpm,
                dial_raw: format!("{dial}"),
                dial,
            }
        })
        .collect();
    let set = Payload::ViscometerSet {
        viscometer: "VIS-A".into(),
        product: "chilli-sauce".into(),
        temperature_raw: Some("30 C".into()),
        temperature_k: Some(303.15),
        rows,
    };
    w.append(Some("VIS-A"), set).unwrap();
    w.end_session().unwrap();
    w.path().unwrap().to_path_buf()
}

#[test]
fn journal_gives_the_latest_fitted_set_shifted() {
    let dir = tempfile::tempdir().unwrap();
    let path = sauce_journal(dir.path());
    let req = SourceRequest {
        product: Some("chilli-sauce".into()),
        journal: Some(path),
        temperature_k: Some(298.15),
        ..Default::default()
    };
    let r = resolve(&demo(), &req).unwrap();
    assert!(
        matches!(r.origin, Origin::Journal { seq: 2, .. }),
        "{:?}",
        r.origin
    );
    let fit = r.fit.as_ref().expect("the fit with its intervals");
    assert!(fit.covariance.is_some());
    assert_eq!(r.measured_at_k, Some(303.15));
    // 30 °C → 25 °C at 30 kJ/mol, by hand: 3608.171·(1/298.15 − 1/303.15)
    // = 3608.171·5.531 94×10⁻⁵ = 0.199 602; exp(0.199 602) = 1.220 92.
    assert!(rel(r.shift.factor(), 1.220_92) < 1e-5, "{:?}", r.shift);
    let p = rheoside::session::temperature::viscosity_parameter(r.model.kind());
    assert!(
        rel(
            r.model.param(p).unwrap(),
            r.measured.param(p).unwrap() * 1.220_92
        ) < 1e-5
    );
    assert_eq!(r.model.param(ParamName::N), r.measured.param(ParamName::N));
    // Another product has no set in it.
    let other = SourceRequest {
        product: Some("filler-paste".into()),
        journal: req.journal.clone(),
        ..Default::default()
    };
    let msg = resolve(&demo(), &other).unwrap_err().to_string();
    assert!(
        msg.contains("no fitted viscometer set for filler-paste"),
        "{msg}"
    );
}
