//! The user's choices that are not numbers: indoors or outdoors (and the terrain outdoors), the
//! stream's fluid, how pressure and humidity are given, the inside film, and whether the surface
//! is typed or worked out.

use super::*;
pub use crate::engine::outdoors::irradiance::Climate;
pub use crate::engine::outdoors::wind::Terrain;

/// Where the body is: indoors it radiates to one typed surroundings temperature and the typed
/// speed is the stream at the body, square to it (the behaviour before issue #19, the default);
/// outdoors it radiates to the sky and the ground, absorbs the sun, and the typed speed is a
/// weather report's wind carried to the body's height, terrain and angle.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum Setting {
    Indoors,
    Outdoors,
}

impl Setting {
    pub const ALL: [Setting; 2] = [Setting::Indoors, Setting::Outdoors];
    /// Stable id in links (`env=…`, written only outdoors).
    pub fn id(&self) -> &'static str {
        match self {
            Setting::Indoors => "in",
            Setting::Outdoors => "out",
        }
    }
    pub fn label(&self) -> &'static str {
        match self {
            Setting::Indoors => "Indoors (one surroundings temperature)",
            Setting::Outdoors => "Outdoors (sky, ground, sun and wind)",
        }
    }
    pub fn from_id(id: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|m| m.id() == id)
    }
}

/// A terrain category by its number in EN 1991-1-4 ("0", "I", "II", "III", "IV"), as links
/// write it (`tc=…`, outdoors only).
pub fn terrain_from_id(id: &str) -> Option<Terrain> {
    Terrain::ALL.into_iter().find(|t| t.category() == id)
}

/// A terrain category as the page names it (own wording after EN 1991-1-4 Table 4.1).
pub fn terrain_label(t: Terrain) -> &'static str {
    match t {
        Terrain::Sea => "0 — open sea or coast",
        Terrain::Flat => "I — lakes, flat country without obstacles",
        Terrain::Open => "II — open ground, grass, isolated obstacles (weather stations)",
        Terrain::Suburban => "III — villages, woods, a plant among tanks and racks",
        Terrain::Urban => "IV — city, tall buildings close together",
    }
}

/// The fluid of the stream.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum FluidKind {
    DryAir,
    HumidAir,
    Water,
    Steam,
    EthyleneGlycol,
    PropyleneGlycol,
    User,
}

impl FluidKind {
    pub const ALL: [FluidKind; 7] = [
        FluidKind::DryAir,
        FluidKind::HumidAir,
        FluidKind::Water,
        FluidKind::Steam,
        FluidKind::EthyleneGlycol,
        FluidKind::PropyleneGlycol,
        FluidKind::User,
    ];
    /// Stable id in links.
    pub fn id(&self) -> &'static str {
        match self {
            FluidKind::DryAir => "air",
            FluidKind::HumidAir => "humid",
            FluidKind::Water => "water",
            FluidKind::Steam => "steam",
            FluidKind::EthyleneGlycol => "eg",
            FluidKind::PropyleneGlycol => "pg",
            FluidKind::User => "user",
        }
    }
    pub fn label(&self) -> &'static str {
        match self {
            FluidKind::DryAir => "Dry air",
            FluidKind::HumidAir => "Humid air",
            FluidKind::Water => "Liquid water",
            FluidKind::Steam => "Steam",
            FluidKind::EthyleneGlycol => "Ethylene glycol–water",
            FluidKind::PropyleneGlycol => "Propylene glycol–water",
            FluidKind::User => "My own fluid (constant properties)",
        }
    }
    pub fn from_id(id: &str) -> Option<FluidKind> {
        FluidKind::ALL.into_iter().find(|f| f.id() == id)
    }
}

/// How the stream's pressure is given.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum PressureInput {
    Absolute,
    /// From the site elevation through the standard atmosphere.
    Elevation,
}

/// How humid air's moisture is given.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum HumidityInput {
    Relative,
    DewPoint,
}

/// Where the inside film coefficient of a pipe comes from: typed (0 for none), or computed from
/// the flow of a process fluid through the bore.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum InsideFilm {
    Typed,
    Water,
    EthyleneGlycol,
    PropyleneGlycol,
    /// Steam or a gas inside: the film is typed, and there is no water to freeze.
    Gas,
}

impl InsideFilm {
    pub const ALL: [InsideFilm; 5] = [
        InsideFilm::Typed,
        InsideFilm::Water,
        InsideFilm::EthyleneGlycol,
        InsideFilm::PropyleneGlycol,
        InsideFilm::Gas,
    ];
    /// Stable id in links.
    pub fn id(&self) -> &'static str {
        match self {
            InsideFilm::Typed => "typed",
            InsideFilm::Water => "water",
            InsideFilm::EthyleneGlycol => "eg",
            InsideFilm::PropyleneGlycol => "pg",
            InsideFilm::Gas => "gas",
        }
    }
    pub fn label(&self) -> &'static str {
        match self {
            InsideFilm::Typed => "Typed below (0: none)",
            InsideFilm::Water => "Flow of water",
            InsideFilm::EthyleneGlycol => "Flow of ethylene glycol–water",
            InsideFilm::PropyleneGlycol => "Flow of propylene glycol–water",
            InsideFilm::Gas => "Steam or gas inside, film typed below (nothing to freeze)",
        }
    }
    pub fn from_id(id: &str) -> Option<Self> {
        Self::ALL.into_iter().find(|m| m.id() == id)
    }
}

/// The inside film as a scenario has it, once worked out.
#[derive(Debug, Clone, PartialEq)]
pub enum Inside {
    /// Typed (0: none): the job takes `h_inside` as it stands.
    Typed,
    /// A process fluid is chosen but nothing flows: the bore is at the process temperature.
    Still(Properties),
    /// Worked out from the flow through the bore.
    Flowing(PipeFlow),
}

impl Inside {
    /// The process fluid's properties at the process temperature, when a fluid is chosen.
    pub fn props(&self) -> Option<&Properties> {
        match self {
            Inside::Typed => None,
            Inside::Still(p) => Some(p),
            Inside::Flowing(f) => Some(&f.props),
        }
    }
    /// The range flags of the process fluid and of the inside correlation.
    pub fn flags(&self) -> &[Flag] {
        match self {
            Inside::Typed => &[],
            Inside::Still(p) => &p.flags,
            Inside::Flowing(f) => &f.flags,
        }
    }
}

/// Whether the surface temperature is typed, solved from the process inside, or read with an
/// infrared instrument (issue #20: the construction is solved as designed, and the reading,
/// corrected, says what the insulation really does; link `sm=r`).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum SurfaceMode {
    Given,
    Solved,
    Reading,
    /// Heat made inside (issue #19): a tracer, a heater or a current through a conductor holds
    /// the surface at the temperature where it loses what it makes (link `sm=h`).
    Made,
}

/// Where the sunlight comes from outdoors: typed (beam, diffuse, global), or a clear sky at a
/// date, time and place (the sun by NREL SPA, the irradiance by Hottel with Liu & Jordan; link
/// `sun=t` or `sun=p`).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum SunInput {
    Typed,
    Place,
}

/// A clear-sky atmosphere's id in links (`cl=…`) and its name.
pub fn climate_id(c: Climate) -> &'static str {
    match c {
        Climate::Tropical => "tr",
        Climate::MidlatitudeSummer => "ms",
        Climate::SubarcticSummer => "ss",
        Climate::MidlatitudeWinter => "mw",
    }
}

pub fn climate_from_id(id: &str) -> Option<Climate> {
    Climate::ALL.into_iter().find(|c| climate_id(*c) == id)
}

/// What the heat made inside is given as: a heat (W per metre, or W for a sphere), or a current
/// through a conductor whose resistance is linear in temperature between two data-sheet points
/// (link `hk=q` or `hk=i`).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum HeatSource {
    Heat,
    Current,
}
