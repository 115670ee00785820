//! A positive-displacement pump on a line: delivered flow from displacement, speed and slip,
//! the discharge pressure against the relief setting, the shaft power, and how the pressure
//! rises with speed.
//!
//! Slip through the clearances scales roughly as ΔP·c³/μ, so it falls as the product
//! thickens (common practice, no source). Without a measured volumetric efficiency the slip
//! fraction is estimated as s = S_REF·(ΔP/P_REF)·(μ_REF/μ), capped at [`MAX_SLIP`]: a rough
//! default with invented reference values (common practice, no source); a measured value
//! from the site always wins.

/// Slip fraction at the reference pressure and viscosity (common practice, no source).
pub const S_REF: f64 = 0.05;
/// Reference differential pressure for [`S_REF`], Pa (10 bar).
pub const P_REF: f64 = 10e5;
/// Reference viscosity for [`S_REF`], Pa·s (100 cP).
pub const MU_REF: f64 = 0.1;
/// The estimate is not trusted beyond this slip fraction.
pub const MAX_SLIP: f64 = 0.5;

/// The pump as built and run.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct DisplacementPump {
    pub displacement_m3_per_rev: f64,
    /// Shaft speed, rev/s.
    pub speed_rev_s: f64,
    /// Measured volumetric efficiency (0–1), overriding the slip estimate.
    pub volumetric_efficiency: Option<f64>,
    /// Relief valve setting, gauge, Pa.
    pub relief_pa: Option<f64>,
    pub motor_rating_w: Option<f64>,
}

/// Where the volumetric efficiency came from.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum SlipBasis {
    Measured,
    Estimated,
    /// The estimate hit its cap: the pump may not fill or may barely deliver.
    EstimateCapped,
}

/// The discharge pressure against the relief setting.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Relief {
    /// Below the setting by this much, Pa.
    Below {
        margin_pa: f64,
    },
    /// At or above: the relief opens and the line gets less than the pump moves.
    Opens {
        excess_pa: f64,
    },
    Unknown,
}

/// The delivered duty.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct PdDuty {
    pub theoretical_flow_m3_s: f64,
    pub flow_m3_s: f64,
    pub volumetric_efficiency: f64,
    pub basis: SlipBasis,
    pub pressure_pa: f64,
    /// ΔP·Q_theoretical, W: mechanical losses not counted, so the motor needs more.
    pub power_w: f64,
    pub motor_margin_w: Option<f64>,
    pub relief: Relief,
    /// d ln P/d ln N at this speed: above 1 the pressure rises faster than the speed.
    pub pressure_speed_exponent: f64,
}

/// Volumetric efficiency at a differential pressure (Pa) and viscosity (Pa·s).
pub fn volumetric_efficiency(
    pump: &DisplacementPump,
    pressure_pa: f64,
    viscosity_pa_s: f64,
) -> (f64, SlipBasis) {
    if let Some(v) = pump.volumetric_efficiency {
        return (v, SlipBasis::Measured);
    }
    let slip = S_REF * (pressure_pa.max(0.0) / P_REF) * (MU_REF / viscosity_pa_s.max(1e-6));
    if slip > MAX_SLIP {
        (1.0 - MAX_SLIP, SlipBasis::EstimateCapped)
    } else {
        (1.0 - slip, SlipBasis::Estimated)
    }
}

/// The flow the pump delivers into a line whose pressure at flow Q is `system_pa(Q)`:
/// Q = Q_th·η_v(P(Q)), solved by bisection on [0, Q_th].
fn delivered(
    pump: &DisplacementPump,
    system_pa: &dyn Fn(f64) -> f64,
    mu: f64,
) -> (f64, f64, f64, SlipBasis) {
    let q_th = pump.displacement_m3_per_rev * pump.speed_rev_s;
    let excess = |q: f64| q - q_th * volumetric_efficiency(pump, system_pa(q), mu).0;
    let (mut a, mut b) = (0.0, q_th);
    for _ in 0..200 {
        let m = 0.5 * (a + b);
        if excess(m) < 0.0 {
            a = m
        } else {
            b = m
        }
        if b - a <= 1e-12 * q_th {
            break;
        }
    }
    let q = 0.5 * (a + b);
    let p = system_pa(q);
    let basis = volumetric_efficiency(pump, p, mu).1;
    (q_th, q, p, basis)
}

/// The duty on a line: `system_pa(Q)` is the discharge pressure (gauge, Pa) the line needs at
/// flow Q; `viscosity_pa_s` the product's viscosity in the clearances.
pub fn pd_duty(
    pump: &DisplacementPump,
    system_pa: &dyn Fn(f64) -> f64,
    viscosity_pa_s: f64,
) -> PdDuty {
    let (q_th, q, p, basis) = delivered(pump, system_pa, viscosity_pa_s);
    let eta = if q_th > 0.0 { q / q_th } else { 0.0 };
    let power_w = p.max(0.0) * q_th;
    let faster = DisplacementPump {
        speed_rev_s: pump.speed_rev_s * 1.1,
        ..*pump
    };
    let p2 = delivered(&faster, system_pa, viscosity_pa_s).2;
    let exponent = if p > 0.0 && p2 > 0.0 {
        (p2 / p).ln() / 1.1f64.ln()
    } else {
        0.0
    };
    let relief = match pump.relief_pa {
        Some(r) if p < r => Relief::Below { margin_pa: r - p },
        Some(r) => Relief::Opens { excess_pa: p - r },
        None => Relief::Unknown,
    };
    PdDuty {
        theoretical_flow_m3_s: q_th,
        flow_m3_s: q,
        volumetric_efficiency: eta,
        basis,
        pressure_pa: p,
        power_w,
        motor_margin_w: pump.motor_rating_w.map(|m| m - power_w),
        relief,
        pressure_speed_exponent: exponent,
    }
}
