//! A piece of a survey (`survey --shard K/N --json`) as `merge` streams it:
//! the [`Layout`] of its `"results"` (each a [`SurveyResult`]) and of its
//! `"counterexamples"` (each a [`Counterexample`]), and their text in the
//! merged survey.
//!
//! A result's normal form and a counterexample's negative coefficients are
//! re-written compact as they are read (serde_json's own text for the value,
//! the text a whole run prints), never built as a tree of values; each is at
//! most [`MAX_FORM_TEXT`] bytes so written. When they are not wanted (the
//! merge's checking pass) they are measured and dropped.
//!
//! The counterexamples, which come after the results in a piece, are streamed
//! like the results; a piece whose `"counterexamples"` come before its
//! `"results"` has them read whole, bounded by [`MAX_ENTRIES`] entries.

use super::piece_reader::{Layout, MAX_ENTRIES};
use serde::de::{self, DeserializeSeed, IgnoredAny, MapAccess, SeqAccess, Visitor};
use std::cell::Cell;
use std::fmt;

/// The longest normal form (or list of negative coefficients) of one result,
/// written compact (bytes). A normal form modulo J_n has at most as many terms
/// as the largest graded piece of the quotient, Catalan(n − 1) (the graded
/// dimensions are the ballot numbers (n − k)/(n + k)·C(n + k, k),
/// Aval–Bergeron–Bergeron 2004): 58 786 terms at n = 12, about 50 bytes
/// each, so about 3 MB; 16 MiB leaves room and bounds what one item holds.
pub const MAX_FORM_TEXT: usize = 16 << 20;

/// The survey's lists: results read with their normal forms written compact
/// (`keep`), or only checked.
pub struct Survey {
    /// Whether normal forms and negative coefficients are kept.
    pub keep: bool,
}

/// The fields of a survey piece that `merge` reads.
pub const SURVEY_KEPT: [&str; 9] = [
    "kind",
    "n",
    "shard",
    "count",
    "all_nonnegative",
    "version",
    "build",
    "listed_total",
    "listing",
];

impl Layout for Survey {
    type Item = SurveyResult;
    type Extra = Counterexample;
    const LIST: &'static str = "results";
    const EXPECTING: &'static str = "the list of results";
    const EXTRA: Option<&'static str> = Some("counterexamples");
    const KEPT: &'static [&'static str] = &SURVEY_KEPT;

    fn item<'de, A: SeqAccess<'de>>(&self, seq: &mut A) -> Result<Option<SurveyResult>, A::Error> {
        seq.next_element_seed(ResultSeed { keep: self.keep })
    }

    fn extra<'de, A: SeqAccess<'de>>(
        &self,
        seq: &mut A,
    ) -> Result<Option<Counterexample>, A::Error> {
        seq.next_element_seed(CounterexampleSeed { keep: self.keep })
    }

    fn bytes(item: &SurveyResult) -> usize {
        item.normal_form.as_ref().map_or(0, String::len) + 8 * item.perm.len()
    }
}

/// One result of a survey, as read.
#[derive(Debug, Default)]
pub struct SurveyResult {
    /// w in one-line notation.
    pub perm: Vec<u64>,
    /// ℓ(w).
    pub length: Option<u64>,
    /// Whether every coefficient of the normal form is nonnegative.
    pub nonnegative: bool,
    /// The number of terms of the normal form.
    pub terms: Option<u64>,
    /// The sum of the coefficients, as a string.
    pub sum: Option<String>,
    /// The normal form, written compact (empty when not kept).
    pub normal_form: Option<String>,
}

impl SurveyResult {
    /// Appends the result's text in a survey (its members in the order a
    /// whole run writes them, the ones it lacks left out).
    pub fn write(&self, out: &mut String) {
        out.push_str("{\"perm\":");
        out.push_str(&perm_text(&self.perm));
        if let Some(l) = self.length {
            out.push_str(&format!(",\"length\":{l}"));
        }
        out.push_str(&format!(",\"nonnegative\":{}", self.nonnegative));
        if let Some(t) = self.terms {
            out.push_str(&format!(",\"terms\":{t}"));
        }
        if let Some(s) = &self.sum {
            out.push_str(",\"sum\":");
            out.push_str(&string_text(s));
        }
        if let Some(f) = &self.normal_form {
            out.push_str(",\"normal_form\":");
            out.push_str(f);
        }
        out.push('}');
    }
}

/// One counterexample of a survey, as read.
#[derive(Debug, Default)]
pub struct Counterexample {
    /// w in one-line notation.
    pub perm: Vec<u64>,
    /// The negative coefficients, written compact (empty when not kept).
    pub negative_coefficients: String,
}

impl Counterexample {
    /// Appends the counterexample's text in a survey.
    pub fn write(&self, out: &mut String) {
        out.push_str("{\"perm\":");
        out.push_str(&perm_text(&self.perm));
        out.push_str(",\"negative_coefficients\":");
        out.push_str(&self.negative_coefficients);
        out.push('}');
    }
}

fn perm_text(perm: &[u64]) -> String {
    let entries: Vec<String> = perm.iter().map(u64::to_string).collect();
    format!("[{}]", entries.join(","))
}

/// A string as JSON text, escaped as serde_json escapes it.
fn string_text(s: &str) -> String {
    let mut out = String::with_capacity(s.len() + 2);
    escape_into(&mut out, s);
    out
}

/// The decimal digits of `v`.
fn digits(v: u64) -> usize {
    v.checked_ilog10().map_or(1, |d| d as usize + 1)
}

/// How many bytes serde_json writes for `c` inside a string.
fn escaped_len(c: char) -> usize {
    match c {
        '"' | '\\' | '\u{8}' | '\u{c}' | '\n' | '\r' | '\t' => 2,
        c if (c as u32) < 0x20 => 6,
        c => c.len_utf8(),
    }
}

/// Appends `s` quoted and escaped as serde_json writes it.
fn escape_into(out: &mut String, s: &str) {
    const HEX: &[u8; 16] = b"0123456789abcdef";
    out.push('"');
    for c in s.chars() {
        match c {
            '"' => out.push_str("\\\""),
            '\\' => out.push_str("\\\\"),
            '\u{8}' => out.push_str("\\b"),
            '\u{c}' => out.push_str("\\f"),
            '\n' => out.push_str("\\n"),
            '\r' => out.push_str("\\r"),
            '\t' => out.push_str("\\t"),
            c if (c as u32) < 0x20 => {
                let b = c as usize;
                out.push_str("\\u00");
                out.push(HEX[b >> 4] as char);
                out.push(HEX[b & 15] as char);
            }
            c => out.push(c),
        }
    }
    out.push('"');
}

/// Reads one result.
struct ResultSeed {
    keep: bool,
}

impl<'de> DeserializeSeed<'de> for ResultSeed {
    type Value = SurveyResult;

    fn deserialize<D: de::Deserializer<'de>>(self, d: D) -> Result<SurveyResult, D::Error> {
        d.deserialize_map(self)
    }
}

/// Refuses a field given twice, as serde does for a record.
fn once<E: de::Error>(seen: &mut Vec<&'static str>, key: &'static str) -> Result<(), E> {
    if seen.contains(&key) {
        return Err(de::Error::duplicate_field(key));
    }
    seen.push(key);
    Ok(())
}

impl<'de> Visitor<'de> for ResultSeed {
    type Value = SurveyResult;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a result {\"perm\": [...], \"nonnegative\": ..., ...}")
    }

    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<SurveyResult, A::Error> {
        let mut r = SurveyResult::default();
        let mut seen = Vec::new();
        while let Some(key) = map.next_key::<String>()? {
            match key.as_str() {
                "perm" => {
                    once(&mut seen, "perm")?;
                    r.perm = map.next_value_seed(PermSeed)?;
                }
                "length" => {
                    once(&mut seen, "length")?;
                    r.length = map.next_value()?;
                }
                "nonnegative" => {
                    once(&mut seen, "nonnegative")?;
                    r.nonnegative = map.next_value()?;
                }
                "terms" => {
                    once(&mut seen, "terms")?;
                    r.terms = map.next_value()?;
                }
                "sum" => {
                    once(&mut seen, "sum")?;
                    r.sum = map.next_value()?;
                }
                "normal_form" => {
                    once(&mut seen, "normal_form")?;
                    r.normal_form = map.next_value_seed(OptionalForm { keep: self.keep })?;
                }
                _ => {
                    map.next_value::<IgnoredAny>()?;
                }
            }
        }
        for key in ["perm", "nonnegative"] {
            if !seen.contains(&key) {
                return Err(de::Error::missing_field(key));
            }
        }
        Ok(r)
    }
}

/// Reads one counterexample (from the file, or from a value read whole).
pub struct CounterexampleSeed {
    /// Whether the negative coefficients are kept.
    pub keep: bool,
}

impl<'de> DeserializeSeed<'de> for CounterexampleSeed {
    type Value = Counterexample;

    fn deserialize<D: de::Deserializer<'de>>(self, d: D) -> Result<Counterexample, D::Error> {
        d.deserialize_map(self)
    }
}

impl<'de> Visitor<'de> for CounterexampleSeed {
    type Value = Counterexample;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a counterexample {\"perm\": [...], \"negative_coefficients\": ...}")
    }

    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<Counterexample, A::Error> {
        let mut c = Counterexample::default();
        let mut seen = Vec::new();
        while let Some(key) = map.next_key::<String>()? {
            match key.as_str() {
                "perm" => {
                    once(&mut seen, "perm")?;
                    c.perm = map.next_value_seed(PermSeed)?;
                }
                "negative_coefficients" => {
                    once(&mut seen, "negative_coefficients")?;
                    c.negative_coefficients = map.next_value_seed(Form::new(self.keep))?;
                }
                _ => {
                    map.next_value::<IgnoredAny>()?;
                }
            }
        }
        for key in ["perm", "negative_coefficients"] {
            if !seen.contains(&key) {
                return Err(de::Error::missing_field(key));
            }
        }
        Ok(c)
    }
}

/// A permutation's one-line list of at most [`MAX_ENTRIES`] entries.
struct PermSeed;

impl<'de> DeserializeSeed<'de> for PermSeed {
    type Value = Vec<u64>;

    fn deserialize<D: de::Deserializer<'de>>(self, d: D) -> Result<Vec<u64>, D::Error> {
        d.deserialize_seq(self)
    }
}

impl<'de> Visitor<'de> for PermSeed {
    type Value = Vec<u64>;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a permutation in one-line notation")
    }

    fn visit_seq<A: SeqAccess<'de>>(self, mut seq: A) -> Result<Vec<u64>, A::Error> {
        let mut out = Vec::new();
        while let Some(v) = seq.next_element::<u64>()? {
            if out.len() == MAX_ENTRIES {
                return Err(de::Error::custom(format!(
                    "a value with more than {MAX_ENTRIES} entries"
                )));
            }
            out.push(v);
        }
        Ok(out)
    }
}

/// A normal form that may be `null` or absent.
struct OptionalForm {
    keep: bool,
}

impl<'de> DeserializeSeed<'de> for OptionalForm {
    type Value = Option<String>;

    fn deserialize<D: de::Deserializer<'de>>(self, d: D) -> Result<Option<String>, D::Error> {
        d.deserialize_option(self)
    }
}

impl<'de> Visitor<'de> for OptionalForm {
    type Value = Option<String>;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a normal form")
    }

    fn visit_none<E>(self) -> Result<Option<String>, E> {
        Ok(None)
    }

    fn visit_unit<E>(self) -> Result<Option<String>, E> {
        Ok(None)
    }

    fn visit_some<D: de::Deserializer<'de>>(self, d: D) -> Result<Option<String>, D::Error> {
        Form::new(self.keep).deserialize(d).map(Some)
    }
}

/// Any JSON value, written compact into a string (or only measured), at most
/// [`MAX_FORM_TEXT`] bytes.
struct Form {
    keep: bool,
}

impl Form {
    fn new(keep: bool) -> Form {
        Form { keep }
    }
}

impl<'de> DeserializeSeed<'de> for Form {
    type Value = String;

    fn deserialize<D: de::Deserializer<'de>>(self, d: D) -> Result<String, D::Error> {
        let mut out = String::new();
        let left = Cell::new(MAX_FORM_TEXT);
        Compact {
            out: &mut out,
            keep: self.keep,
            left: &left,
            lead: "",
        }
        .deserialize(d)?;
        Ok(out)
    }
}

/// Writes the value it visits into `out`, compact, as serde_json writes the
/// value it would read (same numbers, same escapes, fields in their order).
struct Compact<'a> {
    out: &'a mut String,
    keep: bool,
    left: &'a Cell<usize>,
    /// Written before the value (a comma between two list items).
    lead: &'static str,
}

impl Compact<'_> {
    /// Counts `len` more bytes against the limit.
    fn account<E: de::Error>(&self, len: usize) -> Result<(), E> {
        let left = self.left.get();
        if len > left {
            return Err(E::custom(format!(
                "a normal form longer than {MAX_FORM_TEXT} bytes"
            )));
        }
        self.left.set(left - len);
        Ok(())
    }

    fn put<E: de::Error>(&mut self, s: &str) -> Result<(), E> {
        self.account(s.len())?;
        if self.keep {
            self.out.push_str(s);
        }
        Ok(())
    }

    /// Writes an integer, its sign and its digits (or their count only,
    /// when not kept).
    fn integer<E: de::Error>(&mut self, negative: bool, v: u64) -> Result<(), E> {
        self.account(usize::from(negative) + digits(v))?;
        if self.keep {
            if negative {
                self.out.push('-');
            }
            let mut buf = [0u8; 20];
            let mut at = buf.len();
            let mut rest = v;
            loop {
                at -= 1;
                buf[at] = b'0' + (rest % 10) as u8;
                rest /= 10;
                if rest == 0 {
                    break;
                }
            }
            self.out
                .push_str(std::str::from_utf8(&buf[at..]).unwrap_or("0"));
        }
        Ok(())
    }

    /// Writes a string as serde_json escapes it (or its length only).
    fn string<E: de::Error>(&mut self, v: &str) -> Result<(), E> {
        let len = 2 + v.chars().map(escaped_len).sum::<usize>();
        self.account(len)?;
        if self.keep {
            escape_into(self.out, v);
        }
        Ok(())
    }

    /// The same writer for a value inside this one, `lead` written first.
    fn inner(&mut self, lead: &'static str) -> Compact<'_> {
        Compact {
            out: self.out,
            keep: self.keep,
            left: self.left,
            lead,
        }
    }
}

impl<'de> DeserializeSeed<'de> for Compact<'_> {
    type Value = ();

    fn deserialize<D: de::Deserializer<'de>>(mut self, d: D) -> Result<(), D::Error> {
        let lead = self.lead;
        self.put(lead)?;
        d.deserialize_any(self)
    }
}

impl<'de> Visitor<'de> for Compact<'_> {
    type Value = ();

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a JSON value")
    }

    fn visit_bool<E: de::Error>(mut self, v: bool) -> Result<(), E> {
        self.put(if v { "true" } else { "false" })
    }

    fn visit_i64<E: de::Error>(mut self, v: i64) -> Result<(), E> {
        self.integer(v < 0, v.unsigned_abs())
    }

    fn visit_u64<E: de::Error>(mut self, v: u64) -> Result<(), E> {
        self.integer(false, v)
    }

    fn visit_f64<E: de::Error>(mut self, v: f64) -> Result<(), E> {
        let number = serde_json::Number::from_f64(v).map_or("null".into(), |n| n.to_string());
        self.put(&number)
    }

    fn visit_str<E: de::Error>(mut self, v: &str) -> Result<(), E> {
        self.string(v)
    }

    fn visit_unit<E: de::Error>(mut self) -> Result<(), E> {
        self.put("null")
    }

    fn visit_none<E: de::Error>(mut self) -> Result<(), E> {
        self.put("null")
    }

    fn visit_seq<A: SeqAccess<'de>>(mut self, mut seq: A) -> Result<(), A::Error> {
        self.put("[")?;
        let mut lead = "";
        while seq.next_element_seed(self.inner(lead))?.is_some() {
            lead = ",";
        }
        self.put("]")
    }

    fn visit_map<A: MapAccess<'de>>(mut self, mut map: A) -> Result<(), A::Error> {
        self.put("{")?;
        let mut first = true;
        while let Some(key) = map.next_key::<String>()? {
            if !first {
                self.put(",")?;
            }
            first = false;
            self.string(&key)?;
            self.put(":")?;
            map.next_value_seed(self.inner(""))?;
        }
        self.put("}")
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use serde_json::Value;

    /// A value read through [`Form`] is the text serde_json writes for it,
    /// whatever white space it had.
    #[test]
    fn forms_are_written_as_serde_json_writes_them() {
        let texts = [
            r#"{"nvars": 3, "terms": [[[0, 1, 2], "-12"], [[1,0,0],"1"]]}"#,
            r#"[ ]"#,
            r#"[0, -9223372036854775808, 18446744073709551615, 10, -1]"#,
            r#"{ }"#,
            r#"[1.5, -3, 1e3, true, null, "a\"b\\u00e9\n\u0001\b\f\r\t/", {"x": [[]]}]"#,
        ];
        for text in texts {
            let v: Value = serde_json::from_str(text).unwrap_or_default();
            let mut de = serde_json::Deserializer::from_str(text);
            let got = Form::new(true).deserialize(&mut de).unwrap_or_default();
            assert_eq!(got, v.to_string(), "{text}");
            // from a value read whole, the same
            let again = Form::new(true).deserialize(&v).unwrap_or_default();
            assert_eq!(again, v.to_string(), "{text}");
        }
    }

    /// A form longer than the limit is refused, kept or not.
    #[test]
    fn long_forms_are_refused() {
        let text = format!("[{}0]", "12345678,".repeat(MAX_FORM_TEXT / 9 + 1));
        for keep in [true, false] {
            let mut de = serde_json::Deserializer::from_str(&text);
            let e = Form::new(keep).deserialize(&mut de).unwrap_err();
            assert!(e.to_string().contains("longer than"), "{e}");
        }
    }
}
