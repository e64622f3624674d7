//! Where the sun is: NREL's Solar Position Algorithm.
//!
//! I. Reda and A. Andreas, "Solar position algorithm for solar radiation applications", Solar
//! Energy 76 (2004) 577–589; the step-by-step form with its tables and test case is NREL
//! technical report NREL/TP-560-34302 (revised January 2008). Stated uncertainty ±0.0003° in
//! zenith and azimuth for the years −2000 to 6000. The comments `§3.n` and `Eq. n` below follow
//! the report's numbering.
//!
//! Inputs here are a UTC date and time (UT1 − UTC, at most 0.9 s, is neglected: ≤ 0.004° in the
//! hour angle), the site's latitude (degrees, north positive), longitude (degrees, east
//! positive) and elevation (m), and the air's pressure (Pa) and temperature (K) for the
//! refraction. Outputs in degrees; the azimuth is measured eastward from north.

use super::sun_tables::{
    B0, B1, L0, L1, L2, L3, L4, L5, NUTATION_ABCD, NUTATION_Y, R0, R1, R2, R3, R4,
};
use super::{finite, kelvin, keys, limit_degrees, pressure_pa, sin_cos_deg, undefined, within};
use crate::engine::error::{finite_result, EngineError, Subject};
use crate::engine::validity::{Flagged, Range};

pub const SPA: &str = "NREL SPA (Reda & Andreas 2004)";

/// The years the SPA's uncertainty is stated for.
pub const SPA_YEARS: Range = Range {
    quantity: "year",
    lo: -2000.0,
    hi: 6000.0,
    unit: "",
    source: "Reda & Andreas (2004)",
};

/// ΔT = TT − UT the report's code accepts, s (spa.c's input check).
pub const SPA_DELTA_T: Range = Range {
    quantity: "ΔT",
    lo: -8000.0,
    hi: 8000.0,
    unit: "s",
    source: "Reda & Andreas (2004), NREL spa.c",
};

/// ΔT = TT − UT1 at present, s: 32.184 s + (TAI − UTC = 37 s since 2017) − (UT1 − UTC, within
/// ±0.9 s) = 69.2 ± 0.9 s while no leap second is added. One second of error moves the sun by
/// 0.000 01°: any value within a minute of the truth is exact enough here.
pub const DELTA_T_NOW: f64 = 69.2;

/// The apparent radius of the sun and the refraction at the horizon, degrees: the report's
/// refraction (Eq. 42) is applied while the sun's upper limb can still be seen, e0 ≥ −(0.26667
/// + 0.5667)°, as NREL's spa.c does (Eq. 42 alone diverges near e0 = −5.11°).
const SUN_RADIUS: f64 = 0.26667;
const HORIZON_REFRACTION: f64 = 0.5667;

/// A date and time in UTC (proleptic Gregorian after 1582-10-15, Julian before, as the report's
/// Julian-day formula, Eq. 4).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Utc {
    pub year: i32,
    /// 1–12.
    pub month: u32,
    /// 1 to the month's length.
    pub day: u32,
    /// 0–23.
    pub hour: u32,
    /// 0–59.
    pub minute: u32,
    /// 0 ≤ s < 60.
    pub second: f64,
}

/// Where the observer stands.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Site {
    /// Degrees, −90 (south pole) to 90, north positive.
    pub latitude: f64,
    /// Degrees, −180 to 180, east of Greenwich positive.
    pub longitude: f64,
    /// Above sea level, m.
    pub elevation: f64,
}

/// The air the sunlight is refracted through: site pressure, Pa, and temperature, K (annual
/// means serve: they move the refraction, which is itself at most 0.6°).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Air {
    pub pressure: f64,
    pub temperature: f64,
}

/// The sun seen from the site.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SunPosition {
    /// Topocentric zenith angle with refraction, degrees (0 overhead, 90 on the horizon, above
    /// 90 below it).
    pub zenith: f64,
    /// Topocentric azimuth, degrees eastward from north (0–360).
    pub azimuth: f64,
    /// Elevation above the horizon with refraction, degrees: 90 − zenith.
    pub elevation: f64,
    /// Elevation without refraction, degrees.
    pub elevation_geometric: f64,
    /// Topocentric declination, degrees.
    pub declination: f64,
    /// Topocentric local hour angle, degrees (0–360, 0 at the meridian, growing westward).
    pub hour_angle: f64,
    /// Earth–sun distance, AU.
    pub distance: f64,
    /// Julian day (UT) of the instant.
    pub julian_day: f64,
}

/// The sun's position by NREL's SPA (Reda & Andreas 2004), §3.1–3.15.
///
/// - `t`: the instant, UTC.
/// - `site`: latitude −90–90°, longitude −180–180°, elevation m (finite).
/// - `air`: pressure Pa (> 0) and temperature K (> 0), for the refraction (Eq. 42).
/// - `delta_t`: TT − UT, s ([`DELTA_T_NOW`] for the present).
///
/// Flagged for a year outside −2000–6000 or ΔT outside ±8000 s (computed all the same).
/// Errors: a non-finite input; a month, day, hour, minute or second that is not on the clock or
/// calendar; latitude or longitude outside their domains; pressure or temperature ≤ 0.
pub fn position(
    t: &Utc,
    site: &Site,
    air: &Air,
    delta_t: f64,
) -> Result<Flagged<SunPosition>, EngineError> {
    let day_fraction = check_instant(t)?;
    let lat = within(
        keys::LATITUDE,
        "latitude",
        site.latitude,
        -90.0,
        90.0,
        "°",
        "a latitude lies between −90° and 90°",
    )?;
    let lon = within(
        keys::LONGITUDE,
        "longitude",
        site.longitude,
        -180.0,
        180.0,
        "°",
        "a longitude lies between −180° and 180°",
    )?;
    let elevation = finite("site elevation", site.elevation)?;
    pressure_pa(air.pressure)?;
    kelvin(
        Subject::Input(keys::AIR_TEMPERATURE),
        "air temperature",
        air.temperature,
    )?;
    finite("ΔT", delta_t)?;

    // §3.1: Julian day, century and millennium (Eqs. 4–9).
    let jd = julian_day(t.year, t.month, t.day as f64 + day_fraction);
    let jde = jd + delta_t / 86_400.0;
    let jc = (jd - 2_451_545.0) / 36_525.0;
    let jce = (jde - 2_451_545.0) / 36_525.0;
    let jme = jce / 10.0;

    let g = geocentric(jme, jce);

    // §3.8: apparent sidereal time at Greenwich (Eqs. 28–29).
    let nu0 = limit_degrees(
        280.460_618_37 + 360.985_647_366_29 * (jd - 2_451_545.0) + 0.000_387_933 * jc * jc
            - jc * jc * jc / 38_710_000.0,
    );
    let nu = nu0 + g.delta_psi * g.epsilon.to_radians().cos();

    // §3.9–3.10: geocentric right ascension and declination (Eqs. 30–31).
    let (sin_lam, cos_lam) = sin_cos_deg(g.lambda);
    let (sin_eps, cos_eps) = sin_cos_deg(g.epsilon);
    let (sin_beta, cos_beta) = sin_cos_deg(g.beta);
    let alpha = limit_degrees(
        (sin_lam * cos_eps - sin_beta / cos_beta * sin_eps)
            .atan2(cos_lam)
            .to_degrees(),
    );
    let delta = (sin_beta * cos_eps + cos_beta * sin_eps * sin_lam)
        .asin()
        .to_degrees();

    // §3.11: observer local hour angle (Eq. 32).
    let h = limit_degrees(nu + lon - alpha);

    // §3.12: topocentric right ascension (Eqs. 33–38).
    let xi = 8.794 / (3600.0 * g.r);
    let (sin_lat, cos_lat) = sin_cos_deg(lat);
    let u = (0.996_647_19 * sin_lat / cos_lat).atan();
    let x = u.cos() + elevation / 6_378_140.0 * cos_lat;
    let y = 0.996_647_19 * u.sin() + elevation / 6_378_140.0 * sin_lat;
    let (sin_xi, _) = sin_cos_deg(xi);
    let (sin_h, cos_h) = sin_cos_deg(h);
    let (sin_delta, cos_delta) = sin_cos_deg(delta);
    let d_alpha = (-x * sin_xi * sin_h)
        .atan2(cos_delta - x * sin_xi * cos_h)
        .to_degrees();
    // Eq. 39: topocentric declination.
    let (_, cos_d_alpha) = sin_cos_deg(d_alpha);
    let delta_prime = ((sin_delta - y * sin_xi) * cos_d_alpha)
        .atan2(cos_delta - x * sin_xi * cos_h)
        .to_degrees();
    // §3.13: topocentric local hour angle (Eq. 40).
    let h_prime = h - d_alpha;

    // §3.14: topocentric zenith angle (Eqs. 41–44).
    let (sin_dp, cos_dp) = sin_cos_deg(delta_prime);
    let (sin_hp, cos_hp) = sin_cos_deg(h_prime);
    let e0 = (sin_lat * sin_dp + cos_lat * cos_dp * cos_hp)
        .clamp(-1.0, 1.0)
        .asin()
        .to_degrees();
    let p_mbar = air.pressure / 100.0;
    let t_c = air.temperature - 273.15;
    let refraction = if e0 >= -(SUN_RADIUS + HORIZON_REFRACTION) {
        let arg = (e0 + 10.3 / (e0 + 5.11)).to_radians();
        (p_mbar / 1010.0) * (283.0 / (273.0 + t_c)) * 1.02 / (60.0 * arg.tan())
    } else {
        0.0
    };
    let e = e0 + refraction;
    let zenith = 90.0 - e;

    // §3.15: topocentric azimuth (Eqs. 45–46).
    let gamma = limit_degrees(
        sin_hp
            .atan2(cos_hp * sin_lat - sin_dp / cos_dp * cos_lat)
            .to_degrees(),
    );
    let azimuth = limit_degrees(gamma + 180.0);

    let position = SunPosition {
        zenith: finite_result("solar zenith angle", zenith)?,
        azimuth: finite_result("solar azimuth", azimuth)?,
        elevation: finite_result("solar elevation", e)?,
        elevation_geometric: finite_result("solar elevation", e0)?,
        declination: finite_result("solar declination", delta_prime)?,
        hour_angle: finite_result("hour angle", limit_degrees(h_prime))?,
        distance: finite_result("earth–sun distance", g.r)?,
        julian_day: jd,
    };
    let mut out = Flagged::new(position);
    out.check(SPA, &SPA_YEARS, t.year as f64);
    out.check(SPA, &SPA_DELTA_T, delta_t);
    Ok(out)
}

/// The calendar and clock checks; the time of day as a fraction of the day.
fn check_instant(t: &Utc) -> Result<f64, EngineError> {
    let date_error = |quantity: &'static str, value: f64, why: &'static str| {
        Err(undefined(
            Subject::Input(keys::DATE),
            quantity,
            value,
            "",
            why,
        ))
    };
    if !(1..=12).contains(&t.month) {
        return date_error("month", t.month as f64, "a month runs from 1 to 12");
    }
    if t.day < 1 || t.day > days_in_month(t.year, t.month) {
        return date_error("day", t.day as f64, "that month has no such day");
    }
    let time_error = |quantity: &'static str, value: f64, why: &'static str| {
        Err(undefined(
            Subject::Input(keys::TIME),
            quantity,
            value,
            "",
            why,
        ))
    };
    if t.hour > 23 {
        return time_error("hour", t.hour as f64, "an hour runs from 0 to 23");
    }
    if t.minute > 59 {
        return time_error("minute", t.minute as f64, "a minute runs from 0 to 59");
    }
    finite("second", t.second)?;
    if !(t.second >= 0.0 && t.second < 60.0) {
        return time_error("second", t.second, "a second runs from 0 to below 60");
    }
    Ok((t.hour as f64 + (t.minute as f64 + t.second / 60.0) / 60.0) / 24.0)
}

fn days_in_month(year: i32, month: u32) -> u32 {
    // The Gregorian rule from 1583, the Julian (every fourth year) before, as Eq. 4 switches.
    let leap = if year > 1582 {
        (year % 4 == 0 && year % 100 != 0) || year % 400 == 0
    } else {
        year.rem_euclid(4) == 0
    };
    match month {
        4 | 6 | 9 | 11 => 30,
        2 if leap => 29,
        2 => 28,
        _ => 31,
    }
}

/// Eq. 4: the Julian day of a calendar date, `day` with its fraction (UT). INT truncates toward
/// zero, as the report defines it.
fn julian_day(year: i32, month: u32, day: f64) -> f64 {
    let (mut y, mut m) = (year as f64, month as f64);
    if m < 3.0 {
        y -= 1.0;
        m += 12.0;
    }
    let jd = (365.25 * (y + 4716.0)).trunc() + (30.600_1 * (m + 1.0)).trunc() + day - 1524.5;
    if jd > 2_299_160.0 {
        let a = (y / 100.0).trunc();
        jd + 2.0 - a + (a / 4.0).trunc()
    } else {
        jd
    }
}

/// The sun's geocentric position at an instant (§3.3–3.7).
#[derive(Debug, Clone, Copy)]
struct Geocentric {
    /// Earth radius vector, AU.
    r: f64,
    /// Geocentric latitude β, degrees.
    beta: f64,
    /// Nutation in longitude, degrees.
    delta_psi: f64,
    /// True obliquity of the ecliptic, degrees.
    epsilon: f64,
    /// Apparent sun longitude, degrees.
    lambda: f64,
}

/// Σ A·cos(B + C·JME) over one table (Eq. 10).
fn series(terms: &[[f64; 3]], jme: f64) -> f64 {
    terms.iter().map(|[a, b, c]| a * (b + c * jme).cos()).sum()
}

/// (X0 + X1·JME + X2·JME² + …)/10⁸ (Eq. 11 and its counterparts for B and R).
fn poly_series(tables: &[&[[f64; 3]]], jme: f64) -> f64 {
    tables
        .iter()
        .rev()
        .fold(0.0, |acc, t| acc * jme + series(t, jme))
        / 1e8
}

/// A cubic in JCE, as the fundamental arguments of Eqs. 15–19 are written.
fn cubic(c0: f64, c1: f64, c2: f64, inv_c3: f64, jce: f64) -> f64 {
    c0 + jce * (c1 + jce * (c2 + jce / inv_c3))
}

/// §3.2: the Earth's heliocentric longitude and latitude, degrees, and radius vector, AU
/// (Eqs. 10–13).
fn heliocentric(jme: f64) -> (f64, f64, f64) {
    let l = limit_degrees(poly_series(&[&L0, &L1, &L2, &L3, &L4, &L5], jme).to_degrees());
    let b = poly_series(&[&B0, &B1], jme).to_degrees();
    let r = poly_series(&[&R0, &R1, &R2, &R3, &R4], jme);
    (l, b, r)
}

/// §3.4: nutation in longitude and obliquity, degrees (Eqs. 15–23). X0 mean elongation of the
/// moon from the sun, X1 mean anomaly of the sun, X2 of the moon, X3 the moon's argument of
/// latitude, X4 the longitude of its ascending node, degrees.
fn nutation(jce: f64) -> (f64, f64) {
    let x = [
        cubic(297.850_36, 445_267.111_480, -0.001_914_2, 189_474.0, jce),
        cubic(357.527_72, 35_999.050_340, -0.000_160_3, -300_000.0, jce),
        cubic(134.962_98, 477_198.867_398, 0.008_697_2, 56_250.0, jce),
        cubic(93.271_91, 483_202.017_538, -0.003_682_5, 327_270.0, jce),
        cubic(125.044_52, -1_934.136_261, 0.002_070_8, 450_000.0, jce),
    ];
    let (mut dpsi, mut deps) = (0.0, 0.0);
    for (y, [a, b, c, d]) in NUTATION_Y.iter().zip(NUTATION_ABCD.iter()) {
        let arg: f64 = x.iter().zip(y.iter()).map(|(xj, yj)| xj * yj).sum();
        let (s, co) = arg.to_radians().sin_cos();
        dpsi += (a + b * jce) * s;
        deps += (c + d * jce) * co;
    }
    (dpsi / 36_000_000.0, deps / 36_000_000.0)
}

/// §3.5: the true obliquity of the ecliptic, degrees (Eqs. 24–26): U = JME/10, ε0 in arc
/// seconds, ε = ε0/3600 + Δε.
fn obliquity(jme: f64, delta_eps: f64) -> f64 {
    let u = jme / 10.0;
    let eps0 = [
        84_381.448, -4_680.93, -1.55, 1_999.25, -51.38, -249.67, -39.05, 7.12, 27.87, 5.79, 2.45,
    ]
    .iter()
    .rev()
    .fold(0.0, |acc, c| acc * u + c);
    eps0 / 3600.0 + delta_eps
}

fn geocentric(jme: f64, jce: f64) -> Geocentric {
    let (l, b, r) = heliocentric(jme);
    // §3.3: geocentric longitude and latitude (Eqs. 13–14).
    let theta = limit_degrees(l + 180.0);
    let (delta_psi, delta_eps) = nutation(jce);
    // §3.6–3.7: aberration and apparent sun longitude (Eqs. 27–28).
    let delta_tau = -20.4898 / (3600.0 * r);
    Geocentric {
        r,
        beta: -b,
        delta_psi,
        epsilon: obliquity(jme, delta_eps),
        lambda: theta + delta_psi + delta_tau,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The report's test case: 2003-10-17 12:30:30 local time at time zone −7 (19:30:30 UTC),
    /// latitude 39.742476°, longitude −105.1786°, elevation 1830.14 m, 820 mbar, 11 °C,
    /// ΔT = 67 s.
    fn report_case() -> (Utc, Site, Air, f64) {
        (
            Utc {
                year: 2003,
                month: 10,
                day: 17,
                hour: 19,
                minute: 30,
                second: 30.0,
            },
            Site {
                latitude: 39.742476,
                longitude: -105.1786,
                elevation: 1830.14,
            },
            Air {
                pressure: 82_000.0,
                temperature: 284.15,
            },
            67.0,
        )
    }

    /// Within half a unit of the last printed digit, widened by 1e-7 for the difference between
    /// maths libraries.
    fn printed(value: f64, expected: f64, decimals: i32, what: &str) {
        let tol = 0.5 * 10f64.powi(-decimals) + 1e-7;
        assert!(
            (value - expected).abs() <= tol,
            "{what}: {value} vs {expected} (±{tol})"
        );
    }

    /// NREL's own test program for the report's code (spa_tester.c, distributed with spa.c;
    /// read here) prints for this case: Julian day 2452930.312847, L 2.401826e+01°,
    /// B −1.011219e−04°, R 0.996542 AU, H 11.105902°, Δψ −3.998404e−03°, Δε 1.666568e−03°,
    /// ε 23.440465°, zenith 50.111622°, azimuth 194.340241°.
    #[test]
    fn reproduces_nrel_spa_tester_to_its_printed_digits() {
        let (t, site, air, dt) = report_case();
        let p = position(&t, &site, &air, dt).unwrap();
        assert!(p.flags.is_empty());
        let p = p.value;
        printed(p.julian_day, 2_452_930.312_847, 6, "JD");
        let jde = p.julian_day + dt / 86_400.0;
        let jce = (jde - 2_451_545.0) / 36_525.0;
        let (l, b, r) = heliocentric(jce / 10.0);
        printed(l, 24.01826, 5, "L");
        assert!((b - -1.011219e-4).abs() <= 0.5e-10 + 1e-12, "B {b}");
        printed(r, 0.996542, 6, "R");
        let (dpsi, deps) = nutation(jce);
        assert!((dpsi - -3.998404e-3).abs() <= 0.5e-9 + 1e-12, "Δψ {dpsi}");
        assert!((deps - 1.666568e-3).abs() <= 0.5e-9 + 1e-12, "Δε {deps}");
        printed(obliquity(jce / 10.0, deps), 23.440465, 6, "ε");
        printed(p.zenith, 50.111622, 6, "zenith");
        printed(p.azimuth, 194.340241, 6, "azimuth");
    }

    /// The report's test case as the report itself prints it (NREL/TP-560-34302, Table A5.1:
    /// topocentric zenith 50.11162°, azimuth 194.34024°, topocentric declination −9.316179°),
    /// as quoted by several independent test suites that cite the table (the report itself was
    /// not read here). One of them also quotes a topocentric hour angle of 11.10629°; this code,
    /// pvlib 0.16.1 and NREL's spa.c (through its printed zenith and azimuth) all give 11.106271°,
    /// so that quotation is not used.
    #[test]
    fn reproduces_the_report_table_a5_1() {
        let (t, site, air, dt) = report_case();
        let p = position(&t, &site, &air, dt).unwrap().value;
        printed(p.zenith, 50.11162, 5, "zenith");
        printed(p.azimuth, 194.34024, 5, "azimuth");
        printed(p.declination, -9.316179, 6, "δ'");
        assert!((p.elevation - (90.0 - p.zenith)).abs() < 1e-12);
    }

    /// pvlib 0.16.1 `spa.solar_position_numpy` (the same algorithm, coded independently),
    /// independent computation: other hemispheres, centuries, the low winter sun where the
    /// refraction matters, and the sun below the horizon (no refraction). Printed here to 7
    /// decimals; 1e-6° allows for the maths libraries.
    #[test]
    fn agrees_with_pvlib_elsewhere_and_elsewhen() {
        #[rustfmt::skip]
        let cases: [((i32, u32, u32, u32, u32, f64), (f64, f64, f64), (f64, f64, f64), (f64, f64)); 6] = [
            ((2024, 12, 21, 2, 0, 0.0), (-33.8688, 151.2093, 50.0), (1013.25, 20.0, 69.0), (10.5323496, 351.4983125)),
            ((2024, 2, 10, 11, 0, 0.0), (69.6492, 18.9553, 10.0), (1000.0, -10.0, 69.0), (83.9375089, 180.3996397)),
            ((1950, 1, 1, 0, 0, 0.0), (51.4769, -0.0005, 46.0), (1013.25, 5.0, 29.0), (151.5881101, 358.4330568)),
            ((2100, 6, 30, 12, 0, 0.0), (0.0, 0.0, 0.0), (1013.25, 25.0, 200.0), (23.1471968, 2.2741893)),
            ((2024, 6, 21, 4, 0, 0.0), (35.0, -120.0, 100.0), (1000.0, 15.0, 69.0), (98.1876119, 306.2481899)),
            ((2024, 3, 20, 15, 30, 0.0), (-77.85, 166.67, 20.0), (990.0, -25.0, 69.0), (99.8359922, 141.9916481)),
        ];
        for ((y, mo, d, h, mi, s), (lat, lon, z), (p, tc, dt), (zen, az)) in cases {
            let t = Utc {
                year: y,
                month: mo,
                day: d,
                hour: h,
                minute: mi,
                second: s,
            };
            let site = Site {
                latitude: lat,
                longitude: lon,
                elevation: z,
            };
            let air = Air {
                pressure: p * 100.0,
                temperature: tc + 273.15,
            };
            let r = position(&t, &site, &air, dt).unwrap().value;
            assert!((r.zenith - zen).abs() < 1e-6, "{t:?}: zenith {}", r.zenith);
            assert!(
                (r.azimuth - az).abs() < 1e-6,
                "{t:?}: azimuth {}",
                r.azimuth
            );
        }
    }

    /// Julian days printed in the report's Table A4.1 (from memory, as Meeus, Astronomical
    /// Algorithms, Ch. 7, prints them): 2000-01-01 12:00 → 2451545.0, 1987-01-27 0:00 →
    /// 2446822.5, 1988-06-19 12:00 → 2447332.0, 1900-01-01 → 2415020.5, 1600-01-01 →
    /// 2305447.5, 837-04-10 07:12 → 2026871.8, −1000-07-12 12:00 → 1356001.0, −4712-01-01 12:00
    /// → 0.0.
    #[test]
    fn julian_days_of_the_report_table() {
        for (y, m, d, jd) in [
            (2000, 1, 1.5, 2_451_545.0),
            (1999, 1, 1.0, 2_451_179.5),
            (1987, 1, 27.0, 2_446_822.5),
            (1987, 6, 19.5, 2_446_966.0),
            (1988, 1, 27.0, 2_447_187.5),
            (1988, 6, 19.5, 2_447_332.0),
            (1900, 1, 1.0, 2_415_020.5),
            (1600, 1, 1.0, 2_305_447.5),
            (1600, 12, 31.0, 2_305_812.5),
            (837, 4, 10.3, 2_026_871.8),
            (-1000, 7, 12.5, 1_356_001.0),
            (-4712, 1, 1.5, 0.0),
        ] {
            assert!((julian_day(y, m, d) - jd).abs() < 1e-6, "{y}-{m}-{d}");
        }
    }

    /// Each bad input is an error naming its field (`None`: a non-finite value, which names
    /// only the quantity).
    #[test]
    fn bad_dates_and_places_are_errors_naming_the_field() {
        type Edit = fn(&mut Utc, &mut Site, &mut Air, &mut f64);
        #[rustfmt::skip]
        let cases: [(Edit, Option<&str>); 15] = [
            (|t, _, _, _| t.month = 13, Some(keys::DATE)),
            (|t, _, _, _| t.day = 0, Some(keys::DATE)),
            (|t, _, _, _| (t.year, t.month, t.day) = (2023, 2, 29), Some(keys::DATE)),
            (|t, _, _, _| (t.year, t.month, t.day) = (1900, 2, 29), Some(keys::DATE)),
            (|t, _, _, _| t.hour = 24, Some(keys::TIME)),
            (|t, _, _, _| t.minute = 60, Some(keys::TIME)),
            (|t, _, _, _| t.second = 60.0, Some(keys::TIME)),
            (|t, _, _, _| t.second = f64::NAN, None),
            (|_, s, _, _| s.latitude = 90.5, Some(keys::LATITUDE)),
            (|_, s, _, _| s.longitude = -181.0, Some(keys::LONGITUDE)),
            (|_, s, _, _| s.elevation = f64::INFINITY, None),
            (|_, _, a, _| a.pressure = 0.0, Some(keys::PRESSURE)),
            (|_, _, a, _| a.temperature = -1.0, Some(keys::AIR_TEMPERATURE)),
            (|_, _, a, _| a.temperature = f64::NAN, None),
            (|_, _, _, dt| *dt = f64::NAN, None),
        ];
        for (i, (edit, key)) in cases.into_iter().enumerate() {
            let (mut t, mut site, mut air, mut dt) = report_case();
            edit(&mut t, &mut site, &mut air, &mut dt);
            match (position(&t, &site, &air, dt), key) {
                (Err(EngineError::Undefined { subject, .. }), Some(k)) => {
                    assert_eq!(subject, Subject::Input(k), "case {i}")
                }
                (Err(EngineError::NonFinite { .. }), None) => {}
                (other, _) => panic!("case {i}: {other:?}"),
            }
        }
        // A leap day that exists.
        let (t, site, air, dt) = report_case();
        let leap = Utc {
            year: 2024,
            month: 2,
            day: 29,
            ..t
        };
        assert!(position(&leap, &site, &air, dt).is_ok());
    }

    /// Every valid extreme computes finite angles: the poles, the date line, the years at the
    /// range's ends and beyond (flagged), absurd elevations and ΔT.
    #[test]
    fn extremes_stay_finite_and_far_years_are_flagged() {
        let (t, site, air, dt) = report_case();
        for (latitude, longitude) in [(-90.0, -180.0), (90.0, 180.0), (0.0, 180.0), (90.0, 0.0)] {
            for year in [-2000, 6000, -5000, 9999] {
                for elevation in [-1e6, 0.0, 1e9] {
                    let site = Site {
                        latitude,
                        longitude,
                        elevation,
                    };
                    let p = position(&Utc { year, ..t }, &site, &air, dt).unwrap();
                    let v = p.value;
                    for a in [v.zenith, v.azimuth, v.elevation, v.declination] {
                        assert!(a.is_finite());
                    }
                    assert!((0.0..360.0).contains(&v.azimuth));
                    assert_eq!(p.flags.is_empty(), (-2000..=6000).contains(&year));
                }
            }
        }
        assert_eq!(position(&t, &site, &air, 1e9).unwrap().flags.len(), 1);
    }
}
