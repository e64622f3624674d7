//! Mixed forced and natural convection: Churchill's combination Nuⁿ = Nu_Fⁿ ± Nu_Nⁿ.
//!
//! S. W. Churchill, "A comprehensive correlating equation for laminar, assisting, forced and free
//! convection", AIChE J. 23 (1977) 10–16; exponents as given by Incropera & DeWitt, §9.9 (from
//! memory): n = 3 in general, n = 4 for transverse flow over horizontal cylinders and spheres;
//! + for assisting and transverse flow, − for opposing flow.
//!
//! So that the blend is exactly the natural answer in still fluid and tends to the forced answer in
//! strong wind, it is applied to the parts above the still-fluid limits: for a sphere both
//! correlations contain the conduction limit Nu = 2, blended once; a forced correlation's own
//! still-fluid constant (0.3 in Churchill–Bernstein) is taken off before blending. Written in h
//! on the same length D:
//!
//! h = h_c + [(h_F − h_F0)ⁿ ± (h_N − h_c)ⁿ]^(1/n), with h_c = 2k/D for a sphere and 0 otherwise.

use crate::engine::validity::{Flag, FlagKind, Range};

/// Which way the stream goes relative to the buoyant flow along the surface.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Direction {
    /// Across the buoyant flow (horizontal wind on a horizontal cylinder or a sphere, or any wind
    /// on a vertical one).
    Transverse,
    /// With it (wind upward past a hot body, downward past a cold one).
    Assisting,
    /// Against it.
    Opposing,
}

impl Direction {
    pub fn describe(&self) -> &'static str {
        match self {
            Direction::Transverse => "transverse (stream across the buoyant flow)",
            Direction::Assisting => "assisting (stream along the buoyant flow)",
            Direction::Opposing => "opposing (stream against the buoyant flow)",
        }
    }
}

/// Churchill's exponent for this direction; `compact` is a horizontal cylinder or a sphere.
pub fn exponent(direction: Direction, compact: bool) -> f64 {
    match direction {
        Direction::Transverse if compact => 4.0,
        _ => 3.0,
    }
}

/// Opposing flows of similar strength are where the blend is known to be poor (the flow may
/// separate and reverse): flagged when the forced part is within a factor 2 of the natural part
/// (common practice).
pub const OPPOSING_BALANCE: Range = Range {
    quantity: "h_F/h_N (opposing)",
    lo: 2.0,
    hi: f64::INFINITY,
    unit: "",
    source: "Churchill (1977) blend; limit common practice",
};
pub const MIXED: &str = "Churchill (1977) mixed-convection blend";

/// The blended h, W/(m²·K), and any flag. `forced` is h_F − h_F0, `natural` h_N − h_c, both ≥ 0.
pub fn blend(
    forced: f64,
    natural: f64,
    floor: f64,
    n: f64,
    direction: Direction,
) -> (f64, Option<Flag>) {
    let (a, b) = (forced.max(0.0), natural.max(0.0));
    // n is 3 or 4: integer powers and roots, exact and cheaper than powf.
    let pow = |x: f64| match n as u32 {
        4 if n == 4.0 => (x * x) * (x * x),
        3 if n == 3.0 => x * x * x,
        _ => x.powf(n),
    };
    let root = |x: f64| match n as u32 {
        4 if n == 4.0 => x.sqrt().sqrt(),
        3 if n == 3.0 => x.cbrt(),
        _ => x.powf(1.0 / n),
    };
    let sum = match direction {
        Direction::Opposing => (pow(a) - pow(b)).abs(),
        _ => pow(a) + pow(b),
    };
    let flag =
        (direction == Direction::Opposing && b > 0.0 && a / b >= 0.5 && a / b < 2.0).then(|| {
            Flag {
                kind: FlagKind::Outside,
                method: MIXED,
                range: OPPOSING_BALANCE,
                value: a / b,
            }
        });
    (floor + root(sum), flag)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn limits_and_continuity() {
        // Still fluid: exactly the natural part; no natural part: exactly the forced part.
        assert_eq!(blend(0.0, 7.0, 1.0, 4.0, Direction::Transverse).0, 8.0);
        assert!((blend(9.0, 0.0, 0.0, 3.0, Direction::Assisting).0 - 9.0).abs() < 1e-12);
        // Continuous and rising in the forced part.
        let mut last = 7.0;
        for i in 0..=1000 {
            let h = blend(i as f64 * 0.05, 7.0, 0.0, 4.0, Direction::Transverse).0;
            assert!(h >= last && h - last < 0.06);
            last = h;
        }
        // Strong forced flow: within 0.1 % of forced.
        let h = blend(100.0, 7.0, 0.0, 3.0, Direction::Assisting).0;
        assert!((h / 100.0 - 1.0) < 1e-3);
    }

    #[test]
    fn opposing_balance_is_flagged() {
        let (h, f) = blend(7.0, 7.0, 0.0, 3.0, Direction::Opposing);
        assert_eq!(h, 0.0);
        assert!(f.is_some());
        assert!(blend(30.0, 7.0, 0.0, 3.0, Direction::Opposing).1.is_none());
    }
}
