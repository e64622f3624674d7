//! Criterion benchmarks of the engine: `cargo bench --bench engine`.
//! Budgets (README, Performance): one property set ≤ 1 µs; all correlations of one shape for one
//! state, properties included, ≤ 1 µs; the inspection's effective-k inverse ≤ 100 µs; a full
//! scenario evaluation (with its working) recorded.

mod field_job;

use criterion::{black_box, criterion_group, criterion_main, Criterion};
use leeward::engine::props::{air, glycol, humid_air, water, Glycol, Humidity};
use leeward::engine::scenario::{evaluate, DEMO};

fn properties(c: &mut Criterion) {
    c.bench_function("air property set (T, p)", |b| {
        b.iter(|| air::properties(black_box(310.0), black_box(101_325.0)).unwrap())
    });
    c.bench_function("liquid water property set (T, p)", |b| {
        b.iter(|| water::liquid(black_box(330.0), black_box(101_325.0)).unwrap())
    });
    c.bench_function("steam property set (T, p)", |b| {
        b.iter(|| water::steam(black_box(450.0), black_box(101_325.0)).unwrap())
    });
    c.bench_function("humid air property set (T, p, RH)", |b| {
        b.iter(|| {
            humid_air::properties(
                black_box(300.0),
                black_box(101_325.0),
                Humidity::Relative(0.6),
            )
            .unwrap()
        })
    });
    c.bench_function("glycol-water property set (T, x)", |b| {
        b.iter(|| {
            glycol::properties(
                Glycol::Ethylene,
                black_box(0.3),
                black_box(290.0),
                101_325.0,
            )
            .unwrap()
        })
    });
}

/// All correlations of one shape for one state, the three property sets (film, free stream,
/// surface) included: budget 1 µs native.
fn correlations(c: &mut Criterion) {
    use leeward::engine::body::{analyse, Shape};
    use leeward::engine::props::Fluid;
    for (name, shape, fluid) in [
        (
            "cylinder in air: every correlation, properties included",
            Shape::Cylinder,
            Fluid::DryAir,
        ),
        (
            "sphere in air: every correlation, properties included",
            Shape::Sphere,
            Fluid::DryAir,
        ),
        (
            "cylinder in water: every correlation, properties included",
            Shape::Cylinder,
            Fluid::Water,
        ),
    ] {
        let b = field_job::body(shape, fluid);
        c.bench_function(name, |bch| bch.iter(|| analyse(black_box(&b)).unwrap()));
    }
}

/// The field job: properties, correlations, two insulation layers, radiation and the solve
/// (budget 5 µs median), and a thickness inverse (budget 100 µs).
fn field_job(c: &mut Criterion) {
    let job = field_job::job();
    c.bench_function("field job: two layers, radiation, the solve", |b| {
        b.iter(|| leeward::engine::heatloss::solve(black_box(&job)).unwrap())
    });
    // The inverse: one insulation layer over the wall, its thickness for a 40 °C surface.
    let mut one = job.clone();
    one.construction.layers.truncate(2);
    c.bench_function("field job: layer thickness for a 40 °C surface", |b| {
        b.iter(|| {
            leeward::engine::heatloss::thickness_for(black_box(&one), 0.5, 313.15, |s| s.t_surface)
                .unwrap()
                .unwrap()
        })
    });
}

/// The inspection's inverse (issue #20): the factor on the outer layer's k that reproduces a
/// measured surface, on the two-layer field job (budget 100 µs native, as the thickness inverse).
/// The surface is the job's own with that layer's k doubled, so the answer is known (2).
fn effective_k(c: &mut Criterion) {
    use leeward::engine::inspect::effective_k::{effective_k, scaled};
    let job = field_job::job();
    let ts = leeward::engine::heatloss::solve(&scaled(&job, 2.0))
        .unwrap()
        .t_surface;
    c.bench_function(
        "inspection: outer layer's k factor from a measured surface",
        |b| b.iter(|| effective_k(black_box(&job), black_box(ts)).unwrap()),
    );
}

/// A full outdoor evaluation (issue #19, budget 10 µs native): the sun's position by SPA at a
/// winter noon, the clear-sky beam and diffuse at that zenith, the sun a level line absorbs, the
/// sky from the weather with four oktas of cloud, one radiant temperature for sky and ground, a
/// 10 m forecast carried to a 3 m rack in suburban terrain, the yaw of a wind 60° off the axis,
/// and the steady surface of a heat-traced line (20 W/m) in all of it.
fn outdoors(c: &mut Criterion) {
    use leeward::engine::body::{Axis, Body, Shape, Wind};
    use leeward::engine::outdoors::{irradiance, joule, sky, sun, wind};
    use leeward::engine::props::Fluid;
    let day = sun::Utc {
        year: 2026,
        month: 12,
        day: 21,
        hour: 11,
        minute: 45,
        second: 0.0,
    };
    let site = sun::Site {
        latitude: 53.4,
        longitude: -2.2,
        elevation: 40.0,
    };
    let air = sun::Air {
        pressure: 101_325.0,
        temperature: 276.15,
    };
    // The traced line: a level 2-inch line in dry air at 3 °C, ε 0.9.
    let traced = |speed: f64, yaw: f64, t_radiant: f64, solar: f64| joule::Surface {
        stream: Body {
            shape: Shape::Cylinder,
            axis: Axis::Horizontal,
            wind: Wind::Horizontal,
            d: 0.0603,
            length: 1.0,
            speed,
            t_inf: 276.15,
            t_s: 0.0,
            p: 101_325.0,
            fluid: Fluid::DryAir,
            yaw,
        },
        emissivity: 0.9,
        t_radiant,
        solar,
    };
    let rack = wind::Exposure {
        height: 3.0,
        terrain: wind::Terrain::Suburban,
    };
    c.bench_function(
        "outdoors: sun, sky, wind and a traced line's steady surface",
        |b| {
            b.iter(|| {
                let pos = sun::position(black_box(&day), &site, &air, sun::DELTA_T_NOW)
                    .unwrap()
                    .value;
                let g0 = irradiance::extraterrestrial_normal(pos.distance).unwrap();
                let irr = irradiance::hottel_liu_jordan(
                    pos.zenith,
                    site.elevation,
                    irradiance::Climate::MidlatitudeWinter,
                    g0,
                )
                .unwrap()
                .value;
                let beam = irradiance::beam_across(pos.zenith, pos.azimuth, 90.0, 0.0).unwrap();
                let view = sky::ViewFactors::OPEN;
                let solar =
                    irradiance::absorbed_cylinder(0.6, 0.0603, &irr, 0.2, view, beam).unwrap();
                let s = sky::sky(276.15, 271.15, 12.0, 101_325.0, 4.0)
                    .unwrap()
                    .value;
                let t_radiant = sky::radiant_surroundings(view, s.temperature, 276.15).unwrap();
                let speed = wind::speed_at(black_box(6.0), wind::STATION, rack)
                    .unwrap()
                    .value;
                let yaw = wind::yaw_factor(60.0).unwrap();
                let surface = traced(speed, yaw, t_radiant, solar);
                joule::surface_temperature(&surface, &joule::Source::Heat(20.0)).unwrap()
            })
        },
    );
    // Its two largest parts alone: the sun's position, and the steady surface for a given sky,
    // sun and wind.
    c.bench_function("outdoors: the sun's position alone (SPA)", |b| {
        b.iter(|| sun::position(black_box(&day), &site, &air, sun::DELTA_T_NOW).unwrap())
    });
    let surface = traced(4.0, 0.9, 262.0, 8.0);
    c.bench_function("outdoors: the traced line's steady surface alone", |b| {
        b.iter(|| {
            joule::surface_temperature(black_box(&surface), &joule::Source::Heat(20.0)).unwrap()
        })
    });
}

fn scenario(c: &mut Criterion) {
    c.bench_function("demo scenario, full evaluation", |b| {
        b.iter(|| evaluate(black_box(&DEMO)).unwrap())
    });
}

criterion_group!(
    benches,
    properties,
    correlations,
    field_job,
    effective_k,
    outdoors,
    scenario
);
criterion_main!(benches);
