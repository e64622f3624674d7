//! The wind at the body: a reading carried to the body's height and terrain, and the angle it
//! makes with the body's axis.
//!
//! A weather station or forecast gives the mean wind at 10 m over open, level ground; a pipe on
//! a 3 m rack among tanks sees less. EN 1991-1-4 carries the basic wind to any height over each
//! of five terrain categories by a logarithmic profile; the same profile carries a reading back
//! to the basic wind. Wind along a cylinder cools it less than wind across it: the yaw factor.
//!
//! Units: speeds m/s, heights and roughness lengths m, angles degrees.

use super::{finite, keys, undefined};
use crate::engine::error::{finite_result, EngineError, Subject};
use crate::engine::validity::{Flagged, Range};

pub const EN_1991_1_4: &str = "EN 1991-1-4 §4.3.2";

/// The terrain categories of EN 1991-1-4:2005, Table 4.1.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum Terrain {
    /// 0: sea or coastal area exposed to the open sea.
    Sea,
    /// I: lakes or flat, level country with negligible vegetation and no obstacles.
    Flat,
    /// II: low vegetation such as grass, isolated obstacles (trees, buildings) at least 20
    /// obstacle heights apart — the open terrain of weather stations.
    Open,
    /// III: regular cover of vegetation or buildings, or isolated obstacles at most 20 obstacle
    /// heights apart (villages, suburbs, permanent forest; a plant among tanks and pipe racks).
    Suburban,
    /// IV: at least 15 % of the surface covered by buildings averaging more than 15 m high.
    Urban,
}

impl Terrain {
    pub const ALL: [Terrain; 5] = [
        Terrain::Sea,
        Terrain::Flat,
        Terrain::Open,
        Terrain::Suburban,
        Terrain::Urban,
    ];

    /// The category as the standard numbers it.
    pub fn category(self) -> &'static str {
        match self {
            Terrain::Sea => "0",
            Terrain::Flat => "I",
            Terrain::Open => "II",
            Terrain::Suburban => "III",
            Terrain::Urban => "IV",
        }
    }

    /// Roughness length z0, m (Table 4.1).
    pub fn z0(self) -> f64 {
        match self {
            Terrain::Sea => 0.003,
            Terrain::Flat => 0.01,
            Terrain::Open => 0.05,
            Terrain::Suburban => 0.3,
            Terrain::Urban => 1.0,
        }
    }

    /// Minimum height z_min, m (Table 4.1): below it the profile is held at its value there.
    pub fn z_min(self) -> f64 {
        match self {
            Terrain::Sea | Terrain::Flat => 1.0,
            Terrain::Open => 2.0,
            Terrain::Suburban => 5.0,
            Terrain::Urban => 10.0,
        }
    }

    /// Terrain factor k_r = 0.19·(z0/z0,II)^0.07, z0,II = 0.05 m (Eq. 4.5).
    pub fn k_r(self) -> f64 {
        0.19 * (self.z0() / 0.05).powf(0.07)
    }
}

/// The top of the profile, m (EN 1991-1-4 §4.3.2: z_max = 200 m).
pub const PROFILE_HEIGHT: Range = Range {
    quantity: "height",
    lo: 0.0,
    hi: 200.0,
    unit: "m",
    source: EN_1991_1_4,
};

/// A height above a terrain: where a wind is read or a body stands.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Exposure {
    /// Above the ground, m.
    pub height: f64,
    pub terrain: Terrain,
}

/// A weather station's or forecast's wind: 10 m over open terrain (WMO's standard exposure;
/// EN 1991-1-4's basic wind is defined there too).
pub const STATION: Exposure = Exposure {
    height: 10.0,
    terrain: Terrain::Open,
};

/// The roughness factor c_r(z) of EN 1991-1-4:2005 Eq. (4.4): c_r = k_r·ln(z/z0) for
/// z_min ≤ z ≤ z_max, and c_r(z_min) below z_min (dimensionless; the ratio of the mean wind at
/// z to the basic wind, with the orography factor c_o = 1: level ground).
///
/// `key` names the height's field in an error. Flagged above z_max = 200 m (the logarithmic
/// profile is extrapolated). Errors: a non-finite height, or one at or below the roughness
/// length z0 (the profile is not defined there: the body sits inside the roughness itself; EN's
/// z_min rule would give it the speed at z_min, but a height the user typed as lower than z0 is
/// taken as a mistake).
pub fn roughness_factor(at: Exposure, key: &'static str) -> Result<Flagged<f64>, EngineError> {
    let z = finite("height above ground", at.height)?;
    let z0 = at.terrain.z0();
    if z <= z0 {
        return Err(undefined(
            Subject::Input(key),
            "height above ground",
            z,
            "m",
            "at or below the terrain's roughness length z0: the wind profile is not defined there",
        ));
    }
    let c_r = at.terrain.k_r() * (z.max(at.terrain.z_min()) / z0).ln();
    let mut out = Flagged::new(c_r);
    out.check(EN_1991_1_4, &PROFILE_HEIGHT, z);
    Ok(out)
}

/// The mean wind at the body, m/s, from a reading: v = reading·c_r(body)/c_r(reading's place),
/// both by [`roughness_factor`] — the reading taken back to EN 1991-1-4's basic wind and carried
/// to the body's height over its terrain (Eqs. 4.3–4.5, c_o = 1).
///
/// - `reading`: m/s, ≥ 0 (a 10-minute mean, as the standard's profile is).
/// - `station`: where it was read ([`STATION`] for a weather report); `body`: where the body is.
///
/// Exactly the reading when the two exposures are the same. Flags of either height kept.
/// Errors: a non-finite or negative reading, a height as in [`roughness_factor`].
pub fn speed_at(
    reading: f64,
    station: Exposure,
    body: Exposure,
) -> Result<Flagged<f64>, EngineError> {
    finite("wind reading", reading)?;
    if reading < 0.0 {
        return Err(undefined(
            Subject::Input(keys::WIND_READING),
            "wind reading",
            reading,
            "m/s",
            "a wind speed cannot be negative",
        ));
    }
    let at_station = roughness_factor(station, keys::STATION_HEIGHT)?;
    let at_body = roughness_factor(body, keys::BODY_HEIGHT)?;
    let ratio = at_body.value / at_station.value;
    let mut out = Flagged::new(finite_result("wind at the body", reading * ratio)?);
    out.flags.extend(at_station.flags);
    out.flags.extend(at_body.flags);
    Ok(out)
}

/// Which yaw relation the engine uses.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Yaw {
    /// Morgan's relation as CIGRE TB 601 gives it for smooth conductors: [`yaw_morgan`].
    Morgan,
    /// IEEE Std 738's wind direction factor: [`yaw_ieee738`].
    Ieee738,
}

pub const MORGAN: &str = "Morgan, as in CIGRE TB 601 (2014)";
pub const IEEE_738: &str = "IEEE Std 738-2012";

/// The engine's yaw relation: Morgan's, for three reasons. (1) Leeward's bodies are smooth
/// (pipes, jackets, rods, cladding) and TB 601 gives Morgan's form for smooth conductors, while
/// IEEE 738's factor (and TB 601's other forms) are written for stranded overhead conductors.
/// (2) Heat transfer must be an even, smooth function of the angle about 90° (wind from either
/// side of square is the same wind): Morgan's form has zero slope at 90°, IEEE's has a slope of
/// 0.264 per radian there, a kink when mirrored. (3) Both give the same at the parallel end
/// (0.399 against 0.388) and differ by at most 0.034 anywhere, so the choice never decides a
/// verdict. IEEE's factor is kept as the cross-check ([`yaw_factors`]).
pub const RECOMMENDED_YAW: Yaw = Yaw::Morgan;

/// The yaw factor the engine applies, by [`RECOMMENDED_YAW`].
pub fn yaw_factor(angle: f64) -> Result<f64, EngineError> {
    match RECOMMENDED_YAW {
        Yaw::Morgan => yaw_morgan(angle),
        Yaw::Ieee738 => yaw_ieee738(angle),
    }
}

/// Both yaw factors: (recommended, cross-check).
pub fn yaw_factors(angle: f64) -> Result<(f64, f64), EngineError> {
    Ok((yaw_morgan(angle)?, yaw_ieee738(angle)?))
}

/// Morgan's yaw relation for the forced-convection Nusselt number of a smooth cylinder at an
/// angle of attack δ between the wind and the axis, as CIGRE Technical Brochure 601, "Guide for
/// thermal rating calculations of overhead lines" (2014), Eq. (21) with Table 4 gives it for
/// smooth conductors (V. T. Morgan, "The overall convective heat transfer from smooth circular
/// cylinders", Adv. Heat Transfer 11 (1975) 199–264):
///
/// Nu_δ/Nu_90 = (sin²δ + 0.0169·cos²δ)^0.225
///
/// The brochure was not read here: the form and its constants are as the `linerate` library's
/// implementation of TB 601 transcribes them (cross-checked against IEEE 738 and TB 207 in the
/// tests). Multiply the forced-convection Nu (or h) at the full wind speed; it applies to
/// cylinders and long bars, not to a sphere or an upright body in a level wind.
///
/// `angle`: degrees, any finite value (reduced to 0–90°: the axis is a line, so δ, −δ and
/// 180° − δ are the same wind). Exactly 1 at 90°; 0.399 along the axis. Errors: non-finite.
pub fn yaw_morgan(angle: f64) -> Result<f64, EngineError> {
    let (sin_d, cos_d) = reduced(angle)?;
    Ok((sin_d * sin_d + 0.0169 * cos_d * cos_d).powf(0.225))
}

/// IEEE Std 738-2012, "Standard for calculating the current–temperature relationship of bare
/// overhead conductors", Eq. (4a), the wind direction factor:
///
/// K_angle = 1.194 − cos φ + 0.194·cos 2φ + 0.368·sin 2φ
///
/// φ the angle between the wind and the conductor axis (equation number as the `linerate`
/// library cites it; the standard itself not read here). Evaluated in the algebraically equal
/// form 1 − cos φ·(1 − 0.388·cos φ − 0.736·sin φ) (1.194 + 0.194·cos 2φ = 1 + 0.388·cos²φ), which
/// is exactly 1 at 90°. Fitted for stranded conductors; the cross-check of [`yaw_morgan`].
///
/// `angle`: degrees, any finite value (reduced to 0–90°). 0.388 along the axis. Errors:
/// non-finite.
pub fn yaw_ieee738(angle: f64) -> Result<f64, EngineError> {
    let (sin_p, cos_p) = reduced(angle)?;
    Ok(1.0 - cos_p * (1.0 - 0.388 * cos_p - 0.736 * sin_p))
}

/// Sine and cosine of the angle reduced to 0–90°, with cos exactly 0 and sin exactly 1 at 90°.
fn reduced(angle: f64) -> Result<(f64, f64), EngineError> {
    let a = finite("wind angle to the axis", angle)?.abs() % 180.0;
    let a = if a > 90.0 { 180.0 - a } else { a };
    // Through the angle from square to the axis, which is exactly 0 at 90°.
    let (sin_off, cos_off) = (90.0 - a).to_radians().sin_cos();
    Ok((cos_off, sin_off))
}

#[cfg(test)]
mod tests {
    use super::*;

    fn at(height: f64, terrain: Terrain) -> Exposure {
        Exposure { height, terrain }
    }

    /// EN 1991-1-4 Eq. (4.5), k_r by category, as design guides tabulate it (from memory):
    /// 0.156, 0.170, 0.190, 0.215, 0.234, to 3 decimals.
    #[test]
    fn terrain_factors_as_tabulated() {
        let printed = [0.156, 0.170, 0.190, 0.215, 0.234];
        for (t, k) in Terrain::ALL.iter().zip(printed) {
            assert!((t.k_r() - k).abs() <= 0.0005, "{:?}: {}", t, t.k_r());
        }
    }

    /// Hand values of Eq. (4.4) with common logarithms (ln x = 2.302 585·log₁₀ x):
    /// c_r(10 m, II) = 0.19·2.302 585·log₁₀ 200 = 1.0067; a 5 m/s reading carried to a 3 m rack
    /// in terrain III (below z_min = 5 m, so at 5 m): 5·0.2154·2.302 585·log₁₀(5/0.3)/1.0067 =
    /// 3.010 m/s; to 30 m over the sea: 5·0.1560·2.302 585·log₁₀(10 000)/1.0067 = 7.14 m/s.
    #[test]
    fn profile_hand_values() {
        let ln = |x: f64| std::f64::consts::LN_10 * x.log10();
        let c_ii = 0.19 * ln(200.0);
        let c = roughness_factor(STATION, "x").unwrap().value;
        assert!((c - c_ii).abs() < 1e-12 && (c - 1.0067).abs() < 5e-5);
        let k3 = 0.19 * 6f64.powf(0.07);
        let v = speed_at(5.0, STATION, at(3.0, Terrain::Suburban)).unwrap();
        assert!(v.flags.is_empty());
        assert!((v.value - 5.0 * k3 * ln(5.0 / 0.3) / c_ii).abs() < 1e-9);
        assert!((v.value - 3.010).abs() < 5e-4, "{}", v.value);
        let k0 = 0.19 * 0.06f64.powf(0.07);
        let v = speed_at(5.0, STATION, at(30.0, Terrain::Sea))
            .unwrap()
            .value;
        assert!((v - 5.0 * k0 * ln(10_000.0) / c_ii).abs() < 1e-9);
        assert!((v - 7.14).abs() < 0.005, "{v}");
    }

    #[test]
    fn a_reading_at_its_own_place_is_the_reading() {
        for r in [0.0, 0.7, 5.0, 33.3] {
            assert_eq!(speed_at(r, STATION, STATION).unwrap().value, r);
            let rack = at(3.0, Terrain::Suburban);
            assert_eq!(speed_at(r, rack, rack).unwrap().value, r);
        }
    }

    #[test]
    fn below_z_min_the_speed_is_held_and_at_z0_it_is_an_error() {
        let v = |z: f64| speed_at(4.0, STATION, at(z, Terrain::Urban)).unwrap().value;
        assert_eq!(v(1.5), v(10.0));
        assert_eq!(v(9.99), v(10.0));
        assert!(v(12.0) > v(10.0));
        match speed_at(4.0, STATION, at(1.0, Terrain::Urban)) {
            Err(EngineError::Undefined { subject, value, .. }) => {
                assert_eq!(subject, Subject::Input(keys::BODY_HEIGHT));
                assert_eq!(value, 1.0);
            }
            other => panic!("{other:?}"),
        }
        match speed_at(4.0, at(0.02, Terrain::Open), STATION) {
            Err(EngineError::Undefined { subject, .. }) => {
                assert_eq!(subject, Subject::Input(keys::STATION_HEIGHT))
            }
            other => panic!("{other:?}"),
        }
        assert!(speed_at(4.0, STATION, at(-3.0, Terrain::Sea)).is_err());
        assert!(speed_at(-1.0, STATION, STATION).is_err());
        assert!(speed_at(f64::NAN, STATION, STATION).is_err());
        assert!(speed_at(1.0, STATION, at(f64::INFINITY, Terrain::Sea)).is_err());
        // Above 200 m: computed and flagged.
        let high = speed_at(4.0, STATION, at(300.0, Terrain::Open)).unwrap();
        assert_eq!(high.flags.len(), 1);
        assert!(high.value > 4.0);
    }

    /// Every category slows the wind near the ground relative to the sea, and rougher terrain
    /// slows it more at the same height (EN 1991-1-4 Fig. 4.2's ordering).
    #[test]
    fn rougher_terrain_is_slower() {
        for z in [2.0, 5.0, 10.0, 20.0, 50.0] {
            let speeds: Vec<f64> = Terrain::ALL
                .iter()
                .map(|&t| speed_at(10.0, STATION, at(z, t)).unwrap().value)
                .collect();
            for w in speeds.windows(2) {
                assert!(w[0] > w[1], "{z}: {speeds:?}");
            }
        }
    }

    #[test]
    fn square_to_the_axis_is_exactly_one() {
        for a in [90.0, -90.0, 270.0, 450.0] {
            assert_eq!(yaw_morgan(a).unwrap(), 1.0);
            assert_eq!(yaw_ieee738(a).unwrap(), 1.0);
            assert_eq!(yaw_factor(a).unwrap(), 1.0);
        }
    }

    /// IEEE 738's printed form, 1.194 − cos φ + 0.194 cos 2φ + 0.368 sin 2φ, evaluated as
    /// printed (in radians, double angles) against the engine's rearrangement, every 0.5°; and
    /// its parallel value 1.194 − 1 + 0.194 = 0.388.
    #[test]
    fn ieee738_matches_its_printed_form() {
        for i in 0..=180 {
            let phi = i as f64 * 0.5;
            let p = phi.to_radians();
            let printed = 1.194 - p.cos() + 0.194 * (2.0 * p).cos() + 0.368 * (2.0 * p).sin();
            assert!((yaw_ieee738(phi).unwrap() - printed).abs() < 1e-12, "{phi}");
        }
        assert!((yaw_ieee738(0.0).unwrap() - 0.388).abs() < 1e-12);
    }

    /// Morgan's relation along the axis: 0.0169^0.225 = e^(0.225·ln 0.0169) = 0.3993; at 45°
    /// (0.508 45)^0.225 = 0.8588 — by hand.
    #[test]
    fn morgan_hand_values() {
        assert!((yaw_morgan(0.0).unwrap() - 0.3993).abs() < 5e-5);
        assert!((yaw_morgan(45.0).unwrap() - 0.8588).abs() < 5e-5);
    }

    /// The published yaw relations agree within their spread: Morgan's against IEEE 738's, and
    /// against CIGRE TB 207's for stranded conductors, 0.42 + 0.68·sin^1.08 δ (δ ≤ 24°) and
    /// 0.42 + 0.58·sin^0.90 δ (above) (CIGRE TB 207 (2002), as the `linerate` library
    /// transcribes it) — within 0.04 at every degree, both rising from about 0.4 to 1.
    #[test]
    fn the_published_yaw_relations_agree_within_their_spread() {
        let mut last = 0.0;
        for i in 0..=90 {
            let d = i as f64;
            let s = d.to_radians().sin();
            let tb207 = if d <= 24.0 {
                0.42 + 0.68 * s.powf(1.08)
            } else {
                0.42 + 0.58 * s.powf(0.90)
            };
            let (m, ieee) = yaw_factors(d).unwrap();
            assert!((m - ieee).abs() < 0.04, "{d}: {m} {ieee}");
            assert!((m - tb207).abs() < 0.04, "{d}: {m} {tb207}");
            assert!(m >= last, "Morgan's rises monotonically");
            last = m;
        }
    }

    #[test]
    fn the_axis_is_a_line_and_bad_angles_are_errors() {
        for a in [0.0, 10.0, 37.5, 66.0, 89.0] {
            let m = yaw_morgan(a).unwrap();
            for b in [-a, 180.0 - a, 180.0 + a, 360.0 - a, a + 720.0] {
                assert!((yaw_morgan(b).unwrap() - m).abs() < 1e-12, "{a} {b}");
                let i = yaw_ieee738(a).unwrap();
                assert!((yaw_ieee738(b).unwrap() - i).abs() < 1e-12);
            }
        }
        assert!(yaw_morgan(f64::NAN).is_err());
        assert!(yaw_ieee738(f64::NEG_INFINITY).is_err());
        assert!(yaw_morgan(1e300).unwrap().is_finite());
    }
}
