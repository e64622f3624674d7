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
mod tests {
    use super::*;
    use crate::engine::scenario::DEMO;

    fn sample() -> Store {
        let mut s2 = DEMO;
        s2.diameter = 0.1143;
        Store {
            items: vec![
                Saved::new("Roof line A", "L-101", "Roof, east", &DEMO, System::Si),
                Saved::new("Boiler room \"B\" <4in>", "", "", &s2, System::Us),
            ],
            unreadable: vec![],
        }
    }

    /// The text the page puts together from entries written one at a time is, to the byte, the
    /// file `serde_json` (crates.io) writes whole, after any insertion, deletion or edit at any
    /// place; only the entries that changed are written again; a refused entry changes nothing.
    #[test]
    fn a_file_assembled_from_its_entries_is_the_file_written_whole() {
        let mut s = sample();
        s.items.push(Saved::new(
            "tab\tnew\nline \u{1} é 漢 🙂 \\",
            "t\"",
            "<&>",
            &DEMO,
            System::Si,
        ));
        s.unreadable = vec![
            Value::Number(1.5e-7),
            Value::String("kept \"as\" was".into()),
            Value::Null,
        ];
        let mut w = Written::default();
        let mut write = |i: &Saved| {
            let t = serde_json::to_string(i).unwrap();
            let v: Value = serde_json::from_str(&t).unwrap();
            reads_as(i, &v).then_some(t)
        };
        let unreadable = serde_json::to_string(&s.unreadable).unwrap();
        assert_eq!(w.update(&s.items, &mut write), Some(3));
        assert_eq!(w.text(&unreadable), to_json(&s));
        assert_eq!(w.update(&s.items, &mut write), Some(0));
        for at in 0..=s.items.len() {
            let mut t = s.clone();
            t.items.insert(
                at,
                Saved::new(&format!("new {at}"), "", "", &DEMO, System::Us),
            );
            assert_eq!(w.update(&t.items, &mut write), Some(1), "insert at {at}");
            assert_eq!(w.text(&unreadable), to_json(&t), "insert at {at}");
            t.items.remove((at + 1) % t.items.len());
            assert_eq!(w.update(&t.items, &mut write), Some(0), "delete after {at}");
            assert_eq!(w.text(&unreadable), to_json(&t), "delete after {at}");
            if let Some(e) = t.items.get_mut(at.min(2)) {
                e.tag.push('x');
            }
            assert_eq!(w.update(&t.items, &mut write), Some(1), "edit near {at}");
            assert_eq!(w.text(&unreadable), to_json(&t), "edit near {at}");
            let before = w.text(&unreadable);
            t.items[0].name.push('y');
            assert_eq!(w.update(&t.items, &mut |_| None), None);
            assert_eq!(
                w.text(&unreadable),
                before,
                "a refused write changes nothing"
            );
            assert_eq!(w.update(&s.items, &mut write).map(|n| n <= 3), Some(true));
            assert_eq!(w.text(&unreadable), to_json(&s));
        }
        // Written ahead in pieces (three entries per piece), the next change writes one entry.
        w = Written::default();
        let mut t = s.clone();
        for k in 0..10 {
            t.items
                .push(Saved::new(&format!("more {k}"), "", "", &DEMO, System::Si));
        }
        let mut pieces = 0;
        while !w.extend(&t.items, &mut write, &mut {
            let mut budget = 3;
            move || {
                budget -= 1;
                budget >= 0
            }
        }) {
            pieces += 1;
        }
        assert_eq!(pieces, 4);
        t.items.remove(5);
        assert_eq!(w.update(&t.items, &mut write), Some(0));
        t.items[7].location.push('z');
        assert_eq!(w.update(&t.items, &mut write), Some(1));
        assert_eq!(w.text(&unreadable), to_json(&t));
        w = Written::default();
        assert_eq!(w.update(&[], &mut write), Some(0));
        assert_eq!(w.text("[]"), to_json(&Store::default()));
    }

    /// An entry read back must hold every field as written.
    #[test]
    fn an_entry_reads_as_written_only_when_every_field_is_the_same() {
        let i = &sample().items[1];
        let v: Value = serde_json::from_str(&serde_json::to_string(i).unwrap()).unwrap();
        assert!(reads_as(i, &v));
        for k in 0..4 {
            let mut j = i.clone();
            [&mut j.name, &mut j.tag, &mut j.location, &mut j.link][k].push('x');
            assert!(!reads_as(&j, &v), "field {k}");
        }
    }

    #[test]
    fn export_then_import_is_identical() {
        let s = sample();
        let back = from_json(&to_json(&s)).unwrap();
        assert!(back.problems.is_empty());
        assert_eq!(back.store, s);
        assert_eq!(back.store.items[1].scenario().unwrap().0.diameter, 0.1143);
    }

    #[test]
    fn bad_entries_are_kept_aside_and_the_rest_read() {
        let text = r#"{"format":"leeward-saved-work","version":1,"scenarios":[
            {"name":"good","link":"v=1&D=0.05"},
            {"name":"bad link","link":"v=1&D=-4"},
            {"link":"v=1"},
            42
        ]}"#;
        let l = from_json(text).unwrap();
        assert_eq!(l.store.items.len(), 1);
        assert_eq!(l.store.unreadable.len(), 3);
        assert_eq!(l.problems.len(), 3);
        // Written out again, the unreadable entries are still there.
        let again = from_json(&to_json(&l.store)).unwrap();
        assert_eq!(again.store.unreadable, l.store.unreadable);
    }

    #[test]
    fn whole_files_that_cannot_be_read_say_why() {
        assert!(from_json("not json")
            .unwrap_err()
            .contains("not a saved-work file"));
        assert!(from_json(r#"{"format":"other","version":1}"#).is_err());
        assert!(from_json(r#"{"format":"leeward-saved-work","version":2}"#)
            .unwrap_err()
            .contains("later version"));
        assert!(from_json(r#"{"format":"leeward-saved-work"}"#).is_err());
    }

    #[test]
    fn import_plan_names_what_it_adds_and_replaces() {
        let cur = sample();
        let mut inc = Store::default();
        inc.items
            .push(Saved::new("Roof line A", "", "", &DEMO, System::Si));
        inc.items
            .push(Saved::new("New tank", "", "", &DEMO, System::Si));
        let p = plan_import(&cur, &inc);
        assert_eq!(p.replace, vec!["Roof line A"]);
        assert_eq!(p.add, vec!["New tank"]);
        let after = apply_import(&cur, &inc);
        assert_eq!(after.items.len(), 3);
        assert_eq!(free_name(&after, "New tank"), "New tank (2)");
    }

    /// Regression: a name of 118–120 characters froze the tab when it was taken, because each
    /// candidate "name (n)" was clipped back to the same 120 characters. Every length 0–200,
    /// taken once, twice and three times, gives distinct names of at most 120 characters.
    #[test]
    fn free_name_at_120_characters_does_not_loop() {
        for len in 0..=200 {
            let base: String = "ä".repeat(len);
            let mut store = Store::default();
            for _ in 0..4 {
                let n = free_name(&store, &base);
                assert!(n.chars().count() <= MAX_NAME, "{len}: {n}");
                assert!(
                    !store.items.iter().any(|i| i.name == n),
                    "{len}: {n} repeats"
                );
                store.items.push(Saved::new(&n, "", "", &DEMO, System::Si));
            }
        }
    }

    /// Regression: a store of the right format but another shape ("scenarios" an object, the
    /// list under another key, "unreadable" not a list) opened empty with no message and no copy
    /// kept, and the next save overwrote it. Now each stray part is kept aside, with a line.
    #[test]
    fn a_store_of_another_shape_keeps_everything_aside() {
        let link = scenario::to_fragment(&DEMO, System::Si);
        let entry = format!(
            "{{\"name\":\"A\",\"link\":{}}}",
            serde_json::to_string(&link).unwrap()
        );
        for (text, kept) in [
            (format!("{{\"format\":\"{FORMAT}\",\"version\":1,\"scenarios\":{{\"a\":{entry}}}}}"), 1),
            (format!("{{\"format\":\"{FORMAT}\",\"version\":1,\"items\":[{entry}]}}"), 1),
            (format!("{{\"format\":\"{FORMAT}\",\"version\":1,\"scenarios\":[{entry}],\"unreadable\":7}}"), 1),
        ] {
            let l = from_json(&text).unwrap();
            assert_eq!(l.store.unreadable.len(), kept, "{text}");
            assert!(!l.problems.is_empty(), "{text}");
            // What is kept aside survives a save.
            let again = from_json(&to_json(&l.store)).unwrap();
            assert_eq!(again.store.unreadable, l.store.unreadable);
        }
    }

    /// Regression: after a 10,000-row and a 1,100-row CSV import the store was written at
    /// 4.2 M characters (each link's `&` escaped to six characters), more than the reader takes;
    /// the next load found it unreadable and the next save lost all of it. Now the text is not
    /// inflated, and a store the reader would refuse is refused before it is written.
    #[test]
    fn a_store_the_reader_would_refuse_is_never_written() {
        let item = Saved::new("Pipe", "tag", "place", &DEMO, System::Si);
        let one = to_json(&Store {
            items: vec![item.clone()],
            unreadable: vec![],
        });
        assert!(!one.contains("\\u0026"), "no inflating escapes: {one}");
        let two = to_json(&Store {
            items: vec![item.clone(), item.clone()],
            unreadable: vec![],
        });
        let per = two.len() - one.len();
        let mut namer = Namer::default();
        let store_of = |n: usize, namer: &mut Namer| Store {
            items: (0..n)
                .map(|_| Saved {
                    name: namer.name("Pipe"),
                    ..item.clone()
                })
                .collect(),
            unreadable: vec![],
        };
        let over = store_of(MAX_TEXT / per + 200, &mut namer);
        assert!(to_json(&over).len() > MAX_TEXT);
        let why = checked_text(&over).unwrap_err();
        assert!(why.contains("MB"), "{why}");
        // Names "Pipe (n)" add up to eight characters each.
        let big = store_of(MAX_TEXT / (per + 8) - 10, &mut Namer::default());
        assert!(to_json(&big).len() <= MAX_TEXT);
        let text = checked_text(&big).expect("just under the limit is written");
        assert_eq!(from_json(&text).unwrap().store, big);
    }

    /// Naming 10,000 items alike takes linear time (it once took minutes): each gets the next
    /// number, and all are distinct.
    #[test]
    fn naming_many_alike_is_linear_and_distinct() {
        let mut namer = Namer::new(["Pipe"]);
        let names: Vec<String> = (0..10_000).map(|_| namer.name("Pipe")).collect();
        assert_eq!(names[0], "Pipe (2)");
        assert_eq!(names[9_999], "Pipe (10001)");
        let set: std::collections::HashSet<_> = names.iter().collect();
        assert_eq!(set.len(), names.len());
    }

    /// Regression: a file with two entries of one name kept only the second, silently, although
    /// the plan listed both. Now the second is renamed, in the plan and in the import alike.
    #[test]
    fn an_import_with_a_repeated_name_keeps_both() {
        let roof = Saved::new("Roof A", "", "", &DEMO, System::Si);
        let incoming = Store {
            items: vec![roof.clone(), roof.clone()],
            unreadable: vec![],
        };
        let plan = plan_import(&Store::default(), &incoming);
        assert_eq!(plan.add, vec!["Roof A", "Roof A (2)"]);
        let after = apply_import(&Store::default(), &incoming);
        let names: Vec<&str> = after.items.iter().map(|i| i.name.as_str()).collect();
        assert_eq!(names, vec!["Roof A", "Roof A (2)"]);
        // Against a saved "Roof A": the first replaces it, the second is added beside it.
        let current = Store {
            items: vec![roof.clone()],
            unreadable: vec![],
        };
        let plan = plan_import(&current, &incoming);
        assert_eq!(
            (plan.replace, plan.add),
            (vec!["Roof A".to_string()], vec!["Roof A (2)".to_string()])
        );
    }
}
