//! A whole calculation: the inputs a user gives, their hard limits, the evaluation with its
//! working, and the link format that carries it.
//!
//! The scenario is a body in a cross-flow of a fluid: the choices (shape, axis, wind direction,
//! fluid, how pressure and humidity are given) and the numbers, all SI.

use crate::engine::atmosphere;
use crate::engine::body::{self, Analysis, Body};
pub use crate::engine::body::{Axis, Shape, Wind};
use crate::engine::correlations::internal::{pipe_flow, process_properties, PipeFlow};
use crate::engine::error::{finite_result, EngineError};
use crate::engine::heatloss::Job;
use crate::engine::job::Targets;
pub use crate::engine::job::{JobResult, Verdict, WallMaterial};
use crate::engine::layers::{Conductivity, Construction, Geometry, Layer};
use crate::engine::props::{Fluid, Glycol, Humidity, Properties, UserFluid};
use crate::engine::units::{self, format_sig, Dim, System, Unit};
use crate::engine::validity::Flag;

mod choices;
mod entry;
mod evaluate;
mod fields;
mod inspection;
#[cfg(test)]
mod inspection_tests;
mod link;
#[cfg(test)]
mod link_tests;
mod lower;
mod made;
#[cfg(test)]
mod made_tests;
mod outdoor;
#[cfg(test)]
mod outdoor_tests;
mod outdoor_working;
#[cfg(test)]
mod tests;
mod working;

pub use choices::*;
pub use entry::*;
pub use evaluate::*;
pub use fields::*;
pub(crate) use inspection::*;
pub use link::*;
pub(crate) use lower::Case;
pub use made::{Made, MADE_CAUTION};
pub use outdoor::*;
pub(crate) use working::*;

/// The inputs, SI: lengths m, speed m/s, temperatures K, pressure Pa, elevation m, fractions 0–1,
/// user-fluid properties in SI.
#[derive(Debug, Clone, Copy, PartialEq, serde::Serialize, serde::Deserialize)]
pub struct Scenario {
    pub shape: Shape,
    pub axis: Axis,
    pub wind: Wind,
    pub fluid: FluidKind,
    pub pressure_input: PressureInput,
    pub humidity_input: HumidityInput,
    pub diameter: f64,
    /// Length along the axis (the height when upright), m; not used for a sphere.
    pub length: f64,
    pub speed: f64,
    pub fluid_temp: f64,
    pub surface_temp: f64,
    pub pressure: f64,
    pub elevation: f64,
    pub relative_humidity: f64,
    pub dew_point: f64,
    pub glycol_fraction: f64,
    pub user_rho: f64,
    pub user_mu: f64,
    pub user_k: f64,
    pub user_cp: f64,
    pub user_beta: f64,
    pub surface_mode: SurfaceMode,
    pub wall: WallMaterial,
    /// Insulation layers over the wall, 0–3.
    pub layer_count: usize,
    pub process_temp: f64,
    /// Inside film coefficient, W/(m²·K); 0: not limiting.
    pub h_inside: f64,
    /// Typed, or computed from the flow of a process fluid (pipes only).
    pub inside: InsideFilm,
    /// Glycol mass fraction of a glycol process fluid, 0–0.6.
    pub process_glycol: f64,
    pub wall_thickness: f64,
    pub wall_k: f64,
    pub layer_t: [f64; 3],
    /// Each layer's conductivity at the data sheet's mean temperatures A and B.
    pub layer_ka: [f64; 3],
    pub layer_kb: [f64; 3],
    /// An optional third data-sheet point per layer (0: not given) at mean temperature C.
    pub layer_kc: [f64; 3],
    pub k_temp_a: f64,
    pub k_temp_b: f64,
    pub k_temp_c: f64,
    pub emissivity: f64,
    pub t_surround: f64,
    pub touch_limit: f64,
    pub dew_margin: f64,
    pub mass_flow: f64,
    pub process_cp: f64,
    pub hours: f64,
    /// Price per joule.
    pub price: f64,
    pub efficiency: f64,
    /// Target temperature for the lumped cooling of a solid body, K.
    pub cool_target: f64,
    /// Highest heat loss per metre of pipe wanted, W/m (0: none).
    pub loss_target: f64,
    /// Time still water must hold out before it has frozen through, s (0: none).
    pub freeze_target: f64,
    /// Indoors (today's single surroundings temperature) or outdoors (issue #19).
    pub setting: Setting,
    /// Outdoors: the terrain around the body (EN 1991-1-4 category).
    pub terrain: Terrain,
    /// Outdoors: cloud cover, oktas (0 clear – 8 overcast).
    pub cloud: f64,
    /// Outdoors: the ground's temperature, K (follows the stream's until set apart).
    pub t_ground: f64,
    /// Outdoors: the share of the surface's view that is sky, 0–1.
    pub sky_view: f64,
    /// Outdoors: beam irradiance normal to the sun, diffuse and global on the horizontal, W/m².
    pub beam_normal: f64,
    pub diffuse: f64,
    pub global: f64,
    /// Outdoors: solar absorptance of the outer surface, 0–1.
    pub absorptance: f64,
    /// Outdoors: the ground's solar reflectance, 0–1.
    pub albedo: f64,
    /// Outdoors: the body's height above the ground, m.
    pub body_height: f64,
    /// Outdoors: the wind's angle to the axis, degrees (90: square to it).
    pub yaw: f64,
    /// Read with an infrared instrument (issue #20): the temperature it displayed, K; the
    /// emissivity it was set to; the reflected apparent temperature it compensated with, K; its
    /// waveband, m; its stated accuracy, ± K; the surface emissivity's uncertainty, ±.
    pub ir_reading: f64,
    pub ir_emissivity: f64,
    pub ir_reflected: f64,
    pub ir_band_low: f64,
    pub ir_band_high: f64,
    pub ir_accuracy: f64,
    pub ir_emissivity_uncertainty: f64,
    /// Heat made inside (`SurfaceMode::Made`): given as a heat or a current; the heat per metre
    /// of a long body, W/m, or of a sphere, W; the current, A, with the resistance per metre at
    /// two data-sheet temperatures (Ω/m at K); the least surface temperature a heat must hold,
    /// and the most a conductor may reach, K.
    pub heat_source: HeatSource,
    pub heat_made: f64,
    pub heat_body: f64,
    pub current: f64,
    pub r_low: f64,
    pub t_r_low: f64,
    pub r_high: f64,
    pub t_r_high: f64,
    pub hold_temp: f64,
    pub conductor_limit: f64,
    /// Outdoors: sunlight typed, or a clear sky at a date, time and place — latitude and
    /// longitude, degrees (north and east positive), the instant as seconds since 1970-01-01
    /// 00:00 UTC, and the atmosphere's type for Hottel's clear-sky beam.
    pub sun_input: SunInput,
    pub latitude: f64,
    pub longitude: f64,
    pub sun_time: f64,
    pub climate: Climate,
}

/// The demo that opens by default (invented): a bare 2-inch line (60.3 mm outside diameter), a
/// 12 m horizontal run with its surface at 65 °C, crossing a roof in a 7 m/s wind of 5 °C air at
/// sea-level pressure, 70 % relative humidity.
pub const DEMO: Scenario = Scenario {
    shape: Shape::Cylinder,
    axis: Axis::Horizontal,
    wind: Wind::Horizontal,
    fluid: FluidKind::HumidAir,
    pressure_input: PressureInput::Absolute,
    humidity_input: HumidityInput::Relative,
    diameter: 0.0603,
    length: 12.0,
    speed: 7.0,
    fluid_temp: 278.15,
    surface_temp: 338.15,
    pressure: 101_325.0,
    elevation: 0.0,
    relative_humidity: 0.7,
    dew_point: 273.15,
    glycol_fraction: 0.3,
    // A light mineral oil near 40 °C (invented round values, typical magnitudes).
    user_rho: 860.0,
    user_mu: 0.03,
    user_k: 0.13,
    user_cp: 2000.0,
    user_beta: 7e-4,
    surface_mode: SurfaceMode::Given,
    wall: WallMaterial::CarbonSteel,
    layer_count: 1,
    process_temp: 343.15,
    h_inside: 0.0,
    inside: InsideFilm::Typed,
    process_glycol: 0.3,
    // 2-inch schedule 40 wall (ASME B36.10M, from memory).
    wall_thickness: 0.00391,
    wall_k: 45.0,
    // An invented mineral-wool-like layer for the demo: 40 mm, k 0.036 at 10 °C, 0.045 at 100 °C.
    layer_t: [0.04, 0.02, 0.02],
    layer_ka: [0.036, 0.036, 0.036],
    layer_kb: [0.045, 0.045, 0.045],
    layer_kc: [0.0, 0.0, 0.0],
    k_temp_a: 283.15,
    k_temp_b: 373.15,
    k_temp_c: 473.15,
    // Painted or oxidised steel (common practice).
    emissivity: 0.9,
    t_surround: 278.15,
    // 60 °C: common practice for a short touch; local codes govern.
    touch_limit: 333.15,
    dew_margin: 2.0,
    mass_flow: 0.0,
    process_cp: 4180.0,
    hours: 5000.0,
    // 0.06 per kWh (invented for the demo).
    price: 0.06 / 3.6e6,
    efficiency: 0.8,
    cool_target: 313.15,
    loss_target: 0.0,
    freeze_target: 0.0,
    setting: Setting::Indoors,
    terrain: Terrain::Open,
    // Clear: the coldest sky, the worst case for freezing and sweating.
    cloud: 0.0,
    t_ground: 278.15,
    sky_view: 0.5,
    // Night: no sun.
    beam_normal: 0.0,
    diffuse: 0.0,
    global: 0.0,
    // Dark paint or weathered steel (common practice).
    absorptance: 0.9,
    // Grass and soil (common practice).
    albedo: 0.2,
    // A low pipe rack (invented round value).
    body_height: 3.0,
    yaw: 90.0,
    // An invented reading of the insulated line: 7.5 °C on an instrument at its factory 0.95 (common
    // practice), the surroundings as the reflected temperature, the 8–14 µm band of most field
    // instruments, ±2 K and ±0.05 (common practice).
    ir_reading: 280.65,
    ir_emissivity: 0.95,
    ir_reflected: 278.15,
    ir_band_low: 8e-6,
    ir_band_high: 14e-6,
    ir_accuracy: crate::engine::inspect::DEFAULT_ACCURACY,
    ir_emissivity_uncertainty: crate::engine::inspect::DEFAULT_EMISSIVITY_UNCERTAINTY,
    // Heat made inside (invented magnitudes): a 20 W/m tracer, a 10 W heater in a sphere, 400 A
    // through a conductor of 0.080 Ω/km at 20 °C and 0.096 Ω/km at 75 °C.
    heat_source: HeatSource::Heat,
    heat_made: 20.0,
    heat_body: 10.0,
    current: 400.0,
    r_low: 8.0e-5,
    t_r_low: 293.15,
    r_high: 9.6e-5,
    t_r_high: 348.15,
    // 5 °C to hold a water line above freezing, 75 °C for a bare conductor (common practice).
    hold_temp: 278.15,
    conductor_limit: 348.15,
    // An invented site at 50° N, 10° E at noon UTC on the winter solstice of 2026.
    sun_input: SunInput::Typed,
    latitude: 50.0,
    longitude: 10.0,
    sun_time: 1_797_854_400.0,
    climate: Climate::MidlatitudeWinter,
};

pub const DEMO_TITLE: &str = "Demo: a bare 2-inch line on a windy roof";
