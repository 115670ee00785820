//! Turbulent (and all-regime) Fanning friction factors: Colebrook for a Newtonian product in a
//! rough pipe, Dodge–Metzner for a power-law-like product in a smooth pipe, and Darby, Mun &
//! Boger for a Bingham plastic.

/// Fixed-point iterations for Colebrook (it converges in under 20).
const ITERATIONS: usize = 100;

/// Colebrook (1939, J. Inst. Civ. Eng. 11:133), Darcy form
/// 1/√f_D = −2 log10(ε/(3.7D) + 2.51/(Re√f_D)), returned as Fanning f = f_D/4.
/// For turbulent Newtonian flow, Re above about 4000; `relative_roughness` = ε/D.
pub fn colebrook_fanning(reynolds: f64, relative_roughness: f64) -> f64 {
    let mut x: f64 = 8.0; // 1/√f_D
    for _ in 0..ITERATIONS {
        let next = -2.0 * (relative_roughness / 3.7 + 2.51 * x / reynolds).log10();
        if (next - x).abs() <= 1e-14 * x.abs() {
            x = next;
            break;
        }
        x = next;
    }
    1.0 / (4.0 * x * x)
}

/// Dodge & Metzner (1959, AIChE J 5:189), smooth pipe, Fanning f:
/// 1/√f = (4/n′^0.75)·log10(Re_MR·f^(1−n′/2)) − 0.4/n′^1.2.
/// Their data span 0.36 ≤ n′ ≤ 1 and Re_MR up to about 3.6×10⁴ (the upper figure from memory);
/// beyond that it is an extrapolation. At n′ = 1 it is the von Kármán–Nikuradse smooth-pipe law
/// with −0.4 for −0.396 (Prandtl 1935; Nikuradse 1932).
pub fn dodge_metzner(reynolds: f64, n_prime: f64) -> f64 {
    let a = 4.0 / n_prime.powf(0.75);
    let b = 0.4 / n_prime.powf(1.2);
    // In x = 1/√f the equation is g(x) = x − a·log10(Re·x^(n′−2)) + b = 0, with f^(1−n′/2) =
    // x^(n′−2). g rises with x (g′ = 1 + a(2−n′)/(x ln 10) > 0), so bisection finds the one
    // root; a plain fixed-point iteration oscillates at small n′.
    let g = |x: f64| x - a * (reynolds * x.powf(n_prime - 2.0)).log10() + b;
    let (lo, hi) = (1e-3, 1e4);
    let x = if g(lo) >= 0.0 {
        lo
    } else if g(hi) <= 0.0 {
        hi
    } else {
        super::solve::bisect(lo, hi, g)
    };
    1.0 / (x * x)
}

/// Darby, Mun & Boger (1992, Chemical Engineering, September issue, p. 116; issue from memory), turbulent Bingham plastic, Fanning f:
/// f_T = 10^a·Re_B^(−0.193), a = −1.47[1 + 0.146·exp(−2.9×10⁻⁵·He)], with the plastic
/// Reynolds number Re_B = ρVD/μp and Hedstrom number He = ρD²τ0/μp² (as given in Darby 2001,
/// *Chemical Engineering Fluid Mechanics*, 2nd ed., ch. 6).
pub fn darby_mun_boger_turbulent(re_b: f64, hedstrom: f64) -> f64 {
    let a = -1.47 * (1.0 + 0.146 * (-2.9e-5 * hedstrom).exp());
    10f64.powf(a) * re_b.powf(-0.193)
}

/// Darby, Mun & Boger (1992) all-regime blend f = (f_L^m + f_T^m)^(1/m), m = 1.7 + 40000/Re_B,
/// with f_L the laminar (Buckingham–Reiner) friction factor. Computed relative to the larger
/// term so that a large m (low Re_B) does not underflow.
pub fn darby_mun_boger_blend(f_laminar: f64, f_turbulent: f64, re_b: f64) -> f64 {
    let m = 1.7 + 40000.0 / re_b;
    let top = f_laminar.max(f_turbulent);
    let sum = (f_laminar / top).powf(m) + (f_turbulent / top).powf(m);
    top * sum.powf(1.0 / m)
}
