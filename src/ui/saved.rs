//! Saved work: named scenarios in the browser's storage, a JSON file to carry them, and an import
//! that shows what it will add or replace before it does. The format is the engine's
//! (`engine::store`); this file only talks to the browser.

use leptos::prelude::*;
use wasm_bindgen::JsCast;

use crate::engine::scenario::Scenario;
use crate::engine::store::{self, Plan, Saved, Store};
use crate::engine::units::System;

const KEY: &str = "leeward.saved";
const UNREADABLE_KEY: &str = "leeward.saved.unreadable";

fn storage() -> Option<web_sys::Storage> {
    window().local_storage().ok().flatten()
}

/// Read the store; a message when something could not be read (the raw text is kept aside).
fn load() -> (Store, Option<String>) {
    let Some(st) = storage() else {
        return (Store::default(), Some("This browser keeps no storage for the page here (private mode, or a file the browser isolates): saving is off; export a file instead.".into()));
    };
    let Ok(Some(text)) = st.get_item(KEY) else {
        return (Store::default(), None);
    };
    match store::from_json(&text) {
        Ok(l) if l.problems.is_empty() => (l.store, None),
        Ok(l) => (
            l.store,
            Some(format!(
                "Some saved entries could not be read and were kept aside: {}",
                l.problems.join("; ")
            )),
        ),
        Err(why) => {
            let _ = st.set_item(UNREADABLE_KEY, &text);
            (Store::default(), Some(format!("The saved work could not be read ({why}). Its text is kept under “{UNREADABLE_KEY}” in this browser's storage; nothing was deleted.")))
        }
    }
}

fn save(s: &Store) -> Result<(), String> {
    let st = storage().ok_or("no storage in this browser")?;
    st.set_item(KEY, &store::to_json(s)).map_err(|_| "the browser's storage is full or refused the write: nothing was changed; export a file to keep this work".to_string())
}

/// Offer `text` as a download named `name`.
fn download(name: &str, text: &str) {
    let parts = js_sys::Array::of1(&wasm_bindgen::JsValue::from_str(text));
    let bag = web_sys::BlobPropertyBag::new();
    bag.set_type("application/json");
    let Ok(blob) = web_sys::Blob::new_with_str_sequence_and_options(&parts, &bag) else {
        return;
    };
    let Ok(url) = web_sys::Url::create_object_url_with_blob(&blob) else {
        return;
    };
    if let Some(a) = document()
        .create_element("a")
        .ok()
        .and_then(|e| e.dyn_into::<web_sys::HtmlAnchorElement>().ok())
    {
        a.set_href(&url);
        a.set_download(name);
        a.click();
    }
    let _ = web_sys::Url::revoke_object_url(&url);
}

#[component]
pub fn SavedPanel(
    scenario: RwSignal<Scenario>,
    system: RwSignal<System>,
    tag: RwSignal<String>,
    place: RwSignal<String>,
    on_open: impl Fn(Scenario, System) + Copy + Send + Sync + 'static,
) -> impl IntoView {
    let (start, message) = load();
    let saved = RwSignal::new(start);
    let note = RwSignal::new(message);
    let name = RwSignal::new(String::from("Line 1"));
    let pending: RwSignal<Option<(Store, Plan)>> = RwSignal::new(None);

    let commit = move |next: Store, done: String| match save(&next) {
        Ok(()) => {
            saved.set(next);
            note.set(Some(done));
        }
        Err(e) => note.set(Some(format!("Not saved: {e}."))),
    };
    let save_now = move |_| {
        let mut next = saved.get_untracked();
        let n = store::free_name(&next, &name.get_untracked());
        next.items.push(Saved::new(
            &n,
            &tag.get_untracked(),
            &place.get_untracked(),
            &scenario.get_untracked(),
            system.get_untracked(),
        ));
        commit(next, format!("Saved as “{n}”."));
    };
    let export = move |_| {
        download(
            "leeward-saved-work.json",
            &store::to_json(&saved.get_untracked()),
        );
    };
    let import = move |ev: leptos::ev::Event| {
        let Some(input) = ev
            .target()
            .and_then(|t| t.dyn_into::<web_sys::HtmlInputElement>().ok())
        else {
            return;
        };
        let Some(file) = input.files().and_then(|f| f.get(0)) else {
            return;
        };
        input.set_value("");
        wasm_bindgen_futures::spawn_local(async move {
            let text = wasm_bindgen_futures::JsFuture::from(file.text())
                .await
                .ok()
                .and_then(|v| v.as_string())
                .unwrap_or_default();
            match store::from_json(&text) {
                Ok(l) => {
                    let plan = store::plan_import(&saved.get_untracked(), &l.store);
                    let extra = if l.problems.is_empty() {
                        String::new()
                    } else {
                        format!(" Not importable: {}.", l.problems.join("; "))
                    };
                    note.set(Some(format!("The file adds {} and replaces {} saved scenario(s). Confirm below to import.{extra}", plan.add.len(), plan.replace.len())));
                    pending.set(Some((l.store, plan)));
                }
                Err(why) => note.set(Some(format!("Nothing imported: {why}."))),
            }
        });
    };
    let confirm = move |_| {
        if let Some((incoming, _)) = pending.get_untracked() {
            let next = store::apply_import(&saved.get_untracked(), &incoming);
            pending.set(None);
            commit(next, "Imported.".into());
        }
    };

    let rows = move || {
        saved.with(|s| {
            s.items
                .iter()
                .enumerate()
                .map(|(i, it)| {
                    let label = it.name.clone();
                    let sub = [it.tag.as_str(), it.location.as_str()].iter().filter(|x| !x.is_empty()).cloned().collect::<Vec<_>>().join(" · ");
                    let open = move |_| {
                        let item = saved.with_untracked(|s| s.items.get(i).cloned());
                        if let Some(it) = item {
                            if let Ok((sc, sys)) = it.scenario() {
                                name.set(it.name.clone());
                                tag.set(it.tag.clone());
                                place.set(it.location.clone());
                                on_open(sc, sys);
                            }
                        }
                    };
                    let dup = move |_| {
                        let mut next = saved.get_untracked();
                        if let Some(mut c) = next.items.get(i).cloned() {
                            c.name = store::free_name(&next, &c.name);
                            let n = c.name.clone();
                            next.items.push(c);
                            commit(next, format!("Duplicated as “{n}”."));
                        }
                    };
                    let rename = move |_| {
                        let mut next = saved.get_untracked();
                        let new = store::free_name(&next, &name.get_untracked());
                        if let Some(c) = next.items.get_mut(i) {
                            c.name = new.clone();
                            commit(next, format!("Renamed to “{new}”."));
                        }
                    };
                    let delete = move |_| {
                        let mut next = saved.get_untracked();
                        if i < next.items.len() {
                            let gone = next.items.remove(i).name;
                            commit(next, format!("Deleted “{gone}”."));
                        }
                    };
                    view! {
                        <li data-saved=label.clone()>
                            <span class="saved-name">{label.clone()}<small>{sub}</small></span>
                            <span class="saved-actions">
                                <button type="button" on:click=open>"Open"</button>
                                <button type="button" on:click=rename title="Rename to the name typed above">"Rename"</button>
                                <button type="button" on:click=dup>"Duplicate"</button>
                                <button type="button" on:click=delete>"Delete"</button>
                            </span>
                        </li>
                    }
                })
                .collect_view()
        })
    };

    let text_field = move |id: &'static str, label: &'static str, sig: RwSignal<String>| {
        view! {
            <div class="field">
                <label for=id>{label}</label>
                <div class="entry"><input id=id type="text" maxlength="120" prop:value=move || sig.get() on:input=move |ev| sig.set(event_target_value(&ev))/></div>
            </div>
        }
    };

    view! {
        <section aria-labelledby="saved-title" data-panel="saved">
            <h2 id="saved-title">"5 · Saved work"</h2>
            {text_field("in-save-name", "Name", name)}
            {text_field("in-save-tag", "Item tag (optional; printed on the report)", tag)}
            {text_field("in-save-place", "Location (optional; printed on the report)", place)}
            <div class="actions">
                <button type="button" data-action="save" on:click=save_now>"Save this scenario"</button>
                <button type="button" data-action="export" on:click=export>"Export all to a file"</button>
                <label class="file-button">"Import a file"<input type="file" accept=".json,application/json" data-action="import" on:change=import/></label>
                <button type="button" data-action="print" on:click=move |_| { let _ = window().print(); }>"Print a one-page report"</button>
            </div>
            <p class="notice" role="status" data-saved-note class:hidden=move || note.with(|n| n.is_none())>{move || note.get()}</p>
            {move || pending.with(|p| p.as_ref().map(|(_, plan)| {
                let adds = plan.add.join(", ");
                let repl = plan.replace.join(", ");
                view! {
                    <div class="import-plan" data-import-plan>
                        <p>{format!("Adds: {}", if adds.is_empty() { "nothing".to_string() } else { adds })}</p>
                        <p>{format!("Replaces: {}", if repl.is_empty() { "nothing".to_string() } else { repl })}</p>
                        <button type="button" data-action="confirm-import" on:click=confirm>"Import"</button>
                        <button type="button" on:click=move |_| { pending.set(None); note.set(Some("Import cancelled.".into())); }>"Cancel"</button>
                    </div>
                }
            }))}
            <ul class="saved-list" data-saved-list>{rows}</ul>
        </section>
    }
}
