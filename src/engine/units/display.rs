//! How numbers are written for a person: significant figures, and the display resolution of
//! every unit (what a person would write: 149.4 °C, 42.7 W/m, 2.37 in). Defined once here; the
//! stored values keep full precision.

use super::{unit, Dim, Unit, HOUR};

/// Format with `sig` significant figures, no exponent for everyday magnitudes, no trailing noise
/// (109044 to three figures is 109000, not six figures). Never returns "NaN" or "inf": a
/// non-finite value shows as an em dash.
pub fn format_sig(v: f64, sig: usize) -> String {
    if !v.is_finite() {
        return "—".to_string();
    }
    if v == 0.0 {
        return "0".to_string();
    }
    let sig = sig.clamp(1, 17);
    let mag = magnitude(v);
    if !(-4..9).contains(&mag) {
        let s = format!("{:.*e}", sig - 1, v);
        // "1.230e5" -> "1.23e5"
        if let Some((m, e)) = s.split_once('e') {
            let m = trim_zeros(m);
            return format!("{m}e{e}");
        }
        return s;
    }
    fixed(v, sig as i32 - 1 - mag)
}

/// The power of ten of a finite, non-zero value's leading digit.
fn magnitude(v: f64) -> i32 {
    let mag = v.abs().log10().floor() as i32;
    // log10 can land a hair below an exact power of ten.
    if v.abs() >= 10f64.powi(mag + 1) {
        mag + 1
    } else {
        mag
    }
}

/// `v` rounded to `decimals` places (negative: to tens, hundreds, …), trailing zeros trimmed.
fn fixed(v: f64, decimals: i32) -> String {
    let s = if decimals >= 0 {
        format!("{:.*}", decimals as usize, v)
    } else {
        let step = 10f64.powi(-decimals);
        format!("{:.0}", (v / step).round() * step)
    };
    let s = trim_zeros(&s);
    if s == "-0" {
        "0".to_string()
    } else {
        s
    }
}

/// How finely a quantity is shown: the digits a person would write. Significant figures, a
/// fixed number of decimals, or significant figures never coarser than a fixed decimal (168.3 mm
/// keeps its tenth, 5.54 mm its hundredth). Defined once per unit by [`resolution`]; the stored
/// value keeps full precision (links, files and `data-si` carry it).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Resolution {
    pub sig: Option<i32>,
    pub decimals: Option<i32>,
}

const fn sig(n: i32) -> Resolution {
    Resolution {
        sig: Some(n),
        decimals: None,
    }
}
const fn step(decimals: i32) -> Resolution {
    Resolution {
        sig: None,
        decimals: Some(decimals),
    }
}
const fn sig_at_least(n: i32, decimals: i32) -> Resolution {
    Resolution {
        sig: Some(n),
        decimals: Some(decimals),
    }
}

/// The display resolution of a unit: temperatures and temperature differences to 0.1, heat
/// flows and coefficients to three figures, lengths in mm to three figures or 0.1 mm, pressures
/// to four figures, money to the whole unit.
pub fn resolution(u: &Unit) -> Resolution {
    match (u.dim, u.id) {
        (Dim::Temperature | Dim::TemperatureDifference, _) => step(1),
        (Dim::Length, "mm") => sig_at_least(3, 1),
        (Dim::Elevation | Dim::HoursPerYear, _) => step(0),
        (Dim::MoneyPerYear, _) => sig_at_least(3, 0),
        (Dim::Pressure, "psi") => sig(3),
        (Dim::Pressure | Dim::Density | Dim::SpecificHeat, _) => sig(4),
        (Dim::KinematicViscosity | Dim::DynamicViscosity, _) => sig(4),
        (Dim::Ratio, _) => sig_at_least(2, 2),
        (Dim::Angle, _) => step(0),
        (Dim::Oktas, _) => step(1),
        (Dim::Wavelength, _) => sig_at_least(2, 1),
        (Dim::Current, _) => sig_at_least(3, 0),
        // A coordinate keeps four decimals (about 10 m on the ground).
        (Dim::Coordinate, _) => sig_at_least(2, 4),
        (Dim::ResistancePerLength, _) => sig(4),
        _ => sig(3),
    }
}

impl Resolution {
    /// Decimals shown for a value of this magnitude (negative: rounded to tens, hundreds, …).
    fn places(&self, v: f64) -> i32 {
        let from_sig = self
            .sig
            .map(|n| if v == 0.0 { 0 } else { n - 1 - magnitude(v) });
        match (from_sig, self.decimals) {
            (Some(a), Some(b)) => a.max(b),
            (Some(a), None) => a,
            (None, Some(b)) => b,
            (None, None) => 6,
        }
    }
    /// The largest difference rounding to this resolution makes at `v`.
    pub fn half_step(&self, v: f64) -> f64 {
        0.5 * 10f64.powi(-self.places(v))
    }
}

/// A value already in `u`, as a person would write it at the unit's resolution.
pub fn format_value(v: f64, u: &Unit) -> String {
    if !v.is_finite() {
        return "—".to_string();
    }
    let r = resolution(u);
    let places = r.places(v);
    // Outside everyday magnitudes, figures are written with an exponent where the figures set
    // the places (the same rounding, so `half_step` still bounds it).
    if let Some(n) = r.sig {
        if v != 0.0 && !(-4..9).contains(&magnitude(v)) && places == n - 1 - magnitude(v) {
            return format_sig(v, n as usize);
        }
    }
    fixed(v, places)
}

/// Units a time span is shown in when it is a result: seconds, minutes, hours or days, whichever
/// gives a number between about 1 and 100.
pub fn fitting_duration(seconds: f64) -> &'static Unit {
    let id = match seconds.abs() {
        s if s < 120.0 => "s",
        s if s < 2.0 * HOUR => "min",
        s if s < 48.0 * HOUR => "h",
        _ => "d",
    };
    unit(id).expect("duration units are in UNITS")
}

/// A result in SI, in the chosen unit (a time span in the unit that fits it), at the display
/// resolution: the number and the unit's symbol. A quantity shown to a fixed step keeps its
/// last decimal in a result ("−7.0 °C" beside "149.4 °C"); a typed text drops it ("20").
pub fn shown(si: f64, u: &'static Unit) -> (String, &'static str) {
    let u = if u.dim == Dim::Duration {
        fitting_duration(si)
    } else {
        u
    };
    let v = u.from_si(si);
    let r = resolution(u);
    let text = match (r.sig, r.decimals) {
        (None, Some(d)) if v.is_finite() && d > 0 => {
            let t = format!("{:.*}", d as usize, v);
            // "-0.0" is zero.
            if t.trim_start_matches('-')
                .chars()
                .all(|c| c == '0' || c == '.')
            {
                t.trim_start_matches('-').to_string()
            } else {
                t
            }
        }
        _ => format_value(v, u),
    };
    (grouped(text), u.symbol)
}

/// A result's digits grouped in threes by a narrow no-break space once its whole part has five
/// digits or more ("18 800 W", "127 000 kWh"; "6359" stays whole), as the SI Brochure (BIPM, 9th
/// ed. 2019, §5.4.4) writes numbers: never a comma or a point, which read as the decimal marker
/// somewhere. Typed texts, files and links are never grouped.
fn grouped(t: String) -> String {
    let (sign, rest) = t.strip_prefix('-').map_or(("", t.as_str()), |r| ("-", r));
    let whole = rest
        .find(|c: char| !c.is_ascii_digit())
        .unwrap_or(rest.len());
    if whole < 5 {
        return t;
    }
    let mut out = String::from(sign);
    for (k, ch) in rest[..whole].chars().enumerate() {
        if k > 0 && (whole - k) % 3 == 0 {
            out.push('\u{202F}');
        }
        out.push(ch);
    }
    out + &rest[whole..]
}

/// [`shown`] as one text, "149.4 °C".
pub fn show(si: f64, u: &'static Unit) -> String {
    if !si.is_finite() {
        return "—".to_string();
    }
    let (n, sym) = shown(si, u);
    format!("{n} {sym}")
}

fn trim_zeros(s: &str) -> String {
    if s.contains('.') {
        s.trim_end_matches('0').trim_end_matches('.').to_string()
    } else {
        s.to_string()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Grouping as the SI Brochure (BIPM, 9th ed. 2019, §5.4.4) prints its examples: threes from
    /// the decimal marker, a four-digit whole part left whole; exponents and typed texts untouched.
    #[test]
    fn results_group_their_digits_in_threes() {
        let nb = |s: &str| s.replace(' ', "\u{202F}");
        assert_eq!(grouped("18800".into()), nb("18 800"));
        assert_eq!(grouped("127000".into()), nb("127 000"));
        assert_eq!(grouped("1234567.5".into()), nb("1 234 567.5"));
        assert_eq!(grouped("-43210".into()), nb("-43 210"));
        assert_eq!(grouped("6359".into()), "6359");
        assert_eq!(grouped("0.000123".into()), "0.000123");
        assert_eq!(grouped("1.23e9".into()), "1.23e9");
        assert_eq!(grouped("—".into()), "—");
        let w = unit("W").unwrap();
        assert_eq!(shown(18_812.0, w).0, nb("18 800"));
        assert_eq!(
            format_value(18_812.0, w),
            "18800",
            "a typed text is never grouped"
        );
    }

    #[test]
    fn formatting_significant_figures() {
        assert_eq!(format_sig(96.0234, 3), "96");
        assert_eq!(format_sig(96.0234, 4), "96.02");
        assert_eq!(format_sig(0.026352, 3), "0.0264");
        // Three figures of a whole number round its integer part too (Re 109044 read six).
        assert_eq!(format_sig(6071.4, 3), "6070");
        assert_eq!(format_sig(109044.0, 3), "109000");
        assert_eq!(format_sig(1000.0, 2), "1000");
        assert_eq!(format_sig(999.96, 3), "1000");
        assert_eq!(format_sig(1.5e-5, 3), "1.5e-5");
        assert_eq!(format_sig(2.5e12, 3), "2.5e12");
        assert_eq!(format_sig(f64::NAN, 3), "—");
        assert_eq!(format_sig(f64::INFINITY, 3), "—");
        assert_eq!(format_sig(-0.0001, 1), "-0.0001");
        assert_eq!(format_sig(-0.00001, 1), "-1e-5");
    }

    /// The digits a person would write, for the noisy figures a field test found on the page
    /// (dew point −0.00698 °C, surface −0.2328 °C, film −2.403 °C, 2.37402 in, 39.3701 ft,
    /// 11.1847 mph, 14.6959 psi); full precision stays in the stored value.
    #[test]
    fn display_resolution_writes_what_a_person_would() {
        let f = |v: f64, id: &str| format_value(v, unit(id).unwrap());
        assert_eq!(f(-0.00698, "C"), "0");
        assert_eq!(f(-0.2328, "C"), "-0.2");
        assert_eq!(f(-2.403, "C"), "-2.4");
        assert_eq!(f(149.44, "C"), "149.4");
        assert_eq!(f(2.37402, "in"), "2.37");
        assert_eq!(f(39.3701, "ft-run"), "39.4");
        assert_eq!(f(11.1847, "mph"), "11.2");
        assert_eq!(f(14.6959, "psi"), "14.7");
        assert_eq!(f(101.325, "kPa"), "101.3");
        assert_eq!(f(60.3, "mm"), "60.3");
        assert_eq!(f(168.28, "mm"), "168.3");
        assert_eq!(f(5.537, "mm"), "5.54");
        assert_eq!(f(1564.2, "W/m"), "1560");
        assert_eq!(f(42.66, "W/m"), "42.7");
        assert_eq!(f(6848.3, "/yr"), "6848");
        assert_eq!(f(0.9, "ratio"), "0.9");
        assert_eq!(f(0.045, "W/mK"), "0.045");
        assert_eq!(f(8760.0, "h/yr"), "8760");
        // Tiny values keep the unit's figures, with an exponent (a US specific heat of a
        // property override: 1.316e-5 Btu/(lb·°F), not 1.32e-5).
        assert_eq!(f(1.31553e-5, "Btu/lbF"), "1.316e-5");
        let r = resolution(unit("Btu/lbF").unwrap());
        assert!((r.half_step(1.31553e-5) - 0.5e-8).abs() < 1e-20);
        // The half step bounds what the rounding changes.
        let r = resolution(unit("C").unwrap());
        assert!((r.half_step(20.0) - 0.05).abs() < 1e-12);
        let r = resolution(unit("W/m").unwrap());
        assert!((r.half_step(1564.2) - 5.0).abs() < 1e-9);
    }

    #[test]
    fn a_time_span_is_shown_in_the_unit_that_fits() {
        let h = unit("h").unwrap();
        assert_eq!(show(0.06957 * 3600.0, h), "4.17 min");
        assert_eq!(show(30.0, h), "30 s");
        assert_eq!(show(5.5 * 3600.0, h), "5.5 h");
        assert_eq!(show(3.0 * 86400.0, h), "3 d");
        assert_eq!(show(f64::NAN, h), "—");
        // A result to a fixed step keeps its decimal; a zero carries no sign.
        let c = unit("C").unwrap();
        assert_eq!(show(266.15, c), "-7.0 °C");
        assert_eq!(show(273.15 - 0.00698, c), "0.0 °C");
        assert_eq!(format_value(-7.0, c), "-7");
    }
}
