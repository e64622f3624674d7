//! The pick-lists of the inputs: wall material, inside film, nominal pipe size, typical
//! emissivity, and the number of insulation layers. Each sets the scenario (and, where it fills
//! a field, that field's text); none holds physics.

use leptos::prelude::*;

use crate::engine::outdoors::sun::Utc;
use crate::engine::scenario::{
    self, Field, InsideFilm, Scenario, Shape, SurfaceMode, WallMaterial,
};
use crate::engine::units::{Dim, UnitChoice};

/// The wall's material (or the body's, for a cooling body).
pub fn wall_select(scenario: RwSignal<Scenario>, choice: RwSignal<UnitChoice>) -> impl IntoView {
    // Each material with its k in the unit the person reads.
    let opts = move || {
        let u = choice.get().get(Dim::ThermalConductivity);
        WallMaterial::ALL
            .into_iter()
            .map(|m| {
                let text = match m.properties() {
                    Some((k, _, _)) => format!("{} (k {})", m.label(), crate::engine::units::show(k, u)),
                    None => m.label().to_string(),
                };
                view! { <option value=m.id() prop:selected=move || scenario.with(|s| s.wall == m)>{text}</option> }
            })
            .collect_view()
    };
    view! {
        <div class="field" class:hidden=move || !scenario.with(|s| s.solved() || s.cools())>
            <label for="in-wall">{move || if scenario.with(|s| s.solved()) { "Wall material" } else { "Material of the body" }}<small>"its k near room temperature, from Incropera & DeWitt Table A.1"</small></label>
            <select id="in-wall" class="wide" data-choice="wall" on:change=move |ev| {
                if let Some(m) = WallMaterial::from_id(&event_target_value(&ev)) {
                    scenario.update(|s| s.wall = m);
                }
            }>{opts}</select>
        </div>
    }
}

/// Where the inside film comes from: typed, or worked out from a process fluid's flow.
pub fn inside_select(scenario: RwSignal<Scenario>) -> impl IntoView {
    let opts = InsideFilm::ALL
        .into_iter()
        .map(|m| view! { <option value=m.id() prop:selected=move || scenario.with(|s| s.inside == m)>{m.label()}</option> })
        .collect_view();
    view! {
        <div class="field" class:hidden=move || !scenario.with(|s| s.offers_inside_film())>
            <label for="in-inside">"What flows inside, and its film"<small>"typed, or worked out from the flow set under 4 · The job; steam or gas: no freezing check"</small></label>
            <select id="in-inside" class="wide" data-choice="inside" on:change=move |ev| {
                if let Some(m) = InsideFilm::from_id(&event_target_value(&ev)) {
                    scenario.update(|s| s.inside = m);
                }
            }>{opts}</select>
        </div>
    }
}

/// Nominal pipe sizes set D (and the text shown in the D field).
pub fn size_picker(
    scenario: RwSignal<Scenario>,
    choice: RwSignal<UnitChoice>,
    text_of: impl Fn(Field) -> RwSignal<String> + Copy + Send + Sync + 'static,
) -> impl IntoView {
    let opts = crate::engine::job::NOMINAL_SIZES
        .iter()
        .enumerate()
        .map(|(i, (name, d))| {
            let d = *d;
            // The size stays chosen while D is its diameter (a reopened item shows its size).
            view! { <option value=i.to_string() prop:selected=move || scenario.with(|s| (s.diameter - d).abs() < 1e-9)>{*name}</option> }
        })
        .collect_view();
    view! {
        <div class="field" class:hidden=move || !scenario.with(|s| s.shape == Shape::Cylinder)>
            <label for="in-nps">"Nominal pipe size"<small>"sets D to the outside diameter (ASME B36.10M)"</small></label>
            <select id="in-nps" class="wide" data-choice="nps" on:change=move |ev| {
                let Ok(i) = event_target_value(&ev).parse::<usize>() else { return };
                let Some((_, d)) = crate::engine::job::NOMINAL_SIZES.get(i) else { return };
                scenario.update(|s| s.diameter = *d);
                let u = choice.get_untracked().get(Dim::Length);
                text_of(Field::Diameter).set(scenario::shown_text(scenario::spec(Field::Diameter), *d, u));
            }>
                <option value="" prop:selected=move || scenario.with(|s| crate::engine::job::NOMINAL_SIZES.iter().all(|(_, d)| (s.diameter - d).abs() >= 1e-9))>"Choose a size, or type D below"</option>
                {opts}
            </select>
        </div>
    }
}

/// A pick-list of typical values (common practice, rounded) that sets one field: its value and
/// its text in the unit shown.
#[allow(clippy::too_many_arguments)]
pub fn typical_picker(
    scenario: RwSignal<Scenario>,
    choice: RwSignal<UnitChoice>,
    text_of: impl Fn(Field) -> RwSignal<String> + Copy + Send + Sync + 'static,
    list: &'static [(&'static str, f64)],
    field: Field,
    id: &'static str,
    label: &'static str,
    prompt: &'static str,
) -> impl IntoView {
    let opts = list
        .iter()
        .enumerate()
        .map(|(i, (name, e))| view! { <option value=i.to_string()>{format!("{name}: {e}")}</option> })
        .collect_view();
    let spec = scenario::spec(field);
    view! {
        <div class="field" class:hidden=move || !scenario.with(|s| s.uses(field))>
            <label for=id>{label}<small>"common practice, rounded; a measured value is better"</small></label>
            <select id=id class="wide" data-choice=id on:change=move |ev| {
                let Ok(i) = event_target_value(&ev).parse::<usize>() else { return };
                let Some((_, e)) = list.get(i) else { return };
                scenario.update(|s| s.set(field, *e));
                let u = choice.get_untracked().get(spec.dim);
                text_of(field).set(scenario::shown_text(spec, *e, u));
            }>
                <option value="" selected>{prompt}</option>
                {opts}
            </select>
        </div>
    }
}

/// How many insulation layers: bare to three.
pub fn layer_picker(scenario: RwSignal<Scenario>) -> impl IntoView {
    let buttons = (0..=3usize)
        .map(|n| {
            view! {
                <button type="button" data-layers=n.to_string()
                    aria-pressed=move || scenario.with(|s| s.layer_count == n).to_string()
                    on:click=move |_| scenario.update(|s| s.layer_count = n)>
                    {match n { 0 => "Bare".to_string(), 1 => "1 layer".to_string(), k => format!("{k} layers") }}
                </button>
            }
        })
        .collect_view();
    view! {
        <div class:hidden=move || !scenario.with(|s| s.solved())>
            <h3 class="sub">"Insulation"</h3>
            <div class="toggle" role="group" aria-label="Insulation layers">{buttons}</div>
        </div>
    }
}

/// How the surface is known: typed, worked out from the process inside (round pipes and
/// spheres), or where heat made inside is lost (any body).
pub fn surface_mode(scenario: RwSignal<Scenario>) -> impl IntoView {
    let pick = move |m: SurfaceMode| {
        scenario.update(|s| {
            // Working the surface out starts from the bare line: layers are added on purpose.
            if m == SurfaceMode::Solved && !s.solved() {
                s.layer_count = 0;
            }
            s.surface_mode = m;
        })
    };
    view! {
    <div class="toggle" role="group" aria-label="surface-mode" data-toggle="surface-mode">
        <button type="button" aria-pressed=move || scenario.with(|s| !s.solved() && !s.makes_heat()).to_string()
            on:click=move |_| pick(SurfaceMode::Given)>"Surface known"</button>
        <button type="button" aria-pressed=move || scenario.with(|s| s.solved()).to_string()
            class:hidden=move || !scenario.with(|s| matches!(s.shape, Shape::Cylinder | Shape::Sphere))
            on:click=move |_| pick(SurfaceMode::Solved)>"Work it out from inside"</button>
        <button type="button" aria-pressed=move || scenario.with(|s| s.makes_heat()).to_string()
            on:click=move |_| pick(SurfaceMode::Made)>"Heat made inside"</button>
    </div>
    }
}

/// The instant of a clear sky from a date and place: the device's local date and time (its own
/// time zone, the one on site), kept as seconds since 1970 UTC; and the atmosphere's type.
pub fn sun_place(scenario: RwSignal<Scenario>) -> impl IntoView {
    // Local calendar fields of an instant, and back, through the browser's own clock.
    let local_text = |t: f64| {
        let d = js_sys::Date::new(&wasm_bindgen::JsValue::from_f64(t * 1000.0));
        format!(
            "{:04}-{:02}-{:02}T{:02}:{:02}",
            d.get_full_year(),
            d.get_month() + 1,
            d.get_date(),
            d.get_hours(),
            d.get_minutes()
        )
    };
    let set_local = move |ev: leptos::ev::Event| {
        // "YYYY-MM-DDTHH:MM" from the picker; anything else (cleared) leaves the instant as it is.
        let v = event_target_value(&ev);
        let n: Vec<i32> = v
            .split(['-', 'T', ':'])
            .filter_map(|p| p.parse().ok())
            .collect();
        if let [y, mo, d, h, mi] = n[..] {
            let date =
                js_sys::Date::new_with_year_month_day_hr_min(y.max(0) as u32, mo - 1, d, h, mi);
            let t = date.get_time() / 1000.0;
            // The engine's own bounds on an instant (1583–9999), not a second copy of them.
            if Utc::from_unix(t).is_ok() {
                scenario.update(|s| s.sun_time = t);
            }
        }
    };
    let climates = crate::engine::outdoors::irradiance::Climate::ALL
        .into_iter()
        .map(|c| {
            view! {
                <option value=scenario::climate_id(c) prop:selected=move || scenario.with(|s| s.climate == c)>
                    {c.name()}
                </option>
            }
        })
        .collect_view();
    view! {
        <div class:hidden=move || !scenario.with(|s| s.outdoors() && s.sun_input == scenario::SunInput::Place)>
            <div class="field">
                <label for="in-sun-time">"Local date and time"<small>{move || format!("this device's time zone; {}", Utc::minute_text(scenario.with(|s| s.sun_time)).unwrap_or_default())}</small></label>
                <input id="in-sun-time" type="datetime-local" data-field="tu"
                    prop:value=move || local_text(scenario.with(|s| s.sun_time)) on:change=set_local/>
            </div>
            <div class="field">
                <label for="in-climate">"Clear-sky atmosphere"<small>"Hottel's climate type: the beam that gets through"</small></label>
                <select id="in-climate" class="wide" data-choice="climate" on:change=move |ev| {
                    if let Some(c) = scenario::climate_from_id(&event_target_value(&ev)) {
                        scenario.update(|s| s.climate = c);
                    }
                }>{climates}</select>
            </div>
        </div>
    }
}
