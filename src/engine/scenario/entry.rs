//! What a person typed into one field, and what a unit switch does to it. The page holds one text
//! per field beside its unit; these rules keep the text, the unit and the value the scenario uses
//! in agreement at every moment: either the text reads, in the unit shown, as the value used, or
//! the field carries a message (and the page marks its results stale). A refused entry is never
//! shown as accepted while the last good value computes.

use super::*;

/// Text for a field's value in the unit shown, at the unit's display resolution (what a person
/// would type: 2.37 in, not 2.37402); the scenario keeps full precision. Where rounding would
/// carry the text across one of the field's limits, six figures are shown instead, so the text
/// never reads as refused while its value is used.
pub fn shown_text(spec: &FieldSpec, si: f64, unit: &Unit) -> String {
    let v = unit.from_si(si);
    let text = units::format_value(v, unit);
    if read_field(spec, &text, unit).is_ok() {
        text
    } else {
        format_sig(v, 6)
    }
}

/// A person typed `text` with `unit` shown: the scenario takes the value when it reads, otherwise
/// keeps its last good value and the message is returned for the page to show beside the field.
///
/// The surroundings' temperature, and outdoors the ground's, follow the stream's while each is
/// equal to it (a person who has not set them apart means "the same"), and an infrared reading's
/// reflected temperature follows the stream's or the surroundings'; the fields that followed are
/// returned, for the page to rewrite their texts.
pub fn type_text(
    s: &mut Scenario,
    spec: &FieldSpec,
    text: &str,
    unit: &Unit,
) -> Result<Vec<Field>, String> {
    let si = read_field(spec, text, unit)?;
    let stream = spec.field == Field::FluidTemp;
    let follows = stream && s.t_surround == s.fluid_temp;
    let ground = stream && s.t_ground == s.fluid_temp;
    // The infrared reading's reflected temperature follows the surroundings it stands for (the
    // stream's temperature, or the surroundings' where typed apart) while it equals them.
    let reflected = (stream && s.ir_reflected == s.fluid_temp)
        || (spec.field == Field::Surround && s.ir_reflected == s.t_surround);
    s.set(spec.field, si);
    let mut moved = Vec::new();
    if follows {
        s.t_surround = si;
        moved.push(Field::Surround);
    }
    if ground {
        s.t_ground = si;
        moved.push(Field::GroundTemp);
    }
    if reflected {
        s.ir_reflected = si;
        moved.push(Field::IrReflected);
    }
    Ok(moved)
}

/// A note under a field, where the page should say something about its value (not an error).
pub fn field_note(s: &Scenario, f: Field) -> Option<&'static str> {
    match f {
        Field::Surround if s.uses(f) && s.t_surround != s.fluid_temp => Some(
            "Set apart from the stream's temperature: the surface exchanges radiation with surroundings at this temperature.",
        ),
        Field::GroundTemp if s.uses(f) && s.t_ground != s.fluid_temp => Some(
            "Set apart from the air's temperature: the lower half of the view radiates at this temperature.",
        ),
        _ => None,
    }
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
        return shown_text(spec, s.get(spec.field), to);
    }
    let _ = type_text(s, spec, text, to);
    text.to_string()
}
