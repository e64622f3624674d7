//! The evaluation: a scenario in, an `Outcome` out (every number the page shows, the verdicts,
//! the sweeps for the plots, the working), and the cautions that apply to it.

use super::*;

/// One step of the working, written so it can be checked by hand.
#[derive(Debug, Clone, PartialEq)]
pub struct Step {
    pub title: &'static str,
    pub text: String,
}

/// The steps a one-page report keeps: the balance, the convection and radiation parts and the
/// heat flow (the page shows every step).
const KEY_STEPS: [&str; 6] = [
    "Inside film (flow through the bore)",
    "Heat made inside (energy balance)",
    "Surface temperature (energy balance)",
    "Forced convection (recommended correlation)",
    "Radiation",
    "Heat flow",
];

impl Outcome {
    /// Where the stream's properties come from, one "quantity: source" a method, for the working
    /// and the report.
    pub fn property_sources(&self) -> String {
        self.properties
            .first()
            .map(|r| {
                r.props
                    .sources
                    .iter()
                    .map(|(q, src)| format!("{q}: {src}"))
                    .collect::<Vec<_>>()
                    .join(" · ")
            })
            .unwrap_or_default()
    }
}

impl Step {
    /// Whether the report keeps this step.
    pub fn is_key(&self) -> bool {
        KEY_STEPS.contains(&self.title)
    }
}

/// The properties used at one temperature, and why that temperature.
#[derive(Debug, Clone, PartialEq)]
pub struct PropertyRow {
    pub role: &'static str,
    pub props: Properties,
}

/// Everything the page shows for one evaluation, SI.
#[derive(Debug, Clone, PartialEq)]
pub struct Outcome {
    pub shape: Shape,
    pub fluid: &'static str,
    pub pressure: f64,
    pub film_temp: f64,
    /// Dew point of humid air, K.
    pub dew_point: Option<f64>,
    pub properties: Vec<PropertyRow>,
    /// Re and Pr of the recommended forced correlation, at its reference temperature.
    pub reynolds: f64,
    pub prandtl: f64,
    /// Nu = h·D/k of the answer, k at the film temperature.
    pub nusselt: f64,
    /// The answer: mean convective heat-transfer coefficient, W/(m²·K).
    pub h: f64,
    /// Heat flow per metre of length, convection plus radiation less any absorbed sun, W/m
    /// (positive from the surface outward); none for a sphere.
    pub q_per_length: Option<f64>,
    /// Heat flow from the whole body (over the length L for a prism), W.
    pub q_total: f64,
    /// The convective and radiative parts of `q_total`, W.
    pub q_conv_total: f64,
    pub q_rad_total: f64,
    /// Linearised radiation coefficient εσ(Ts² + Tsur²)(Ts + Tsur), W/(m²·K).
    pub h_rad: f64,
    /// Outdoors (none indoors): the effective sky temperature, K (Berdahl & Martin with Clark &
    /// Allen's clouds).
    pub sky_temp: Option<f64>,
    /// Outdoors: the one temperature the surface radiates to, the sky and the ground by view
    /// factor, K (it stands where the typed surroundings stand indoors).
    pub radiant_temp: Option<f64>,
    /// Outdoors: the solar heat absorbed over the whole body (the length L for a prism), W, and
    /// per metre, W/m (none for a sphere). A gain: `q_total` = convection + radiation − this.
    pub solar_total: Option<f64>,
    pub solar_per_length: Option<f64>,
    /// Outdoors with a clear sky at a date, time and place: the sun's elevation above the
    /// horizon (refracted), degrees, and the clear-sky irradiance used (W/m²).
    pub sun_elevation: Option<f64>,
    pub sunlight: Option<crate::engine::outdoors::irradiance::Irradiance>,
    /// Outdoors: the typed wind carried to the body's height and terrain, m/s.
    pub wind_at_body: Option<f64>,
    /// Outdoors, for a level cylinder or bar in a level wind: the factor on forced convection
    /// for the wind's angle to the axis (Morgan's).
    pub yaw_factor: Option<f64>,
    /// Surface temperature: as typed, or solved from the process inside.
    pub surface_temp: f64,
    /// Outer diameter the stream sees (over the insulation when solved), m.
    pub outer_d: f64,
    /// The solved job (process inside, layers) when the surface temperature is worked out.
    pub job: Option<JobResult>,
    /// The inside film worked out from the flow through the bore, when it is.
    pub inside: Option<PipeFlow>,
    /// Verdict cards: touch, condensation, freezing, the run, insulated against bare.
    pub verdicts: Vec<Verdict>,
    /// Energy bought per year to make up the loss, J/yr, and its cost per year.
    pub annual_energy: f64,
    pub annual_cost: f64,
    /// Loss and surface temperature against the outer layer's thickness (solved, with layers):
    /// (thickness m, heat flow W, surface K).
    pub thickness_sweep: Vec<(f64, f64, f64)>,
    /// Targets to mark on the plots: on heat flow over the run (the loss target per metre times
    /// the length), W; on surface temperature (the touch limit, the dew point plus the margin), K.
    pub loss_marks: Vec<(&'static str, f64)>,
    pub surface_marks: Vec<(&'static str, f64)>,
    /// Heat-transfer coefficient and heat flow against stream speed 0–20 m/s: (speed m/s,
    /// h W/(m²·K), heat flow W, surface K).
    pub wind_sweep: Vec<(f64, f64, f64, f64)>,
    /// Outdoors, a level body in a level wind: heat flow and surface against the wind's angle to
    /// the axis, 0–90°: (angle °, heat flow W, surface K).
    pub yaw_sweep: Vec<(f64, f64, f64)>,
    /// The recommended forced correlation's name.
    pub method: &'static str,
    pub regime: &'static str,
    pub analysis: Analysis,
    /// Flags on the answer: properties, the recommended correlation, natural convection, blend.
    pub flags: Vec<Flag>,
    pub working: Vec<Step>,
    /// Read with an infrared instrument (`SurfaceMode::Reading`, issue #20): the reading
    /// corrected, the loss as built against the design (the rest of the outcome is the design),
    /// the outer layer's k ratio, the condition, the excess and the ranges.
    pub inspection: Option<crate::engine::inspect::Inspection>,
    /// Heat made inside (`SurfaceMode::Made`, issue #19): what it came to at the surface, and
    /// the heat or current its limit allows.
    pub made: Option<Made>,
}

/// Evaluate a scenario. Errors only where nothing meaningful can be computed.
pub fn evaluate(s: &Scenario) -> Result<Outcome, EngineError> {
    evaluate_with(s, true)
}

/// As [`evaluate`]; without the sweeps (the plots' data) and the written working when `sweeps` is
/// false, for lists.
pub fn evaluate_with(s: &Scenario, sweeps: bool) -> Result<Outcome, EngineError> {
    // Lowered once: every check, the stream, the inside film, the targets and the job.
    let Case {
        p,
        fluid,
        dew_point,
        stream,
        inside,
        targets,
        job,
        env,
        mut flags,
    } = s.case()?;
    let mut inspection = None;
    let mut made_result = None;
    let (a, ts, outer_d, job_result) = match job {
        Some(job) => {
            if s.reads() {
                inspection = Some(crate::engine::inspect::inspect(
                    &job,
                    &s.ir(),
                    &inspection_terms(s),
                )?);
            }
            let mut r = crate::engine::job::evaluate(&job, &targets, s.layer_count)?;
            if let Inside::Still(_) = &inside {
                r.notes.push("No flow through the pipe: the inside film is not worked out, and the bore is taken at the process temperature (still fluid).".into());
            }
            let a =
                r.solution
                    .loss
                    .analysis
                    .clone()
                    .ok_or(EngineError::NoTemperatureDifference {
                        value: s.fluid_temp,
                        unit: "K",
                    })?;
            (a, r.solution.t_surface, r.solution.outer_d, Some(r))
        }
        None if s.makes_heat() => {
            let (a, ts, m) = made::solve(s, &stream, &env)?;
            made_result = Some(m);
            (a, ts, s.diameter, None)
        }
        None => (body::analyse(&stream)?, s.surface_temp, s.diameter, None),
    };
    let thickness_sweep = match &job_result {
        Some(_) if sweeps && s.layer_count > 0 => {
            let i = s.layer_count - 1;
            let top = (2.0 * s.layer_t[i]).max(0.1);
            grid_dense_start(top, 14, s.layer_t[i])
                .into_iter()
                .filter_map(|x| {
                    let mut t = *s;
                    t.layer_t[i] = x;
                    let o = quick(&t, p, fluid, &inside, &env).ok()?;
                    (o.0.is_finite() && o.1.is_finite()).then_some((x, o.0, o.1))
                })
                .collect()
        }
        _ => Vec::new(),
    };
    // Outdoors, for a level body in a level wind: the loss as the wind swings from along the
    // axis (0°) to square across it (90°), each angle with its own yaw factor.
    let yaw_sweep = match &env.outdoor {
        Some(o) if sweeps && o.yawed => grid_with(90.0, 9, s.yaw)
            .into_iter()
            .filter_map(|angle| {
                let mut t = *s;
                t.yaw = angle;
                let e = Surroundings {
                    yaw: crate::engine::outdoors::wind::yaw_factor(angle).ok()?,
                    ..env.clone()
                };
                let o = quick(&t, p, fluid, &inside, &e).ok()?;
                (o.0.is_finite() && o.1.is_finite()).then_some((angle, o.0, o.1))
            })
            .collect(),
        _ => Vec::new(),
    };
    let wind_sweep = if sweeps {
        grid_with(20.0, 10, s.speed)
    } else {
        Vec::new()
    }
    .into_iter()
    .filter_map(|u| {
        let mut t = *s;
        t.speed = u;
        let o = quick(&t, p, fluid, &inside, &env).ok()?;
        (o.0.is_finite() && o.1.is_finite() && o.2.is_finite()).then_some((u, o.2, o.0, o.1))
    })
    .collect();
    let film = a.film.t;
    let rec = a.recommended().clone();
    let h = a.h;
    let dt = ts - s.fluid_temp;
    let h_rad = crate::engine::heatloss::radiation_coefficient(s.emissivity, ts, env.t_radiant);
    let rad_flux = crate::engine::heatloss::radiated_flux(s.emissivity, ts, env.t_radiant);
    let area_unit = crate::engine::heatloss::outer_area(s.shape, outer_d);
    let run = s.run();
    let q_conv_unit = finite_result("convective heat flow", h * area_unit * dt)?;
    let q_rad_unit = finite_result("radiative heat flow", area_unit * rad_flux)?;
    let q_solar_unit = finite_result("absorbed solar heat", env.solar * area_unit)?;
    // Indoors the solar term is 0.0 exactly: the sum is today's, bit for bit.
    let q_unit = match &made_result {
        // What the body makes is what it loses: the balance closed (its residual, rounding, is
        // in the working), not a hair of noise shown as a loss.
        Some(m) => m.made,
        None => q_conv_unit + q_rad_unit - q_solar_unit,
    };
    let q_per_length = s.shape.perimeter_over_d().map(|_| q_unit);
    let q_total = finite_result("heat flow", q_unit * run)?;
    let annual_energy = finite_result(
        "energy per year",
        crate::engine::job::annual_energy(q_total, s.hours, s.efficiency),
    )?;
    let annual_cost = finite_result("cost per year", annual_energy * s.price)?;
    let mut verdicts = match &job_result {
        Some(r) => r.verdicts.clone(),
        None => given_verdicts(s, ts, dew_point),
    };
    if s.cools() {
        if let Some(m) = s.wall.properties() {
            verdicts.push(crate::engine::job::lumped(
                s.shape == Shape::Sphere,
                outer_d,
                h + h_rad,
                m,
                s.fluid_temp,
                ts,
                s.cool_target,
            ));
        }
    }
    if let Some(m) = &made_result {
        verdicts.push(made::verdict(s, ts, m));
    }
    if let Some(i) = &inspection {
        as_read(&mut verdicts, s, i, dew_point);
        verdicts.push(inspection_verdict(s, i));
    }
    crate::engine::job::sanitize(&mut verdicts);
    let nusselt = finite_result("Nusselt number", h * outer_d / a.film.k)?;

    for props in [&a.film, &a.free, &a.surface] {
        for f in &props.flags {
            if !flags.contains(f) {
                flags.push(f.clone());
            }
        }
    }
    flags.extend(rec.flags.iter().cloned());
    if let Some(n) = &a.natural {
        flags.extend(n.flags.iter().cloned());
    }
    flags.extend(a.flags.iter().cloned());
    for f in inside.flags() {
        if !flags.contains(f) {
            flags.push(f.clone());
        }
    }

    let w = WorkingInputs {
        p,
        dew_point,
        fluid: fluid.name(),
        ts,
        outer_d,
        q_conv_unit,
        q_rad_unit,
        q_solar_unit,
        h_rad,
        q_total,
        job: job_result.as_ref(),
        inside: &inside,
        env: &env,
    };
    let working = if sweeps {
        let mut steps = working(s, &a, &w);
        if let Some(m) = &made_result {
            steps.push(made::step(s, ts, m, &w));
        }
        if let Some(i) = &inspection {
            steps.extend(inspection_working(s, i));
        }
        steps
    } else {
        Vec::new()
    };
    let role = |r: &str| -> &'static str {
        match r {
            "film" => "film temperature Tf: Churchill–Bernstein, Hilpert, Ranz–Marshall, Jakob, natural convection",
            "free" => "free stream T∞: Zukauskas, Whitaker, Gnielinski",
            _ => "surface Ts: Pr_s and μs of the corrections",
        }
    };
    Ok(Outcome {
        shape: s.shape,
        fluid: fluid.name(),
        pressure: p,
        film_temp: film,
        dew_point,
        properties: vec![
            PropertyRow {
                role: role("film"),
                props: a.film.clone(),
            },
            PropertyRow {
                role: role("free"),
                props: a.free.clone(),
            },
            PropertyRow {
                role: role("surface"),
                props: a.surface.clone(),
            },
        ],
        reynolds: rec.groups.re,
        prandtl: rec.groups.pr,
        nusselt,
        h,
        q_per_length,
        q_total,
        q_conv_total: q_conv_unit * run,
        q_rad_total: q_rad_unit * run,
        h_rad,
        sky_temp: env.outdoor.as_ref().map(|o| o.sky.temperature),
        radiant_temp: env.outdoor.as_ref().map(|_| env.t_radiant),
        solar_total: env.outdoor.as_ref().map(|_| q_solar_unit * run),
        solar_per_length: env
            .outdoor
            .as_ref()
            .and_then(|_| s.shape.perimeter_over_d().map(|_| q_solar_unit)),
        sun_elevation: env
            .outdoor
            .as_ref()
            .and_then(|o| o.sun.map(|(pos, _)| pos.elevation)),
        sunlight: env
            .outdoor
            .as_ref()
            .and_then(|o| o.sun.map(|_| o.irradiance)),
        wind_at_body: env.outdoor.as_ref().map(|o| o.wind_at_body),
        yaw_factor: env
            .outdoor
            .as_ref()
            .and_then(|o| o.yawed.then_some(env.yaw)),
        surface_temp: ts,
        outer_d,
        job: job_result,
        inside: match inside {
            Inside::Flowing(f) => Some(f),
            _ => None,
        },
        verdicts,
        annual_energy,
        annual_cost,
        thickness_sweep,
        wind_sweep,
        yaw_sweep,
        loss_marks: if s.uses(Field::LossTarget) && s.loss_target > 0.0 {
            vec![("loss target", s.loss_target * s.length)]
        } else {
            Vec::new()
        },
        surface_marks: std::iter::once(("touch limit", s.touch_limit))
            .chain(dew_point.map(|td| ("dew point + margin", td + s.dew_margin)))
            .collect(),
        method: rec.name,
        regime: s.shape.regime(rec.groups.re),
        analysis: a,
        flags,
        working,
        inspection,
        made: made_result,
    })
}

/// `steps` equal steps over 0..=top, with `also` (the operating point) put in its place, so the
/// plotted curve passes through the point marked on it.
pub(crate) fn grid_with(top: f64, steps: usize, also: f64) -> Vec<f64> {
    with_point(
        (0..=steps).map(|k| top * k as f64 / steps as f64).collect(),
        also,
    )
}

/// The rising grid `g` with `also` put in its place (once; not a negative or non-finite one).
fn with_point(mut g: Vec<f64>, also: f64) -> Vec<f64> {
    if also.is_finite() && also >= 0.0 && !g.contains(&also) {
        g.insert(g.partition_point(|x| *x < also), also);
    }
    g
}

/// 0 to `top` in `steps`, spaced as the square of the step (loss and surface change fastest in
/// the first millimetres of insulation), with `also` (the operating point) in place of a grid
/// point within 2 % of `top` of it, so the plot neither skips the steep start nor draws two dots.
pub(crate) fn grid_dense_start(top: f64, steps: usize, also: f64) -> Vec<f64> {
    let n = steps as f64;
    let g: Vec<f64> = (0..=steps)
        .map(|k| top * (k as f64 / n).powi(2))
        .filter(|x| *x == 0.0 || !(also.is_finite() && (x - also).abs() < 0.02 * top))
        .collect();
    with_point(g, also)
}

/// The heat flow (W, whole run or body), surface temperature and convective h of a scenario, without
/// the working or the verdicts: what the sweeps need.
pub(crate) fn quick(
    s: &Scenario,
    p: f64,
    fluid: Fluid,
    inside: &Inside,
    env: &Surroundings,
) -> Result<(f64, f64, f64), EngineError> {
    let stream = s.stream(p, fluid, env);
    let run = s.run();
    if s.makes_heat() {
        made::quick(s, &stream, env)
    } else if s.solved() {
        let job = s.job_with(stream, inside, env);
        let sol = crate::engine::heatloss::solve_lean(&job)?;
        Ok((sol.q * run, sol.t_surface, sol.loss.h_conv))
    } else {
        let l = crate::engine::heatloss::surface_loss_lean(
            &stream,
            s.diameter,
            s.surface_temp,
            s.emissivity,
            env.t_radiant,
        )?;
        let sun = env.solar * crate::engine::heatloss::outer_area(s.shape, s.diameter);
        Ok(((l.q_conv + l.q_rad - sun) * run, s.surface_temp, l.h_conv))
    }
}

/// Touch and condensation verdicts for a typed surface temperature (no thickness to offer).
pub(crate) fn given_verdicts(s: &Scenario, ts: f64, dew_point: Option<f64>) -> Vec<Verdict> {
    use crate::engine::job::{DEW_CAUTION, TOUCH_CAUTION};
    let mut out = Vec::new();
    if ts > s.touch_limit {
        out.push(Verdict {
            id: "touch",
            title: "Touch",
            ok: false,
            summary: if s.makes_heat() {
                "The surface is above the touch limit: guard it, or make less heat.".into()
            } else {
                "The surface is above the touch limit. Work out the surface from the process temperature with an insulation layer to see the thickness that meets it.".into()
            },
            figures: vec![("surface", ts, Dim::Temperature), ("limit", s.touch_limit, Dim::Temperature)],
            thickness: None,
            caution: Some(TOUCH_CAUTION),
        });
    }
    if let Some(td) = dew_point {
        if ts < td + s.dew_margin {
            out.push(Verdict {
                id: "dew",
                title: "Condensation",
                ok: false,
                summary: "The surface is below the dew point plus the margin: it will sweat."
                    .into(),
                figures: vec![
                    ("surface", ts, Dim::Temperature),
                    ("dew point", td, Dim::Temperature),
                    ("margin", s.dew_margin, Dim::TemperatureDifference),
                ],
                thickness: None,
                caution: Some(DEW_CAUTION),
            });
        }
    }
    out
}

/// The cautions that apply to this result: hot surface (above the touch limit), condensation,
/// freezing. Each defers to local codes and licensed practice.
pub fn cautions(s: &Scenario, o: &Outcome) -> Vec<&'static str> {
    let mut out = Vec::new();
    let ts = o.surface_temp;
    if ts >= s.touch_limit {
        out.push("Hot surface: at this temperature bare skin can be burned on contact. Guard or insulate it and follow the personnel-protection rules of your local codes; verify with a contact thermometer before touching.");
    }
    // Moisture leaves the stream only on a surface at or below its dew point (the frost point
    // below 0 °C): as dew above freezing, as frost below. A surface merely below 0 °C but above
    // the frost point stays dry; a line's water freezing inside is the freezing card's own
    // caution (still water in frost only), never said of a hot or flowing line here.
    if o.dew_point.is_some_and(|td| ts <= td) {
        if ts < 273.15 {
            out.push("The surface is at or below the stream's frost point: frost or ice will form on it and make it slippery or heavy, and melt water wets insulation. Follow local codes and licensed practice.");
        } else {
            out.push("The surface is at or below the stream's dew point: moisture will condense on it. Condensate wets insulation and corrodes steel; a vapour-tight design is a matter for a qualified designer and local codes.");
        }
    }
    out
}
