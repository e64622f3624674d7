//! Heat made inside: a body that carries its own heat source — a heat-traced line, a cable, a
//! heater, a sensor, an overhead conductor — and the steady surface temperature it runs at in
//! the stream, the sky and the sun.
//!
//! The steady balance on the outer surface, per metre of a long body (per body for a sphere):
//!
//! q_made(Ts) + q_sun = q_conv(Ts) + q_rad(Ts)
//!
//! - q_made: a known heat, or I²·R(Ts) for a current I through a resistance per metre that is
//!   linear in temperature between two data-sheet points (the form IEEE Std 738 and CIGRE TB 601
//!   use for a conductor's AC resistance).
//! - q_sun: the absorbed solar heat ([`super::irradiance::absorbed_cylinder`] or
//!   `absorbed_sphere`), 0 at night or indoors.
//! - q_conv: the engine's recommended correlation at its own reference temperature, blended with
//!   natural convection, with the wind's yaw factor carried by the body
//!   ([`crate::engine::body::Body::yaw`], [`super::wind::yaw_factor`]) — exactly the
//!   convection of the insulated job ([`crate::engine::heatloss::surface_loss`]).
//! - q_rad: ε·σ·A·(Ts⁴ − Tr⁴), Tr the surroundings indoors, the sky and ground together outdoors
//!   ([`super::sky::radiant_surroundings`]).
//!
//! The body is taken as isothermal: the heat is made at the surface temperature, the conductor's
//! temperature is its surface's. A stranded conductor's core runs somewhat hotter than its
//! surface at high current, and a traced line's tracer hotter than its jacket; neither radial
//! difference is modelled here.
//!
//! The forward problem is solved for Ts with the bracketed solver ([`crate::engine::solve`]): the
//! residual is never negative at the colder of the air and the surroundings (nothing there is
//! lost, everything made is gained) and the upper end is found by doubling the step until the
//! losses exceed the gains. The inverse (the heat or current that holds the surface at a limit)
//! needs no solver: at a known Ts every term is known.
//!
//! Units: SI — K, W/m (W for a sphere), A, Ω/m. No function panics on any input; an input
//! outside its domain is an [`EngineError`] naming it by its link key ([`super::keys`]).

use super::{finite, kelvin, keys, pressure_pa, undefined, within};
use crate::engine::body::Body;
use crate::engine::error::{finite_result, EngineError, Subject};
use crate::engine::heatloss::{self, SurfaceLoss};
use crate::engine::solve;

/// The hottest surface the forward solve looks for, K: the top of the air formulation's range
/// (Lemmon & Jacobsen 2004, 2000 K). A heat that no surface below it can lose is an error.
pub const HOTTEST: f64 = 2000.0;

/// A conductor's resistance per metre, linear in temperature through two data-sheet points
/// (R(T) = R1 + (R2 − R1)·(T − T1)/(T2 − T1)), extrapolated linearly outside them as IEEE Std
/// 738 does. AC or DC, as the data sheet gives it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Resistance {
    t_low: f64,
    r_low: f64,
    t_high: f64,
    r_high: f64,
}

impl Resistance {
    /// From two data-sheet points: `r_low` (Ω/m) at `t_low` (K) and `r_high` at `t_high`.
    /// Errors name the input: a temperature not above 0 K, `t_high` not above `t_low`, a
    /// resistance not above 0 (either may be the larger: a falling resistance is allowed).
    pub fn new(t_low: f64, r_low: f64, t_high: f64, r_high: f64) -> Result<Self, EngineError> {
        kelvin(
            Subject::Input(keys::RESISTANCE_T_LOW),
            "resistance's first temperature",
            t_low,
        )?;
        kelvin(
            Subject::Input(keys::RESISTANCE_T_HIGH),
            "resistance's second temperature",
            t_high,
        )?;
        if t_high <= t_low {
            return Err(undefined(
                Subject::Input(keys::RESISTANCE_T_HIGH),
                "resistance's second temperature",
                t_high,
                "K",
                "the second data-sheet temperature must lie above the first",
            ));
        }
        for (key, quantity, r) in [
            (
                keys::RESISTANCE_LOW,
                "resistance at the first temperature",
                r_low,
            ),
            (
                keys::RESISTANCE_HIGH,
                "resistance at the second temperature",
                r_high,
            ),
        ] {
            finite(quantity, r)?;
            if r <= 0.0 {
                return Err(undefined(
                    Subject::Input(key),
                    quantity,
                    r,
                    "Ω/m",
                    "a conductor's resistance must be above 0",
                ));
            }
        }
        Ok(Resistance {
            t_low,
            r_low,
            t_high,
            r_high,
        })
    }

    /// R(T), Ω/m, at `t` K: the line through the two points (outside them too).
    pub fn at(&self, t: f64) -> f64 {
        self.r_low + (self.r_high - self.r_low) * (t - self.t_low) / (self.t_high - self.t_low)
    }

    /// The resistance at `t`, or an error when the line has fallen to 0 or below there (two
    /// points far apart on a falling resistance, extrapolated a long way).
    fn positive_at(&self, t: f64) -> Result<f64, EngineError> {
        let r = self.at(t);
        if r > 0.0 {
            Ok(r)
        } else {
            Err(undefined(
                Subject::Input(keys::RESISTANCE_HIGH),
                "resistance extrapolated to the surface temperature",
                r,
                "Ω/m",
                "the line through the two data-sheet points falls to 0 here: give points nearer the working temperature",
            ))
        }
    }
}

/// What heats the body from inside.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Source {
    /// A known heat, W per metre of a long body (W for a sphere), ≥ 0: a tracer's output, a
    /// heater's rating.
    Heat(f64),
    /// A current through a long conductor, A (rms for AC), ≥ 0, with its resistance per metre.
    Current { amps: f64, resistance: Resistance },
}

/// The body in its surroundings, SI.
#[derive(Debug, Clone, PartialEq)]
pub struct Surface {
    /// The body and the stream: shape, axis, wind direction, outer size `d`, the speed at the
    /// body, air (or water) temperature and pressure, fluid, and `yaw`, the factor on forced
    /// convection for the wind's angle to the axis (1 square to it, for a sphere or an upright
    /// body; [`super::wind::yaw_factor`] otherwise). `t_s` is ignored: it is solved for.
    pub stream: Body,
    /// Emissivity of the outer surface, 0–1.
    pub emissivity: f64,
    /// The one temperature the surface radiates to, K: the surroundings indoors, outdoors
    /// [`super::sky::radiant_surroundings`] of the sky and the ground.
    pub t_radiant: f64,
    /// Absorbed solar heat, W/m of a long body (W for a sphere), ≥ 0.
    pub solar: f64,
}

/// The steady balance of a surface, per metre of a long body (whole body for a sphere).
#[derive(Debug, Clone, PartialEq)]
pub struct Balance {
    /// Surface (and, isothermal, conductor) temperature, K.
    pub t_surface: f64,
    /// Heat made inside at that temperature, W/m (W).
    pub made: f64,
    /// The current, A, when the heat is a current's.
    pub current: Option<f64>,
    /// The resistance at the surface temperature, Ω/m, when the heat is a current's.
    pub resistance: Option<f64>,
    /// Absorbed solar heat, W/m (W).
    pub solar: f64,
    /// Convection and radiation from the surface, with the full convection analysis.
    pub loss: SurfaceLoss,
    /// Solver steps (0 for the inverse, which needs none).
    pub iterations: u32,
    /// made + solar − convection − radiation at the answer, W/m (W).
    pub residual: f64,
}

/// Every input of the surface checked, with the error naming the one that is not usable.
fn check(s: &Surface) -> Result<(), EngineError> {
    let b = &s.stream;
    finite("outside diameter", b.d)?;
    if b.d <= 0.0 {
        return Err(undefined(
            Subject::Input(keys::DIAMETER),
            "outside diameter",
            b.d,
            "m",
            "a body's size must be above 0",
        ));
    }
    within(
        keys::WIND_READING,
        "stream speed",
        b.speed,
        0.0,
        f64::MAX,
        "m/s",
        "a speed cannot be negative",
    )?;
    kelvin(
        Subject::Input(keys::AIR_TEMPERATURE),
        "stream temperature",
        b.t_inf,
    )?;
    pressure_pa(b.p)?;
    finite("yaw factor", b.yaw)?;
    if !(b.yaw > 0.0 && b.yaw <= 1.0) {
        return Err(undefined(
            Subject::Input(keys::YAW),
            "yaw factor",
            b.yaw,
            "",
            "the factor on forced convection for the wind's angle lies above 0 and at most 1",
        ));
    }
    finite("emissivity", s.emissivity)?;
    if !(0.0..=1.0).contains(&s.emissivity) {
        return Err(undefined(
            Subject::Emissivity,
            "emissivity",
            s.emissivity,
            "",
            "must lie between 0 and 1",
        ));
    }
    kelvin(
        Subject::Input(keys::SURROUNDINGS),
        "radiant surroundings temperature",
        s.t_radiant,
    )?;
    within(
        keys::ABSORPTANCE,
        "absorbed solar heat",
        s.solar,
        0.0,
        f64::MAX,
        "W/m",
        "an absorbed solar heat cannot be negative",
    )?;
    Ok(())
}

/// The source checked: a heat or current ≥ 0; a current only through a long body.
fn check_source(s: &Surface, source: &Source) -> Result<(), EngineError> {
    match *source {
        Source::Heat(q) => within(
            keys::HEAT_MADE,
            "heat made inside",
            q,
            0.0,
            f64::MAX,
            "W/m",
            "a heat source cannot be negative (a body cooled from inside is not this mode)",
        )
        .map(|_| ()),
        Source::Current { amps, .. } => {
            within(
                keys::CURRENT,
                "current",
                amps,
                0.0,
                f64::MAX,
                "A",
                "give the current's magnitude (rms for AC): it cannot be negative",
            )?;
            long_body(s, amps)
        }
    }
}

/// A resistance per metre needs a length: a current through a sphere is refused.
fn long_body(s: &Surface, amps: f64) -> Result<(), EngineError> {
    if s.stream.shape.is_sphere() {
        Err(undefined(
            Subject::Input(keys::CURRENT),
            "current",
            amps,
            "A",
            "a resistance per metre applies to a long conductor, not to a sphere: give the heat it makes in W instead",
        ))
    } else {
        Ok(())
    }
}

/// Convection and radiation from the surface at `ts`, the lean path (the solver's inner loop).
fn loss_lean(s: &Surface, ts: f64) -> Result<SurfaceLoss, EngineError> {
    heatloss::surface_loss_lean(&s.stream, s.stream.d, ts, s.emissivity, s.t_radiant)
}

/// The heat made at `ts`, W/m (W), with the current and the resistance there.
fn made_at(source: &Source, ts: f64) -> Result<(f64, Option<f64>, Option<f64>), EngineError> {
    match *source {
        Source::Heat(q) => Ok((q, None, None)),
        Source::Current { amps, resistance } => {
            let r = resistance.positive_at(ts)?;
            Ok((amps * amps * r, Some(amps), Some(r)))
        }
    }
}

/// The balance at a known surface temperature, with the full convection analysis.
fn balance_at(
    s: &Surface,
    ts: f64,
    (made, current, resistance): (f64, Option<f64>, Option<f64>),
    iterations: u32,
) -> Result<Balance, EngineError> {
    let loss = heatloss::surface_loss(&s.stream, s.stream.d, ts, s.emissivity, s.t_radiant)?;
    let residual = made + s.solar - loss.q_conv - loss.q_rad;
    Ok(Balance {
        t_surface: finite_result("surface temperature", ts)?,
        made: finite_result("heat made inside", made)?,
        current: current.map(|i| finite_result("current", i)).transpose()?,
        resistance,
        solar: s.solar,
        loss,
        iterations,
        residual: finite_result("energy balance", residual)?,
    })
}

/// The steady surface temperature of a body making heat inside (see the module's balance).
///
/// Errors: any input outside its domain (named by its key), a current through a sphere, a
/// resistance that extrapolates to 0 at the answer, a heat no surface below [`HOTTEST`] can
/// lose, or a state the stream's fluid cannot be in at the surface (water boiling at the wall).
pub fn surface_temperature(s: &Surface, source: &Source) -> Result<Balance, EngineError> {
    check(s)?;
    check_source(s, source)?;
    // At the colder of the air and the surroundings nothing is lost (both terms are ≤ 0 there):
    // the residual is ≥ 0. The upper end is the first temperature, stepping up, where the losses
    // exceed the gains: the root lies between.
    let t_lo = s.stream.t_inf.min(s.t_radiant);
    let f_lo = residual_at(s, source, t_lo)?;
    let (t_hi, f_hi) = upper_end(s, source, t_lo)?;
    let scale = (f_lo - f_hi).abs().max(f64::MIN_POSITIVE);
    let mut failure: Option<EngineError> = None;
    let root = solve::bracketed_known_ends(
        |ts| match residual_at(s, source, ts) {
            Ok(v) => v,
            Err(e) => {
                failure.get_or_insert(e);
                f64::NAN
            }
        },
        (t_lo, Some(f_lo)),
        (t_hi, Some(f_hi)),
        1e-13 * scale,
    );
    if let Some(e) = failure {
        return Err(e);
    }
    let root = root.map_err(|_| EngineError::NonFiniteResult {
        quantity: "surface temperature (the balance did not close)",
    })?;
    balance_at(s, root.x, made_at(source, root.x)?, root.iterations)
}

/// Gains minus losses at `ts`, W/m (W): made + sun − convection − radiation.
fn residual_at(s: &Surface, source: &Source, ts: f64) -> Result<f64, EngineError> {
    let (made, ..) = made_at(source, ts)?;
    let l = loss_lean(s, ts)?;
    Ok(made + s.solar - l.q_conv - l.q_rad)
}

/// A temperature above `t_lo` where the residual is negative, and the residual there: steps of
/// 8 K doubled until the losses exceed the gains. A step the stream's fluid cannot take (water
/// boiling at the wall) is halved back towards the last good temperature, since the root may lie
/// short of it; the fluid's error is returned only when the root is beyond it.
fn upper_end(s: &Surface, source: &Source, t_lo: f64) -> Result<(f64, f64), EngineError> {
    let (mut good, mut step) = (t_lo, 8.0);
    let mut refused = None;
    for _ in 0..200 {
        let t = (good + step).min(HOTTEST);
        if t <= good {
            break;
        }
        match residual_at(s, source, t) {
            Err(e) if step < 1e-6 => return Err(e),
            Err(e) => {
                refused = Some(e);
                step *= 0.5;
            }
            Ok(f) if f < 0.0 => return Ok((t, f)),
            Ok(_) if t >= HOTTEST => break,
            Ok(_) => {
                good = t;
                step *= 2.0;
            }
        }
    }
    if let Some(e) = refused {
        return Err(e);
    }
    let (key, quantity, value, unit) = match *source {
        Source::Heat(q) => (keys::HEAT_MADE, "heat made inside", q, "W/m"),
        Source::Current { amps, .. } => (keys::CURRENT, "current", amps, "A"),
    };
    Err(undefined(
        Subject::Input(key),
        quantity,
        value,
        unit,
        "no surface below 2000 K loses this much heat: there is no steady temperature",
    ))
}

/// The heat made inside, W/m (W for a sphere), that holds the surface at exactly `limit` (K):
/// convection + radiation − sun there. `made` of the balance is the answer.
///
/// Errors: an input outside its domain, and a limit below the temperature the surroundings and
/// the sun alone hold the surface at (no heat made inside brings it down there) — named by the
/// limit's key.
pub fn heat_for_limit(s: &Surface, limit: f64) -> Result<Balance, EngineError> {
    check(s)?;
    kelvin(
        Subject::Input(keys::TEMPERATURE_LIMIT),
        "surface temperature limit",
        limit,
    )?;
    let l = loss_lean(s, limit)?;
    let need = l.q_conv + l.q_rad - s.solar;
    // A limit at the surroundings' own balance needs nothing; rounding there is not a refusal.
    let rounding = 1e-12 * (l.q_conv.abs() + l.q_rad.abs() + s.solar);
    if need < -rounding {
        return Err(undefined(
            Subject::Input(keys::TEMPERATURE_LIMIT),
            "surface temperature limit",
            limit,
            "K",
            "below what the surroundings and the sun alone hold the surface at: no heat made inside brings it down there",
        ));
    }
    balance_at(s, limit, (need.max(0.0), None, None), 0)
}

/// The current, A, through a conductor of resistance `resistance` that holds its surface at
/// exactly `limit` (K): I = √((convection + radiation − sun)/R(limit)). `current` of the balance
/// is the answer.
///
/// Errors: as [`heat_for_limit`], a sphere, and a resistance that extrapolates to 0 at the
/// limit.
pub fn current_for_limit(
    s: &Surface,
    resistance: &Resistance,
    limit: f64,
) -> Result<Balance, EngineError> {
    check(s)?;
    long_body(s, 0.0)?;
    let heat = heat_for_limit(s, limit)?;
    let r = resistance.positive_at(limit)?;
    let amps = finite_result("current", (heat.made / r).sqrt())?;
    Ok(Balance {
        current: Some(amps),
        resistance: Some(r),
        ..heat
    })
}

#[cfg(test)]
#[path = "joule_tests.rs"]
mod tests;
