//! The job's verdicts: checks against the lumped models and independent solves.
use super::*;
use crate::engine::heatloss::tests_support::job;

fn targets() -> Targets {
    Targets {
        touch_limit: 333.15,
        dew_point: None,
        dew_margin: 2.0,
        hours: 8000.0,
        price: 0.05 / 3.6e6,
        efficiency: 0.8,
        mass_flow: 0.0,
        process_cp: 4180.0,
        process_water: true,
        wall_heat_capacity: None,
        loss_target: 0.0,
        freeze_target: 0.0,
    }
}

#[test]
fn bare_against_insulated_and_the_touch_thickness() {
    let j = job(0.03, 0.9);
    let r = evaluate(&j, &targets(), 1).unwrap();
    let bare = r.bare.as_ref().unwrap();
    assert!(bare.q > r.solution.q);
    let touch = r.verdicts.iter().find(|v| v.id == "touch").unwrap();
    assert_eq!(touch.ok, r.solution.t_surface <= 333.15);
    // The saving card's energy: (q'_bare − q')·L·hours/efficiency.
    let saved = (bare.q - r.solution.q) * 10.0 * 8000.0 * 3600.0 / 0.8;
    let card = r.verdicts.iter().find(|v| v.id == "saving").unwrap();
    assert!((card.figures[3].1 - saved).abs() < 1e-6 * saved);
}

/// A chilled line (5 °C inside, 30 °C air) gains heat: the card says "heat gain", and no
/// figure is shown negative (the card said "cuts the loss" above a negative "saved").
#[test]
fn a_cold_line_gains_heat_and_the_card_says_so() {
    let mut j = job(0.03, 0.9);
    j.stream.t_inf = 303.15;
    j.t_surround = 303.15;
    j.process_temp = 278.15;
    let r = evaluate(&j, &targets(), 1).unwrap();
    assert!(r.solution.q < 0.0, "heat flows in");
    let card = r.verdicts.iter().find(|v| v.id == "saving").unwrap();
    assert!(
        card.ok && card.summary.contains("heat gain"),
        "{}",
        card.summary
    );
    assert!(
        card.figures.iter().all(|(_, v, _)| *v >= 0.0),
        "{:?}",
        card.figures
    );
    assert_eq!(card.figures[2].0, "gain avoided");
    let bare = r.bare.as_ref().unwrap();
    let avoided = (bare.q.abs() - r.solution.q.abs()) * 10.0;
    assert!((card.figures[2].1 - avoided).abs() < 1e-9 * avoided);
}

/// The thickness that meets the touch limit is offered whether or not the present layer
/// meets it (a technician wants "60 °C needs ≥ 38 mm" either way), and at that thickness
/// the surface sits at the limit: an independent solve of the job with the layer set to it.
#[test]
fn the_touch_thickness_is_given_whether_or_not_the_layer_passes() {
    for present in [0.01, 0.12] {
        let j = job(present, 0.9);
        let r = evaluate(&j, &targets(), 1).unwrap();
        let card = r.verdicts.iter().find(|v| v.id == "touch").unwrap();
        let th = card.thickness.expect("a thickness either way");
        assert_eq!(card.ok, th <= present, "{present}: ok {} th {th}", card.ok);
        let mut at = j.clone();
        at.construction.layers[1].thickness = th;
        let ts = heatloss::solve(&at).unwrap().t_surface;
        assert!((ts - targets().touch_limit).abs() < 1e-4, "{ts}");
    }
}

/// A trickle of water through a bare line in hard frost reaches 0 °C before the outlet: the
/// card says it can freeze. A brisk flow keeps it liquid and says nothing of freezing.
#[test]
fn a_flow_too_small_to_stay_liquid_is_named() {
    let mut j = frost(0.0);
    j.construction.layers.truncate(1);
    j.stream.length = 200.0;
    let mut t = targets();
    t.process_water = true;
    t.process_cp = 4190.0;
    t.mass_flow = 0.001;
    let r = evaluate(&j, &t, 0).unwrap();
    let flow = r.verdicts.iter().find(|v| v.id == "flow").unwrap();
    assert!(!flow.ok && flow.summary.contains("freez") && flow.caution.is_some());
    t.mass_flow = 5.0;
    let r = evaluate(&j, &t, 0).unwrap();
    let flow = r.verdicts.iter().find(|v| v.id == "flow").unwrap();
    assert!(flow.ok && !flow.summary.contains("freez") && flow.caution.is_none());
}

/// The test line with still water at 10 °C inside, in −10 °C air under a −10 °C sky.
fn frost(insulation: f64) -> Job {
    let mut j = job(insulation, 0.9);
    j.stream.t_inf = 263.15;
    j.t_surround = 263.15;
    j.process_temp = 283.15;
    j
}

#[test]
fn freezing_times_follow_the_lumped_model() {
    let j = frost(0.03);
    let r = evaluate(&j, &targets(), 1).unwrap();
    let f = r.verdicts.iter().find(|v| v.id == "freeze").unwrap();
    let (cool, frozen) = (f.figures[0].1, f.figures[1].1);
    assert!(cool > 0.0 && frozen > 0.0);
    // Hand check of the cooling time from the same resistance.
    let r_in = j.construction.r_in;
    let c = WATER_RHO * std::f64::consts::PI * r_in * r_in * WATER_CP;
    let rt = 20.0 / r.solution.q;
    assert!((cool - c * rt * 2f64.ln()).abs() < 1e-9 * cool);
}

/// A 10 mm copper sphere, h = 100 W/(m²·K): τ = ρc(D/6)/h = 8933·385·0.01/6/100 = 57.32 s (hand
/// arithmetic); Bi = 100·0.01/6/401 = 4.2×10⁻³, lumping valid.
#[test]
fn lumped_sphere_by_hand() {
    let v = lumped(
        true,
        0.01,
        100.0,
        (401.0, 8933.0, 385.0),
        300.0,
        400.0,
        300.0 + 100.0 / std::f64::consts::E,
    );
    assert!(
        (v.figures[0].1 - 57.320_083).abs() < 1e-3,
        "{}",
        v.figures[0].1
    );
    assert!(
        (v.figures[1].1 - v.figures[0].1).abs() < 1e-9,
        "one time constant to 1/e"
    );
    assert!(v.ok);
    let thick = lumped(
        false,
        0.3,
        100.0,
        (0.5, 1000.0, 1000.0),
        300.0,
        400.0,
        350.0,
    );
    assert!(!thick.ok, "a thick poor conductor fails the Biot check");
}

/// The freeze-time inverse: a wanted time longer than the job holds out gives the outer-layer
/// thickness at which the lumped times add up to it; a time no insulation can reach says so.
#[test]
fn freeze_time_target_gives_a_thickness_or_says_none_can() {
    let j = frost(0.01);
    let mut t = targets();
    let r = evaluate(&j, &t, 1).unwrap();
    let now = r
        .verdicts
        .iter()
        .find(|v| v.id == "freeze")
        .unwrap()
        .figures[2]
        .1;
    t.freeze_target = 2.0 * now;
    let r = evaluate(&j, &t, 1).unwrap();
    let f = r.verdicts.iter().find(|v| v.id == "freeze").unwrap();
    assert!(!f.ok);
    let th = f.thickness.expect("a thickness");
    assert!(th > 0.01 && th < 0.5, "{th}");
    // At that thickness the job holds out for the time wanted.
    let mut thick = j.clone();
    thick.construction.layers[1].thickness = th;
    let r2 = evaluate(&thick, &t, 1).unwrap();
    let f2 = r2.verdicts.iter().find(|v| v.id == "freeze").unwrap();
    assert!((f2.figures[2].1 / t.freeze_target - 1.0).abs() < 1e-6);
    assert!(f2.ok);
    // A year: no thickness up to 0.5 m holds out (0.5 m gives about a month here).
    t.freeze_target = 365.0 * 86_400.0;
    let r3 = evaluate(&j, &t, 1).unwrap();
    let f3 = r3.verdicts.iter().find(|v| v.id == "freeze").unwrap();
    assert!(f3.summary.contains("cannot stop it"), "{}", f3.summary);
}

/// The loss-per-metre inverse, met and unmet, and a target below what any thickness reaches.
#[test]
fn loss_target_gives_a_thickness_or_says_none_can() {
    let j = job(0.01, 0.9);
    let mut t = targets();
    let q = evaluate(&j, &t, 1).unwrap().solution.q;
    t.loss_target = 0.5 * q;
    let r = evaluate(&j, &t, 1).unwrap();
    let v = r.verdicts.iter().find(|v| v.id == "loss").unwrap();
    assert!(!v.ok);
    let th = v.thickness.expect("a thickness meets it");
    let mut at = j.clone();
    at.construction.layers[1].thickness = th;
    let q_at = heatloss::solve(&at).unwrap().q;
    assert!((q_at / (0.5 * q) - 1.0).abs() < 1e-6, "{q_at}");
    t.loss_target = 2.0 * q;
    let r = evaluate(&j, &t, 1).unwrap();
    let v = r.verdicts.iter().find(|v| v.id == "loss").unwrap();
    assert!(v.ok);
    // Met, it still says which thickness would just meet it (thinner than the present layer).
    assert!(v.thickness.is_some_and(|th| th < 0.01), "{:?}", v.thickness);
    // 1 W/m from a 180 °C line through this insulant would take metres of it.
    t.loss_target = 1.0;
    let r = evaluate(&j, &t, 1).unwrap();
    let v = r.verdicts.iter().find(|v| v.id == "loss").unwrap();
    assert!(
        v.summary.contains("below what this construction can reach"),
        "{}",
        v.summary
    );
    assert!(v.figures[2].1 > 1.0);
}

#[test]
fn flow_outlet_lies_between_inlet_and_air() {
    let j = job(0.03, 0.9);
    let mut t = targets();
    t.mass_flow = 0.2;
    let r = evaluate(&j, &t, 1).unwrap();
    let f = r.verdicts.iter().find(|v| v.id == "flow").unwrap();
    let out = f.figures[1].1;
    assert!(out < j.process_temp && out > j.stream.t_inf);
    assert_eq!(f.figures[2].0, "drop");
    assert!((f.figures[2].1 - (j.process_temp - out)).abs() < 1e-12);
    // A cold line in warmer air warms along the run: a rise, shown positive.
    let mut cold = j.clone();
    cold.process_temp = 263.15;
    cold.t_surround = 288.15;
    cold.stream.t_inf = 288.15;
    let r = evaluate(&cold, &t, 1).unwrap();
    let f = r.verdicts.iter().find(|v| v.id == "flow").unwrap();
    assert!(f.figures[1].1 > 263.15 && f.figures[1].1 < 288.15);
    assert_eq!(f.figures[2].0, "rise");
    assert!(f.figures[2].1 > 0.0);
}

/// Two layers where the inner one alone keeps the surface below the touch limit: the card says
/// so, and does not claim that no thickness brings it to the limit.
#[test]
fn inner_layers_that_meet_the_limit_alone_are_named() {
    let mut j = job(0.12, 0.9);
    let mut outer = j.construction.layers[1].clone();
    outer.thickness = 0.02;
    j.construction.layers.push(outer);
    let r = evaluate(&j, &targets(), 2).unwrap();
    let card = r.verdicts.iter().find(|v| v.id == "touch").unwrap();
    assert!(card.ok && card.thickness.is_none(), "{card:?}");
    assert!(card.summary.contains("on their own"), "{}", card.summary);
}
