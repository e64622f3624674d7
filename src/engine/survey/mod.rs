//! The survey list: many items (each a saved scenario), their results and totals, and the CSV form
//! a spreadsheet opens — one row per item, units in the header row, in the unit system chosen.
//!
//! Columns: `name`, `tag`, `location`; the choice keys of the link (`s`, `ax`, `w`, `f`, `pm`, `hm`,
//! `sm`, `wm`, `nl`; blank where the link leaves them out); then every numeric input as
//! `label (key) [unit id]`, e.g. `Size D (D) [mm]`, `Stream temperature (Ta) [C]` (files with the
//! bare `key [unit id]` of earlier versions still read). A blank cell takes the demo's value.

use crate::engine::error::EngineError;
use crate::engine::scenario::{self, check_field, Scenario, FIELDS};
use crate::engine::store::Saved;
use crate::engine::units::{self, System, UnitChoice};

/// The link keys of the choices, one CSV column each (`hf`, the inside film, was missing: a CSV
/// round trip lost a worked-out inside film and its glycol content).
pub const CHOICE_KEYS: [&str; 10] = ["s", "ax", "w", "f", "pm", "hm", "sm", "wm", "nl", "hf"];

/// One item's figures for the list, SI: heat flow W (run or body), surface K, energy J/yr, cost.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ItemResult {
    pub q_total: f64,
    pub surface_temp: f64,
    pub flags: usize,
    pub annual_energy: f64,
    pub annual_cost: f64,
}

pub fn evaluate_item(s: &Scenario) -> Result<ItemResult, EngineError> {
    let o = scenario::evaluate_with(s, false)?;
    Ok(ItemResult {
        q_total: o.q_total,
        surface_temp: o.surface_temp,
        flags: o.flags.len(),
        annual_energy: o.annual_energy,
        annual_cost: o.annual_cost,
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
pub fn totals(results: &[Result<ItemResult, EngineError>]) -> (f64, f64, f64) {
    results
        .iter()
        .flatten()
        .fold((0.0, 0.0, 0.0), |(q, e, c), r| {
            (q + r.q_total, e + r.annual_energy, c + r.annual_cost)
        })
}

/// A CSV cell, quoted where it must be (RFC 4180).
fn cell(s: &str) -> String {
    if s.contains([',', ';', '"', '\n', '\r']) {
        format!("\"{}\"", s.replace('"', "\"\""))
    } else {
        s.to_string()
    }
}

/// A free-text cell: one that a spreadsheet would take for a formula (=, +, -, @) gets a leading
/// apostrophe, which the import takes off again.
fn text_cell(s: &str) -> String {
    if s.starts_with(['=', '+', '-', '@']) {
        cell(&format!("'{s}"))
    } else {
        cell(s)
    }
}

pub fn header(system: System) -> Vec<String> {
    let c = UnitChoice::for_system(system);
    let mut h: Vec<String> = ["name", "tag", "location"]
        .iter()
        .map(|s| s.to_string())
        .collect();
    h.extend(CHOICE_KEYS.iter().map(|k| k.to_string()));
    h.extend(
        FIELDS
            .iter()
            .map(|f| format!("{} ({}) [{}]", f.label, f.key, c.get(f.dim).id)),
    );
    h
}

/// The whole list as CSV in the unit system chosen.
pub fn to_csv(items: &[Saved], system: System) -> String {
    let c = UnitChoice::for_system(system);
    let mut out = header(system)
        .iter()
        .map(|h| cell(h))
        .collect::<Vec<_>>()
        .join(",");
    out.push_str("\r\n");
    for it in items {
        let Ok((s, _)) = it.scenario() else { continue };
        let link = scenario::to_fragment(&s, system);
        let choice = |k: &str| {
            link.split('&')
                .find_map(|p| p.strip_prefix(&format!("{k}=")))
                .unwrap_or("")
                .to_string()
        };
        let mut row = vec![
            text_cell(&it.name),
            text_cell(&it.tag),
            text_cell(&it.location),
        ];
        row.extend(CHOICE_KEYS.iter().map(|k| cell(&choice(k))));
        row.extend(
            FIELDS
                .iter()
                .map(|f| format!("{}", c.get(f.dim).from_si(s.get(f.field)))),
        );
        out.push_str(&row.join(","));
        out.push_str("\r\n");
    }
    out
}

/// A problem in a CSV file, by line and column (both from 1).
#[derive(Debug, Clone, PartialEq)]
pub struct CsvError {
    pub line: usize,
    pub column: usize,
    pub what: String,
}

impl std::fmt::Display for CsvError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        if self.column == 0 {
            write!(f, "line {}: {}", self.line, self.what)
        } else {
            write!(
                f,
                "line {}, column {}: {}",
                self.line, self.column, self.what
            )
        }
    }
}

/// Split CSV text into records of cells (RFC 4180 quoting; commas or semicolons as separators).
fn records(text: &str) -> Vec<(usize, Vec<String>)> {
    let sep = if text
        .lines()
        .next()
        .is_some_and(|l| l.matches(';').count() > l.matches(',').count())
    {
        ';'
    } else {
        ','
    };
    let mut out = Vec::new();
    let (mut row, mut cell, mut quoted, mut line, mut start) =
        (Vec::new(), String::new(), false, 1usize, 1usize);
    let mut chars = text.trim_start_matches('\u{feff}').chars().peekable();
    while let Some(ch) = chars.next() {
        match (ch, quoted) {
            ('"', true) if chars.peek() == Some(&'"') => {
                chars.next();
                cell.push('"');
            }
            ('"', true) => quoted = false,
            ('"', false) if cell.is_empty() => quoted = true,
            (c, false) if c == sep => row.push(std::mem::take(&mut cell)),
            // A lone CR (old Mac line endings) ends a line too; CR LF counts once.
            ('\r', false) if chars.peek() == Some(&'\n') => {}
            ('\r', false) | ('\n', false) => {
                row.push(std::mem::take(&mut cell));
                if row.iter().any(|c| !c.is_empty()) {
                    out.push((start, std::mem::take(&mut row)));
                } else {
                    row.clear();
                }
                line += 1;
                start = line;
            }
            ('\n', true) => {
                line += 1;
                cell.push('\n');
            }
            (c, _) => cell.push(c),
        }
    }
    row.push(cell);
    if row.iter().any(|c| !c.is_empty()) {
        out.push((start, row));
    }
    out
}

/// The most data rows one CSV import reads.
pub const MAX_ROWS: usize = 10_000;

/// The link key of a field column's header: "Size D (D)" (the label as the page writes it, the
/// key in parentheses) or the bare key "D" of earlier files.
fn column_key(head: &str) -> &str {
    let head = head.trim();
    head.strip_suffix(')')
        .and_then(|h| h.rsplit_once(" ("))
        .map_or(head, |(_, key)| key)
}

/// Read a CSV list. Rows that fail are reported by line and column and left out; the rest are
/// returned. Limits: 10,000 rows, 4 MB. A file that is not text, or has no column of the list's
/// format, is refused whole with a reason; rows past the limit are reported, never dropped
/// silently.
pub fn from_csv(text: &str) -> (Vec<Saved>, Vec<CsvError>) {
    let mut errors = Vec::new();
    if text.len() > 4 * 1024 * 1024 {
        errors.push(CsvError {
            line: 1,
            column: 0,
            what: "the file is larger than 4 MB".into(),
        });
        return (Vec::new(), errors);
    }
    // A file that is not text: NUL bytes, or many control or replacement characters (what a
    // browser makes of binary bytes read as text).
    let odd = text
        .chars()
        .filter(|&c| c == '\u{fffd}' || (c.is_control() && !matches!(c, '\t' | '\r' | '\n')))
        .count();
    if text.contains('\0') || odd * 100 > text.chars().count().max(1) {
        errors.push(CsvError {
            line: 1,
            column: 0,
            what: "not a text file".into(),
        });
        return (Vec::new(), errors);
    }
    let recs = records(text);
    let Some((hl, head)) = recs.first() else {
        errors.push(CsvError {
            line: 1,
            column: 0,
            what: "the file is empty".into(),
        });
        return (Vec::new(), errors);
    };
    // What each column is: a text column, a choice key, or a field with its unit.
    enum Col {
        Text(usize),
        Choice(&'static str),
        Field(&'static scenario::FieldSpec, &'static units::Unit),
        Skip,
    }
    let mut cols = Vec::new();
    for (j, h) in head.iter().enumerate() {
        let h = h.trim();
        let col = if let Some(i) = ["name", "tag", "location"].iter().position(|k| *k == h) {
            Col::Text(i)
        } else if let Some(k) = CHOICE_KEYS.iter().find(|k| **k == h) {
            Col::Choice(k)
        } else if let Some((key, unit)) = h
            .rsplit_once(" [")
            .and_then(|(k, u)| u.strip_suffix(']').map(|u| (column_key(k), u)))
        {
            match (FIELDS.iter().find(|f| f.key == key), units::unit(unit)) {
                (Some(f), Some(u)) if u.dim == f.dim => Col::Field(f, u),
                (Some(_), _) => {
                    errors.push(CsvError {
                        line: *hl,
                        column: j + 1,
                        what: format!("unknown unit “{unit}” for {key}; the column is ignored"),
                    });
                    Col::Skip
                }
                _ => Col::Skip,
            }
        } else {
            Col::Skip
        };
        cols.push(col);
    }
    if !cols
        .iter()
        .any(|c| matches!(c, Col::Field(..) | Col::Choice(_)))
    {
        errors.push(CsvError {
            line: *hl,
            column: 0,
            what: "no column of the list's format in the first line; nothing imported".into(),
        });
        return (Vec::new(), errors);
    }
    if recs.len() - 1 > MAX_ROWS {
        errors.push(CsvError {
            line: recs[MAX_ROWS + 1].0,
            column: 0,
            what: format!(
                "only the first {MAX_ROWS} rows are read; {} more left out",
                recs.len() - 1 - MAX_ROWS
            ),
        });
    }
    let mut items = Vec::new();
    for (line, rec) in recs.iter().skip(1).take(MAX_ROWS) {
        let mut texts = [String::new(), String::new(), String::new()];
        let mut frag = format!("v={}", scenario::LINK_VERSION);
        let mut bad = false;
        for (j, (col, v)) in cols.iter().zip(rec.iter()).enumerate() {
            let v = v.trim();
            match col {
                Col::Text(i) => {
                    texts[*i] = v
                        .strip_prefix('\'')
                        .filter(|r| r.starts_with(['=', '+', '-', '@']))
                        .unwrap_or(v)
                        .to_string()
                }
                Col::Choice(k) if !v.is_empty() => {
                    let one = format!("v={}&{k}={v}", scenario::LINK_VERSION);
                    if let Err(e) = scenario::from_fragment(&one) {
                        errors.push(CsvError {
                            line: *line,
                            column: j + 1,
                            what: e.replace("the link", "the cell"),
                        });
                        bad = true;
                    } else {
                        frag.push_str(&format!("&{k}={v}"));
                    }
                }
                Col::Field(f, u) if !v.is_empty() => match scenario::read_field(f, v, u) {
                    Ok(si) => frag.push_str(&format!("&{}={si}", f.key)),
                    Err(e) => {
                        errors.push(CsvError {
                            line: *line,
                            column: j + 1,
                            what: format!("{}: {e}", f.label),
                        });
                        bad = true;
                    }
                },
                _ => {}
            }
        }
        if bad {
            continue;
        }
        let name = if texts[0].is_empty() {
            format!("Row {line}")
        } else {
            texts[0].clone()
        };
        match scenario::from_fragment(&frag) {
            Ok((s, sys)) => {
                // Every value was checked against its field's limits above; check once more.
                debug_assert!(FIELDS.iter().all(|f| check_field(
                    f,
                    s.get(f.field),
                    units::units_of(f.dim).next().unwrap()
                )
                .is_ok()));
                items.push(Saved::new(&name, &texts[1], &texts[2], &s, sys));
            }
            Err(e) => errors.push(CsvError {
                line: *line,
                column: 0,
                what: e,
            }),
        }
    }
    (items, errors)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::engine::scenario::{SurfaceMode, DEMO};

    /// Regression: a binary file imported as "765 rows" of the demo, and a text file of another
    /// format would too. Both are refused whole, with a reason.
    #[test]
    fn junk_is_refused_with_a_reason() {
        let binary: String = (0..20_000u32)
            .map(|i| char::from_u32((i * 7919) % 256).unwrap_or('\u{fffd}'))
            .collect();
        let (rows, errors) = from_csv(&binary);
        assert!(rows.is_empty());
        assert!(errors[0].what.contains("not a text file"), "{}", errors[0]);
        let (rows, errors) = from_csv("date,amount\n2026-01-01,12\n2026-01-02,13\n");
        assert!(rows.is_empty());
        assert!(errors[0].what.contains("no column"), "{}", errors[0]);
    }

    /// Regression: CR-only line endings read as one line ("0 rows", no reason), and a lone CR
    /// merged two rows.
    #[test]
    fn cr_only_line_endings_read_as_lines() {
        let lf = to_csv(&items(), System::Si).replace("\r\n", "\n");
        let cr = lf.replace('\n', "\r");
        let (rows, errors) = from_csv(&cr);
        assert!(errors.is_empty(), "{errors:?}");
        assert_eq!(rows.len(), items().len());
        let (rows, _) = from_csv(&lf);
        assert_eq!(rows.len(), items().len());
    }

    /// Regression: a 10,001-row file dropped its last row without a word.
    #[test]
    fn rows_past_the_limit_are_reported() {
        let one = to_csv(&items()[..1], System::Si);
        let (head, row) = one.split_once("\r\n").unwrap();
        let mut text = format!("{head}\r\n");
        for _ in 0..=MAX_ROWS {
            text.push_str(row);
        }
        let (rows, errors) = from_csv(&text);
        assert_eq!(rows.len(), MAX_ROWS);
        assert_eq!(errors.len(), 1);
        assert!(errors[0].what.contains("1 more left out"), "{}", errors[0]);
    }

    fn items() -> Vec<Saved> {
        let mut b = DEMO;
        b.surface_mode = SurfaceMode::Solved;
        b.layer_count = 2;
        vec![
            Saved::new("Roof line, A", "L-101", "Roof \"east\"", &DEMO, System::Si),
            Saved::new(
                "Boiler feed",
                "=HYPERLINK(1)",
                "Plant room; level -1",
                &b,
                System::Si,
            ),
        ]
    }

    #[test]
    fn csv_round_trips_in_both_systems() {
        for sys in [System::Si, System::Us] {
            let text = to_csv(&items(), sys);
            let (back, errors) = from_csv(&text);
            assert!(errors.is_empty(), "{errors:?}");
            assert_eq!(back.len(), 2);
            for (a, b) in items().iter().zip(&back) {
                assert_eq!(
                    (&a.name, &a.tag, &a.location),
                    (&b.name, &b.tag, &b.location)
                );
                let (sa, sb) = (a.scenario().unwrap().0, b.scenario().unwrap().0);
                assert_eq!(
                    (sa.shape, sa.surface_mode, sa.layer_count),
                    (sb.shape, sb.surface_mode, sb.layer_count)
                );
                for f in FIELDS.iter() {
                    let (x, y) = (sa.get(f.field), sb.get(f.field));
                    assert!(
                        (x - y).abs() <= 1e-12 * x.abs().max(1e-300),
                        "{}: {x} vs {y}",
                        f.key
                    );
                }
            }
        }
    }

    #[test]
    fn formula_like_text_is_neutralised_in_the_file() {
        let text = to_csv(&items(), System::Si);
        assert!(text.contains("'=HYPERLINK(1)") && !text.contains(",=HYPERLINK"));
    }

    #[test]
    fn bad_rows_are_reported_by_line_and_column_and_the_rest_import() {
        let mut text = to_csv(&items(), System::Si);
        let head = text.lines().next().unwrap().to_string();
        let d_col = head
            .split(',')
            .position(|h| h == "Size D (D) [mm]")
            .unwrap()
            + 1;
        let mut row = vec![String::new(); d_col];
        row[0] = "Broken".into();
        row[d_col - 1] = "-5".into();
        text.push_str(&(row.join(",") + "\r\n"));
        text.push_str("Bad shape,,,cube\r\n");
        let (back, errors) = from_csv(&text);
        assert_eq!(back.len(), 2);
        assert_eq!(errors.len(), 2, "{errors:?}");
        assert_eq!((errors[0].line, errors[0].column), (4, d_col));
        assert!(errors[0].to_string().contains("line 4, column"));
        assert_eq!((errors[1].line, errors[1].column), (5, 4));
    }

    #[test]
    fn a_spreadsheet_with_semicolons_and_decimal_commas_reads() {
        let text = "name;D [mm];U [m/s]\nSmall;33,4;3\n";
        let (back, errors) = from_csv(text);
        assert!(errors.is_empty(), "{errors:?}");
        assert_eq!(back[0].scenario().unwrap().0.diameter, 0.0334);
    }

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
            .map(|i| evaluate_item(&i.scenario().unwrap().0))
            .collect();
        let (q, e, c) = totals(&rs);
        let want: f64 = rs.iter().map(|r| r.as_ref().unwrap().q_total).sum();
        assert_eq!(q, want);
        assert!(e > 0.0 && c > 0.0);
    }
}
