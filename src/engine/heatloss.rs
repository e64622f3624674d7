//! The field job: a pipe or vessel with its process fluid inside, wall and insulation layers,
//! losing heat to the stream by convection (forced, natural or mixed, from `body::analyse`) and to
//! the surroundings by radiation. The surface temperature is found by the bracketed solver of
//! [`crate::engine::solve`]; the fluid's properties are re-evaluated at every trial temperature.
//!
//! Per metre for a cylinder (W/m), whole body for a sphere (W).

use crate::engine::body::{self, Analysis, Body};
use crate::engine::error::{finite_result, EngineError};
use crate::engine::layers::{critical_radius, Construction, Geometry};
use crate::engine::pick::Pick;
use crate::engine::props::Properties;
use crate::engine::solve;

/// Stefan–Boltzmann constant, W/(m²·K⁴) (CODATA 2018, exact in the 2019 SI).
pub const SIGMA: f64 = 5.670_374_419e-8;

/// The whole job, SI. `stream.d` and `stream.t_s` are ignored: the outer diameter comes from the
/// construction and the surface temperature is solved for.
#[derive(Debug, Clone, PartialEq)]
pub struct Job {
    pub stream: Body,
    pub process_temp: f64,
    /// Inside film coefficient, W/(m²·K); `None`: the bore is at the process temperature.
    pub h_inside: Option<f64>,
    pub construction: Construction,
    pub emissivity: f64,
    /// Temperature of the surroundings the surface radiates to, K.
    pub t_surround: f64,
    /// Solar heat absorbed per m² of the outer surface, W/m² (0: none, indoors or at night): a
    /// gain in the surface balance, conduction out = convection + radiation − solar.
    pub solar: f64,
}

impl Job {
    pub fn geometry(&self) -> Geometry {
        if self.stream.shape.is_sphere() {
            Geometry::Sphere
        } else {
            Geometry::Cylinder
        }
    }
}

/// What leaves the outer surface at temperature `ts`.
#[derive(Debug, Clone, PartialEq)]
pub struct SurfaceLoss {
    /// Convective and radiative heat flow, W/m (cylinder) or W (sphere).
    pub q_conv: f64,
    pub q_rad: f64,
    /// Convective coefficient and the linearised radiation coefficient εσ(Ts² + Tsur²)(Ts + Tsur).
    pub h_conv: f64,
    pub h_rad: f64,
    /// The convection analysis at this surface temperature (none when Ts = T∞ exactly).
    pub analysis: Option<Analysis>,
}

/// Convection plus radiation from a surface of diameter `d` at `ts`.
pub fn surface_loss(
    stream: &Body,
    d: f64,
    ts: f64,
    emissivity: f64,
    t_sur: f64,
) -> Result<SurfaceLoss, EngineError> {
    surface_loss_with(stream, d, ts, emissivity, t_sur, None, None)
}

/// As [`surface_loss`] with the recommendation held at `fixed`.
pub fn surface_loss_with(
    stream: &Body,
    d: f64,
    ts: f64,
    emissivity: f64,
    t_sur: f64,
    fixed: Option<Pick>,
    free: Option<&Properties>,
) -> Result<SurfaceLoss, EngineError> {
    let (area, q_rad, h_rad, body) = at_surface(stream, d, ts, emissivity, t_sur);
    let Some(body) = body else {
        return Ok(SurfaceLoss {
            q_conv: 0.0,
            q_rad,
            h_conv: 0.0,
            h_rad,
            analysis: None,
        });
    };
    let a = match free {
        Some(f) => body::analyse_given_free(&body, fixed, f.clone())?,
        None => body::analyse_with(&body, fixed)?,
    };
    Ok(SurfaceLoss {
        q_conv: area * a.h * (ts - stream.t_inf),
        q_rad,
        h_conv: a.h,
        h_rad,
        analysis: Some(a),
    })
}

/// The net radiative flux from a surface at `ts` to surroundings at `t_sur` (K), W/m²:
/// ε·σ·(Ts⁴ − Tsur⁴).
pub fn radiated_flux(emissivity: f64, ts: f64, t_sur: f64) -> f64 {
    emissivity * SIGMA * (ts.powi(4) - t_sur.powi(4))
}

/// The outer surface of a body of size `d` (m): per metre of length for a cylinder or a bar
/// (perimeter, m), the whole surface for a sphere (π·d², m²).
pub fn outer_area(shape: crate::engine::body::Shape, d: f64) -> f64 {
    if shape.is_sphere() {
        std::f64::consts::PI * d * d
    } else {
        shape.perimeter_over_d().unwrap_or(std::f64::consts::PI) * d
    }
}

/// The linearised radiation coefficient εσ(Ts² + Tsur²)(Ts + Tsur), W/(m²·K).
pub fn radiation_coefficient(emissivity: f64, ts: f64, t_sur: f64) -> f64 {
    emissivity * SIGMA * (ts * ts + t_sur * t_sur) * (ts + t_sur)
}

/// The body with its surface at `ts` and diameter `d` — none when Ts = T∞ (no convection).
fn body_at(stream: &Body, d: f64, ts: f64) -> Option<Body> {
    ((ts - stream.t_inf).abs() >= 1e-9).then_some(Body {
        d,
        t_s: ts,
        ..*stream
    })
}

/// The recommendation a surface at `ts` would make (none without convection).
fn recommended_at(
    stream: &Body,
    d: f64,
    ts: f64,
    free: &Properties,
) -> Result<Option<Pick>, EngineError> {
    body_at(stream, d, ts)
        .map(|b| body::recommended_given_free(&b, free))
        .transpose()
}

/// The outer surface (per metre for cylinders and prisms, m; whole for a sphere, m²), the heat it
/// radiates at `ts`, the radiation coefficient, and the body at that surface temperature.
fn at_surface(
    stream: &Body,
    d: f64,
    ts: f64,
    emissivity: f64,
    t_sur: f64,
) -> (f64, f64, f64, Option<Body>) {
    let area = outer_area(stream.shape, d);
    let q_rad = area * emissivity * SIGMA * (ts.powi(4) - t_sur.powi(4));
    (
        area,
        q_rad,
        radiation_coefficient(emissivity, ts, t_sur),
        body_at(stream, d, ts),
    )
}

/// As [`surface_loss`] without the full analysis (`analysis` is `None`; the numbers are the
/// same): the recommended correlation's h alone, for the plots' sweeps.
pub fn surface_loss_lean(
    stream: &Body,
    d: f64,
    ts: f64,
    emissivity: f64,
    t_sur: f64,
) -> Result<SurfaceLoss, EngineError> {
    let free = stream.fluid.at(stream.t_inf, stream.p)?;
    let fixed = recommended_at(stream, d, ts, &free)?;
    surface_lean(stream, d, ts, emissivity, t_sur, fixed, &free)
}

/// As [`surface_loss_with`] without the full analysis (`analysis` is `None`): with a fixed
/// correlation it takes [`body::h_given_free`], for the solver's inner loop and the lean solve.
fn surface_lean(
    stream: &Body,
    d: f64,
    ts: f64,
    emissivity: f64,
    t_sur: f64,
    fixed: Option<Pick>,
    free: &Properties,
) -> Result<SurfaceLoss, EngineError> {
    let Some(pick) = fixed else {
        let mut l = surface_loss_with(stream, d, ts, emissivity, t_sur, None, Some(free))?;
        l.analysis = None;
        return Ok(l);
    };
    let (area, q_rad, h_rad, body) = at_surface(stream, d, ts, emissivity, t_sur);
    let h = match body {
        Some(body) => body::h_given_free(&body, &pick, free)?,
        None => 0.0,
    };
    Ok(SurfaceLoss {
        q_conv: area * h * (ts - stream.t_inf),
        q_rad,
        h_conv: h,
        h_rad,
        analysis: None,
    })
}

/// The solved job.
#[derive(Debug, Clone, PartialEq)]
pub struct Solution {
    /// Heat flow from the process to the surroundings, W/m or W.
    pub q: f64,
    /// What leaves the surface; `loss.analysis` is `None` from [`solve_lean`].
    pub loss: SurfaceLoss,
    pub t_surface: f64,
    /// Temperature of the bore face (after the inside film).
    pub t_bore: f64,
    /// Temperature at the outer face of each layer; the last is the surface.
    pub interfaces: Vec<f64>,
    pub outer_d: f64,
    pub iterations: u32,
    /// Conduction minus surface loss at the solution, W/m or W.
    pub residual: f64,
    /// Critical radius for the outer layer (k at its mean temperature, h = h_conv + h_rad), m.
    pub critical_radius: Option<f64>,
    /// The recommendation at this solution differs from the one it was solved with by more than
    /// 1 % of a share (see [`solve`]).
    pub switched: bool,
}

/// Solve the surface energy balance.
///
/// The recommendation can change with the surface temperature (Re and the properties move with
/// it). It is held fixed while solving, so that the residual is a smooth function of Ts: first
/// the one made with the surface at the process temperature; if the solution makes another, the
/// balance is solved again with that one, and `switched` says whether the second solution still
/// differs. The recommendation is continuous in its inputs (see [`crate::engine::pick`]), so the
/// answer is too.
pub fn solve(job: &Job) -> Result<Solution, EngineError> {
    solve_as(job, true)
}

/// As [`solve`], without the full convection analysis at the solution (`loss.analysis` is
/// `None`; every number is the same): for the thickness search and the plots, which need the heat
/// flow and the temperatures only.
pub fn solve_lean(job: &Job) -> Result<Solution, EngineError> {
    solve_as(job, false)
}

fn solve_as(job: &Job, full: bool) -> Result<Solution, EngineError> {
    let s = &job.stream;
    let free = s.fluid.at(s.t_inf, s.p)?;
    let d = 2.0 * job.construction.r_out();
    let start = recommended_at(s, d, job.process_temp, &free)?;
    let first = solve_fixed(job, start, &free)?;
    let at_first = recommended_at(s, d, first.t_surface, &free)?;
    let (core, fixed, switched) = if at_first.is_none() || at_first == start {
        (first, start, false)
    } else {
        let second = solve_fixed(job, at_first, &free)?;
        let at_second = recommended_at(s, d, second.t_surface, &free)?;
        let switched = match (at_second, at_first) {
            (Some(a), Some(b)) => a.distance(&b) > 0.01,
            _ => false,
        };
        (second, at_first, switched)
    };
    let loss = if full {
        surface_loss_with(
            s,
            d,
            core.t_surface,
            job.emissivity,
            job.t_surround,
            fixed,
            Some(&free),
        )?
    } else {
        surface_lean(
            s,
            d,
            core.t_surface,
            job.emissivity,
            job.t_surround,
            fixed,
            &free,
        )?
    };
    let g = job.geometry();
    let h_total = loss.h_conv + loss.h_rad;
    let critical_radius = job.construction.layers.last().and_then(|l| {
        let n = core.interfaces.len();
        let t_in = if n >= 2 {
            core.interfaces[n - 2]
        } else {
            core.t_bore
        };
        let k = l.k.mean(t_in, core.t_surface);
        (h_total > 0.0).then(|| critical_radius(g, k, h_total))
    });
    Ok(Solution {
        q: core.q,
        residual: loss.q_conv + loss.q_rad - job.solar * outer_area(s.shape, d) - core.q,
        loss,
        t_surface: core.t_surface,
        t_bore: core.t_bore,
        interfaces: core.interfaces,
        outer_d: d,
        iterations: core.iterations,
        critical_radius,
        switched,
    })
}

/// The heat flow and temperatures of one solve with the recommendation held at `fixed`.
struct Core {
    q: f64,
    t_surface: f64,
    t_bore: f64,
    interfaces: Vec<f64>,
    iterations: u32,
}

fn solve_fixed(job: &Job, fixed: Option<Pick>, free: &Properties) -> Result<Core, EngineError> {
    let s = &job.stream;
    let (tp, tinf, tsur) = (job.process_temp, s.t_inf, job.t_surround);
    let t_lo = tp.min(tinf).min(tsur);
    let t_hi = tp.max(tinf).max(tsur).max(sunlit_bound(job, free, fixed)?);
    job.construction.check(t_lo, t_hi)?;
    if !(0.0..=1.0).contains(&job.emissivity) {
        return Err(EngineError::Undefined {
            subject: crate::engine::error::Subject::Emissivity,
            quantity: "emissivity",
            value: job.emissivity,
            unit: "",
            why: "must lie between 0 and 1",
        });
    }
    let g = job.geometry();
    let outer_d = 2.0 * job.construction.r_out();
    let a_in = g.area(job.construction.r_in);
    let q_sun = job.solar * outer_area(s.shape, outer_d);
    let surface_of = |q: f64| -> (f64, Vec<f64>) {
        let t_bore = match job.h_inside {
            Some(hi) => (tp - q / (hi * a_in)).clamp(t_lo, t_hi),
            None => tp,
        };
        let t = job.construction.march(t_bore, q, t_lo, t_hi);
        (t_bore, t)
    };
    let mut failure: Option<EngineError> = None;
    let mut residual = |q: f64| -> f64 {
        let (t_bore, t) = surface_of(q);
        let ts = t.last().copied().unwrap_or(t_bore);
        match surface_lean(s, outer_d, ts, job.emissivity, tsur, fixed, free) {
            Ok(l) => l.q_conv + l.q_rad - q_sun - q,
            Err(e) => {
                failure.get_or_insert(e);
                f64::NAN
            }
        }
    };
    // At q = 0 the surface sits at the process temperature; the root lies between 0 and that loss.
    let q0 = residual(0.0);
    let root = if q0 == 0.0 {
        solve::Root {
            x: 0.0,
            residual: 0.0,
            iterations: 0,
        }
    } else {
        // Narrow the bracket before solving: a first guess from constant resistances (the outside
        // coefficient as it is at q = 0), then a step of 5 % towards the root. An end moves only
        // where the residual's sign proves the root lies beyond it, so the bracket stays valid.
        // In t = q/q0 the residual's sign (times q0's) is + left of the root and − right of it.
        // The residuals already known at the ends are handed to the solver with them.
        let (mut lo, mut hi) = ((0.0f64, Some(q0)), (1.0f64, None));
        let r_out = (tp - tinf).abs() / q0.abs();
        let tm = 0.5 * (tp + tinf);
        let mut r_cond = job.h_inside.map(|hi| 1.0 / (hi * a_in)).unwrap_or(0.0);
        let mut r1 = job.construction.r_in;
        for (l, r2) in job.construction.layers.iter().zip(job.construction.radii()) {
            if r2 > r1 {
                r_cond += 1.0 / (g.shape_factor(r1, r2) * l.k.at(tm));
            }
            r1 = r2;
        }
        let t_guess = r_out / (r_cond + r_out);
        if t_guess.is_finite() && t_guess > 0.0 && t_guess < 1.0 {
            let r1 = residual(t_guess * q0);
            let g1 = r1 * q0.signum();
            let t_step = (t_guess * if g1 > 0.0 { 1.05 } else { 0.95 }).min(1.0);
            let r2 = residual(t_step * q0);
            for (t, rt) in [(t_guess, r1), (t_step, r2)] {
                let gt = rt * q0.signum();
                if gt.is_finite() && t > 0.0 && t < 1.0 {
                    if gt > 0.0 {
                        if t > lo.0 {
                            lo = (t, Some(rt));
                        }
                    } else if t < hi.0 {
                        hi = (t, Some(rt));
                    }
                }
            }
        }
        let (lo, hi) = ((lo.0 * q0, lo.1), (hi.0 * q0, hi.1));
        match solve::bracketed_rel_known(&mut residual, lo, hi, 1e-12) {
            Ok(r) => r,
            Err(_) => {
                return Err(failure.unwrap_or(EngineError::NonFiniteResult {
                    quantity: "surface temperature (the energy balance did not close)",
                }))
            }
        }
    };
    if let Some(e) = failure {
        return Err(e);
    }
    let q = finite_result("heat flow", root.x)?;
    let (t_bore, interfaces) = surface_of(q);
    let t_surface = interfaces.last().copied().unwrap_or(t_bore);
    Ok(Core {
        q,
        t_surface,
        t_bore,
        interfaces,
        iterations: root.iterations,
    })
}

/// The hottest the surface can be in the sun, K: the temperature at which it loses all the solar
/// heat it absorbs with no heat conducted to it (0 K without sun, leaving the job's span as it
/// was). The solved surface lies between the process temperature and this one (the net loss
/// rises with Ts and the conducted heat pulls Ts towards the process), so the span the trial
/// temperatures are clamped to must reach it, or a sunlit surface hotter than the process, air
/// and surroundings could not be found and the bracket would close on a clamp.
///
/// Radiation alone bounds it where the surface emits (ε·σ·(T⁴ − Tsur⁴) ≥ solar above the
/// stream's and surroundings' temperatures, convection only adds); an emissivity of 0 leaves
/// convection, found by doubling the excess over the air until the lean loss covers the sun.
fn sunlit_bound(job: &Job, free: &Properties, fixed: Option<Pick>) -> Result<f64, EngineError> {
    if job.solar <= 0.0 {
        return Ok(0.0);
    }
    let s = &job.stream;
    let floor = s.t_inf.max(job.t_surround);
    if job.emissivity > 0.0 {
        let t4 = job.t_surround.powi(4) + job.solar / (job.emissivity * SIGMA);
        return finite_result(
            "surface temperature in the sun",
            t4.sqrt().sqrt().max(floor),
        );
    }
    let d = 2.0 * job.construction.r_out();
    let q_sun = job.solar * outer_area(s.shape, d);
    let mut dt = 10.0;
    while dt < 1e4 {
        let t = floor + dt;
        let l = surface_lean(s, d, t, 0.0, job.t_surround, fixed, free)?;
        if l.q_conv >= q_sun {
            return Ok(t);
        }
        dt *= 2.0;
    }
    Err(EngineError::NonFiniteResult {
        quantity: "surface temperature in the sun (no loss covers the solar gain)",
    })
}

/// A search over the outer layer's thickness for a target: the thickness that meets it, if any,
/// and the measure at both ends of the span searched (what to say when none meets it).
#[derive(Debug, Clone, PartialEq)]
pub struct Search {
    pub found: Option<(f64, Solution)>,
    /// The measure with no outer layer and with the thickest one searched.
    pub at_zero: f64,
    pub at_max: f64,
}

/// The thickness of the outermost layer that makes `measure(solution)` equal `target`, searched
/// over 0 to `max_thickness`. `Ok(None)` when no thickness in that span meets it.
pub fn thickness_for(
    job: &Job,
    max_thickness: f64,
    target: f64,
    measure: impl Fn(&Solution) -> f64,
) -> Result<Option<(f64, Solution)>, EngineError> {
    Ok(thickness_search(job, max_thickness, target, measure)?.and_then(|s| s.found))
}

/// As [`thickness_for`], with the measure at both ends of the span; `Ok(None)` when the job has
/// no layer to vary.
pub fn thickness_search(
    job: &Job,
    max_thickness: f64,
    target: f64,
    measure: impl Fn(&Solution) -> f64,
) -> Result<Option<Search>, EngineError> {
    let n = job.construction.layers.len();
    if n == 0 {
        return Ok(None);
    }
    // The search needs only the numbers: lean solves, and the full one at the answer.
    let at = |t: f64, full: bool| -> Result<Solution, EngineError> {
        let mut j = job.clone();
        j.construction.layers[n - 1].thickness = t;
        solve_as(&j, full)
    };
    let with = |t: f64| at(t, false);
    let (at_zero, at_max) = (measure(&with(0.0)?), measure(&with(max_thickness)?));
    let (f0, f1) = (at_zero - target, at_max - target);
    let search = |found| {
        Ok(Some(Search {
            found,
            at_zero,
            at_max,
        }))
    };
    if f0 == 0.0 {
        return search(Some((0.0, at(0.0, true)?)));
    }
    if f0.signum() == f1.signum() {
        return search(None);
    }
    let mut failure = None;
    let root = solve::bracketed_known_ends(
        |t| match with(t) {
            Ok(s) => measure(&s) - target,
            Err(e) => {
                failure.get_or_insert(e);
                f64::NAN
            }
        },
        (0.0, Some(f0)),
        (max_thickness, Some(f1)),
        1e-9 * target.abs().max(1e-9),
    );
    if let Some(e) = failure {
        return Err(e);
    }
    match root {
        Ok(r) => search(Some((r.x, at(r.x, true)?))),
        Err(_) => search(None),
    }
}

#[cfg(test)]
pub(crate) mod tests_support {
    use super::*;
    use crate::engine::body::{Axis, Shape, Wind};
    use crate::engine::layers::{Conductivity, Layer};
    use crate::engine::props::Fluid;

    /// An invented steam line: 4-inch steel pipe (114.3 mm OD, 6.02 mm wall), 50 mm of an
    /// insulation with k = 0.035 + 1.5×10⁻⁴·θ W/(m·K), 180 °C inside, 5 °C air at 4 m/s.
    pub fn job(insulation: f64, emissivity: f64) -> Job {
        Job {
            stream: Body {
                shape: Shape::Cylinder,
                axis: Axis::Horizontal,
                wind: Wind::Horizontal,
                d: 0.0,
                length: 10.0,
                speed: 4.0,
                t_inf: 278.15,
                t_s: 0.0,
                p: 101_325.0,
                fluid: Fluid::DryAir,
                yaw: 1.0,
            },
            process_temp: 453.15,
            h_inside: None,
            construction: Construction {
                geometry: Geometry::Cylinder,
                r_in: 0.05715 - 0.00602,
                layers: vec![
                    Layer {
                        thickness: 0.00602,
                        k: Conductivity::constant(50.0),
                    },
                    Layer {
                        thickness: insulation,
                        k: Conductivity {
                            a: 0.035,
                            b: 1.5e-4,
                            c: 0.0,
                        },
                    },
                ],
            },
            emissivity,
            t_surround: 268.15,
            solar: 0.0,
        }
    }
}

#[cfg(test)]
#[path = "heatloss_tests.rs"]
mod tests;
