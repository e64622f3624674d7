//! The one place where units are converted, numbers are parsed from user text and formatted.
//!
//! Inside the engine everything is SI. A [`Unit`] maps a shown value to SI as
//! `si = shown * scale + offset`. Factors are the exact definitions of NIST Special Publication 811
//! (2008), Appendix B: 1 in = 0.0254 m, 1 ft = 0.3048 m, 1 mile = 1609.344 m, 1 lbf =
//! 4.4482216152605 N, 1 Btu_IT = 1055.05585262 J, °F = (°R − 459.67), 1 °R = 5/9 K.

/// The kind of quantity a unit measures.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Dim {
    Temperature,
    Length,
    Speed,
    Pressure,
    HeatTransferCoefficient,
    HeatFlowPerLength,
    ThermalConductivity,
    KinematicViscosity,
    DynamicViscosity,
    Density,
    SpecificHeat,
    /// Site elevation (its own dimension so that it can be in m while diameters are in mm).
    Elevation,
    /// Relative humidity, concentration.
    Fraction,
    HeatFlow,
    ExpansionCoefficient,
    /// A run length (m or ft, while diameters and thicknesses are in mm or in).
    RunLength,
    /// A dimensionless ratio shown as such (emissivity).
    Ratio,
    /// A temperature difference (margins).
    TemperatureDifference,
    /// Time spans: freezing, cooling, time constants.
    Duration,
    /// Operating hours per year.
    HoursPerYear,
    /// Energy price per unit of energy (currency-neutral).
    EnergyPrice,
    /// Energy per year.
    EnergyPerYear,
    /// Money per year (currency-neutral).
    MoneyPerYear,
    MassFlow,
    /// An insulation's conductivity: the same quantity as `ThermalConductivity`, in the units of
    /// insulation data sheets (Btu·in/(h·ft²·°F) in US units).
    LayerConductivity,
    /// An angle, degrees (the wind's angle to an axis).
    Angle,
    /// A heat flux or an irradiance, W/m².
    HeatFlux,
    /// Cloud cover in oktas (eighths of the sky), 0–8.
    Oktas,
    /// A wavelength (an infrared instrument's band), µm on the page in both systems.
    Wavelength,
    /// An electric current, A (rms for AC), in both systems.
    Current,
    /// A latitude or longitude, degrees, in both systems.
    Coordinate,
    /// A conductor's resistance per length: Ω/km on SI data sheets, Ω/mi on US ones.
    ResistancePerLength,
    /// Heat made per length (a tracer's output): the same quantity as `HeatFlowPerLength`, in the
    /// units of heat-tracing data sheets (W/ft in US units).
    HeatOutputPerLength,
}

/// Every dimension, in the order the page lists them.
pub const ALL_DIMS: [Dim; 33] = [
    Dim::Temperature,
    Dim::Length,
    Dim::Speed,
    Dim::Pressure,
    Dim::HeatTransferCoefficient,
    Dim::HeatFlowPerLength,
    Dim::ThermalConductivity,
    Dim::KinematicViscosity,
    Dim::DynamicViscosity,
    Dim::Density,
    Dim::SpecificHeat,
    Dim::Elevation,
    Dim::Fraction,
    Dim::HeatFlow,
    Dim::ExpansionCoefficient,
    Dim::RunLength,
    Dim::Ratio,
    Dim::TemperatureDifference,
    Dim::Duration,
    Dim::HoursPerYear,
    Dim::EnergyPrice,
    Dim::EnergyPerYear,
    Dim::MoneyPerYear,
    Dim::MassFlow,
    Dim::LayerConductivity,
    Dim::Angle,
    Dim::HeatFlux,
    Dim::Oktas,
    Dim::Wavelength,
    Dim::Current,
    Dim::Coordinate,
    Dim::ResistancePerLength,
    Dim::HeatOutputPerLength,
];

/// A unit system for the global switch.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, serde::Serialize, serde::Deserialize)]
pub enum System {
    Si,
    Us,
}

#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Unit {
    /// Stable id used in links and storage.
    pub id: &'static str,
    /// What the page shows.
    pub symbol: &'static str,
    pub dim: Dim,
    pub scale: f64,
    pub offset: f64,
}

const IN: f64 = 0.0254;
const FT: f64 = 0.3048;
const MILE: f64 = 1609.344;
const LBF: f64 = 4.448_221_615_260_5;
const BTU_IT: f64 = 1_055.055_852_62;
const HOUR: f64 = 3600.0;
const RANKINE: f64 = 5.0 / 9.0;
const LB: f64 = 0.453_592_37;

const fn u(id: &'static str, symbol: &'static str, dim: Dim, scale: f64, offset: f64) -> Unit {
    Unit {
        id,
        symbol,
        dim,
        scale,
        offset,
    }
}

/// Every unit the page offers. The first unit of each dimension is SI's own.
pub const UNITS: &[Unit] = &[
    u("K", "K", Dim::Temperature, 1.0, 0.0),
    u("C", "°C", Dim::Temperature, 1.0, 273.15),
    u("F", "°F", Dim::Temperature, RANKINE, 459.67 * RANKINE),
    u("m", "m", Dim::Length, 1.0, 0.0),
    u("mm", "mm", Dim::Length, 1e-3, 0.0),
    u("in", "in", Dim::Length, IN, 0.0),
    u("ft", "ft", Dim::Length, FT, 0.0),
    u("m/s", "m/s", Dim::Speed, 1.0, 0.0),
    u("km/h", "km/h", Dim::Speed, 1000.0 / HOUR, 0.0),
    u("ft/s", "ft/s", Dim::Speed, FT, 0.0),
    u("mph", "mph", Dim::Speed, MILE / HOUR, 0.0),
    u("Pa", "Pa", Dim::Pressure, 1.0, 0.0),
    u("kPa", "kPa", Dim::Pressure, 1e3, 0.0),
    u("bar", "bar", Dim::Pressure, 1e5, 0.0),
    u("psi", "psi", Dim::Pressure, LBF / (IN * IN), 0.0),
    u("inHg", "inHg", Dim::Pressure, 3386.389, 0.0),
    u("W/m2K", "W/(m²·K)", Dim::HeatTransferCoefficient, 1.0, 0.0),
    u(
        "Btu/hft2F",
        "Btu/(h·ft²·°F)",
        Dim::HeatTransferCoefficient,
        BTU_IT / HOUR / (FT * FT) / RANKINE,
        0.0,
    ),
    u("W/m", "W/m", Dim::HeatFlowPerLength, 1.0, 0.0),
    u(
        "Btu/hft",
        "Btu/(h·ft)",
        Dim::HeatFlowPerLength,
        BTU_IT / HOUR / FT,
        0.0,
    ),
    // Heat-tracing data sheets give W/ft in US units.
    u("W/ft", "W/ft", Dim::HeatFlowPerLength, 1.0 / FT, 0.0),
    u("W/mK", "W/(m·K)", Dim::ThermalConductivity, 1.0, 0.0),
    u(
        "Btu/hftF",
        "Btu/(h·ft·°F)",
        Dim::ThermalConductivity,
        BTU_IT / HOUR / FT / RANKINE,
        0.0,
    ),
    u("W/mK-ins", "W/(m·K)", Dim::LayerConductivity, 1.0, 0.0),
    u(
        "Btuin/hft2F",
        "Btu·in/(h·ft²·°F)",
        Dim::LayerConductivity,
        BTU_IT / HOUR * IN / (FT * FT) / RANKINE,
        0.0,
    ),
    u(
        "Btu/hftF-ins",
        "Btu/(h·ft·°F)",
        Dim::LayerConductivity,
        BTU_IT / HOUR / FT / RANKINE,
        0.0,
    ),
    u("m2/s", "m²/s", Dim::KinematicViscosity, 1.0, 0.0),
    u("ft2/s", "ft²/s", Dim::KinematicViscosity, FT * FT, 0.0),
    u("Pas", "Pa·s", Dim::DynamicViscosity, 1.0, 0.0),
    u("lb/fts", "lb/(ft·s)", Dim::DynamicViscosity, LB / FT, 0.0),
    u("kg/m3", "kg/m³", Dim::Density, 1.0, 0.0),
    u("lb/ft3", "lb/ft³", Dim::Density, LB / (FT * FT * FT), 0.0),
    u("J/kgK", "J/(kg·K)", Dim::SpecificHeat, 1.0, 0.0),
    u(
        "Btu/lbF",
        "Btu/(lb·°F)",
        Dim::SpecificHeat,
        BTU_IT / LB / RANKINE,
        0.0,
    ),
    u("m-elev", "m", Dim::Elevation, 1.0, 0.0),
    u("ft-elev", "ft", Dim::Elevation, FT, 0.0),
    u("frac", "fraction", Dim::Fraction, 1.0, 0.0),
    u("%", "%", Dim::Fraction, 0.01, 0.0),
    u("W", "W", Dim::HeatFlow, 1.0, 0.0),
    u("kW", "kW", Dim::HeatFlow, 1e3, 0.0),
    u("Btu/h", "Btu/h", Dim::HeatFlow, BTU_IT / HOUR, 0.0),
    u("1/K", "1/K", Dim::ExpansionCoefficient, 1.0, 0.0),
    u("1/F", "1/°F", Dim::ExpansionCoefficient, 1.0 / RANKINE, 0.0),
    u("m-run", "m", Dim::RunLength, 1.0, 0.0),
    u("ft-run", "ft", Dim::RunLength, FT, 0.0),
    u("ratio", "(0–1)", Dim::Ratio, 1.0, 0.0),
    u("dK", "K", Dim::TemperatureDifference, 1.0, 0.0),
    u("dF", "°F", Dim::TemperatureDifference, RANKINE, 0.0),
    u("s", "s", Dim::Duration, 1.0, 0.0),
    u("min", "min", Dim::Duration, 60.0, 0.0),
    u("h", "h", Dim::Duration, HOUR, 0.0),
    u("d", "d", Dim::Duration, 24.0 * HOUR, 0.0),
    u("h/yr", "h/yr", Dim::HoursPerYear, 1.0, 0.0),
    u("/J", "per J", Dim::EnergyPrice, 1.0, 0.0),
    u("/kWh", "per kWh", Dim::EnergyPrice, 1.0 / (1e3 * HOUR), 0.0),
    u(
        "/MMBtu",
        "per MMBtu",
        Dim::EnergyPrice,
        1.0 / (1e6 * BTU_IT),
        0.0,
    ),
    u(
        "/therm",
        "per therm",
        Dim::EnergyPrice,
        1.0 / (1e5 * BTU_IT),
        0.0,
    ),
    u("J/yr", "J/yr", Dim::EnergyPerYear, 1.0, 0.0),
    u("kWh/yr", "kWh/yr", Dim::EnergyPerYear, 1e3 * HOUR, 0.0),
    u("MWh/yr", "MWh/yr", Dim::EnergyPerYear, 1e6 * HOUR, 0.0),
    u(
        "MMBtu/yr",
        "MMBtu/yr",
        Dim::EnergyPerYear,
        1e6 * BTU_IT,
        0.0,
    ),
    u("/yr", "per yr", Dim::MoneyPerYear, 1.0, 0.0),
    u("kg/s", "kg/s", Dim::MassFlow, 1.0, 0.0),
    u("kg/h", "kg/h", Dim::MassFlow, 1.0 / HOUR, 0.0),
    u("lb/h", "lb/h", Dim::MassFlow, LB / HOUR, 0.0),
    u("deg", "°", Dim::Angle, 1.0, 0.0),
    u("W/m2", "W/m²", Dim::HeatFlux, 1.0, 0.0),
    u(
        "Btu/hft2",
        "Btu/(h·ft²)",
        Dim::HeatFlux,
        BTU_IT / HOUR / (FT * FT),
        0.0,
    ),
    u("okta", "oktas", Dim::Oktas, 1.0, 0.0),
    u("m-wl", "m", Dim::Wavelength, 1.0, 0.0),
    u("um", "µm", Dim::Wavelength, 1e-6, 0.0),
    u("A", "A", Dim::Current, 1.0, 0.0),
    u("deg-geo", "°", Dim::Coordinate, 1.0, 0.0),
    u("W/m-out", "W/m", Dim::HeatOutputPerLength, 1.0, 0.0),
    u("W/ft-out", "W/ft", Dim::HeatOutputPerLength, 1.0 / FT, 0.0),
    u(
        "Btu/hft-out",
        "Btu/(h·ft)",
        Dim::HeatOutputPerLength,
        BTU_IT / HOUR / FT,
        0.0,
    ),
    u("ohm/m", "Ω/m", Dim::ResistancePerLength, 1.0, 0.0),
    u("ohm/km", "Ω/km", Dim::ResistancePerLength, 1e-3, 0.0),
    u("ohm/mi", "Ω/mi", Dim::ResistancePerLength, 1.0 / MILE, 0.0),
    u(
        "ohm/kft",
        "Ω/kft",
        Dim::ResistancePerLength,
        1.0 / (1000.0 * FT),
        0.0,
    ),
];

impl Unit {
    pub fn to_si(&self, shown: f64) -> f64 {
        shown * self.scale + self.offset
    }
    pub fn from_si(&self, si: f64) -> f64 {
        (si - self.offset) / self.scale
    }
}

/// Whether two dimensions measure the same quantity (an insulation's conductivity is a
/// conductivity), so a value in a unit of one reads in the other (older files' headers).
pub fn same_quantity(a: Dim, b: Dim) -> bool {
    let norm = |d| match d {
        Dim::LayerConductivity => Dim::ThermalConductivity,
        Dim::HeatOutputPerLength => Dim::HeatFlowPerLength,
        d => d,
    };
    norm(a) == norm(b)
}

/// Look a unit up by its id.
pub fn unit(id: &str) -> Option<&'static Unit> {
    UNITS.iter().find(|u| u.id == id)
}

/// The units offered for one dimension, in the order shown.
pub fn units_of(dim: Dim) -> impl Iterator<Item = &'static Unit> {
    UNITS.iter().filter(move |u| u.dim == dim)
}

/// The unit the global switch picks for a dimension.
pub fn default_unit(dim: Dim, system: System) -> &'static Unit {
    let id = match (dim, system) {
        (Dim::Temperature, System::Si) => "C",
        (Dim::Temperature, System::Us) => "F",
        (Dim::Length, System::Si) => "mm",
        (Dim::Length, System::Us) => "in",
        (Dim::Speed, System::Si) => "m/s",
        (Dim::Speed, System::Us) => "mph",
        (Dim::Pressure, System::Si) => "kPa",
        (Dim::Pressure, System::Us) => "psi",
        (Dim::HeatTransferCoefficient, System::Si) => "W/m2K",
        (Dim::HeatTransferCoefficient, System::Us) => "Btu/hft2F",
        (Dim::HeatFlowPerLength, System::Si) => "W/m",
        (Dim::HeatFlowPerLength, System::Us) => "Btu/hft",
        (Dim::ThermalConductivity, System::Si) => "W/mK",
        (Dim::ThermalConductivity, System::Us) => "Btu/hftF",
        (Dim::KinematicViscosity, System::Si) => "m2/s",
        (Dim::KinematicViscosity, System::Us) => "ft2/s",
        (Dim::DynamicViscosity, System::Si) => "Pas",
        (Dim::DynamicViscosity, System::Us) => "lb/fts",
        (Dim::Density, System::Si) => "kg/m3",
        (Dim::Density, System::Us) => "lb/ft3",
        (Dim::SpecificHeat, System::Si) => "J/kgK",
        (Dim::SpecificHeat, System::Us) => "Btu/lbF",
        (Dim::Elevation, System::Si) => "m-elev",
        (Dim::Elevation, System::Us) => "ft-elev",
        (Dim::Fraction, _) => "%",
        (Dim::HeatFlow, System::Si) => "W",
        (Dim::HeatFlow, System::Us) => "Btu/h",
        (Dim::ExpansionCoefficient, System::Si) => "1/K",
        (Dim::ExpansionCoefficient, System::Us) => "1/F",
        (Dim::RunLength, System::Si) => "m-run",
        (Dim::RunLength, System::Us) => "ft-run",
        (Dim::Ratio, _) => "ratio",
        (Dim::TemperatureDifference, System::Si) => "dK",
        (Dim::TemperatureDifference, System::Us) => "dF",
        (Dim::Duration, _) => "h",
        (Dim::HoursPerYear, _) => "h/yr",
        (Dim::EnergyPrice, _) => "/kWh",
        (Dim::EnergyPerYear, System::Si) => "kWh/yr",
        (Dim::EnergyPerYear, System::Us) => "MMBtu/yr",
        (Dim::MoneyPerYear, _) => "/yr",
        (Dim::MassFlow, System::Si) => "kg/h",
        (Dim::MassFlow, System::Us) => "lb/h",
        (Dim::LayerConductivity, System::Si) => "W/mK-ins",
        (Dim::LayerConductivity, System::Us) => "Btuin/hft2F",
        (Dim::Angle, _) => "deg",
        (Dim::HeatFlux, System::Si) => "W/m2",
        (Dim::HeatFlux, System::Us) => "Btu/hft2",
        (Dim::Oktas, _) => "okta",
        (Dim::Wavelength, _) => "um",
        (Dim::Current, _) => "A",
        (Dim::Coordinate, _) => "deg-geo",
        (Dim::ResistancePerLength, System::Si) => "ohm/km",
        (Dim::ResistancePerLength, System::Us) => "ohm/mi",
        (Dim::HeatOutputPerLength, System::Si) => "W/m-out",
        (Dim::HeatOutputPerLength, System::Us) => "W/ft-out",
    };
    unit(id).expect("every default unit is in UNITS")
}

/// The unit chosen for each dimension: the global switch fills it, a per-quantity choice changes
/// one entry. Presentation only: the computed state is SI and never passes through it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct UnitChoice([&'static Unit; ALL_DIMS.len()]);

impl UnitChoice {
    pub fn for_system(system: System) -> Self {
        UnitChoice(ALL_DIMS.map(|d| default_unit(d, system)))
    }
    pub fn get(&self, dim: Dim) -> &'static Unit {
        self.0[dim as usize]
    }
    pub fn set(&mut self, unit: &'static Unit) {
        self.0[unit.dim as usize] = unit;
    }
}

/// Why a typed number was refused, in plain words for the message beside the field.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum ParseError {
    Empty,
    NotANumber,
    NotFinite,
    /// "1,000": a thousands separator or a decimal comma — the two readings differ a thousandfold.
    AmbiguousComma,
}

impl std::fmt::Display for ParseError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(match self {
            ParseError::Empty => "enter a value",
            ParseError::NotANumber => {
                "not a number: use digits, one decimal point or comma, e.g. 60.3"
            }
            ParseError::NotFinite => "the number is too large to use",
            ParseError::AmbiguousComma => "ambiguous: write 1000 or 1.000",
        })
    }
}

/// Parse what a user typed: surrounding spaces allowed, a decimal point or a single decimal comma,
/// an exponent (`1e-3`). "NaN", "inf", thousands separators and lists (`1,2,3`) are refused.
pub fn parse_number(text: &str) -> Result<f64, ParseError> {
    let t = text.trim();
    if t.is_empty() {
        return Err(ParseError::Empty);
    }
    let commas = t.matches(',').count();
    let owned;
    let t = if commas == 0 {
        t
    } else if commas == 1 && !t.contains('.') {
        // "1,000" or "12,500": a thousands separator as likely as a decimal comma. "0,125" can
        // only be a decimal comma.
        let (int, frac) = t.split_once(',').unwrap_or((t, ""));
        let digits = int.trim_start_matches(['-', '+']);
        if frac.len() == 3
            && frac.chars().all(|c| c.is_ascii_digit())
            && !digits.is_empty()
            && digits.len() <= 3
            && digits.chars().all(|c| c.is_ascii_digit())
            && digits.trim_start_matches('0') != ""
        {
            return Err(ParseError::AmbiguousComma);
        }
        owned = t.replace(',', ".");
        owned.as_str()
    } else {
        return Err(ParseError::NotANumber);
    };
    // Only digits, one sign, a point and an exponent: this refuses "inf", "NaN", "0x10", "1_000".
    let ok_chars = t
        .chars()
        .all(|c| c.is_ascii_digit() || matches!(c, '.' | '-' | '+' | 'e' | 'E'));
    if !ok_chars || !t.chars().any(|c| c.is_ascii_digit()) {
        return Err(ParseError::NotANumber);
    }
    let v: f64 = t.parse().map_err(|_| ParseError::NotANumber)?;
    if !v.is_finite() {
        return Err(ParseError::NotFinite);
    }
    Ok(v)
}

mod display;
pub use display::*;

#[cfg(test)]
mod tests {
    use super::*;

    fn close(a: f64, b: f64, rel: f64) -> bool {
        (a - b).abs() <= rel * b.abs().max(1e-300)
    }

    #[test]
    fn exact_definitions_nist_sp811() {
        // NIST SP 811 (2008) Appendix B.8/B.9 factors.
        assert!(close(unit("in").unwrap().to_si(1.0), 0.0254, 1e-15));
        assert!(close(unit("ft").unwrap().to_si(1.0), 0.3048, 1e-15));
        assert!(close(unit("mph").unwrap().to_si(1.0), 0.44704, 1e-15));
        assert!(close(
            unit("psi").unwrap().to_si(1.0),
            6894.757293168,
            1e-12
        ));
        // SP 811 B.9: Btu_IT/(h·ft²·°F) = 5.678263 W/(m²·K), Btu_IT·ft/(h·ft²·°F) = 1.730735
        // W/(m·K), Btu_IT/h = 0.2930711 W (so Btu_IT/(h·ft) × 1 ft = 0.2930711 W).
        assert!(close(unit("Btu/hft2F").unwrap().to_si(1.0), 5.678263, 1e-6));
        assert!(close(unit("Btu/hftF").unwrap().to_si(1.0), 1.730735, 1e-6));
        assert!(close(
            unit("Btu/hft").unwrap().to_si(1.0) * 0.3048,
            0.2930711,
            1e-6
        ));
        assert!(close(unit("Btu/lbF").unwrap().to_si(1.0), 4186.8, 1e-12));
        assert!(close(unit("km/h").unwrap().to_si(36.0), 10.0, 1e-15));
        assert!(close(unit("Btu/h").unwrap().to_si(1.0), 0.2930711, 1e-6));
        assert!(close(unit("1/F").unwrap().to_si(1.0), 1.8, 1e-15));
        // 1 MMBtu = 10⁶ Btu_IT = 1.05505585262 GJ; 1 lb/h = 0.45359237/3600 kg/s (NIST SP 811).
        assert!(close(
            unit("MMBtu/yr").unwrap().to_si(1.0),
            1.055_055_852_62e9,
            1e-15
        ));
        assert!(close(
            unit("lb/h").unwrap().to_si(3600.0),
            0.453_592_37,
            1e-15
        ));
        assert!(close(unit("dF").unwrap().to_si(9.0), 5.0, 1e-15));
        // A price per kWh and per J: 0.36 per kWh is 10⁻⁷ per J.
        assert!(close(unit("/kWh").unwrap().to_si(0.36), 1e-7, 1e-15));
    }

    #[test]
    fn temperature_points() {
        let c = unit("C").unwrap();
        let f = unit("F").unwrap();
        assert!(close(c.to_si(0.0), 273.15, 1e-15));
        assert!(close(f.to_si(32.0), 273.15, 1e-14));
        assert!(close(f.to_si(212.0), 373.15, 1e-14));
        assert!(close(f.to_si(-459.67), 0.0 + 1e-300, 1.0) || f.to_si(-459.67).abs() < 1e-12);
        assert!(close(f.from_si(c.to_si(-40.0)), -40.0, 1e-13));
    }

    #[test]
    fn round_trips_every_unit() {
        for u in UNITS {
            for &x in &[-1234.5, -1.0, 0.0, 1e-6, 0.37, 1.0, 42.0, 6.02e5] {
                let back = u.from_si(u.to_si(x));
                assert!(
                    (back - x).abs() <= 1e-12 * x.abs().max(1.0),
                    "{} {x} -> {back}",
                    u.id
                );
            }
        }
    }

    #[test]
    fn every_dimension_has_both_defaults_and_an_si_first_unit() {
        for u in UNITS {
            for sys in [System::Si, System::Us] {
                assert_eq!(default_unit(u.dim, sys).dim, u.dim);
            }
            let first = units_of(u.dim).next().unwrap();
            assert_eq!((first.scale, first.offset), (1.0, 0.0), "{}", u.id);
        }
    }

    #[test]
    fn unit_choice_follows_the_switch_and_one_entry_changes_alone() {
        for (i, d) in ALL_DIMS.iter().enumerate() {
            assert_eq!(*d as usize, i, "ALL_DIMS must follow the enum's order");
        }
        let mut c = UnitChoice::for_system(System::Si);
        assert_eq!(c.get(Dim::Temperature).id, "C");
        c.set(unit("K").unwrap());
        assert_eq!(c.get(Dim::Temperature).id, "K");
        assert_eq!(c.get(Dim::Length).id, "mm");
        assert_eq!(UnitChoice::for_system(System::Us).get(Dim::Speed).id, "mph");
    }

    #[test]
    fn parsing_user_text() {
        assert_eq!(parse_number(" 60.3 "), Ok(60.3));
        assert_eq!(parse_number("60,3"), Ok(60.3));
        assert_eq!(parse_number("-5"), Ok(-5.0));
        assert_eq!(parse_number("1e-3"), Ok(1e-3));
        assert_eq!(parse_number(""), Err(ParseError::Empty));
        assert_eq!(parse_number("   "), Err(ParseError::Empty));
        for bad in [
            "abc", "1,2,3", "1.2,3", "NaN", "nan", "inf", "Infinity", "-", ".", "e5", "1..2",
            "0x10",
        ] {
            assert!(parse_number(bad).is_err(), "{bad}");
        }
        assert_eq!(parse_number("1e309"), Err(ParseError::NotFinite));
        assert_eq!(parse_number("1e308"), Ok(1e308));
        // Regression: "1,000" was read as 1 without a word. A comma before exactly three digits
        // after a non-zero whole part reads two ways and is refused; other decimal commas stand.
        assert_eq!(parse_number("1,000"), Err(ParseError::AmbiguousComma));
        assert_eq!(parse_number("-12,500"), Err(ParseError::AmbiguousComma));
        assert_eq!(parse_number("0,125"), Ok(0.125));
        assert_eq!(parse_number("1,25"), Ok(1.25));
        assert_eq!(parse_number("1234,567"), Ok(1234.567));
    }

    /// NIST SP 811 (2008) Appendix B.9, "British thermal unit_IT inch per hour square foot
    /// degree Fahrenheit": 1.442 279 E−01 W/(m·K) (from memory of the table; it follows from
    /// the exact definitions above, which are checked independently).
    #[test]
    fn insulation_conductivity_in_the_units_of_us_data_sheets() {
        let u = unit("Btuin/hft2F").unwrap();
        assert!(close(u.to_si(1.0), 0.1442279, 1e-6), "{}", u.to_si(1.0));
        // 12 Btu·in/(h·ft²·°F) is one Btu/(h·ft·°F): an inch is a twelfth of a foot.
        let per_ft = unit("Btu/hftF-ins").unwrap();
        assert!(close(u.to_si(12.0), per_ft.to_si(1.0), 1e-12));
        assert_eq!(
            default_unit(Dim::LayerConductivity, System::Us).symbol,
            "Btu·in/(h·ft²·°F)"
        );
        assert!(same_quantity(
            Dim::LayerConductivity,
            Dim::ThermalConductivity
        ));
        assert!(!same_quantity(Dim::Length, Dim::RunLength));
    }
}
