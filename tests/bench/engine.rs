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
    scenario
);
criterion_main!(benches);
