//! Liquid water and steam.
//!
//! - Thermodynamic properties: IAPWS R7-97(2012), "Revised Release on the IAPWS Industrial
//!   Formulation 1997 for the Thermodynamic Properties of Water and Steam" (IAPWS-IF97): region 1
//!   (liquid) Eq. (7) with Table 2, region 2 (vapour) Eqs. (15)–(17) with Tables 10 and 11, the
//!   B23 boundary Eq. (5), region 4 (saturation) Eqs. (30) and (31) with Table 34.
//! - Viscosity: IAPWS R12-08, "Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary
//!   Water Substance", Eqs. (10)–(12) with Tables 1 and 2, without the critical enhancement
//!   (μ̄2 = 1, the release's own recommendation for industrial use outside the critical region).
//! - Thermal conductivity: IAPWS R15-11, "Release on the IAPWS Formulation 2011 for the Thermal
//!   Conductivity of Ordinary Water Substance", Eqs. (15)–(17) with Tables 1 and 2, without the
//!   critical enhancement λ̄2: it is nil in liquid up to about 400 K, but worth up to 0.8 % in
//!   liquid at 450–550 K and 0.03 % in steam near saturation at 1 MPa (CoolProp 8.0.0, which
//!   includes it; tests/data/water_coolprop.csv).
//!
//! Units: T K, p MPa inside the IF97 functions (as the release writes them), Pa at the public
//! [`liquid`] and [`steam`] entry points; ρ kg/m³; results SI unless the name says otherwise.

use super::Properties;
use crate::engine::error::{finite, EngineError};
use crate::engine::validity::Range;

/// Specific gas constant of water, kJ/(kg·K) (IF97 Eq. 1).
pub const R: f64 = 0.461_526;
/// Critical temperature K, pressure MPa, density kg/m³ (IF97 Eqs. 2–4).
pub const T_CRIT: f64 = 647.096;
pub const P_CRIT: f64 = 22.064;
pub const RHO_CRIT: f64 = 322.0;
/// Triple point: 273.16 K, 611.657 Pa.
pub const T_TRIPLE: f64 = 273.16;

/// IF97 region 1, Table 2: (I, J, n).
const R1: [(i32, i32, f64); 34] = [
    (0, -2, 0.146_329_712_131_67),
    (0, -1, -0.845_481_871_691_14),
    (0, 0, -0.375_636_036_720_40e1),
    (0, 1, 0.338_551_691_683_85e1),
    (0, 2, -0.957_919_633_878_72),
    (0, 3, 0.157_720_385_132_28),
    (0, 4, -0.166_164_171_995_01e-1),
    (0, 5, 0.812_146_299_835_68e-3),
    (1, -9, 0.283_190_801_238_04e-3),
    (1, -7, -0.607_063_015_658_74e-3),
    (1, -1, -0.189_900_682_184_19e-1),
    (1, 0, -0.325_297_487_705_05e-1),
    (1, 1, -0.218_417_171_754_14e-1),
    (1, 3, -0.528_383_579_699_30e-4),
    (2, -3, -0.471_843_210_732_67e-3),
    (2, 0, -0.300_017_807_930_26e-3),
    (2, 1, 0.476_613_939_069_87e-4),
    (2, 3, -0.441_418_453_308_46e-5),
    (2, 17, -0.726_949_962_975_94e-15),
    (3, -4, -0.316_796_448_450_54e-4),
    (3, 0, -0.282_707_979_853_12e-5),
    (3, 6, -0.852_051_281_201_03e-9),
    (4, -5, -0.224_252_819_080_00e-5),
    (4, -2, -0.651_712_228_956_01e-6),
    (4, 10, -0.143_417_299_379_24e-12),
    (5, -8, -0.405_169_968_601_17e-6),
    (8, -11, -0.127_343_017_416_41e-8),
    (8, -6, -0.174_248_712_306_34e-9),
    (21, -29, -0.687_621_312_955_31e-18),
    (23, -31, 0.144_783_078_285_21e-19),
    (29, -38, 0.263_357_816_627_95e-22),
    (30, -39, -0.119_476_226_400_71e-22),
    (31, -40, 0.182_280_945_814_04e-23),
    (32, -41, -0.935_370_872_924_58e-25),
];

/// IF97 region 2, ideal-gas part, Table 10: (J, n).
const R2_IDEAL: [(i32, f64); 9] = [
    (0, -0.969_276_865_002_17e1),
    (1, 0.100_866_559_680_18e2),
    (-5, -0.560_879_112_830_20e-2),
    (-4, 0.714_527_380_814_55e-1),
    (-3, -0.407_104_982_239_28),
    (-2, 0.142_408_191_714_44e1),
    (-1, -0.438_395_113_194_50e1),
    (2, -0.284_086_324_607_72),
    (3, 0.212_684_637_533_07e-1),
];

/// IF97 region 2, residual part, Table 11: (I, J, n).
const R2_RES: [(i32, i32, f64); 43] = [
    (1, 0, -0.177_317_424_732_13e-2),
    (1, 1, -0.178_348_622_923_58e-1),
    (1, 2, -0.459_960_136_963_65e-1),
    (1, 3, -0.575_812_590_834_32e-1),
    (1, 6, -0.503_252_787_279_30e-1),
    (2, 1, -0.330_326_416_702_03e-4),
    (2, 2, -0.189_489_875_163_15e-3),
    (2, 4, -0.393_927_772_433_55e-2),
    (2, 7, -0.437_972_956_505_73e-1),
    (2, 36, -0.266_745_479_140_87e-4),
    (3, 0, 0.204_817_376_923_09e-7),
    (3, 1, 0.438_706_672_844_35e-6),
    (3, 3, -0.322_776_772_385_70e-4),
    (3, 6, -0.150_339_245_421_48e-2),
    (3, 35, -0.406_682_535_626_49e-1),
    (4, 1, -0.788_473_095_593_67e-9),
    (4, 2, 0.127_907_178_522_85e-7),
    (4, 3, 0.482_253_727_185_07e-6),
    (5, 7, 0.229_220_763_376_61e-5),
    (6, 3, -0.167_147_664_510_61e-10),
    (6, 16, -0.211_714_723_213_55e-2),
    (6, 35, -0.238_957_419_341_04e2),
    (7, 0, -0.590_595_643_242_70e-17),
    (7, 11, -0.126_218_088_991_01e-5),
    (7, 25, -0.389_468_424_357_39e-1),
    (8, 8, 0.112_562_113_604_59e-10),
    (8, 36, -0.823_113_408_979_98e1),
    (9, 13, 0.198_097_128_020_88e-7),
    (10, 4, 0.104_069_652_101_74e-18),
    (10, 10, -0.102_347_470_959_29e-12),
    (10, 14, -0.100_181_793_795_11e-8),
    (16, 29, -0.808_829_086_469_85e-10),
    (16, 50, 0.106_930_318_794_09),
    (18, 57, -0.336_622_505_741_71),
    (20, 20, 0.891_858_453_554_21e-24),
    (20, 35, 0.306_293_168_762_32e-12),
    (20, 48, -0.420_024_676_982_08e-5),
    (21, 21, -0.590_560_296_856_39e-25),
    (22, 53, 0.378_269_476_134_57e-5),
    (23, 39, -0.127_686_089_346_81e-14),
    (24, 26, 0.730_876_105_950_61e-28),
    (24, 40, 0.554_147_153_507_78e-16),
    (24, 58, -0.943_697_072_412_10e-6),
];

/// IF97 region 4, Table 34: n1..n10.
const R4: [f64; 10] = [
    0.116_705_214_527_67e4,
    -0.724_213_167_032_06e6,
    -0.170_738_469_400_92e2,
    0.120_208_247_024_70e5,
    -0.323_255_503_223_33e7,
    0.149_151_086_135_30e2,
    -0.482_326_573_615_91e4,
    0.405_113_405_420_57e6,
    -0.238_555_575_678_49,
    0.650_175_348_447_98e3,
];

/// IF97 B23 boundary, Table 1: n1..n3 (Eq. 5).
const B23: [f64; 3] = [
    0.348_051_856_289_69e3,
    -0.116_718_598_799_75e1,
    0.101_929_700_393_26e-2,
];

/// The dimensionless Gibbs energy and the derivatives the properties need.
#[derive(Debug, Clone, Copy, Default)]
struct Gibbs {
    g: f64,
    g_p: f64,
    g_pp: f64,
    g_t: f64,
    g_tt: f64,
    g_pt: f64,
}

/// Powers x^0 ..= x^N by repeated multiplication (one pass instead of a powi per term).
fn powers<const N: usize>(x: f64) -> [f64; N] {
    let mut out = [1.0; N];
    for k in 1..N {
        out[k] = out[k - 1] * x;
    }
    out
}

/// Region 1, Eq. (7): π = p/16.53 MPa, τ = 1386 K/T.
fn gibbs1(pi: f64, tau: f64) -> Gibbs {
    let a = 7.1 - pi;
    let b = tau - 1.222;
    // I runs 0..=32; J runs −41..=17, and its derivatives need down to −43.
    let pa: [f64; 33] = powers(a);
    let pb: [f64; 18] = powers(b);
    let pbi: [f64; 44] = powers(1.0 / b);
    let bp = |j: i32| {
        if j >= 0 {
            pb[j as usize]
        } else {
            pbi[(-j) as usize]
        }
    };
    let mut out = Gibbs::default();
    for &(i, j, n) in &R1 {
        let (fi, fj) = (i as f64, j as f64);
        let iu = i as usize;
        let ai = pa[iu];
        let ai1 = if i >= 1 { pa[iu - 1] } else { 0.0 };
        let ai2 = if i >= 2 { pa[iu - 2] } else { 0.0 };
        let (bj, bj1, bj2) = (bp(j), bp(j - 1), bp(j - 2));
        out.g += n * ai * bj;
        out.g_p -= n * fi * ai1 * bj;
        out.g_pp += n * fi * (fi - 1.0) * ai2 * bj;
        out.g_t += n * ai * fj * bj1;
        out.g_tt += n * ai * fj * (fj - 1.0) * bj2;
        out.g_pt -= n * fi * ai1 * fj * bj1;
    }
    out
}

/// Region 2, Eqs. (15)–(17): π = p/1 MPa, τ = 540 K/T; ideal-gas plus residual part.
fn gibbs2(pi: f64, tau: f64) -> (Gibbs, Gibbs) {
    let mut o = Gibbs {
        g: pi.ln(),
        g_p: 1.0 / pi,
        g_pp: -1.0 / (pi * pi),
        ..Gibbs::default()
    };
    for &(j, n) in &R2_IDEAL {
        let fj = j as f64;
        o.g += n * tau.powi(j);
        o.g_t += n * fj * tau.powi(j - 1);
        o.g_tt += n * fj * (fj - 1.0) * tau.powi(j - 2);
    }
    let b = tau - 0.5;
    // I runs 1..=24, J 0..=58; derivatives use the powers one and two below, only where the
    // exponent's own factor is not zero (so b = 0 never divides).
    let pp: [f64; 25] = powers(pi);
    let pb: [f64; 59] = powers(b);
    let mut r = Gibbs::default();
    for &(i, j, n) in &R2_RES {
        let (fi, fj) = (i as f64, j as f64);
        let (iu, ju) = (i as usize, j as usize);
        let (pi_i, pi_i1) = (pp[iu], pp[iu - 1]);
        let pi_i2 = if i >= 2 { pp[iu - 2] } else { 0.0 };
        let bj = pb[ju];
        let bj1 = if j >= 1 { pb[ju - 1] } else { 0.0 };
        let bj2 = if j >= 2 { pb[ju - 2] } else { 0.0 };
        r.g += n * pi_i * bj;
        r.g_p += n * fi * pi_i1 * bj;
        r.g_pp += n * fi * (fi - 1.0) * pi_i2 * bj;
        r.g_t += n * pi_i * fj * bj1;
        r.g_tt += n * pi_i * fj * (fj - 1.0) * bj2;
        r.g_pt += n * fi * pi_i1 * fj * bj1;
    }
    (o, r)
}

/// A thermodynamic state from IF97, in the release's units: v m³/kg, h u kJ/kg, s cp kJ/(kg·K),
/// w m/s; β 1/K.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct If97 {
    pub v: f64,
    pub h: f64,
    pub u: f64,
    pub s: f64,
    pub cp: f64,
    pub w: f64,
    pub beta: f64,
}

/// Region 1 at T (K), p (MPa) (Table 3 relations).
pub fn region1(t: f64, p: f64) -> If97 {
    let (pi, tau) = (p / 16.53, 1386.0 / t);
    let g = gibbs1(pi, tau);
    let rt = R * t;
    let w2 =
        1e3 * rt * g.g_p * g.g_p / ((g.g_p - tau * g.g_pt).powi(2) / (tau * tau * g.g_tt) - g.g_pp);
    If97 {
        v: rt * pi * g.g_p / p * 1e-3,
        h: rt * tau * g.g_t,
        u: rt * (tau * g.g_t - pi * g.g_p),
        s: R * (tau * g.g_t - g.g),
        cp: -R * tau * tau * g.g_tt,
        w: w2.sqrt(),
        beta: (1.0 - tau * g.g_pt / g.g_p) / t,
    }
}

/// Region 2 at T (K), p (MPa) (Table 12 relations).
pub fn region2(t: f64, p: f64) -> If97 {
    let (pi, tau) = (p, 540.0 / t);
    let (o, r) = gibbs2(pi, tau);
    let rt = R * t;
    let gp = o.g_p + r.g_p;
    let num = 1.0 + 2.0 * pi * r.g_p + pi * pi * r.g_p * r.g_p;
    let den = (1.0 - pi * pi * r.g_pp)
        + (1.0 + pi * r.g_p - tau * pi * r.g_pt).powi(2) / (tau * tau * (o.g_tt + r.g_tt));
    If97 {
        v: rt * pi * gp / p * 1e-3,
        h: rt * tau * (o.g_t + r.g_t),
        u: rt * (tau * (o.g_t + r.g_t) - pi * gp),
        s: R * (tau * (o.g_t + r.g_t) - (o.g + r.g)),
        cp: -R * tau * tau * (o.g_tt + r.g_tt),
        w: (1e3 * rt * num / den).sqrt(),
        beta: (1.0 - tau * (o.g_pt + r.g_pt) / gp) / t,
    }
}

/// Saturation pressure, MPa, at T (K), 273.15 K ≤ T ≤ 647.096 K (IF97 Eq. 30).
pub fn psat_mpa(t: f64) -> f64 {
    let n = &R4;
    let th = t + n[8] / (t - n[9]);
    let a = th * th + n[0] * th + n[1];
    let b = n[2] * th * th + n[3] * th + n[4];
    let c = n[5] * th * th + n[6] * th + n[7];
    (2.0 * c / (-b + (b * b - 4.0 * a * c).sqrt())).powi(4)
}

/// Saturation temperature, K, at p (MPa), 611.213 Pa ≤ p ≤ 22.064 MPa (IF97 Eq. 31).
pub fn tsat_k(p: f64) -> f64 {
    let n = &R4;
    let be = p.powf(0.25);
    let e = be * be + n[2] * be + n[5];
    let f = n[0] * be * be + n[3] * be + n[6];
    let g = n[1] * be * be + n[4] * be + n[7];
    let d = 2.0 * g / (-f - (f * f - 4.0 * e * g).sqrt());
    (n[9] + d - ((n[9] + d).powi(2) - 4.0 * (n[8] + n[9] * d)).sqrt()) / 2.0
}

/// The B23 boundary pressure, MPa, at T (K), 623.15–863.15 K (IF97 Eq. 5).
pub fn p_b23_mpa(t: f64) -> f64 {
    B23[0] + B23[1] * t + B23[2] * t * t
}

/// R12-08 Table 1 (H0..H3) and Table 2 (H_ij, i = 0..5 by rows, j = 0..6 by columns).
const H0: [f64; 4] = [1.677_52, 2.204_62, 0.636_656_4, -0.241_605];
const H1: [[f64; 7]; 6] = [
    [
        5.200_94e-1,
        2.225_31e-1,
        -2.813_78e-1,
        1.619_13e-1,
        -3.253_72e-2,
        0.0,
        0.0,
    ],
    [
        8.508_95e-2,
        9.991_15e-1,
        -9.068_51e-1,
        2.573_99e-1,
        0.0,
        0.0,
        0.0,
    ],
    [-1.083_74, 1.887_97, -7.724_79e-1, 0.0, 0.0, 0.0, 0.0],
    [
        -2.895_55e-1,
        1.266_13,
        -4.898_37e-1,
        0.0,
        6.984_52e-2,
        0.0,
        -4.356_73e-3,
    ],
    [0.0, 0.0, -2.570_40e-1, 0.0, 0.0, 8.721_02e-3, 0.0],
    [0.0, 1.205_73e-1, 0.0, 0.0, 0.0, 0.0, -5.932_64e-4],
];

/// Viscosity, Pa·s, at T (K) and ρ (kg/m³): R12-08 Eqs. (10)–(12), no critical enhancement.
pub fn viscosity(t: f64, rho: f64) -> f64 {
    let tb = t / T_CRIT;
    let rb = rho / RHO_CRIT;
    let mut s0 = 0.0;
    for (i, h) in H0.iter().enumerate() {
        s0 += h / tb.powi(i as i32);
    }
    let mu0 = 100.0 * tb.sqrt() / s0;
    let (x, y) = (1.0 / tb - 1.0, rb - 1.0);
    let mut s1 = 0.0;
    let mut xi = 1.0;
    for row in &H1 {
        let mut yj = 1.0;
        for h in row {
            s1 += xi * h * yj;
            yj *= y;
        }
        xi *= x;
    }
    mu0 * (rb * s1).exp() * 1e-6
}

/// R15-11 Table 1 (L0..L4) and Table 2 (L_ij, i = 0..4 by rows, j = 0..5 by columns).
const L0: [f64; 5] = [
    2.443_221e-3,
    1.323_095e-2,
    6.770_357e-3,
    -3.454_586e-3,
    4.096_266e-4,
];
const L1: [[f64; 6]; 5] = [
    [
        1.603_973_57,
        -0.646_013_523,
        0.111_443_906,
        0.102_997_357,
        -0.050_412_363_4,
        0.006_098_592_58,
    ],
    [
        2.337_718_42,
        -2.788_437_78,
        1.536_161_67,
        -0.463_045_512,
        0.083_282_701_9,
        -0.007_192_012_45,
    ],
    [
        2.196_505_29,
        -4.545_807_85,
        3.557_772_44,
        -1.409_449_78,
        0.275_418_278,
        -0.020_593_881_6,
    ],
    [
        -1.210_513_78,
        1.608_129_89,
        -0.621_178_141,
        0.071_637_322_4,
        0.0,
        0.0,
    ],
    [
        -2.720_337_0,
        4.575_863_31,
        -3.183_692_45,
        1.116_834_8,
        -0.192_683_05,
        0.012_913_842,
    ],
];

/// Thermal conductivity, W/(m·K), at T (K) and ρ (kg/m³): R15-11 Eqs. (15)–(17), no critical
/// enhancement.
pub fn conductivity(t: f64, rho: f64) -> f64 {
    let tb = t / T_CRIT;
    let rb = rho / RHO_CRIT;
    let mut s0 = 0.0;
    for (k, l) in L0.iter().enumerate() {
        s0 += l / tb.powi(k as i32);
    }
    let l0 = tb.sqrt() / s0;
    let (x, y) = (1.0 / tb - 1.0, rb - 1.0);
    let mut s1 = 0.0;
    let mut xi = 1.0;
    for row in &L1 {
        let mut yj = 1.0;
        for l in row {
            s1 += xi * l * yj;
            yj *= y;
        }
        xi *= x;
    }
    l0 * (rb * s1).exp() * 1e-3
}

pub const SOURCES_LIQUID: &[(&str, &str)] = &[
    ("ρ, cp, β", "IAPWS-IF97 region 1"),
    ("μ", "IAPWS R12-08, without the critical enhancement"),
    ("k", "IAPWS R15-11, without the critical enhancement"),
];
pub const SOURCES_STEAM: &[(&str, &str)] = &[
    ("ρ, cp, β", "IAPWS-IF97 region 2"),
    ("μ", "IAPWS R12-08, without the critical enhancement"),
    ("k", "IAPWS R15-11, without the critical enhancement"),
];

/// IF97 region 1's temperature range, K (R7-97 section 4).
pub const REGION1_T: Range = Range {
    quantity: "T",
    lo: 273.15,
    hi: 623.15,
    unit: "K",
    source: "IAPWS-IF97 region 1",
};
/// IF97 region 2's temperature range, K (R7-97 section 5; up to 863.15 K only below the B23 line).
pub const REGION2_T: Range = Range {
    quantity: "T",
    lo: 273.15,
    hi: 1073.15,
    unit: "K",
    source: "IAPWS-IF97 region 2",
};
/// The IF97 pressure limit, Pa.
pub const IF97_P: Range = Range {
    quantity: "p",
    lo: 0.0,
    hi: 100e6,
    unit: "Pa",
    source: "IAPWS-IF97",
};

fn check_state(t: f64, p: f64) -> Result<(), EngineError> {
    finite("water temperature", t)?;
    finite("water pressure", p)?;
    if t <= 0.0 {
        return Err(EngineError::Undefined {
            subject: crate::engine::error::Subject::General,
            quantity: "temperature",
            value: t,
            unit: "K",
            why: "at or below absolute zero",
        });
    }
    if p <= 0.0 {
        return Err(EngineError::Undefined {
            subject: crate::engine::error::Subject::General,
            quantity: "pressure",
            value: p,
            unit: "Pa",
            why: "an absolute pressure must be above zero",
        });
    }
    Ok(())
}

/// Saturation temperature at `p` (Pa), when p is below the critical pressure.
fn saturation(p: f64) -> Option<f64> {
    let p_mpa = p * 1e-6;
    (611.213e-6..P_CRIT).contains(&p_mpa).then(|| tsat_k(p_mpa))
}

/// Liquid water at T (K) and p (Pa). Above the saturation temperature at p it is an error that
/// names that temperature; never a silent switch to steam.
pub fn liquid(t: f64, p: f64) -> Result<Properties, EngineError> {
    check_state(t, p)?;
    if t < 273.15 {
        return Err(EngineError::WrongPhase {
            subject: crate::engine::error::Subject::StreamFluid,
            asked: "liquid water",
            t,
            boundary: 273.15,
            why: "water freezes at about 273.15 K (0 °C); below it the liquid is not stable",
        });
    }
    if let Some(ts) = saturation(p) {
        if t >= ts {
            return Err(EngineError::WrongPhase {
                subject: crate::engine::error::Subject::StreamFluid,
                asked: "liquid water",
                t,
                boundary: ts,
                why: "at this pressure water boils at the saturation temperature; above it the water is steam",
            });
        }
    } else if p * 1e-6 < P_CRIT {
        // Below the triple-point pressure there is no liquid at all.
        return Err(EngineError::Undefined {
            subject: crate::engine::error::Subject::General,
            quantity: "pressure",
            value: p,
            unit: "Pa",
            why: "below the triple-point pressure (611.657 Pa) water cannot be liquid",
        });
    }
    let mut flags = Vec::new();
    for (r, v) in [(&REGION1_T, t), (&IF97_P, p)] {
        flags.extend(r.check("IAPWS-IF97", v, false));
    }
    let st = region1(t, p * 1e-6);
    let rho = 1.0 / st.v;
    Ok(Properties::from_primaries(
        t,
        p,
        rho,
        viscosity(t, rho),
        conductivity(t, rho),
        st.cp * 1e3,
        st.beta,
        SOURCES_LIQUID,
        flags,
    ))
}

/// Steam (water vapour) at T (K) and p (Pa). Below the saturation temperature at p it is an error
/// that names that temperature.
pub fn steam(t: f64, p: f64) -> Result<Properties, EngineError> {
    check_state(t, p)?;
    if let Some(ts) = saturation(p) {
        if t <= ts {
            return Err(EngineError::WrongPhase {
                subject: crate::engine::error::Subject::StreamFluid,
                asked: "steam",
                t,
                boundary: ts,
                why: "at this pressure steam condenses at the saturation temperature; below it the water is liquid",
            });
        }
    }
    let mut flags = Vec::new();
    for (r, v) in [(&REGION2_T, t), (&IF97_P, p)] {
        flags.extend(r.check("IAPWS-IF97", v, false));
    }
    if t > 623.15 && t <= 863.15 && p * 1e-6 > p_b23_mpa(t) {
        flags.extend(
            Range {
                quantity: "p",
                lo: 0.0,
                hi: p_b23_mpa(t) * 1e6,
                unit: "Pa",
                source: "IAPWS-IF97 region 2 (B23 boundary; region 3 is not implemented)",
            }
            .check("IAPWS-IF97", p, false),
        );
    }
    let st = region2(t, p * 1e-6);
    let rho = 1.0 / st.v;
    Ok(Properties::from_primaries(
        t,
        p,
        rho,
        viscosity(t, rho),
        conductivity(t, rho),
        st.cp * 1e3,
        st.beta,
        SOURCES_STEAM,
        flags,
    ))
}

#[cfg(test)]
mod tests {
    use super::*;

    fn rel(a: f64, b: f64) -> f64 {
        ((a - b) / b).abs()
    }

    /// IAPWS R7-97(2012) Table 5 (region 1) and Table 15 (region 2): v, h, u, s, cp, w to 1e-8.
    #[test]
    fn if97_verification_tables_5_and_15() {
        type Row = (f64, f64, [f64; 6]);
        let r1: [Row; 3] = [
            (
                300.0,
                3.0,
                [
                    1.00215168e-3,
                    115.331273,
                    112.324818,
                    0.392294792,
                    4.17301218,
                    1507.73921,
                ],
            ),
            (
                300.0,
                80.0,
                [
                    9.71180894e-4,
                    184.142828,
                    106.448356,
                    0.368563852,
                    4.01008987,
                    1634.69054,
                ],
            ),
            (
                500.0,
                3.0,
                [
                    1.20241800e-3,
                    975.542239,
                    971.934985,
                    2.58041912,
                    4.65580682,
                    1240.71337,
                ],
            ),
        ];
        let r2: [Row; 3] = [
            (
                300.0,
                0.0035,
                [
                    39.4913866, 2549.91145, 2411.69160, 8.52238967, 1.91300162, 427.920172,
                ],
            ),
            (
                700.0,
                0.0035,
                [
                    92.3015898, 3335.68375, 3012.62819, 10.1749996, 2.08141274, 644.289068,
                ],
            ),
            (
                700.0,
                30.0,
                [
                    5.42946619e-3,
                    2631.49474,
                    2468.61076,
                    5.17540298,
                    10.3505092,
                    480.386523,
                ],
            ),
        ];
        for (f, rows) in [(region1 as fn(f64, f64) -> If97, r1), (region2, r2)] {
            for (t, p, want) in rows {
                let s = f(t, p);
                let got = [s.v, s.h, s.u, s.s, s.cp, s.w];
                for (k, (g, w)) in got.iter().zip(want).enumerate() {
                    assert!(rel(*g, w) < 1e-8, "T {t} p {p} item {k}: {g} vs {w}");
                }
            }
        }
    }

    /// IAPWS R7-97(2012) Tables 35 and 36 (region 4), to 1e-8.
    #[test]
    fn if97_verification_tables_35_and_36() {
        for (t, p) in [
            (300.0, 3.53658941e-3),
            (500.0, 2.63889776),
            (600.0, 12.3443146),
        ] {
            assert!(rel(psat_mpa(t), p) < 1e-8, "psat({t})");
        }
        for (p, t) in [(0.1, 372.755919), (1.0, 453.035632), (10.0, 584.149488)] {
            assert!(rel(tsat_k(p), t) < 1e-8, "Tsat({p})");
        }
    }

    /// IAPWS R12-08 Table 4 (no critical enhancement at these points), μ in μPa·s, to 1e-7.
    #[test]
    fn r12_08_table_4() {
        let cases = [
            (998.0, 298.15, 889.735100),
            (1200.0, 298.15, 1437.649467),
            (1000.0, 373.15, 307.883622),
            (1.0, 433.15, 14.538324),
            (1000.0, 433.15, 217.685358),
            (1.0, 873.15, 32.619287),
            (100.0, 873.15, 35.802262),
            (600.0, 873.15, 77.430195),
            (1.0, 1173.15, 44.217245),
            (100.0, 1173.15, 47.640433),
            (400.0, 1173.15, 64.154608),
        ];
        for (rho, t, mu) in cases {
            let got = viscosity(t, rho) * 1e6;
            assert!(rel(got, mu) < 1e-7, "μ({rho}, {t}) = {got}, table {mu}");
        }
    }

    /// IAPWS R15-11 Table 4 (critical enhancement excluded), λ in mW/(m·K), to 1e-7.
    #[test]
    fn r15_11_table_4() {
        let cases = [
            (0.0, 298.15, 18.4341883),
            (998.0, 298.15, 607.712868),
            (1200.0, 298.15, 799.038144),
            (0.0, 873.15, 79.1034659),
        ];
        for (rho, t, l) in cases {
            let got = conductivity(t, rho) * 1e3;
            assert!(rel(got, l) < 1e-7, "λ({rho}, {t}) = {got}, table {l}");
        }
    }

    #[test]
    fn phase_checks_name_the_saturation_temperature() {
        let e = liquid(380.0, 101_325.0).unwrap_err();
        match e {
            EngineError::WrongPhase { boundary, .. } => assert!((boundary - 373.124).abs() < 0.01),
            other => panic!("{other:?}"),
        }
        assert!(steam(360.0, 101_325.0).is_err());
        assert!(liquid(360.0, 101_325.0).is_ok());
        assert!(steam(400.0, 101_325.0).is_ok());
        assert!(liquid(270.0, 101_325.0).is_err());
    }

    #[test]
    fn saturation_pressure_rises_strictly() {
        let mut last = 0.0;
        let mut t = 273.16;
        while t < 647.0 {
            let p = psat_mpa(t);
            assert!(p > last, "not rising at {t}");
            // Tsat inverts psat.
            assert!((tsat_k(p) - t).abs() < 1e-6, "Tsat(psat({t}))");
            last = p;
            t += 0.5;
        }
    }
}
