//! Humid air: dry air plus water vapour as an ideal-gas mixture.
//!
//! - Saturation pressure of water: over liquid water (T ≥ 273.16 K) IAPWS-IF97 region 4, Eq. (30);
//!   over ice (T < 273.16 K) the Hyland–Wexler formula as ASHRAE Handbook–Fundamentals (2017),
//!   Ch. 1, Eq. (5) gives it, published for 173.15–273.15 K. No enhancement factor: the
//!   saturation pressure of the pure phase is used, which puts the dew point about 0.02 K low at
//!   1 atm (common practice for field work).
//! - Humidity as relative humidity (to liquid water above 0 °C, to ice below) or dew point.
//! - Density and cp: ideal-gas mixture of dry air (see `air`) and vapour (IF97 region 2 at its
//!   partial pressure).
//! - Viscosity by Wilke's mixing rule (C. R. Wilke, J. Chem. Phys. 18 (1950) 517) and thermal
//!   conductivity by the Wassiljewa equation with the Mason–Saxena coefficients (E. A. Mason and
//!   S. C. Saxena, Phys. Fluids 1 (1958) 361), from each component's own value at the mixture's
//!   temperature and its partial density (vapour: IAPWS R12-08 and R15-11).
//!
//! Units: T K, p Pa, relative humidity as a fraction 0–1.

use super::{air, water, Properties};
use crate::engine::error::{finite, EngineError};
use crate::engine::validity::Range;

/// Molar mass of water, g/mol (IAPWS).
pub const M_WATER: f64 = 18.015_268;

/// How the user gives the air's moisture.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Humidity {
    /// Relative humidity, fraction 0–1.
    Relative(f64),
    /// Dew point (frost point below 0 °C), K.
    DewPoint(f64),
    /// A fixed vapour partial pressure, Pa: the moisture of a stream carried to another
    /// temperature (film, surface). Where it exceeds saturation at that temperature (a surface
    /// below the dew point) the air next to it is taken as saturated.
    VapourPressure(f64),
}

/// Hyland–Wexler over ice, ASHRAE Handbook–Fundamentals (2017) Ch. 1 Eq. (5): C1..C7.
const HW_ICE: [f64; 7] = [
    -5.674_535_9e3,
    6.392_524_7,
    -9.677_843_0e-3,
    6.221_570_1e-7,
    2.074_782_5e-9,
    -9.484_024_0e-13,
    4.163_501_9,
];

/// Saturation pressure over ice, Pa (Hyland–Wexler).
pub fn psat_ice(t: f64) -> f64 {
    let c = &HW_ICE;
    (c[0] / t
        + c[1]
        + c[2] * t
        + c[3] * t * t
        + c[4] * t.powi(3)
        + c[5] * t.powi(4)
        + c[6] * t.ln())
    .exp()
}

/// Saturation pressure of water, Pa: over liquid at and above the triple point, over ice below.
pub fn psat(t: f64) -> f64 {
    if t >= water::T_TRIPLE {
        water::psat_mpa(t) * 1e6
    } else {
        psat_ice(t)
    }
}

/// The temperature, K, at which `pv` (Pa) is the saturation pressure: the dew point (over liquid)
/// or, below the triple-point pressure, the frost point (over ice).
pub fn dew_point(pv: f64) -> f64 {
    let p_triple = psat(water::T_TRIPLE);
    if pv >= p_triple {
        return water::tsat_k(pv * 1e-6);
    }
    // Frost point: psat_ice rises strictly with T; bisection on a bracket that always holds it.
    let (mut lo, mut hi) = (100.0_f64, water::T_TRIPLE);
    for _ in 0..80 {
        let mid = 0.5 * (lo + hi);
        if psat_ice(mid) < pv {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    0.5 * (lo + hi)
}

pub const SOURCES: &[(&str, &str)] = &[
    (
        "ρ, cp",
        "ideal-gas mixture: dry air (Lemmon et al. 2000) and vapour (IAPWS-IF97 region 2)",
    ),
    (
        "μ",
        "Wilke's rule: dry air (Lemmon & Jacobsen 2004), vapour (IAPWS R12-08)",
    ),
    (
        "k",
        "Wassiljewa–Mason–Saxena: dry air (Lemmon & Jacobsen 2004), vapour (IAPWS R15-11)",
    ),
    (
        "psat",
        "IAPWS-IF97 region 4 over water; Hyland–Wexler (ASHRAE) over ice",
    ),
];

pub const HW_ICE_T: Range = Range {
    quantity: "T",
    lo: 173.15,
    hi: 273.16,
    unit: "K",
    source: "Hyland–Wexler over ice (ASHRAE Handbook–Fundamentals)",
};
/// Where the vapour's own transport properties are published (IAPWS R12-08, from memory).
pub const VAPOUR_T: Range = Range {
    quantity: "T",
    lo: 253.15,
    hi: 1173.15,
    unit: "K",
    source: "IAPWS R12-08 (vapour), from memory",
};

/// The vapour mole fraction, Pa of vapour pressure, and the dew point for this humidity.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Moisture {
    pub vapour_pressure: f64,
    pub mole_fraction: f64,
    pub dew_point: f64,
    pub relative_humidity: f64,
}

/// Resolve the humidity at air temperature `t` (K) and pressure `p` (Pa).
pub fn moisture(t: f64, p: f64, h: Humidity) -> Result<Moisture, EngineError> {
    let (pv, ps) = vapour(t, p, h)?;
    let dew = if pv > 0.0 { dew_point(pv) } else { 0.0 };
    Ok(Moisture {
        vapour_pressure: pv,
        mole_fraction: pv / p,
        dew_point: dew,
        relative_humidity: pv / ps,
    })
}

/// The vapour pressure for this humidity and the saturation pressure at `t`, Pa, with every check
/// of [`moisture`] but without the dew point (a root search the properties do not need).
fn vapour(t: f64, p: f64, h: Humidity) -> Result<(f64, f64), EngineError> {
    finite("air temperature", t)?;
    finite("air pressure", p)?;
    let ps = psat(t);
    let pv = match h {
        Humidity::Relative(rh) => {
            finite("relative humidity", rh)?;
            if t > water::T_CRIT {
                // The air temperature is what was typed last and what to change (or give the dew
                // point): the message stands beside the stream's temperature.
                return Err(EngineError::Undefined {
                    subject: crate::engine::error::Subject::Input("Ta"),
                    quantity: "relative humidity",
                    value: rh * 100.0,
                    unit: "%",
                    why: "has no meaning above water's critical temperature (647.096 K); give the dew point instead",
                });
            }
            if !(0.0..=1.0).contains(&rh) {
                return Err(EngineError::Undefined {
                    subject: crate::engine::error::Subject::Humidity,
                    quantity: "relative humidity",
                    value: rh * 100.0,
                    unit: "%",
                    why: "must lie between 0 and 100 %",
                });
            }
            rh * ps
        }
        Humidity::DewPoint(td) => {
            finite("dew point", td)?;
            if td > t {
                return Err(EngineError::Undefined {
                    subject: crate::engine::error::Subject::DewPoint,
                    quantity: "dew point",
                    value: td,
                    unit: "K",
                    why: "cannot be above the air temperature",
                });
            }
            if td <= 0.0 {
                return Err(EngineError::Undefined {
                    subject: crate::engine::error::Subject::DewPoint,
                    quantity: "dew point",
                    value: td,
                    unit: "K",
                    why: "at or below absolute zero",
                });
            }
            psat(td)
        }
        Humidity::VapourPressure(pv) => {
            finite("vapour pressure", pv)?;
            if pv < 0.0 {
                return Err(EngineError::Undefined {
                    subject: crate::engine::error::Subject::Humidity,
                    quantity: "vapour pressure",
                    value: pv,
                    unit: "Pa",
                    why: "cannot be negative",
                });
            }
            pv.min(ps)
        }
    };
    if !pv.is_finite() {
        return Err(EngineError::Undefined {
            subject: crate::engine::error::Subject::DewPoint,
            quantity: "dew point",
            value: t,
            unit: "K",
            why:
                "gives no saturation pressure: it is above water's critical temperature (647.096 K)",
        });
    }
    if pv >= p {
        return Err(EngineError::Undefined {
            subject: crate::engine::error::Subject::Humidity,
            quantity: "vapour pressure",
            value: pv,
            unit: "Pa",
            why: "is at or above the total pressure: the air cannot hold that much water",
        });
    }
    Ok((pv, ps))
}

/// Wilke's Φ_ij for the pair (i, j).
fn phi(mu_i: f64, mu_j: f64, m_i: f64, m_j: f64) -> f64 {
    (1.0 + (mu_i / mu_j).sqrt() * (m_j / m_i).powf(0.25)).powi(2) / (8.0 * (1.0 + m_i / m_j)).sqrt()
}

/// Properties of humid air at T (K), p (Pa).
pub fn properties(t: f64, p: f64, h: Humidity) -> Result<Properties, EngineError> {
    let (pv, _) = vapour(t, p, h)?;
    let xv = pv / p;
    let dry = air::properties(t, p * (1.0 - xv))?;
    let xa = 1.0 - xv;
    let mut flags = dry.flags.clone();
    if xv == 0.0 {
        return Ok(Properties::from_primaries(
            t, p, dry.rho, dry.mu, dry.k, dry.cp, dry.beta, SOURCES, flags,
        ));
    }
    if t < water::T_TRIPLE {
        flags.extend(HW_ICE_T.check("saturation over ice", t, false));
    }
    flags.extend(VAPOUR_T.check("water vapour properties", t, false));
    let (ma, mv) = (air::MOLAR_MASS, M_WATER);
    let rho_v = pv * mv * 1e-3 / (air::R_MOLAR * t);
    let vap = water::region2(t, pv * 1e-6);
    let (mu_v, k_v) = (water::viscosity(t, rho_v), water::conductivity(t, rho_v));
    let mix_mass = xa * ma + xv * mv;
    let rho = p * mix_mass * 1e-3 / (air::R_MOLAR * t);
    let cp = (xa * ma * dry.cp + xv * mv * vap.cp * 1e3) / mix_mass;
    let (pa_a, pa_v) = (phi(dry.mu, mu_v, ma, mv), phi(mu_v, dry.mu, mv, ma));
    let den_a = xa + xv * pa_a;
    let den_v = xa * pa_v + xv;
    let mu = xa * dry.mu / den_a + xv * mu_v / den_v;
    let k = xa * dry.k / den_a + xv * k_v / den_v;
    Ok(Properties::from_primaries(
        t,
        p,
        rho,
        mu,
        k,
        cp,
        1.0 / t,
        SOURCES,
        flags,
    ))
}

#[cfg(test)]
mod tests {
    use super::*;

    fn rel(a: f64, b: f64) -> f64 {
        ((a - b) / b).abs()
    }

    /// ASHRAE Handbook–Fundamentals, saturation pressure over liquid water (Hyland–Wexler
    /// tabulation): 5, 25, 50, 100 °C, printed to five or six figures; IF97 agrees to ~300 ppm.
    /// The stream's moisture carried to another temperature keeps its vapour pressure, and is
    /// capped at saturation below the dew point.
    #[test]
    fn vapour_pressure_is_carried_and_capped() {
        let m = moisture(278.15, 101_325.0, Humidity::Relative(0.7)).unwrap();
        let warm = moisture(
            338.15,
            101_325.0,
            Humidity::VapourPressure(m.vapour_pressure),
        )
        .unwrap();
        assert_eq!(warm.vapour_pressure, m.vapour_pressure);
        assert!(warm.relative_humidity < 0.1);
        let cold = moisture(
            263.15,
            101_325.0,
            Humidity::VapourPressure(m.vapour_pressure),
        )
        .unwrap();
        assert!((cold.vapour_pressure - psat(263.15)).abs() < 1e-12 * psat(263.15));
    }

    #[test]
    fn ashrae_saturation_pressures() {
        for (tc, pa) in [
            (5.0, 872.6),
            (25.0, 3169.7),
            (50.0, 12351.3),
            (100.0, 101418.0),
        ] {
            let p = psat(tc + 273.15);
            assert!(rel(p, pa) < 3e-4, "{tc} °C: {p} vs {pa}");
        }
    }

    /// Dew point at 25 °C, 50 % RH, 1 atm: 13.864 °C by the ASHRAE formulas without an
    /// enhancement factor (shared/references.md; CoolProp 8.0.0 gives 287.0169 K with it).
    #[test]
    fn dew_point_at_25c_50_percent() {
        let m = moisture(298.15, 101_325.0, Humidity::Relative(0.5)).unwrap();
        assert!(
            (m.dew_point - 273.15 - 13.864).abs() < 0.01,
            "{}",
            m.dew_point - 273.15
        );
    }

    #[test]
    fn ice_and_water_meet_at_the_triple_point() {
        let a = psat_ice(water::T_TRIPLE - 1e-9);
        let b = psat(water::T_TRIPLE);
        assert!(rel(a, b) < 1e-3, "{a} vs {b}");
    }

    #[test]
    fn frost_point_inverts_psat_over_ice() {
        for t in [200.0, 240.0, 263.15, 272.0] {
            assert!((dew_point(psat_ice(t)) - t).abs() < 1e-6);
        }
    }

    #[test]
    fn dew_point_in_is_dew_point_out() {
        let m = moisture(300.0, 101_325.0, Humidity::DewPoint(285.0)).unwrap();
        assert!((m.dew_point - 285.0).abs() < 1e-6);
    }

    #[test]
    fn bad_humidity_is_an_error() {
        assert!(moisture(300.0, 101_325.0, Humidity::Relative(1.2)).is_err());
        assert!(moisture(300.0, 101_325.0, Humidity::Relative(-0.1)).is_err());
        assert!(moisture(300.0, 101_325.0, Humidity::DewPoint(301.0)).is_err());
        // 95 °C saturated air at 50 kPa: vapour pressure above total pressure.
        assert!(moisture(368.15, 50e3, Humidity::Relative(1.0)).is_err());
    }

    /// Wilke's rule with one component is that component: zero humidity gives dry air exactly.
    #[test]
    fn dry_limit_is_dry_air() {
        let h = properties(300.0, 101_325.0, Humidity::Relative(0.0)).unwrap();
        let d = air::properties(300.0, 101_325.0).unwrap();
        assert_eq!((h.mu, h.k, h.rho, h.cp), (d.mu, d.k, d.rho, d.cp));
    }

    /// Moist air is lighter than dry air, and its viscosity lower (vapour's μ is about half of
    /// air's): textbook trends.
    #[test]
    fn humidity_trends() {
        let d = properties(310.0, 101_325.0, Humidity::Relative(0.0)).unwrap();
        let w = properties(310.0, 101_325.0, Humidity::Relative(1.0)).unwrap();
        assert!(w.rho < d.rho && w.mu < d.mu && w.cp > d.cp);
    }
}
