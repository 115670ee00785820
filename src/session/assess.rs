//! The checks themselves: reversed pairs, fit quality, implausible constants and the runs of
//! residual signs (with the exact runs test).

use super::checks::{
    Concern, Implausibility, LONGEST_RUN, PLAUSIBLE_N, POOR_R_SQUARED, REVERSED_MARGIN,
    RUNS_TEST_LEVEL, WATER_VISCOSITY_PA_S,
};
use crate::rheology::{Fit, ParamName};

/// Pairs (slower, faster) of indices into `xy` where the slower reads higher. Each slower
/// reading is paired with the fastest reading below it, so one misread gives one pair.
pub fn reversed_pairs(xy: &[(f64, f64)]) -> Vec<(usize, usize)> {
    let mut out = Vec::new();
    for (i, &(xi, yi)) in xy.iter().enumerate() {
        let faster_lower = xy
            .iter()
            .enumerate()
            .filter(|&(_, &(xj, yj))| xj > xi && yi > yj * (1.0 + REVERSED_MARGIN))
            .max_by(|a, b| a.1.0.total_cmp(&b.1.0));
        if let Some((j, _)) = faster_lower {
            out.push((i, j));
        }
    }
    out
}

/// Concerns about a fit itself: quality, residual pattern, constants.
pub fn assess_fit(fit: &Fit, rates: &[f64]) -> Vec<Concern> {
    let mut out = Vec::new();
    if fit.r_squared < 0.0 {
        out.push(Concern::WorseThanFlat);
    } else if fit.r_squared < POOR_R_SQUARED {
        out.push(Concern::PoorFit {
            r_squared: fit.r_squared,
        });
    }
    out.extend(residual_pattern(&fit.residuals_pa, rates));
    out.extend(implausible(fit));
    out
}

fn implausible(fit: &Fit) -> Vec<Concern> {
    let mut out = Vec::new();
    for (param, value) in fit.model.params() {
        let why = match param {
            ParamName::MuP | ParamName::MuC if value < WATER_VISCOSITY_PA_S => {
                Implausibility::BelowWater
            }
            ParamName::N if !(PLAUSIBLE_N.0..=PLAUSIBLE_N.1).contains(&value) => {
                Implausibility::FlowIndexOutside
            }
            _ => continue,
        };
        out.push(Concern::Implausible { param, value, why });
    }
    out
}

/// Runs of one sign in the residuals ordered by rate; residuals at rounding level are skipped.
fn residual_pattern(residuals: &[f64], rates: &[f64]) -> Option<Concern> {
    let mut order: Vec<usize> = (0..residuals.len().min(rates.len())).collect();
    order.sort_by(|&a, &b| rates[a].total_cmp(&rates[b]));
    let scale = residuals.iter().fold(0.0_f64, |m, r| m.max(r.abs()));
    let signs: Vec<bool> = order
        .iter()
        .map(|&i| residuals[i])
        .filter(|r| r.abs() > 1e-9 * scale)
        .map(|r| r > 0.0)
        .collect();
    let points = signs.len();
    if points < LONGEST_RUN {
        return None;
    }
    let (runs, longest) = count_runs(&signs);
    let positives = signs.iter().filter(|&&s| s).count();
    let p = runs_p_value(positives, points - positives, runs);
    (longest >= LONGEST_RUN || p <= RUNS_TEST_LEVEL).then_some(Concern::ResidualPattern {
        runs,
        longest,
        points,
    })
}

fn count_runs(signs: &[bool]) -> (usize, usize) {
    let (mut runs, mut longest, mut current) = (0, 0, 0);
    for (i, s) in signs.iter().enumerate() {
        if i == 0 || signs[i - 1] != *s {
            runs += 1;
            current = 0;
        }
        current += 1;
        longest = longest.max(current);
    }
    (runs, longest)
}

/// P(R ≤ runs) for n1 and n2 signs in random order: the exact runs distribution (Wald &
/// Wolfowitz 1940, *Ann. Math. Statist.* 11:147): P(R = 2k) = 2·C(n1−1, k−1)·C(n2−1, k−1)/C(n, n1),
/// P(R = 2k+1) = [C(n1−1, k)·C(n2−1, k−1) + C(n1−1, k−1)·C(n2−1, k)]/C(n, n1).
pub fn runs_p_value(n1: usize, n2: usize, runs: usize) -> f64 {
    if n1 == 0 || n2 == 0 {
        return 1.0;
    }
    let total = choose(n1 + n2, n1);
    let ways = |r: usize| -> f64 {
        let k = r / 2;
        if r.is_multiple_of(2) {
            2.0 * choose_m1(n1, k) * choose_m1(n2, k)
        } else {
            choose(n1 - 1, k) * choose_m1(n2, k) + choose_m1(n1, k) * choose(n2 - 1, k)
        }
    };
    (2..=runs).map(ways).sum::<f64>() / total
}

/// C(n − 1, k − 1), 0 when k = 0.
fn choose_m1(n: usize, k: usize) -> f64 {
    if k == 0 { 0.0 } else { choose(n - 1, k - 1) }
}

fn choose(n: usize, k: usize) -> f64 {
    if k > n {
        return 0.0;
    }
    (0..k).fold(1.0, |acc, i| acc * (n - i) as f64 / (i + 1) as f64)
}

#[cfg(test)]
mod tests {
    use super::*;

    // Source: exact runs distribution worked by hand. n1 = n2 = 4: C(8, 4) = 70 orders;
    // R = 2 in 2 of them (++++−−−− and its mirror), R = 3 in 2·C(3,1)·C(3,0) = 6, so
    // P(R ≤ 2) = 2/70 and P(R ≤ 3) = 8/70. n1 = n2 = 3: P(R = 2) = 2/20.
    #[test]
    fn runs_test_matches_hand_counts() {
        assert!((runs_p_value(4, 4, 2) - 2.0 / 70.0).abs() < 1e-12);
        assert!((runs_p_value(4, 4, 3) - 8.0 / 70.0).abs() < 1e-12);
        assert!((runs_p_value(3, 3, 2) - 0.1).abs() < 1e-12);
        assert!((runs_p_value(3, 3, 6) - 1.0).abs() < 1e-12);
    }

    #[test]
    fn reversed_pairs_name_the_slower_and_the_fastest_lower_reading() {
        // 3 rpm reads 14 above 6 rpm at 12 and 100 rpm at 13: paired with 100 rpm.
        let xy = [
            (600.0, 52.0),
            (300.0, 34.0),
            (100.0, 13.0),
            (6.0, 12.0),
            (3.0, 14.0),
        ];
        assert_eq!(reversed_pairs(&xy), vec![(4, 2)]);
        assert!(reversed_pairs(&[(1.0, 1.0), (2.0, 2.0)]).is_empty());
    }
}
