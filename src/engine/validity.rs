//! Validity ranges as data, and the one checker that reads them.
//!
//! A method is always evaluated; outside the range it was fitted on the caller gets a [`Flag`]
//! naming the quantity, its value, the range and the source. Near a band edge (where tabulated
//! constants jump) the flag says so.

/// A published range of validity for one quantity of one method.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Range {
    /// Short symbol shown to the user, e.g. "Re·Pr" or "T".
    pub quantity: &'static str,
    /// Inclusive lower bound (SI, or dimensionless).
    pub lo: f64,
    /// Inclusive upper bound (SI, or dimensionless); `f64::INFINITY` for none.
    pub hi: f64,
    /// Unit of `lo`, `hi` and the value ("" for dimensionless).
    pub unit: &'static str,
    /// Where the range comes from.
    pub source: &'static str,
}

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum FlagKind {
    /// The value lies outside the published range: the result is an extrapolation.
    Outside,
    /// Inside, but within [`NEAR_EDGE`] of a band edge where constants change.
    NearEdge,
    /// Outside a printed range that is not a limit of the method in this case (a viscosity-ratio
    /// range fitted on liquids, read for a gas): shown, never a reason to set the method aside.
    Advisory,
}

/// Relative tolerance on a printed Prandtl-number limit: a Pr within 3 % of it counts as inside.
/// Limits are printed to two figures (0.71 covers 0.705–0.715), and Pr enters the correlations as
/// Pr^⅓ to Pr^0.4, so 3 % in Pr moves Nu by at most 1.2 %, far inside their ±20 % scatter
/// (common practice).
pub const PR_SLACK: f64 = 0.03;

/// Relative distance from a band edge counted as "near" it.
pub const NEAR_EDGE: f64 = 0.03;

/// One range flag attached to a result.
#[derive(Debug, Clone, PartialEq)]
pub struct Flag {
    pub kind: FlagKind,
    /// Which method or property the range belongs to, e.g. "Churchill–Bernstein".
    pub method: &'static str,
    pub range: Range,
    pub value: f64,
    /// Relative slack the range was checked with (0 for most ranges; [`PR_SLACK`] for printed
    /// Prandtl limits): the distance outside is measured from the widened limit.
    pub slack: f64,
}

/// Largest distance outside a range counted, in decades (a value of 0 against a positive lower
/// limit is infinitely far in log terms).
pub const MAX_DECADES: f64 = 10.0;

impl Flag {
    /// How far the value lies outside the range, in decades (log₁₀ of the ratio to the nearest
    /// widened limit); 0 for a flag that is not `Outside`.
    pub fn decades_outside(&self) -> f64 {
        if self.kind != FlagKind::Outside {
            return 0.0;
        }
        let (lo, hi) = (
            self.range.lo * (1.0 - self.slack),
            self.range.hi * (1.0 + self.slack),
        );
        let v = self.value;
        let d = if !v.is_finite() || v <= 0.0 {
            MAX_DECADES
        } else if v < lo {
            (lo / v).log10()
        } else if v > hi {
            (v / hi).log10()
        } else {
            0.0
        };
        d.clamp(0.0, MAX_DECADES)
    }

    /// One line for the page: reason, the value, the range, the source.
    pub fn message(&self) -> String {
        let r = &self.range;
        let unit = if r.unit.is_empty() {
            String::new()
        } else {
            format!(" {}", r.unit)
        };
        let range = if r.hi.is_infinite() {
            format!("≥ {}{unit}", fmt_bound(r.lo))
        } else if r.lo == 0.0 || r.lo.is_infinite() {
            format!("≤ {}{unit}", fmt_bound(r.hi))
        } else {
            format!("{} to {}{unit}", fmt_bound(r.lo), fmt_bound(r.hi))
        };
        let value = crate::engine::units::format_sig(self.value, 4);
        match self.kind {
            FlagKind::Outside => format!(
                "{}: {} = {}{unit} is outside its range {} ({}); the value shown is an extrapolation",
                self.method, r.quantity, value, range, r.source
            ),
            FlagKind::NearEdge => format!(
                "{}: {} = {}{unit} is near an edge of its band {} ({}); the constants change there",
                self.method, r.quantity, value, range, r.source
            ),
            FlagKind::Advisory => format!(
                "{}: {} = {}{unit} is outside the printed {} ({}), fitted on liquids: not a limit in a gas",
                self.method, r.quantity, value, range, r.source
            ),
        }
    }
}

fn fmt_bound(v: f64) -> String {
    crate::engine::units::format_sig(v, 4)
}

impl Range {
    /// Check a value against this range. `banded` ranges also flag values near an edge.
    pub fn check(&self, method: &'static str, value: f64, banded: bool) -> Option<Flag> {
        let outside = !(value >= self.lo && value <= self.hi);
        if outside {
            return Some(Flag {
                kind: FlagKind::Outside,
                method,
                range: *self,
                value,
                slack: 0.0,
            });
        }
        if banded {
            let near = |edge: f64| {
                edge.is_finite() && edge != 0.0 && ((value - edge) / edge).abs() < NEAR_EDGE
            };
            if near(self.lo) || near(self.hi) {
                return Some(Flag {
                    kind: FlagKind::NearEdge,
                    method,
                    range: *self,
                    value,
                    slack: 0.0,
                });
            }
        }
        None
    }
}

/// A table of constants by bands of one quantity (e.g. C and m by Reynolds band). `edges` are the
/// band limits in increasing order: band `i` runs from `edges[i]` to `edges[i + 1]`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Bands {
    pub quantity: &'static str,
    pub edges: &'static [f64],
    pub source: &'static str,
}

impl Bands {
    /// The whole published range, first edge to last.
    pub fn range(&self) -> Range {
        Range {
            quantity: self.quantity,
            lo: self.edges[0],
            hi: self.edges[self.edges.len() - 1],
            unit: "",
            source: self.source,
        }
    }

    /// The band a value falls in (the nearest band outside the range) and the flag it raises:
    /// outside the whole range, or within [`NEAR_EDGE`] of an inner edge where the constants jump.
    /// A value on an inner edge belongs to the upper band.
    pub fn locate(&self, method: &'static str, value: f64) -> (usize, Option<Flag>) {
        let n = self.edges.len() - 1;
        let i = self.edges[1..n].iter().take_while(|&&e| value >= e).count();
        let whole = self.range();
        if let Some(f) = whole.check(method, value, false) {
            return (i, Some(f));
        }
        let band = Range {
            lo: self.edges[i],
            hi: self.edges[i + 1],
            ..whole
        };
        let inner_near =
            |edge: f64, inner: bool| inner && ((value - edge) / edge).abs() < NEAR_EDGE;
        let near = inner_near(band.lo, i > 0) || inner_near(band.hi, i + 1 < n);
        let flag = near.then_some(Flag {
            kind: FlagKind::NearEdge,
            method,
            range: band,
            value,
            slack: 0.0,
        });
        (i, flag)
    }
}

/// A value with the range flags raised while computing it.
#[derive(Debug, Clone, PartialEq)]
pub struct Flagged<T> {
    pub value: T,
    pub flags: Vec<Flag>,
}

impl<T> Flagged<T> {
    pub fn new(value: T) -> Self {
        Flagged {
            value,
            flags: Vec::new(),
        }
    }

    /// Check `v` against `range` and keep the flag if one is raised.
    pub fn check(&mut self, method: &'static str, range: &Range, v: f64) {
        if let Some(f) = range.check(method, v, false) {
            self.flags.push(f);
        }
    }

    /// As [`Flagged::check`] for a printed Prandtl-number limit: inside within [`PR_SLACK`] of it.
    pub fn check_pr(&mut self, method: &'static str, range: &Range, pr: f64) {
        let widened = Range {
            lo: range.lo * (1.0 - PR_SLACK),
            hi: range.hi * (1.0 + PR_SLACK),
            ..*range
        };
        if widened.check(method, pr, false).is_some() {
            self.flags.push(Flag {
                kind: FlagKind::Outside,
                method,
                range: *range,
                value: pr,
                slack: PR_SLACK,
            });
        }
    }

    /// Check `v` against a range that is shown but never sets the method aside
    /// ([`FlagKind::Advisory`]).
    pub fn advise(&mut self, method: &'static str, range: &Range, v: f64) {
        if range.check(method, v, false).is_some() {
            self.flags.push(Flag {
                kind: FlagKind::Advisory,
                method,
                range: *range,
                value: v,
                slack: 0.0,
            });
        }
    }

    /// The distance outside all its ranges, in decades, summed over the flags.
    pub fn decades_outside(&self) -> f64 {
        decades_outside(&self.flags)
    }
}

/// The distance outside all ranges, in decades, summed over `flags` (0 when inside them all).
pub fn decades_outside(flags: &[Flag]) -> f64 {
    flags.iter().map(Flag::decades_outside).sum()
}

#[cfg(test)]
mod tests {
    use super::*;

    const R: Range = Range {
        quantity: "Re",
        lo: 40.0,
        hi: 4000.0,
        unit: "",
        source: "test",
    };

    #[test]
    fn inside_is_clean_and_edges_are_inclusive() {
        assert_eq!(R.check("m", 400.0, true), None);
        assert_eq!(R.check("m", 40.0, false), None);
        assert_eq!(R.check("m", 4000.0, false), None);
    }

    #[test]
    fn outside_and_nan_are_flagged() {
        assert_eq!(R.check("m", 39.9, false).unwrap().kind, FlagKind::Outside);
        assert_eq!(R.check("m", 5000.0, false).unwrap().kind, FlagKind::Outside);
        assert_eq!(
            R.check("m", f64::NAN, false).unwrap().kind,
            FlagKind::Outside
        );
    }

    #[test]
    fn near_edge_only_for_bands() {
        assert_eq!(R.check("m", 3950.0, true).unwrap().kind, FlagKind::NearEdge);
        assert_eq!(R.check("m", 3950.0, false), None);
    }

    const B: Bands = Bands {
        quantity: "Re",
        edges: &[1.0, 40.0, 1000.0],
        source: "test",
    };

    #[test]
    fn bands_locate_values_and_flag_only_inner_edges() {
        assert_eq!(B.locate("m", 10.0), (0, None));
        assert_eq!(B.locate("m", 40.0).0, 1);
        let (i, f) = B.locate("m", 39.5);
        assert_eq!(i, 0);
        assert_eq!(f.unwrap().kind, FlagKind::NearEdge);
        // Near an outer edge but inside: no flag (the constants do not jump there).
        assert_eq!(B.locate("m", 990.0), (1, None));
        let (i, f) = B.locate("m", 2000.0);
        assert_eq!(i, 1);
        let f = f.unwrap();
        assert_eq!(
            (f.kind, f.range.lo, f.range.hi),
            (FlagKind::Outside, 1.0, 1000.0)
        );
        assert_eq!(B.locate("m", 0.5).0, 0);
    }

    #[test]
    fn distance_outside_is_in_decades_from_the_widened_limit() {
        let f = R.check("m", 40_000.0, false).unwrap();
        assert!((f.decades_outside() - 1.0).abs() < 1e-12);
        let f = R.check("m", 4.0, false).unwrap();
        assert!((f.decades_outside() - 1.0).abs() < 1e-12);
        assert_eq!(
            R.check("m", 0.0, false).unwrap().decades_outside(),
            MAX_DECADES
        );
        let pr = Range {
            quantity: "Pr",
            lo: 0.71,
            hi: 380.0,
            unit: "",
            source: "test",
        };
        // Air's 0.707 is inside a printed 0.71; 0.68 is outside, measured from 0.71 × 0.97.
        let mut v = Flagged::new(0.0);
        v.check_pr("m", &pr, 0.707);
        assert!(v.flags.is_empty());
        v.check_pr("m", &pr, 0.68);
        let d = v.decades_outside();
        assert!((d - (0.71 * 0.97 / 0.68f64).log10()).abs() < 1e-12, "{d}");
        // Continuous at the widened limit.
        let mut w = Flagged::new(0.0);
        w.check_pr("m", &pr, 0.71 * 0.97 * (1.0 - 1e-12));
        assert!(w.decades_outside() < 1e-9);
    }

    #[test]
    fn an_advisory_flag_is_shown_but_not_outside() {
        let mut v = Flagged::new(0.0);
        v.advise("m", &R, 1.0);
        assert_eq!(v.flags[0].kind, FlagKind::Advisory);
        assert_eq!(v.decades_outside(), 0.0);
        assert!(v.flags[0].message().contains("not a limit"));
    }

    #[test]
    fn message_names_quantity_value_range_source() {
        let m = R.check("Hilpert", 5000.0, false).unwrap().message();
        assert!(m.contains("Hilpert") && m.contains("Re = 5000") && m.contains("40 to 4000"));
        assert!(m.contains("test"));
    }
}
