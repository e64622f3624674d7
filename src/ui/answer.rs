//! The answer bar: the loss, the surface temperature and one badge per verdict, always in view
//! (it sticks to the top of the window at every width). A badge takes the person to its card; the
//! bar's last two buttons go to the inputs and to the results, one tap apart on a phone.

use leptos::prelude::*;

use super::Shown;
use crate::engine::units::{self, Dim, UnitChoice};

/// The verdicts that earn a badge, in the order a technician asks about them, with short names.
const BADGES: [(&str, &str); 6] = [
    ("touch", "Touch"),
    ("dew", "Sweating"),
    ("freeze", "Freezing"),
    ("flow", "Outlet"),
    ("loss", "Loss target"),
    ("cooling", "Cooling"),
];

/// Bring the element that `selector` finds into view below the bar.
fn go_to(selector: &str) {
    if let Ok(Some(el)) = document().query_selector(selector) {
        el.scroll_into_view();
    }
}

#[component]
pub fn AnswerBar(
    shown: Memo<Shown>,
    choice: RwSignal<UnitChoice>,
    stale: Signal<bool>,
) -> impl IntoView {
    let main = move || {
        shown.with(|s| {
            s.outcome.as_ref().map(|o| {
                let c = choice.get();
                let (label, v, d) = match o.q_per_length {
                    Some(q) => ("Loss", q, Dim::HeatFlowPerLength),
                    None => ("Loss", o.q_total, Dim::HeatFlow),
                };
                // A cold body gains heat: say so rather than show a negative loss.
                let (label, v) = if v < 0.0 { ("Gain", -v) } else { (label, v) };
                (
                    label,
                    units::show(v, c.get(d)),
                    units::show(o.surface_temp, c.get(Dim::Temperature)),
                )
            })
        })
    };
    let badges = move || {
        shown.with(|s| {
            let Some(o) = s.outcome.as_ref() else {
                return Vec::new();
            };
            BADGES
                .iter()
                .filter_map(|(id, name)| {
                    let v = o.verdicts.iter().find(|v| v.id == *id)?;
                    let ok = v.ok;
                    let sel = format!("[data-verdict=\"{id}\"]");
                    Some(view! {
                        <button type="button" class="badge" class:bad=!ok data-badge=*id data-ok=ok.to_string()
                            aria-label=format!("{name}: {}. Show its card.", if ok { "fine" } else { "needs attention" })
                            on:click=move |_| go_to(&sel)>
                            {if ok { "✓ " } else { "⚠ " }}{*name}
                        </button>
                    })
                })
                .collect::<Vec<_>>()
        })
    };
    view! {
        <div class="answer-bar" class:stale=stale data-answer-bar role="region" aria-label="Answer">
            <div class="answer-figures">
                {move || match main() {
                    Some((label, loss, surface)) => view! {
                        <p><span class="answer-label">{label}</span><strong data-answer="loss">{loss}</strong></p>
                        <p><span class="answer-label">"Surface"</span><strong data-answer="surface">{surface}</strong></p>
                    }.into_any(),
                    None => view! { <p>"—"</p> }.into_any(),
                }}
                {move || stale.get().then(|| view! { <p class="answer-stale">"⏸ last good result"</p> })}
            </div>
            <div class="answer-badges">
                {badges}
                <button type="button" class="badge jump" data-jump="inputs" on:click=move |_| go_to("#body-title")>"↑ Inputs"</button>
                <button type="button" class="badge jump" data-jump="results" on:click=move |_| go_to("#results-title")>"↓ Results"</button>
            </div>
        </div>
    }
}
