//! Where a centrifugal pump runs on a line: the flow at which its head curve meets the
//! system curve (bisection on H_pump − H_system), with the power drawn P = ρ·g·Q·H/η and
//! the margin to the motor's rating.

use super::curve::PumpCurve;

/// Standard gravity, m/s² (CGPM 1901, exact by definition).
pub const G: f64 = 9.806_65;

/// The line's head needed against flow: a function, or points (flow m³/s, head m) with flow
/// increasing, read by straight lines between them.
pub enum SystemCurve<'a> {
    Function(&'a dyn Fn(f64) -> f64),
    Sampled(&'a [(f64, f64)]),
}

impl SystemCurve<'_> {
    /// Head needed at a flow, m; NaN outside a sampled curve's range.
    pub fn head_m(&self, flow_m3_s: f64) -> f64 {
        match self {
            SystemCurve::Function(f) => f(flow_m3_s),
            SystemCurve::Sampled(points) => sampled(points, flow_m3_s),
        }
    }
}

fn sampled(points: &[(f64, f64)], q: f64) -> f64 {
    points
        .windows(2)
        .find(|w| q >= w[0].0 && q <= w[1].0)
        .map_or(f64::NAN, |w| {
            let f = (q - w[0].0) / (w[1].0 - w[0].0);
            w[0].1 + f * (w[1].1 - w[0].1)
        })
}

/// The duty point.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct Duty {
    pub flow_m3_s: f64,
    pub head_m: f64,
    /// ρ·g·H, Pa (the pump's pressure rise).
    pub pressure_pa: f64,
    pub efficiency: f64,
    /// Shaft power ρ·g·Q·H/η, W.
    pub power_w: f64,
    /// Motor rating less the power drawn, W (when the rating is known).
    pub motor_margin_w: Option<f64>,
}

/// Why there is no duty point on the curve given.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum NoDuty {
    /// The pump's head at its lowest flow is below what the line needs: it cannot push.
    PumpBelowSystem,
    /// The pump still has head to spare at the end of its curve: it runs out past it.
    BeyondCurve,
    /// The system curve gave no number in the pump's range.
    SystemUndefined,
}

/// The intersection of the pump and system curves.
pub fn operating_point(
    pump: &PumpCurve,
    system: &SystemCurve,
    density_kg_m3: f64,
    motor_rating_w: Option<f64>,
) -> Result<Duty, NoDuty> {
    let gap = |q: f64| pump.at(q).map_or(f64::NAN, |(h, _)| h) - system.head_m(q);
    let (mut a, mut b) = pump.flow_range();
    let (ga, gb) = (gap(a), gap(b));
    if ga.is_nan() || gb.is_nan() {
        return Err(NoDuty::SystemUndefined);
    }
    if ga < 0.0 {
        return Err(NoDuty::PumpBelowSystem);
    }
    if gb > 0.0 {
        return Err(NoDuty::BeyondCurve);
    }
    for _ in 0..200 {
        let m = 0.5 * (a + b);
        if gap(m) > 0.0 {
            a = m
        } else {
            b = m
        }
        if b - a <= 1e-12 * b.max(1e-12) {
            break;
        }
    }
    let q = 0.5 * (a + b);
    let (head_m, efficiency) = pump.at(q).ok_or(NoDuty::SystemUndefined)?;
    let pressure_pa = density_kg_m3 * G * head_m;
    let power_w = if efficiency > 0.0 {
        pressure_pa * q / efficiency
    } else {
        f64::INFINITY
    };
    Ok(Duty {
        flow_m3_s: q,
        head_m,
        pressure_pa,
        efficiency,
        power_w,
        motor_margin_w: motor_rating_w.map(|r| r - power_w),
    })
}
