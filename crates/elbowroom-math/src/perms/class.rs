//! Named classes of permutations, by pattern avoidance and by reduced words.

use crate::perms::perm::Perm;

/// A class of permutations a researcher filters by.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum PermClass {
    /// 132-avoiding; equivalently the Lehmer code is weakly decreasing.
    Dominant,
    /// At most one descent.
    Grassmannian,
    /// 2143-avoiding.
    Vexillary,
    /// 321-avoiding: any two reduced words are related by commutations alone.
    FullyCommutative,
    /// A reduced word uses each s_1, ..., s_{n-1} exactly once.
    Coxeter,
}

impl PermClass {
    /// Every class, in display order.
    pub const ALL: [PermClass; 5] = [
        PermClass::Dominant,
        PermClass::Grassmannian,
        PermClass::Vexillary,
        PermClass::FullyCommutative,
        PermClass::Coxeter,
    ];

    /// The machine-readable name used in JSON and on the command line.
    pub fn key(self) -> &'static str {
        match self {
            PermClass::Dominant => "dominant",
            PermClass::Grassmannian => "grassmannian",
            PermClass::Vexillary => "vexillary",
            PermClass::FullyCommutative => "fully_commutative",
            PermClass::Coxeter => "coxeter",
        }
    }

    /// A human-readable label.
    pub fn label(self) -> &'static str {
        match self {
            PermClass::Dominant => "dominant",
            PermClass::Grassmannian => "Grassmannian",
            PermClass::Vexillary => "vexillary",
            PermClass::FullyCommutative => "fully commutative",
            PermClass::Coxeter => "Coxeter element",
        }
    }

    /// Parses a key as printed by [`PermClass::key`].
    pub fn from_key(key: &str) -> Option<PermClass> {
        PermClass::ALL.into_iter().find(|c| c.key() == key)
    }

    /// Whether w belongs to the class.
    pub fn contains(self, w: &Perm) -> bool {
        match self {
            PermClass::Dominant => !contains_pattern(w, &[1, 3, 2]),
            PermClass::Grassmannian => w.descents().len() <= 1,
            PermClass::Vexillary => !contains_pattern(w, &[2, 1, 4, 3]),
            PermClass::FullyCommutative => !contains_pattern(w, &[3, 2, 1]),
            PermClass::Coxeter => is_coxeter_element(w),
        }
    }
}

/// The classes w belongs to.
pub fn classes_of(w: &Perm) -> Vec<PermClass> {
    PermClass::ALL
        .into_iter()
        .filter(|c| c.contains(w))
        .collect()
}

/// Whether w contains the pattern p (p in one-line notation, 1-based values).
pub fn contains_pattern(w: &Perm, p: &[usize]) -> bool {
    let v = w.one_line();
    let mut chosen = Vec::with_capacity(p.len());
    search(&v, p, 0, &mut chosen)
}

fn search(v: &[usize], p: &[usize], start: usize, chosen: &mut Vec<usize>) -> bool {
    let k = chosen.len();
    if k == p.len() {
        return true;
    }
    for i in start..v.len() {
        // the new entry must compare with every chosen entry as the pattern says
        let ok = (0..k).all(|j| (v[chosen[j]] < v[i]) == (p[j] < p[k]));
        if ok {
            chosen.push(i);
            if search(v, p, i + 1, chosen) {
                return true;
            }
            chosen.pop();
        }
    }
    false
}

/// A Coxeter element of S_n: length n - 1 and every s_i in its support
/// (so every reduced word uses each letter exactly once).
pub fn is_coxeter_element(w: &Perm) -> bool {
    let n = w.n();
    if w.length() != n - 1 {
        return false;
    }
    let mut running_max = 0;
    for i in 1..n {
        running_max = running_max.max(w.at(i));
        if running_max <= i {
            return false;
        }
    }
    true
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Pattern-avoidance counts are Catalan numbers (OEIS A000108) for 132 and 321;
    /// 2143-avoiding (vexillary) permutations are equinumerous with 1234-avoiding ones
    /// (West, 1990), OEIS A005802 (1, 2, 6, 23, 103, 513);
    /// Grassmannian permutations of S_n number 2^n - n (OEIS A000325).
    #[test]
    fn class_counts_match_oeis() {
        let count = |n: usize, c: PermClass| Perm::all(n).filter(|w| c.contains(w)).count();
        assert_eq!(count(5, PermClass::Dominant), 42);
        assert_eq!(count(6, PermClass::FullyCommutative), 132);
        assert_eq!(count(6, PermClass::Vexillary), 513);
        assert_eq!(count(6, PermClass::Grassmannian), 64 - 6);
        // Coxeter elements of S_n: 2^{n-2} (one choice of order per adjacent pair), from memory.
        assert_eq!(count(6, PermClass::Coxeter), 16);
    }
}
