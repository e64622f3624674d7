//! Sunlight on a body: clear-sky irradiance at the sun's zenith angle, and the solar heat a
//! level cylinder absorbs per metre or a sphere absorbs whole.
//!
//! Units: irradiance W/m², heat W/m (cylinder) or W (sphere), lengths m, angles degrees,
//! absorptance and albedo dimensionless (0–1).

use super::sky::ViewFactors;
use super::{finite, keys, sin_cos_deg, undefined, within};
use crate::engine::error::{finite_result, EngineError, Subject};
use crate::engine::validity::{Flagged, Range};
use std::f64::consts::PI;

/// The solar constant, W/m²: the World Radiation Center value that Duffie & Beckman, and the
/// worked examples of Hottel's model, use (Solar Engineering of Thermal Processes, §1.2). The
/// present satellite value (Kopp & Lean 2011) is 1361 W/m², 0.4 % lower — far inside the
/// clear-sky model's own uncertainty.
pub const SOLAR_CONSTANT: f64 = 1367.0;

/// The extraterrestrial irradiance normal to the beam, W/m², at an Earth–sun distance in AU
/// (`sun::SunPosition::distance`): G_on = G_sc/R² (inverse-square law). Errors: a non-finite or
/// non-positive distance.
pub fn extraterrestrial_normal(distance_au: f64) -> Result<f64, EngineError> {
    finite("earth–sun distance", distance_au)?;
    if distance_au <= 0.0 {
        return Err(undefined(
            Subject::General,
            "earth–sun distance",
            distance_au,
            "AU",
            "a distance must be above 0",
        ));
    }
    finite_result(
        "extraterrestrial irradiance",
        SOLAR_CONSTANT / (distance_au * distance_au),
    )
}

/// The climate types of Hottel's correction factors (Duffie & Beckman, Table 2.8.1).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum Climate {
    Tropical,
    MidlatitudeSummer,
    SubarcticSummer,
    MidlatitudeWinter,
}

impl Climate {
    pub const ALL: [Climate; 4] = [
        Climate::Tropical,
        Climate::MidlatitudeSummer,
        Climate::SubarcticSummer,
        Climate::MidlatitudeWinter,
    ];

    /// Hottel's r0, r1, rk (a0 = r0·a0*, a1 = r1·a1*, k = rk·k*).
    pub fn factors(self) -> (f64, f64, f64) {
        match self {
            Climate::Tropical => (0.95, 0.98, 1.02),
            Climate::MidlatitudeSummer => (0.97, 0.99, 1.02),
            Climate::SubarcticSummer => (0.99, 0.99, 1.01),
            Climate::MidlatitudeWinter => (1.03, 1.01, 1.00),
        }
    }

    pub fn name(self) -> &'static str {
        match self {
            Climate::Tropical => "tropical",
            Climate::MidlatitudeSummer => "mid-latitude summer",
            Climate::SubarcticSummer => "subarctic summer",
            Climate::MidlatitudeWinter => "mid-latitude winter",
        }
    }
}

pub const HOTTEL: &str = "Hottel (1976) with Liu & Jordan (1960)";

/// The site elevations Hottel's constants were fitted for: sea level to 2.5 km.
pub const HOTTEL_ALTITUDE: Range = Range {
    quantity: "site elevation",
    lo: 0.0,
    hi: 2500.0,
    unit: "m",
    source: "Hottel (1976)",
};

/// Zenith angles where the air mass 1/cos θz of a flat atmosphere holds (within about 1 % of a
/// curved one up to 75–80°, common practice). Nearer the horizon the model's constant a0 keeps
/// the beam at 10–15 % of the extraterrestrial value: an overestimate.
pub const HOTTEL_ZENITH: Range = Range {
    quantity: "solar zenith angle",
    lo: 0.0,
    hi: 80.0,
    unit: "°",
    source: "plane-parallel air mass, common practice",
};

/// Sunlight at the ground, W/m².
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Irradiance {
    /// Beam (direct) irradiance on a surface normal to the sun's rays.
    pub beam_normal: f64,
    /// Diffuse sky irradiance on a horizontal surface.
    pub diffuse_horizontal: f64,
    /// Global (beam + diffuse) irradiance on a horizontal surface: what the ground reflects.
    pub global_horizontal: f64,
}

impl Irradiance {
    /// Night: nothing.
    pub const DARK: Irradiance = Irradiance {
        beam_normal: 0.0,
        diffuse_horizontal: 0.0,
        global_horizontal: 0.0,
    };

    /// Typed values, each finite and ≥ 0 (errors name the irradiance).
    pub fn typed(
        beam_normal: f64,
        diffuse_horizontal: f64,
        global_horizontal: f64,
    ) -> Result<Irradiance, EngineError> {
        for (key, what, v) in [
            (keys::IRRADIANCE, "beam irradiance", beam_normal),
            (
                keys::IRRADIANCE_DIFFUSE,
                "diffuse irradiance",
                diffuse_horizontal,
            ),
            (
                keys::IRRADIANCE_GLOBAL,
                "global irradiance",
                global_horizontal,
            ),
        ] {
            within(
                key,
                what,
                v,
                0.0,
                f64::MAX,
                "W/m²",
                "an irradiance cannot be negative",
            )?;
        }
        Ok(Irradiance {
            beam_normal,
            diffuse_horizontal,
            global_horizontal,
        })
    }
}

/// Clear-sky irradiance at the sun's zenith angle.
///
/// Beam: H. C. Hottel, "A simple model for estimating the transmittance of direct solar
/// radiation through clear atmospheres", Solar Energy 18 (1976) 129–134, for the 1962 US
/// standard atmosphere with 23 km visibility:
/// τ_b = a0 + a1·exp(−k/cos θz), a0* = 0.4237 − 0.00821·(6 − A)², a1* = 0.5055 + 0.00595·(6.5 −
/// A)², k* = 0.2711 + 0.01858·(2.5 − A)², A the site elevation in km, and the climate factors
/// r0 = a0/a0*, r1 = a1/a1*, rk = k/k* of [`Climate::factors`] (Duffie & Beckman, Solar
/// Engineering of Thermal Processes, §2.8 and Table 2.8.1). G_bn = G_on·τ_b.
///
/// Diffuse: B. Y. H. Liu and R. C. Jordan, "The interrelationship and characteristic
/// distribution of direct, diffuse and total solar radiation", Solar Energy 4(3) (1960) 1–19, in
/// the form τ_d = 0.271 − 0.294·τ_b (Duffie & Beckman §2.8): G_dh = G_on·τ_d·cos θz. The
/// papers were not read here; the forms and constants are as Duffie & Beckman give them (from
/// memory) and as independent implementations read here agree (Table 2.8.1's factors too).
///
/// - `zenith`: degrees (refracted, `sun::SunPosition::zenith`); at or beyond 90° the sun is
///   down and everything is zero (no flag).
/// - `site_elevation`: m; `climate`: the atmosphere's type; `extraterrestrial`: G_on, W/m²
///   ([`extraterrestrial_normal`]), ≥ 0.
///
/// Flagged outside [`HOTTEL_ALTITUDE`] and [`HOTTEL_ZENITH`] (computed all the same; the
/// transmittances are held within 0–1). Errors: non-finite input, a negative G_on.
pub fn hottel_liu_jordan(
    zenith: f64,
    site_elevation: f64,
    climate: Climate,
    extraterrestrial: f64,
) -> Result<Flagged<Irradiance>, EngineError> {
    finite("solar zenith angle", zenith)?;
    finite("site elevation", site_elevation)?;
    within(
        keys::IRRADIANCE,
        "extraterrestrial irradiance",
        extraterrestrial,
        0.0,
        f64::MAX,
        "W/m²",
        "an irradiance cannot be negative",
    )?;
    let cos_z = zenith.to_radians().cos();
    if zenith.abs() >= 90.0 || cos_z <= 0.0 {
        return Ok(Flagged::new(Irradiance::DARK));
    }
    let a = site_elevation / 1000.0;
    let (r0, r1, rk) = climate.factors();
    let a0 = r0 * (0.4237 - 0.00821 * (6.0 - a) * (6.0 - a));
    let a1 = r1 * (0.5055 + 0.00595 * (6.5 - a) * (6.5 - a));
    let k = rk * (0.2711 + 0.01858 * (2.5 - a) * (2.5 - a));
    let tau_b = (a0 + a1 * (-k / cos_z).exp()).clamp(0.0, 1.0);
    let tau_d = (0.271 - 0.294 * tau_b).clamp(0.0, 1.0);
    let beam_normal = extraterrestrial * tau_b;
    let diffuse_horizontal = extraterrestrial * tau_d * cos_z;
    let mut out = Flagged::new(Irradiance {
        beam_normal: finite_result("beam irradiance", beam_normal)?,
        diffuse_horizontal: finite_result("diffuse irradiance", diffuse_horizontal)?,
        global_horizontal: finite_result(
            "global irradiance",
            beam_normal * cos_z + diffuse_horizontal,
        )?,
    });
    out.check(HOTTEL, &HOTTEL_ALTITUDE, site_elevation);
    out.check(HOTTEL, &HOTTEL_ZENITH, zenith);
    Ok(out)
}

/// The share of the diameter a long body presents to the beam: the sine of the angle between
/// the sun's direction and the body's axis (1 square to it, 0 along it). For the projected area
/// D·L·[`beam_across`] of a cylinder (or of a bar, taking its width across).
///
/// - `sun_zenith`, `sun_azimuth`: degrees (azimuth eastward from north).
/// - `axis_azimuth`: the axis's direction, degrees eastward from north (either end).
/// - `axis_tilt`: the axis's angle above the horizontal, degrees: 0 level, 90 upright.
///
/// When the sun's direction relative to the axis is unknown, the worst case is 1 (beam square
/// to the axis): [`WORST_CASE_BEAM`]. Errors: a non-finite angle.
pub fn beam_across(
    sun_zenith: f64,
    sun_azimuth: f64,
    axis_azimuth: f64,
    axis_tilt: f64,
) -> Result<f64, EngineError> {
    finite("solar zenith angle", sun_zenith)?;
    finite("solar azimuth", sun_azimuth)?;
    let axis_azimuth = finite("axis azimuth", axis_azimuth)?;
    let axis_tilt = finite("axis tilt", axis_tilt)?;
    // Unit vectors in (east, north, up).
    let (sz, cz) = sin_cos_deg(sun_zenith);
    let (sa, ca) = sin_cos_deg(sun_azimuth);
    let (st, ct) = sin_cos_deg(axis_tilt);
    let (sb, cb) = sin_cos_deg(axis_azimuth);
    let along = sz * sa * ct * sb + sz * ca * ct * cb + cz * st;
    Ok((1.0 - along * along).max(0.0).sqrt().min(1.0))
}

/// The beam square to the axis: the most a long body can intercept.
pub const WORST_CASE_BEAM: f64 = 1.0;

/// The absorbed solar heat of a cylinder per metre of length, W/m:
///
/// q' = α_s·(G_bn·D·f + G_dh·πD·F_sky + ρ_g·G_gh·πD·F_gnd)
///
/// — the beam on the projected width D·f ([`beam_across`], 1 for the worst case), the diffuse
/// sky on the whole surface through its sky view (an isotropic sky: a body of area A with view
/// factor F to the sky receives A·F·G_dh, by reciprocity with a black hemisphere of emissive
/// power G_dh), and the ground, a diffuse reflector of albedo ρ_g lit by G_gh, likewise through
/// the ground view. The isotropic sky and ground are the assumptions of Liu & Jordan (1960) for
/// tilted surfaces; α_s is a hemispherical solar absorptance, the same for beam and diffuse
/// (common practice). Shading of the ground by the body itself is neglected.
///
/// - `absorptance`: α_s, 0–1; `diameter`: D, m, > 0; `irradiance`: the three components;
///   `albedo`: ρ_g, 0–1 (about 0.2 for grass and soil, 0.6–0.9 for fresh snow, common
///   practice); `view`: [`ViewFactors::OPEN`] in the open; `beam`: f, 0–1.
///
/// Errors name the input that is non-finite or outside its domain.
pub fn absorbed_cylinder(
    absorptance: f64,
    diameter: f64,
    irradiance: &Irradiance,
    albedo: f64,
    view: ViewFactors,
    beam: f64,
) -> Result<f64, EngineError> {
    check_surface(absorptance, diameter, irradiance, albedo)?;
    within(
        keys::AXIS_AZIMUTH,
        "beam factor",
        beam,
        0.0,
        1.0,
        "",
        "the share of the diameter the beam sees lies between 0 and 1",
    )?;
    let perimeter = PI * diameter;
    let q = absorptance
        * (irradiance.beam_normal * diameter * beam
            + irradiance.diffuse_horizontal * perimeter * view.sky
            + albedo * irradiance.global_horizontal * perimeter * view.ground);
    finite_result("absorbed solar heat", q)
}

/// The absorbed solar heat of a sphere, W: the beam on its shadow πD²/4, the diffuse sky and the
/// ground-reflected light on its surface πD² through the sky and ground views, as
/// [`absorbed_cylinder`]: q = α_s·(G_bn·πD²/4 + G_dh·πD²·F_sky + ρ_g·G_gh·πD²·F_gnd).
pub fn absorbed_sphere(
    absorptance: f64,
    diameter: f64,
    irradiance: &Irradiance,
    albedo: f64,
    view: ViewFactors,
) -> Result<f64, EngineError> {
    check_surface(absorptance, diameter, irradiance, albedo)?;
    let area = PI * diameter * diameter;
    let q = absorptance
        * (irradiance.beam_normal * area / 4.0
            + irradiance.diffuse_horizontal * area * view.sky
            + albedo * irradiance.global_horizontal * area * view.ground);
    finite_result("absorbed solar heat", q)
}

fn check_surface(
    absorptance: f64,
    diameter: f64,
    irradiance: &Irradiance,
    albedo: f64,
) -> Result<(), EngineError> {
    within(
        keys::ABSORPTANCE,
        "solar absorptance",
        absorptance,
        0.0,
        1.0,
        "",
        "an absorptance lies between 0 and 1",
    )?;
    within(
        keys::ALBEDO,
        "ground albedo",
        albedo,
        0.0,
        1.0,
        "",
        "an albedo lies between 0 and 1",
    )?;
    finite("diameter", diameter)?;
    if diameter <= 0.0 {
        return Err(undefined(
            Subject::Input(keys::DIAMETER),
            "diameter",
            diameter,
            "m",
            "a body has a size above 0",
        ));
    }
    Irradiance::typed(
        irradiance.beam_normal,
        irradiance.diffuse_horizontal,
        irradiance.global_horizontal,
    )?;
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Duffie & Beckman, Solar Engineering of Thermal Processes, Example 2.8.1 (from memory; the
    /// arithmetic re-done by hand agrees): Madison, elevation 270 m, mid-latitude summer,
    /// August 22 at 11:30 solar time, cos θz = 0.846, G_on = 1338 W/m²: τ_b = 0.62,
    /// G_cnb = 830 W/m², G_cb = 702 W/m². Printed to 2–3 figures: ±0.005 on τ_b, ±5 W/m².
    #[test]
    fn duffie_beckman_example_2_8_1_from_memory() {
        let zenith = 0.846f64.acos().to_degrees();
        let g = hottel_liu_jordan(zenith, 270.0, Climate::MidlatitudeSummer, 1338.0)
            .unwrap()
            .value;
        let tau_b = g.beam_normal / 1338.0;
        assert!((tau_b - 0.62).abs() <= 0.005, "{tau_b}");
        assert!((g.beam_normal - 830.0).abs() <= 5.0, "{}", g.beam_normal);
        assert!((g.beam_normal * 0.846 - 702.0).abs() <= 5.0);
        // Liu & Jordan's diffuse by hand: (0.271 − 0.294·0.620)·1338·0.846 = 100 W/m².
        assert!(
            (g.diffuse_horizontal - 100.0).abs() <= 2.0,
            "{}",
            g.diffuse_horizontal
        );
    }

    /// Hottel's constants by hand at sea level (A = 0) with mid-latitude winter's factors
    /// r0 = 1.03, r1 = 1.01, rk = 1.00: a0* = 0.4237 − 0.00821·36 = 0.12814, a1* = 0.5055 +
    /// 0.00595·42.25 = 0.75689, k* = 0.2711 + 0.01858·6.25 = 0.38723; for the sun overhead
    /// τ_b = 1.03·0.12814 + 1.01·0.75689·e^(−0.38723) = 0.13198 + 0.76446·0.678 935 = 0.65100
    /// (five decimals: ±2e-5).
    #[test]
    fn hottel_constants_by_hand() {
        let g = hottel_liu_jordan(0.0, 0.0, Climate::MidlatitudeWinter, 1000.0)
            .unwrap()
            .value;
        let tau = 1.03 * 0.12814 + 1.01 * 0.75689 * 0.678_935;
        assert!(
            (g.beam_normal / 1000.0 - tau).abs() < 2e-5,
            "{}",
            g.beam_normal
        );
        assert!((g.global_horizontal - g.beam_normal - g.diffuse_horizontal).abs() < 1e-9);
    }

    #[test]
    fn below_the_horizon_is_dark_and_near_it_is_flagged() {
        for z in [90.0, 95.0, 180.0, -90.0] {
            let g = hottel_liu_jordan(z, 100.0, Climate::Tropical, 1367.0).unwrap();
            assert_eq!(g.value, Irradiance::DARK);
            assert!(g.flags.is_empty());
        }
        let low = hottel_liu_jordan(85.0, 100.0, Climate::Tropical, 1367.0).unwrap();
        assert_eq!(low.flags.len(), 1);
        let high = hottel_liu_jordan(30.0, 4000.0, Climate::Tropical, 1367.0).unwrap();
        assert_eq!(high.flags.len(), 1);
        assert!(hottel_liu_jordan(f64::NAN, 0.0, Climate::Tropical, 1367.0).is_err());
        assert!(hottel_liu_jordan(30.0, 0.0, Climate::Tropical, -1.0).is_err());
        // Every climate, every zenith: within 0 and the extraterrestrial value.
        for c in Climate::ALL {
            for i in 0..90 {
                let g = hottel_liu_jordan(i as f64, 1000.0, c, 1367.0)
                    .unwrap()
                    .value;
                assert!(g.beam_normal > 0.0 && g.beam_normal < 1367.0);
                assert!(g.diffuse_horizontal > 0.0 && g.global_horizontal < 1367.0);
            }
        }
    }

    /// The inverse-square law by hand: at perihelion (0.98329 AU, from memory) 1367/0.966 86 =
    /// 1413.9 W/m²; at 1 AU the solar constant.
    #[test]
    fn extraterrestrial_follows_the_inverse_square_law() {
        assert_eq!(extraterrestrial_normal(1.0).unwrap(), SOLAR_CONSTANT);
        assert!((extraterrestrial_normal(0.98329).unwrap() - 1413.9).abs() < 0.1);
        assert!(extraterrestrial_normal(0.0).is_err());
        assert!(extraterrestrial_normal(f64::NAN).is_err());
    }

    /// Geometry of the beam on a long body: square to a level axis when the sun is overhead,
    /// along it when the sun is on the horizon in the axis's direction, sin θz for an upright
    /// body, and cos(elevation)·cos(azimuth difference) along a level axis otherwise.
    #[test]
    fn beam_across_a_long_body() {
        assert!((beam_across(0.0, 123.0, 40.0, 0.0).unwrap() - 1.0).abs() < 1e-12);
        assert!(beam_across(90.0, 40.0, 40.0, 0.0).unwrap() < 1e-7);
        assert!(beam_across(90.0, 220.0, 40.0, 0.0).unwrap() < 1e-7);
        for z in [10.0f64, 45.0, 80.0] {
            let f = beam_across(z, 77.0, 0.0, 90.0).unwrap();
            assert!((f - z.to_radians().sin()).abs() < 1e-12);
        }
        // Sun at elevation 30°, 60° round from a level axis: cos(angle) = cos 30°·cos 60°.
        let c = 30f64.to_radians().cos() * 60f64.to_radians().cos();
        let f = beam_across(60.0, 150.0, 90.0, 0.0).unwrap();
        assert!((f - (1.0 - c * c).sqrt()).abs() < 1e-12);
        assert!(beam_across(f64::INFINITY, 0.0, 0.0, 0.0).is_err());
    }

    /// Hand value for a 0.1 m pipe, α 0.9, beam 800, diffuse 100, global 600 W/m², albedo 0.2,
    /// in the open, worst-case beam: 0.9·(80 + 5π + 6π) = 0.9·(80 + 34.5575) = 103.10 W/m.
    #[test]
    fn absorbed_cylinder_hand_value() {
        let g = Irradiance::typed(800.0, 100.0, 600.0).unwrap();
        let q = absorbed_cylinder(0.9, 0.1, &g, 0.2, ViewFactors::OPEN, WORST_CASE_BEAM).unwrap();
        assert!((q - 103.1018).abs() < 1e-3, "{q}");
        // The beam along the axis leaves only the diffuse parts.
        let q0 = absorbed_cylinder(0.9, 0.1, &g, 0.2, ViewFactors::OPEN, 0.0).unwrap();
        assert!((q0 - 0.9 * 11.0 * PI).abs() < 1e-9);
        // No sun, no heat: exactly zero (the limit of today's answers).
        let dark = absorbed_cylinder(0.9, 0.1, &Irradiance::DARK, 0.2, ViewFactors::OPEN, 1.0);
        assert_eq!(dark.unwrap(), 0.0);
    }

    /// A uniformly bright surround (sky radiance equal to the ground's, G_dh = ρ·G_gh) lights
    /// every element of a surface with the same irradiance G_dh whatever its orientation, so the
    /// diffuse heat is α·G_dh·(area) for any split of the view — for a cylinder and a sphere.
    #[test]
    fn a_uniform_surround_lights_every_facet_alike() {
        let g = Irradiance::typed(0.0, 120.0, 400.0).unwrap(); // ρ = 0.3 → 120
        for sky in [0.0, 0.25, 0.5, 1.0] {
            let v = ViewFactors::with_sky(sky).unwrap();
            let qc = absorbed_cylinder(0.6, 0.2, &g, 0.3, v, 1.0).unwrap();
            assert!((qc - 0.6 * 120.0 * PI * 0.2).abs() < 1e-9, "{qc}");
            let qs = absorbed_sphere(0.6, 0.2, &g, 0.3, v).unwrap();
            assert!((qs - 0.6 * 120.0 * PI * 0.04).abs() < 1e-9, "{qs}");
        }
    }

    /// A sphere of diameter D takes the beam on its shadow πD²/4: for 1000 W/m² on a 0.2 m ball
    /// of α = 1, 10π W = 31.416 W.
    #[test]
    fn absorbed_sphere_beam_on_its_shadow() {
        let g = Irradiance::typed(1000.0, 0.0, 0.0).unwrap();
        let q = absorbed_sphere(1.0, 0.2, &g, 0.0, ViewFactors::OPEN).unwrap();
        assert!((q - 31.415_93).abs() < 1e-4, "{q}");
    }

    #[test]
    fn bad_surface_inputs_are_errors_naming_the_field() {
        let g = Irradiance::typed(800.0, 100.0, 600.0).unwrap();
        let v = ViewFactors::OPEN;
        let subject = |r: Result<f64, EngineError>| match r {
            Err(EngineError::Undefined { subject, .. }) => subject,
            other => panic!("{other:?}"),
        };
        let cyl = |a, d, r, f| absorbed_cylinder(a, d, &g, r, v, f);
        assert_eq!(
            subject(cyl(1.1, 0.1, 0.2, 1.0)),
            Subject::Input(keys::ABSORPTANCE)
        );
        assert_eq!(
            subject(cyl(0.5, 0.0, 0.2, 1.0)),
            Subject::Input(keys::DIAMETER)
        );
        assert_eq!(
            subject(cyl(0.5, 0.1, -0.2, 1.0)),
            Subject::Input(keys::ALBEDO)
        );
        assert!(cyl(0.5, 0.1, 0.2, 1.5).is_err());
        assert!(cyl(f64::NAN, 0.1, 0.2, 1.0).is_err());
        assert!(Irradiance::typed(-1.0, 0.0, 0.0).is_err());
        assert!(Irradiance::typed(0.0, f64::INFINITY, 0.0).is_err());
        let huge = Irradiance::typed(f64::MAX, f64::MAX, f64::MAX).unwrap();
        assert!(absorbed_sphere(1.0, 1e200, &huge, 1.0, v).is_err());
    }
}
