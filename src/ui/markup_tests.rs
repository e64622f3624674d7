//! Checks of the results' markup: every row once, nothing lost, text escaped, the report's
//! inputs.

use super::*;
use crate::engine::scenario::{evaluate, DEMO};
use crate::engine::units::System;

/// Each verdict, correlation and property row of the demo is written once, with the
/// attributes the page and its tests find them by, and no number is lost in markup.
#[test]
fn the_demo_writes_every_row_once() {
    let o = evaluate(&DEMO).expect("demo");
    let c = UnitChoice::for_system(System::Us);
    let cards = verdict_cards(&o, &c, None);
    assert_eq!(cards.matches("<article").count(), o.verdicts.len());
    let t = correlation_table(&o, &c);
    assert_eq!(
        t.matches("data-correlation=").count(),
        o.analysis.forced.len() + 2 * usize::from(o.analysis.natural.is_some())
    );
    assert_eq!(t.matches(r#"class="recommended""#).count(), 1);
    let p = property_table(&o, &c);
    assert_eq!(p.matches("data-prop-row=").count(), o.properties.len());
    let r = report(
        &o,
        &DEMO,
        &c,
        &Item {
            name: "<b>Roof & co</b>",
            tag: "\"L-1\"",
            place: "",
            date: "2026-12-05 11:05 (UTC+01:00)",
        },
    );
    assert!(
        r.contains("Leeward report: &lt;b&gt;Roof &amp; co&lt;/b&gt;"),
        "{r}"
    );
    assert!(!r.contains("<b>") && r.contains("item &quot;L-1&quot;"));
    // A clear sky at a date and place prints its instant (in UTC) and atmosphere, which are
    // not table fields; typed sunlight prints neither.
    assert!(!r.contains("Date and time of the clear sky"));
    let mut sun = DEMO;
    sun.setting = crate::engine::scenario::Setting::Outdoors;
    sun.sun_input = crate::engine::scenario::SunInput::Place;
    let so = evaluate(&sun).expect("outdoors");
    let item = Item {
        name: "Roof",
        tag: "",
        place: "",
        date: "",
    };
    let r2 = report(&so, &sun, &c, &item);
    assert!(r2.contains("<dt>Date and time of the clear sky</dt><dd>2026-12-21 12:00 UTC</dd>"));
    assert!(r2.contains("<dt>Clear-sky atmosphere</dt><dd>mid-latitude winter</dd>"));
    let f = figures(&o, &c, " (over L = 39.4 ft)");
    // every output the README lists beside the answer, once, with its full value
    for q in [
        "q_conv",
        "q_rad",
        "h_rad",
        "annual_energy",
        "annual_cost",
        "h",
        "nusselt",
        "reynolds",
        "prandtl",
        "film_temperature",
        "pressure",
        "dew_point",
    ] {
        assert_eq!(
            f.matches(&format!(r#"data-quantity="{q}""#)).count(),
            1,
            "{q}"
        );
    }
    assert!(f.contains(&format!(r#"data-si="{}""#, o.h)));
    for s in [&cards, &t, &p, &r, &f] {
        assert!(!s.contains("NaN") && !s.contains("inf"), "{s}");
        assert_eq!(s.matches('<').count(), s.matches('>').count());
    }
}
