//! Fitting a journalled viscometer set: the rows through the site's viscometer to a flow
//! curve, with the model and pegged-reading choices a `choice` record can make.

use super::checks::OffScale;
use super::flow_curve::{FlowCurve, FlowCurveInput, FlowCurveOptions, ModelPick, analyse};
use super::state::{SetError, ViscometerSet};
use crate::instrument::DialReading;
use crate::journal::{DialRow, Payload};
use crate::site::Site;

/// The set with its curve, fitted with the default options (automatic model choice,
/// rate correction on): the same call the faces make for a fresh set.
pub(super) fn fitted_set(site: &Site, payload: &Payload) -> Option<ViscometerSet> {
    let Payload::ViscometerSet {
        viscometer,
        product,
        temperature_raw,
        temperature_k,
        rows,
    } = payload
    else {
        return None;
    };
    Some(ViscometerSet {
        viscometer: viscometer.clone(),
        product: product.clone(),
        temperature_raw: temperature_raw.clone(),
        temperature_k: *temperature_k,
        rows: rows.clone(),
        curve: fit_rows(site, viscometer, rows),
        pick: ModelPick::Auto,
        shear_rate_per_s: None,
        include_off_scale: false,
        by_hand: None,
    })
}

/// Fit journalled dial rows on the site's geometry for `viscometer`, model by the rule.
pub fn fit_rows(site: &Site, viscometer: &str, rows: &[DialRow]) -> Result<FlowCurve, SetError> {
    fit_rows_with(site, viscometer, rows, ModelPick::Auto)
}

/// Fit journalled dial rows with a given model pick.
pub fn fit_rows_with(
    site: &Site,
    viscometer: &str,
    rows: &[DialRow],
    pick: ModelPick,
) -> Result<FlowCurve, SetError> {
    fit_rows_as(site, viscometer, rows, pick, OffScale::LeaveOut)
}

/// The rows fitted with a model pick and a rule for pegged readings.
pub fn fit_rows_as(
    site: &Site,
    viscometer: &str,
    rows: &[DialRow],
    pick: ModelPick,
    off_scale: OffScale,
) -> Result<FlowCurve, SetError> {
    let Some(v) = site.viscometer(viscometer) else {
        let known: Vec<&str> = site.viscometers.iter().map(|v| v.id.as_str()).collect();
        return Err(SetError::UnknownViscometer {
            id: viscometer.to_string(),
            known: if known.is_empty() {
                "none".to_string()
            } else {
                known.join(", ")
            },
        });
    };
    let readings: Vec<DialReading> = rows
        .iter()
        .map(|r| DialReading::new(r.rpm, r.dial))
        .collect();
    let input = FlowCurveInput::Dial {
        geometry: &v.geometry,
        readings: &readings,
    };
    let opts = FlowCurveOptions {
        model: pick,
        off_scale,
        ..FlowCurveOptions::default()
    };
    Ok(analyse(input, &opts)?)
}
