//! Mixed forced and natural convection: Churchill's combination Nuⁿ = Nu_Fⁿ ± Nu_Nⁿ.
//!
//! S. W. Churchill, "A comprehensive correlating equation for laminar, assisting, forced and free
//! convection", AIChE J. 23 (1977) 10–16, and his chapter on combined free and forced convection
//! around immersed bodies in the Heat Exchanger Design Handbook (1983), as applied in Incropera,
//! DeWitt, Bergman & Lavine, Fundamentals of Heat and Mass Transfer, §9.9: n = 3 in general,
//! n = 4 for transverse flow over horizontal cylinders and spheres; + for assisting and
//! transverse flow, − for opposing flow (exponents and signs from memory of §9.9).
//!
//! Both parts are the whole correlations, each with its own still-fluid limit (0.3 in
//! Churchill–Bernstein, 2 for a sphere, about 0.36 in Churchill–Chu). The still-fluid limit they
//! share, h₀ = min(h_F0, h_N), is the part neither adds to the other — the conduction term of a
//! sphere is Churchill's own example — so it is blended once:
//!
//! h = h₀ + [(h_F − h₀)ⁿ ± (h_N − h₀)ⁿ]^(1/n).
//!
//! For assisting and transverse flow the answer is then never below either part (the root of a
//! sum of n-th powers is at least the larger term), it is exactly h_N in still fluid (h_F = h_F0
//! there), it tends to h_F in strong wind, and it is continuous in between.

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

/// The blended h, W/(m²·K), and any flag: `forced` is the forced correlation's h_F,
/// `forced_still` its value in still fluid h_F0 (≤ h_F), `natural` the natural correlation's h_N.
pub fn blend(
    forced: f64,
    forced_still: f64,
    natural: f64,
    n: f64,
    direction: Direction,
) -> (f64, Option<Flag>) {
    let floor = forced_still.min(natural).max(0.0);
    let (a, b) = ((forced - floor).max(0.0), (natural - floor).max(0.0));
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
                slack: 0.0,
            }
        });
    (floor + root(sum), flag)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn limits_and_continuity() {
        // Still fluid (h_F = h_F0): exactly the natural part, whatever the forced constant.
        assert_eq!(blend(1.0, 1.0, 8.0, 4.0, Direction::Transverse).0, 8.0);
        assert_eq!(blend(0.3, 0.3, 8.0, 3.0, Direction::Assisting).0, 8.0);
        // No natural part: exactly the forced part.
        assert!((blend(9.0, 0.3, 0.0, 3.0, Direction::Assisting).0 - 9.0).abs() < 1e-12);
        // Continuous and rising in the forced part, never below either part.
        let mut last = 7.0;
        for i in 0..=1000 {
            let hf = 0.3 + i as f64 * 0.05;
            let h = blend(hf, 0.3, 7.0, 4.0, Direction::Transverse).0;
            assert!(h >= last && h - last < 0.06);
            assert!(h >= hf && h >= 7.0, "{hf}: {h}");
            last = h;
        }
        // Strong forced flow: within 0.1 % of forced.
        let h = blend(100.0, 0.3, 7.0, 3.0, Direction::Assisting).0;
        assert!((h / 100.0 - 1.0) < 1e-3);
    }

    /// The defect this replaced: the forced part's still-fluid constant was taken off and not
    /// put back, so strong wind gave h_F − h_F0 and a weak draught gave less than h_F alone.
    #[test]
    fn the_blend_never_falls_below_the_forced_part() {
        for (hf, h0, hn) in [
            (2.0, 1.5, 1.2),
            (20.0, 0.3, 5.0),
            (5.0, 2.0, 4.0),
            (3.0, 3.0, 1.0),
        ] {
            for n in [3.0, 4.0] {
                for dir in [Direction::Transverse, Direction::Assisting] {
                    let h = blend(hf, h0, hn, n, dir).0;
                    assert!(h >= hf.max(hn) - 1e-12, "{hf} {h0} {hn} {n}: {h}");
                }
            }
        }
    }

    #[test]
    fn opposing_balance_is_flagged() {
        let (h, f) = blend(7.0, 0.0, 7.0, 3.0, Direction::Opposing);
        assert_eq!(h, 0.0);
        assert!(f.is_some());
        assert!(blend(30.0, 0.0, 7.0, 3.0, Direction::Opposing).1.is_none());
    }
}
