//! `--shard K/N`: a deterministic split of a batch over S_n into N shards, so
//! that a cluster's array job can run shard K (1-based) of N on each node.
//!
//! Item i (0-based, in the command's listing order) belongs to shard
//! (i mod N) + 1; interleaving keeps the shards balanced, since cost tends to
//! grow along the listing. "Shard" is the one word for this in the code; the
//! printed texts and `--help` say "piece K/N", and the flag and the JSON key
//! say `shard`: both are kept as they are, since scripts read them.

use super::error::CliError;

/// One shard of a split batch.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub struct Shard {
    /// The shard, 1-based.
    pub index: usize,
    /// The number of shards.
    pub count: usize,
}

impl Shard {
    /// The whole batch as one shard.
    pub const WHOLE: Shard = Shard { index: 1, count: 1 };

    /// Parses `K/N` with 1 <= K <= N.
    pub fn parse(text: &str) -> Result<Shard, CliError> {
        let bad = || {
            CliError::Input(format!(
                "--shard '{}' is not of the form K/N with 1 <= K <= N (for example 3/8)",
                crate::math::excerpt::excerpt(text)
            ))
        };
        let (k, n) = text.split_once('/').ok_or_else(bad)?;
        let index: usize = k.trim().parse().map_err(|_| bad())?;
        let count: usize = n.trim().parse().map_err(|_| bad())?;
        if index == 0 || count == 0 || index > count {
            return Err(bad());
        }
        Ok(Shard { index, count })
    }

    /// The shard of an optional `--shard` argument: the whole batch without one.
    pub fn of_arg(text: Option<&str>) -> Result<Shard, CliError> {
        text.map_or(Ok(Shard::WHOLE), Shard::parse)
    }

    /// Refuses a split into more pieces than the listing has rows (`rows`):
    /// such pieces would be empty, and a merge would have to account for
    /// pieces that hold nothing.
    pub fn check_fits(&self, rows: usize) -> Result<(), CliError> {
        if !self.is_whole() && self.count > rows.max(1) {
            return Err(CliError::Input(format!(
                "--shard {}/{} is beyond the listing: it has {rows} {}, so N can be at most {} (a piece holds at least one)",
                self.index,
                self.count,
                if rows == 1 { "row" } else { "rows" },
                rows.max(1)
            )));
        }
        Ok(())
    }

    /// Whether item `i` (0-based, in listing order) belongs to this shard.
    pub fn selects(&self, i: usize) -> bool {
        i % self.count == self.index - 1
    }

    /// Whether this is the whole batch.
    pub fn is_whole(&self) -> bool {
        self.count == 1
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn shards_partition_the_batch() {
        let shards: Vec<Shard> = (1..=3)
            .map(|k| Shard::parse(&format!("{k}/3")).unwrap())
            .collect();
        for i in 0..100 {
            assert_eq!(shards.iter().filter(|s| s.selects(i)).count(), 1);
        }
        assert!(Shard::parse("0/3").is_err_and(|e| matches!(e, CliError::Input(_))));
        assert!(Shard::parse("4/3").is_err_and(|e| matches!(e, CliError::Input(_))));
        assert!(Shard::parse("x").is_err_and(|e| matches!(e, CliError::Input(_))));
        // a split into more pieces than rows is refused when the piece is made
        assert!(Shard::parse("2/3").unwrap().check_fits(3).is_ok());
        let e = Shard::parse("1/4").unwrap().check_fits(3).unwrap_err();
        assert!(
            matches!(&e, CliError::Input(m) if m.contains("beyond the listing: it has 3 rows, so N can be at most 3")),
            "{e:?}"
        );
        assert!(Shard::WHOLE.check_fits(0).is_ok());
    }
}
