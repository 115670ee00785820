//! The product's flow curve given on the command line, shared by `line`, `restart`, `pump`
//! and `mix`: one of five flag sets, each naming exactly one flow model.
//!
//! `--mu M` | `--k K --n N` | `--tau0 T --mu-p M` | `--tau0 T --k K --n N` | `--tau0 T --mu-c M`.
//! Bare numbers are SI (Pa·s, Pa·sⁿ, Pa); viscosities and stresses may carry a unit
//! ("1200 cP", "12 lbf/100ft2"). Any other mix is refused with what is accepted.

use crate::rheology::Model;
use crate::session::rheology_source::{self, Resolved, SourceRequest};
use crate::site::Site;
use crate::units::{self, Dimension};
use anyhow::{Result, bail};
use clap::Args;
use std::path::PathBuf;

/// Where the flow curve comes from: the flags above, a journal's latest fitted set for the
/// product, or the product's nominal constants in the site config; and the temperature the
/// answer is for (the curve is shifted there by the product's activation energy).
#[derive(Debug, Clone, Default, Args)]
pub struct RheologySourceArgs {
    #[command(flatten)]
    pub rheology: RheologyArgs,
    /// Product name from the site config (its density, activation energy, nominal curve).
    #[arg(long, value_name = "NAME")]
    pub product: Option<String>,
    /// Take the product's latest fitted viscometer set from this session journal.
    #[arg(long, value_name = "FILE")]
    pub journal: Option<PathBuf>,
    /// Temperature the answer is for (bare number: °C; or e.g. "318 K", "140 F").
    #[arg(long, value_name = "T")]
    pub temperature: Option<String>,
}

impl RheologySourceArgs {
    /// The request for the session resolver, with every flag checked.
    pub fn request(&self) -> Result<SourceRequest> {
        let temperature_k = match self.temperature.as_deref() {
            None => None,
            Some(text) => match units::parse_positive(text, Dimension::Temperature) {
                Ok(t) => Some(t),
                Err(e) => bail!("--temperature: {e}"),
            },
        };
        Ok(SourceRequest {
            flags: self.rheology.model()?,
            product: self.product.clone(),
            journal: self.journal.clone(),
            temperature_k,
        })
    }

    /// The flow curve these flags name, at the requested temperature.
    pub fn resolve(&self, site: &Site) -> Result<Resolved> {
        Ok(rheology_source::resolve(site, &self.request()?)?)
    }
}

/// Flow-curve constants typed as flags. Empty when the rheology comes from elsewhere (a site
/// product's nominal constants or a journal's latest fit).
#[derive(Debug, Clone, Default, Args)]
pub struct RheologyArgs {
    /// Newtonian viscosity (bare number: Pa·s; or with a unit, e.g. "1200 cP").
    #[arg(long, value_name = "VISCOSITY")]
    pub mu: Option<String>,
    /// Consistency index K, Pa·sⁿ (power law or Herschel–Bulkley; needs --n).
    #[arg(long, value_name = "K")]
    pub k: Option<f64>,
    /// Flow behaviour index n (needs --k).
    #[arg(long, value_name = "N")]
    pub n: Option<f64>,
    /// Yield stress τ0 (bare number: Pa); with --mu-p, --k/--n or --mu-c.
    #[arg(long, value_name = "STRESS")]
    pub tau0: Option<String>,
    /// Bingham plastic viscosity (bare number: Pa·s; needs --tau0).
    #[arg(long = "mu-p", value_name = "VISCOSITY")]
    pub mu_p: Option<String>,
    /// Casson viscosity (bare number: Pa·s; needs --tau0).
    #[arg(long = "mu-c", value_name = "VISCOSITY")]
    pub mu_c: Option<String>,
}

/// What the five flag sets accept, for every refusal.
const ACCEPTED: &str = "give one of: --mu M | --k K --n N | --tau0 T --mu-p M | \
     --tau0 T --k K --n N | --tau0 T --mu-c M";

impl RheologyArgs {
    /// True when no rheology flag was given.
    pub fn is_empty(&self) -> bool {
        self.mu.is_none()
            && self.k.is_none()
            && self.n.is_none()
            && self.tau0.is_none()
            && self.mu_p.is_none()
            && self.mu_c.is_none()
    }

    /// The model the flags name, `None` when no flag was given, an error for any other mix.
    pub fn model(&self) -> Result<Option<Model>> {
        if self.is_empty() {
            return Ok(None);
        }
        let mu = viscosity("--mu", self.mu.as_deref())?;
        let mu_p = viscosity("--mu-p", self.mu_p.as_deref())?;
        let mu_c = viscosity("--mu-c", self.mu_c.as_deref())?;
        let tau0 = yield_stress(self.tau0.as_deref())?;
        let k = positive("--k", self.k)?;
        let n = positive("--n", self.n)?;
        let model = match (mu, k, n, tau0, mu_p, mu_c) {
            (Some(mu), None, None, None, None, None) => Model::Newtonian { mu },
            (None, Some(k), Some(n), None, None, None) => Model::PowerLaw { k, n },
            (None, None, None, Some(tau0), Some(mu_p), None) => Model::Bingham { tau0, mu_p },
            (None, Some(k), Some(n), Some(tau0), None, None) => {
                Model::HerschelBulkley { tau0, k, n }
            }
            (None, None, None, Some(tau0), None, Some(mu_c)) => Model::Casson { tau0, mu_c },
            _ => bail!(
                "these rheology flags do not name one flow model; {}",
                self.hint()
            ),
        };
        Ok(Some(model))
    }

    /// A pointed hint for the commonest mistakes, then the accepted sets.
    fn hint(&self) -> String {
        let pointed = if self.k.is_some() != self.n.is_some() {
            "--k and --n go together; "
        } else if self.tau0.is_some()
            && self.mu_p.is_none()
            && self.mu_c.is_none()
            && self.k.is_none()
        {
            "a yield stress alone is not a flow curve; "
        } else if self.mu.is_some() && self.tau0.is_some() {
            "--mu is the Newtonian viscosity (no yield stress); for a Bingham product use --mu-p; "
        } else {
            ""
        };
        format!("{pointed}{ACCEPTED}")
    }
}

fn viscosity(flag: &str, text: Option<&str>) -> Result<Option<f64>> {
    let Some(text) = text else { return Ok(None) };
    match units::parse_with_default(text, Dimension::DynamicViscosity, "Pa.s") {
        Ok(v) if v > 0.0 => Ok(Some(v)),
        Ok(_) => bail!("{flag} '{text}': a viscosity must be above zero"),
        Err(e) => bail!("{flag}: {e}"),
    }
}

fn yield_stress(text: Option<&str>) -> Result<Option<f64>> {
    let Some(text) = text else { return Ok(None) };
    match units::parse(text, Dimension::Stress) {
        Ok(v) if v >= 0.0 => Ok(Some(v)),
        Ok(_) => bail!("--tau0 '{text}': a yield stress cannot be negative"),
        Err(e) => bail!("--tau0: {e}"),
    }
}

fn positive(flag: &str, value: Option<f64>) -> Result<Option<f64>> {
    match value {
        Some(v) if !(v.is_finite() && v > 0.0) => {
            bail!("{flag} {v}: must be a finite number above zero")
        }
        other => Ok(other),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn args(f: impl FnOnce(&mut RheologyArgs)) -> RheologyArgs {
        let mut a = RheologyArgs::default();
        f(&mut a);
        a
    }

    #[test]
    fn each_flag_set_names_its_model() {
        let hb = args(|a| {
            a.tau0 = Some("5".into());
            a.k = Some(2.0);
            a.n = Some(0.5);
        });
        assert_eq!(
            hb.model().unwrap(),
            Some(Model::HerschelBulkley {
                tau0: 5.0,
                k: 2.0,
                n: 0.5
            })
        );
        // 1200 cP = 1.2 Pa·s (NIST SP 811: 1 cP = 1 mPa·s).
        let newt = args(|a| a.mu = Some("1200 cP".into()));
        assert_eq!(newt.model().unwrap(), Some(Model::Newtonian { mu: 1.2 }));
        assert_eq!(RheologyArgs::default().model().unwrap(), None);
    }

    #[test]
    fn half_sets_are_refused_with_the_reason() {
        let k_only = args(|a| a.k = Some(2.0));
        let msg = k_only.model().unwrap_err().to_string();
        assert!(msg.contains("--k and --n go together"), "{msg}");
        let tau_only = args(|a| a.tau0 = Some("5 Pa".into()));
        let msg = tau_only.model().unwrap_err().to_string();
        assert!(msg.contains("yield stress alone"), "{msg}");
        let negative = args(|a| a.mu = Some("-1".into()));
        assert!(negative.model().is_err());
    }
}
