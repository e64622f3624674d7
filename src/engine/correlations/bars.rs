//! Non-circular bars in cross-flow of a gas: Nu = C·Re^m·Pr^⅓ by Reynolds band.
//!
//! Constants from M. Jakob, Heat Transfer, vol. 1, Wiley (1949), as reproduced in Incropera &
//! DeWitt, Fundamentals of Heat and Mass Transfer (6th ed.), Table 7.3, and in Kutz (ed.),
//! Mechanical Engineers' Handbook, vol. 4, Table 13 (the constants, read there; which orientation
//! each pair belongs to and which length it is based on are from memory of the book's drawings).
//! The characteristic length D is the bar's width across the flow, as drawn on the page; the
//! properties are taken at the film temperature. The table is for gases.

use super::{band_text, zero, Forced, Groups, Reference};
use crate::engine::validity::{Bands, Flagged, Range};

const JAKOB: &str = "Jakob (1949)";

/// The table was measured in gases: Pr outside the gases' range is an extrapolation (common
/// practice for the limits).
pub const GAS_PR: Range = Range {
    quantity: "Pr",
    lo: 0.6,
    hi: 1.2,
    unit: "",
    source: "Jakob (1949): gases only",
};

/// One row group of the table: bands and (C, m) per band.
#[derive(Debug, Clone, Copy)]
pub struct Table {
    pub name: &'static str,
    pub bands: Bands,
    pub constants: &'static [(f64, f64)],
}

pub const SQUARE_FACE: Table = Table {
    name: "Jakob (1949), square face-on",
    bands: Bands {
        quantity: "Re",
        edges: &[5e3, 1e5],
        source: JAKOB,
    },
    constants: &[(0.102, 0.675)],
};
pub const SQUARE_CORNER: Table = Table {
    name: "Jakob (1949), square corner-on",
    bands: Bands {
        quantity: "Re",
        edges: &[5e3, 1e5],
        source: JAKOB,
    },
    constants: &[(0.246, 0.588)],
};
pub const HEX_FACE: Table = Table {
    name: "Jakob (1949), hexagon face-on",
    bands: Bands {
        quantity: "Re",
        edges: &[5e3, 1.95e4, 1e5],
        source: JAKOB,
    },
    constants: &[(0.160, 0.638), (0.0385, 0.782)],
};
pub const HEX_CORNER: Table = Table {
    name: "Jakob (1949), hexagon corner-on",
    bands: Bands {
        quantity: "Re",
        edges: &[5e3, 1e5],
        source: JAKOB,
    },
    constants: &[(0.153, 0.638)],
};
pub const PLATE: Table = Table {
    name: "Jakob (1949), thin plate normal to the flow",
    bands: Bands {
        quantity: "Re",
        edges: &[4e3, 1.5e4],
        source: JAKOB,
    },
    constants: &[(0.228, 0.731)],
};

impl Table {
    /// Nu = C·Re^m·Pr^⅓ with the band's constants; flagged outside the table, near an inner band
    /// edge, and for Pr outside the gases' range.
    pub fn nu(&self, re: f64, pr: f64) -> Flagged<f64> {
        let (i, band_flag) = self.bands.locate(self.name, re);
        let (c, m) = self.constants[i];
        let mut out = Flagged::new(c * re.powf(m) * pr.cbrt());
        out.flags.extend(band_flag);
        out.check(self.name, &GAS_PR, pr);
        out
    }
}

impl Table {
    /// The band and constants used at this Reynolds number, for the working.
    pub fn detail(&self, re: f64) -> String {
        let (i, _) = self.bands.locate(self.name, re);
        let (c, m) = self.constants[i];
        band_text(&self.bands, i, c, m)
    }
}

macro_rules! forced {
    ($fname:ident, $dname:ident, $table:ident) => {
        fn $fname(g: &Groups) -> Flagged<f64> {
            $table.nu(g.re, g.pr)
        }
        fn $dname(g: &Groups) -> Option<String> {
            Some($table.detail(g.re))
        }
    };
}
forced!(square_face, square_face_detail, SQUARE_FACE);
forced!(square_corner, square_corner_detail, SQUARE_CORNER);
forced!(hex_face, hex_face_detail, HEX_FACE);
forced!(hex_corner, hex_corner_detail, HEX_CORNER);
forced!(plate, plate_detail, PLATE);

const FORMULA: &str = "Nu = C·Re^m·Pr^⅓, C and m by Reynolds band (Jakob's table, gases)";

const fn entry(
    id: &'static str,
    t: &Table,
    nu: fn(&Groups) -> Flagged<f64>,
    detail: fn(&Groups) -> Option<String>,
) -> Forced {
    Forced {
        id,
        name: t.name,
        reference: Reference::Film,
        formula: FORMULA,
        nu,
        nu_still: zero,
        detail,
        surface: false,
    }
}

pub const SQUARE_FACE_FORCED: [Forced; 1] = [entry(
    "jakob-square-face",
    &SQUARE_FACE,
    square_face,
    square_face_detail,
)];
pub const SQUARE_CORNER_FORCED: [Forced; 1] = [entry(
    "jakob-square-corner",
    &SQUARE_CORNER,
    square_corner,
    square_corner_detail,
)];
pub const HEX_FACE_FORCED: [Forced; 1] = [entry(
    "jakob-hex-face",
    &HEX_FACE,
    hex_face,
    hex_face_detail,
)];
pub const HEX_CORNER_FORCED: [Forced; 1] = [entry(
    "jakob-hex-corner",
    &HEX_CORNER,
    hex_corner,
    hex_corner_detail,
)];
pub const PLATE_FORCED: [Forced; 1] = [entry("jakob-plate", &PLATE, plate, plate_detail)];

#[cfg(test)]
mod tests {
    use super::*;
    use crate::engine::validity::FlagKind;

    /// Hand arithmetic on the printed constants: 0.102 × 10⁴^0.675 × 0.7^⅓ = 0.102 × 501.19 ×
    /// 0.887904 = 45.39.
    #[test]
    fn square_face_value() {
        let nu = SQUARE_FACE.nu(1e4, 0.7);
        assert!((nu.value - 45.39).abs() < 0.01, "{}", nu.value);
        assert!(nu.flags.is_empty());
    }

    #[test]
    fn hexagon_band_edge_is_flagged_on_both_sides() {
        // The two bands were fitted to meet: 0.160·Re^0.638 = 0.0385·Re^0.782 near 1.95×10⁴.
        let below = HEX_FACE.nu(1.95e4 * 0.999, 0.7);
        let above = HEX_FACE.nu(1.95e4 * 1.001, 0.7);
        assert!((above.value / below.value - 1.0).abs() < 0.01);
        assert_eq!(below.flags[0].kind, FlagKind::NearEdge);
        assert_eq!(above.flags[0].kind, FlagKind::NearEdge);
    }

    #[test]
    fn outside_the_table_and_in_liquids_is_flagged() {
        let nu = PLATE.nu(1e5, 7.0);
        assert_eq!(nu.flags.len(), 2);
        assert!(nu.value.is_finite() && nu.value > 0.0);
    }
}
