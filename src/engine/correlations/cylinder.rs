//! Circular cylinder in cross-flow, mean Nusselt number over the circumference.

use super::Reference;
use crate::engine::validity::{Flagged, Range};

/// Churchill & Bernstein's lower bound on Re·Pr.
pub const CHURCHILL_BERNSTEIN_REPR: Range = Range {
    quantity: "Re·Pr",
    lo: 0.2,
    hi: f64::INFINITY,
    unit: "",
    source: "Churchill & Bernstein (1977)",
};

pub const CHURCHILL_BERNSTEIN: &str = "Churchill–Bernstein";
/// Churchill–Bernstein takes its properties at the film temperature.
pub const CHURCHILL_BERNSTEIN_REFERENCE: Reference = Reference::Film;

/// S. W. Churchill and M. Bernstein, "A Correlating Equation for Forced Convection From Gases and
/// Liquids to a Circular Cylinder in Crossflow", J. Heat Transfer 99 (1977) 300–306, Eq. (3):
///
/// Nu = 0.3 + 0.62·Re^½·Pr^⅓ / [1 + (0.4/Pr)^⅔]^¼ · [1 + (Re/282 000)^⅝]^⅘
///
/// Re = U·D/ν and Pr at the film temperature. Published for all Re·Pr ≥ 0.2 (flagged below).
/// Tends to 0.3 as Re → 0. Inputs: Re ≥ 0, Pr > 0 (dimensionless).
pub fn churchill_bernstein(re: f64, pr: f64) -> Flagged<f64> {
    let lam = 0.62 * re.sqrt() * pr.cbrt() / (1.0 + (0.4 / pr).powf(2.0 / 3.0)).powf(0.25);
    let nu = 0.3 + lam * (1.0 + (re / 282_000.0).powf(5.0 / 8.0)).powf(0.8);
    let mut out = Flagged::new(nu);
    out.check(CHURCHILL_BERNSTEIN, &CHURCHILL_BERNSTEIN_REPR, re * pr);
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Worked example, from memory: Incropera & DeWitt, Fundamentals of Heat and Mass Transfer,
    /// 6th ed., Example 7.4 — a 12.7 mm cylinder in air at 10 m/s, film properties at 350 K give
    /// Re = 6071, Pr = 0.700 and Nu = 40.6 (printed to three figures).
    #[test]
    fn incropera_example_7_4_from_memory() {
        let nu = churchill_bernstein(6071.0, 0.700);
        assert!((nu.value - 40.6).abs() < 0.05, "{}", nu.value);
        assert!(nu.flags.is_empty());
    }

    #[test]
    fn tends_to_0_3_in_still_fluid_and_is_flagged_there() {
        let nu = churchill_bernstein(1e-12, 0.7);
        assert!((nu.value - 0.3).abs() < 1e-5);
        assert_eq!(nu.flags.len(), 1);
        assert_eq!(nu.flags[0].range, CHURCHILL_BERNSTEIN_REPR);
    }

    #[test]
    fn increases_with_reynolds() {
        let mut last = 0.0;
        let mut re = 0.1;
        while re < 1e7 {
            let nu = churchill_bernstein(re, 0.71).value;
            assert!(nu > last, "not increasing at Re = {re}");
            last = nu;
            re *= 1.2;
        }
    }
}
