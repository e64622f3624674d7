//! Checks of heat made inside on the page's path (issue #19): a published conductor rating
//! reproduced through a scenario and its link, and the mode's wiring against the typed surface.

use super::*;

/// IEEE Std 738-2006, Annex B, through a scenario: the Drake 26/7 ACSR conductor (D = 28.14 mm,
/// ε = α_s = 0.8; 7.283×10⁻⁵ Ω/m at 25 °C and 8.688×10⁻⁵ Ω/m at 75 °C, AC) in 40 °C air at sea
/// level, a 0.61 m/s wind square to it, absorbing 22.44 W/m of sun; printed: 1025 A holds it at
/// 100 °C. The scenario gives the sun as a beam on the projected area (22.44 / (0.8 × 0.02814)
/// W/m²), the ground at the air temperature filling the view (the standard radiates to the
/// air), and the wind read at 10 m over open ground (the reference height: the wind at the
/// body is the reading). The engine cools with its own correlations, not the standard's: the
/// spread between the two is worked out in `outdoors::joule_tests` (1031 A against 1025 A, and
/// 99.4 °C against 100 °C at 1025 A), and the tolerances here are that spread.
fn drake_line() -> Scenario {
    let mut s = DEMO;
    s.surface_mode = SurfaceMode::Made;
    s.heat_source = HeatSource::Current;
    s.diameter = 0.02814;
    s.length = 1.0;
    s.speed = 0.61;
    s.fluid = FluidKind::HumidAir;
    // Nearly dry: outdoors the sky needs a dew point, though the ground fills the view here.
    s.relative_humidity = 0.01;
    s.fluid_temp = 313.15;
    s.pressure = 101_325.0;
    s.emissivity = 0.8;
    s.absorptance = 0.8;
    s.setting = Setting::Outdoors;
    s.sky_view = 0.0;
    s.t_ground = 313.15;
    s.beam_normal = 22.44 / (0.8 * 0.02814);
    s.diffuse = 0.0;
    s.global = 0.0;
    s.body_height = 10.0;
    s.terrain = Terrain::Open;
    s.yaw = 90.0;
    s.current = 1025.0;
    s.r_low = 7.283e-5;
    s.t_r_low = 298.15;
    s.r_high = 8.688e-5;
    s.t_r_high = 348.15;
    s.conductor_limit = 373.15;
    s
}

#[test]
fn ieee_738_annex_b_drake_through_a_scenario_link() {
    // Through the link, as a saved item or a shared link carries it.
    let link = to_fragment(&drake_line(), System::Si);
    assert!(link.contains("&sm=h") && link.contains("&hk=i"), "{link}");
    let (s, system) = from_fragment(&link).unwrap();
    assert_eq!((s, system), (drake_line(), System::Si));
    let o = evaluate(&s).unwrap();
    // The sun the scenario absorbs is the standard's, per metre.
    assert!((o.solar_per_length.unwrap() - 22.44).abs() < 1e-9);
    assert!((o.wind_at_body.unwrap() - 0.61).abs() < 1e-9);
    let m = o.made.as_ref().unwrap();
    // At the printed 1025 A: 100 °C printed, 99.4 °C by the engine's correlations.
    let ts = o.surface_temp - 273.15;
    assert!((98.9..=100.5).contains(&ts), "{ts} °C");
    // The heat made is I²·R at that temperature, and it is what the surface loses.
    assert!((m.made - 1025.0_f64.powi(2) * m.resistance.unwrap()).abs() < 1e-9 * m.made);
    assert!((o.q_per_length.unwrap() - m.made).abs() < 1e-9 * m.made);
    // The current for 100 °C: printed 1025 A, the engine 1031 A.
    let (_, amps) = m.at_limit.unwrap();
    let amps = amps.unwrap();
    assert!((1024.5..=1033.0).contains(&amps), "{amps} A");
    // Below its limit: the card says so, with its caution.
    let card = o.verdicts.iter().find(|v| v.id == "made").unwrap();
    assert!(card.ok && card.caution == Some(MADE_CAUTION));
    // The working carries the balance, and the report keeps it.
    let step = o
        .working
        .iter()
        .find(|w| w.title == "Heat made inside (energy balance)")
        .unwrap();
    assert!(
        step.is_key() && step.text.contains("I²·R(Ts)"),
        "{}",
        step.text
    );
}

#[test]
fn a_current_past_the_limit_fails_the_card() {
    let mut s = drake_line();
    s.current = 1300.0;
    let o = evaluate(&s).unwrap();
    let card = o.verdicts.iter().find(|v| v.id == "made").unwrap();
    assert!(!card.ok && o.surface_temp > 373.15);
}

/// Wiring: indoors, a tracer's 20 W/m settles the surface where a typed surface at that
/// temperature loses exactly 20 W/m (the two paths of the page agree), and the heat that holds
/// the solved temperature is the heat made.
#[test]
fn a_heat_made_is_what_the_surface_then_loses() {
    let mut s = DEMO;
    s.surface_mode = SurfaceMode::Made;
    s.heat_made = 20.0;
    s.speed = 2.0;
    let o = evaluate(&s).unwrap();
    assert!(
        (o.q_per_length.unwrap() - 20.0).abs() < 1e-6,
        "{:?}",
        o.q_per_length
    );
    let mut typed = s;
    typed.surface_mode = SurfaceMode::Given;
    typed.surface_temp = o.surface_temp;
    let t = evaluate(&typed).unwrap();
    assert!((t.q_per_length.unwrap() - 20.0).abs() < 1e-6);
    // Held at the temperature it reaches, the heat needed is the heat made.
    s.hold_temp = o.surface_temp;
    let m = evaluate(&s).unwrap().made.unwrap();
    assert!((m.at_limit.unwrap().0 - 20.0).abs() < 1e-6);
    // A keep-above temperature it does not reach fails the card, with the heat that would.
    s.hold_temp = o.surface_temp + 5.0;
    let o = evaluate(&s).unwrap();
    let card = o.verdicts.iter().find(|v| v.id == "made").unwrap();
    assert!(!card.ok);
    assert!(o.made.unwrap().at_limit.unwrap().0 > 20.0);
}

/// A sphere takes its heat per body; a current needs a long conductor (the link never writes
/// `hk` for a sphere, and a sphere given one reads its heat).
#[test]
fn a_sphere_makes_a_heat_per_body() {
    let mut s = DEMO;
    s.shape = Shape::Sphere;
    s.surface_mode = SurfaceMode::Made;
    s.heat_source = HeatSource::Current;
    s.heat_body = 5.0;
    assert!(!s.current_given() && s.uses(Field::HeatBody) && !s.uses(Field::Current));
    assert!(!to_fragment(&s, System::Si).contains("hk="));
    let o = evaluate(&s).unwrap();
    assert!((o.q_total - 5.0).abs() < 1e-6, "{}", o.q_total);
    assert!(o.q_per_length.is_none());
}

/// A wrong resistance pair is refused with a message naming it, nothing computed.
#[test]
fn a_resistance_pair_in_the_wrong_order_is_refused() {
    let mut s = drake_line();
    s.t_r_high = s.t_r_low;
    assert!(evaluate(&s).is_err());
}

/// A temperature to keep that the surroundings alone already hold needs no heat (it was shown as
/// a refusal in kelvin with fourteen decimals); a conductor limit below them has no current, in
/// words; with nothing made (the sun alone warming the line) the loss is nothing, not rounding
/// noise.
#[test]
fn limits_the_surroundings_already_hold_read_in_words() {
    let mut s = DEMO;
    s.surface_mode = SurfaceMode::Made;
    s.hold_temp = s.fluid_temp - 30.0;
    let m = evaluate(&s).unwrap().made.unwrap();
    assert_eq!(
        (m.at_limit, m.refused.as_deref()),
        (Some((0.0, None)), None)
    );
    let mut c = drake_line();
    c.conductor_limit = 300.0;
    let o = evaluate(&c).unwrap();
    let why = o.made.as_ref().unwrap().refused.clone().unwrap();
    assert!(!why.contains(" K") && why.contains("no current"), "{why}");
    let card = o.verdicts.iter().find(|v| v.id == "made").unwrap();
    assert!(card.summary.contains(&why));
    c.current = 0.0;
    c.conductor_limit = 373.15;
    let o = evaluate(&c).unwrap();
    assert_eq!(o.q_per_length, Some(0.0));
    assert_eq!(o.annual_energy, 0.0);
}

/// A tracer's output reads in W/ft on a US page, as heat-tracing data sheets give it (the loss
/// stays in Btu/(h·ft), the insulation trade's); 10 W/ft is 32.8 W/m (1 ft = 0.3048 m exactly).
#[test]
fn a_tracers_output_is_in_watts_per_foot_in_us_units() {
    use crate::engine::units::UnitChoice;
    let us = UnitChoice::for_system(System::Us);
    let u = us.get(spec(Field::HeatMade).dim);
    assert_eq!(u.symbol, "W/ft");
    assert!((u.to_si(10.0) - 10.0 / 0.3048).abs() < 1e-12);
    assert_eq!(
        UnitChoice::for_system(System::Si)
            .get(spec(Field::HeatMade).dim)
            .symbol,
        "W/m"
    );
    assert_eq!(us.get(Dim::HeatFlowPerLength).symbol, "Btu/(h·ft)");
}
