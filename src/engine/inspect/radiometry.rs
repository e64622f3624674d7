//! An infrared reading, corrected: the true surface temperature behind what an instrument shows.
//!
//! # Model (after ASTM E1862, reflected temperature, and ASTM E1933, emissivity)
//! The instrument turns the radiance it receives over its waveband into a temperature. It was set
//! to an emissivity `ε_set` and compensates for a reflected apparent temperature `T_refl`; the
//! surface's true emissivity is `ε_s`. With `L(T)` the blackbody radiance over the band (Planck's
//! law integrated from `λ₁` to `λ₂`), the signal is, as the instrument assumed and in truth,
//!
//! ```text
//! S = ε_set·L(T_disp) + (1 − ε_set)·L(T_refl) = ε_s·L(T_s) + (1 − ε_s)·L(T_refl)
//! ```
//!
//! so `L(T_s) = [ε_set·L(T_disp) + (ε_s − ε_set)·L(T_refl)] / ε_s`, inverted for `T_s` with the
//! bracketed root finder ([`crate::engine::solve`]). Assumptions, stated: the surface is grey and
//! opaque over the band (reflectance 1 − ε); the surroundings it reflects are one uniform
//! temperature, the same the instrument compensated with; the atmosphere between instrument and
//! surface transmits everything (τ = 1: a short range, as in a walk-down), and emits nothing; the
//! instrument's spectral response is flat over the band. [`total_radiation`] is the same balance
//! with σT⁴ in place of the band radiance (all wavelengths): a cross-check and an approximation
//! only, as a band instrument does not see the whole spectrum.
//!
//! The band integral is exact: with x = c₂/(λT), ∫ L_λ dλ = (c₁ₗ·T⁴/c₂⁴)·∫ x³/(eˣ − 1) dx, and
//! ∫ₓ^∞ t³/(eᵗ − 1) dt = Σₙ e^(−nx)·(x³/n + 3x²/n² + 6x/n³ + 6/n⁴), summed until the terms no
//! longer change the sum.

use crate::engine::error::{finite_result, EngineError, Subject};
use crate::engine::solve;

/// Planck constant, J·s; speed of light, m/s; Boltzmann constant, J/K (exact in the 2019 SI).
const H: f64 = 6.626_070_15e-34;
const C: f64 = 299_792_458.0;
const KB: f64 = 1.380_649e-23;
/// First radiation constant for spectral radiance, 2hc², W·m²/sr.
pub const C1L: f64 = 2.0 * H * C * C;
/// Second radiation constant, hc/k, m·K.
pub const C2: f64 = H * C / KB;

/// The step in emissivity the reliability measure uses: how far the answer moves for an
/// emissivity 0.05 off (common practice: tables and contact methods rarely know ε better).
pub const EMISSIVITY_STEP: f64 = 0.05;
/// Below this emissivity a reading is taken as unreliable without a tape or paint of known
/// emissivity on the spot (common practice in thermography, not a standard's number).
pub const LOW_EMISSIVITY: f64 = 0.5;
/// A correction larger than this, K, is flagged (common practice).
pub const LARGE_CORRECTION: f64 = 10.0;
/// A reading within this many kelvin of the reflected temperature, on a surface that reflects
/// enough for it to matter ([`REFLECTED_SHARE`]), carries little of the surface's own radiation
/// (common practice).
pub const MIN_CONTRAST: f64 = 10.0;
/// The share of the received signal that is reflection, (1 − ε)·L(T_r)/S, above which a reading
/// near the reflected temperature is flagged (a threshold chosen here, not a standard's: a
/// painted jacket, ε 0.95, reflects about 5 % and is never flagged for contrast alone).
pub const REFLECTED_SHARE: f64 = 0.2;
/// When ±[`EMISSIVITY_STEP`] moves the corrected temperature by more than this, K, the emissivity
/// must be known better than tables give it (common practice).
pub const SENSITIVITY_LIMIT: f64 = 5.0;

/// Most terms of the series: enough for x ≥ 0.02 (a band to 100 µm at 7000 K) to 1e-17.
const MAX_TERMS: usize = 4000;

/// The instrument's reading and settings, SI (K, m; emissivities 0–1).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Reading {
    /// The temperature the instrument displayed, K.
    pub displayed: f64,
    /// The emissivity the instrument was set to.
    pub emissivity_set: f64,
    /// The reflected apparent temperature it compensated with (ASTM E1862), K.
    pub reflected: f64,
    /// The waveband, m (8–14 µm for most field instruments).
    pub band: (f64, f64),
}

/// Why a corrected reading is flagged (each threshold is common practice).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Caveat {
    /// The surface's emissivity is below [`LOW_EMISSIVITY`].
    LowEmissivity,
    /// The correction exceeds [`LARGE_CORRECTION`].
    LargeCorrection,
    /// The reading is within [`MIN_CONTRAST`] of the reflected temperature.
    NearReflected,
    /// ±[`EMISSIVITY_STEP`] moves the answer by more than [`SENSITIVITY_LIMIT`] (or the
    /// emissivity is too low for the step to be taken at all).
    EmissivitySensitive,
}

impl Caveat {
    pub fn text(&self) -> &'static str {
        match self {
            Caveat::LowEmissivity => "the surface's emissivity is below 0.5: put a tape or paint of known emissivity on the spot and read that (common practice)",
            Caveat::LargeCorrection => "the correction is more than 10 K (common practice threshold)",
            Caveat::NearReflected => "the reading is within 10 K of the reflected temperature on a surface that reflects a fifth or more of what the instrument receives: an error in the reflected temperature passes straight into the answer (common practice threshold)",
            Caveat::EmissivitySensitive => "an emissivity 0.05 off moves the answer by more than 5 K (common practice threshold)",
        }
    }
}

/// A reading corrected to the surface's emissivity.
#[derive(Debug, Clone, PartialEq)]
pub struct Corrected {
    /// The true surface temperature by the band balance, K.
    pub surface: f64,
    /// The same by the total-radiation (σT⁴) balance, K: a cross-check.
    pub total_radiation: f64,
    /// `surface − displayed`, K.
    pub correction: f64,
    /// The corrected temperature with the surface's emissivity 0.05 lower and 0.05 higher
    /// (capped at 1), K; `None` low when ε − 0.05 ≤ 0 (no answer).
    pub at_lower_emissivity: Option<f64>,
    pub at_higher_emissivity: f64,
    /// The largest move of the two, K (`None` when the lower one has no answer).
    pub sensitivity: Option<f64>,
    /// Band radiances used, W/(m²·sr): at the display, the reflected and the surface temperature.
    pub radiance_displayed: f64,
    pub radiance_reflected: f64,
    pub radiance_surface: f64,
    pub iterations: u32,
    pub caveats: Vec<Caveat>,
}

impl Corrected {
    /// No caveat applies.
    pub fn reliable(&self) -> bool {
        self.caveats.is_empty()
    }
}

/// ∫ₓ^∞ t³/(eᵗ − 1) dt by the exact series (see the module). `x > 0`.
pub fn tail_integral(x: f64) -> f64 {
    let r = (-x).exp();
    let (x2, x3) = (x * x, x * x * x);
    let mut p = 1.0;
    let mut sum = 0.0;
    for n in 1..=MAX_TERMS {
        p *= r;
        let nf = n as f64;
        let term = p
            * (x3 / nf
                + 3.0 * x2 / (nf * nf)
                + 6.0 * x / (nf * nf * nf)
                + 6.0 / (nf * nf * nf * nf));
        sum += term;
        if term <= 1e-17 * sum || p == 0.0 {
            break;
        }
    }
    sum
}

/// Blackbody radiance over the band (λ₁, λ₂) at temperature `t`, W/(m²·sr).
pub fn band_radiance(t: f64, band: (f64, f64)) -> f64 {
    if t <= 0.0 {
        return 0.0;
    }
    let (x_short, x_long) = (C2 / (band.0 * t), C2 / (band.1 * t));
    let scale = C1L * (t / C2).powi(4);
    scale * (tail_integral(x_long) - tail_integral(x_short))
}

/// The error for the reading input `key` (its link key: the page marks that field).
fn input_error(
    key: &'static str,
    quantity: &'static str,
    value: f64,
    unit: &'static str,
    why: &'static str,
) -> EngineError {
    crate::engine::error::undefined(Subject::Input(key), quantity, value, unit, why)
}

/// Check a reading's own inputs: emissivities in (0, 1], a band with λ₁ < λ₂, a reading apart from
/// the reflected temperature. Errors name the input by its link key (see `scenario::FIELDS`).
pub fn check(r: &Reading, emissivity: f64) -> Result<(), EngineError> {
    if !(emissivity > 0.0 && emissivity <= 1.0) {
        return Err(input_error("e", "emissivity", emissivity, "", "must be above 0 and at most 1 to correct a reading (at 0 the surface shows nothing of itself)"));
    }
    if !(r.emissivity_set > 0.0 && r.emissivity_set <= 1.0) {
        return Err(input_error(
            "eir",
            "instrument emissivity",
            r.emissivity_set,
            "",
            "must be above 0 and at most 1",
        ));
    }
    let (a, b) = r.band;
    if !(a > 0.0 && b.is_finite()) || b <= a {
        return Err(input_error(
            "lb2",
            "band upper wavelength",
            b * 1e6,
            "µm",
            "must be longer than the band's lower wavelength (an empty or reversed band)",
        ));
    }
    if !(r.displayed > 0.0 && r.reflected > 0.0) {
        return Err(input_error(
            "Tir",
            "reading",
            r.displayed,
            "K",
            "must be above absolute zero",
        ));
    }
    if (r.displayed - r.reflected).abs() < 1e-6 {
        return Err(input_error("Tir", "reading", r.displayed, "K", "equals the reflected temperature: the reading carries no information about the surface"));
    }
    Ok(())
}

/// The surface temperature whose band radiance is `target`, K, by the bracketed solver on
/// ln L(T) − ln target, starting from `guess`.
fn invert(target: f64, band: (f64, f64), guess: f64) -> Result<solve::Root, EngineError> {
    let out = |value: f64| {
        input_error(
            "Tir",
            "corrected surface temperature",
            value,
            "K",
            "is outside what the instrument's band can measure",
        )
    };
    if !(target > 0.0 && target.is_finite()) {
        return Err(input_error("Tir", "reading", guess, "K", "is below what the reflection alone would show at this emissivity: no surface temperature explains it (check the emissivities and the reflected temperature)"));
    }
    let f = |t: f64| band_radiance(t, band).ln() - target.ln();
    let (mut lo, mut hi) = (0.9 * guess, 1.1 * guess);
    while f(lo) >= 0.0 {
        lo *= 0.5;
        if lo < 1.0 {
            return Err(out(lo));
        }
    }
    while f(hi) <= 0.0 {
        hi *= 2.0;
        if hi > 1e5 {
            return Err(out(hi));
        }
    }
    solve::bracketed(f, lo, hi, 1e-14).map_err(|_| out(guess))
}

/// The total-radiation (σT⁴) form of the balance: T_s = [(ε_set·T_d⁴ + (ε_s − ε_set)·T_r⁴)/ε_s]^¼.
/// `None` where the bracket is not positive (the reading is below what the reflection shows).
pub fn total_radiation(r: &Reading, emissivity: f64) -> Option<f64> {
    let t4 = (r.emissivity_set * r.displayed.powi(4)
        + (emissivity - r.emissivity_set) * r.reflected.powi(4))
        / emissivity;
    (t4 > 0.0 && t4.is_finite()).then(|| t4.sqrt().sqrt())
}

/// The surface temperature by the band balance alone (no sensitivity, no caveats), K.
pub fn surface_temperature(r: &Reading, emissivity: f64) -> Result<f64, EngineError> {
    Ok(surface_root(r, emissivity)?.0)
}

fn surface_root(r: &Reading, emissivity: f64) -> Result<(f64, u32, [f64; 3]), EngineError> {
    check(r, emissivity)?;
    let l_d = band_radiance(r.displayed, r.band);
    let l_r = band_radiance(r.reflected, r.band);
    let target = (r.emissivity_set * l_d + (emissivity - r.emissivity_set) * l_r) / emissivity;
    if !(target > 0.0 && target.is_finite()) {
        return Err(input_error("Tir", "reading", r.displayed, "K", "is below what the reflection alone would show at this emissivity: no surface temperature explains it (check the emissivities and the reflected temperature)"));
    }
    let guess = total_radiation(r, emissivity).unwrap_or(r.displayed);
    let root = invert(target, r.band, guess)?;
    let t = finite_result("corrected surface temperature", root.x)?;
    Ok((t, root.iterations, [l_d, l_r, target]))
}

/// Correct a reading to the surface's true `emissivity`: the band balance, the σT⁴ cross-check,
/// the move for an emissivity 0.05 off either way, and the caveats.
pub fn correct(r: &Reading, emissivity: f64) -> Result<Corrected, EngineError> {
    let (surface, iterations, [l_d, l_r, l_s]) = surface_root(r, emissivity)?;
    let total_radiation = finite_result(
        "corrected surface temperature (σT⁴ form)",
        total_radiation(r, emissivity).unwrap_or(0.0),
    )?;
    let lower = emissivity - EMISSIVITY_STEP;
    let at_lower_emissivity = if lower > 0.0 {
        surface_temperature(r, lower).ok()
    } else {
        None
    };
    let at_higher_emissivity = surface_temperature(r, (emissivity + EMISSIVITY_STEP).min(1.0))?;
    let sensitivity = at_lower_emissivity.map(|lo| {
        (lo - surface)
            .abs()
            .max((at_higher_emissivity - surface).abs())
    });
    let correction = surface - r.displayed;
    let mut caveats = Vec::new();
    if emissivity < LOW_EMISSIVITY {
        caveats.push(Caveat::LowEmissivity);
    }
    if correction.abs() > LARGE_CORRECTION {
        caveats.push(Caveat::LargeCorrection);
    }
    if (r.displayed - r.reflected).abs() < MIN_CONTRAST
        && (1.0 - emissivity) * l_r / (emissivity * l_s + (1.0 - emissivity) * l_r)
            > REFLECTED_SHARE
    {
        caveats.push(Caveat::NearReflected);
    }
    if sensitivity.is_none_or(|s| s > SENSITIVITY_LIMIT) {
        caveats.push(Caveat::EmissivitySensitive);
    }
    Ok(Corrected {
        surface,
        total_radiation,
        correction,
        at_lower_emissivity,
        at_higher_emissivity,
        sensitivity,
        radiance_displayed: l_d,
        radiance_reflected: l_r,
        radiance_surface: l_s,
        iterations,
        caveats,
    })
}
