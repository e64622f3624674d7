//! What a person typed into one field, and what a unit switch does to it. The page holds one text
//! per field beside its unit; these rules keep the text, the unit and the value the scenario uses
//! in agreement at every moment: either the text reads, in the unit shown, as the value used, or
//! the field carries a message (and the page marks its results stale). A refused entry is never
//! shown as accepted while the last good value computes.

use super::*;

/// Text for a field's value in the unit shown, trimmed to sensible digits (display only; the
/// scenario keeps full precision).
pub fn shown_text(si: f64, unit: &Unit) -> String {
    format_sig(unit.from_si(si), 6)
}

/// A person typed `text` with `unit` shown: the scenario takes the value when it reads, otherwise
/// keeps its last good value and the message is returned for the page to show beside the field.
pub fn type_text(
    s: &mut Scenario,
    spec: &FieldSpec,
    text: &str,
    unit: &Unit,
) -> Result<(), String> {
    let si = read_field(spec, text, unit)?;
    s.set(spec.field, si);
    Ok(())
}

/// The unit shown beside a field changes from `from` to `to`; returns the field's new text.
///
/// - A text that reads in the old unit is rewritten in the new one from the value used (full
///   precision kept; the value does not change).
/// - A refused text is kept as typed and read again in the new unit: used when it now reads
///   ("150" refused in m, then mm chosen, is 150 mm); still refused otherwise, its message now in
///   the new unit.
pub fn switch_unit(
    s: &mut Scenario,
    spec: &FieldSpec,
    text: &str,
    from: &Unit,
    to: &Unit,
) -> String {
    if from == to {
        return text.to_string();
    }
    if read_field(spec, text, from).is_ok() {
        return shown_text(s.get(spec.field), to);
    }
    let _ = type_text(s, spec, text, to);
    text.to_string()
}
