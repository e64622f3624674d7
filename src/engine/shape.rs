//! The cross-sections a body can have (or a sphere): names, ids, the drawn length D, the
//! perimeter, the forced correlations in their order of preference, and the rule in words.

use crate::engine::correlations::{bars, cylinder, sphere, Forced};
use std::f64::consts::PI;

/// The cross-section of the body (or a sphere).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum Shape {
    Cylinder,
    Sphere,
    SquareFace,
    SquareCorner,
    HexFace,
    HexCorner,
    Plate,
}

impl Shape {
    pub const ALL: [Shape; 7] = [
        Shape::Cylinder,
        Shape::Sphere,
        Shape::SquareFace,
        Shape::SquareCorner,
        Shape::HexFace,
        Shape::HexCorner,
        Shape::Plate,
    ];
    /// Stable id in links and page attributes.
    pub fn id(&self) -> &'static str {
        match self {
            Shape::Cylinder => "cyl",
            Shape::Sphere => "sph",
            Shape::SquareFace => "sqf",
            Shape::SquareCorner => "sqc",
            Shape::HexFace => "hxf",
            Shape::HexCorner => "hxc",
            Shape::Plate => "plt",
        }
    }
    pub fn from_id(id: &str) -> Option<Shape> {
        Shape::ALL.into_iter().find(|s| s.id() == id)
    }
    pub fn label(&self) -> &'static str {
        match self {
            Shape::Cylinder => "Round: pipe, rod, wire",
            Shape::Sphere => "Sphere: ball, bulb, tank",
            Shape::SquareFace => "Square bar, flat face to the stream",
            Shape::SquareCorner => "Square bar, corner to the stream",
            Shape::HexFace => "Hexagon bar, flat face to the stream",
            Shape::HexCorner => "Hexagon bar, corner to the stream",
            Shape::Plate => "Thin strip across the stream",
        }
    }
    /// What D means for this shape (it is drawn on the page).
    pub fn length_meaning(&self) -> &'static str {
        match self {
            Shape::Cylinder => "D: outside diameter",
            Shape::Sphere => "D: diameter",
            Shape::SquareFace => "D: side (the width across the stream)",
            Shape::SquareCorner => "D: diagonal (the width across the stream)",
            Shape::HexFace => "D: across the corners (the width across the stream)",
            Shape::HexCorner => "D: across the flats (the width across the stream)",
            Shape::Plate => "D: height of the strip (across the stream)",
        }
    }
    /// Perimeter over D for a prism (heat per length = h·P·ΔT); `None` for the sphere. The strip
    /// counts both faces and ignores its edges.
    pub fn perimeter_over_d(&self) -> Option<f64> {
        match self {
            Shape::Cylinder => Some(PI),
            Shape::Sphere => None,
            Shape::SquareFace => Some(4.0),
            Shape::SquareCorner => Some(2.0 * std::f64::consts::SQRT_2),
            Shape::HexFace => Some(3.0),
            Shape::HexCorner => Some(2.0 * 3f64.sqrt()),
            Shape::Plate => Some(2.0),
        }
    }
    /// The forced-convection correlations, in preference order.
    pub fn forced(&self) -> &'static [Forced] {
        match self {
            Shape::Cylinder => &cylinder::FORCED,
            Shape::Sphere => &sphere::FORCED,
            Shape::SquareFace => &bars::SQUARE_FACE_FORCED,
            Shape::SquareCorner => &bars::SQUARE_CORNER_FORCED,
            Shape::HexFace => &bars::HEX_FACE_FORCED,
            Shape::HexCorner => &bars::HEX_CORNER_FORCED,
            Shape::Plate => &bars::PLATE_FORCED,
        }
    }
    /// The recommendation rule, in words.
    pub fn rule(&self) -> &'static str {
        match self {
            Shape::Cylinder => "Order: Churchill–Bernstein (one equation for gases and liquids, smooth through the bands), Hilpert, Zukauskas, Gnielinski. The first inside its ranges is used, else the least far outside; Re limits are hard, printed Pr limits hold within 3 %. Past a limit the value moves linearly to the next over a factor 2 in Re, so it never jumps.",
            Shape::Sphere => "Order: Whitaker (its μ/μs range, fitted on liquids, does not bind in a gas), Achenbach (air, to Re 2×10⁵), Gnielinski (VDI), Ranz & Marshall. The first inside its ranges is used, else the least far outside; printed Pr limits hold within 3 %. Past a limit the value moves linearly to the next over a factor 2 in Re, so it never jumps.",
            _ => "Sparrow, Abraham & Tong (2004; Incropera et al. 7th ed., Table 7.3; gases), flagged outside its Re range; it replaced Jakob's 1949 table, which read squares 20–26 % low.",
        }
    }
    pub fn is_sphere(&self) -> bool {
        *self == Shape::Sphere
    }
    /// Flow-regime note for the operating point.
    pub fn regime(&self, re: f64) -> &'static str {
        match self {
            Shape::Cylinder if re < 2e5 => "Subcritical (Re below about 2×10⁵): the laminar boundary layer separates near 80° from the front stagnation point; the wake drives the heat transfer at the rear.",
            Shape::Cylinder => "Critical or beyond (Re above about 2×10⁵): the boundary layer turns turbulent before it separates, further back; here the correlations disagree most.",
            Shape::Sphere if re < 3e5 => "Subcritical (Re below about 3×10⁵): the laminar boundary layer separates a little ahead of the equator; the wake governs the rear half.",
            Shape::Sphere => "Critical or beyond (Re above about 3×10⁵): the boundary layer turns turbulent and separates further back; the correlations disagree most here.",
            _ => "Sharp edges fix the separation at the front corners at any Reynolds number; the wake governs the side and rear faces.",
        }
    }
}
