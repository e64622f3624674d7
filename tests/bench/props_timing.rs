//! `cargo run --profile native --example props_timing -- FILE`: reads "fluid,T,p" lines (fluid air or
//! water), evaluates ρ, μ, k, cp for each through the engine, and prints the wall time per state
//! in nanoseconds (best of five passes). Called by tests/bench/coolprop_ratio.py.

use leeward::engine::props::{air, water};
use std::hint::black_box;
use std::time::Instant;

fn main() {
    let path = std::env::args().nth(1).expect("states file");
    let text = std::fs::read_to_string(&path).expect("read states");
    let states: Vec<(bool, f64, f64)> = text
        .lines()
        .filter_map(|l| {
            let mut it = l.split(',');
            let f = it.next()? == "air";
            Some((f, it.next()?.parse().ok()?, it.next()?.parse().ok()?))
        })
        .collect();
    let mut best = f64::INFINITY;
    for _ in 0..5 {
        let t0 = Instant::now();
        let mut acc = 0.0;
        for &(is_air, t, p) in &states {
            let s = if is_air {
                air::properties(t, p)
            } else {
                water::liquid(t, p)
            }
            .expect("valid state");
            acc += s.rho + s.mu + s.k + s.cp;
        }
        black_box(acc);
        best = best.min(t0.elapsed().as_secs_f64());
    }
    println!("{}", best / states.len() as f64 * 1e9);
}
