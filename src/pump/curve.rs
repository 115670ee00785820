//! A pump's head and efficiency against flow, between the points given (straight lines
//! between points, nothing beyond the last); the best-efficiency point; speed scaling by the
//! affinity laws; and the viscosity-corrected curve.

use super::hi967::{Correction, c_h};

/// One point of a head curve.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize)]
pub struct PumpPoint {
    pub flow_m3_s: f64,
    pub head_m: f64,
    /// 0–1.
    pub efficiency: f64,
}

/// A head curve with flow strictly increasing (at least two points).
#[derive(Debug, Clone, PartialEq, serde::Serialize)]
pub struct PumpCurve {
    pub points: Vec<PumpPoint>,
}

impl PumpCurve {
    /// `None` unless there are two or more points with flow strictly increasing and
    /// finite, non-negative values.
    pub fn new(points: Vec<PumpPoint>) -> Option<PumpCurve> {
        let ok = points.len() >= 2
            && points.windows(2).all(|w| w[1].flow_m3_s > w[0].flow_m3_s)
            && points.iter().all(|p| {
                p.flow_m3_s.is_finite()
                    && p.flow_m3_s >= 0.0
                    && p.head_m.is_finite()
                    && p.head_m >= 0.0
                    && (0.0..=1.0).contains(&p.efficiency)
            });
        ok.then_some(PumpCurve { points })
    }

    /// The best-efficiency point: the given point of highest efficiency.
    pub fn bep(&self) -> PumpPoint {
        self.points
            .iter()
            .copied()
            .max_by(|a, b| a.efficiency.total_cmp(&b.efficiency))
            .unwrap_or(PumpPoint {
                flow_m3_s: 0.0,
                head_m: 0.0,
                efficiency: 0.0,
            })
    }

    /// Head at the lowest flow given (shut-off when the curve starts at zero flow), m.
    pub fn first_head_m(&self) -> f64 {
        self.points.first().map_or(0.0, |p| p.head_m)
    }

    /// Flow range covered, m³/s.
    pub fn flow_range(&self) -> (f64, f64) {
        let first = self.points.first().map_or(0.0, |p| p.flow_m3_s);
        let last = self.points.last().map_or(0.0, |p| p.flow_m3_s);
        (first, last)
    }

    /// Head and efficiency at a flow inside the range, by straight lines between points.
    pub fn at(&self, flow_m3_s: f64) -> Option<(f64, f64)> {
        let w = self
            .points
            .windows(2)
            .find(|w| flow_m3_s >= w[0].flow_m3_s && flow_m3_s <= w[1].flow_m3_s)?;
        let f = (flow_m3_s - w[0].flow_m3_s) / (w[1].flow_m3_s - w[0].flow_m3_s);
        let lerp = |a: f64, b: f64| a + f * (b - a);
        Some((
            lerp(w[0].head_m, w[1].head_m),
            lerp(w[0].efficiency, w[1].efficiency),
        ))
    }

    /// Affinity laws (same pump, another speed): Q ∝ N, H ∝ N², efficiency unchanged
    /// (Karassik et al., *Pump Handbook*, from memory; exact only for geometric similarity
    /// and ignoring the small change of efficiency with speed).
    pub fn at_speed(&self, speed_ratio: f64) -> PumpCurve {
        let points = self
            .points
            .iter()
            .map(|p| PumpPoint {
                flow_m3_s: p.flow_m3_s * speed_ratio,
                head_m: p.head_m * speed_ratio * speed_ratio,
                efficiency: p.efficiency,
            })
            .collect();
        PumpCurve { points }
    }

    /// The curve on the viscous product: Q·C_Q, H·C_H(Q_W/Q_BEP,W), η·C_η (ANSI/HI 9.6.7).
    pub fn corrected(&self, c: &Correction) -> PumpCurve {
        let q_bep = self.bep().flow_m3_s;
        let points = self
            .points
            .iter()
            .map(|p| {
                let ratio = if q_bep > 0.0 {
                    p.flow_m3_s / q_bep
                } else {
                    0.0
                };
                PumpPoint {
                    flow_m3_s: p.flow_m3_s * c.c_q,
                    head_m: p.head_m * c_h(c.c_h_bep, ratio),
                    efficiency: p.efficiency * c.c_eta,
                }
            })
            .collect();
        PumpCurve { points }
    }
}
