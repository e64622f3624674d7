//! The inspection round (issue #20): a technician reads a surface with an infrared instrument;
//! what the reading says of the surface, and what the surface says of the insulation under it.
//!
//! - [`radiometry`] — the reading corrected to the surface's emissivity over the instrument's band
//!   (Planck's law, after ASTM E1862 and E1933), with the σT⁴ form as a cross-check, its
//!   sensitivity to the emissivity and its caveats.
//! - [`effective_k`] — the factor on the outer layer's data-sheet k that reproduces the measured
//!   surface (an inverse of the surface solve, bracketed, with its residual).
//! - [`inspect`] here — both, with the loss as built against the loss as designed, the condition
//!   of the insulation, the excess energy and cost per year, and ranges by corner evaluation.
//!
//! Pure computation, SI: temperatures K, lengths m, losses W/m (cylinder) or W (sphere).

pub mod effective_k;
pub mod radiometry;
#[cfg(test)]
mod tests;

pub use effective_k::{effective_k, KRatio};
pub use radiometry::{correct, Caveat, Corrected, Reading};

use crate::engine::error::{finite_result, EngineError};
use crate::engine::heatloss::{self, Job};

/// k ratios up to this are "as designed": data-sheet values are for new material in the
/// laboratory, and joints, supports, compression and ageing put an installed layer some tens of
/// percent above them (common practice, not a standard's number).
pub const AS_DESIGNED_MAX: f64 = 1.3;
/// k ratios up to this are "degraded"; above it the layer is likely wet, damaged or missing in
/// part (common practice: wet mineral wool or a gap runs several times the dry k).
pub const DEGRADED_MAX: f64 = 2.5;
/// The reading's accuracy and the emissivity's uncertainty when none is given (common practice:
/// ±2 K is what field instruments state near ambient; ±0.05 what tables know of an emissivity).
pub const DEFAULT_ACCURACY: f64 = 2.0;
pub const DEFAULT_EMISSIVITY_UNCERTAINTY: f64 = 0.05;

/// The insulation's condition, from the k ratio.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Condition {
    AsDesigned,
    Degraded,
    /// Likely wet, damaged or missing in part.
    Failed,
}

impl Condition {
    pub fn from_ratio(f: f64) -> Self {
        if f <= AS_DESIGNED_MAX {
            Condition::AsDesigned
        } else if f <= DEGRADED_MAX {
            Condition::Degraded
        } else {
            Condition::Failed
        }
    }
    /// Stable id (survey CSV).
    pub fn id(&self) -> &'static str {
        match self {
            Condition::AsDesigned => "as designed",
            Condition::Degraded => "degraded",
            Condition::Failed => "likely wet, damaged or missing",
        }
    }
}

/// What the inspection needs beyond the design job and the reading.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Terms {
    /// Run length, m (1 for a sphere: its figures are whole-body).
    pub run: f64,
    pub hours: f64,
    pub efficiency: f64,
    /// Price per joule.
    pub price: f64,
    /// The reading's stated accuracy, ± K.
    pub accuracy: f64,
    /// The surface emissivity's uncertainty, ±.
    pub emissivity_uncertainty: f64,
}

/// Lowest and highest over the corners.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Span {
    pub lo: f64,
    pub hi: f64,
}

impl Span {
    fn of(v: f64) -> Self {
        Span { lo: v, hi: v }
    }
    fn take(&mut self, v: f64) {
        self.lo = self.lo.min(v);
        self.hi = self.hi.max(v);
    }
}

/// Ranges by bounds: every corner of (reading ± accuracy) × (emissivity ± its uncertainty) ×
/// (convection at the lowest and highest in-range forced correlation), the nominal answer
/// included. Not a statistical interval.
#[derive(Debug, Clone, PartialEq)]
pub struct Ranges {
    pub surface: Span,
    pub k_ratio: Span,
    /// Excess cost per year against design.
    pub excess_cost: Span,
    /// The factors on forced convection the correlations' spread gave (lowest, highest).
    pub convection: (f64, f64),
    /// Corners evaluated, and how many of them no insulation explains (left out of the spans).
    pub corners: usize,
    pub unexplained: usize,
}

/// The inspection of one item.
#[derive(Debug, Clone, PartialEq)]
pub struct Inspection {
    pub reading: Reading,
    pub corrected: Corrected,
    /// Loss at the measured surface and as designed, W/m (cylinder) or W (sphere), outward.
    pub actual: f64,
    pub design: f64,
    /// Surface temperature as designed, K.
    pub design_surface: f64,
    pub k: KRatio,
    pub condition: Condition,
    /// |actual| − |design|: W/m (W for a sphere), over the run W, energy bought J/yr and its cost
    /// per year (negative: less than design).
    pub excess: f64,
    pub excess_total: f64,
    pub excess_energy: f64,
    pub excess_cost: f64,
    pub ranges: Ranges,
}

/// Excess over design per unit, over the run, energy bought and cost per year.
fn excess(actual: f64, design: f64, t: &Terms) -> Result<[f64; 4], EngineError> {
    let per = actual.abs() - design.abs();
    let total = per * t.run;
    let energy = crate::engine::job::annual_energy(total, t.hours, t.efficiency) * total.signum();
    Ok([
        finite_result("excess loss", per)?,
        finite_result("excess loss of the item", total)?,
        finite_result("excess energy per year", energy)?,
        finite_result("excess cost per year", energy * t.price)?,
    ])
}

/// The factors on forced convection from the correlations' spread at the measured surface: the
/// lowest and highest in-range correlation over the recommended one (1, 1 without a spread).
fn convection_spread(job: &Job, ts: f64) -> Result<(f64, f64), EngineError> {
    let d = 2.0 * job.construction.r_out();
    let l = heatloss::surface_loss(&job.stream, d, ts, job.emissivity, job.t_surround)?;
    let Some(a) = l.analysis else {
        return Ok((1.0, 1.0));
    };
    let rec = a.h_forced / job.stream.yaw;
    Ok(match a.spread {
        Some((lo, hi, _)) if rec > 0.0 && (lo / rec).is_finite() && (hi / rec).is_finite() => {
            ((lo / rec).min(1.0), (hi / rec).max(1.0))
        }
        _ => (1.0, 1.0),
    })
}

/// One corner: the reading at `dt` off, the emissivity at `de` off, forced convection × `hf`.
fn corner(
    job: &Job,
    r: &Reading,
    dt: f64,
    de: f64,
    hf: f64,
    t: &Terms,
) -> Result<[f64; 3], EngineError> {
    let mut j = job.clone();
    j.emissivity = job.emissivity + de;
    j.stream.yaw *= hf;
    let read = Reading {
        displayed: r.displayed + dt,
        ..*r
    };
    let ts = radiometry::surface_temperature(&read, j.emissivity)?;
    let design = heatloss::solve_lean(&j)?.q;
    let k = effective_k(&j, ts)?;
    Ok([ts, k.factor, excess(k.loss, design, t)?[3]])
}

/// Inspect one item: `job` is the construction as designed (its last layer the outer
/// insulation), `reading` what the instrument showed and how it was set; the surface's
/// emissivity is `job.emissivity`. Errors: the reading's own inputs (named), a bare line, a
/// surface no insulation explains.
pub fn inspect(job: &Job, reading: &Reading, t: &Terms) -> Result<Inspection, EngineError> {
    let corrected = radiometry::correct(reading, job.emissivity)?;
    let ts = corrected.surface;
    let design = heatloss::solve_lean(job)?;
    let k = effective_k(job, ts)?;
    let [excess, excess_total, excess_energy, excess_cost] = excess(k.loss, design.q, t)?;
    let convection = convection_spread(job, ts)?;
    let mut ranges = Ranges {
        surface: Span::of(ts),
        k_ratio: Span::of(k.factor),
        excess_cost: Span::of(excess_cost),
        convection,
        corners: 0,
        unexplained: 0,
    };
    for dt in [-t.accuracy, t.accuracy] {
        for de in [-t.emissivity_uncertainty, t.emissivity_uncertainty] {
            for hf in [convection.0, convection.1] {
                ranges.corners += 1;
                // An emissivity past 1 is capped there; at or below 0 the corner has no answer.
                let e = (job.emissivity + de).min(1.0);
                if e <= 0.0 {
                    ranges.unexplained += 1;
                    continue;
                }
                let de = e - job.emissivity;
                match corner(job, reading, dt, de, hf, t) {
                    Ok([s, f, c]) => {
                        ranges.surface.take(s);
                        ranges.k_ratio.take(f);
                        ranges.excess_cost.take(c);
                    }
                    Err(_) => ranges.unexplained += 1,
                }
            }
        }
    }
    Ok(Inspection {
        reading: *reading,
        condition: Condition::from_ratio(k.factor),
        actual: k.loss,
        design: design.q,
        design_surface: design.t_surface,
        corrected,
        k,
        excess,
        excess_total,
        excess_energy,
        excess_cost,
        ranges,
    })
}
