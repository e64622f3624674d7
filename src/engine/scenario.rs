//! A whole calculation: the inputs a user gives, their hard limits, the evaluation with its
//! working, and the link format that carries it.
//!
//! Today's scenario is a circular cylinder (a bare pipe, rod or wire) in a cross-flow of dry air.

use crate::engine::correlations::cylinder;
use crate::engine::error::{finite_result, EngineError};
use crate::engine::props::{Fluid, Properties};
use crate::engine::units::{self, format_sig, Dim, System, Unit};
use crate::engine::validity::Flag;

/// The inputs, SI: diameter m, speed m/s, temperatures K, pressure Pa.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Scenario {
    pub diameter: f64,
    pub speed: f64,
    pub air_temp: f64,
    pub surface_temp: f64,
    pub pressure: f64,
}

/// The demo that opens by default (invented): a bare 2-inch line (60.3 mm outside diameter) with
/// its surface at 65 °C, crossing a roof in a 7 m/s wind of 5 °C air at sea-level pressure.
pub const DEMO: Scenario = Scenario {
    diameter: 0.0603,
    speed: 7.0,
    air_temp: 278.15,
    surface_temp: 338.15,
    pressure: 101_325.0,
};

pub const DEMO_TITLE: &str = "Demo: a bare 2-inch line on a windy roof";

/// Which input a value belongs to.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Field {
    Diameter,
    Speed,
    AirTemp,
    SurfaceTemp,
    Pressure,
}

/// An input's label, dimension, link key and hard limits. The limits are where the computation
/// stops making physical sense (not a method's fitted range, which only flags).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FieldSpec {
    pub field: Field,
    /// Key in the link fragment.
    pub key: &'static str,
    pub label: &'static str,
    pub dim: Dim,
    /// SI; `min_open` makes the lower limit exclusive.
    pub min: f64,
    pub min_open: bool,
    pub max: f64,
    pub help: &'static str,
}

pub const FIELDS: [FieldSpec; 5] = [
    FieldSpec {
        field: Field::Diameter,
        key: "D",
        label: "Outside diameter",
        dim: Dim::Length,
        min: 0.0,
        min_open: true,
        max: 100.0,
        help: "of the bare surface the air touches",
    },
    FieldSpec {
        field: Field::Speed,
        key: "U",
        label: "Air speed",
        dim: Dim::Speed,
        min: 0.0,
        min_open: false,
        max: 300.0,
        help: "across the pipe axis",
    },
    FieldSpec {
        field: Field::AirTemp,
        key: "Ta",
        label: "Air temperature",
        dim: Dim::Temperature,
        min: 0.0,
        min_open: true,
        max: 3000.0,
        help: "of the approaching air",
    },
    FieldSpec {
        field: Field::SurfaceTemp,
        key: "Ts",
        label: "Surface temperature",
        dim: Dim::Temperature,
        min: 0.0,
        min_open: true,
        max: 3000.0,
        help: "of the outer surface",
    },
    FieldSpec {
        field: Field::Pressure,
        key: "p",
        label: "Air pressure",
        dim: Dim::Pressure,
        min: 0.0,
        min_open: true,
        max: 100e6,
        help: "absolute, at the site",
    },
];

pub fn spec(field: Field) -> &'static FieldSpec {
    FIELDS
        .iter()
        .find(|s| s.field == field)
        .expect("every field has a spec")
}

impl Scenario {
    pub fn get(&self, f: Field) -> f64 {
        match f {
            Field::Diameter => self.diameter,
            Field::Speed => self.speed,
            Field::AirTemp => self.air_temp,
            Field::SurfaceTemp => self.surface_temp,
            Field::Pressure => self.pressure,
        }
    }
    pub fn set(&mut self, f: Field, v: f64) {
        match f {
            Field::Diameter => self.diameter = v,
            Field::Speed => self.speed = v,
            Field::AirTemp => self.air_temp = v,
            Field::SurfaceTemp => self.surface_temp = v,
            Field::Pressure => self.pressure = v,
        }
    }
}

/// Check an SI value against the field's hard limits. The message is written in `shown`, the
/// unit the user is looking at.
pub fn check_field(spec: &FieldSpec, si: f64, shown: &Unit) -> Result<f64, String> {
    let lim = |v: f64| format!("{} {}", format_sig(shown.from_si(v), 4), shown.symbol);
    if !si.is_finite() {
        return Err("the number is too large to use".into());
    }
    let too_low = if spec.min_open {
        si <= spec.min
    } else {
        si < spec.min
    };
    if too_low {
        if spec.dim == Dim::Temperature {
            return Err(format!("must be above absolute zero ({})", lim(0.0)));
        }
        let word = if spec.min_open {
            "more than"
        } else {
            "at least"
        };
        return Err(format!("must be {word} {}", lim(spec.min)));
    }
    if si > spec.max {
        return Err(format!("must be at most {}", lim(spec.max)));
    }
    Ok(si)
}

/// Parse a field's text typed in unit `shown` and check it: the value in SI, or the message to
/// show beside the field.
pub fn read_field(spec: &FieldSpec, text: &str, shown: &Unit) -> Result<f64, String> {
    let v = units::parse_number(text).map_err(|e| e.to_string())?;
    check_field(spec, shown.to_si(v), shown)
}

/// One step of the working, written so it can be checked by hand.
#[derive(Debug, Clone, PartialEq)]
pub struct Step {
    pub title: &'static str,
    pub text: String,
}

/// The flow regime around the cylinder at this Reynolds number.
pub fn regime_note(re: f64) -> &'static str {
    if re < 2e5 {
        "Subcritical (Re below about 2×10⁵): the laminar boundary layer separates near 80° from the front stagnation point; the wake drives the heat transfer at the rear."
    } else {
        "Critical or beyond (Re above about 2×10⁵): the boundary layer turns turbulent before it separates, further back; here the correlations disagree most."
    }
}

/// Everything the page shows for one evaluation, SI.
#[derive(Debug, Clone, PartialEq)]
pub struct Outcome {
    pub film_temp: f64,
    pub props: Properties,
    pub reynolds: f64,
    pub prandtl: f64,
    pub nusselt: f64,
    /// Mean convective heat-transfer coefficient, W/(m²·K).
    pub h: f64,
    /// Heat flow per metre of length, W/m (positive from surface to air).
    pub q_per_length: f64,
    pub method: &'static str,
    pub regime: &'static str,
    pub flags: Vec<Flag>,
    pub working: Vec<Step>,
}

/// Evaluate a scenario. Errors only where nothing meaningful can be computed.
pub fn evaluate(s: &Scenario) -> Result<Outcome, EngineError> {
    for spec in &FIELDS {
        let v = s.get(spec.field);
        check_field(spec, v, units::units_of(spec.dim).next().expect("SI unit")).map_err(|_| {
            EngineError::Undefined {
                quantity: spec.label,
                value: v,
                unit: units::units_of(spec.dim)
                    .next()
                    .map(|u| u.symbol)
                    .unwrap_or(""),
                why: "outside the physical limits of the input",
            }
        })?;
    }
    if s.surface_temp == s.air_temp {
        return Err(EngineError::NoTemperatureDifference {
            value: s.air_temp,
            unit: "K",
        });
    }
    let film = 0.5 * (s.surface_temp + s.air_temp);
    let props = Fluid::DryAir.at(film, s.pressure)?;
    let re = finite_result("Reynolds number", s.speed * s.diameter / props.nu)?;
    let pr = props.pr;
    let cb = cylinder::churchill_bernstein(re, pr);
    let nu = finite_result("Nusselt number", cb.value)?;
    let h = finite_result("heat-transfer coefficient", nu * props.k / s.diameter)?;
    let dt = s.surface_temp - s.air_temp;
    let q = finite_result(
        "heat flow per length",
        h * std::f64::consts::PI * s.diameter * dt,
    )?;

    let mut flags = props.flags.clone();
    flags.extend(cb.flags);

    let g = |v: f64| format_sig(v, 5);
    let working = vec![
        Step {
            title: "Reference temperature",
            text: format!(
                "Churchill–Bernstein takes properties at the {}: Tf = ({} K + {} K)/2 = {} K",
                cylinder::CHURCHILL_BERNSTEIN_REFERENCE.describe(),
                g(s.surface_temp),
                g(s.air_temp),
                g(film)
            ),
        },
        Step {
            title: "Air properties at Tf",
            text: format!(
                "ρ = {} kg/m³, μ = {} Pa·s, k = {} W/(m·K), cp = {} J/(kg·K); ν = μ/ρ = {} m²/s",
                g(props.rho),
                g(props.mu),
                g(props.k),
                g(props.cp),
                g(props.nu)
            ),
        },
        Step {
            title: "Reynolds and Prandtl numbers",
            text: format!(
                "Re = U·D/ν = {} m/s × {} m / {} m²/s = {}; Pr = μ·cp/k = {}",
                g(s.speed),
                g(s.diameter),
                g(props.nu),
                g(re),
                g(pr)
            ),
        },
        Step {
            title: "Nusselt number (Churchill–Bernstein 1977)",
            text: format!(
                "Nu = 0.3 + 0.62·Re^½·Pr^⅓ / [1 + (0.4/Pr)^⅔]^¼ · [1 + (Re/282000)^⅝]^⅘ = {}",
                g(nu)
            ),
        },
        Step {
            title: "Heat-transfer coefficient",
            text: format!(
                "h = Nu·k/D = {} × {} W/(m·K) / {} m = {} W/(m²·K)",
                g(nu),
                g(props.k),
                g(s.diameter),
                g(h)
            ),
        },
        Step {
            title: "Heat flow per metre",
            text: format!(
                "q′ = h·π·D·(Ts − T∞) = {} × π × {} m × {} K = {} W/m",
                g(h),
                g(s.diameter),
                g(dt),
                g(q)
            ),
        },
    ];

    Ok(Outcome {
        film_temp: film,
        props,
        reynolds: re,
        prandtl: pr,
        nusselt: nu,
        h,
        q_per_length: q,
        method: cylinder::CHURCHILL_BERNSTEIN,
        regime: regime_note(re),
        flags,
        working,
    })
}

/// The link format's version. See README "Links".
pub const LINK_VERSION: u32 = 1;
/// Longest fragment read; anything longer is refused unread.
pub const LINK_MAX_LEN: usize = 2048;

/// Encode a scenario and the unit system as a URL fragment (without the `#`). Values are SI at
/// full precision (shortest round-trip form), so a link reproduces the calculation exactly.
pub fn to_fragment(s: &Scenario, system: System) -> String {
    let mut out = format!("v={LINK_VERSION}");
    for spec in &FIELDS {
        out.push_str(&format!("&{}={}", spec.key, s.get(spec.field)));
    }
    out.push_str(match system {
        System::Si => "&u=si",
        System::Us => "&u=us",
    });
    out
}

/// Read a fragment (with or without the leading `#`). Keys left out take the demo's value.
/// Anything malformed refuses the whole link with a message; nothing of it is ever echoed as markup.
pub fn from_fragment(fragment: &str) -> Result<(Scenario, System), String> {
    let f = fragment.strip_prefix('#').unwrap_or(fragment);
    if f.len() > LINK_MAX_LEN {
        return Err(format!(
            "the link's scenario is {} characters long, more than the {} a scenario can take",
            f.len(),
            LINK_MAX_LEN
        ));
    }
    let mut s = DEMO;
    let mut system = System::Si;
    let mut version = None;
    for pair in f.split('&').filter(|p| !p.is_empty()) {
        let (key, value) = pair
            .split_once('=')
            .ok_or_else(|| "the link's scenario is not in the key=value form".to_string())?;
        match key {
            "v" => version = Some(value),
            "u" => {
                system = match value {
                    "si" => System::Si,
                    "us" => System::Us,
                    _ => return Err("the link names an unknown unit system".into()),
                }
            }
            _ => {
                let Some(spec) = FIELDS.iter().find(|sp| sp.key == key) else {
                    continue; // a key from a later version: ignored
                };
                let si_unit = units::units_of(spec.dim).next().expect("SI unit");
                let v = read_field(spec, value, si_unit).map_err(|e| {
                    format!("the link's {} is unusable: {e}", spec.label.to_lowercase())
                })?;
                s.set(spec.field, v);
            }
        }
    }
    match version {
        Some(v) if v == LINK_VERSION.to_string() => Ok((s, system)),
        Some(_) => Err(format!(
            "the link was written in a format version this page does not read (it reads version {LINK_VERSION})"
        )),
        None => Err("the link has no format version (v=…)".into()),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn demo_evaluates_cleanly() {
        let o = evaluate(&DEMO).unwrap();
        assert!(o.flags.is_empty(), "{:?}", o.flags);
        assert!(o.q_per_length > 0.0 && o.h > 0.0);
        // Energy bookkeeping: q' = h·π·D·ΔT.
        let q = o.h * std::f64::consts::PI * DEMO.diameter * (DEMO.surface_temp - DEMO.air_temp);
        assert!((q - o.q_per_length).abs() <= 1e-12 * q);
    }

    #[test]
    fn heat_flows_into_a_cold_surface_with_a_negative_sign() {
        let mut s = DEMO;
        s.surface_temp = 263.15;
        assert!(evaluate(&s).unwrap().q_per_length < 0.0);
    }

    #[test]
    fn equal_temperatures_say_no_heat_flow() {
        let mut s = DEMO;
        s.surface_temp = s.air_temp;
        assert!(matches!(
            evaluate(&s),
            Err(EngineError::NoTemperatureDifference { .. })
        ));
    }

    #[test]
    fn still_air_is_computed_and_flagged() {
        let mut s = DEMO;
        s.speed = 0.0;
        let o = evaluate(&s).unwrap();
        assert!((o.nusselt - 0.3).abs() < 1e-12);
        assert!(o
            .flags
            .iter()
            .any(|f| f.method == cylinder::CHURCHILL_BERNSTEIN));
    }

    #[test]
    fn absurd_magnitudes_are_errors_not_nan() {
        for (f, v) in [
            (Field::Diameter, 1e308),
            (Field::Diameter, 0.0),
            (Field::Diameter, -1.0),
            (Field::Speed, -1.0),
            (Field::AirTemp, -1.0),
            (Field::Pressure, 1e308),
            (Field::Speed, f64::NAN),
        ] {
            let mut s = DEMO;
            s.set(f, v);
            assert!(evaluate(&s).is_err(), "{f:?} = {v}");
        }
    }

    #[test]
    fn field_messages_speak_the_users_unit() {
        let c = units::unit("C").unwrap();
        let e = read_field(spec(Field::AirTemp), "-300", c).unwrap_err();
        assert!(e.contains("absolute zero") && e.contains("-273.1"), "{e}");
        let mm = units::unit("mm").unwrap();
        assert_eq!(read_field(spec(Field::Diameter), "60,3", mm), Ok(0.0603));
        assert!(read_field(spec(Field::Diameter), "0", mm)
            .unwrap_err()
            .contains("more than 0 mm"));
        assert!(read_field(spec(Field::Diameter), "", mm).is_err());
    }

    #[test]
    fn fragment_round_trips_exactly() {
        let s = Scenario {
            diameter: 0.0334,
            speed: 1.0 / 3.0,
            air_temp: 250.123456789,
            surface_temp: 400.0,
            pressure: 84_000.5,
        };
        let (back, sys) = from_fragment(&to_fragment(&s, System::Us)).unwrap();
        assert_eq!(back, s);
        assert_eq!(sys, System::Us);
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
            long.as_str(),
        ] {
            let e = from_fragment(bad).unwrap_err();
            assert!(!e.contains('<'), "message echoes input: {e}");
        }
        // Missing keys take the demo's values; unknown keys are ignored.
        assert_eq!(from_fragment("#v=1&future=3").unwrap().0, DEMO);
    }
}
