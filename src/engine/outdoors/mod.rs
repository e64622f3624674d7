//! Outdoors as it is (issue #19): the sky a body radiates to, the sun it absorbs, and the wind
//! at its height and angle — pure functions, each one published method, for the surface balance
//! to call.
//!
//! - [`sky`] — clear-sky emissivity (Berdahl & Martin 1984; Swinbank 1963 as a cross-check), a
//!   cloud-cover correction (Clark & Allen 1978; Martin & Berdahl 1984), the sky temperature,
//!   the split between sky and ground by view factor, and the one radiant surroundings
//!   temperature that carries both into the existing `σ(Ts⁴ − Tr⁴)` term.
//! - [`sun`] — the sun's position from UTC date and time and the site (NREL's SPA, Reda &
//!   Andreas 2004), coefficient tables in `sun_tables`.
//! - [`irradiance`] — clear-sky irradiance at the sun's zenith angle (Hottel 1976 beam, Liu &
//!   Jordan 1960 diffuse) and the absorbed solar heat of a level cylinder per metre and of a
//!   sphere.
//! - [`wind`] — a wind reading carried to the body's height and terrain (EN 1991-1-4 §4.3), and
//!   the yaw factor of forced convection on a cylinder (Morgan's relation as CIGRE TB 601 gives
//!   it, IEEE Std 738's K_angle as the cross-check).
//! - [`joule`] — heat made inside: the steady surface temperature of a body carrying a known
//!   heat or a current through a temperature-dependent resistance, in everything above, and the
//!   inverse (the heat or current that holds the surface at a limit).
//!
//! Units: SI `f64` — K, Pa, m, m/s, W/m², W/m — except angles, which are decimal degrees (as the
//! published algorithms, the page and every map write latitude, longitude and the sun's
//! angles), cloud cover in oktas (0–8, as weather reports give it) and the hour of the day in
//! hours. No function panics on any input, finite or not: where a method is undefined it returns
//! an [`EngineError`] naming the input (by the link key in [`keys`]); outside a method's
//! published range it computes and flags ([`crate::engine::validity::Flagged`]).

mod clock;
pub mod irradiance;
pub mod joule;
pub mod sky;
pub mod sun;
mod sun_tables;
pub mod wind;

use crate::engine::error::{EngineError, Subject};

/// The link keys the outdoor errors name (`Subject::Input(key)`). The keys of existing fields
/// ("Ta", "td", "p") are the page's own; the rest are proposed here for the rows the page adds
/// for issue #19 — a field added with another key must change its constant here, so that
/// `scenario::error_field` places each message beside its field.
pub mod keys {
    /// Air (stream) temperature, existing field.
    pub const AIR_TEMPERATURE: &str = "Ta";
    /// Site pressure, existing field.
    pub const PRESSURE: &str = "p";
    /// Cloud cover, oktas.
    pub const CLOUD: &str = "cc";
    /// Height of the cloud base, m.
    pub const CLOUD_BASE: &str = "zc";
    /// Emissivity of the cloud.
    pub const CLOUD_EMISSIVITY: &str = "ec";
    /// Local solar time, h.
    pub const SOLAR_HOUR: &str = "hs";
    /// Ground temperature.
    pub const GROUND_TEMPERATURE: &str = "Tg";
    /// Share of the surface's view that is sky.
    pub const SKY_VIEW: &str = "fs";
    /// Date (year, month, day) and UTC time of day.
    pub const DATE: &str = "dt";
    pub const TIME: &str = "tu";
    /// Latitude and longitude, degrees.
    pub const LATITUDE: &str = "lat";
    pub const LONGITUDE: &str = "lon";
    /// Site elevation, existing field.
    pub const ELEVATION: &str = "z";
    /// TT − UT (ΔT), s.
    pub const DELTA_T: &str = "dT";
    /// Solar absorptance of the outer surface.
    pub const ABSORPTANCE: &str = "as";
    /// Ground albedo.
    pub const ALBEDO: &str = "alb";
    /// Irradiance components, W/m²: beam normal, diffuse horizontal, global horizontal.
    pub const IRRADIANCE: &str = "Gb";
    pub const IRRADIANCE_DIFFUSE: &str = "Gd";
    pub const IRRADIANCE_GLOBAL: &str = "Gg";
    /// Outside size D, existing field.
    pub const DIAMETER: &str = "D";
    /// The axis's direction (azimuth and tilt), degrees.
    pub const AXIS_AZIMUTH: &str = "axa";
    pub const AXIS_TILT: &str = "axt";
    /// The wind reading, m/s (outdoors the stream-speed field is the reading), and the height it
    /// was measured at, m (10 m for now: no field yet).
    pub const WIND_READING: &str = "U";
    pub const STATION_HEIGHT: &str = "zw";
    /// The body's height above ground, m.
    pub const BODY_HEIGHT: &str = "zb";
    /// The wind's angle to the body's axis, degrees.
    pub const YAW: &str = "yaw";
    /// Surroundings temperature, existing field (indoors; outdoors the sky and ground give it).
    pub const SURROUNDINGS: &str = "Tr";
    /// Heat made inside: W/m for a long body, W for a sphere.
    pub const HEAT_MADE: &str = "qm";
    /// Current through the conductor, A (rms for AC).
    pub const CURRENT: &str = "I";
    /// The data sheet's two resistances per metre, Ω/m, and their temperatures.
    pub const RESISTANCE_LOW: &str = "R1";
    pub const RESISTANCE_HIGH: &str = "R2";
    pub const RESISTANCE_T_LOW: &str = "TR1";
    pub const RESISTANCE_T_HIGH: &str = "TR2";
    /// The surface temperature limit the inverse solves for.
    pub const TEMPERATURE_LIMIT: &str = "Tmax";
}

/// A finite value, or the error that names it.
fn finite(quantity: &'static str, v: f64) -> Result<f64, EngineError> {
    crate::engine::error::finite(quantity, v)
}

pub(crate) use crate::engine::error::undefined;

/// A finite value within `lo..=hi`, or the error naming the input by `key`.
fn within(
    key: &'static str,
    quantity: &'static str,
    v: f64,
    lo: f64,
    hi: f64,
    unit: &'static str,
    why: &'static str,
) -> Result<f64, EngineError> {
    finite(quantity, v)?;
    if v >= lo && v <= hi {
        Ok(v)
    } else {
        Err(undefined(Subject::Input(key), quantity, v, unit, why))
    }
}

/// A finite absolute temperature above 0 K.
fn kelvin(subject: Subject, quantity: &'static str, t: f64) -> Result<f64, EngineError> {
    finite(quantity, t)?;
    if t > 0.0 {
        Ok(t)
    } else {
        Err(undefined(
            subject,
            quantity,
            t,
            "K",
            "an absolute temperature must be above 0 K",
        ))
    }
}

/// A finite absolute pressure above 0 Pa (the site's, named by its field).
fn pressure_pa(p: f64) -> Result<f64, EngineError> {
    finite("pressure", p)?;
    if p > 0.0 {
        Ok(p)
    } else {
        Err(undefined(
            Subject::Input(keys::PRESSURE),
            "pressure",
            p,
            "Pa",
            "an absolute pressure must be above 0",
        ))
    }
}

/// Sine and cosine of an angle in degrees.
fn sin_cos_deg(a: f64) -> (f64, f64) {
    a.to_radians().sin_cos()
}

/// An angle in degrees reduced to 0 ≤ a < 360.
fn limit_degrees(a: f64) -> f64 {
    let r = a.rem_euclid(360.0);
    // rem_euclid can return 360.0 itself for tiny negative inputs.
    if r >= 360.0 {
        0.0
    } else {
        r
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn degrees_are_limited_to_one_turn() {
        assert_eq!(limit_degrees(370.0), 10.0);
        assert_eq!(limit_degrees(-10.0), 350.0);
        assert_eq!(limit_degrees(-1e-20), 0.0);
        assert!(limit_degrees(f64::NAN).is_nan());
    }

    #[test]
    fn non_finite_and_out_of_domain_inputs_are_errors_naming_the_input() {
        assert!(matches!(
            within(keys::CLOUD, "cloud cover", f64::NAN, 0.0, 8.0, "okta", "x"),
            Err(EngineError::NonFinite { .. })
        ));
        match within(keys::CLOUD, "cloud cover", 9.0, 0.0, 8.0, "okta", "x") {
            Err(EngineError::Undefined { subject, .. }) => {
                assert_eq!(subject, Subject::Input(keys::CLOUD))
            }
            other => panic!("{other:?}"),
        }
        assert!(kelvin(Subject::General, "T", 0.0).is_err());
        assert!(kelvin(Subject::General, "T", f64::INFINITY).is_err());
    }
}
