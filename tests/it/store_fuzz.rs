//! A fuzz of the saved-work reader and writer: any store the page can hold is written and read
//! back unchanged, a written text is never larger than the reader accepts (else the write is
//! refused), and no text at all — cut, spliced or random — makes the reader panic.
//!
//! Natively the text is `serde_json`'s; the page's is the browser's `JSON.stringify`. The two meet
//! in the browser tests, where the page reads with `JSON.parse` stores written here natively.
use leeward::engine::scenario::{self, DEMO};
use leeward::engine::store::{self, Saved, Store, Value, MAX_TEXT};
use leeward::engine::units::System;
use proptest::prelude::*;

fn kept() -> impl Strategy<Value = Value> {
    let leaf = prop_oneof![
        Just(Value::Null),
        any::<bool>().prop_map(Value::Bool),
        (-1e9..1e9f64).prop_map(Value::Number),
        ".{0,20}".prop_map(Value::String),
    ];
    leaf.prop_recursive(3, 16, 4, |inner| {
        prop_oneof![
            prop::collection::vec(inner.clone(), 0..4).prop_map(Value::Array),
            prop::collection::vec((".{0,8}", inner), 0..4).prop_map(Value::Object),
        ]
    })
}

fn item() -> impl Strategy<Value = Saved> {
    // Names of any characters (markup, quotes, controls, emoji), any length the page accepts.
    (
        ".{1,130}",
        ".{0,30}",
        ".{0,30}",
        0.001..2.0f64,
        any::<bool>(),
    )
        .prop_filter_map("blank names are not saved", |(name, tag, place, d, us)| {
            let mut s = DEMO;
            s.diameter = d;
            let sys = if us { System::Us } else { System::Si };
            let it = Saved::new(&name, &tag, &place, &s, sys);
            (!it.name.is_empty()).then_some(it)
        })
}

fn a_store() -> impl Strategy<Value = Store> {
    (
        prop::collection::vec(item(), 0..12),
        prop::collection::vec(kept(), 0..3),
    )
        .prop_map(|(items, unreadable)| Store { items, unreadable })
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(400))]

    #[test]
    fn any_store_round_trips_and_stays_within_the_readers_bound(s in a_store()) {
        let text = store::checked_text(&s).expect("a small store is written");
        prop_assert!(text.len() <= MAX_TEXT);
        let back = store::from_json(&text).unwrap();
        prop_assert!(back.problems.is_empty(), "{:?}", back.problems);
        prop_assert_eq!(&back.store, &s);
        // Written as the format says: the entries under "scenarios", in order.
        let v: serde_json::Value = serde_json::from_str(&text).expect("valid JSON");
        let list = v["scenarios"].as_array().unwrap();
        prop_assert_eq!(list.len(), s.items.len());
        for (j, it) in list.iter().zip(&s.items) {
            prop_assert_eq!(j["name"].as_str(), Some(it.name.as_str()));
            prop_assert_eq!(j["link"].as_str(), Some(it.link.as_str()));
        }
    }

    #[test]
    fn no_text_makes_the_reader_panic(s in a_store(), cut in 0.0..1.0f64, junk in ".{0,40}") {
        let text = store::to_json(&s);
        let mut at = (cut * text.len() as f64) as usize;
        while !text.is_char_boundary(at) {
            at -= 1;
        }
        for t in [&text[..at], &format!("{}{junk}{}", &text[..at], &text[at..]), junk.as_str()] {
            // Either read (perhaps with entries kept aside) or refused with a reason.
            match store::from_json(t) {
                Ok(l) => {
                    // Whatever was read writes back and reads the same.
                    let again = store::from_json(&store::to_json(&l.store)).unwrap();
                    prop_assert_eq!(again.store, l.store);
                }
                Err(why) => prop_assert!(!why.is_empty()),
            }
        }
    }
}

/// The size bound holds at the edge: a store just over what the reader accepts is refused by the
/// writer (checked on a store built up to the limit).
#[test]
fn a_store_over_the_bound_is_refused_not_written() {
    let base = Saved::new("Pipe", "", "", &DEMO, System::Si);
    let len = |n: usize| {
        store::to_json(&Store {
            items: vec![base.clone(); n],
            unreadable: vec![],
        })
        .len()
    };
    let per = len(2) - len(1);
    let n = MAX_TEXT / per + 10;
    let mut namer = store::Namer::default();
    let items = (0..n)
        .map(|_| Saved {
            name: namer.name("Pipe"),
            ..base.clone()
        })
        .collect();
    let s = Store {
        items,
        unreadable: vec![],
    };
    assert!(store::to_json(&s).len() > MAX_TEXT);
    assert!(store::checked_text(&s).is_err());
    let _ = scenario::from_fragment(&base.link).unwrap();
}
