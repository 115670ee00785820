//! One impeller's power curve in one tank: Np against the impeller Reynolds number, laminar,
//! transitional and turbulent, with where each constant came from.

use super::error::MixError;
use super::impeller::{ImpellerKind, Spread};
use serde::Serialize;

/// Whether the tank wall carries baffles. Only the turbulent power number depends on it:
/// laminar power is the same with or without baffles, and the transition moves little (from
/// memory). Unbaffled, the swirl and the surface vortex make power depend on the Froude
/// number too (Rushton, Costich & Everett 1950), which the table values do not carry.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Baffling {
    Baffled,
    Unbaffled,
}

/// The flow regime around the impeller.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Regime {
    Laminar,
    Transitional,
    Turbulent,
}

/// Where a constant came from.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum ConstantSource {
    /// The impeller type's table value (see [`super::impeller`]).
    Published,
    /// The ribbon's Kp from its geometry (Rieger et al. 1988).
    RiegerCorrelation,
    /// Given for this impeller by the site or on the command line.
    Given,
}

/// A constant with its range and origin.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Constant {
    pub spread: Spread,
    pub source: ConstantSource,
}

/// The site's or the command line's own constants, replacing the table values.
#[derive(Debug, Clone, Copy, PartialEq, Default, Serialize)]
pub struct Overrides {
    pub ks: Option<f64>,
    pub kp: Option<f64>,
    pub np_turbulent: Option<f64>,
}

/// Scatter assumed around a Rieger Kp: ±15 %. Our own allowance, no source: the
/// correlation's own error band is not known here.
pub const RIEGER_SCATTER: f64 = 0.15;

/// One impeller's curve in one tank, with the range of each constant.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct PowerCurve {
    pub ks: Constant,
    pub kp: Constant,
    pub np_turbulent: Constant,
    pub re_laminar_below: f64,
    pub re_turbulent_above: f64,
}

/// One definite curve (no ranges): the numbers that fix Np(Re).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Shape {
    pub ks: f64,
    pub kp: f64,
    pub np_turbulent: f64,
    pub re_laminar_below: f64,
    pub re_turbulent_above: f64,
}

impl PowerCurve {
    /// The curve for `impeller` with the site's overrides; `kp_geometry` is a Kp worked out
    /// from the impeller's shape (the ribbon), used unless Kp itself is overridden.
    pub fn build(
        impeller: ImpellerKind,
        baffling: Baffling,
        overrides: &Overrides,
        kp_geometry: Option<f64>,
    ) -> Result<PowerCurve, MixError> {
        let c = impeller.constants();
        let np_table = match baffling {
            Baffling::Baffled => c.np_turbulent_baffled,
            Baffling::Unbaffled => c.np_turbulent_unbaffled,
        };
        let kp_default = match kp_geometry {
            Some(kp) => Constant {
                spread: Spread::new(kp * (1.0 - RIEGER_SCATTER), kp, kp * (1.0 + RIEGER_SCATTER)),
                source: ConstantSource::RiegerCorrelation,
            },
            None => published(c.kp),
        };
        let curve = PowerCurve {
            ks: pick("ks", overrides.ks, published(c.ks))?,
            kp: pick("Kp", overrides.kp, kp_default)?,
            np_turbulent: pick("turbulent Np", overrides.np_turbulent, published(np_table))?,
            re_laminar_below: c.re_laminar_below,
            re_turbulent_above: c.re_turbulent_above,
        };
        for shape in curve.corners() {
            shape.check()?;
        }
        Ok(curve)
    }

    /// The nominal curve.
    pub fn nominal(&self) -> Shape {
        self.shape(
            self.ks.spread.value,
            self.kp.spread.value,
            self.np_turbulent.spread.value,
        )
    }

    /// The eight curves at the ends of every constant's range, for the uncertainty.
    pub fn corners(&self) -> Vec<Shape> {
        let mut out = Vec::with_capacity(8);
        for ks in [self.ks.spread.low, self.ks.spread.high] {
            for kp in [self.kp.spread.low, self.kp.spread.high] {
                for np in [self.np_turbulent.spread.low, self.np_turbulent.spread.high] {
                    out.push(self.shape(ks, kp, np));
                }
            }
        }
        out
    }

    fn shape(&self, ks: f64, kp: f64, np_turbulent: f64) -> Shape {
        Shape {
            ks,
            kp,
            np_turbulent,
            re_laminar_below: self.re_laminar_below,
            re_turbulent_above: self.re_turbulent_above,
        }
    }

    /// The regime at an impeller Reynolds number.
    pub fn regime(&self, reynolds: f64) -> Regime {
        self.nominal().regime(reynolds)
    }
}

fn published(spread: Spread) -> Constant {
    Constant {
        spread,
        source: ConstantSource::Published,
    }
}

fn pick(what: &'static str, given: Option<f64>, default: Constant) -> Result<Constant, MixError> {
    match given {
        Some(v) => Ok(Constant {
            spread: Spread::exact(super::error::positive(what, v)?),
            source: ConstantSource::Given,
        }),
        None => Ok(default),
    }
}

impl Shape {
    /// Laminar below `re_laminar_below`, turbulent above `re_turbulent_above`.
    pub fn regime(&self, reynolds: f64) -> Regime {
        if reynolds < self.re_laminar_below {
            Regime::Laminar
        } else if reynolds > self.re_turbulent_above {
            Regime::Turbulent
        } else {
            Regime::Transitional
        }
    }

    /// Np at the end of the laminar range, Kp/Re_L.
    fn np_laminar_end(&self) -> f64 {
        self.kp / self.re_laminar_below
    }

    /// Slope d ln Np / d ln Re across the transitional range.
    fn slope(&self) -> f64 {
        (self.np_turbulent / self.np_laminar_end()).ln()
            / (self.re_turbulent_above / self.re_laminar_below).ln()
    }

    /// The power number at an impeller Reynolds number.
    ///
    /// Laminar: Np = Kp/Re (Metzner & Otto 1957). Turbulent: Np constant. Between them our
    /// own bridge (common practice, no source): a straight line on log–log axes from
    /// (Re_L, Kp/Re_L) to (Re_T, Np_T), continuous at both ends. It ignores the dip of the
    /// disc-turbine curve near Re ≈ 10–100; a measured curve for the impeller is better.
    pub fn power_number(&self, reynolds: f64) -> f64 {
        match self.regime(reynolds) {
            Regime::Laminar => self.kp / reynolds,
            Regime::Turbulent => self.np_turbulent,
            Regime::Transitional => {
                self.np_laminar_end() * (reynolds / self.re_laminar_below).powf(self.slope())
            }
        }
    }

    /// The Reynolds number at which the curve has power number `np`, and that regime;
    /// `None` when `np` is at or below the turbulent value (Np no longer depends on Re).
    pub fn reynolds_at(&self, np: f64) -> Option<(f64, Regime)> {
        if np >= self.np_laminar_end() {
            Some((self.kp / np, Regime::Laminar))
        } else if np > self.np_turbulent {
            let re = self.re_laminar_below * (np / self.np_laminar_end()).powf(1.0 / self.slope());
            Some((re, Regime::Transitional))
        } else {
            None
        }
    }

    /// d ln μa / d ln P when viscosity is read back from power: 1 laminar, larger (worse)
    /// across the transition, where power depends less and less on viscosity.
    pub fn viscosity_sensitivity(&self, regime: Regime) -> f64 {
        match regime {
            Regime::Laminar => 1.0,
            Regime::Transitional => -1.0 / self.slope(),
            Regime::Turbulent => f64::INFINITY,
        }
    }

    /// The curve must fall with Re, and no faster than the laminar line, so that power rises
    /// with speed and one power number means one Reynolds number.
    fn check(&self) -> Result<(), MixError> {
        if self.np_turbulent >= self.np_laminar_end() {
            return Err(MixError::CurveRises {
                np_turbulent: self.np_turbulent,
                np_laminar_end: self.np_laminar_end(),
            });
        }
        if self.kp > self.np_turbulent * self.re_turbulent_above {
            return Err(MixError::CurveTooSteep {
                kp: self.kp,
                np_turbulent: self.np_turbulent,
                re_turbulent: self.re_turbulent_above,
            });
        }
        Ok(())
    }
}
