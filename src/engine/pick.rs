//! The recommendation rule: which forced correlation (or which blend of two) gives the answer.
//!
//! Each shape lists its correlations in an order of preference (`Shape::forced`). Every printed
//! limit is classified where the correlation checks it (see [`crate::engine::validity`]):
//! - a Reynolds band (or Re·Pr) the data covered is a hard limit;
//! - a printed Prandtl limit holds within [`crate::engine::validity::PR_SLACK`];
//! - a viscosity-ratio range fitted on liquids is shown but never sets a correlation aside in a
//!   gas (an advisory flag).
//!
//! The distance of a correlation outside its ranges, D (decades, summed over its flags), plus
//! [`HANDOVER`] for each place it stands down the order, is its score; the lowest score wins.
//! So a correlation inside all its ranges (D = 0) beats every later one; one outside is
//! preferred to the next only while it is less far outside; and among correlations all outside,
//! the least far outside wins — not the next in a fixed list.
//!
//! Continuity: the two lowest scores share the answer when they lie within [`HANDOVER`] of each
//! other, the runner-up with weight (HANDOVER − gap)/(2·HANDOVER) — a half each when they tie.
//! As one input moves a correlation past its limit, its share falls linearly in log Re from 1 at
//! the limit to 0 at 2 × HANDOVER = 0.3 decade (a factor 2) beyond it, so the recommended h never
//! jumps; and where the two lowest trade places their shares are equal, so nothing jumps there
//! either.

/// Half the width of the handover zone, in decades of distance outside a range; also the
/// score added for each place down the order of preference.
pub const HANDOVER: f64 = 0.15;

/// The most forced correlations a shape lists.
pub const MAX_FORCED: usize = 5;

/// The recommendation: a weight for each correlation of the shape's list (summing to 1).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Pick {
    pub weights: [f64; MAX_FORCED],
}

impl Pick {
    /// The one correlation that carries all the weight, if there is one.
    pub fn only(&self) -> Option<usize> {
        let i = self.main();
        (self.weights[i] == 1.0).then_some(i)
    }

    /// All the weight on correlation `i`.
    pub fn single(i: usize) -> Pick {
        let mut weights = [0.0; MAX_FORCED];
        weights[i.min(MAX_FORCED - 1)] = 1.0;
        Pick { weights }
    }

    /// The correlation with the largest share (the first on a tie).
    pub fn main(&self) -> usize {
        let mut best = 0;
        for (i, &w) in self.weights.iter().enumerate() {
            if w > self.weights[best] {
                best = i;
            }
        }
        best
    }

    /// The correlations that share the answer, with their weights, in list order.
    pub fn shares(&self) -> impl Iterator<Item = (usize, f64)> + '_ {
        self.weights
            .iter()
            .enumerate()
            .filter(|(_, &w)| w > 0.0)
            .map(|(i, &w)| (i, w))
    }

    /// Σ wᵢ·f(i) over the correlations that share the answer. With one correlation this is
    /// exactly f(i) (1.0 × x = x), so a single pick costs nothing in precision.
    pub fn combine(
        &self,
        mut f: impl FnMut(usize) -> Result<f64, crate::engine::error::EngineError>,
    ) -> Result<f64, crate::engine::error::EngineError> {
        let mut sum = 0.0;
        for (i, w) in self.shares() {
            sum += w * f(i)?;
        }
        Ok(sum)
    }

    /// The largest change of any weight between two picks.
    pub fn distance(&self, other: &Pick) -> f64 {
        self.weights
            .iter()
            .zip(other.weights.iter())
            .map(|(a, b)| (a - b).abs())
            .fold(0.0, f64::max)
    }
}

/// Picks from the correlations' distances outside their ranges, taken in the shape's order:
/// `outside(i)` evaluates correlation `i` and returns its distance in decades
/// ([`crate::engine::validity::decades_outside`] of its flags), or `None` for one that takes no
/// part. Stops evaluating as soon as no later correlation could get a share.
pub fn pick(n: usize, outside: &mut dyn FnMut(usize) -> Option<f64>) -> Pick {
    // The lowest score and the runner-up, as (index, score).
    let mut best: Option<(usize, f64)> = None;
    let mut second: Option<(usize, f64)> = None;
    let mut rank = 0.0;
    for i in 0..n.min(MAX_FORCED) {
        // Every later correlation scores at least HANDOVER × its rank: none can share.
        if best.is_some_and(|(_, lo)| lo + HANDOVER <= HANDOVER * rank) {
            break;
        }
        let Some(d) = outside(i) else {
            continue;
        };
        let score = d + HANDOVER * rank;
        rank += 1.0;
        match best {
            Some((_, lo)) if score >= lo => {
                if second.is_none_or(|(_, s2)| score < s2) {
                    second = Some((i, score));
                }
            }
            _ => {
                second = best;
                best = Some((i, score));
            }
        }
    }
    match (best, second) {
        (Some((b, lo)), Some((j, s2))) => {
            let share = (HANDOVER - (s2 - lo)) / (2.0 * HANDOVER);
            if share > 0.0 {
                let mut weights = [0.0; MAX_FORCED];
                weights[b] = 1.0 - share;
                weights[j] = share;
                Pick { weights }
            } else {
                Pick::single(b)
            }
        }
        (Some((b, _)), None) => Pick::single(b),
        _ => Pick::single(0),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::engine::validity::{decades_outside, Flag, FlagKind, Range};

    const RE: Range = Range {
        quantity: "Re",
        lo: 10.0,
        hi: 1000.0,
        unit: "",
        source: "test",
    };

    fn outside(v: f64) -> Vec<Flag> {
        RE.check("m", v, false).into_iter().collect()
    }

    fn run(values: &[f64]) -> Pick {
        pick(values.len(), &mut |i| {
            Some(decades_outside(&outside(values[i])))
        })
    }

    #[test]
    fn the_first_inside_its_ranges_wins_alone() {
        assert_eq!(run(&[500.0, 500.0]), Pick::single(0));
        assert_eq!(run(&[5000.0, 500.0]), Pick::single(1));
    }

    #[test]
    fn the_least_far_outside_wins_not_the_next_in_the_list() {
        // 1.5 decades above the first, 0.5 below the second, 1 decade above the third: scores
        // 1.5, 0.65, 1.3.
        let vals = [31_623.0 * 1.0, 10f64.powf(0.5), 10_000.0];
        let p = pick(3, &mut |i| Some(decades_outside(&outside(vals[i]))));
        assert_eq!(p, Pick::single(1));
    }

    #[test]
    fn the_handover_is_linear_and_continuous() {
        // The first correlation moves past its upper limit; the second stays inside.
        let mut last = 1.0;
        let mut x = 1000.0;
        let step = 1.002f64;
        while x < 2100.0 {
            let w = run(&[x, 500.0]).weights[0];
            // Linear in log Re: each step moves the share by the same amount, or none.
            let most = step.log10() / (2.0 * HANDOVER) * (1.0 + 1e-9);
            assert!(w <= last + 1e-12 && last - w <= most, "{x}: {last} → {w}");
            last = w;
            x *= step;
        }
        assert_eq!(last, 0.0);
        // Half way (0.15 decade past the limit) the two share equally.
        let half = run(&[1000.0 * 10f64.powf(HANDOVER), 500.0]);
        assert!((half.weights[0] - 0.5).abs() < 1e-9, "{half:?}");
    }

    #[test]
    fn one_taking_no_part_is_skipped_and_evaluation_stops_early() {
        let mut asked = Vec::new();
        let p = pick(3, &mut |i| {
            asked.push(i);
            (i != 0).then(|| decades_outside(&outside(500.0)))
        });
        assert_eq!(p, Pick::single(1));
        assert_eq!(asked, vec![0, 1]);
        let f = &outside(5000.0)[0];
        assert_eq!(f.kind, FlagKind::Outside);
    }
}
