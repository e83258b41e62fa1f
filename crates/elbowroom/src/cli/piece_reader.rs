//! Reading the JSON pieces that `merge` combines, with serde as they stream
//! from the file, so that memory depends neither on a piece's size nor on the
//! order of its fields.
//!
//! A [`PieceStream`] deserializes one piece on its own thread
//! (`serde_json::Deserializer` over the file, a map [`Visitor`] for the object,
//! a [`DeserializeSeed`] for its long list): the fields before the list come
//! as its head, the list's items in small batches through a bounded channel,
//! the fields after it as its tail. What the list is and how its items are
//! read is the piece's [`Layout`]: [`Hessenberg`] (the `"coefficients"`) here,
//! the survey's (`"results"`, then `"counterexamples"`) in
//! [`super::survey_piece`]. `merge` walks every piece's stream side by side
//! without holding any of them. [`labels`], [`fields`] and [`kind`] read a few
//! fields of a file, stepping over everything else ([`IgnoredAny`]).
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
/// [`MAX_STRING`] bytes: the bytes before the one that is too many are handed
/// on, and the next read fails, so that the reader above sees the bytes and the
/// failure in the order a byte-by-byte reader would.
struct Guarded<R> {
    inner: R,
    in_string: bool,
    escaped: bool,
    run: usize,
    too_long: bool,
}

fn too_long() -> std::io::Error {
    std::io::Error::new(
        ErrorKind::InvalidData,
        format!("a string or number longer than {MAX_STRING} bytes"),
    )
}

impl<R: Read> Read for Guarded<R> {
    fn read(&mut self, buf: &mut [u8]) -> std::io::Result<usize> {
        if self.too_long {
            return Err(too_long());
        }
        let got = self.inner.read(buf)?;
        for (at, &b) in buf[..got].iter().enumerate() {
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
                self.too_long = true;
                if at == 0 {
                    return Err(too_long());
                }
                return Ok(at);
            }
        }
        Ok(got)
    }
}

/// A file opened for serde, its bytes guarded, then buffered (serde_json reads
/// a byte at a time, which a [`BufReader`] serves from its buffer).
fn reader(file: File) -> BufReader<Guarded<File>> {
    BufReader::with_capacity(
        1 << 16,
        Guarded {
            inner: file,
            in_string: false,
            escaped: false,
            run: 0,
            too_long: false,
        },
    )
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

/// What one kind of piece streams: the key of its long list, how one item is
/// read, and which other fields are kept (read whole, bounded); all other
/// fields are stepped over. A second list ([`Layout::EXTRA`]) is streamed as
/// well when it comes after the first; before it, it is read whole as a field
/// (bounded by [`MAX_ENTRIES`] like every value read whole).
pub trait Layout: Send + 'static {
    /// One item of the list.
    type Item: Send + 'static;
    /// One item of the second list.
    type Extra: Send + 'static;
    /// The key of the list streamed.
    const LIST: &'static str;
    /// What serde's messages say was expected of the list.
    const EXPECTING: &'static str;
    /// The key of the second list streamed, if any.
    const EXTRA: Option<&'static str>;
    /// The fields kept; the others are stepped over.
    const KEPT: &'static [&'static str];
    /// Reads the next item of the list (`None` at its end).
    fn item<'de, A: SeqAccess<'de>>(&self, seq: &mut A) -> Result<Option<Self::Item>, A::Error>;
    /// Reads the next item of the second list (`None` at its end).
    fn extra<'de, A: SeqAccess<'de>>(&self, seq: &mut A) -> Result<Option<Self::Extra>, A::Error>;
    /// About how many bytes an item holds beyond its own size, so that a batch
    /// of large items goes on early (a batch holds at most [`BATCH_BYTES`]
    /// beyond its last item).
    fn bytes(_item: &Self::Item) -> usize {
        0
    }
}

/// What the reading thread hands on.
enum Event<L: Layout> {
    /// The fields before the list.
    Head(Map<String, Value>),
    /// The object ended without the list.
    NoList,
    /// Items of the list, in order.
    Rows(Vec<L::Item>),
    /// The list has ended.
    EndRows,
    /// Items of the second list (after the first), in order.
    Extras(Vec<L::Extra>),
    /// The second list has ended.
    EndExtras,
    /// The fields after the list; the object and the text have ended.
    Tail(Map<String, Value>),
    /// Why reading stopped.
    Failed(String),
}

/// The items of a batch are sent on at this many bytes ([`Layout::bytes`]).
pub const BATCH_BYTES: usize = 1 << 20;

/// A Hessenberg piece: its `"coefficients"`, item by item.
pub struct Hessenberg;

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

impl Layout for Hessenberg {
    type Item = RowItem;
    type Extra = ();
    const LIST: &'static str = "coefficients";
    const EXPECTING: &'static str = "the list of coefficients";
    const EXTRA: Option<&'static str> = None;
    const KEPT: &'static [&'static str] = &KEPT;

    fn item<'de, A: SeqAccess<'de>>(&self, seq: &mut A) -> Result<Option<RowItem>, A::Error> {
        seq.next_element::<RowItem>()
    }

    fn extra<'de, A: SeqAccess<'de>>(&self, _seq: &mut A) -> Result<Option<()>, A::Error> {
        Ok(None)
    }
}

/// The piece's object, its head and tail sent on as fields, its lists as batches.
struct PieceVisitor<'a, L: Layout> {
    layout: &'a L,
    out: &'a SyncSender<Event<L>>,
}

/// The receiver has gone (the merge stopped): the thread stops reading.
const GONE: &str = "the merge stopped reading";

fn send<L: Layout, E: de::Error>(out: &SyncSender<Event<L>>, e: Event<L>) -> Result<(), E> {
    out.send(e).map_err(|_| E::custom(GONE))
}

impl<'de, L: Layout> Visitor<'de> for PieceVisitor<'_, L> {
    type Value = ();

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a JSON object")
    }

    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<(), A::Error> {
        let mut fields = Map::new();
        let mut listed = false;
        let mut extra = false;
        while let Some(key) = map.next_key::<String>()? {
            if key == L::LIST {
                if listed {
                    return Err(de::Error::custom(format!("\"{}\" appears twice", L::LIST)));
                }
                listed = true;
                send(self.out, Event::Head(std::mem::take(&mut fields)))?;
                map.next_value_seed(ListSeed {
                    layout: self.layout,
                    out: self.out,
                    extra: false,
                })?;
                continue;
            }
            let is_extra = L::EXTRA == Some(key.as_str());
            if is_extra {
                if extra {
                    return Err(de::Error::custom(format!("\"{key}\" appears twice")));
                }
                extra = true;
                if listed {
                    map.next_value_seed(ListSeed {
                        layout: self.layout,
                        out: self.out,
                        extra: true,
                    })?;
                    continue;
                }
            }
            if is_extra || L::KEPT.contains(&key.as_str()) {
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

/// A list, item by item, sent on in batches: the first list, or the second
/// (`extra`).
struct ListSeed<'a, L: Layout> {
    layout: &'a L,
    out: &'a SyncSender<Event<L>>,
    extra: bool,
}

impl<'de, L: Layout> DeserializeSeed<'de> for ListSeed<'_, L> {
    type Value = ();

    fn deserialize<D: de::Deserializer<'de>>(self, d: D) -> Result<(), D::Error> {
        d.deserialize_seq(self)
    }
}

impl<'de, L: Layout> Visitor<'de> for ListSeed<'_, L> {
    type Value = ();

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match (self.extra, L::EXTRA) {
            (true, Some(key)) => write!(f, "the list of {key}"),
            _ => f.write_str(L::EXPECTING),
        }
    }

    fn visit_seq<A: SeqAccess<'de>>(self, mut seq: A) -> Result<(), A::Error> {
        if self.extra {
            batches(
                self.out,
                &mut seq,
                |s| self.layout.extra(s),
                |_| 0,
                Event::Extras,
                Event::EndExtras,
            )
        } else {
            batches(
                self.out,
                &mut seq,
                |s| self.layout.item(s),
                L::bytes,
                Event::Rows,
                Event::EndRows,
            )
        }
    }
}

/// Reads a list's items with `next` and sends them on in batches of at most
/// [`BATCH`] items (fewer once they hold [`BATCH_BYTES`]), then `end`.
fn batches<'de, L: Layout, A: SeqAccess<'de>, T>(
    out: &SyncSender<Event<L>>,
    seq: &mut A,
    mut next: impl FnMut(&mut A) -> Result<Option<T>, A::Error>,
    bytes: impl Fn(&T) -> usize,
    wrap: fn(Vec<T>) -> Event<L>,
    end: Event<L>,
) -> Result<(), A::Error> {
    let mut batch = Vec::with_capacity(BATCH);
    let mut held = 0;
    loop {
        let item = match next(seq) {
            Ok(item) => item,
            Err(e) => {
                // the items read before the failure go first
                if !batch.is_empty() {
                    send(out, wrap(batch))?;
                }
                return Err(e);
            }
        };
        let Some(item) = item else { break };
        held += bytes(&item);
        batch.push(item);
        if batch.len() == BATCH || held >= BATCH_BYTES {
            held = 0;
            send(
                out,
                wrap(std::mem::replace(&mut batch, Vec::with_capacity(BATCH))),
            )?;
        }
    }
    if !batch.is_empty() {
        send(out, wrap(batch))?;
    }
    send(out, end)
}

/// One piece read as it streams: [`PieceStream::head`], then the items
/// ([`PieceStream::next_item`] until `None`), then the items of the second
/// list when it comes after the first ([`PieceStream::next_extra`] until
/// `None`), then [`PieceStream::tail`].
pub struct PieceStream<L: Layout = Hessenberg> {
    events: Option<Receiver<Event<L>>>,
    thread: Option<std::thread::JoinHandle<()>>,
    batch: std::vec::IntoIter<L::Item>,
    extras: std::vec::IntoIter<L::Extra>,
    ended: bool,
    extras_ended: bool,
    /// The tail, when it came while the second list was looked for.
    tail: Option<Map<String, Value>>,
    /// The fields before the list.
    head: Map<String, Value>,
}

impl PieceStream<Hessenberg> {
    /// Starts reading a Hessenberg piece on its own thread.
    pub fn open(file: File) -> Result<PieceStream<Hessenberg>, String> {
        PieceStream::open_as(file, Hessenberg)
    }
}

impl<L: Layout> PieceStream<L> {
    /// Starts reading the file on its own thread, as `layout` says.
    pub fn open_as(file: File, layout: L) -> Result<PieceStream<L>, String> {
        let (out, events) = sync_channel(WAITING);
        let thread = std::thread::Builder::new()
            .name("merge piece".into())
            .stack_size(1 << 20)
            .spawn(move || {
                let mut de = serde_json::Deserializer::from_reader(reader(file));
                let visitor = PieceVisitor {
                    layout: &layout,
                    out: &out,
                };
                let read =
                    de::Deserializer::deserialize_map(&mut de, visitor).and_then(|()| de.end());
                if let Err(e) = read {
                    let _ = out.send(Event::Failed(message(&e)));
                }
            })
            .map_err(|e| format!("cannot start reading: {e}"))?;
        Ok(PieceStream {
            events: Some(events),
            thread: Some(thread),
            batch: Vec::new().into_iter(),
            extras: Vec::new().into_iter(),
            ended: false,
            extras_ended: false,
            tail: None,
            head: Map::new(),
        })
    }

    fn next_event(&mut self) -> Result<Event<L>, String> {
        let Some(events) = &self.events else {
            return Err("the piece was read to its end".into());
        };
        match events.recv() {
            Ok(Event::Failed(why)) => Err(why),
            Ok(e) => Ok(e),
            Err(_) => Err("the text ends before its JSON object does (cut short)".into()),
        }
    }

    /// The fields before the list.
    pub fn head(&mut self) -> Result<Map<String, Value>, String> {
        match self.next_event()? {
            Event::Head(fields) => {
                self.head = fields.clone();
                Ok(fields)
            }
            Event::NoList => Err(format!("no \"{}\" list (cut short?)", L::LIST)),
            _ => Err("the fields came out of order".into()),
        }
    }

    /// The next item of the list, `None` after the last.
    pub fn next_item(&mut self) -> Result<Option<L::Item>, String> {
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

    /// The next item of the second list when it comes after the first (once
    /// every item of the first was read), `None` after its last or when it
    /// does not come after the first.
    pub fn next_extra(&mut self) -> Result<Option<L::Extra>, String> {
        loop {
            if let Some(item) = self.extras.next() {
                return Ok(Some(item));
            }
            if self.extras_ended {
                return Ok(None);
            }
            match self.next_event()? {
                Event::Extras(batch) => self.extras = batch.into_iter(),
                Event::EndExtras => self.extras_ended = true,
                Event::Tail(fields) => {
                    self.tail = Some(fields);
                    self.extras_ended = true;
                }
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
        let fields = match self.tail.take() {
            Some(fields) => fields,
            None => match self.next_event()? {
                Event::Tail(fields) => fields,
                _ => return Err("the fields came out of order".into()),
            },
        };
        let mut fields = fields;
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
}

impl<L: Layout> Drop for PieceStream<L> {
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

/// Some fields of an object, read whole (bounded) wherever they stand, and
/// how many items some lists have (their items stepped over).
#[derive(Debug, Default)]
pub struct Fields {
    /// The fields asked for that the object has.
    pub values: Map<String, Value>,
    /// For each list asked to be counted, its number of items (`None` when
    /// the object lacks it).
    pub counts: Vec<Option<usize>>,
}

struct FieldsVisitor<'a> {
    keys: &'a [&'a str],
    counted: &'a [&'a str],
}

impl<'de> Visitor<'de> for FieldsVisitor<'_> {
    type Value = Fields;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a JSON object")
    }

    fn visit_map<A: MapAccess<'de>>(self, mut map: A) -> Result<Fields, A::Error> {
        let mut fields = Fields {
            values: Map::new(),
            counts: vec![None; self.counted.len()],
        };
        while let Some(key) = map.next_key::<String>()? {
            if let Some(at) = self.counted.iter().position(|c| *c == key) {
                fields.counts[at] = Some(map.next_value_seed(Count)?);
            } else if self.keys.contains(&key.as_str()) {
                let v = bounded_value(&mut map)?;
                fields.values.insert(key, v);
            } else {
                map.next_value::<IgnoredAny>()?;
            }
        }
        Ok(fields)
    }
}

/// The number of items of a list, stepped over.
struct Count;

impl<'de> DeserializeSeed<'de> for Count {
    type Value = usize;

    fn deserialize<D: de::Deserializer<'de>>(self, d: D) -> Result<usize, D::Error> {
        d.deserialize_seq(self)
    }
}

impl<'de> Visitor<'de> for Count {
    type Value = usize;

    fn expecting(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str("a list")
    }

    fn visit_seq<A: SeqAccess<'de>>(self, mut seq: A) -> Result<usize, A::Error> {
        let mut count = 0;
        while seq.next_element::<IgnoredAny>()?.is_some() {
            count += 1;
        }
        Ok(count)
    }
}

/// Reads the fields `keys` of the object in a file and counts the items of
/// the lists `counted`, in one pass (everything else is stepped over); the
/// text must end with the object.
pub fn fields(file: File, keys: &[&str], counted: &[&str]) -> Result<Fields, String> {
    let mut de = serde_json::Deserializer::from_reader(reader(file));
    de::Deserializer::deserialize_map(&mut de, FieldsVisitor { keys, counted })
        .and_then(|f| de.end().map(|()| f))
        .map_err(|e| message(&e))
}

/// Reads a piece's labels ([`Labels`]) in one pass over the file.
pub fn labels(file: File) -> Result<Labels, String> {
    let mut read = fields(file, &["shard", "version", "build"], &[])?;
    let mut take = |key: &str| read.values.remove(key);
    Ok(Labels {
        shard: take("shard"),
        version: take("version"),
        build: take("build"),
    })
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

    /// An item that counts how many of its kind are alive.
    struct Live(std::sync::Arc<std::sync::atomic::AtomicUsize>);

    impl Drop for Live {
        fn drop(&mut self) {
            self.0.fetch_sub(1, std::sync::atomic::Ordering::SeqCst);
        }
    }

    /// A list of numbers read as [`Live`] items, each said to hold `bytes`.
    struct Counted {
        live: std::sync::Arc<std::sync::atomic::AtomicUsize>,
        bytes: usize,
    }

    impl Layout for Counted {
        type Item = (Live, usize);
        type Extra = ();
        const LIST: &'static str = "items";
        const EXPECTING: &'static str = "the items";
        const EXTRA: Option<&'static str> = None;
        const KEPT: &'static [&'static str] = &[];

        fn item<'de, A: SeqAccess<'de>>(
            &self,
            seq: &mut A,
        ) -> Result<Option<(Live, usize)>, A::Error> {
            let v = seq.next_element::<IgnoredAny>()?;
            Ok(v.map(|_| {
                self.live.fetch_add(1, std::sync::atomic::Ordering::SeqCst);
                (Live(self.live.clone()), self.bytes)
            }))
        }

        fn extra<'de, A: SeqAccess<'de>>(&self, _seq: &mut A) -> Result<Option<()>, A::Error> {
            Ok(None)
        }

        fn bytes(item: &(Live, usize)) -> usize {
            item.1
        }
    }

    /// However long the list, at most the batches in the channel, the one
    /// waiting to be sent and the one being read are alive at once: BATCH
    /// items each, or fewer when the items are large (BATCH_BYTES a batch).
    #[test]
    fn a_stream_holds_a_few_batches_whatever_the_list() {
        let items = 40 * BATCH;
        let text = format!(r#"{{"items":[{}0]}}"#, "0,".repeat(items - 1));
        for (bytes, per_batch) in [(0, BATCH), (BATCH_BYTES / 4, 4)] {
            let live = std::sync::Arc::new(std::sync::atomic::AtomicUsize::new(0));
            let layout = Counted {
                live: live.clone(),
                bytes,
            };
            let mut s =
                PieceStream::open_as(file_of(&text), layout).unwrap_or_else(|e| panic!("{e}"));
            assert!(s.head().is_ok());
            let mut read = 0;
            let mut most = 0;
            while let Some(item) = s.next_item().unwrap_or_else(|e| panic!("{e}")) {
                drop(item);
                read += 1;
                // let the reading thread run ahead as far as it can
                if read % per_batch == 0 {
                    std::thread::yield_now();
                }
                most = most.max(live.load(std::sync::atomic::Ordering::SeqCst));
            }
            assert_eq!(read, items);
            assert!(most <= (WAITING + 2) * per_batch, "{most} alive");
            assert!(s.tail().is_ok());
        }
    }
}
