//! Ethylene- and propylene-glycol–water mixtures.
//!
//! Å. Melinder, "Properties of Secondary Working Fluids for Indirect Systems", 2nd ed., IIR (2010):
//! each property is a double polynomial f(x, T) = Σ c_ij (x − x_m)^i (T − T_m)^j in the mass
//! fraction x and the temperature, ln(μ/mPa·s) for viscosity, and the freezing point as a
//! polynomial in x. The coefficients below are those of the fits as CoolProp 8.0.0 carries them
//! (its `INCOMP::MEG` and `INCOMP::MPG` fluids), against which tests/data/glycol_coolprop.csv checks
//! them. Published for 0–60 % by mass, from the mixture's freezing point to 100 °C (the upper
//! limit as CoolProp applies it).
//!
//! Units: T K, x mass fraction 0–0.6, ρ kg/m³, cp J/(kg·K), k W/(m·K), μ Pa·s.

use super::Properties;
use crate::engine::error::{finite, EngineError};
use crate::engine::validity::Range;

#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Glycol {
    Ethylene,
    Propylene,
}

/// One fluid's fits: rows are powers of (T − T_m), columns powers of (x − x_m).
struct Fit {
    t_m: f64,
    x_m: f64,
    freeze: [f64; 6],
    rho: [[f64; 6]; 4],
    cp: [[f64; 6]; 4],
    k: [[f64; 6]; 4],
    /// ln(μ / mPa·s).
    ln_mu: [[f64; 6]; 4],
}

const MEG: Fit = Fit {
    t_m: 304.878,
    x_m: 0.308462,
    freeze: [257.9, -80.8, -133.4, -72.93, 100.6, 11.4],
    rho: [
        [1034.0, 131.1, 0.749, -106.2, -96.23, 489.1],
        [-0.4781, -0.6876, 0.7855, 1.229, -7.211, 0.0],
        [-2.692e-3, 4.805e-3, -3.995e-3, -1.153e-2, 0.0, 0.0],
        [4.725e-6, 1.69e-6, 4.982e-5, 0.0, 0.0, 0.0],
    ],
    cp: [
        [3737.0, -1799.0, -993.3, 2610.0, 1537.0, -16180.0],
        [2.93, 10.46, 3.516, -1.189, -42.72, 0.0],
        [-4.675e-3, -4.147e-2, 5.109e-2, -1.643e-1, 0.0, 0.0],
        [-1.389e-5, 1.847e-5, -7.138e-4, 0.0, 0.0, 0.0],
    ],
    k: [
        [0.472, -0.4286, 0.1747, 0.03017, -0.1322, 0.2678],
        [8.903e-4, -1.473e-3, 6.814e-4, -2.412e-3, 2.555e-3, 0.0],
        [-1.058e-6, 1.059e-5, -3.612e-5, 4.004e-5, 0.0, 0.0],
        [-2.789e-9, -1.142e-8, 2.365e-8, 0.0, 0.0, 0.0],
    ],
    ln_mu: [
        [0.4705, 2.471, 0.03328, 1.659, 3.089, -18.65],
        [-2.55e-2, -1.171e-2, 1.086e-2, 3.157e-3, 1.831e-2, 0.0],
        [1.782e-4, 1.052e-4, 1.051e-4, 4.063e-4, 0.0, 0.0],
        [-7.669e-7, -1.634e-6, -6.475e-6, 0.0, 0.0, 0.0],
    ],
};

const MPG: Fit = Fit {
    t_m: 305.8583,
    x_m: 0.307031,
    freeze: [259.9, -66.31, -109.4, -228.3, -340.9, 146.5],
    rho: [
        [1018.0, 76.04, -24.98, -155.0, -113.1, 234.2],
        [-0.5406, -0.945, 0.27, 2.829, -2.221, 0.0],
        [-2.666e-3, 5.541e-3, -4.018e-3, -7.175e-3, 0.0, 0.0],
        [1.347e-5, -1.343e-5, 3.376e-5, 0.0, 0.0, 0.0],
    ],
    cp: [
        [3882.0, -1304.0, -1598.0, 353.9, 5000.0, -4959.0],
        [2.699, 5.07, 0.9534, 31.02, -71.35, 0.0],
        [-1.659e-3, -4.752e-3, 0.1167, -0.295, 0.0, 0.0],
        [-1.032e-5, 1.522e-4, -4.87e-4, 0.0, 0.0, 0.0],
    ],
    k: [
        [0.4513, -0.4795, 0.2076, -0.09083, -0.05952, 0.2104],
        [7.955e-4, -1.678e-3, 1.563e-3, -2.518e-3, -3.605e-3, 0.0],
        [3.482e-8, 8.941e-6, -4.615e-5, 6.543e-5, 0.0, 0.0],
        [-5.966e-9, 1.493e-8, 9.897e-8, 0.0, 0.0, 0.0],
    ],
    ln_mu: [
        [0.6837, 3.328, 0.5453, -3.9, -1.587, 35.64],
        [-3.045e-2, -3.984e-2, -8.6e-4, 0.1054, 4.475e-2, 0.0],
        [2.525e-4, 4.332e-4, -1.593e-4, -1.589e-3, 0.0, 0.0],
        [-1.399e-6, -1.86e-6, -4.465e-7, 0.0, 0.0, 0.0],
    ],
};

impl Glycol {
    fn fit(&self) -> &'static Fit {
        match self {
            Glycol::Ethylene => &MEG,
            Glycol::Propylene => &MPG,
        }
    }
    pub fn name(&self) -> &'static str {
        match self {
            Glycol::Ethylene => "ethylene glycol–water",
            Glycol::Propylene => "propylene glycol–water",
        }
    }
}

/// f and ∂f/∂T of one double polynomial.
fn poly(c: &[[f64; 6]; 4], dt: f64, dx: f64) -> (f64, f64) {
    let (mut f, mut df) = (0.0, 0.0);
    for (i, row) in c.iter().enumerate() {
        let mut inner = 0.0;
        for &cij in row.iter().rev() {
            inner = inner * dx + cij;
        }
        f += inner * dt.powi(i as i32);
        if i > 0 {
            df += inner * i as f64 * dt.powi(i as i32 - 1);
        }
    }
    (f, df)
}

/// Freezing point of the mixture, K, at mass fraction x.
pub fn freezing_point(g: Glycol, x: f64) -> f64 {
    let f = g.fit();
    let dx = x - f.x_m;
    f.freeze.iter().rev().fold(0.0, |acc, c| acc * dx + c)
}

pub const CONCENTRATION: Range = Range {
    quantity: "mass fraction",
    lo: 0.0,
    hi: 0.6,
    unit: "",
    source: "Melinder (2010)",
};
pub const UPPER_T: Range = Range {
    quantity: "T",
    lo: 0.0,
    hi: 373.15,
    unit: "K",
    source: "Melinder (2010) as CoolProp 8.0.0 applies it",
};

pub const SOURCES: &[(&str, &str)] = &[
    ("ρ, cp, k, μ, β", "Melinder (2010) fits"),
    ("freezing point", "Melinder (2010) fit"),
];

/// Properties of a glycol–water mixture at T (K), mass fraction x. Below the mixture's freezing
/// point it is an error naming that point; outside 0–60 % the concentration is refused (the fits
/// diverge quickly there).
pub fn properties(g: Glycol, x: f64, t: f64, p: f64) -> Result<Properties, EngineError> {
    finite("glycol temperature", t)?;
    finite("glycol concentration", x)?;
    if !(0.0..=0.6).contains(&x) {
        return Err(EngineError::Undefined {
            subject: crate::engine::error::Subject::GlycolFraction,
            quantity: "glycol concentration",
            value: x * 100.0,
            unit: "% by mass",
            why: "the fits cover 0 to 60 % by mass",
        });
    }
    let tf = freezing_point(g, x);
    if t < tf {
        return Err(EngineError::WrongPhase {
            subject: crate::engine::error::Subject::StreamFluid,
            asked: g.name(),
            t,
            boundary: tf,
            why: "the mixture freezes below its freezing point",
        });
    }
    let f = g.fit();
    let (dt, dx) = (t - f.t_m, x - f.x_m);
    let (rho, drho) = poly(&f.rho, dt, dx);
    let (cp, _) = poly(&f.cp, dt, dx);
    let (k, _) = poly(&f.k, dt, dx);
    let (ln_mu, _) = poly(&f.ln_mu, dt, dx);
    let mut flags = Vec::new();
    flags.extend(UPPER_T.check(g.name(), t, false));
    flags.extend(CONCENTRATION.check(g.name(), x, false));
    Ok(Properties::from_primaries(
        t,
        p,
        rho,
        ln_mu.exp() * 1e-3,
        k,
        cp,
        -drho / rho,
        SOURCES,
        flags,
    ))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn pure_water_end_freezes_at_zero_celsius() {
        // Both fits are anchored on water at x = 0: 273.15 K within the fits' rounding.
        for g in [Glycol::Ethylene, Glycol::Propylene] {
            assert!((freezing_point(g, 0.0) - 273.15).abs() < 0.2, "{g:?}");
        }
    }

    #[test]
    fn more_glycol_freezes_lower_within_the_range() {
        for g in [Glycol::Ethylene, Glycol::Propylene] {
            let mut last = freezing_point(g, 0.0);
            for i in 1..=12 {
                let tf = freezing_point(g, i as f64 * 0.05);
                assert!(tf < last, "{g:?} at {}", i as f64 * 0.05);
                last = tf;
            }
        }
    }

    #[test]
    fn below_freezing_is_an_error_naming_the_point() {
        let e = properties(Glycol::Ethylene, 0.3, 250.0, 101_325.0).unwrap_err();
        assert!(
            matches!(e, EngineError::WrongPhase { boundary, .. } if (boundary - 258.57).abs() < 0.05)
        );
        assert!(properties(Glycol::Ethylene, 0.7, 300.0, 101_325.0).is_err());
    }
}
