//! Property-based tests of the fluid layer over named input domains.

use leeward::engine::props::{air, glycol, humid_air, water, Fluid, Glycol, Humidity};
use proptest::prelude::*;

/// Field conditions for air: the tool's working range.
fn air_state() -> impl Strategy<Value = (f64, f64)> {
    (200.0..1000.0f64, 50e3..500e3f64)
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(2000))]

    #[test]
    fn saturation_pressure_strictly_increases(t in 180.0..646.0f64, dt in 1e-3..1.0f64) {
        prop_assert!(humid_air::psat(t + dt) > humid_air::psat(t));
    }

    #[test]
    fn dew_point_never_exceeds_dry_bulb(t in 240.0..360.0f64, rh in 0.0..=1.0f64, p in 60e3..200e3f64) {
        if let Ok(m) = humid_air::moisture(t, p, Humidity::Relative(rh)) {
            prop_assert!(m.dew_point <= t + 1e-9, "dew {} > {}", m.dew_point, t);
        }
    }

    #[test]
    fn air_properties_are_positive_and_pr_is_a_gas_s((t, p) in air_state(), rh in 0.0..=1.0f64) {
        for f in [Fluid::DryAir, Fluid::HumidAir(Humidity::Relative(rh))] {
            if let Ok(s) = f.at(t, p) {
                // Pr of dry air lies between 0.65 and 0.80 over this domain (CoolProp 8.0.0 gives
                // 0.70–0.72 at 1 atm); moist air moves toward water vapour's Pr of about 1 (hot
                // and near saturation, up to about 1.1 for saturated steam). A wrong unit in μ, cp
                // or k would put it orders of magnitude away.
                let top = if f == Fluid::DryAir { 0.80 } else { 1.2 };
                prop_assert!(s.pr > 0.65 && s.pr < top, "{f:?}: Pr {}", s.pr);
                prop_assert!(s.rho > 0.0 && s.mu > 0.0 && s.k > 0.0 && s.cp > 0.0);
            }
        }
    }

    #[test]
    fn air_properties_are_continuous((t, p) in air_state()) {
        let a = air::properties(t, p).unwrap();
        let b = air::properties(t * (1.0 + 1e-9), p).unwrap();
        for (x, y) in [(a.mu, b.mu), (a.k, b.k), (a.cp, b.cp), (a.rho, b.rho)] {
            prop_assert!(((x - y) / x).abs() < 1e-7);
        }
    }

    #[test]
    fn liquid_water_is_finite_below_boiling(t in 273.15..372.0f64, p in 101_325.0..10e6f64) {
        let s = water::liquid(t, p).unwrap();
        prop_assert!(s.rho > 900.0 && s.rho < 1010.0 && s.mu > 0.0 && s.k > 0.5 && s.cp > 4000.0);
        // Liquid water's Pr runs from 13.5 at 0 °C to 1.75 at 100 °C (CoolProp 8.0.0 gives 5.856
        // at 300 K); pressure barely moves it.
        prop_assert!(s.pr > 1.6 && s.pr < 14.0, "Pr {}", s.pr);
    }

    #[test]
    fn glycol_is_finite_and_continuous_above_freezing(x in 0.0..=0.6f64, dt in 0.5..90.0f64, eg in any::<bool>()) {
        let g = if eg { Glycol::Ethylene } else { Glycol::Propylene };
        let t = glycol::freezing_point(g, x) + dt;
        if t <= 373.15 {
            let a = glycol::properties(g, x, t, 101_325.0).unwrap();
            let b = glycol::properties(g, x, t + 1e-7, 101_325.0).unwrap();
            prop_assert!(a.rho > 900.0 && a.mu > 0.0 && a.k > 0.0 && a.cp > 2000.0);
            prop_assert!(((a.mu - b.mu) / a.mu).abs() < 1e-6);
        }
    }
}

/// The over-ice and over-water saturation formulas meet at the triple point within 0.1 %, so the
/// humid-air properties do not jump there.
#[test]
fn humid_air_is_continuous_across_the_triple_point() {
    let below =
        humid_air::properties(water::T_TRIPLE - 1e-6, 101_325.0, Humidity::Relative(1.0)).unwrap();
    let above =
        humid_air::properties(water::T_TRIPLE + 1e-6, 101_325.0, Humidity::Relative(1.0)).unwrap();
    for (x, y) in [
        (below.mu, above.mu),
        (below.k, above.k),
        (below.rho, above.rho),
        (below.cp, above.cp),
    ] {
        assert!(((x - y) / x).abs() < 1e-4, "{x} vs {y}");
    }
}

/// Correlation domain: Re over 0.1–10⁷ (the plot's range and beyond), Pr over gases to oils.
fn groups() -> impl Strategy<Value = (f64, f64, f64)> {
    (-1.0..7.0f64, 0.6..500.0f64, 1.0001..1.5f64)
}

/// Field domain for a body in a stream: every shape, both axes, any wind, air, water or glycol.
fn body() -> impl Strategy<Value = leeward::engine::body::Body> {
    use leeward::engine::body::{Axis, Body, Shape, Wind};
    (
        0..7usize,
        any::<bool>(),
        0..3usize,
        (1e-4..3.0f64, 0.05..50.0f64, 0.0..40.0f64),
        (250.0..330.0f64, -60.0..200.0f64),
        0..3usize,
    )
        .prop_filter_map(
            "ΔT = 0, or a liquid out of its phase",
            |(s, vert, w, (d, l, u), (t_inf, dt), f)| {
                let fluid = [
                    Fluid::DryAir,
                    Fluid::Water,
                    Fluid::Glycol(Glycol::Ethylene, 0.3),
                ][f];
                let t_s = t_inf + dt;
                if dt.abs() < 1e-3 || (f > 0 && (t_inf < 280.0 || !(280.0..=365.0).contains(&t_s)))
                {
                    return None;
                }
                Some(Body {
                    shape: Shape::ALL[s],
                    axis: if vert {
                        Axis::Vertical
                    } else {
                        Axis::Horizontal
                    },
                    wind: [Wind::Horizontal, Wind::Up, Wind::Down][w],
                    d,
                    length: l,
                    speed: u,
                    t_inf,
                    t_s,
                    p: 101_325.0,
                    fluid,
                    yaw: 1.0,
                })
            },
        )
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(3000))]

    /// Nu rises with Re for every forced correlation of every shape; tables of constants by band
    /// may step down at a band edge, by at most 3 % (Zukauskas at Re = 40: 2 %).
    #[test]
    fn nusselt_increases_with_reynolds((log_re, pr, step) in groups()) {
        use leeward::engine::body::Shape;
        use leeward::engine::correlations::Groups;
        let re = 10f64.powf(log_re);
        for shape in Shape::ALL {
            for c in shape.forced() {
                let lo = (c.nu)(&Groups::uniform(re, pr, pr < 2.0)).value;
                let hi = (c.nu)(&Groups::uniform(re * step, pr, pr < 2.0)).value;
                prop_assert!(hi > 0.97 * lo, "{} falls from Re {} to {}", c.name, re, re * step);
                let banded = c.name.contains("Hilpert") || c.name.contains("Zukauskas") || c.name.contains("Jakob");
                if !banded {
                    prop_assert!(hi > lo, "{} not increasing at Re {}", c.name, re);
                }
            }
        }
    }

    /// h is finite and positive wherever the inputs are physical (opposing flows that cancel
    /// exactly are the one refusal, and they name themselves).
    #[test]
    fn h_is_finite_and_positive(b in body()) {
        match leeward::engine::body::analyse(&b) {
            Ok(a) => {
                prop_assert!(a.h.is_finite() && a.h > 0.0, "{:?}: h = {}", b, a.h);
                for e in &a.forced {
                    prop_assert!(e.h.is_finite() && e.h > 0.0 || b.speed == 0.0, "{}: {}", e.name, e.h);
                }
            }
            Err(e) => prop_assert!(e.to_string().contains("opposing"), "{:?}: {}", b, e),
        }
    }
}

/// The field job's domain: a round pipe or a sphere, 0–3 layers, any wind, any emissivity, hot or
/// cold process, in air; layer k rising with temperature (so it stays positive over the job).
fn field_job() -> impl Strategy<Value = leeward::engine::scenario::Scenario> {
    use leeward::engine::scenario::{Shape, SurfaceMode, DEMO};
    (
        any::<bool>(),
        (0.01..1.0f64, 0.0..0.2f64, 0usize..=3),
        (0.0..30.0f64, 230.0..320.0f64, -40.0..300.0f64),
        (0.0..=1.0f64, -30.0..30.0f64),
        (0.001..0.3f64, 0.001..0.3f64, 0.02..0.2f64, 0.0..0.5f64),
    )
        .prop_map(
            |(sphere, (d, wall_frac, n), (u, t_inf, dtp), (eps, dtr), (t1, t2, ka, rise))| {
                // Insulation k rises with temperature (by up to half from A to B), as data sheets show.
                let kb = ka * (1.0 + rise);
                let mut s = DEMO;
                s.shape = if sphere {
                    Shape::Sphere
                } else {
                    Shape::Cylinder
                };
                s.surface_mode = SurfaceMode::Solved;
                s.diameter = d;
                s.wall_thickness = d / 2.0 * wall_frac;
                s.layer_count = n;
                s.layer_t = [t1, t2, t1];
                s.layer_ka = [ka; 3];
                s.layer_kb = [kb; 3];
                s.speed = u;
                s.fluid_temp = t_inf;
                s.process_temp = t_inf + dtp;
                s.emissivity = eps;
                s.t_surround = t_inf + dtr;
                s.fluid = leeward::engine::scenario::FluidKind::DryAir;
                s
            },
        )
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(10_000))]

    /// Every valid case converges within the solver's bound, closes the energy balance to 1e-9 and
    /// shows only finite numbers.
    #[test]
    fn the_energy_balance_always_closes(s in field_job()) {
        // Below about 1 K between process and air the heat flow is a difference of nearly equal
        // temperatures, and f64 cancellation alone exceeds 1e-9 of it: such cases are left out.
        if (s.process_temp - s.fluid_temp).abs() < 1.0 {
            return Ok(());
        }
        let o = leeward::engine::scenario::evaluate(&s);
        let o = match o {
            Ok(o) => o,
            Err(e) => return Err(TestCaseError::fail(format!("{e} for {s:?}"))),
        };
        closes(&s, &o, 0.0)?;
        for v in [o.h, o.q_total, o.surface_temp, o.annual_energy, o.annual_cost] {
            prop_assert!(v.is_finite());
        }
        let (lo, hi) = (s.process_temp.min(s.fluid_temp).min(s.t_surround), s.process_temp.max(s.fluid_temp).max(s.t_surround));
        prop_assert!(o.surface_temp >= lo - 1e-9 && o.surface_temp <= hi + 1e-9);
    }
}

/// A field job outdoors (issue #19): the cases above in humid air under any sky and sun, at any
/// wind angle and rack height over any terrain.
fn outdoor_job() -> impl Strategy<Value = leeward::engine::scenario::Scenario> {
    use leeward::engine::scenario::{FluidKind, Setting, Terrain};
    (
        field_job(),
        (0.0..=8.0f64, 0.0..1100.0f64, 0.0..400.0f64, 0.0..1.0f64),
        (0.0..=1.0f64, 0.0..=90.0f64, 1.0..50.0f64, 0usize..5),
    )
        .prop_map(
            |(mut s, (cloud, gb, gd, gg_share), (alpha, yaw, z, terrain))| {
                s.fluid = FluidKind::HumidAir;
                s.setting = Setting::Outdoors;
                s.terrain = Terrain::ALL[terrain];
                s.cloud = cloud;
                s.t_ground = s.fluid_temp;
                s.beam_normal = gb;
                s.diffuse = gd;
                s.global = gd + gg_share * gb;
                s.absorptance = alpha;
                s.yaw = yaw;
                s.body_height = z;
                s
            },
        )
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(2_000))]

    /// Outdoors, with the sun a gain that can turn the net flow inward: the solve still converges
    /// within its bound and closes conduction = convection + radiation − sun to 1e-9, with only
    /// finite numbers.
    #[test]
    fn the_energy_balance_closes_outdoors_in_the_sun(s in outdoor_job()) {
        if (s.process_temp - s.fluid_temp).abs() < 1.0 {
            return Ok(());
        }
        let o = match leeward::engine::scenario::evaluate(&s) {
            Ok(o) => o,
            Err(e) => return Err(TestCaseError::fail(format!("{e} for {s:?}"))),
        };
        let sun = o.solar_total.unwrap()
            / if s.shape == leeward::engine::scenario::Shape::Sphere { 1.0 } else { s.length };
        closes(&s, &o, sun)?;
        for v in [o.h, o.q_total, o.surface_temp, o.sky_temp.unwrap(), o.radiant_temp.unwrap(), o.wind_at_body.unwrap()] {
            prop_assert!(v.is_finite());
        }
        let lo = s.process_temp.min(s.fluid_temp).min(o.radiant_temp.unwrap());
        prop_assert!(o.surface_temp >= lo - 1e-9);
    }
}

/// Cases for the whole-scenario fuzz: 2,000 in the test command, `LEEWARD_FUZZ_CASES` for the long
/// run (README: `LEEWARD_FUZZ_CASES=1000000 cargo test --release --test it fuzz`).
fn fuzz_cases() -> u32 {
    std::env::var("LEEWARD_FUZZ_CASES")
        .ok()
        .and_then(|v| v.parse().ok())
        .unwrap_or(2_000)
}

/// Any scenario at all: every choice; each numeric input kept, scaled, or drawn from far beyond its
/// limits on both sides (zero, negatives, huge and tiny values).
fn any_scenario() -> impl Strategy<Value = leeward::engine::scenario::Scenario> {
    use leeward::engine::scenario::{
        Axis, FluidKind, HumidityInput, InsideFilm, PressureInput, Setting, Shape, SurfaceMode,
        Terrain, WallMaterial, Wind, DEMO, FIELDS,
    };
    use leeward::engine::units::Dim;
    // Per input: 0–2 keep the demo's value, 3–5 scale it by 0.2–5 (temperatures: 150–1500 K),
    // 6 a wild value from anywhere.
    let values = proptest::collection::vec(
        (
            0..7u8,
            0.2..5.0f64,
            prop_oneof![
                -1e6..1e6f64,
                -1.0..1.0f64,
                prop_oneof![
                    Just(0.0),
                    Just(1e308),
                    Just(-1e308),
                    Just(f64::MIN_POSITIVE),
                    Just(1e-300)
                ],
            ],
        ),
        FIELDS.len(),
    );
    (
        values,
        0..7usize,
        0..7usize,
        0..16u32,
        (0..4usize, 0..5usize),
        0..5usize,
        any::<bool>(),
        0..4usize,
    )
        .prop_map(
            |(vals, shape, fluid, bits, (layers, outside), wall, wild_ok, inside)| {
                let mut s = DEMO;
                s.shape = Shape::ALL[shape];
                s.fluid = FluidKind::ALL[fluid];
                s.axis = if bits & 1 == 0 {
                    Axis::Horizontal
                } else {
                    Axis::Vertical
                };
                s.wind = [Wind::Horizontal, Wind::Up, Wind::Down][(bits as usize >> 1) % 3];
                s.pressure_input = if bits & 4 == 0 {
                    PressureInput::Absolute
                } else {
                    PressureInput::Elevation
                };
                s.humidity_input = if bits & 2 == 0 {
                    HumidityInput::Relative
                } else {
                    HumidityInput::DewPoint
                };
                s.surface_mode = if bits & 8 == 0 {
                    SurfaceMode::Given
                } else {
                    SurfaceMode::Solved
                };
                s.layer_count = layers;
                // Outdoors in three cases of five, over a terrain drawn from all five (the
                // wall's draw reused: independent enough for a fuzz).
                s.setting = if outside < 3 {
                    Setting::Outdoors
                } else {
                    Setting::Indoors
                };
                s.terrain = Terrain::ALL[wall % 5];
                s.wall = WallMaterial::ALL[wall];
                s.inside = InsideFilm::ALL[inside];
                for (spec, (how, factor, wild)) in FIELDS.iter().zip(vals) {
                    let demo = s.get(spec.field);
                    match how {
                        0..=2 => {}
                        3..=5 if spec.dim == Dim::Temperature => {
                            s.set(spec.field, 150.0 + 1350.0 * (factor - 0.2) / 4.8)
                        }
                        // Half the scenarios stay inside every input's hard limits, so that many of
                        // them compute an answer; the other half take wild values too.
                        3..=6 if !wild_ok => {
                            let lo = if spec.min_open {
                                spec.min + 1e-9 * spec.max
                            } else {
                                spec.min
                            };
                            s.set(spec.field, (demo * factor).clamp(lo, spec.max))
                        }
                        3..=5 => s.set(spec.field, demo * factor),
                        _ => s.set(spec.field, wild),
                    }
                }
                s
            },
        )
}

static FUZZ_OK: std::sync::atomic::AtomicUsize = std::sync::atomic::AtomicUsize::new(0);
static FUZZ_ALL: std::sync::atomic::AtomicUsize = std::sync::atomic::AtomicUsize::new(0);

proptest! {
    #![proptest_config(ProptestConfig::with_cases(fuzz_cases()))]

    /// The whole scenario space, in and far outside every method's domain: never a panic, and every
    /// number of an answer that is not an error is finite.
    #[test]
    fn fuzz_whole_scenario_space(s in any_scenario()) {
        let r = leeward::engine::scenario::evaluate(&s);
        FUZZ_OK.fetch_add(r.is_ok() as usize, std::sync::atomic::Ordering::Relaxed);
        FUZZ_ALL.fetch_add(1, std::sync::atomic::Ordering::Relaxed);
        if std::env::var_os("LEEWARD_FUZZ_REPORT").is_some() && FUZZ_ALL.load(std::sync::atomic::Ordering::Relaxed).is_multiple_of(1000) {
            eprintln!("fuzz: {} of {} cases computed an answer", FUZZ_OK.load(std::sync::atomic::Ordering::Relaxed), FUZZ_ALL.load(std::sync::atomic::Ordering::Relaxed));
        }
        if let Ok(o) = r {
            let mut nums = vec![o.h, o.q_total, o.q_conv_total, o.q_rad_total, o.h_rad, o.surface_temp,
                o.outer_d, o.annual_energy, o.annual_cost, o.nusselt, o.reynolds, o.prandtl, o.film_temp, o.pressure];
            nums.extend(o.q_per_length);
            nums.extend(o.dew_point);
            nums.extend([o.sky_temp, o.radiant_temp, o.solar_total, o.solar_per_length, o.wind_at_body, o.yaw_factor].into_iter().flatten());
            for e in &o.analysis.forced { nums.extend([e.nu, e.h, e.groups.re, e.groups.pr]); }
            for v in &o.verdicts { nums.extend(v.figures.iter().map(|f| f.1)); }
            for (a, b, c) in &o.thickness_sweep { nums.extend([*a, *b, *c]); }
            for (a, b, c, d) in &o.wind_sweep { nums.extend([*a, *b, *c, *d]); }
            for (i, v) in nums.iter().enumerate() {
                prop_assert!(v.is_finite(), "non-finite #{i} = {v} for {s:?}");
            }
            for st in &o.working {
                prop_assert!(!st.text.contains("NaN") && !st.text.contains("inf"), "{}: {}", st.title, st.text);
            }
        }
    }
}

/// The solved job's energy balance closes within the solver's bound: to 1e-9 of the heat flow (or
/// of the absorbed sun per metre, `sun`, where that is larger) — or, where the surface sits within
/// micro-kelvins of the air, to what f64 can resolve: the loss is (h + h_rad)·A·(Ts − T∞) and Ts
/// itself carries a rounding of about ε·Ts, so the residual cannot be smaller than that times the
/// conductance (with a factor 100 of headroom).
fn closes(
    s: &leeward::engine::scenario::Scenario,
    o: &leeward::engine::scenario::Outcome,
    sun: f64,
) -> Result<(), TestCaseError> {
    let sol = &o.job.as_ref().unwrap().solution;
    prop_assert!(sol.iterations <= leeward::engine::solve::MAX_ITER);
    let area = if s.shape == leeward::engine::scenario::Shape::Sphere {
        std::f64::consts::PI * sol.outer_d * sol.outer_d
    } else {
        std::f64::consts::PI * sol.outer_d
    };
    let floor = 100.0 * f64::EPSILON * o.surface_temp * (sol.loss.h_conv + sol.loss.h_rad) * area;
    prop_assert!(
        sol.residual.abs() <= (1e-9 * sol.q.abs().max(sun)).max(floor),
        "residual {} of {} (sun {sun}, floor {floor})",
        sol.residual,
        sol.q
    );
    Ok(())
}
