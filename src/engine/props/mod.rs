//! Fluid properties at (T, p), each with the range flags of the formulation behind it.

pub mod air;
pub mod glycol;
pub mod humid_air;
pub mod user;
pub mod water;

pub use glycol::Glycol;
pub use humid_air::Humidity;
pub use user::UserFluid;

use crate::engine::error::EngineError;
use crate::engine::validity::Flag;

/// One property set, SI: ρ kg/m³, μ Pa·s, k W/(m·K), cp J/(kg·K), ν m²/s, α m²/s, β 1/K.
#[derive(Debug, Clone, PartialEq)]
pub struct Properties {
    /// Temperature the set was evaluated at, K.
    pub t: f64,
    /// Pressure, Pa.
    pub p: f64,
    pub rho: f64,
    pub mu: f64,
    pub k: f64,
    pub cp: f64,
    /// Kinematic viscosity μ/ρ.
    pub nu: f64,
    /// Thermal diffusivity k/(ρ·cp).
    pub alpha: f64,
    /// Prandtl number μ·cp/k.
    pub pr: f64,
    /// Volumetric expansion coefficient −(1/ρ)(∂ρ/∂T)_p.
    pub beta: f64,
    /// Where each property comes from, for the working.
    pub sources: &'static [(&'static str, &'static str)],
    pub flags: Vec<Flag>,
}

impl Properties {
    /// Fill the derived members from the four primaries.
    #[allow(clippy::too_many_arguments)]
    pub fn from_primaries(
        t: f64,
        p: f64,
        rho: f64,
        mu: f64,
        k: f64,
        cp: f64,
        beta: f64,
        sources: &'static [(&'static str, &'static str)],
        flags: Vec<Flag>,
    ) -> Self {
        Properties {
            t,
            p,
            rho,
            mu,
            k,
            cp,
            nu: mu / rho,
            alpha: k / (rho * cp),
            pr: mu * cp / k,
            beta,
            sources,
            flags,
        }
    }
}

/// The fluids the engine knows. One interface for all: [`Fluid::at`].
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Fluid {
    DryAir,
    HumidAir(Humidity),
    Water,
    Steam,
    /// A glycol–water mixture at a mass fraction 0–0.6.
    Glycol(Glycol, f64),
    User(UserFluid),
}

impl Fluid {
    pub fn name(&self) -> &'static str {
        match self {
            Fluid::DryAir => "dry air",
            Fluid::HumidAir(_) => "humid air",
            Fluid::Water => "liquid water",
            Fluid::Steam => "steam",
            Fluid::Glycol(g, _) => g.name(),
            Fluid::User(_) => "user fluid",
        }
    }

    /// Whether the fluid is a gas (for the choice of correlation and its ranges).
    pub fn is_gas(&self) -> bool {
        matches!(self, Fluid::DryAir | Fluid::HumidAir(_) | Fluid::Steam)
    }

    /// Properties at temperature `t` (K) and pressure `p` (Pa).
    pub fn at(&self, t: f64, p: f64) -> Result<Properties, EngineError> {
        match self {
            Fluid::DryAir => air::properties(t, p),
            Fluid::HumidAir(h) => humid_air::properties(t, p, *h),
            Fluid::Water => water::liquid(t, p),
            Fluid::Steam => water::steam(t, p),
            Fluid::Glycol(g, x) => glycol::properties(*g, *x, t, p),
            Fluid::User(u) => user::properties(u, t, p),
        }
    }
}
