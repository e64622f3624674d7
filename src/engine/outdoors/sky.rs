//! The sky a body outdoors radiates to, and the ground it also sees.
//!
//! A clear night sky radiates like a black body well below the air temperature: its effective
//! emissivity ε_sky relative to the air at screen height is about 0.7–0.85, so the sky
//! temperature T_sky = ε_sky^¼·T_air lies some 10–30 K below the air. Clouds close that gap.
//! A body in the open sees the sky over part of its surface and the ground over the rest; the
//! surface balance keeps one surroundings temperature, [`radiant_surroundings`], that gives the
//! same net exchange as the two parts.
//!
//! Units: temperatures K, pressure Pa, hour of the day h (local solar time), cloud cover oktas
//! (eighths of the sky covered, 0–8), heights m, emissivities and view factors dimensionless.

use super::{finite, kelvin, keys, pressure_pa, undefined, within};
use crate::engine::error::{EngineError, Subject};
use crate::engine::heatloss::SIGMA;
use crate::engine::validity::{Flagged, Range};

pub const BERDAHL_MARTIN: &str = "Berdahl & Martin (1984)";

/// The dew points Berdahl & Martin's fit was made over: about −20 to +30 °C in the six US
/// stations' data (from memory: verify against the paper's Fig. 1 before relying on the edges).
pub const BERDAHL_MARTIN_DEW_POINT: Range = Range {
    quantity: "dew point",
    lo: 253.15,
    hi: 303.15,
    unit: "K",
    source: "Berdahl & Martin (1984), from memory",
};

/// P. Berdahl and M. Martin, "Emissivity of clear skies", Solar Energy 32 (1984) 663–664, with
/// its diurnal and altitude (pressure) terms:
///
/// ε = 0.711 + 0.56·(t_dp/100) + 0.73·(t_dp/100)² + 0.013·cos(2π·h/24) + 0.000 12·(P − 1000)
///
/// with t_dp the dew point in °C, h the hour from local solar midnight, P the site pressure in
/// mbar (hPa). The clear-sky effective emissivity relative to the air temperature at screen
/// height, so that the downward long-wave irradiance is ε·σ·T_air⁴. Neither paper was read here:
/// the form and constants are from memory, and agree with the Modelica Buildings library's
/// implementation (which cites M. Martin and P. Berdahl, "Characteristics of infrared sky
/// radiation in the United States", Solar Energy 33 (1984) 321–336, for the same terms) and with
/// Duffie & Beckman's Eq. 3.9.2 as remembered.
///
/// - `dew_point`: K, above 0 K (the frost point below 0 °C, as the engine's humid air gives it).
/// - `solar_hour`: local solar time, h, 0–24 (the diurnal term is largest at midnight).
/// - `pressure`: Pa, above 0.
///
/// Returns the emissivity (dimensionless), capped at 1 (no sky emits more than a black body at
/// the air temperature; the fit would pass 1 only for dew points far above its range). Flagged
/// outside [`BERDAHL_MARTIN_DEW_POINT`]; the pressure term has no printed range (it is small:
/// 0.012 per 100 hPa). Errors: a non-finite input, a dew point at or below 0 K, an hour outside
/// 0–24, a pressure at or below 0.
pub fn berdahl_martin(
    dew_point: f64,
    solar_hour: f64,
    pressure: f64,
) -> Result<Flagged<f64>, EngineError> {
    kelvin(Subject::DewPoint, "dew point", dew_point)?;
    within(
        keys::SOLAR_HOUR,
        "solar time",
        solar_hour,
        0.0,
        24.0,
        "h",
        "the hour of the day lies between 0 and 24",
    )?;
    pressure_pa(pressure)?;
    let t = (dew_point - 273.15) / 100.0;
    let base = 0.711 + 0.56 * t + 0.73 * t * t;
    let diurnal = 0.013 * (std::f64::consts::TAU * solar_hour / 24.0).cos();
    let altitude = 0.000_12 * (pressure / 100.0 - 1000.0);
    let mut out = Flagged::new((base + diurnal + altitude).min(1.0));
    out.check(BERDAHL_MARTIN, &BERDAHL_MARTIN_DEW_POINT, dew_point);
    Ok(out)
}

pub const SWINBANK: &str = "Swinbank (1963)";

/// The screen temperatures of Swinbank's clear-sky data (Aspendale, Victoria, and the Indian
/// Ocean): about −5 to +30 °C (from memory, not verified against the paper).
pub const SWINBANK_AIR: Range = Range {
    quantity: "air temperature",
    lo: 268.15,
    hi: 303.15,
    unit: "K",
    source: "Swinbank (1963), from memory",
};

/// W. C. Swinbank, "Long-wave radiation from clear skies", Q. J. R. Meteorol. Soc. 89 (1963)
/// 339–348: the downward long-wave irradiance from a clear sky L = 5.31×10⁻¹³·T⁶ W/m², T the
/// screen air temperature in K — a function of the air temperature alone. Returned as the
/// emissivity relative to the air, ε = L/(σT⁴) = 9.37×10⁻⁶·T² (dimensionless), capped at 1.
///
/// A cross-check of [`berdahl_martin`] (which sees the humidity), not the engine's answer.
/// `air_temperature` K, above 0; flagged outside [`SWINBANK_AIR`]; errors: non-finite, ≤ 0 K.
pub fn swinbank(air_temperature: f64) -> Result<Flagged<f64>, EngineError> {
    let t = kelvin(
        Subject::Input(keys::AIR_TEMPERATURE),
        "air temperature",
        air_temperature,
    )?;
    let mut out = Flagged::new((5.31e-13 * t * t / SIGMA).min(1.0));
    out.check(SWINBANK, &SWINBANK_AIR, t);
    Ok(out)
}

pub const CLARK_ALLEN: &str = "Clark & Allen (1978)";

/// Tenths of sky cover per okta (eighths).
const TENTHS_PER_OKTA: f64 = 10.0 / 8.0;

/// The cloud-cover correction of G. Clark and C. Allen, "The estimation of atmospheric radiation
/// for clear and cloudy skies", Proc. 2nd National Passive Solar Conference, Philadelphia (1978)
/// 675–678 (as the EnergyPlus Engineering Reference cites it; the paper not read here), in the
/// form EnergyPlus and the Modelica Buildings library use it: ε = ε_clear·(1 + 0.0224·N − 0.0035·N² + 0.000 28·N³), N the opaque sky cover in tenths
/// (here N = oktas × 10/8). The factor rises monotonically from 1 (clear) to 1.154 (overcast).
///
/// - `clear`: the clear-sky emissivity, 0 < ε ≤ 1.
/// - `oktas`: cloud cover, 0–8 (fractions of an okta allowed).
///
/// Returns the cloudy-sky emissivity, capped at 1 (an overcast humid sky radiates as a black
/// body at the air temperature). The polynomial covers the whole 0–8 domain: no flag. Errors:
/// non-finite input, `clear` outside (0, 1], `oktas` outside 0–8.
pub fn clark_allen(clear: f64, oktas: f64) -> Result<f64, EngineError> {
    clear_emissivity(clear)?;
    cloud_oktas(oktas)?;
    let n = oktas * TENTHS_PER_OKTA;
    // Horner's form of the published cubic.
    let factor = 1.0 + n * (0.0224 + n * (-0.0035 + n * 0.000_28));
    Ok((clear * factor).min(1.0))
}

pub const MARTIN_BERDAHL: &str = "Martin & Berdahl (1984)";

/// Scale height of the cloud term, m (Martin & Berdahl 1984: Γ = exp(−z_c/8.2 km); from
/// memory, matching one independent implementation read).
const CLOUD_SCALE_HEIGHT: f64 = 8200.0;

/// The cloud correction of M. Martin and P. Berdahl, "Characteristics of infrared sky radiation
/// in the United States", Solar Energy 33 (1984) 321–336, for one cloud layer:
/// ε = ε_clear + (1 − ε_clear)·n·ε_c·exp(−z_c/8200 m), n the covered fraction (oktas/8), ε_c the
/// cloud's emissivity (low cloud 1.00 ± 0.03, altocumulus 0.79 on average, cirrus 0.35, from 20
/// months of zenith radiances in J. Appl. Meteorol. 10 (1971) 260 — its abstract read), z_c the
/// height of the cloud base above the ground. Never above 1. For when the cloud base is known
/// (a weather report's ceiling); [`clark_allen`] needs the cover alone.
///
/// - `clear`: 0 < ε ≤ 1; `oktas`: 0–8; `cloud_base`: m, ≥ 0; `cloud_emissivity`: 0–1.
///
/// Errors: non-finite input or any of them outside its domain. No printed range known: no flag.
pub fn martin_berdahl(
    clear: f64,
    oktas: f64,
    cloud_base: f64,
    cloud_emissivity: f64,
) -> Result<f64, EngineError> {
    clear_emissivity(clear)?;
    cloud_oktas(oktas)?;
    within(
        keys::CLOUD_BASE,
        "cloud base height",
        cloud_base,
        0.0,
        f64::MAX,
        "m",
        "a cloud base lies above the ground",
    )?;
    within(
        keys::CLOUD_EMISSIVITY,
        "cloud emissivity",
        cloud_emissivity,
        0.0,
        1.0,
        "",
        "an emissivity lies between 0 and 1",
    )?;
    let cover = oktas / 8.0 * cloud_emissivity * (-cloud_base / CLOUD_SCALE_HEIGHT).exp();
    Ok(clear + (1.0 - clear) * cover)
}

/// Cloud cover given as a fraction of the sky (0–1), in oktas.
pub fn oktas_from_fraction(fraction: f64) -> Result<f64, EngineError> {
    within(
        keys::CLOUD,
        "cloud cover",
        fraction,
        0.0,
        1.0,
        "",
        "the covered share of the sky lies between 0 and 1",
    )
    .map(|f| 8.0 * f)
}

/// The effective sky temperature, K: the black body that radiates what the sky does,
/// T_sky = ε_sky^¼·T_air (the definition behind every emissivity model above).
///
/// `air_temperature` K (> 0), `emissivity` 0 < ε ≤ 1. Exactly the air temperature when ε = 1.
/// Errors: non-finite input, T ≤ 0 K, ε outside (0, 1].
pub fn sky_temperature(air_temperature: f64, emissivity: f64) -> Result<f64, EngineError> {
    let t = kelvin(
        Subject::Input(keys::AIR_TEMPERATURE),
        "air temperature",
        air_temperature,
    )?;
    clear_emissivity(emissivity)?;
    Ok(t * emissivity.sqrt().sqrt())
}

/// The sky above a site, as the page shows it and the surface balance uses it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Sky {
    /// Clear-sky emissivity (Berdahl & Martin).
    pub clear_emissivity: f64,
    /// With the cloud cover (Clark & Allen).
    pub emissivity: f64,
    /// The effective sky temperature, K.
    pub temperature: f64,
    /// Swinbank's clear-sky temperature, K, the cross-check.
    pub swinbank_temperature: f64,
}

/// The sky from the weather: Berdahl & Martin's clear sky, Clark & Allen's cloud correction,
/// the sky temperature, and Swinbank's clear sky beside it. Arguments as in [`berdahl_martin`]
/// and [`clark_allen`], with the air temperature in K. A dew point above the air temperature is
/// an error (air cannot hold more vapour than saturates it). The flags are Berdahl & Martin's:
/// Swinbank's temperature is the cross-check shown beside the answer, not part of it.
pub fn sky(
    air_temperature: f64,
    dew_point: f64,
    solar_hour: f64,
    pressure: f64,
    oktas: f64,
) -> Result<Flagged<Sky>, EngineError> {
    let t = kelvin(
        Subject::Input(keys::AIR_TEMPERATURE),
        "air temperature",
        air_temperature,
    )?;
    kelvin(Subject::DewPoint, "dew point", dew_point)?;
    if dew_point > t {
        return Err(undefined(
            Subject::DewPoint,
            "dew point",
            dew_point,
            "K",
            "the dew point cannot lie above the air temperature",
        ));
    }
    let clear = berdahl_martin(dew_point, solar_hour, pressure)?;
    let cross = swinbank(t)?;
    let emissivity = clark_allen(clear.value, oktas)?;
    let mut out = Flagged::new(Sky {
        clear_emissivity: clear.value,
        emissivity,
        temperature: sky_temperature(t, emissivity)?,
        swinbank_temperature: sky_temperature(t, cross.value)?,
    });
    out.flags.extend(clear.flags);
    Ok(out)
}

/// How a body's outer surface divides its view between the sky and the ground.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ViewFactors {
    pub sky: f64,
    pub ground: f64,
}

impl ViewFactors {
    /// Half sky, half ground: any body whose surface has, for each outward normal, as much area
    /// facing the opposite way (a level or upright cylinder's side, a sphere, the square and
    /// hexagonal bars, a plate), standing clear over open level ground. Each facet tilted β
    /// from the horizontal sees the sky over (1 + cos β)/2 (the view factor of a plane to the
    /// sky hemisphere, e.g. Duffie & Beckman, Solar Engineering of Thermal Processes, §2.16);
    /// the opposite facet sees (1 − cos β)/2; the pair averages ½. The ends of an upright body
    /// are not part of the area the engine counts.
    pub const OPEN: ViewFactors = ViewFactors {
        sky: 0.5,
        ground: 0.5,
    };

    /// A typed share of sky (a body under a canopy, beside a wall); the rest is ground (or
    /// anything at the ground's temperature). `sky` 0–1; errors outside it or non-finite.
    pub fn with_sky(sky: f64) -> Result<ViewFactors, EngineError> {
        within(
            keys::SKY_VIEW,
            "sky view factor",
            sky,
            0.0,
            1.0,
            "",
            "a view factor lies between 0 and 1",
        )?;
        Ok(ViewFactors {
            sky,
            ground: 1.0 - sky,
        })
    }
}

/// The one surroundings temperature T_r, K, that gives the existing surface balance the same
/// net long-wave exchange as the sky and the ground together:
///
/// σ(Ts⁴ − T_r⁴) = F_sky·σ(Ts⁴ − T_sky⁴) + F_gnd·σ(Ts⁴ − T_gnd⁴), so T_r = (F_sky·T_sky⁴ +
/// F_gnd·T_gnd⁴)^¼ with F_sky + F_gnd = 1.
///
/// The surface's own emissivity ε multiplies both sides and cancels: the balance keeps
/// ε·σ(Ts⁴ − T_r⁴) for a grey surface of any ε, with the sky (black at T_sky by the definition
/// of [`sky_temperature`]) and the ground taken as black — the ground's emissivity is 0.9–0.97
/// for soil, grass, concrete and snow, and the sky it reflects is neglected (common practice).
/// T_r does not depend on Ts, so the balance needs no iteration for it.
///
/// `t_sky`, `t_ground` K (> 0). Exactly T_sky when the two are equal. Errors: non-finite, ≤ 0 K.
pub fn radiant_surroundings(
    view: ViewFactors,
    t_sky: f64,
    t_ground: f64,
) -> Result<f64, EngineError> {
    kelvin(Subject::General, "sky temperature", t_sky)?;
    kelvin(
        Subject::Input(keys::GROUND_TEMPERATURE),
        "ground temperature",
        t_ground,
    )?;
    if t_sky == t_ground {
        return Ok(t_sky);
    }
    let fourth = |t: f64| {
        let t2 = t * t;
        t2 * t2
    };
    let mean = view.sky * fourth(t_sky) + view.ground * fourth(t_ground);
    crate::engine::error::finite_result("surroundings temperature", mean.sqrt().sqrt())
}

fn clear_emissivity(e: f64) -> Result<f64, EngineError> {
    finite("sky emissivity", e)?;
    if e > 0.0 && e <= 1.0 {
        Ok(e)
    } else {
        Err(undefined(
            Subject::General,
            "sky emissivity",
            e,
            "",
            "a sky emissivity lies above 0 and at most 1",
        ))
    }
}

fn cloud_oktas(oktas: f64) -> Result<f64, EngineError> {
    within(
        keys::CLOUD,
        "cloud cover",
        oktas,
        0.0,
        8.0,
        "okta",
        "cloud cover runs from 0 (clear) to 8 oktas (overcast)",
    )
}

#[cfg(test)]
mod tests {
    use super::*;

    const C0: f64 = 273.15;

    /// Berdahl & Martin's fit, by hand in another arrangement: the constant 0.711 at a dew point
    /// of 0 °C, the polynomial in °C as printed in the 0.0056/0.000 073 form (Duffie & Beckman,
    /// Solar Engineering of Thermal Processes, Eq. 3.9.2, from memory), the diurnal term ±0.013
    /// at midnight and noon and the pressure term zero at 1000 hPa. Printed to 3–4 decimals: 1e-9
    /// covers the arithmetic.
    #[test]
    fn berdahl_martin_hand_values() {
        let bm = |tdp_c: f64, h: f64, p: f64| berdahl_martin(tdp_c + C0, h, p).unwrap().value;
        // 0 °C, 6 h (cos = 0), 1000 hPa: the constant alone.
        assert!((bm(0.0, 6.0, 100_000.0) - 0.711).abs() < 1e-12);
        for tdp in [-20.0, -5.0, 0.0, 10.0, 24.0] {
            let base = 0.711 + 0.0056 * tdp + 0.000_073 * tdp * tdp;
            assert!((bm(tdp, 6.0, 100_000.0) - base).abs() < 1e-9, "{tdp}");
            // Midnight +0.013, noon −0.013.
            assert!((bm(tdp, 0.0, 100_000.0) - (base + 0.013)).abs() < 1e-9);
            assert!((bm(tdp, 12.0, 100_000.0) - (base - 0.013)).abs() < 1e-9);
            // 820 hPa (about 1800 m): −0.0216.
            assert!((bm(tdp, 6.0, 82_000.0) - (base - 0.0216)).abs() < 1e-9);
        }
    }

    /// Swinbank's relation in the sky-temperature form textbooks print, T_sky = 0.0552·T^1.5
    /// (Duffie & Beckman, Solar Engineering of Thermal Processes, Eq. 3.9.1, from memory). The
    /// printed constant is (5.31e-13/σ)^¼ = 0.055 32 cut to three figures, 0.21 % below: the
    /// check holds the transcription of Swinbank's coefficient and of σ to 0.25 %.
    #[test]
    fn swinbank_matches_its_printed_sky_temperature_form() {
        for t in [263.15, 273.15, 288.15, 303.15] {
            let e = swinbank(t).unwrap().value;
            let t_sky = sky_temperature(t, e).unwrap();
            let printed = 0.0552 * t.powf(1.5);
            assert!(
                (t_sky / printed - 1.0).abs() < 2.5e-3,
                "{t}: {t_sky} vs {printed}"
            );
        }
    }

    /// The two clear-sky models agree where both were fitted (typical mid-latitude nights with
    /// the dew point a few kelvin below the air): within 0.03 in emissivity, the scatter of
    /// clear-sky models against measurement (about 0.02–0.05, common practice).
    #[test]
    fn berdahl_martin_and_swinbank_agree_on_ordinary_nights() {
        for (ta, tdp) in [(15.0, 10.0), (5.0, 0.0), (20.0, 12.0), (25.0, 18.0)] {
            let bm = berdahl_martin(tdp + C0, 0.0, 101_325.0).unwrap().value;
            let sw = swinbank(ta + C0).unwrap().value;
            assert!((bm - sw).abs() < 0.03, "{ta} {tdp}: {bm} {sw}");
        }
    }

    /// A clear winter night sky is 20–30 K below the air (issue #19; common practice).
    #[test]
    fn a_clear_winter_night_sky_is_20_to_30_k_below_the_air() {
        let s = sky(C0, C0 - 5.0, 2.0, 101_325.0, 0.0).unwrap().value;
        let depression = C0 - s.temperature;
        assert!((20.0..=30.0).contains(&depression), "{depression}");
        assert!((C0 - s.swinbank_temperature - depression).abs() < 5.0);
    }

    /// Clark & Allen's factor by hand: 1 + 0.0224·10 − 0.0035·100 + 0.000 28·1000 = 1.154 for an
    /// overcast sky (10 tenths = 8 oktas), 1 for a clear one, and at 4 oktas (5 tenths)
    /// 1 + 0.112 − 0.0875 + 0.035 = 1.0595.
    #[test]
    fn clark_allen_hand_values() {
        assert_eq!(clark_allen(0.7, 0.0).unwrap(), 0.7);
        assert!((clark_allen(0.7, 8.0).unwrap() - 0.7 * 1.154).abs() < 1e-12);
        assert!((clark_allen(0.7, 4.0).unwrap() - 0.7 * 1.0595).abs() < 1e-12);
        // Capped at 1 for a humid overcast sky.
        assert_eq!(clark_allen(0.9, 8.0).unwrap(), 1.0);
        // Rising with the cover.
        let mut last = 0.0;
        for i in 0..=80 {
            let e = clark_allen(0.7, i as f64 / 10.0).unwrap();
            assert!(e >= last);
            last = e;
        }
    }

    /// Martin & Berdahl's layer form by hand: an overcast (8 oktas) black cloud at the ground
    /// closes the sky to 1; at 2 km, ε = ε0 + (1 − ε0)·e^(−2/8.2).
    #[test]
    fn martin_berdahl_hand_values() {
        assert_eq!(martin_berdahl(0.75, 8.0, 0.0, 1.0).unwrap(), 1.0);
        assert_eq!(martin_berdahl(0.75, 0.0, 500.0, 1.0).unwrap(), 0.75);
        let e = martin_berdahl(0.75, 8.0, 2000.0, 1.0).unwrap();
        assert!((e - (0.75 + 0.25 * 0.783_564_3)).abs() < 1e-7, "{e}");
        assert!(martin_berdahl(0.75, 8.0, -1.0, 1.0).is_err());
        assert!(martin_berdahl(0.75, 8.0, 1.0, 1.5).is_err());
    }

    #[test]
    fn emissivity_one_gives_the_air_temperature_exactly() {
        for t in [233.15, 273.15, 300.0, 318.15] {
            assert_eq!(sky_temperature(t, 1.0).unwrap(), t);
        }
        // And an overcast sky that the cap closes.
        let s = sky(300.0, 299.0, 0.0, 101_325.0, 8.0).unwrap().value;
        assert_eq!(s.emissivity, 1.0);
        assert_eq!(s.temperature, 300.0);
    }

    /// The effective surroundings close the two-part balance: for any surface temperature,
    /// σ(Ts⁴ − Tr⁴) equals F_sky·σ(Ts⁴ − Tsky⁴) + F_gnd·σ(Ts⁴ − Tgnd⁴); by hand for half and
    /// half, 250 K and 280 K: ((3.906 25e9 + 6.146 56e9)/2)^¼ = 266.27 K.
    #[test]
    fn radiant_surroundings_closes_the_two_part_balance() {
        let tr = radiant_surroundings(ViewFactors::OPEN, 250.0, 280.0).unwrap();
        assert!((tr - 266.27).abs() < 0.005, "{tr}");
        for view in [ViewFactors::OPEN, ViewFactors::with_sky(0.3).unwrap()] {
            let tr = radiant_surroundings(view, 240.0, 275.0).unwrap();
            for ts in [250.0f64, 300.0, 400.0] {
                let one = SIGMA * (ts.powi(4) - tr.powi(4));
                let two = view.sky * SIGMA * (ts.powi(4) - 240f64.powi(4))
                    + view.ground * SIGMA * (ts.powi(4) - 275f64.powi(4));
                assert!((one - two).abs() < 1e-9 * two.abs().max(1.0), "{one} {two}");
            }
            assert!(tr > 240.0 && tr < 275.0);
        }
        // Sky and ground at the air temperature: exactly the air temperature.
        assert_eq!(
            radiant_surroundings(ViewFactors::OPEN, 281.3, 281.3).unwrap(),
            281.3
        );
        // All sky or all ground.
        let all_sky = ViewFactors::with_sky(1.0).unwrap();
        assert!((radiant_surroundings(all_sky, 250.0, 280.0).unwrap() - 250.0).abs() < 1e-12);
    }

    #[test]
    fn bad_inputs_are_errors_and_ranges_flag() {
        assert!(berdahl_martin(f64::NAN, 0.0, 1e5).is_err());
        assert!(berdahl_martin(0.0, 0.0, 1e5).is_err());
        assert!(berdahl_martin(280.0, 25.0, 1e5).is_err());
        assert!(berdahl_martin(280.0, 0.0, 0.0).is_err());
        assert!(berdahl_martin(280.0, 0.0, f64::INFINITY).is_err());
        assert!(clark_allen(0.7, 8.5).is_err());
        assert!(clark_allen(0.7, -0.1).is_err());
        assert!(clark_allen(1.2, 1.0).is_err());
        assert!(oktas_from_fraction(1.1).is_err());
        assert_eq!(oktas_from_fraction(0.5).unwrap(), 4.0);
        assert!(sky(280.0, 281.0, 0.0, 1e5, 0.0).is_err());
        assert!(ViewFactors::with_sky(-0.1).is_err());
        assert!(radiant_surroundings(ViewFactors::OPEN, 250.0, -1.0).is_err());
        // A dew point of −40 °C is computed and flagged.
        let f = berdahl_martin(233.15, 0.0, 1e5).unwrap();
        assert_eq!(f.flags.len(), 1);
        assert!(f.flags[0].message().contains(BERDAHL_MARTIN));
        assert!(swinbank(320.0).unwrap().flags.len() == 1);
    }
}
