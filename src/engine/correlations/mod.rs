//! External-flow correlations: dimensionless functions Nu(Re, Pr, …), each with its published
//! range as data. Properties are the caller's business: each correlation declares the reference
//! temperature its properties must be taken at ([`Reference`]), and the caller builds its
//! [`Groups`] there.
//!
//! Every Nusselt number returned here is based on the shape's characteristic length `D` (the one
//! drawn on the page), whatever length the correlation uses inside.

pub mod bars;
pub mod cylinder;
pub mod internal;
pub mod local;
pub mod mixed;
pub mod natural;
pub mod sphere;

use crate::engine::validity::Flagged;

/// The temperature a correlation's properties are evaluated at.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Reference {
    /// Mean of surface and free stream, (Ts + T∞)/2.
    Film,
    /// The approaching stream, T∞; a correction factor takes Pr or μ at the surface, Ts.
    FreeStream,
}

impl Reference {
    pub fn describe(&self) -> &'static str {
        match self {
            Reference::Film => "film temperature (Ts + T∞)/2",
            Reference::FreeStream => "free-stream temperature T∞",
        }
    }
    pub fn short(&self) -> &'static str {
        match self {
            Reference::Film => "Tf",
            Reference::FreeStream => "T∞",
        }
    }
}

/// The dimensionless groups one forced-convection correlation needs, each taken at the
/// temperature that correlation asks for.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Groups {
    /// Reynolds number U·D/ν, ν at the correlation's reference temperature.
    pub re: f64,
    /// Prandtl number at the reference temperature.
    pub pr: f64,
    /// Prandtl number at the surface temperature.
    pub pr_s: f64,
    /// μ at the reference temperature over μ at the surface.
    pub mu_ratio: f64,
    /// T∞/Ts, absolute temperatures.
    pub t_ratio: f64,
    /// The fluid is a gas (some corrections differ for gases and liquids).
    pub gas: bool,
}

impl Groups {
    /// Groups with no property variation (Pr_s = Pr, μ/μs = 1, T∞ = Ts), for plots and checks.
    pub fn uniform(re: f64, pr: f64, gas: bool) -> Self {
        Groups {
            re,
            pr,
            pr_s: pr,
            mu_ratio: 1.0,
            t_ratio: 1.0,
            gas,
        }
    }
}

/// One forced-convection correlation, described as data.
#[derive(Debug, Clone, Copy)]
pub struct Forced {
    /// Stable id (tests, page attributes).
    pub id: &'static str,
    /// Name with year, as shown.
    pub name: &'static str,
    pub reference: Reference,
    /// The equation in one line, as shown in the working.
    pub formula: &'static str,
    /// Mean Nu on the shape's characteristic length, with its range flags.
    pub nu: fn(&Groups) -> Flagged<f64>,
    /// The limit of Nu as Re → 0 with everything else fixed (0 for pure power laws); the
    /// mixed-convection blend adds natural convection to the part above it.
    pub nu_still: fn(&Groups) -> f64,
    /// For the working: the band and constants used, or the parts of a composite form.
    pub detail: fn(&Groups) -> Option<String>,
    /// It reads the surface's properties (Pr_s or μs in a correction factor).
    pub surface: bool,
}

/// No detail beyond the formula.
pub(crate) fn no_detail(_: &Groups) -> Option<String> {
    None
}

/// "C = 0.193, m = 0.618 for 4000 ≤ Re < 40 000" for a banded table.
pub(crate) fn band_text(
    bands: &crate::engine::validity::Bands,
    i: usize,
    c: f64,
    m: f64,
) -> String {
    let f = |v: f64| crate::engine::units::format_sig(v, 4);
    format!(
        "band {} ≤ {} < {}: C = {}, m = {}",
        f(bands.edges[i]),
        bands.quantity,
        f(bands.edges[i + 1]),
        c,
        m
    )
}

/// Zero, for correlations that vanish with Re.
pub(crate) fn zero(_: &Groups) -> f64 {
    0.0
}

/// Standard acceleration of gravity, m/s² (CGPM 1901, exact).
pub const G: f64 = 9.806_65;
