//! One product read at several temperatures: a flow curve per temperature and the
//! activation energy of its viscosity parameter (the Arrhenius form; Steffe 1996, *Rheological Methods in Food
//! Process Engineering*, 2nd ed., ch. 1).

use super::flow_curve::{
    FlowCurve, FlowCurveError, FlowCurveInput, FlowCurveOptions, ModelPick, analyse,
};
use crate::instrument::DialReading;
use crate::rheology::temperature::{ActivationFit, fit_activation_energy, shift_to_reference};
use crate::rheology::{FitError, Model, ModelKind, ParamName, Point};

/// Readings closer than this are taken as the same temperature (a thermometer's resolution).
pub const SAME_TEMPERATURE_K: f64 = 0.05;

/// The flow curve at one temperature.
#[derive(Debug, Clone)]
pub struct AtTemperature {
    pub temperature_k: f64,
    pub curve: FlowCurve,
}

/// Curves at every temperature with one model, and how its viscosity parameter shifts.
#[derive(Debug, Clone)]
pub struct TemperatureSeries {
    /// In the order the temperatures first appear in the readings.
    pub curves: Vec<AtTemperature>,
    pub model: ModelKind,
    /// The parameter that carries the temperature dependence (K, μ, μp or μc).
    pub parameter: ParamName,
    /// The first temperature read; the activation fit's value_at_ref is at it.
    pub reference_k: f64,
    pub activation: Result<ActivationFit, FitError>,
}

/// The parameter taken to follow Arrhenius for each model; n and τ0 are held apart.
pub fn viscosity_parameter(kind: ModelKind) -> ParamName {
    match kind {
        ModelKind::Newtonian => ParamName::Mu,
        ModelKind::PowerLaw | ModelKind::HerschelBulkley => ParamName::K,
        ModelKind::Bingham => ParamName::MuP,
        ModelKind::Casson => ParamName::MuC,
    }
}

/// Split readings by temperature, fit each with one model, then fit the activation energy.
///
/// The model is the operator's pick, or the rule's choice at the first temperature, so
/// that the parameters compare like with like across temperatures.
pub fn analyse_by_temperature(
    input: FlowCurveInput<'_>,
    temperatures_k: &[f64],
    opts: &FlowCurveOptions,
) -> Result<TemperatureSeries, FlowCurveError> {
    let groups = group_rows(temperatures_k);
    let mut curves = Vec::with_capacity(groups.len());
    let mut model = match opts.model {
        ModelPick::Fixed(kind) => Some(kind),
        ModelPick::Auto => None,
    };
    for (temperature_k, rows) in &groups {
        let pick = model.map_or(ModelPick::Auto, ModelPick::Fixed);
        let group_opts = FlowCurveOptions {
            model: pick,
            ..*opts
        };
        let curve = analyse_subset(input, rows, &group_opts)?;
        model.get_or_insert(curve.fit.model.kind());
        curves.push(AtTemperature {
            temperature_k: *temperature_k,
            curve,
        });
    }
    let model = model.unwrap_or(ModelKind::Newtonian);
    let parameter = viscosity_parameter(model);
    let reference_k = groups.first().map_or(f64::NAN, |g| g.0);
    let samples: Vec<(f64, f64)> = curves
        .iter()
        .filter_map(|c| Some((c.temperature_k, c.curve.fit.model.param(parameter)?)))
        .collect();
    Ok(TemperatureSeries {
        curves,
        model,
        parameter,
        reference_k,
        activation: fit_activation_energy(&samples, reference_k),
    })
}

/// Temperature groups in first-seen order, each with the row indices it holds.
fn group_rows(temperatures_k: &[f64]) -> Vec<(f64, Vec<usize>)> {
    let mut groups: Vec<(f64, Vec<usize>)> = Vec::new();
    for (i, &t) in temperatures_k.iter().enumerate() {
        match groups
            .iter_mut()
            .find(|(g, _)| (g - t).abs() <= SAME_TEMPERATURE_K)
        {
            Some((_, rows)) => rows.push(i),
            None => groups.push((t, vec![i])),
        }
    }
    groups
}

fn analyse_subset(
    input: FlowCurveInput<'_>,
    rows: &[usize],
    opts: &FlowCurveOptions,
) -> Result<FlowCurve, FlowCurveError> {
    match input {
        FlowCurveInput::Dial { geometry, readings } => {
            let subset: Vec<DialReading> = rows
                .iter()
                .filter_map(|&i| readings.get(i).copied())
                .collect();
            analyse(
                FlowCurveInput::Dial {
                    geometry,
                    readings: &subset,
                },
                opts,
            )
        }
        FlowCurveInput::Direct { points } => {
            let subset: Vec<Point> = rows
                .iter()
                .filter_map(|&i| points.get(i).copied())
                .collect();
            analyse(FlowCurveInput::Direct { points: &subset }, opts)
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::rheology::temperature::arrhenius_factor;

    /// Power-law data at three temperatures with K following Arrhenius exactly:
    /// Ea = 35 kJ/mol, K = 8 Pa·sⁿ at 20 °C, n = 0.45 at every temperature (invented product).
    fn power_law_at_three_temperatures() -> (Vec<Point>, Vec<f64>) {
        let (ea, k_ref, n, t_ref) = (35_000.0, 8.0, 0.45, 293.15);
        let mut points = Vec::new();
        let mut temps = Vec::new();
        for t in [293.15, 313.15, 333.15] {
            let k = k_ref * arrhenius_factor(ea, t, t_ref);
            for rate in [5.0, 10.0, 50.0, 100.0, 300.0, 600.0] {
                points.push(Point {
                    shear_rate: rate,
                    shear_stress: k * f64::powf(rate, n),
                });
                temps.push(t);
            }
        }
        (points, temps)
    }

    #[test]
    fn recovers_the_activation_energy_from_exact_data() {
        let (points, temps) = power_law_at_three_temperatures();
        let opts = FlowCurveOptions {
            model: ModelPick::Fixed(ModelKind::PowerLaw),
            ..Default::default()
        };
        let series =
            analyse_by_temperature(FlowCurveInput::Direct { points: &points }, &temps, &opts)
                .unwrap();
        assert_eq!(series.curves.len(), 3);
        assert_eq!(series.parameter, ParamName::K);
        let fit = series.activation.unwrap();
        // The data were built with Ea = 35 000 J/mol and K_ref = 8 (derivation above).
        assert!((fit.ea_j_per_mol - 35_000.0).abs() < 1e-6 * 35_000.0);
        assert!((fit.value_at_ref - 8.0).abs() < 1e-8);
    }

    #[test]
    fn groups_readings_within_the_thermometer_resolution() {
        let groups = group_rows(&[298.15, 298.17, 310.0, 298.14]);
        assert_eq!(groups.len(), 2);
        assert_eq!(groups[0].1, vec![0, 1, 3]);
        assert_eq!(groups[1].1, vec![2]);
    }
}

/// The model with its viscosity parameter (K, μ, μp or μc) brought from the temperature it
/// was read at to `t_ref_k` by Arrhenius, so sets read warm and cold compare against the
/// same spec limits. τ0 and n are left as measured: n is taken as independent of temperature
/// (Steffe 1996, the orange-juice concentrate example: n 0.76–0.80 from −19 to 29 °C), and the yield stress has no general temperature law.
pub fn shift_model_to_reference(model: &Model, ea_j_per_mol: f64, t_k: f64, t_ref_k: f64) -> Model {
    let to_ref = |v: f64| shift_to_reference(v, ea_j_per_mol, t_k, t_ref_k);
    match *model {
        Model::Newtonian { mu } => Model::Newtonian { mu: to_ref(mu) },
        Model::PowerLaw { k, n } => Model::PowerLaw { k: to_ref(k), n },
        Model::Bingham { tau0, mu_p } => Model::Bingham {
            tau0,
            mu_p: to_ref(mu_p),
        },
        Model::HerschelBulkley { tau0, k, n } => Model::HerschelBulkley {
            tau0,
            k: to_ref(k),
            n,
        },
        Model::Casson { tau0, mu_c } => Model::Casson {
            tau0,
            mu_c: to_ref(mu_c),
        },
    }
}

#[cfg(test)]
mod shift_tests {
    use super::*;

    #[test]
    fn shifts_only_the_viscosity_parameter() {
        // Arrhenius (Steffe 1996, ch. 1), worked by hand: Ea = 40 kJ/mol, read at 40 °C, reference
        // 20 °C: (40000/8.314462618)(1/313.15 − 1/293.15) = 4810.894·(−2.178651e-4) = −1.048126,
        // so K(40 °C)/K(20 °C) = exp(−1.048126) = 0.3505942 and K_ref = 2/0.3505942 = 5.704602.
        let read = Model::HerschelBulkley {
            tau0: 3.0,
            k: 2.0,
            n: 0.5,
        };
        let Model::HerschelBulkley { tau0, k, n } =
            shift_model_to_reference(&read, 40_000.0, 313.15, 293.15)
        else {
            panic!("model kind changed");
        };
        assert_eq!((tau0, n), (3.0, 0.5));
        assert!((k - 5.704602).abs() < 1e-5, "K at reference {k}");
    }
}
