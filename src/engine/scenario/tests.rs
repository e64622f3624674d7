use super::*;
use crate::engine::heatloss::SIGMA;

#[test]
fn demo_evaluates_cleanly() {
    let o = evaluate(&DEMO).unwrap();
    assert!(o.flags.is_empty(), "{:?}", o.flags);
    let q_per_length = o.q_per_length.unwrap();
    assert!(q_per_length > 0.0 && o.h > 0.0);
    // Energy bookkeeping: q' = h·π·D·ΔT + εσ(Ts⁴ − Tsur⁴)·π·D, Q = q'·L.
    let pd = std::f64::consts::PI * DEMO.diameter;
    let q = o.h * pd * (DEMO.surface_temp - DEMO.fluid_temp)
        + DEMO.emissivity * SIGMA * (DEMO.surface_temp.powi(4) - DEMO.t_surround.powi(4)) * pd;
    assert!((q - q_per_length).abs() <= 1e-12 * q);
    assert!((o.q_total - q * DEMO.length).abs() <= 1e-12 * o.q_total);
    assert!(o.dew_point.unwrap() < DEMO.fluid_temp);
}

#[test]
fn every_fluid_evaluates_at_a_sensible_state() {
    for kind in FluidKind::ALL {
        let mut s = DEMO;
        s.fluid = kind;
        if kind == FluidKind::Steam {
            s.fluid_temp = 420.0;
            s.surface_temp = 400.0;
        } else if kind != FluidKind::DryAir && kind != FluidKind::HumidAir {
            s.fluid_temp = 290.0;
            s.surface_temp = 330.0;
            s.speed = 0.5;
        }
        let o = evaluate(&s).unwrap_or_else(|e| panic!("{kind:?}: {e}"));
        assert!(o.h.is_finite() && o.h > 0.0, "{kind:?}");
    }
}

#[test]
fn elevation_lowers_pressure_and_density() {
    let mut s = DEMO;
    s.pressure_input = PressureInput::Elevation;
    s.elevation = 2000.0;
    let o = evaluate(&s).unwrap();
    assert!((o.pressure - atmosphere::pressure_at(2000.0)).abs() < 1e-9);
    let sea = evaluate(&DEMO).unwrap();
    assert!(o.properties[0].props.rho < sea.properties[0].props.rho);
}

#[test]
fn boiling_at_the_film_is_a_clear_error() {
    let mut s = DEMO;
    s.fluid = FluidKind::Water;
    s.fluid_temp = 300.0;
    s.surface_temp = 480.0;
    let e = evaluate(&s).unwrap_err();
    assert!(matches!(e, EngineError::WrongPhase { .. }), "{e}");
    assert!(e.to_string().contains("373.1"), "{e}");
}

#[test]
fn heat_flows_into_a_cold_surface_with_a_negative_sign() {
    let mut s = DEMO;
    s.surface_temp = 263.15;
    let o = evaluate(&s).unwrap();
    assert!(o.q_per_length.unwrap() < 0.0 && o.q_total < 0.0 && o.h > 0.0);
}

pub(super) fn solved_demo() -> Scenario {
    let mut s = DEMO;
    s.surface_mode = SurfaceMode::Solved;
    s
}

#[test]
fn solved_surface_closes_the_energy_balance_and_beats_bare() {
    let s = solved_demo();
    let o = evaluate(&s).unwrap();
    let j = o.job.as_ref().unwrap();
    let sol = &j.solution;
    assert!((o.q_per_length.unwrap() - sol.q).abs() <= 1e-9 * sol.q);
    assert!(sol.residual.abs() <= 1e-9 * sol.q.abs());
    assert!(o.surface_temp < s.process_temp && o.surface_temp > s.fluid_temp);
    assert!((o.outer_d - (s.diameter + 2.0 * s.layer_t[0])).abs() < 1e-12);
    assert!(j.bare.as_ref().unwrap().q > sol.q);
    assert!(o.verdicts.iter().any(|v| v.id == "saving"));
    // The same line with no layers is the bare answer.
    let mut b = s;
    b.layer_count = 0;
    let ob = evaluate(&b).unwrap();
    assert!((ob.q_total - j.bare.as_ref().unwrap().q * s.length).abs() < 1e-9 * ob.q_total);
}

#[test]
fn sweeps_pass_through_the_operating_point() {
    let o = evaluate(&DEMO).unwrap();
    let at7 = o.wind_sweep.iter().find(|w| w.0 == 7.0).unwrap();
    assert!((at7.2 - o.q_total).abs() <= 1e-12 * o.q_total.abs());
    assert!((at7.1 - o.h).abs() <= 1e-12 * o.h);
    assert!(o.thickness_sweep.is_empty());
    let s = solved_demo();
    let o = evaluate(&s).unwrap();
    let at = *o
        .thickness_sweep
        .iter()
        .find(|p| p.0 == s.layer_t[0])
        .unwrap();
    assert!((at.0 - s.layer_t[0]).abs() < 1e-15);
    assert!((at.1 - o.q_total).abs() <= 1e-9 * o.q_total.abs());
    // Dense where the curve is steep: three points within the first tenth of the span, and no
    // grid point crowding the operating one.
    let top = o.thickness_sweep.last().unwrap().0;
    assert!(
        o.thickness_sweep
            .iter()
            .filter(|p| p.0 > 0.0 && p.0 < 0.1 * top)
            .count()
            >= 3
    );
    assert!(o
        .thickness_sweep
        .iter()
        .all(|p| p.0 == s.layer_t[0] || (p.0 - s.layer_t[0]).abs() >= 0.02 * top));
    // More insulation: less loss, cooler surface, all along the sweep.
    for w in o.thickness_sweep.windows(2).skip(1) {
        assert!(w[1].1 < w[0].1 && w[1].2 < w[0].2);
    }
}

/// Humid air keeps the stream's moisture at every temperature it is evaluated at: a 150 °C
/// line in 5 °C air at 70 % RH is computed (70 % RH at 150 °C would be more vapour than the air
/// can hold), and the film properties use the stream's vapour pressure.
#[test]
fn humid_air_carries_the_streams_vapour_pressure() {
    let mut s = solved_demo();
    s.process_temp = 423.15;
    let o = evaluate(&s).unwrap();
    let m =
        crate::engine::props::humid_air::moisture(s.fluid_temp, 101_325.0, Humidity::Relative(0.7))
            .unwrap();
    let film = crate::engine::props::humid_air::properties(
        o.film_temp,
        101_325.0,
        Humidity::VapourPressure(m.vapour_pressure),
    )
    .unwrap();
    assert_eq!(o.properties[0].props.mu, film.mu);
    assert!((o.dew_point.unwrap() - m.dew_point).abs() < 1e-9);
}

/// A third data-sheet point makes k the quadratic through all three (hand check at each point).
#[test]
fn three_point_conductivity_passes_through_each_point() {
    let mut s = solved_demo();
    s.layer_kc = [0.060, 0.0, 0.0];
    let k = s.layer_conductivity(0);
    for (t, want) in [
        (s.k_temp_a, 0.036),
        (s.k_temp_b, 0.045),
        (s.k_temp_c, 0.060),
    ] {
        assert!((k.at(t) - want).abs() < 1e-12, "{t}: {}", k.at(t));
    }
    assert!(k.c > 0.0, "the sheet's points curve upward");
    assert!(evaluate(&s).is_ok());
    s.k_temp_c = s.k_temp_b;
    let e = evaluate(&s).unwrap_err();
    assert_eq!(error_field(&s, &e), Some(Field::KTempC));
}

#[test]
fn mean_temperatures_must_differ_for_a_varying_k() {
    let mut s = solved_demo();
    s.k_temp_b = s.k_temp_a;
    assert!(evaluate(&s).is_err());
    s.layer_kb = s.layer_ka;
    assert!(evaluate(&s).is_ok());
}

/// A hot-water line with 2 kg/s through it: the worked-out inside film, its place in the
/// balance, the link, and the process fluid's own limits.
#[test]
fn inside_film_from_the_flow() {
    let mut s = solved_demo();
    s.mass_flow = 2.0;
    s.process_temp = 353.15;
    s.inside = InsideFilm::Water;
    let o = evaluate(&s).unwrap();
    let f = o.inside.as_ref().expect("a flow makes an inside film");
    let d_in = s.diameter - 2.0 * s.wall_thickness;
    let by_hand = crate::engine::correlations::internal::pipe_flow(
        process_properties(&Fluid::Water, 353.15).unwrap(),
        2.0,
        d_in,
        s.length,
    )
    .unwrap();
    assert_eq!(f.h, by_hand.h);
    // The bore sits below the process temperature by q/(h_i·π·d).
    let sol = &o.job.as_ref().unwrap().solution;
    let drop = sol.q / (f.h * std::f64::consts::PI * d_in);
    assert!((s.process_temp - sol.t_bore - drop).abs() < 1e-9 * drop.max(1e-9));
    assert!(
        drop > 0.0 && drop < 0.5,
        "a turbulent water film barely matters: {drop}"
    );
    // The film is the only change: typed with the same value, the answer is the same.
    let mut typed = s;
    typed.inside = InsideFilm::Typed;
    typed.h_inside = f.h;
    let ot = evaluate(&typed).unwrap();
    assert_eq!(ot.job.unwrap().solution.q, sol.q);
    assert!(o.working.iter().any(|w| w.text.contains("Gnielinski")));
    assert!(!s.uses(Field::HInside) && !s.uses(Field::ProcessCp) && s.uses(Field::MassFlow));
    // The link carries the choice.
    let (back, _) = from_fragment(&to_fragment(&s, System::Si)).unwrap();
    assert_eq!(back, s);
    // Still water: no film, a note, the freezing card as before.
    let mut still = s;
    still.mass_flow = 0.0;
    still.fluid_temp = 258.15;
    still.process_temp = 283.15;
    let os = evaluate(&still).unwrap();
    assert!(os.inside.is_none());
    assert!(os
        .job
        .as_ref()
        .unwrap()
        .notes
        .iter()
        .any(|n| n.contains("No flow")));
    assert!(os.verdicts.iter().any(|v| v.id == "freeze"));
    // Still glycol does not freeze like water: no freezing card.
    still.inside = InsideFilm::PropyleneGlycol;
    still.process_glycol = 0.4;
    let og = evaluate(&still).unwrap();
    assert!(!og.verdicts.iter().any(|v| v.id == "freeze"));
    assert!(still.uses(Field::ProcessGlycol));
    // Water below its freezing point inside is an error beside the process temperature.
    let mut frozen = s;
    frozen.process_temp = 268.15;
    let e = evaluate(&frozen).unwrap_err();
    assert_eq!(error_field(&s, &e), Some(Field::ProcessTemp), "{e}");
    // A sphere (a tank) keeps the typed film whatever the choice says.
    let mut tank = s;
    tank.shape = Shape::Sphere;
    assert!(!tank.inside_computed() && tank.uses(Field::HInside));
}

/// The outlet of a flowing line uses the process fluid's own cp when the film is worked out.
#[test]
fn run_temperature_drop_uses_the_fluids_cp() {
    let mut s = solved_demo();
    s.mass_flow = 0.05;
    s.inside = InsideFilm::EthyleneGlycol;
    s.process_glycol = 0.3;
    s.process_temp = 343.15;
    let o = evaluate(&s).unwrap();
    let flow = o.verdicts.iter().find(|v| v.id == "flow").unwrap();
    let drop = flow.figures.iter().find(|f| f.0 == "drop").unwrap().1;
    let cp = o.inside.as_ref().unwrap().props.cp;
    assert!(cp > 3400.0 && cp < 3900.0, "{cp}");
    // Against the same line with water's typed cp: a lower cp drops more.
    let mut typed = s;
    typed.inside = InsideFilm::Typed;
    typed.h_inside = o.inside.as_ref().unwrap().h;
    typed.process_cp = 4180.0;
    let ot = evaluate(&typed).unwrap();
    let flow_t = ot.verdicts.iter().find(|v| v.id == "flow").unwrap();
    assert!(drop > flow_t.figures.iter().find(|f| f.0 == "drop").unwrap().1);
}

#[test]
fn cautions_follow_the_surface_temperature() {
    let o = evaluate(&DEMO).unwrap();
    assert_eq!(cautions(&DEMO, &o).len(), 1, "the 65 °C demo line is hot");
    let mut cold = DEMO;
    cold.surface_temp = 263.15;
    let o = evaluate(&cold).unwrap();
    // Below the frost point (below freezing): one caution, of frost; not hot.
    let c = cautions(&cold, &o);
    assert_eq!(c.len(), 1, "{c:?}");
    assert!(c[0].contains("frost point"), "{c:?}");
    let mut mild = DEMO;
    mild.surface_temp = 300.0;
    assert!(cautions(&mild, &evaluate(&mild).unwrap()).is_empty());
}

#[test]
fn equal_temperatures_say_no_heat_flow() {
    let mut s = DEMO;
    s.surface_temp = s.fluid_temp;
    let e = evaluate(&s).unwrap_err();
    assert!(matches!(e, EngineError::NoTemperatureDifference { .. }));
    assert_eq!(error_field(&s, &e), Some(Field::SurfaceTemp));
}

#[test]
fn still_air_gives_the_natural_answer() {
    let mut s = DEMO;
    s.speed = 0.0;
    let o = evaluate(&s).unwrap();
    let n = o.analysis.natural.as_ref().unwrap();
    assert!((o.h - n.h).abs() <= 1e-12 * n.h);
    assert!(o.analysis.mode().starts_with("natural"));
    // The forced correlation is still shown, flagged outside its range.
    assert!(o
        .flags
        .iter()
        .any(|f| f.method == crate::engine::correlations::cylinder::CHURCHILL_BERNSTEIN));
}

#[test]
fn still_user_fluid_without_beta_is_an_error_at_beta() {
    let mut s = DEMO;
    s.fluid = FluidKind::User;
    s.user_beta = 0.0;
    s.speed = 0.0;
    let e = evaluate(&s).unwrap_err();
    assert_eq!(error_field(&s, &e), Some(Field::UserBeta));
    s.speed = 0.2;
    assert!(evaluate(&s).unwrap().analysis.natural.is_none());
}

#[test]
fn every_shape_evaluates_and_sphere_has_no_per_length_figure() {
    for shape in Shape::ALL {
        let mut s = DEMO;
        s.shape = shape;
        let o = evaluate(&s).unwrap_or_else(|e| panic!("{shape:?}: {e}"));
        assert!(o.h > 0.0 && o.q_total > 0.0);
        assert_eq!(o.q_per_length.is_none(), shape == Shape::Sphere);
        let mut v = s;
        v.axis = Axis::Vertical;
        assert!(evaluate(&v).unwrap().h > 0.0);
    }
}

#[test]
fn absurd_magnitudes_are_errors_not_nan() {
    for (f, v) in [
        (Field::Diameter, 1e308),
        (Field::Diameter, 0.0),
        (Field::Diameter, -1.0),
        (Field::Speed, -1.0),
        (Field::FluidTemp, -1.0),
        (Field::Pressure, 1e308),
        (Field::Speed, f64::NAN),
        (Field::RelativeHumidity, 1.5),
    ] {
        let mut s = DEMO;
        s.set(f, v);
        assert!(evaluate(&s).is_err(), "{f:?} = {v}");
    }
}

#[test]
fn field_messages_speak_the_users_unit() {
    let c = units::unit("C").unwrap();
    let e = read_field(spec(Field::FluidTemp), "-300", c).unwrap_err();
    assert!(e.contains("absolute zero") && e.contains("-273.1"), "{e}");
    let mm = units::unit("mm").unwrap();
    assert_eq!(read_field(spec(Field::Diameter), "60,3", mm), Ok(0.0603));
    assert!(read_field(spec(Field::Diameter), "0", mm)
        .unwrap_err()
        .contains("more than 0 mm"));
    assert!(read_field(spec(Field::Diameter), "", mm).is_err());
    let pct = units::unit("%").unwrap();
    assert!(read_field(spec(Field::RelativeHumidity), "120", pct)
        .unwrap_err()
        .contains("100 %"));
}

/// Regression: a conductivity that falls below zero in insulation layer 2 was reported beside
/// layer 1 (the page matched the message text). The error now names its layer as data.
#[test]
fn a_bad_conductivity_is_reported_beside_its_own_layer() {
    let mut s = DEMO;
    s.surface_mode = SurfaceMode::Solved;
    s.layer_count = 3;
    s.process_temp = 453.15;
    // Layer 2's k falls from 0.05 at 10 °C to 0.001 at 100 °C: below zero well before 180 °C.
    s.layer_ka[1] = 0.05;
    s.layer_kb[1] = 0.001;
    let e = evaluate(&s).unwrap_err();
    assert_eq!(error_field(&s, &e), Some(Field::Layer2Kb), "{e}");
    s.layer_ka[1] = DEMO.layer_ka[1];
    s.layer_kb[1] = DEMO.layer_kb[1];
    s.layer_ka[2] = 0.05;
    s.layer_kb[2] = 0.001;
    let e = evaluate(&s).unwrap_err();
    assert_eq!(error_field(&s, &e), Some(Field::Layer3Kb), "{e}");
}

/// Regression: in solved mode a process temperature equal to the stream's sent its message to the
/// surface temperature, which is hidden there; it now goes beside the process temperature.
#[test]
fn no_temperature_difference_in_solved_mode_goes_beside_the_process_temperature() {
    let mut s = DEMO;
    s.surface_mode = SurfaceMode::Solved;
    s.process_temp = s.fluid_temp;
    let e = evaluate(&s).unwrap_err();
    assert!(
        matches!(e, EngineError::NoTemperatureDifference { .. }),
        "{e}"
    );
    assert_eq!(error_field(&s, &e), Some(Field::ProcessTemp));
}

/// Regression (defect 9 of the hostile-user report): messages showed raw SI numbers with float
/// noise ("bore radius = -0.0028499999999999984 m"). Now in the person's units, at the unit's
/// display resolution.
#[test]
fn error_messages_are_in_the_persons_units_without_float_noise() {
    let mut s = DEMO;
    s.surface_mode = SurfaceMode::Solved;
    s.wall_thickness = 0.033; // more than the 30.15 mm outer radius
    let e = evaluate(&s).unwrap_err();
    let si = error_message(&e, &units::UnitChoice::for_system(System::Si));
    assert!(si.contains("-2.85 mm") && si.starts_with('B'), "{si}");
    let us = error_message(&e, &units::UnitChoice::for_system(System::Us));
    assert!(us.contains("-0.112 in") && !us.contains("mm"), "{us}");
    // A phase error in °F on a US page.
    let mut w = DEMO;
    w.fluid = FluidKind::Water;
    w.fluid_temp = 390.0;
    if let Err(e) = evaluate(&w) {
        let us = error_message(&e, &units::UnitChoice::for_system(System::Us));
        assert!(us.contains("°F") && !us.contains(" K"), "{us}");
    }
}

/// The field table is the single source of truth: in `Field`'s order, keys and labels unique, and
/// every row's getter and setter reach its own slot of the scenario and no other.
#[test]
fn every_row_of_the_field_table_owns_one_slot() {
    let mut keys = std::collections::HashSet::new();
    let mut labels = std::collections::HashSet::new();
    for (i, row) in FIELDS.iter().enumerate() {
        assert_eq!(row.field as usize, i, "{:?} out of order", row.field);
        assert!(keys.insert(row.key), "key {} twice", row.key);
        assert!(labels.insert(row.label), "label {} twice", row.label);
        let mut s = DEMO;
        let v = 12345.678 + i as f64;
        s.set(row.field, v);
        for other in &FIELDS {
            let want = if other.field == row.field {
                v
            } else {
                DEMO.get(other.field)
            };
            assert_eq!(
                s.get(other.field).to_bits(),
                want.to_bits(),
                "setting {} moved {}",
                row.key,
                other.key
            );
        }
    }
}

/// Cautions only where they apply: a hot line in frost air carries no "freeze and burst" words
/// (that caution belongs to the still-water freezing card); frost on a surface below 0 °C is
/// named only where the stream carries moisture.
#[test]
fn cautions_apply_only_where_they_should() {
    let mut hot = DEMO;
    hot.surface_mode = SurfaceMode::Solved;
    hot.process_temp = 423.15;
    hot.fluid_temp = 263.15;
    hot.t_surround = 263.15;
    hot.layer_count = 0;
    hot.mass_flow = 2.0;
    let o = evaluate(&hot).unwrap();
    let all = cautions(&hot, &o).join(" ");
    assert!(!all.contains("burst") && !all.contains("frost"), "{all}");
    assert!(
        o.verdicts.iter().all(|v| v.id != "freeze"),
        "no freezing card with flow"
    );
    // A hot line's jacket below 0 °C but above the air's frost point stays dry: no frost.
    let mut jacket = hot;
    jacket.layer_count = 3;
    jacket.fluid = FluidKind::HumidAir;
    let o = evaluate(&jacket).unwrap();
    let td = o.dew_point.unwrap();
    assert!(
        o.surface_temp < 273.15 && o.surface_temp > td,
        "{} {td}",
        o.surface_temp
    );
    assert!(!cautions(&jacket, &o).iter().any(|c| c.contains("frost")));
    // A surface below the frost point in humid air: frost, in dry air: nothing about frost.
    let mut cold = DEMO;
    cold.fluid_temp = 263.15;
    cold.t_surround = 263.15;
    cold.surface_temp = 258.15;
    let o = evaluate(&cold).unwrap();
    assert!(cautions(&cold, &o).iter().any(|c| c.contains("frost")));
    cold.fluid = FluidKind::DryAir;
    let o = evaluate(&cold).unwrap();
    assert!(!cautions(&cold, &o).iter().any(|c| c.contains("frost")));
}

/// Help texts speak the person's units: no "°C" in US units, no "°F" in SI.
#[test]
fn help_texts_are_in_the_units_chosen() {
    use crate::engine::units::{System, UnitChoice};
    let si = UnitChoice::for_system(System::Si);
    let us = UnitChoice::for_system(System::Us);
    let touch = spec(Field::TouchLimit);
    assert_eq!(
        help_text(touch, &si),
        "60 °C is common practice; local codes govern"
    );
    assert_eq!(
        help_text(touch, &us),
        "140 °F is common practice; local codes govern"
    );
    assert_eq!(
        help_text(spec(Field::ProcessCp), &us),
        "about 0.9984 Btu/(lb·°F) for water"
    );
    for f in FIELDS.iter() {
        let t = help_text(f, &us);
        assert!(
            !t.contains("°C") && !t.contains("J/") && !t.contains('{'),
            "{}: {t}",
            f.key
        );
    }
}

/// Every step the report keeps is a step the working writes (a renamed step would silently drop
/// out of the report): a solved job with a flow writes all five.
#[test]
fn the_reports_key_steps_are_written() {
    let mut s = DEMO;
    s.surface_mode = SurfaceMode::Solved;
    s.inside = InsideFilm::Water;
    s.mass_flow = 1.0;
    let o = evaluate(&s).unwrap();
    assert_eq!(
        o.working.iter().filter(|st| st.is_key()).count(),
        5,
        "{:?}",
        o.working.iter().map(|s| s.title).collect::<Vec<_>>()
    );
}

/// Regression (phone walk): a winter steam line showed a freezing card with no way to say it
/// carries steam. Marked as steam or gas, it has none; typed (unknown contents, taken as water)
/// it keeps it.
#[test]
fn a_steam_line_gets_no_freezing_card() {
    let mut s = DEMO;
    s.surface_mode = SurfaceMode::Solved;
    s.fluid_temp = 263.15;
    s.t_surround = 263.15;
    s.process_temp = 423.15;
    s.layer_count = 0;
    s.mass_flow = 0.0;
    s.inside = InsideFilm::Typed;
    let has_freeze = |s: &Scenario| {
        evaluate(s)
            .unwrap()
            .verdicts
            .iter()
            .any(|v| v.id == "freeze")
    };
    assert!(has_freeze(&s));
    s.inside = InsideFilm::Gas;
    assert!(!has_freeze(&s));
    // nor is the time to hold out against freezing asked for (the report listed it)
    assert!(!s.uses(Field::FreezeTarget));
    // the link keeps the choice
    let (back, _) = from_fragment(&to_fragment(&s, crate::engine::units::System::Si)).unwrap();
    assert_eq!(back.inside, InsideFilm::Gas);
}

/// Air typed at 1,000 °C with a relative humidity: the humidity has no meaning above water's
/// critical temperature (647.096 K, IAPWS), and the message stands beside the air temperature
/// that was typed, not beside the humidity several fields away.
#[test]
fn air_above_waters_critical_point_is_marked_at_its_temperature() {
    let mut s = DEMO;
    s.fluid_temp = 1273.15;
    let e = evaluate(&s).unwrap_err();
    assert_eq!(error_field(&s, &e), Some(Field::FluidTemp), "{e}");
    assert!(e.to_string().contains("dew point"), "{e}");
    // What the message offers: the same air with its dew point given computes.
    s.humidity_input = HumidityInput::DewPoint;
    s.dew_point = 283.15;
    assert!(evaluate(&s).is_ok());
}
