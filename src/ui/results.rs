//! The side-by-side table of correlations and the two plots. Everything shown comes from the
//! engine's `Outcome` (numbers) and `chart` (coordinates); this file only lays it out.

use leptos::prelude::*;

use crate::engine::chart;
use crate::engine::correlations::local;
use crate::engine::scenario::{Outcome, Shape};
use crate::engine::units::{format_sig, Dim, UnitChoice};

fn with_unit(v: f64, d: Dim, c: &UnitChoice) -> String {
    let u = c.get(d);
    format!("{} {}", format_sig(u.from_si(v), 4), u.symbol)
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
                    <th scope="row">{e.name}{rec.then_some(view! { <span class="rec-mark">" ★ recommended"</span> })}</th>
                    <td>{e.reference.short()}</td>
                    <td>{format_sig(e.groups.re, 4)}</td>
                    <td>{format_sig(e.nu, 4)}</td>
                    <td>{with_unit(e.h, Dim::HeatTransferCoefficient, c)}</td>
                    <td class:warn=!e.valid()>{if e.valid() { "✓ " } else { "⚠ " }}{status}<ul class="row-flags">{flags}</ul></td>
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
                <td>"Tf"</td>
                <td>{format!("Ra = {}", format_sig(n.ra, 4))}</td>
                <td>{format_sig(n.nu, 4)}</td>
                <td>{with_unit(n.h, Dim::HeatTransferCoefficient, c)}</td>
                <td class:warn=!ok>{if ok { "✓ in range" } else { "⚠ see note" }}<ul class="row-flags">{flags}</ul></td>
            </tr>
        }
    });
    let blend = a.natural.as_ref().map(|_| {
        view! {
            <tr class="answer" data-correlation="mixed">
                <th scope="row">{format!("Blend of ★ and natural, n = {}", format_sig(a.exponent, 2))}</th>
                <td>"—"</td>
                <td>"—"</td>
                <td>{format_sig(o.nusselt, 4)}</td>
                <td>{with_unit(a.h, Dim::HeatTransferCoefficient, c)}</td>
                <td>{a.direction.describe()}</td>
            </tr>
        }
    });
    view! {
        <div class="table-wrap">
            <table class="corr" data-table="correlations">
                <caption>"Every correlation for this shape, each at its own reference temperature"</caption>
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

/// The Nu–Re plot of every correlation for the shape, operating points marked.
pub fn nu_re_plot(o: &Outcome) -> impl IntoView {
    let (w, h) = (480.0, 300.0);
    let (frame, curves) = chart::nu_re(o.shape, &o.analysis, w, h);
    let (l, r, t, b) = frame.margin;
    let xt = frame
        .x_ticks(1.0)
        .into_iter()
        .map(|(x, s)| {
            view! {
                <line x1=x y1=t x2=x y2={h - b} class="grid"/>
                <text x=x y={h - b + 16.0} class="tick" text-anchor="middle">{s}</text>
            }
        })
        .collect_view();
    let yt = frame
        .y_ticks(1.0)
        .into_iter()
        .map(|(y, s)| {
            view! {
                <line x1=l y1=y x2={w - r} y2=y class="grid"/>
                <text x={l - 4.0} y={y + 4.0} class="tick" text-anchor="end">{s}</text>
            }
        })
        .collect_view();
    let lines = curves
        .iter()
        .enumerate()
        .map(|(i, cv)| {
            let segs = cv
                .segments
                .iter()
                .map(|sg| view! { <path d=sg.path.clone() class={if sg.inside { "in" } else { "out" }}/> })
                .collect_view();
            view! {
                <g class=format!("curve c{i}") class:rec=cv.recommended data-curve=cv.id>
                    {segs}
                    <circle cx=cv.point.0 cy=cv.point.1 r={if cv.recommended { "5" } else { "3.5" }} class="op"/>
                </g>
            }
        })
        .collect_view();
    let legend = curves
        .iter()
        .enumerate()
        .map(|(i, cv)| view! {
            <li class=format!("c{i}")><span class="swatch"></span>{cv.name}{cv.recommended.then_some(" ★")}</li>
        })
        .collect_view();
    view! {
        <figure class="plot" data-plot="nu-re">
            <svg viewBox=format!("0 0 {w} {h}") role="img" aria-label="Nusselt number against Reynolds number for each correlation, log–log">
                {xt}{yt}
                <rect x=l y=t width={w - l - r} height={h - t - b} class="frame"/>
                {lines}
                <text x={(l + w - r) / 2.0} y={h - 2.0} class="axis" text-anchor="middle">"Re"</text>
                <text x="6" y="14" class="axis">"Nu"</text>
            </svg>
            <figcaption>
                <ul class="legend">{legend}</ul>
                "Solid: inside the correlation's published range; dashed: outside it. Dots: this operating point (each at its own reference temperature)."
            </figcaption>
        </figure>
    }
}

/// Local Nu over the front of a cylinder with the separation point marked.
pub fn front_plot(o: &Outcome) -> Option<AnyView> {
    if o.shape != Shape::Cylinder {
        return None;
    }
    let film = &o.analysis.film;
    let re = o.analysis.forced[0].groups.re;
    let (w, h) = (480.0, 220.0);
    let (frame, path, sep) = chart::front_profile(re, film.pr, w, h);
    let (l, r, t, b) = frame.margin;
    let (angle, words) = local::separation(re);
    let xt = frame
        .x_ticks(30.0)
        .into_iter()
        .map(|(x, s)| view! { <text x=x y={h - b + 16.0} class="tick" text-anchor="middle">{format!("{s}°")}</text> })
        .collect_view();
    let step = chart::nice_ceiling(frame.y.1) / 4.0;
    let yt = frame
        .y_ticks(step)
        .into_iter()
        .map(|(y, s)| {
            view! {
                <line x1=l y1=y x2={w - r} y2=y class="grid"/>
                <text x={l - 4.0} y={y + 4.0} class="tick" text-anchor="end">{s}</text>
            }
        })
        .collect_view();
    let rear_x = frame.to_svg(angle, 0.0).0;
    let flags = local::front(0.0, re, film.pr).flags;
    let note = flags
        .first()
        .map(|f| view! { <p class="flag">"⚠ "{f.message()}</p> });
    Some(
        view! {
            <figure class="plot" data-plot="front">
                <svg viewBox=format!("0 0 {w} {h}") role="img" aria-label="Local Nusselt number over the front of the cylinder">
                    {xt}{yt}
                    <rect x=l y=t width={w - l - r} height={h - t - b} class="frame"/>
                    <rect x=rear_x y=t width={w - r - rear_x} height={h - t - b} class="rear"/>
                    <text x={(rear_x + w - r) / 2.0} y={t + 40.0} class="tick" text-anchor="middle">"wake: not drawn"</text>
                    <path d=path class="in local"/>
                    <line x1=sep y1=t x2=sep y2={h - b} class="sep" data-separation=format!("{angle}")/>
                    <text x={sep + 3.0} y={t + 14.0} class="tick">{format!("separation ≈ {angle}°")}</text>
                    <text x={(l + w - r) / 2.0} y={h - 2.0} class="axis" text-anchor="middle">"θ from the front stagnation point"</text>
                    <text x="6" y="14" class="axis">"Nu_θ"</text>
                </svg>
                <figcaption>
                    {format!("{}: Nu_θ = 1.14·Re^½·Pr^0.4·[1 − (θ/90°)³], valid 0–80°, film properties, Re = {}. Here: {}. ", local::FRONT, format_sig(re, 4), words)}
                    {local::REAR_NOTE}
                </figcaption>
                {note}
            </figure>
        }
        .into_any(),
    )
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
        view! {
            <article class="verdict" data-verdict="layers">
                <h3>"Through the layers"</h3>
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
