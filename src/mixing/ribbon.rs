//! The helical ribbon's laminar constant Kp from its geometry (Rieger et al. 1988).

use super::error::MixError;
use serde::Serialize;

/// A helical ribbon's shape, SI.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct RibbonGeometry {
    /// h: height of the ribbon, m.
    pub height_m: f64,
    /// p: pitch, the height of one full turn of a blade, m.
    pub pitch_m: f64,
    /// w: radial width of one blade, m.
    pub width_m: f64,
    /// nb: number of blades (flights).
    pub blades: u32,
}

/// Kp = 82.8 (h/D)(c/D)^−0.38 (p/D)^−0.35 (w/D)^0.20 nb^0.78, with c = (T − D)/2 the wall
/// clearance.
///
/// Rieger, Novák & Havelková (1988), "The influence of the geometrical shape on the power
/// requirements of ribbon impellers", Int. Chem. Eng. 28:376–383; recommended in Paul,
/// Atiemo-Obeng & Kresta (2004), *Handbook of Industrial Mixing*, section 9, whose example 9-6
/// gives Kp ≈ 357 for D = 1.9 m, T = 2 m, h = 1.9 m, p = 1.9 m, w = 0.19 m, two blades.
/// Laminar regime only. The data range (roughly c/D 0.02–0.1, p/D 0.5–1.5, one or two
/// blades) is from memory; outside it the value is an extrapolation.
pub fn kp_rieger(
    geometry: &RibbonGeometry,
    impeller_diameter_m: f64,
    tank_diameter_m: f64,
) -> Result<f64, MixError> {
    let d = impeller_diameter_m;
    let g = geometry;
    if g.blades == 0 {
        return Err(MixError::RibbonBlades);
    }
    for (what, v) in [
        ("ribbon height", g.height_m),
        ("ribbon pitch", g.pitch_m),
        ("ribbon width", g.width_m),
    ] {
        if !(v.is_finite() && v > 0.0) {
            return Err(MixError::NotPositive { what, value: v });
        }
    }
    let clearance = 0.5 * (tank_diameter_m - d);
    if clearance.is_nan() || clearance <= 0.0 {
        return Err(MixError::ImpellerNotInsideTank {
            impeller_m: d,
            tank_m: tank_diameter_m,
        });
    }
    let kp = 82.8
        * (g.height_m / d)
        * (clearance / d).powf(-0.38)
        * (g.pitch_m / d).powf(-0.35)
        * (g.width_m / d).powf(0.20)
        * f64::from(g.blades).powf(0.78);
    Ok(kp)
}
