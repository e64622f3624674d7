//! Natural convection from a body in still fluid: mean Nusselt number on the body's own length
//! (the diameter, or the height of a vertical body), properties at the film temperature.
//! Ra = g·β·|Ts − T∞|·L³/(ν·α).

use crate::engine::validity::{Flagged, Range};

/// The length a natural-convection correlation is based on.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Length {
    Diameter,
    Height,
}

/// One natural-convection correlation, described as data.
#[derive(Debug, Clone, Copy)]
pub struct Natural {
    pub id: &'static str,
    pub name: &'static str,
    pub formula: &'static str,
    pub length: Length,
    pub nu: fn(f64, f64) -> Flagged<f64>,
}

pub const CHURCHILL_CHU_CYLINDER: &str = "Churchill–Chu (1975), horizontal cylinder";
pub const CHURCHILL_CHU_CYLINDER_RA: Range = Range {
    quantity: "Ra_D",
    lo: 1e-5,
    hi: 1e12,
    unit: "",
    source: "Churchill & Chu (1975b), from memory",
};

/// S. W. Churchill and H. H. S. Chu, "Correlating Equations for Laminar and Turbulent Free
/// Convection from a Horizontal Cylinder", Int. J. Heat Mass Transfer 18 (1975) 1049–1053:
/// Nu_D = {0.60 + 0.387·Ra_D^⅙ / [1 + (0.559/Pr)^(9/16)]^(8/27)}², 10⁻⁵ ≤ Ra_D ≤ 10¹².
pub fn horizontal_cylinder(ra: f64, pr: f64) -> Flagged<f64> {
    let f = (1.0 + (0.559 / pr).powf(9.0 / 16.0)).powf(8.0 / 27.0);
    let root = 0.60 + 0.387 * ra.sqrt().cbrt() / f;
    let mut out = Flagged::new(root * root);
    out.check(CHURCHILL_CHU_CYLINDER, &CHURCHILL_CHU_CYLINDER_RA, ra);
    out
}

pub const CHURCHILL_SPHERE: &str = "Churchill (1983), sphere";
pub const CHURCHILL_SPHERE_RA: Range = Range {
    quantity: "Ra_D",
    lo: 0.0,
    hi: 1e13,
    unit: "",
    source: "Churchill (1983), as noted in the ht 1.2.0 docs",
};
pub const CHURCHILL_SPHERE_PR: Range = Range {
    quantity: "Pr",
    lo: 0.7,
    hi: f64::INFINITY,
    unit: "",
    source: "Churchill (1983), from memory",
};

/// S. W. Churchill, "Free convection around immersed bodies", Heat Exchanger Design Handbook,
/// §2.5.7, Hemisphere (1983): Nu_D = 2 + 0.589·Ra^¼ / [1 + (0.469/Pr)^(9/16)]^(4/9) ·
/// {1 + 7.44×10⁻⁸·Ra / [1 + (0.469/Pr)^(9/16)]^(16/9)}^(1/12). Tends to 2 in still fluid.
pub fn sphere(ra: f64, pr: f64) -> Flagged<f64> {
    let psi = 1.0 + (0.469 / pr).powf(9.0 / 16.0);
    let turb = (1.0 + 7.44e-8 * ra / psi.powf(16.0 / 9.0)).powf(1.0 / 12.0);
    let mut out = Flagged::new(2.0 + 0.589 * ra.powf(0.25) / psi.powf(4.0 / 9.0) * turb);
    out.check(CHURCHILL_SPHERE, &CHURCHILL_SPHERE_RA, ra);
    out.check(CHURCHILL_SPHERE, &CHURCHILL_SPHERE_PR, pr);
    out
}

pub const CHURCHILL_CHU_PLATE: &str = "Churchill–Chu (1975), vertical surface";
pub const CHURCHILL_CHU_PLATE_RA: Range = Range {
    quantity: "Ra_L",
    lo: 0.1,
    hi: 1e12,
    unit: "",
    source: "Churchill & Chu (1975a), from memory",
};

/// S. W. Churchill and H. H. S. Chu, "Correlating Equations for Laminar and Turbulent Free
/// Convection from a Vertical Plate", Int. J. Heat Mass Transfer 18 (1975) 1323–1329:
/// Nu_L = {0.825 + 0.387·Ra_L^⅙ / [1 + (0.492/Pr)^(9/16)]^(8/27)}², on the height L.
pub fn vertical_plate(ra: f64, pr: f64) -> Flagged<f64> {
    let f = (1.0 + (0.492 / pr).powf(9.0 / 16.0)).powf(8.0 / 27.0);
    let root = 0.825 + 0.387 * ra.sqrt().cbrt() / f;
    let mut out = Flagged::new(root * root);
    out.check(CHURCHILL_CHU_PLATE, &CHURCHILL_CHU_PLATE_RA, ra);
    out
}

/// The thin-cylinder criterion: a vertical cylinder behaves as a vertical plate when
/// D/L ≥ 35/Gr_L^¼ (Incropera & DeWitt, Eq. 9.33, after Sparrow & Gregg (1956); from memory).
/// Thinner cylinders transfer more than the plate value: the range is returned for the check.
pub fn thin_cylinder_range(gr_l: f64) -> Range {
    Range {
        quantity: "D/L",
        lo: 35.0 / gr_l.powf(0.25),
        hi: f64::INFINITY,
        unit: "",
        source: "thin-cylinder criterion D/L ≥ 35/Gr_L^¼ (Sparrow & Gregg 1956)",
    }
}

pub const HORIZONTAL_CYLINDER: Natural = Natural {
    id: "churchill-chu-cylinder",
    name: CHURCHILL_CHU_CYLINDER,
    formula: "Nu_D = {0.60 + 0.387·Ra_D^⅙ / [1 + (0.559/Pr)^(9/16)]^(8/27)}²",
    length: Length::Diameter,
    nu: horizontal_cylinder,
};
pub const SPHERE: Natural = Natural {
    id: "churchill-sphere",
    name: CHURCHILL_SPHERE,
    formula: "Nu_D = 2 + 0.589·Ra^¼/ψ^(4/9) · {1 + 7.44×10⁻⁸·Ra/ψ^(16/9)}^(1/12), ψ = 1 + (0.469/Pr)^(9/16)",
    length: Length::Diameter,
    nu: sphere,
};
pub const VERTICAL: Natural = Natural {
    id: "churchill-chu-vertical",
    name: CHURCHILL_CHU_PLATE,
    formula: "Nu_L = {0.825 + 0.387·Ra_L^⅙ / [1 + (0.492/Pr)^(9/16)]^(8/27)}², on the height L",
    length: Length::Height,
    nu: vertical_plate,
};

#[cfg(test)]
mod tests {
    use super::*;

    /// Values printed in the `ht` 1.2.0 (PyPI) docs for the same equations; the fixture test in
    /// `tests/it/correlation_reference.rs` checks a whole grid.
    #[test]
    fn ht_docs_values() {
        let nu = horizontal_cylinder(0.69 * 2.63e9, 0.69).value;
        assert!((nu / 139.134_939_700_735_97 - 1.0).abs() < 1e-12, "{nu}");
        let nu = vertical_plate(0.69 * 2.63e9, 0.69).value;
        assert!((nu / 147.161_852_237_706_03 - 1.0).abs() < 1e-12, "{nu}");
        let nu = sphere(0.7 * 1e7, 0.7).value;
        assert!((nu / 25.670_869_440_317_578 - 1.0).abs() < 1e-12, "{nu}");
    }

    #[test]
    fn still_fluid_limits() {
        assert!((sphere(0.0, 0.7).value - 2.0).abs() < 1e-15);
        assert!((horizontal_cylinder(0.0, 0.7).value - 0.36).abs() < 1e-12);
        assert!(!horizontal_cylinder(0.0, 0.7).flags.is_empty());
    }

    #[test]
    fn thin_cylinder_criterion() {
        // Gr_L = 10⁸: 35/100 = 0.35.
        let r = thin_cylinder_range(1e8);
        assert!((r.lo - 0.35).abs() < 1e-12);
        assert!(r.check("x", 0.1, false).is_some() && r.check("x", 0.5, false).is_none());
    }
}
