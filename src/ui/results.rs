//! The side-by-side table of correlations and the two plots. Everything shown comes from the
//! engine's `Outcome` (numbers) and `chart` (coordinates); this file only lays it out.

use leptos::prelude::*;

use crate::engine::chart;
use crate::engine::scenario::{Outcome, Shape};
use crate::engine::units::{format_sig, Dim, UnitChoice};

fn with_unit(v: f64, d: Dim, c: &UnitChoice) -> String {
    crate::engine::units::show(v, c.get(d))
}

fn width_class() -> f64 {
    let w = window()
        .inner_width()
        .ok()
        .and_then(|v| v.as_f64())
        .unwrap_or(1024.0);
    if w < 560.0 {
        320.0
    } else {
        480.0
    }
}

thread_local! {
    static PLOT_WIDTH: std::cell::OnceCell<RwSignal<f64>> = const { std::cell::OnceCell::new() };
}

/// The plots' drawing width in SVG units: narrower on a phone, so that their 11–12 unit text
/// stays at least 11 px on screen where the plot is about 300 px wide. Reactive: a turn of the
/// phone or a resized window that crosses the width redraws the plots (and only then).
fn plot_width() -> f64 {
    PLOT_WIDTH
        .with(|c| {
            *c.get_or_init(|| {
                let sig = RwSignal::new(width_class());
                let _ = window_event_listener(leptos::ev::resize, move |_| {
                    let w = width_class();
                    if sig.get_untracked() != w {
                        sig.set(w);
                    }
                });
                sig
            })
        })
        .get()
}

/// Forced correlations side by side, natural convection and the blend below them.
pub fn table(o: &Outcome, c: &UnitChoice) -> impl IntoView {
    let a = &o.analysis;
    let rows = a
        .forced
        .iter()
        .enumerate()
        .map(|(i, e)| {
            let rec = i == a.recommended;
            let share = a.pick.weights.get(i).copied().unwrap_or(0.0);
            let note = (share > 0.0 && share < 1.0).then(|| format!("{} % of the recommended value (handover)", format_sig(100.0 * share, 2)));
            let flags = e.flags.iter().map(|f| view! { <li>{f.message()}</li> }).collect_view();
            let status = if !e.valid() {
                "outside its range"
            } else if e.flags.is_empty() {
                "in range"
            } else {
                "near a band edge"
            };
            view! {
                <tr class:recommended=rec data-correlation=e.id data-h=format!("{}", e.h) data-valid=e.valid().to_string()>
                    <th scope="row">{e.name}{rec.then_some(view! { <span class="rec-mark">" ★ recommended"</span> })}{note.map(|t| view! { <small class="detail">{t}</small> })}
                        {e.detail().map(|d| view! { <small class="detail">{d}</small> })}</th>
                    <td data-label="Properties at">{e.reference.short()}</td>
                    <td data-label="Re">{format_sig(e.groups.re, 3)}</td>
                    <td data-label="Nu">{format_sig(e.nu, 3)}</td>
                    <td data-label="h">{with_unit(e.h, Dim::HeatTransferCoefficient, c)}</td>
                    <td data-label="Range" class:warn=!e.valid()>{if e.valid() { "✓ " } else { "⚠ " }}{status}<ul class="row-flags">{flags}</ul></td>
                </tr>
            }
        })
        .collect_view();
    let natural = a.natural.as_ref().map(|n| {
        let flags = n.flags.iter().map(|f| view! { <li>{f.message()}</li> }).collect_view();
        let ok = n.flags.is_empty();
        view! {
            <tr data-correlation=n.id data-h=format!("{}", n.h)>
                <th scope="row">{n.name}" (still fluid)"</th>
                <td data-label="Properties at">"Tf"</td>
                <td data-label="Ra">{format_sig(n.ra, 3)}</td>
                <td data-label="Nu">{format_sig(n.nu, 3)}</td>
                <td data-label="h">{with_unit(n.h, Dim::HeatTransferCoefficient, c)}</td>
                <td data-label="Range" class:warn=!ok>{if ok { "✓ in range" } else { "⚠ see note" }}<ul class="row-flags">{flags}</ul></td>
            </tr>
        }
    });
    let blend = a.natural.as_ref().map(|_| {
        view! {
            <tr class="answer" data-correlation="mixed">
                <th scope="row">{format!("Blend of ★ and natural, n = {}", format_sig(a.exponent, 2))}</th>
                <td class="empty">"—"</td>
                <td class="empty">"—"</td>
                <td data-label="Nu">{format_sig(o.nusselt, 3)}</td>
                <td data-label="h">{with_unit(a.h, Dim::HeatTransferCoefficient, c)}</td>
                <td data-label="Flow">{a.direction.describe()}</td>
            </tr>
        }
    });
    view! {
        <div class="table-wrap" tabindex="0" role="region" aria-label="Correlations side by side (scrolls sideways)">
            <table class="corr" data-table="correlations">
                <caption class="sr-only">"Every correlation for this shape, each at its own reference temperature"</caption>
                <thead><tr>
                    <th scope="col">"Correlation"</th><th scope="col">"Properties at"</th>
                    <th scope="col">"Re"</th><th scope="col">"Nu"</th><th scope="col">"h"</th><th scope="col">"Range"</th>
                </tr></thead>
                <tbody>{rows}</tbody>
                <tbody class="extra">{natural}{blend}</tbody>
            </table>
        </div>
    }
}

/// The Nu–Re plot of every correlation for the shape, operating points marked (markup written by
/// the engine's `chart::svg`, set in one step).
pub fn nu_re_plot(o: &Outcome) -> impl IntoView {
    let m = chart::svg::nu_re_figure(o.shape, &o.analysis, plot_width());
    view! { <figure class="plot" data-plot="nu-re" inner_html=m></figure> }
}

/// Local Nu over the front of a cylinder with the separation point marked.
pub fn front_plot(o: &Outcome) -> Option<AnyView> {
    if o.shape != Shape::Cylinder {
        return None;
    }
    let m = chart::svg::front_figure(
        o.analysis.forced[0].groups.re,
        o.analysis.film.pr,
        plot_width(),
    )?;
    Some(view! { <figure class="plot" data-plot="front" inner_html=m></figure> }.into_any())
}

/// The verdict cards: touch, condensation, freezing, the run, insulated against bare.
pub fn verdicts(o: &Outcome, c: &UnitChoice) -> impl IntoView {
    let cards = o
        .verdicts
        .iter()
        .map(|v| {
            let figs = v
                .figures
                .iter()
                .map(|(label, value, dim)| view! { <li><span>{*label}": "</span><strong>{with_unit(*value, *dim, c)}</strong></li> })
                .collect_view();
            view! {
                <article class="verdict" class:warn=!v.ok data-verdict=v.id data-ok=v.ok.to_string()>
                    <h3>{if v.ok { "✓ " } else { "⚠ " }}{v.title}</h3>
                    <p>{v.summary.clone()}</p>
                    {v.thickness.map(|th| view! { <p class="order" data-order>"The outer layer "<strong>{crate::engine::catalogue::order_text(th, c.get(Dim::Length))}</strong>"."</p> })}
                    <ul>{figs}</ul>
                    {v.caution.map(|t| view! { <p class="caution-note">{t}</p> })}
                </article>
            }
        })
        .collect_view();
    let layers = o.job.as_ref().map(|j| {
        let temps = j
            .solution
            .interfaces
            .iter()
            .enumerate()
            .map(|(i, t)| {
                let name = if i == 0 { "outside of the wall".to_string() } else { format!("outside of layer {i}") };
                view! { <li>{name}": "{with_unit(*t, Dim::Temperature, c)}</li> }
            })
            .collect_view();
        let notes = j.notes.iter().map(|n| view! { <p class="flag">"⚠ "{n.clone()}</p> }).collect_view();
        let section = cross_section(j, c);
        view! {
            <article class="verdict" data-verdict="layers">
                <h3>"Through the layers"</h3>
                {section}
                <ul>
                    <li>"bore: "{with_unit(j.solution.t_bore, Dim::Temperature, c)}</li>
                    {temps}
                    <li>{format!("outer diameter: {}", with_unit(j.solution.outer_d, Dim::Length, c))}</li>
                </ul>
                {notes}
            </article>
        }
    });
    view! { {cards}{layers} }
}

/// One swept series: label, dimension, values (SI).
struct Series {
    label: &'static str,
    dim: Dim,
    values: Vec<f64>,
}

/// A line plot of one series against a swept input, with the operating point, target lines and
/// the numbers as a table for screen readers (markup written by the engine's `chart::svg`).
#[allow(clippy::too_many_arguments)]
fn sweep_plot(
    id: &'static str,
    title: String,
    x_label: &'static str,
    x_dim: Dim,
    xs: &[f64],
    y: Series,
    point: Option<(f64, f64)>,
    targets: Vec<(&'static str, f64)>,
    c: &UnitChoice,
) -> impl IntoView {
    let m = chart::svg::sweep_figure(&chart::svg::Sweep {
        id,
        title: &title,
        x_label,
        x_unit: c.get(x_dim),
        y_label: y.label,
        y_unit: c.get(y.dim),
        xs,
        ys: &y.values,
        point,
        targets: &targets,
        width: plot_width(),
    });
    view! { <figure class="plot" data-plot=id inner_html=m></figure> }
}

/// The plots against thickness (solved, with layers) and against stream speed.
pub fn sweeps(o: &Outcome, s: &crate::engine::scenario::Scenario, c: &UnitChoice) -> impl IntoView {
    let mut out = Vec::new();
    if !o.thickness_sweep.is_empty() {
        let xs: Vec<f64> = o.thickness_sweep.iter().map(|p| p.0).collect();
        let outer = s.layer_t[s.layer_count.saturating_sub(1)];
        out.push(
            sweep_plot(
                "loss-thickness",
                "Heat loss against the outer layer's thickness.".into(),
                "outer layer thickness",
                Dim::Length,
                &xs,
                Series {
                    label: "heat loss",
                    dim: Dim::HeatFlow,
                    values: o.thickness_sweep.iter().map(|p| p.1).collect(),
                },
                Some((outer, o.q_total)),
                o.loss_marks.clone(),
                c,
            )
            .into_any(),
        );
        out.push(
            sweep_plot(
                "surface-thickness",
                "Surface temperature against the outer layer's thickness.".into(),
                "outer layer thickness",
                Dim::Length,
                &xs,
                Series {
                    label: "surface",
                    dim: Dim::Temperature,
                    values: o.thickness_sweep.iter().map(|p| p.2).collect(),
                },
                Some((outer, o.surface_temp)),
                o.surface_marks.clone(),
                c,
            )
            .into_any(),
        );
    }
    let xs: Vec<f64> = o.wind_sweep.iter().map(|p| p.0).collect();
    // The sweep's span in the speed unit the person reads.
    let span = {
        let u = c.get(Dim::Speed);
        let (lo, hi) = (
            xs.first().copied().unwrap_or(0.0),
            xs.last().copied().unwrap_or(0.0),
        );
        format!(
            "{}–{} {}",
            crate::engine::units::format_value(u.from_si(lo), u),
            crate::engine::units::format_value(u.from_si(hi), u),
            u.symbol
        )
    };
    out.push(
        sweep_plot(
            "loss-wind",
            format!("Heat loss against stream speed, {span}."),
            "stream speed",
            Dim::Speed,
            &xs,
            Series {
                label: "heat loss",
                dim: Dim::HeatFlow,
                values: o.wind_sweep.iter().map(|p| p.2).collect(),
            },
            Some((s.speed, o.q_total)),
            vec![],
            c,
        )
        .into_any(),
    );
    if s.solved() {
        out.push(
            sweep_plot(
                "surface-wind",
                format!("Surface temperature against stream speed, {span}."),
                "stream speed",
                Dim::Speed,
                &xs,
                Series {
                    label: "surface",
                    dim: Dim::Temperature,
                    values: o.wind_sweep.iter().map(|p| p.3).collect(),
                },
                Some((s.speed, o.surface_temp)),
                o.surface_marks.clone(),
                c,
            )
            .into_any(),
        );
    } else {
        out.push(
            sweep_plot(
                "h-wind",
                format!("Convective coefficient against stream speed, {span}."),
                "stream speed",
                Dim::Speed,
                &xs,
                Series {
                    label: "h",
                    dim: Dim::HeatTransferCoefficient,
                    values: o.wind_sweep.iter().map(|p| p.1).collect(),
                },
                Some((s.speed, o.h)),
                vec![],
                c,
            )
            .into_any(),
        );
    }
    out.collect_view()
}

/// A cross-section of the wall and its layers, drawn to scale (each ring at least 3 px so a thin
/// wall stays visible), with the temperature at each face.
fn cross_section(j: &crate::engine::scenario::JobResult, c: &UnitChoice) -> impl IntoView {
    let sol = &j.solution;
    // Radii of every face from the bore out, in metres.
    let mut faces = vec![j.r_in];
    let mut r = j.r_in;
    for t in &j.thicknesses {
        r += t;
        faces.push(r);
    }
    let temps: Vec<f64> = std::iter::once(sol.t_bore)
        .chain(sol.interfaces.iter().copied())
        .collect();
    let m = chart::svg::section_svg(&faces, &temps, c.get(Dim::Temperature));
    view! { <div class="section-box" inner_html=m></div> }
}

/// The one-page report, shown only when printing: inputs in use, results, flags, verdicts, the
/// working's key steps, sources, cautions, the date, the item tag and location.
pub fn report(
    o: &Outcome,
    s: &crate::engine::scenario::Scenario,
    c: &UnitChoice,
    name: &str,
    tag: &str,
    place: &str,
) -> impl IntoView {
    use crate::engine::scenario::FIELDS;
    let date = js_sys::Date::new_0()
        .to_iso_string()
        .as_string()
        .unwrap_or_default();
    let date = date.get(..16).unwrap_or(&date).replace('T', " ");
    // The inputs the item uses; a third k point left at 0 (none) is not one of them.
    use crate::engine::scenario::Group;
    let curved = FIELDS.iter().any(|sp| {
        sp.group == Group::LayerCurve
            && sp.dim != Dim::Temperature
            && s.uses(sp.field)
            && s.get(sp.field) > 0.0
    });
    let inputs = FIELDS
        .iter()
        .filter(|sp| s.uses(sp.field))
        .filter(|sp| sp.group != Group::LayerCurve || (curved && (sp.dim == Dim::Temperature || s.get(sp.field) > 0.0)))
        .map(|sp| view! { <div><dt>{sp.label}</dt><dd>{with_unit(s.get(sp.field), sp.dim, c)}</dd></div> })
        .collect_view();
    let mut figures = vec![
        (
            "Heat loss over the length or body",
            with_unit(o.q_total, Dim::HeatFlow, c),
        ),
        (
            "Surface temperature",
            with_unit(o.surface_temp, Dim::Temperature, c),
        ),
        (
            "Heat-transfer coefficient (convection)",
            with_unit(o.h, Dim::HeatTransferCoefficient, c),
        ),
        ("Radiation part", with_unit(o.q_rad_total, Dim::HeatFlow, c)),
        (
            "Energy per year",
            with_unit(o.annual_energy, Dim::EnergyPerYear, c),
        ),
        (
            "Cost per year",
            with_unit(o.annual_cost, Dim::MoneyPerYear, c),
        ),
    ];
    if let Some(q) = o.q_per_length {
        figures.insert(
            0,
            (
                "Heat loss per length",
                with_unit(q, Dim::HeatFlowPerLength, c),
            ),
        );
    }
    let figures = figures
        .into_iter()
        .map(|(k, v)| view! { <div><dt>{k}</dt><dd>{v}</dd></div> })
        .collect_view();
    let flags = o
        .flags
        .iter()
        .map(|f| view! { <li>{f.message()}</li> })
        .collect_view();
    let verdicts = o
        .verdicts
        .iter()
        .map(|v| {
            let mut figs = v.figures.iter().map(|(l, x, d)| format!("{l}: {}", with_unit(*x, *d, c))).collect::<Vec<_>>();
            if let Some(th) = v.thickness {
                figs.push(format!("outer layer {}", crate::engine::catalogue::order_text(th, c.get(Dim::Length))));
            }
            let figs = figs.join("; ");
            view! { <li><strong>{if v.ok { "✓ " } else { "⚠ " }}{v.title}</strong>": "{v.summary.clone()}" "{figs}</li> }
        })
        .collect_view();
    let steps = o
        .working
        .iter()
        .filter(|st| st.is_key())
        .map(|st| view! { <li><strong>{st.title}</strong>": "{st.text.clone()}</li> })
        .collect_view();
    let sources = o.property_sources();
    let cautions = crate::engine::scenario::cautions(s, o)
        .into_iter()
        .chain(o.verdicts.iter().filter_map(|v| v.caution))
        .collect::<std::collections::BTreeSet<_>>()
        .into_iter()
        .map(|t| view! { <li>{t}</li> })
        .collect_view();
    view! {
        <article class="report" data-report>
            <h1>{if name.trim().is_empty() { "Leeward report".to_string() } else { format!("Leeward report: {}", name.trim()) }}</h1>
            <p class="meta">{format!("{date} UTC · item {} · {}", if tag.is_empty() { "—" } else { tag }, if place.is_empty() { "location not given" } else { place })}</p>
            <p class="meta">{format!("{}, {} in {}; recommended {} ({}).", o.shape.label(), o.analysis.mode(), o.fluid, o.method, o.regime)}</p>
            <h2>"Results"</h2><dl class="kv results">{figures}</dl>
            <h2>"Inputs used"</h2><dl class="kv">{inputs}</dl>
            <h2>"Range notes"</h2>
            {if o.flags.is_empty() { Some(view! { <p class="meta">"None: every method used is inside its published range here."</p> }) } else { None }}
            <ul>{flags}</ul>
            <h2>"Verdicts"</h2><ul>{verdicts}</ul>
            <h2>"Working (summary)"</h2><ol>{steps}</ol>
            <p class="meta">{format!("Property sources: {sources}. Correlations of this kind are good to about ±20–25 % (common practice).")}</p>
            <h2>"Cautions"</h2><ul>{cautions}</ul>
            <p class="meta">"Engineering estimates from published correlations. Local codes and licensed practice govern any decision about safety."</p>
        </article>
    }
}

/// The spread of the correlations inside their ranges and the usual uncertainty, in words.
pub fn spread_text(o: &Outcome, c: &UnitChoice) -> String {
    let u = c.get(Dim::HeatTransferCoefficient);
    let f = |v: f64| format_sig(u.from_si(v), 3);
    let total = o.analysis.forced.len();
    let band = match o.analysis.spread {
        Some((lo, hi, n)) if n > 1 => format!(
            "{n} of {total} forced correlations are inside their ranges here; they give h_F from {} to {} {}.",
            f(lo), f(hi), u.symbol
        ),
        Some(_) if total > 1 => format!("Only one of {total} forced correlations is inside its range here."),
        Some(_) => "One published correlation covers this shape.".to_string(),
        None => "No forced correlation is inside its range here: every value below is an extrapolation.".to_string(),
    };
    format!("{band} Correlations of this kind are good to about ±20–25 % (common practice).")
}

/// The properties used, at each temperature the correlations read them, with their sources.
pub fn property_table(o: &Outcome, c: &UnitChoice) -> impl IntoView {
    let cell = |v: f64, d: Dim| with_unit(v, d, c);
    let rows = o
        .properties
        .iter()
        .map(|r| {
            let p = &r.props;
            view! {
                <tr data-prop-row=r.role>
                    <th scope="row">{r.role}<br/>{cell(p.t, Dim::Temperature)}</th>
                    <td data-label="ρ">{cell(p.rho, Dim::Density)}</td>
                    <td data-label="μ">{cell(p.mu, Dim::DynamicViscosity)}</td>
                    <td data-label="k">{cell(p.k, Dim::ThermalConductivity)}</td>
                    <td data-label="cp">{cell(p.cp, Dim::SpecificHeat)}</td>
                    <td data-label="Pr">{format_sig(p.pr, 3)}</td>
                </tr>
            }
        })
        .collect_view();
    let sources = o.property_sources();
    view! {
        <table class="props" data-props>
            <caption>{format!("Properties of {} used", o.fluid)}</caption>
            <thead><tr><th scope="col">"at"</th><th scope="col">"ρ"</th><th scope="col">"μ"</th><th scope="col">"k"</th><th scope="col">"cp"</th><th scope="col">"Pr"</th></tr></thead>
            <tbody>{rows}</tbody>
        </table>
        <p class="sources">{sources}</p>
    }
}
