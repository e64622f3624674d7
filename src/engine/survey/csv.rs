//! The survey list's CSV form, the one a spreadsheet opens: one row per item, units in the
//! header row, in the unit system chosen.
//!
//! Columns: `name`, `tag`, `location`; the choice keys of the link (`s`, `ax`, `w`, `f`, `pm`, `hm`,
//! `sm`, `wm`, `nl`, `hf`, `env`, `tc`; blank where the link leaves them out); then every numeric input as
//! `label (key) [unit id]`, e.g. `Size D (D) [mm]`, `Stream temperature (Ta) [C]` (files with the
//! bare `key [unit id]` of earlier versions still read), blank where the item does not use it;
//! then the results (`Result: …`, an infrared reading's four among them) and verdicts
//! (`Verdict: …`), which the import ignores; last
//! the item's `link`. A cell that still shows what the export wrote keeps the link's full
//! precision; a changed cell wins; a blank cell takes the link's value, or the demo's.

use crate::engine::scenario::{self, check_field, Scenario, FIELDS};
use crate::engine::store::Saved;
use crate::engine::units::{self, Dim, System, UnitChoice};

use super::{evaluate_item, Figure, Figures};

/// The link keys of the choices, one CSV column each (`hf`, the inside film, was missing: a CSV
/// round trip lost a worked-out inside film and its glycol content; `env` and `tc`, outdoors and
/// its terrain category, are blank indoors; `hk`, what the heat made inside is given as, is blank
/// unless the body makes heat).
pub const CHOICE_KEYS: [&str; 13] = [
    "s", "ax", "w", "f", "pm", "hm", "sm", "hk", "wm", "nl", "hf", "env", "tc",
];

/// The verdict columns of the CSV: the card's id and the column's heading.
const VERDICT_COLUMNS: [(&str, &str); 7] = [
    ("touch", "touch"),
    ("dew", "condensation"),
    ("freeze", "freezing"),
    ("flow", "outlet"),
    ("loss", "loss target"),
    ("cooling", "cooling"),
    ("insulation", "insulation condition"),
];

/// How many result cells come before the verdicts: five figures, the range notes and the
/// inspection's four (blank unless the item was read with an infrared instrument).
const RESULT_CELLS: usize = 10;

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
    let unit = |d: Dim| c.get(d).id;
    h.extend([
        format!(
            "Result: heat loss per length [{}]",
            unit(Dim::HeatFlowPerLength)
        ),
        format!("Result: heat loss of the item [{}]", unit(Dim::HeatFlow)),
        format!("Result: surface temperature [{}]", unit(Dim::Temperature)),
        format!("Result: energy per year [{}]", unit(Dim::EnergyPerYear)),
        format!("Result: cost per year [{}]", unit(Dim::MoneyPerYear)),
        "Result: range notes".to_string(),
        format!(
            "Result: surface from the infrared reading [{}]",
            unit(Dim::Temperature)
        ),
        "Result: outer layer k over data sheet".to_string(),
        "Result: insulation condition".to_string(),
        format!(
            "Result: excess cost per year against design [{}]",
            unit(Dim::MoneyPerYear)
        ),
    ]);
    h.extend(
        VERDICT_COLUMNS
            .iter()
            .map(|(_, name)| format!("Verdict: {name}")),
    );
    h.push("Result: error".to_string());
    h.push("link".to_string());
    h
}

/// The result and verdict cells of one item, rounded as the page shows them: blank where a
/// figure does not apply, "ok" or "attention" per verdict, the reason where it did not compute.
fn result_cells(r: &Figure, c: &UnitChoice) -> Vec<String> {
    let v = |x: f64, d: Dim| {
        let u = c.get(d);
        units::format_value(u.from_si(x), u)
    };
    match r {
        Ok(r) => {
            let mut out = vec![
                r.q_per_length
                    .map(|q| v(q, Dim::HeatFlowPerLength))
                    .unwrap_or_default(),
                v(r.q_total, Dim::HeatFlow),
                v(r.surface_temp, Dim::Temperature),
                v(r.annual_energy, Dim::EnergyPerYear),
                v(r.annual_cost, Dim::MoneyPerYear),
                r.flags.to_string(),
            ];
            match &r.inspection {
                Some(i) => out.extend([
                    v(i.surface, Dim::Temperature),
                    units::format_value(i.k_ratio, c.get(Dim::Ratio)),
                    cell(i.condition.id()),
                    v(i.excess_cost, Dim::MoneyPerYear),
                ]),
                None => out.extend(std::iter::repeat_n(String::new(), 4)),
            }
            out.extend(VERDICT_COLUMNS.iter().map(|(id, _)| {
                match r.verdicts.iter().find(|(v, _)| v == id) {
                    Some((_, true)) => "ok".to_string(),
                    Some((_, false)) => "attention".to_string(),
                    None => String::new(),
                }
            }));
            out.push(String::new());
            out
        }
        Err(why) => {
            let mut out = vec![String::new(); RESULT_CELLS + VERDICT_COLUMNS.len()];
            out.push(cell(why));
            out
        }
    }
}

/// The whole list as CSV in the unit system chosen: each item's inputs (only those it uses,
/// rounded as the page shows them), its results and verdicts, and its link, which carries the
/// inputs at full precision (the import takes the link's value where a cell still shows it).
/// Results come from `figures` where known and are computed here otherwise.
pub fn to_csv(items: &[Saved], system: System, figures: &Figures) -> String {
    let c = UnitChoice::for_system(system);
    let mut out = header(system)
        .iter()
        .map(|h| cell(h))
        .collect::<Vec<_>>()
        .join(",");
    out.push_str("\r\n");
    let mut computed: std::collections::HashMap<String, Figure> = Default::default();
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
        row.extend(FIELDS.iter().map(|f| {
            if s.uses(f.field) {
                let u = c.get(f.dim);
                units::format_value(u.from_si(s.get(f.field)), u)
            } else {
                String::new()
            }
        }));
        // Items alike (one link) are computed once.
        let r = match figures.get(&it.link) {
            Some(r) => r,
            None => computed
                .entry(it.link.clone())
                .or_insert_with(|| evaluate_item(&s).map_err(|e| e.to_string())),
        };
        row.extend(result_cells(r, &c));
        row.push(cell(&link));
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
/// returned. Limits: 10,000 rows, 8 MB (a full row with its results and link runs to about 500
/// bytes: 4 MB no longer held 10,000 of them once the outdoor and heat-made columns came). A file that is not text, or has no column of the list's
/// format, is refused whole with a reason; rows past the limit are reported, never dropped
/// silently.
pub fn from_csv(text: &str) -> (Vec<Saved>, Vec<CsvError>) {
    let mut errors = Vec::new();
    if text.len() > 8 * 1024 * 1024 {
        errors.push(CsvError {
            line: 1,
            column: 0,
            what: "the file is larger than 8 MB".into(),
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
        /// The item's link: its inputs at full precision.
        Link,
        Skip,
    }
    let mut cols = Vec::new();
    for (j, h) in head.iter().enumerate() {
        let h = h.trim();
        let col = if let Some(i) = ["name", "tag", "location"].iter().position(|k| *k == h) {
            Col::Text(i)
        } else if h == "link" {
            Col::Link
        } else if let Some(k) = CHOICE_KEYS.iter().find(|k| **k == h) {
            Col::Choice(k)
        } else if let Some((key, unit)) = h
            .rsplit_once(" [")
            .and_then(|(k, u)| u.strip_suffix(']').map(|u| (column_key(k), u)))
        {
            match (FIELDS.iter().find(|f| f.key == key), units::unit(unit)) {
                (Some(f), Some(u)) if units::same_quantity(u.dim, f.dim) => Col::Field(f, u),
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
        // The link, where the row has one that reads, is the start: a cell that still shows
        // what the export wrote keeps the link's full precision; a cell changed since wins.
        let mut base: Option<Scenario> = None;
        if let Some((j, l)) = cols
            .iter()
            .zip(rec.iter())
            .enumerate()
            .find_map(|(j, (c, v))| matches!(c, Col::Link).then_some((j, v.trim())))
            .filter(|(_, l)| !l.is_empty())
        {
            match scenario::from_fragment(l) {
                Ok((s, _)) => {
                    frag = l.trim_start_matches('#').to_string();
                    base = Some(s);
                }
                Err(e) => errors.push(CsvError {
                    line: *line,
                    column: j + 1,
                    what: format!(
                        "{}; the row's other cells were read instead",
                        e.replace("the link", "the link cell")
                    ),
                }),
            }
        }
        let base_link = base.as_ref().map(|_| frag.clone()).unwrap_or_default();
        for (j, (col, v)) in cols.iter().zip(rec.iter()).enumerate() {
            let v = v.trim();
            let unchanged = |text: String| base.is_some() && v == text;
            match col {
                Col::Text(i) => {
                    texts[*i] = v
                        .strip_prefix('\'')
                        .filter(|r| r.starts_with(['=', '+', '-', '@']))
                        .unwrap_or(v)
                        .to_string()
                }
                Col::Choice(k)
                    if !v.is_empty()
                        && !(base.is_some()
                            && base_link.split('&').any(|p| p == format!("{k}={v}"))) =>
                {
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
                Col::Field(f, u)
                    if !v.is_empty()
                        && !unchanged(units::format_value(
                            u.from_si(base.as_ref().map_or(0.0, |b| b.get(f.field))),
                            u,
                        )) =>
                {
                    match scenario::read_field(f, v, u) {
                        Ok(si) => frag.push_str(&format!("&{}={si}", f.key)),
                        Err(e) => {
                            errors.push(CsvError {
                                line: *line,
                                column: j + 1,
                                what: format!("{}: {e}", f.label),
                            });
                            bad = true;
                        }
                    }
                }
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
pub(super) mod tests {
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
        let lf = to_csv(&items(), System::Si, &Figures::default()).replace("\r\n", "\n");
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
        let one = to_csv(&items()[..1], System::Si, &Figures::default());
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

    pub(crate) fn items() -> Vec<Saved> {
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
            let text = to_csv(&items(), sys, &Figures::default());
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

    /// The survey CSV carries each item's results and verdicts after its inputs, leaves the
    /// inputs it does not use blank, rounds as the page does, and still round-trips exactly
    /// through the link column; a cell changed in a spreadsheet wins over the link.
    #[test]
    fn the_csv_carries_results_and_an_edited_cell_wins_over_the_link() {
        let text = to_csv(&items(), System::Si, &Figures::default());
        let rows: Vec<Vec<String>> = records(&text).into_iter().map(|(_, r)| r).collect();
        let head = &rows[0];
        let col = |name: &str| head.iter().position(|h| h == name).unwrap();
        let boiler = rows.iter().find(|r| r[0] == "Boiler feed").unwrap();
        let r = evaluate_item(&items()[1].scenario().unwrap().0).unwrap();
        // Results as the page rounds them (loss per length to three figures, in W/m).
        let q = &boiler[col("Result: heat loss per length [W/m]")];
        assert_eq!(
            *q,
            units::format_value(r.q_per_length.unwrap(), units::unit("W/m").unwrap())
        );
        assert!(!boiler[col("Result: surface temperature [C]")].is_empty());
        assert!(["ok", "attention"].contains(&boiler[col("Verdict: touch")].as_str()));
        // The demo gives the surface: the layer inputs it does not use are blank.
        let demo = rows.iter().find(|r| r[0] == "Roof line, A").unwrap();
        assert_eq!(demo[col("Layer 1 thickness (t1) [mm]")], "");
        assert!(!demo[col("Size D (D) [mm]")].is_empty());
        // Edit D in the boiler row: the edited cell wins; untouched cells keep the link's
        // full-precision values.
        let d = col("Size D (D) [mm]");
        let edited: String = text
            .lines()
            .map(|l| {
                if l.starts_with("Boiler feed") {
                    let mut c: Vec<&str> = l.split(',').collect();
                    c[d] = "88.9";
                    c.join(",")
                } else {
                    l.to_string()
                }
            })
            .collect::<Vec<_>>()
            .join("\r\n");
        let (back, errors) = from_csv(&edited);
        assert!(errors.is_empty(), "{errors:?}");
        let b = back[1].scenario().unwrap().0;
        assert!((b.diameter - 0.0889).abs() < 1e-12);
        let orig = items()[1].scenario().unwrap().0;
        assert_eq!(b.fluid_temp, orig.fluid_temp);
        assert_eq!(b.process_temp, orig.process_temp);
    }

    #[test]
    fn formula_like_text_is_neutralised_in_the_file() {
        let text = to_csv(&items(), System::Si, &Figures::default());
        assert!(text.contains("'=HYPERLINK(1)") && !text.contains(",=HYPERLINK"));
    }

    #[test]
    fn bad_rows_are_reported_by_line_and_column_and_the_rest_import() {
        let mut text = to_csv(&items(), System::Si, &Figures::default());
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
}
