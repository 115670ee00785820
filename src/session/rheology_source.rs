//! Where a product's flow curve comes from for a line, pump or tank answer: constants typed
//! as flags, the product's latest fitted set in a journal, or the nominal constants the site
//! config gives the product; and the Arrhenius shift to the temperature the answer is for.
//!
//! The shift follows the usual rule for food and process fluids: the viscosity parameter
//! (μ, K, μp or μc) follows K(T) = K_ref·exp[(Ea/R)(1/T − 1/T_ref)], n is independent of
//! temperature (Steffe 1996, *Rheological Methods in Food Process Engineering*, §1.10), and the
//! yield stress is taken as measured because it has no general temperature law.

use super::rheology_shift::shift_for;
pub use super::rheology_shift::{Shift, scale_viscosity};
use super::state::SessionState;
use super::temperature::viscosity_parameter;
use crate::rheology::{Fit, Model, ParamName};
use crate::site::{NominalCurve, Product, Site};
use chrono::{DateTime, Utc};
use std::path::{Path, PathBuf};

/// What the caller asks for: each part optional, checked by [`resolve`].
#[derive(Debug, Clone, Default)]
pub struct SourceRequest {
    /// Constants typed on the command line (already parsed into one model).
    pub flags: Option<Model>,
    /// The product's name in the site config.
    pub product: Option<String>,
    /// A session journal to take the product's latest fitted set from.
    pub journal: Option<PathBuf>,
    /// The temperature the answer is for (the line's), K.
    pub temperature_k: Option<f64>,
}

/// Where the curve came from.
#[derive(Debug, Clone, PartialEq)]
pub enum Origin {
    /// Typed as flags; taken as valid at the requested temperature.
    Flags,
    /// The product's latest fitted viscometer set in a journal.
    Journal {
        path: PathBuf,
        seq: u64,
        viscometer: String,
        recorded_utc: DateTime<Utc>,
    },
    /// The nominal constants of the product in the site config.
    SiteNominal { product: String },
    /// The product's latest fitted set in the live session (the screens).
    Session {
        seq: u64,
        viscometer: String,
        recorded_utc: DateTime<Utc>,
    },
}

/// The curve to use, with where it came from and at what temperature.
#[derive(Debug, Clone)]
pub struct Resolved {
    /// At the requested temperature (shifted when a shift applies).
    pub model: Model,
    /// As measured or given, before any shift.
    pub measured: Model,
    /// The fit behind a journal curve (with its intervals), at the measured temperature.
    pub fit: Option<Fit>,
    pub origin: Origin,
    /// The product from the site config, when one was named.
    pub product: Option<Product>,
    /// Temperature the measured curve applies at, K, when known.
    pub measured_at_k: Option<f64>,
    /// Temperature the answer is for, K, when one was asked for.
    pub applies_at_k: Option<f64>,
    pub shift: Shift,
    /// The parameter the shift scales (μ, K, μp or μc).
    pub shifted_parameter: ParamName,
}

impl Resolved {
    /// Where the curve came from and how it was brought to temperature, in words.
    pub fn describe(&self) -> String {
        let from = match &self.origin {
            Origin::Flags => "constants given on the command line".to_string(),
            Origin::Journal {
                path,
                seq,
                viscometer,
                recorded_utc,
            } => format!(
                "the latest fitted set in {} (record {seq}, viscometer {viscometer}, {} UTC)",
                path.display(),
                recorded_utc.format("%Y-%m-%d %H:%M")
            ),
            Origin::SiteNominal { product } => {
                format!("the site's nominal constants for {product}")
            }
            Origin::Session {
                seq, viscometer, ..
            } => format!("this session's set #{seq} (viscometer {viscometer})"),
        };
        let shift = self.shift.words(
            self.shifted_parameter,
            self.applies_at_k.or(self.measured_at_k),
        );
        format!("{} curve from {from}; {shift}", self.model.kind())
    }
}

/// Why no curve could be resolved; each says what is accepted.
#[derive(Debug, thiserror::Error)]
pub enum SourceError {
    #[error("product '{given}' is not in the site config; the site's products: {known}")]
    UnknownProduct { given: String, known: String },
    #[error("give the flow curve one way only: rheology flags or --journal, not both")]
    FlagsAndJournal,
    #[error("cannot read the journal: {0}")]
    Journal(#[from] crate::journal::JournalError),
    #[error(
        "{path} has no fitted viscometer set{which}; record a set for it, or give the rheology \
         as flags (--mu | --k --n | --tau0 --mu-p | --tau0 --k --n | --tau0 --mu-c)"
    )]
    NoFittedSet { path: String, which: String },
    #[error(
        "no flow curve given: use rheology flags (--mu | --k --n | --tau0 --mu-p | \
         --tau0 --k --n | --tau0 --mu-c), --journal FILE with --product, or --product P for a \
         product with nominal constants in the site config"
    )]
    NothingGiven,
    #[error(
        "product '{product}' has no nominal flow curve in the site config; give the rheology \
         as flags or --journal FILE, or add a [product.nominal] table"
    )]
    NoNominal { product: String },
}

/// The curve the request names, brought to its temperature.
pub fn resolve(site: &Site, req: &SourceRequest) -> Result<Resolved, SourceError> {
    let product = match &req.product {
        Some(name) => Some(find_product(site, name)?.clone()),
        None => None,
    };
    let (measured, fit, origin, measured_at_k) = match (req.flags, &req.journal) {
        (Some(_), Some(_)) => return Err(SourceError::FlagsAndJournal),
        (Some(m), None) => (m, None, Origin::Flags, req.temperature_k),
        (None, Some(path)) => from_journal(site, path, req.product.as_deref())?,
        (None, None) => from_site(product.as_ref())?,
    };
    let shift = shift_for(product.as_ref(), measured_at_k, req.temperature_k);
    let shifted_parameter = viscosity_parameter(measured.kind());
    Ok(Resolved {
        model: scale_viscosity(measured, shift.factor()),
        measured,
        fit,
        origin,
        product,
        measured_at_k,
        applies_at_k: req.temperature_k,
        shift,
        shifted_parameter,
    })
}

fn find_product<'a>(site: &'a Site, name: &str) -> Result<&'a Product, SourceError> {
    site.product(name)
        .ok_or_else(|| SourceError::UnknownProduct {
            given: name.to_string(),
            known: list(site.products.iter().map(|p| p.name.as_str())),
        })
}

fn list<'a>(names: impl Iterator<Item = &'a str>) -> String {
    let v: Vec<&str> = names.collect();
    if v.is_empty() {
        "none".to_string()
    } else {
        v.join(", ")
    }
}

type Found = (Model, Option<Fit>, Origin, Option<f64>);

/// The product's latest fitted curve in a live session (the screens' state), else the
/// site's nominal constants for it, brought to `temperature_k`.
pub fn resolve_live(
    site: &Site,
    state: &SessionState,
    product: &str,
    temperature_k: Option<f64>,
) -> Result<Resolved, SourceError> {
    let p = find_product(site, product)?.clone();
    let found = match latest_fitted(state, Some(product), Path::new("")) {
        Ok((
            m,
            fit,
            Origin::Journal {
                seq,
                viscometer,
                recorded_utc,
                ..
            },
            at,
        )) => (
            m,
            fit,
            Origin::Session {
                seq,
                viscometer,
                recorded_utc,
            },
            at,
        ),
        _ => from_site(Some(&p))?,
    };
    let (measured, fit, origin, measured_at_k) = found;
    let shift = shift_for(Some(&p), measured_at_k, temperature_k);
    Ok(Resolved {
        model: scale_viscosity(measured, shift.factor()),
        measured,
        fit,
        origin,
        product: Some(p),
        measured_at_k,
        applies_at_k: temperature_k,
        shift,
        shifted_parameter: viscosity_parameter(measured.kind()),
    })
}

/// The product's latest set whose curve fitted (any product's when none is named).
fn from_journal(site: &Site, path: &Path, product: Option<&str>) -> Result<Found, SourceError> {
    let loaded = crate::journal::load(path)?;
    let state = SessionState::replay(site, &loaded.records);
    latest_fitted(&state, product, path)
}

fn latest_fitted(
    state: &SessionState,
    product: Option<&str>,
    path: &Path,
) -> Result<Found, SourceError> {
    let set = state
        .sets
        .iter()
        .rev()
        .find(|s| s.item.curve.is_ok() && product.is_none_or(|p| s.item.product == p));
    let Some(set) = set else {
        return Err(SourceError::NoFittedSet {
            path: path.display().to_string(),
            which: product.map(|p| format!(" for {p}")).unwrap_or_default(),
        });
    };
    let Ok(curve) = &set.item.curve else {
        return Err(SourceError::NothingGiven);
    };
    let origin = Origin::Journal {
        path: path.to_path_buf(),
        seq: set.seq,
        viscometer: set.item.viscometer.clone(),
        recorded_utc: set.at.utc,
    };
    Ok((
        curve.fit.model,
        Some(curve.fit.clone()),
        origin,
        set.item.temperature_k,
    ))
}

/// The site's nominal constants for the product, at its reference temperature.
fn from_site(product: Option<&Product>) -> Result<Found, SourceError> {
    let Some(p) = product else {
        return Err(SourceError::NothingGiven);
    };
    let Some(nominal) = p.nominal else {
        return Err(SourceError::NoNominal {
            product: p.name.clone(),
        });
    };
    let origin = Origin::SiteNominal {
        product: p.name.clone(),
    };
    Ok((
        nominal_model(nominal),
        None,
        origin,
        Some(p.reference_temperature_k),
    ))
}

/// The site schema's nominal curve as a flow model.
pub fn nominal_model(n: NominalCurve) -> Model {
    match n {
        NominalCurve::Newtonian { mu_pa_s } => Model::Newtonian { mu: mu_pa_s },
        NominalCurve::PowerLaw { k_pa_sn, n } => Model::PowerLaw { k: k_pa_sn, n },
        NominalCurve::Bingham { tau0_pa, mu_p_pa_s } => Model::Bingham {
            tau0: tau0_pa,
            mu_p: mu_p_pa_s,
        },
        NominalCurve::HerschelBulkley {
            tau0_pa,
            k_pa_sn,
            n,
        } => Model::HerschelBulkley {
            tau0: tau0_pa,
            k: k_pa_sn,
            n,
        },
        NominalCurve::Casson { tau0_pa, mu_c_pa_s } => Model::Casson {
            tau0: tau0_pa,
            mu_c: mu_c_pa_s,
        },
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::session::rheology_shift::shift_for;

    #[test]
    fn flags_at_their_own_temperature_are_not_shifted() {
        let site = crate::site::demo().unwrap();
        let req = SourceRequest {
            flags: Some(Model::PowerLaw { k: 10.0, n: 0.3 }),
            product: Some("chilli-sauce".into()),
            temperature_k: Some(300.0),
            ..Default::default()
        };
        let r = resolve(&site, &req).unwrap();
        assert_eq!(r.shift, Shift::NotNeeded);
        assert_eq!(r.model, r.measured);
    }

    #[test]
    fn shift_scales_only_the_viscosity_parameter() {
        // Arrhenius, Steffe 1996 §1.10: 30 kJ/mol from 25 °C to 15 °C:
        // exp(30000/8.314462618·(1/288.15 − 1/298.15)) = exp(0.41998…) = 1.5219…
        let product = crate::site::demo().unwrap().products[0].clone();
        let s = shift_for(Some(&product), Some(298.15), Some(288.15));
        assert!((s.factor() - 1.5219).abs() < 1e-3, "{s:?}");
        let m = scale_viscosity(
            Model::HerschelBulkley {
                tau0: 20.0,
                k: 10.0,
                n: 0.3,
            },
            2.0,
        );
        assert_eq!(
            m,
            Model::HerschelBulkley {
                tau0: 20.0,
                k: 20.0,
                n: 0.3
            }
        );
    }

    #[test]
    fn flags_and_journal_together_are_refused() {
        let site = crate::site::demo().unwrap();
        let req = SourceRequest {
            flags: Some(Model::Newtonian { mu: 1.0 }),
            journal: Some("x.jsonl".into()),
            ..Default::default()
        };
        assert!(matches!(
            resolve(&site, &req),
            Err(SourceError::FlagsAndJournal)
        ));
        let none = resolve(&site, &SourceRequest::default());
        assert!(matches!(none, Err(SourceError::NothingGiven)));
    }
}
