//! Power at a speed by Metzner–Otto: effective shear rate ks·N, apparent viscosity, impeller
//! Reynolds number, power number from the curve, then power, torque and power per volume
//! against the drive's limits.

use super::curve::{Baffling, Overrides, PowerCurve, Regime, Shape};
use super::error::{MixError, fraction, positive};
use super::impeller::{ImpellerKind, Spread};
use super::limits::{LoadCheck, SpecificPowerBand};
use super::ribbon::{RibbonGeometry, kp_rieger};
use crate::rheology::Model;
use serde::Serialize;
use std::f64::consts::PI;

/// The tank and its impeller, SI.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Vessel {
    pub impeller: ImpellerKind,
    pub impeller_diameter_m: f64,
    pub baffling: Baffling,
    pub tank_diameter_m: Option<f64>,
    pub liquid_height_m: Option<f64>,
    pub overrides: Overrides,
    pub ribbon: Option<RibbonGeometry>,
}

/// What drives the impeller; each limit is optional.
#[derive(Debug, Clone, Copy, PartialEq, Default, Serialize)]
pub struct Drive {
    /// Rated shaft output of the motor, W.
    pub motor_rating_w: Option<f64>,
    /// 0–1; `None` for a direct drive (taken as 1).
    pub gearbox_efficiency: Option<f64>,
    /// Output torque limit of the gearbox, N·m.
    pub gearbox_torque_limit_n_m: Option<f64>,
}

/// The product in the tank.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Fluid {
    pub density_kg_m3: f64,
    pub model: Model,
}

/// The answer at one speed on one definite curve.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Point {
    pub speed_rps: f64,
    pub effective_shear_rate_per_s: f64,
    pub apparent_viscosity_pa_s: f64,
    pub reynolds: f64,
    pub regime: Regime,
    pub power_number: f64,
    pub power_w: f64,
    pub torque_n_m: f64,
}

/// The operating point with its ranges and verdicts.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Operating {
    pub point: Point,
    /// Over the ranges of ks, Kp and the turbulent Np.
    pub power_w: Spread,
    pub torque_n_m: Spread,
    pub volume_m3: Option<f64>,
    pub specific_power_w_m3: Option<Spread>,
    pub specific_power_band: Option<SpecificPowerBand>,
    /// Motor shaft power needed (impeller power / gearbox efficiency) against the rating.
    pub motor: Option<LoadCheck>,
    /// Impeller shaft torque against the gearbox's output limit.
    pub gearbox: Option<LoadCheck>,
}

impl Vessel {
    /// Check the geometry and build the impeller's power curve in this tank.
    pub fn power_curve(&self) -> Result<PowerCurve, MixError> {
        let d = positive("impeller diameter", self.impeller_diameter_m)?;
        if let Some(t) = self.tank_diameter_m {
            positive("tank diameter", t)?;
            if d >= t {
                return Err(MixError::ImpellerNotInsideTank {
                    impeller_m: d,
                    tank_m: t,
                });
            }
        }
        if let Some(h) = self.liquid_height_m {
            positive("liquid height", h)?;
        }
        let kp_geometry = self.ribbon_kp()?;
        PowerCurve::build(self.impeller, self.baffling, &self.overrides, kp_geometry)
    }

    fn ribbon_kp(&self) -> Result<Option<f64>, MixError> {
        match (self.ribbon, self.impeller, self.tank_diameter_m) {
            (None, _, _) => Ok(None),
            (Some(_), impeller, _) if impeller != ImpellerKind::HelicalRibbon => {
                Err(MixError::RibbonGeometryOnOther { impeller })
            }
            (Some(g), _, Some(t)) => kp_rieger(&g, self.impeller_diameter_m, t).map(Some),
            // The correlation needs the wall clearance; without the tank use the table Kp.
            (Some(_), _, None) => Ok(None),
        }
    }

    /// Liquid volume of a flat-bottomed cylinder, πT²H/4, m³ (a dished bottom differs a
    /// little).
    pub fn volume_m3(&self) -> Option<f64> {
        Some(PI * self.tank_diameter_m?.powi(2) * self.liquid_height_m? / 4.0)
    }
}

/// The speed must be positive; a yield-stress product at rest gets its own message.
pub(crate) fn check_speed(speed_rps: f64, model: &Model) -> Result<f64, MixError> {
    if speed_rps.is_finite() && speed_rps > 0.0 {
        return Ok(speed_rps);
    }
    if model.yield_stress() > 0.0 && speed_rps == 0.0 {
        return Err(MixError::ZeroSpeedWithYieldStress {
            tau0: model.yield_stress(),
        });
    }
    Err(MixError::SpeedNotPositive { value: speed_rps })
}

/// Metzner–Otto (1957) at one speed: γ̇_eff = ks·N, μa = τ(γ̇_eff)/γ̇_eff, Re = ρND²/μa,
/// Np from the curve, P = Np·ρN³D⁵, torque P/(2πN).
pub fn point_on(shape: &Shape, d: f64, fluid: &Fluid, speed_rps: f64) -> Result<Point, MixError> {
    let n = check_speed(speed_rps, &fluid.model)?;
    let rho = positive("density", fluid.density_kg_m3)?;
    let rate = shape.ks * n;
    let mu = positive(
        "apparent viscosity at the effective shear rate",
        fluid.model.apparent_viscosity(rate),
    )?;
    let reynolds = rho * n * d * d / mu;
    let np = shape.power_number(reynolds);
    let power = np * rho * n.powi(3) * d.powi(5);
    // Inputs far outside plant sizes (a subnormal speed, a 5 km impeller) can underflow or
    // overflow on the way (found by fuzzing): no answer then, rather than inf or NaN.
    for (what, value) in [
        ("Reynolds number", reynolds),
        ("power number", np),
        ("power", power),
        ("torque", power / (2.0 * PI * n)),
    ] {
        if !value.is_finite() {
            return Err(MixError::OutOfRange { what, value });
        }
    }
    Ok(Point {
        speed_rps: n,
        effective_shear_rate_per_s: rate,
        apparent_viscosity_pa_s: mu,
        reynolds,
        regime: shape.regime(reynolds),
        power_number: np,
        power_w: power,
        torque_n_m: power / (2.0 * PI * n),
    })
}

/// The operating point at `speed_rps`, its range over the curve's constants, and the checks
/// against the drive and the rules of thumb.
pub fn operate(
    vessel: &Vessel,
    drive: &Drive,
    fluid: &Fluid,
    speed_rps: f64,
) -> Result<Operating, MixError> {
    let curve = vessel.power_curve()?;
    let d = vessel.impeller_diameter_m;
    let point = point_on(&curve.nominal(), d, fluid, speed_rps)?;
    let mut powers = Vec::with_capacity(8);
    for shape in curve.corners() {
        powers.push(point_on(&shape, d, fluid, speed_rps)?.power_w);
    }
    let power = spread_of(point.power_w, &powers);
    let to_torque = 1.0 / (2.0 * PI * point.speed_rps);
    let torque = scale(power, to_torque);
    let volume = vessel.volume_m3();
    let specific = volume.map(|v| scale(power, 1.0 / v));
    Ok(Operating {
        point,
        power_w: power,
        torque_n_m: torque,
        volume_m3: volume,
        specific_power_w_m3: specific,
        specific_power_band: specific.map(|s| SpecificPowerBand::of(s.value)),
        motor: motor_check(drive, power)?,
        gearbox: match drive.gearbox_torque_limit_n_m {
            Some(limit) => Some(LoadCheck::new(
                torque,
                positive("gearbox torque limit", limit)?,
            )),
            None => None,
        },
    })
}

fn motor_check(drive: &Drive, power: Spread) -> Result<Option<LoadCheck>, MixError> {
    let Some(rating) = drive.motor_rating_w else {
        return Ok(None);
    };
    let rating = positive("motor rating", rating)?;
    let eff = match drive.gearbox_efficiency {
        Some(e) => fraction("gearbox efficiency", e)?,
        None => 1.0,
    };
    Ok(Some(LoadCheck::new(scale(power, 1.0 / eff), rating)))
}

fn spread_of(value: f64, others: &[f64]) -> Spread {
    let low = others.iter().copied().fold(value, f64::min);
    let high = others.iter().copied().fold(value, f64::max);
    Spread::new(low, value, high)
}

fn scale(s: Spread, k: f64) -> Spread {
    Spread::new(s.low * k, s.value * k, s.high * k)
}
