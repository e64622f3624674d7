//! Dry air.
//!
//! - Viscosity and thermal conductivity: E. W. Lemmon and R. T Jacobsen, "Viscosity and Thermal
//!   Conductivity Equations for Nitrogen, Oxygen, Argon, and Air", Int. J. Thermophys. 25 (2004)
//!   21–69: dilute gas Eqs. (2)–(4) with the collision integral of Eq. (4) and Table I, residual
//!   terms Eq. (5)/(7) with the air coefficients of Tables II and IV. The critical enhancement λc
//!   (Eq. 8) is left out: at the pressures this tool serves (50–500 kPa) and above 200 K it is
//!   below 0.05 % of λ, far inside the correlation's own uncertainty.
//! - Ideal-gas isobaric heat capacity: the ideal-gas part of E. W. Lemmon, R. T Jacobsen,
//!   S. G. Penoncello and D. G. Friend, "Thermodynamic Properties of Air and Mixtures of Nitrogen,
//!   Argon, and Oxygen From 60 to 2000 K at Pressures to 2000 MPa", J. Phys. Chem. Ref. Data 29
//!   (2000) 331–385, Eq. (24) with Table 12's coefficients. It is the zero-pressure cp; at 1 atm
//!   real air's cp is higher by 0.25 % at 250 K, 0.16 % at 300 K and 0.05 % at 500 K (CoolProp
//!   8.0.0, HEOS::Air), well inside the uncertainty of any convection correlation.
//! - Density: ideal gas ρ = pM/(RT) with M = 28.9586 g/mol and R = 8.314510 J/(mol·K), the values
//!   of Lemmon et al. (2000). At 1 atm real air is denser by 0.1 % at 250 K, 0.03 % at 300 K and
//!   less when hotter (CoolProp 8.0.0, HEOS::Air); CoolProp takes M = 28.96546 g/mol, a further
//!   0.024 % on every per-kilogram value.
//!
//! Units: T in K, molar density in mol/dm³ for the transport functions (as the paper tabulates),
//! p in Pa, results SI unless the name says otherwise.

use super::Properties;
use crate::engine::error::{finite, EngineError};
use crate::engine::validity::Range;

/// Molar mass of dry air, g/mol (Lemmon et al. 2000).
pub const MOLAR_MASS: f64 = 28.9586;
/// Molar gas constant used with it, J/(mol·K) (Lemmon et al. 2000).
pub const R_MOLAR: f64 = 8.314_510;
/// Reducing temperature (maxcondentherm), K, and reducing density, mol/dm³ (Lemmon & Jacobsen 2004).
pub const T_C: f64 = 132.6312;
pub const RHO_C: f64 = 10.4477;

/// Where each air property comes from, for the working.
pub const SOURCES: &[(&str, &str)] = &[
    ("ρ", "ideal gas, M = 28.9586 g/mol (Lemmon et al. 2000)"),
    ("μ", "Lemmon & Jacobsen (2004)"),
    (
        "k",
        "Lemmon & Jacobsen (2004), without the critical enhancement",
    ),
    ("cp", "ideal-gas part of Lemmon et al. (2000)"),
    ("β", "ideal gas, 1/T"),
];

/// The range the transport equations were published for: the range of the air equation of state,
/// 60–2000 K (Lemmon & Jacobsen 2004, abstract; from memory).
pub const PUBLISHED_T: Range = Range {
    quantity: "T",
    lo: 60.0,
    hi: 2000.0,
    unit: "K",
    source: "Lemmon & Jacobsen (2004), from memory",
};
/// The tool's own working range for air: 200–1000 K.
pub const WORKING_T: Range = Range {
    quantity: "T",
    lo: 200.0,
    hi: 1000.0,
    unit: "K",
    source: "Leeward's working range for air",
};
/// The tool's own working range for air: 50–500 kPa.
pub const WORKING_P: Range = Range {
    quantity: "p",
    lo: 50e3,
    hi: 500e3,
    unit: "Pa",
    source: "Leeward's working range for air",
};

const METHOD: &str = "air properties";

/// Lennard-Jones parameters for air: σ nm, ε/k K (Lemmon & Jacobsen 2004, Table I).
const SIGMA: f64 = 0.360;
const EPS_K: f64 = 103.3;
/// Collision integral coefficients b0..b4 (Table I).
const B: [f64; 5] = [0.431, -0.4623, 0.08406, 0.005341, -0.00331];

/// Residual viscosity terms (N, t, d, l, γ) for air (Table II).
const ETA_R: [(f64, f64, i32, i32, f64); 5] = [
    (10.72, 0.2, 1, 0, 0.0),
    (1.122, 0.05, 4, 0, 0.0),
    (0.002019, 2.4, 9, 0, 0.0),
    (-8.876, 0.6, 1, 1, 1.0),
    (-0.02916, 3.6, 8, 1, 1.0),
];

/// Dilute-gas conductivity terms for air (Table IV): N1·η0 + N2·τ^t2 + N3·τ^t3.
const LAMBDA_0: (f64, (f64, f64), (f64, f64)) = (1.308, (1.405, -1.1), (-1.036, -0.3));

/// Residual conductivity terms (N, t, d, l, γ) for air (Table IV).
const LAMBDA_R: [(f64, f64, i32, i32, f64); 6] = [
    (8.743, 0.1, 1, 0, 0.0),
    (14.76, 0.0, 2, 0, 0.0),
    (-16.62, 0.5, 3, 2, 1.0),
    (3.793, 2.7, 7, 2, 1.0),
    (-6.142, 0.3, 7, 2, 1.0),
    (-0.3778, 1.3, 11, 2, 1.0),
];

fn residual(terms: &[(f64, f64, i32, i32, f64)], tau: f64, delta: f64) -> f64 {
    residual_with(terms, twentieth_power(tau), delta)
}

/// τ^(1/20): every exponent of τ in Tables II and IV is a multiple of 0.05, so each power is an
/// integer power of this one number (one exponential for all of them).
fn twentieth_power(tau: f64) -> f64 {
    (0.05 * tau.ln()).exp()
}

/// τ^t from `a` = τ^(1/20), for t a multiple of 0.05.
fn tau_pow(a: f64, t: f64) -> f64 {
    let k = (20.0 * t).round();
    debug_assert!(
        (20.0 * t - k).abs() < 1e-9,
        "exponent {t} is not a multiple of 0.05"
    );
    a.powi(k as i32)
}

fn residual_with(terms: &[(f64, f64, i32, i32, f64)], a: f64, delta: f64) -> f64 {
    // The exponential factor exp(−γ·δ^l) once per distinct (γ, l): every term with l ≠ 0 has
    // γ = 1 in both tables.
    let (e1, e2) = ((-delta).exp(), (-delta * delta).exp());
    terms
        .iter()
        .map(|&(n, t, d, l, g)| {
            let e = match (l, g) {
                (0, _) => 1.0,
                (1, 1.0) => e1,
                (2, 1.0) => e2,
                _ => (-g * delta.powi(l)).exp(),
            };
            n * tau_pow(a, t) * delta.powi(d) * e
        })
        .sum()
}

/// Dilute-gas viscosity η0, μPa·s (Eq. 2, collision integral Eq. 4).
pub fn viscosity_dilute_upas(t: f64) -> f64 {
    let ln_ts = (t / EPS_K).ln();
    let mut poly = 0.0;
    for &b in B.iter().rev() {
        poly = poly * ln_ts + b;
    }
    let omega = poly.exp();
    0.026_695_8 * (MOLAR_MASS * t).sqrt() / (SIGMA * SIGMA * omega)
}

/// Viscosity η, μPa·s, at T (K) and molar density ρ (mol/dm³) (Eqs. 1, 2, 5).
pub fn viscosity_upas(t: f64, rho_mol: f64) -> f64 {
    viscosity_dilute_upas(t) + residual(&ETA_R, T_C / t, rho_mol / RHO_C)
}

/// Thermal conductivity λ without the critical enhancement, mW/(m·K), at T (K) and molar density
/// ρ (mol/dm³) (Eqs. 3, 7).
pub fn conductivity_mwmk(t: f64, rho_mol: f64) -> f64 {
    let tau = T_C / t;
    let (n1, (n2, t2), (n3, t3)) = LAMBDA_0;
    let l0 = n1 * viscosity_dilute_upas(t) + n2 * tau.powf(t2) + n3 * tau.powf(t3);
    l0 + residual(&LAMBDA_R, tau, rho_mol / RHO_C)
}

/// Viscosity (μPa·s) and conductivity (mW/(m·K)) together, sharing the dilute-gas viscosity.
pub fn transport(t: f64, rho_mol: f64) -> (f64, f64) {
    let tau = T_C / t;
    let delta = rho_mol / RHO_C;
    let eta0 = viscosity_dilute_upas(t);
    let (n1, (n2, t2), (n3, t3)) = LAMBDA_0;
    let a = twentieth_power(tau);
    let l0 = n1 * eta0 + n2 * tau_pow(a, t2) + n3 * tau_pow(a, t3);
    (
        eta0 + residual_with(&ETA_R, a, delta),
        l0 + residual_with(&LAMBDA_R, a, delta),
    )
}

/// Ideal-gas part of the air Helmholtz energy, Lemmon et al. (2000) Table 12: the power terms
/// N1..N3 (τ^-3, τ^-2, τ^-1), N6 (τ^1.5), N7 (ln τ), and the Planck–Einstein-like terms.
const N_IG: [f64; 13] = [
    0.605_719_400e-7,
    -0.210_274_769e-4,
    -0.158_860_716e-3,
    -13.841_928_076,
    17.275_266_575,
    -0.195_363_420e-3,
    2.490_888_032,
    0.791_309_509,
    0.212_236_768,
    -0.197_938_904,
    25.363_65,
    16.907_41,
    87.312_79,
];

/// Ideal-gas isobaric heat capacity cp0/R (dimensionless), from −τ²·∂²α0/∂τ² + 1.
pub fn cp0_over_r(t: f64) -> f64 {
    let n = &N_IG;
    let tau = T_C / t;
    let mut cv = -12.0 * n[0] * tau.powi(-3)
        - 6.0 * n[1] * tau.powi(-2)
        - 2.0 * n[2] / tau
        - 0.75 * n[5] * tau * tau.sqrt()
        + n[6];
    // ln(1 − exp(−c·τ)) terms.
    for (ni, ci) in [(n[7], n[10]), (n[8], n[11])] {
        let x = ci * tau;
        let e = x.exp();
        cv += ni * x * x * e / ((e - 1.0) * (e - 1.0));
    }
    // ln(2/3 + exp(c·τ)) term.
    let x = n[12] * tau;
    // Written with exp(−x) so large x cannot overflow: e/(2/3+e)² = em/(1+2/3·em)², em = exp(−x).
    let em = (-x).exp();
    cv -= n[9] * x * x * (2.0 / 3.0) * em / ((1.0 + 2.0 / 3.0 * em) * (1.0 + 2.0 / 3.0 * em));
    1.0 + cv
}

/// Ideal-gas molar density, mol/dm³, at T (K) and p (Pa).
pub fn molar_density(t: f64, p: f64) -> f64 {
    p / (R_MOLAR * t) / 1000.0
}

/// All properties of dry air at T (K) and p (Pa), flagged against the published and working ranges.
pub fn properties(t: f64, p: f64) -> Result<Properties, EngineError> {
    finite("air temperature", t)?;
    finite("air pressure", p)?;
    if t <= 0.0 {
        return Err(EngineError::Undefined {
            subject: crate::engine::error::Subject::General,
            quantity: "temperature",
            value: t,
            unit: "K",
            why: "at or below absolute zero",
        });
    }
    if p <= 0.0 {
        return Err(EngineError::Undefined {
            subject: crate::engine::error::Subject::General,
            quantity: "pressure",
            value: p,
            unit: "Pa",
            why: "an absolute pressure must be above zero",
        });
    }
    let mut flags = Vec::new();
    for (range, v) in [(&PUBLISHED_T, t), (&WORKING_T, t), (&WORKING_P, p)] {
        if let Some(f) = range.check(METHOD, v, false) {
            flags.push(f);
        }
    }
    let rho_mol = molar_density(t, p);
    let m = MOLAR_MASS * 1e-3;
    let rho = rho_mol * 1000.0 * m;
    let (eta, lambda) = transport(t, rho_mol);
    let (mu, k) = (eta * 1e-6, lambda * 1e-3);
    let cp = cp0_over_r(t) * R_MOLAR / m;
    Ok(Properties::from_primaries(
        t,
        p,
        rho,
        mu,
        k,
        cp,
        1.0 / t,
        SOURCES,
        flags,
    ))
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Relative closeness; tolerances follow the digits the source printed.
    fn rel(a: f64, b: f64) -> f64 {
        ((a - b) / b).abs()
    }

    /// Lemmon & Jacobsen (2004) Table V, points without the critical enhancement. Printed to six
    /// significant figures, so agreement to half a unit in the sixth digit.
    #[test]
    fn lemmon_jacobsen_2004_table_v() {
        let cases = [
            // (T K, ρ mol/dm³, η μPa·s, λ mW/(m·K) or NaN where the table's λ includes λc)
            (100.0, 0.0, 7.09559, 9.35902),
            (300.0, 0.0, 18.5230, 26.3529),
            (300.0, 5.0, 21.3241, 32.6062),
            (100.0, 28.0, 107.923, f64::NAN),
            (200.0, 10.0, 21.1392, f64::NAN),
            (132.64, 10.4, 17.7623, f64::NAN),
        ];
        for (t, rho, eta, lambda) in cases {
            let e = viscosity_upas(t, rho);
            assert!(rel(e, eta) < 5e-6, "η({t}, {rho}) = {e}, table {eta}");
            if lambda.is_finite() {
                let l = conductivity_mwmk(t, rho);
                assert!(rel(l, lambda) < 5e-6, "λ({t}, {rho}) = {l}, table {lambda}");
            }
        }
    }

    #[test]
    fn shared_transport_equals_the_separate_functions() {
        for (t, rho) in [(250.0, 0.05), (300.0, 5.0), (900.0, 0.01)] {
            let (e, l) = transport(t, rho);
            assert!(rel(e, viscosity_upas(t, rho)) < 1e-14);
            assert!(rel(l, conductivity_mwmk(t, rho)) < 1e-14);
        }
    }

    #[test]
    fn cp0_is_near_seven_halves_r_at_room_temperature() {
        // Diatomic ideal gas with frozen vibration: cp0/R → 3.5 (textbook kinetic theory).
        let c = cp0_over_r(300.0);
        assert!((c - 3.5).abs() < 0.01, "{c}");
        // Vibration switches on when hot: cp0 rises monotonically from 250 to 2000 K.
        let mut last = cp0_over_r(250.0);
        for t in (260..=2000).step_by(10) {
            let c = cp0_over_r(t as f64);
            assert!(c > last, "cp0/R not increasing at {t} K");
            last = c;
        }
    }

    #[test]
    fn bad_states_are_errors() {
        assert!(properties(0.0, 101325.0).is_err());
        assert!(properties(-5.0, 101325.0).is_err());
        assert!(properties(300.0, 0.0).is_err());
        assert!(properties(f64::NAN, 101325.0).is_err());
    }

    #[test]
    fn outside_the_working_range_is_flagged_not_refused() {
        let p = properties(1200.0, 101325.0).unwrap();
        assert!(p.flags.iter().any(|f| f.range == WORKING_T));
        assert!(p.mu.is_finite() && p.k > 0.0);
        assert!(properties(300.0, 101325.0).unwrap().flags.is_empty());
    }

    /// CoolProp 8.0.0 (PyPI), HEOS::Air at 350 K and 101 325 Pa: Pr = 0.7019015 (shared/
    /// references.md). The engine's Lemmon–Jacobsen transport and its cp agree within 0.5 %.
    #[test]
    fn prandtl_against_coolprop_at_350_k() {
        let p = properties(350.0, 101325.0).unwrap();
        assert!((p.pr / 0.7019015 - 1.0).abs() < 0.005, "{}", p.pr);
    }
}
