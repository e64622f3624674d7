//! A fluid the user describes with constant properties (oils, brines, anything not built in).

use super::Properties;
use crate::engine::error::{finite, EngineError};

/// Constant properties typed by the user, SI. `beta` is optional: without it natural convection
/// cannot be computed for this fluid.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct UserFluid {
    pub rho: f64,
    pub mu: f64,
    pub k: f64,
    pub cp: f64,
    pub beta: Option<f64>,
}

pub const SOURCES: &[(&str, &str)] = &[("ρ, μ, k, cp, β", "entered by the user (constant)")];

pub fn properties(f: &UserFluid, t: f64, p: f64) -> Result<Properties, EngineError> {
    for (q, v) in [
        ("user fluid density", f.rho),
        ("user fluid viscosity", f.mu),
        ("user fluid conductivity", f.k),
        ("user fluid heat capacity", f.cp),
    ] {
        finite(q, v)?;
        if v <= 0.0 {
            return Err(EngineError::Undefined {
                subject: crate::engine::error::Subject::General,
                quantity: q,
                value: v,
                unit: "SI",
                why: "must be above zero",
            });
        }
    }
    let beta = match f.beta {
        Some(b) => finite("user fluid expansion coefficient", b)?,
        None => 0.0,
    };
    Ok(Properties::from_primaries(
        t,
        p,
        f.rho,
        f.mu,
        f.k,
        f.cp,
        beta,
        SOURCES,
        Vec::new(),
    ))
}
