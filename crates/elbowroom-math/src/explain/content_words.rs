//! The reduced words of w of one content c (c_i letters equal to i), in
//! lexicographic order: how many there are, the words from any place in that
//! order (a page of them), and the place of one word, without listing the
//! words before it.
//!
//! A reduced word a_1 ⋯ a_l of w (w = s_{a_1} ⋯ s_{a_l}) begins with a exactly
//! when a is a left descent of w (a + 1 stands before a in one-line notation),
//! and then a_2 ⋯ a_l is a reduced word of s_a w. So the words of w of content c
//! are counted by N(w, c) = Σ_a N(s_a w, c − e_a) over the left descents a with
//! c_a > 0, N(e, 0) = 1, remembered for each (w, c) met; a page skips whole
//! branches by their counts.

use crate::error::{MathError, MathResult};
use crate::perms::perm::Perm;
use crate::progress::Progress;
use std::collections::HashMap;

/// The most pairs (permutation, content) one count may remember.
pub const CONTENT_WORD_STATES: usize = 4_000_000;

/// Counts of reduced words by content below one w, remembered as they are met.
pub struct ContentWords<'a> {
    /// w^{-1} in one-line notation, 0-based values: a is a left descent of w
    /// when `inv[a - 1] > inv[a]`, and s_a w has these two entries swapped.
    inv: Vec<u8>,
    content: Vec<u8>,
    memo: HashMap<(Vec<u8>, Vec<u8>), u128>,
    progress: &'a Progress,
}

impl<'a> ContentWords<'a> {
    /// The words of `w` of content `c` (c_1, …, c_{n−1}); a content of another
    /// length is refused.
    pub fn new(w: &Perm, c: &[usize], progress: &'a Progress) -> MathResult<ContentWords<'a>> {
        let n = w.n();
        if c.len() != n.saturating_sub(1) {
            return Err(MathError::InvalidInput(format!(
                "a content of w in S_{n} has {} entries, not {}",
                n.saturating_sub(1),
                c.len()
            )));
        }
        let content = c
            .iter()
            .map(|&x| u8::try_from(x))
            .collect::<Result<Vec<u8>, _>>()
            .map_err(|_| MathError::OutOfRange("a content entry is past 255".into()))?;
        let inv = w
            .inverse()
            .one_line()
            .iter()
            .map(|&v| (v - 1) as u8)
            .collect();
        Ok(ContentWords {
            inv,
            content,
            memo: HashMap::new(),
            progress,
        })
    }

    /// The number of reduced words of w of content c.
    pub fn count(&mut self) -> MathResult<u128> {
        let (inv, c) = (self.inv.clone(), self.content.clone());
        if c.iter().map(|&x| x as usize).sum::<usize>() != inversions(&inv) {
            return Ok(0);
        }
        self.count_of(&inv, &c)
    }

    fn count_of(&mut self, inv: &[u8], c: &[u8]) -> MathResult<u128> {
        if c.iter().all(|&x| x == 0) {
            return Ok(1);
        }
        if let Some(&k) = self.memo.get(&(inv.to_vec(), c.to_vec())) {
            return Ok(k);
        }
        if self.memo.len() >= CONTENT_WORD_STATES {
            return Err(MathError::TooLarge(format!(
                "the reduced words of one content pass through more than {CONTENT_WORD_STATES} pairs (permutation, content); refused"
            )));
        }
        if self.memo.len().is_multiple_of(1024) {
            self.progress.check()?;
        }
        let mut total: u128 = 0;
        let (mut inv, mut c) = (inv.to_vec(), c.to_vec());
        for a in 1..inv.len() {
            if c[a - 1] == 0 || inv[a - 1] < inv[a] {
                continue;
            }
            inv.swap(a - 1, a);
            c[a - 1] -= 1;
            let below = self.count_of(&inv, &c);
            inv.swap(a - 1, a);
            c[a - 1] += 1;
            total = total
                .checked_add(below?)
                .ok_or_else(|| MathError::TooLarge("more than 2^128 reduced words".into()))?;
        }
        self.memo.insert((inv, c), total);
        Ok(total)
    }

    /// The words at places `skip`, `skip + 1`, … (at most `take` of them) of
    /// the lexicographic list of the reduced words of w of content c.
    pub fn page(&mut self, skip: u128, take: usize) -> MathResult<Vec<Vec<usize>>> {
        let mut out = Vec::new();
        if take == 0 || skip >= self.count()? {
            return Ok(out);
        }
        let (inv, c) = (self.inv.clone(), self.content.clone());
        let mut skip = skip;
        let mut prefix = Vec::new();
        self.walk(inv, c, &mut skip, take, &mut prefix, &mut out)?;
        Ok(out)
    }

    fn walk(
        &mut self,
        mut inv: Vec<u8>,
        mut c: Vec<u8>,
        skip: &mut u128,
        take: usize,
        prefix: &mut Vec<usize>,
        out: &mut Vec<Vec<usize>>,
    ) -> MathResult<()> {
        if c.iter().all(|&x| x == 0) {
            if *skip > 0 {
                *skip -= 1;
            } else {
                out.push(prefix.clone());
            }
            return Ok(());
        }
        for a in 1..inv.len() {
            if out.len() == take {
                return Ok(());
            }
            if c[a - 1] == 0 || inv[a - 1] < inv[a] {
                continue;
            }
            inv.swap(a - 1, a);
            c[a - 1] -= 1;
            let below = self.count_of(&inv, &c)?;
            if *skip >= below {
                *skip -= below;
            } else {
                prefix.push(a);
                self.walk(inv.clone(), c.clone(), skip, take, prefix, out)?;
                prefix.pop();
            }
            inv.swap(a - 1, a);
            c[a - 1] += 1;
        }
        Ok(())
    }

    /// The place (0-based) of `word` in the lexicographic list of the reduced
    /// words of w of content c; a word that is not one of them is refused.
    pub fn rank(&mut self, word: &[usize]) -> MathResult<u128> {
        let (mut inv, mut c) = (self.inv.clone(), self.content.clone());
        let not_one = || {
            MathError::InvalidInput(format!(
                "{word:?} is not a reduced word of this permutation with this content"
            ))
        };
        let mut rank: u128 = 0;
        for &a in word {
            if a == 0 || a >= inv.len() || c[a - 1] == 0 || inv[a - 1] < inv[a] {
                return Err(not_one());
            }
            for b in 1..a {
                if c[b - 1] == 0 || inv[b - 1] < inv[b] {
                    continue;
                }
                inv.swap(b - 1, b);
                c[b - 1] -= 1;
                let below = self.count_of(&inv, &c);
                inv.swap(b - 1, b);
                c[b - 1] += 1;
                rank += below?;
            }
            inv.swap(a - 1, a);
            c[a - 1] -= 1;
        }
        if c.iter().any(|&x| x > 0) {
            return Err(not_one());
        }
        Ok(rank)
    }
}

/// The number of inversions of a one-line vector (the length of w, read off w^{-1}).
fn inversions(v: &[u8]) -> usize {
    let mut k = 0;
    for i in 0..v.len() {
        for j in i + 1..v.len() {
            if v[i] > v[j] {
                k += 1;
            }
        }
    }
    k
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::perms::listing::perms_of_length;
    use crate::perms::words::{content, reduced_words};

    /// The second method: every reduced word of w listed in lexicographic order
    /// (the lazy listing of `perms::words`), kept when its content is c.
    fn by_listing(w: &Perm, c: &[usize]) -> Vec<Vec<usize>> {
        reduced_words(w)
            .filter(|a| content(a, w.n()) == c)
            .collect()
    }

    /// For every w of length n − 1 in S_5 and S_6, and every content met among
    /// its words: the count, pages of 3 words from every place, and each word's
    /// place agree with the filtered listing. For w = 1432 (Red = {232, 323})
    /// the contents (0, 2, 1) and (0, 1, 2) have one word each.
    #[test]
    fn pages_counts_and_places_agree_with_the_listing() {
        let p = Progress::default();
        let w = Perm::parse("1432").unwrap_or_else(|_| Perm::identity(4));
        assert_eq!(
            ContentWords::new(&w, &[0, 2, 1], &p)
                .and_then(|mut x| x.page(0, 10))
                .ok(),
            Some(vec![vec![2, 3, 2]])
        );
        for n in [5usize, 6] {
            for w in perms_of_length(n, n - 1) {
                let mut contents: Vec<Vec<usize>> =
                    reduced_words(&w).map(|a| content(&a, n)).collect();
                contents.sort();
                contents.dedup();
                for c in contents {
                    let listed = by_listing(&w, &c);
                    let mut x = ContentWords::new(&w, &c, &p).unwrap_or_else(|e| panic!("{e}"));
                    assert_eq!(x.count().ok(), Some(listed.len() as u128), "{w} {c:?}");
                    for skip in 0..listed.len() {
                        let page = x.page(skip as u128, 3).unwrap_or_default();
                        let end = (skip + 3).min(listed.len());
                        assert_eq!(page, listed[skip..end], "{w} {c:?} from {skip}");
                        assert_eq!(x.rank(&listed[skip]).ok(), Some(skip as u128));
                    }
                }
                // a content no word has: none
                let mut none = vec![0; n - 1];
                none[0] = n - 1;
                let listed = by_listing(&w, &none);
                let mut x = ContentWords::new(&w, &none, &p).unwrap_or_else(|e| panic!("{e}"));
                assert_eq!(x.count().ok(), Some(listed.len() as u128));
            }
        }
    }

    #[test]
    fn words_of_other_contents_are_refused() {
        let p = Progress::default();
        let w = Perm::parse("1432").unwrap_or_else(|_| Perm::identity(4));
        let mut x = ContentWords::new(&w, &[0, 2, 1], &p).unwrap_or_else(|e| panic!("{e}"));
        assert!(x.rank(&[3, 2, 3]).is_err());
        assert!(x.rank(&[2, 3]).is_err());
        assert!(ContentWords::new(&w, &[0, 2], &p).is_err());
    }
}
