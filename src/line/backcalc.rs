//! The product's flow curve from plant readings: (pressure drop, flow) pairs on a known line
//! give the wall stress τw = DΔp/(4L) against the nominal shear rate 8V/D; the log–log slope
//! gives n′ and K′, and Rabinowitsch–Mooney the true wall shear rate
//! γ̇w = (8V/D)(3n′+1)/(4n′) (Rabinowitsch 1929; Mooney 1931; Steffe 1996 eqs 2.119–2.121).
//! The points (γ̇w, τw) are then fitted like viscometer readings. Laminar flow only.

use super::error::LineError;
use super::pipe::{Pipe, positive};
use super::regime::ryan_johnson;
use crate::rheology::Point;

/// One plant reading: total pressure drop between the taps (Pa) and the flow (m³/s).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PlantPair {
    pub pressure_drop_pa: f64,
    pub flow_m3_s: f64,
}

/// One pair reduced to pipe-flow quantities.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct PlantPoint {
    pub flow_m3_s: f64,
    pub wall_shear_stress_pa: f64,
    /// 8V/D, 1/s.
    pub nominal_shear_rate_per_s: f64,
    /// Rabinowitsch–Mooney true wall shear rate, 1/s.
    pub shear_rate_per_s: f64,
    /// The n′ used for this point's correction.
    pub n_prime: f64,
    /// 8ρV²/τw.
    pub reynolds: f64,
}

/// Two or more pairs reduced, ready for the flow-curve fit.
#[derive(Debug, Clone, PartialEq)]
pub struct BackCalc {
    pub points: Vec<PlantPoint>,
    /// Slope of the straight log–log line of τw on 8V/D.
    pub n_prime: f64,
    /// τw = K′(8V/D)^n′ on that line, Pa·sⁿ.
    pub k_prime_pa_sn: f64,
}

impl BackCalc {
    /// The (γ̇w, τw) points for `rheology::fit`.
    pub fn fit_points(&self) -> Vec<Point> {
        self.points
            .iter()
            .map(|p| Point::new(p.shear_rate_per_s, p.wall_shear_stress_pa))
            .collect()
    }
}

/// Reduce the pairs. With four or more, each point's n′ is the local slope of a quadratic
/// in log–log (the pipe flow curve of a yield-stress product bends); with two or three it is
/// the straight line's slope. Every pair must be laminar: Re = 8ρV²/τw at most the
/// Ryan–Johnson critical value at its n′ (Ryan & Johnson 1959).
pub fn back_calculate(
    pipe: &Pipe,
    density: f64,
    pairs: &[PlantPair],
) -> Result<BackCalc, LineError> {
    pipe.check()?;
    positive("density", density)?;
    if pairs.len() < 2 {
        return Err(LineError::TooFewPairs {
            need: "two or more (pressure drop, flow) pairs for n′ (one pair gives only the \
                   apparent viscosity at the wall)",
            got: pairs.len(),
        });
    }
    let walls = pairs
        .iter()
        .enumerate()
        .map(|(i, p)| wall(pipe, density, i, p))
        .collect::<Result<Vec<_>, _>>()?;
    let x: Vec<f64> = walls.iter().map(|w| w.1.ln()).collect();
    let y: Vec<f64> = walls.iter().map(|w| w.0.ln()).collect();
    let (b0, b1) = straight(&x, &y);
    if !(b1 > 0.0 && b1.is_finite()) {
        return Err(LineError::NoSlope { n_prime: b1 });
    }
    let local = (pairs.len() >= 4).then(|| quadratic_slopes(&x, &y));
    let points: Vec<PlantPoint> = walls
        .iter()
        .enumerate()
        .map(|(i, &(tau_w, nominal, q, v))| {
            let n = local.as_ref().map_or(b1, |s| s[i]).max(1e-3);
            PlantPoint {
                flow_m3_s: q,
                wall_shear_stress_pa: tau_w,
                nominal_shear_rate_per_s: nominal,
                shear_rate_per_s: nominal * (3.0 * n + 1.0) / (4.0 * n),
                n_prime: n,
                reynolds: 8.0 * density * v * v / tau_w,
            }
        })
        .collect();
    check_laminar(&points)?;
    Ok(BackCalc {
        points,
        n_prime: b1,
        k_prime_pa_sn: b0.exp(),
    })
}

/// (τw, 8V/D, Q, V) of one pair, after taking the static head off.
fn wall(
    pipe: &Pipe,
    density: f64,
    i: usize,
    p: &PlantPair,
) -> Result<(f64, f64, f64, f64), LineError> {
    let friction = p.pressure_drop_pa - density * super::pipe::GRAVITY * pipe.elevation_change_m;
    if !(friction > 0.0 && p.flow_m3_s > 0.0 && friction.is_finite() && p.flow_m3_s.is_finite()) {
        return Err(LineError::BadPair {
            index: i + 1,
            friction_pa: friction,
        });
    }
    let d = pipe.inner_diameter_m;
    let v = pipe.velocity(p.flow_m3_s);
    Ok((
        d * friction / (4.0 * pipe.total_length_m()),
        8.0 * v / d,
        p.flow_m3_s,
        v,
    ))
}

fn check_laminar(points: &[PlantPoint]) -> Result<(), LineError> {
    let bad: Vec<(usize, &PlantPoint)> = points
        .iter()
        .enumerate()
        .filter(|(_, p)| p.reynolds > ryan_johnson(p.n_prime))
        .collect();
    if bad.is_empty() {
        return Ok(());
    }
    let join = |f: &dyn Fn(usize, &PlantPoint) -> String| {
        bad.iter()
            .map(|(i, p)| f(*i, p))
            .collect::<Vec<_>>()
            .join(", ")
    };
    Err(LineError::NotLaminar {
        pairs: join(&|i, _| (i + 1).to_string()),
        reynolds: join(&|_, p| format!("{:.0}", p.reynolds)),
        critical: join(&|_, p| format!("{:.0}", ryan_johnson(p.n_prime))),
    })
}

/// Least-squares y = b0 + b1·x.
fn straight(x: &[f64], y: &[f64]) -> (f64, f64) {
    let m = x.len() as f64;
    let (mx, my) = (x.iter().sum::<f64>() / m, y.iter().sum::<f64>() / m);
    let sxy: f64 = x.iter().zip(y).map(|(a, b)| (a - mx) * (b - my)).sum();
    let sxx: f64 = x.iter().map(|a| (a - mx).powi(2)).sum();
    let b1 = sxy / sxx;
    (my - b1 * mx, b1)
}

/// dy/dx at each x of the least-squares quadratic y = a + b·u + c·u², u = x − x̄; the straight
/// line's slope everywhere if the quadratic is singular.
fn quadratic_slopes(x: &[f64], y: &[f64]) -> Vec<f64> {
    let m = x.len() as f64;
    let mx = x.iter().sum::<f64>() / m;
    let u: Vec<f64> = x.iter().map(|v| v - mx).collect();
    let s = |p: i32| u.iter().map(|v| v.powi(p)).sum::<f64>();
    let t = |p: i32| u.iter().zip(y).map(|(v, w)| v.powi(p) * w).sum::<f64>();
    let a = [[m, s(1), s(2)], [s(1), s(2), s(3)], [s(2), s(3), s(4)]];
    let rhs = [t(0), t(1), t(2)];
    let det = det3(&a);
    if det.abs() <= 1e-12 * s(4).abs().max(1.0) || det.is_nan() {
        let (_, b1) = straight(x, y);
        return vec![b1; x.len()];
    }
    let col = |k: usize| {
        let mut c = a;
        for r in 0..3 {
            c[r][k] = rhs[r];
        }
        det3(&c) / det
    };
    let (b, c) = (col(1), col(2));
    u.iter().map(|v| b + 2.0 * c * v).collect()
}

fn det3(a: &[[f64; 3]; 3]) -> f64 {
    a[0][0] * (a[1][1] * a[2][2] - a[1][2] * a[2][1])
        - a[0][1] * (a[1][0] * a[2][2] - a[1][2] * a[2][0])
        + a[0][2] * (a[1][0] * a[2][1] - a[1][1] * a[2][0])
}

/// One pair: the apparent viscosity at the wall τw/(8V/D) and, with n from the viscometer,
/// K = τw/γ̇w^n with γ̇w = (8V/D)(3n+1)/(4n) (the power-law reading of Rabinowitsch–Mooney).
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct SinglePair {
    pub point: PlantPoint,
    pub apparent_viscosity_pa_s: f64,
    pub k_pa_sn: Option<f64>,
}

pub fn single_pair(
    pipe: &Pipe,
    density: f64,
    pair: PlantPair,
    n_from_viscometer: Option<f64>,
) -> Result<SinglePair, LineError> {
    pipe.check()?;
    positive("density", density)?;
    let (tau_w, nominal, q, v) = wall(pipe, density, 0, &pair)?;
    let n = n_from_viscometer.unwrap_or(1.0);
    positive("flow index n", n)?;
    let rate = nominal * (3.0 * n + 1.0) / (4.0 * n);
    let point = PlantPoint {
        flow_m3_s: q,
        wall_shear_stress_pa: tau_w,
        nominal_shear_rate_per_s: nominal,
        shear_rate_per_s: rate,
        n_prime: n,
        reynolds: 8.0 * density * v * v / tau_w,
    };
    check_laminar(&[point])?;
    Ok(SinglePair {
        point,
        apparent_viscosity_pa_s: tau_w / nominal,
        k_pa_sn: n_from_viscometer.map(|n| tau_w / rate.powf(n)),
    })
}
