//! The checks of `store`: the saved-work file written and read, entries kept aside, names, the
//! import plan, and the file put together from its entries (`Written`) against `serde_json`.
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
