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
}

impl<'a> Sink<'a> {
    /// A sink writing to `out`, called `name` in messages.
    pub fn new(out: &'a mut dyn Write, name: &str) -> Sink<'a> {
        Sink {
            out,
            name: name.into(),
            closed_pipe: false,
            written: 0,
            last_byte: None,
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
        if let Err(e) = self.out.write_all(s.as_bytes()) {
            return Err(self.failed(e));
        }
        self.written += s.len() as u64;
        self.last_byte = s.as_bytes().last().copied();
        Ok(())
    }

    /// Writes one JSON value, compact (serde_json's own text, as [`super::json::render`]).
    pub fn json(&mut self, v: &Value) -> Result<(), CliError> {
        let text = serde_json::to_string(v).unwrap_or_else(|_| "null".into());
        self.text(&text)
    }

    /// Writes the JSON object `head` with one more field, `key`, last: an array
    /// of `items` streamed one by one (each one polled for a cancel and counted
    /// on `progress` and `written`), then a newline: the same text as the whole
    /// object with `key` inserted last (serde_json keeps insertion order here).
    pub fn json_listing<T>(
        &mut self,
        head: &Value,
        key: &str,
        items: impl IntoIterator<Item = T>,
        item: impl Fn(T) -> Value,
        progress: &crate::math::Progress,
        written: &mut u64,
    ) -> Result<(), CliError> {
        let head = super::json::render(head);
        self.text(&head[..head.len() - 1])?;
        self.text(&format!(",\"{key}\":["))?;
        for (k, x) in items.into_iter().enumerate() {
            progress.check()?;
            if k > 0 {
                self.text(",")?;
            }
            self.json(&item(x))?;
            progress.advance(1);
            *written += 1;
        }
        self.text("]}\n")
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
        assert!(sink.text("x").is_err());
        assert!(sink.closed_pipe());
        let mut buf = Vec::new();
        let mut sink = Sink::new(&mut buf, "a buffer");
        sink.whole("a").unwrap();
        sink.whole("b\n").unwrap();
        assert_eq!(buf, b"a\nb\n");
    }
}
