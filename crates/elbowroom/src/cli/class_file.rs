//! The class file of a Hessenberg table, for a split run: `hessenberg --save-class
//! FILE` writes every a^h_w once, in listing order; `hessenberg --shard K/M
//! --class FILE` then reads the values instead of expanding the class again, so
//! each piece costs its share of the rows.
//!
//! Layout (little-endian): the 16 bytes `ELBOWROOM-CLASS\n`; the format version
//! (u32); the build that wrote it (u64, a hash of the executable); n (u32) and
//! h(1..n) (one byte each); the length of the listing M(n, |h|) (u64); the
//! checksum of the values (u64); then one value per listed w, in lexicographic
//! order of w, each a zigzag LEB128 varint of an `i128`. A file is read only by
//! the build that wrote it, for the same n and h, after its checksum and its
//! count of values are checked; anything else is refused in one line.

use super::error::CliError;
use crate::atomic_write;
use crate::math::Progress;
use crate::math::hessenberg::function::HessenbergFn;
use crate::math::hessenberg::rows::{RowValue, for_each_class_value};
use std::fs::File;
use std::io::{BufReader, BufWriter, Read, Seek, SeekFrom, Write};
use std::path::{Path, PathBuf};
use std::sync::OnceLock;

const MAGIC: &[u8; 16] = b"ELBOWROOM-CLASS\n";
const FORMAT: u32 = 1;
const IO_BUFFER: usize = 1 << 20;

/// The build that runs: a 64-bit hash of the executable's bytes (0 when the
/// executable cannot be read, which no class file written elsewhere matches).
pub fn build_id() -> u64 {
    static ID: OnceLock<u64> = OnceLock::new();
    *ID.get_or_init(|| {
        let Ok(exe) = std::env::current_exe() else {
            return 0;
        };
        let Ok(file) = File::open(exe) else {
            return 0;
        };
        let mut hash = Checksum::default();
        let mut reader = BufReader::with_capacity(IO_BUFFER, file);
        let mut chunk = vec![0u8; IO_BUFFER];
        loop {
            match reader.read(&mut chunk) {
                Ok(0) => break,
                Ok(k) => hash.add(&chunk[..k]),
                Err(_) => return 0,
            }
        }
        hash.value()
    })
}

/// A checksum of a byte stream (FNV-1a over 8-byte words), against damage, not
/// against forgery.
#[derive(Clone, Copy)]
struct Checksum {
    state: u64,
    tail: [u8; 8],
    tail_len: usize,
}

impl Default for Checksum {
    fn default() -> Self {
        Checksum {
            state: 0xcbf2_9ce4_8422_2325,
            tail: [0; 8],
            tail_len: 0,
        }
    }
}

impl Checksum {
    fn word(&mut self, w: u64) {
        self.state = (self.state ^ w).wrapping_mul(0x0000_0100_0000_01b3);
        self.state ^= self.state >> 29;
    }

    fn add(&mut self, mut bytes: &[u8]) {
        while self.tail_len > 0 && !bytes.is_empty() {
            self.tail[self.tail_len] = bytes[0];
            self.tail_len += 1;
            bytes = &bytes[1..];
            if self.tail_len == 8 {
                self.word(u64::from_le_bytes(self.tail));
                self.tail_len = 0;
            }
        }
        let mut words = bytes.chunks_exact(8);
        for w in &mut words {
            let mut b = [0u8; 8];
            b.copy_from_slice(w);
            self.word(u64::from_le_bytes(b));
        }
        for &b in words.remainder() {
            self.tail[self.tail_len] = b;
            self.tail_len += 1;
        }
    }

    fn value(mut self) -> u64 {
        if self.tail_len > 0 {
            let mut b = [0u8; 8];
            b[..self.tail_len].copy_from_slice(&self.tail[..self.tail_len]);
            let w = u64::from_le_bytes(b) ^ ((self.tail_len as u64) << 56);
            self.word(w);
        }
        self.state
    }
}

/// The zigzag LEB128 varint of `v` into `out`; returns the bytes written.
fn encode(v: i128, out: &mut [u8; 19]) -> usize {
    let mut z = ((v << 1) ^ (v >> 127)) as u128;
    let mut k = 0;
    loop {
        let byte = (z & 0x7f) as u8;
        z >>= 7;
        if z == 0 {
            out[k] = byte;
            return k + 1;
        }
        out[k] = byte | 0x80;
        k += 1;
    }
}

fn header_bytes(h: &HessenbergFn, listed: u64, checksum: u64) -> Vec<u8> {
    let mut out = Vec::with_capacity(64);
    out.extend_from_slice(MAGIC);
    out.extend_from_slice(&FORMAT.to_le_bytes());
    out.extend_from_slice(&build_id().to_le_bytes());
    out.extend_from_slice(&(h.n() as u32).to_le_bytes());
    out.extend(h.values().iter().map(|&v| v as u8));
    out.extend_from_slice(&listed.to_le_bytes());
    out.extend_from_slice(&checksum.to_le_bytes());
    out
}

/// What a save wrote.
pub struct Saved {
    /// The number of values (M(n, |h|)).
    pub values: u64,
    /// The size of the file in bytes.
    pub bytes: u64,
    /// The number of nonzero values.
    pub nonzero: u64,
}

/// Computes the table of h and writes it to `path` (atomically, through a
/// temporary file beside it).
pub fn save(path: &Path, h: &HessenbergFn, progress: &Progress) -> Result<Saved, CliError> {
    let failed = |e: &dyn std::fmt::Display| {
        CliError::Failed(format!(
            "cannot write the class file {}: {e}",
            path.display()
        ))
    };
    let temp = atomic_write::temp_path(path, "saving").map_err(|e| failed(&e))?;
    let result = (|| -> Result<Saved, CliError> {
        let file = File::create(&temp).map_err(|e| failed(&e))?;
        let mut out = BufWriter::with_capacity(IO_BUFFER, file);
        let listed = crate::math::hessenberg::rows::size_class_table(h)? as u64;
        out.write_all(&header_bytes(h, listed, 0))
            .map_err(|e| failed(&e))?;
        let mut sum = Checksum::default();
        let mut bytes = 0u64;
        let mut nonzero = 0u64;
        let mut buf = [0u8; 19];
        let mut io_error: Option<std::io::Error> = None;
        let written = for_each_class_value(h, &|_| true, progress, &mut |row| {
            let v = match row.value {
                RowValue::Int(v) => v,
                RowValue::Big(v) => {
                    return Err(CliError::Input(format!(
                        "a^h_w = {v} does not fit the 128-bit integers of a class file"
                    )));
                }
            };
            if v != 0 {
                nonzero += 1;
            }
            let k = encode(v, &mut buf);
            sum.add(&buf[..k]);
            bytes += k as u64;
            if let Err(e) = out.write_all(&buf[..k]) {
                io_error = Some(e);
                return Err(CliError::Failed(String::new()));
            }
            Ok(())
        });
        if let Some(e) = io_error {
            return Err(failed(&e));
        }
        let values = written? as u64;
        let mut file = out
            .into_inner()
            .map_err(|e| failed(&e.error().to_string()))?;
        let head = header_bytes(h, listed, sum.value());
        file.seek(SeekFrom::Start(0)).map_err(|e| failed(&e))?;
        file.write_all(&head).map_err(|e| failed(&e))?;
        file.sync_all().map_err(|e| failed(&e))?;
        Ok(Saved {
            values,
            bytes: head.len() as u64 + bytes,
            nonzero,
        })
    })();
    match result {
        Ok(saved) => {
            atomic_write::replace(&temp, path).map_err(|e| failed(&e))?;
            Ok(saved)
        }
        Err(e) => {
            let _ = std::fs::remove_file(&temp);
            Err(e)
        }
    }
}

/// The values of a class file, read in listing order.
pub struct ClassReader {
    reader: BufReader<File>,
    path: PathBuf,
    remaining: u64,
}

impl ClassReader {
    /// Opens `path` for h, checking the format, the build, n, h, the length of
    /// the listing, the count of values and their checksum before any is read.
    pub fn open(path: &Path, h: &HessenbergFn, listed: u64) -> Result<ClassReader, CliError> {
        let shown = path.display();
        let refuse = |why: String| CliError::Input(format!("the class file {shown} {why}"));
        let file = File::open(path).map_err(|e| refuse(format!("cannot be read: {e}")))?;
        if !file.metadata().is_ok_and(|m| m.is_file()) {
            return Err(refuse("is not a regular file".into()));
        }
        let mut reader = BufReader::with_capacity(IO_BUFFER, file);
        let mut fixed = [0u8; 16 + 4 + 8 + 4];
        reader
            .read_exact(&mut fixed)
            .map_err(|_| refuse("is not a class file written by elbowroom".into()))?;
        if &fixed[..16] != MAGIC {
            return Err(refuse("is not a class file written by elbowroom".into()));
        }
        let word = |at: usize| {
            u32::from_le_bytes([fixed[at], fixed[at + 1], fixed[at + 2], fixed[at + 3]])
        };
        if word(16) != FORMAT {
            return Err(refuse(format!(
                "has format {}; this build reads format {FORMAT}",
                word(16)
            )));
        }
        let mut build = [0u8; 8];
        build.copy_from_slice(&fixed[20..28]);
        if u64::from_le_bytes(build) != build_id() {
            return Err(refuse(
                "was written by another build of elbowroom; save it again with this one".into(),
            ));
        }
        let n = word(28) as usize;
        let mut values = vec![0u8; n.min(64)];
        reader
            .read_exact(&mut values)
            .map_err(|_| refuse("is cut short".into()))?;
        let saved_h: Vec<usize> = values.iter().map(|&v| usize::from(v)).collect();
        if n != h.n() || saved_h != h.values() {
            let parts: Vec<String> = saved_h.iter().map(|v| v.to_string()).collect();
            return Err(refuse(format!(
                "holds the class of n = {n}, h = ({}), not of n = {}, h = {h}",
                parts.join(","),
                h.n()
            )));
        }
        let mut tail = [0u8; 16];
        reader
            .read_exact(&mut tail)
            .map_err(|_| refuse("is cut short".into()))?;
        let mut a = [0u8; 8];
        a.copy_from_slice(&tail[..8]);
        let saved_listed = u64::from_le_bytes(a);
        a.copy_from_slice(&tail[8..]);
        let saved_sum = u64::from_le_bytes(a);
        if saved_listed != listed {
            return Err(refuse(format!(
                "lists {saved_listed} permutations, not the {listed} of h = {h}"
            )));
        }
        let start = reader
            .stream_position()
            .map_err(|e| refuse(format!("cannot be read: {e}")))?;
        // the checksum and the count of values, before any row is written
        let mut sum = Checksum::default();
        let mut count = 0u64;
        let mut chunk = vec![0u8; IO_BUFFER];
        let mut last = 0u8;
        loop {
            let k = reader
                .read(&mut chunk)
                .map_err(|e| refuse(format!("cannot be read: {e}")))?;
            if k == 0 {
                break;
            }
            sum.add(&chunk[..k]);
            count += chunk[..k].iter().filter(|&&b| b & 0x80 == 0).count() as u64;
            last = chunk[k - 1];
        }
        if sum.value() != saved_sum || count != listed || (listed > 0 && last & 0x80 != 0) {
            return Err(refuse(
                "is damaged (its checksum or its count of values is wrong)".into(),
            ));
        }
        reader
            .seek(SeekFrom::Start(start))
            .map_err(|e| refuse(format!("cannot be read: {e}")))?;
        Ok(ClassReader {
            reader,
            path: path.to_path_buf(),
            remaining: listed,
        })
    }

    /// The next value, in listing order.
    pub fn next_value(&mut self) -> Result<i128, CliError> {
        let damaged = || {
            CliError::Failed(format!(
                "the class file {} changed while it was read",
                self.path.display()
            ))
        };
        if self.remaining == 0 {
            return Err(damaged());
        }
        self.remaining -= 1;
        let mut z: u128 = 0;
        let mut shift = 0u32;
        loop {
            let mut b = [0u8; 1];
            self.reader.read_exact(&mut b).map_err(|_| damaged())?;
            if shift >= 128 {
                return Err(damaged());
            }
            z |= u128::from(b[0] & 0x7f) << shift;
            if b[0] & 0x80 == 0 {
                break;
            }
            shift += 7;
        }
        Ok(((z >> 1) as i128) ^ -((z & 1) as i128))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn varints_round_trip() {
        for v in [
            0i128,
            1,
            -1,
            63,
            64,
            -64,
            -65,
            1 << 40,
            i128::MAX,
            i128::MIN,
        ] {
            let mut buf = [0u8; 19];
            let k = encode(v, &mut buf);
            let mut z: u128 = 0;
            for (s, b) in buf[..k].iter().enumerate() {
                z |= u128::from(b & 0x7f) << (7 * s);
            }
            assert_eq!(((z >> 1) as i128) ^ -((z & 1) as i128), v);
            assert!(buf[..k - 1].iter().all(|b| b & 0x80 != 0) && buf[k - 1] & 0x80 == 0);
        }
    }

    #[test]
    fn the_checksum_sees_a_changed_byte_and_the_cut() {
        let data: Vec<u8> = (0..1000u32).map(|x| (x * 7 % 251) as u8).collect();
        let whole = {
            let mut c = Checksum::default();
            c.add(&data);
            c.value()
        };
        let split = {
            let mut c = Checksum::default();
            c.add(&data[..13]);
            c.add(&data[13..]);
            c.value()
        };
        assert_eq!(whole, split);
        let mut changed = data.clone();
        changed[500] ^= 1;
        let mut c = Checksum::default();
        c.add(&changed);
        assert_ne!(c.value(), whole);
        let mut c = Checksum::default();
        c.add(&data[..999]);
        assert_ne!(c.value(), whole);
    }
}
