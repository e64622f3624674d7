//! Errors: only where a formulation is undefined or a solver cannot converge.
//! Each carries the offending value and its unit.

use std::fmt;

/// What an error is about, as data: the input layer maps it to the field a person can change
/// (`scenario::error_field`), never by reading the message.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Subject {
    /// Nothing one input names.
    General,
    /// A scenario input, by its link key.
    Input(&'static str),
    /// The stream's fluid, or the process fluid inside a pipe.
    StreamFluid,
    ProcessFluid,
    /// A user fluid's expansion coefficient β.
    Beta,
    /// The bore left inside the wall.
    BoreRadius,
    /// Layer `i` of a construction counted from the bore (0: the wall).
    LayerThickness(usize),
    LayerConductivity(usize),
    /// The data sheet's second and third mean temperatures.
    MeanTempB,
    MeanTempC,
    Emissivity,
    /// The stream's moisture (relative humidity or vapour pressure), its dew point.
    Humidity,
    DewPoint,
    /// A glycol–water mixture's glycol content.
    GlycolFraction,
}

#[derive(Debug, Clone, PartialEq)]
pub enum EngineError {
    /// An input was NaN or infinite.
    NonFinite { quantity: &'static str },
    /// A value outside what the formulation can be evaluated at at all (not merely outside its fit).
    Undefined {
        subject: Subject,
        quantity: &'static str,
        value: f64,
        unit: &'static str,
        why: &'static str,
    },
    /// The surface and the stream are at the same temperature: there is no heat flow to compute.
    NoTemperatureDifference { value: f64, unit: &'static str },
    /// A fluid asked for in a phase it is not in at that state; `boundary` is the temperature of
    /// the phase change (saturation or freezing), K.
    WrongPhase {
        subject: Subject,
        asked: &'static str,
        t: f64,
        boundary: f64,
        why: &'static str,
    },
    /// A result came out non-finite (an input of absurd magnitude somewhere).
    NonFiniteResult { quantity: &'static str },
    /// A stream against the buoyant flow cancels it: the blend leaves no heat-transfer coefficient.
    OpposingFlowsCancel,
}

impl fmt::Display for EngineError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            EngineError::NonFinite { quantity } => write!(f, "{quantity} must be a finite number"),
            EngineError::Undefined {
                quantity,
                value,
                unit,
                why,
                ..
            } => write!(f, "{quantity} = {value} {unit}: {why}"),
            EngineError::NoTemperatureDifference { value, unit } => write!(
                f,
                "surface and stream are both at {value} {unit}: no heat flows, so there is nothing to compute"
            ),
            EngineError::WrongPhase {
                asked,
                t,
                boundary,
                why,
                ..
            } => write!(
                f,
                "{asked} at {} K ({} °C): {why}; the phase changes at {} K ({} °C)",
                fmt4(*t),
                fmt4(t - 273.15),
                fmt4(*boundary),
                fmt4(boundary - 273.15)
            ),
            EngineError::NonFiniteResult { quantity } => write!(
                f,
                "{quantity} came out too large to represent; check the inputs' magnitudes"
            ),
            EngineError::OpposingFlowsCancel => write!(
                f,
                "heat-transfer coefficient: the stream against the buoyant flow cancels it here (the blend gives none); change the stream's speed or direction"
            ),
        }
    }
}

impl std::error::Error for EngineError {}

fn fmt4(v: f64) -> String {
    crate::engine::units::format_sig(v, 5)
}

/// The error for a value outside what a method can be evaluated at at all, about `subject`.
pub fn undefined(
    subject: Subject,
    quantity: &'static str,
    value: f64,
    unit: &'static str,
    why: &'static str,
) -> EngineError {
    EngineError::Undefined {
        subject,
        quantity,
        value,
        unit,
        why,
    }
}

/// Reject NaN and infinities up front.
pub fn finite(quantity: &'static str, v: f64) -> Result<f64, EngineError> {
    if v.is_finite() {
        Ok(v)
    } else {
        Err(EngineError::NonFinite { quantity })
    }
}

/// A result must be finite before it leaves the engine.
pub fn finite_result(quantity: &'static str, v: f64) -> Result<f64, EngineError> {
    if v.is_finite() {
        Ok(v)
    } else {
        Err(EngineError::NonFiniteResult { quantity })
    }
}
