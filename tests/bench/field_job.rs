//! The work the benchmarks time, shared by `engine.rs` (criterion) and `solve_count.rs`
//! (instruction counts): the field job (the demo line with two insulation layers, 180 °C inside,
//! in dry air under a 268 K sky) and the body the correlation benchmarks analyse.

use leeward::engine::body::{Axis, Body, Shape, Wind};
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
            yaw: 1.0,
        },
        process_temp: 453.15,
        h_inside: None,
        construction: s.construction(),
        emissivity: 0.9,
        t_surround: 268.15,
        solar: 0.0,
    }
}

/// A 60.3 mm body, level, in a 3 m/s stream at 15 °C with its surface at 65 °C.
pub fn body(shape: Shape, fluid: Fluid) -> Body {
    Body {
        shape,
        axis: Axis::Horizontal,
        wind: Wind::Horizontal,
        d: 0.0603,
        length: 12.0,
        speed: 3.0,
        t_inf: 288.15,
        t_s: 338.15,
        p: 101_325.0,
        fluid,
        yaw: 1.0,
    }
}
