//! Reading the JSON pieces that `merge` combines, with serde as they stream
//! from the file, so that memory depends neither on a piece's size nor on the
//! order of its fields.
//!
//! A [`PieceStream`] deserializes one Hessenberg piece on its own thread
//! (`serde_json::Deserializer` over the file, a map [`Visitor`] for the object,
//! a [`DeserializeSeed`] for the `"coefficients"` list): the fields before the
//! list come as its head, the list's items in small batches through a bounded
//! channel, the fields after it as its tail. `merge` walks every piece's stream
//! side by side without holding any of them. [`labels`] and [`kind`] read a
//! few fields of a file, stepping over everything else ([`IgnoredAny`]).
//!
//! Every value kept is small: a value read whole has at most [`MAX_ENTRIES`]
//! list items and object fields, no string or number is longer than
//! [`MAX_STRING`] bytes (checked on the bytes before serde sees them, since
//! serde_json collects a string whole), and serde_json limits the nesting.

use serde::de::{self, DeserializeSeed, IgnoredAny, MapAccess, SeqAccess, Visitor};
use serde_json::{Map, Number, Value};
use std::cell::Cell;
use std::fmt;
use std::fs::File;
use std::io::{BufReader, ErrorKind, Read};
use std::sync::mpsc::{Receiver, SyncSender, sync_channel};

/// The longest string or number read (bytes).
pub const MAX_STRING: usize = 1 << 16;

/// The most entries (list items and object fields, at every depth) of one
/// value read whole: a field or a list item of a piece is small, so memory
/// stays bounded whatever a file holds and in whatever order.
pub const MAX_ENTRIES: usize = 100_000;

/// How many list items go through the channel together.
const BATCH: usize = 256;

/// How many batches wait in the channel at most.
const WAITING: usize = 2;

/// The bytes of a file, refused once a string or a number runs longer than
/// [`MAX_STRING`] bytes.
struct Guarded<R> {
    inner: R,
    in_string: bool,
    escaped: bool,
    run: usize,
}

impl<R: Read> Read for Guarded<R> {
    fn read(&mut self, buf: &mut [u8]) -> std::io::Result<usize> {
        let got = self.inner.read(buf)?;
        for &b in &buf[..got] {
            if self.in_string {
                if self.escaped {
                    self.escaped = false;
                } else if b == b'\\' {
                    self.escaped = true;
                } else if b == b'"' {
                    self.in_string = false;
                    self.run = 0;
                    continue;
                }
                self.run += 1;
            } else if b == b'"' {
                self.in_string = true;
                self.run = 0;
            } else if b.is_ascii_alphanumeric() || matches!(b, b'-' | b'+' | b'.') {
                self.run += 1;
            } else {
                self.run = 0;
            }
            if self.run > MAX_STRING {
                return Err(std::io::Error::new(
                    ErrorKind::InvalidData,
                    format!("a string or number longer than {MAX_STRING} bytes"),
                ));
            }
        }
        Ok(got)
    }
}

/// A file opened for serde, its bytes guarded.
fn reader(file: File) -> Guarded<BufReader<File>> {
    Guarded {
        inner: BufReader::with_capacity(1 << 16, file),
        in_string: false,
        escaped: false,
        run: 0,
    }
}

/// A serde_json error as a message: an end of text in the middle says "cut short".
fn message(e: &serde_json::Error) -> String {
    if e.is_eof() {
        format!("the text ends before its JSON object does (cut short): {e}")
    } else {
        e.to_string()
    }
}

/// Reads one value whole into a [`Value`], spending one entry of `budget` per
/// list item and object field.
struct Bounded<'b> {
    budget: &'b Cell<usize>,
}

impl Bounded<'_> {
    fn spend<E: de::Error>(&self) -> Result<(), E> {
        match self.budget.get() {
            0 => Err(E::custom(format!(
                "a value with more than {MAX_ENTRIES} entries"
            ))),
            left => {
                self.budget.set(left - 1);
                Ok(())
            }
        }
    }
}

impl<'de> DeserializeSeed<'de> for Bounded<'_> {
    type Value = Value;

    fn deserialize<D: de::Deserializer<'de>>(self, d: D) -> Result<Value, D::Error> {
        d.deserialize_any(self)
    }
}

impl<'de> Visitor<'de> for Bounded<'_> {
    type Value = Value;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a JSON value")
    }

    fn visit_bool<E>(self, v: bool) -> Result<Value, E> {
        Ok(Value::Bool(v))
    }

    fn visit_i64<E>(self, v: i64) -> Result<Value, E> {
        Ok(Value::from(v))
    }

    fn visit_u64<E>(self, v: u64) -> Result<Value, E> {
        Ok(Value::from(v))
    }

    fn visit_f64<E>(self, v: f64) -> Result<Value, E> {
        Ok(Number::from_f64(v).map_or(Value::Null, Value::Number))
    }

    fn visit_str<E>(self, v: &str) -> Result<Value, E> {
        Ok(Value::String(v.to_string()))
    }

    fn visit_string<E>(self, v: String) -> Result<Value, E> {
        Ok(Value::String(v))
    }

    fn visit_unit<E>(self) -> Result<Value, E> {
        Ok(Value::Null)
    }

    fn visit_none<E>(self) -> Result<Value, E> {
        Ok(Value::Null)
    }

    fn visit_seq<A: SeqAccess<'de>>(self, mut seq: A) -> Result<Value, A::Error> {
        let mut items = Vec::new();
        loop {
            self.spend()?;
            match seq.next_element_seed(Bounded {
                budget: self.budget,
            })? {
                Some(v) => items.push(v),
                None => return Ok(Value::Array(items)),
            }
        }
    }

    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<Value, A::Error> {
        let mut fields = Map::new();
        loop {
            self.spend()?;
            let Some(key) = map.next_key::<String>()? else {
                return Ok(Value::Object(fields));
            };
            let v = map.next_value_seed(Bounded {
                budget: self.budget,
            })?;
            fields.insert(key, v);
        }
    }
}

/// One value read whole, bounded.
fn bounded_value<'de, A: MapAccess<'de>>(map: &mut A) -> Result<Value, A::Error> {
    let budget = Cell::new(MAX_ENTRIES);
    map.next_value_seed(Bounded { budget: &budget })
}

/// One item of a piece's `"coefficients"`: its `"perm"` and `"value"` as read
/// (`None` when missing); other fields are stepped over.
#[derive(Debug, Default)]
pub struct RowItem {
    /// `"perm"`.
    pub perm: Option<Value>,
    /// `"value"`.
    pub value: Option<Value>,
}

impl<'de> de::Deserialize<'de> for RowItem {
    fn deserialize<D: de::Deserializer<'de>>(d: D) -> Result<RowItem, D::Error> {
        struct Fields;
        impl<'de> Visitor<'de> for Fields {
            type Value = RowItem;

            fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
                f.write_str("an object {\"perm\": [...], \"value\": \"...\"}")
            }

            fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<RowItem, A::Error> {
                let mut row = RowItem::default();
                while let Some(key) = map.next_key::<String>()? {
                    match key.as_str() {
                        "perm" => row.perm = Some(bounded_value(&mut map)?),
                        "value" => row.value = Some(bounded_value(&mut map)?),
                        _ => {
                            map.next_value::<IgnoredAny>()?;
                        }
                    }
                }
                Ok(row)
            }
        }
        d.deserialize_map(Fields)
    }
}

/// What the reading thread hands on.
enum Event {
    /// The fields before `"coefficients"`.
    Head(Map<String, Value>),
    /// The object ended without a `"coefficients"` list.
    NoList,
    /// Items of the list, in order.
    Rows(Vec<RowItem>),
    /// The list has ended.
    EndRows,
    /// The fields after the list; the object and the text have ended.
    Tail(Map<String, Value>),
    /// Why reading stopped.
    Failed(String),
}

/// The fields of a Hessenberg piece that `merge` reads; others are stepped over.
const KEPT: [&str; 14] = [
    "kind",
    "n",
    "h",
    "dimension",
    "order",
    "listed",
    "total",
    "nonzero",
    "max",
    "negative",
    "all_nonnegative_integers",
    "shard",
    "version",
    "build",
];

/// The piece's object, its head and tail sent on as fields, its list as batches.
struct PieceVisitor<'a> {
    out: &'a SyncSender<Event>,
}

/// The receiver has gone (the merge stopped): the thread stops reading.
const GONE: &str = "the merge stopped reading";

fn send<E: de::Error>(out: &SyncSender<Event>, e: Event) -> Result<(), E> {
    out.send(e).map_err(|_| E::custom(GONE))
}

impl<'de> Visitor<'de> for PieceVisitor<'_> {
    type Value = ();

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a JSON object")
    }

    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<(), A::Error> {
        let mut fields = Map::new();
        let mut listed = false;
        while let Some(key) = map.next_key::<String>()? {
            if key == "coefficients" {
                if listed {
                    return Err(de::Error::custom("\"coefficients\" appears twice"));
                }
                listed = true;
                send(self.out, Event::Head(std::mem::take(&mut fields)))?;
                map.next_value_seed(ListSeed { out: self.out })?;
                continue;
            }
            if KEPT.contains(&key.as_str()) {
                let v = bounded_value(&mut map)?;
                fields.insert(key, v);
            } else {
                map.next_value::<IgnoredAny>()?;
            }
        }
        if !listed {
            return send(self.out, Event::NoList);
        }
        send(self.out, Event::Tail(fields))
    }
}

/// The `"coefficients"` list, item by item, sent on in batches.
struct ListSeed<'a> {
    out: &'a SyncSender<Event>,
}

impl<'de> DeserializeSeed<'de> for ListSeed<'_> {
    type Value = ();

    fn deserialize<D: de::Deserializer<'de>>(self, d: D) -> Result<(), D::Error> {
        d.deserialize_seq(self)
    }
}

impl<'de> Visitor<'de> for ListSeed<'_> {
    type Value = ();

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("the list of coefficients")
    }

    fn visit_seq<A: SeqAccess<'de>>(self, mut seq: A) -> Result<(), A::Error> {
        let mut batch = Vec::with_capacity(BATCH);
        loop {
            let item = match seq.next_element::<RowItem>() {
                Ok(item) => item,
                Err(e) => {
                    // the items read before the failure go first
                    if !batch.is_empty() {
                        send(self.out, Event::Rows(batch))?;
                    }
                    return Err(e);
                }
            };
            let Some(item) = item else { break };
            batch.push(item);
            if batch.len() == BATCH {
                send(
                    self.out,
                    Event::Rows(std::mem::replace(&mut batch, Vec::with_capacity(BATCH))),
                )?;
            }
        }
        if !batch.is_empty() {
            send(self.out, Event::Rows(batch))?;
        }
        send(self.out, Event::EndRows)
    }
}

/// One Hessenberg piece read as it streams: [`PieceStream::head`], then the
/// items ([`PieceStream::next_item`] until `None`), then [`PieceStream::tail`].
pub struct PieceStream {
    events: Option<Receiver<Event>>,
    thread: Option<std::thread::JoinHandle<()>>,
    batch: std::vec::IntoIter<RowItem>,
    ended: bool,
    /// The fields before the list.
    head: Map<String, Value>,
}

impl PieceStream {
    /// Starts reading the file on its own thread.
    pub fn open(file: File) -> Result<PieceStream, String> {
        let (out, events) = sync_channel(WAITING);
        let thread = std::thread::Builder::new()
            .name("merge piece".into())
            .stack_size(1 << 20)
            .spawn(move || {
                let mut de = serde_json::Deserializer::from_reader(reader(file));
                let read = de::Deserializer::deserialize_map(&mut de, PieceVisitor { out: &out })
                    .and_then(|()| de.end());
                if let Err(e) = read {
                    let _ = out.send(Event::Failed(message(&e)));
                }
            })
            .map_err(|e| format!("cannot start reading: {e}"))?;
        Ok(PieceStream {
            events: Some(events),
            thread: Some(thread),
            batch: Vec::new().into_iter(),
            ended: false,
            head: Map::new(),
        })
    }

    fn next_event(&mut self) -> Result<Event, String> {
        let Some(events) = &self.events else {
            return Err("the piece was read to its end".into());
        };
        match events.recv() {
            Ok(Event::Failed(why)) => Err(why),
            Ok(e) => Ok(e),
            Err(_) => Err("the text ends before its JSON object does (cut short)".into()),
        }
    }

    /// The fields before `"coefficients"`.
    pub fn head(&mut self) -> Result<Map<String, Value>, String> {
        match self.next_event()? {
            Event::Head(fields) => {
                self.head = fields.clone();
                Ok(fields)
            }
            Event::NoList => Err("no \"coefficients\" list (cut short?)".into()),
            _ => Err("the fields came out of order".into()),
        }
    }

    /// The next item of the list, `None` after the last.
    pub fn next_item(&mut self) -> Result<Option<RowItem>, String> {
        loop {
            if let Some(item) = self.batch.next() {
                return Ok(Some(item));
            }
            if self.ended {
                return Ok(None);
            }
            match self.next_event()? {
                Event::Rows(batch) => self.batch = batch.into_iter(),
                Event::EndRows => self.ended = true,
                _ => {
                    return Err("the fields came out of order".into());
                }
            }
        }
    }

    /// The fields after the list (once every item was read), with those
    /// before it that it lacks (the order of the fields is free); the text
    /// has ended after the object.
    pub fn tail(&mut self) -> Result<Map<String, Value>, String> {
        match self.next_event()? {
            Event::Tail(mut fields) => {
                // the text must end with the object: the thread says so by ending
                if let Some(events) = &self.events
                    && let Ok(Event::Failed(why)) = events.recv()
                {
                    return Err(why);
                }
                for (k, v) in std::mem::take(&mut self.head) {
                    fields.entry(k).or_insert(v);
                }
                Ok(fields)
            }
            _ => Err("the fields came out of order".into()),
        }
    }
}

impl Drop for PieceStream {
    fn drop(&mut self) {
        // the thread stops at its next send once nobody receives
        self.events = None;
        if let Some(t) = self.thread.take() {
            let _ = t.join();
        }
    }
}

/// The labels of a piece, read as JSON wherever they stand: `"shard"`,
/// `"version"` and `"build"` (`None` when absent); the list is stepped over.
#[derive(Debug, Default)]
pub struct Labels {
    /// `"shard"`.
    pub shard: Option<Value>,
    /// `"version"`.
    pub version: Option<Value>,
    /// `"build"`.
    pub build: Option<Value>,
}

struct LabelsVisitor;

impl<'de> Visitor<'de> for LabelsVisitor {
    type Value = Labels;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a JSON object")
    }

    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<Labels, A::Error> {
        let mut labels = Labels::default();
        while let Some(key) = map.next_key::<String>()? {
            let slot = match key.as_str() {
                "shard" => &mut labels.shard,
                "version" => &mut labels.version,
                "build" => &mut labels.build,
                _ => {
                    map.next_value::<IgnoredAny>()?;
                    continue;
                }
            };
            *slot = Some(bounded_value(&mut map)?);
        }
        Ok(labels)
    }
}

/// Reads a piece's labels ([`Labels`]) in one pass over the file.
pub fn labels(file: File) -> Result<Labels, String> {
    let mut de = serde_json::Deserializer::from_reader(reader(file));
    de::Deserializer::deserialize_map(&mut de, LabelsVisitor)
        .and_then(|l| de.end().map(|()| l))
        .map_err(|e| message(&e))
}

/// Reads the top-level object up to its `"kind"` and stops there.
struct KindVisitor<'a> {
    found: &'a Cell<Option<Option<String>>>,
}

/// What stops the reading once the kind is known.
const FOUND: &str = "found the kind";

impl<'de> Visitor<'de> for KindVisitor<'_> {
    type Value = ();

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a JSON object")
    }

    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<(), A::Error> {
        while let Some(key) = map.next_key::<String>()? {
            if key == "kind" {
                let v = bounded_value(&mut map)?;
                self.found.set(Some(v.as_str().map(str::to_string)));
                return Err(de::Error::custom(FOUND));
            }
            map.next_value::<IgnoredAny>()?;
        }
        Ok(())
    }
}

/// The `"kind"` of a JSON object in a file (empty when it has none or it is
/// not text): the fields are read up to the kind and stepped over.
pub fn kind(file: File) -> Result<String, String> {
    let found = Cell::new(None);
    let mut de = serde_json::Deserializer::from_reader(reader(file));
    let read = de::Deserializer::deserialize_map(&mut de, KindVisitor { found: &found });
    match (found.take(), read) {
        (Some(kind), _) => Ok(kind.unwrap_or_default()),
        (None, Ok(())) => Ok(String::new()),
        (None, Err(e)) => Err(message(&e)),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use std::io::Write;

    fn file_of(text: &str) -> File {
        let mut f = tempfile::tempfile().unwrap_or_else(|e| panic!("{e}"));
        f.write_all(text.as_bytes())
            .unwrap_or_else(|e| panic!("{e}"));
        use std::io::Seek;
        f.rewind().unwrap_or_else(|e| panic!("{e}"));
        f
    }

    /// Head, items and tail come back as serde_json reads the whole text.
    #[test]
    fn a_piece_streams_as_serde_json_reads_it() {
        let text = r#"{"kind":"k","n":3,"coefficients":[{"perm":[1,3,2],"value":"1"},{"value":"-2","perm":[2,1,3],"x":[1,{"y":2}]}],"total":"-1","shard":"1/2"}"#;
        let whole: Value = serde_json::from_str(text).unwrap_or_default();
        let mut s = PieceStream::open(file_of(text)).unwrap_or_else(|e| panic!("{e}"));
        let head = s.head().unwrap_or_else(|e| panic!("{e}"));
        assert_eq!(head.get("n"), whole.get("n"));
        assert_eq!(head.len(), 2);
        let mut items = Vec::new();
        while let Some(item) = s.next_item().unwrap_or_else(|e| panic!("{e}")) {
            items.push(item);
        }
        assert_eq!(items.len(), 2);
        assert_eq!(
            items[1].perm.as_ref(),
            Some(&whole["coefficients"][1]["perm"])
        );
        assert_eq!(
            items[1].value.as_ref(),
            Some(&whole["coefficients"][1]["value"])
        );
        let tail = s.tail().unwrap_or_else(|e| panic!("{e}"));
        assert_eq!(tail.get("shard"), whole.get("shard"));
        // text after the object is refused when the tail is read
        let mut s =
            PieceStream::open(file_of(&format!("{text} x"))).unwrap_or_else(|e| panic!("{e}"));
        assert!(s.head().is_ok());
        while let Ok(Some(_)) = s.next_item() {}
        assert!(s.tail().is_err_and(|e| e.contains("trailing")));
        assert_eq!(kind(file_of(text)), Ok("k".into()));
        let l = labels(file_of(text)).unwrap_or_default();
        assert_eq!(l.shard, Some(Value::from("1/2")));
        assert_eq!(l.version, None);
    }

    /// A text cut short, a long string, a value with too many entries and text
    /// after the object are refused, saying why.
    #[test]
    fn bad_texts_are_refused() {
        let text = r#"{"n":3,"coefficients":[{"perm":[1,3,2],"value":"1"}],"total":"1"}"#;
        for cut in 1..text.len() {
            assert!(labels(file_of(&text[..cut])).is_err(), "{cut}");
        }
        let cut = labels(file_of(&text[..30])).map(|_| ()).unwrap_err();
        assert!(cut.contains("cut short"), "{cut}");
        let long = format!(r#"{{"junk":"{}","kind":"k"}}"#, "a".repeat(MAX_STRING + 1));
        let e = kind(file_of(&long)).unwrap_err();
        assert!(e.contains("longer than"), "{e}");
        let wide = format!(r#"{{"shard":[{}0]}}"#, "0,".repeat(MAX_ENTRIES));
        let e = labels(file_of(&wide)).map(|_| ()).unwrap_err();
        assert!(e.contains("entries"), "{e}");
        // many entries in a field stepped over cost nothing
        let ignored = format!(r#"{{"other":[{}0],"kind":"k"}}"#, "0,".repeat(MAX_ENTRIES));
        assert_eq!(kind(file_of(&ignored)), Ok("k".into()));
        assert!(labels(file_of(r#"{"shard":"1/2"} x"#)).is_err());
    }
}
