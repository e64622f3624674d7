//! Saved work: named scenarios in the browser's storage, a JSON file to carry them, and an import
//! that shows what it will add or replace before it does. The format is the engine's
//! (`engine::store`); this file only talks to the browser.

use leptos::prelude::*;
use wasm_bindgen::JsCast;

use super::mark;
use super::rows::{redraw_changed, row_markup, PAGE};
use super::storage::{json_text, load, read_text, save, write_ahead};
use crate::engine::chart::svg::esc;
use crate::engine::scenario::Scenario;
use crate::engine::store::{self, Plan, Saved, Store};
use crate::engine::survey;
use crate::engine::units::{System, UnitChoice};

/// Compute the survey's figures a slice at a time (about 25 ms, then yield to the browser), and
/// publish the list with its figures once all are known. A newer change (`generation`) stops an
/// older run.
fn compute_list(
    gen: u64,
    generation: StoredValue<u64>,
    saved: RwSignal<Store>,
    figures: StoredValue<survey::Figures>,
    list: RwSignal<Vec<(Saved, survey::Figure)>>,
    progress: RwSignal<Option<(usize, usize)>>,
) {
    if generation.get_value() != gen {
        return;
    }
    // Read in place: the store is not cloned for each slice.
    let t0 = js_sys::Date::now();
    let (counted, shown) = saved.with_untracked(|s| {
        let links: Vec<&str> = s.items.iter().map(|i| i.link.as_str()).collect();
        let done = figures
            .try_update_value(|f| f.fill(&links, &mut || js_sys::Date::now() - t0 < 25.0))
            .unwrap_or(true);
        if !done {
            let known = figures.with_value(|f| links.iter().filter(|l| f.get(l).is_some()).count());
            return (Some((known, links.len())), Vec::new());
        }
        figures.update_value(|f| f.keep_only(&links));
        let shown = figures.with_value(|f| {
            s.items
                .iter()
                .map(|it| {
                    (
                        it.clone(),
                        f.get(&it.link)
                            .cloned()
                            .unwrap_or_else(|| Err("not computed".into())),
                    )
                })
                .collect()
        });
        (None, shown)
    });
    if let Some(p) = counted {
        progress.set(Some(p));
        set_timeout(
            move || compute_list(gen, generation, saved, figures, list, progress),
            std::time::Duration::ZERO,
        );
    } else {
        progress.set(None);
        list.set(shown);
        mark("leeward-survey-shown");
        write_ahead(gen, generation, saved);
    }
}

/// Read the file just chosen in a file input as text, clear the input (so the same file can be
/// chosen again), and hand the text to `then` (boxed: one copy of the reading for both imports).
fn read_chosen_file(ev: leptos::ev::Event, then: Box<dyn FnOnce(String)>) {
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
    /// The item's name: typed here, printed on the report.
    name: RwSignal<String>,
    tag: RwSignal<String>,
    place: RwSignal<String>,
    choice: RwSignal<UnitChoice>,
    /// The survey summary's markup while it prints (the page shows it in place of the report).
    summary: RwSignal<Option<String>>,
    /// Open an item: its inputs, shown in the page's units (the units it was saved in are not
    /// imposed on the page).
    on_open: impl Fn(Scenario) + Copy + Send + Sync + 'static,
) -> impl IntoView {
    let saved = RwSignal::new(Store::default());
    let note = RwSignal::new(None::<String>);
    let held = RwSignal::new(None::<String>);
    // False until the saved work has been read (just after the first result is shown).
    let ready = RwSignal::new(false);
    let pending: RwSignal<Option<(Store, Plan)>> = RwSignal::new(None);

    // What the last change to a row replaced, while it can still be undone (a tap on Delete or
    // Update is easy to make by mistake with one thumb), with a stamp so an older timer does not
    // take away a newer offer.
    let undo = RwSignal::new(None::<(Store, u32)>);
    let offers = StoredValue::new(0u32);
    // Every change to the saved work goes through here: refused while an unreadable store is
    // held (it would be overwritten), and committed to the page only once storage has it; true
    // when it was.
    let commit = move |next: Store, done: String| {
        if !ready.get_untracked() {
            note.set(Some(
                "Not saved yet: the saved work is still being read; try again in a moment.".into(),
            ));
            return false;
        }
        if held.with_untracked(Option::is_some) {
            note.set(Some("Not saved: the saved work that could not be read is still stored and would be overwritten. Download it first (below).".into()));
            return false;
        }
        match save(&next) {
            Ok(()) => {
                saved.set(next);
                note.set(Some(done));
                undo.set(None);
                true
            }
            Err(e) => {
                note.set(Some(format!(
                    "Not saved: {e}. Export a file to keep this work."
                )));
                false
            }
        }
    };
    let save_now = move || {
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
    let export = move || match json_text(&store::file(&saved.get_untracked()), true) {
        Ok(text) => download("leeward-saved-work.json", "application/json", &text),
        Err(e) => note.set(Some(format!("Not exported: {e}."))),
    };
    let import = move |ev: leptos::ev::Event| {
        read_chosen_file(
            ev,
            Box::new(move |text| match read_text(&text) {
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
            }),
        );
    };

    let import_csv = move |ev: leptos::ev::Event| {
        read_chosen_file(
            ev,
            Box::new(move |text| {
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
            }),
        );
    };
    let by_loss = RwSignal::new(false);
    // The list as shown: items with their figures, published together once every figure is
    // known, so a row never shows another item's figures. Figures are remembered by link
    // (`survey::Figures`) and computed in slices of about 25 ms between frames, so the page stays
    // responsive and the first result never waits for the survey.
    let figures = StoredValue::new(survey::Figures::default());
    // The CSV carries each item's results: those already worked out for the list are reused.
    let export_csv = move || {
        let text = figures.with_value(|f| {
            survey::to_csv(&saved.get_untracked().items, system.get_untracked(), f)
        });
        download("leeward-survey.csv", "text/csv", &text);
    };
    let list: RwSignal<Vec<(Saved, survey::Figure)>> = RwSignal::new(Vec::new());
    let progress: RwSignal<Option<(usize, usize)>> = RwSignal::new(None);
    let generation = StoredValue::new(0u64);
    Effect::new(move |_| {
        saved.track();
        generation.update_value(|g| *g += 1);
        compute_list(
            generation.get_value(),
            generation,
            saved,
            figures,
            list,
            progress,
        );
    });
    // Read the saved work once the page has shown its first result.
    set_timeout(
        move || {
            let opened = load();
            saved.set(opened.store);
            note.set(opened.message);
            held.set(opened.held);
            ready.set(true);
            mark("leeward-saved-read");
        },
        std::time::Duration::ZERO,
    );

    let confirm = move || {
        if let Some((incoming, _)) = pending.get_untracked() {
            let next = store::apply_import(&saved.get_untracked(), &incoming);
            pending.set(None);
            commit(next, "Imported.".into());
        }
    };

    // Rows act on their item by name (names are unique in the store): the list shown may be a
    // moment behind the store while new figures are computed.
    let find =
        move |name: &str| saved.with_untracked(|s| s.items.iter().position(|i| i.name == name));
    // Every button of a row is handled here, by what it does (`data-act`) and its row's item
    // (`data-saved`: names are unique in the store); the rows themselves are markup.
    let open_item = move |k: &str| {
        if let Some(it) = find(k).and_then(|i| saved.with_untracked(|s| s.items.get(i).cloned())) {
            if let Ok((sc, _)) = it.scenario() {
                name.set(it.name.clone());
                tag.set(it.tag.clone());
                place.set(it.location.clone());
                on_open(sc);
            }
        }
    };
    let act_on = move |act: &str, k: &str| {
        if act == "open" {
            return open_item(k);
        }
        let before = saved.get_untracked();
        let mut next = before.clone();
        let Some(i) = find(k) else { return };
        let done = match act {
            "update" => {
                let c = &mut next.items[i];
                *c = Saved::new(
                    k,
                    &tag.get_untracked(),
                    &place.get_untracked(),
                    &scenario.get_untracked(),
                    system.get_untracked(),
                );
                format!("“{k}” now holds the inputs shown.")
            }
            "dup" => {
                let mut c = next.items[i].clone();
                c.name = store::free_name(&next, &c.name);
                let n = c.name.clone();
                // Beside its original, where the person is looking.
                next.items.insert(i + 1, c);
                format!("Duplicated as “{n}”.")
            }
            "rename" => {
                let new = store::free_name(&next, &name.get_untracked());
                next.items[i].name = new.clone();
                format!("Renamed to “{new}”.")
            }
            "delete" => {
                let gone = next.items.remove(i).name;
                format!("Deleted “{gone}”.")
            }
            _ => return,
        };
        if commit(next, done) {
            // Offered for 15 s, beside the thumb wherever the list is scrolled.
            offers.update_value(|n| *n = n.wrapping_add(1));
            let id = offers.get_value();
            undo.set(Some((before, id)));
            set_timeout(
                move || {
                    undo.update(|u| {
                        if u.as_ref().is_some_and(|(_, n)| *n == id) {
                            *u = None
                        }
                    })
                },
                std::time::Duration::from_secs(15),
            );
        }
    };
    // The rows in the order shown (sorted by reference, nothing cloned), the first `rows_shown`
    // of them, each as markup (user text escaped). Only the rows that changed are redrawn
    // (`redraw_changed`): a save, a duplicate, a delete or an update touches a row or two; a sort
    // or a unit switch all of those shown.
    let drawn = StoredValue::new(Vec::<String>::new());
    let rows_shown = RwSignal::new(PAGE);
    Effect::new(move |_| {
        let c = choice.get();
        let now: Vec<String> = list.with(|l| {
            let mut rows: Vec<&(Saved, survey::Figure)> = l.iter().collect();
            if by_loss.get() {
                survey::worst_first(&mut rows);
            }
            rows.iter()
                .take(rows_shown.get())
                .map(|(it, res)| {
                    let mut m = String::with_capacity(900);
                    row_markup(&mut m, it, res, &c);
                    m
                })
                .collect()
        });
        if let Ok(Some(tb)) = document().query_selector("[data-saved-list] tbody") {
            drawn.update_value(|before| {
                redraw_changed(&tb, before, &now);
                *before = now;
            });
        }
    });
    // The totals row as markup (its three texts escaped).
    let totals = move || {
        let (head, q, rest) = list.with(|l| super::summary::totals(l.iter(), &choice.get()));
        format!(
            r#"<tr class="totals" data-totals><th scope="row">{}</th><td data-total-loss>{}</td><td colspan="4" data-total-excess>{}</td></tr>"#,
            esc(&head),
            esc(&q),
            esc(&rest)
        )
    };
    let count = move || list.with(Vec::len);
    // The whole survey on paper: built now, shown in place of the one-item report while the
    // browser prints, and taken away after.
    let print_summary = move || {
        let date = super::results::now_local();
        summary.set(Some(list.with(|l| {
            super::summary::summary(l, &choice.get_untracked(), &date)
        })));
        wasm_bindgen_futures::spawn_local(async {
            let _ = window().print();
        });
    };

    let text_field = move |id: &'static str, label: &'static str, sig: RwSignal<String>| {
        view! {
            <div class="field">
                <label for=id>{label}</label>
                <div class="entry"><input id=id type="text" maxlength="120" prop:value=move || sig.get() on:input=move |ev| sig.set(event_target_value(&ev))/></div>
            </div>
        }
    };

    // Every tap in the panel is handled here, in one place (one handler costs less code than one
    // per button): a row's button by what it does (`data-act`) and its row's item (`data-saved`:
    // names are unique in the store; the rows themselves are markup), any other button by its
    // `data-action` (the import plan's Cancel has none).
    let on_click = move |ev: leptos::ev::MouseEvent| {
        let Some(el) = ev
            .target()
            .and_then(|t| t.dyn_into::<web_sys::Element>().ok())
        else {
            return;
        };
        if let Ok(Some(b)) = el.closest("[data-act]") {
            let item = b
                .closest("[data-saved]")
                .ok()
                .flatten()
                .and_then(|r| r.get_attribute("data-saved"));
            if let (Some(act), Some(k)) = (b.get_attribute("data-act"), item) {
                // The row's menu closes once its action is taken.
                if let Ok(Some(menu)) = b.closest("details") {
                    let _ = menu.remove_attribute("open");
                }
                act_on(&act, &k);
            }
            return;
        }
        let Ok(Some(b)) = el.closest("button") else {
            return;
        };
        match b.get_attribute("data-action").as_deref() {
            Some("save") => save_now(),
            Some("export") => export(),
            Some("print") => {
                // beforeprint builds the report; print once it is in the page.
                let _ = window().dispatch_event(&web_sys::Event::new("beforeprint").unwrap());
                wasm_bindgen_futures::spawn_local(async {
                    let _ = window().print();
                });
            }
            Some("download-unreadable") => {
                if let Some(text) = held.get_untracked() {
                    download("leeward-unreadable-saved-work.txt", "text/plain", &text);
                }
            }
            Some("release-unreadable") => {
                if let Some(text) = held.get_untracked() {
                    download("leeward-unreadable-saved-work.txt", "text/plain", &text);
                }
                held.set(None);
                note.set(Some(
                    "Downloaded. Saving here will now replace the unreadable text.".into(),
                ));
            }
            Some("confirm-import") => confirm(),
            None if b.closest("[data-import-plan]").ok().flatten().is_some() => {
                pending.set(None);
                note.set(Some("Import cancelled.".into()));
            }
            Some("export-csv") => export_csv(),
            Some("sort") => by_loss.update(|b| *b = !*b),
            Some("print-summary") => print_summary(),
            Some("undo") => {
                if let Some((before, _)) = undo.get_untracked() {
                    commit(before, "Undone: the list is as it was.".into());
                }
            }
            Some("more") => rows_shown.update(|n| *n += PAGE),
            _ => {}
        }
    };
    // Both file inputs, by their `data-action` (the text inputs' change events pass by).
    let on_change = move |ev: leptos::ev::Event| {
        let act = ev
            .target()
            .and_then(|t| t.dyn_into::<web_sys::Element>().ok())
            .and_then(|e| e.get_attribute("data-action"));
        match act.as_deref() {
            Some("import") => import(ev),
            Some("import-csv") => import_csv(ev),
            _ => {}
        }
    };
    view! {
        <section aria-labelledby="saved-title" data-panel="saved" data-saved-ready=move || ready.get().to_string() on:click=on_click on:change=on_change>
            <h2 id="saved-title">"5 · Saved work"</h2>
            {text_field("in-save-name", "Name", name)}
            {text_field("in-save-tag", "Item tag (optional; printed on the report)", tag)}
            {text_field("in-save-place", "Location (optional; printed on the report)", place)}
            <div class="actions">
                <button type="button" data-action="save">"Save this scenario"</button>
                <button type="button" data-action="export">"Export all to a file"</button>
                <label class="file-button">"Import a file"<input type="file" accept=".json,application/json" data-action="import"/></label>
                <button type="button" data-action="print">"Print a one-page report"</button>
            </div>
            <p class="notice" role="status" data-saved-note class:hidden=move || note.with(|n| n.is_none())>{move || note.get()}</p>
            {move || held.with(Option::is_some).then(|| view! {
                <div class="actions" data-held>
                    <button type="button" data-action="download-unreadable">"Download the unreadable saved work"</button>
                    <button type="button" data-action="release-unreadable">"Download it and start afresh"</button>
                </div>
            })}
            {move || pending.with(|p| p.as_ref().map(|(_, plan)| {
                let adds = plan.add.join(", ");
                let repl = plan.replace.join(", ");
                view! {
                    <div class="import-plan" data-import-plan>
                        <p>{format!("Adds: {}", if adds.is_empty() { "nothing".to_string() } else { adds })}</p>
                        <p>{format!("Replaces: {}", if repl.is_empty() { "nothing".to_string() } else { repl })}</p>
                        <button type="button" data-action="confirm-import">"Import"</button>
                        <button type="button">"Cancel"</button>
                    </div>
                }
            }))}
            <div class="actions">
                <button type="button" data-action="export-csv">"Export the list as CSV"</button>
                <label class="file-button">"Import CSV rows"<input type="file" accept=".csv,text/csv" data-action="import-csv"/></label>
                <button type="button" data-action="sort" title="Items read with infrared by what their defects cost a year over design, then the others by heat loss" aria-pressed=move || by_loss.get().to_string()>"Worst first"</button>
                <button type="button" data-action="print-summary">"Print the survey summary"</button>
            </div>
            <p class="notice" role="status" data-survey-progress class:hidden=move || progress.with(|p| p.is_none())>
                {move || progress.get().map(|(done, all)| format!("Computing the survey list: {done} of {all} items…"))}
            </p>
                        <div class="table-wrap" tabindex="0" role="region" aria-label="Survey list (scrolls sideways)">
                <table class="saved-list" data-saved-list data-items=move || count().to_string()>
                    <caption>"Survey list: every saved item with its results"</caption>
                    <thead><tr><th scope="col">"Item"</th><th scope="col">"Heat loss"</th><th scope="col">"Surface"</th><th scope="col">"Checks"</th><th scope="col">"Range"</th><th scope="col">"Actions"</th></tr></thead>
                    <tbody></tbody>
                    <tfoot inner_html=totals></tfoot>
                </table>
            </div>
            <div class="undo-bar" role="status" data-undo class:hidden=move || undo.with(Option::is_none)>
                <span>{move || note.get()}</span>
                <button type="button" data-action="undo">"Undo"</button>
            </div>
            <div class="actions" data-more class:hidden=move || count() <= rows_shown.get()>
                <span>{move || format!("Showing {} of {} items.", rows_shown.get().min(count()), count())}</span>
                <button type="button" data-action="more">{move || format!("Show {} more", PAGE.min(count().saturating_sub(rows_shown.get())))}</button>
            </div>
        </section>
    }
}
