//! The cross-sections a body can have (or a sphere): names, ids, the drawn length D, the
//! perimeter, the forced correlations in their order of preference, and the rule in words.

use crate::engine::correlations::{bars, cylinder, sphere, Forced};
use std::f64::consts::PI;

/// The cross-section of the body (or a sphere).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
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
            Shape::Cylinder => "Churchill–Bernstein comes first: one equation for gases and liquids over all Re·Pr ≥ 0.2, smooth through the Reynolds bands where tabulated constants jump; then Hilpert, Zukauskas and Gnielinski. The first inside its published ranges is used. A Reynolds range is a hard limit; a printed Prandtl limit holds within 3 %. Where none is inside, the least far outside (in decades of Re) is used; where one passes its limit, the value moves linearly to the next over 0.3 decade beyond it (a factor 2 in Re), so it never jumps.",
            Shape::Sphere => "Whitaker comes first (it carries the viscosity correction for liquids; in a gas that ratio's range, fitted on liquids, is shown but does not set it aside), then Achenbach's subcritical air form (to Re 2×10⁵), Gnielinski's VDI form (the widest range) and Ranz & Marshall (drops and small spheres). The first inside its published ranges is used; a printed Prandtl limit holds within 3 %. Where none is inside, the least far outside is used; where one passes its limit, the value moves linearly to the next over 0.3 decade of Re beyond it (a factor 2), so it never jumps.",
            _ => "The current table (Sparrow, Abraham & Tong 2004, as in Incropera et al., 7th ed., Table 7.3; gases) is used throughout, flagged outside its Reynolds range. Jakob's older 1949 constants are shown below it for comparison only, never recommended.",
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
