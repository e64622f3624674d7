//! Saved work: named scenarios kept in the browser and carried in a JSON file.
//!
//! Format (README, "Saved work"), version 1:
//! `{"format":"leeward-saved-work","version":1,"scenarios":[{"name":…,"tag":…,"location":…,"link":…}],"unreadable":[…]}`.
//! Each scenario is its link fragment (itself versioned, see `scenario::to_fragment`), so the
//! file and the links stay one format. Entries that cannot be read are kept, as they were, under
//! `unreadable`, never dropped.

use crate::engine::json::{self, Value};
use crate::engine::scenario::{self, Scenario};
use crate::engine::units::System;

pub const FORMAT: &str = "leeward-saved-work";
pub const VERSION: u32 = 1;
pub const MAX_NAME: usize = 120;

#[derive(Debug, Clone, PartialEq)]
pub struct Saved {
    pub name: String,
    pub tag: String,
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

fn clip(s: &str) -> String {
    s.trim().chars().take(MAX_NAME).collect()
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

pub fn to_json(s: &Store) -> String {
    let items = s
        .items
        .iter()
        .map(|i| {
            format!(
                "{{\"name\":{},\"tag\":{},\"location\":{},\"link\":{}}}",
                json::quote(&i.name),
                json::quote(&i.tag),
                json::quote(&i.location),
                json::quote(&i.link)
            )
        })
        .collect::<Vec<_>>()
        .join(",\n  ");
    let unreadable = s
        .unreadable
        .iter()
        .map(json::write)
        .collect::<Vec<_>>()
        .join(",");
    format!(
        "{{\"format\":{},\"version\":{VERSION},\"scenarios\":[\n  {items}\n],\"unreadable\":[{unreadable}]}}\n",
        json::quote(FORMAT)
    )
}

/// Read a saved-work text. `Err` when nothing of it can be read (not JSON, another format, a
/// later version); otherwise every readable entry, and a problem line for each one that is not.
pub fn from_json(text: &str) -> Result<Loaded, String> {
    let v = json::parse(text).map_err(|e| format!("not a saved-work file: {e}"))?;
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
    if let Some(old) = v.get("unreadable").and_then(Value::as_array) {
        store.unreadable.extend(old.iter().cloned());
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

/// Carry out an import the user has seen the plan of.
pub fn apply_import(current: &Store, incoming: &Store) -> Store {
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

/// A name not yet used: `base`, or `base (2)`, `base (3)` …
pub fn free_name(store: &Store, base: &str) -> String {
    let base = if base.trim().is_empty() {
        "Scenario"
    } else {
        base.trim()
    };
    if !store.items.iter().any(|i| i.name == base) {
        return clip(base);
    }
    (2..)
        .map(|n| clip(&format!("{base} ({n})")))
        .find(|c| !store.items.iter().any(|i| &i.name == c))
        .expect("some number is free")
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
}
