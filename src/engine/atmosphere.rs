//! Pressure at a site elevation from the standard atmosphere, because field users know their
//! elevation, not their barometric pressure.
//!
//! ISO 2533:1975 / ICAO Doc 7488 standard atmosphere, troposphere layer (−5 km to 11 km
//! geopotential altitude): p = p0·(1 − L·H/T0)^(g0·M/(R*·L)) with p0 = 101 325 Pa, T0 = 288.15 K,
//! L = 0.0065 K/m, g0 = 9.806 65 m/s², M = 0.028 964 4 kg/mol, R* = 8.314 32 J/(mol·K).
//! The elevation is taken as geopotential altitude (the two differ by 0.16 % at 10 km).

use crate::engine::validity::Range;

const P0: f64 = 101_325.0;
const T0: f64 = 288.15;
const LAPSE: f64 = 0.0065;
const G0: f64 = 9.806_65;
const M_AIR: f64 = 0.028_964_4;
const R_STAR: f64 = 8.314_32;

/// The layer the formula covers, m.
pub const TROPOSPHERE: Range = Range {
    quantity: "elevation",
    lo: -5000.0,
    hi: 11_000.0,
    unit: "m",
    source: "ISO 2533 standard atmosphere, troposphere",
};

/// Standard-atmosphere pressure, Pa, at elevation `h` m.
pub fn pressure_at(h: f64) -> f64 {
    P0 * (1.0 - LAPSE * h / T0).powf(G0 * M_AIR / (R_STAR * LAPSE))
}

/// The standard-atmosphere elevation, m, where the pressure is `p` Pa (the inverse of
/// [`pressure_at`]): a site known by its barometric pressure.
pub fn elevation_at(p: f64) -> f64 {
    T0 / LAPSE * (1.0 - (p / P0).powf(R_STAR * LAPSE / (G0 * M_AIR)))
}

/// Standard-atmosphere temperature, K, at elevation `h` m.
pub fn temperature_at(h: f64) -> f64 {
    T0 - LAPSE * h
}

#[cfg(test)]
mod tests {
    use super::*;

    /// ICAO standard atmosphere table values, from memory: 1000 m 89 875 Pa, 2000 m 79 495 Pa,
    /// 5000 m 54 020 Pa, 11 000 m 22 632 Pa (printed to five figures).
    #[test]
    fn icao_table_values_from_memory() {
        for (h, p) in [
            (0.0, 101_325.0),
            (1000.0, 89_875.0),
            (2000.0, 79_495.0),
            (5000.0, 54_020.0),
            (11_000.0, 22_632.0),
        ] {
            assert!(
                ((pressure_at(h) - p) / p).abs() < 5e-5,
                "{h} m: {}",
                pressure_at(h)
            );
        }
        assert!((temperature_at(11_000.0) - 216.65).abs() < 1e-9);
        // The inverse reads the same table back (its pressures to their printed figures).
        for (h, p) in [(1000.0, 89_875.0), (2000.0, 79_495.0), (5000.0, 54_020.0)] {
            assert!(
                (elevation_at(p) - h).abs() < 1.0,
                "{p} Pa: {} m",
                elevation_at(p)
            );
        }
    }
}
