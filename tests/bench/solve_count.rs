//! The field-job solve and thickness inverse of the criterion benchmark, run a fixed number of
//! times, for counting instructions: criterion's medians swing by ±10 % on a shared machine, an
//! instruction count does not.
//!
//!     cargo build --profile native --no-default-features --example solve_count
//!     valgrind --tool=callgrind --callgrind-out-file=/tmp/cg.out \
//!         target/native/examples/solve_count solve 1000
//!     callgrind_annotate /tmp/cg.out | head -40
//!
//! The argument picks the work (`solve` or `inverse`) and the count.

use leeward::engine::body::Body;
use leeward::engine::heatloss::{self, Job};
use leeward::engine::props::Fluid;
use leeward::engine::scenario::{SurfaceMode, DEMO};
use std::hint::black_box;

fn main() {
    let mut args = std::env::args().skip(1);
    let what = args.next().unwrap_or_else(|| "solve".into());
    let n: u32 = args.next().and_then(|a| a.parse().ok()).unwrap_or(1000);
    // The benchmark's job: the demo line with two layers, 180 °C inside, a 268 K sky.
    let mut s = DEMO;
    s.surface_mode = SurfaceMode::Solved;
    s.layer_count = 2;
    let job = Job {
        stream: Body {
            shape: s.shape,
            axis: s.axis,
            wind: s.wind,
            d: s.diameter,
            length: s.length,
            speed: s.speed,
            t_inf: s.fluid_temp,
            t_s: 0.0,
            p: s.pressure,
            fluid: Fluid::DryAir,
        },
        process_temp: 453.15,
        h_inside: None,
        construction: s.construction(),
        emissivity: 0.9,
        t_surround: 268.15,
    };
    let mut one = job.clone();
    one.construction.layers.truncate(2);
    let mut sum = 0.0;
    let mut iterations = 0;
    for _ in 0..n {
        match what.as_str() {
            "inverse" => {
                let (t, _) = heatloss::thickness_for(black_box(&one), 0.5, 313.15, |s| s.t_surface)
                    .expect("solves")
                    .expect("a thickness meets it");
                sum += t;
            }
            _ => {
                let sol = heatloss::solve(black_box(&job)).expect("solves");
                iterations = sol.iterations;
                sum += sol.q;
            }
        }
    }
    println!(
        "{what} × {n}: mean result {}, last solve's iterations {iterations}",
        sum / n as f64
    );
}
