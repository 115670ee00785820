//! `[[product]]` tables: density, reference temperature, gel build-up and spec limits.

use super::errors::{ErrorKind, Sink};
use super::fields::{Need, Rule};
use super::model::{GelBuildUp, LimitProperty, Product, SpecLimit};
use super::raw::RawTable;
use crate::units::Dimension;

pub(crate) const PRODUCT_KEYS: &[&str] = &[
    "name",
    "description",
    "density",
    "reference_temperature",
    "activation_energy",
    "gel",
    "limit",
    "nominal",
];
const GEL_KEYS: &[&str] = &["initial", "long_rest", "rebuild_time"];
const LIMIT_KEYS: &[&str] = &["property", "min", "max", "shear_rate"];

/// Densities outside this are almost surely a unit slip (an SG typed as kg/m3), kg/m³.
const DENSITY_RANGE: (f64, f64) = (300.0, 5000.0);

/// Which limit property, before its shear rate (if any) is read.
#[derive(Debug, Clone, Copy, PartialEq)]
enum Property {
    K,
    N,
    Tau0,
    Viscosity,
}

const PROPERTIES: [(&str, Property); 4] = [
    ("consistency-index", Property::K),
    ("flow-index", Property::N),
    ("yield-stress", Property::Tau0),
    ("apparent-viscosity", Property::Viscosity),
];

pub(crate) fn build(mut t: RawTable, sink: &mut Sink) -> Option<Product> {
    let name = t.id(sink, "name", Need::Required);
    if let Some(n) = &name {
        t.name_it(n);
    }
    let description = t
        .text(sink, "description", Need::Optional)
        .unwrap_or_default();
    let (lo, hi) = DENSITY_RANGE;
    let density = t.quantity(
        sink,
        "density",
        Dimension::Density,
        Rule::Within(lo, hi),
        Need::Required,
    );
    let reference = t.quantity(
        sink,
        "reference_temperature",
        Dimension::Temperature,
        Rule::Positive,
        Need::Required,
    );
    let ea = t.quantity(
        sink,
        "activation_energy",
        Dimension::MolarEnergy,
        Rule::NonNegative,
        Need::Optional,
    );
    let gel = t.table("gel", GEL_KEYS, sink).map(|g| gel(&g, sink));
    let nominal = t
        .table("nominal", super::nominal::NOMINAL_KEYS, sink)
        .map(|n| super::nominal::build(&n, sink));
    let limits: Vec<Option<SpecLimit>> = t
        .tables("limit", LIMIT_KEYS, sink)
        .iter()
        .map(|l| limit(l, sink))
        .collect();
    Some(Product {
        name: name?,
        description,
        density_kg_m3: density?,
        reference_temperature_k: reference?,
        activation_energy_j_mol: ea,
        gel: gel.flatten(),
        nominal: nominal.flatten(),
        limits: limits.into_iter().collect::<Option<Vec<_>>>()?,
    })
}

fn gel(t: &RawTable, sink: &mut Sink) -> Option<GelBuildUp> {
    let stress = |key, sink: &mut Sink| {
        t.quantity(
            sink,
            key,
            Dimension::Stress,
            Rule::NonNegative,
            Need::Required,
        )
    };
    let initial = stress("initial", sink);
    let long_rest = stress("long_rest", sink);
    let rebuild = t.quantity(
        sink,
        "rebuild_time",
        Dimension::Time,
        Rule::Positive,
        Need::Required,
    );
    let (initial, long_rest) = (initial?, long_rest?);
    if long_rest < initial {
        let msg = "must be at least the initial static yield stress: gel builds up at rest";
        t.fail(sink, "long_rest", ErrorKind::BadValue, msg.into());
        return None;
    }
    Some(GelBuildUp {
        initial_pa: initial,
        long_rest_pa: long_rest,
        rebuild_time_s: rebuild?,
    })
}

fn limit(t: &RawTable, sink: &mut Sink) -> Option<SpecLimit> {
    let property = t.choice(sink, "property", &PROPERTIES, Need::Required);
    let (dim, rule) = match property {
        Some(Property::Tau0) => (Dimension::Stress, Rule::NonNegative),
        Some(Property::Viscosity) => (Dimension::DynamicViscosity, Rule::Positive),
        _ => (Dimension::Dimensionless, Rule::Positive),
    };
    let shear_rate = shear_rate(t, property, sink);
    let min = t.quantity(sink, "min", dim, rule, Need::Optional);
    let max = t.quantity(sink, "max", dim, rule, Need::Optional);
    if !t.has("min") && !t.has("max") {
        t.need(sink, "min", Need::Required, "give 'min', 'max' or both");
        return None;
    }
    if let (Some(lo), Some(hi)) = (min, max)
        && hi < lo
    {
        t.fail(
            sink,
            "max",
            ErrorKind::BadValue,
            "must not be below 'min'".into(),
        );
        return None;
    }
    let property = match property? {
        Property::K => LimitProperty::ConsistencyIndex,
        Property::N => LimitProperty::FlowIndex,
        Property::Tau0 => LimitProperty::YieldStress,
        Property::Viscosity => LimitProperty::ApparentViscosity {
            shear_rate_per_s: shear_rate?,
        },
    };
    Some(SpecLimit { property, min, max })
}

/// The shear rate an apparent-viscosity limit is stated at; refused for other properties.
fn shear_rate(t: &RawTable, property: Option<Property>, sink: &mut Sink) -> Option<f64> {
    match property {
        Some(Property::Viscosity) => t.quantity(
            sink,
            "shear_rate",
            Dimension::ShearRate,
            Rule::Positive,
            Need::Required,
        ),
        Some(_) if t.has("shear_rate") => {
            let msg = "used only with property 'apparent-viscosity'; remove it".into();
            t.fail(sink, "shear_rate", ErrorKind::BadValue, msg);
            None
        }
        _ => None,
    }
}
