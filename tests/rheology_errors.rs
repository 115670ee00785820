//! Bad input gives a clear error per case, and never a NaN in output.
//! Source for the counts: a model with p parameters needs p readings at p different rates to be
//! determined, and m − p − 1 > 0 for AICc (the AICc formula's denominator; Hurvich & Tsai 1989,
//! from memory).

use rheoside::rheology::{
    FitError, FitOptions, ModelKind, NoCi, ParamName, Point, choose, fit, temperature,
};

fn pts(pairs: &[(f64, f64)]) -> Vec<Point> {
    pairs.iter().map(|&(x, y)| Point::new(x, y)).collect()
}

fn message(kind: ModelKind, points: &[Point]) -> String {
    fit(kind, points, &FitOptions::default())
        .unwrap_err()
        .to_string()
}

#[test]
fn too_few_points_says_how_many_and_why() {
    let two = pts(&[(10.0, 20.0), (100.0, 50.0)]);
    assert_eq!(
        message(ModelKind::HerschelBulkley, &two),
        "the Herschel–Bulkley model needs at least 3 readings because it has 3 parameters \
         (yield stress, consistency index, flow behaviour index); got 2"
    );
    let one = pts(&[(10.0, 20.0)]);
    assert_eq!(
        message(ModelKind::Bingham, &one),
        "the Bingham model needs at least 2 readings because it has 2 parameters \
         (yield stress, plastic viscosity); got 1"
    );
    assert_eq!(
        message(ModelKind::Newtonian, &[]),
        "no readings were given: a flow curve needs shear rate and shear stress pairs"
    );
}

#[test]
fn repeated_rates_are_not_enough() {
    let same = pts(&[(10.0, 20.0), (10.0, 21.0), (100.0, 50.0), (100.0, 51.0)]);
    assert_eq!(
        message(ModelKind::HerschelBulkley, &same),
        "the Herschel–Bulkley model needs readings at 3 or more different shear rates to separate \
         its 3 parameters (yield stress, consistency index, flow behaviour index); got 2 distinct rate(s)"
    );
    assert!(fit(ModelKind::PowerLaw, &same, &FitOptions::default()).is_ok());
}

#[test]
fn zero_negative_and_nan_readings_are_named() {
    let zero_rate = pts(&[(10.0, 20.0), (0.0, 5.0), (100.0, 50.0)]);
    assert_eq!(
        message(ModelKind::PowerLaw, &zero_rate),
        "reading 2: shear rate must be greater than zero, got 0 1/s; \
         a reading at rest or with a negative rate says nothing about the flow curve"
    );
    let negative_stress = pts(&[(10.0, 20.0), (50.0, 30.0), (100.0, -5.0)]);
    assert_eq!(
        message(ModelKind::Bingham, &negative_stress),
        "reading 3: shear stress must be greater than zero, got -5 Pa; check the dial zero and the units"
    );
    let nan = pts(&[(f64::NAN, 20.0), (100.0, 50.0)]);
    assert_eq!(
        message(ModelKind::Newtonian, &nan),
        "reading 1: shear rate is not a number (NaN or infinite); enter a finite value in 1/s"
    );
    let inf = pts(&[(10.0, 20.0), (100.0, f64::INFINITY)]);
    assert!(
        message(ModelKind::Newtonian, &inf).starts_with("reading 2: shear stress is not a number")
    );
    // The choice runs the same checks first and returns the same error.
    assert_eq!(
        choose(&zero_rate, &FitOptions::default()).unwrap_err(),
        FitError::NonPositiveRate {
            index: 2,
            value: 0.0
        }
    );
}

#[test]
fn a_fit_that_does_not_converge_says_so() {
    let e = FitError::NotConverged {
        model: ModelKind::HerschelBulkley,
        iterations: 2000,
    };
    assert_eq!(
        e.to_string(),
        "the Herschel–Bulkley fit did not converge after 2000 iterations; \
         check the readings for a stray value or try another model"
    );
}

#[test]
fn a_fit_with_no_degrees_of_freedom_has_no_ci_and_no_nan() {
    // Three readings, three HB parameters: the curve interpolates them.
    let three = pts(&[(10.0, 14.0), (100.0, 25.0), (1000.0, 60.0)]);
    let f = fit(ModelKind::HerschelBulkley, &three, &FitOptions::default()).unwrap();
    assert_eq!(f.dof, 0);
    assert_eq!(f.aicc, None);
    for e in &f.estimates {
        assert_eq!(e.ci95, None);
        assert_eq!(e.std_error, None);
        assert_eq!(e.no_ci, Some(NoCi::NoDegreesOfFreedom));
        assert!(e.value.is_finite());
    }
    assert!(f.r_squared.is_finite() && f.rmse_pa.is_finite());
    assert!(f.estimate(ParamName::Tau0).unwrap().value > 0.0);
}

#[test]
fn stress_falling_with_rate_is_refused_as_unphysical() {
    let falling = pts(&[(10.0, 50.0), (100.0, 30.0), (1000.0, 10.0)]);
    let msg = message(ModelKind::Bingham, &falling);
    assert!(
        msg.starts_with("the Bingham fit gives a result with no physical meaning: the fitted plastic viscosity is"),
        "{msg}"
    );
    assert!(
        msg.ends_with("the stress does not rise with shear rate in these readings"),
        "{msg}"
    );
}

#[test]
fn too_few_readings_for_any_comparison() {
    let two = pts(&[(10.0, 20.0), (100.0, 50.0)]);
    let err = choose(&two, &FitOptions::default())
        .unwrap_err()
        .to_string();
    assert_eq!(
        err,
        "no model could be compared: the Newtonian model needs at least 3 readings to be compared \
         by AICc (readings − parameters − 1 must be above zero); got 2"
    );
}

#[test]
fn temperature_inputs_are_checked() {
    let one = [(293.15, 10.0), (293.15, 11.0)];
    assert_eq!(
        temperature::fit_activation_energy(&one, 293.15)
            .unwrap_err()
            .to_string(),
        "an activation energy needs the same product read at 2 or more different temperatures; got 1"
    );
    let celsius = [(20.0, 10.0), (-10.0, 11.0)];
    assert_eq!(
        temperature::fit_activation_energy(&celsius, 293.15)
            .unwrap_err()
            .to_string(),
        "sample 2: temperature must be a finite absolute temperature above 0 K, got -10 K"
    );
    let bad_value = [(293.15, 10.0), (313.15, 0.0)];
    assert!(
        temperature::fit_activation_energy(&bad_value, 293.15)
            .unwrap_err()
            .to_string()
            .starts_with(
                "sample 2: the consistency index or viscosity must be finite and above zero"
            )
    );
}
