//! Outdoors (issue #19): the sky and the ground the surface radiates to, the sun it absorbs and
//! the wind at its height and angle, lowered once into what the surface balance needs. Indoors
//! the same four numbers are the typed surroundings, no sun, and the typed speed square to the
//! axis — exactly the arithmetic before outdoors existed (every factor is 1.0 or 0.0 there).

use super::*;
use crate::engine::error::Subject;
use crate::engine::outdoors::irradiance::{self, Irradiance};
use crate::engine::outdoors::sky::{self, Sky, ViewFactors};
use crate::engine::outdoors::sun::{self, SunPosition};
use crate::engine::outdoors::wind::{self, Exposure};
use crate::engine::validity::Flagged;

/// The hour of Berdahl & Martin's diurnal term: 6 h local solar time, where cos(2π·h/24) is
/// zero — the daily mean of the fit (±0.013 in emissivity, under 1 K of sky temperature), as
/// long as no time of day is an input.
pub const SKY_HOUR: f64 = 6.0;

/// What the surroundings bring to the surface balance.
#[derive(Debug, Clone, PartialEq)]
pub struct Surroundings {
    /// The one temperature the surface radiates to, K: the typed surroundings indoors, the sky
    /// and the ground by view factor outdoors ([`sky::radiant_surroundings`]).
    pub t_radiant: f64,
    /// Solar heat absorbed per m² of the outer surface, W/m² (0 indoors).
    pub solar: f64,
    /// The wind at the body over the typed speed (1 indoors).
    pub wind_ratio: f64,
    /// Factor on forced convection for the wind's angle to the axis (1 indoors, for a sphere or
    /// an upright body).
    pub yaw: f64,
    /// The derived outdoor numbers, none indoors.
    pub outdoor: Option<Outdoor>,
}

/// The outdoor numbers as the page shows them and the working explains them.
#[derive(Debug, Clone, PartialEq)]
pub struct Outdoor {
    pub sky: Sky,
    pub view: ViewFactors,
    pub irradiance: Irradiance,
    /// The share of the outer surface's area the beam falls on (its projected area over its
    /// surface: 1/π for a cylinder, 1/4 for a sphere, the width over the perimeter for a bar).
    pub beam_share: f64,
    /// The typed speed, carried to the body's height and terrain, m/s.
    pub wind_at_body: f64,
    /// Whether the yaw factor applies (a level cylinder or bar in a level wind).
    pub yawed: bool,
    /// The sun's position when the sunlight is a clear sky at a date, time and place (none
    /// when it is typed), and the site elevation that sky was worked out for, m.
    pub sun: Option<(SunPosition, f64)>,
    /// Flags of the sky model and the wind profile.
    pub flags: Vec<Flag>,
}

impl Scenario {
    /// Whether the body is outdoors.
    pub fn outdoors(&self) -> bool {
        self.setting == Setting::Outdoors
    }

    /// Whether a wind's angle to the axis matters: a level cylinder or bar in a level wind (not a
    /// sphere, not an upright body, which every level wind crosses square).
    pub fn yaw_applies(&self) -> bool {
        self.shape != Shape::Sphere
            && self.axis == Axis::Horizontal
            && self.wind == Wind::Horizontal
    }

    /// The surroundings of this scenario (see [`Surroundings`]); `dew_point` is the stream's
    /// (humid air only) and `p` the site pressure, Pa.
    pub fn surroundings(
        &self,
        dew_point: Option<f64>,
        p: f64,
    ) -> Result<Surroundings, EngineError> {
        if !self.outdoors() {
            return Ok(Surroundings {
                t_radiant: self.t_surround,
                solar: 0.0,
                wind_ratio: 1.0,
                yaw: 1.0,
                outdoor: None,
            });
        }
        let Some(dew_point) = dew_point else {
            return Err(EngineError::Undefined {
                subject: Subject::StreamFluid,
                quantity: "stream fluid",
                value: self.fluid_temp,
                unit: "K",
                why: "outdoors the sky's temperature comes from the air's dew point: choose humid air as the stream",
            });
        };
        let mut flags = Vec::new();
        let sky = sky::sky(self.fluid_temp, dew_point, SKY_HOUR, p, self.cloud)?;
        flags.extend(sky.flags);
        let view = ViewFactors::with_sky(self.sky_view)?;
        let t_radiant = sky::radiant_surroundings(view, sky.value.temperature, self.t_ground)?;
        let (irradiance, sun) = match self.sun_input {
            SunInput::Typed => (
                Irradiance::typed(self.beam_normal, self.diffuse, self.global)?,
                None,
            ),
            SunInput::Place => {
                let (pos, irr, elevation) = self.clear_sky(p)?;
                flags.extend(pos.flags);
                flags.extend(irr.flags);
                (irr.value, Some((pos.value, elevation)))
            }
        };
        let beam_share = match self.shape {
            Shape::Sphere => 0.25,
            Shape::Cylinder => 1.0 / std::f64::consts::PI,
            _ => {
                1.0 / self
                    .shape
                    .perimeter_over_d()
                    .unwrap_or(std::f64::consts::PI)
            }
        };
        // The beam square to the axis (the worst case, `irradiance::WORST_CASE_BEAM`) on the
        // projected area; the diffuse sky and the ground's reflection on the whole surface
        // through its views — `irradiance::absorbed_cylinder` and `absorbed_sphere` per m².
        let solar = self.absorptance
            * (irradiance.beam_normal * irradiance::WORST_CASE_BEAM * beam_share
                + irradiance.diffuse_horizontal * view.sky
                + self.albedo * irradiance.global_horizontal * view.ground);
        let solar = crate::engine::error::finite_result("absorbed solar heat", solar)?;
        let body = Exposure {
            height: self.body_height,
            terrain: self.terrain,
        };
        // The profile's ratio: the wind at the body is the reading times it, exactly as
        // `wind::speed_at` computes it (and the sweeps over the reading reuse it).
        let ratio = wind::speed_at(1.0, wind::STATION, body)?;
        flags.extend(ratio.flags);
        let yawed = self.yaw_applies();
        let yaw = if yawed {
            wind::yaw_factor(self.yaw)?
        } else {
            1.0
        };
        Ok(Surroundings {
            t_radiant,
            solar,
            wind_ratio: ratio.value,
            yaw,
            outdoor: Some(Outdoor {
                sky: sky.value,
                view,
                irradiance,
                beam_share,
                wind_at_body: crate::engine::error::finite_result(
                    "wind at the body",
                    self.speed * ratio.value,
                )?,
                yawed,
                sun,
                flags,
            }),
        })
    }

    /// The sun at the scenario's instant and site by NREL SPA (refracted through the stream's
    /// air at the site pressure `p`), and the clear-sky irradiance at its zenith by Hottel with
    /// Liu & Jordan for the chosen atmosphere, with the site elevation used, m: the typed one,
    /// or the standard atmosphere's for a typed pressure.
    pub fn clear_sky(
        &self,
        p: f64,
    ) -> Result<(Flagged<SunPosition>, Flagged<Irradiance>, f64), EngineError> {
        let elevation = match self.pressure_input {
            PressureInput::Elevation => self.elevation,
            PressureInput::Absolute => atmosphere::elevation_at(p),
        };
        let site = sun::Site {
            latitude: self.latitude,
            longitude: self.longitude,
            elevation,
        };
        let air = sun::Air {
            pressure: p,
            temperature: self.fluid_temp,
        };
        let at = sun::Utc::from_unix(self.sun_time)?;
        let pos = sun::position(&at, &site, &air, sun::DELTA_T_NOW)?;
        let g0 = irradiance::extraterrestrial_normal(pos.value.distance)?;
        let irr = irradiance::hottel_liu_jordan(pos.value.zenith, elevation, self.climate, g0)?;
        Ok((pos, irr, elevation))
    }
}
