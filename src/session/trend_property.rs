//! Which limited property a trend charts: K, n, τ0 or the apparent viscosity at a limit's
//! shear rate, read off each set's constants.

use super::trend::{Constants, DEFAULT_RATE_PER_S, TrendError};
use crate::site::{LimitProperty, Product};

/// The properties the product has a limit on, each once, in the config's order; the
/// apparent viscosity at [`DEFAULT_RATE_PER_S`] when it has none.
pub fn limited_properties(product: &Product) -> Vec<LimitProperty> {
    let mut out: Vec<LimitProperty> = Vec::new();
    for l in &product.limits {
        if !out.contains(&l.property) {
            out.push(l.property);
        }
    }
    if out.is_empty() {
        out.push(LimitProperty::ApparentViscosity {
            shear_rate_per_s: DEFAULT_RATE_PER_S,
        });
    }
    out
}

/// The value of `property` for one set (SI), when its model has it.
pub fn property_value(c: &Constants, property: LimitProperty) -> Option<f64> {
    match property {
        LimitProperty::ConsistencyIndex => c.k.value(),
        LimitProperty::FlowIndex => c.n.value(),
        LimitProperty::YieldStress => c.tau0.value(),
        LimitProperty::ApparentViscosity { shear_rate_per_s } => {
            Some(c.model.apparent_viscosity(shear_rate_per_s))
        }
    }
    .filter(|v| v.is_finite())
}

/// Accepted `--property` names, for messages.
pub const PROPERTY_NAMES: &str = "consistency-index (k), flow-index (n), yield-stress (tau0), \
     apparent-viscosity (mu-a, at the shear rate of the product's limit)";

/// `--property NAME`: the property or properties to chart. "apparent-viscosity" takes each
/// rate the product has a limit at (the default rate when it has none).
pub fn parse_property(text: &str, product: &Product) -> Result<Vec<LimitProperty>, TrendError> {
    let wanted = text.trim().to_ascii_lowercase().replace('_', "-");
    let one = match wanted.as_str() {
        "consistency-index" | "k" => LimitProperty::ConsistencyIndex,
        "flow-index" | "n" => LimitProperty::FlowIndex,
        "yield-stress" | "tau0" => LimitProperty::YieldStress,
        "apparent-viscosity" | "mu-a" | "mua" => {
            let rates: Vec<LimitProperty> = limited_properties(product)
                .into_iter()
                .filter(|p| matches!(p, LimitProperty::ApparentViscosity { .. }))
                .collect();
            return Ok(if rates.is_empty() {
                vec![LimitProperty::ApparentViscosity {
                    shear_rate_per_s: DEFAULT_RATE_PER_S,
                }]
            } else {
                rates
            });
        }
        _ => {
            return Err(TrendError::UnknownProperty {
                text: crate::text::sanitize(text, false),
                accepted: PROPERTY_NAMES,
            });
        }
    };
    Ok(vec![one])
}
