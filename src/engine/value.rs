//! A part of a saved-work file kept exactly as it was: any JSON value, objects in their written
//! order. The saved-work reader reads a file into this first and then takes what it knows from it,
//! so whatever it does not know is kept aside, never dropped. It crosses to and from text with
//! serde: `serde_json` natively, and on the page the browser's own `JSON.parse` / `JSON.stringify`
//! through `serde-wasm-bindgen` (the wasm carries no JSON text parser).

use std::fmt;

use serde::de::{self, MapAccess, SeqAccess, Visitor};
use serde::ser::{SerializeMap, SerializeSeq};
use serde::{Deserialize, Deserializer, Serialize, Serializer};

#[derive(Debug, Clone, PartialEq)]
pub enum Value {
    Null,
    Bool(bool),
    Number(f64),
    String(String),
    Array(Vec<Value>),
    Object(Vec<(String, Value)>),
}

impl Value {
    pub fn get(&self, key: &str) -> Option<&Value> {
        match self {
            Value::Object(m) => m.iter().find(|(k, _)| k == key).map(|(_, v)| v),
            _ => None,
        }
    }
    pub fn as_str(&self) -> Option<&str> {
        match self {
            Value::String(s) => Some(s),
            _ => None,
        }
    }
    pub fn as_f64(&self) -> Option<f64> {
        match self {
            Value::Number(n) => Some(*n),
            _ => None,
        }
    }
    pub fn as_array(&self) -> Option<&[Value]> {
        match self {
            Value::Array(a) => Some(a),
            _ => None,
        }
    }
}

/// The deepest nesting a file may have: the reader recurses once per level, and a hostile file
/// must not exhaust the stack (checked on the text before it is parsed, see [`too_deep`]).
pub const MAX_DEPTH: usize = 32;

/// Whether a JSON text nests arrays and objects deeper than [`MAX_DEPTH`] (strings skipped).
pub fn too_deep(text: &str) -> bool {
    let (mut depth, mut in_string, mut escaped) = (0usize, false, false);
    for b in text.bytes() {
        if in_string {
            match (escaped, b) {
                (true, _) => escaped = false,
                (false, b'\\') => escaped = true,
                (false, b'"') => in_string = false,
                _ => {}
            }
            continue;
        }
        match b {
            b'"' => in_string = true,
            b'[' | b'{' => {
                depth += 1;
                if depth > MAX_DEPTH {
                    return true;
                }
            }
            b']' | b'}' => depth = depth.saturating_sub(1),
            _ => {}
        }
    }
    false
}

impl Serialize for Value {
    fn serialize<S: Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        match self {
            Value::Null => s.serialize_unit(),
            Value::Bool(b) => s.serialize_bool(*b),
            Value::Number(n) => s.serialize_f64(*n),
            Value::String(t) => s.serialize_str(t),
            Value::Array(a) => {
                let mut seq = s.serialize_seq(Some(a.len()))?;
                for v in a {
                    seq.serialize_element(v)?;
                }
                seq.end()
            }
            Value::Object(m) => {
                let mut map = s.serialize_map(Some(m.len()))?;
                for (k, v) in m {
                    map.serialize_entry(k, v)?;
                }
                map.end()
            }
        }
    }
}

impl<'de> Deserialize<'de> for Value {
    fn deserialize<D: Deserializer<'de>>(d: D) -> Result<Self, D::Error> {
        d.deserialize_any(ValueVisitor)
    }
}

struct ValueVisitor;

impl<'de> Visitor<'de> for ValueVisitor {
    type Value = Value;

    fn expecting(&self, f: &mut fmt::Formatter) -> fmt::Result {
        f.write_str("a JSON value")
    }
    fn visit_unit<E>(self) -> Result<Value, E> {
        Ok(Value::Null)
    }
    fn visit_none<E>(self) -> Result<Value, E> {
        Ok(Value::Null)
    }
    fn visit_bool<E>(self, b: bool) -> Result<Value, E> {
        Ok(Value::Bool(b))
    }
    fn visit_i64<E>(self, n: i64) -> Result<Value, E> {
        Ok(Value::Number(n as f64))
    }
    fn visit_u64<E>(self, n: u64) -> Result<Value, E> {
        Ok(Value::Number(n as f64))
    }
    fn visit_f64<E: de::Error>(self, n: f64) -> Result<Value, E> {
        if n.is_finite() {
            Ok(Value::Number(n))
        } else {
            Err(E::custom("a number too large to keep"))
        }
    }
    fn visit_str<E>(self, s: &str) -> Result<Value, E> {
        Ok(Value::String(s.to_owned()))
    }
    fn visit_string<E>(self, s: String) -> Result<Value, E> {
        Ok(Value::String(s))
    }
    fn visit_seq<A: SeqAccess<'de>>(self, mut seq: A) -> Result<Value, A::Error> {
        let mut out = Vec::new();
        while let Some(v) = seq.next_element()? {
            out.push(v);
        }
        Ok(Value::Array(out))
    }
    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<Value, A::Error> {
        let mut out = Vec::new();
        while let Some((k, v)) = map.next_entry::<String, Value>()? {
            out.push((k, v));
        }
        Ok(Value::Object(out))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Read by `serde_json` (crates.io), the value keeps what RFC 8259 allows, objects in order.
    #[test]
    fn reads_and_writes_what_rfc_8259_allows() {
        let text = r#" {"z": [1, -2.5e3, true, false, null], "s": "x\"\\\/\n\u00e9\ud83d\ude00", "a": {}} "#;
        let v: Value = serde_json::from_str(text).unwrap();
        assert_eq!(
            v.get("z").unwrap().as_array().unwrap()[1].as_f64(),
            Some(-2500.0)
        );
        assert_eq!(v.get("s").unwrap().as_str(), Some("x\"\\/\né😀"));
        let keys: Vec<&str> = match &v {
            Value::Object(m) => m.iter().map(|(k, _)| k.as_str()).collect(),
            _ => vec![],
        };
        assert_eq!(keys, ["z", "s", "a"], "written order kept");
        let again: Value = serde_json::from_str(&serde_json::to_string(&v).unwrap()).unwrap();
        assert_eq!(again, v);
        for bad in [
            "",
            "{",
            "[1,]",
            "01",
            "1.",
            "nul",
            "\"\\ud800\"",
            "[1] 2",
            "1e999",
        ] {
            assert!(serde_json::from_str::<Value>(bad).is_err(), "{bad:?}");
        }
    }

    #[test]
    fn nesting_is_bounded_and_strings_do_not_count() {
        assert!(!too_deep(&("[".repeat(MAX_DEPTH) + &"]".repeat(MAX_DEPTH))));
        assert!(too_deep(
            &("[".repeat(MAX_DEPTH + 1) + &"]".repeat(MAX_DEPTH + 1))
        ));
        let s = format!("[\"{}\\\"{}\"]", "[".repeat(100), "{".repeat(100));
        assert!(!too_deep(&s));
    }
}
