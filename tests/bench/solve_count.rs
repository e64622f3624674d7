//! The field-job solve and thickness inverse of the criterion benchmark, run a fixed number of
//! times, for counting instructions: criterion's medians swing by ±10 % on a shared machine, an
//! instruction count does not.
//!
//!     cargo build --profile native --no-default-features --example solve_count
//!     valgrind --tool=callgrind --callgrind-out-file=/tmp/cg.out \
//!         target/native/examples/solve_count solve 1000
//!     callgrind_annotate /tmp/cg.out | head -40
//!
//! The argument picks the work (`solve`, `inverse`, `demo`: the demo scenario's whole evaluation,
//! `insulated`: an insulated line's whole evaluation with every limit card's thickness search,
//! `water`: every cylinder correlation in water, `air` and `sphere`: every cylinder or sphere
//! correlation in air) and the count.

#[path = "field_job.rs"]
mod field_job;

use leeward::engine::heatloss;
use std::hint::black_box;

/// An insulated DN 50 steam line in a winter wind with a loss target and a freezing time.
const INSULATED: &str = "v=1&s=cyl&ax=h&w=h&f=humid&pm=p&hm=rh&sm=x&nl=1&wm=cs&D=0.0603&L=12&U=8&Ta=263.15&Tr=263.15&p=101325&rh=0.8&Tp=423.15&t1=0.03&ka1=0.04&kb1=0.06&Tka=283.15&Tkb=373.15&qt=40&tft=28800&u=si";

fn main() {
    let mut args = std::env::args().skip(1);
    let what = args.next().unwrap_or_else(|| "solve".into());
    let n: u32 = args.next().and_then(|a| a.parse().ok()).unwrap_or(1000);
    let job = field_job::job();
    let mut one = job.clone();
    one.construction.layers.truncate(2);
    let mut sum = 0.0;
    let mut iterations = 0;
    for _ in 0..n {
        match what.as_str() {
            "water" => {
                // The criterion benchmark's cylinder in water: every correlation, three IF97 sets.
                use leeward::engine::body::{analyse, Shape};
                let b = field_job::body(Shape::Cylinder, leeward::engine::props::Fluid::Water);
                sum += analyse(black_box(&b)).expect("analyses").h;
            }
            "air" | "sphere" => {
                use leeward::engine::body::{analyse, Shape};
                let shape = if what == "air" {
                    Shape::Cylinder
                } else {
                    Shape::Sphere
                };
                let b = field_job::body(shape, leeward::engine::props::Fluid::DryAir);
                sum += analyse(black_box(&b)).expect("analyses").h;
            }
            "demo" => {
                let o = leeward::engine::scenario::evaluate(black_box(
                    &leeward::engine::scenario::DEMO,
                ))
                .expect("the demo evaluates");
                sum += o.q_total;
            }
            "insulated" => {
                // A line with a touch limit, a loss target and a freezing time: every limit card
                // searches for the thickness that meets it.
                let (s, _) = leeward::engine::scenario::from_fragment(INSULATED).expect("reads");
                let o = leeward::engine::scenario::evaluate(black_box(&s)).expect("evaluates");
                sum += o.q_total;
            }
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
