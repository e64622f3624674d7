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

/// The drawing of one shape with the flow arrows and the D dimension.
pub fn drawing(shape: Shape, large: bool) -> impl IntoView {
    let (cx, cy) = (66.0, 40.0);
    // Half the width across the stream, so the D line spans it.
    let (outline, half): (AnyView, f64) = match shape {
        Shape::Cylinder => (
            view! { <circle cx=cx cy=cy r="26" class="body"/> }.into_any(),
            26.0,
        ),
        Shape::Sphere => (
            view! {
                <circle cx=cx cy=cy r="26" class="body"/>
                <ellipse cx=cx cy=cy rx="26" ry="8" class="contour"/>
            }
            .into_any(),
            26.0,
        ),
        Shape::SquareFace => (
            view! { <rect x={cx - 24.0} y={cy - 24.0} width="48" height="48" class="body"/> }
                .into_any(),
            24.0,
        ),
        Shape::SquareCorner => (
            view! { <polygon points={polygon(cx, cy, 30.0, 4, 0.0)} class="body"/> }.into_any(),
            30.0,
        ),
        // Flat faces upstream and downstream: corners at the top and bottom.
        Shape::HexFace => (
            view! { <polygon points={polygon(cx, cy, 28.0, 6, 90.0)} class="body"/> }.into_any(),
            28.0,
        ),
        // A corner upstream: flats at the top and bottom.
        Shape::HexCorner => (
            view! { <polygon points={polygon(cx, cy, 30.0, 6, 0.0)} class="body"/> }.into_any(),
            30.0 * 3f64.sqrt() / 2.0,
        ),
        Shape::Plate => (
            view! { <rect x={cx - 3.0} y={cy - 28.0} width="6" height="56" class="body"/> }
                .into_any(),
            28.0,
        ),
    };
    let dx = 108.0;
    let (top, bottom) = (cy - half, cy + half);
    let size = if large { "big" } else { "icon" };
    view! {
        <svg viewBox="0 0 120 80" class=format!("shape-drawing {size}") role="img"
            aria-label=format!("{}; the stream comes from the left; {}", shape.label(), shape.length_meaning())>
            <g class="flow">
                <line x1="4" y1="22" x2="26" y2="22"/><path d="M26,18 L32,22 L26,26 Z"/>
                <line x1="4" y1="40" x2="26" y2="40"/><path d="M26,36 L32,40 L26,44 Z"/>
                <line x1="4" y1="58" x2="26" y2="58"/><path d="M26,54 L32,58 L26,62 Z"/>
            </g>
            {outline}
            <g class="dim">
                <line x1={dx} y1={top} x2={dx} y2={bottom}/>
                <line x1={dx - 4.0} y1={top} x2={dx + 4.0} y2={top}/>
                <line x1={dx - 4.0} y1={bottom} x2={dx + 4.0} y2={bottom}/>
                <line x1={cx} y1={top} x2={dx} y2={top} class="ext"/>
                <line x1={cx} y1={bottom} x2={dx} y2={bottom} class="ext"/>
                <text x={dx + 3.0} y={cy + 4.0}>"D"</text>
            </g>
        </svg>
    }
}
