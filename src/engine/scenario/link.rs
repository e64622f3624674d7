//! The link format: a scenario and its unit system as a URL fragment, and back; the view
//! options a link may carry.

use super::*;

/// The link format's version. See README "Links".
pub const LINK_VERSION: u32 = 1;
/// Longest fragment read; anything longer is refused unread.
pub const LINK_MAX_LEN: usize = 2048;

/// Encode a scenario and the unit system as a URL fragment (without the `#`). Values are SI at
/// full precision (shortest round-trip form), so a link reproduces the calculation exactly. Only
/// the fields the scenario uses are written.
pub fn to_fragment(s: &Scenario, system: System) -> String {
    let mut out = format!("v={LINK_VERSION}&s={}", s.shape.id());
    if s.shape != Shape::Sphere {
        out.push_str(match s.axis {
            Axis::Horizontal => "&ax=h",
            Axis::Vertical => "&ax=v",
        });
    }
    if s.uses_wind() {
        out.push_str(match s.wind {
            Wind::Horizontal => "&w=h",
            Wind::Up => "&w=u",
            Wind::Down => "&w=d",
        });
    }
    out.push_str(&format!("&f={}", s.fluid.id()));
    if matches!(s.shape, Shape::Cylinder | Shape::Sphere) || s.makes_heat() {
        out.push_str(match s.surface_mode {
            SurfaceMode::Given => "&sm=g",
            SurfaceMode::Solved => "&sm=x",
            SurfaceMode::Reading => "&sm=r",
            SurfaceMode::Made => "&sm=h",
        });
    }
    if s.makes_heat() && !s.shape.is_sphere() {
        out.push_str(match s.heat_source {
            HeatSource::Heat => "&hk=q",
            HeatSource::Current => "&hk=i",
        });
    }
    if s.solved() {
        out.push_str(&format!("&wm={}&nl={}", s.wall.id(), s.layer_count));
        if s.offers_inside_film() {
            out.push_str(&format!("&hf={}", s.inside.id()));
        }
    } else if s.cools() {
        out.push_str(&format!("&wm={}", s.wall.id()));
    }
    out.push_str(match s.pressure_input {
        PressureInput::Absolute => "&pm=p",
        PressureInput::Elevation => "&pm=z",
    });
    if s.fluid == FluidKind::HumidAir {
        out.push_str(match s.humidity_input {
            HumidityInput::Relative => "&hm=rh",
            HumidityInput::DewPoint => "&hm=td",
        });
    }
    // Outdoors only: an indoor link reads as it always has.
    if s.outdoors() {
        out.push_str(&format!(
            "&env={}&tc={}",
            s.setting.id(),
            s.terrain.category()
        ));
        match s.sun_input {
            SunInput::Typed => out.push_str("&sun=t"),
            // The instant in seconds since 1970 UTC, shortest round-trip form like every value.
            SunInput::Place => out.push_str(&format!(
                "&sun=p&tu={}&cl={}",
                s.sun_time,
                climate_id(s.climate)
            )),
        }
    }
    for spec in FIELDS.iter().filter(|sp| s.uses(sp.field)) {
        out.push_str(&format!("&{}={}", spec.key, s.get(spec.field)));
    }
    out.push_str(match system {
        System::Si => "&u=si",
        System::Us => "&u=us",
    });
    out
}

/// How the page is shown, from the same fragment: `view=embed` for the compact view inside a
/// wiki page (no header, no plots, no saved-work panel), `lock=1` to make the inputs read-only
/// (a worked example). Unknown values are ignored.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, serde::Serialize, serde::Deserialize)]
pub struct ViewOptions {
    pub embed: bool,
    pub locked: bool,
}

impl ViewOptions {
    pub fn from_fragment(fragment: &str) -> Self {
        let f = fragment.strip_prefix('#').unwrap_or(fragment);
        let mut o = ViewOptions::default();
        for pair in f.split('&').take(200) {
            match pair {
                "view=embed" => o.embed = true,
                "lock=1" => o.locked = true,
                _ => {}
            }
        }
        o
    }
    /// The keys to append to a scenario's fragment.
    pub fn suffix(&self) -> &'static str {
        match (self.embed, self.locked) {
            (false, false) => "",
            (true, false) => "&view=embed",
            (false, true) => "&lock=1",
            (true, true) => "&view=embed&lock=1",
        }
    }
}

/// Read a fragment (with or without the leading `#`). Keys left out take the demo's value.
/// Anything malformed refuses the whole link with a message; nothing of it is ever echoed.
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
            "s" => {
                s.shape = Shape::from_id(value)
                    .ok_or_else(|| "the link names an unknown shape".to_string())?
            }
            "ax" => {
                s.axis = match value {
                    "h" => Axis::Horizontal,
                    "v" => Axis::Vertical,
                    _ => return Err("the link names an unknown axis direction".into()),
                }
            }
            "w" => {
                s.wind = match value {
                    "h" => Wind::Horizontal,
                    "u" => Wind::Up,
                    "d" => Wind::Down,
                    _ => return Err("the link names an unknown wind direction".into()),
                }
            }
            "sm" => {
                s.surface_mode = match value {
                    "g" => SurfaceMode::Given,
                    "x" => SurfaceMode::Solved,
                    "r" => SurfaceMode::Reading,
                    "h" => SurfaceMode::Made,
                    _ => return Err("the link names an unknown way to give the surface".into()),
                }
            }
            "hk" => {
                s.heat_source = match value {
                    "q" => HeatSource::Heat,
                    "i" => HeatSource::Current,
                    _ => return Err("the link names an unknown kind of heat made inside".into()),
                }
            }
            "wm" => {
                s.wall = WallMaterial::from_id(value)
                    .ok_or_else(|| "the link names an unknown wall material".to_string())?
            }
            "hf" => {
                s.inside = InsideFilm::from_id(value).ok_or_else(|| {
                    "the link names an unknown way to give the inside film".to_string()
                })?
            }
            "nl" => {
                s.layer_count = match value {
                    "0" => 0,
                    "1" => 1,
                    "2" => 2,
                    "3" => 3,
                    _ => return Err("the link's number of layers must be 0 to 3".into()),
                }
            }
            "f" => {
                s.fluid = FluidKind::from_id(value)
                    .ok_or_else(|| "the link names an unknown fluid".to_string())?
            }
            "pm" => {
                s.pressure_input = match value {
                    "p" => PressureInput::Absolute,
                    "z" => PressureInput::Elevation,
                    _ => return Err("the link names an unknown way to give pressure".into()),
                }
            }
            "env" => {
                s.setting = Setting::from_id(value).ok_or_else(|| {
                    "the link names an unknown setting (indoors or outdoors)".to_string()
                })?
            }
            "tc" => {
                s.terrain = terrain_from_id(value)
                    .ok_or_else(|| "the link names an unknown terrain category".to_string())?
            }
            "hm" => {
                s.humidity_input = match value {
                    "rh" => HumidityInput::Relative,
                    "td" => HumidityInput::DewPoint,
                    _ => return Err("the link names an unknown way to give humidity".into()),
                }
            }
            "sun" => {
                s.sun_input = match value {
                    "t" => SunInput::Typed,
                    "p" => SunInput::Place,
                    _ => return Err("the link names an unknown way to give the sunlight".into()),
                }
            }
            "cl" => {
                s.climate = climate_from_id(value)
                    .ok_or_else(|| "the link names an unknown clear-sky atmosphere".to_string())?
            }
            "tu" => {
                let t = value
                    .parse::<f64>()
                    .ok()
                    .filter(|t| crate::engine::outdoors::sun::Utc::from_unix(*t).is_ok())
                    .ok_or_else(|| {
                        "the link's date and time is not a date from 1583 to 9999".to_string()
                    })?;
                s.sun_time = t;
            }
            _ => {
                let Some(spec) = FIELDS.iter().find(|sp| sp.key == key) else {
                    continue; // a key from a later version: ignored
                };
                let si_unit = units::units_of(spec.dim).next().expect("SI unit");
                let v = read_field(spec, value, si_unit).map_err(|e| {
                    format!("the link's value for “{}” is unusable: {e}", spec.label)
                })?;
                s.set(spec.field, v);
            }
        }
    }
    // The surroundings and the ground follow the stream's temperature until set apart: a link
    // that leaves them out (written by hand) means the stream's, not the demo's.
    // (A field the scenario does not use keeps the demo's value, so every written link still
    // reads back exactly.)
    let has = |k: &str| {
        f.split('&')
            .any(|p| p.split_once('=').is_some_and(|(key, _)| key == k))
    };
    if !has("Tr") && s.uses(Field::Surround) {
        s.t_surround = s.fluid_temp;
    }
    if !has("Tg") && s.uses(Field::GroundTemp) {
        s.t_ground = s.fluid_temp;
    }
    if !has("Trf") && s.uses(Field::IrReflected) {
        s.ir_reflected = if s.uses(Field::Surround) {
            s.t_surround
        } else {
            s.fluid_temp
        };
    }
    match version {
        Some(v) if v == LINK_VERSION.to_string() => Ok((s, system)),
        Some(_) => Err(format!(
            "the link was written in a format version this page does not read (it reads version {LINK_VERSION})"
        )),
        None => Err("the link has no format version (v=…)".into()),
    }
}
