//! The field job on top of the energy balance: the bare-versus-insulated comparison, the verdicts
//! (touch, condensation, freezing) with the thickness that fixes each, the temperature drop along
//! a pipe carrying a flow, and the annual energy and cost.

use crate::engine::error::EngineError;
use crate::engine::heatloss::{self, Job, Solution};
use crate::engine::layers::Geometry;
use crate::engine::units::Dim;

/// Wall materials with properties near 300 K from Incropera & DeWitt, Fundamentals of Heat and Mass
/// Transfer, Table A.1 (from memory): k W/(m·K), ρ kg/m³, cp J/(kg·K).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum WallMaterial {
    CarbonSteel,
    Stainless,
    Copper,
    Aluminium,
    User,
}

impl WallMaterial {
    pub const ALL: [WallMaterial; 5] = [
        WallMaterial::CarbonSteel,
        WallMaterial::Stainless,
        WallMaterial::Copper,
        WallMaterial::Aluminium,
        WallMaterial::User,
    ];
    pub fn id(&self) -> &'static str {
        match self {
            WallMaterial::CarbonSteel => "cs",
            WallMaterial::Stainless => "ss",
            WallMaterial::Copper => "cu",
            WallMaterial::Aluminium => "al",
            WallMaterial::User => "user",
        }
    }
    pub fn from_id(id: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|m| m.id() == id)
    }
    pub fn label(&self) -> &'static str {
        match self {
            WallMaterial::CarbonSteel => "Carbon steel",
            WallMaterial::Stainless => "Stainless steel, AISI 304",
            WallMaterial::Copper => "Copper",
            WallMaterial::Aluminium => "Aluminium",
            WallMaterial::User => "Other: type its conductivity",
        }
    }
    /// (k, ρ, cp), or `None` for the user's material (k typed, ρ·cp unknown).
    pub fn properties(&self) -> Option<(f64, f64, f64)> {
        match self {
            WallMaterial::CarbonSteel => Some((60.5, 7854.0, 434.0)),
            WallMaterial::Stainless => Some((14.9, 7900.0, 477.0)),
            WallMaterial::Copper => Some((401.0, 8933.0, 385.0)),
            WallMaterial::Aluminium => Some((237.0, 2702.0, 903.0)),
            WallMaterial::User => None,
        }
    }
}

/// Water for the freezing estimate: ρ, cp of the liquid near 5 °C and the latent heat of fusion at
/// 0 °C, 333.6 kJ/kg (from memory; IAPWS-IF97 gives ρ and cp of the liquid, the fusion enthalpy is
/// the common handbook value).
pub use crate::engine::catalogue::{EMISSIVITIES, NOMINAL_SIZES};

pub const WATER_RHO: f64 = 1000.0;
pub const WATER_CP: f64 = 4200.0;
pub const ICE_LATENT: f64 = 333_600.0;

/// One verdict card: what it says, whether it passes, and its figures (SI, with their dimension).
#[derive(Debug, Clone, PartialEq)]
pub struct Verdict {
    pub id: &'static str,
    pub title: &'static str,
    /// false: the card is a warning.
    pub ok: bool,
    pub summary: String,
    pub figures: Vec<(&'static str, f64, Dim)>,
    /// The outer-layer thickness that meets this card's limit, m, whenever there is a layer to
    /// vary and a thickness up to 0.5 m meets it (whether or not the present layer does).
    pub thickness: Option<f64>,
    pub caution: Option<&'static str>,
}

/// Inputs of the verdicts beyond the job itself.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Targets {
    /// Highest surface temperature a person may touch, K.
    pub touch_limit: f64,
    /// Dew point of the stream, K, when it is humid air.
    pub dew_point: Option<f64>,
    /// Margin above the dew point the surface must keep, K.
    pub dew_margin: f64,
    pub hours: f64,
    /// Price per joule of the energy bought.
    pub price: f64,
    pub efficiency: f64,
    /// Mass flow through a pipe, kg/s (0: stagnant).
    pub mass_flow: f64,
    pub process_cp: f64,
    /// The still fluid in a pipe is water (the freezing card); false for an antifreeze mixture.
    pub process_water: bool,
    /// ρ·cp·(wall cross-section) per metre of the wall, J/(m·K), if known.
    pub wall_heat_capacity: Option<f64>,
    /// Highest heat loss per metre of pipe wanted, W/m (0: none).
    pub loss_target: f64,
    /// Time still water must hold out before it has frozen through, s (0: none).
    pub freeze_target: f64,
}

/// Everything the job adds to the convection result.
#[derive(Debug, Clone, PartialEq)]
pub struct JobResult {
    pub solution: Solution,
    /// The same line with every insulation layer taken away (only the wall).
    pub bare: Option<Solution>,
    pub verdicts: Vec<Verdict>,
    pub notes: Vec<String>,
    /// Bore radius and each layer's thickness (the wall first), m, for the cross-section.
    pub r_in: f64,
    pub thicknesses: Vec<f64>,
}

pub const TOUCH_CAUTION: &str = "Hot surfaces burn. The touch limit here is common practice, not a rule: local codes and your employer's personnel-protection standard govern. Guard or insulate, and check the surface with a contact thermometer before anyone touches it.";
pub const DEW_CAUTION: &str = "Condensation wets insulation, corrodes steel and drips. A vapour-retarding jacket and sealed joints matter as much as thickness; cold-service design is a job for a qualified designer under local codes.";
pub const FREEZE_CAUTION: &str = "A frozen line can burst. These times assume still water, no heat tracing and steady weather; wind gusts, colder nights and thin spots (valves, supports) freeze first. Follow local codes and licensed practice for freeze protection.";

/// Energy bought per year to make up a heat flow `q` (W) over `hours` of operation, J/yr.
pub fn annual_energy(q: f64, hours: f64, efficiency: f64) -> f64 {
    q.abs() * hours * 3600.0 / efficiency
}

/// Heat flow per unit (W/m or W) over a run of length `len` (1 for a sphere).
fn per_run(q: f64, g: Geometry, len: f64) -> f64 {
    match g {
        Geometry::Cylinder => q * len,
        Geometry::Sphere => q,
    }
}

/// Evaluate the job and its verdicts. `insulated_layers` is how many of the construction's
/// layers are insulation (after the wall).
pub fn evaluate(job: &Job, t: &Targets, insulated_layers: usize) -> Result<JobResult, EngineError> {
    let solution = heatloss::solve(job)?;
    let g = job.geometry();
    let n = job.construction.layers.len();
    let bare = if insulated_layers > 0 {
        let mut b = job.clone();
        b.construction.layers.truncate(n - insulated_layers);
        Some(heatloss::solve_lean(&b)?)
    } else {
        None
    };
    let mut notes = Vec::new();
    let run = job.stream.length;
    let q_run = per_run(solution.q, g, run);
    let mut verdicts = Vec::new();

    if let (Some(b), Some(rc)) = (&bare, solution.critical_radius) {
        let r_bare = b.outer_d / 2.0;
        if r_bare < rc {
            notes.push(format!(
                "The bare outer radius ({:.4} m) is below the critical radius of the insulation, k/h = {:.4} m: a thin layer first increases the loss; only beyond the critical radius does more insulation save heat.",
                r_bare, rc
            ));
        }
    }
    if let Some(b) = &bare {
        // A cold line gains heat (the flow is inward, negative): the card speaks of gain, and
        // every figure is a magnitude, so "saved" is never shown negative.
        let gain = b.q < 0.0;
        let (bare_q, ins_q) = (per_run(b.q, g, run).abs(), q_run.abs());
        let saving = bare_q - ins_q;
        // Negative when the insulation adds to the flow (below the critical radius).
        let energy_saved = annual_energy(saving, t.hours, t.efficiency).copysign(saving);
        let (what, bare_w, ins_w, saved_w) = if gain {
            ("heat gain", "bare gain", "insulated gain", "gain avoided")
        } else {
            ("loss", "bare loss", "insulated loss", "saved")
        };
        verdicts.push(Verdict {
            id: "saving",
            title: "Insulated against bare",
            ok: ins_q <= bare_q,
            summary: if ins_q <= bare_q {
                format!("The insulation cuts the {what}.")
            } else {
                format!(
                    "The insulation increases the {what}: the line is below the critical radius."
                )
            },
            figures: vec![
                (bare_w, bare_q, Dim::HeatFlow),
                (ins_w, ins_q, Dim::HeatFlow),
                (saved_w, saving, Dim::HeatFlow),
                ("energy saved", energy_saved, Dim::EnergyPerYear),
                ("money saved", energy_saved * t.price, Dim::MoneyPerYear),
            ],
            thickness: None,
            caution: None,
        });
    }

    let ts = solution.t_surface;
    // Personnel protection (hot side).
    if job.process_temp > t.touch_limit || ts > t.touch_limit {
        let hot = ts > t.touch_limit;
        let figures = vec![
            ("surface", ts, Dim::Temperature),
            ("limit", t.touch_limit, Dim::Temperature),
        ];
        let mut summary = if hot {
            "The surface is above the touch limit.".to_string()
        } else {
            "The surface is below the touch limit.".to_string()
        };
        let mut thickness = None;
        if insulated_layers > 0 && job.process_temp > t.touch_limit {
            match heatloss::thickness_search(job, 0.5, t.touch_limit, |s| s.t_surface)? {
                Some(heatloss::Search {
                    found: Some((th, _)),
                    ..
                }) => thickness = Some(th),
                // The layers inside the outer one meet it on their own.
                Some(heatloss::Search { at_zero, .. }) if at_zero <= t.touch_limit => summary
                    .push_str(
                        " The layers inside the outer one keep it below the limit on their own.",
                    ),
                _ => summary
                    .push_str(" No outer-layer thickness up to 0.5 m brings it to the limit."),
            }
        } else if hot {
            summary.push_str(" Add an insulation layer to see the thickness that meets the limit.");
        }
        verdicts.push(Verdict {
            id: "touch",
            title: "Touch",
            ok: !hot,
            summary,
            figures,
            thickness,
            // The burn caution where the surface can burn; a cool jacket over a hot line only
            // needs its thickness.
            caution: hot.then_some(TOUCH_CAUTION),
        });
    }
    // Condensation (cold side).
    if let Some(td) = t.dew_point {
        let need = td + t.dew_margin;
        if ts < need || job.process_temp < need {
            let wet = ts < need;
            let figures = vec![
                ("surface", ts, Dim::Temperature),
                ("dew point", td, Dim::Temperature),
                ("margin", t.dew_margin, Dim::TemperatureDifference),
            ];
            let mut summary = if wet {
                "The surface is below the dew point plus the margin: it will sweat.".to_string()
            } else {
                "The surface stays above the dew point plus the margin.".to_string()
            };
            let mut thickness = None;
            if insulated_layers > 0 && job.process_temp < need {
                match heatloss::thickness_search(job, 0.5, need, |s| s.t_surface)? {
                    Some(heatloss::Search {
                        found: Some((th, _)),
                        ..
                    }) => thickness = Some(th),
                    Some(heatloss::Search { at_zero, .. }) if at_zero >= need => summary.push_str(
                        " The layers inside the outer one keep the surface above it on their own.",
                    ),
                    _ => summary.push_str(
                        " No outer-layer thickness up to 0.5 m keeps the surface above it.",
                    ),
                }
            }
            verdicts.push(Verdict {
                id: "dew",
                title: "Condensation",
                ok: !wet,
                summary,
                figures,
                thickness,
                caution: Some(DEW_CAUTION),
            });
        }
    }
    // Freezing of still water in a pipe.
    let tinf = job.stream.t_inf;
    if g == Geometry::Cylinder
        && tinf < 273.15
        && job.process_temp > 273.15
        && t.mass_flow == 0.0
        && t.process_water
        && solution.q > 0.0
    {
        let r_in = job.construction.r_in;
        let water = WATER_RHO * std::f64::consts::PI * r_in * r_in;
        let c = water * WATER_CP + t.wall_heat_capacity.unwrap_or(0.0);
        // The two times from the overall resistance per metre, water to air, at a solution.
        let times = |s: &Solution| -> (f64, f64) {
            let r_tot = (job.process_temp - tinf) / s.q;
            (
                c * r_tot * ((job.process_temp - tinf) / (273.15 - tinf)).ln(),
                water * ICE_LATENT * r_tot / (273.15 - tinf),
            )
        };
        let (t_cool, t_freeze) = times(&solution);
        let mut summary = "Still water: time to cool to freezing, then to freeze through (lumped water and wall, constant resistance, the approach of ISO 12241; from memory).".to_string();
        if t.wall_heat_capacity.is_none() {
            summary.push_str(" The wall's heat capacity is left out for a material of your own (the times are then a little short).");
        }
        let mut figures = vec![
            ("to freezing", t_cool, Dim::Duration),
            ("then frozen through", t_freeze, Dim::Duration),
            ("in all", t_cool + t_freeze, Dim::Duration),
        ];
        let mut ok = false;
        let mut thickness = None;
        if t.freeze_target > 0.0 {
            figures.push(("wanted", t.freeze_target, Dim::Duration));
            let holds = t_cool + t_freeze >= t.freeze_target;
            if holds {
                ok = true;
                summary.push_str(" It holds out for the time wanted.");
            } else if insulated_layers == 0 {
                summary.push_str(" It freezes sooner than wanted; add an insulation layer to see the thickness that would hold out.");
            } else {
                summary.push_str(" It freezes sooner than wanted.");
            }
            if insulated_layers > 0 {
                let total = |s: &Solution| {
                    let (a, b) = times(s);
                    a + b
                };
                match heatloss::thickness_search(job, 0.5, t.freeze_target, total)? {
                    Some(heatloss::Search { found: Some((th, _)), .. }) => thickness = Some(th),
                    Some(heatloss::Search { at_zero, .. }) if at_zero >= t.freeze_target => summary
                        .push_str(" The layers inside the outer one hold out that long on their own."),
                    _ if !holds => summary.push_str(" No outer-layer thickness up to 0.5 m holds out that long: insulation only slows freezing, it cannot stop it. Heat tracing, a flow kept moving, or draining the line is the usual remedy (common practice)."),
                    _ => {}
                }
            }
        }
        verdicts.push(Verdict {
            id: "freeze",
            title: "Freezing",
            ok,
            summary,
            figures,
            thickness,
            caution: Some(FREEZE_CAUTION),
        });
    }
    // A loss target per metre of pipe.
    if g == Geometry::Cylinder && t.loss_target > 0.0 {
        let q = solution.q.abs();
        let mut figures = vec![
            ("loss per length", q, Dim::HeatFlowPerLength),
            ("target", t.loss_target, Dim::HeatFlowPerLength),
        ];
        let met = q <= t.loss_target;
        let mut thickness = None;
        let summary = if insulated_layers == 0 {
            if met {
                "The loss per length is within the target.".to_string()
            } else {
                "The loss per length is above the target. Add an insulation layer to see the thickness that meets it.".to_string()
            }
        } else {
            let search = heatloss::thickness_search(job, 0.5, t.loss_target, |s| s.q.abs())?;
            match search {
                Some(heatloss::Search {
                    found: Some((th, _)),
                    ..
                }) => {
                    thickness = Some(th);
                    if met {
                        "The loss per length is within the target.".to_string()
                    } else {
                        "The loss per length is above the target.".to_string()
                    }
                }
                _ if met => "The loss per length is within the target.".to_string(),
                Some(heatloss::Search { at_zero, .. }) if at_zero <= t.loss_target => "The loss per length is above the target, and the layer makes it worse: without the outer layer the loss is within it (the line is below the critical radius, where a thin layer adds surface faster than resistance).".to_string(),
                Some(heatloss::Search { at_max, .. }) => {
                    figures.push(("loss with 0.5 m of the outer layer", at_max, Dim::HeatFlowPerLength));
                    "The loss per length is above the target, and no outer-layer thickness up to 0.5 m (about 20 in) meets it: the target is below what this construction can reach. A better insulant (lower k) or a lower process temperature is needed.".to_string()
                }
                None => "The loss per length is above the target.".to_string(),
            }
        };
        verdicts.push(Verdict {
            id: "loss",
            title: "Loss target",
            ok: met,
            summary,
            figures,
            thickness,
            caution: None,
        });
    }
    // Temperature along a pipe carrying a flow.
    if g == Geometry::Cylinder && t.mass_flow > 0.0 {
        let r_tot = (job.process_temp - tinf) / solution.q;
        let (lo, hi) = (
            job.process_temp.min(tinf).min(job.t_surround),
            job.process_temp.max(tinf).max(job.t_surround),
        );
        let t_out = if r_tot.is_finite() && r_tot > 0.0 {
            // Loss proportional to the fluid's excess over the air, along the run.
            tinf + (job.process_temp - tinf) * (-run / (t.mass_flow * t.process_cp * r_tot)).exp()
        } else {
            // Heat flowing against the air difference (hot surroundings): the inlet's loss held
            // along the run.
            job.process_temp - solution.q * run / (t.mass_flow * t.process_cp)
        };
        let t_out = if t_out.is_finite() {
            t_out.clamp(lo, hi)
        } else {
            tinf
        };
        // Water that reaches 0 °C along the run can freeze there: the flow is too small to
        // keep it liquid (the outlet figure assumes it stays liquid).
        let freezes = t.process_water && job.process_temp > 273.15 && t_out <= 273.15;
        let mut summary = "Outlet temperature of the flow over the run length, with the inlet's loss per degree held along it.".to_string();
        if freezes {
            summary.push_str(" The water reaches freezing before the outlet: this flow is too small to keep it liquid over the run, and it can freeze there (the outlet figure assumes it stays liquid).");
        }
        verdicts.push(Verdict {
            id: "flow",
            title: "Along the run",
            ok: !freezes,
            summary,
            figures: vec![
                ("inlet", job.process_temp, Dim::Temperature),
                ("outlet", t_out, Dim::Temperature),
                // A line colder than its surroundings warms along the run.
                if t_out <= job.process_temp {
                    ("drop", job.process_temp - t_out, Dim::TemperatureDifference)
                } else {
                    ("rise", t_out - job.process_temp, Dim::TemperatureDifference)
                },
            ],
            thickness: None,
            caution: freezes.then_some(FREEZE_CAUTION),
        });
    }
    Ok(JobResult {
        solution,
        bare,
        verdicts,
        notes,
        r_in: job.construction.r_in,
        thicknesses: job
            .construction
            .layers
            .iter()
            .map(|l| l.thickness)
            .collect(),
    })
}

/// Figures that came out non-finite (a resistance or time beyond f64, from absurd inputs) are
/// taken off their card, which says so: no NaN or ∞ is ever shown.
pub fn sanitize(verdicts: &mut [Verdict]) {
    for v in verdicts {
        let before = v.figures.len();
        v.figures.retain(|f| f.1.is_finite());
        if v.figures.len() < before {
            v.summary.push_str(
                " Some figures are beyond what can be computed for these inputs and are left out.",
            );
        }
    }
}

/// Lumped cooling (or warming) of a solid round bar or sphere in the stream: the time constant
/// τ = ρ·c·V/(h·A) with V/A = D/4 (long cylinder, ends left out) or D/6 (sphere), the time from
/// `t0` to `t1`, and the Biot number h·(V/A)/k, with the usual validity Bi < 0.1 (Incropera &
/// DeWitt §5.2, from memory). `h` is convection plus linearised radiation at the present surface.
pub fn lumped(
    sphere: bool,
    d: f64,
    h: f64,
    (k, rho, cp): (f64, f64, f64),
    t_inf: f64,
    t0: f64,
    t1: f64,
) -> Verdict {
    let lc = if sphere { d / 6.0 } else { d / 4.0 };
    let tau = rho * cp * lc / h;
    let bi = h * lc / k;
    let between = (t1 - t_inf) * (t0 - t_inf) > 0.0 && (t1 - t_inf).abs() < (t0 - t_inf).abs();
    let mut figures = vec![
        ("time constant τ (63 % of the way)", tau, Dim::Duration),
        ("Biot number h·(V/A)/k", bi, Dim::Ratio),
    ];
    let mut summary =
        String::from("Lumped body: one temperature throughout, h held at its present value.");
    if between {
        figures.insert(
            1,
            (
                "time to the target temperature",
                tau * ((t0 - t_inf) / (t1 - t_inf)).ln(),
                Dim::Duration,
            ),
        );
    } else {
        summary.push_str(" The target temperature must lie between the present surface temperature and the stream's.");
    }
    let ok = bi < 0.1;
    if !ok {
        summary.push_str(" Bi ≥ 0.1: the inside is not at one temperature, so the lumped times are too short; a conduction solution is needed.");
    }
    Verdict {
        id: "cooling",
        title: "Cooling in the stream",
        ok,
        summary,
        figures,
        thickness: None,
        caution: None,
    }
}

#[cfg(test)]
mod tests;
