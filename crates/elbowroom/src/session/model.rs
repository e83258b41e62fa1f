//! What a session remembers: the current permutation, its history and pins, the
//! open view and its place in each view, typed inputs, notes and figure settings.
//!
//! Only inputs are stored (permutations as one-line vectors, polynomials and λ
//! as the text the user typed); everything shown is recomputed on open.

use serde::{Deserialize, Serialize};

/// One exploration, as the explorer shows it and as a session file stores it.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(default)]
pub struct Session {
    /// A short title shown in the window's title bar.
    pub title: String,
    /// Free-text notes the researcher keeps with the exploration.
    pub notes: String,
    /// The size n of S_n being explored.
    pub n: usize,
    /// The current permutation in one-line notation (1-based values).
    pub current: Vec<usize>,
    /// Permutations visited, oldest first.
    pub history: Vec<Vec<usize>>,
    /// Position of `current` in `history` (for back and forward).
    pub history_pos: usize,
    /// Pinned favourites.
    pub pins: Vec<Vec<usize>>,
    /// The view in front.
    pub view: View,
    /// The light or dark theme.
    pub dark: bool,
    /// Where the permutation browser is.
    pub browser: BrowserPlace,
    /// Where the pipe-dream view is.
    pub dreams: DreamPlace,
    /// Where the reduced-word view is.
    pub words: WordPlace,
    /// Where the quotient view is.
    pub quotient: QuotientPlace,
    /// Where the permutohedron view is.
    pub solid: PermutohedronPlace,
    /// Where the Hessenberg view is.
    pub hessenberg: HessenbergPlace,
    /// Where the polynomial workbench is.
    pub workbench: WorkbenchPlace,
    /// The products view's factors and typed polynomial.
    pub products: ProductsPlace,
    /// How figures are exported.
    pub figure: FigureSettings,
}

impl Default for Session {
    fn default() -> Self {
        Session {
            title: "untitled exploration".into(),
            notes: String::new(),
            n: 4,
            current: vec![1, 4, 3, 2],
            history: vec![vec![1, 4, 3, 2]],
            history_pos: 0,
            pins: Vec::new(),
            view: View::Dreams,
            dark: false,
            browser: BrowserPlace::default(),
            dreams: DreamPlace::default(),
            words: WordPlace::default(),
            quotient: QuotientPlace::default(),
            solid: PermutohedronPlace::default(),
            hessenberg: HessenbergPlace::default(),
            workbench: WorkbenchPlace::default(),
            products: ProductsPlace::default(),
            figure: FigureSettings::default(),
        }
    }
}

/// The views of the explorer.
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq, Hash, Serialize, Deserialize)]
pub enum View {
    /// Reduced pipe dreams (or bumpless ones).
    #[default]
    Dreams,
    /// Reduced words and wiring diagrams.
    Words,
    /// Normal forms in the quasisymmetric quotient, drawn as lattice paths.
    Quotient,
    /// Permutohedron volumes and mixed Eulerian numbers.
    Permutohedron,
    /// Hessenberg class tables.
    Hessenberg,
    /// A typed polynomial: divided symmetrization and normal form.
    Workbench,
    /// Products of Schubert classes and Schubert expansions.
    Products,
    /// Forest polynomials and forest expansions.
    Forests,
}

/// How the permutation browser filters and sorts S_n.
#[derive(Clone, Debug, Default, PartialEq, Eq, Serialize, Deserialize)]
#[serde(default)]
pub struct BrowserPlace {
    /// Smallest length shown, if limited.
    pub min_length: Option<usize>,
    /// Largest length shown, if limited.
    pub max_length: Option<usize>,
    /// A class filter by key (`dominant`, `grassmannian`, `vexillary`, `fully_commutative`, `coxeter`).
    pub class: Option<String>,
    /// Sort by length (then lexicographically) instead of lexicographically.
    pub by_length: bool,
}

/// Which pipe dream is shown.
#[derive(Clone, Debug, Default, PartialEq, Eq, Serialize, Deserialize)]
#[serde(default)]
pub struct DreamPlace {
    /// 0-based index in the enumeration order.
    pub index: usize,
    /// Show bumpless pipe dreams instead of reduced pipe dreams.
    pub bumpless: bool,
}

/// Which reduced word is selected.
#[derive(Clone, Debug, Default, PartialEq, Eq, Serialize, Deserialize)]
#[serde(default)]
pub struct WordPlace {
    /// 0-based index in lexicographic order.
    pub index: usize,
}

/// What the quotient view reduces.
#[derive(Clone, Debug, Default, PartialEq, Eq, Serialize, Deserialize)]
#[serde(default)]
pub struct QuotientPlace {
    /// Reduce the typed polynomial instead of the current reversed Schubert polynomial.
    pub use_typed: bool,
    /// The typed polynomial, as typed.
    pub typed: String,
    /// Show the positivity survey over all of S_n instead of one normal form.
    pub survey: bool,
}

/// The permutohedron view's inputs, as typed (exact rationals like `3/2`).
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(default)]
pub struct PermutohedronPlace {
    /// λ for the exact volume and the drawing.
    pub lambda: Vec<String>,
    /// The start λ_a of the segment plotted.
    pub from: Vec<String>,
    /// The end λ_b of the segment plotted.
    pub to: Vec<String>,
    /// Rotation of the n = 4 projection about the vertical axis (radians);
    /// the default turn (0.9, 0.5) keeps the 24 vertices of the regular P_λ
    /// apart on screen.
    pub yaw: f32,
    /// Rotation of the n = 4 projection about the horizontal axis (radians).
    pub pitch: f32,
}

impl Default for PermutohedronPlace {
    fn default() -> Self {
        let s = |v: &[&str]| v.iter().map(|x| x.to_string()).collect::<Vec<_>>();
        PermutohedronPlace {
            lambda: s(&["3", "2", "1", "0"]),
            from: s(&["1", "1", "0", "0"]),
            to: s(&["3", "2", "1", "0"]),
            yaw: 0.9,
            pitch: 0.5,
        }
    }
}

/// The Hessenberg view's function h and table order.
#[derive(Clone, Debug, Default, PartialEq, Eq, Serialize, Deserialize)]
#[serde(default)]
pub struct HessenbergPlace {
    /// h(1), ..., h(n); empty means the default h(i) = i + 1.
    pub h: Vec<usize>,
    /// The column the table is sorted by; `None` (not chosen yet) sorts by w.
    /// Stored as the column's key (`"perm"`, `"length"`, `"value"`) or `""`
    /// for `None`; an unknown key is refused with the keys accepted.
    #[serde(with = "sort_key")]
    pub sort_by: Option<SortColumn>,
    /// Sort descending.
    pub descending: bool,
}

/// A column of the Hessenberg view's table, to sort it by.
#[derive(Clone, Copy, Debug, Default, PartialEq, Eq, Hash)]
pub enum SortColumn {
    /// The permutation w, lexicographically (key `perm`).
    #[default]
    Perm,
    /// The length ℓ(w) (key `length`).
    Length,
    /// The coefficient a^h_w (key `value`).
    Value,
}

impl SortColumn {
    /// The key a session file stores.
    pub fn key(self) -> &'static str {
        match self {
            SortColumn::Perm => "perm",
            SortColumn::Length => "length",
            SortColumn::Value => "value",
        }
    }

    /// The column of a stored key, if it names one.
    pub fn from_key(key: &str) -> Option<SortColumn> {
        [SortColumn::Perm, SortColumn::Length, SortColumn::Value]
            .into_iter()
            .find(|c| c.key() == key)
    }
}

/// `sort_by` as a string, as files have always stored it: serde's own enum
/// encoding would write a RON identifier (`perm`) instead of `"perm"`.
mod sort_key {
    use super::SortColumn;
    use serde::{Deserialize, Deserializer, Serializer};

    pub fn serialize<S: Serializer>(v: &Option<SortColumn>, s: S) -> Result<S::Ok, S::Error> {
        s.serialize_str(v.map_or("", SortColumn::key))
    }

    pub fn deserialize<'de, D: Deserializer<'de>>(d: D) -> Result<Option<SortColumn>, D::Error> {
        let key = String::deserialize(d)?;
        if key.is_empty() {
            return Ok(None);
        }
        SortColumn::from_key(&key).map(Some).ok_or_else(|| {
            serde::de::Error::custom(format!(
                "the sort key \"{key}\" is not known; accepted: \"perm\", \"length\", \"value\" or \"\""
            ))
        })
    }
}

/// The workbench's typed polynomial and choice of denominator.
#[derive(Clone, Debug, Default, PartialEq, Eq, Serialize, Deserialize)]
#[serde(default)]
pub struct WorkbenchPlace {
    /// The polynomial, as typed.
    pub poly: String,
    /// Use the Hessenberg function of the Hessenberg view instead of DS_n.
    pub use_h: bool,
}

/// The products view's inputs: the factors u and v as typed (empty: the
/// current permutation), how they are multiplied, and a typed polynomial to
/// expand with its own n.
#[derive(Clone, Debug, PartialEq, Eq, Serialize, Deserialize)]
#[serde(default)]
pub struct ProductsPlace {
    /// The first factor, as typed.
    pub u: String,
    /// The second factor, as typed.
    pub v: String,
    /// Multiply stably (over S_∞) rather than in H*(Fl_n).
    pub stable: bool,
    /// The n of H*(Fl_n) for the product (raised, when shown, to hold u and v).
    pub n: usize,
    /// The typed polynomial to expand.
    pub poly: String,
    /// Expand it stably rather than in H*(Fl_n).
    pub poly_stable: bool,
    /// The n of the expansion: H*(Fl_n), or the variables x1, …, xn.
    pub poly_n: usize,
}

impl Default for ProductsPlace {
    fn default() -> Self {
        ProductsPlace {
            u: String::new(),
            v: String::new(),
            stable: true,
            n: 4,
            poly: "(x1 - x3)(x2 - x4)".into(),
            poly_stable: false,
            poly_n: 4,
        }
    }
}

/// How figures are exported.
#[derive(Clone, Debug, PartialEq, Serialize, Deserialize)]
#[serde(default)]
pub struct FigureSettings {
    /// Pixels per figure unit for PNG.
    pub scale: f32,
    /// A transparent PNG background instead of a solid one.
    pub transparent: bool,
    /// Draw row and column labels.
    pub labels: bool,
    /// The last directory figures were exported to.
    pub last_dir: String,
}

impl Default for FigureSettings {
    fn default() -> Self {
        FigureSettings {
            scale: 4.0,
            transparent: false,
            labels: true,
            last_dir: String::new(),
        }
    }
}

/// The first `most` characters of a session's text (a title, the notes), with
/// "…" when some were left out: what a report or the window shows of a text too
/// long to show whole.
pub fn excerpt(text: &str, most: usize) -> String {
    match text.char_indices().nth(most) {
        Some((at, _)) => format!("{}…", &text[..at]),
        None => text.to_string(),
    }
}

/// A session's text as the window system and one-line messages may show it:
/// control characters (a NUL, a newline, an escape) written as escapes
/// (`\u{0}`, `\n`, `\u{1b}`), at most `most` characters of the text, with "…"
/// when some were left out.
pub fn shown_text(text: &str, most: usize) -> String {
    let mut out = String::new();
    for (k, c) in text.chars().enumerate() {
        if k == most {
            out.push('…');
            break;
        }
        if c.is_control() {
            out.extend(c.escape_default());
        } else {
            out.push(c);
        }
    }
    out
}
