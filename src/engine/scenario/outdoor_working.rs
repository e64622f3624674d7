//! The outdoor steps of the working (issue #19): the sky, the sky and ground together, the sun
//! and the wind at the body, each with its method and source, written from the numbers used.

use super::*;
use crate::engine::outdoors::{irradiance, sky, wind};

pub(crate) fn steps(s: &Scenario, o: &Outdoor, w: &WorkingInputs) -> Vec<Step> {
    let g = |v: f64| format_sig(v, 5);
    let mut out = Vec::new();
    let td = w.dew_point.unwrap_or(f64::NAN);
    out.push(Step {
        title: "Sky (outdoors)",
        text: format!(
            "{}: clear-sky emissivity ε₀ = 0.711 + 0.56·(t_d/100) + 0.73·(t_d/100)² + 0.013·cos(2π·h/24) + 0.00012·(P − 1000) with the dew point t_d = {} °C and P = {} hPa, the hour h = {} h where the diurnal term is zero (its daily mean: no time of day is an input): ε₀ = {}. {}: cloud cover {} oktas = {} tenths, ε = ε₀·(1 + 0.0224·N − 0.0035·N² + 0.00028·N³) = {} (at most 1). Sky temperature T_sky = ε^¼·T_air = {} K ({} gives {} K for a clear sky, as a cross-check).",
            sky::BERDAHL_MARTIN,
            g(td - 273.15),
            g(w.p / 100.0),
            g(SKY_HOUR),
            g(o.sky.clear_emissivity),
            sky::CLARK_ALLEN,
            g(s.cloud),
            g(s.cloud * 10.0 / 8.0),
            g(o.sky.emissivity),
            g(o.sky.temperature),
            sky::SWINBANK,
            g(o.sky.swinbank_temperature)
        ),
    });
    out.push(Step {
        title: "Sky and ground",
        text: format!(
            "The surface sees the sky over F_sky = {} of its view and the ground over F_gnd = {} at T_gnd = {} K, both taken as black (the ground's emissivity is 0.9–0.97, common practice). One radiant temperature gives the same net exchange: T_r = (F_sky·T_sky⁴ + F_gnd·T_gnd⁴)^¼ = {} K, used in place of a surroundings temperature.",
            g(o.view.sky),
            g(o.view.ground),
            g(s.t_ground),
            g(w.env.t_radiant)
        ),
    });
    let unit = if s.shape.is_sphere() { "W" } else { "W/m" };
    let source = match &o.sun {
        None => "Typed irradiance".to_string(),
        Some((pos, elevation)) => {
            let when =
                crate::engine::outdoors::sun::Utc::minute_text(s.sun_time).unwrap_or_default();
            format!(
                "The sun by {} at {when}, latitude {}°, longitude {}°, site elevation {} m: zenith {}° (refracted), azimuth {}° from north, {} AU away; a clear sky by {} for a {} atmosphere (extraterrestrial {} W/m²)",
                crate::engine::outdoors::sun::SPA,
                g(s.latitude),
                g(s.longitude),
                g(*elevation),
                g(pos.zenith),
                g(pos.azimuth),
                g(pos.distance),
                irradiance::HOTTEL,
                s.climate.name(),
                g(irradiance::extraterrestrial_normal(pos.distance).unwrap_or(f64::NAN))
            )
        }
    };
    out.push(Step {
        title: "Sun",
        text: format!(
            "{}: beam G_bn = {} W/m² facing the sun, diffuse G_dh = {} W/m² and global G_gh = {} W/m² on level ground; solar absorptance α_s = {}, ground reflectance ρ_g = {}. The beam taken square to the axis (the worst case) on the projected area, {} of the surface; the diffuse sky and the ground's reflection on the whole surface through its views (an isotropic sky and ground, after {}): q_sun = α_s·(G_bn·{} + G_dh·F_sky + ρ_g·G_gh·F_gnd) = {} W/m² of surface, {} {} absorbed — a gain in the balance: conduction out = convection + radiation − sun.",
            source,
            g(o.irradiance.beam_normal),
            g(o.irradiance.diffuse_horizontal),
            g(o.irradiance.global_horizontal),
            g(s.absorptance),
            g(s.albedo),
            g(o.beam_share),
            irradiance::HOTTEL.split(" with ").nth(1).unwrap_or("Liu & Jordan (1960)"),
            g(o.beam_share),
            g(w.env.solar),
            g(w.q_solar_unit),
            unit
        ),
    });
    let t = s.terrain;
    let site = wind::STATION.terrain;
    let yaw = if o.yawed {
        let (_, cross) = wind::yaw_factors(s.yaw).unwrap_or((f64::NAN, f64::NAN));
        format!(
            " The wind meets the axis at δ = {}°: the yaw factor of {}, (sin²δ + 0.0169·cos²δ)^0.225 = {}, multiplies forced convection ({} gives {}, the cross-check).",
            g(s.yaw),
            wind::MORGAN,
            g(w.env.yaw),
            wind::IEEE_738,
            g(cross)
        )
    } else {
        " No yaw factor: a sphere or an upright body meets every level wind the same way."
            .to_string()
    };
    out.push(Step {
        title: "Wind at the body",
        text: format!(
            "{}: the typed speed U = {} m/s is a reading at {} m over terrain {} (z0 = {} m), carried by the logarithmic profile c_r(z) = k_r·ln(max(z, z_min)/z0), k_r = 0.19·(z0/0.05)^0.07, to {} m over terrain {} (z0 = {} m, z_min = {} m, k_r = {}): U_body = U·c_r(body)/c_r(reading) = {} m/s.{}",
            wind::EN_1991_1_4,
            g(s.speed),
            g(wind::STATION.height),
            site.category(),
            g(site.z0()),
            g(s.body_height),
            t.category(),
            g(t.z0()),
            g(t.z_min()),
            g(t.k_r()),
            g(o.wind_at_body),
            yaw
        ),
    });
    out
}
