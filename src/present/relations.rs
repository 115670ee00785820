//! The API RP 13D field relations beside a fit, as label and value pairs for the screens.

use super::{Style, quantity};
use crate::session::api_rp13d::ApiRp13d;
use crate::units::{Dimension, significant};

/// ("plastic viscosity PV", "12.0 mPa.s"), … in the order `fit` prints them.
pub fn field_relations(a: &ApiRp13d, style: Style) -> Vec<(&'static str, String)> {
    let mut out = vec![
        (
            "plastic viscosity PV",
            quantity(a.plastic_viscosity_pa_s, Dimension::DynamicViscosity, style),
        ),
        (
            "yield point YP",
            format!(
                "{} lbf/100 ft² = {} Pa",
                significant(a.yield_point_lbf_100ft2),
                significant(a.yield_point_pa)
            ),
        ),
        (
            "pipe n, K",
            format!("{:.4}, {} Pa·sⁿ", a.n, significant(a.k_pa_sn)),
        ),
    ];
    if let (Some(n), Some(k)) = (a.n_annulus, a.k_annulus_pa_sn) {
        out.push((
            "annulus n, K (100/3)",
            format!("{n:.4}, {} Pa·sⁿ", significant(k)),
        ));
    }
    out.into_iter()
        .map(|(label, value)| (label, style.text(&value)))
        .collect()
}
