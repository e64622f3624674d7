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

pub(crate) const fn f(
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
            Some(d) => {
                let u = c.get(d);
                format!("{} {}", format_sig(u.from_si(v), 4), u.symbol)
            }
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
