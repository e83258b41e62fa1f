//! Reading a large JSON object a field at a time, so that `merge` can walk the
//! coefficient lists of many pieces side by side without holding any of them.
//!
//! [`JsonReader`] reads from a buffered file: [`JsonReader::next_key`] steps
//! through the keys of the top-level object, [`JsonReader::value`] reads one
//! (small) value whole, and [`JsonReader::next_item`] reads the items of a list
//! one by one. Nesting is limited to [`MAX_DEPTH`], strings to [`MAX_STRING`]
//! bytes, so no input drives unbounded recursion or memory.

use serde_json::{Map, Number, Value};
use std::io::{BufRead, ErrorKind};

/// The deepest nesting read.
pub const MAX_DEPTH: usize = 32;

/// The longest string or number read (bytes).
pub const MAX_STRING: usize = 1 << 16;

/// The most entries (list items and object fields, at every depth) of one
/// value read whole: a field or a list item of a piece is small, so memory
/// stays bounded whatever a file holds and in whatever order.
pub const MAX_ENTRIES: usize = 100_000;

/// A pull reader of one JSON object.
pub struct JsonReader<R> {
    input: R,
    first_key: bool,
    first_item: bool,
    /// Entries still allowed in the value being read.
    budget: usize,
}

/// Why the text could not be read: a message naming what was expected.
pub type ReadResult<T> = Result<T, String>;

impl<R: BufRead> JsonReader<R> {
    /// A reader at the start of the text; reads the opening brace.
    pub fn new(input: R) -> ReadResult<JsonReader<R>> {
        let mut r = JsonReader {
            input,
            first_key: true,
            first_item: true,
            budget: MAX_ENTRIES,
        };
        r.expect(b'{', "the opening '{' of a JSON object")?;
        Ok(r)
    }

    fn peek(&mut self) -> ReadResult<Option<u8>> {
        loop {
            let buf = match self.input.fill_buf() {
                Ok(b) => b,
                Err(e) if e.kind() == ErrorKind::Interrupted => continue,
                Err(e) => return Err(format!("cannot read: {e}")),
            };
            let Some(&b) = buf.first() else {
                return Ok(None);
            };
            if b.is_ascii_whitespace() {
                self.input.consume(1);
                continue;
            }
            return Ok(Some(b));
        }
    }

    fn byte(&mut self) -> ReadResult<Option<u8>> {
        let b = self.peek()?;
        if b.is_some() {
            self.input.consume(1);
        }
        Ok(b)
    }

    fn raw_byte(&mut self) -> ReadResult<Option<u8>> {
        let buf = self
            .input
            .fill_buf()
            .map_err(|e| format!("cannot read: {e}"))?;
        let Some(&b) = buf.first() else {
            return Ok(None);
        };
        self.input.consume(1);
        Ok(Some(b))
    }

    fn expect(&mut self, want: u8, what: &str) -> ReadResult<()> {
        match self.byte()? {
            Some(b) if b == want => Ok(()),
            Some(b) => Err(format!("expected {what}, found '{}'", b as char)),
            None => Err(format!(
                "the text ends where {what} was expected (cut short)"
            )),
        }
    }

    /// The next key of the top-level object, or `None` at its closing brace.
    pub fn next_key(&mut self) -> ReadResult<Option<String>> {
        if self.peek()? == Some(b'}') {
            self.input.consume(1);
            return Ok(None);
        }
        if !self.first_key {
            self.expect(b',', "',' or '}' after a field")?;
        }
        self.first_key = false;
        self.expect(b'"', "a key")?;
        let key = self.string_body()?;
        self.expect(b':', "':' after a key")?;
        Ok(Some(key))
    }

    /// After the top-level object: only white space may follow.
    pub fn finish(&mut self) -> ReadResult<()> {
        match self.peek()? {
            None => Ok(()),
            Some(b) => Err(format!(
                "text after the end of the object ('{}')",
                b as char
            )),
        }
    }

    /// Opens the list that is the current field's value.
    pub fn begin_list(&mut self) -> ReadResult<()> {
        self.expect(b'[', "a list '['")?;
        self.first_item = true;
        Ok(())
    }

    /// The next item of the open list (read whole), or `None` at its end.
    pub fn next_item(&mut self) -> ReadResult<Option<Value>> {
        if self.peek()? == Some(b']') {
            self.input.consume(1);
            return Ok(None);
        }
        if !self.first_item {
            self.expect(b',', "',' or ']' in a list")?;
        }
        self.first_item = false;
        self.budget = MAX_ENTRIES;
        self.value_at(1).map(Some)
    }

    /// The current field's value, read whole.
    pub fn value(&mut self) -> ReadResult<Value> {
        self.budget = MAX_ENTRIES;
        self.value_at(1)
    }

    fn value_at(&mut self, depth: usize) -> ReadResult<Value> {
        if depth > MAX_DEPTH {
            return Err(format!("nested more than {MAX_DEPTH} deep"));
        }
        if self.budget == 0 {
            return Err(format!(
                "a value with more than {MAX_ENTRIES} entries, far more than a piece's fields hold"
            ));
        }
        self.budget -= 1;
        match self.peek()? {
            None => Err("the text ends where a value was expected (cut short)".into()),
            Some(b'"') => {
                self.input.consume(1);
                Ok(Value::String(self.string_body()?))
            }
            Some(b'[') => {
                self.input.consume(1);
                let mut items = Vec::new();
                if self.peek()? == Some(b']') {
                    self.input.consume(1);
                    return Ok(Value::Array(items));
                }
                loop {
                    items.push(self.value_at(depth + 1)?);
                    match self.byte()? {
                        Some(b',') => continue,
                        Some(b']') => return Ok(Value::Array(items)),
                        _ => return Err("expected ',' or ']' in a list".into()),
                    }
                }
            }
            Some(b'{') => {
                self.input.consume(1);
                let mut map = Map::new();
                if self.peek()? == Some(b'}') {
                    self.input.consume(1);
                    return Ok(Value::Object(map));
                }
                loop {
                    self.expect(b'"', "a key")?;
                    let k = self.string_body()?;
                    self.expect(b':', "':' after a key")?;
                    let v = self.value_at(depth + 1)?;
                    map.insert(k, v);
                    match self.byte()? {
                        Some(b',') => continue,
                        Some(b'}') => return Ok(Value::Object(map)),
                        _ => return Err("expected ',' or '}' in an object".into()),
                    }
                }
            }
            Some(_) => self.scalar(),
        }
    }

    fn scalar(&mut self) -> ReadResult<Value> {
        let mut text = String::new();
        loop {
            let buf = self
                .input
                .fill_buf()
                .map_err(|e| format!("cannot read: {e}"))?;
            let Some(&b) = buf.first() else { break };
            if b.is_ascii_alphanumeric() || b == b'-' || b == b'+' || b == b'.' {
                text.push(b as char);
                self.input.consume(1);
                if text.len() > MAX_STRING {
                    return Err("a value longer than accepted".into());
                }
            } else {
                break;
            }
        }
        match text.as_str() {
            "true" => Ok(Value::Bool(true)),
            "false" => Ok(Value::Bool(false)),
            "null" => Ok(Value::Null),
            t => t
                .parse::<u64>()
                .map(Number::from)
                .or_else(|_| t.parse::<i64>().map(Number::from))
                .ok()
                .or_else(|| t.parse::<f64>().ok().and_then(Number::from_f64))
                .map(Value::Number)
                .ok_or_else(|| format!("'{t}' is not a JSON value")),
        }
    }

    /// A string's body after its opening quote, escapes decoded.
    fn string_body(&mut self) -> ReadResult<String> {
        let mut bytes = Vec::new();
        loop {
            let Some(b) = self.raw_byte()? else {
                return Err("the text ends inside a string (cut short)".into());
            };
            match b {
                b'"' => break,
                b'\\' => {
                    let Some(e) = self.raw_byte()? else {
                        return Err("the text ends inside a string (cut short)".into());
                    };
                    match e {
                        b'"' | b'\\' | b'/' => bytes.push(e),
                        b'n' => bytes.push(b'\n'),
                        b't' => bytes.push(b'\t'),
                        b'r' => bytes.push(b'\r'),
                        b'b' => bytes.push(8),
                        b'f' => bytes.push(12),
                        b'u' => {
                            let mut hex = String::new();
                            for _ in 0..4 {
                                match self.raw_byte()? {
                                    Some(h) => hex.push(h as char),
                                    None => return Err("a cut-short \\u escape".into()),
                                }
                            }
                            let code = u32::from_str_radix(&hex, 16)
                                .map_err(|_| format!("'\\u{hex}' is not an escape"))?;
                            let ch = char::from_u32(code).unwrap_or('\u{fffd}');
                            let mut tmp = [0u8; 4];
                            bytes.extend_from_slice(ch.encode_utf8(&mut tmp).as_bytes());
                        }
                        other => return Err(format!("'\\{}' is not an escape", other as char)),
                    }
                }
                _ => bytes.push(b),
            }
            if bytes.len() > MAX_STRING {
                return Err("a string longer than accepted".into());
            }
        }
        String::from_utf8(bytes).map_err(|_| "a string that is not UTF-8".into())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn reads_fields_and_list_items_as_serde_json_does() {
        let text = r#"{"kind": "k", "n": 3, "list": [{"a": [1, 2]}, {"a": []}], "t": true, "s": "x\"y\u00e9"}"#;
        let whole: Value = serde_json::from_str(text).unwrap();
        let mut r = JsonReader::new(text.as_bytes()).unwrap();
        let mut seen = Map::new();
        while let Some(k) = r.next_key().unwrap() {
            if k == "list" {
                r.begin_list().unwrap();
                let mut items = Vec::new();
                while let Some(v) = r.next_item().unwrap() {
                    items.push(v);
                }
                seen.insert(k, Value::Array(items));
            } else {
                seen.insert(k, r.value().unwrap());
            }
        }
        r.finish().unwrap();
        assert_eq!(Value::Object(seen), whole);
        let cut = &text[..40];
        let mut r = JsonReader::new(cut.as_bytes()).unwrap();
        let mut failed = false;
        while !failed {
            match r.next_key() {
                Ok(Some(k)) if k == "list" => {
                    r.begin_list().unwrap();
                    loop {
                        match r.next_item() {
                            Ok(Some(_)) => {}
                            Ok(None) => break,
                            Err(e) => {
                                assert!(e.contains("cut short") || e.contains("expected"), "{e}");
                                failed = true;
                                break;
                            }
                        }
                    }
                }
                Ok(Some(_)) => {
                    r.value().unwrap();
                }
                Ok(None) => panic!("a cut text read to its end"),
                Err(_) => failed = true,
            }
        }
        let deep = format!("{{\"a\": {}{}}}", "[".repeat(100), "]".repeat(100));
        let mut r = JsonReader::new(deep.as_bytes()).unwrap();
        r.next_key().unwrap();
        assert!(r.value().unwrap_err().contains("nested"));
        // a huge field is refused at its bound, whatever comes before or after it
        let huge = format!(
            "{{\"x\": [{}0], \"kind\": \"k\"}}",
            "0,".repeat(MAX_ENTRIES + 5)
        );
        let mut r = JsonReader::new(huge.as_bytes()).unwrap();
        r.next_key().unwrap();
        assert!(r.value().unwrap_err().contains("entries"));
        let fits = format!("{{\"x\": [{}0]}}", "0,".repeat(MAX_ENTRIES - 10));
        let mut r = JsonReader::new(fits.as_bytes()).unwrap();
        r.next_key().unwrap();
        assert!(r.value().is_ok());
    }
}
