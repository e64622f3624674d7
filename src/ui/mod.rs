//! The page. Components read inputs, call the engine and render what it returns; no physics and
//! no unit arithmetic live here (both are in `crate::engine`).

use leptos::prelude::*;

use crate::engine::scenario::{self, Field, FieldSpec, Outcome, Scenario, FIELDS};
use crate::engine::units::{self, format_sig, Dim, System, UnitChoice};
use crate::engine::EngineError;

/// What the results panel shows: the latest good outcome, and why it is stale if it is.
#[derive(Debug, Clone, PartialEq)]
struct Shown {
    outcome: Option<Outcome>,
    error: Option<String>,
    /// The error belongs beside the surface-temperature field rather than in the results.
    error_at_surface: bool,
}

/// Read the scenario from the page's URL fragment, or the demo with a message.
fn initial() -> (Scenario, System, Option<String>) {
    let hash = window().location().hash().unwrap_or_default();
    if hash.len() <= 1 {
        return (scenario::DEMO, System::Si, None);
    }
    match scenario::from_fragment(&hash) {
        Ok((s, sys)) => (s, sys, None),
        Err(e) => (
            scenario::DEMO,
            System::Si,
            Some(format!(
                "This link could not be read ({e}). The demo is shown instead."
            )),
        ),
    }
}

/// Text for a field in the unit shown, trimmed to sensible digits (display only).
fn shown_text(si: f64, unit: &units::Unit) -> String {
    format_sig(unit.from_si(si), 6)
}

#[component]
pub fn App() -> impl IntoView {
    let (start, start_system, link_message) = initial();
    let scenario = RwSignal::new(start);
    let system = RwSignal::new(start_system);
    let choice = RwSignal::new(UnitChoice::for_system(start_system));

    // One text per field: what the user typed, kept as typed while it is being edited.
    let texts: Vec<(Field, RwSignal<String>)> = FIELDS
        .iter()
        .map(|spec| {
            let u = choice.get_untracked().get(spec.dim);
            (
                spec.field,
                RwSignal::new(shown_text(start.get(spec.field), u)),
            )
        })
        .collect();
    let texts = StoredValue::new(texts);
    let text_of = move |f: Field| {
        texts.with_value(|t| {
            t.iter()
                .find(|(g, _)| *g == f)
                .map(|(_, s)| *s)
                .expect("field")
        })
    };

    // Change the units shown. Texts the user had accepted are rewritten from the stored SI values
    // (display rounding only; the SI values are untouched). A refused entry is kept as typed.
    let change_units = move |new: UnitChoice| {
        let old = choice.get_untracked();
        let s = scenario.get_untracked();
        for spec in &FIELDS {
            let (from, to) = (old.get(spec.dim), new.get(spec.dim));
            let t = text_of(spec.field);
            if from != to && scenario::read_field(spec, &t.get_untracked(), from).is_ok() {
                t.set(shown_text(s.get(spec.field), to));
            }
        }
        choice.set(new);
    };

    let set_system = move |sys: System| {
        system.set(sys);
        change_units(UnitChoice::for_system(sys));
    };
    let set_unit = move |id: String| {
        if let Some(u) = units::unit(&id) {
            let mut c = choice.get_untracked();
            c.set(u);
            change_units(c);
        }
    };

    let field_error = move |spec: &'static FieldSpec| {
        let t = text_of(spec.field);
        move || scenario::read_field(spec, &t.get(), choice.get().get(spec.dim)).err()
    };
    let any_field_error = move || FIELDS.iter().any(|spec| field_error(spec)().is_some());

    let shown = Memo::new(move |prev: Option<&Shown>| {
        let s = scenario.get();
        match scenario::evaluate(&s) {
            Ok(o) => Shown {
                outcome: Some(o),
                error: None,
                error_at_surface: false,
            },
            Err(e) => Shown {
                outcome: prev.and_then(|p| p.outcome.clone()),
                error_at_surface: matches!(e, EngineError::NoTemperatureDifference { .. }),
                error: Some(e.to_string()),
            },
        }
    });
    let stale = move || any_field_error() || shown.with(|s| s.error.is_some());

    // The outside world: keep the link in the address bar in step with the scenario.
    Effect::new(move |_| {
        let frag = scenario::to_fragment(&scenario.get(), system.get());
        let loc = window().location();
        if loc.hash().unwrap_or_default().trim_start_matches('#') != frag {
            let _ = loc.replace(&format!("#{frag}"));
        }
    });

    let field_views = FIELDS
        .iter()
        .map(|spec| {
            let t = text_of(spec.field);
            let err = field_error(spec);
            let err2 = field_error(spec);
            let surface = spec.field == Field::SurfaceTemp;
            let extra = move || {
                if surface {
                    shown.with(|s| {
                        if s.error_at_surface {
                            s.error.clone()
                        } else {
                            None
                        }
                    })
                } else {
                    None
                }
            };
            let input_id = format!("in-{}", spec.key);
            let msg_id = format!("msg-{}", spec.key);
            let on_input = move |ev: leptos::ev::Event| {
                let v = event_target_value(&ev);
                t.set(v.clone());
                let u = choice.get_untracked().get(spec.dim);
                if let Ok(si) = scenario::read_field(spec, &v, u) {
                    scenario.update(|s| s.set(spec.field, si));
                }
            };
            view! {
                <div class="field" class:invalid=move || err2().is_some()>
                    <label for=input_id.clone()>{spec.label}<small>{spec.help}</small></label>
                    <div class="entry">
                        <input
                            id=input_id
                            type="text"
                            inputmode="decimal"
                            autocomplete="off"
                            spellcheck="false"
                            data-field=spec.key
                            aria-describedby=msg_id.clone()
                            prop:value=move || t.get()
                            on:input=on_input
                        />
                        <UnitSelect dim=spec.dim choice=choice on_pick=set_unit/>
                    </div>
                    <p class="field-msg" id=msg_id role="status" data-msg-for=spec.key>
                        {move || err().or_else(extra).map(|m| format!("⚠ {m}"))}
                    </p>
                </div>
            }
        })
        .collect_view();

    let out = move |quantity: &'static str, get: fn(&Outcome) -> f64, dim: Option<Dim>| {
        view! {
            <output data-quantity=quantity data-si=move || {
                shown.with(|s| s.outcome.as_ref().map(|o| format!("{}", get(o))).unwrap_or_default())
            }>
                {move || {
                    shown.with(|s| match &s.outcome {
                        Some(o) => {
                            let v = get(o);
                            match dim {
                                Some(d) => format_sig(choice.get().get(d).from_si(v), 4),
                                None => format_sig(v, 4),
                            }
                        }
                        None => "—".to_string(),
                    })
                }}
            </output>
            <span class="unit">{move || dim.map(|d| choice.get().get(d).symbol).unwrap_or("")}</span>
        }
    };

    view! {
        <header class="bar">
            <h1>"Leeward"</h1>
            <p class="tagline">"Heat loss from a pipe in the wind"</p>
            <div class="system" role="group" aria-label="Unit system">
                <button
                    type="button"
                    data-system="si"
                    aria-pressed=move || (system.get() == System::Si).to_string()
                    on:click=move |_| set_system(System::Si)
                >"SI"</button>
                <button
                    type="button"
                    data-system="us"
                    aria-pressed=move || (system.get() == System::Us).to_string()
                    on:click=move |_| set_system(System::Us)
                >"US"</button>
            </div>
        </header>
        <main class="layout">
            {link_message.map(|m| view! { <p class="notice" role="alert" data-notice="link">"⚠ "{m}</p> })}
            <section class="inputs" aria-labelledby="inputs-title">
                <h2 id="inputs-title">"Pipe and air"</h2>
                <p class="demo" data-demo>
                    {move || (scenario.get() == scenario::DEMO).then_some(scenario::DEMO_TITLE)}
                </p>
                {field_views}
            </section>
            <section class="results" class:stale=stale aria-labelledby="results-title" aria-live="polite">
                <h2 id="results-title">"Results"</h2>
                <p class="stale-note" data-stale=move || stale().to_string()>
                    {move || stale().then_some("⏸ Showing the last good result: fix the marked input to update.")}
                </p>
                {move || shown.with(|s| s.error.clone().filter(|_| !s.error_at_surface).map(|e| view! { <p class="error">"⚠ "{e}</p> }))}
                <dl class="figures">
                    <div class="main"><dt>"Heat loss per length"</dt><dd>{out("q_per_length", |o| o.q_per_length, Some(Dim::HeatFlowPerLength))}</dd></div>
                    <div class="main"><dt>"Heat-transfer coefficient h"</dt><dd>{out("h", |o| o.h, Some(Dim::HeatTransferCoefficient))}</dd></div>
                    <div><dt>"Nusselt number Nu"</dt><dd>{out("nusselt", |o| o.nusselt, None)}</dd></div>
                    <div><dt>"Reynolds number Re"</dt><dd>{out("reynolds", |o| o.reynolds, None)}</dd></div>
                    <div><dt>"Prandtl number Pr"</dt><dd>{out("prandtl", |o| o.prandtl, None)}</dd></div>
                    <div><dt>"Film temperature"</dt><dd>{out("film_temperature", |o| o.film_temp, Some(Dim::Temperature))}</dd></div>
                </dl>
                <p class="method">{move || shown.with(|s| s.outcome.as_ref().map(|o| format!("Method: {} (typical uncertainty of such correlations ±20 %, common practice). {}", o.method, o.regime)))}</p>
                <ul class="flags" data-flags>
                    {move || shown.with(|s| s.outcome.as_ref().map(|o| o.flags.iter().map(|f| view! {
                        <li class="flag" data-flag=f.method>"⚠ "{f.message()}</li>
                    }).collect_view()))}
                </ul>
                <details class="working">
                    <summary>"How this was worked out"</summary>
                    <ol>
                        {move || shown.with(|s| s.outcome.as_ref().map(|o| o.working.iter().map(|st| view! {
                            <li><strong>{st.title}</strong><br/>{st.text.clone()}</li>
                        }).collect_view()))}
                    </ol>
                    <p class="sources">{move || shown.with(|s| s.outcome.as_ref().map(|o| {
                        o.props.sources.iter().map(|(q, src)| format!("{q}: {src}")).collect::<Vec<_>>().join(" · ")
                    }))}</p>
                </details>
            </section>
            <footer class="standing">
                "Results are engineering estimates from published correlations. Check them before you rely on them; local codes and licensed practice govern any decision about safety."
            </footer>
        </main>
    }
}

/// The unit picker for one dimension; changing it changes that dimension everywhere on the page.
#[component]
fn UnitSelect(
    dim: Dim,
    choice: RwSignal<UnitChoice>,
    on_pick: impl Fn(String) + Copy + Send + Sync + 'static,
) -> impl IntoView {
    let options = units::units_of(dim)
        .map(|u| {
            view! {
                <option value=u.id prop:selected=move || choice.get().get(dim).id == u.id>
                    {u.symbol}
                </option>
            }
        })
        .collect_view();
    view! {
        <select
            class="unit-pick"
            aria-label="Unit"
            data-unit-for=format!("{dim:?}")
            on:change=move |ev| on_pick(event_target_value(&ev))
        >
            {options}
        </select>
    }
}
