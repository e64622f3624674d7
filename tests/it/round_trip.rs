//! Every input field survives the three ways a scenario travels — the link, the saved-work file
//! and the survey CSV (in SI and in US units) — at full precision. Six scenarios together use
//! every row of `FIELDS` (the test checks that they do), each value is nudged off round numbers,
//! and what comes back must be the same number: bit for bit through the link and the file (they
//! carry the SI value), within 1e-12 relative through the CSV in US units (a unit conversion and
//! back).

use leeward::engine::body::{Shape, Wind};
use leeward::engine::scenario::{
    self, check_field, spec, FluidKind, HumidityInput, InsideFilm, PressureInput, Scenario,
    Setting, SurfaceMode, Terrain, DEMO, FIELDS,
};
use leeward::engine::store::{self, Saved, Store};
use leeward::engine::survey;
use leeward::engine::units::{self, System};

fn scenarios() -> Vec<Scenario> {
    let mut a = DEMO;
    a.surface_mode = SurfaceMode::Solved;
    a.layer_count = 3;
    a.layer_kc = [0.06, 0.061, 0.062];
    a.wall = scenario::WallMaterial::User;
    a.h_inside = 500.0;
    a.loss_target = 30.0;
    a.freeze_target = 3600.0;

    let mut b = a;
    b.humidity_input = HumidityInput::DewPoint;
    b.pressure_input = PressureInput::Elevation;
    b.elevation = 850.0;
    b.inside = InsideFilm::EthyleneGlycol;
    b.mass_flow = 0.4;

    let mut c = DEMO;
    c.fluid = FluidKind::User;
    c.shape = Shape::Sphere;
    c.wind = Wind::Horizontal;

    let mut d = DEMO;
    d.fluid = FluidKind::EthyleneGlycol;
    d.fluid_temp = 283.15;
    d.surface_temp = 303.15;
    d.t_surround = 283.15;

    // Outdoors (issue #19): every sky, sun and wind input off its default, the wind at an angle.
    let mut e = a;
    e.setting = Setting::Outdoors;
    e.terrain = Terrain::Suburban;
    e.cloud = 3.0;
    e.t_ground = 275.0;
    e.sky_view = 0.6;
    e.beam_normal = 700.0;
    e.diffuse = 110.0;
    e.global = 500.0;
    e.absorptance = 0.7;
    e.albedo = 0.25;
    e.body_height = 4.5;
    e.yaw = 40.0;

    // An infrared reading (issue #20): every reading input off its default.
    let mut f = a;
    f.surface_mode = SurfaceMode::Reading;
    f.ir_reading = 301.0;
    f.ir_emissivity = 0.93;
    f.ir_reflected = 281.0;
    f.ir_band_low = 7.5e-6;
    f.ir_band_high = 13e-6;
    f.ir_accuracy = 1.5;
    f.ir_emissivity_uncertainty = 0.03;

    // Heat made inside (issue #19): a tracer outdoors, a conductor, a heated sphere.
    let mut g = e;
    g.surface_mode = SurfaceMode::Made;
    g.heat_made = 25.0;
    g.hold_temp = 280.0;
    let mut h = DEMO;
    h.surface_mode = SurfaceMode::Made;
    h.heat_source = scenario::HeatSource::Current;
    h.current = 350.0;
    h.r_low = 9.0e-5;
    h.t_r_low = 290.0;
    h.r_high = 1.1e-4;
    h.t_r_high = 350.0;
    h.conductor_limit = 360.0;
    let mut k = DEMO;
    k.shape = Shape::Sphere;
    k.surface_mode = SurfaceMode::Made;
    k.heat_body = 7.0;
    // The sun from a date, time and place (issue #19).
    let mut l = e;
    l.sun_input = scenario::SunInput::Place;
    l.latitude = -33.8688;
    l.longitude = 151.2093;
    l.sun_time = 1_781_000_000.0;
    l.climate = scenario::Climate::Tropical;
    vec![a, b, c, d, f, g, h, k, l, e]
}

/// A value off round numbers, still inside the field's hard limits.
fn nudged(s: &Scenario, f: scenario::Field) -> f64 {
    let v = s.get(f);
    let si = units::units_of(spec(f).dim).next().expect("SI unit");
    [v * (1.0 + 1.0 / 3.0e6), v * (1.0 - 1.0 / 3.0e6), v]
        .into_iter()
        .find(|&x| check_field(spec(f), x, si).is_ok())
        .expect("the value or a neighbour is inside the limits")
}

#[test]
fn every_field_round_trips_through_link_file_and_csv() {
    let mut covered = std::collections::HashSet::new();
    for base in scenarios() {
        let mut s = base;
        for sp in FIELDS.iter().filter(|sp| base.uses(sp.field)) {
            s.set(sp.field, nudged(&base, sp.field));
        }
        let used: Vec<_> = FIELDS.iter().filter(|sp| s.uses(sp.field)).collect();
        for system in [System::Si, System::Us] {
            // The link.
            let (back, sys) = scenario::from_fragment(&scenario::to_fragment(&s, system))
                .expect("the link reads back");
            assert_eq!(sys, system);
            // The saved-work file.
            let item = Saved::new("Round trip", "T-1", "Roof", &s, system);
            let text = store::to_json(&Store {
                items: vec![item.clone()],
                unreadable: vec![],
            });
            let loaded = store::from_json(&text).expect("the file reads back");
            let (from_file, _) = loaded.store.items[0]
                .scenario()
                .expect("its scenario reads");
            // The survey CSV.
            let (rows, errors) = survey::from_csv(&survey::to_csv(
                &[item],
                system,
                &survey::Figures::default(),
            ));
            assert!(errors.is_empty(), "{system:?}: {errors:?}");
            let (from_csv, _) = rows[0].scenario().expect("the CSV row reads");
            for got in [&back, &from_file, &from_csv] {
                assert_eq!((got.setting, got.terrain), (s.setting, s.terrain));
            }
            for sp in &used {
                let want = s.get(sp.field);
                assert_eq!(
                    back.get(sp.field).to_bits(),
                    want.to_bits(),
                    "link {} {system:?}",
                    sp.key
                );
                assert_eq!(
                    from_file.get(sp.field).to_bits(),
                    want.to_bits(),
                    "file {} {system:?}",
                    sp.key
                );
                let got = from_csv.get(sp.field);
                assert!(
                    (got - want).abs() <= 1e-12 * want.abs(),
                    "CSV {} {system:?}: {got} vs {want}",
                    sp.key
                );
                covered.insert(sp.key);
            }
        }
    }
    let missing: Vec<_> = FIELDS
        .iter()
        .filter(|sp| !covered.contains(sp.key))
        .map(|sp| sp.key)
        .collect();
    assert!(
        missing.is_empty(),
        "fields no scenario here uses: {missing:?}"
    );
}

/// The scenario's serde form (derived in the engine, no web dependency) carries every field and
/// every choice exactly; the view options' too. Checked through `serde_json`'s text.
#[test]
fn the_scenario_and_view_options_round_trip_through_serde() {
    for base in scenarios() {
        let mut s = base;
        for sp in FIELDS.iter().filter(|sp| base.uses(sp.field)) {
            s.set(sp.field, nudged(&base, sp.field));
        }
        let text = serde_json::to_string(&s).unwrap();
        let back: Scenario = serde_json::from_str(&text).unwrap();
        assert_eq!(back, s, "{text}");
    }
    for frag in ["#v=1", "#v=1&view=embed", "#v=1&lock=1&view=embed"] {
        let v = scenario::ViewOptions::from_fragment(frag);
        let back: scenario::ViewOptions =
            serde_json::from_str(&serde_json::to_string(&v).unwrap()).unwrap();
        assert_eq!(back, v);
    }
}

/// Outdoors and its terrain travel in the CSV's own choice columns too (`env`, `tc`): a list
/// whose link column is gone still reads them; indoors leaves both cells blank.
#[test]
fn outdoors_and_its_terrain_travel_in_the_csv_columns() {
    let outdoor = scenarios().pop().expect("the outdoor scenario");
    assert_eq!(outdoor.setting, Setting::Outdoors);
    for s in [outdoor, DEMO] {
        let item = Saved::new("Rack", "T-2", "Yard", &s, System::Si);
        let text = survey::to_csv(&[item], System::Si, &survey::Figures::default());
        let lines: Vec<&str> = text.lines().collect();
        let head: Vec<&str> = lines[0].split(',').collect();
        assert!(head.contains(&"env") && head.contains(&"tc"));
        // Every line without its last cell, the link.
        let cut: String = lines
            .iter()
            .map(|l| l.rsplit_once(',').map_or(*l, |(a, _)| a).to_string() + "\n")
            .collect();
        let (rows, errors) = survey::from_csv(&cut);
        assert!(errors.is_empty(), "{errors:?}");
        let (back, _) = rows[0].scenario().expect("the row reads");
        assert_eq!((back.setting, back.terrain), (s.setting, s.terrain));
    }
}
