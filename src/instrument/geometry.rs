//! Viscometer geometries: the standard six-speed rotor–bob, coaxial cylinders from their
//! dimensions, and a cylindrical spindle in a large container.

use super::error::InstrumentError;
use std::f64::consts::PI;

/// Rotor (outer cylinder) radius of the standard direct-indicating viscometer, m.
///
/// API RP 13B-1 / ISO 10414-1 rotor–bob R1-B1 [from memory; confirm against the primary text].
pub const STANDARD_ROTOR_RADIUS_M: f64 = 0.018415;
/// Bob radius of the standard direct-indicating viscometer, m [from memory, as above].
pub const STANDARD_BOB_RADIUS_M: f64 = 0.017245;
/// Bob length of the standard direct-indicating viscometer, m [from memory, as above].
pub const STANDARD_BOB_LENGTH_M: f64 = 0.038;
/// Bob shear stress per dial degree with the standard spring, Pa.
///
/// Follows from API's apparent viscosity AV = θ600/2 mPa·s at 1022 s⁻¹ (API glossary); the
/// nominal spring constant and bob length would give about 0.544, so 0.511 is used as the
/// calibrated value (the API definition of apparent viscosity, AV = θ600/2 mPa·s at
/// 1022 s⁻¹, API RP 13D glossary).
pub const STANDARD_STRESS_PER_DIAL_PA: f64 = 0.511;
/// Full-scale dial of the standard instrument, degrees [from memory].
pub const STANDARD_FULL_SCALE_DIAL: f64 = 300.0;
/// The six speeds of the standard instrument, rpm, in the usual reading order.
pub const STANDARD_SPEEDS_RPM: [f64; 6] = [600.0, 300.0, 200.0, 100.0, 6.0, 3.0];

/// Angular speed per rpm, rad/s.
pub(crate) const OMEGA_PER_RPM: f64 = 2.0 * PI / 60.0;

/// Coaxial cylinders given by their dimensions (fluid in the gap between bob and cup).
#[derive(Debug, Clone, PartialEq, serde::Serialize, serde::Deserialize)]
pub struct Coaxial {
    pub bob_radius_m: f64,
    pub cup_radius_m: f64,
    pub bob_length_m: f64,
    /// Torque on the bob per dial unit, N·m.
    pub torque_per_dial_n_m: f64,
    pub full_scale_dial: f64,
    /// Effective bob length / geometric bob length (end effects); 1 if not calibrated.
    #[serde(default = "one")]
    pub end_effect_factor: f64,
}

/// A cylindrical spindle turning in a container much wider than itself (s → ∞).
#[derive(Debug, Clone, PartialEq, serde::Serialize, serde::Deserialize)]
pub struct Spindle {
    pub radius_m: f64,
    pub length_m: f64,
    /// Torque on the spindle per dial unit, N·m.
    pub torque_per_dial_n_m: f64,
    pub full_scale_dial: f64,
    /// Effective length / geometric length (end effects); 1 if not calibrated.
    #[serde(default = "one")]
    pub end_effect_factor: f64,
}

fn one() -> f64 {
    1.0
}

/// A rotational viscometer geometry.
#[derive(Debug, Clone, PartialEq, serde::Serialize, serde::Deserialize)]
#[serde(rename_all = "kebab-case")]
pub enum Geometry {
    /// Direct-indicating six-speed oilfield viscometer, standard rotor–bob and spring.
    StandardSixSpeed,
    Coaxial(Coaxial),
    Spindle(Spindle),
}

impl Geometry {
    /// The geometry with a plain name; only `standard-six-speed` has one (any case).
    pub fn from_name(name: &str) -> Result<Geometry, InstrumentError> {
        match name.trim().to_ascii_lowercase().as_str() {
            "standard-six-speed" => Ok(Geometry::StandardSixSpeed),
            _ => Err(InstrumentError::UnknownGeometry {
                name: name.to_string(),
            }),
        }
    }

    /// Dial value at 100 % of the scale.
    pub fn full_scale_dial(&self) -> f64 {
        match self {
            Geometry::StandardSixSpeed => STANDARD_FULL_SCALE_DIAL,
            Geometry::Coaxial(c) => c.full_scale_dial,
            Geometry::Spindle(s) => s.full_scale_dial,
        }
    }

    /// Bob shear stress per dial unit, Pa: τb = T/(2πRb²L_eff) with L_eff = factor × L.
    pub fn stress_per_dial_pa(&self) -> f64 {
        match self {
            Geometry::StandardSixSpeed => STANDARD_STRESS_PER_DIAL_PA,
            Geometry::Coaxial(c) => {
                bob_stress_per_torque(c.bob_radius_m, c.bob_length_m * c.end_effect_factor)
                    * c.torque_per_dial_n_m
            }
            Geometry::Spindle(s) => {
                bob_stress_per_torque(s.radius_m, s.length_m * s.end_effect_factor)
                    * s.torque_per_dial_n_m
            }
        }
    }

    /// Newtonian bob shear rate per rpm, s⁻¹: Margules 2Ω/(1−κ²); 2Ω for a spindle (κ → 0).
    pub fn newtonian_rate_per_rpm(&self) -> f64 {
        let kappa = self.radius_ratio().map_or(0.0, |s| 1.0 / s);
        2.0 * OMEGA_PER_RPM / (1.0 - kappa * kappa)
    }

    /// s = Rc/Rb (cup over bob radius); `None` for a spindle in a large container.
    pub fn radius_ratio(&self) -> Option<f64> {
        match self {
            Geometry::StandardSixSpeed => Some(STANDARD_ROTOR_RADIUS_M / STANDARD_BOB_RADIUS_M),
            Geometry::Coaxial(c) => Some(c.cup_radius_m / c.bob_radius_m),
            Geometry::Spindle(_) => None,
        }
    }

    /// Check every dimension; the error names the first bad field and what is accepted.
    pub fn validate(&self) -> Result<(), InstrumentError> {
        match self {
            Geometry::StandardSixSpeed => Ok(()),
            Geometry::Coaxial(c) => validate_coaxial(c),
            Geometry::Spindle(s) => {
                positive("spindle radius (m)", s.radius_m)?;
                positive("spindle length (m)", s.length_m)?;
                positive("torque per dial unit (N·m)", s.torque_per_dial_n_m)?;
                positive("full-scale dial", s.full_scale_dial)?;
                positive("end-effect factor", s.end_effect_factor)
            }
        }
    }

    /// The same geometry with its end-effect factor set (e.g. from a calibration).
    pub fn with_end_effect_factor(&self, factor: f64) -> Result<Geometry, InstrumentError> {
        positive("end-effect factor", factor)?;
        match self {
            Geometry::StandardSixSpeed => Err(InstrumentError::NoEndEffectFactor),
            Geometry::Coaxial(c) => Ok(Geometry::Coaxial(Coaxial {
                end_effect_factor: factor,
                ..c.clone()
            })),
            Geometry::Spindle(s) => Ok(Geometry::Spindle(Spindle {
                end_effect_factor: factor,
                ..s.clone()
            })),
        }
    }

    /// Bob radius and geometric length, m, for the torque-based geometries.
    pub(crate) fn bob_dimensions(&self) -> Option<(f64, f64, f64)> {
        match self {
            Geometry::StandardSixSpeed => None,
            Geometry::Coaxial(c) => Some((c.bob_radius_m, c.bob_length_m, c.torque_per_dial_n_m)),
            Geometry::Spindle(s) => Some((s.radius_m, s.length_m, s.torque_per_dial_n_m)),
        }
    }
}

/// τb per unit torque for a bob of radius r and (effective) length l: 1/(2πr²l).
pub(crate) fn bob_stress_per_torque(radius_m: f64, length_m: f64) -> f64 {
    1.0 / (2.0 * PI * radius_m * radius_m * length_m)
}

fn validate_coaxial(c: &Coaxial) -> Result<(), InstrumentError> {
    positive("bob radius (m)", c.bob_radius_m)?;
    positive("cup radius (m)", c.cup_radius_m)?;
    if c.cup_radius_m <= c.bob_radius_m {
        return Err(InstrumentError::BadGeometry {
            field: "cup radius (m)",
            value: c.cup_radius_m,
            accepted: "larger than the bob radius",
        });
    }
    positive("bob length (m)", c.bob_length_m)?;
    positive("torque per dial unit (N·m)", c.torque_per_dial_n_m)?;
    positive("full-scale dial", c.full_scale_dial)?;
    positive("end-effect factor", c.end_effect_factor)
}

fn positive(field: &'static str, value: f64) -> Result<(), InstrumentError> {
    if value.is_finite() && value > 0.0 {
        Ok(())
    } else {
        Err(InstrumentError::BadGeometry {
            field,
            value,
            accepted: "a finite number above 0",
        })
    }
}
