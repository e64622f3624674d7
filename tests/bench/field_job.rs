//! The field job the benchmarks time, shared by `engine.rs` (criterion) and `solve_count.rs`
//! (instruction counts): the demo line with two insulation layers, 180 °C inside, in dry air under
//! a 268 K sky.

use leeward::engine::body::Body;
use leeward::engine::heatloss::Job;
use leeward::engine::props::Fluid;
use leeward::engine::scenario::{SurfaceMode, DEMO};

pub fn job() -> Job {
    let mut s = DEMO;
    s.surface_mode = SurfaceMode::Solved;
    s.layer_count = 2;
    Job {
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
    }
}
