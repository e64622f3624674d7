//! A regression net for restructuring: `evaluate` over a fixed set of scenarios, compared bit for
//! bit with the outcomes recorded in `tests/data/evaluate_snapshot.csv` (self-computed: a
//! regression fixture, not a published value). Every number, flag and line of working the page
//! shows is in the outcome's `Debug` text, whose floats print to the last bit; the fixture keeps a
//! 64-bit FNV-1a hash of that text per scenario, with the scenario's link so a failing case can be
//! opened on the page.
//!
//! A change that is meant to move numbers (a physics fix) regenerates the fixture, and says so in
//! its commit: `LEEWARD_WRITE_SNAPSHOT=1 cargo test --test it snapshot`. A restructure must not.

use leeward::engine::body::{Axis, Shape, Wind};
use leeward::engine::scenario::{self, FluidKind, Scenario, SurfaceMode, DEMO};
use leeward::engine::units::System;

const FIXTURE: &str = concat!(
    env!("CARGO_MANIFEST_DIR"),
    "/tests/data/evaluate_snapshot.csv"
);

fn fnv1a(text: &str) -> u64 {
    let mut h: u64 = 0xcbf2_9ce4_8422_2325;
    for b in text.bytes() {
        h ^= u64::from(b);
        h = h.wrapping_mul(0x0100_0000_01b3);
    }
    h
}

/// The fixed set: every shape, several streams, both surface modes with 0–3 layers, still air and
/// wind, an upright body, a vertical stream.
fn cases() -> Vec<(String, Scenario)> {
    let mut out = Vec::new();
    let fluids = [
        (FluidKind::DryAir, 283.15, 333.15),
        (FluidKind::HumidAir, 278.15, 338.15),
        (FluidKind::Water, 288.15, 318.15),
        (FluidKind::EthyleneGlycol, 283.15, 303.15),
        (FluidKind::Steam, 423.15, 473.15),
    ];
    for shape in Shape::ALL {
        for &(fluid, t_inf, t_s) in &fluids {
            for speed in [0.0, 0.4, 7.0] {
                let mut s = DEMO;
                s.shape = shape;
                s.fluid = fluid;
                s.fluid_temp = t_inf;
                s.surface_temp = t_s;
                s.t_surround = t_inf;
                s.speed = speed;
                out.push((format!("{shape:?} {fluid:?} {speed} m/s"), s));
            }
        }
        let mut up = DEMO;
        up.shape = shape;
        up.axis = Axis::Vertical;
        up.wind = Wind::Up;
        up.speed = 0.3;
        out.push((format!("{shape:?} upright, wind up"), up));
    }
    for shape in [Shape::Cylinder, Shape::Sphere] {
        for layers in 0..=3 {
            for speed in [0.0, 3.0, 12.0] {
                let mut s = DEMO;
                s.shape = shape;
                s.surface_mode = SurfaceMode::Solved;
                s.layer_count = layers;
                s.speed = speed;
                s.process_temp = if layers == 2 { 453.15 } else { 343.15 };
                s.loss_target = if layers == 1 { 40.0 } else { 0.0 };
                out.push((format!("{shape:?} solved, {layers} layers, {speed} m/s"), s));
            }
        }
    }
    let mut cold = DEMO;
    cold.surface_mode = SurfaceMode::Solved;
    cold.process_temp = 276.15;
    cold.fluid_temp = 303.15;
    cold.t_surround = 303.15;
    out.push(("cold line, sweating".into(), cold));
    let mut freezing = DEMO;
    freezing.surface_mode = SurfaceMode::Solved;
    freezing.process_temp = 283.15;
    freezing.fluid_temp = 258.15;
    freezing.t_surround = 258.15;
    freezing.freeze_target = 8.0 * 3600.0;
    out.push(("still water line in frost".into(), freezing));
    out
}

fn record(s: &Scenario) -> u64 {
    match scenario::evaluate(s) {
        Ok(o) => fnv1a(&format!("{o:?}")),
        Err(e) => fnv1a(&format!("error: {e:?}")),
    }
}

#[test]
fn evaluate_is_unchanged_bit_for_bit_over_the_fixed_set() {
    let cases = cases();
    assert!(cases.len() > 100, "{}", cases.len());
    let now: Vec<String> = cases
        .iter()
        .map(|(name, s)| {
            format!(
                "{name},{:016x},{}",
                record(s),
                scenario::to_fragment(s, System::Si)
            )
        })
        .collect();
    if std::env::var_os("LEEWARD_WRITE_SNAPSHOT").is_some() {
        let mut text = String::from(
            "# source: self-computed by tests/it/snapshot.rs (regression fixture, not a published value)\n# kind: FNV-1a 64 of the Debug text of scenario::evaluate's outcome, per scenario\ncase,hash,link\n",
        );
        for line in &now {
            text.push_str(line);
            text.push('\n');
        }
        std::fs::write(FIXTURE, text).expect("fixture written");
        return;
    }
    let text = std::fs::read_to_string(FIXTURE).expect("the fixture exists");
    let recorded: Vec<&str> = text
        .lines()
        .filter(|l| !l.starts_with('#') && !l.starts_with("case,"))
        .collect();
    assert_eq!(recorded.len(), now.len(), "the fixed set changed size");
    let changed: Vec<&str> = recorded
        .iter()
        .zip(&now)
        .filter(|(a, b)| a != &b)
        .map(|(a, _)| *a)
        .collect();
    assert!(
        changed.is_empty(),
        "{} of {} outcomes changed, first: {}",
        changed.len(),
        now.len(),
        changed[0]
    );
}
