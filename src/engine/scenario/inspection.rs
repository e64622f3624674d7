//! The inspection round (issue #20) in a scenario: its terms from the inputs, its verdict card and
//! its steps of the working. The computation is `engine::inspect`.

use super::*;
use crate::engine::inspect::{Condition, Inspection, Terms};

/// What a card on an inspection says beside its figures.
pub const INSPECTION_CAUTION: &str = "An infrared survey screens; it does not prove. The k ratio carries every error of the reading (emissivity, reflected temperature, wind at the moment of reading, sun) and of the design inputs. Confirm a degraded or wet section by opening it or by a contact measurement before repair decisions, and follow your site's rules for work on hot or cold lines.";

/// The inspection's terms from the scenario: run length (1 for a sphere: whole body), the energy
/// and cost inputs, the reading's accuracy and the emissivity's uncertainty.
pub(crate) fn inspection_terms(s: &Scenario) -> Terms {
    Terms {
        run: s.run(),
        hours: s.hours,
        efficiency: s.efficiency,
        price: s.price,
        accuracy: s.ir_accuracy,
        emissivity_uncertainty: s.ir_emissivity_uncertainty,
    }
}

/// The design's touch, sweat and loss-target cards judged again on what the reading says: a
/// surface that burns or sweats as read fails its card whatever the design gives (touch on the
/// high end of the reading's range, sweating on the low end), and the loss as read meets the
/// target or not. Each card keeps the design's figures and says which governs.
pub(crate) fn as_read(verdicts: &mut [Verdict], s: &Scenario, i: &Inspection, dew: Option<f64>) {
    let r = &i.ranges.surface;
    let (lo, hi) = (r.lo.min(i.corrected.surface), r.hi.max(i.corrected.surface));
    for v in verdicts.iter_mut() {
        if v.id == "saving" {
            saving_as_read(v, (i.actual * s.run()).abs());
            continue;
        }
        let (bad, figure) = match v.id {
            "touch" => (
                hi > s.touch_limit,
                ("surface as read, high end", hi, Dim::Temperature),
            ),
            "dew" => match dew {
                Some(td) => (
                    lo < td + s.dew_margin,
                    ("surface as read, low end", lo, Dim::Temperature),
                ),
                None => continue,
            },
            "loss" => (
                i.actual > s.loss_target,
                ("loss per length as read", i.actual, Dim::HeatFlowPerLength),
            ),
            _ => continue,
        };
        // The design's own figures stay, named as the design's.
        for f in v.figures.iter_mut() {
            f.0 = match f.0 {
                "surface" => "surface as designed",
                "loss per length" => "loss per length as designed",
                other => other,
            };
        }
        v.figures.insert(0, figure);
        v.summary = format!(
            "As read: {}. As designed: {}",
            if bad {
                "fails this limit"
            } else {
                "within this limit"
            },
            v.summary
        );
        if bad {
            v.ok = false;
            // A thickness that meets the limit as designed does not mend what the reading shows.
            v.thickness = None;
            if v.id == "touch" {
                v.caution = Some(crate::engine::job::TOUCH_CAUTION);
            }
        }
    }
}

/// The card of the insulation against bare, judged again on the reading: what the line loses as
/// read (`read`, W over the run, a magnitude) against its bare loss; the design's figures stay,
/// named as the design's (a walk found "✓ saved …" beside insulation read as wet).
fn saving_as_read(v: &mut Verdict, read: f64) {
    let Some(&(bare_label, bare, _)) = v.figures.first() else {
        return;
    };
    let gain = bare_label == "bare gain";
    for f in v.figures.iter_mut().skip(1) {
        f.0 = match f.0 {
            "insulated loss" => "insulated loss as designed",
            "insulated gain" => "insulated gain as designed",
            "saved" => "saved as designed",
            "gain avoided" => "gain avoided as designed",
            "energy saved" => "energy saved as designed",
            "money saved" => "money saved as designed",
            other => other,
        };
    }
    let (read_label, saved_label) = if gain {
        ("gain as read", "gain avoided as read")
    } else {
        ("loss as read", "saved as read")
    };
    v.figures.splice(
        1..1,
        [
            (read_label, read, Dim::HeatFlow),
            (saved_label, bare - read, Dim::HeatFlow),
        ],
    );
    let cuts = read < bare;
    v.summary = format!(
        "As read: {} As designed: {}",
        if cuts {
            "the insulation still cuts it, by what the reading shows."
        } else {
            "the insulation does not cut it."
        },
        v.summary
    );
    v.ok = v.ok && cuts;
}

/// A k ratio below this is not better insulation but a reading or an input to check (a threshold
/// chosen here: data sheets state k within about ±10 %, from memory).
const IMPLAUSIBLY_LOW: f64 = 0.7;

/// The condition card: passes only as designed, with the uncertainty unable to change that.
pub(crate) fn inspection_verdict(s: &Scenario, i: &Inspection) -> Verdict {
    let what = match i.condition {
        _ if i.k.factor < IMPLAUSIBLY_LOW => "The reading is implausible: the effective conductivity is under 70 % of the data sheet's, and insulation does not do better than its sheet. Check the reading, the emissivities and the inputs.",
        Condition::AsDesigned => "The insulation performs as designed: its effective conductivity is at most 130 % of the data sheet's (common practice).",
        Condition::Degraded => "The insulation is degraded: its effective conductivity is 130 % to 250 % of the data sheet's (common practice thresholds).",
        Condition::Failed => "The insulation is likely wet, damaged or missing in part: its effective conductivity is more than 250 % of the data sheet's (common practice threshold).",
    };
    let mut summary = what.to_string();
    // What the uncertainty leaves open: a verdict that its range could change, a k well below
    // the data sheet's, corners with no answer. Each makes the card one to act on.
    let (lo, hi) = (i.ranges.k_ratio.lo, i.ranges.k_ratio.hi);
    let (c_lo, c_hi) = (Condition::from_ratio(lo), Condition::from_ratio(hi));
    let mut settled = true;
    if c_lo != c_hi {
        settled = false;
        summary.push_str(&format!(
            " Within the uncertainty the condition could be anything from {} to {}: read again (closer, on a tape of known emissivity) before deciding.",
            c_lo.id(),
            c_hi.id()
        ));
    }
    if i.k.factor < IMPLAUSIBLY_LOW {
        settled = false;
    }
    if i.ranges.unexplained > 0 {
        settled = false;
        summary.push_str(&format!(
            " {} of the {} corners of the uncertainty have no answer, so the range is wider than shown.",
            i.ranges.unexplained, i.ranges.corners
        ));
    }
    if !i.corrected.reliable() {
        summary.push_str(" The reading is uncertain: ");
        summary.push_str(
            &i.corrected
                .caveats
                .iter()
                .map(|c| c.text())
                .collect::<Vec<_>>()
                .join("; "),
        );
        summary.push('.');
    }
    // The ranges (corner bounds of the reading's accuracy, the emissivity's uncertainty and the
    // correlations' spread) beside each figure they bound, so a defect stands out from the noise.
    let r = &i.ranges;
    let mut figures = vec![
        ("reading as shown", i.reading.displayed, Dim::Temperature),
        ("surface, corrected", i.corrected.surface, Dim::Temperature),
        ("surface range, low", r.surface.lo, Dim::Temperature),
        ("surface range, high", r.surface.hi, Dim::Temperature),
        ("surface as designed", i.design_surface, Dim::Temperature),
        ("k over data sheet", i.k.factor, Dim::Fraction),
        ("k range, low", r.k_ratio.lo, Dim::Fraction),
        ("k range, high", r.k_ratio.hi, Dim::Fraction),
    ];
    if s.shape.perimeter_over_d().is_some() {
        figures.push(("excess loss per length", i.excess, Dim::HeatFlowPerLength));
    }
    figures.extend([
        ("excess loss of the item", i.excess_total, Dim::HeatFlow),
        ("excess cost per year", i.excess_cost, Dim::MoneyPerYear),
        (
            "excess cost range, low",
            r.excess_cost.lo,
            Dim::MoneyPerYear,
        ),
        (
            "excess cost range, high",
            r.excess_cost.hi,
            Dim::MoneyPerYear,
        ),
    ]);
    Verdict {
        id: "insulation",
        title: "Insulation condition (infrared reading)",
        ok: i.condition == Condition::AsDesigned && settled,
        summary,
        figures,
        thickness: None,
        caution: Some(INSPECTION_CAUTION),
    }
}

/// The inspection's steps of the working, each with its method named.
pub(crate) fn inspection_working(s: &Scenario, i: &Inspection) -> Vec<Step> {
    let g = |v: f64| format_sig(v, 5);
    let c = &i.corrected;
    let r = &i.reading;
    let mut out = vec![Step {
        title: "Infrared reading corrected (band radiance)",
        text: format!(
            "Method after ASTM E1862 (reflected temperature) and ASTM E1933 (emissivity): the instrument set to ε = {} showed {} K compensating a reflected {} K; the signal it received is ε_set·L(T_d) + (1 − ε_set)·L(T_r) = ε_s·L(T_s) + (1 − ε_s)·L(T_r) with the surface's ε_s = {}, L the blackbody radiance over its band {}–{} µm (Planck's law, the exact series Σ e^(−nx)(x³/n + 3x²/n² + 6x/n³ + 6/n⁴) for ∫x³/(eˣ − 1)dx, x = c₂/(λT)). L(T_d) = {} and L(T_r) = {} W/(m²·sr) give L(T_s) = {} W/(m²·sr), inverted by the bracketed solver in {} iterations: T_s = {} K, a correction of {} K. The total-radiation form (σT⁴ in place of L) gives {} K, a cross-check only. Assumed: a grey opaque surface, one uniform reflected temperature (the one the instrument used), air transmitting everything at short range. With the emissivity 0.05 off: {} and {} K.{}",
            g(r.emissivity_set),
            g(r.displayed),
            g(r.reflected),
            g(s.emissivity),
            g(r.band.0 * 1e6),
            g(r.band.1 * 1e6),
            g(c.radiance_displayed),
            g(c.radiance_reflected),
            g(c.radiance_surface),
            c.iterations,
            g(c.surface),
            format_sig(c.correction, 3),
            g(c.total_radiation),
            c.at_lower_emissivity
                .map(g)
                .unwrap_or_else(|| "no answer".into()),
            g(c.at_higher_emissivity),
            if c.reliable() {
                String::new()
            } else {
                format!(
                    " Flagged (common practice thresholds): {}.",
                    c.caveats
                        .iter()
                        .map(|c| c.text())
                        .collect::<Vec<_>>()
                        .join("; ")
                )
            }
        ),
    }];
    out.push(Step {
        title: "Loss at the measured surface",
        text: format!(
            "Convection (the same correlations as the design, at T_s) plus radiation{} at the corrected surface {} K: {} W/m (or W for a sphere) leaves it. As designed the surface is {} K and loses {}.",
            if s.outdoors() { " less the absorbed sun" } else { "" },
            g(c.surface),
            g(i.actual),
            g(i.design_surface),
            g(i.design)
        ),
    });
    out.push(Step {
        title: "Effective conductivity of the outer layer (inverse)",
        text: format!(
            "The measured loss crosses the inside film, the wall and the inner layers as designed, reaching the outer layer's inner face at {} K; the outer layer must carry it, q = f·S·[K(T_in) − K(T_s)] (Kirchhoff transform of the data sheet's k), which gives f = {}. The surface solve with the outer layer's k(T) times f, solved for f by bracketed regula falsi (Anderson–Björck) over ln f in {} iterations, gives f = {} with the solved surface {} K from the measured one.",
            g(i.k.inner_face),
            g(i.k.from_loss),
            i.k.iterations,
            g(i.k.factor),
            format_sig(i.k.residual, 2)
        ),
    });
    out.push(Step {
        title: "Condition and excess against design",
        text: format!(
            "k ratio {} → {} (common practice thresholds: ≤ 1.3 as designed, ≤ 2.5 degraded, above likely wet, damaged or missing). Excess loss |q| − |q_design| = {} W/m (W for a sphere), {} W over the item; energy bought per year = excess × {} h × 3600 s/h ÷ efficiency {} = {} J/yr; at the price given, {} per year.",
            g(i.k.factor),
            i.condition.id(),
            g(i.excess),
            g(i.excess_total),
            g(s.hours),
            g(s.efficiency),
            g(i.excess_energy),
            format_sig(i.excess_cost, 3)
        ),
    });
    let gr = &i.ranges;
    out.push(Step {
        title: "Ranges (bounds by corner evaluation)",
        text: format!(
            "Every corner of reading ± {} K, surface emissivity ± {} and forced convection × {} or × {} (the lowest and highest in-range correlation over the recommended one at the measured surface), each corrected, solved and inverted again; not a statistical interval. Surface {}–{} K, k ratio {}–{}, excess cost {}–{} per year; {} of {} corners explained by no insulation and left out.",
            g(s.ir_accuracy),
            g(s.ir_emissivity_uncertainty),
            format_sig(gr.convection.0, 3),
            format_sig(gr.convection.1, 3),
            g(gr.surface.lo),
            g(gr.surface.hi),
            format_sig(gr.k_ratio.lo, 3),
            format_sig(gr.k_ratio.hi, 3),
            format_sig(gr.excess_cost.lo, 3),
            format_sig(gr.excess_cost.hi, 3),
            gr.unexplained,
            gr.corners
        ),
    });
    out
}
