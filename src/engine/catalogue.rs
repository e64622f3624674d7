//! Lists a person picks from instead of typing: typical surface emissivities and solar
//! absorptances, nominal pipe sizes (re-exported by `job`), and the insulation thicknesses
//! commonly stocked.

use crate::engine::units::{self, Unit};

/// Typical total emissivities of outer surfaces near room temperature (common practice: rounded
/// values of the kind insulation guides list; a measured value is always better).
pub const EMISSIVITIES: [(&str, f64); 9] = [
    ("Painted or oxidised steel", 0.9),
    ("Black paint", 0.95),
    ("PVC or plastic jacket", 0.9),
    ("Cloth or canvas jacket", 0.9),
    ("Weathered galvanised steel", 0.3),
    ("New galvanised steel", 0.1),
    ("Stainless steel jacket", 0.2),
    ("Oxidised aluminium jacket", 0.15),
    ("Bright aluminium jacket", 0.05),
];

/// Typical solar absorptances of outer surfaces, for a body outdoors in the sun (common practice,
/// from memory: rounded values of the kind building and solar guides list; paint ages, dust and
/// weathering raise them, and a measured or data-sheet value is always better).
pub const SOLAR_ABSORPTANCES: [(&str, f64); 9] = [
    ("Black paint or jacket", 0.95),
    ("Dark paint, rusted or oxidised steel", 0.9),
    ("Weathered galvanised steel", 0.9),
    ("Mid-grey paint", 0.75),
    ("New galvanised steel", 0.65),
    ("Aluminium paint", 0.5),
    ("Stainless steel jacket", 0.45),
    ("White paint", 0.25),
    ("Bright aluminium jacket", 0.15),
];

/// Nominal pipe sizes and their outside diameters, m: ASME B36.10M (from memory; the ODs are the
/// same in EN 10220's series 1 to the rounding shown).
pub const NOMINAL_SIZES: [(&str, f64); 19] = [
    ("NPS ½ (DN 15)", 0.0213),
    ("NPS ¾ (DN 20)", 0.0267),
    ("NPS 1 (DN 25)", 0.0334),
    ("NPS 1¼ (DN 32)", 0.0422),
    ("NPS 1½ (DN 40)", 0.0483),
    ("NPS 2 (DN 50)", 0.0603),
    ("NPS 2½ (DN 65)", 0.0730),
    ("NPS 3 (DN 80)", 0.0889),
    ("NPS 4 (DN 100)", 0.1143),
    ("NPS 5 (DN 125)", 0.1413),
    ("NPS 6 (DN 150)", 0.1683),
    ("NPS 8 (DN 200)", 0.2191),
    ("NPS 10 (DN 250)", 0.2730),
    ("NPS 12 (DN 300)", 0.3238),
    ("NPS 14 (DN 350)", 0.3556),
    ("NPS 16 (DN 400)", 0.4064),
    ("NPS 18 (DN 450)", 0.4570),
    ("NPS 20 (DN 500)", 0.5080),
    ("NPS 24 (DN 600)", 0.6100),
];

/// Insulation thicknesses commonly stocked, m: metric pipe sections and slabs in mm, and US
/// pipe insulation in half-inch steps (common practice; a supplier's list may differ).
pub const METRIC_THICKNESSES_MM: [f64; 20] = [
    10.0, 13.0, 19.0, 20.0, 25.0, 30.0, 32.0, 40.0, 50.0, 60.0, 70.0, 80.0, 90.0, 100.0, 120.0,
    140.0, 150.0, 160.0, 180.0, 200.0,
];
pub const INCH_THICKNESSES_IN: [f64; 14] = [
    0.5, 1.0, 1.5, 2.0, 2.5, 3.0, 3.5, 4.0, 4.5, 5.0, 5.5, 6.0, 7.0, 8.0,
];

/// The thickness a person would order to meet a limit that needs `needed` m: rounded up to
/// 1 mm, or to ⅛ in in the inch series, and the next commonly stocked thickness at or above it
/// (`None` past the list's end).
pub fn thickness_to_order(needed: f64, inch: bool) -> (f64, Option<f64>) {
    let (step, list): (f64, &[f64]) = if inch {
        (0.0254 / 8.0, &INCH_THICKNESSES_IN)
    } else {
        (1e-3, &METRIC_THICKNESSES_MM)
    };
    let unit = if inch { 0.0254 } else { 1e-3 };
    // A hair of tolerance: 40.0000001 mm needs 40 mm, not 41.
    let up = (needed / step - 1e-6).ceil().max(1.0) * step;
    let next = list
        .iter()
        .map(|t| t * unit)
        .find(|t| *t >= up - 1e-9 * unit);
    (up, next)
}

/// Inches in eighths as a person writes them: 1⅛, 2½, ¾.
fn eighths(inches: f64) -> String {
    let n = (inches * 8.0).round() as i64;
    let (whole, part) = (n / 8, (n % 8) as usize);
    let frac = ["", "⅛", "¼", "⅜", "½", "⅝", "¾", "⅞"][part];
    match (whole, part) {
        (0, 0) => "0".to_string(),
        (0, _) => frac.to_string(),
        _ => format!("{whole}{frac}"),
    }
}

/// What a card says of the thickness that meets its limit, in the length unit the person reads
/// (inch series where lengths are in inches or feet): "needs ≥ 38 mm; next stocked size 40 mm",
/// or, when the present layer already meets it (`met`), "meets it from 2 mm; the thinnest
/// stocked size that does is 13 mm" (a present layer is never said to need what it has).
pub fn order_text(needed: f64, length: &'static Unit, met: bool) -> String {
    let inch = matches!(length.id, "in" | "ft");
    let (up, next) = thickness_to_order(needed, inch);
    let write = |t: f64| {
        if inch {
            format!("{} in", eighths(t / 0.0254))
        } else if length.id == "m" {
            units::show(t, length)
        } else {
            format!(
                "{} mm",
                units::format_value(t * 1e3, units::unit("mm").expect("mm"))
            )
        }
    };
    match (next, met) {
        (Some(n), false) => format!("needs ≥ {}; next stocked size {}", write(up), write(n)),
        (None, false) => format!(
            "needs ≥ {}, thicker than the stocked sizes listed",
            write(up)
        ),
        (Some(n), true) => format!(
            "meets it from {}; the thinnest stocked size that does is {}",
            write(up),
            write(n)
        ),
        (None, true) => format!("meets it from {}", write(up)),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_needed_thickness_rounds_up_to_what_is_stocked() {
        // 37.2 mm needed: order at least 38 mm; the next stocked size is 40 mm.
        let (up, next) = thickness_to_order(0.0372, false);
        assert!((up - 0.038).abs() < 1e-12 && (next.unwrap() - 0.040).abs() < 1e-12);
        // Exactly a stocked size stays that size.
        let (up, next) = thickness_to_order(0.050, false);
        assert!((up - 0.050).abs() < 1e-12 && (next.unwrap() - 0.050).abs() < 1e-12);
        // 1.1 in needed: 1⅛ in, next stocked 1½ in.
        let (up, next) = thickness_to_order(1.1 * 0.0254, true);
        assert!((up - 1.125 * 0.0254).abs() < 1e-12);
        assert!((next.unwrap() - 1.5 * 0.0254).abs() < 1e-12);
        // Past the list: no stocked size.
        assert_eq!(thickness_to_order(0.3, false).1, None);
        // The lists rise.
        assert!(METRIC_THICKNESSES_MM.windows(2).all(|w| w[0] < w[1]));
        assert!(INCH_THICKNESSES_IN.windows(2).all(|w| w[0] < w[1]));
    }

    #[test]
    fn the_card_writes_the_thickness_as_ordered() {
        let u = |id| units::unit(id).unwrap();
        assert_eq!(
            order_text(0.0372, u("mm"), false),
            "needs ≥ 38 mm; next stocked size 40 mm"
        );
        assert_eq!(
            order_text(1.1 * 0.0254, u("in"), false),
            "needs ≥ 1⅛ in; next stocked size 1½ in"
        );
        assert_eq!(
            order_text(0.3 * 0.0254, u("in"), false),
            "needs ≥ ⅜ in; next stocked size ½ in"
        );
        assert_eq!(
            order_text(0.25, u("mm"), false),
            "needs ≥ 250 mm, thicker than the stocked sizes listed"
        );
        // A present layer that already meets the limit is not said to need it.
        assert_eq!(
            order_text(0.0017, u("mm"), true),
            "meets it from 2 mm; the thinnest stocked size that does is 10 mm"
        );
    }
}
