//! Where a command's output goes: a [`Sink`] over a bounded buffer, written as
//! the rows are produced, so a long listing never sits in memory whole.
//!
//! A failed write becomes [`CliError::Failed`] ("cannot write standard output:
//! reason", exit status 1); a closed pipe (`| head`) is remembered so that the
//! runner can end quietly, since the reader has what it wanted.

use super::error::CliError;
use serde_json::Value;
use std::io::{ErrorKind, Write};

/// The buffer between the rows and standard output (bytes).
pub const BUFFER: usize = 1 << 16;

/// A command's output stream.
pub struct Sink<'a> {
    out: &'a mut dyn Write,
    /// Where the output goes, for messages ("standard output").
    name: String,
    closed_pipe: bool,
    written: u64,
    last_byte: Option<u8>,
    /// The format whose cut marker ends a cut-short output, if one is to be written.
    cut: Option<super::cut_short::Format>,
    /// The first line written (up to [`HEAD_KEPT`] bytes), for the CSV marker.
    head: String,
    /// Whether the first line is complete (and the marker recorded for a signal).
    head_done: bool,
}

/// How much of the first line a sink keeps for its cut marker.
const HEAD_KEPT: usize = 1 << 16;

impl<'a> Sink<'a> {
    /// A sink writing to `out`, called `name` in messages.
    pub fn new(out: &'a mut dyn Write, name: &str) -> Sink<'a> {
        Sink {
            out,
            name: name.into(),
            closed_pipe: false,
            written: 0,
            last_byte: None,
            cut: None,
            head: String::new(),
            head_done: false,
        }
    }

    /// A sink that, when the output is cut short ([`Sink::cut_short`], or a
    /// signal ending the process), ends it with the marker of `format`
    /// ([`super::cut_short`]).
    pub fn with_cut_marker(mut self, format: super::cut_short::Format) -> Sink<'a> {
        self.cut = Some(format);
        self
    }

    /// Keeps the first line and, once it is complete, records the marker a
    /// signal would write.
    fn note_head(&mut self, s: &str) {
        let Some(format) = self.cut else {
            return;
        };
        let line = s.split('\n').next().unwrap_or("");
        if self.head.len() < HEAD_KEPT {
            let room = HEAD_KEPT - self.head.len();
            let mut end = line.len().min(room);
            while !line.is_char_boundary(end) {
                end -= 1;
            }
            self.head.push_str(&line[..end]);
        }
        if s.contains('\n') || self.head.len() >= HEAD_KEPT {
            self.head_done = true;
            super::cut_short::set_pending(Some(format.marker(&self.head, false)));
        }
    }

    /// Ends an output that stopped before it was complete with the marker of
    /// its format (nothing when nothing was written, when the reader closed
    /// the pipe, or when the sink has no marker); a failure to write it is
    /// left unreported, as the run is failing already.
    pub fn cut_short(&mut self) {
        super::cut_short::set_pending(None);
        let Some(format) = self.cut else {
            return;
        };
        if self.written == 0 || self.closed_pipe {
            return;
        }
        let marker = format.marker(&self.head, self.last_byte == Some(b'\n'));
        let _ = self.out.write_all(marker.as_bytes());
        let _ = self.out.flush();
    }

    /// Forgets the marker a signal would write (the output is complete).
    pub fn finished(&mut self) {
        if self.cut.is_some() {
            super::cut_short::set_pending(None);
        }
    }

    fn failed(&mut self, e: std::io::Error) -> CliError {
        if e.kind() == ErrorKind::BrokenPipe {
            self.closed_pipe = true;
        }
        CliError::Failed(format!("cannot write {}: {e}", self.name))
    }

    /// Writes text as it is.
    pub fn text(&mut self, s: &str) -> Result<(), CliError> {
        if s.is_empty() {
            return Ok(());
        }
        if !self.head_done {
            self.note_head(s);
        }
        if let Err(e) = self.out.write_all(s.as_bytes()) {
            return Err(self.failed(e));
        }
        self.written += s.len() as u64;
        self.last_byte = s.as_bytes().last().copied();
        Ok(())
    }

    /// Writes one JSON value, compact (serde_json's own text, as [`super::json::render`]).
    pub fn json(&mut self, v: &Value) -> Result<(), CliError> {
        self.text(&v.to_string())
    }

    /// Writes the JSON object `head` with one more field, `key`, last: an array
    /// of `items` streamed one by one (each one polled for a cancel and counted
    /// on `progress` and `written`), then a newline: the same text as the whole
    /// object with `key` inserted last ([`super::json::open_list`]).
    pub fn json_listing<T, R: serde::Serialize>(
        &mut self,
        head: &impl serde::Serialize,
        key: &str,
        items: impl IntoIterator<Item = T>,
        item: impl Fn(T) -> R,
        progress: &crate::math::Progress,
        written: &mut u64,
    ) -> Result<(), CliError> {
        self.text(&super::json::open_list(head, key)?)?;
        for (k, x) in items.into_iter().enumerate() {
            progress.check()?;
            if k > 0 {
                self.text(",")?;
            }
            self.text(&super::json::text(&item(x))?)?;
            progress.advance(1);
            *written += 1;
        }
        self.text("]}\n")
    }

    /// A listing as JSON Lines (`--jsonl`): a header line `{"kind": KIND, ...head}`, one
    /// line per item (each item's object), then `{"summary": KIND, "count": rows}`.
    #[allow(clippy::too_many_arguments)]
    pub fn json_lines_listing<T, R: serde::Serialize>(
        &mut self,
        kind: &str,
        head: &impl serde::Serialize,
        items: impl IntoIterator<Item = T>,
        item: impl Fn(T) -> R,
        progress: &crate::math::Progress,
        written: &mut u64,
    ) -> Result<(), CliError> {
        #[derive(serde::Serialize)]
        struct Header<'a, H> {
            kind: &'a str,
            #[serde(flatten)]
            head: &'a H,
        }
        #[derive(serde::Serialize)]
        struct Summary<'a> {
            summary: &'a str,
            count: u64,
        }
        self.text(&super::json::line(&Header { kind, head }))?;
        self.text("\n")?;
        let mut rows = 0u64;
        for x in items {
            progress.check()?;
            self.text(&super::json::line(&item(x)))?;
            self.text("\n")?;
            progress.advance(1);
            *written += 1;
            rows += 1;
        }
        self.text(&super::json::line(&Summary {
            summary: kind,
            count: rows,
        }))?;
        self.text("\n")
    }

    /// Writes a whole output collected as one string, ending it with a newline.
    pub fn whole(&mut self, s: &str) -> Result<(), CliError> {
        self.text(s)?;
        self.end_line()
    }

    /// Ends the output with a newline unless it already ends with one.
    pub fn end_line(&mut self) -> Result<(), CliError> {
        if self.last_byte != Some(b'\n') {
            self.text("\n")?;
        }
        Ok(())
    }

    /// Flushes the buffer: a write that fails only now is still an error.
    pub fn flush(&mut self) -> Result<(), CliError> {
        if let Err(e) = self.out.flush() {
            return Err(self.failed(e));
        }
        Ok(())
    }

    /// Whether a write failed because the reader closed the pipe.
    pub fn closed_pipe(&self) -> bool {
        self.closed_pipe
    }

    /// The bytes written so far.
    pub fn written(&self) -> u64 {
        self.written
    }
}

/// Rendered rows kept in memory up to this many bytes; beyond, they go to a
/// temporary file.
pub const KEPT_IN_MEMORY: usize = 8 << 20;

/// How the temporary file's name starts (the rest is random).
const SPILL_PREFIX: &str = "elbowroom-rows-";

/// The environment variable that sets another [`KEPT_IN_MEMORY`] (bytes; `0`:
/// every row goes to the temporary file), so that tests reach the file with
/// small listings.
pub const KEPT_IN_MEMORY_ENV: &str = "ELBOWROOM_ROWS_IN_MEMORY";

/// Rows produced out of order (each one's text rendered at once), written back
/// in listing order: kept in memory up to [`KEPT_IN_MEMORY`] bytes, then in a
/// temporary file in [`std::env::temp_dir`] (unique, and without a name once open), so what is held
/// is 16 bytes a listing position, whatever the rows' length. Besides the rows,
/// a few positions may carry a second text (a survey's counterexamples), written
/// after all the rows, in listing order too.
pub struct Reorder {
    limit: usize,
    memory: Vec<u8>,
    file: Option<Spill>,
    /// Where the store ends (memory, then the file).
    end: u64,
    /// (offset, length) of each position's row; `u64::MAX` while it has none.
    rows: Vec<(u64, u64)>,
    /// (position, offset, length) of the second texts, in the order given.
    extras: Vec<(usize, u64, u64)>,
    read: Vec<u8>,
}

/// The temporary file of a [`Reorder`]: made by `tempfile` with a unique name
/// in [`std::env::temp_dir`], and unlinked at once (the open file has no name,
/// so two runs never meet on it and nothing is left however the run ends).
struct Spill {
    /// The name it was made under, for messages.
    path: std::path::PathBuf,
    file: std::io::BufWriter<std::fs::File>,
}

impl Reorder {
    /// A store for the rows of `positions` listing positions, keeping
    /// [`KEPT_IN_MEMORY`] bytes (or what [`KEPT_IN_MEMORY_ENV`] says) in memory.
    pub fn new(positions: usize) -> Reorder {
        let limit = std::env::var(KEPT_IN_MEMORY_ENV)
            .ok()
            .and_then(|v| v.parse().ok())
            .unwrap_or(KEPT_IN_MEMORY);
        Reorder::with_limit(positions, limit)
    }

    /// A store keeping up to `limit` bytes in memory.
    pub fn with_limit(positions: usize, limit: usize) -> Reorder {
        Reorder {
            limit,
            memory: Vec::new(),
            file: None,
            end: 0,
            rows: vec![(u64::MAX, 0); positions],
            extras: Vec::new(),
            read: Vec::new(),
        }
    }

    /// Whether the rows went to a temporary file.
    pub fn spilled(&self) -> bool {
        self.file.is_some()
    }

    fn spill_error(path: &std::path::Path, e: std::io::Error) -> CliError {
        CliError::Failed(format!(
            "cannot write the temporary file {}: {e}",
            path.display()
        ))
    }

    /// Appends text to the store; where it starts.
    fn append(&mut self, text: &str) -> Result<u64, CliError> {
        let at = self.end;
        if self.file.is_none() && self.memory.len() + text.len() > self.limit {
            let dir = std::env::temp_dir();
            let named = tempfile::Builder::new()
                .prefix(SPILL_PREFIX)
                .suffix(".tmp")
                .tempfile_in(&dir)
                .map_err(|e| {
                    // the name is unknown when it could not be made: its pattern
                    let reason = e
                        .raw_os_error()
                        .map_or(e, std::io::Error::from_raw_os_error);
                    Reorder::spill_error(&dir.join(format!("{SPILL_PREFIX}*.tmp")), reason)
                })?;
            let path = named.path().to_path_buf();
            let file = named.into_file();
            let mut spill = Spill {
                path,
                file: std::io::BufWriter::with_capacity(BUFFER, file),
            };
            if let Err(e) = spill.file.write_all(&self.memory) {
                return Err(Reorder::spill_error(&spill.path, e));
            }
            self.memory = Vec::new();
            self.file = Some(spill);
        }
        match self.file.as_mut() {
            Some(spill) => {
                if let Err(e) = spill.file.write_all(text.as_bytes()) {
                    return Err(Reorder::spill_error(&spill.path, e));
                }
            }
            None => self.memory.extend_from_slice(text.as_bytes()),
        }
        self.end += text.len() as u64;
        Ok(at)
    }

    /// Keeps the row of listing position `i`.
    pub fn row(&mut self, i: usize, text: &str) -> Result<(), CliError> {
        if i >= self.rows.len() {
            return Err(CliError::Failed(format!(
                "internal: row {i} of a listing of {}",
                self.rows.len()
            )));
        }
        let at = self.append(text)?;
        self.rows[i] = (at, text.len() as u64);
        Ok(())
    }

    /// Keeps a second text for listing position `i`.
    pub fn extra(&mut self, i: usize, text: &str) -> Result<(), CliError> {
        let at = self.append(text)?;
        self.extras.push((i, at, text.len() as u64));
        Ok(())
    }

    /// The number of second texts kept.
    pub fn extras(&self) -> usize {
        self.extras.len()
    }

    fn fetch(&mut self, at: u64, len: u64) -> Result<&str, CliError> {
        let bytes: &[u8] = match self.file.as_mut() {
            None => self
                .memory
                .get(at as usize..(at + len) as usize)
                .unwrap_or(&[]),
            Some(spill) => {
                use std::io::{Read, Seek, SeekFrom};
                let failed = |path: &std::path::Path, e: std::io::Error| {
                    CliError::Failed(format!(
                        "cannot read the temporary file {}: {e}",
                        path.display()
                    ))
                };
                if let Err(e) = spill.file.flush() {
                    return Err(Reorder::spill_error(&spill.path, e));
                }
                let file = spill.file.get_mut();
                self.read.resize(len as usize, 0);
                if let Err(e) = file
                    .seek(SeekFrom::Start(at))
                    .and_then(|_| file.read_exact(&mut self.read))
                {
                    return Err(failed(&spill.path, e));
                }
                &self.read
            }
        };
        std::str::from_utf8(bytes)
            .map_err(|_| CliError::Failed("internal: a kept row is not text".into()))
    }

    /// Writes the rows in listing order to `sink`, `sep` between two, each one
    /// after `before(k)` (k rows written so far: a cancel check); every position
    /// must have its row.
    pub fn write_rows(
        &mut self,
        sink: &mut Sink<'_>,
        sep: &str,
        before: &mut dyn FnMut(u64) -> Result<(), CliError>,
    ) -> Result<(), CliError> {
        for i in 0..self.rows.len() {
            let (at, len) = self.rows[i];
            if at == u64::MAX {
                return Err(CliError::Failed(format!(
                    "internal: listing position {i} has no row"
                )));
            }
            before(i as u64)?;
            if i > 0 {
                sink.text(sep)?;
            }
            let text = self.fetch(at, len)?;
            sink.text(text)?;
        }
        Ok(())
    }

    /// Writes the second texts in listing order, `sep` between two.
    pub fn write_extras(&mut self, sink: &mut Sink<'_>, sep: &str) -> Result<(), CliError> {
        let mut extras = std::mem::take(&mut self.extras);
        extras.sort_by_key(|e| e.0);
        for (k, &(_, at, len)) in extras.iter().enumerate() {
            if k > 0 {
                sink.text(sep)?;
            }
            let text = self.fetch(at, len)?;
            sink.text(text)?;
        }
        Ok(())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_full_device_is_an_error_and_a_closed_pipe_is_remembered() {
        struct Refuses(ErrorKind);
        impl Write for Refuses {
            fn write(&mut self, _: &[u8]) -> std::io::Result<usize> {
                Err(std::io::Error::from(self.0))
            }
            fn flush(&mut self) -> std::io::Result<()> {
                Ok(())
            }
        }
        let mut full = Refuses(ErrorKind::StorageFull);
        let mut sink = Sink::new(&mut full, "standard output");
        let e = sink.text("x").unwrap_err();
        assert!(e.message().starts_with("cannot write standard output: "));
        assert_eq!(e.exit_code(), 1);
        assert!(!sink.closed_pipe());
        let mut pipe = Refuses(ErrorKind::BrokenPipe);
        let mut sink = Sink::new(&mut pipe, "standard output");
        assert!(matches!(sink.text("x"), Err(CliError::Failed(_))));
        assert!(sink.closed_pipe());
        let mut buf = Vec::new();
        let mut sink = Sink::new(&mut buf, "a buffer");
        sink.whole("a").unwrap();
        sink.whole("b\n").unwrap();
        assert_eq!(buf, b"a\nb\n");
    }

    /// Rows given out of order come back in listing order, the same from memory
    /// and from the temporary file; the second texts after them, in order too.
    #[test]
    fn rows_come_back_in_listing_order() {
        let order = [3usize, 0, 4, 1, 2];
        for limit in [usize::MAX, 0, 7] {
            let mut store = Reorder::with_limit(order.len(), limit);
            for &i in &order {
                store.row(i, &format!("row {i};")).unwrap();
                if i % 2 == 0 {
                    store.extra(i, &format!("extra {i}")).unwrap();
                }
            }
            assert_eq!(store.spilled(), limit != usize::MAX);
            assert_eq!(store.extras(), 3);
            let mut buf = Vec::new();
            let mut sink = Sink::new(&mut buf, "a buffer");
            let mut seen = Vec::new();
            store
                .write_rows(&mut sink, "|", &mut |k| {
                    seen.push(k);
                    Ok(())
                })
                .unwrap();
            sink.text(" / ").unwrap();
            store.write_extras(&mut sink, ",").unwrap();
            assert_eq!(seen, vec![0, 1, 2, 3, 4]);
            assert_eq!(
                String::from_utf8(buf).unwrap(),
                "row 0;|row 1;|row 2;|row 3;|row 4; / extra 0,extra 2,extra 4"
            );
        }
        // a position left without its row is an error, not a gap
        let mut store = Reorder::with_limit(2, usize::MAX);
        store.row(1, "b").unwrap();
        let mut buf = Vec::new();
        let mut sink = Sink::new(&mut buf, "a buffer");
        assert!(matches!(
            store.write_rows(&mut sink, "", &mut |_| Ok(())),
            Err(CliError::Failed(_))
        ));
        assert!(matches!(store.row(2, "c"), Err(CliError::Failed(_))));
    }
}
