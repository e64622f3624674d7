//! Saved work: named scenarios kept in the browser and carried in a JSON file.
//!
//! Format (README, "Saved work"), version 1:
//! `{"format":"leeward-saved-work","version":1,"scenarios":[{"name":…,"tag":…,"location":…,"link":…}],"unreadable":[…]}`.
//! Each scenario is its link fragment (itself versioned, see `scenario::to_fragment`), so the
//! file and the links stay one format. Entries that cannot be read are kept, as they were, under
//! `unreadable`, never dropped.
//!
//! The text crosses with serde (`serde_json` natively; the page's own `JSON.parse` and
//! `JSON.stringify` through `serde-wasm-bindgen`): [`file`] is what is written, [`read`] takes a
//! parsed [`Value`] apart, [`verify`] checks a write before it is committed.

use serde::{Deserialize, Serialize};

use crate::engine::scenario::{self, Scenario};
use crate::engine::units::System;
pub use crate::engine::value::{too_deep, Value};

pub const FORMAT: &str = "leeward-saved-work";
pub const VERSION: u32 = 1;
pub const MAX_NAME: usize = 120;

#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Saved {
    pub name: String,
    #[serde(default)]
    pub tag: String,
    #[serde(default)]
    pub location: String,
    /// The scenario as a link fragment (without '#').
    pub link: String,
}

impl Saved {
    pub fn new(name: &str, tag: &str, location: &str, s: &Scenario, system: System) -> Self {
        Saved {
            name: clip(name),
            tag: clip(tag),
            location: clip(location),
            link: scenario::to_fragment(s, system),
        }
    }
    pub fn scenario(&self) -> Result<(Scenario, System), String> {
        scenario::from_fragment(&self.link)
    }
}

/// Trimmed and cut to [`MAX_NAME`] characters, trimmed again (a cut can end in a space, which
/// the reader would trim: the name must read back as written).
fn clip(s: &str) -> String {
    let cut: String = s.trim().chars().take(MAX_NAME).collect();
    cut.trim_end().to_string()
}

#[derive(Debug, Clone, PartialEq, Default)]
pub struct Store {
    pub items: Vec<Saved>,
    /// Entries that could not be read, kept as they were.
    pub unreadable: Vec<Value>,
}

/// A store read back, with what could not be read and why.
#[derive(Debug, Clone, PartialEq)]
pub struct Loaded {
    pub store: Store,
    pub problems: Vec<String>,
}

/// The saved-work file as written: serialise it with any serde serializer.
#[derive(Serialize)]
pub struct File<'a> {
    format: &'static str,
    version: u32,
    scenarios: &'a [Saved],
    unreadable: &'a [Value],
}

/// The entries of the last text written, each with its own text, in order. A change to a long
/// list writes only the entries between the unchanged start and the unchanged end (an edit, an
/// insertion, a deletion: one entry), and the file's text is put together from the parts.
#[derive(Debug, Default)]
pub struct Written(Vec<(Saved, String)>);

impl Written {
    /// Bring the written entries to `items`, writing each entry not already written with
    /// `write` (its text, or `None` when it could not be written and read back). Returns how
    /// many were written; on `None` nothing has changed.
    pub fn update(
        &mut self,
        items: &[Saved],
        write: &mut dyn FnMut(&Saved) -> Option<String>,
    ) -> Option<usize> {
        let old = &self.0;
        let same = |(i, (k, _)): (&Saved, &(Saved, String))| i == k;
        let head = items.iter().zip(old).take_while(|&p| same(p)).count();
        let tail = items[head..]
            .iter()
            .rev()
            .zip(old[head..].iter().rev())
            .take_while(|&p| same(p))
            .count();
        let mut new = Vec::new();
        for i in &items[head..items.len() - tail] {
            new.push((i.clone(), write(i)?));
        }
        let n = new.len();
        let end = old.len() - tail;
        self.0.splice(head..end, new);
        Some(n)
    }

    /// Write ahead, while the page is idle, the entries of `items` not yet written, from the
    /// first that differs, for as long as `more()` allows; true when every entry is written (or
    /// one could not be, which the next [`Written::update`] reports).
    pub fn extend(
        &mut self,
        items: &[Saved],
        write: &mut dyn FnMut(&Saved) -> Option<String>,
        more: &mut dyn FnMut() -> bool,
    ) -> bool {
        let head = items
            .iter()
            .zip(&self.0)
            .take_while(|(i, (k, _))| i == &k)
            .count();
        self.0.truncate(head);
        for i in &items[head..] {
            if !more() {
                return false;
            }
            let Some(t) = write(i) else { return true };
            self.0.push((i.clone(), t));
        }
        true
    }

    /// The file's text with the `unreadable` list's text: exactly what serialising [`file`]
    /// whole writes (tested against `serde_json`).
    pub fn text(&self, unreadable: &str) -> String {
        let mut t = format!(r#"{{"format":"{FORMAT}","version":{VERSION},"scenarios":["#);
        for (k, (_, e)) in self.0.iter().enumerate() {
            if k > 0 {
                t.push(',');
            }
            t.push_str(e);
        }
        t + "],\"unreadable\":" + unreadable + "}"
    }
}

/// Whether `v`, an entry read back, holds exactly `i` (compared as written).
pub fn reads_as(i: &Saved, v: &Value) -> bool {
    let t = |k: &str| v.get(k).and_then(Value::as_str);
    t("name") == Some(i.name.as_str())
        && t("tag") == Some(i.tag.as_str())
        && t("location") == Some(i.location.as_str())
        && t("link") == Some(i.link.as_str())
}

pub fn file(s: &Store) -> File<'_> {
    File {
        format: FORMAT,
        version: VERSION,
        scenarios: &s.items,
        unreadable: &s.unreadable,
    }
}

/// The longest saved-work text the reader accepts (characters): every write is held to it.
pub const MAX_TEXT: usize = 4 * 1024 * 1024;

/// Before a text is parsed: refuse what the reader would not take (too long, nested too deep).
pub fn admissible(text_len: usize, text: &str) -> Result<(), String> {
    if text_len > MAX_TEXT {
        return Err(format!(
            "the text is {:.1} MB, more than the {:.0} MB this page reads",
            text_len as f64 / 1e6,
            MAX_TEXT as f64 / (1024.0 * 1024.0)
        ));
    }
    if too_deep(text) {
        return Err("nested too deeply to be a saved-work file".into());
    }
    Ok(())
}

/// A text of `text_len` characters is no longer than the reader accepts.
pub fn verify_length(text_len: usize) -> Result<(), String> {
    if text_len > MAX_TEXT {
        return Err(format!(
            "the saved work would be {:.1} MB, more than the {:.0} MB this page can read back",
            text_len as f64 / 1e6,
            MAX_TEXT as f64 / (1024.0 * 1024.0)
        ));
    }
    Ok(())
}

/// Check a write before it is committed: the text (of `text_len` characters) is no longer than
/// the reader accepts, and `back` — the text parsed again — holds the very same entries (compared
/// as written; the links were checked when they were made or read). A write that fails is refused
/// with the reason; the caller then changes nothing and offers an export instead.
pub fn verify(s: &Store, text_len: usize, back: Result<Value, String>) -> Result<(), String> {
    verify_length(text_len)?;
    let same = back.ok().is_some_and(|v| {
        let list = v.get("scenarios").and_then(Value::as_array).unwrap_or(&[]);
        list.len() == s.items.len()
            && list.iter().zip(&s.items).all(|(e, i)| reads_as(i, e))
            && v.get("unreadable").and_then(Value::as_array) == Some(s.unreadable.as_slice())
    });
    if same {
        Ok(())
    } else {
        Err("the saved work would not read back as written".into())
    }
}

/// The file as text, natively (tests, harnesses, the build step): `serde_json`, compact.
#[cfg(not(target_arch = "wasm32"))]
pub fn to_json(s: &Store) -> String {
    serde_json::to_string(&file(s)).expect("a store always serialises")
}

/// Parse a text, natively, as the page does: bounded first, then `serde_json`.
#[cfg(not(target_arch = "wasm32"))]
pub fn parse(text: &str) -> Result<Value, String> {
    admissible(text.len(), text)?;
    serde_json::from_str(text).map_err(|e| e.to_string())
}

/// The text to write for `s`, natively, checked as the page checks it.
#[cfg(not(target_arch = "wasm32"))]
pub fn checked_text(s: &Store) -> Result<String, String> {
    let text = to_json(s);
    verify(s, text.len(), parse(&text))?;
    Ok(text)
}

/// Read a saved-work text, natively (see [`read`]).
#[cfg(not(target_arch = "wasm32"))]
pub fn from_json(text: &str) -> Result<Loaded, String> {
    read(parse(text).map_err(|e| format!("not a saved-work file: {e}"))?)
}

/// Take a parsed saved-work file apart. `Err` when nothing of it can be read (another format, a
/// later version); otherwise every readable entry, and a problem line for each one that is not.
pub fn read(v: Value) -> Result<Loaded, String> {
    if v.get("format").and_then(Value::as_str) != Some(FORMAT) {
        return Err("not a Leeward saved-work file (no \"format\": \"leeward-saved-work\")".into());
    }
    match v.get("version").and_then(Value::as_f64) {
        Some(n) if n == VERSION as f64 => {}
        Some(n) if n > VERSION as f64 => {
            return Err(format!("written by a later version of the page (format {n}); this page reads version {VERSION}"))
        }
        _ => return Err("the file's format version is missing or unknown".into()),
    }
    let mut store = Store::default();
    let mut problems = Vec::new();
    // A file of the right format but another shape keeps everything it holds: whatever is not
    // where it should be is kept aside, unread, with a line saying so (never dropped).
    if let Value::Object(members) = &v {
        for (k, val) in members {
            match (k.as_str(), val) {
                ("format" | "version", _) | ("scenarios", Value::Array(_)) => {}
                ("unreadable", Value::Array(old)) => store.unreadable.extend(old.iter().cloned()),
                _ => {
                    problems.push(format!(
                        "“{k}” is not where or what this page expects; kept aside unread"
                    ));
                    store.unreadable.push(val.clone());
                }
            }
        }
    }
    if v.get("scenarios").is_none() {
        problems.push("the file has no “scenarios” list".into());
    }
    let entries = v.get("scenarios").and_then(Value::as_array).unwrap_or(&[]);
    for (i, e) in entries.iter().enumerate() {
        let text = |k: &str| e.get(k).and_then(Value::as_str).map(str::to_string);
        let item = match (text("name"), text("link")) {
            (Some(name), Some(link)) if !name.trim().is_empty() => Saved {
                name: clip(&name),
                tag: clip(&text("tag").unwrap_or_default()),
                location: clip(&text("location").unwrap_or_default()),
                link,
            },
            _ => {
                problems.push(format!(
                    "entry {}: no name or no scenario link; kept aside unread",
                    i + 1
                ));
                store.unreadable.push(e.clone());
                continue;
            }
        };
        match item.scenario() {
            Ok(_) => store.items.push(item),
            Err(why) => {
                problems.push(format!(
                    "entry {} ({}): {why}; kept aside unread",
                    i + 1,
                    item.name
                ));
                store.unreadable.push(e.clone());
            }
        }
    }
    Ok(Loaded { store, problems })
}

/// What an import would do: names it adds, names it replaces.
#[derive(Debug, Clone, PartialEq)]
pub struct Plan {
    pub add: Vec<String>,
    pub replace: Vec<String>,
}

pub fn plan_import(current: &Store, incoming: &Store) -> Plan {
    let incoming = distinct_names(current, incoming);
    let mut plan = Plan {
        add: Vec::new(),
        replace: Vec::new(),
    };
    for i in &incoming.items {
        if current.items.iter().any(|c| c.name == i.name) {
            plan.replace.push(i.name.clone());
        } else {
            plan.add.push(i.name.clone());
        }
    }
    plan
}

/// The incoming store with names repeated inside it made distinct: the first of a name keeps it
/// (and replaces a saved item of that name, as the plan says); each later one is renamed
/// "name (n)" to a name free in both stores. The plan and the import use the same names.
pub fn distinct_names(current: &Store, incoming: &Store) -> Store {
    let mut seen = Namer::default();
    let mut namer = Namer::new(
        current
            .items
            .iter()
            .chain(incoming.items.iter())
            .map(|i| i.name.as_str()),
    );
    let mut out = incoming.clone();
    for i in out.items.iter_mut() {
        if !seen.taken.insert(fnv(&i.name), 1) {
            i.name = namer.name(&i.name);
            seen.taken.insert(fnv(&i.name), 1);
        }
    }
    out
}

/// Carry out an import the user has seen the plan of.
pub fn apply_import(current: &Store, incoming: &Store) -> Store {
    let incoming = distinct_names(current, incoming);
    let mut out = current.clone();
    for i in &incoming.items {
        match out.items.iter_mut().find(|c| c.name == i.name) {
            Some(c) => *c = i.clone(),
            None => out.items.push(i.clone()),
        }
    }
    out.unreadable.extend(incoming.unreadable.iter().cloned());
    out
}

/// A name not yet used in `store`: `base`, or `base (2)`, `base (3)` … (see [`Namer`]).
pub fn free_name(store: &Store, base: &str) -> String {
    Namer::new(store.items.iter().map(|i| i.name.as_str())).name(base)
}

/// Hands out names not yet taken, each at most [`MAX_NAME`] characters: `base`, or `base (n)`
/// with the smallest n ≥ 2 free, the base clipped first so that the number always fits (a
/// clipped candidate could otherwise repeat forever). The next number to try is kept per base,
/// so naming many items alike costs no more than naming them apart: linear in time overall.
#[derive(Debug, Clone, Default)]
pub struct Namer {
    /// The names taken, by their 64-bit FNV-1a hash; `next` the number to try next per base.
    taken: Table,
    next: Table,
}

impl Namer {
    pub fn new<'a>(names: impl IntoIterator<Item = &'a str>) -> Self {
        let mut n = Namer::default();
        for name in names {
            n.taken.insert(fnv(name), 1);
        }
        n
    }

    /// A free name for `base`, now taken. Names are compared by hash: two different names with
    /// the same 64-bit hash would only make a number be skipped, never a name be given twice.
    pub fn name(&mut self, base: &str) -> String {
        let base = match clip(base) {
            b if b.is_empty() => "Scenario".to_owned(),
            b => b,
        };
        let key = fnv(&base);
        if self.taken.insert(key, 1) {
            return base;
        }
        let mut n = self.next.get(key).unwrap_or(2);
        loop {
            let suffix = format!(" ({n})");
            let room = MAX_NAME - suffix.chars().count();
            let stem: String = base.chars().take(room).collect();
            let candidate = format!("{}{suffix}", stem.trim_end());
            n += 1;
            if self.taken.insert(fnv(&candidate), 1) {
                self.next.set(key, n);
                return candidate;
            }
        }
    }
}

fn fnv(s: &str) -> u64 {
    s.bytes().fold(0xcbf2_9ce4_8422_2325, |h, b| {
        (h ^ u64::from(b)).wrapping_mul(0x0100_0000_01b3)
    })
}

/// A small open-addressing map from a 64-bit hash to a number (0 marks an empty slot, so a key
/// of 0 is stored as 1): enough for the namer, without the hashing machinery of the standard
/// collections in the page's wasm.
#[derive(Debug, Clone, Default)]
struct Table {
    slots: Vec<(u64, u64)>,
    len: usize,
}

impl Table {
    fn slot(&self, key: u64) -> usize {
        let mask = self.slots.len() - 1;
        let mut i = (key as usize) & mask;
        while self.slots[i].0 != 0 && self.slots[i].0 != key {
            i = (i + 1) & mask;
        }
        i
    }
    fn get(&self, key: u64) -> Option<u64> {
        let key = key.max(1);
        if self.slots.is_empty() {
            return None;
        }
        let s = self.slots[self.slot(key)];
        (s.0 == key).then_some(s.1)
    }
    /// Set `key` to `value`.
    fn set(&mut self, key: u64, value: u64) {
        let key = key.max(1);
        if (self.len + 1) * 2 > self.slots.len() {
            let old = std::mem::take(&mut self.slots);
            self.slots = vec![(0, 0); (old.len() * 2).max(16)];
            self.len = 0;
            for (k, v) in old.into_iter().filter(|s| s.0 != 0) {
                let i = self.slot(k);
                self.slots[i] = (k, v);
                self.len += 1;
            }
        }
        let i = self.slot(key);
        if self.slots[i].0 == 0 {
            self.len += 1;
        }
        self.slots[i] = (key, value);
    }
    /// Insert `key` if absent; whether it was.
    fn insert(&mut self, key: u64, value: u64) -> bool {
        if self.get(key).is_some() {
            return false;
        }
        self.set(key, value);
        true
    }
}

#[cfg(test)]
#[path = "store_tests.rs"]
mod tests;
