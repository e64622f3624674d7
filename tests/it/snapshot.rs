//! A regression net for restructuring: `evaluate` over a fixed set of scenarios, compared bit for
//! bit with the outcomes recorded in `tests/data/evaluate_snapshot.csv` (self-computed: a
//! regression fixture, not a published value). Every number, flag and line of working the page
//! shows is in the outcome's `Debug` text, whose floats print to the last bit; the fixture keeps a
//! 64-bit FNV-1a hash of that text per scenario, with the scenario's link so a failing case can be
//! opened on the page.
//!
//! A change of wording or layout regenerates the hashes and keeps the numbers column, which must
//! then still hold: `LEEWARD_WRITE_SNAPSHOT=1 cargo test --test it snapshot`. A change that is
//! meant to move numbers (a physics fix) rewrites both with `LEEWARD_WRITE_SNAPSHOT=all`, and
//! says so in its commit. A restructure must do neither.

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

/// The main numbers alone, to the last bit: heat flow, per length, surface, h, h_rad, Re, Nu.
/// Kept in their own column so that a change of wording or layout (which moves the hash) can be
/// shown to move no number: the column is rewritten only with `LEEWARD_WRITE_SNAPSHOT=all`.
fn numbers(s: &Scenario) -> String {
    match scenario::evaluate(s) {
        Ok(o) => format!(
            "{:?} {:?} {:?} {:?} {:?} {:?} {:?}",
            o.q_total, o.q_per_length, o.surface_temp, o.h, o.h_rad, o.reynolds, o.nusselt
        ),
        Err(_) => "error".to_string(),
    }
}

#[test]
fn evaluate_is_unchanged_bit_for_bit_over_the_fixed_set() {
    let cases = cases();
    assert!(cases.len() > 100, "{}", cases.len());
    let text = std::fs::read_to_string(FIXTURE).unwrap_or_default();
    let recorded: Vec<Vec<&str>> = text
        .lines()
        .filter(|l| !l.starts_with('#') && !l.starts_with("case,"))
        .map(|l| {
            // The case's name may hold commas; hash, numbers and link do not.
            let mut v: Vec<&str> = l.rsplitn(4, ',').collect();
            v.reverse();
            v
        })
        .collect();
    let now: Vec<[String; 4]> = cases
        .iter()
        .map(|(name, s)| {
            [
                name.clone(),
                format!("{:016x}", record(s)),
                numbers(s),
                scenario::to_fragment(s, System::Si),
            ]
        })
        .collect();
    let write = std::env::var("LEEWARD_WRITE_SNAPSHOT").ok();
    if let Some(what) = write {
        let mut out = String::from(
            "# source: self-computed by tests/it/snapshot.rs (regression fixture, not a published value)\n# kind: FNV-1a 64 of the Debug text of scenario::evaluate's outcome, and its main numbers (q, q per length, Ts, h, h_rad, Re, Nu) to the last bit, per scenario\ncase,hash,numbers,link\n",
        );
        for (i, row) in now.iter().enumerate() {
            // Numbers are kept as recorded unless asked to rewrite them all.
            let nums = match recorded.get(i) {
                Some(r) if what != "all" && r.len() == 4 => r[2].to_string(),
                _ => row[2].clone(),
            };
            out.push_str(&format!("{},{},{},{}\n", row[0], row[1], nums, row[3]));
        }
        std::fs::write(FIXTURE, out).expect("fixture written");
        return;
    }
    assert_eq!(recorded.len(), now.len(), "the fixed set changed size");
    let mut moved_numbers = Vec::new();
    let mut changed = Vec::new();
    for (r, n) in recorded.iter().zip(&now) {
        assert_eq!(r.len(), 4, "a fixture row has case, hash, numbers, link");
        if r[0] != n[0] || r[3] != n[3] {
            panic!("the fixed set changed: {} / {}", r[0], n[0]);
        }
        if r[2] != n[2] {
            moved_numbers.push(format!("{}: {} -> {}", r[0], r[2], n[2]));
        }
        if r[1] != n[1] {
            changed.push(r[0]);
        }
    }
    assert!(
        moved_numbers.is_empty(),
        "{} of {} outcomes moved a main number, first: {}",
        moved_numbers.len(),
        now.len(),
        moved_numbers[0]
    );
    assert!(
        changed.is_empty(),
        "{} of {} outcomes changed, first: {}",
        changed.len(),
        now.len(),
        changed[0]
    );
}
