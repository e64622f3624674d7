//! Heat made inside, on the page (issue #19): the scenario's tracer, heater or conductor handed
//! to [`crate::engine::outdoors::joule`], the surface solved where the body loses what it makes
//! (in the stream, the sky and the sun as set), and the heat or the current that its limit
//! allows: the least surface a heat must hold (a traced water line above freezing), the most a
//! conductor may reach (its rating).

use super::*;
use crate::engine::outdoors::joule;

/// What the heat made inside came to, SI, per metre of a long body (per body for a sphere).
#[derive(Debug, Clone, PartialEq)]
pub struct Made {
    /// Heat made at the surface temperature, W/m (W).
    pub made: f64,
    /// The current, A, and the resistance at the surface temperature, Ω/m, for a conductor.
    pub current: Option<f64>,
    pub resistance: Option<f64>,
    /// Solver steps, and made + sun − convection − radiation at the answer, W/m (W).
    pub iterations: u32,
    pub residual: f64,
    /// The least surface a heat must hold, or the most a conductor may reach, K.
    pub limit: f64,
    /// At the limit: the heat that holds the surface there, W/m (W), and the current for a
    /// conductor; none when no heat made inside can (`refused` says why).
    pub at_limit: Option<(f64, Option<f64>)>,
    pub refused: Option<String>,
}

/// The body in its surroundings as the balance takes it: the absorbed sun per metre (per body).
pub(crate) fn surface(s: &Scenario, stream: &Body, env: &Surroundings) -> joule::Surface {
    joule::Surface {
        stream: *stream,
        emissivity: s.emissivity,
        t_radiant: env.t_radiant,
        solar: env.solar * crate::engine::heatloss::outer_area(s.shape, s.diameter),
    }
}

/// The heat source the scenario gives: a heat (per metre, or per body for a sphere), or a current
/// through a resistance linear between the data sheet's two points.
pub(crate) fn source(s: &Scenario) -> Result<joule::Source, EngineError> {
    Ok(if s.current_given() {
        joule::Source::Current {
            amps: s.current,
            resistance: joule::Resistance::new(s.t_r_low, s.r_low, s.t_r_high, s.r_high)?,
        }
    } else if s.shape.is_sphere() {
        joule::Source::Heat(s.heat_body)
    } else {
        joule::Source::Heat(s.heat_made)
    })
}

/// The steady surface of a body making heat inside: the full analysis there, the surface
/// temperature, and what the heat came to with the heat or current at the limit.
pub(crate) fn solve(
    s: &Scenario,
    stream: &Body,
    env: &Surroundings,
) -> Result<(Analysis, f64, Made), EngineError> {
    let surf = surface(s, stream, env);
    let src = source(s)?;
    let b = joule::surface_temperature(&surf, &src)?;
    let a = b
        .loss
        .analysis
        .clone()
        .ok_or(EngineError::NoTemperatureDifference {
            value: s.fluid_temp,
            unit: "K",
        })?;
    let limit = if s.current_given() {
        s.conductor_limit
    } else {
        s.hold_temp
    };
    let inverse = match &src {
        joule::Source::Current { resistance, .. } => {
            joule::current_for_limit(&surf, resistance, limit).map(|l| (l.made, l.current))
        }
        joule::Source::Heat(_) => joule::heat_for_limit(&surf, limit).map(|l| (l.made, None)),
    };
    // A limit the surroundings and the sun alone already hold the surface beyond: a heat to keep
    // it at least there needs none; no current brings a conductor down to it.
    let (at_limit, refused) = match (inverse, &src) {
        (Ok(v), _) => (Some(v), None),
        (Err(_), joule::Source::Heat(_)) => (Some((0.0, None)), None),
        (Err(_), joule::Source::Current { .. }) => (
            None,
            Some("the surroundings and the sun alone hold the conductor above this limit: no current brings it down there".to_string()),
        ),
    };
    let made = Made {
        made: b.made,
        current: b.current,
        resistance: b.resistance,
        iterations: b.iterations,
        residual: b.residual,
        limit,
        at_limit,
        refused,
    };
    Ok((a, b.t_surface, made))
}

/// The heat flow (W, whole run or body), surface temperature and convective h of a body making
/// heat inside: what the sweeps need.
pub(crate) fn quick(
    s: &Scenario,
    stream: &Body,
    env: &Surroundings,
) -> Result<(f64, f64, f64), EngineError> {
    let surf = surface(s, stream, env);
    let b = joule::surface_temperature(&surf, &source(s)?)?;
    Ok((
        (b.loss.q_conv + b.loss.q_rad - surf.solar) * s.run(),
        b.t_surface,
        b.loss.h_conv,
    ))
}

/// The card of a body making heat inside: whether it holds the surface at the limit (a heat) or
/// keeps the conductor below it (a current), with the heat or current the limit allows.
pub(crate) fn verdict(s: &Scenario, ts: f64, m: &Made) -> Verdict {
    let per = if s.shape.is_sphere() {
        Dim::HeatFlow
    } else {
        Dim::HeatOutputPerLength
    };
    let conductor = s.current_given();
    // A hair of rounding at the limit itself is not a failure.
    let tol = 1e-9 * m.limit;
    let ok = if conductor {
        ts <= m.limit + tol
    } else {
        ts >= m.limit - tol
    };
    let summary = match (conductor, ok) {
        (false, true) => "The heat made keeps the surface at or above the temperature to keep.",
        (false, false) => "Not enough: the surface settles colder than the temperature to keep. The figures give the heat needed to keep it; insulating the line cuts that need (this mode takes the bare outer surface).",
        (true, true) => "The conductor stays at or below its temperature limit.",
        (true, false) => "The conductor runs hotter than its temperature limit. The figures give the current that brings it to the limit.",
    };
    let mut figures = vec![
        ("surface", ts, Dim::Temperature),
        (
            if conductor { "limit" } else { "to keep" },
            m.limit,
            Dim::Temperature,
        ),
        ("heat made", m.made, per),
    ];
    if let Some((q, amps)) = m.at_limit {
        if conductor {
            figures.push(("heat at the limit", q, per));
        } else {
            figures.push(("heat needed to keep it", q, per));
        }
        if let Some(i) = amps {
            figures.push(("current at the limit", i, Dim::Current));
        }
    }
    let mut summary = summary.to_string();
    if let Some(why) = &m.refused {
        summary.push_str(&format!(" At the limit, {why}."));
    }
    Verdict {
        id: "made",
        title: "Heat made inside",
        ok,
        summary,
        figures,
        thickness: None,
        caution: Some(MADE_CAUTION),
    }
}

/// Heat tracing, heaters and conductors are electrical work.
pub const MADE_CAUTION: &str = "Heat tracing, heaters and conductors are electrical installations: their design, protection, hazardous-area rating and installation follow local electrical codes, the maker's instructions and licensed practice. This balance takes the body as one temperature; a tracer or a conductor's core runs hotter than the surface.";

/// The working's step for the balance and the limit, in SI as the rest of the working.
pub(crate) fn step(s: &Scenario, ts: f64, m: &Made, w: &WorkingInputs) -> Step {
    let g = |v: f64| format_sig(v, 5);
    let per = if s.shape.is_sphere() { "W" } else { "W/m" };
    let made = match (m.current, m.resistance) {
        (Some(i), Some(r)) => format!(
            "heat made I²·R(Ts) = {}² × {} = {} {per}, R linear in temperature through the data sheet's {} Ω/m at {} K and {} Ω/m at {} K (the form of IEEE Std 738 and CIGRE TB 601)",
            g(i),
            g(r),
            g(m.made),
            g(s.r_low),
            g(s.t_r_low),
            g(s.r_high),
            g(s.t_r_high)
        ),
        _ => format!("heat made {} {per}", g(m.made)),
    };
    let limit = match (&m.at_limit, &m.refused) {
        (Some((q, Some(i))), _) => format!(
            "At the limit {} K every term is known: the current that brings the conductor there is I = √((q_conv + q_rad − q_sun)/R) = {} A ({} {per}).",
            g(m.limit),
            g(*i),
            g(*q)
        ),
        (Some((q, None)), _) => format!(
            "At {} K every term is known: the heat that holds the surface there is q_conv + q_rad − q_sun = {} {per}.",
            g(m.limit),
            g(*q)
        ),
        (None, Some(why)) => format!("At {} K: {why}.", g(m.limit)),
        (None, None) => String::new(),
    };
    Step {
        title: "Heat made inside (energy balance)",
        text: format!(
            "The body is taken as one temperature. Made + sun = convection + radiation: {made}, sun {} {per}; convection {} {per}, radiation {} {per} at Ts = {} K, solved with the bracketed solver in {} steps (residual {} {per}). {limit}",
            g(w.q_solar_unit),
            g(w.q_conv_unit),
            g(w.q_rad_unit),
            g(ts),
            m.iterations,
            g(m.residual)
        ),
    }
}
