//! Extra sections of the `fit` table: readings left out of the fit and the API RP 13D field
//! relations.

use crate::present::{self, Style};
use crate::session::FlowCurve;
use crate::session::api_rp13d::{ApiRp13d, CONVERSION_NOTE};
use crate::units::{self, Dimension};
use std::fmt::Write as _;

/// Both sections, each only when it has something to show.
pub fn sections(curve: &FlowCurve, style: Style) -> String {
    let mut out = left_out(curve);
    if let Some(a) = &curve.api_rp13d {
        out.push_str(&api(a, style));
    }
    out
}

fn left_out(curve: &FlowCurve) -> String {
    if curve.left_out.is_empty() {
        return String::new();
    }
    let mut out = String::from("\n  left out of the fit (dial at or above full scale):\n");
    for l in &curve.left_out {
        let _ = writeln!(
            out,
            "    {:>3} {:>7} {:>7}  pegged (full scale {})",
            l.row,
            units::significant(l.rpm),
            units::significant(l.dial),
            units::significant(l.full_scale_dial)
        );
    }
    out
}

fn api(a: &ApiRp13d, style: Style) -> String {
    let mut out =
        String::from("\n  API RP 13D field relations (from the 600 and 300 rpm readings):\n");
    let visc = present::quantity(a.plastic_viscosity_pa_s, Dimension::DynamicViscosity, style);
    let _ = writeln!(out, "    plastic viscosity PV   {visc}");
    let _ = writeln!(
        out,
        "    yield point YP         {} lbf/100 ft² = {} Pa",
        units::significant(a.yield_point_lbf_100ft2),
        units::significant(a.yield_point_pa)
    );
    let _ = writeln!(
        out,
        "    pipe n, K              {:.4}, {} Pa·sⁿ",
        a.n,
        units::significant(a.k_pa_sn)
    );
    if let (Some(n), Some(k)) = (a.n_annulus, a.k_annulus_pa_sn) {
        let _ = writeln!(
            out,
            "    annulus n, K (100/3)   {n:.4}, {} Pa·sⁿ",
            units::significant(k)
        );
    }
    let _ = writeln!(out, "    note: {CONVERSION_NOTE}");
    out
}
