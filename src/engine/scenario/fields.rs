//! The numeric inputs: one row per field (`FIELDS`: label, link key, hard limits, quantity),
//! reading and checking a typed value, and which field an evaluation error belongs to.

use super::*;

/// Which numeric input a value belongs to.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Field {
    Diameter,
    Length,
    Speed,
    FluidTemp,
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
    SurfaceTemp,
    ProcessTemp,
    HInside,
    ProcessGlycol,
    WallThickness,
    WallK,
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
    LossTarget,
    FreezeTarget,
    MassFlow,
    ProcessCp,
    Hours,
    Price,
    Efficiency,
    CoolTarget,
    Cloud,
    GroundTemp,
    SkyView,
    Latitude,
    Longitude,
    BeamNormal,
    DiffuseHorizontal,
    GlobalHorizontal,
    Absorptance,
    Albedo,
    BodyHeight,
    Yaw,
    IrReading,
    IrEmissivity,
    IrReflected,
    IrBandLow,
    IrBandHigh,
    IrAccuracy,
    IrEmissivityUncertainty,
    HeatMade,
    HeatBody,
    Current,
    ResistanceLow,
    ResistanceLowTemp,
    ResistanceHigh,
    ResistanceHighTemp,
    HoldTemp,
    ConductorLimit,
    Emissivity,
}

/// The group a field is shown in.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Group {
    Body,
    Stream,
    Surface,
    Layers,
    /// The optional third point of the layers' k(T): folded on the page.
    LayerCurve,
    Job,
    /// Sky and wind at the body: outdoors only.
    Outdoors,
    /// The sun outdoors: where and when, or the sunlight typed, and how much of it is absorbed.
    Sun,
}

/// One input, the single source of truth for it: identity, group, link key, label and help as
/// the page writes them, quantity (units, display, the CSV header's unit), hard limits, where the
/// value lives in the `Scenario`, and when it applies. Link, CSV, saved file, the form, unit
/// rewrites and messages all read this row; adding an input is one row (plus its `Field` name and
/// its typed `Scenario` field, and the demo's value there).
///
/// The limits are where the computation stops making physical sense (not a method's fitted
/// range, which only flags).
#[derive(Clone, Copy)]
pub struct FieldSpec {
    pub field: Field,
    pub group: Group,
    /// Key in the link fragment and in the CSV header.
    pub key: &'static str,
    pub label: &'static str,
    pub dim: Dim,
    /// SI; `min_open` makes the lower limit exclusive.
    pub min: f64,
    pub min_open: bool,
    pub max: f64,
    pub help: &'static str,
    /// The value in a scenario, SI.
    pub get: fn(&Scenario) -> f64,
    pub put: fn(&mut Scenario, f64),
    /// Whether the field takes part in a scenario (the page hides it otherwise, the CSV leaves
    /// it blank).
    pub applies: fn(&Scenario) -> bool,
}

impl std::fmt::Debug for FieldSpec {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "FieldSpec({:?})", self.field)
    }
}

impl PartialEq for FieldSpec {
    fn eq(&self, other: &Self) -> bool {
        self.field == other.field
    }
}

/// Where a field's value lives in the `Scenario`: a getter and a setter from one path.
macro_rules! at {
    ($($path:tt)+) => {
        (|s: &Scenario| s.$($path)+, |s: &mut Scenario, v: f64| s.$($path)+ = v)
    };
}

#[allow(clippy::too_many_arguments)]
pub(crate) const fn f(
    field: Field,
    group: Group,
    key: &'static str,
    label: &'static str,
    dim: Dim,
    (min, min_open, max): (f64, bool, f64),
    help: &'static str,
    (get, put): (fn(&Scenario) -> f64, fn(&mut Scenario, f64)),
    applies: fn(&Scenario) -> bool,
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
        get,
        put,
        applies,
    }
}

// When a field applies: one predicate per condition, named as the page would say it.
fn always(_: &Scenario) -> bool {
    true
}
fn not_sphere(s: &Scenario) -> bool {
    s.shape != Shape::Sphere
}
fn pressure_typed(s: &Scenario) -> bool {
    s.pressure_input == PressureInput::Absolute
}
fn elevation_typed(s: &Scenario) -> bool {
    s.pressure_input == PressureInput::Elevation
}
fn humidity_typed(s: &Scenario) -> bool {
    s.fluid == FluidKind::HumidAir && s.humidity_input == HumidityInput::Relative
}
fn dew_point_typed(s: &Scenario) -> bool {
    s.fluid == FluidKind::HumidAir && s.humidity_input == HumidityInput::DewPoint
}
fn glycol_stream(s: &Scenario) -> bool {
    matches!(
        s.fluid,
        FluidKind::EthyleneGlycol | FluidKind::PropyleneGlycol
    )
}
fn user_fluid(s: &Scenario) -> bool {
    s.fluid == FluidKind::User
}
fn surface_typed(s: &Scenario) -> bool {
    !s.solved() && !s.makes_heat()
}
fn solved(s: &Scenario) -> bool {
    s.solved()
}
fn inside_typed(s: &Scenario) -> bool {
    s.solved() && !s.inside_computed()
}
fn offers_film(s: &Scenario) -> bool {
    s.offers_inside_film()
}
fn process_glycol(s: &Scenario) -> bool {
    s.inside_computed()
        && matches!(
            s.inside,
            InsideFilm::EthyleneGlycol | InsideFilm::PropyleneGlycol
        )
}
fn wall_typed(s: &Scenario) -> bool {
    s.solved() && s.wall == WallMaterial::User
}
fn layer_1(s: &Scenario) -> bool {
    s.solved() && s.layer_count >= 1
}
fn layer_2(s: &Scenario) -> bool {
    s.solved() && s.layer_count >= 2
}
fn layer_3(s: &Scenario) -> bool {
    s.solved() && s.layer_count >= 3
}
fn still_water(s: &Scenario) -> bool {
    s.offers_inside_film() && s.mass_flow == 0.0 && !s.carries_gas()
}
fn process_cp_typed(s: &Scenario) -> bool {
    s.offers_inside_film() && !s.inside_computed()
}
fn cools(s: &Scenario) -> bool {
    s.cools()
}
fn indoors(s: &Scenario) -> bool {
    !s.outdoors()
}
fn outdoors(s: &Scenario) -> bool {
    s.outdoors()
}
fn yawed(s: &Scenario) -> bool {
    s.outdoors() && s.yaw_applies()
}
fn read_ir(s: &Scenario) -> bool {
    s.reads()
}
fn sun_from_place(s: &Scenario) -> bool {
    s.outdoors() && s.sun_input == SunInput::Place
}
fn sun_typed(s: &Scenario) -> bool {
    s.outdoors() && s.sun_input == SunInput::Typed
}
fn heat_per_length(s: &Scenario) -> bool {
    s.makes_heat() && !s.shape.is_sphere() && !s.current_given()
}
fn heat_per_body(s: &Scenario) -> bool {
    s.makes_heat() && s.shape.is_sphere()
}
fn current_given(s: &Scenario) -> bool {
    s.current_given()
}
fn heat_given(s: &Scenario) -> bool {
    s.makes_heat() && !s.current_given()
}

#[rustfmt::skip]
pub const FIELDS: [FieldSpec; 75] = [
    f(Field::Diameter, Group::Body, "D", "Size D", Dim::Length, (0.0, true, 100.0), "as drawn: the width across the stream (bare outside diameter of a pipe)", at!(diameter), always),
    f(Field::Length, Group::Body, "L", "Length", Dim::RunLength, (0.0, true, 10_000.0), "along the axis; the height when upright", at!(length), not_sphere),
    f(Field::Speed, Group::Stream, "U", "Stream speed", Dim::Speed, (0.0, false, 300.0), "across the axis; 0 for still air; outdoors, the wind a weather report gives (10 m, 33 ft, over open ground)", at!(speed), always),
    f(Field::FluidTemp, Group::Stream, "Ta", "Stream temperature", Dim::Temperature, (0.0, true, 3000.0), "of the approaching fluid", at!(fluid_temp), always),
    f(Field::Pressure, Group::Stream, "p", "Pressure", Dim::Pressure, (0.0, true, 100e6), "absolute, at the site", at!(pressure), pressure_typed),
    f(Field::Elevation, Group::Stream, "z", "Site elevation", Dim::Elevation, (-500.0, false, 11_000.0), "above sea level; standard atmosphere", at!(elevation), elevation_typed),
    f(Field::RelativeHumidity, Group::Stream, "rh", "Relative humidity", Dim::Fraction, (0.0, false, 1.0), "to water above {T:273.15}, to ice below", at!(relative_humidity), humidity_typed),
    f(Field::DewPoint, Group::Stream, "td", "Dew point", Dim::Temperature, (0.0, true, 3000.0), "frost point below {T:273.15}", at!(dew_point), dew_point_typed),
    f(Field::GlycolFraction, Group::Stream, "xg", "Glycol content", Dim::Fraction, (0.0, false, 0.6), "by mass, 0–60 %", at!(glycol_fraction), glycol_stream),
    f(Field::UserRho, Group::Stream, "ur", "Density", Dim::Density, (0.0, true, 1e5), "of your fluid", at!(user_rho), user_fluid),
    f(Field::UserMu, Group::Stream, "um", "Viscosity", Dim::DynamicViscosity, (0.0, true, 1e3), "dynamic, of your fluid", at!(user_mu), user_fluid),
    f(Field::UserK, Group::Stream, "uk", "Thermal conductivity", Dim::ThermalConductivity, (0.0, true, 1e4), "of your fluid", at!(user_k), user_fluid),
    f(Field::UserCp, Group::Stream, "uc", "Heat capacity", Dim::SpecificHeat, (0.0, true, 1e6), "isobaric, of your fluid", at!(user_cp), user_fluid),
    f(Field::UserBeta, Group::Stream, "ub", "Expansion coefficient β", Dim::ExpansionCoefficient, (0.0, false, 1.0), "volumetric; 0 if unknown", at!(user_beta), user_fluid),
    f(Field::SurfaceTemp, Group::Surface, "Ts", "Surface temperature", Dim::Temperature, (0.0, true, 3000.0), "of the outer surface", at!(surface_temp), surface_typed),
    f(Field::ProcessTemp, Group::Surface, "Tp", "Process temperature", Dim::Temperature, (0.0, true, 3000.0), "of the fluid inside", at!(process_temp), solved),
    f(Field::HInside, Group::Surface, "hi", "Inside film coefficient", Dim::HeatTransferCoefficient, (0.0, false, 1e6), "0 if the bore sits at the process temperature", at!(h_inside), inside_typed),
    f(Field::ProcessGlycol, Group::Surface, "xgp", "Glycol in the process fluid", Dim::Fraction, (0.0, false, 0.6), "by mass, 0–60 %", at!(process_glycol), process_glycol),
    f(Field::WallThickness, Group::Surface, "tw", "Wall thickness", Dim::Length, (0.0, false, 1.0), "of the pipe or vessel", at!(wall_thickness), solved),
    f(Field::WallK, Group::Surface, "kw", "Wall conductivity", Dim::ThermalConductivity, (0.0, true, 1e4), "of your wall material", at!(wall_k), wall_typed),
    f(Field::Surround, Group::Surface, "Tr", "Surroundings temperature", Dim::Temperature, (0.0, true, 3000.0), "what the surface sees (walls, roof); the stream's if unsure", at!(t_surround), indoors),
    f(Field::Layer1T, Group::Layers, "t1", "Layer 1 thickness", Dim::Length, (0.0, false, 2.0), "innermost insulation", at!(layer_t[0]), layer_1),
    f(Field::Layer1Ka, Group::Layers, "ka1", "Layer 1 k at mean temperature A", Dim::LayerConductivity, (0.0, true, 100.0), "from the data sheet", at!(layer_ka[0]), layer_1),
    f(Field::Layer1Kb, Group::Layers, "kb1", "Layer 1 k at mean temperature B", Dim::LayerConductivity, (0.0, true, 100.0), "the same as at A for a constant k", at!(layer_kb[0]), layer_1),
    f(Field::Layer2T, Group::Layers, "t2", "Layer 2 thickness", Dim::Length, (0.0, false, 2.0), "over layer 1", at!(layer_t[1]), layer_2),
    f(Field::Layer2Ka, Group::Layers, "ka2", "Layer 2 k at mean temperature A", Dim::LayerConductivity, (0.0, true, 100.0), "from the data sheet", at!(layer_ka[1]), layer_2),
    f(Field::Layer2Kb, Group::Layers, "kb2", "Layer 2 k at mean temperature B", Dim::LayerConductivity, (0.0, true, 100.0), "the same as at A for a constant k", at!(layer_kb[1]), layer_2),
    f(Field::Layer3T, Group::Layers, "t3", "Layer 3 thickness", Dim::Length, (0.0, false, 2.0), "outermost", at!(layer_t[2]), layer_3),
    f(Field::Layer3Ka, Group::Layers, "ka3", "Layer 3 k at mean temperature A", Dim::LayerConductivity, (0.0, true, 100.0), "from the data sheet", at!(layer_ka[2]), layer_3),
    f(Field::Layer3Kb, Group::Layers, "kb3", "Layer 3 k at mean temperature B", Dim::LayerConductivity, (0.0, true, 100.0), "the same as at A for a constant k", at!(layer_kb[2]), layer_3),
    f(Field::KTempA, Group::Layers, "Tka", "Mean temperature A", Dim::Temperature, (0.0, true, 3000.0), "of the data sheet's first k", at!(k_temp_a), layer_1),
    f(Field::KTempB, Group::Layers, "Tkb", "Mean temperature B", Dim::Temperature, (0.0, true, 3000.0), "of its second k", at!(k_temp_b), layer_1),
    f(Field::Layer1Kc, Group::LayerCurve, "kc1", "Layer 1 k at mean temperature C", Dim::LayerConductivity, (0.0, false, 100.0), "optional third point (0: k is linear through A and B)", at!(layer_kc[0]), layer_1),
    f(Field::Layer2Kc, Group::LayerCurve, "kc2", "Layer 2 k at mean temperature C", Dim::LayerConductivity, (0.0, false, 100.0), "optional third point (0: linear)", at!(layer_kc[1]), layer_2),
    f(Field::Layer3Kc, Group::LayerCurve, "kc3", "Layer 3 k at mean temperature C", Dim::LayerConductivity, (0.0, false, 100.0), "optional third point (0: linear)", at!(layer_kc[2]), layer_3),
    f(Field::KTempC, Group::LayerCurve, "Tkc", "Mean temperature C", Dim::Temperature, (0.0, true, 3000.0), "of the data sheet's third k, if given", at!(k_temp_c), layer_1),
    f(Field::TouchLimit, Group::Job, "Tl", "Touch limit", Dim::Temperature, (0.0, true, 3000.0), "{T:333.15} is common practice; local codes govern", at!(touch_limit), always),
    f(Field::DewMargin, Group::Job, "dm", "Margin above the dew point", Dim::TemperatureDifference, (0.0, false, 50.0), "for cold surfaces in humid air", at!(dew_margin), always),
    f(Field::LossTarget, Group::Job, "qt", "Loss target", Dim::HeatFlowPerLength, (0.0, false, 1e6), "highest loss per length wanted; 0 for none", at!(loss_target), offers_film),
    f(Field::FreezeTarget, Group::Job, "tft", "Hold out against freezing for", Dim::Duration, (0.0, false, 3.6e7), "still water in frost; 0: no time set (the card warns wherever still water can freeze)", at!(freeze_target), still_water),
    f(Field::MassFlow, Group::Job, "mf", "Flow through the pipe", Dim::MassFlow, (0.0, false, 1e4), "0 for still water (then the freezing times)", at!(mass_flow), offers_film),
    f(Field::ProcessCp, Group::Job, "cpp", "Heat capacity of the process fluid", Dim::SpecificHeat, (0.0, true, 1e6), "about {cp:4180} for water", at!(process_cp), process_cp_typed),
    f(Field::Hours, Group::Job, "hy", "Operating hours", Dim::HoursPerYear, (0.0, false, 8784.0), "per year", at!(hours), always),
    f(Field::Price, Group::Job, "pe", "Energy price", Dim::EnergyPrice, (0.0, false, 1e-4), "of the fuel or power that makes up the loss", at!(price), always),
    f(Field::Efficiency, Group::Job, "ef", "Heater or boiler efficiency", Dim::Fraction, (0.01, false, 1.0), "share of that energy that becomes heat", at!(efficiency), always),
    f(Field::CoolTarget, Group::Job, "T1", "Cool or warm a solid body to", Dim::Temperature, (0.0, true, 3000.0), "its cooling time in this stream (material above)", at!(cool_target), cools),
    f(Field::Cloud, Group::Outdoors, "cc", "Cloud cover", Dim::Oktas, (0.0, false, 8.0), "0 clear (the coldest sky: the worst case for freezing and sweating) to 8 overcast", at!(cloud), outdoors),
    f(Field::GroundTemp, Group::Outdoors, "Tg", "Ground temperature", Dim::Temperature, (0.0, true, 3000.0), "what the lower half sees; the air's if unsure", at!(t_ground), outdoors),
    f(Field::SkyView, Group::Outdoors, "fs", "Share of the view that is sky", Dim::Ratio, (0.0, false, 1.0), "0.5 in the open; less under a canopy or beside a wall", at!(sky_view), outdoors),
    f(Field::Latitude, Group::Sun, "lat", "Latitude", Dim::Coordinate, (-90.0, false, 90.0), "of the site, north positive (a map app shows it)", at!(latitude), sun_from_place),
    f(Field::Longitude, Group::Sun, "lon", "Longitude", Dim::Coordinate, (-180.0, false, 180.0), "of the site, east of Greenwich positive", at!(longitude), sun_from_place),
    f(Field::BeamNormal, Group::Sun, "Gb", "Direct sunlight", Dim::HeatFlux, (0.0, false, 1500.0), "beam irradiance facing the sun; 0 at night, about 900 at a clear noon (common practice)", at!(beam_normal), sun_typed),
    f(Field::DiffuseHorizontal, Group::Sun, "Gd", "Diffuse sunlight", Dim::HeatFlux, (0.0, false, 1500.0), "from the sky on level ground; about 100 clear, more under thin cloud (common practice)", at!(diffuse), sun_typed),
    f(Field::GlobalHorizontal, Group::Sun, "Gg", "Global sunlight on level ground", Dim::HeatFlux, (0.0, false, 1500.0), "direct plus diffuse on the ground: what the ground reflects", at!(global), sun_typed),
    f(Field::Absorptance, Group::Sun, "as", "Solar absorptance", Dim::Ratio, (0.0, false, 1.0), "of the outer surface: about 0.9 dark paint, 0.3 white paint, 0.15 bright aluminium (common practice)", at!(absorptance), outdoors),
    f(Field::Albedo, Group::Sun, "alb", "Ground reflectance", Dim::Ratio, (0.0, false, 1.0), "about 0.2 grass or soil, 0.3 concrete, 0.8 fresh snow (common practice)", at!(albedo), outdoors),
    f(Field::BodyHeight, Group::Outdoors, "zb", "Height above ground", Dim::RunLength, (0.0, true, 1000.0), "of the body: the wind there is less than the report's at 10 m", at!(body_height), outdoors),
    f(Field::Yaw, Group::Outdoors, "yaw", "Wind angle to the axis", Dim::Angle, (0.0, false, 90.0), "90° square across (the most cooling), 0° along it", at!(yaw), yawed),
    f(Field::IrReading, Group::Surface, "Tir", "Infrared reading", Dim::Temperature, (0.0, true, 3000.0), "the temperature the instrument displayed on the surface", at!(ir_reading), read_ir),
    f(Field::IrEmissivity, Group::Surface, "eir", "Instrument emissivity setting", Dim::Ratio, (0.0, true, 1.0), "what the instrument was set to; 0.95 is a common factory setting (common practice)", at!(ir_emissivity), read_ir),
    f(Field::IrReflected, Group::Surface, "Trf", "Reflected apparent temperature", Dim::Temperature, (0.0, true, 3000.0), "what the instrument compensated with (ASTM E1862); the surroundings' if unsure", at!(ir_reflected), read_ir),
    f(Field::IrBandLow, Group::Surface, "lb1", "Instrument band from", Dim::Wavelength, (0.1e-6, false, 100e-6), "shortest wavelength it sees; 8 µm for most field instruments", at!(ir_band_low), read_ir),
    f(Field::IrBandHigh, Group::Surface, "lb2", "Instrument band to", Dim::Wavelength, (0.1e-6, false, 100e-6), "longest wavelength it sees; 14 µm for most field instruments", at!(ir_band_high), read_ir),
    f(Field::IrAccuracy, Group::Surface, "dTir", "Reading accuracy", Dim::TemperatureDifference, (0.0, false, 100.0), "± as the instrument's sheet states it; {dT:2} is common for field instruments (common practice)", at!(ir_accuracy), read_ir),
    f(Field::IrEmissivityUncertainty, Group::Surface, "de", "Emissivity uncertainty", Dim::Ratio, (0.0, false, 0.5), "± on the surface's emissivity; 0.05 from a table (common practice), less measured by ASTM E1933", at!(ir_emissivity_uncertainty), read_ir),
    f(Field::HeatMade, Group::Surface, "qm", "Heat made inside", Dim::HeatOutputPerLength, (0.0, false, 1e6), "per length: a tracer's output, a heater's rating", at!(heat_made), heat_per_length),
    f(Field::HeatBody, Group::Surface, "qb", "Heat made inside the body", Dim::HeatFlow, (0.0, false, 1e7), "the whole body's: a heater's or a sensor's rating", at!(heat_body), heat_per_body),
    f(Field::Current, Group::Surface, "I", "Current", Dim::Current, (0.0, false, 1e6), "through the conductor; rms for AC", at!(current), current_given),
    f(Field::ResistanceLow, Group::Surface, "R1", "Resistance at the lower temperature", Dim::ResistancePerLength, (0.0, true, 1e3), "per length, from the data sheet (AC for AC)", at!(r_low), current_given),
    f(Field::ResistanceLowTemp, Group::Surface, "TR1", "Lower data-sheet temperature", Dim::Temperature, (0.0, true, 3000.0), "where the sheet gives the first resistance", at!(t_r_low), current_given),
    f(Field::ResistanceHigh, Group::Surface, "R2", "Resistance at the higher temperature", Dim::ResistancePerLength, (0.0, true, 1e3), "linear between the two, and beyond them", at!(r_high), current_given),
    f(Field::ResistanceHighTemp, Group::Surface, "TR2", "Higher data-sheet temperature", Dim::Temperature, (0.0, true, 3000.0), "where the sheet gives the second resistance", at!(t_r_high), current_given),
    f(Field::HoldTemp, Group::Surface, "Th", "Keep the surface at least at", Dim::Temperature, (0.0, true, 3000.0), "the heat that holds it there is shown; {T:278.15} keeps water lines from freezing (common practice)", at!(hold_temp), heat_given),
    f(Field::ConductorLimit, Group::Surface, "Tcx", "Conductor temperature limit", Dim::Temperature, (0.0, true, 3000.0), "the current that brings it there is shown; from the conductor's or cable's rating", at!(conductor_limit), current_given),
    f(Field::Emissivity, Group::Surface, "e", "Emissivity", Dim::Ratio, (0.0, false, 1.0), "of the outer surface: about 0.9 painted or oxidised, 0.05 bright aluminium (common practice)", at!(emissivity), always),
];

/// The row of a field: `FIELDS` is in `Field`'s order (a test holds it so).
pub fn spec(field: Field) -> &'static FieldSpec {
    &FIELDS[field as usize]
}

impl Scenario {
    pub fn get(&self, f: Field) -> f64 {
        (spec(f).get)(self)
    }

    pub fn set(&mut self, f: Field, v: f64) {
        (spec(f).put)(self, v)
    }

    /// Whether a field takes part in this scenario (the page hides the others).
    pub fn uses(&self, f: Field) -> bool {
        (spec(f).applies)(self)
    }
}

/// A field's help text in the units the person reads: `{T:333.15}` in a row's help is a
/// temperature in kelvin, `{dT:2}` a temperature difference in kelvin, `{cp:4180}` a heat
/// capacity in J/(kg·K), each written in the unit
/// chosen ("60 °C", "140 °F"; "4180 J/(kg·K)", "0.998 Btu/(lb·°F)").
pub fn help_text(spec: &FieldSpec, c: &units::UnitChoice) -> String {
    let mut out = String::new();
    let mut rest = spec.help;
    while let Some(i) = rest.find('{') {
        out.push_str(&rest[..i]);
        let Some(j) = rest[i..].find('}') else { break };
        let token = &rest[i + 1..i + j];
        let value = token.split_once(':').and_then(|(k, v)| {
            let dim = match k {
                "T" => Dim::Temperature,
                "cp" => Dim::SpecificHeat,
                "dT" => Dim::TemperatureDifference,
                _ => return None,
            };
            // Written as a person would type it ("60 °C", not "60.0 °C").
            let u = c.get(dim);
            v.parse::<f64>()
                .ok()
                .map(|v| format!("{} {}", units::format_value(u.from_si(v), u), u.symbol))
        });
        out.push_str(&value.unwrap_or_else(|| rest[i..=i + j].to_string()));
        rest = &rest[i + j + 1..];
    }
    out.push_str(rest);
    out
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

/// Where an evaluation error belongs on the page: the field a person can change, read from the
/// error's `Subject` (data, never the message). In solved mode the surface is not an input, so a
/// missing temperature difference belongs to the process temperature.
pub fn error_field(s: &Scenario, e: &EngineError) -> Option<Field> {
    use crate::engine::error::Subject as S;
    let layer = |i: usize, wall: Field, of: [Field; 3]| match i {
        0 => wall,
        n => of[(n - 1).min(2)],
    };
    let field = match e {
        EngineError::NoTemperatureDifference { .. } if s.solved() => Field::ProcessTemp,
        EngineError::NoTemperatureDifference { .. } => Field::SurfaceTemp,
        EngineError::OpposingFlowsCancel => Field::Speed,
        EngineError::WrongPhase {
            subject: S::ProcessFluid,
            ..
        } => Field::ProcessTemp,
        EngineError::WrongPhase { .. } => Field::FluidTemp,
        EngineError::Undefined { subject, .. } => match *subject {
            S::Beta => Field::UserBeta,
            S::BoreRadius => Field::WallThickness,
            S::LayerThickness(i) => layer(
                i,
                Field::WallThickness,
                [Field::Layer1T, Field::Layer2T, Field::Layer3T],
            ),
            S::LayerConductivity(i) => layer(
                i,
                Field::WallK,
                [Field::Layer1Kb, Field::Layer2Kb, Field::Layer3Kb],
            ),
            S::MeanTempB => Field::KTempB,
            S::MeanTempC => Field::KTempC,
            S::Emissivity => Field::Emissivity,
            S::Humidity => Field::RelativeHumidity,
            S::DewPoint => Field::DewPoint,
            S::GlycolFraction => Field::GlycolFraction,
            S::Input(key) => FIELDS.iter().find(|f| f.key == key)?.field,
            S::General | S::StreamFluid | S::ProcessFluid => return None,
        },
        _ => return None,
    };
    Some(field)
}

/// An evaluation error as the page shows it: values in the person's units (never raw SI with
/// float noise), the first letter capitalised.
pub fn error_message(e: &EngineError, c: &units::UnitChoice) -> String {
    let show = |v: f64, unit: &str| {
        let dim = match unit {
            "K" => Some(Dim::Temperature),
            "Pa" => Some(Dim::Pressure),
            "m" => Some(Dim::Length),
            "W/(m·K)" => Some(Dim::ThermalConductivity),
            "1/K" => Some(Dim::ExpansionCoefficient),
            _ => None,
        };
        match dim {
            Some(d) => units::show(v, c.get(d)),
            None => format!("{} {unit}", format_sig(v, 4))
                .trim_end()
                .to_string(),
        }
    };
    let text = match e {
        EngineError::Undefined {
            quantity,
            value,
            unit,
            why,
            ..
        } => format!("{quantity} = {}: {why}", show(*value, unit)),
        EngineError::NoTemperatureDifference { value, unit } => format!(
            "surface and stream are both at {}: no heat flows, so there is nothing to compute",
            show(*value, unit)
        ),
        EngineError::WrongPhase {
            asked,
            t,
            boundary,
            why,
            ..
        } => format!(
            "{asked} at {}: {why}; the phase changes at {}",
            show(*t, "K"),
            show(*boundary, "K")
        ),
        other => other.to_string(),
    };
    // ASCII only: `char::to_uppercase` would bring Unicode's case tables (14 kB) into the page.
    let mut text = text;
    if let Some(first) = text.get_mut(..1) {
        first.make_ascii_uppercase();
    }
    text
}

/// How a phase error of the process fluid names it, so the page puts it beside the process
/// temperature.
pub const PROCESS_FLUID: &str = "the process fluid";
