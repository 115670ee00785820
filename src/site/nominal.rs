//! `[product.nominal]`: a product's nominal flow curve (one model and its constants) at the
//! product's reference temperature, used when no measured curve is at hand.

use super::errors::{ErrorKind, Sink};
use super::fields::{Need, Rule};
use super::model::NominalCurve;
use super::raw::RawTable;
use crate::units::Dimension;

pub(crate) const NOMINAL_KEYS: &[&str] = &["model", "mu", "k", "n", "tau0", "mu_p", "mu_c"];

/// The model names, as `rheoside fit --model` spells them.
#[derive(Debug, Clone, Copy, PartialEq)]
enum Kind {
    Newtonian,
    PowerLaw,
    Bingham,
    HerschelBulkley,
    Casson,
}

const KINDS: [(&str, Kind); 5] = [
    ("newtonian", Kind::Newtonian),
    ("power-law", Kind::PowerLaw),
    ("bingham", Kind::Bingham),
    ("herschel-bulkley", Kind::HerschelBulkley),
    ("casson", Kind::Casson),
];

/// The constants each model takes; any other constant is refused.
fn keys_of(kind: Kind) -> &'static [&'static str] {
    match kind {
        Kind::Newtonian => &["mu"],
        Kind::PowerLaw => &["k", "n"],
        Kind::Bingham => &["tau0", "mu_p"],
        Kind::HerschelBulkley => &["tau0", "k", "n"],
        Kind::Casson => &["tau0", "mu_c"],
    }
}

pub(crate) fn build(t: &RawTable, sink: &mut Sink) -> Option<NominalCurve> {
    let kind = t.choice(sink, "model", &KINDS, Need::Required)?;
    let wanted = keys_of(kind);
    let mut ok = true;
    for key in &NOMINAL_KEYS[1..] {
        if t.has(key) && !wanted.contains(key) {
            let msg = format!(
                "not a constant of this model; it takes {}",
                wanted.join(" and ")
            );
            t.fail(sink, key, ErrorKind::BadValue, msg);
            ok = false;
        }
    }
    let viscosity = |key, sink: &mut Sink| {
        t.quantity(
            sink,
            key,
            Dimension::DynamicViscosity,
            Rule::Positive,
            Need::Required,
        )
    };
    let k = |sink: &mut Sink| t.number(sink, "k", Rule::Positive, Need::Required);
    // n outside 0.05–3 is almost surely a slip (a K typed as n); common practice, no source.
    let n = |sink: &mut Sink| t.number(sink, "n", Rule::Within(0.05, 3.0), Need::Required);
    let tau0 = |sink: &mut Sink| {
        t.quantity(
            sink,
            "tau0",
            Dimension::Stress,
            Rule::NonNegative,
            Need::Required,
        )
    };
    let curve = match kind {
        Kind::Newtonian => NominalCurve::Newtonian {
            mu_pa_s: viscosity("mu", sink)?,
        },
        Kind::PowerLaw => {
            let (k, n) = (k(sink), n(sink));
            NominalCurve::PowerLaw { k_pa_sn: k?, n: n? }
        }
        Kind::Bingham => {
            let (tau0, mu_p) = (tau0(sink), viscosity("mu_p", sink));
            NominalCurve::Bingham {
                tau0_pa: tau0?,
                mu_p_pa_s: mu_p?,
            }
        }
        Kind::HerschelBulkley => {
            let (tau0, k, n) = (tau0(sink), k(sink), n(sink));
            NominalCurve::HerschelBulkley {
                tau0_pa: tau0?,
                k_pa_sn: k?,
                n: n?,
            }
        }
        Kind::Casson => {
            let (tau0, mu_c) = (tau0(sink), viscosity("mu_c", sink));
            NominalCurve::Casson {
                tau0_pa: tau0?,
                mu_c_pa_s: mu_c?,
            }
        }
    };
    ok.then_some(curve)
}
