//! Criterion benchmarks of the engine: `cargo bench --bench engine`.
//! Budgets (README, Performance): one property set ≤ 1 µs; all correlations of one shape for one
//! state, properties included, ≤ 1 µs; a full scenario evaluation (with its working) recorded.

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

fn scenario(c: &mut Criterion) {
    c.bench_function("demo scenario, full evaluation", |b| {
        b.iter(|| evaluate(black_box(&DEMO)).unwrap())
    });
}

criterion_group!(benches, properties, correlations, field_job, scenario);
criterion_main!(benches);
