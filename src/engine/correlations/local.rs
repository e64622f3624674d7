//! Local heat transfer over the front of a circular cylinder.
//!
//! Forward-region formula Nu_θ = 1.14·Re^½·Pr^0.4·[1 − (θ/90°)³], 0° ≤ θ ≤ 80° from the front
//! stagnation point, as given by F. Kreith and M. S. Bohn, Principles of Heat Transfer, after
//! Frössling's laminar boundary-layer solution (from memory). Properties at the film temperature.
//! It describes the laminar boundary layer on the front only; behind separation the wake governs
//! and no formula of this kind applies.

use crate::engine::validity::{Flagged, Range};

pub const FRONT: &str = "Forward-region formula (Frössling; Kreith & Bohn)";
pub const FRONT_ANGLE: Range = Range {
    quantity: "θ",
    lo: 0.0,
    hi: 80.0,
    unit: "°",
    source: "Kreith & Bohn, from memory",
};
/// The formula assumes a laminar boundary layer over the front: subcritical flow.
pub const FRONT_RE: Range = Range {
    quantity: "Re",
    lo: 0.0,
    hi: 2e5,
    unit: "",
    source: "laminar front boundary layer, Re below about 2×10⁵",
};

/// Local Nusselt number on D at angle `theta_deg` from the front stagnation point.
pub fn front(theta_deg: f64, re: f64, pr: f64) -> Flagged<f64> {
    let x = theta_deg / 90.0;
    let mut out = Flagged::new(1.14 * re.sqrt() * pr.powf(0.4) * (1.0 - x * x * x));
    out.check(FRONT, &FRONT_ANGLE, theta_deg);
    out.check(FRONT, &FRONT_RE, re);
    out
}

/// Where the boundary layer leaves the surface at this Reynolds number, degrees from the front,
/// and the words for it. Subcritical: laminar separation near 80°. Above about 2×10⁵ the layer
/// turns turbulent first and separates further back, near 120–140° (typical values, common
/// practice).
pub fn separation(re: f64) -> (f64, &'static str) {
    if re < 2e5 {
        (80.0, "laminar separation near 80°")
    } else {
        (120.0, "transition, then turbulent separation near 120–140°")
    }
}

/// The front profile for plotting: (θ in degrees, Nu_θ) every 2° over 0–80°.
pub fn profile(re: f64, pr: f64) -> Vec<(f64, f64)> {
    (0..=40)
        .map(|i| {
            let th = 2.0 * i as f64;
            (th, front(th, re, pr).value)
        })
        .collect()
}

/// What the page says about the rear of the cylinder (never drawn from invented data).
pub const REAR_NOTE: &str = "Behind the separation point the wake governs: the local coefficient first falls to a minimum near separation, then rises again towards the rear stagnation point as eddies sweep the surface. No published formula of this kind describes it, so it is not drawn.";

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn stagnation_value_and_fall_to_eighty_degrees() {
        // θ = 0: 1.14·√10⁴·0.7^0.4 = 114 × 0.867040 = 98.84 (hand arithmetic).
        let n0 = front(0.0, 1e4, 0.7).value;
        assert!((n0 - 98.84).abs() < 0.01, "{n0}");
        let n80 = front(80.0, 1e4, 0.7);
        assert!((n80.value / n0 - (1.0 - (80.0f64 / 90.0).powi(3))).abs() < 1e-12);
        assert!(n80.flags.is_empty());
        assert!(!front(100.0, 1e4, 0.7).flags.is_empty());
    }
}
