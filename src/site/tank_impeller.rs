//! A tank's own impeller constants (ks, Kp, turbulent Np), its ribbon shape, and the drive's
//! no-load power: optional `[[tank]]` fields, each checked on its own and against the
//! impeller type.

use super::errors::{ErrorKind, Sink};
use super::fields::{Need, Rule};
use super::model::{Impeller, RibbonShape, TankConstants};
use super::raw::RawTable;
use crate::units::Dimension;

/// The optional keys this file reads.
pub(crate) const KEYS: &[&str] = &[
    "ks",
    "kp",
    "np_turbulent",
    "ribbon_height",
    "ribbon_pitch",
    "ribbon_width",
    "ribbon_blades",
    "no_load_power",
];

const RIBBON_KEYS: [&str; 4] = [
    "ribbon_height",
    "ribbon_pitch",
    "ribbon_width",
    "ribbon_blades",
];

/// Most flights a ribbon impeller is built with; more is surely a typing slip.
const MAX_RIBBON_BLADES: f64 = 8.0;

/// The site's impeller constants; each replaces the published value when given.
pub(crate) fn constants(t: &RawTable, sink: &mut Sink) -> TankConstants {
    let opt = Need::Optional;
    TankConstants {
        ks: t.number(sink, "ks", Rule::Positive, opt),
        kp: t.number(sink, "kp", Rule::Positive, opt),
        np_turbulent: t.number(sink, "np_turbulent", Rule::Positive, opt),
    }
}

/// Shaft power with the impeller turning in an empty tank, W.
pub(crate) fn no_load_power(t: &RawTable, sink: &mut Sink) -> Option<f64> {
    let dim = Dimension::Power;
    t.quantity(
        sink,
        "no_load_power",
        dim,
        Rule::NonNegative,
        Need::Optional,
    )
}

/// The ribbon's shape: all four keys or none, and only on a helical ribbon.
pub(crate) fn ribbon(
    t: &RawTable,
    sink: &mut Sink,
    impeller: Option<Impeller>,
) -> Option<RibbonShape> {
    let given: Vec<&str> = RIBBON_KEYS.iter().copied().filter(|k| t.has(k)).collect();
    let first = *given.first()?;
    if let Some(other) = impeller.filter(|i| *i != Impeller::HelicalRibbon) {
        let msg = format!(
            "ribbon geometry applies to impeller = 'helical-ribbon' only, not '{}'; remove it",
            other.name()
        );
        t.fail(sink, first, ErrorKind::BadValue, msg);
        return None;
    }
    if given.len() < RIBBON_KEYS.len() {
        let missing: Vec<&str> = RIBBON_KEYS.iter().copied().filter(|k| !t.has(k)).collect();
        let msg = format!(
            "the ribbon's Kp needs all of {}; missing: {}",
            RIBBON_KEYS.join(", "),
            missing.join(", ")
        );
        t.fail(sink, first, ErrorKind::Missing, msg);
        return None;
    }
    read_ribbon(t, sink)
}

fn read_ribbon(t: &RawTable, sink: &mut Sink) -> Option<RibbonShape> {
    let len = Dimension::Length;
    let req = Need::Required;
    let height = t.quantity(sink, "ribbon_height", len, Rule::Positive, req);
    let pitch = t.quantity(sink, "ribbon_pitch", len, Rule::Positive, req);
    let width = t.quantity(sink, "ribbon_width", len, Rule::Positive, req);
    let blades = t.number(
        sink,
        "ribbon_blades",
        Rule::Within(1.0, MAX_RIBBON_BLADES),
        req,
    );
    let blades = blades?;
    if blades.fract() != 0.0 {
        let msg = "the number of blades must be a whole number, e.g. 2".into();
        t.fail(sink, "ribbon_blades", ErrorKind::BadValue, msg);
        return None;
    }
    Some(RibbonShape {
        height_m: height?,
        pitch_m: pitch?,
        width_m: width?,
        // Whole and within 1–8, checked above.
        blades: blades as u32,
    })
}
