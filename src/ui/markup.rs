//! The result views that never take a tap (verdict cards, the correlations table, the property
//! table) written as markup strings and set in one step, as the plots are: one parse by the
//! browser per redraw instead of a call across the wasm boundary per element, and one small
//! writer in the wasm instead of a view per element. Plain functions over the engine's `Outcome`:
//! they compute nothing, and every text passes through `esc` (none of it is the person's text
//! anyway: names, summaries and messages are the engine's own).

use std::fmt::Write;

use crate::engine::catalogue::order_text;
use crate::engine::chart::svg::esc;
use crate::engine::outdoors::irradiance::Irradiance;
use crate::engine::scenario::{JobResult, Outcome};
use crate::engine::units::{format_sig, show, Dim, UnitChoice};

fn u(v: f64, d: Dim, c: &UnitChoice) -> String {
    esc(&show(v, c.get(d)))
}

fn mark(ok: bool) -> &'static str {
    if ok {
        "✓ "
    } else {
        "⚠ "
    }
}

/// The verdict cards (touch, condensation, freezing, the run, insulated against bare), then the
/// card through the layers with `section` (the cross-section's SVG) when the surface was solved.
pub fn verdict_cards(o: &Outcome, c: &UnitChoice, section: Option<&str>) -> String {
    let mut m = String::with_capacity(4096);
    for v in &o.verdicts {
        let _ = write!(
            m,
            r#"<article class="verdict{}" data-verdict="{}" data-ok="{}"><h3>{}{}</h3><p>{}</p>"#,
            if v.ok { "" } else { " warn" },
            esc(v.id),
            v.ok,
            mark(v.ok),
            esc(v.title),
            esc(&v.summary)
        );
        if let Some(th) = v.thickness {
            let _ = write!(
                m,
                r#"<p class="order" data-order>The outer layer <strong>{}</strong>.</p>"#,
                esc(&order_text(th, c.get(Dim::Length), v.ok))
            );
        }
        m.push_str("<ul>");
        for (label, value, dim) in &v.figures {
            let _ = write!(
                m,
                "<li><span>{}: </span><strong>{}</strong></li>",
                esc(label),
                u(*value, *dim, c)
            );
        }
        m.push_str("</ul>");
        if let Some(t) = v.caution {
            let _ = write!(m, r#"<p class="caution-note">{}</p>"#, esc(t));
        }
        m.push_str("</article>");
    }
    if let (Some(j), Some(svg)) = (o.job.as_ref(), section) {
        layers_card(&mut m, j, c, svg);
    }
    m
}

fn layers_card(m: &mut String, j: &JobResult, c: &UnitChoice, svg: &str) {
    let _ = write!(
        m,
        r#"<article class="verdict" data-verdict="layers"><h3>Through the layers</h3><div class="section-box">{svg}</div><ul><li>bore: {}</li>"#,
        u(j.solution.t_bore, Dim::Temperature, c)
    );
    for (i, t) in j.solution.interfaces.iter().enumerate() {
        let name = if i == 0 {
            "outside of the wall".to_string()
        } else {
            format!("outside of layer {i}")
        };
        let _ = write!(m, "<li>{name}: {}</li>", u(*t, Dim::Temperature, c));
    }
    let _ = write!(
        m,
        "<li>outer diameter: {}</li></ul>",
        u(j.solution.outer_d, Dim::Length, c)
    );
    for n in &j.notes {
        let _ = write!(m, r#"<p class="flag">⚠ {}</p>"#, esc(n));
    }
    m.push_str("</article>");
}

/// Forced correlations side by side (the recommended one marked, a handover's shares said),
/// natural convection and the blend below them.
pub fn correlation_table(o: &Outcome, c: &UnitChoice) -> String {
    let a = &o.analysis;
    let mut m = String::with_capacity(4096);
    m.push_str(r#"<div class="table-wrap" tabindex="0" role="region" aria-label="Correlations side by side (scrolls sideways)"><table class="corr" data-table="correlations"><caption class="sr-only">Every correlation for this shape, each at its own reference temperature</caption><thead><tr><th scope="col">Correlation</th><th scope="col">Properties at</th><th scope="col">Re</th><th scope="col">Nu</th><th scope="col">h</th><th scope="col">Range</th></tr></thead><tbody>"#);
    let flags_list = |m: &mut String, flags: &[crate::engine::Flag]| {
        m.push_str(r#"<ul class="row-flags">"#);
        for f in flags {
            let _ = write!(m, "<li>{}</li>", esc(&f.message()));
        }
        m.push_str("</ul>");
    };
    for (i, e) in a.forced.iter().enumerate() {
        let rec = i == a.recommended;
        let share = a.pick.weights.get(i).copied().unwrap_or(0.0);
        let status = if !e.valid() {
            "outside its range"
        } else if e.flags.is_empty() {
            "in range"
        } else {
            "near a band edge"
        };
        let _ = write!(
            m,
            r#"<tr{} data-correlation="{}" data-h="{}" data-valid="{}"><th scope="row">{}"#,
            if rec { r#" class="recommended""# } else { "" },
            esc(e.id),
            e.h,
            e.valid(),
            esc(e.name)
        );
        if rec {
            m.push_str(r#"<span class="rec-mark"> ★ recommended</span>"#);
        }
        if share > 0.0 && share < 1.0 {
            let _ = write!(
                m,
                r#"<small class="detail">{} % of the recommended value (handover)</small>"#,
                format_sig(100.0 * share, 2)
            );
        }
        if let Some(d) = e.detail() {
            let _ = write!(m, r#"<small class="detail">{}</small>"#, esc(&d));
        }
        let _ = write!(
            m,
            r#"</th><td data-label="Properties at">{}</td><td data-label="Re">{}</td><td data-label="Nu">{}</td><td data-label="h">{}</td><td data-label="Range"{}>{}{status}"#,
            esc(e.reference.short()),
            format_sig(e.groups.re, 3),
            format_sig(e.nu, 3),
            u(e.h, Dim::HeatTransferCoefficient, c),
            if e.valid() { "" } else { r#" class="warn""# },
            mark(e.valid())
        );
        flags_list(&mut m, &e.flags);
        m.push_str("</td></tr>");
    }
    m.push_str(r#"</tbody><tbody class="extra">"#);
    if let Some(n) = a.natural.as_ref() {
        let ok = n.flags.is_empty();
        let _ = write!(
            m,
            r#"<tr data-correlation="{}" data-h="{}"><th scope="row">{} (still fluid)</th><td data-label="Properties at">Tf</td><td data-label="Ra">{}</td><td data-label="Nu">{}</td><td data-label="h">{}</td><td data-label="Range"{}>{}"#,
            esc(n.id),
            n.h,
            esc(n.name),
            format_sig(n.ra, 3),
            format_sig(n.nu, 3),
            u(n.h, Dim::HeatTransferCoefficient, c),
            if ok { "" } else { r#" class="warn""# },
            if ok { "✓ in range" } else { "⚠ see note" }
        );
        flags_list(&mut m, &n.flags);
        m.push_str("</td></tr>");
        let _ = write!(
            m,
            r#"<tr class="answer" data-correlation="mixed"><th scope="row">Blend of ★ and natural, n = {}</th><td class="empty">—</td><td class="empty">—</td><td data-label="Nu">{}</td><td data-label="h">{}</td><td data-label="Flow">{}</td></tr>"#,
            format_sig(a.exponent, 2),
            format_sig(o.nusselt, 3),
            u(a.h, Dim::HeatTransferCoefficient, c),
            esc(a.direction.describe())
        );
    }
    m.push_str("</tbody></table></div>");
    m
}

/// The stream's properties at each temperature the correlations read them, with their sources.
pub fn property_table(o: &Outcome, c: &UnitChoice) -> String {
    let mut m = String::with_capacity(2048);
    let _ = write!(
        m,
        r#"<table class="props" data-props><caption>Properties of {} used</caption><thead><tr><th scope="col">at</th><th scope="col">ρ</th><th scope="col">μ</th><th scope="col">k</th><th scope="col">cp</th><th scope="col">Pr</th></tr></thead><tbody>"#,
        esc(&o.fluid.to_string())
    );
    for r in &o.properties {
        let p = &r.props;
        let _ = write!(
            m,
            r#"<tr data-prop-row="{}"><th scope="row">{}<br>{}</th><td data-label="ρ">{}</td><td data-label="μ">{}</td><td data-label="k">{}</td><td data-label="cp">{}</td><td data-label="Pr">{}</td></tr>"#,
            esc(r.role),
            esc(r.role),
            u(p.t, Dim::Temperature, c),
            u(p.rho, Dim::Density, c),
            u(p.mu, Dim::DynamicViscosity, c),
            u(p.k, Dim::ThermalConductivity, c),
            u(p.cp, Dim::SpecificHeat, c),
            format_sig(p.pr, 3)
        );
    }
    let _ = write!(
        m,
        r#"</tbody></table><p class="sources">{}</p>"#,
        esc(&o.property_sources())
    );
    m
}

/// Who and when a report is for: the person's own words, escaped where they are written.
pub struct Item<'a> {
    pub name: &'a str,
    pub tag: &'a str,
    pub place: &'a str,
    /// "2026-12-05 11:05 (UTC+01:00)": the device's clock and its offset.
    pub date: &'a str,
}

/// The one-page report's content: results, the inputs the item uses (a third k point left at 0
/// is not one of them), range notes, verdicts with the thickness that meets each limit, the
/// working's key steps, sources and cautions (each once).
pub fn report(
    o: &Outcome,
    s: &crate::engine::scenario::Scenario,
    c: &UnitChoice,
    item: &Item,
) -> String {
    use crate::engine::scenario::{cautions, Group, FIELDS};
    let mut m = String::with_capacity(8192);
    let name = item.name.trim();
    let _ = write!(
        m,
        r#"<h1>{}</h1><p class="meta">{} · item {} · {}</p><p class="meta">{}, {} in {}; recommended {} ({}).</p><h2>Results</h2><dl class="kv results">"#,
        if name.is_empty() {
            "Leeward report".to_string()
        } else {
            format!("Leeward report: {}", esc(name))
        },
        esc(item.date),
        if item.tag.is_empty() {
            "—".to_string()
        } else {
            esc(item.tag)
        },
        if item.place.is_empty() {
            "location not given".to_string()
        } else {
            esc(item.place)
        },
        esc(o.shape.label()),
        esc(&o.analysis.mode().to_string()),
        esc(&o.fluid.to_string()),
        esc(&o.method.to_string()),
        esc(&o.regime.to_string())
    );
    let kv = |m: &mut String, k: &str, v: String| {
        let _ = write!(m, "<div><dt>{}</dt><dd>{v}</dd></div>", esc(k));
    };
    if let Some(q) = o.q_per_length {
        kv(
            &mut m,
            "Heat loss per length",
            u(q, Dim::HeatFlowPerLength, c),
        );
    }
    kv(
        &mut m,
        "Heat loss over the length or body",
        u(o.q_total, Dim::HeatFlow, c),
    );
    kv(
        &mut m,
        "Surface temperature",
        u(o.surface_temp, Dim::Temperature, c),
    );
    kv(
        &mut m,
        "Heat-transfer coefficient (convection)",
        u(o.h, Dim::HeatTransferCoefficient, c),
    );
    kv(&mut m, "Radiation part", u(o.q_rad_total, Dim::HeatFlow, c));
    kv(
        &mut m,
        "Energy bought per year",
        u(o.annual_energy, Dim::EnergyPerYear, c),
    );
    kv(
        &mut m,
        "Cost per year",
        u(o.annual_cost, Dim::MoneyPerYear, c),
    );
    m.push_str(r#"</dl><h2>Inputs used</h2><dl class="kv">"#);
    let curved = FIELDS.iter().any(|sp| {
        sp.group == Group::LayerCurve
            && sp.dim != Dim::Temperature
            && s.uses(sp.field)
            && s.get(sp.field) > 0.0
    });
    for sp in FIELDS.iter().filter(|sp| s.uses(sp.field)).filter(|sp| {
        sp.group != Group::LayerCurve
            || (curved && (sp.dim == Dim::Temperature || s.get(sp.field) > 0.0))
    }) {
        kv(&mut m, sp.label, u(s.get(sp.field), sp.dim, c));
    }
    // The sun's instant and atmosphere are not table fields: written here when they are used.
    if s.outdoors() && s.sun_input == crate::engine::scenario::SunInput::Place {
        if let Some(when) = crate::engine::outdoors::sun::Utc::minute_text(s.sun_time) {
            kv(&mut m, "Date and time of the clear sky", when);
        }
        kv(&mut m, "Clear-sky atmosphere", s.climate.name().to_string());
    }
    m.push_str("</dl><h2>Range notes</h2>");
    if o.flags.is_empty() {
        m.push_str(
            r#"<p class="meta">None: every method used is inside its published range here.</p>"#,
        );
    }
    m.push_str("<ul>");
    for f in &o.flags {
        let _ = write!(m, "<li>{}</li>", esc(&f.message()));
    }
    m.push_str("</ul><h2>Verdicts</h2><ul>");
    for v in &o.verdicts {
        let mut figs: Vec<String> = v
            .figures
            .iter()
            .map(|(l, x, d)| format!("{l}: {}", show(*x, c.get(*d))))
            .collect();
        if let Some(th) = v.thickness {
            figs.push(format!(
                "outer layer {}",
                order_text(th, c.get(Dim::Length), v.ok)
            ));
        }
        let _ = write!(
            m,
            "<li><strong>{}{}</strong>: {} {}</li>",
            mark(v.ok),
            esc(v.title),
            esc(&v.summary),
            esc(&figs.join("; "))
        );
    }
    m.push_str("</ul><h2>Working (summary)</h2><ol>");
    for st in o.working.iter().filter(|st| st.is_key()) {
        let _ = write!(
            m,
            "<li><strong>{}</strong>: {}</li>",
            esc(st.title),
            esc(&st.text)
        );
    }
    let _ = write!(
        m,
        r#"</ol><p class="meta">Property sources: {}. Correlations of this kind are good to about ±20–25 % (common practice).</p><h2>Cautions</h2><ul>"#,
        esc(&o.property_sources())
    );
    // Each caution once, in the order the page gives them.
    let mut all: Vec<&str> = Vec::new();
    for t in cautions(s, o)
        .into_iter()
        .chain(o.verdicts.iter().filter_map(|v| v.caution))
    {
        if !all.contains(&t) {
            all.push(t);
        }
    }
    for t in all {
        let _ = write!(m, "<li>{}</li>", esc(t));
    }
    m.push_str(r#"</ul><p class="meta">Engineering estimates from published correlations. Local codes and licensed practice govern any decision about safety.</p>"#);
    m
}

/// One result as `<div><dt>label</dt><dd><output data-quantity data-si>…</output> unit</dd></div>`:
/// `data-si` the value as computed (full precision), the text at its unit's resolution. A value
/// that does not apply keeps its element, hidden, with an empty `data-si`.
fn figure(
    m: &mut String,
    label: &str,
    quantity: &str,
    v: Option<f64>,
    d: Option<Dim>,
    c: &UnitChoice,
    note: &str,
) {
    let (text, unit) = match (v, d) {
        (Some(v), Some(d)) => {
            let (t, u) = crate::engine::units::shown(v, c.get(d));
            (t, u)
        }
        (Some(v), None) => (format_sig(v, 3), ""),
        (None, _) => ("—".to_string(), ""),
    };
    let _ = write!(
        m,
        r#"<div{}><dt>{}</dt><dd><output data-quantity="{quantity}" data-si="{}">{}</output><span class="unit">{}</span>{note}</dd></div>"#,
        match (v.is_some(), quantity) {
            (false, _) => r#" class="hidden""#,
            // the answer's coefficient spans the row, as the loss and surface above it do
            (true, "h") => r#" class="main""#,
            _ => "",
        },
        esc(label),
        v.map(|v| format!("{v}")).unwrap_or_default(),
        esc(&text),
        esc(unit)
    );
}

/// The results below the answer (the parts of the loss, energy and cost, h and its groups, the
/// outdoor and inside-film figures where they apply), then the range notes; `run` says the
/// length the yearly totals are over (" (over L = 12 m)", or "" for a body).
pub fn figures(o: &Outcome, c: &UnitChoice, run: &str) -> String {
    let mut m = String::with_capacity(4096);
    let n = o.flags.len();
    let flag_mark = if n > 0 {
        format!(
            r#"<span class="flag-mark" data-flag-mark>⚠ {n} range note{} below</span>"#,
            if n == 1 { "" } else { "s" }
        )
    } else {
        String::new()
    };
    m.push_str(r#"<dl class="figures">"#);
    let t = Some(Dim::Temperature);
    figure(
        &mut m,
        "By convection",
        "q_conv",
        Some(o.q_conv_total),
        Some(Dim::HeatFlow),
        c,
        "",
    );
    figure(
        &mut m,
        "By radiation",
        "q_rad",
        Some(o.q_rad_total),
        Some(Dim::HeatFlow),
        c,
        "",
    );
    figure(
        &mut m,
        "Radiation coefficient h_rad",
        "h_rad",
        Some(o.h_rad),
        Some(Dim::HeatTransferCoefficient),
        c,
        "",
    );
    figure(
        &mut m,
        &format!("Energy bought per year{run}"),
        "annual_energy",
        Some(o.annual_energy),
        Some(Dim::EnergyPerYear),
        c,
        "",
    );
    figure(
        &mut m,
        &format!("Cost per year{run}"),
        "annual_cost",
        Some(o.annual_cost),
        Some(Dim::MoneyPerYear),
        c,
        "",
    );
    figure(
        &mut m,
        "Heat-transfer coefficient h (convection)",
        "h",
        Some(o.h),
        Some(Dim::HeatTransferCoefficient),
        c,
        &flag_mark,
    );
    figure(
        &mut m,
        "Nusselt number Nu = h·D/k",
        "nusselt",
        Some(o.nusselt),
        None,
        c,
        "",
    );
    figure(
        &mut m,
        "Reynolds number Re (★)",
        "reynolds",
        Some(o.reynolds),
        None,
        c,
        "",
    );
    figure(
        &mut m,
        "Prandtl number Pr (★)",
        "prandtl",
        Some(o.prandtl),
        None,
        c,
        "",
    );
    figure(
        &mut m,
        "Film temperature",
        "film_temperature",
        Some(o.film_temp),
        t,
        c,
        "",
    );
    figure(
        &mut m,
        "Pressure used",
        "pressure",
        Some(o.pressure),
        Some(Dim::Pressure),
        c,
        "",
    );
    figure(
        &mut m,
        "Sky temperature",
        "sky_temperature",
        o.sky_temp,
        t,
        c,
        "",
    );
    figure(
        &mut m,
        "Sky and ground together (radiant)",
        "radiant_temperature",
        o.radiant_temp,
        t,
        c,
        "",
    );
    figure(
        &mut m,
        "Sun's elevation (below 0: under the horizon)",
        "sun_elevation",
        o.sun_elevation,
        Some(Dim::Angle),
        c,
        "",
    );
    let sky = |f: fn(&Irradiance) -> f64| o.sunlight.as_ref().map(f);
    figure(
        &mut m,
        "Clear-sky beam facing the sun",
        "clear_beam",
        sky(|g| g.beam_normal),
        Some(Dim::HeatFlux),
        c,
        "",
    );
    figure(
        &mut m,
        "Clear-sky diffuse, level ground",
        "clear_diffuse",
        sky(|g| g.diffuse_horizontal),
        Some(Dim::HeatFlux),
        c,
        "",
    );
    figure(
        &mut m,
        "Clear-sky global, level ground",
        "clear_global",
        sky(|g| g.global_horizontal),
        Some(Dim::HeatFlux),
        c,
        "",
    );
    figure(
        &mut m,
        "Sun absorbed per length",
        "solar_per_length",
        o.solar_per_length,
        Some(Dim::HeatFlowPerLength),
        c,
        "",
    );
    figure(
        &mut m,
        &format!("Sun absorbed{run}"),
        "solar_total",
        o.solar_total,
        Some(Dim::HeatFlow),
        c,
        "",
    );
    figure(
        &mut m,
        "Wind at the body",
        "wind_at_body",
        o.wind_at_body,
        Some(Dim::Speed),
        c,
        "",
    );
    figure(
        &mut m,
        "Wind-angle factor on forced convection",
        "yaw_factor",
        o.yaw_factor,
        None,
        c,
        "",
    );
    figure(
        &mut m,
        "Dew point of the stream",
        "dew_point",
        o.dew_point,
        t,
        c,
        "",
    );
    let inside = o.inside.as_ref();
    figure(
        &mut m,
        "Inside film h_i (worked out)",
        "h_inside",
        inside.map(|f| f.h),
        Some(Dim::HeatTransferCoefficient),
        c,
        &flag_mark,
    );
    figure(
        &mut m,
        "Reynolds number in the bore",
        "re_inside",
        inside.map(|f| f.re),
        None,
        c,
        "",
    );
    m.push_str("</dl>");
    m
}

#[cfg(test)]
#[path = "markup_tests.rs"]
mod tests;
