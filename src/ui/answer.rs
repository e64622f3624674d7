//! The answer bar: the loss, the surface temperature and one badge per verdict, always in view
//! (it sticks to the top of the window at every width). A badge takes the person to its card; the
//! bar's arrow goes to the results or back to the inputs, one tap apart on a phone.

use leptos::prelude::*;

use super::Shown;
use crate::engine::units::{self, Dim, UnitChoice};

/// The verdicts that earn a badge, in the order a technician asks about them, with short names
/// (the card's title is the long one).
const BADGES: [(&str, &str); 8] = [
    ("insulation", "Insulation"),
    ("made", "Heat"),
    ("touch", "Touch"),
    ("dew", "Sweat"),
    ("freeze", "Freeze"),
    ("flow", "Outlet"),
    ("loss", "Target"),
    ("cooling", "Cooling"),
];

/// A survey item's checks in a few words: the verdicts that need attention by their badge names
/// ("⚠ Touch, Freeze"), "✓" when every one that applies is fine, "—" when none applies.
pub(super) fn failing(verdicts: &[(&'static str, bool)]) -> String {
    let named: Vec<(&str, bool)> = verdicts
        .iter()
        .filter_map(|(id, ok)| BADGES.iter().find(|(b, _)| b == id).map(|(_, n)| (*n, *ok)))
        .collect();
    if named.is_empty() {
        return "—".into();
    }
    let bad: Vec<&str> = named
        .iter()
        .filter(|(_, ok)| !ok)
        .map(|(n, _)| *n)
        .collect();
    if bad.is_empty() {
        "✓".into()
    } else {
        format!("⚠ {}", bad.join(", "))
    }
}

/// Bring the element that `selector` finds into view below the bar (the page's scroll padding
/// keeps it clear of the bar).
fn go_to(selector: &str) {
    if let Ok(Some(el)) = document().query_selector(selector) {
        el.scroll_into_view();
    }
}

/// Whether the results' heading is above the middle of the window: the person is reading the
/// results, so the jump goes back to the inputs.
fn reading_results() -> bool {
    let mid = window()
        .inner_height()
        .ok()
        .and_then(|h| h.as_f64())
        .unwrap_or(0.0)
        / 2.0;
    document()
        .get_element_by_id("results-title")
        .is_some_and(|e| e.get_bounding_client_rect().top() < mid)
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
                // Checking a reading: the loss and surface the reading says, not the design's.
                let (label, v, surface, surface_label) = match &o.inspection {
                    Some(i) => (
                        "Loss, read",
                        i.actual,
                        i.corrected.surface,
                        "Surface, corrected",
                    ),
                    None => (label, v, o.surface_temp, "Surface"),
                };
                // A cold body gains heat: say so rather than show a negative loss.
                let (label, v) = if v < 0.0 { ("Gain", -v) } else { (label, v) };
                (
                    label,
                    units::show(v, c.get(d)),
                    units::show(surface, c.get(Dim::Temperature)),
                    surface_label,
                )
            })
        })
    };
    // The badges as markup; a tap on one goes to its card (`data-badge` names the verdict).
    let badges = move || {
        shown.with(|s| {
            let Some(o) = s.outcome.as_ref() else {
                return String::new();
            };
            BADGES
                .iter()
                .filter_map(|(id, name)| {
                    let ok = o.verdicts.iter().find(|v| v.id == *id)?.ok;
                    Some(format!(
                        r#"<button type="button" class="badge{}" data-badge="{id}" data-ok="{ok}" aria-label="{name}: {}. Show its card.">{}{name}</button>"#,
                        if ok { "" } else { " bad" },
                        if ok { "fine" } else { "needs attention" },
                        if ok { "✓ " } else { "⚠ " }
                    ))
                })
                .collect::<String>()
        })
    };
    let on_badge = move |ev: leptos::ev::MouseEvent| {
        use wasm_bindgen::JsCast;
        let id = ev
            .target()
            .and_then(|t| t.dyn_into::<web_sys::Element>().ok())
            .and_then(|e| e.closest("[data-badge]").ok().flatten())
            .and_then(|b| b.get_attribute("data-badge"));
        if let Some(id) = id {
            go_to(&format!("[data-verdict=\"{id}\"]"));
        }
    };
    // One jump, inputs to results or back, as the person's place on the page says.
    let at_results = RwSignal::new(false);
    let _ = window_event_listener(leptos::ev::scroll, move |_| {
        let now = reading_results();
        if now != at_results.get_untracked() {
            at_results.set(now);
        }
    });
    let jump = move |_| {
        go_to(if at_results.get_untracked() {
            "#body-title"
        } else {
            "#results-title"
        })
    };
    view! {
        <div class="answer-bar" class:stale=stale data-answer-bar role="region" aria-label="Answer">
            <div class="answer-figures">
                {move || match main() {
                    Some((label, loss, surface, surface_label)) => view! {
                        <p><span class="answer-label">{label}</span><strong data-answer="loss">{loss}</strong></p>
                        <p><span class="answer-label">{surface_label}</span><strong data-answer="surface">{surface}</strong></p>
                    }.into_any(),
                    None => view! { <p>"—"</p> }.into_any(),
                }}
                {move || stale.get().then(|| view! { <p class="answer-stale">"paused: last good result"</p> })}
            </div>
            <div class="answer-badges">
                <span class="badge-set" on:click=on_badge inner_html=badges></span>
                <button type="button" class="jump" data-jump=move || if at_results.get() { "inputs" } else { "results" }
                    aria-label=move || if at_results.get() { "Go to the inputs" } else { "Go to the results" }
                    on:click=jump>
                    {move || if at_results.get() { "↑" } else { "↓" }}
                </button>
            </div>
        </div>
    }
}
