//! Tank answers in words, shared by the CLI and the Tank view: the standing cautions, one
//! line per finding, and the names of regimes and verdicts.

use super::tank::{TankAnswer, TankFinding};
use crate::mixing::{
    Agreement, CavernFinding, KRefusal, LoadVerdict, MAX_SEARCH_RPS, Refusal, Regime,
    SpecificPowerBand, WallSpeed,
};

/// Printed with every tank answer.
pub const CAUTIONS: [&str; 5] = [
    "Stop and lock out the agitator before sampling from the tank, looking in or reaching in.",
    "Hot product: wear face and hand protection; let samples cool before handling them.",
    "Never run the agitator at full speed with the liquid level at the blades.",
    "Power, torque and viscosity here rest on generic impeller constants (the ranges shown); \
     the tool advises and does not certify.",
    "Local codes and licensed practice come first.",
];

pub fn regime(r: Regime) -> &'static str {
    match r {
        Regime::Laminar => "laminar",
        Regime::Transitional => "transitional",
        Regime::Turbulent => "turbulent",
    }
}

pub fn load(v: LoadVerdict) -> &'static str {
    match v {
        LoadVerdict::Within => "within the limit",
        LoadVerdict::Near => "near the limit",
        LoadVerdict::Over => "over the limit",
    }
}

/// What a power per volume is usually enough for (common practice, no source).
pub fn band(b: SpecificPowerBand) -> &'static str {
    match b {
        SpecificPowerBand::BelowUsual => "below what usually keeps a tank moving",
        SpecificPowerBand::KeepingUniform => "enough to keep a thin product uniform",
        SpecificPowerBand::BlendingHeatTransfer => "the usual range for blending and heat transfer",
        SpecificPowerBand::SuspensionDispersion => {
            "the usual range for suspending solids or dispersing gas"
        }
        SpecificPowerBand::ViscousPaste => "the usual range for viscous pastes",
        SpecificPowerBand::AboveUsual => "above what tanks are usually given",
    }
}

/// One line per finding, then why any contract value is missing.
pub fn findings(a: &TankAnswer) -> Vec<String> {
    let mut out: Vec<String> = a.findings.iter().map(finding).collect();
    if a.operating.specific_power_w_m3.is_none() {
        out.push("No power per volume: give the tank diameter and the liquid height.".into());
    }
    if let Some(c) = &a.cavern {
        out.extend(wall_speed(c.speed_to_wall));
    }
    out
}

/// Why there is no speed at which the cavern reaches the wall, if there is none.
fn wall_speed(w: Option<WallSpeed>) -> Option<String> {
    match w {
        Some(WallSpeed::Rps(_)) => None,
        None => Some("No cavern against the wall: give the tank diameter.".into()),
        Some(WallSpeed::AtAnySpeed) => Some(
            "The cavern model puts the cavern at the wall at any running speed (the impeller \
             nearly fills the tank), so no speed to reach the wall is given."
                .into(),
        ),
        Some(WallSpeed::NotReached) => Some(format!(
            "The cavern does not reach the wall below {MAX_SEARCH_RPS} rev/s."
        )),
    }
}

fn finding(f: &TankFinding) -> String {
    match *f {
        TankFinding::MotorLoad(v) => format!(
            "Motor: the power needed is {}; check before raising the speed or taking a thicker batch.",
            load(v)
        ),
        TankFinding::GearboxLoad(v) => format!(
            "Gearbox: the shaft torque is {}; a thicker or colder batch raises it further.",
            load(v)
        ),
        TankFinding::Transitional => "Transitional regime: the power number is bridged between \
             the laminar and turbulent constants, not read off a measured curve."
            .into(),
        TankFinding::UnbaffledTurbulent => "Turbulent in an unbaffled tank: swirl and the surface \
             vortex make the power number rough; a measured curve or the maker's value is better."
            .into(),
        TankFinding::Stagnant { finding, moving } => stagnant(finding, moving),
        TankFinding::CavernCloseClearance => "The cavern model was built for impellers that stand \
             off the wall; an anchor or ribbon sweeps the wall, so take the cavern as indicative."
            .into(),
        TankFinding::BackCalcRefused(r) => refusal(&r),
        TankFinding::KRefused(k) => k_refusal(&k),
        TankFinding::ViscosityDisagrees(g) => disagreement(g).into(),
        TankFinding::WeakBackCalc { sensitivity } => format!(
            "The motor's viscosity is weakly determined here: a 10 % error in power is about \
             {:.0} % in viscosity.",
            10.0 * sensitivity
        ),
        TankFinding::LightLoad { fraction } => format!(
            "The motor runs at about {:.0} % of its rating: at light load the nameplate power \
             factor and efficiency overstate the power; a power meter reading is better.",
            100.0 * fraction
        ),
    }
}

fn stagnant(finding: CavernFinding, moving: Option<f64>) -> String {
    let share = moving.map_or(String::new(), |m| {
        format!(" (about {:.0} % of the liquid moves)", 100.0 * m)
    });
    match finding {
        CavernFinding::WithinImpeller => format!(
            "Stagnant product: the product hardly moves beyond the blades{share}; raise the speed \
             or heat the product to lower its yield stress."
        ),
        CavernFinding::ReachesWall => format!(
            "Stagnant product: the cavern reaches the wall but not the whole liquid height{share}; \
             product above and below it does not turn over."
        ),
        CavernFinding::StagnantRing => format!(
            "Stagnant product: the cavern does not reach the wall{share}; product near the wall \
             and above the cavern does not turn over."
        ),
    }
}

/// Why the viscosity was not read back from the motor.
pub fn refusal(r: &Refusal) -> String {
    match *r {
        Refusal::Turbulent {
            power_number,
            np_turbulent,
        } => format!(
            "No viscosity from the motor: the power number {power_number:.3} is on the turbulent \
             part of the curve (about {np_turbulent}), where power hardly depends on viscosity."
        ),
        Refusal::NoPowerLeft { shaft_power_w } => format!(
            "No viscosity from the motor: after the no-load power nothing is left for the product \
             ({shaft_power_w:.0} W); check the reading and the no-load power."
        ),
    }
}

fn k_refusal(k: &KRefusal) -> String {
    match *k {
        KRefusal::NoFlowIndex => {
            "No K from the motor: the Casson model has no flow index to carry over.".into()
        }
        KRefusal::YieldStressExceeds {
            from_yield_stress_pa_s,
        } => format!(
            "No K from the motor: the viscometer's yield stress alone gives {from_yield_stress_pa_s:.3} \
             Pa·s, more than the motor implies; the product in the tank is thinner than the sample."
        ),
    }
}

/// What a disagreement between motor and viscometer may mean.
pub fn disagreement(g: Agreement) -> &'static str {
    match g {
        Agreement::Agree => "The motor and the viscometer agree within the constants' spread.",
        Agreement::MotorHigher => {
            "The motor implies a thicker product than the viscometer. It may be a colder or \
             different batch than the sample, a worn gearbox or bearings (losses counted as \
             product power), a motor reading at light load, no no-load power taken off, or \
             product built up on the wall or the blades."
        }
        Agreement::MotorLower => {
            "The motor implies a thinner product than the viscometer. It may be a warmer or \
             different batch than the sample, a sample taken from stagnant product, product \
             broken down by long shearing in the tank, or the level at or below the blades."
        }
    }
}
