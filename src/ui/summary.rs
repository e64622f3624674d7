//! The survey as text: one item's figures as its list row writes them, and the printed summary of
//! the whole survey (every item worst first, its verdicts, the totals). Markup only; the figures
//! come from `survey`, the words for each unit from `units`.

use std::fmt::Write;

use crate::engine::chart::svg::esc;
use crate::engine::inspect::{Condition, AS_DESIGNED_MAX, DEGRADED_MAX};
use crate::engine::store::Saved;
use crate::engine::survey::{self, Figure};
use crate::engine::units::{show, Dim, UnitChoice};

/// An item's figures in the chosen units: heat flow, surface, checks, range notes. An inspected
/// item shows its loss and surface as read (the design's are in the item), the instrument's own
/// reading beside the corrected surface, and its insulation's condition, k ratio and excess cost.
pub(super) fn cells(res: &Figure, c: &UnitChoice) -> [String; 4] {
    let f = |v: f64, d: Dim| show(v, c.get(d));
    match res {
        Ok(r) => match &r.inspection {
            Some(i) => [
                format!("{} read", f(i.loss, Dim::HeatFlow)),
                format!(
                    "{} read (IR {})",
                    f(i.surface, Dim::Temperature),
                    f(i.reading, Dim::Temperature)
                ),
                format!(
                    "{} · {} · k {} · {} over design",
                    super::answer::failing(&r.verdicts),
                    i.condition.id(),
                    f(i.k_ratio, Dim::Fraction),
                    f(i.excess_cost, Dim::MoneyPerYear)
                ),
                range(r.flags),
            ],
            None => [
                f(r.q_total, Dim::HeatFlow),
                f(r.surface_temp, Dim::Temperature),
                super::answer::failing(&r.verdicts),
                range(r.flags),
            ],
        },
        // Why, in the person's units, is on the page once the item is opened.
        Err(_) => [
            "⚠ not computed: open it to see why".into(),
            "—".into(),
            "—".into(),
            "—".into(),
        ],
    }
}

fn range(flags: usize) -> String {
    if flags == 0 {
        "✓".into()
    } else {
        format!("⚠ {flags}")
    }
}

/// The item's tag and place, "L-7 · North rack", or nothing.
pub(super) fn sub(it: &Saved) -> String {
    [it.tag.as_str(), it.location.as_str()]
        .iter()
        .filter(|x| !x.is_empty())
        .cloned()
        .collect::<Vec<_>>()
        .join(" · ")
}

/// The totals line: heat flow, energy and cost a year of the items that computed, and for an
/// inspection round what its defects lose over design.
pub(super) fn totals<'a>(
    rows: impl Iterator<Item = &'a (Saved, Figure)> + Clone,
    c: &UnitChoice,
) -> (String, String, String) {
    let n = rows.clone().count();
    let computed = rows.clone().filter(|(_, r)| r.is_ok()).count();
    let (q, e, m) = survey::totals(rows.clone().map(|(_, r)| r));
    let (read, xq, xm) = survey::inspection_totals(rows.map(|(_, r)| r));
    let u = |v: f64, d: Dim| show(v, c.get(d));
    let head = if computed < n {
        format!("Total of {computed} of {n} item(s), the others not computed")
    } else {
        format!("Total of {n} item(s)")
    };
    let mut rest = format!("{} · {}", u(e, Dim::EnergyPerYear), u(m, Dim::MoneyPerYear));
    if read > 0 {
        let _ = write!(
            rest,
            " · {read} read with infrared: {} and {} over design",
            u(xq, Dim::HeatFlow),
            u(xm, Dim::MoneyPerYear)
        );
    }
    (head, u(q, Dim::HeatFlow), rest)
}

/// The printed survey summary: every item worst first (inspected items by what their defects
/// cost), its figures and checks, the totals, how many inspected items fall in each condition,
/// and the standing note. `date` is "2026-12-05 11:05 (UTC+01:00)", the device's clock.
pub fn summary(rows: &[(Saved, Figure)], c: &UnitChoice, date: &str) -> String {
    // Sorted by reference, as the list sorts (one sort in the page's code, nothing cloned).
    let mut rows: Vec<&(Saved, Figure)> = rows.iter().collect();
    survey::worst_first(&mut rows);
    let mut m = String::with_capacity(400 + 300 * rows.len());
    let _ = write!(
        m,
        r#"<h1>Leeward survey summary</h1><p class="meta">{} · {} item(s), worst first: items read with infrared by what their defects cost a year over design, then the others by heat loss</p><table><thead><tr><th>Item</th><th>Heat loss</th><th>Surface</th><th>Checks</th><th>Range notes</th></tr></thead><tbody>"#,
        esc(date),
        rows.len()
    );
    for (it, res) in &rows {
        let [loss, surface, checks, range] = cells(res, c);
        let _ = write!(
            m,
            "<tr><td>{}<br><small>{}</small></td><td>{}</td><td>{}</td><td>{}</td><td>{}</td></tr>",
            esc(&it.name),
            esc(&sub(it)),
            esc(&loss),
            esc(&surface),
            esc(&checks),
            esc(&range)
        );
    }
    let (head, q, rest) = totals(rows.iter().copied(), c);
    let _ = write!(
        m,
        r#"</tbody><tfoot><tr><th>{}</th><td>{}</td><td colspan="3">{}</td></tr></tfoot></table>"#,
        esc(&head),
        esc(&q),
        esc(&rest)
    );
    let count = |k: Condition| {
        rows.iter()
            .filter(|(_, r)| {
                r.as_ref()
                    .is_ok_and(|r| r.inspection.is_some_and(|i| i.condition == k))
            })
            .count()
    };
    let pct = |f: f64| show(f, c.get(Dim::Fraction));
    let counts = [
        Condition::AsDesigned,
        Condition::Degraded,
        Condition::Failed,
    ]
    .map(count);
    if counts.iter().sum::<usize>() > 0 {
        let _ = write!(
            m,
            r#"<p class="meta">Insulation read with infrared: {} as designed (k up to {} of the data sheet's), {} degraded (up to {}), {} likely wet, damaged or missing (above {}); the thresholds are common practice.</p>"#,
            counts[0],
            pct(AS_DESIGNED_MAX),
            counts[1],
            pct(DEGRADED_MAX),
            counts[2],
            pct(DEGRADED_MAX)
        );
    }
    m.push_str(r#"<p class="meta">Results are engineering estimates from published correlations; each item's one-page report gives its inputs, working and cautions. Local codes and licensed practice govern any decision about safety.</p>"#);
    m
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::engine::scenario::{SurfaceMode, DEMO};
    use crate::engine::units::System;

    fn item(name: &str, s: &crate::engine::scenario::Scenario) -> (Saved, Figure) {
        let it = Saved::new(name, "L-1", "<roof>", s, System::Si);
        let f = survey::evaluate_item(s).map_err(|e| e.to_string());
        (it, f)
    }

    /// The summary lists every item once, worst first, escapes what people typed, totals the
    /// round and counts the inspected items by condition.
    #[test]
    fn the_summary_lists_every_item_worst_first_with_totals() {
        let small = {
            let mut s = DEMO;
            s.diameter = 0.02;
            s
        };
        let big = {
            let mut s = DEMO;
            s.diameter = 0.2;
            s
        };
        let rows = vec![item("Small <b>", &small), item("Big", &big)];
        let c = UnitChoice::for_system(System::Si);
        let m = summary(&rows, &c, "2026-12-05 10:05");
        assert!(
            m.find("Big").unwrap() < m.find("Small &lt;b&gt;").unwrap(),
            "{m}"
        );
        assert!(!m.contains("<b>") && !m.contains("<roof>") && m.contains("&lt;roof&gt;"));
        assert!(m.contains("Total of 2 item(s)"), "{m}");
        assert!(
            !m.contains("Insulation read with infrared"),
            "no inspection, no counts: {m}"
        );
        assert_eq!(m.matches("<tr>").count(), 4, "head, two items, totals");
        assert_eq!(m.matches('<').count(), m.matches('>').count());
        assert!(!m.contains("NaN") && !m.replace("infrared", "").contains("inf"));
    }

    /// An inspected item's row shows the instrument's reading beside the corrected surface and
    /// its condition; the summary counts it.
    #[test]
    fn an_inspected_item_shows_its_reading_and_condition() {
        let (s, _) = crate::engine::scenario::from_fragment(
            "v=1&s=cyl&ax=h&w=h&f=humid&pm=p&hm=rh&sm=r&nl=1&wm=cs&D=0.0603&L=12&U=8&Ta=263.15&Tr=263.15&p=101325&rh=0.8&Tp=423.15&t1=0.03&ka1=0.04&kb1=0.06&Tka=283.15&Tkb=373.15&qt=40&Tir=277.15&Trf=263.15&u=si",
        )
        .expect("link");
        assert_eq!(s.surface_mode, SurfaceMode::Reading);
        let rows = vec![item("Jacket", &s)];
        let c = UnitChoice::for_system(System::Si);
        let [_, surface, checks, _] = cells(&rows[0].1, &c);
        assert!(surface.contains("(IR 4.0 °C)"), "{surface}");
        let cond = rows[0].1.as_ref().unwrap().inspection.unwrap().condition;
        assert!(checks.contains(cond.id()), "{checks}");
        let m = summary(&rows, &c, "2026-12-05 10:05");
        assert!(m.contains("Insulation read with infrared"), "{m}");
        // The thresholds as the inspection judges them (1.3 and 2.5 times the data sheet's k).
        assert!(
            m.contains("up to 130 %") && m.contains("above 250 %"),
            "{m}"
        );
    }
}
