//! Inputs as messages quote them: at most [`QUOTE_LIMIT`] characters, with
//! control characters escaped, so that a refusal stays one short line
//! whatever was typed or read from a file.

use crate::limits::QUOTE_LIMIT;

/// `text` as a message quotes it: control characters escaped (`\n`, `\t`,
/// `\r`, `\u{1b}`, ...), and cut to its first [`QUOTE_LIMIT`] characters with
/// `…` when longer.
pub fn excerpt(text: &str) -> String {
    let mut out = String::new();
    for (k, ch) in text.chars().enumerate() {
        if k == QUOTE_LIMIT {
            out.push('…');
            break;
        }
        push_escaped(&mut out, ch);
    }
    out
}

/// A whole line with its control characters escaped (for a message built
/// from several parts, so it cannot span several lines or drive the terminal).
pub fn escape_controls(text: &str) -> String {
    if !text.chars().any(char::is_control) {
        return text.to_string();
    }
    let mut out = String::with_capacity(text.len() + 8);
    for ch in text.chars() {
        push_escaped(&mut out, ch);
    }
    out
}

fn push_escaped(out: &mut String, ch: char) {
    match ch {
        '\n' => out.push_str("\\n"),
        '\t' => out.push_str("\\t"),
        '\r' => out.push_str("\\r"),
        c if c.is_control() => out.push_str(&format!("\\u{{{:x}}}", c as u32)),
        c => out.push(c),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn excerpts_are_short_and_on_one_line() {
        assert_eq!(excerpt("1\n2"), "1\\n2");
        assert_eq!(excerpt("a\u{1b}[31mb"), "a\\u{1b}[31mb");
        let long = "7".repeat(1000);
        let e = excerpt(&long);
        assert_eq!(e.chars().count(), QUOTE_LIMIT + 1);
        assert!(e.ends_with('…'));
        assert_eq!(excerpt(&"8".repeat(QUOTE_LIMIT)), "8".repeat(QUOTE_LIMIT));
        assert_eq!(escape_controls("x\0y"), "x\\u{0}y");
    }
}
