//! A product's fitted constants session by session, checked against its spec limits.
//!
//! Pure: the caller reads the files and the clock (`now` is passed in). Each session
//! contributes every viscometer set of the product inside the window (so an out-of-spec
//! set followed by a good one in the same session is still seen), fitted through
//! the same [`super::state::fit_rows`] the report and the TUI use. When the set's
//! temperature and the product's activation energy are known, the viscosity parameter is
//! shifted to the product's reference temperature before the limits are checked.

use super::state::{Moment, fit_rows};
use super::temperature::shift_model_to_reference;
use crate::journal::{Payload, Record};
use crate::rheology::{Model, ParamName};
use crate::site::{LimitProperty, Product, Site, SpecLimit};
use chrono::{DateTime, Duration, Utc};

/// Shear rate for the apparent viscosity when no limit states one, 1/s (common practice,
/// no source: a round rate inside what pumps and viscometers both reach).
pub const DEFAULT_RATE_PER_S: f64 = 100.0;

#[derive(Debug, Clone, PartialEq, Eq, thiserror::Error)]
pub enum TrendError {
    #[error(
        "--since '{text}': give a whole number and h, d or w (hours, days, weeks), e.g. 30d, 12h, 8w"
    )]
    BadSince { text: String },
    #[error("--property '{text}' is not a property a trend can chart; accepted: {accepted}")]
    UnknownProperty {
        text: String,
        accepted: &'static str,
    },
    #[error("product '{name}' is not in site '{site}'; its products: {known}")]
    UnknownProduct {
        name: String,
        site: String,
        known: String,
    },
}

/// `30d`, `12h`, `8w` → a duration (up to 100 years).
pub fn parse_since(text: &str) -> Result<Duration, TrendError> {
    let bad = || TrendError::BadSince {
        text: crate::text::sanitize(text, false),
    };
    let t = text.trim();
    // Split before the last character, which may be more than one byte.
    let last = t.char_indices().last().map_or(0, |(i, _)| i);
    let (number, unit) = t.split_at(last);
    let count: i64 = number.trim().parse().map_err(|_| bad())?;
    let hours = match unit.to_ascii_lowercase().as_str() {
        "h" => count,
        "d" => count.saturating_mul(24),
        "w" => count.saturating_mul(24 * 7),
        _ => return Err(bad()),
    };
    if !(1..=100 * 366 * 24).contains(&hours) {
        return Err(bad());
    }
    Duration::try_hours(hours).ok_or_else(bad)
}

/// The product by name, or an error listing the site's products.
pub fn find_product<'s>(site: &'s Site, name: &str) -> Result<&'s Product, TrendError> {
    site.product(name.trim())
        .ok_or_else(|| TrendError::UnknownProduct {
            name: crate::text::sanitize(name, false),
            site: site.id.clone(),
            known: site
                .products
                .iter()
                .map(|p| p.name.as_str())
                .collect::<Vec<_>>()
                .join(", "),
        })
}

/// The rate of the product's first apparent-viscosity limit, else [`DEFAULT_RATE_PER_S`].
pub fn spec_rate(product: &Product) -> f64 {
    product
        .limits
        .iter()
        .find_map(|l| match l.property {
            LimitProperty::ApparentViscosity { shear_rate_per_s } => Some(shear_rate_per_s),
            _ => None,
        })
        .unwrap_or(DEFAULT_RATE_PER_S)
}

/// A Herschel–Bulkley constant (τ0, K or n) read off whichever model was fitted.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Param {
    /// Estimated by the fit.
    Fitted(f64),
    /// Fixed by the model's form: the model is Herschel–Bulkley with this value held.
    Implied(f64),
    /// The model has no such constant (Casson has no K or n).
    Absent,
}

impl Param {
    pub fn value(self) -> Option<f64> {
        match self {
            Param::Fitted(v) | Param::Implied(v) => Some(v),
            Param::Absent => None,
        }
    }
}

/// τ0, K or n of `model` as a Herschel–Bulkley model τ = τ0 + Kγ̇ⁿ.
///
/// Derived from the forms (see `rheology::Model`): Newtonian τ = μγ̇ is τ0 = 0, K = μ, n = 1;
/// power law is τ0 = 0; Bingham τ = τ0 + μpγ̇ is K = μp, n = 1. Casson's √τ form is not a
/// Herschel–Bulkley curve, so it has no K or n.
pub fn hb_equivalent(model: &Model, name: ParamName) -> Param {
    use Param::{Absent, Fitted, Implied};
    match (*model, name) {
        (Model::Newtonian { .. } | Model::PowerLaw { .. }, ParamName::Tau0) => Implied(0.0),
        (Model::Newtonian { mu }, ParamName::K) => Implied(mu),
        (Model::Newtonian { .. } | Model::Bingham { .. }, ParamName::N) => Implied(1.0),
        (Model::Bingham { mu_p, .. }, ParamName::K) => Implied(mu_p),
        (Model::Casson { .. }, ParamName::K | ParamName::N) => Absent,
        (m, p) => m.param(p).map_or(Absent, Fitted),
    }
}

/// Where a value stands against one limit.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum LimitStatus {
    Within,
    Above,
    Below,
    /// The model has no such constant.
    NotChecked,
}

#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LimitCheck {
    pub limit: SpecLimit,
    /// The value compared (SI), when the model has it.
    pub value: Option<f64>,
    pub status: LimitStatus,
}

impl LimitCheck {
    pub fn is_out(&self) -> bool {
        matches!(self.status, LimitStatus::Above | LimitStatus::Below)
    }
}

/// Check a fitted model against every limit, in the config's order.
pub fn check_limits(limits: &[SpecLimit], model: &Model) -> Vec<LimitCheck> {
    limits.iter().map(|l| check_one(*l, model)).collect()
}

fn check_one(limit: SpecLimit, model: &Model) -> LimitCheck {
    let value = match limit.property {
        LimitProperty::ConsistencyIndex => hb_equivalent(model, ParamName::K).value(),
        LimitProperty::FlowIndex => hb_equivalent(model, ParamName::N).value(),
        LimitProperty::YieldStress => Some(model.yield_stress()),
        LimitProperty::ApparentViscosity { shear_rate_per_s } => {
            Some(model.apparent_viscosity(shear_rate_per_s))
        }
    };
    let status = match value {
        None => LimitStatus::NotChecked,
        Some(v) if limit.min.is_some_and(|lo| v < lo) => LimitStatus::Below,
        Some(v) if limit.max.is_some_and(|hi| v > hi) => LimitStatus::Above,
        Some(_) => LimitStatus::Within,
    };
    LimitCheck {
        limit,
        value,
        status,
    }
}

/// The model as it would read at the product's reference temperature, and that
/// temperature, when the set's temperature and the product's activation energy are both
/// known; otherwise the model as measured and `None`. Spec limits are stated at the
/// reference temperature, so limits are checked on this.
pub fn at_reference(
    product: &Product,
    model: &Model,
    temperature_k: Option<f64>,
) -> (Model, Option<f64>) {
    let t_ref = product.reference_temperature_k;
    match (product.activation_energy_j_mol, temperature_k) {
        (Some(ea), Some(t)) if t.is_finite() && t > 0.0 => {
            (shift_model_to_reference(model, ea, t, t_ref), Some(t_ref))
        }
        _ => (*model, None),
    }
}

/// A set's curve checked against its product's limits exactly as `report` and `trend` do:
/// at the product's reference temperature when it can be shifted there (see
/// [`at_reference`]), else as measured. Returns the checks and the temperature they were
/// shifted to, if any.
pub fn checks_at_reference(
    product: &Product,
    model: &Model,
    temperature_k: Option<f64>,
) -> (Vec<LimitCheck>, Option<f64>) {
    let (model, shifted_to) = at_reference(product, model, temperature_k);
    (check_limits(&product.limits, &model), shifted_to)
}

/// The constants of one fitted set.
#[derive(Debug, Clone, PartialEq)]
pub struct Constants {
    pub model: Model,
    pub tau0: Param,
    pub k: Param,
    pub n: Param,
    /// Apparent viscosity at the trend's shear rate, Pa·s.
    pub mu_a_pa_s: f64,
    pub checks: Vec<LimitCheck>,
}

impl Constants {
    pub fn is_out(&self) -> bool {
        self.checks.iter().any(LimitCheck::is_out)
    }
}

/// One set's row of the trend.
#[derive(Debug, Clone, PartialEq)]
pub struct SessionPoint {
    pub session: String,
    /// Who recorded the set shown, and when.
    pub operator: String,
    pub at: Moment,
    pub set_seq: u64,
    /// Sets of this product in the window in this session (each is a row of its own).
    pub sets: usize,
    pub temperature_k: Option<f64>,
    /// The reference temperature K, μ, μp or μc were shifted to (Arrhenius, the product's
    /// activation energy); `None` when they are as measured.
    pub shifted_to_k: Option<f64>,
    /// The constants, or why the set could not be fitted.
    pub outcome: Result<Constants, String>,
}

/// The whole trend, oldest session first.
#[derive(Debug, Clone, PartialEq)]
pub struct Trend {
    pub product: String,
    pub rate_per_s: f64,
    pub since: DateTime<Utc>,
    pub points: Vec<SessionPoint>,
    /// Journals whose session-start names another site.
    pub other_site: usize,
    /// Record lists that do not open with a session-start record.
    pub not_journal: usize,
}

/// Collects sessions one at a time, so a caller can stream files and drop each after use.
#[derive(Debug, Clone)]
pub struct TrendBuilder<'a> {
    site: &'a Site,
    product: &'a Product,
    trend: Trend,
}

impl<'a> TrendBuilder<'a> {
    /// Sets recorded before `now − window` are left out.
    pub fn new(site: &'a Site, product: &'a Product, now: DateTime<Utc>, window: Duration) -> Self {
        let since = now
            .checked_sub_signed(window)
            .unwrap_or(DateTime::<Utc>::MIN_UTC);
        TrendBuilder {
            site,
            product,
            trend: Trend {
                product: product.name.clone(),
                rate_per_s: spec_rate(product),
                since,
                points: Vec::new(),
                other_site: 0,
                not_journal: 0,
            },
        }
    }

    /// Whether a session-start record names this builder's site.
    pub fn site_matches(&self, start: &Record) -> bool {
        matches!(&start.payload, Payload::SessionStart { site_id, .. } if *site_id == self.site.id)
    }

    /// One session's records (all of them, or at least its start and its sets).
    pub fn add(&mut self, records: &[Record]) {
        match records.first().map(|r| &r.payload) {
            Some(Payload::SessionStart { site_id, .. }) if *site_id == self.site.id => {}
            Some(Payload::SessionStart { .. }) => return self.trend.other_site += 1,
            _ => return self.trend.not_journal += 1,
        }
        let ours: Vec<&Record> = records
            .iter()
            .filter(|r| r.utc >= self.trend.since && self.is_our_set(r))
            .collect();
        let count = ours.len();
        let points: Vec<SessionPoint> = ours
            .into_iter()
            .filter_map(|r| self.point(r, count))
            .collect();
        self.trend.points.extend(points);
    }

    fn point(&self, record: &Record, count: usize) -> Option<SessionPoint> {
        let Payload::ViscometerSet {
            viscometer,
            rows,
            temperature_k,
            ..
        } = &record.payload
        else {
            return None;
        };
        let mut shifted_to_k = None;
        let outcome = fit_rows(self.site, viscometer, rows)
            .map(|curve| {
                let (model, to) = at_reference(self.product, &curve.fit.model, *temperature_k);
                shifted_to_k = to;
                self.constants(&model)
            })
            .map_err(|e| e.to_string());
        Some(SessionPoint {
            session: record.session.clone(),
            operator: record.operator.clone(),
            at: Moment {
                utc: record.utc,
                offset: record.offset,
            },
            set_seq: record.seq,
            sets: count,
            temperature_k: *temperature_k,
            shifted_to_k,
            outcome,
        })
    }

    fn is_our_set(&self, r: &Record) -> bool {
        matches!(&r.payload, Payload::ViscometerSet { product, .. } if *product == self.product.name)
    }

    fn constants(&self, model: &Model) -> Constants {
        Constants {
            model: *model,
            tau0: hb_equivalent(model, ParamName::Tau0),
            k: hb_equivalent(model, ParamName::K),
            n: hb_equivalent(model, ParamName::N),
            mu_a_pa_s: model.apparent_viscosity(self.trend.rate_per_s),
            checks: check_limits(&self.product.limits, model),
        }
    }

    /// The trend, sets in time order (ties by session id, then record number).
    pub fn finish(mut self) -> Trend {
        self.trend.points.sort_by(|a, b| {
            a.at.utc
                .cmp(&b.at.utc)
                .then_with(|| a.session.cmp(&b.session))
                .then_with(|| a.set_seq.cmp(&b.set_seq))
        });
        self.trend
    }
}

/// The trend of `product` over whole sessions held in memory.
pub fn trend<'r>(
    site: &Site,
    product: &Product,
    sessions: impl IntoIterator<Item = &'r [Record]>,
    now: DateTime<Utc>,
    window: Duration,
) -> Trend {
    let mut builder = TrendBuilder::new(site, product, now, window);
    for records in sessions {
        builder.add(records);
    }
    builder.finish()
}
