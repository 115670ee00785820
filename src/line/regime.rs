//! Laminar, transitional or turbulent: the critical generalized Reynolds number for each flow
//! model, and where the turbulent correlations take over.

use crate::rheology::Model;

/// Flow regime at one flow.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Regime {
    Laminar,
    /// Between the laminar limit and the turbulent correlations: the answer is a band.
    Transitional,
    Turbulent,
}

impl Regime {
    /// The JSON value ("laminar" | "transitional" | "turbulent").
    pub fn name(self) -> &'static str {
        match self {
            Regime::Laminar => "laminar",
            Regime::Transitional => "transitional",
            Regime::Turbulent => "turbulent",
        }
    }
}

/// Which criterion set the critical Reynolds number.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
#[serde(rename_all = "kebab-case", tag = "rule")]
pub enum CriticalRule {
    /// Re = 2100 for a Newtonian product (common practice since Reynolds 1883; the n = 1
    /// value of Ryan & Johnson 1959).
    Newtonian,
    /// Ryan & Johnson (1959, AIChE J 5:433) for a power law with index n.
    RyanJohnson { n: f64 },
    /// Hanks (1963, AIChE J 9:306; page from memory) for a Bingham plastic with Hedstrom number He; φc is the
    /// plug fraction τ0/τw at transition.
    Hanks { hedstrom: f64, phi_c: f64 },
    /// Our choice for Herschel–Bulkley and Casson, where no single published criterion
    /// covers both: the larger of Ryan–Johnson at the local flow index n′ of the laminar pipe
    /// flow curve (the Metzner–Reed view of the product as a local power law) and Hanks'
    /// criterion for the Bingham plastic tangent to the flow curve at the wall (its Hedstrom
    /// number from τ0 and the slope dτ/dγ̇ at the wall rate). Near the yield stress n′ falls
    /// towards zero and Ryan–Johnson alone would call a plug flow turbulent; far above it the
    /// tangent viscosity is small and Ryan–Johnson governs. It is Hanks' rule for a
    /// Herschel–Bulkley product with n = 1 (a Bingham plastic) and Ryan–Johnson at τ0 = 0.
    YieldStressLocal {
        n_prime: f64,
        tangent_hedstrom: f64,
        ryan_johnson: f64,
        hanks: f64,
    },
}

/// Ryan–Johnson critical Reynolds number, Re_c = 6464n(2+n)^((2+n)/(1+n))/(1+3n)²
/// (Ryan & Johnson 1959, AIChE J 5(4):433): 2099 at n = 1, a maximum near 2400 at n ≈ 0.4.
pub fn ryan_johnson(n: f64) -> f64 {
    6464.0 * n * (2.0 + n).powf((2.0 + n) / (1.0 + n)) / (1.0 + 3.0 * n).powi(2)
}

/// Hanks (1963) criterion for a Bingham plastic: solve φc/(1−φc)³ = He/16800 for the critical
/// plug fraction, then Re_Bc = He(1 − 4φc/3 + φc⁴/3)/(8φc). Returns (Re_Bc, φc). As He → 0
/// Re_Bc → 2100. The constant 16800 is from memory and should be confirmed against Hanks'
/// paper.
pub fn hanks_critical(hedstrom: f64) -> (f64, f64) {
    if hedstrom.is_nan() || hedstrom <= 0.0 {
        return (2100.0, 0.0);
    }
    let target = hedstrom / 16800.0;
    let g = |phi: f64| phi / (1.0 - phi).powi(3) - target;
    let phi = super::solve::bisect(0.0, 1.0 - 1e-15, g);
    let re_b = hedstrom * (1.0 - 4.0 * phi / 3.0 + phi.powi(4) / 3.0) / (8.0 * phi);
    (re_b, phi)
}

/// The critical generalized (Metzner–Reed) Reynolds number for this product and line, with
/// the rule that set it. `n_prime` is the local flow index of the laminar pipe flow curve.
pub fn critical_reynolds(
    model: &Model,
    density: f64,
    diameter: f64,
    n_prime: f64,
    wall_rate: f64,
) -> (f64, CriticalRule) {
    match *model {
        Model::Newtonian { .. } => (2100.0, CriticalRule::Newtonian),
        Model::PowerLaw { n, .. } => (ryan_johnson(n), CriticalRule::RyanJohnson { n }),
        Model::Bingham { tau0, mu_p } => {
            let he = density * diameter * diameter * tau0 / (mu_p * mu_p);
            let (re, phi_c) = hanks_generalized(he);
            (
                re,
                CriticalRule::Hanks {
                    hedstrom: he,
                    phi_c,
                },
            )
        }
        Model::HerschelBulkley { .. } | Model::Casson { .. } => {
            let tau0 = model.yield_stress();
            let slope = tangent_slope(model, wall_rate);
            let he = if tau0 > 0.0 && slope > 0.0 {
                density * diameter * diameter * tau0 / (slope * slope)
            } else {
                0.0
            };
            let rj = ryan_johnson(n_prime);
            let hanks = if he > 0.0 {
                hanks_generalized(he).0
            } else {
                0.0
            };
            let rule = CriticalRule::YieldStressLocal {
                n_prime,
                tangent_hedstrom: he,
                ryan_johnson: rj,
                hanks,
            };
            (rj.max(hanks), rule)
        }
    }
}

/// Hanks' critical Re_B as a generalized Reynolds number: in laminar Bingham flow
/// Re_MR = 8ρV²/τw = Re_B·(1 − 4φ/3 + φ⁴/3), so it converts at φc (derived from
/// Buckingham–Reiner).
fn hanks_generalized(hedstrom: f64) -> (f64, f64) {
    let (re_b, phi_c) = hanks_critical(hedstrom);
    let g = 1.0 - 4.0 * phi_c / 3.0 + phi_c.powi(4) / 3.0;
    (re_b * g, phi_c)
}

/// dτ/dγ̇ of the flow curve at a shear rate, by a central difference.
fn tangent_slope(model: &Model, rate: f64) -> f64 {
    if !(rate.is_finite() && rate > 0.0) {
        return 0.0;
    }
    let h = 1e-6 * rate;
    (model.stress(rate + h) - model.stress(rate - h)) / (2.0 * h)
}

/// The generalized Reynolds number where the turbulent correlations are taken to hold fully:
/// the critical value scaled by 4000/2100, the Newtonian transition band of common practice
/// (common practice, no source).
pub fn turbulent_onset(critical: f64) -> f64 {
    critical * 4000.0 / 2100.0
}
