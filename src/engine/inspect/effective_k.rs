//! The effective conductivity of the outer insulation layer that reproduces a measured surface:
//! the factor f on the data sheet's k(T) of that layer (f = 1 as designed) such that the solved
//! surface temperature ([`heatloss::solve`]) equals the measured one.
//!
//! The measured surface fixes the loss (convection plus radiation less sun at that temperature,
//! [`heatloss::surface_loss_lean`]); that loss crosses the inside film, the wall and the inner
//! layers as designed, which fixes the inner face of the outer layer, and the outer layer must
//! then carry it: q = f·S·[K(T_in) − K(T_s)] (Kirchhoff transform, see [`crate::engine::layers`]).
//! That gives f directly (`from_loss`), and says when no f > 0 can: a surface that loses no heat
//! (or gains it) while the line is hot, a surface hotter than the inner face (hotter than even a
//! missing outer layer would leave it), or one beyond the process temperature. The answer is then
//! found by the bracketed solver over ln f on the whole solve (the forward model the page shows),
//! starting from a bracket around that value, and reported with its residual in kelvin: so what is
//! reported is the factor at which the full energy balance gives the measured surface.

use crate::engine::error::{finite_result, EngineError, Subject};
use crate::engine::heatloss::{self, Job};
use crate::engine::layers::Construction;
use crate::engine::solve;

/// The factor and its evidence.
#[derive(Debug, Clone, PartialEq)]
pub struct KRatio {
    /// Effective k of the outer layer over the data sheet's, at every temperature.
    pub factor: f64,
    /// Solved surface temperature at `factor` minus the measured one, K.
    pub residual: f64,
    pub iterations: u32,
    /// The factor straight from the conduction carrying the measured loss.
    pub from_loss: f64,
    /// The loss at the measured surface, W/m (cylinder) or W (sphere), outward positive.
    pub loss: f64,
    /// The temperature at the inner face of the outer layer with that loss, K.
    pub inner_face: f64,
}

/// A surface no conductivity of the outer layer can explain: the message names the reading.
fn unexplained(ts: f64, why: &'static str) -> EngineError {
    EngineError::Undefined {
        subject: Subject::Input("Tir"),
        quantity: "surface temperature from the reading",
        value: ts,
        unit: "K",
        why,
    }
}

/// The job with the outer layer's k(T) scaled by `f`.
pub fn scaled(job: &Job, f: f64) -> Job {
    let mut j = job.clone();
    if let Some(l) = j.construction.layers.last_mut() {
        l.k.a *= f;
        l.k.b *= f;
        l.k.c *= f;
    }
    j
}

/// The largest miss, K, between the surface solved with the factor found and the measured one.
const MAX_RESIDUAL: f64 = 0.01;

/// The factor on the outer layer's k that makes the solved surface `ts` (K). `job` is the design:
/// its last layer is the outer insulation (the first is the wall). Errors: a job with no
/// insulation over the wall, or a surface no factor explains (see the module).
pub fn effective_k(job: &Job, ts: f64) -> Result<KRatio, EngineError> {
    let n = job.construction.layers.len();
    if n < 2 {
        return Err(EngineError::Undefined {
            subject: Subject::General,
            quantity: "insulation layers",
            value: 0.0,
            unit: "",
            why: "a bare line has no insulation whose conductivity a reading could tell",
        });
    }
    let s = &job.stream;
    let tp = job.process_temp;
    let d = 2.0 * job.construction.r_out();
    let area = heatloss::outer_area(s.shape, d);
    let l = heatloss::surface_loss_lean(s, d, ts, job.emissivity, job.t_surround)?;
    let q = finite_result(
        "loss at the measured surface",
        l.q_conv + l.q_rad - job.solar * area,
    )?;
    let drive = tp - ts;
    let hot = tp > s.t_inf;
    if (hot && ts >= tp) || (!hot && ts <= tp) {
        return Err(unexplained(
            ts,
            if hot {
                "is at or above the process temperature of a hot line: no insulation explains it (check the emissivities and the reflected temperature)"
            } else {
                "is at or below the process temperature of a cold line: no insulation explains it (check the emissivities and the reflected temperature)"
            },
        ));
    }
    if q == 0.0 || q.signum() != drive.signum() {
        return Err(unexplained(
            ts,
            if hot {
                "would take heat in from the air and surroundings while the line inside is hotter: no insulation explains it (is the surface colder than the air?)"
            } else {
                "would give heat to the air and surroundings while the line inside is colder: no insulation explains it (is the surface warmer than the air?)"
            },
        ));
    }
    // Through the inside film, the wall and the inner layers as designed.
    let g = job.geometry();
    let t_bore = match job.h_inside {
        Some(hi) => tp - q / (hi * g.area(job.construction.r_in)),
        None => tp,
    };
    let inner = Construction {
        layers: job.construction.layers[..n - 1].to_vec(),
        ..job.construction.clone()
    };
    let t_lo = tp.min(ts).min(s.t_inf).min(job.t_surround);
    let t_hi = tp.max(ts).max(s.t_inf).max(job.t_surround);
    let span = (t_lo - 0.5 * (t_hi - t_lo)).max(1.0)..=(t_hi + 0.5 * (t_hi - t_lo));
    job.construction.check(*span.start(), *span.end())?;
    let t_in = inner
        .march(t_bore, q, *span.start(), *span.end())
        .last()
        .copied()
        .unwrap_or(t_bore);
    let outer = job.construction.layers[n - 1];
    let r2 = job.construction.r_out();
    let r1 = r2 - outer.thickness;
    let dk = outer.k.integral(t_in) - outer.k.integral(ts);
    let from_loss = q / (g.shape_factor(r1, r2) * dk);
    if !(from_loss.is_finite() && from_loss > 0.0) || outer.thickness <= 0.0 {
        return Err(unexplained(
            ts,
            if hot {
                "is hotter than even a missing outer layer would leave it at this loss: no insulation explains it (check the emissivities, the reflected temperature and the inner layers)"
            } else {
                "is colder than even a missing outer layer would leave it at this gain: no insulation explains it (check the emissivities, the reflected temperature and the inner layers)"
            },
        ));
    }
    // The whole solve, over u = ln f.
    let mut failure = None;
    let mut f = |u: f64| match heatloss::solve_lean(&scaled(job, u.exp())) {
        Ok(sol) => sol.t_surface - ts,
        Err(e) => {
            failure.get_or_insert(e);
            f64::NAN
        }
    };
    let u0 = from_loss.ln();
    let mut half = 0.02;
    let (mut lo, mut hi) = ((u0 - half, f(u0 - half)), (u0 + half, f(u0 + half)));
    while lo.1.is_finite() && hi.1.is_finite() && lo.1.signum() == hi.1.signum() && half < 8.0 {
        half *= 4.0;
        lo = (u0 - half, f(u0 - half));
        hi = (u0 + half, f(u0 + half));
    }
    let root = solve::bracketed_known_ends(&mut f, (lo.0, Some(lo.1)), (hi.0, Some(hi.1)), 1e-9);
    if let Some(e) = failure {
        return Err(e);
    }
    let root = root.map_err(|_| EngineError::NonFiniteResult {
        quantity: "effective conductivity of the outer layer (no factor within e^±20 of the direct value closes the balance)",
    })?;
    // A bracket that closed onto a jump rather than a root leaves the surface off: refused.
    if root.residual.abs() > MAX_RESIDUAL {
        return Err(EngineError::NonFiniteResult {
            quantity: "effective conductivity of the outer layer (no factor reproduces the measured surface to 0.01 K)",
        });
    }
    Ok(KRatio {
        factor: finite_result("k ratio to the data sheet", root.x.exp())?,
        residual: root.residual,
        iterations: root.iterations,
        from_loss,
        loss: q,
        inner_face: t_in,
    })
}
