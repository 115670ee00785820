//! The plant's wall stresses against a viscometer curve's prediction at the same flows: the
//! ratio and which way it goes (the words for why are built at the edge).

use super::backcalc::PlantPoint;
use super::laminar::wall_stress_at_flow;
use super::pipe::Pipe;
use crate::rheology::Model;

/// Which way the plant disagrees with the viscometer's curve.
#[derive(Debug, Clone, Copy, PartialEq, Eq, serde::Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Disagreement {
    /// Within ±15 % at every pair (common practice, no source).
    Agree,
    /// The plant's wall stress is below the viscometer's prediction.
    PlantLower,
    /// The plant's wall stress is above the viscometer's prediction.
    PlantHigher,
    /// Some pairs above, some below.
    Mixed,
}

/// Tolerance of [`Disagreement::Agree`], as a ratio (common practice, no source).
pub const AGREE_WITHIN: f64 = 0.15;

/// The plant's wall stresses against the viscometer curve's laminar prediction at each flow.
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct Comparison {
    /// Measured τw / predicted τw, one per point, in flow order given.
    pub ratios: Vec<f64>,
    /// Geometric mean of the ratios.
    pub mean_ratio: f64,
    pub direction: Disagreement,
    /// Ratio at the lowest and at the highest flow (wall slip shows most at low wall stress).
    pub ratio_at_lowest_flow: f64,
    pub ratio_at_highest_flow: f64,
}

pub fn compare_with_curve(pipe: &Pipe, model: &Model, points: &[PlantPoint]) -> Comparison {
    let ratios: Vec<f64> = points
        .iter()
        .map(|p| p.wall_shear_stress_pa / wall_stress_at_flow(model, pipe.radius_m(), p.flow_m3_s))
        .collect();
    let mean_ratio =
        (ratios.iter().map(|r| r.ln()).sum::<f64>() / ratios.len().max(1) as f64).exp();
    let (lo, hi) = (1.0 - AGREE_WITHIN, 1.0 + AGREE_WITHIN);
    let direction = if ratios.iter().all(|r| (lo..=hi).contains(r)) {
        Disagreement::Agree
    } else if ratios.iter().all(|r| *r < 1.0) {
        Disagreement::PlantLower
    } else if ratios.iter().all(|r| *r > 1.0) {
        Disagreement::PlantHigher
    } else {
        Disagreement::Mixed
    };
    let by_flow = |pick_max: bool| {
        points
            .iter()
            .zip(&ratios)
            .reduce(|a, b| {
                let later = b.0.flow_m3_s > a.0.flow_m3_s;
                if later == pick_max { b } else { a }
            })
            .map_or(1.0, |(_, r)| *r)
    };
    Comparison {
        mean_ratio,
        direction,
        ratio_at_lowest_flow: by_flow(false),
        ratio_at_highest_flow: by_flow(true),
        ratios,
    }
}
