//! Errors: only where a formulation is undefined or a solver cannot converge.
//! Each carries the offending value and its unit.

use std::fmt;

#[derive(Debug, Clone, PartialEq)]
pub enum EngineError {
    /// An input was NaN or infinite.
    NonFinite { quantity: &'static str },
    /// A value outside what the formulation can be evaluated at at all (not merely outside its fit).
    Undefined {
        quantity: &'static str,
        value: f64,
        unit: &'static str,
        why: &'static str,
    },
    /// The surface and the stream are at the same temperature: there is no heat flow to compute.
    NoTemperatureDifference { value: f64, unit: &'static str },
    /// A result came out non-finite (an input of absurd magnitude somewhere).
    NonFiniteResult { quantity: &'static str },
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
            } => write!(f, "{quantity} = {value} {unit}: {why}"),
            EngineError::NoTemperatureDifference { value, unit } => write!(
                f,
                "surface and stream are both at {value} {unit}: no heat flows, so there is nothing to compute"
            ),
            EngineError::NonFiniteResult { quantity } => write!(
                f,
                "{quantity} came out too large to represent; check the inputs' magnitudes"
            ),
        }
    }
}

impl std::error::Error for EngineError {}

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
