//! The pressure to break a gelled plug and push it out, against what the pump can give and
//! what the line is rated for.

use super::error::{RestartError, non_negative, positive};

/// The line as the plug sees it.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct PlugLine {
    /// Inner diameter, m.
    pub diameter_m: f64,
    /// Length of gelled product, m (the fittings' equivalent length may be added, which errs
    /// on the safe side).
    pub length_m: f64,
    /// Static head to lift: ρ·g·Δz, Pa (negative downhill).
    pub static_pa: f64,
    /// Pressure held at the outlet (a filler head, a pressurised tank), gauge, Pa.
    pub back_pressure_pa: f64,
}

impl PlugLine {
    /// Checked: D, L > 0, back-pressure ≥ 0, static head finite.
    pub fn new(
        diameter_m: f64,
        length_m: f64,
        static_pa: f64,
        back_pressure_pa: f64,
    ) -> Result<Self, RestartError> {
        if !static_pa.is_finite() {
            return Err(RestartError::Negative {
                what: "static pressure (Pa)",
                value: static_pa,
            });
        }
        Ok(PlugLine {
            diameter_m: positive("inner diameter (m)", diameter_m)?,
            length_m: positive("line length (m)", length_m)?,
            static_pa,
            back_pressure_pa: non_negative("back-pressure (Pa)", back_pressure_pa)?,
        })
    }

    /// 4·L/D: the plug's wall area over its cross-section, per Pa of gel stress.
    pub fn wall_factor(&self) -> f64 {
        4.0 * self.length_m / self.diameter_m
    }

    /// The gel stress at which the pressure `p` just breaks the plug: (p − static − back)·D/(4L).
    pub fn gel_stress_for(&self, pressure_pa: f64) -> f64 {
        (pressure_pa - self.static_pa - self.back_pressure_pa) / self.wall_factor()
    }
}

/// ΔP_restart = 4·τ_gel·L/D + static head + back-pressure, by parts.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct RestartPressure {
    pub gel_stress_pa: f64,
    /// 4·τ_gel·L/D, Pa.
    pub plug_pa: f64,
    pub static_pa: f64,
    pub back_pressure_pa: f64,
    pub total_pa: f64,
}

impl RestartPressure {
    /// Force balance on a plug of length L in a bore D: τ·πDL = ΔP·πD²/4 gives ΔP = 4τL/D.
    /// Ignores compressibility and shrinkage, so conservative for long lines (Smith &
    /// Ramsden 1978).
    pub fn of(line: &PlugLine, gel_stress_pa: f64) -> RestartPressure {
        let plug_pa = line.wall_factor() * gel_stress_pa;
        RestartPressure {
            gel_stress_pa,
            plug_pa,
            static_pa: line.static_pa,
            back_pressure_pa: line.back_pressure_pa,
            total_pa: plug_pa + line.static_pa + line.back_pressure_pa,
        }
    }
}

/// Whether it restarts, and which limit stops it.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Outcome {
    /// Needs no more than the pump gives and the line is rated for.
    Restarts,
    /// Needs more than the pump can give.
    PumpTooWeak,
    /// The pump could, but the line's weakest part is rated below what is needed.
    LineTooWeak,
}

/// The restart pressure against the pump's limit and the line's design pressure.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct RestartCheck {
    pub pressure: RestartPressure,
    pub available_pa: f64,
    pub design_pa: Option<f64>,
    /// Available less needed, Pa (negative: short by this much).
    pub margin_to_available_pa: f64,
    /// Design less needed, Pa.
    pub margin_to_design_pa: Option<f64>,
    pub outcome: Outcome,
}

impl RestartCheck {
    pub fn will_restart(&self) -> bool {
        self.outcome == Outcome::Restarts
    }

    /// The lower of what the pump gives and what the line is rated for, Pa.
    pub fn usable_pa(&self) -> f64 {
        self.design_pa
            .map_or(self.available_pa, |d| d.min(self.available_pa))
    }
}

/// Check a restart at a gel stress against the limits. `available_pa` must be above zero.
pub fn check_restart(
    line: &PlugLine,
    gel_stress_pa: f64,
    available_pa: f64,
    design_pa: Option<f64>,
) -> Result<RestartCheck, RestartError> {
    if !(available_pa.is_finite() && available_pa > 0.0) {
        return Err(RestartError::NoLimit);
    }
    if let Some(d) = design_pa {
        positive("design pressure (Pa)", d)?;
    }
    non_negative("gel stress (Pa)", gel_stress_pa)?;
    let pressure = RestartPressure::of(line, gel_stress_pa);
    let margin_to_available_pa = available_pa - pressure.total_pa;
    let margin_to_design_pa = design_pa.map(|d| d - pressure.total_pa);
    let outcome = if margin_to_available_pa < 0.0 {
        Outcome::PumpTooWeak
    } else if margin_to_design_pa.is_some_and(|m| m < 0.0) {
        Outcome::LineTooWeak
    } else {
        Outcome::Restarts
    };
    Ok(RestartCheck {
        pressure,
        available_pa,
        design_pa,
        margin_to_available_pa,
        margin_to_design_pa,
        outcome,
    })
}
