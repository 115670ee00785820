//! A site tank's answer from a live session (the screens): the product's latest curve in the
//! session (else the site's nominal constants) brought to the tank's latest temperature
//! reading, with the latest spot readings at the tank (speed, motor current, voltage, level).

use super::rheology_source::{Resolved, SourceError, resolve_live};
use super::state::SessionState;
use super::tank::{TankAnswer, analyse};
use super::tank_input::{self, TankFlags, TankInputError, TankReadings};
use crate::mixing::MixError;
use crate::site::Site;

/// Why a tank could not be worked out, in words that say what is accepted.
#[derive(Debug, thiserror::Error)]
pub enum TankLiveError {
    #[error("{0}")]
    Input(#[from] TankInputError),
    #[error("{0}")]
    Source(#[from] SourceError),
    #[error("{0}")]
    Mix(#[from] MixError),
}

/// What the tank is, what it holds, and the readings the answer is for.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct TankInputs {
    pub readings: TankReadings,
    /// The product's temperature in the tank, K.
    pub temperature_k: Option<f64>,
}

impl TankInputs {
    /// The newest readings journalled against `tank_id` in the session.
    pub fn latest(state: &SessionState, tank_id: &str) -> TankInputs {
        TankInputs {
            readings: TankReadings::latest(&state.readings, tank_id),
            temperature_k: latest_temperature(state, tank_id),
        }
    }
}

/// The answer and the curve it came from.
#[derive(Debug, Clone)]
pub struct TankLive {
    pub tank_id: String,
    pub product: String,
    pub answer: TankAnswer,
    pub source: Resolved,
    pub inputs: TankInputs,
}

/// The newest product temperature read at the tank, K.
pub fn latest_temperature(state: &SessionState, tank_id: &str) -> Option<f64> {
    state
        .readings
        .iter()
        .rev()
        .find(|e| e.equipment.as_deref() == Some(tank_id) && e.item.name == "temperature")
        .map(|e| e.item.value_si)
}

/// Work out `tank_id` holding `product` (the tank's own product when `None`) with `inputs`.
pub fn live(
    site: &Site,
    state: &SessionState,
    tank_id: &str,
    product: Option<&str>,
    inputs: TankInputs,
) -> Result<TankLive, TankLiveError> {
    let (tank, density) = tank_input::site_tank(site, tank_id, product)?;
    let product = product.map_or(tank.product.as_str(), str::trim).to_string();
    let source = resolve_live(site, state, &product, inputs.temperature_k)?;
    let request = tank_input::request(
        Some((tank, density)),
        &inputs.readings,
        &TankFlags::default(),
        source.model,
    )?;
    let answer = analyse(&request)?;
    Ok(TankLive {
        tank_id: tank.id.clone(),
        product,
        answer,
        source,
        inputs,
    })
}
