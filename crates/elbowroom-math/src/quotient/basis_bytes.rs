//! The reduced Gröbner basis of J_n as bytes, and back: the form in which a program
//! may keep a finished basis (for instance in a cache file) instead of building it again.
//!
//! Layout (all integers little-endian):
//!
//! | bytes | what |
//! |---|---|
//! | 8 | the tag `ELBQJN\r\n` |
//! | 4 | [`FORMAT_VERSION`] |
//! | 1 + k | the math crate's version: its length k, then its text |
//! | 1 | n |
//! | 8 | the payload's length |
//! | 8 | FNV-1a (64 bits) of the payload |
//! | ... | the payload |
//!
//! The payload holds the rows used per degree and, per basis element in decreasing order
//! of its corner, the corner's exponents (n bytes) and its tail as (gap to the previous
//! basis position, coefficient) pairs in LEB128 varints (coefficients zigzag-encoded).
//! The standard monomials are not stored: they follow from n.
//!
//! Reading checks everything before trusting anything: the tag, the format and crate
//! versions, n, the length, the checksum, and then the mathematics' shape: the corners are
//! exactly the corners of degrees 1..n, each once and in order; every tail term is a
//! standard monomial of the corner's degree, below the corner, positions strictly
//! increasing, coefficients nonzero; tails of degree n are empty; no byte is left over.
//! A basis that passes came from [`to_bytes`] of some finished basis and was not damaged
//! (up to a 64-bit checksum collision); whether it is the basis of J_n is then checked by
//! [`crate::quotient::groebner::QuasiGroebner::certify`].

use crate::error::{MathError, MathResult};
use crate::poly::compositions::monomials_of_degree;
use crate::poly::mono::Mono;
use crate::quotient::groebner::{GroebnerElement, MAX_QUOTIENT_N, QuasiGroebner};
use crate::quotient::standard::is_corner;

/// The tag at the start of the bytes of a basis.
pub const TAG: &[u8; 8] = b"ELBQJN\r\n";

/// The version of the layout; a change of layout raises it, and older bytes are refused.
pub const FORMAT_VERSION: u32 = 1;

/// The version of the math crate that wrote the bytes (bytes of another version are refused).
pub const CRATE_VERSION: &str = env!("CARGO_PKG_VERSION");

/// FNV-1a, 64 bits, of `bytes`.
///
/// ```
/// use elbowroom_math::quotient::basis_bytes::fnv1a64;
/// // the published test vectors of FNV-1a 64 (Fowler–Noll–Vo): "" and "a"
/// assert_eq!(fnv1a64(b""), 0xcbf2_9ce4_8422_2325);
/// assert_eq!(fnv1a64(b"a"), 0xaf63_dc4c_8601_ec8c);
/// ```
pub fn fnv1a64(bytes: &[u8]) -> u64 {
    let mut h: u64 = 0xcbf2_9ce4_8422_2325;
    for &b in bytes {
        h ^= b as u64;
        h = h.wrapping_mul(0x0000_0100_0000_01b3);
    }
    h
}

fn put_varint(out: &mut Vec<u8>, mut x: u128) {
    loop {
        let b = (x & 0x7f) as u8;
        x >>= 7;
        if x == 0 {
            out.push(b);
            return;
        }
        out.push(b | 0x80);
    }
}

fn zigzag(x: i128) -> u128 {
    ((x << 1) ^ (x >> 127)) as u128
}

fn unzigzag(x: u128) -> i128 {
    ((x >> 1) as i128) ^ -((x & 1) as i128)
}

fn bad(what: &str) -> MathError {
    MathError::InvalidInput(format!("not a basis of J_n: {what}"))
}

/// A reader over the payload that fails cleanly at its end.
struct Reader<'a> {
    bytes: &'a [u8],
    at: usize,
}

impl<'a> Reader<'a> {
    fn take(&mut self, k: usize) -> MathResult<&'a [u8]> {
        let end = self
            .at
            .checked_add(k)
            .filter(|&e| e <= self.bytes.len())
            .ok_or_else(|| bad("it ends early"))?;
        let s = &self.bytes[self.at..end];
        self.at = end;
        Ok(s)
    }

    fn varint(&mut self) -> MathResult<u128> {
        let mut x = 0u128;
        for shift in (0..128).step_by(7) {
            let b = self.take(1)?[0];
            x |= ((b & 0x7f) as u128) << shift;
            if b & 0x80 == 0 {
                return Ok(x);
            }
        }
        Err(bad("a number is too long"))
    }

    fn small(&mut self, limit: usize) -> MathResult<usize> {
        let x = self.varint()?;
        usize::try_from(x)
            .ok()
            .filter(|&x| x <= limit)
            .ok_or_else(|| bad("a count is out of range"))
    }
}

/// The bytes of a finished basis (see the module doc for the layout).
///
/// ```
/// use elbowroom_math::quotient::{basis_bytes::{from_bytes, to_bytes}, groebner::QuasiGroebner};
/// let g = QuasiGroebner::compute(4, None).unwrap();
/// assert_eq!(from_bytes(&to_bytes(&g)).unwrap(), g);
/// ```
pub fn to_bytes(g: &QuasiGroebner) -> Vec<u8> {
    let n = g.n();
    let mut payload = Vec::new();
    put_varint(&mut payload, g.rows_used().len() as u128);
    for &r in g.rows_used() {
        put_varint(&mut payload, r as u128);
    }
    put_varint(&mut payload, g.elements().len() as u128);
    for e in g.elements() {
        payload.extend(e.corner.exps(n).iter().map(|&x| x as u8));
        put_varint(&mut payload, e.tail.len() as u128);
        let mut prev = 0usize;
        for &(m, a) in &e.tail {
            let pos = g.basis_position(m).unwrap_or(0);
            put_varint(&mut payload, (pos - prev.min(pos)) as u128);
            prev = pos;
            put_varint(&mut payload, zigzag(a));
        }
    }
    let mut out = Vec::with_capacity(payload.len() + 40);
    out.extend_from_slice(TAG);
    out.extend_from_slice(&FORMAT_VERSION.to_le_bytes());
    out.push(CRATE_VERSION.len() as u8);
    out.extend_from_slice(CRATE_VERSION.as_bytes());
    out.push(n as u8);
    out.extend_from_slice(&(payload.len() as u64).to_le_bytes());
    out.extend_from_slice(&fnv1a64(&payload).to_le_bytes());
    out.extend_from_slice(&payload);
    out
}

/// What the header of the bytes says, read without the payload.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Header {
    /// The layout's version.
    pub format_version: u32,
    /// The math crate's version that wrote them.
    pub crate_version: String,
    /// The number of variables.
    pub n: usize,
}

/// Reads and checks the header; returns it and the payload (length checked, checksum not yet).
fn split(bytes: &[u8]) -> MathResult<(Header, &[u8], u64)> {
    let mut r = Reader { bytes, at: 0 };
    if r.take(8)? != TAG {
        return Err(bad("the tag is missing"));
    }
    let mut v = [0u8; 4];
    v.copy_from_slice(r.take(4)?);
    let format_version = u32::from_le_bytes(v);
    let k = r.take(1)?[0] as usize;
    let crate_version = String::from_utf8_lossy(r.take(k)?).into_owned();
    let n = r.take(1)?[0] as usize;
    let mut l = [0u8; 8];
    l.copy_from_slice(r.take(8)?);
    let len = u64::from_le_bytes(l);
    l.copy_from_slice(r.take(8)?);
    let sum = u64::from_le_bytes(l);
    let header = Header {
        format_version,
        crate_version,
        n,
    };
    let rest = &bytes[r.at..];
    if rest.len() as u64 != len {
        return Err(bad("its length differs from the one its header gives"));
    }
    Ok((header, rest, sum))
}

/// The header of the bytes of a basis, checked for the tag only.
pub fn header(bytes: &[u8]) -> MathResult<Header> {
    split(bytes).map(|t| t.0)
}

/// Reads a basis written by [`to_bytes`], checking everything listed in the module doc;
/// any failure is an error saying what was wrong, and nothing is trusted.
pub fn from_bytes(bytes: &[u8]) -> MathResult<QuasiGroebner> {
    let (h, payload, sum) = split(bytes)?;
    if h.format_version != FORMAT_VERSION {
        return Err(bad(&format!(
            "layout version {} (this program reads {FORMAT_VERSION})",
            h.format_version
        )));
    }
    if h.crate_version != CRATE_VERSION {
        return Err(bad(&format!(
            "written by version {} (this is {CRATE_VERSION})",
            h.crate_version
        )));
    }
    let n = h.n;
    if n == 0 || n > MAX_QUOTIENT_N {
        return Err(bad(&format!("n = {n} is out of range")));
    }
    if fnv1a64(payload) != sum {
        return Err(bad("the checksum differs"));
    }
    let basis = QuasiGroebner::standard_basis(n);
    let mut r = Reader {
        bytes: payload,
        at: 0,
    };
    let k = r.small(n + 1)?;
    let mut rows_used = Vec::with_capacity(k);
    for _ in 0..k {
        rows_used.push(r.small(usize::MAX)?);
    }
    let mut corners: Vec<Mono> = (1..=n as u32)
        .flat_map(|d| monomials_of_degree(n, d))
        .filter(|m| is_corner(&m.exps(n)))
        .collect();
    corners.sort_unstable_by(|a, b| b.cmp(a));
    if r.small(corners.len())? != corners.len() {
        return Err(bad("the number of elements is not the number of corners"));
    }
    let mut elements = Vec::with_capacity(corners.len());
    for &c in &corners {
        let e: Vec<u32> = r.take(n)?.iter().map(|&x| x as u32).collect();
        if Mono::from_exps(&e) != Some(c) {
            return Err(bad("an element's corner is not the expected one"));
        }
        let len = r.small(basis.len())?;
        let mut tail = Vec::with_capacity(len);
        let mut pos = 0usize;
        for i in 0..len {
            let gap = r.small(basis.len())?;
            if i > 0 && gap == 0 {
                return Err(bad("a tail repeats a monomial"));
            }
            pos = pos
                .checked_add(gap)
                .filter(|&p| p < basis.len())
                .ok_or_else(|| bad("a tail names no standard monomial"))?;
            let m = basis[pos];
            if m.degree() != c.degree() || m >= c {
                return Err(bad(
                    "a tail term has the wrong degree or is not below its corner",
                ));
            }
            let a = unzigzag(r.varint()?);
            if a == 0 {
                return Err(bad("a tail has a zero coefficient"));
            }
            tail.push((m, a));
        }
        elements.push(GroebnerElement { corner: c, tail });
    }
    if r.at != payload.len() {
        return Err(bad("bytes are left over"));
    }
    Ok(QuasiGroebner::from_parts(n, elements, basis, rows_used))
}
