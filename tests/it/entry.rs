//! One truth per field: the text a field shows, the unit beside it and the value the scenario
//! computes with must agree at every moment. Over every field, random typing and random unit
//! switches (the page's two actions on a field, `scenario::type_text` and `scenario::switch_unit`)
//! must leave each field either reading, in its unit, as the value used, or refused with a message
//! (the page then marks its results stale).
//!
//! The independent check is the reading itself: `read_field` of the shown text in the shown unit,
//! compared with what the scenario holds.

use leeward::engine::scenario::{self, read_field, FieldSpec, Scenario, DEMO, FIELDS};
use leeward::engine::units::{self, System, Unit, UnitChoice};
use proptest::prelude::*;

#[derive(Debug, Clone)]
enum Act {
    /// Type a text into field `i`.
    Type(usize, String),
    /// Pick the `n`-th unit of field `i`'s quantity.
    Switch(usize, usize),
    /// Flip the whole page to SI or US units.
    System(bool),
}

fn text() -> impl Strategy<Value = String> {
    prop_oneof![
        // Everyday magnitudes, in range in some units and out of it in others.
        (-500.0..5000.0f64).prop_map(|v| format!("{v:.3}")),
        (0.0..200.0f64).prop_map(|v| format!("{v:.0}")),
        (1e-6..1e-1f64).prop_map(|v| format!("{v:e}")),
        prop::sample::select(vec!["", "abc", "1,000", "-", "60,3", "1e999", " 12 ", "0"])
            .prop_map(str::to_string),
    ]
}

fn act() -> impl Strategy<Value = Act> {
    let n = FIELDS.len();
    prop_oneof![
        3 => (0..n, text()).prop_map(|(i, t)| Act::Type(i, t)),
        3 => (0..n, 0..8usize).prop_map(|(i, u)| Act::Switch(i, u)),
        1 => any::<bool>().prop_map(Act::System),
    ]
}

/// The page's state: the scenario, one text per field, the units shown.
struct Page {
    s: Scenario,
    texts: Vec<String>,
    choice: UnitChoice,
}

impl Page {
    fn new() -> Self {
        let choice = UnitChoice::for_system(System::Si);
        let texts = FIELDS
            .iter()
            .map(|f| scenario::shown_text(f, DEMO.get(f.field), choice.get(f.dim)))
            .collect();
        Page {
            s: DEMO,
            texts,
            choice,
        }
    }
    fn change_units(&mut self, new: UnitChoice) {
        for (i, spec) in FIELDS.iter().enumerate() {
            let (from, to) = (self.choice.get(spec.dim), new.get(spec.dim));
            self.texts[i] = scenario::switch_unit(&mut self.s, spec, &self.texts[i], from, to);
        }
        self.choice = new;
    }
    fn apply(&mut self, a: &Act) {
        match a {
            Act::Type(i, t) => {
                let spec = &FIELDS[*i];
                self.texts[*i] = t.clone();
                if let Ok(followed) =
                    scenario::type_text(&mut self.s, spec, t, self.choice.get(spec.dim))
                {
                    // As the page does: the fields that followed show their new values.
                    for f in followed {
                        let j = FIELDS.iter().position(|r| r.field == f).unwrap();
                        let u = self.choice.get(FIELDS[j].dim);
                        self.texts[j] = scenario::shown_text(&FIELDS[j], self.s.get(f), u);
                    }
                }
            }
            Act::Switch(i, n) => {
                let dim = FIELDS[*i].dim;
                let all: Vec<&'static Unit> = units::units_of(dim).collect();
                let mut c = self.choice;
                c.set(all[n % all.len()]);
                self.change_units(c);
            }
            Act::System(us) => self.change_units(UnitChoice::for_system(if *us {
                System::Us
            } else {
                System::Si
            })),
        }
    }
    /// Every field either reads as the value used, or is refused (its message shown).
    fn agrees(&self) -> Result<(), String> {
        for (i, spec) in FIELDS.iter().enumerate() {
            check(
                spec,
                &self.texts[i],
                self.choice.get(spec.dim),
                self.s.get(spec.field),
            )?;
        }
        Ok(())
    }
}

fn check(spec: &FieldSpec, text: &str, unit: &Unit, used: f64) -> Result<(), String> {
    let Ok(meant) = read_field(spec, text, unit) else {
        return Ok(());
    };
    // The shown text is the value used rounded to the unit's display resolution (or to six
    // figures where that rounding would cross a limit): it may differ by half a step of either.
    let (a, b) = (unit.from_si(meant), unit.from_si(used));
    let half = units::resolution(unit).half_step(b).max(5e-6 * b.abs());
    if (a - b).abs() <= half * (1.0 + 1e-9) + 1e-12 {
        Ok(())
    } else {
        Err(format!(
            "{}: shows “{text} {}” (= {meant} SI) but computes with {used} SI",
            spec.key, unit.symbol
        ))
    }
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(300))]

    #[test]
    fn a_field_shows_the_value_it_computes_with_through_any_unit_switch(
        acts in prop::collection::vec(act(), 1..40)
    ) {
        let mut p = Page::new();
        for a in &acts {
            p.apply(a);
            if let Err(e) = p.agrees() {
                prop_assert!(false, "after {a:?}: {e}");
            }
        }
    }
}

/// Defect 4 of the hostile-user report, as it was found: 150 typed with D in m (refused: at most
/// 100 m), then D's unit switched to mm. The field then shows 150 mm; the value used must be
/// 150 mm, not the last good 60.3 mm.
#[test]
fn unit_switch_after_a_refused_entry_uses_what_the_field_shows() {
    let mut p = Page::new();
    let d = FIELDS
        .iter()
        .position(|f| f.key == "D")
        .expect("a diameter field");
    let m = units::unit("m").expect("metres");
    let mm = units::unit("mm").expect("millimetres");
    let mut c = p.choice;
    c.set(m);
    p.change_units(c);
    p.apply(&Act::Type(d, "150".into()));
    assert!(
        read_field(&FIELDS[d], "150", m).is_err(),
        "150 m is refused"
    );
    assert!(
        (p.s.diameter - 0.0603).abs() < 1e-12,
        "the last good value is kept meanwhile"
    );
    c.set(mm);
    p.change_units(c);
    assert_eq!(p.texts[d], "150");
    assert!(
        (p.s.diameter - 0.150).abs() < 1e-12,
        "used: {}",
        p.s.diameter
    );
    p.agrees().unwrap();
}

/// No trap: the surroundings' temperature follows the stream's until a person sets it apart (it
/// once stayed at its old value, and radiation showed −155 W with no word).
#[test]
fn the_surroundings_follow_the_stream_until_set_apart() {
    let mut p = Page::new();
    let ta = FIELDS.iter().position(|f| f.key == "Ta").unwrap();
    let tr = FIELDS.iter().position(|f| f.key == "Tr").unwrap();
    assert_eq!(p.s.t_surround, p.s.fluid_temp);
    p.apply(&Act::Type(ta, "-20".into()));
    assert!((p.s.t_surround - 253.15).abs() < 1e-9 && p.texts[tr] == "-20");
    p.agrees().unwrap();
    p.apply(&Act::Type(tr, "-40".into()));
    p.apply(&Act::Type(ta, "0".into()));
    assert!(
        (p.s.t_surround - 233.15).abs() < 1e-9,
        "set apart, it stays"
    );
    assert!(scenario::field_note(&p.s, leeward::engine::scenario::Field::Surround).is_some());
}

/// The infrared reading's reflected temperature stands for the surroundings the instrument saw
/// (ASTM E1862: the reflected apparent temperature): while a person has not set it apart it
/// follows the stream's temperature, and the surroundings' once those are typed apart; typed
/// apart itself, it stays.
#[test]
fn the_reflected_temperature_follows_the_surroundings_until_set_apart() {
    let mut p = Page::new();
    let key = |k: &str| FIELDS.iter().position(|f| f.key == k).unwrap();
    let (ta, tr, trf) = (key("Ta"), key("Tr"), key("Trf"));
    assert_eq!(p.s.ir_reflected, p.s.fluid_temp);
    p.apply(&Act::Type(ta, "-20".into()));
    assert!((p.s.ir_reflected - 253.15).abs() < 1e-9 && p.texts[trf] == "-20");
    p.apply(&Act::Type(tr, "-30".into()));
    assert!((p.s.ir_reflected - 243.15).abs() < 1e-9 && p.texts[trf] == "-30");
    p.agrees().unwrap();
    p.apply(&Act::Type(trf, "10".into()));
    p.apply(&Act::Type(ta, "0".into()));
    p.apply(&Act::Type(tr, "5".into()));
    assert!(
        (p.s.ir_reflected - 283.15).abs() < 1e-9,
        "set apart, it stays"
    );
}
