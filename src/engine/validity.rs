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
}

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
}

impl Flag {
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
    fn message_names_quantity_value_range_source() {
        let m = R.check("Hilpert", 5000.0, false).unwrap().message();
        assert!(m.contains("Hilpert") && m.contains("Re = 5000") && m.contains("40 to 4000"));
        assert!(m.contains("test"));
    }
}
