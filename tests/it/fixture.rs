//! Reading the CSV fixtures in tests/data: `#` header lines (source, kind, units), a column row,
//! then numbers.

use std::collections::HashMap;

pub struct Table {
    pub header: Vec<String>,
    pub rows: Vec<HashMap<String, f64>>,
}

pub fn load(name: &str) -> Table {
    let path = format!("{}/tests/data/{name}", env!("CARGO_MANIFEST_DIR"));
    let text = std::fs::read_to_string(&path).unwrap_or_else(|e| panic!("{path}: {e}"));
    let mut header = Vec::new();
    let mut columns: Vec<String> = Vec::new();
    let mut rows = Vec::new();
    for line in text.lines().filter(|l| !l.trim().is_empty()) {
        if let Some(h) = line.strip_prefix('#') {
            header.push(h.trim().to_string());
        } else if columns.is_empty() {
            columns = line.split(',').map(|c| c.trim().to_string()).collect();
        } else {
            let row = columns
                .iter()
                .zip(line.split(','))
                .map(|(c, v)| {
                    (
                        c.clone(),
                        v.trim()
                            .parse::<f64>()
                            .unwrap_or_else(|_| panic!("{name}: bad number {v}")),
                    )
                })
                .collect();
            rows.push(row);
        }
    }
    assert!(
        header.iter().any(|h| h.starts_with("source:")),
        "{name} names no source"
    );
    assert!(!rows.is_empty(), "{name} has no rows");
    Table { header, rows }
}
