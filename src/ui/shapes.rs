//! Small drawings of each shape: the stream arrives from the left, D is marked across it.
//! Pure presentation: positions in a 120 × 80 box.

use leptos::prelude::*;

use crate::engine::scenario::Shape;

/// Corner points of a polygon around (cx, cy) with circumradius r, first vertex at `start_deg`.
fn polygon(cx: f64, cy: f64, r: f64, n: usize, start_deg: f64) -> String {
    (0..n)
        .map(|i| {
            let a = (start_deg + 360.0 * i as f64 / n as f64).to_radians();
            format!("{:.1},{:.1}", cx + r * a.cos(), cy - r * a.sin())
        })
        .collect::<Vec<_>>()
        .join(" ")
}

/// The drawing of one shape with the flow arrows and the D dimension, as SVG markup (set in one
/// step; no text of the person's goes in).
pub fn markup(shape: Shape, large: bool) -> String {
    let (cx, cy) = (66.0, 40.0);
    // Half the width across the stream, so the D line spans it.
    let (outline, half) = match shape {
        Shape::Cylinder => (
            format!(r#"<circle cx="{cx}" cy="{cy}" r="26" class="body"/>"#),
            26.0,
        ),
        Shape::Sphere => (
            format!(
                r#"<circle cx="{cx}" cy="{cy}" r="26" class="body"/><ellipse cx="{cx}" cy="{cy}" rx="26" ry="8" class="contour"/>"#
            ),
            26.0,
        ),
        Shape::SquareFace => (
            format!(
                r#"<rect x="{}" y="{}" width="48" height="48" class="body"/>"#,
                cx - 24.0,
                cy - 24.0
            ),
            24.0,
        ),
        Shape::SquareCorner => (
            format!(
                r#"<polygon points="{}" class="body"/>"#,
                polygon(cx, cy, 30.0, 4, 0.0)
            ),
            30.0,
        ),
        // Flat faces upstream and downstream: corners at the top and bottom.
        Shape::HexFace => (
            format!(
                r#"<polygon points="{}" class="body"/>"#,
                polygon(cx, cy, 28.0, 6, 90.0)
            ),
            28.0,
        ),
        // A corner upstream: flats at the top and bottom.
        Shape::HexCorner => (
            format!(
                r#"<polygon points="{}" class="body"/>"#,
                polygon(cx, cy, 30.0, 6, 0.0)
            ),
            30.0 * 3f64.sqrt() / 2.0,
        ),
        Shape::Plate => (
            format!(
                r#"<rect x="{}" y="{}" width="6" height="56" class="body"/>"#,
                cx - 3.0,
                cy - 28.0
            ),
            28.0,
        ),
    };
    let dx = 108.0;
    let (top, bottom) = (cy - half, cy + half);
    format!(
        r#"<svg viewBox="0 0 120 80" class="shape-drawing {size}" role="img" aria-label="{label}"><g class="flow"><line x1="4" y1="22" x2="26" y2="22"/><path d="M26,18 L32,22 L26,26 Z"/><line x1="4" y1="40" x2="26" y2="40"/><path d="M26,36 L32,40 L26,44 Z"/><line x1="4" y1="58" x2="26" y2="58"/><path d="M26,54 L32,58 L26,62 Z"/></g>{outline}<g class="dim"><line x1="{dx}" y1="{top:.1}" x2="{dx}" y2="{bottom:.1}"/><line x1="{a}" y1="{top:.1}" x2="{b}" y2="{top:.1}"/><line x1="{a}" y1="{bottom:.1}" x2="{b}" y2="{bottom:.1}"/><line x1="{cx}" y1="{top:.1}" x2="{dx}" y2="{top:.1}" class="ext"/><line x1="{cx}" y1="{bottom:.1}" x2="{dx}" y2="{bottom:.1}" class="ext"/><text x="{t}" y="{ty}">D</text></g></svg>"#,
        size = if large { "big" } else { "icon" },
        label = crate::engine::chart::svg::esc(&format!(
            "{}; the stream comes from the left; {}",
            shape.label(),
            shape.length_meaning()
        )),
        a = dx - 4.0,
        b = dx + 4.0,
        t = dx + 3.0,
        ty = cy + 4.0,
    )
}

/// The drawing as a view: a span holding [`markup`].
pub fn drawing(shape: Shape, large: bool) -> impl IntoView {
    view! { <span class="shape-box" inner_html=markup(shape, large)></span> }
}
