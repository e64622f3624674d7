//! The page. Components read inputs, call the engine and render what it returns; no physics and
//! no unit arithmetic live here (both are in `crate::engine`).

use leptos::prelude::*;

mod answer;
mod markup;
mod pickers;
mod results;
mod rows;
mod saved;
mod shapes;
mod start;
mod storage;
mod summary;
mod unit_select;

use start::initial;
pub(crate) use start::mark;

use unit_select::UnitSelect;

use crate::engine::chart::svg::esc;
use crate::engine::scenario::{
    self, Axis, Field, FieldSpec, FluidKind, Group, HeatSource, HumidityInput, Outcome,
    PressureInput, Scenario, Setting, Shape, SunInput, SurfaceMode, Wind, FIELDS,
};
use crate::engine::units::{self, format_sig, Dim, System, UnitChoice};

/// What the results panel shows: the latest good outcome, and why it is stale if it is.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Shown {
    outcome: Option<Outcome>,
    error: Option<crate::engine::error::EngineError>,
    /// The field the error belongs beside, if any (otherwise it shows in the results).
    error_at: Option<Field>,
}

/// Whether the `<details>` a toggle event came from is now open.
fn is_open(ev: &leptos::ev::Event) -> bool {
    use wasm_bindgen::JsCast;
    ev.target()
        .and_then(|t| t.dyn_into::<web_sys::HtmlDetailsElement>().ok())
        .is_some_and(|d| d.open())
}

#[component]
pub fn App() -> impl IntoView {
    let (start, start_system, link_message) = initial();
    let view_opts =
        scenario::ViewOptions::from_fragment(&window().location().hash().unwrap_or_default());
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
                RwSignal::new(scenario::shown_text(spec, start.get(spec.field), u)),
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

    // Change the units shown: each field's text, unit and value stay in agreement
    // (`scenario::switch_unit`: accepted texts are rewritten, refused ones read again).
    let change_units = move |new: UnitChoice| {
        let old = choice.get_untracked();
        let mut s = scenario.get_untracked();
        for spec in &FIELDS {
            let t = text_of(spec.field);
            let before = t.get_untracked();
            let after =
                scenario::switch_unit(&mut s, spec, &before, old.get(spec.dim), new.get(spec.dim));
            if after != before {
                t.set(after);
            }
        }
        choice.set(new);
        if s != scenario.get_untracked() {
            scenario.set(s);
        }
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
    // Read once per change, not once per reader (the stale mark, its note and the answer bar).
    let any_field_error = Memo::new(move |_| {
        let s = scenario.get();
        FIELDS
            .iter()
            .filter(|spec| s.uses(spec.field))
            .any(|spec| field_error(spec)().is_some())
    });

    let shown = Memo::new(move |prev: Option<&Shown>| {
        let s = scenario.get();
        match scenario::evaluate(&s) {
            Ok(o) => Shown {
                outcome: Some(o),
                error: None,
                error_at: None,
            },
            Err(e) => Shown {
                outcome: prev.and_then(|p| p.outcome.clone()),
                error_at: scenario::error_field(&s, &e),
                error: Some(e),
            },
        }
    });
    // The moment the first result is on the page (read by the browser timing harness).
    Effect::new(move |marked: Option<bool>| {
        if marked == Some(true) {
            return true;
        }
        let has = shown.with(|s| s.outcome.is_some());
        if has {
            mark("leeward-first-result");
        }
        has
    });
    let stale = move || any_field_error.get() || shown.with(|s| s.error.is_some());
    let stale_signal = Signal::derive(stale);

    // The outside world: keep the link in the address bar in step with the scenario.
    // A refused link stays in the address bar (and in the notice) until the person changes an
    // input: their link text is never replaced by the demo's unasked.
    let refused_link = link_message.is_some();
    Effect::new(move |prev: Option<()>| {
        let frag = format!(
            "{}{}",
            scenario::to_fragment(&scenario.get(), system.get()),
            view_opts.suffix()
        );
        if prev.is_none() && refused_link {
            return;
        }
        // `history.replaceState`, not `location.replace`: the same address without a navigation
        // (the latter cost as much per keystroke as redrawing every plot).
        let loc = window().location();
        if loc.hash().unwrap_or_default().trim_start_matches('#') != frag {
            if let Ok(h) = window().history() {
                let _ = h.replace_state_with_url(
                    &wasm_bindgen::JsValue::NULL,
                    "",
                    Some(&format!("#{frag}")),
                );
            }
        }
    });

    // Which fields a scenario uses, and the notes beside them, worked out once per change: a
    // memo tells its readers only when its value changes, so a keystroke that shows or hides no
    // field re-runs none of the fields' own closures.
    let used = Memo::new(move |_| {
        scenario.with(|s| {
            FIELDS
                .iter()
                .map(|sp| s.uses(sp.field))
                .collect::<Vec<bool>>()
        })
    });
    let notes = Memo::new(move |_| {
        scenario.with(|s| {
            FIELDS
                .iter()
                .map(|sp| scenario::field_note(s, sp.field))
                .collect::<Vec<_>>()
        })
    });

    let field_view = move |spec: &'static FieldSpec| {
        let i = FIELDS
            .iter()
            .position(|sp| sp.field == spec.field)
            .unwrap_or(0);
        let t = text_of(spec.field);
        let err = field_error(spec);
        let err2 = field_error(spec);
        let err3 = field_error(spec);
        let extra = move || {
            shown.with(|s| {
                if s.error_at == Some(spec.field) {
                    s.error
                        .as_ref()
                        .map(|e| scenario::error_message(e, &choice.get()))
                } else {
                    None
                }
            })
        };
        let input_id = format!("in-{}", spec.key);
        let msg_id = format!("msg-{}", spec.key);
        let on_input = move |ev: leptos::ev::Event| {
            let v = event_target_value(&ev);
            t.set(v.clone());
            let u = choice.get_untracked().get(spec.dim);
            let mut s = scenario.get_untracked();
            if let Ok(followed) = scenario::type_text(&mut s, spec, &v, u) {
                let c = choice.get_untracked();
                for f in followed {
                    let sp = scenario::spec(f);
                    text_of(f).set(scenario::shown_text(sp, s.get(f), c.get(sp.dim)));
                }
                scenario.set(s);
            }
        };
        view! {
            <div
                class="field"
                class:invalid=move || err2().is_some()
                class:hidden=move || !used.with(|u| u[i])
                data-field-box=spec.key
            >
                <label for=input_id.clone()>{spec.label}<small>{move || scenario::help_text(spec, &choice.get())}</small></label>
                <div class="entry">
                    <input
                        id=input_id
                        type="text"
                        inputmode="decimal"
                        autocomplete="off"
                        spellcheck="false"
                        data-field=spec.key
                        aria-describedby=msg_id.clone()
                        aria-invalid=move || if err3().is_some() { "true" } else { "false" }
                        prop:value=move || t.get()
                        on:input=on_input
                    />
                    <UnitSelect dim=spec.dim choice=choice on_pick=set_unit/>
                </div>
                <p class="field-msg" id=msg_id role="status" data-msg-for=spec.key>
                    {move || err().or_else(extra).map(|m| format!("⚠ {m}"))}
                </p>
                {move || notes.with(|n| n[i].clone()).map(|n| view! { <p class="field-note" data-note-for=spec.key>{n}</p> })}
            </div>
        }
    };
    let fields_of = move |g: Group| {
        FIELDS
            .iter()
            .filter(|sp| sp.group == g)
            .map(field_view)
            .collect_view()
    };

    let fluid_options = FluidKind::ALL
        .iter()
        .map(|k| {
            view! {
                <option value=k.id() prop:selected=move || scenario.with(|s| s.fluid == *k)>
                    {k.label()}
                </option>
            }
        })
        .collect_view();
    let pick_fluid = move |ev: leptos::ev::Event| {
        if let Some(k) = FluidKind::from_id(&event_target_value(&ev)) {
            scenario.update(|s| s.fluid = k);
        }
    };
    let toggle = move |name: &'static str,
                       label_a: &'static str,
                       label_b: &'static str,
                       is_a: fn(&Scenario) -> bool,
                       set: fn(&mut Scenario, bool),
                       shown_when: fn(&Scenario) -> bool| {
        view! {
            <div
                class="toggle"
                role="group"
                aria-label=name
                data-toggle=name
                class:hidden=move || !scenario.with(shown_when)
            >
                <button type="button" aria-pressed=move || scenario.with(is_a).to_string()
                    on:click=move |_| scenario.update(|s| set(s, true))>{label_a}</button>
                <button type="button" aria-pressed=move || (!scenario.with(is_a)).to_string()
                    on:click=move |_| scenario.update(|s| set(s, false))>{label_b}</button>
            </div>
        }
    };
    let pressure_toggle = toggle(
        "pressure-input",
        "Pressure",
        "Elevation",
        |s| s.pressure_input == PressureInput::Absolute,
        |s, a| {
            s.pressure_input = if a {
                PressureInput::Absolute
            } else {
                PressureInput::Elevation
            }
        },
        |_| true,
    );
    let humidity_toggle = toggle(
        "humidity-input",
        "Relative humidity",
        "Dew point",
        |s| s.humidity_input == HumidityInput::Relative,
        |s, a| {
            s.humidity_input = if a {
                HumidityInput::Relative
            } else {
                HumidityInput::DewPoint
            }
        },
        |s| s.fluid == FluidKind::HumidAir,
    );

    let setting_toggle = toggle(
        "setting",
        "Indoors",
        "Outdoors",
        |s| s.setting == Setting::Indoors,
        |s, a| {
            s.setting = if a {
                Setting::Indoors
            } else {
                Setting::Outdoors
            }
        },
        |_| true,
    );
    let sun_toggle = toggle(
        "sun-input",
        "Sunlight typed",
        "Clear sky at a date, time and place",
        |s| s.sun_input == SunInput::Typed,
        |s, a| s.sun_input = if a { SunInput::Typed } else { SunInput::Place },
        |s| s.outdoors(),
    );
    let terrain_options = crate::engine::outdoors::wind::Terrain::ALL
        .into_iter()
        .map(|t| {
            view! {
                <option value=t.category() prop:selected=move || scenario.with(|s| s.terrain == t)>
                    {scenario::terrain_label(t)}
                </option>
            }
        })
        .collect_view();

    let axis_toggle = toggle(
        "axis",
        "Axis level",
        "Axis upright",
        |s| s.axis == Axis::Horizontal,
        |s, a| s.axis = if a { Axis::Horizontal } else { Axis::Vertical },
        |s| s.shape != Shape::Sphere,
    );
    let wind_select = move || {
        let opts = [
            (Wind::Horizontal, "h", "Level (across the body)"),
            (Wind::Up, "u", "Rising"),
            (Wind::Down, "d", "Falling"),
        ]
        .into_iter()
        .map(|(w, id, label)| {
            view! { <option value=id prop:selected=move || scenario.with(|s| s.wind == w)>{label}</option> }
        })
        .collect_view();
        view! {
            <div class="field" class:hidden=move || !scenario.with(|s| s.uses_wind())>
                <label for="in-wind">"Stream direction"<small>"rising or falling: with or against the rise of warm fluid"</small></label>
                <select id="in-wind" class="wide" data-choice="wind" on:change=move |ev| {
                    let w = match event_target_value(&ev).as_str() {
                        "u" => Wind::Up,
                        "d" => Wind::Down,
                        _ => Wind::Horizontal,
                    };
                    scenario.update(|s| s.wind = w);
                }>{opts}</select>
            </div>
        }
    };
    let shape_picker = move || {
        let buttons = Shape::ALL
            .into_iter()
            .map(|sh| {
                view! {
                    <button type="button" class="shape-option" data-shape=sh.id()
                        aria-pressed=move || scenario.with(|s| s.shape == sh).to_string()
                        on:click=move |_| scenario.update(|s| s.shape = sh)>
                        {shapes::drawing(sh, false)}
                        <span>{sh.label()}</span>
                    </button>
                }
            })
            .collect_view();
        view! {
            <div class="shapes" role="group" aria-label="Shape" data-choice="shape">{buttons}</div>
            <div class="shape-chosen">
                {move || shapes::drawing(scenario.with(|s| s.shape), true)}
                <p>{move || scenario.with(|s| s.shape.length_meaning())}<br/>
                   <small>{move || scenario.with(|s| if s.shape == Shape::Sphere { "The stream comes from the left." } else { "The stream comes from the left, across the axis." })}</small></p>
            </div>
        }
    };

    let surface_toggle = pickers::surface_mode(scenario);
    let source_toggle = toggle(
        "heat-source",
        "A heat",
        "A current through a conductor",
        |s| s.heat_source == HeatSource::Heat,
        |s, a| {
            s.heat_source = if a {
                HeatSource::Heat
            } else {
                HeatSource::Current
            }
        },
        |s| s.makes_heat() && !s.shape.is_sphere(),
    );
    // An insulated line worked out from inside can be set against an infrared reading of its
    // surface (the design stays the reference; the reading says what the insulation really does).
    let reading_toggle = toggle(
        "inspection",
        "As designed",
        "Check an infrared reading",
        |s| s.surface_mode != SurfaceMode::Reading,
        |s, a| {
            s.surface_mode = if a {
                SurfaceMode::Solved
            } else {
                SurfaceMode::Reading
            }
        },
        |s| s.solved() && matches!(s.shape, Shape::Cylinder | Shape::Sphere),
    );
    // An output: `data-si` carries the value as computed (signed, full precision); the text
    // shows it at its unit's resolution, as a magnitude where the label names the direction.
    let out_as = move |quantity: &'static str,
                       get: fn(&Outcome) -> Option<f64>,
                       dim: Option<Dim>,
                       magnitude: bool| {
        let get_shown = move |o: &Outcome| get(o).map(|v| if magnitude { v.abs() } else { v });
        view! {
            <output data-quantity=quantity data-si=move || {
                shown.with(|s| s.outcome.as_ref().and_then(get).map(|v| format!("{v}")).unwrap_or_default())
            }>
                {move || {
                    shown.with(|s| match (s.outcome.as_ref().and_then(get_shown), dim) {
                        (Some(v), Some(d)) => units::shown(v, choice.get().get(d)).0,
                        (Some(v), None) => format_sig(v, 3),
                        (None, _) => "—".to_string(),
                    })
                }}
            </output>
            <span class="unit">{move || {
                let v = shown.with(|s| s.outcome.as_ref().and_then(get)).unwrap_or(0.0);
                dim.map(|d| units::shown(v, choice.get().get(d)).1).unwrap_or("")
            }}</span>
        }
    };
    let out = move |quantity: &'static str, get: fn(&Outcome) -> Option<f64>, dim: Option<Dim>| {
        out_as(quantity, get, dim, false)
    };
    // A cold body gains heat: its flows are named as a gain and shown as magnitudes.
    let gains = move || shown.with(|s| s.outcome.as_ref().is_some_and(|o| o.q_total < 0.0));

    // The run length every total is over, said beside each total (the demo's 12 m once drove
    // totals without a word).
    let run_note = move || {
        scenario.with(|s| {
            if s.shape == Shape::Sphere {
                String::new()
            } else {
                format!(
                    " (over L = {})",
                    units::show(s.length, choice.get().get(Dim::RunLength))
                )
            }
        })
    };

    // Folded views are built only while open: a keystroke does not redraw what nobody sees.
    let open_working = RwSignal::new(false);
    let open_table = RwSignal::new(false);
    let open_plots = RwSignal::new(false);

    // The report is built only for printing (it is a large view): the browser's beforeprint and
    // afterprint events, or the panel's print button, switch it on and off.
    let printing = RwSignal::new(false);
    let _ = window_event_listener(leptos::ev::beforeprint, move |_| printing.set(true));
    // The survey summary prints instead of the one-item report while it is set.
    let summary = RwSignal::new(None::<String>);
    let _ = window_event_listener(leptos::ev::afterprint, move |_| {
        printing.set(false);
        summary.set(None);
    });

    // Item tag and location: typed in the saved-work panel, printed on the report.
    let item_name = RwSignal::new(String::from("Line 1"));
    let tag = RwSignal::new(String::new());
    let place = RwSignal::new(String::new());

    // Open a saved scenario: its numbers replace the inputs, shown in the units the page is in,
    // whichever it was saved in (a technician working in °C who opens a colleague's item saved in
    // °F keeps reading °C).
    let open_saved = move |sc: Scenario| {
        let c = choice.get_untracked();
        for spec in &FIELDS {
            text_of(spec.field).set(scenario::shown_text(
                spec,
                sc.get(spec.field),
                c.get(spec.dim),
            ));
        }
        scenario.set(sc);
    };

    // Beside a value the range flags touch: an icon and words, pointing at the notes below.
    let flag_mark = move || {
        shown.with(|s| {
            s.outcome.as_ref().and_then(|o| {
                let n = o.flags.len();
                (n > 0).then(|| {
                    view! {
                        <span class="flag-mark" data-flag-mark>
                            {format!("⚠ {n} range note{} below", if n == 1 { "" } else { "s" })}
                        </span>
                    }
                })
            })
        })
    };

    view! {
        <header class="bar" class:hidden=view_opts.embed>
            <h1>"Leeward"</h1>
            <p class="tagline">"Heat transfer from a body in a cross-flow"</p>
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
        <main class="layout" class:embed=view_opts.embed data-embed=view_opts.embed.to_string()>
            <answer::AnswerBar shown=shown choice=choice stale=stale_signal/>
            {link_message.map(|m| view! { <p class="notice" role="alert" data-notice="link">"⚠ "{m}</p> })}
            <fieldset class="inputs" disabled=view_opts.locked data-locked=view_opts.locked.to_string()>
                <legend class="sr-only">"Inputs"</legend>
                <p class="demo" data-demo>
                    {move || (scenario.get() == scenario::DEMO).then_some(scenario::DEMO_TITLE)}
                </p>
                <section aria-labelledby="body-title">
                    <h2 id="body-title">"1 · Body"</h2>
                    {shape_picker}
                    {axis_toggle}
                    {pickers::size_picker(scenario, choice, text_of)}
                    {fields_of(Group::Body)}
                </section>
                <section aria-labelledby="stream-title">
                    <h2 id="stream-title">"2 · Stream: what flows past the outside"</h2>
                    <div class="field">
                        <label for="in-fluid">"Fluid outside the body"<small>"the air or liquid flowing past it (what flows inside a pipe is set under 3 · Surface)"</small></label>
                        <select id="in-fluid" class="wide" data-choice="fluid" on:change=pick_fluid>
                            {fluid_options}
                        </select>
                    </div>
                    {setting_toggle}
                    {wind_select}
                    {pressure_toggle}
                    {humidity_toggle}
                    {fields_of(Group::Stream)}
                    <div class="outdoors" data-group="outdoors" class:hidden=move || scenario.with(|s| s.setting != Setting::Outdoors)>
                        <h3 class="sub">"Outdoors: sky, sun and wind"</h3>
                        <div class="field">
                            <label for="in-terrain">"Terrain around the site"<small>"EN 1991-1-4 terrain category: how much the ground slows the wind"</small></label>
                            <select id="in-terrain" class="wide" data-choice="terrain" on:change=move |ev| {
                                if let Some(t) = scenario::terrain_from_id(&event_target_value(&ev)) {
                                    scenario.update(|s| s.terrain = t);
                                }
                            }>{terrain_options}</select>
                        </div>
                        {fields_of(Group::Outdoors)}
                        {sun_toggle}
                        {pickers::sun_place(scenario)}
                        {fields_of(Group::Sun)}
                        {pickers::typical_picker(scenario, choice, text_of, &crate::engine::catalogue::SOLAR_ABSORPTANCES, Field::Absorptance, "in-as-pick", "Typical solar absorptances", "Choose a finish, or type the absorptance above")}
                    </div>
                </section>
                <section aria-labelledby="surface-title">
                    <h2 id="surface-title">"3 · Surface"</h2>
                    {surface_toggle}
                    {reading_toggle}
                    {source_toggle}
                    {pickers::wall_select(scenario, choice)}
                    {pickers::inside_select(scenario)}
                    {fields_of(Group::Surface)}
                    {pickers::typical_picker(scenario, choice, text_of, &crate::engine::job::EMISSIVITIES, Field::Emissivity, "in-eps-pick", "Typical emissivities", "Choose a surface, or type ε above")}
                    {pickers::layer_picker(scenario)}
                    {fields_of(Group::Layers)}
                    <details class="fold" data-fold="k-curve" class:hidden=move || !scenario.with(|s| s.solved() && s.layer_count > 0)>
                        <summary>"A third k point (optional: k curved in temperature)"</summary>
                        {fields_of(Group::LayerCurve)}
                    </details>
                </section>
                <section aria-labelledby="job-title">
                    <h2 id="job-title">"4 · The job"</h2>
                    {fields_of(Group::Job)}
                </section>
            </fieldset>
            <section class="results" class:stale=stale aria-labelledby="results-title" aria-live="polite">
                <h2 id="results-title">"Results"</h2>
                <p class="stale-note" data-stale=move || stale().to_string()>
                    {move || stale().then_some("Paused: showing the last good result; fix the marked input to update.")}
                </p>
                {move || shown.with(|s| s.error.as_ref().filter(|_| s.error_at.is_none()).map(|e| view! { <p class="error" data-error>"⚠ "{scenario::error_message(e, &choice.get())}</p> }))}
                <dl class="figures" class:designed=move || scenario.with(|s| s.reads())>
                    <div class="main" class:hidden=move || shown.with(|s| s.outcome.as_ref().is_some_and(|o| o.q_per_length.is_none()))><dt>{move || if gains() { "Heat gain per length" } else { "Heat loss per length" }}</dt><dd>{out_as("q_per_length", |o| o.q_per_length, Some(Dim::HeatFlowPerLength), true)}{flag_mark}</dd></div>
                    <div class="main"><dt>{move || {
                        let what = if gains() { "Heat gain" } else { "Heat loss" };
                        scenario.with(|s| if s.shape == Shape::Sphere { format!("{what} of the body") } else {
                            format!("{what} over the length L = {}", units::show(s.length, choice.get().get(Dim::RunLength)))
                        })
                    }}</dt><dd>{out_as("q_total", |o| Some(o.q_total), Some(Dim::HeatFlow), true)}{flag_mark}</dd></div>
                    <div class="main"><dt>"Surface temperature"</dt><dd>{out("surface_temperature", |o| Some(o.surface_temp), Some(Dim::Temperature))}</dd></div>
                </dl>
                <div class="verdicts" data-verdicts inner_html=move || shown.with(|s| s.outcome.as_ref().map(|o| results::verdicts(o, &choice.get())).unwrap_or_default())></div>
                <ul class="cautions" data-cautions inner_html=move || shown.with(|s| s.outcome.as_ref().map(|o| scenario::cautions(&scenario.get(), o).iter().map(|c| format!(r#"<li class="caution">⚠ {}</li>"#, esc(c))).collect::<String>()).unwrap_or_default())></ul>
                <div data-figures inner_html=move || shown.with(|s| s.outcome.as_ref().map(|o| markup::figures(o, &choice.get(), &run_note())).unwrap_or_default())></div>
                <p class="spread" data-spread>{move || shown.with(|s| s.outcome.as_ref().map(|o| results::spread_text(o, &choice.get())))}</p>
                <p class="method">{move || shown.with(|s| s.outcome.as_ref().map(|o| format!("Recommended: {} ({}). {} {}", o.method, o.analysis.mode(), o.regime, o.analysis.notes.join(" "))))}</p>
                <p class="reason" data-reason>{move || shown.with(|s| s.outcome.as_ref().map(|o| format!("Why this one: {}", o.analysis.reason())))}</p>
                <ul class="flags" data-flags inner_html=move || shown.with(|s| s.outcome.as_ref().map(|o| o.flags.iter().map(|f| format!(r#"<li class="flag" data-flag="{}">⚠ {}</li>"#, esc(f.method), esc(&f.message()))).collect::<String>()).unwrap_or_default())></ul>
                <details class="fold" data-fold="correlations" on:toggle=move |ev| open_table.set(is_open(&ev))>
                    <summary>"Every correlation side by side, and how the recommendation is chosen"</summary>
                    {move || open_table.get().then(|| view! {
                        {move || shown.with(|s| s.outcome.as_ref().map(|o| results::table(o, &choice.get())))}
                        <p class="rule">{move || scenario.with(|s| format!("How the recommendation is chosen: {}", s.shape.rule()))}</p>
                    })}
                </details>
                <details class="working" on:toggle=move |ev| open_working.set(is_open(&ev))>
                    <summary>"How this was worked out"</summary>
                    {move || open_working.get().then(|| view! {
                        <ol inner_html=move || shown.with(|s| s.outcome.as_ref().map(|o| o.working.iter().map(|st| format!("<li><strong>{}</strong><br>{}</li>", esc(st.title), esc(&st.text))).collect::<String>()).unwrap_or_default())></ol>
                        {move || shown.with(|s| s.outcome.as_ref().map(|o| results::property_table(o, &choice.get())))}
                    })}
                </details>
            </section>
            {(!view_opts.embed).then(|| view! { <saved::SavedPanel scenario=scenario system=system name=item_name tag=tag place=place choice=choice summary=summary on_open=open_saved/> })}
            <section class="plots" class:hidden=view_opts.embed aria-labelledby="plots-title">
                <h2 id="plots-title">"Against thickness and wind"</h2>
                <div data-sweeps inner_html=move || shown.with(|sh| sh.outcome.as_ref().map(|o| results::sweeps(o, &scenario.get(), &choice.get())).unwrap_or_default())></div>
                <details class="fold" data-fold="nu-re" on:toggle=move |ev| open_plots.set(is_open(&ev))>
                    <summary>"The Nusselt number against Reynolds for every correlation, and around the front of the body"</summary>
                    {move || open_plots.get().then(|| view! {
                        {move || shown.with(|s| s.outcome.as_ref().map(results::nu_re_plot))}
                        {move || shown.with(|s| s.outcome.as_ref().and_then(results::front_plot))}
                    })}
                </details>
            </section>
            {move || summary.get().map(|m| view! { <article class="report summary" data-survey-summary inner_html=m></article> })}
            {move || (printing.get() && summary.with(Option::is_none)).then(|| shown.with(|sh| sh.outcome.as_ref().map(|o| results::report(o, &scenario.get(), &choice.get(), &item_name.get(), &tag.get(), &place.get()))))}
            <footer class="standing">
                "Results are engineering estimates from published correlations. Check them before you rely on them; local codes and licensed practice govern any decision about safety."
            </footer>
        </main>
    }
}
