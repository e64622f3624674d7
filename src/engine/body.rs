//! A body in a stream: its shape, the correlations that apply to it, and the side-by-side analysis
//! (every forced correlation at its own reference temperature, natural convection, the mixed
//! blend, the recommended value and the spread).
//!
//! Recommendation rule (shown on the page as `Shape::rule`, written in [`crate::engine::pick`]):
//! each shape has a preference order; the correlation inside its ranges that comes first wins,
//! otherwise the least far outside, with a linear handover between two where one passes its
//! limit. The answer the page leads with is that forced value blended with natural convection
//! (see [`crate::engine::correlations::mixed`]).

use crate::engine::correlations::mixed::{self, Direction};
use crate::engine::correlations::natural::{self, Length, Natural};
use crate::engine::correlations::{Groups, Reference, G};
use crate::engine::error::{finite_result, EngineError};
use crate::engine::pick::{self, Pick};
use crate::engine::props::{Fluid, Properties};
use crate::engine::validity::{decades_outside, Flag, FlagKind};
use std::f64::consts::PI;

pub use crate::engine::shape::Shape;

/// The axis of a prism.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum Axis {
    Horizontal,
    Vertical,
}

/// Which way the wind blows.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum Wind {
    Horizontal,
    Up,
    Down,
}

/// Everything the analysis needs, SI.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Body {
    pub shape: Shape,
    pub axis: Axis,
    pub wind: Wind,
    /// Characteristic length D, m.
    pub d: f64,
    /// Length of the prism along its axis (the height when vertical), m.
    pub length: f64,
    pub speed: f64,
    pub t_inf: f64,
    pub t_s: f64,
    pub p: f64,
    pub fluid: Fluid,
    /// Factor on forced convection for a wind at an angle to the axis (1: square to it, as every
    /// correlation is written; `outdoors::wind::yaw_factor` outdoors). Multiplies the recommended
    /// forced h and its still-fluid value alike, before the blend with natural convection.
    pub yaw: f64,
}

/// One forced-convection correlation evaluated at the operating point.
#[derive(Debug, Clone, PartialEq)]
pub struct Estimate {
    pub id: &'static str,
    pub name: &'static str,
    pub formula: &'static str,
    pub reference: Reference,
    /// The groups it was evaluated with (Re on D at its reference temperature).
    pub groups: Groups,
    /// Mean Nu on D.
    pub nu: f64,
    /// Nu as Re → 0 for the blend.
    pub nu_still: f64,
    /// W/(m²·K), Nu·k/D with k at its reference temperature.
    pub h: f64,
    /// k at the reference temperature, W/(m·K).
    pub k: f64,
    /// The band and constants used (banded tables) or the parts of a composite form, written
    /// only when shown: see [`Estimate::detail`].
    detail_of: DetailOf,
    pub flags: Vec<Flag>,
    /// How far outside its ranges, in decades (0 inside them all).
    pub outside: f64,
}

/// A correlation's detail writer (text for the page, so not made in a solver's loop).
#[derive(Clone, Copy)]
struct DetailOf(fn(&Groups) -> Option<String>);

impl PartialEq for DetailOf {
    fn eq(&self, other: &Self) -> bool {
        std::ptr::fn_addr_eq(self.0, other.0)
    }
}

impl std::fmt::Debug for DetailOf {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str("DetailOf")
    }
}

impl Estimate {
    /// The band and constants used (banded tables) or the parts of a composite form.
    pub fn detail(&self) -> Option<String> {
        (self.detail_of.0)(&self.groups)
    }

    /// Inside every published range (near-edge notes allowed).
    pub fn valid(&self) -> bool {
        inside_ranges(&self.flags)
    }
}

/// Natural convection evaluated at the operating point.
#[derive(Debug, Clone, PartialEq)]
pub struct NaturalEstimate {
    pub id: &'static str,
    pub name: &'static str,
    pub formula: &'static str,
    /// The length Ra and Nu are based on, m, and what it is.
    pub length: f64,
    pub length_kind: Length,
    pub gr: f64,
    pub ra: f64,
    /// Nu on its own length.
    pub nu: f64,
    pub h: f64,
    /// Buoyant flow along the surface goes up (true) or down.
    pub rises: bool,
    pub flags: Vec<Flag>,
}

/// The whole analysis of one body at one operating point.
#[derive(Debug, Clone, PartialEq)]
pub struct Analysis {
    pub film: Properties,
    pub free: Properties,
    pub surface: Properties,
    pub forced: Vec<Estimate>,
    /// Index into `forced` of the recommended correlation (the largest share of `pick`).
    pub recommended: usize,
    /// The share of each forced correlation in the recommended value.
    pub pick: Pick,
    /// The recommended forced h: Σ share × h, times the body's yaw factor, W/(m²·K).
    pub h_forced: f64,
    /// Lowest and highest h among the correlations inside their ranges, and how many there are.
    pub spread: Option<(f64, f64, usize)>,
    pub natural: Option<NaturalEstimate>,
    pub direction: Direction,
    pub exponent: f64,
    /// The answer: recommended forced blended with natural convection, W/(m²·K).
    pub h: f64,
    /// Gr/Re² on D (film properties): ≪ 1 forced, ≫ 1 natural.
    pub richardson: Option<f64>,
    pub flags: Vec<Flag>,
    pub notes: Vec<&'static str>,
}

impl Analysis {
    pub fn recommended(&self) -> &Estimate {
        &self.forced[self.recommended]
    }

    /// Why the recommended value is what it is, in one sentence.
    pub fn reason(&self) -> String {
        let shares: Vec<(usize, f64)> = self.pick.shares().collect();
        let worst = |e: &Estimate| {
            e.flags
                .iter()
                .filter(|f| f.kind == FlagKind::Outside)
                .max_by(|a, b| a.decades_outside().total_cmp(&b.decades_outside()))
                .map(|f| {
                    format!(
                        "{} = {}",
                        f.range.quantity,
                        crate::engine::units::format_sig(f.value, 3)
                    )
                })
                .unwrap_or_default()
        };
        if let [(a, _), (b, wb), ..] = shares[..] {
            let (ea, eb) = (&self.forced[a], &self.forced[b]);
            let (out, other, w_other) = if ea.outside >= eb.outside {
                (ea, eb, wb)
            } else {
                (eb, ea, 1.0 - wb)
            };
            return format!(
                "Handover: {} is just past its range ({}), so the value moves linearly from it to {} over 0.3 decade of Re beyond the limit; here {} % {} — the recommended h never jumps at a range edge.",
                out.name,
                worst(out),
                other.name,
                crate::engine::units::format_sig(100.0 * w_other, 2),
                other.name
            );
        }
        let r = self.recommended();
        if r.outside > 0.0 {
            format!(
                "No correlation is inside its published ranges here: {} is the least far outside ({}), so it is used, flagged.",
                r.name,
                worst(r)
            )
        } else if self.recommended == 0 {
            format!(
                "{} is inside its published ranges here and comes first in this shape's order of preference.",
                r.name
            )
        } else {
            let before: Vec<&str> = self.forced[..self.recommended]
                .iter()
                .map(|e| e.name)
                .collect();
            format!(
                "{} is outside its range here, so {} — the next inside its published ranges — is used.",
                before.join(" and "),
                r.name
            )
        }
    }
    /// Which mode dominates, in words (thresholds 0.1 and 10 on Gr/Re², common practice).
    pub fn mode(&self) -> &'static str {
        match self.richardson {
            None => "forced convection only (natural convection needs the fluid's expansion coefficient β)",
            Some(r) if r.is_infinite() || r > 10.0 => "natural convection dominates (Gr/Re² > 10)",
            Some(r) if r < 0.1 => "forced convection dominates (Gr/Re² < 0.1)",
            Some(_) => "mixed convection: both matter (0.1 ≤ Gr/Re² ≤ 10)",
        }
    }
}

/// Evaluate every correlation for the body.
pub fn analyse(b: &Body) -> Result<Analysis, EngineError> {
    analyse_with(b, None)
}

/// As [`analyse`], with the recommendation fixed to `fixed` (a solver holds it fixed while it
/// iterates, so that the answer is continuous in Ts).
pub fn analyse_with(b: &Body, fixed: Option<Pick>) -> Result<Analysis, EngineError> {
    let free = b.fluid.at(b.t_inf, b.p)?;
    analyse_given_free(b, fixed, free)
}

/// As [`analyse_with`], with the free-stream properties already evaluated (they do not change
/// while a solver varies the surface temperature).
pub fn analyse_given_free(
    b: &Body,
    fixed: Option<Pick>,
    free: Properties,
) -> Result<Analysis, EngineError> {
    let film_t = 0.5 * (b.t_s + b.t_inf);
    let film = b.fluid.at(film_t, b.p)?;
    let surface = b.fluid.at(b.t_s, b.p)?;
    let gas = b.fluid.is_gas();

    let mut forced = Vec::with_capacity(4);
    for c in b.shape.forced() {
        let at = at_reference(c.reference, &film, &free);
        let groups = groups_at(b, at, &surface, gas);
        let nu = (c.nu)(&groups);
        let value = finite_result("Nusselt number", nu.value)?;
        forced.push(Estimate {
            id: c.id,
            name: c.name,
            formula: c.formula,
            reference: c.reference,
            groups,
            nu: value,
            nu_still: (c.nu_still)(&groups),
            h: finite_result("heat-transfer coefficient", value * at.k / b.d)?,
            k: at.k,
            detail_of: DetailOf(c.detail),
            outside: decades_outside(&nu.flags),
            flags: nu.flags,
        });
    }
    let pick = match fixed {
        Some(p) => p,
        None => pick::pick(forced.len(), &mut |i| Some(forced[i].outside)),
    };
    let recommended = pick.main().min(forced.len() - 1);
    // Lowest and highest h among the correlations inside their ranges, and how many.
    let (mut lo, mut hi, mut count) = (f64::INFINITY, f64::NEG_INFINITY, 0);
    for e in forced.iter().filter(|e| e.valid()) {
        (lo, hi, count) = (lo.min(e.h), hi.max(e.h), count + 1);
    }
    let spread = (count > 0).then_some((lo, hi, count));

    let mut notes = Vec::new();
    let natural = natural_estimate(b, &film, &mut notes)?;
    let vertical_body = !b.shape.is_sphere() && b.axis == Axis::Vertical;
    if vertical_body && b.wind != Wind::Horizontal {
        notes.push("A vertical body in a vertical stream is flow along its axis, not cross-flow: the correlations here assume the stream crosses the axis, so the stream is treated as crossing it.");
    }
    let (direction, exponent) = mixing(b, natural.as_ref());
    let at = |i: usize| {
        forced.get(i).ok_or(EngineError::NonFiniteResult {
            quantity: "recommended correlation",
        })
    };
    let h_forced = pick.combine(|i| Ok(at(i)?.h))? * b.yaw;
    let h_still = pick.combine(|i| Ok(at(i)?.nu_still * at(i)?.k / b.d))? * b.yaw;
    let mut flags = Vec::new();
    let (h, flag) = blended((h_forced, h_still), natural.as_ref(), direction, exponent)?;
    flags.extend(flag);
    let richardson = natural.as_ref().map(|n| {
        let re = b.speed * b.d / film.nu;
        let gr_d = n.gr * (b.d / n.length).powi(3);
        gr_d / (re * re)
    });
    Ok(Analysis {
        film,
        free,
        surface,
        forced,
        recommended,
        pick,
        h_forced,
        spread,
        natural,
        direction,
        exponent,
        h,
        richardson,
        flags,
        notes,
    })
}

/// The dimensionless groups of a forced correlation whose properties are `at`.
fn groups_at(b: &Body, at: &Properties, surface: &Properties, gas: bool) -> Groups {
    Groups {
        re: b.speed * b.d / at.nu,
        pr: at.pr,
        pr_s: surface.pr,
        mu_ratio: at.mu / surface.mu,
        t_ratio: b.t_inf / b.t_s,
        gas,
    }
}

/// How the stream meets the buoyant flow, and the blending exponent that goes with it.
fn mixing(b: &Body, natural: Option<&NaturalEstimate>) -> (Direction, f64) {
    let vertical_body = !b.shape.is_sphere() && b.axis == Axis::Vertical;
    let direction = match (b.wind, natural) {
        (Wind::Horizontal, _) | (_, None) => Direction::Transverse,
        _ if vertical_body => Direction::Transverse,
        (w, Some(n)) => {
            if (w == Wind::Up) == n.rises {
                Direction::Assisting
            } else {
                Direction::Opposing
            }
        }
    };
    let compact = b.shape.is_sphere() || !vertical_body;
    let exponent = mixed::exponent(direction, compact && direction == Direction::Transverse);
    (direction, exponent)
}

/// The answer h: the recommended forced `(h_F, h_F0)` (its value and its still-fluid value)
/// blended with natural convection, with the blend's flag if it raised one.
fn blended(
    (h_f, h_f0): (f64, f64),
    natural: Option<&NaturalEstimate>,
    direction: Direction,
    exponent: f64,
) -> Result<(f64, Option<Flag>), EngineError> {
    let (h, flag) = match natural {
        Some(n) => mixed::blend(h_f, h_f0, n.h, exponent, direction),
        None => (h_f, None),
    };
    let h = finite_result("heat-transfer coefficient", h)?;
    if h <= 0.0 {
        return Err(EngineError::OpposingFlowsCancel);
    }
    Ok((h, flag))
}

/// The answer h alone, with the forced correlation at index `fixed` of the shape's list and the
/// free-stream properties given: the arithmetic of [`analyse_given_free`] without the other
/// correlations, their band descriptions or the flags. A solver's inner loop calls this; the
/// full analysis is made once at the solution (a test holds the two equal).
///
/// In air the surface's properties are evaluated only for a correlation that reads them (air is
/// defined at every surface temperature the solver tries, so nothing is refused by skipping
/// them); in other fluids always, as the full analysis does, so that a surface state the fluid
/// cannot be in (water boiling at the wall) is refused on both paths alike.
pub fn h_given_free(b: &Body, pick: &Pick, free: &Properties) -> Result<f64, EngineError> {
    let film = b.fluid.at(0.5 * (b.t_s + b.t_inf), b.p)?;
    let (h_forced, h_still) = match pick.only() {
        // One correlation: its h and still-fluid h exactly (Σ 1.0 × x = x).
        Some(i) => forced_h(b, i, &film, free, None)?,
        None => {
            let mut surface: Option<Properties> = None;
            let mut parts = [(0.0, 0.0); pick::MAX_FORCED];
            for (i, _) in pick.shares() {
                parts[i] = forced_h(b, i, &film, free, Some(&mut surface))?;
            }
            (
                pick.combine(|i| Ok(parts[i].0))?,
                pick.combine(|i| Ok(parts[i].1))?,
            )
        }
    };
    let (h_forced, h_still) = (h_forced * b.yaw, h_still * b.yaw);
    let mut notes = Vec::new();
    let natural = natural_estimate(b, &film, &mut notes)?;
    let (direction, exponent) = mixing(b, natural.as_ref());
    Ok(blended((h_forced, h_still), natural.as_ref(), direction, exponent)?.0)
}

/// One forced correlation's h and its still-fluid h, W/(m²·K), as [`analyse_given_free`] computes
/// them; the surface's properties are evaluated (once, kept in `surface` when given) only where
/// they are read or the fluid is not air.
fn forced_h(
    b: &Body,
    i: usize,
    film: &Properties,
    free: &Properties,
    surface: Option<&mut Option<Properties>>,
) -> Result<(f64, f64), EngineError> {
    let list = b.shape.forced();
    let c = &list[i.min(list.len() - 1)];
    let at = at_reference(c.reference, film, free);
    let air = matches!(b.fluid, Fluid::DryAir | Fluid::HumidAir(_));
    let groups = if c.surface || !air {
        match surface {
            Some(slot) => {
                if slot.is_none() {
                    *slot = Some(b.fluid.at(b.t_s, b.p)?);
                }
                groups_at(b, at, slot.as_ref().unwrap_or(at), b.fluid.is_gas())
            }
            None => groups_at(b, at, &b.fluid.at(b.t_s, b.p)?, b.fluid.is_gas()),
        }
    } else {
        // Not read by this correlation: Pr_s and μs stand at the reference values.
        groups_at(b, at, at, b.fluid.is_gas())
    };
    let nu = finite_result("Nusselt number", (c.nu)(&groups).value)?;
    let h = finite_result("heat-transfer coefficient", nu * at.k / b.d)?;
    Ok((h, (c.nu_still)(&groups) * at.k / b.d))
}

/// No flag says a value lies outside its range (near-edge and advisory notes allowed).
fn inside_ranges(flags: &[Flag]) -> bool {
    flags.iter().all(|f| f.kind != FlagKind::Outside)
}

/// The properties a correlation with this reference temperature takes.
fn at_reference<'a>(r: Reference, film: &'a Properties, free: &'a Properties) -> &'a Properties {
    match r {
        Reference::Film => film,
        Reference::FreeStream => free,
    }
}

/// The pick [`analyse_given_free`] would make for this body: the same rule
/// ([`crate::engine::pick::pick`]) on the same flags, evaluating correlations only until no later
/// one could share the answer.
pub fn recommended_given_free(b: &Body, free: &Properties) -> Result<Pick, EngineError> {
    let film = b.fluid.at(0.5 * (b.t_s + b.t_inf), b.p)?;
    let surface = b.fluid.at(b.t_s, b.p)?;
    let gas = b.fluid.is_gas();
    let list = b.shape.forced();
    let mut failed = None;
    let p = pick::pick(list.len(), &mut |i| {
        let c = &list[i];
        let at = at_reference(c.reference, &film, free);
        let nu = (c.nu)(&groups_at(b, at, &surface, gas));
        match finite_result("Nusselt number", nu.value) {
            Ok(_) => Some(nu.decades_outside()),
            Err(e) => {
                failed.get_or_insert(e);
                None
            }
        }
    });
    match failed {
        Some(e) => Err(e),
        None => Ok(p),
    }
}

fn natural_estimate(
    b: &Body,
    film: &Properties,
    notes: &mut Vec<&'static str>,
) -> Result<Option<NaturalEstimate>, EngineError> {
    if film.beta == 0.0 {
        if b.speed == 0.0 {
            return Err(EngineError::Undefined {
                subject: crate::engine::error::Subject::Beta,
                quantity: "expansion coefficient β",
                value: 0.0,
                unit: "1/K",
                why: "in still fluid the answer is natural convection, which needs β",
            });
        }
        notes
            .push("Natural convection left out: the fluid's expansion coefficient β is not given.");
        return Ok(None);
    }
    let vertical = !b.shape.is_sphere() && b.axis == Axis::Vertical;
    let (corr, d_eq): (&Natural, f64) = match b.shape {
        Shape::Sphere => (&natural::SPHERE, b.d),
        Shape::Cylinder if !vertical => (&natural::HORIZONTAL_CYLINDER, b.d),
        _ if vertical => (&natural::VERTICAL, b.d),
        s => {
            notes.push("No natural-convection correlation for this section is built in: the horizontal-cylinder one is applied to the diameter of equal perimeter, P/π (common practice).");
            (
                &natural::HORIZONTAL_CYLINDER,
                b.d * s.perimeter_over_d().unwrap_or(PI) / PI,
            )
        }
    };
    let length = match corr.length {
        Length::Diameter => d_eq,
        Length::Height => b.length,
    };
    let dt = b.t_s - b.t_inf;
    let gr = G * film.beta.abs() * dt.abs() * length.powi(3) / (film.nu * film.nu);
    let ra = gr * film.pr;
    let nu = (corr.nu)(ra, film.pr);
    let mut flags = nu.flags;
    if vertical {
        let d_side = if b.shape == Shape::Cylinder {
            b.d
        } else {
            b.d * b.shape.perimeter_over_d().unwrap_or(PI) / PI
        };
        let r = natural::thin_cylinder_range(gr);
        flags.extend(r.check(corr.name, d_side / b.length, false));
    }
    let value = finite_result("Nusselt number (natural)", nu.value)?;
    Ok(Some(NaturalEstimate {
        id: corr.id,
        name: corr.name,
        formula: corr.formula,
        length,
        length_kind: corr.length,
        gr: finite_result("Grashof number", gr)?,
        ra: finite_result("Rayleigh number", ra)?,
        nu: value,
        h: finite_result(
            "heat-transfer coefficient (natural)",
            value * film.k / length,
        )?,
        rises: (film.beta * dt) > 0.0,
        flags,
    }))
}

#[cfg(test)]
#[path = "body_tests.rs"]
mod tests;
