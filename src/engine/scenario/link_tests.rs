//! The link: a scenario to its URL fragment and back, exactly; view options riding along;
//! hostile fragments refused; what a link that leaves a field out means.

use super::tests::solved_demo;
use super::*;

#[test]
fn solved_fragment_round_trips() {
    let mut s = solved_demo();
    s.layer_count = 3;
    s.wall = WallMaterial::User;
    s.wall_k = 0.4;
    s.layer_t = [0.01, 0.02, 0.03];
    s.loss_target = 25.0;
    s.freeze_target = 36_000.0;
    let (back, _) = from_fragment(&to_fragment(&s, System::Si)).unwrap();
    assert_eq!(back, s);
}

#[test]
fn fragment_round_trips_exactly() {
    let mut s = DEMO;
    s.diameter = 0.0334;
    s.speed = 1.0 / 3.0;
    s.fluid_temp = 250.123456789;
    s.surface_temp = 400.0;
    s.pressure_input = PressureInput::Elevation;
    s.elevation = 1234.5;
    s.humidity_input = HumidityInput::DewPoint;
    s.dew_point = 240.0;
    s.wind = Wind::Up;
    s.length = 3.25;
    let (back, sys) = from_fragment(&to_fragment(&s, System::Us)).unwrap();
    assert_eq!(back, s);
    assert_eq!(sys, System::Us);
    for kind in FluidKind::ALL {
        let mut s = DEMO;
        s.fluid = kind;
        assert_eq!(from_fragment(&to_fragment(&s, System::Si)).unwrap().0, s);
    }
    for shape in Shape::ALL {
        let mut s = DEMO;
        s.shape = shape;
        s.axis = Axis::Vertical;
        if shape == Shape::Sphere {
            s.axis = Axis::Horizontal;
        }
        assert_eq!(from_fragment(&to_fragment(&s, System::Si)).unwrap().0, s);
    }
}

#[test]
fn view_options_ride_along_and_leave_the_scenario_alone() {
    let f = format!("{}&view=embed&lock=1", to_fragment(&DEMO, System::Si));
    assert_eq!(
        ViewOptions::from_fragment(&f),
        ViewOptions {
            embed: true,
            locked: true
        }
    );
    assert_eq!(from_fragment(&f).unwrap().0, DEMO);
    assert_eq!(
        ViewOptions::from_fragment("#v=1&view=full"),
        ViewOptions::default()
    );
}

#[test]
fn hostile_or_malformed_fragments_are_refused() {
    let long = format!("v=1&D={}", "1".repeat(5000));
    for bad in [
        "v=1&D=<script>alert(1)</script>",
        "v=2&D=0.05",
        "D=0.05",
        "v=1&D=-1",
        "v=1&D=NaN",
        "v=1&U",
        "v=1&u=imperial",
        "v=1&f=<b>",
        "v=1&pm=x",
        "v=1&s=cube",
        "v=1&w=sideways",
        long.as_str(),
    ] {
        let e = from_fragment(bad).unwrap_err();
        assert!(!e.contains('<'), "message echoes input: {e}");
    }
    // Missing keys take the demo's values; unknown keys are ignored.
    assert_eq!(from_fragment("#v=1&future=3").unwrap().0, DEMO);
}

/// A hand-written link that leaves out the surroundings and the ground means the stream's
/// temperature for both, not the demo's (a winter link radiated to 5 °C surroundings).
#[test]
fn a_link_without_surroundings_follows_the_stream() {
    let (s, _) = from_fragment("v=1&s=cyl&Ta=263.15&sm=x&Tp=423.15").unwrap();
    assert_eq!(s.t_surround, 263.15);
    let (s, _) = from_fragment("v=1&s=cyl&f=humid&Ta=263.15&env=out").unwrap();
    assert_eq!(s.t_ground, 263.15);
    let (s, _) = from_fragment("v=1&s=cyl&Ta=263.15&Tr=300").unwrap();
    assert_eq!(s.t_surround, 300.0);
}

/// The same for an infrared reading's reflected temperature: left out of a link it is the
/// surroundings' the instrument saw (typed apart, or the stream's), not the demo's.
#[test]
fn a_link_without_the_reflected_temperature_follows_the_surroundings() {
    let (s, _) = from_fragment("v=1&s=cyl&Ta=263.15&sm=r&Tp=423.15&nl=1").unwrap();
    assert_eq!(s.ir_reflected, 263.15);
    let (s, _) = from_fragment("v=1&s=cyl&Ta=263.15&Tr=250&sm=r&Tp=423.15&nl=1").unwrap();
    assert_eq!(s.ir_reflected, 250.0);
    let (s, _) = from_fragment("v=1&s=cyl&Ta=263.15&sm=r&Tp=423.15&nl=1&Trf=300").unwrap();
    assert_eq!(s.ir_reflected, 300.0);
}
