//! The line as the engine sees it (bore, lengths, roughness, rise) and the product in it.

use super::error::LineError;
use crate::rheology::Model;

/// Standard acceleration of gravity g_n, m/s² (3rd CGPM 1901; exact by definition).
pub const GRAVITY: f64 = 9.80665;

/// A straight run of round pipe with its fittings as an equivalent length.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Pipe {
    pub inner_diameter_m: f64,
    pub length_m: f64,
    /// Equivalent length of bends, valves and tees, added to the straight length, m.
    pub fittings_length_m: f64,
    /// Absolute roughness ε, m (used by Colebrook only).
    pub roughness_m: f64,
    /// Outlet height minus inlet height, m.
    pub elevation_change_m: f64,
}

impl Pipe {
    /// A plain straight pipe: no fittings, smooth, level.
    pub fn straight(inner_diameter_m: f64, length_m: f64) -> Self {
        Pipe {
            inner_diameter_m,
            length_m,
            fittings_length_m: 0.0,
            roughness_m: 0.0,
            elevation_change_m: 0.0,
        }
    }

    pub fn radius_m(&self) -> f64 {
        self.inner_diameter_m / 2.0
    }

    pub fn area_m2(&self) -> f64 {
        std::f64::consts::PI * self.radius_m().powi(2)
    }

    /// Straight length plus the fittings' equivalent length, m.
    pub fn total_length_m(&self) -> f64 {
        self.length_m + self.fittings_length_m
    }

    /// Mean velocity at a volumetric flow, m/s.
    pub fn velocity(&self, flow_m3_s: f64) -> f64 {
        flow_m3_s / self.area_m2()
    }

    /// Every dimension in range.
    pub fn check(&self) -> Result<(), LineError> {
        positive("inner diameter", self.inner_diameter_m)?;
        positive("length", self.length_m)?;
        if !(self.fittings_length_m.is_finite() && self.fittings_length_m >= 0.0) {
            return Err(LineError::NotFinite {
                what: "fittings length (zero or more)",
                value: self.fittings_length_m,
            });
        }
        let eps = self.roughness_m;
        if !(eps.is_finite() && eps >= 0.0 && eps <= 0.05 * self.inner_diameter_m) {
            return Err(LineError::BadRoughness { value: eps });
        }
        if !self.elevation_change_m.is_finite() {
            return Err(LineError::NotFinite {
                what: "elevation change",
                value: self.elevation_change_m,
            });
        }
        Ok(())
    }
}

/// The product: its flow curve at the line's temperature and its density.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Fluid {
    pub model: Model,
    pub density_kg_m3: f64,
}

impl Fluid {
    /// Density above zero and every flow-curve constant usable.
    pub fn check(&self) -> Result<(), LineError> {
        positive("density", self.density_kg_m3)?;
        for (name, value) in self.model.params() {
            let tau0 = matches!(name, crate::rheology::ParamName::Tau0);
            let ok = value.is_finite() && (value > 0.0 || (tau0 && value >= 0.0));
            if !ok {
                return Err(LineError::BadModel {
                    what: name.label(),
                    value,
                });
            }
        }
        Ok(())
    }

    /// Static head ρgΔz of a rise, Pa.
    pub fn static_pressure(&self, pipe: &Pipe) -> f64 {
        self.density_kg_m3 * GRAVITY * pipe.elevation_change_m
    }
}

pub(crate) fn positive(what: &'static str, value: f64) -> Result<(), LineError> {
    if value.is_finite() && value > 0.0 {
        Ok(())
    } else {
        Err(LineError::NotPositive { what, value })
    }
}
