//! Saved work in the browser's storage: read it at opening (an unreadable text copied aside or
//! held), and write it checked — each entry not written before is written and read back through
//! the browser's JSON, the whole file put together from the entries' texts (`store::Written`),
//! parsed again, stored and read back. The panel (`saved.rs`) calls these; the format is the
//! engine's (`engine::store`).

use leptos::prelude::*;
use wasm_bindgen::JsCast;

use crate::engine::store::{self, Loaded, Saved, Store};

const KEY: &str = "leeward.saved";
const UNREADABLE_KEY: &str = "leeward.saved.unreadable";

fn storage() -> Option<web_sys::Storage> {
    window().local_storage().ok().flatten()
}

/// The message of a JavaScript exception (JSON.parse's syntax error, a storage refusal).
fn js_message(e: &wasm_bindgen::JsValue) -> String {
    e.dyn_ref::<js_sys::Error>()
        .map(|e| String::from(e.message()))
        .unwrap_or_else(|| "not JSON".into())
}

/// Parse saved-work text with the browser's own `JSON.parse`, bounded first (length, nesting).
fn parse_text(text: &str) -> Result<store::Value, String> {
    store::admissible(text.len(), text)?;
    let v = js_sys::JSON::parse(text).map_err(|e| js_message(&e))?;
    serde_wasm_bindgen::from_value(v).map_err(|e| e.to_string())
}

/// Read a saved-work text (storage or a chosen file).
pub(super) fn read_text(text: &str) -> Result<Loaded, String> {
    store::read(parse_text(text).map_err(|e| format!("not a saved-work file: {e}"))?)
}

/// A value's JSON text through the browser's `JSON.stringify` (indented with one space when
/// `indent`, for a file a person may open).
pub(super) fn json_text<T: serde::Serialize + ?Sized>(
    v: &T,
    indent: bool,
) -> Result<String, String> {
    let v = v
        .serialize(&serde_wasm_bindgen::Serializer::json_compatible())
        .map_err(|e| e.to_string())?;
    let t = if indent {
        js_sys::JSON::stringify_with_replacer_and_space(&v, &wasm_bindgen::JsValue::NULL, &1.into())
    } else {
        js_sys::JSON::stringify(&v)
    };
    t.map(String::from).map_err(|e| js_message(&e))
}

thread_local! {
    /// The entries of the last text written, each written and read back (`checked_text`).
    static WRITTEN: std::cell::RefCell<store::Written> = Default::default();
}

/// One entry's text, written and read back through the browser's JSON; `None` when it would
/// not read back as written.
fn entry_text(i: &Saved) -> Option<String> {
    let t = json_text(i, false).ok()?;
    parse_text(&t)
        .is_ok_and(|v| store::reads_as(i, &v))
        .then_some(t)
}

/// Write ahead, about 25 ms at a time while the page is idle, the entries a save would write
/// (`store::Written::extend`), so that the first change to a long list writes only itself.
pub(super) fn write_ahead(gen: u64, generation: StoredValue<u64>, saved: RwSignal<Store>) {
    if generation.get_value() != gen {
        return;
    }
    let t0 = js_sys::Date::now();
    let done = saved.with_untracked(|s| {
        WRITTEN.with_borrow_mut(|w| {
            w.extend(&s.items, &mut entry_text, &mut || {
                js_sys::Date::now() - t0 < 25.0
            })
        })
    });
    if !done {
        set_timeout(
            move || write_ahead(gen, generation, saved),
            std::time::Duration::ZERO,
        );
    }
}

/// The text to store for `s`, checked before anything is written: each entry not written before
/// is written and read back through the browser's JSON (`store::reads_as`), the unreadable list
/// likewise, and the whole text is read again by `JSON.parse`, which must find every entry
/// (`store::verify` makes the same check on a whole file at once).
fn checked_text(s: &Store) -> Result<String, String> {
    let refused = || "the saved work would not read back as written".to_string();
    WRITTEN
        .with_borrow_mut(|w| w.update(&s.items, &mut entry_text))
        .ok_or_else(refused)?;
    let unreadable = json_text(&s.unreadable, false)?;
    if parse_text(&unreadable)
        .ok()
        .is_none_or(|v| v.as_array() != Some(s.unreadable.as_slice()))
    {
        return Err(refused());
    }
    let text = WRITTEN.with_borrow(|w| w.text(&unreadable));
    store::verify_length(text.len())?;
    let count = js_sys::JSON::parse(&text)
        .ok()
        .and_then(|v| js_sys::Reflect::get(&v, &"scenarios".into()).ok())
        .and_then(|l| l.dyn_into::<js_sys::Array>().ok())
        .map(|l| l.length() as usize);
    if count == Some(s.items.len()) {
        Ok(text)
    } else {
        Err(refused())
    }
}

/// What opening the store found.
pub(super) struct Opened {
    pub store: Store,
    pub message: Option<String>,
    /// The text of a store that could not be read and could not be copied aside: the page holds
    /// it, offers it as a download, and writes nothing over it until the person says so.
    pub held: Option<String>,
}

/// Read the store; a message when something could not be read. An unreadable text is copied
/// under `UNREADABLE_KEY` (checked), or held by the page when the copy fails.
pub(super) fn load() -> Opened {
    let Some(st) = storage() else {
        return Opened { store: Store::default(), message: Some("This browser keeps no storage for the page here (private mode, or a file the browser isolates): saving is off; export a file instead.".into()), held: None };
    };
    let Ok(Some(text)) = st.get_item(KEY) else {
        return Opened {
            store: Store::default(),
            message: None,
            held: None,
        };
    };
    match read_text(&text) {
        Ok(l) => Opened {
            store: l.store,
            message: (!l.problems.is_empty()).then(|| {
                format!(
                    "Some saved entries could not be read and were kept aside: {}",
                    l.problems.join("; ")
                )
            }),
            held: None,
        },
        Err(why) => {
            let copied = st.set_item(UNREADABLE_KEY, &text).is_ok()
                && st.get_item(UNREADABLE_KEY).ok().flatten().as_deref() == Some(text.as_str());
            if copied {
                Opened { store: Store::default(), message: Some(format!("The saved work could not be read ({why}). Its text is kept under “{UNREADABLE_KEY}” in this browser's storage; nothing was deleted.")), held: None }
            } else {
                Opened { store: Store::default(), message: Some(format!("The saved work could not be read ({why}), and the browser has no room to keep a copy aside. It is still stored as it was: download it below before saving anything here.")), held: Some(text) }
            }
        }
    }
}

/// Write the store: checked first (size, read-back), written, then read back from storage. On any
/// failure nothing has changed and the reason is returned.
#[inline(never)]
pub(super) fn save(s: &Store) -> Result<(), String> {
    let st = storage().ok_or("no storage in this browser")?;
    let text = js_sys::JsString::from(checked_text(s)?);
    let st: &TextStore = st.unchecked_ref();
    st.set_text(KEY, &text).map_err(|_| {
        "the browser's storage is full or refused the write; nothing was changed".to_string()
    })?;
    // Compared inside the browser (`===` on the two strings): the text is not copied back.
    if st.get_text(KEY) == **text {
        Ok(())
    } else {
        Err("the browser did not keep what was written".into())
    }
}

#[wasm_bindgen::prelude::wasm_bindgen]
extern "C" {
    /// The browser's `Storage`, with a string kept in the browser both ways.
    #[wasm_bindgen(js_name = Storage)]
    type TextStore;
    /// `Storage.setItem` with a string already in the browser.
    #[wasm_bindgen(method, catch, js_name = setItem)]
    fn set_text(
        this: &TextStore,
        key: &str,
        value: &js_sys::JsString,
    ) -> Result<(), wasm_bindgen::JsValue>;
    /// `Storage.getItem`, left in the browser (null when absent).
    #[wasm_bindgen(method, js_name = getItem)]
    fn get_text(this: &TextStore, key: &str) -> wasm_bindgen::JsValue;
}
