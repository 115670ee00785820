//! Straight-line least squares y = a + b·x in closed form, with the textbook standard errors.
//!
//! Used for the linear models' fits and starts, the log–log power-law fit and the Arrhenius fit.
//! Formulas: ordinary least squares, e.g. Montgomery & Runger, *Applied Statistics and
//! Probability for Engineers*, ch. 11 (from memory): b = Sxy/Sxx, a = ȳ − b·x̄,
//! s² = SSR/(m−2), SE(b) = √(s²/Sxx), SE(a) = √(s²(1/m + x̄²/Sxx)).

/// A fitted straight line with its scatter.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LineFit {
    pub intercept: f64,
    pub slope: f64,
    /// Sum of squared residuals.
    pub ssr: f64,
    /// Number of points m.
    pub points: usize,
    pub x_mean: f64,
    /// Σ(x − x̄)².
    pub sxx: f64,
}

impl LineFit {
    /// Degrees of freedom m − 2.
    pub fn dof(&self) -> usize {
        self.points.saturating_sub(2)
    }

    /// Residual variance s² = SSR/(m − 2); `None` with two points.
    pub fn s2(&self) -> Option<f64> {
        (self.dof() > 0).then(|| self.ssr / self.dof() as f64)
    }

    /// SE(b) = √(s²/Sxx).
    pub fn se_slope(&self) -> Option<f64> {
        self.s2().map(|s2| (s2 / self.sxx).sqrt())
    }

    /// SE(a) = √(s²(1/m + x̄²/Sxx)).
    pub fn se_intercept(&self) -> Option<f64> {
        let m = self.points as f64;
        self.s2()
            .map(|s2| (s2 * (1.0 / m + self.x_mean * self.x_mean / self.sxx)).sqrt())
    }
}

/// Ordinary least squares through (x, y); `None` if fewer than two different x.
pub fn fit_line(x: &[f64], y: &[f64]) -> Option<LineFit> {
    let m = x.len().min(y.len());
    if m < 2 {
        return None;
    }
    let x_mean = x[..m].iter().sum::<f64>() / m as f64;
    let y_mean = y[..m].iter().sum::<f64>() / m as f64;
    let (mut sxx, mut sxy) = (0.0, 0.0);
    for (xi, yi) in x.iter().zip(y) {
        sxx += (xi - x_mean) * (xi - x_mean);
        sxy += (xi - x_mean) * (yi - y_mean);
    }
    if sxx.is_nan() || sxx <= 0.0 {
        return None;
    }
    let slope = sxy / sxx;
    let intercept = y_mean - slope * x_mean;
    let ssr = x
        .iter()
        .zip(y)
        .map(|(xi, yi)| (yi - intercept - slope * xi).powi(2))
        .sum();
    Some(LineFit {
        intercept,
        slope,
        ssr,
        points: m,
        x_mean,
        sxx,
    })
}

/// Weighted least squares of y = a + b·x minimising Σ(wᵢ(yᵢ − a − b·xᵢ))²; returns (a, b).
pub(crate) fn weighted_line(x: &[f64], y: &[f64], w: &[f64]) -> Option<(f64, f64)> {
    let (mut sw, mut sx, mut sy) = (0.0, 0.0, 0.0);
    for ((xi, yi), wi) in x.iter().zip(y).zip(w) {
        let w2 = wi * wi;
        sw += w2;
        sx += w2 * xi;
        sy += w2 * yi;
    }
    let (xm, ym) = (sx / sw, sy / sw);
    let (mut sxx, mut sxy) = (0.0, 0.0);
    for ((xi, yi), wi) in x.iter().zip(y).zip(w) {
        sxx += wi * wi * (xi - xm) * (xi - xm);
        sxy += wi * wi * (xi - xm) * (yi - ym);
    }
    if sxx.is_nan() || sxx <= 0.0 {
        return None;
    }
    let b = sxy / sxx;
    Some((ym - b * xm, b))
}

/// Weighted least squares of y = b·x (no intercept): b = Σw²xy / Σw²x².
pub(crate) fn weighted_origin_slope(x: &[f64], y: &[f64], w: &[f64]) -> Option<f64> {
    let (mut sxy, mut sxx) = (0.0, 0.0);
    for ((xi, yi), wi) in x.iter().zip(y).zip(w) {
        sxy += wi * wi * xi * yi;
        sxx += wi * wi * xi * xi;
    }
    (sxx > 0.0).then(|| sxy / sxx)
}
