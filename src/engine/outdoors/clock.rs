//! The page keeps a date and time as one number, seconds since 1970-01-01 00:00 UTC (the
//! browser's own clock, converted from the device's local time there): here it becomes the UTC
//! calendar date and time the sun's position takes.

use super::sun::Utc;
use super::{keys, undefined};
use crate::engine::error::{EngineError, Subject};

impl Utc {
    /// The instant to the minute as the page, the working and the report write it:
    /// "2026-12-21 12:00 UTC", or `None` outside the years [`Utc::from_unix`] takes.
    pub fn minute_text(seconds: f64) -> Option<String> {
        let t = Utc::from_unix(seconds).ok()?;
        Some(format!(
            "{:04}-{:02}-{:02} {:02}:{:02} UTC",
            t.year, t.month, t.day, t.hour, t.minute
        ))
    }

    /// The instant `seconds` after 1970-01-01 00:00 UTC (before it when negative), on the
    /// proleptic Gregorian calendar (days to a civil date by H. Hinnant's `civil_from_days`).
    /// The page keeps a date and time as this one number. Errors: a non-finite value, or an
    /// instant before 1583 (the SPA's Julian-day formula reads earlier dates as Julian-calendar
    /// dates) or after 9999.
    pub fn from_unix(seconds: f64) -> Result<Utc, EngineError> {
        // 1583-01-01 and 10000-01-01, 00:00 UTC.
        const FIRST: f64 = -12_212_553_600.0;
        const END: f64 = 253_402_300_800.0;
        if !(FIRST..END).contains(&seconds) {
            return Err(undefined(
                Subject::Input(keys::TIME),
                "date and time",
                seconds,
                "s since 1970",
                "give a date from the year 1583 to 9999",
            ));
        }
        let days = (seconds / 86_400.0).floor();
        let mut rest = seconds - days * 86_400.0;
        let z = days as i64 + 719_468;
        let era = z.div_euclid(146_097);
        let doe = z.rem_euclid(146_097);
        let yoe = (doe - doe / 1460 + doe / 36_524 - doe / 146_096) / 365;
        let doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
        let mp = (5 * doy + 2) / 153;
        let day = (doy - (153 * mp + 2) / 5 + 1) as u32;
        let month = if mp < 10 { mp + 3 } else { mp - 9 } as u32;
        let year = (yoe + era * 400 + i64::from(month <= 2)) as i32;
        let hour = (rest / 3600.0).floor().min(23.0);
        rest -= hour * 3600.0;
        let minute = (rest / 60.0).floor().min(59.0);
        let second = (rest - minute * 60.0).clamp(0.0, 59.999_999);
        Ok(Utc {
            year,
            month,
            day,
            hour: hour as u32,
            minute: minute as u32,
            second,
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn at(y: i32, mo: u32, d: u32, h: u32, mi: u32, s: f64) -> Utc {
        Utc {
            year: y,
            month: mo,
            day: d,
            hour: h,
            minute: mi,
            second: s,
        }
    }

    /// Against Python's `datetime.fromtimestamp(t, timezone.utc)` (an independent computation,
    /// run here): the epoch, a leap day, the SPA report's test instant, a date before the epoch,
    /// and the first and last instants the page takes.
    #[test]
    fn seconds_since_1970_become_the_utc_calendar() {
        for (t, want) in [
            (0.0, at(1970, 1, 1, 0, 0, 0.0)),
            (-1.0, at(1969, 12, 31, 23, 59, 59.0)),
            (951_804_428.0, at(2000, 2, 29, 6, 7, 8.0)),
            (1_066_419_030.0, at(2003, 10, 17, 19, 30, 30.0)),
            (1_700_000_000.0, at(2023, 11, 14, 22, 13, 20.0)),
            (1_797_854_400.0, at(2026, 12, 21, 12, 0, 0.0)),
            (-2_203_848_000.0, at(1900, 3, 1, 12, 0, 0.0)),
            (-12_212_553_600.0, at(1583, 1, 1, 0, 0, 0.0)),
            (253_402_300_799.0, at(9999, 12, 31, 23, 59, 59.0)),
            (1_066_419_030.25, at(2003, 10, 17, 19, 30, 30.25)),
        ] {
            assert_eq!(Utc::from_unix(t).unwrap(), want, "{t}");
        }
        for bad in [
            -12_212_553_601.0,
            253_402_300_800.0,
            f64::NAN,
            f64::INFINITY,
        ] {
            assert!(Utc::from_unix(bad).is_err(), "{bad}");
        }
    }
}
