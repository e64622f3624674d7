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
use crate::engine::heatloss::{Job, SIGMA};
use crate::engine::job::Targets;
pub use crate::engine::job::{JobResult, Verdict, WallMaterial};
use crate::engine::layers::{Conductivity, Construction, Geometry, Layer};
use crate::engine::props::{Fluid, Glycol, Humidity, Properties, UserFluid};
use crate::engine::units::{self, format_sig, Dim, System, Unit};
use crate::engine::validity::Flag;

/// The fluid of the stream.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum FluidKind {
    DryAir,
    HumidAir,
    Water,
    Steam,
    EthyleneGlycol,
    PropyleneGlycol,
    User,
}

impl FluidKind {
    pub const ALL: [FluidKind; 7] = [
        FluidKind::DryAir,
        FluidKind::HumidAir,
        FluidKind::Water,
        FluidKind::Steam,
        FluidKind::EthyleneGlycol,
        FluidKind::PropyleneGlycol,
        FluidKind::User,
    ];
    /// Stable id in links.
    pub fn id(&self) -> &'static str {
        match self {
            FluidKind::DryAir => "air",
            FluidKind::HumidAir => "humid",
            FluidKind::Water => "water",
            FluidKind::Steam => "steam",
            FluidKind::EthyleneGlycol => "eg",
            FluidKind::PropyleneGlycol => "pg",
            FluidKind::User => "user",
        }
    }
    pub fn label(&self) -> &'static str {
        match self {
            FluidKind::DryAir => "Dry air",
            FluidKind::HumidAir => "Humid air",
            FluidKind::Water => "Liquid water",
            FluidKind::Steam => "Steam",
            FluidKind::EthyleneGlycol => "Ethylene glycol–water",
            FluidKind::PropyleneGlycol => "Propylene glycol–water",
            FluidKind::User => "My own fluid (constant properties)",
        }
    }
    pub fn from_id(id: &str) -> Option<FluidKind> {
        FluidKind::ALL.into_iter().find(|f| f.id() == id)
    }
}

/// How the stream's pressure is given.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum PressureInput {
    Absolute,
    /// From the site elevation through the standard atmosphere.
    Elevation,
}

/// How humid air's moisture is given.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum HumidityInput {
    Relative,
    DewPoint,
}

/// Where the inside film coefficient of a pipe comes from: typed (0 for none), or computed from
/// the flow of a process fluid through the bore.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum InsideFilm {
    Typed,
    Water,
    EthyleneGlycol,
    PropyleneGlycol,
}

impl InsideFilm {
    pub const ALL: [InsideFilm; 4] = [
        InsideFilm::Typed,
        InsideFilm::Water,
        InsideFilm::EthyleneGlycol,
        InsideFilm::PropyleneGlycol,
    ];
    /// Stable id in links.
    pub fn id(&self) -> &'static str {
        match self {
            InsideFilm::Typed => "typed",
            InsideFilm::Water => "water",
            InsideFilm::EthyleneGlycol => "eg",
            InsideFilm::PropyleneGlycol => "pg",
        }
    }
    pub fn label(&self) -> &'static str {
        match self {
            InsideFilm::Typed => "Typed below (0: none)",
            InsideFilm::Water => "Flow of water",
            InsideFilm::EthyleneGlycol => "Flow of ethylene glycol–water",
            InsideFilm::PropyleneGlycol => "Flow of propylene glycol–water",
        }
    }
    pub fn from_id(id: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|m| m.id() == id)
    }
}

/// The inside film as a scenario has it, once worked out.
#[derive(Debug, Clone, PartialEq)]
pub enum Inside {
    /// Typed (0: none): the job takes `h_inside` as it stands.
    Typed,
    /// A process fluid is chosen but nothing flows: the bore is at the process temperature.
    Still(Properties),
    /// Worked out from the flow through the bore.
    Flowing(PipeFlow),
}

impl Inside {
    /// The process fluid's properties at the process temperature, when a fluid is chosen.
    pub fn props(&self) -> Option<&Properties> {
        match self {
            Inside::Typed => None,
            Inside::Still(p) => Some(p),
            Inside::Flowing(f) => Some(&f.props),
        }
    }
    /// The range flags of the process fluid and of the inside correlation.
    pub fn flags(&self) -> &[Flag] {
        match self {
            Inside::Typed => &[],
            Inside::Still(p) => &p.flags,
            Inside::Flowing(f) => &f.flags,
        }
    }
}

/// Whether the surface temperature is typed or solved from the process inside.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum SurfaceMode {
    Given,
    Solved,
}

/// The inputs, SI: lengths m, speed m/s, temperatures K, pressure Pa, elevation m, fractions 0–1,
/// user-fluid properties in SI.
#[derive(Debug, Clone, Copy, PartialEq)]
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
};

pub const DEMO_TITLE: &str = "Demo: a bare 2-inch line on a windy roof";

/// Which numeric input a value belongs to.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Field {
    Diameter,
    Length,
    Speed,
    FluidTemp,
    SurfaceTemp,
    Pressure,
    Elevation,
    RelativeHumidity,
    DewPoint,
    GlycolFraction,
    UserRho,
    UserMu,
    UserK,
    UserCp,
    UserBeta,
    ProcessTemp,
    HInside,
    ProcessGlycol,
    WallThickness,
    WallK,
    Emissivity,
    Surround,
    Layer1T,
    Layer1Ka,
    Layer1Kb,
    Layer2T,
    Layer2Ka,
    Layer2Kb,
    Layer3T,
    Layer3Ka,
    Layer3Kb,
    KTempA,
    KTempB,
    Layer1Kc,
    Layer2Kc,
    Layer3Kc,
    KTempC,
    TouchLimit,
    DewMargin,
    MassFlow,
    ProcessCp,
    Hours,
    Price,
    Efficiency,
    CoolTarget,
    LossTarget,
    FreezeTarget,
}

/// The group a field is shown in.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Group {
    Body,
    Stream,
    Surface,
    Layers,
    Job,
}

/// An input's label, dimension, link key and hard limits. The limits are where the computation
/// stops making physical sense (not a method's fitted range, which only flags).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FieldSpec {
    pub field: Field,
    pub group: Group,
    /// Key in the link fragment.
    pub key: &'static str,
    pub label: &'static str,
    pub dim: Dim,
    /// SI; `min_open` makes the lower limit exclusive.
    pub min: f64,
    pub min_open: bool,
    pub max: f64,
    pub help: &'static str,
}

const fn f(
    field: Field,
    group: Group,
    key: &'static str,
    label: &'static str,
    dim: Dim,
    (min, min_open, max): (f64, bool, f64),
    help: &'static str,
) -> FieldSpec {
    FieldSpec {
        field,
        group,
        key,
        label,
        dim,
        min,
        min_open,
        max,
        help,
    }
}

#[rustfmt::skip]
pub const FIELDS: [FieldSpec; 47] = [
    f(Field::Diameter, Group::Body, "D", "Size D", Dim::Length, (0.0, true, 100.0), "as drawn: the width across the stream (bare outside diameter of a pipe)"),
    f(Field::Length, Group::Body, "L", "Length", Dim::RunLength, (0.0, true, 10_000.0), "along the axis; the height when upright"),
    f(Field::Speed, Group::Stream, "U", "Stream speed", Dim::Speed, (0.0, false, 300.0), "across the axis; 0 for still air"),
    f(Field::FluidTemp, Group::Stream, "Ta", "Stream temperature", Dim::Temperature, (0.0, true, 3000.0), "of the approaching fluid"),
    f(Field::Pressure, Group::Stream, "p", "Pressure", Dim::Pressure, (0.0, true, 100e6), "absolute, at the site"),
    f(Field::Elevation, Group::Stream, "z", "Site elevation", Dim::Elevation, (-500.0, false, 11_000.0), "above sea level; standard atmosphere"),
    f(Field::RelativeHumidity, Group::Stream, "rh", "Relative humidity", Dim::Fraction, (0.0, false, 1.0), "to water above 0 °C, to ice below"),
    f(Field::DewPoint, Group::Stream, "td", "Dew point", Dim::Temperature, (0.0, true, 3000.0), "frost point below 0 °C"),
    f(Field::GlycolFraction, Group::Stream, "xg", "Glycol content", Dim::Fraction, (0.0, false, 0.6), "by mass, 0–60 %"),
    f(Field::UserRho, Group::Stream, "ur", "Density", Dim::Density, (0.0, true, 1e5), "of your fluid"),
    f(Field::UserMu, Group::Stream, "um", "Viscosity", Dim::DynamicViscosity, (0.0, true, 1e3), "dynamic, of your fluid"),
    f(Field::UserK, Group::Stream, "uk", "Thermal conductivity", Dim::ThermalConductivity, (0.0, true, 1e4), "of your fluid"),
    f(Field::UserCp, Group::Stream, "uc", "Heat capacity", Dim::SpecificHeat, (0.0, true, 1e6), "isobaric, of your fluid"),
    f(Field::UserBeta, Group::Stream, "ub", "Expansion coefficient β", Dim::ExpansionCoefficient, (0.0, false, 1.0), "volumetric; 0 if unknown"),
    f(Field::SurfaceTemp, Group::Surface, "Ts", "Surface temperature", Dim::Temperature, (0.0, true, 3000.0), "of the outer surface"),
    f(Field::ProcessTemp, Group::Surface, "Tp", "Process temperature", Dim::Temperature, (0.0, true, 3000.0), "of the fluid inside"),
    f(Field::HInside, Group::Surface, "hi", "Inside film coefficient", Dim::HeatTransferCoefficient, (0.0, false, 1e6), "0 if the bore sits at the process temperature"),
    f(Field::ProcessGlycol, Group::Surface, "xgp", "Glycol in the process fluid", Dim::Fraction, (0.0, false, 0.6), "by mass, 0–60 %"),
    f(Field::WallThickness, Group::Surface, "tw", "Wall thickness", Dim::Length, (0.0, false, 1.0), "of the pipe or vessel"),
    f(Field::WallK, Group::Surface, "kw", "Wall conductivity", Dim::ThermalConductivity, (0.0, true, 1e4), "of your wall material"),
    f(Field::Emissivity, Group::Surface, "e", "Emissivity", Dim::Ratio, (0.0, false, 1.0), "of the outer surface: about 0.9 painted or oxidised, 0.1 bright aluminium (common practice)"),
    f(Field::Surround, Group::Surface, "Tr", "Surroundings temperature", Dim::Temperature, (0.0, true, 3000.0), "what the surface sees (sky, walls); the stream's if unsure"),
    f(Field::Layer1T, Group::Layers, "t1", "Layer 1 thickness", Dim::Length, (0.0, false, 2.0), "innermost insulation"),
    f(Field::Layer1Ka, Group::Layers, "ka1", "Layer 1 k at mean temperature A", Dim::ThermalConductivity, (0.0, true, 100.0), "from the data sheet"),
    f(Field::Layer1Kb, Group::Layers, "kb1", "Layer 1 k at mean temperature B", Dim::ThermalConductivity, (0.0, true, 100.0), "the same as at A for a constant k"),
    f(Field::Layer2T, Group::Layers, "t2", "Layer 2 thickness", Dim::Length, (0.0, false, 2.0), "over layer 1"),
    f(Field::Layer2Ka, Group::Layers, "ka2", "Layer 2 k at mean temperature A", Dim::ThermalConductivity, (0.0, true, 100.0), "from the data sheet"),
    f(Field::Layer2Kb, Group::Layers, "kb2", "Layer 2 k at mean temperature B", Dim::ThermalConductivity, (0.0, true, 100.0), "the same as at A for a constant k"),
    f(Field::Layer3T, Group::Layers, "t3", "Layer 3 thickness", Dim::Length, (0.0, false, 2.0), "outermost"),
    f(Field::Layer3Ka, Group::Layers, "ka3", "Layer 3 k at mean temperature A", Dim::ThermalConductivity, (0.0, true, 100.0), "from the data sheet"),
    f(Field::Layer3Kb, Group::Layers, "kb3", "Layer 3 k at mean temperature B", Dim::ThermalConductivity, (0.0, true, 100.0), "the same as at A for a constant k"),
    f(Field::KTempA, Group::Layers, "Tka", "Mean temperature A", Dim::Temperature, (0.0, true, 3000.0), "of the data sheet's first k"),
    f(Field::KTempB, Group::Layers, "Tkb", "Mean temperature B", Dim::Temperature, (0.0, true, 3000.0), "of its second k"),
    f(Field::Layer1Kc, Group::Layers, "kc1", "Layer 1 k at mean temperature C", Dim::ThermalConductivity, (0.0, false, 100.0), "optional third point (0: k is linear through A and B)"),
    f(Field::Layer2Kc, Group::Layers, "kc2", "Layer 2 k at mean temperature C", Dim::ThermalConductivity, (0.0, false, 100.0), "optional third point (0: linear)"),
    f(Field::Layer3Kc, Group::Layers, "kc3", "Layer 3 k at mean temperature C", Dim::ThermalConductivity, (0.0, false, 100.0), "optional third point (0: linear)"),
    f(Field::KTempC, Group::Layers, "Tkc", "Mean temperature C", Dim::Temperature, (0.0, true, 3000.0), "of the data sheet's third k, if given"),
    f(Field::TouchLimit, Group::Job, "Tl", "Touch limit", Dim::Temperature, (0.0, true, 3000.0), "60 °C is common practice; local codes govern"),
    f(Field::DewMargin, Group::Job, "dm", "Margin above the dew point", Dim::TemperatureDifference, (0.0, false, 50.0), "for cold surfaces in humid air"),
    f(Field::LossTarget, Group::Job, "qt", "Loss target", Dim::HeatFlowPerLength, (0.0, false, 1e6), "highest loss per metre wanted; 0 for none"),
    f(Field::FreezeTarget, Group::Job, "tft", "Hold out against freezing for", Dim::Duration, (0.0, false, 3.6e7), "still water in frost; 0 for none"),
    f(Field::MassFlow, Group::Job, "mf", "Flow through the pipe", Dim::MassFlow, (0.0, false, 1e4), "0 for still water (then the freezing times)"),
    f(Field::ProcessCp, Group::Job, "cpp", "Heat capacity of the process fluid", Dim::SpecificHeat, (0.0, true, 1e6), "about 4180 J/(kg·K) for water"),
    f(Field::Hours, Group::Job, "hy", "Operating hours", Dim::HoursPerYear, (0.0, false, 8784.0), "per year"),
    f(Field::Price, Group::Job, "pe", "Energy price", Dim::EnergyPrice, (0.0, false, 1e-4), "of the fuel or power that makes up the loss"),
    f(Field::Efficiency, Group::Job, "ef", "Heater or boiler efficiency", Dim::Fraction, (0.01, false, 1.0), "share of that energy that becomes heat"),
    f(Field::CoolTarget, Group::Job, "T1", "Cool or warm a solid body to", Dim::Temperature, (0.0, true, 3000.0), "its cooling time in this stream (material above)"),
];

pub fn spec(field: Field) -> &'static FieldSpec {
    FIELDS
        .iter()
        .find(|s| s.field == field)
        .expect("every field has a spec")
}

impl Scenario {
    pub fn get(&self, f: Field) -> f64 {
        match f {
            Field::Diameter => self.diameter,
            Field::Length => self.length,
            Field::Speed => self.speed,
            Field::FluidTemp => self.fluid_temp,
            Field::SurfaceTemp => self.surface_temp,
            Field::Pressure => self.pressure,
            Field::Elevation => self.elevation,
            Field::RelativeHumidity => self.relative_humidity,
            Field::DewPoint => self.dew_point,
            Field::GlycolFraction => self.glycol_fraction,
            Field::UserRho => self.user_rho,
            Field::UserMu => self.user_mu,
            Field::UserK => self.user_k,
            Field::UserCp => self.user_cp,
            Field::UserBeta => self.user_beta,
            Field::ProcessTemp => self.process_temp,
            Field::HInside => self.h_inside,
            Field::ProcessGlycol => self.process_glycol,
            Field::WallThickness => self.wall_thickness,
            Field::WallK => self.wall_k,
            Field::Emissivity => self.emissivity,
            Field::Surround => self.t_surround,
            Field::Layer1T => self.layer_t[0],
            Field::Layer1Ka => self.layer_ka[0],
            Field::Layer1Kb => self.layer_kb[0],
            Field::Layer2T => self.layer_t[1],
            Field::Layer2Ka => self.layer_ka[1],
            Field::Layer2Kb => self.layer_kb[1],
            Field::Layer3T => self.layer_t[2],
            Field::Layer3Ka => self.layer_ka[2],
            Field::Layer3Kb => self.layer_kb[2],
            Field::KTempA => self.k_temp_a,
            Field::KTempB => self.k_temp_b,
            Field::Layer1Kc => self.layer_kc[0],
            Field::Layer2Kc => self.layer_kc[1],
            Field::Layer3Kc => self.layer_kc[2],
            Field::KTempC => self.k_temp_c,
            Field::TouchLimit => self.touch_limit,
            Field::DewMargin => self.dew_margin,
            Field::MassFlow => self.mass_flow,
            Field::ProcessCp => self.process_cp,
            Field::Hours => self.hours,
            Field::Price => self.price,
            Field::Efficiency => self.efficiency,
            Field::CoolTarget => self.cool_target,
            Field::LossTarget => self.loss_target,
            Field::FreezeTarget => self.freeze_target,
        }
    }

    pub fn set(&mut self, f: Field, v: f64) {
        let slot = match f {
            Field::Diameter => &mut self.diameter,
            Field::Length => &mut self.length,
            Field::Speed => &mut self.speed,
            Field::FluidTemp => &mut self.fluid_temp,
            Field::SurfaceTemp => &mut self.surface_temp,
            Field::Pressure => &mut self.pressure,
            Field::Elevation => &mut self.elevation,
            Field::RelativeHumidity => &mut self.relative_humidity,
            Field::DewPoint => &mut self.dew_point,
            Field::GlycolFraction => &mut self.glycol_fraction,
            Field::UserRho => &mut self.user_rho,
            Field::UserMu => &mut self.user_mu,
            Field::UserK => &mut self.user_k,
            Field::UserCp => &mut self.user_cp,
            Field::UserBeta => &mut self.user_beta,
            Field::ProcessTemp => &mut self.process_temp,
            Field::HInside => &mut self.h_inside,
            Field::ProcessGlycol => &mut self.process_glycol,
            Field::WallThickness => &mut self.wall_thickness,
            Field::WallK => &mut self.wall_k,
            Field::Emissivity => &mut self.emissivity,
            Field::Surround => &mut self.t_surround,
            Field::Layer1T => &mut self.layer_t[0],
            Field::Layer1Ka => &mut self.layer_ka[0],
            Field::Layer1Kb => &mut self.layer_kb[0],
            Field::Layer2T => &mut self.layer_t[1],
            Field::Layer2Ka => &mut self.layer_ka[1],
            Field::Layer2Kb => &mut self.layer_kb[1],
            Field::Layer3T => &mut self.layer_t[2],
            Field::Layer3Ka => &mut self.layer_ka[2],
            Field::Layer3Kb => &mut self.layer_kb[2],
            Field::KTempA => &mut self.k_temp_a,
            Field::KTempB => &mut self.k_temp_b,
            Field::Layer1Kc => &mut self.layer_kc[0],
            Field::Layer2Kc => &mut self.layer_kc[1],
            Field::Layer3Kc => &mut self.layer_kc[2],
            Field::KTempC => &mut self.k_temp_c,
            Field::TouchLimit => &mut self.touch_limit,
            Field::DewMargin => &mut self.dew_margin,
            Field::MassFlow => &mut self.mass_flow,
            Field::ProcessCp => &mut self.process_cp,
            Field::Hours => &mut self.hours,
            Field::Price => &mut self.price,
            Field::Efficiency => &mut self.efficiency,
            Field::CoolTarget => &mut self.cool_target,
            Field::LossTarget => &mut self.loss_target,
            Field::FreezeTarget => &mut self.freeze_target,
        };
        *slot = v;
    }

    /// Whether a field takes part in this scenario (the page hides the others).
    pub fn uses(&self, f: Field) -> bool {
        use FluidKind as K;
        match f {
            Field::Length => self.shape != Shape::Sphere,
            Field::Pressure => self.pressure_input == PressureInput::Absolute,
            Field::Elevation => self.pressure_input == PressureInput::Elevation,
            Field::RelativeHumidity => {
                self.fluid == K::HumidAir && self.humidity_input == HumidityInput::Relative
            }
            Field::DewPoint => {
                self.fluid == K::HumidAir && self.humidity_input == HumidityInput::DewPoint
            }
            Field::GlycolFraction => {
                matches!(self.fluid, K::EthyleneGlycol | K::PropyleneGlycol)
            }
            Field::UserRho | Field::UserMu | Field::UserK | Field::UserCp | Field::UserBeta => {
                self.fluid == K::User
            }
            Field::SurfaceTemp => !self.solved(),
            Field::ProcessTemp | Field::WallThickness => self.solved(),
            Field::HInside => self.solved() && !self.inside_computed(),
            Field::MassFlow | Field::LossTarget => self.offers_inside_film(),
            Field::ProcessGlycol => {
                self.inside_computed()
                    && matches!(
                        self.inside,
                        InsideFilm::EthyleneGlycol | InsideFilm::PropyleneGlycol
                    )
            }
            Field::WallK => self.solved() && self.wall == WallMaterial::User,
            Field::Layer1T
            | Field::Layer1Ka
            | Field::Layer1Kb
            | Field::Layer1Kc
            | Field::KTempA
            | Field::KTempB
            | Field::KTempC => self.solved() && self.layer_count >= 1,
            Field::Layer2T | Field::Layer2Ka | Field::Layer2Kb | Field::Layer2Kc => {
                self.solved() && self.layer_count >= 2
            }
            Field::Layer3T | Field::Layer3Ka | Field::Layer3Kb | Field::Layer3Kc => {
                self.solved() && self.layer_count >= 3
            }
            Field::FreezeTarget => self.offers_inside_film() && self.mass_flow == 0.0,
            Field::ProcessCp => self.offers_inside_film() && !self.inside_computed(),
            Field::CoolTarget => self.cools(),
            _ => true,
        }
    }

    /// The absolute pressure, Pa, whichever way it was given.
    pub fn pressure_pa(&self) -> f64 {
        match self.pressure_input {
            PressureInput::Absolute => self.pressure,
            PressureInput::Elevation => atmosphere::pressure_at(self.elevation),
        }
    }

    /// Whether the surface temperature is solved from the process inside (pipes and vessels only).
    pub fn solved(&self) -> bool {
        self.surface_mode == SurfaceMode::Solved
            && matches!(self.shape, Shape::Cylinder | Shape::Sphere)
    }

    /// A pipe carrying a process fluid, solved from inside: the flow, the inside-film choice, the
    /// loss and freezing targets apply (not to a sphere or a typed surface).
    pub fn offers_inside_film(&self) -> bool {
        self.solved() && self.shape == Shape::Cylinder
    }

    /// Whether the inside film is worked out from a process fluid's flow (solved pipes only).
    pub fn inside_computed(&self) -> bool {
        self.offers_inside_film() && self.inside != InsideFilm::Typed
    }

    /// The process fluid whose flow sets the inside film, when it is worked out.
    pub fn process_fluid(&self) -> Option<Fluid> {
        if !self.inside_computed() {
            return None;
        }
        Some(match self.inside {
            InsideFilm::EthyleneGlycol => Fluid::Glycol(Glycol::Ethylene, self.process_glycol),
            InsideFilm::PropyleneGlycol => Fluid::Glycol(Glycol::Propylene, self.process_glycol),
            _ => Fluid::Water,
        })
    }

    /// The inside film: typed, or the process fluid at the process temperature and, with a flow
    /// through the bore, the film it makes. A bore the wall leaves no room for is left to the
    /// construction's own check.
    pub fn inside_flow(&self) -> Result<Inside, EngineError> {
        let Some(fluid) = self.process_fluid() else {
            return Ok(Inside::Typed);
        };
        let props = process_properties(&fluid, self.process_temp).map_err(|e| match e {
            EngineError::WrongPhase {
                t, boundary, why, ..
            } => EngineError::WrongPhase {
                asked: PROCESS_FLUID,
                t,
                boundary,
                why,
            },
            other => other,
        })?;
        let d_in = self.diameter - 2.0 * self.wall_thickness;
        if self.mass_flow <= 0.0 || d_in <= 0.0 {
            return Ok(Inside::Still(props));
        }
        Ok(Inside::Flowing(pipe_flow(
            props,
            self.mass_flow,
            d_in,
            self.length,
        )?))
    }

    /// Whether the lumped cooling of a solid round bar or sphere is offered (surface typed).
    pub fn cools(&self) -> bool {
        !self.solved() && matches!(self.shape, Shape::Cylinder | Shape::Sphere)
    }

    /// Conductivity of insulation layer `i` as k(θ): linear through the data sheet's points at A
    /// and B, or the quadratic through A, B and C when a third k is given.
    pub fn layer_conductivity(&self, i: usize) -> Conductivity {
        let (x0, x1, x2) = (
            self.k_temp_a - 273.15,
            self.k_temp_b - 273.15,
            self.k_temp_c - 273.15,
        );
        let (k0, k1, k2) = (self.layer_ka[i], self.layer_kb[i], self.layer_kc[i]);
        let distinct = (x1 - x0).abs() > 1e-9 && (x2 - x0).abs() > 1e-9 && (x2 - x1).abs() > 1e-9;
        if k2 > 0.0 && distinct {
            // Newton's divided differences, expanded to a + b·θ + c·θ².
            let d01 = (k1 - k0) / (x1 - x0);
            let d02 = (k2 - k0) / (x2 - x0);
            let c = (d02 - d01) / (x2 - x1);
            let b = d01 - c * (x0 + x1);
            return Conductivity {
                a: k0 - b * x0 - c * x0 * x0,
                b,
                c,
            };
        }
        let slope = if (x1 - x0).abs() > 1e-9 {
            (k1 - k0) / (x1 - x0)
        } else {
            0.0
        };
        Conductivity {
            a: k0 - slope * x0,
            b: slope,
            c: 0.0,
        }
    }

    /// The construction from the bore outward: the wall, then the insulation layers.
    pub fn construction(&self) -> Construction {
        let geometry = if self.shape == Shape::Sphere {
            Geometry::Sphere
        } else {
            Geometry::Cylinder
        };
        let k_wall = self.wall.properties().map(|p| p.0).unwrap_or(self.wall_k);
        let mut layers = vec![Layer {
            thickness: self.wall_thickness,
            k: Conductivity::constant(k_wall),
        }];
        for i in 0..self.layer_count.min(3) {
            layers.push(Layer {
                thickness: self.layer_t[i],
                k: self.layer_conductivity(i),
            });
        }
        Construction {
            geometry,
            r_in: self.diameter / 2.0 - self.wall_thickness,
            layers,
        }
    }

    /// The body in its stream at pressure `p`, as the correlations see it (surface as typed).
    pub fn stream(&self, p: f64, fluid: Fluid) -> Body {
        Body {
            shape: self.shape,
            axis: self.axis,
            wind: if self.uses_wind() {
                self.wind
            } else {
                Wind::Horizontal
            },
            d: self.diameter,
            length: self.length,
            speed: self.speed,
            t_inf: self.fluid_temp,
            t_s: self.surface_temp,
            p,
            fluid,
        }
    }

    /// The field job: this scenario's process, construction and radiation around `stream`.
    pub fn job(&self, stream: Body) -> Job {
        Job {
            stream,
            process_temp: self.process_temp,
            h_inside: (self.h_inside > 0.0).then_some(self.h_inside),
            construction: self.construction(),
            emissivity: self.emissivity,
            t_surround: self.t_surround,
        }
    }

    /// As [`Scenario::job`], with the inside film of [`Scenario::inside_flow`] in place of the
    /// typed one when a process fluid is chosen.
    pub fn job_with(&self, stream: Body, inside: &Inside) -> Job {
        let mut j = self.job(stream);
        match inside {
            Inside::Typed => {}
            Inside::Still(_) => j.h_inside = None,
            Inside::Flowing(f) => j.h_inside = Some(f.h),
        }
        j
    }

    /// Whether the wind direction matters (it does not for an upright prism: any wind crosses it).
    pub fn uses_wind(&self) -> bool {
        self.shape == Shape::Sphere || self.axis == Axis::Horizontal
    }

    /// The engine's fluid for this scenario.
    pub fn fluid(&self) -> Fluid {
        match self.fluid {
            FluidKind::DryAir => Fluid::DryAir,
            FluidKind::HumidAir => {
                // The moisture is the stream's: fixed as a vapour pressure at T∞ and p, and carried
                // to the film and surface temperatures (not the same relative humidity there).
                let given = match self.humidity_input {
                    HumidityInput::Relative => Humidity::Relative(self.relative_humidity),
                    HumidityInput::DewPoint => Humidity::DewPoint(self.dew_point),
                };
                Fluid::HumidAir(
                    match crate::engine::props::humid_air::moisture(
                        self.fluid_temp,
                        self.pressure_pa(),
                        given,
                    ) {
                        Ok(m) => Humidity::VapourPressure(m.vapour_pressure),
                        Err(_) => given,
                    },
                )
            }
            FluidKind::Water => Fluid::Water,
            FluidKind::Steam => Fluid::Steam,
            FluidKind::EthyleneGlycol => Fluid::Glycol(Glycol::Ethylene, self.glycol_fraction),
            FluidKind::PropyleneGlycol => Fluid::Glycol(Glycol::Propylene, self.glycol_fraction),
            FluidKind::User => Fluid::User(UserFluid {
                rho: self.user_rho,
                mu: self.user_mu,
                k: self.user_k,
                cp: self.user_cp,
                beta: (self.user_beta > 0.0).then_some(self.user_beta),
            }),
        }
    }
}

/// Check an SI value against the field's hard limits. The message is written in `shown`, the
/// unit the user is looking at.
pub fn check_field(spec: &FieldSpec, si: f64, shown: &Unit) -> Result<f64, String> {
    let lim = |v: f64| format!("{} {}", format_sig(shown.from_si(v), 4), shown.symbol);
    if !si.is_finite() {
        return Err("the number is too large to use".into());
    }
    let too_low = if spec.min_open {
        si <= spec.min
    } else {
        si < spec.min
    };
    if too_low {
        if spec.dim == Dim::Temperature {
            return Err(format!("must be above absolute zero ({})", lim(0.0)));
        }
        let word = if spec.min_open {
            "more than"
        } else {
            "at least"
        };
        return Err(format!("must be {word} {}", lim(spec.min)));
    }
    if si > spec.max {
        return Err(format!("must be at most {}", lim(spec.max)));
    }
    Ok(si)
}

/// Parse a field's text typed in unit `shown` and check it: the value in SI, or the message to
/// show beside the field.
pub fn read_field(spec: &FieldSpec, text: &str, shown: &Unit) -> Result<f64, String> {
    let v = units::parse_number(text).map_err(|e| e.to_string())?;
    check_field(spec, shown.to_si(v), shown)
}

/// Where an evaluation error belongs on the page.
pub fn error_field(e: &EngineError) -> Option<Field> {
    match e {
        EngineError::NoTemperatureDifference { .. } => Some(Field::SurfaceTemp),
        EngineError::WrongPhase { asked, .. } if *asked == PROCESS_FLUID => {
            Some(Field::ProcessTemp)
        }
        EngineError::WrongPhase { .. } => Some(Field::FluidTemp),
        EngineError::NonFiniteResult { quantity } if quantity.contains("opposing") => {
            Some(Field::Speed)
        }
        EngineError::Undefined { quantity, .. } => match *quantity {
            "expansion coefficient β" => Some(Field::UserBeta),
            "bore radius" => Some(Field::WallThickness),
            "layer conductivity" => Some(Field::Layer1Kb),
            "mean temperature B" => Some(Field::KTempB),
            "mean temperature C" => Some(Field::KTempC),
            "emissivity" => Some(Field::Emissivity),
            "relative humidity" | "vapour pressure" => Some(Field::RelativeHumidity),
            "dew point" => Some(Field::DewPoint),
            "glycol concentration" => Some(Field::GlycolFraction),
            _ => None,
        },
        _ => None,
    }
}

/// How a phase error of the process fluid names it, so the page puts it beside the process
/// temperature.
pub const PROCESS_FLUID: &str = "the process fluid";

/// One step of the working, written so it can be checked by hand.
#[derive(Debug, Clone, PartialEq)]
pub struct Step {
    pub title: &'static str,
    pub text: String,
}

/// The properties used at one temperature, and why that temperature.
#[derive(Debug, Clone, PartialEq)]
pub struct PropertyRow {
    pub role: &'static str,
    pub props: Properties,
}

/// Everything the page shows for one evaluation, SI.
#[derive(Debug, Clone, PartialEq)]
pub struct Outcome {
    pub shape: Shape,
    pub fluid: &'static str,
    pub pressure: f64,
    pub film_temp: f64,
    /// Dew point of humid air, K.
    pub dew_point: Option<f64>,
    pub properties: Vec<PropertyRow>,
    /// Re and Pr of the recommended forced correlation, at its reference temperature.
    pub reynolds: f64,
    pub prandtl: f64,
    /// Nu = h·D/k of the answer, k at the film temperature.
    pub nusselt: f64,
    /// The answer: mean convective heat-transfer coefficient, W/(m²·K).
    pub h: f64,
    /// Heat flow per metre of length, convection plus radiation, W/m (positive from the surface
    /// outward); none for a sphere.
    pub q_per_length: Option<f64>,
    /// Heat flow from the whole body (over the length L for a prism), W.
    pub q_total: f64,
    /// The convective and radiative parts of `q_total`, W.
    pub q_conv_total: f64,
    pub q_rad_total: f64,
    /// Linearised radiation coefficient εσ(Ts² + Tsur²)(Ts + Tsur), W/(m²·K).
    pub h_rad: f64,
    /// Surface temperature: as typed, or solved from the process inside.
    pub surface_temp: f64,
    /// Outer diameter the stream sees (over the insulation when solved), m.
    pub outer_d: f64,
    /// The solved job (process inside, layers) when the surface temperature is worked out.
    pub job: Option<JobResult>,
    /// The inside film worked out from the flow through the bore, when it is.
    pub inside: Option<PipeFlow>,
    /// Verdict cards: touch, condensation, freezing, the run, insulated against bare.
    pub verdicts: Vec<Verdict>,
    /// Energy bought per year to make up the loss, J/yr, and its cost per year.
    pub annual_energy: f64,
    pub annual_cost: f64,
    /// Loss and surface temperature against the outer layer's thickness (solved, with layers):
    /// (thickness m, heat flow W, surface K).
    pub thickness_sweep: Vec<(f64, f64, f64)>,
    /// Targets to mark on the plots: on heat flow over the run (the loss target per metre times
    /// the length), W; on surface temperature (the touch limit, the dew point plus the margin), K.
    pub loss_marks: Vec<(&'static str, f64)>,
    pub surface_marks: Vec<(&'static str, f64)>,
    /// Heat-transfer coefficient and heat flow against stream speed 0–20 m/s: (speed m/s,
    /// h W/(m²·K), heat flow W, surface K).
    pub wind_sweep: Vec<(f64, f64, f64, f64)>,
    /// The recommended forced correlation's name.
    pub method: &'static str,
    pub regime: &'static str,
    pub analysis: Analysis,
    /// Flags on the answer: properties, the recommended correlation, natural convection, blend.
    pub flags: Vec<Flag>,
    pub working: Vec<Step>,
}

/// Evaluate a scenario. Errors only where nothing meaningful can be computed.
pub fn evaluate(s: &Scenario) -> Result<Outcome, EngineError> {
    evaluate_with(s, true)
}

/// As [`evaluate`]; without the sweeps (the plots' data) and the written working when `sweeps` is
/// false, for lists.
pub fn evaluate_with(s: &Scenario, sweeps: bool) -> Result<Outcome, EngineError> {
    for spec in FIELDS.iter().filter(|sp| s.uses(sp.field)) {
        let v = s.get(spec.field);
        let si_unit = units::units_of(spec.dim).next().expect("SI unit");
        check_field(spec, v, si_unit).map_err(|_| EngineError::Undefined {
            quantity: spec.label,
            value: v,
            unit: si_unit.symbol,
            why: "outside the physical limits of the input",
        })?;
    }
    if !s.solved() && s.surface_temp == s.fluid_temp {
        return Err(EngineError::NoTemperatureDifference {
            value: s.fluid_temp,
            unit: "K",
        });
    }
    let p = s.pressure_pa();
    let fluid = s.fluid();
    let mut flags = Vec::new();
    if s.pressure_input == PressureInput::Elevation {
        flags.extend(atmosphere::TROPOSPHERE.check("standard atmosphere", s.elevation, false));
    }
    let dew_point = match fluid {
        Fluid::HumidAir(h) => {
            Some(crate::engine::props::humid_air::moisture(s.fluid_temp, p, h)?.dew_point)
        }
        _ => None,
    };
    let stream = s.stream(p, fluid);
    let inside = s.inside_flow()?;
    let targets = Targets {
        touch_limit: s.touch_limit,
        dew_point,
        dew_margin: s.dew_margin,
        hours: s.hours,
        price: s.price,
        efficiency: s.efficiency,
        mass_flow: s.mass_flow,
        process_cp: inside.props().map(|pr| pr.cp).unwrap_or(s.process_cp),
        process_water: !matches!(s.process_fluid(), Some(Fluid::Glycol(..))),
        wall_heat_capacity: s.wall.properties().map(|(_, rho, cp)| {
            let r1 = s.diameter / 2.0;
            let r0 = r1 - s.wall_thickness;
            rho * cp * std::f64::consts::PI * (r1 * r1 - r0 * r0)
        }),
        loss_target: s.loss_target,
        freeze_target: s.freeze_target,
    };
    let (a, ts, outer_d, job_result) = if s.solved() {
        if s.layer_count > 0 && (s.k_temp_a - s.k_temp_b).abs() < 1e-9 && s.layer_ka != s.layer_kb {
            return Err(EngineError::Undefined {
                quantity: "mean temperature B",
                value: s.k_temp_b,
                unit: "K",
                why: "the two data-sheet mean temperatures must differ when the two k values do",
            });
        }
        let third = s.layer_kc[..s.layer_count.min(3)].iter().any(|k| *k > 0.0);
        if third
            && ((s.k_temp_c - s.k_temp_a).abs() < 1e-9 || (s.k_temp_c - s.k_temp_b).abs() < 1e-9)
        {
            return Err(EngineError::Undefined {
                quantity: "mean temperature C",
                value: s.k_temp_c,
                unit: "K",
                why:
                    "the third data-sheet point needs its own mean temperature, apart from A and B",
            });
        }
        let job = s.job_with(stream, &inside);
        let mut r = crate::engine::job::evaluate(&job, &targets, s.layer_count)?;
        if let Inside::Still(_) = &inside {
            r.notes.push("No flow through the pipe: the inside film is not worked out, and the bore is taken at the process temperature (still fluid).".into());
        }
        let a = r
            .solution
            .loss
            .analysis
            .clone()
            .ok_or(EngineError::NoTemperatureDifference {
                value: s.fluid_temp,
                unit: "K",
            })?;
        (a, r.solution.t_surface, r.solution.outer_d, Some(r))
    } else {
        (body::analyse(&stream)?, s.surface_temp, s.diameter, None)
    };
    let thickness_sweep = match &job_result {
        Some(_) if sweeps && s.layer_count > 0 => {
            let i = s.layer_count - 1;
            let top = (2.0 * s.layer_t[i]).max(0.1);
            grid_with(top, 12, s.layer_t[i])
                .into_iter()
                .filter_map(|x| {
                    let mut t = *s;
                    t.layer_t[i] = x;
                    let o = quick(&t, p, fluid, &inside).ok()?;
                    (o.0.is_finite() && o.1.is_finite()).then_some((x, o.0, o.1))
                })
                .collect()
        }
        _ => Vec::new(),
    };
    let wind_sweep = if sweeps {
        grid_with(20.0, 10, s.speed)
    } else {
        Vec::new()
    }
    .into_iter()
    .filter_map(|u| {
        let mut t = *s;
        t.speed = u;
        let o = quick(&t, p, fluid, &inside).ok()?;
        (o.0.is_finite() && o.1.is_finite() && o.2.is_finite()).then_some((u, o.2, o.0, o.1))
    })
    .collect();
    let film = a.film.t;
    let rec = a.recommended().clone();
    let h = a.h;
    let dt = ts - s.fluid_temp;
    let h_rad = crate::engine::heatloss::radiation_coefficient(s.emissivity, ts, s.t_surround);
    let rad_flux = s.emissivity * SIGMA * (ts.powi(4) - s.t_surround.powi(4));
    let (area_unit, run) = match s.shape.perimeter_over_d() {
        Some(k) => (k * outer_d, s.length),
        None => (std::f64::consts::PI * outer_d * outer_d, 1.0),
    };
    let q_conv_unit = finite_result("convective heat flow", h * area_unit * dt)?;
    let q_rad_unit = finite_result("radiative heat flow", area_unit * rad_flux)?;
    let q_unit = q_conv_unit + q_rad_unit;
    let q_per_length = s.shape.perimeter_over_d().map(|_| q_unit);
    let q_total = finite_result("heat flow", q_unit * run)?;
    let annual_energy = finite_result(
        "energy per year",
        crate::engine::job::annual_energy(q_total, s.hours, s.efficiency),
    )?;
    let annual_cost = finite_result("cost per year", annual_energy * s.price)?;
    let mut verdicts = match &job_result {
        Some(r) => r.verdicts.clone(),
        None => given_verdicts(s, ts, dew_point),
    };
    if s.cools() {
        if let Some(m) = s.wall.properties() {
            verdicts.push(crate::engine::job::lumped(
                s.shape == Shape::Sphere,
                outer_d,
                h + h_rad,
                m,
                s.fluid_temp,
                ts,
                s.cool_target,
            ));
        }
    }
    crate::engine::job::sanitize(&mut verdicts);
    let nusselt = finite_result("Nusselt number", h * outer_d / a.film.k)?;

    for props in [&a.film, &a.free, &a.surface] {
        for f in &props.flags {
            if !flags.contains(f) {
                flags.push(f.clone());
            }
        }
    }
    flags.extend(rec.flags.iter().cloned());
    if let Some(n) = &a.natural {
        flags.extend(n.flags.iter().cloned());
    }
    flags.extend(a.flags.iter().cloned());
    for f in inside.flags() {
        if !flags.contains(f) {
            flags.push(f.clone());
        }
    }

    let w = WorkingInputs {
        p,
        dew_point,
        fluid: fluid.name(),
        ts,
        outer_d,
        q_conv_unit,
        q_rad_unit,
        h_rad,
        q_total,
        job: job_result.as_ref(),
        inside: &inside,
    };
    let working = if sweeps {
        working(s, &a, &w)
    } else {
        Vec::new()
    };
    let role = |r: &str| -> &'static str {
        match r {
            "film" => "film temperature Tf: Churchill–Bernstein, Hilpert, Ranz–Marshall, Jakob, natural convection",
            "free" => "free stream T∞: Zukauskas, Whitaker, Gnielinski",
            _ => "surface Ts: Pr_s and μs of the corrections",
        }
    };
    Ok(Outcome {
        shape: s.shape,
        fluid: fluid.name(),
        pressure: p,
        film_temp: film,
        dew_point,
        properties: vec![
            PropertyRow {
                role: role("film"),
                props: a.film.clone(),
            },
            PropertyRow {
                role: role("free"),
                props: a.free.clone(),
            },
            PropertyRow {
                role: role("surface"),
                props: a.surface.clone(),
            },
        ],
        reynolds: rec.groups.re,
        prandtl: rec.groups.pr,
        nusselt,
        h,
        q_per_length,
        q_total,
        q_conv_total: q_conv_unit * run,
        q_rad_total: q_rad_unit * run,
        h_rad,
        surface_temp: ts,
        outer_d,
        job: job_result,
        inside: match inside {
            Inside::Flowing(f) => Some(f),
            _ => None,
        },
        verdicts,
        annual_energy,
        annual_cost,
        thickness_sweep,
        wind_sweep,
        loss_marks: if s.uses(Field::LossTarget) && s.loss_target > 0.0 {
            vec![("loss target", s.loss_target * s.length)]
        } else {
            Vec::new()
        },
        surface_marks: std::iter::once(("touch limit", s.touch_limit))
            .chain(dew_point.map(|td| ("dew point + margin", td + s.dew_margin)))
            .collect(),
        method: rec.name,
        regime: s.shape.regime(rec.groups.re),
        analysis: a,
        flags,
        working,
    })
}

/// `steps` equal steps over 0..=top, with `also` (the operating point) put in its place, so the
/// plotted curve passes through the point marked on it.
fn grid_with(top: f64, steps: usize, also: f64) -> Vec<f64> {
    let mut g: Vec<f64> = (0..=steps).map(|k| top * k as f64 / steps as f64).collect();
    if also.is_finite() && also >= 0.0 && !g.contains(&also) {
        g.push(also);
        g.sort_by(|a, b| a.total_cmp(b));
    }
    g
}

/// The heat flow (W, whole run or body), surface temperature and convective h of a scenario, without
/// the working or the verdicts: what the sweeps need.
fn quick(
    s: &Scenario,
    p: f64,
    fluid: Fluid,
    inside: &Inside,
) -> Result<(f64, f64, f64), EngineError> {
    let stream = s.stream(p, fluid);
    let run = if s.shape == Shape::Sphere {
        1.0
    } else {
        s.length
    };
    if s.solved() {
        let job = s.job_with(stream, inside);
        let sol = crate::engine::heatloss::solve_lean(&job)?;
        Ok((sol.q * run, sol.t_surface, sol.loss.h_conv))
    } else {
        let l = crate::engine::heatloss::surface_loss_lean(
            &stream,
            s.diameter,
            s.surface_temp,
            s.emissivity,
            s.t_surround,
        )?;
        Ok(((l.q_conv + l.q_rad) * run, s.surface_temp, l.h_conv))
    }
}

struct WorkingInputs<'a> {
    p: f64,
    dew_point: Option<f64>,
    fluid: &'a str,
    ts: f64,
    outer_d: f64,
    q_conv_unit: f64,
    q_rad_unit: f64,
    h_rad: f64,
    q_total: f64,
    job: Option<&'a JobResult>,
    inside: &'a Inside,
}

/// Touch and condensation verdicts for a typed surface temperature (no thickness to offer).
fn given_verdicts(s: &Scenario, ts: f64, dew_point: Option<f64>) -> Vec<Verdict> {
    use crate::engine::job::{DEW_CAUTION, TOUCH_CAUTION};
    let mut out = Vec::new();
    if ts > s.touch_limit {
        out.push(Verdict {
            id: "touch",
            title: "Touch",
            ok: false,
            summary: "The surface is above the touch limit. Work out the surface from the process temperature with an insulation layer to see the thickness that meets it.".into(),
            figures: vec![("surface", ts, Dim::Temperature), ("limit", s.touch_limit, Dim::Temperature)],
            caution: Some(TOUCH_CAUTION),
        });
    }
    if let Some(td) = dew_point {
        if ts < td + s.dew_margin {
            out.push(Verdict {
                id: "dew",
                title: "Condensation",
                ok: false,
                summary: "The surface is below the dew point plus the margin: it will sweat."
                    .into(),
                figures: vec![
                    ("surface", ts, Dim::Temperature),
                    ("dew point", td, Dim::Temperature),
                    ("margin", s.dew_margin, Dim::TemperatureDifference),
                ],
                caution: Some(DEW_CAUTION),
            });
        }
    }
    out
}

/// One property set in words for the working: "`fluid` `at` T K, p Pa: ρ = …".
fn property_text(fluid: &str, at: &str, pr: &Properties) -> String {
    let g = |v: f64| format_sig(v, 5);
    format!(
        "{fluid} {at} {} K, {} Pa: ρ = {} kg/m³, μ = {} Pa·s, k = {} W/(m·K), cp = {} J/(kg·K); ν = μ/ρ = {} m²/s, Pr = {}",
        g(pr.t),
        g(pr.p),
        g(pr.rho),
        g(pr.mu),
        g(pr.k),
        g(pr.cp),
        g(pr.nu),
        g(pr.pr)
    )
}

fn working(s: &Scenario, a: &Analysis, w: &WorkingInputs) -> Vec<Step> {
    let g = |v: f64| format_sig(v, 5);
    let rec = a.recommended();
    let mut out = Vec::new();
    if let Some(pr) = w.inside.props() {
        let props = property_text(
            s.process_fluid().map(|f| f.name()).unwrap_or(""),
            "at the process temperature",
            pr,
        );
        let text = match w.inside {
            Inside::Flowing(f) => {
                let formula = match f.regime {
                    crate::engine::correlations::internal::PipeRegime::Laminar => format!(
                        "VDI Heat Atlas G1, laminar: Gz = Re·Pr·d/L = {}; Nu = [3.66³ + 0.7³ + (1.615·Gz^⅓ − 0.7)³ + ((2/(1 + 22·Pr))^⅙·Gz^½)³]^⅓",
                        g(f.d / f.length * f.re * f.pr)
                    ),
                    crate::engine::correlations::internal::PipeRegime::Transition { weight } => format!(
                        "VDI Heat Atlas G1: interpolated with weight γ = (Re − 2300)/(10⁴ − 2300) = {} between the laminar form at Re = 2300 and the turbulent one at Re = 10⁴",
                        g(weight)
                    ),
                    crate::engine::correlations::internal::PipeRegime::Turbulent => format!(
                        "VDI Heat Atlas G1 (Gnielinski), with Konakov's ξ = (1.8·log₁₀Re − 1.5)⁻² = {}: Nu = (ξ/8)·Re·Pr / (1 + 12.7·√(ξ/8)·(Pr^⅔ − 1)) · (1 + (d/L)^⅔)",
                        g(crate::engine::correlations::internal::konakov(f.re))
                    ),
                };
                format!(
                    "{props}. Bore d = {} m, run L = {} m, flow ṁ = {} kg/s, mean velocity {} m/s; Re = 4ṁ/(π·d·μ) = {}, {}. {} = {}; h_i = Nu·k/d = {} W/(m²·K). Properties at the bulk temperature, no wall-property correction.",
                    g(f.d),
                    g(f.length),
                    g(f.mass_flow),
                    g(f.velocity),
                    g(f.re),
                    f.regime.describe(),
                    formula,
                    g(f.nu),
                    g(f.h)
                )
            }
            _ => format!("{props}. No flow through the bore: the inside film is not worked out; the bore is at the process temperature."),
        };
        out.push(Step {
            title: "Inside film (flow through the bore)",
            text,
        });
    }
    if let Some(j) = w.job {
        let sol = &j.solution;
        let temps = sol
            .interfaces
            .iter()
            .map(|t| format!("{} K", g(*t)))
            .collect::<Vec<_>>()
            .join(" → ");
        out.push(Step {
            title: "Surface temperature (energy balance)",
            text: format!(
                "Process {} K inside; conduction through the wall and {} insulation layer(s) (integral-mean k) equals convection plus radiation outside. Solved for the heat flow by bracketed regula falsi (Anderson–Björck) in {} iterations, residual {} W/m (or W); outer diameter {} m. Bore {} K, then {}.",
                g(s.process_temp),
                s.layer_count,
                sol.iterations,
                format_sig(sol.residual, 2),
                g(sol.outer_d),
                g(sol.t_bore),
                temps
            ),
        });
    }
    out.push(Step {
        title: "Temperatures",
        text: format!(
            "Free stream T∞ = {} K, surface Ts = {} K, film Tf = (Ts + T∞)/2 = {} K. Each correlation takes its properties where its authors did: {} at the {}.",
            g(s.fluid_temp),
            g(w.ts),
            g(a.film.t),
            rec.name,
            rec.reference.describe()
        ),
    });
    if s.pressure_input == PressureInput::Elevation {
        out.push(Step {
            title: "Pressure from elevation",
            text: format!(
                "ISO 2533 standard atmosphere at {} m: p = 101325 Pa × (1 − 0.0065 × {} / 288.15)^5.2559 = {} Pa",
                g(s.elevation),
                g(s.elevation),
                g(w.p)
            ),
        });
    }
    if let Some(td) = w.dew_point {
        out.push(Step {
            title: "Moisture",
            text: format!("Dew point of the stream: {} K", g(td)),
        });
    }
    for (title, pr) in [
        ("Properties at Tf", &a.film),
        ("Properties at T∞", &a.free),
        ("Properties at Ts", &a.surface),
    ] {
        out.push(Step {
            title,
            text: property_text(w.fluid, "at", pr),
        });
    }
    let at = if rec.reference == crate::engine::correlations::Reference::Film {
        &a.film
    } else {
        &a.free
    };
    out.push(Step {
        title: "Reynolds and Prandtl numbers",
        text: format!(
            "Re = U·D/ν = {} m/s × {} m / {} m²/s = {}; Pr = {} (at {})",
            g(s.speed),
            g(w.outer_d),
            g(at.nu),
            g(rec.groups.re),
            g(rec.groups.pr),
            rec.reference.short()
        ),
    });
    out.push(Step {
        title: "Forced convection (recommended correlation)",
        text: format!(
            "{}: {}{} = {}; h_F = Nu·k/D = {} × {} W/(m·K) / {} m = {} W/(m²·K)",
            rec.name,
            rec.formula,
            rec.detail().map(|d| format!(" ({d})")).unwrap_or_default(),
            g(rec.nu),
            g(rec.nu),
            g(rec.k),
            g(w.outer_d),
            g(rec.h)
        ),
    });
    let shares: Vec<String> = a
        .pick
        .shares()
        .map(|(i, wt)| {
            format!(
                "{} % × {} W/(m²·K) ({})",
                g(100.0 * wt),
                g(a.forced[i].h),
                a.forced[i].name
            )
        })
        .collect();
    out.push(Step {
        title: "Why this correlation",
        text: if shares.len() > 1 {
            format!(
                "{} h_F = {} = {} W/(m²·K).",
                a.reason(),
                shares.join(" + "),
                g(a.h_forced)
            )
        } else {
            a.reason()
        },
    });
    match &a.natural {
        Some(n) => {
            out.push(Step {
                title: "Natural convection",
                text: format!(
                    "Gr = g·β·|Ts − T∞|·L³/ν² = {} on L = {} m, Ra = Gr·Pr = {}; {}: {} = {}; h_N = {} W/(m²·K)",
                    g(n.gr),
                    g(n.length),
                    g(n.ra),
                    n.name,
                    n.formula,
                    g(n.nu),
                    g(n.h)
                ),
            });
            out.push(Step {
                title: "Mixed convection",
                text: format!(
                    "Stream {}; Churchill's blend, n = {}, shared still-fluid limit added back: h = {} W/(m²·K). {}.",
                    a.direction.describe(),
                    g(a.exponent),
                    g(a.h),
                    a.mode()
                ),
            });
        }
        None => out.push(Step {
            title: "Natural convection",
            text: "Not included: the fluid's expansion coefficient β is not given.".into(),
        }),
    }
    out.push(Step {
        title: "Radiation",
        text: format!(
            "q_rad = ε·σ·(Ts⁴ − Tsur⁴) per m² with ε = {}, σ = 5.670374419×10⁻⁸ W/(m²·K⁴), Tsur = {} K; linearised h_rad = εσ(Ts² + Tsur²)(Ts + Tsur) = {} W/(m²·K)",
            g(s.emissivity),
            g(s.t_surround),
            g(w.h_rad)
        ),
    });
    let dt = w.ts - s.fluid_temp;
    let text = match s.shape.perimeter_over_d() {
        Some(k) => format!(
            "q′ = h·P·(Ts − T∞) + q′_rad = {} × {} m × {} K + {} W/m = {} W/m, P = {}·D; over L = {} m: Q = {} W",
            g(a.h),
            g(k * w.outer_d),
            g(dt),
            g(w.q_rad_unit),
            g(w.q_conv_unit + w.q_rad_unit),
            g(k),
            g(s.length),
            g(w.q_total)
        ),
        None => format!(
            "Q = h·π·D²·(Ts − T∞) + Q_rad = {} × π × ({} m)² × {} K + {} W = {} W",
            g(a.h),
            g(w.outer_d),
            g(dt),
            g(w.q_rad_unit),
            g(w.q_total)
        ),
    };
    out.push(Step {
        title: "Heat flow",
        text,
    });
    out
}

/// The cautions that apply to this result: hot surface (above the touch limit), condensation,
/// freezing. Each defers to local codes and licensed practice.
pub fn cautions(s: &Scenario, o: &Outcome) -> Vec<&'static str> {
    let mut out = Vec::new();
    let ts = o.surface_temp;
    if ts >= s.touch_limit {
        out.push("Hot surface: at this temperature bare skin can be burned on contact. Guard or insulate it and follow the personnel-protection rules of your local codes; verify with a contact thermometer before touching.");
    }
    if o.dew_point.is_some_and(|td| ts <= td) {
        out.push("The surface is at or below the stream's dew point: moisture will condense on it. Condensate wets insulation and corrodes steel; a vapour-tight design is a matter for a qualified designer and local codes.");
    }
    if ts < 273.15 {
        out.push("The surface is below freezing: frost or ice can form on it, and water inside a line this cold can freeze and burst it. Follow local codes and licensed practice for freeze protection.");
    }
    out
}

/// The link format's version. See README "Links".
pub const LINK_VERSION: u32 = 1;
/// Longest fragment read; anything longer is refused unread.
pub const LINK_MAX_LEN: usize = 2048;

/// Encode a scenario and the unit system as a URL fragment (without the `#`). Values are SI at
/// full precision (shortest round-trip form), so a link reproduces the calculation exactly. Only
/// the fields the scenario uses are written.
pub fn to_fragment(s: &Scenario, system: System) -> String {
    let mut out = format!("v={LINK_VERSION}&s={}", s.shape.id());
    if s.shape != Shape::Sphere {
        out.push_str(match s.axis {
            Axis::Horizontal => "&ax=h",
            Axis::Vertical => "&ax=v",
        });
    }
    if s.uses_wind() {
        out.push_str(match s.wind {
            Wind::Horizontal => "&w=h",
            Wind::Up => "&w=u",
            Wind::Down => "&w=d",
        });
    }
    out.push_str(&format!("&f={}", s.fluid.id()));
    if matches!(s.shape, Shape::Cylinder | Shape::Sphere) {
        out.push_str(match s.surface_mode {
            SurfaceMode::Given => "&sm=g",
            SurfaceMode::Solved => "&sm=x",
        });
    }
    if s.solved() {
        out.push_str(&format!("&wm={}&nl={}", s.wall.id(), s.layer_count));
        if s.offers_inside_film() {
            out.push_str(&format!("&hf={}", s.inside.id()));
        }
    } else if s.cools() {
        out.push_str(&format!("&wm={}", s.wall.id()));
    }
    out.push_str(match s.pressure_input {
        PressureInput::Absolute => "&pm=p",
        PressureInput::Elevation => "&pm=z",
    });
    if s.fluid == FluidKind::HumidAir {
        out.push_str(match s.humidity_input {
            HumidityInput::Relative => "&hm=rh",
            HumidityInput::DewPoint => "&hm=td",
        });
    }
    for spec in FIELDS.iter().filter(|sp| s.uses(sp.field)) {
        out.push_str(&format!("&{}={}", spec.key, s.get(spec.field)));
    }
    out.push_str(match system {
        System::Si => "&u=si",
        System::Us => "&u=us",
    });
    out
}

/// How the page is shown, from the same fragment: `view=embed` for the compact view inside a
/// wiki page (no header, no plots, no saved-work panel), `lock=1` to make the inputs read-only
/// (a worked example). Unknown values are ignored.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub struct ViewOptions {
    pub embed: bool,
    pub locked: bool,
}

impl ViewOptions {
    pub fn from_fragment(fragment: &str) -> Self {
        let f = fragment.strip_prefix('#').unwrap_or(fragment);
        let mut o = ViewOptions::default();
        for pair in f.split('&').take(200) {
            match pair {
                "view=embed" => o.embed = true,
                "lock=1" => o.locked = true,
                _ => {}
            }
        }
        o
    }
    /// The keys to append to a scenario's fragment.
    pub fn suffix(&self) -> &'static str {
        match (self.embed, self.locked) {
            (false, false) => "",
            (true, false) => "&view=embed",
            (false, true) => "&lock=1",
            (true, true) => "&view=embed&lock=1",
        }
    }
}

/// Read a fragment (with or without the leading `#`). Keys left out take the demo's value.
/// Anything malformed refuses the whole link with a message; nothing of it is ever echoed.
pub fn from_fragment(fragment: &str) -> Result<(Scenario, System), String> {
    let f = fragment.strip_prefix('#').unwrap_or(fragment);
    if f.len() > LINK_MAX_LEN {
        return Err(format!(
            "the link's scenario is {} characters long, more than the {} a scenario can take",
            f.len(),
            LINK_MAX_LEN
        ));
    }
    let mut s = DEMO;
    let mut system = System::Si;
    let mut version = None;
    for pair in f.split('&').filter(|p| !p.is_empty()) {
        let (key, value) = pair
            .split_once('=')
            .ok_or_else(|| "the link's scenario is not in the key=value form".to_string())?;
        match key {
            "v" => version = Some(value),
            "u" => {
                system = match value {
                    "si" => System::Si,
                    "us" => System::Us,
                    _ => return Err("the link names an unknown unit system".into()),
                }
            }
            "s" => {
                s.shape = Shape::from_id(value)
                    .ok_or_else(|| "the link names an unknown shape".to_string())?
            }
            "ax" => {
                s.axis = match value {
                    "h" => Axis::Horizontal,
                    "v" => Axis::Vertical,
                    _ => return Err("the link names an unknown axis direction".into()),
                }
            }
            "w" => {
                s.wind = match value {
                    "h" => Wind::Horizontal,
                    "u" => Wind::Up,
                    "d" => Wind::Down,
                    _ => return Err("the link names an unknown wind direction".into()),
                }
            }
            "sm" => {
                s.surface_mode = match value {
                    "g" => SurfaceMode::Given,
                    "x" => SurfaceMode::Solved,
                    _ => return Err("the link names an unknown way to give the surface".into()),
                }
            }
            "wm" => {
                s.wall = WallMaterial::from_id(value)
                    .ok_or_else(|| "the link names an unknown wall material".to_string())?
            }
            "hf" => {
                s.inside = InsideFilm::from_id(value).ok_or_else(|| {
                    "the link names an unknown way to give the inside film".to_string()
                })?
            }
            "nl" => {
                s.layer_count = match value {
                    "0" => 0,
                    "1" => 1,
                    "2" => 2,
                    "3" => 3,
                    _ => return Err("the link's number of layers must be 0 to 3".into()),
                }
            }
            "f" => {
                s.fluid = FluidKind::from_id(value)
                    .ok_or_else(|| "the link names an unknown fluid".to_string())?
            }
            "pm" => {
                s.pressure_input = match value {
                    "p" => PressureInput::Absolute,
                    "z" => PressureInput::Elevation,
                    _ => return Err("the link names an unknown way to give pressure".into()),
                }
            }
            "hm" => {
                s.humidity_input = match value {
                    "rh" => HumidityInput::Relative,
                    "td" => HumidityInput::DewPoint,
                    _ => return Err("the link names an unknown way to give humidity".into()),
                }
            }
            _ => {
                let Some(spec) = FIELDS.iter().find(|sp| sp.key == key) else {
                    continue; // a key from a later version: ignored
                };
                let si_unit = units::units_of(spec.dim).next().expect("SI unit");
                let v = read_field(spec, value, si_unit).map_err(|e| {
                    format!("the link's {} is unusable: {e}", spec.label.to_lowercase())
                })?;
                s.set(spec.field, v);
            }
        }
    }
    match version {
        Some(v) if v == LINK_VERSION.to_string() => Ok((s, system)),
        Some(_) => Err(format!(
            "the link was written in a format version this page does not read (it reads version {LINK_VERSION})"
        )),
        None => Err("the link has no format version (v=…)".into()),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn demo_evaluates_cleanly() {
        let o = evaluate(&DEMO).unwrap();
        assert!(o.flags.is_empty(), "{:?}", o.flags);
        let q_per_length = o.q_per_length.unwrap();
        assert!(q_per_length > 0.0 && o.h > 0.0);
        // Energy bookkeeping: q' = h·π·D·ΔT + εσ(Ts⁴ − Tsur⁴)·π·D, Q = q'·L.
        let pd = std::f64::consts::PI * DEMO.diameter;
        let q = o.h * pd * (DEMO.surface_temp - DEMO.fluid_temp)
            + DEMO.emissivity * SIGMA * (DEMO.surface_temp.powi(4) - DEMO.t_surround.powi(4)) * pd;
        assert!((q - q_per_length).abs() <= 1e-12 * q);
        assert!((o.q_total - q * DEMO.length).abs() <= 1e-12 * o.q_total);
        assert!(o.dew_point.unwrap() < DEMO.fluid_temp);
    }

    #[test]
    fn every_fluid_evaluates_at_a_sensible_state() {
        for kind in FluidKind::ALL {
            let mut s = DEMO;
            s.fluid = kind;
            if kind == FluidKind::Steam {
                s.fluid_temp = 420.0;
                s.surface_temp = 400.0;
            } else if kind != FluidKind::DryAir && kind != FluidKind::HumidAir {
                s.fluid_temp = 290.0;
                s.surface_temp = 330.0;
                s.speed = 0.5;
            }
            let o = evaluate(&s).unwrap_or_else(|e| panic!("{kind:?}: {e}"));
            assert!(o.h.is_finite() && o.h > 0.0, "{kind:?}");
        }
    }

    #[test]
    fn elevation_lowers_pressure_and_density() {
        let mut s = DEMO;
        s.pressure_input = PressureInput::Elevation;
        s.elevation = 2000.0;
        let o = evaluate(&s).unwrap();
        assert!((o.pressure - atmosphere::pressure_at(2000.0)).abs() < 1e-9);
        let sea = evaluate(&DEMO).unwrap();
        assert!(o.properties[0].props.rho < sea.properties[0].props.rho);
    }

    #[test]
    fn boiling_at_the_film_is_a_clear_error() {
        let mut s = DEMO;
        s.fluid = FluidKind::Water;
        s.fluid_temp = 300.0;
        s.surface_temp = 480.0;
        let e = evaluate(&s).unwrap_err();
        assert!(matches!(e, EngineError::WrongPhase { .. }), "{e}");
        assert!(e.to_string().contains("373.1"), "{e}");
    }

    #[test]
    fn heat_flows_into_a_cold_surface_with_a_negative_sign() {
        let mut s = DEMO;
        s.surface_temp = 263.15;
        let o = evaluate(&s).unwrap();
        assert!(o.q_per_length.unwrap() < 0.0 && o.q_total < 0.0 && o.h > 0.0);
    }

    fn solved_demo() -> Scenario {
        let mut s = DEMO;
        s.surface_mode = SurfaceMode::Solved;
        s
    }

    #[test]
    fn solved_surface_closes_the_energy_balance_and_beats_bare() {
        let s = solved_demo();
        let o = evaluate(&s).unwrap();
        let j = o.job.as_ref().unwrap();
        let sol = &j.solution;
        assert!((o.q_per_length.unwrap() - sol.q).abs() <= 1e-9 * sol.q);
        assert!(sol.residual.abs() <= 1e-9 * sol.q.abs());
        assert!(o.surface_temp < s.process_temp && o.surface_temp > s.fluid_temp);
        assert!((o.outer_d - (s.diameter + 2.0 * s.layer_t[0])).abs() < 1e-12);
        assert!(j.bare.as_ref().unwrap().q > sol.q);
        assert!(o.verdicts.iter().any(|v| v.id == "saving"));
        // The same line with no layers is the bare answer.
        let mut b = s;
        b.layer_count = 0;
        let ob = evaluate(&b).unwrap();
        assert!((ob.q_total - j.bare.as_ref().unwrap().q * s.length).abs() < 1e-9 * ob.q_total);
    }

    #[test]
    fn sweeps_pass_through_the_operating_point() {
        let o = evaluate(&DEMO).unwrap();
        let at7 = o.wind_sweep.iter().find(|w| w.0 == 7.0).unwrap();
        assert!((at7.2 - o.q_total).abs() <= 1e-12 * o.q_total.abs());
        assert!((at7.1 - o.h).abs() <= 1e-12 * o.h);
        assert!(o.thickness_sweep.is_empty());
        let s = solved_demo();
        let o = evaluate(&s).unwrap();
        let at = *o
            .thickness_sweep
            .iter()
            .find(|p| p.0 == s.layer_t[0])
            .unwrap();
        assert!((at.0 - s.layer_t[0]).abs() < 1e-15);
        assert!((at.1 - o.q_total).abs() <= 1e-9 * o.q_total.abs());
        // More insulation: less loss, cooler surface, all along the sweep.
        for w in o.thickness_sweep.windows(2).skip(1) {
            assert!(w[1].1 < w[0].1 && w[1].2 < w[0].2);
        }
    }

    /// Humid air keeps the stream's moisture at every temperature it is evaluated at: a 150 °C
    /// line in 5 °C air at 70 % RH is computed (70 % RH at 150 °C would be more vapour than the air
    /// can hold), and the film properties use the stream's vapour pressure.
    #[test]
    fn humid_air_carries_the_streams_vapour_pressure() {
        let mut s = solved_demo();
        s.process_temp = 423.15;
        let o = evaluate(&s).unwrap();
        let m = crate::engine::props::humid_air::moisture(
            s.fluid_temp,
            101_325.0,
            Humidity::Relative(0.7),
        )
        .unwrap();
        let film = crate::engine::props::humid_air::properties(
            o.film_temp,
            101_325.0,
            Humidity::VapourPressure(m.vapour_pressure),
        )
        .unwrap();
        assert_eq!(o.properties[0].props.mu, film.mu);
        assert!((o.dew_point.unwrap() - m.dew_point).abs() < 1e-9);
    }

    /// A third data-sheet point makes k the quadratic through all three (hand check at each point).
    #[test]
    fn three_point_conductivity_passes_through_each_point() {
        let mut s = solved_demo();
        s.layer_kc = [0.060, 0.0, 0.0];
        let k = s.layer_conductivity(0);
        for (t, want) in [
            (s.k_temp_a, 0.036),
            (s.k_temp_b, 0.045),
            (s.k_temp_c, 0.060),
        ] {
            assert!((k.at(t) - want).abs() < 1e-12, "{t}: {}", k.at(t));
        }
        assert!(k.c > 0.0, "the sheet's points curve upward");
        assert!(evaluate(&s).is_ok());
        s.k_temp_c = s.k_temp_b;
        let e = evaluate(&s).unwrap_err();
        assert_eq!(error_field(&e), Some(Field::KTempC));
    }

    #[test]
    fn mean_temperatures_must_differ_for_a_varying_k() {
        let mut s = solved_demo();
        s.k_temp_b = s.k_temp_a;
        assert!(evaluate(&s).is_err());
        s.layer_kb = s.layer_ka;
        assert!(evaluate(&s).is_ok());
    }

    #[test]
    fn solved_fragment_round_trips() {
        let mut s = solved_demo();
        s.layer_count = 3;
        s.wall = WallMaterial::User;
        s.wall_k = 0.4;
        s.layer_t = [0.01, 0.02, 0.03];
        s.loss_target = 25.0;
        s.freeze_target = 36_000.0;
        let (back, _) = from_fragment(&to_fragment(&s, System::Si)).unwrap();
        assert_eq!(back, s);
    }

    /// A hot-water line with 2 kg/s through it: the worked-out inside film, its place in the
    /// balance, the link, and the process fluid's own limits.
    #[test]
    fn inside_film_from_the_flow() {
        let mut s = solved_demo();
        s.mass_flow = 2.0;
        s.process_temp = 353.15;
        s.inside = InsideFilm::Water;
        let o = evaluate(&s).unwrap();
        let f = o.inside.as_ref().expect("a flow makes an inside film");
        let d_in = s.diameter - 2.0 * s.wall_thickness;
        let by_hand = crate::engine::correlations::internal::pipe_flow(
            process_properties(&Fluid::Water, 353.15).unwrap(),
            2.0,
            d_in,
            s.length,
        )
        .unwrap();
        assert_eq!(f.h, by_hand.h);
        // The bore sits below the process temperature by q/(h_i·π·d).
        let sol = &o.job.as_ref().unwrap().solution;
        let drop = sol.q / (f.h * std::f64::consts::PI * d_in);
        assert!((s.process_temp - sol.t_bore - drop).abs() < 1e-9 * drop.max(1e-9));
        assert!(
            drop > 0.0 && drop < 0.5,
            "a turbulent water film barely matters: {drop}"
        );
        // The film is the only change: typed with the same value, the answer is the same.
        let mut typed = s;
        typed.inside = InsideFilm::Typed;
        typed.h_inside = f.h;
        let ot = evaluate(&typed).unwrap();
        assert_eq!(ot.job.unwrap().solution.q, sol.q);
        assert!(o.working.iter().any(|w| w.text.contains("Gnielinski")));
        assert!(!s.uses(Field::HInside) && !s.uses(Field::ProcessCp) && s.uses(Field::MassFlow));
        // The link carries the choice.
        let (back, _) = from_fragment(&to_fragment(&s, System::Si)).unwrap();
        assert_eq!(back, s);
        // Still water: no film, a note, the freezing card as before.
        let mut still = s;
        still.mass_flow = 0.0;
        still.fluid_temp = 258.15;
        still.process_temp = 283.15;
        let os = evaluate(&still).unwrap();
        assert!(os.inside.is_none());
        assert!(os
            .job
            .as_ref()
            .unwrap()
            .notes
            .iter()
            .any(|n| n.contains("No flow")));
        assert!(os.verdicts.iter().any(|v| v.id == "freeze"));
        // Still glycol does not freeze like water: no freezing card.
        still.inside = InsideFilm::PropyleneGlycol;
        still.process_glycol = 0.4;
        let og = evaluate(&still).unwrap();
        assert!(!og.verdicts.iter().any(|v| v.id == "freeze"));
        assert!(still.uses(Field::ProcessGlycol));
        // Water below its freezing point inside is an error beside the process temperature.
        let mut frozen = s;
        frozen.process_temp = 268.15;
        let e = evaluate(&frozen).unwrap_err();
        assert_eq!(error_field(&e), Some(Field::ProcessTemp), "{e}");
        // A sphere (a tank) keeps the typed film whatever the choice says.
        let mut tank = s;
        tank.shape = Shape::Sphere;
        assert!(!tank.inside_computed() && tank.uses(Field::HInside));
    }

    /// The outlet of a flowing line uses the process fluid's own cp when the film is worked out.
    #[test]
    fn run_temperature_drop_uses_the_fluids_cp() {
        let mut s = solved_demo();
        s.mass_flow = 0.05;
        s.inside = InsideFilm::EthyleneGlycol;
        s.process_glycol = 0.3;
        s.process_temp = 343.15;
        let o = evaluate(&s).unwrap();
        let flow = o.verdicts.iter().find(|v| v.id == "flow").unwrap();
        let drop = flow.figures.iter().find(|f| f.0 == "drop").unwrap().1;
        let cp = o.inside.as_ref().unwrap().props.cp;
        assert!(cp > 3400.0 && cp < 3900.0, "{cp}");
        // Against the same line with water's typed cp: a lower cp drops more.
        let mut typed = s;
        typed.inside = InsideFilm::Typed;
        typed.h_inside = o.inside.as_ref().unwrap().h;
        typed.process_cp = 4180.0;
        let ot = evaluate(&typed).unwrap();
        let flow_t = ot.verdicts.iter().find(|v| v.id == "flow").unwrap();
        assert!(drop > flow_t.figures.iter().find(|f| f.0 == "drop").unwrap().1);
    }

    #[test]
    fn cautions_follow_the_surface_temperature() {
        let o = evaluate(&DEMO).unwrap();
        assert_eq!(cautions(&DEMO, &o).len(), 1, "the 65 °C demo line is hot");
        let mut cold = DEMO;
        cold.surface_temp = 263.15;
        let o = evaluate(&cold).unwrap();
        // Below the dew point and below freezing; not hot.
        assert_eq!(cautions(&cold, &o).len(), 2);
        let mut mild = DEMO;
        mild.surface_temp = 300.0;
        assert!(cautions(&mild, &evaluate(&mild).unwrap()).is_empty());
    }

    #[test]
    fn equal_temperatures_say_no_heat_flow() {
        let mut s = DEMO;
        s.surface_temp = s.fluid_temp;
        let e = evaluate(&s).unwrap_err();
        assert!(matches!(e, EngineError::NoTemperatureDifference { .. }));
        assert_eq!(error_field(&e), Some(Field::SurfaceTemp));
    }

    #[test]
    fn still_air_gives_the_natural_answer() {
        let mut s = DEMO;
        s.speed = 0.0;
        let o = evaluate(&s).unwrap();
        let n = o.analysis.natural.as_ref().unwrap();
        assert!((o.h - n.h).abs() <= 1e-12 * n.h);
        assert!(o.analysis.mode().starts_with("natural"));
        // The forced correlation is still shown, flagged outside its range.
        assert!(o
            .flags
            .iter()
            .any(|f| f.method == crate::engine::correlations::cylinder::CHURCHILL_BERNSTEIN));
    }

    #[test]
    fn still_user_fluid_without_beta_is_an_error_at_beta() {
        let mut s = DEMO;
        s.fluid = FluidKind::User;
        s.user_beta = 0.0;
        s.speed = 0.0;
        let e = evaluate(&s).unwrap_err();
        assert_eq!(error_field(&e), Some(Field::UserBeta));
        s.speed = 0.2;
        assert!(evaluate(&s).unwrap().analysis.natural.is_none());
    }

    #[test]
    fn every_shape_evaluates_and_sphere_has_no_per_length_figure() {
        for shape in Shape::ALL {
            let mut s = DEMO;
            s.shape = shape;
            let o = evaluate(&s).unwrap_or_else(|e| panic!("{shape:?}: {e}"));
            assert!(o.h > 0.0 && o.q_total > 0.0);
            assert_eq!(o.q_per_length.is_none(), shape == Shape::Sphere);
            let mut v = s;
            v.axis = Axis::Vertical;
            assert!(evaluate(&v).unwrap().h > 0.0);
        }
    }

    #[test]
    fn absurd_magnitudes_are_errors_not_nan() {
        for (f, v) in [
            (Field::Diameter, 1e308),
            (Field::Diameter, 0.0),
            (Field::Diameter, -1.0),
            (Field::Speed, -1.0),
            (Field::FluidTemp, -1.0),
            (Field::Pressure, 1e308),
            (Field::Speed, f64::NAN),
            (Field::RelativeHumidity, 1.5),
        ] {
            let mut s = DEMO;
            s.set(f, v);
            assert!(evaluate(&s).is_err(), "{f:?} = {v}");
        }
    }

    #[test]
    fn field_messages_speak_the_users_unit() {
        let c = units::unit("C").unwrap();
        let e = read_field(spec(Field::FluidTemp), "-300", c).unwrap_err();
        assert!(e.contains("absolute zero") && e.contains("-273.1"), "{e}");
        let mm = units::unit("mm").unwrap();
        assert_eq!(read_field(spec(Field::Diameter), "60,3", mm), Ok(0.0603));
        assert!(read_field(spec(Field::Diameter), "0", mm)
            .unwrap_err()
            .contains("more than 0 mm"));
        assert!(read_field(spec(Field::Diameter), "", mm).is_err());
        let pct = units::unit("%").unwrap();
        assert!(read_field(spec(Field::RelativeHumidity), "120", pct)
            .unwrap_err()
            .contains("100 %"));
    }

    #[test]
    fn fragment_round_trips_exactly() {
        let mut s = DEMO;
        s.diameter = 0.0334;
        s.speed = 1.0 / 3.0;
        s.fluid_temp = 250.123456789;
        s.surface_temp = 400.0;
        s.pressure_input = PressureInput::Elevation;
        s.elevation = 1234.5;
        s.humidity_input = HumidityInput::DewPoint;
        s.dew_point = 240.0;
        s.wind = Wind::Up;
        s.length = 3.25;
        let (back, sys) = from_fragment(&to_fragment(&s, System::Us)).unwrap();
        assert_eq!(back, s);
        assert_eq!(sys, System::Us);
        for kind in FluidKind::ALL {
            let mut s = DEMO;
            s.fluid = kind;
            assert_eq!(from_fragment(&to_fragment(&s, System::Si)).unwrap().0, s);
        }
        for shape in Shape::ALL {
            let mut s = DEMO;
            s.shape = shape;
            s.axis = Axis::Vertical;
            if shape == Shape::Sphere {
                s.axis = Axis::Horizontal;
            }
            assert_eq!(from_fragment(&to_fragment(&s, System::Si)).unwrap().0, s);
        }
    }

    #[test]
    fn view_options_ride_along_and_leave_the_scenario_alone() {
        let f = format!("{}&view=embed&lock=1", to_fragment(&DEMO, System::Si));
        assert_eq!(
            ViewOptions::from_fragment(&f),
            ViewOptions {
                embed: true,
                locked: true
            }
        );
        assert_eq!(from_fragment(&f).unwrap().0, DEMO);
        assert_eq!(
            ViewOptions::from_fragment("#v=1&view=full"),
            ViewOptions::default()
        );
    }

    #[test]
    fn hostile_or_malformed_fragments_are_refused() {
        let long = format!("v=1&D={}", "1".repeat(5000));
        for bad in [
            "v=1&D=<script>alert(1)</script>",
            "v=2&D=0.05",
            "D=0.05",
            "v=1&D=-1",
            "v=1&D=NaN",
            "v=1&U",
            "v=1&u=imperial",
            "v=1&f=<b>",
            "v=1&pm=x",
            "v=1&s=cube",
            "v=1&w=sideways",
            long.as_str(),
        ] {
            let e = from_fragment(bad).unwrap_err();
            assert!(!e.contains('<'), "message echoes input: {e}");
        }
        // Missing keys take the demo's values; unknown keys are ignored.
        assert_eq!(from_fragment("#v=1&future=3").unwrap().0, DEMO);
    }
}
