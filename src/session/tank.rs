//! A tank's answers in one call for both faces: power, torque and power per volume against
//! the drive, the viscosity the motor implies beside the viscometer's, the cavern against
//! the tank wall, the power curve for a chart, and the findings to put into words.

use super::tank_input::TankRequest;
use crate::mixing::Baffling;
use crate::mixing::{
    self, Agreement, BackCalc, Cavern, CavernFinding, Comparison, Electrical, FromPower, KRefusal,
    LoadVerdict, MixError, Operating, PowerCurve, Refusal, Regime, WallSpeed,
};

/// A cavern at the wall holding less than this share of the liquid still leaves product
/// above or below it standing (our own threshold, no source).
pub const MOSTLY_MOVING: f64 = 0.95;

/// Points on the chart's power curve.
pub const CHART_POINTS: usize = 80;

/// Below this share of its rating a motor's nameplate power factor and efficiency overstate
/// what it delivers (common practice, no source).
pub const LIGHT_LOAD_FRACTION: f64 = 0.5;

/// A viscosity read back with a sensitivity above this (d ln μ / d ln P) is flagged as weak:
/// a 10 % power error becomes more than 20 % in viscosity (our own threshold, no source).
pub const WEAK_SENSITIVITY: f64 = 2.0;

/// What the motor reading says.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MotorAnswer {
    pub shaft_power_w: f64,
    pub back: BackCalc,
    /// The motor's viscosity against the viscometer's curve, when read back.
    pub comparison: Option<Comparison>,
}

impl MotorAnswer {
    /// The read-back values, when not refused.
    pub fn done(&self) -> Option<&FromPower> {
        match &self.back {
            BackCalc::Done(d) => Some(d),
            BackCalc::Refused(_) => None,
        }
    }
}

/// Something about the tank worth a line of its own.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum TankFinding {
    MotorLoad(LoadVerdict),
    GearboxLoad(LoadVerdict),
    /// The point is on our bridge across the transition, not on a measured curve.
    Transitional,
    /// Turbulent in an unbaffled tank: the vortex makes the power number rough.
    UnbaffledTurbulent,
    /// Part of the tank does not move; `moving` is the share of liquid in the cavern.
    Stagnant {
        finding: CavernFinding,
        moving: Option<f64>,
    },
    /// Elson's model was built for impellers standing off the wall.
    CavernCloseClearance,
    BackCalcRefused(Refusal),
    KRefused(KRefusal),
    ViscosityDisagrees(Agreement),
    WeakBackCalc {
        sensitivity: f64,
    },
    LightLoad {
        fraction: f64,
    },
}

/// Every answer for one tank at one speed.
#[derive(Debug, Clone, PartialEq)]
pub struct TankAnswer {
    pub request: TankRequest,
    pub curve: PowerCurve,
    pub operating: Operating,
    pub cavern: Option<Cavern>,
    pub motor: Option<MotorAnswer>,
    /// (Re, Np) on the nominal curve, spanning the regimes and today's point.
    pub chart: Vec<(f64, f64)>,
    pub findings: Vec<TankFinding>,
}

impl TankAnswer {
    /// The cavern's speed to the wall, rev/s, when one was found.
    pub fn speed_to_wall_rps(&self) -> Option<f64> {
        match self.cavern?.speed_to_wall? {
            WallSpeed::Rps(n) => Some(n),
            WallSpeed::AtAnySpeed | WallSpeed::NotReached => None,
        }
    }
}

/// Work out everything for `req`.
pub fn analyse(req: &TankRequest) -> Result<TankAnswer, MixError> {
    let curve = req.vessel.power_curve()?;
    let operating = mixing::operate(&req.vessel, &req.drive, &req.fluid, req.speed_rps)?;
    let cavern = mixing::cavern(&req.vessel, &req.fluid, req.speed_rps)?;
    let motor = motor_answer(req, &operating)?;
    let chart = chart(&curve, operating.point.reynolds)?;
    let mut answer = TankAnswer {
        request: *req,
        curve,
        operating,
        cavern,
        motor,
        chart,
        findings: Vec::new(),
    };
    answer.findings = findings(&answer);
    Ok(answer)
}

fn motor_answer(req: &TankRequest, op: &Operating) -> Result<Option<MotorAnswer>, MixError> {
    let Some(reading) = req.motor else {
        return Ok(None);
    };
    let shaft = mixing::shaft_power_w(&reading)?;
    let back = mixing::viscosity_from_power(&req.vessel, &req.fluid, req.speed_rps, shaft)?;
    let comparison = match &back {
        BackCalc::Done(d) => Some(mixing::compare(
            &req.fluid.model,
            d.apparent_viscosity_pa_s,
            op.point.effective_shear_rate_per_s,
        )),
        BackCalc::Refused(_) => None,
    };
    Ok(Some(MotorAnswer {
        shaft_power_w: shaft,
        back,
        comparison,
    }))
}

fn chart(curve: &PowerCurve, today_re: f64) -> Result<Vec<(f64, f64)>, MixError> {
    let lo = (curve.re_laminar_below / 100.0).min(today_re / 3.0);
    let hi = (curve.re_turbulent_above * 10.0).max(today_re * 3.0);
    mixing::power_number_curve(&curve.nominal(), lo, hi, CHART_POINTS)
}

fn findings(a: &TankAnswer) -> Vec<TankFinding> {
    let mut out = Vec::new();
    let op = &a.operating;
    for (check, make) in [
        (
            op.motor,
            TankFinding::MotorLoad as fn(LoadVerdict) -> TankFinding,
        ),
        (op.gearbox, TankFinding::GearboxLoad),
    ] {
        if let Some(c) = check.filter(|c| c.verdict != LoadVerdict::Within) {
            out.push(make(c.verdict));
        }
    }
    match (op.point.regime, a.request.vessel.baffling) {
        (Regime::Transitional, _) => out.push(TankFinding::Transitional),
        (Regime::Turbulent, Baffling::Unbaffled) => out.push(TankFinding::UnbaffledTurbulent),
        _ => {}
    }
    cavern_findings(a, &mut out);
    if let Some(m) = &a.motor {
        motor_findings(a, m, &mut out);
    }
    out
}

fn cavern_findings(a: &TankAnswer, out: &mut Vec<TankFinding>) {
    let Some(c) = &a.cavern else { return };
    if a.request.vessel.impeller.sweeps_wall() {
        out.push(TankFinding::CavernCloseClearance);
    }
    let short_of_level = c.moving_volume_fraction.is_some_and(|m| m < MOSTLY_MOVING);
    let stagnant = match c.finding {
        Some(CavernFinding::ReachesWall) => short_of_level,
        Some(_) => true,
        None => false,
    };
    if let (true, Some(finding)) = (stagnant, c.finding) {
        out.push(TankFinding::Stagnant {
            finding,
            moving: c.moving_volume_fraction,
        });
    }
}

fn motor_findings(a: &TankAnswer, m: &MotorAnswer, out: &mut Vec<TankFinding>) {
    match &m.back {
        BackCalc::Refused(r) => out.push(TankFinding::BackCalcRefused(*r)),
        BackCalc::Done(d) => {
            if let Err(k) = d.k {
                out.push(TankFinding::KRefused(k));
            }
            if d.sensitivity > WEAK_SENSITIVITY {
                out.push(TankFinding::WeakBackCalc {
                    sensitivity: d.sensitivity,
                });
            }
        }
    }
    if let Some(c) = m.comparison.filter(|c| c.agreement != Agreement::Agree) {
        out.push(TankFinding::ViscosityDisagrees(c.agreement));
    }
    let three_phase = a
        .request
        .motor
        .is_some_and(|r| matches!(r.electrical, Electrical::ThreePhase { .. }));
    if let (true, Some(rating)) = (three_phase, a.request.drive.motor_rating_w) {
        let fraction = m.shaft_power_w / rating;
        if fraction < LIGHT_LOAD_FRACTION {
            out.push(TankFinding::LightLoad { fraction });
        }
    }
}
