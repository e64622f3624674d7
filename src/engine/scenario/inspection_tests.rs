//! The inspection in a scenario (issue #20): the mode, its fields, its errors placed on the
//! fields, its card and its working. The physics is checked in `engine::inspect`'s tests and
//! against scipy in `tests/it/infrared.rs`.

use super::*;

fn reading() -> Scenario {
    let mut s = DEMO;
    s.surface_mode = SurfaceMode::Reading;
    s
}

#[test]
fn the_demo_read_with_an_instrument_shows_the_inspection() {
    let s = reading();
    let o = evaluate(&s).unwrap();
    let i = o.inspection.as_ref().expect("an inspection");
    eprintln!(
        "demo read: Ts {} (design {}), f {}, {:?}",
        i.corrected.surface, i.design_surface, i.k.factor, i.condition
    );
    // The rest of the outcome is the design, exactly as the solved mode gives it.
    let mut solved = s;
    solved.surface_mode = SurfaceMode::Solved;
    let d = evaluate(&solved).unwrap();
    assert_eq!((o.q_total, o.surface_temp), (d.q_total, d.surface_temp));
    assert!(d.inspection.is_none());
    assert_eq!(i.design, d.job.as_ref().unwrap().solution.q);
    assert!(o.verdicts.iter().any(|v| v.id == "insulation"));
    // Each step names its method.
    for (title, method) in [
        ("Infrared reading corrected (band radiance)", "ASTM E1862"),
        ("Infrared reading corrected (band radiance)", "Planck"),
        (
            "Effective conductivity of the outer layer (inverse)",
            "regula falsi",
        ),
        (
            "Ranges (bounds by corner evaluation)",
            "not a statistical interval",
        ),
    ] {
        let step = o.working.iter().find(|w| w.title == title).expect(title);
        assert!(step.text.contains(method), "{title}: {}", step.text);
    }
    // Only the reading mode uses the reading's fields.
    for f in [Field::IrReading, Field::IrBandHigh, Field::IrAccuracy] {
        assert!(s.uses(f) && !DEMO.uses(f) && !solved.uses(f));
    }
    assert!(!s.uses(Field::SurfaceTemp) && s.uses(Field::ProcessTemp));
    // The link carries the mode.
    let link = to_fragment(&s, System::Si);
    assert!(link.contains("sm=r") && link.contains("Tir="));
    assert_eq!(from_fragment(&link).unwrap().0, s);
}

#[test]
fn bad_readings_are_messages_on_their_fields() {
    let field = |s: &Scenario| {
        let e = evaluate(s).unwrap_err();
        (
            error_field(s, &e),
            error_message(&e, &units::UnitChoice::for_system(System::Si)),
        )
    };
    let mut hot = reading();
    hot.ir_reading = hot.process_temp + 5.0;
    assert_eq!(field(&hot).0, Some(Field::IrReading));
    let mut band = reading();
    band.ir_band_high = 7e-6;
    let (f, m) = field(&band);
    assert_eq!(f, Some(Field::IrBandHigh));
    assert!(m.contains("7 µm"), "{m}");
    let mut same = reading();
    same.ir_reflected = same.ir_reading;
    assert_eq!(field(&same).0, Some(Field::IrReading));
    let mut black = reading();
    black.emissivity = 0.0;
    assert_eq!(field(&black).0, Some(Field::Emissivity));
    let mut set = reading();
    set.ir_emissivity = 0.0;
    assert!(evaluate(&set).is_err());
    // Colder than the air on a hot line, indoors: no insulation explains it.
    let mut cold = reading();
    cold.ir_reading = cold.fluid_temp - 3.0;
    cold.ir_reflected = cold.fluid_temp + 10.0;
    let (f, m) = field(&cold);
    assert_eq!(f, Some(Field::IrReading));
    assert!(m.contains("no insulation explains it"), "{m}");
    // A bare line has no insulation to judge.
    let mut bare = reading();
    bare.layer_count = 0;
    assert!(evaluate(&bare).is_err());
}

/// A surface read as designed gives a k ratio of 1: the design surface, seen by an instrument
/// set to the surface's own emissivity with the reflection at the surroundings, reads as itself.
#[test]
fn a_surface_read_as_designed_is_as_designed() {
    let mut s = reading();
    s.ir_emissivity = s.emissivity;
    let design = evaluate(&s).unwrap().surface_temp;
    s.ir_reading = design;
    let o = evaluate(&s).unwrap();
    let i = o.inspection.unwrap();
    assert!((i.corrected.surface - design).abs() < 1e-9);
    assert!((i.k.factor - 1.0).abs() < 1e-6, "{}", i.k.factor);
    assert_eq!(i.condition, crate::engine::inspect::Condition::AsDesigned);
    assert!(i.excess_cost.abs() < 1e-6 * o.annual_cost);
}

/// What the instrument displays is not the surface's temperature: set to an emissivity far below
/// the surface's, it shows more than the surface has, even more than the process. Such a reading
/// is corrected and used, not refused (the surface beyond the process is refused once corrected).
/// The displayed figure here comes from the signal balance ε·L(T_s) + (1 − ε)·L(T_r) =
/// ε_set·L(T_d) + (1 − ε_set)·L(T_r) solved by bisection in the test.
#[test]
fn a_display_above_the_process_is_corrected_not_refused() {
    use crate::engine::inspect::radiometry::band_radiance;
    let mut s = reading();
    let design = evaluate(&s).unwrap().inspection.unwrap().design_surface;
    let (ts, eps, set) = (design + 5.0, s.emissivity, 0.02);
    s.ir_emissivity = set;
    let band = (s.ir_band_low, s.ir_band_high);
    let l = |t: f64| band_radiance(t, band);
    let want = (eps * l(ts) + (set - eps) * l(s.ir_reflected)) / set;
    let (mut lo, mut hi) = (ts, 3000.0);
    for _ in 0..200 {
        let mid = 0.5 * (lo + hi);
        if l(mid) < want {
            lo = mid
        } else {
            hi = mid
        }
    }
    s.ir_reading = 0.5 * (lo + hi);
    assert!(
        s.ir_reading > s.process_temp,
        "the display {} K",
        s.ir_reading
    );
    let i = evaluate(&s).unwrap().inspection.unwrap();
    assert!(
        (i.corrected.surface - ts).abs() < 1e-6,
        "{}",
        i.corrected.surface
    );
}

/// A reading whose uncertainty spans two conditions does not pass: the card says the condition
/// is open, and so does its badge.
#[test]
fn a_verdict_the_uncertainty_could_change_is_not_passed() {
    let mut s = reading();
    let i = evaluate(&s).unwrap().inspection.unwrap();
    // Read exactly as designed, with an instrument of ±15 K on a line a few kelvin above the air.
    s.ir_reading = i.design_surface;
    s.ir_emissivity = s.emissivity;
    s.ir_accuracy = 15.0;
    let o = evaluate(&s).unwrap();
    let i = o.inspection.as_ref().unwrap();
    let card = o.verdicts.iter().find(|v| v.id == "insulation").unwrap();
    assert!(i.ranges.k_ratio.hi > 1.3, "{:?}", i.ranges);
    assert!(
        !card.ok && card.summary.contains("could be anything"),
        "{}",
        card.summary
    );
}

/// Safety: a jacket read hotter than the touch limit fails the touch card, whatever the design
/// says (a walk found "✓ Touch" beside a reading of 73 °C on a 60 °C limit); the card keeps the
/// design's figures and says which governs.
#[test]
fn a_reading_over_the_touch_limit_fails_the_touch_card() {
    let mut s = reading();
    s.process_temp = 423.15;
    s.ir_emissivity = s.emissivity;
    let mut solved = s;
    solved.surface_mode = SurfaceMode::Solved;
    let touch = |o: &Outcome| {
        o.verdicts
            .iter()
            .find(|v| v.id == "touch")
            .cloned()
            .unwrap()
    };
    assert!(
        touch(&evaluate(&solved).unwrap()).ok,
        "the design is safe to touch"
    );
    s.ir_reading = 343.15;
    let o = evaluate(&s).unwrap();
    let t = touch(&o);
    assert!(
        !t.ok && t.summary.starts_with("As read: fails"),
        "{}",
        t.summary
    );
    assert!(t.caution.is_some() && t.figures[0].1 >= o.inspection.unwrap().corrected.surface);
    // The design's thickness does not mend a defect; the design's surface is named as such.
    assert!(t.thickness.is_none());
    assert!(t.figures.iter().any(|f| f.0 == "surface as designed"));
    // Read cool, the card passes and still says so.
    s.ir_reading = 300.15;
    let t = touch(&evaluate(&s).unwrap());
    assert!(
        t.ok && t.summary.starts_with("As read: within"),
        "{}",
        t.summary
    );
}

/// The card of the insulation against bare speaks of the line as read, not only as designed: read
/// wet, it saves less than designed by the excess the reading shows; the design's figures stay,
/// named as the design's (a walk found "✓ … saved" beside insulation read as likely wet).
#[test]
fn the_saving_card_says_what_the_insulation_saves_as_read() {
    let mut s = reading();
    s.process_temp = 423.15;
    s.ir_emissivity = s.emissivity;
    s.ir_reading = 300.15;
    let o = evaluate(&s).unwrap();
    let i = o.inspection.as_ref().unwrap();
    let card = o
        .verdicts
        .iter()
        .find(|v| v.id == "saving")
        .expect("a saving card");
    let fig = |l: &str| card.figures.iter().find(|f| f.0 == l).map(|f| f.1);
    let (bare, read, saved_read, saved_design) = (
        fig("bare loss").unwrap(),
        fig("loss as read").unwrap(),
        fig("saved as read").unwrap(),
        fig("saved as designed").unwrap(),
    );
    assert!(card.summary.starts_with("As read:"), "{}", card.summary);
    // The reading is hotter than the design's surface: more is lost than designed, so less is
    // saved, and the two savings differ by the excess loss the inspection reports.
    assert!(i.corrected.surface > i.design_surface);
    assert!(read > bare - saved_design && saved_read < saved_design);
    assert!((saved_design - saved_read - i.excess_total).abs() <= 1e-6 * bare);
    assert!(fig("saved").is_none() && fig("energy saved as designed").is_some());
}
