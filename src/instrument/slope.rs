//! The local slope n′ = d ln τb / d ln Ω, estimated from the readings themselves.
//!
//! Choice: one least-squares quadratic of ln τb against ln Ω over all readings, differentiated
//! at each speed (Krieger's suggestion of a smooth curve through the log–log points, rather
//! than point-to-point slopes that amplify dial noise). Exact power-law data lie on a straight
//! line, which the quadratic reproduces, so n′ = n there. Two distinct speeds give the single
//! chord slope; one speed gives no slope at all. Readings at the same speed are grouped and
//! averaged (in ln τ) so repeated speeds never give a zero-width step.

/// Lowest accepted n′; below it the reading is flagged and n′ is limited.
pub const MIN_LOCAL_N: f64 = 0.05;
/// Highest accepted n′; above it the reading is flagged and n′ is limited.
pub const MAX_LOCAL_N: f64 = 2.0;

/// Speeds whose ln Ω differ by no more than this are taken as the same speed.
const SAME_SPEED_LN: f64 = 1e-9;

/// The fitted log–log curve, or the lack of one.
#[derive(Debug, Clone, PartialEq)]
pub(crate) enum SlopeCurve {
    /// Fewer than two distinct speeds with a reading above 0.
    NotMeasured,
    /// ln τ = c0 + c1·u + c2·u², with u = (ln Ω − centre)/half_width.
    Poly {
        centre: f64,
        half_width: f64,
        c1: f64,
        c2: f64,
    },
}

impl SlopeCurve {
    /// d ln τ / d ln Ω at ln Ω = x, or `None` when there is no curve.
    pub(crate) fn slope_at(&self, x: f64) -> Option<f64> {
        match *self {
            SlopeCurve::NotMeasured => None,
            SlopeCurve::Poly {
                centre,
                half_width,
                c1,
                c2,
            } => Some((c1 + 2.0 * c2 * (x - centre) / half_width) / half_width),
        }
    }
}

/// One speed: mean ln Ω, mean ln τ, and how many readings were taken there.
struct Group {
    x: f64,
    y: f64,
    count: f64,
}

/// Fit the curve to (ln Ω, ln τb) points; all must be finite.
pub(crate) fn fit_slope(points: &[(f64, f64)]) -> SlopeCurve {
    let groups = group_by_speed(points);
    let (Some(first), Some(last)) = (groups.first(), groups.last()) else {
        return SlopeCurve::NotMeasured;
    };
    if groups.len() < 2 {
        return SlopeCurve::NotMeasured;
    }
    let centre = 0.5 * (first.x + last.x);
    let half_width = 0.5 * (last.x - first.x);
    let max_degree = if groups.len() >= 3 { 2 } else { 1 };
    for degree in (1..=max_degree).rev() {
        if let Some(c) = weighted_poly_fit(&groups, centre, half_width, degree) {
            return SlopeCurve::Poly {
                centre,
                half_width,
                c1: c[1],
                c2: c[2],
            };
        }
    }
    SlopeCurve::NotMeasured
}

fn group_by_speed(points: &[(f64, f64)]) -> Vec<Group> {
    let mut sorted: Vec<(f64, f64)> = points.to_vec();
    sorted.sort_by(|a, b| a.0.total_cmp(&b.0));
    let mut groups: Vec<Group> = Vec::new();
    let mut start_x = f64::NEG_INFINITY;
    for (x, y) in sorted {
        match groups.last_mut() {
            Some(g) if x - start_x <= SAME_SPEED_LN => {
                g.x += (x - g.x) / (g.count + 1.0);
                g.y += (y - g.y) / (g.count + 1.0);
                g.count += 1.0;
            }
            _ => {
                start_x = x;
                groups.push(Group { x, y, count: 1.0 });
            }
        }
    }
    groups
}

/// Least squares of y on 1, u, u² (up to `degree`), weighted by group size; coefficients
/// above `degree` are 0. `None` when the normal equations are singular.
fn weighted_poly_fit(groups: &[Group], centre: f64, half: f64, degree: usize) -> Option<[f64; 3]> {
    let size = degree + 1;
    let mut a = [[0.0; 4]; 3];
    for g in groups {
        let u = (g.x - centre) / half;
        let basis = [1.0, u, u * u];
        for i in 0..size {
            for j in 0..size {
                a[i][j] += g.count * basis[i] * basis[j];
            }
            a[i][size] += g.count * basis[i] * g.y;
        }
    }
    solve(&mut a, size)
}

/// Gaussian elimination with partial pivoting on the augmented `size`×(`size`+1) block.
fn solve(a: &mut [[f64; 4]; 3], size: usize) -> Option<[f64; 3]> {
    let scale = (0..size).map(|i| a[i][i].abs()).fold(0.0, f64::max);
    for col in 0..size {
        let pivot = (col..size).max_by(|&i, &j| a[i][col].abs().total_cmp(&a[j][col].abs()))?;
        let p = a[pivot][col].abs();
        if p <= 1e-12 * scale || !p.is_finite() {
            return None;
        }
        a.swap(col, pivot);
        let top = a[col];
        for row in a.iter_mut().take(size).skip(col + 1) {
            let m = row[col] / top[col];
            for (v, t) in row.iter_mut().zip(top).take(size + 1).skip(col) {
                *v -= m * t;
            }
        }
    }
    let mut c = [0.0; 3];
    for row in (0..size).rev() {
        let tail: f64 = (row + 1..size).map(|k| a[row][k] * c[k]).sum();
        c[row] = (a[row][size] - tail) / a[row][row];
    }
    c.iter().all(|v| v.is_finite()).then_some(c)
}

/// How many different speeds the list holds (same grouping as the slope fit); rpm > 0.
pub(crate) fn count_distinct_speeds(rpms: impl Iterator<Item = f64>) -> usize {
    let points: Vec<(f64, f64)> = rpms.map(|rpm| (rpm.ln(), 0.0)).collect();
    group_by_speed(&points).len()
}
