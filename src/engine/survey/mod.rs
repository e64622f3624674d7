//! The survey list: many items (each a saved scenario), their results and totals; its CSV form
//! is in `csv`.

use crate::engine::error::EngineError;
use crate::engine::scenario::{self, Scenario};

mod csv;
pub use csv::*;

/// One item's figures for the list, SI: heat flow W (run or body) and per metre where the body
/// has a length, surface K, energy J/yr, cost, and each verdict's id with whether it is met.
#[derive(Debug, Clone, PartialEq)]
pub struct ItemResult {
    pub q_total: f64,
    pub q_per_length: Option<f64>,
    pub surface_temp: f64,
    pub flags: usize,
    pub annual_energy: f64,
    pub annual_cost: f64,
    pub verdicts: Vec<(&'static str, bool)>,
    /// Read with an infrared instrument (issue #20): the corrected surface K, the outer layer's
    /// k ratio to its data sheet, the condition, and the excess cost per year against design.
    pub inspection: Option<InspectionFigures>,
}

/// An item's inspection in the list.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct InspectionFigures {
    /// The instrument's displayed temperature, K, and the surface corrected from it, K.
    pub reading: f64,
    pub surface: f64,
    pub k_ratio: f64,
    pub condition: crate::engine::inspect::Condition,
    /// The item's heat flow as read, W (signed as `q_total`), and its excess over design: heat
    /// flow of the item, W, and cost per year.
    pub loss: f64,
    pub excess_loss: f64,
    pub excess_cost: f64,
}

pub fn evaluate_item(s: &Scenario) -> Result<ItemResult, EngineError> {
    let o = scenario::evaluate_with(s, false)?;
    Ok(ItemResult {
        q_total: o.q_total,
        q_per_length: o.q_per_length,
        surface_temp: o.surface_temp,
        flags: o.flags.len(),
        annual_energy: o.annual_energy,
        annual_cost: o.annual_cost,
        verdicts: o.verdicts.iter().map(|v| (v.id, v.ok)).collect(),
        inspection: o.inspection.as_ref().map(|i| InspectionFigures {
            reading: s.ir_reading,
            surface: i.corrected.surface,
            k_ratio: i.k.factor,
            condition: i.condition,
            loss: i.actual * s.run(),
            excess_loss: i.excess_total,
            excess_cost: i.excess_cost,
        }),
    })
}

/// An item's figures, or why it could not be computed (shown in its row).
pub type Figure = Result<ItemResult, String>;

/// The survey's figures remembered by link: when the list changes, only items whose inputs changed
/// (a link not seen before) are computed again; a change of units or sort order computes nothing.
#[derive(Debug, Default)]
pub struct Figures {
    known: std::collections::HashMap<String, Figure>,
    /// How many items have been computed so far (for tests and the progress note).
    pub computed: usize,
}

impl Figures {
    /// The figure for a link, when known.
    pub fn get(&self, link: &str) -> Option<&Figure> {
        self.known.get(link)
    }
    /// Compute the first links not yet known, while `more()` says there is time; true when every
    /// link is then known.
    pub fn fill(&mut self, links: &[&str], more: &mut dyn FnMut() -> bool) -> bool {
        for l in links {
            if self.known.contains_key(*l) {
                continue;
            }
            if !more() {
                return false;
            }
            let f = scenario::from_fragment(l)
                .and_then(|(s, _)| evaluate_item(&s).map_err(|e| e.to_string()));
            self.known.insert(l.to_string(), f);
            self.computed += 1;
        }
        true
    }
    /// Forget links no longer in the list.
    pub fn keep_only(&mut self, links: &[&str]) {
        let keep: std::collections::HashSet<&str> = links.iter().copied().collect();
        self.known.retain(|k, _| keep.contains(k.as_str()));
    }
}

/// Sums over the items that computed: heat flow W, energy J/yr, cost per year.
pub fn totals<'a>(results: impl IntoIterator<Item = &'a Figure>) -> (f64, f64, f64) {
    results
        .into_iter()
        .flatten()
        .fold((0.0, 0.0, 0.0), |(q, e, c), r| {
            (q + r.q_total, e + r.annual_energy, c + r.annual_cost)
        })
}

/// The inspected items' excess over design, summed: heat flow W and cost per year, and how many
/// items were inspected (0: the list has no inspection, the totals row says nothing of it). An
/// item read better than its design adds nothing (it does not pay for another's defect).
pub fn inspection_totals<'a>(results: impl IntoIterator<Item = &'a Figure>) -> (usize, f64, f64) {
    results
        .into_iter()
        .flatten()
        .filter_map(|r| r.inspection.as_ref())
        .fold((0, 0.0, 0.0), |(n, q, c), i| {
            (
                n + 1,
                q + i.excess_loss.max(0.0),
                c + i.excess_cost.max(0.0),
            )
        })
}

/// The list worst first: inspected items by their excess cost against design (the money a defect
/// loses), then every other item by the size of its heat flow; items that could not be computed
/// last. Stable: equal items keep their order.
/// Rows may be the items themselves or references to them (the page sorts references).
pub fn worst_first<T, R: std::borrow::Borrow<(T, Figure)>>(rows: &mut [R]) {
    let key = |f: &Figure| match f {
        Ok(r) => match &r.inspection {
            Some(i) => (2, i.excess_cost),
            None => (1, r.q_total.abs()),
        },
        Err(_) => (0, 0.0),
    };
    let keys: Vec<(u8, f64)> = rows.iter().map(|r| key(&r.borrow().1)).collect();
    // Put the rows in that order by swaps: each cycle of the order is walked once, and a
    // place is marked done by pointing it at itself.
    let mut from = stable_order(&keys);
    for i in 0..from.len() {
        let mut j = i;
        loop {
            let k = from[j];
            from[j] = j;
            if k == i {
                break;
            }
            rows.swap(j, k);
            j = k;
        }
    }
}

/// The places of `keys` largest first (by class, then by value), equal keys in their own order.
/// A plain merge sort of places, written here because the library's stable sort, used for this
/// one list, is several kilobytes of the page's code.
fn stable_order(keys: &[(u8, f64)]) -> Vec<usize> {
    let first = |x: (u8, f64), y: (u8, f64)| {
        x.0 > y.0 || (x.0 == y.0 && x.1.total_cmp(&y.1) == std::cmp::Ordering::Greater)
    };
    let n = keys.len();
    let mut a: Vec<usize> = (0..n).collect();
    let mut b = a.clone();
    let mut w = 1;
    while w < n {
        let mut lo = 0;
        while lo < n {
            let (mid, hi) = ((lo + w).min(n), (lo + 2 * w).min(n));
            let (mut i, mut j) = (lo, mid);
            for slot in &mut b[lo..hi] {
                // The right run's head goes first only when strictly before the left's: stable.
                if j < hi && (i >= mid || first(keys[a[j]], keys[a[i]])) {
                    *slot = a[j];
                    j += 1;
                } else {
                    *slot = a[i];
                    i += 1;
                }
            }
            lo = hi;
        }
        std::mem::swap(&mut a, &mut b);
        w *= 2;
    }
    a
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::engine::scenario::DEMO;
    use crate::engine::units::System;

    use super::csv::tests::items;

    #[test]
    fn a_change_computes_only_the_items_it_changed() {
        let links: Vec<String> = items().iter().map(|i| i.link.clone()).collect();
        let all: Vec<&str> = links.iter().map(String::as_str).collect();
        let mut f = Figures::default();
        assert!(f.fill(&all, &mut || true));
        assert_eq!(f.computed, all.len());
        // Each figure is the item evaluated on its own.
        for l in &all {
            let (s, _) = scenario::from_fragment(l).unwrap();
            assert_eq!(
                f.get(l).unwrap().as_ref().ok(),
                evaluate_item(&s).ok().as_ref()
            );
        }
        // One item edited: one computation.
        let mut s = DEMO;
        s.diameter = 0.1;
        let edited = scenario::to_fragment(&s, System::Si);
        let mut now = all.clone();
        now[0] = &edited;
        assert!(f.fill(&now, &mut || true));
        assert_eq!(f.computed, all.len() + 1);
        // Out of time: stops, and says so.
        let mut g = Figures::default();
        let mut budget = 1;
        assert!(!g.fill(&all, &mut || {
            budget -= 1;
            budget >= 0
        }));
        assert_eq!(g.computed, 1);
        f.keep_only(&now);
        assert!(f.get(all[0]).is_none() && f.get(&edited).is_some());
    }

    #[test]
    fn totals_add_the_items_that_computed() {
        let rs: Vec<_> = items()
            .iter()
            .map(|i| evaluate_item(&i.scenario().unwrap().0).map_err(|e| e.to_string()))
            .collect();
        let (q, e, c) = totals(&rs);
        let want: f64 = rs.iter().map(|r| r.as_ref().unwrap().q_total).sum();
        assert_eq!(q, want);
        assert!(e > 0.0 && c > 0.0);
    }

    /// An item read with an infrared instrument carries its inspection into the CSV's result
    /// columns (corrected surface, k ratio, condition, excess cost); an item without leaves them
    /// blank, and the import reads both back.
    #[test]
    fn an_inspected_item_writes_its_inspection_columns() {
        use crate::engine::scenario::SurfaceMode;
        use crate::engine::store::Saved;
        let mut read = DEMO;
        read.surface_mode = SurfaceMode::Reading;
        let items = [
            Saved::new("Read", "IR-1", "Rack", &read, System::Si),
            Saved::new("Plain", "P-1", "Roof", &DEMO, System::Si),
        ];
        let text = to_csv(&items, System::Si, &Figures::default());
        let lines: Vec<Vec<&str>> = text.lines().map(|l| l.split(',').collect()).collect();
        let col = |name: &str| {
            lines[0]
                .iter()
                .position(|h| h.starts_with(name))
                .unwrap_or_else(|| panic!("{name}"))
        };
        let i = evaluate_item(&read).unwrap().inspection.unwrap();
        assert_eq!(
            lines[1][col("Result: insulation condition")],
            i.condition.id()
        );
        assert_eq!(lines[1][col("Verdict: insulation condition")], "attention");
        assert!(!lines[1][col("Result: outer layer k")].is_empty());
        assert!(!lines[1][col("Result: surface from the infrared")].is_empty());
        assert!(lines[2][col("Result: excess cost")].is_empty());
        let (rows, errors) = from_csv(&text);
        assert!(errors.is_empty() && rows.len() == 2, "{errors:?}");
        assert_eq!(rows[0].scenario().unwrap().0, read);
    }

    /// Worst first on an inspection round: the inspected items by the money their defect loses,
    /// then the others by heat flow, the failures last; the totals add the inspected items only.
    #[test]
    fn an_inspection_round_sorts_by_excess_cost_and_totals_it() {
        use crate::engine::scenario::SurfaceMode;
        let mut mild = DEMO;
        mild.surface_mode = SurfaceMode::Reading;
        let mut hot = mild;
        hot.ir_reading += 15.0;
        let mut big = DEMO;
        big.diameter *= 3.0;
        let figure = |s: &Scenario| evaluate_item(s).map_err(|e| e.to_string());
        let mut rows = vec![
            ("small", figure(&DEMO)),
            ("failed", Err("not computed".to_string())),
            ("mild", figure(&mild)),
            ("big", figure(&big)),
            ("hot", figure(&hot)),
        ];
        let cost = |r: &Figure| r.as_ref().unwrap().inspection.unwrap().excess_cost;
        assert!(
            cost(&rows[4].1) > cost(&rows[2].1),
            "a hotter reading loses more"
        );
        let (n, q, c) = inspection_totals(rows.iter().map(|r| &r.1));
        assert_eq!(n, 2);
        assert_eq!(c, cost(&rows[2].1) + cost(&rows[4].1));
        let ex = |r: &Figure| r.as_ref().unwrap().inspection.unwrap().excess_loss;
        assert_eq!(q, ex(&rows[2].1) + ex(&rows[4].1));
        worst_first(&mut rows);
        let order: Vec<&str> = rows.iter().map(|r| r.0).collect();
        assert_eq!(order, ["hot", "mild", "big", "small", "failed"]);
    }

    #[test]
    fn the_order_is_that_of_a_stable_sort_ties_and_all() {
        // Keys with many ties (three classes, few values), at lengths around the powers of two.
        let mut seed = 7u32;
        for n in [0, 1, 2, 3, 7, 8, 9, 31, 64, 100, 257] {
            let keys: Vec<(u8, f64)> = (0..n)
                .map(|_| {
                    seed = seed.wrapping_mul(1_103_515_245).wrapping_add(12_345);
                    (((seed >> 16) % 3) as u8, f64::from((seed >> 8) % 5))
                })
                .collect();
            let mut want: Vec<usize> = (0..n).collect();
            want.sort_by(|&a, &b| {
                let (ka, kb) = (keys[a], keys[b]);
                kb.0.cmp(&ka.0).then(kb.1.total_cmp(&ka.1))
            });
            assert_eq!(stable_order(&keys), want, "n = {n}");
        }
    }
}
