//! Indexed forests: sequences of full binary trees standing on the leaves
//! 1, 2, 3, …, given by their codes.
//!
//! The code of F is c(F)_i = #{v : lo(v) = i}, lo(v) the leftmost leaf of the
//! internal node v; F ↦ c(F) is a bijection onto weak compositions. The
//! inverse (Nadeau–Tewari 2024, §3): for i from the largest down to 1, take
//! the leaf i and c_i times replace the current tree t by the node
//! (t, the next tree to the right). On codes, trimming a terminal node at i
//! (a node whose children are the leaves i and i + 1) is
//! (…, c_i, 0, c_{i+2}, …) ↦ (…, c_i − 1, c_{i+2}, …), and F has a terminal
//! node at i exactly when c_i > 0 and c_{i+1} = 0.

use crate::error::{MathError, MathResult};
use std::fmt;

/// The most internal nodes a forest may have (its degree, the exponent of x^{c(F)}).
pub const FOREST_MAX_NODES: usize = 255;
/// The most positions a code may have (the variables x_1..x_16 of a packed monomial).
pub const FOREST_MAX_LEN: usize = 16;

/// A child of an internal node: a leaf (its number, 1-based) or another internal node.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum Child {
    /// The leaf with this number.
    Leaf(usize),
    /// The internal node at this index of [`Forest::nodes`].
    Node(usize),
}

/// An internal node with its leaf interval.
#[derive(Clone, Debug, PartialEq, Eq, Hash)]
pub struct Node {
    /// The left child.
    pub left: Child,
    /// The right child.
    pub right: Child,
    /// lo(v): the leftmost leaf below v (the terminal position when v is terminal).
    pub lo: usize,
    /// ρ(v): the rightmost leaf of the left subtree (the largest label v may carry).
    pub rho: usize,
    /// The rightmost leaf below v.
    pub hi: usize,
    /// h_v: the number of internal nodes below and at v.
    pub size: usize,
}

impl Node {
    /// Whether both children are leaves.
    pub fn is_terminal(&self) -> bool {
        matches!((self.left, self.right), (Child::Leaf(_), Child::Leaf(_)))
    }
}

/// An indexed forest, stored by its code (no trailing zeros) and its nodes.
#[derive(Clone, Debug, PartialEq, Eq, Hash)]
pub struct Forest {
    code: Vec<usize>,
    nodes: Vec<Node>,
    roots: Vec<usize>,
}

impl Forest {
    /// The forest with no internal node (P_∅ = 1).
    pub fn empty() -> Forest {
        Forest {
            code: Vec::new(),
            nodes: Vec::new(),
            roots: Vec::new(),
        }
    }

    /// The forest of a weak composition (trailing zeros allowed); refused past
    /// [`FOREST_MAX_NODES`] nodes or a last nonzero entry past [`FOREST_MAX_LEN`].
    ///
    /// ```
    /// use elbowroom_math::forest::indexed::Forest;
    /// // (1, 0, 1): the trees (1,2) and (3,4); (2): ((1,2),3)
    /// assert_eq!(Forest::from_code(&[1, 0, 1]).unwrap().to_string(), "(1 2)(3 4)");
    /// assert_eq!(Forest::from_code(&[2]).unwrap().to_string(), "((1 2)3)");
    /// assert_eq!(Forest::from_code(&[0, 2]).unwrap().to_string(), "1((2 3)4)");
    /// ```
    pub fn from_code(code: &[usize]) -> MathResult<Forest> {
        let len = code.iter().rposition(|&c| c > 0).map_or(0, |p| p + 1);
        if len > FOREST_MAX_LEN {
            return Err(MathError::OutOfRange(format!(
                "a code with {len} positions; at most {FOREST_MAX_LEN} (the variables x1..x{FOREST_MAX_LEN})"
            )));
        }
        let total = code
            .iter()
            .try_fold(0usize, |s, &c| s.checked_add(c))
            .unwrap_or(usize::MAX);
        if total > FOREST_MAX_NODES {
            return Err(MathError::OutOfRange(format!(
                "a forest with {total} internal nodes; at most {FOREST_MAX_NODES}"
            )));
        }
        let code = code[..len].to_vec();
        let mut nodes: Vec<Node> = Vec::with_capacity(total);
        // the trees right of the current leaf, left to right, stored reversed
        let mut right: Vec<Child> = Vec::new();
        let mut next_free = len + 1;
        for i in (1..=len).rev() {
            let mut t = Child::Leaf(i);
            for _ in 0..code[i - 1] {
                let next = right.pop().unwrap_or_else(|| {
                    next_free += 1;
                    Child::Leaf(next_free - 1)
                });
                let (lo, rho, ls) = span(&nodes, t);
                let (_, hi, rs) = span(&nodes, next);
                nodes.push(Node {
                    left: t,
                    right: next,
                    lo,
                    rho,
                    hi,
                    size: 1 + ls + rs,
                });
                t = Child::Node(nodes.len() - 1);
            }
            right.push(t);
        }
        let roots = right
            .iter()
            .rev()
            .filter_map(|c| match c {
                Child::Node(k) => Some(*k),
                Child::Leaf(_) => None,
            })
            .collect();
        Ok(Forest { code, nodes, roots })
    }

    /// The code, without trailing zeros.
    pub fn code(&self) -> &[usize] {
        &self.code
    }

    /// The internal nodes (children before parents).
    pub fn nodes(&self) -> &[Node] {
        &self.nodes
    }

    /// The roots of the nontrivial trees, left to right, as indices of [`Forest::nodes`].
    pub fn roots(&self) -> &[usize] {
        &self.roots
    }

    /// |F|: the number of internal nodes (the degree of P_F).
    pub fn size(&self) -> usize {
        self.nodes.len()
    }

    /// The largest leaf of a nontrivial tree (0 for the empty forest).
    pub fn last_leaf(&self) -> usize {
        self.roots
            .iter()
            .map(|&r| self.nodes[r].hi)
            .max()
            .unwrap_or(0)
    }

    /// Whether every nontrivial tree has its leaves in [n]; equivalently
    /// c_i + ⋯ + c_n ≤ n − i for every i (and no c_i with i > n).
    pub fn supported_in(&self, n: usize) -> bool {
        self.last_leaf() <= n
    }

    /// Whether F is one binary tree on the leaves 1..n (n ≥ 2) or empty (n = 1).
    pub fn is_tree_on(&self, n: usize) -> bool {
        match self.roots.as_slice() {
            [] => n <= 1,
            [r] => self.nodes[*r].lo == 1 && self.nodes[*r].hi == n,
            _ => false,
        }
    }

    /// The positions i of the terminal nodes, increasing.
    pub fn terminals(&self) -> Vec<usize> {
        (1..=self.code.len())
            .filter(|&i| has_terminal_at(&self.code, i))
            .collect()
    }

    /// F/i: the terminal node at i replaced by a leaf, later leaves renumbered
    /// down by one; `None` when F has no terminal node at i.
    pub fn trim(&self, i: usize) -> Option<Forest> {
        trim_code(&self.code, i).and_then(|c| Forest::from_code(&c).ok())
    }

    /// The forest with the leaf i replaced by a terminal node on (i, i + 1),
    /// later leaves renumbered up by one (so that `insert(i).trim(i)` is F).
    pub fn insert(&self, i: usize) -> MathResult<Forest> {
        Forest::from_code(&insert_code(&self.code, i))
    }

    /// The number of increasing labelings of the internal nodes by 1..|F|
    /// (parents smaller than children) when F is one tree: (|F|)!/Π_v h_v.
    /// For a forest, the multinomial of the trees times their counts.
    ///
    /// ```
    /// use elbowroom_math::forest::indexed::Forest;
    /// // the comb ((1 2)3) has one labeling; (1 2)(3 4) as a forest has 2; the
    /// // balanced tree ((1 2)(3 4)) has 3!/(3·1·1) = 2
    /// assert_eq!(Forest::from_code(&[2]).unwrap().increasing_labelings(), 1u32.into());
    /// assert_eq!(Forest::from_code(&[1, 0, 1]).unwrap().increasing_labelings(), 2u32.into());
    /// assert_eq!(Forest::from_code(&[2, 0, 1]).unwrap().increasing_labelings(), 2u32.into());
    /// ```
    pub fn increasing_labelings(&self) -> num_bigint::BigUint {
        use num_bigint::BigUint;
        use num_traits::One;
        let mut num = BigUint::one();
        for k in 2..=self.nodes.len() {
            num *= BigUint::from(k);
        }
        let den = self
            .nodes
            .iter()
            .fold(BigUint::one(), |d, v| d * BigUint::from(v.size));
        num / den
    }
}

fn span(nodes: &[Node], c: Child) -> (usize, usize, usize) {
    match c {
        Child::Leaf(i) => (i, i, 0),
        Child::Node(k) => (nodes[k].lo, nodes[k].hi, nodes[k].size),
    }
}

/// Whether the forest of `code` has a terminal node at i (1-based): c_i > 0 and c_{i+1} = 0.
pub fn has_terminal_at(code: &[usize], i: usize) -> bool {
    i >= 1 && code.get(i - 1).copied().unwrap_or(0) > 0 && code.get(i).copied().unwrap_or(0) == 0
}

/// The code of F/i, or `None` when there is no terminal node at i. Trailing zeros dropped.
pub fn trim_code(code: &[usize], i: usize) -> Option<Vec<usize>> {
    if !has_terminal_at(code, i) {
        return None;
    }
    let mut c = code.to_vec();
    c[i - 1] -= 1;
    if i < c.len() {
        c.remove(i);
    }
    while c.last() == Some(&0) {
        c.pop();
    }
    Some(c)
}

/// The code of the forest with a terminal node inserted at the leaf i (1-based).
pub fn insert_code(code: &[usize], i: usize) -> Vec<usize> {
    let mut c = code.to_vec();
    if c.len() < i {
        c.resize(i, 0);
    }
    c[i - 1] += 1;
    if i < c.len() {
        c.insert(i, 0);
    }
    c
}

/// A code as typed and printed: `(1,0,1)`; `()` for the empty forest.
///
/// ```
/// use elbowroom_math::forest::indexed::code_text;
/// assert_eq!(code_text(&[1, 0, 1]), "(1,0,1)");
/// assert_eq!(code_text(&[]), "()");
/// ```
pub fn code_text(code: &[usize]) -> String {
    let parts: Vec<String> = code.iter().map(|c| c.to_string()).collect();
    format!("({})", parts.join(","))
}

impl fmt::Display for Forest {
    /// The one-line notation: each nontrivial tree in parentheses over its
    /// leaves, trivial leaves as numbers, up to the last nontrivial leaf;
    /// `∅` for the empty forest. `(a b)` joins two leaves with a space, a
    /// node next to anything needs none: `((1 2)3)`, `1((2 3)4)`.
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        if self.roots.is_empty() {
            return write!(f, "∅");
        }
        let mut out = String::new();
        let mut leaf = 1;
        for &r in &self.roots {
            while leaf < self.nodes[r].lo {
                push_item(&mut out, &leaf.to_string());
                leaf += 1;
            }
            let mut s = String::new();
            write_node(&self.nodes, r, &mut s);
            push_item(&mut out, &s);
            leaf = self.nodes[r].hi + 1;
        }
        write!(f, "{out}")
    }
}

fn push_item(out: &mut String, item: &str) {
    let last_digit = out.chars().last().is_some_and(|c| c.is_ascii_digit());
    if last_digit && item.starts_with(|c: char| c.is_ascii_digit()) {
        out.push(' ');
    }
    out.push_str(item);
}

fn write_node(nodes: &[Node], k: usize, out: &mut String) {
    let mut inner = String::new();
    for c in [nodes[k].left, nodes[k].right] {
        match c {
            Child::Leaf(i) => push_item(&mut inner, &i.to_string()),
            Child::Node(j) => {
                let mut s = String::new();
                write_node(nodes, j, &mut s);
                push_item(&mut inner, &s);
            }
        }
    }
    out.push('(');
    out.push_str(&inner);
    out.push(')');
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The code read back from the nodes: c_i = #{v : lo(v) = i}.
    fn code_of_nodes(f: &Forest) -> Vec<usize> {
        let mut c = vec![0; f.code().len()];
        for v in f.nodes() {
            c[v.lo - 1] += 1;
        }
        c
    }

    #[test]
    fn codes_round_trip_through_the_nodes() {
        let mut codes = Vec::new();
        for total in 0..=6u32 {
            codes.extend(crate::poly::compositions::weak_compositions(total, 4));
        }
        for code in codes {
            let code: Vec<usize> = code.iter().map(|&c| c as usize).collect();
            let f = Forest::from_code(&code).unwrap();
            let mut trimmed = code.clone();
            while trimmed.last() == Some(&0) {
                trimmed.pop();
            }
            assert_eq!(code_of_nodes(&f), trimmed);
            for i in f.terminals() {
                let v = f.nodes().iter().find(|v| v.lo == i && v.is_terminal());
                assert!(v.is_some(), "{code:?} at {i}");
                assert_eq!(f.trim(i).unwrap().insert(i).unwrap(), f);
            }
            let terminal_count = f.nodes().iter().filter(|v| v.is_terminal()).count();
            assert_eq!(terminal_count, f.terminals().len());
        }
    }
}
