//! The side-by-side table of correlations and the two plots. Everything shown comes from the
//! engine's `Outcome` (numbers) and `chart` (coordinates); this file only lays it out.

use leptos::prelude::*;

use crate::engine::chart;
use crate::engine::scenario::{Outcome, Shape};
use crate::engine::units::{format_sig, Dim, UnitChoice};

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
    // Reference-counted, not owned by the view that first asked: the plots are redrawn (and their
    // owners disposed) on every change, and an owned signal would go with the first of them.
    static PLOT_WIDTH: std::cell::OnceCell<ArcRwSignal<f64>> = const { std::cell::OnceCell::new() };
}

/// The plots' drawing width in SVG units: narrower on a phone, so that their 11–12 unit text
/// stays at least 11 px on screen where the plot is about 300 px wide. Reactive: a turn of the
/// phone or a resized window that crosses the width redraws the plots (and only then).
fn plot_width() -> f64 {
    PLOT_WIDTH
        .with(|c| {
            c.get_or_init(|| {
                let sig = ArcRwSignal::new(width_class());
                let on_resize = sig.clone();
                let _ = window_event_listener(leptos::ev::resize, move |_| {
                    let w = width_class();
                    if on_resize.get_untracked() != w {
                        on_resize.set(w);
                    }
                });
                sig
            })
            .clone()
        })
        .get()
}

/// Forced correlations side by side, natural convection and the blend below them (markup from
/// `markup::correlation_table`).
pub fn table(o: &Outcome, c: &UnitChoice) -> impl IntoView {
    view! { <div inner_html=super::markup::correlation_table(o, c)></div> }
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

/// The verdict cards' markup: touch, condensation, freezing, the run, insulated against bare,
/// and the card through the layers with its cross-section.
pub fn verdicts(o: &Outcome, c: &UnitChoice) -> String {
    let section = o.job.as_ref().map(|j| cross_section(j, c));
    super::markup::verdict_cards(o, c, section.as_deref())
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
) -> String {
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
    format!(r#"<figure class="plot" data-plot="{id}">{m}</figure>"#)
}

/// The plots against thickness (solved, with layers) and against stream speed, as markup.
pub fn sweeps(o: &Outcome, s: &crate::engine::scenario::Scenario, c: &UnitChoice) -> String {
    let mut out = Vec::new();
    if !o.thickness_sweep.is_empty() {
        let xs: Vec<f64> = o.thickness_sweep.iter().map(|p| p.0).collect();
        let outer = s.layer_t[s.layer_count.saturating_sub(1)];
        out.push(sweep_plot(
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
        ));
        out.push(sweep_plot(
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
        ));
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
    // Heat made inside fixes the loss: its curve against the speed would be flat.
    if !s.makes_heat() {
        out.push(sweep_plot(
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
        ));
    }
    if !o.yaw_sweep.is_empty() {
        let xs: Vec<f64> = o.yaw_sweep.iter().map(|p| p.0).collect();
        let caption = "against the wind's angle to the axis, 0° along it to 90° square across (Morgan's yaw factor).";
        // Heat made inside fixes the loss: what the angle moves is the surface.
        let (label, dim, marks, point, values): (_, _, _, _, Vec<f64>) = if s.makes_heat() {
            let v = o.yaw_sweep.iter().map(|p| p.2).collect();
            (
                "surface",
                Dim::Temperature,
                o.surface_marks.clone(),
                o.surface_temp,
                v,
            )
        } else {
            let v = o.yaw_sweep.iter().map(|p| p.1).collect();
            ("heat loss", Dim::HeatFlow, vec![], o.q_total, v)
        };
        out.push(sweep_plot(
            "yaw",
            format!(
                "{} {caption}",
                if s.makes_heat() {
                    "Surface temperature"
                } else {
                    "Heat loss"
                }
            ),
            "wind angle to the axis",
            Dim::Angle,
            &xs,
            Series { label, dim, values },
            Some((s.yaw, point)),
            marks,
            c,
        ));
    }
    // Where the surface moves with the wind (worked out, or set by heat made inside), its curve.
    if s.solved() || s.makes_heat() {
        out.push(sweep_plot(
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
        ));
    } else {
        out.push(sweep_plot(
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
        ));
    }
    out.concat()
}

/// A cross-section of the wall and its layers, drawn to scale (each ring at least 3 px so a thin
/// wall stays visible), with the temperature at each face: the SVG's markup.
fn cross_section(j: &crate::engine::scenario::JobResult, c: &UnitChoice) -> String {
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
    chart::svg::section_svg(&faces, &temps, c.get(Dim::Temperature))
}

/// Now, on the device's clock, with its offset from UTC, for a printed page:
/// "2026-12-05 11:05 (UTC+01:00)".
pub(super) fn now_local() -> String {
    let d = js_sys::Date::new_0();
    // getTimezoneOffset is minutes west of UTC: −60 in Central Europe in winter.
    let east = -(d.get_timezone_offset() as i32);
    format!(
        "{}-{:02}-{:02} {:02}:{:02} (UTC{}{:02}:{:02})",
        d.get_full_year(),
        d.get_month() + 1,
        d.get_date(),
        d.get_hours(),
        d.get_minutes(),
        if east < 0 { '−' } else { '+' },
        east.abs() / 60,
        east.abs() % 60
    )
}

/// The one-page report, shown only when printing: inputs in use, results, flags, verdicts, the
/// working's key steps, sources, cautions, the date, the item tag and location (markup from
/// `markup::report`; the person's name, tag and location are escaped there).
pub fn report(
    o: &Outcome,
    s: &crate::engine::scenario::Scenario,
    c: &UnitChoice,
    name: &str,
    tag: &str,
    place: &str,
) -> impl IntoView {
    let date = now_local();
    let m = super::markup::report(
        o,
        s,
        c,
        &super::markup::Item {
            name,
            tag,
            place,
            date: &date,
        },
    );
    view! { <article class="report" data-report inner_html=m></article> }
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
    view! { <div inner_html=super::markup::property_table(o, c)></div> }
}
