//! Saved work: named scenarios in the browser's storage, a JSON file to carry them, and an import
//! that shows what it will add or replace before it does. The format is the engine's
//! (`engine::store`); this file only talks to the browser.

use leptos::prelude::*;
use wasm_bindgen::JsCast;

use crate::engine::scenario::Scenario;
use crate::engine::store::{self, Plan, Saved, Store};
use crate::engine::survey;
use crate::engine::units::{format_sig, Dim, System, UnitChoice};

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

/// Read the file just chosen in a file input as text, clear the input (so the same file can be
/// chosen again), and hand the text to `then`.
fn read_chosen_file(ev: leptos::ev::Event, then: impl FnOnce(String) + 'static) {
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
        then(text);
    });
}

/// Offer `text` as a download named `name` of type `mime`.
fn download(name: &str, mime: &str, text: &str) {
    let parts = js_sys::Array::of1(&wasm_bindgen::JsValue::from_str(text));
    let bag = web_sys::BlobPropertyBag::new();
    bag.set_type(mime);
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
    choice: RwSignal<UnitChoice>,
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
            "application/json",
            &store::to_json(&saved.get_untracked()),
        );
    };
    let import = move |ev: leptos::ev::Event| {
        read_chosen_file(ev, move |text| match store::from_json(&text) {
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
        });
    };
    let export_csv = move |_| {
        let text = survey::to_csv(&saved.get_untracked().items, system.get_untracked());
        download("leeward-survey.csv", "text/csv", &text);
    };
    let import_csv = move |ev: leptos::ev::Event| {
        read_chosen_file(ev, move |text| {
            let (rows, errors) = survey::from_csv(&text);
            let mut next = saved.get_untracked();
            let n = rows.len();
            let mut namer = store::Namer::new(next.items.iter().map(|i| i.name.as_str()));
            for mut r in rows {
                r.name = namer.name(&r.name);
                next.items.push(r);
            }
            let report = if errors.is_empty() {
                format!("Imported {n} row(s) from the CSV file.")
            } else {
                format!(
                    "Imported {n} row(s); {} problem(s), those rows left out: {}.",
                    errors.len(),
                    errors
                        .iter()
                        .map(|e| e.to_string())
                        .collect::<Vec<_>>()
                        .join("; ")
                )
            };
            commit(next, report);
        });
    };
    let by_loss = RwSignal::new(false);
    // Every item's figures, recomputed when the list changes.
    let results = Memo::new(move |_| {
        saved.with(|s| {
            s.items
                .iter()
                .map(|it| {
                    it.scenario()
                        .map_err(|e| e.to_string())
                        .and_then(|(sc, _)| survey::evaluate_item(&sc).map_err(|e| e.to_string()))
                })
                .collect::<Vec<_>>()
        })
    });

    let confirm = move |_| {
        if let Some((incoming, _)) = pending.get_untracked() {
            let next = store::apply_import(&saved.get_untracked(), &incoming);
            pending.set(None);
            commit(next, "Imported.".into());
        }
    };

    let rows = move || {
        let c = choice.get();
        let f = move |v: f64, d: Dim| {
            let u = c.get(d);
            format!("{} {}", format_sig(u.from_si(v), 4), u.symbol)
        };
        let res = results.get();
        let mut order: Vec<usize> = (0..res.len()).collect();
        if by_loss.get() {
            let loss = |i: &usize| {
                res[*i]
                    .as_ref()
                    .map(|r| r.q_total.abs())
                    .unwrap_or(f64::NEG_INFINITY)
            };
            order.sort_by(|a, b| loss(b).total_cmp(&loss(a)));
        }
        saved.with(|s| {
            order
                .into_iter()
                .filter_map(|i| s.items.get(i).map(|it| (i, it.clone())))
                .map(|(i, it)| {
                    let label = it.name.clone();
                    let figs = match &res[i] {
                        Ok(r) => (f(r.q_total, Dim::HeatFlow), f(r.surface_temp, Dim::Temperature), if r.flags == 0 { "✓".to_string() } else { format!("⚠ {}", r.flags) }),
                        Err(e) => (format!("⚠ {e}"), "—".into(), "—".into()),
                    };
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
                    let update = move |_| {
                        let mut next = saved.get_untracked();
                        if let Some(c) = next.items.get_mut(i) {
                            let n = c.name.clone();
                            *c = Saved::new(&n, &tag.get_untracked(), &place.get_untracked(), &scenario.get_untracked(), system.get_untracked());
                            commit(next, format!("“{n}” now holds the inputs shown."));
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
                    let sub = [it.tag.as_str(), it.location.as_str()].iter().filter(|x| !x.is_empty()).cloned().collect::<Vec<_>>().join(" · ");
                    view! {
                        <tr data-saved=label.clone()>
                            <th scope="row">{label.clone()}<small>{sub}</small></th>
                            <td data-item-loss>{figs.0}</td>
                            <td>{figs.1}</td>
                            <td>{figs.2}</td>
                            <td class="saved-actions">
                                <button type="button" on:click=open>"Open"</button>
                                <button type="button" on:click=update title="Store the inputs shown in this item">"Update"</button>
                                <button type="button" on:click=rename title="Rename to the name typed above">"Rename"</button>
                                <button type="button" on:click=dup>"Duplicate"</button>
                                <button type="button" on:click=delete>"Delete"</button>
                            </td>
                        </tr>
                    }
                })
                .collect_view()
        })
    };
    let totals = move || {
        let c = choice.get();
        let ok: Vec<_> = results
            .get()
            .into_iter()
            .filter_map(|r| r.ok())
            .map(Ok)
            .collect();
        let (q, e, m) = survey::totals(&ok);
        let u =
            |v: f64, d: Dim| format!("{} {}", format_sig(c.get(d).from_si(v), 4), c.get(d).symbol);
        view! {
            <tr class="totals" data-totals>
                <th scope="row">{format!("Total of {} item(s)", results.with(|r| r.len()))}</th>
                <td data-total-loss>{u(q, Dim::HeatFlow)}</td>
                <td colspan="3">{format!("{} · {} per year", u(e, Dim::EnergyPerYear), u(m, Dim::MoneyPerYear))}</td>
            </tr>
        }
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
                <button type="button" data-action="print" on:click=move |_| {
                    // beforeprint builds the report; print once it is in the page.
                    let _ = window().dispatch_event(&web_sys::Event::new("beforeprint").unwrap());
                    wasm_bindgen_futures::spawn_local(async { let _ = window().print(); });
                }>"Print a one-page report"</button>
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
            <div class="actions">
                <button type="button" data-action="export-csv" on:click=export_csv>"Export the list as CSV"</button>
                <label class="file-button">"Import CSV rows"<input type="file" accept=".csv,text/csv" data-action="import-csv" on:change=import_csv/></label>
                <button type="button" data-action="sort" aria-pressed=move || by_loss.get().to_string() on:click=move |_| by_loss.update(|b| *b = !*b)>"Worst first"</button>
            </div>
            <div class="table-wrap" tabindex="0" role="region" aria-label="Survey list (scrolls sideways)">
                <table class="saved-list" data-saved-list>
                    <caption>"Survey list: every saved item with its results"</caption>
                    <thead><tr><th scope="col">"Item"</th><th scope="col">"Heat loss"</th><th scope="col">"Surface"</th><th scope="col">"Range"</th><th scope="col">"Actions"</th></tr></thead>
                    <tbody>{rows}</tbody>
                    <tfoot>{totals}</tfoot>
                </table>
            </div>
        </section>
    }
}
