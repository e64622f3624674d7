//! Circular cylinder in cross-flow: mean Nusselt number over the circumference, on the diameter D.

use super::{band_text, no_detail, zero, Forced, Groups, Reference};
use crate::engine::validity::{Bands, Flagged, Range};

/// Churchill & Bernstein's lower bound on Re·Pr.
pub const CHURCHILL_BERNSTEIN_REPR: Range = Range {
    quantity: "Re·Pr",
    lo: 0.2,
    hi: f64::INFINITY,
    unit: "",
    source: "Churchill & Bernstein (1977)",
};

pub const CHURCHILL_BERNSTEIN: &str = "Churchill–Bernstein (1977)";

/// S. W. Churchill and M. Bernstein, "A Correlating Equation for Forced Convection From Gases and
/// Liquids to a Circular Cylinder in Crossflow", J. Heat Transfer 99 (1977) 300–306, Eq. (3):
///
/// Nu = 0.3 + 0.62·Re^½·Pr^⅓ / [1 + (0.4/Pr)^⅔]^¼ · [1 + (Re/282 000)^⅝]^⅘
///
/// Re = U·D/ν and Pr at the film temperature. Published for all Re·Pr ≥ 0.2 (flagged below).
/// Tends to 0.3 as Re → 0. Inputs: Re ≥ 0, Pr > 0 (dimensionless).
pub fn churchill_bernstein(re: f64, pr: f64) -> Flagged<f64> {
    // Integer-root forms of the exponents (x^⅔ = ∛x², x^¼ = √√x): same values, fewer powf calls.
    let c = (0.4 / pr).cbrt();
    let lam = 0.62 * re.sqrt() * pr.cbrt() / (1.0 + c * c).sqrt().sqrt();
    let nu = 0.3 + lam * (1.0 + (re / 282_000.0).powf(5.0 / 8.0)).powf(0.8);
    let mut out = Flagged::new(nu);
    out.check(CHURCHILL_BERNSTEIN, &CHURCHILL_BERNSTEIN_REPR, re * pr);
    out
}

pub const HILPERT: &str = "Hilpert (1933)";
/// Reynolds bands of Hilpert's constants as tabulated by J. D. Knudsen and D. L. Katz, Fluid
/// Dynamics and Heat Transfer, McGraw-Hill (1958); reproduced in Incropera & DeWitt, Fundamentals
/// of Heat and Mass Transfer, Table 7.2 (from memory).
pub const HILPERT_BANDS: Bands = Bands {
    quantity: "Re",
    edges: &[0.4, 4.0, 40.0, 4000.0, 40_000.0, 400_000.0],
    source: "Hilpert (1933), bands of Knudsen & Katz (1958)",
};
/// (C, m) for each band of [`HILPERT_BANDS`].
pub const HILPERT_CONSTANTS: [(f64, f64); 5] = [
    (0.989, 0.330),
    (0.911, 0.385),
    (0.683, 0.466),
    (0.193, 0.618),
    (0.027, 0.805),
];
/// Hilpert's correlation is stated for Pr ≥ 0.7 (gases and liquids through Pr^⅓).
pub const HILPERT_PR: Range = Range {
    quantity: "Pr",
    lo: 0.7,
    hi: f64::INFINITY,
    unit: "",
    source: "Hilpert (1933) as extended by Knudsen & Katz (1958)",
};

/// R. Hilpert, "Wärmeabgabe von geheizten Drähten und Rohren im Luftstrom", Forsch. Ing.-Wes. 4
/// (1933) 215–224, in the form Nu = C·Re^m·Pr^⅓ with the constants by Reynolds band of
/// [`HILPERT_CONSTANTS`]. Properties at the film temperature. Re within 0.4–4×10⁵ and Pr ≥ 0.7;
/// near an inner band edge the result is flagged (the constants jump there).
pub fn hilpert(re: f64, pr: f64) -> Flagged<f64> {
    let (i, band_flag) = HILPERT_BANDS.locate(HILPERT, re);
    let (c, m) = HILPERT_CONSTANTS[i];
    let mut out = Flagged::new(c * re.powf(m) * pr.cbrt());
    out.flags.extend(band_flag);
    out.check_pr(HILPERT, &HILPERT_PR, pr);
    out
}

pub const ZUKAUSKAS: &str = "Zukauskas (1972)";
/// A. Zukauskas, "Heat Transfer from Tubes in Crossflow", Adv. Heat Transfer 8 (1972) 93–160;
/// bands and constants as in Incropera & DeWitt, Table 7.4 (from memory; the same table is in the
/// docs of the `ht` 1.2.0 library, which the fixture check uses).
pub const ZUKAUSKAS_BANDS: Bands = Bands {
    quantity: "Re",
    edges: &[1.0, 40.0, 1000.0, 200_000.0, 1_000_000.0],
    source: "Zukauskas (1972)",
};
pub const ZUKAUSKAS_CONSTANTS: [(f64, f64); 4] =
    [(0.75, 0.4), (0.51, 0.5), (0.26, 0.6), (0.076, 0.7)];
pub const ZUKAUSKAS_PR: Range = Range {
    quantity: "Pr",
    lo: 0.7,
    hi: 500.0,
    unit: "",
    source: "Zukauskas (1972)",
};

/// Zukauskas (1972): Nu = C·Re^m·Pr^n·(Pr/Pr_s)^¼, n = 0.37 for Pr ≤ 10 and 0.36 above; Re and
/// Pr at the free-stream temperature, Pr_s at the surface. 1 ≤ Re ≤ 10⁶, 0.7 ≤ Pr ≤ 500.
pub fn zukauskas(re: f64, pr: f64, pr_s: f64) -> Flagged<f64> {
    let (i, band_flag) = ZUKAUSKAS_BANDS.locate(ZUKAUSKAS, re);
    let (c, m) = ZUKAUSKAS_CONSTANTS[i];
    let n = if pr <= 10.0 { 0.37 } else { 0.36 };
    let mut out = Flagged::new(c * re.powf(m) * pr.powf(n) * (pr / pr_s).sqrt().sqrt());
    out.flags.extend(band_flag);
    out.check_pr(ZUKAUSKAS, &ZUKAUSKAS_PR, pr);
    out
}

pub const GNIELINSKI: &str = "Gnielinski (VDI Heat Atlas)";
/// Range of the single-cylinder form, on the overflow length l = πD/2: 10 ≤ Re_l ≤ 10⁷ and
/// 0.6 ≤ Pr ≤ 1000 (VDI Heat Atlas, chapter G6 (2010), from memory).
pub const GNIELINSKI_RE: Range = Range {
    quantity: "Re_l (l = πD/2)",
    lo: 10.0,
    hi: 1e7,
    unit: "",
    source: "VDI Heat Atlas G6, from memory",
};
pub const GNIELINSKI_PR: Range = Range {
    quantity: "Pr",
    lo: 0.6,
    hi: 1000.0,
    unit: "",
    source: "VDI Heat Atlas G6, from memory",
};

/// Laminar and turbulent flat-plate parts on a length l (Gnielinski's form in the VDI Heat Atlas):
/// Nu_lam = 0.664·Re^½·Pr^⅓, Nu_turb = 0.037·Re^0.8·Pr / (1 + 2.443·Re^−0.1·(Pr^⅔ − 1)).
pub fn flat_plate_parts(re_l: f64, pr: f64) -> (f64, f64) {
    let lam = 0.664 * re_l.sqrt() * pr.cbrt();
    let turb = if re_l > 0.0 {
        let r01 = re_l.powf(0.1);
        let p13 = pr.cbrt();
        0.037 * r01.powi(8) * pr / (1.0 + 2.443 / r01 * (p13 * p13 - 1.0))
    } else {
        0.0
    };
    (lam, turb)
}

/// V. Gnielinski, single cylinder in cross-flow, VDI Heat Atlas (chapter G6 in the 2010 English
/// edition): on the overflow length l = πD/2, Re_l = U·l/ν,
/// Nu_l = 0.3 + √(Nu_lam² + Nu_turb²) with [`flat_plate_parts`], returned on D as Nu_l·D/l.
/// Properties at the free-stream temperature, with the property-variation factor of the Atlas:
/// (Pr/Pr_s)^0.25 for liquids, (T∞/Ts)^0.12 for gases (from memory).
pub fn gnielinski(g: &Groups) -> Flagged<f64> {
    let l_over_d = std::f64::consts::FRAC_PI_2;
    let re_l = g.re * l_over_d;
    let (lam, turb) = flat_plate_parts(re_l, g.pr);
    let k = if g.gas {
        g.t_ratio.powf(0.12)
    } else {
        (g.pr / g.pr_s).sqrt().sqrt()
    };
    let nu_l = (0.3 + lam.hypot(turb)) * k;
    let mut out = Flagged::new(nu_l / l_over_d);
    out.check(GNIELINSKI, &GNIELINSKI_RE, re_l);
    out.check_pr(GNIELINSKI, &GNIELINSKI_PR, g.pr);
    out
}

fn cb(g: &Groups) -> Flagged<f64> {
    churchill_bernstein(g.re, g.pr)
}
fn cb_still(_: &Groups) -> f64 {
    0.3
}
fn hp(g: &Groups) -> Flagged<f64> {
    hilpert(g.re, g.pr)
}
fn zk(g: &Groups) -> Flagged<f64> {
    zukauskas(g.re, g.pr, g.pr_s)
}
fn gn_still(g: &Groups) -> f64 {
    let k = if g.gas {
        g.t_ratio.powf(0.12)
    } else {
        (g.pr / g.pr_s).powf(0.25)
    };
    0.3 * k / std::f64::consts::FRAC_PI_2
}

fn hp_detail(g: &Groups) -> Option<String> {
    let (i, _) = HILPERT_BANDS.locate(HILPERT, g.re);
    let (c, m) = HILPERT_CONSTANTS[i];
    Some(band_text(&HILPERT_BANDS, i, c, m))
}
fn zk_detail(g: &Groups) -> Option<String> {
    let (i, _) = ZUKAUSKAS_BANDS.locate(ZUKAUSKAS, g.re);
    let (c, m) = ZUKAUSKAS_CONSTANTS[i];
    let n = if g.pr <= 10.0 { 0.37 } else { 0.36 };
    Some(format!(
        "{}, n = {n}; Pr/Pr_s = {}",
        band_text(&ZUKAUSKAS_BANDS, i, c, m),
        crate::engine::units::format_sig(g.pr / g.pr_s, 4)
    ))
}
fn gn_detail(g: &Groups) -> Option<String> {
    let re_l = g.re * std::f64::consts::FRAC_PI_2;
    let (lam, turb) = flat_plate_parts(re_l, g.pr);
    let f = |v: f64| crate::engine::units::format_sig(v, 4);
    Some(format!(
        "Re_l = {}, Nu_lam = {}, Nu_turb = {}",
        f(re_l),
        f(lam),
        f(turb)
    ))
}

/// The forced-convection correlations for a circular cylinder, recommended one first.
pub const FORCED: [Forced; 4] = [
    Forced {
        id: "churchill-bernstein",
        name: CHURCHILL_BERNSTEIN,
        reference: Reference::Film,
        formula: "Nu = 0.3 + 0.62·Re^½·Pr^⅓ / [1 + (0.4/Pr)^⅔]^¼ · [1 + (Re/282000)^⅝]^⅘",
        nu: cb,
        nu_still: cb_still,
        detail: no_detail,
        surface: false,
    },
    Forced {
        id: "hilpert",
        name: HILPERT,
        reference: Reference::Film,
        formula: "Nu = C·Re^m·Pr^⅓, C and m by Reynolds band (Knudsen & Katz)",
        nu: hp,
        nu_still: zero,
        detail: hp_detail,
        surface: false,
    },
    Forced {
        id: "zukauskas",
        name: ZUKAUSKAS,
        reference: Reference::FreeStream,
        formula: "Nu = C·Re^m·Pr^n·(Pr/Pr_s)^¼, C and m by Reynolds band, n = 0.37 (Pr ≤ 10) or 0.36",
        nu: zk,
        nu_still: zero,
        detail: zk_detail,
        surface: true,
    },
    Forced {
        id: "gnielinski",
        name: GNIELINSKI,
        reference: Reference::FreeStream,
        formula: "Nu_l = 0.3 + √(Nu_lam² + Nu_turb²) on l = πD/2, × (Pr/Pr_s)^0.25 (liquids) or (T∞/Ts)^0.12 (gases)",
        nu: gnielinski,
        nu_still: gn_still,
        detail: gn_detail,
        surface: true,
    },
];

#[cfg(test)]
mod tests {
    use super::*;

    /// Worked example, from memory: Incropera & DeWitt, Fundamentals of Heat and Mass Transfer,
    /// 6th ed., Example 7.4 — a 12.7 mm cylinder in air at 10 m/s, film properties at 350 K give
    /// Re = 6071, Pr = 0.700 and Nu = 40.6 (printed to three figures).
    #[test]
    fn incropera_example_7_4_from_memory() {
        let nu = churchill_bernstein(6071.0, 0.700);
        assert!((nu.value - 40.6).abs() < 0.05, "{}", nu.value);
        assert!(nu.flags.is_empty());
    }

    /// Same example, from memory: with Hilpert's constants for 4000–40 000 (C = 0.193,
    /// m = 0.618) the book prints Nu = 37.3.
    #[test]
    fn hilpert_incropera_example_7_4_from_memory() {
        let nu = hilpert(6071.0, 0.700);
        assert!((nu.value - 37.3).abs() < 0.05, "{}", nu.value);
        assert!(nu.flags.is_empty());
    }

    /// Same example, from memory: Zukauskas with free-stream properties at 300 K (Re = 7992,
    /// Pr = 0.707) and Pr_s = 0.690 at the surface gives Nu = 50.5; the `ht` 1.2.0 docs print
    /// 50.523612661934386 for the same inputs.
    #[test]
    fn zukauskas_incropera_example_7_4_from_memory() {
        let nu = zukauskas(7992.0, 0.707, 0.690);
        assert!(
            (nu.value - 50.523_612_661_934_386).abs() < 1e-9,
            "{}",
            nu.value
        );
        assert!(nu.flags.is_empty());
    }

    /// Worked example, from memory: Çengel & Ghajar, Heat and Mass Transfer, Example 7-6 — a 10 cm
    /// steam pipe at 110 °C in 10 °C air at 8 m/s; film properties at 60 °C (k = 0.02808 W/(m·K),
    /// ν = 1.896×10⁻⁵ m²/s, Pr = 0.7202) give Re = 4.219×10⁴, Nu = 124, h = 34.8 W/(m²·K) and
    /// 1093 W per metre.
    #[test]
    fn cengel_example_7_6_from_memory() {
        let re: f64 = 8.0 * 0.1 / 1.896e-5;
        assert!((re - 4.219e4).abs() < 5.0);
        let nu = churchill_bernstein(re, 0.7202).value;
        assert!((nu - 124.0).abs() < 0.5, "{nu}");
        let h = nu * 0.02808 / 0.1;
        assert!((h - 34.8).abs() < 0.15, "{h}");
        let q = h * std::f64::consts::PI * 0.1 * 100.0;
        assert!((q - 1093.0).abs() < 6.0, "{q}");
    }

    #[test]
    fn tends_to_0_3_in_still_fluid_and_is_flagged_there() {
        let nu = churchill_bernstein(1e-12, 0.7);
        assert!((nu.value - 0.3).abs() < 1e-5);
        assert_eq!(nu.flags.len(), 1);
        assert_eq!(nu.flags[0].range, CHURCHILL_BERNSTEIN_REPR);
    }

    /// Each inner band edge of Hilpert's and Zukauskas's tables is a jump, and both sides of it
    /// carry a near-edge flag.
    #[test]
    fn band_edges_jump_and_are_flagged() {
        use crate::engine::validity::FlagKind;
        let check = |f: &dyn Fn(f64) -> Flagged<f64>, edges: &[f64]| {
            for &e in &edges[1..edges.len() - 1] {
                let below = f(e * (1.0 - 1e-9));
                let above = f(e * (1.0 + 1e-9));
                let jump = (above.value - below.value).abs() / below.value;
                assert!(jump > 1e-4, "no jump at Re = {e}: {jump}");
                for side in [&below, &above] {
                    assert!(
                        side.flags.iter().any(|fl| fl.kind == FlagKind::NearEdge),
                        "edge {e} not flagged"
                    );
                }
                // Well inside a band: no flag.
                assert!(f(e * 1.2).flags.is_empty() || e * 1.2 > edges[edges.len() - 1]);
            }
        };
        check(&|re| hilpert(re, 0.71), HILPERT_BANDS.edges);
        check(&|re| zukauskas(re, 0.71, 0.71), ZUKAUSKAS_BANDS.edges);
    }

    #[test]
    fn outside_the_tables_is_computed_and_flagged() {
        assert!(hilpert(1e6, 0.7)
            .flags
            .iter()
            .any(|f| f.range.hi == 400_000.0));
        assert!(zukauskas(0.5, 0.7, 0.7)
            .flags
            .iter()
            .any(|f| f.range.lo == 1.0));
        assert!(zukauskas(1000.0, 0.6, 0.6)
            .flags
            .iter()
            .any(|f| f.range.quantity == "Pr"));
        assert!(gnielinski(&Groups::uniform(2.0, 0.7, true)).flags.len() == 1);
    }

    /// Gnielinski's laminar and turbulent parts: the laminar part is the flat-plate 0.664 law, so
    /// at low Re the form tends to 0.3 + 0.664·Re_l^½·Pr^⅓.
    #[test]
    fn gnielinski_low_re_is_the_laminar_plate_law() {
        let re = 2.0;
        let nu_l = gnielinski(&Groups::uniform(re, 0.7, true)).value * std::f64::consts::FRAC_PI_2;
        let lam = 0.3 + 0.664 * (re * std::f64::consts::FRAC_PI_2).sqrt() * 0.7f64.cbrt();
        assert!((nu_l - lam).abs() / lam < 0.01, "{nu_l} vs {lam}");
    }

    #[test]
    fn every_forced_correlation_increases_with_reynolds() {
        for c in FORCED {
            let mut last = 0.0;
            let mut re = 0.5;
            while re < 2e6 {
                let nu = (c.nu)(&Groups::uniform(re, 0.71, true)).value;
                // Band tables may step down at an edge by up to 3 % (Zukauskas at Re = 40: 2 %).
                assert!(nu > 0.97 * last, "{} falls at Re = {re}", c.name);
                if c.id == "churchill-bernstein" || c.id == "gnielinski" {
                    assert!(nu > last, "{} not increasing at Re = {re}", c.name);
                }
                last = nu;
                re *= 1.2;
            }
        }
    }
}
