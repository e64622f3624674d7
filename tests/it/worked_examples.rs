//! The field job against published worked examples: an insulated steam pipe (the radial network
//! of layers and films) and the time for still water in an insulated pipe to cool to freezing.

use leeward::engine::body::{Axis, Body, Shape, Wind};
use leeward::engine::heatloss::Job;
use leeward::engine::job::{self, Targets};
use leeward::engine::layers::{Conductivity, Construction, Geometry, Layer};
use leeward::engine::props::Fluid;
use leeward::engine::solve;

const INCH: f64 = 0.0254;

/// Çengel & Ghajar, Heat and Mass Transfer, Chapter 3, the example "heat loss through an
/// insulated steam pipe" (from memory): steam at 320 °C inside a cast-iron pipe, k = 80 W/(m·K),
/// bore 5 cm, outside 5.5 cm, under 3 cm of glass wool, k = 0.05 W/(m·K); inside film 60 W/(m²·K),
/// a combined outside coefficient of 18 W/(m²·K) to 5 °C. The book gives about 121 W per metre,
/// a drop of about 0.02 °C across the pipe and about 284 °C across the insulation.
/// Here the engine's own march through the layers carries the conduction; the films are the
/// book's constant coefficients, and the balance is closed with the engine's solver.
#[test]
fn insulated_steam_pipe_per_metre() {
    let c = Construction {
        geometry: Geometry::Cylinder,
        r_in: 0.025,
        layers: vec![
            Layer {
                thickness: 0.0025,
                k: Conductivity::constant(80.0),
            },
            Layer {
                thickness: 0.03,
                k: Conductivity::constant(0.05),
            },
        ],
    };
    let (t_steam, t_air, h_in, h_out) = (593.15, 278.15, 60.0, 18.0);
    let a_in = Geometry::Cylinder.area(c.r_in);
    let a_out = Geometry::Cylinder.area(c.r_out());
    let temps = |q: f64| {
        let t_bore = t_steam - q / (h_in * a_in);
        (t_bore, c.march(t_bore, q, t_air, t_steam))
    };
    let root = solve::bracketed(
        |q| {
            let (_, t) = temps(q);
            h_out * a_out * (t[1] - t_air) - q
        },
        0.0,
        1000.0,
        1e-10,
    )
    .unwrap();
    let q = root.x;
    let (t_bore, t) = temps(q);
    assert!((q - 121.0).abs() < 0.5, "q = {q} W/m");
    assert!(
        ((t_bore - t[0]) - 0.02).abs() < 0.005,
        "pipe drop {}",
        t_bore - t[0]
    );
    assert!(
        ((t[0] - t[1]) - 284.0).abs() < 0.5,
        "insulation drop {}",
        t[0] - t[1]
    );
}

/// ASHRAE Handbook—Fundamentals (2009), Chapter 23, Eq. 1 and its time-to-freezing table, as
/// quoted by Warren Forensics, "How long before the pipes freeze?" (2014): a 2-inch pipe under
/// 1.5 in of insulation, k = 0.30 Btu·in/(h·ft²·°F), water at 42 °F, air suddenly at −18 °F,
/// reaches 32 °F in 1.4 h. The handbook's equation leaves out the wall's resistance and heat
/// capacity and the outside film, so the engine is run with a wall of typed k (no heat capacity)
/// in a strong wind and no radiation, and should come out a little longer (the film it keeps).
#[test]
fn time_for_still_water_to_reach_freezing() {
    let f_to_k = |f: f64| (f - 32.0) / 1.8 + 273.15;
    let (t_air, t_water) = (f_to_k(-18.0), f_to_k(42.0));
    // 2-inch schedule 40 (ASME B36.10M, from memory): 2.375 in outside, 2.067 in bore.
    let (d_bore, d_pipe) = (2.067 * INCH, 2.375 * INCH);
    let d_ins = d_pipe + 2.0 * 1.5 * INCH;
    // NIST SP 811: 1 Btu·in/(h·ft²·°F) = 0.144 227 9 W/(m·K).
    let k_ins = 0.30 * 0.144_227_9;
    let job = Job {
        stream: Body {
            shape: Shape::Cylinder,
            axis: Axis::Horizontal,
            wind: Wind::Horizontal,
            d: d_pipe,
            length: 10.0,
            speed: 15.0,
            t_inf: t_air,
            t_s: 0.0,
            p: 101_325.0,
            fluid: Fluid::DryAir,
            yaw: 1.0,
        },
        process_temp: t_water,
        h_inside: None,
        construction: Construction {
            geometry: Geometry::Cylinder,
            r_in: d_bore / 2.0,
            layers: vec![
                Layer {
                    thickness: (d_pipe - d_bore) / 2.0,
                    k: Conductivity::constant(45.0),
                },
                Layer {
                    thickness: 1.5 * INCH,
                    k: Conductivity::constant(k_ins),
                },
            ],
        },
        emissivity: 0.0,
        t_surround: t_air,
        solar: 0.0,
    };
    let targets = Targets {
        touch_limit: 333.15,
        dew_point: None,
        dew_margin: 2.0,
        hours: 0.0,
        price: 0.0,
        efficiency: 1.0,
        mass_flow: 0.0,
        process_cp: 4180.0,
        process_water: true,
        wall_heat_capacity: None,
        loss_target: 0.0,
        freeze_target: 0.0,
    };
    let r = job::evaluate(&job, &targets, 1).unwrap();
    let card = r.verdicts.iter().find(|v| v.id == "freeze").unwrap();
    let hours = card.figures[0].1 / 3600.0;
    // The handbook equation with its own inputs (62.4 lb/ft³, 1 Btu/(lb·°F), resistance in
    // h·ft·°F/Btu): θ = ρ·cp·π(D1/2)²·R·ln((ti − ta)/(tf − ta)).
    let (d1_ft, r_ft) = (
        2.067f64 / 12.0,
        12.0 * (d_ins / d_pipe).ln() / (2.0 * std::f64::consts::PI * 0.30),
    );
    let ashrae = 62.4 * std::f64::consts::PI * (d1_ft / 2.0).powi(2) * r_ft * (60.0f64 / 50.0).ln();
    assert!((hours - 1.4).abs() < 0.06, "engine {hours} h");
    assert!(
        hours > ashrae && hours < 1.03 * ashrae,
        "engine {hours} h, handbook {ashrae} h"
    );
}
