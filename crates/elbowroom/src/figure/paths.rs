//! The normal form in the quasisymmetric quotient as a grid of small
//! lattice-path diagrams: one panel per standard monomial with a nonzero
//! coefficient, the path N^{e_1} E N^{e_2} E ... in the n×n square (staying
//! weakly below the diagonal, drawn dashed), the monomial and its coefficient
//! under it; negative coefficients in the alert colour with a red frame; and
//! the legend saying how a monomial becomes a path, set beside the grid in
//! an exported figure and beside the panels in the window.

use super::look::Look;
use super::palette::label_color;
use super::scene::{Anchor, Color, ItemKind, PathCmd, Pt, Scene, Stroke, Tag};
use crate::math::MathResult;
use crate::math::quotient::lattice_path::{LatticePath, Step};
use crate::math::quotient::normal_form::NormalForm;
use num_traits::Signed;

/// One panel: the path, the monomial as text, the coefficient as text, and its sign.
pub struct PathPanel {
    /// The lattice path of the standard monomial.
    pub path: LatticePath,
    /// The monomial, e.g. `x2 x3^2`.
    pub monomial: String,
    /// The exact coefficient, e.g. `-3/2`.
    pub coefficient: String,
    /// Whether the coefficient is negative.
    pub negative: bool,
}

/// The panels of a normal form in n variables, one per standard monomial with
/// a nonzero coefficient, in basis order; the monomial is written as in
/// [`crate::math::poly::mono::exponents_text`] (`x2 x3^2`). An error when a
/// monomial has no lattice path (it is then not standard).
pub fn panels_of_normal_form(nf: &NormalForm, n: usize) -> MathResult<Vec<PathPanel>> {
    nf.coefficients
        .iter()
        .map(|(_, m, c)| {
            Ok(PathPanel {
                path: LatticePath::of_monomial(&m.exps(n))?,
                monomial: m.text(n),
                coefficient: c.to_string(),
                negative: c.is_negative(),
            })
        })
        .collect()
}

const PANEL: f32 = 96.0;
const GAP: f32 = 14.0;
const CAPTION: f32 = 30.0;

/// Builds the grid, `columns` panels per row.
pub fn path_grid_scene(panels: &[PathPanel], n: usize, columns: usize, look: &Look) -> Scene {
    let columns = columns.max(1);
    let rows = panels.len().div_ceil(columns).max(1);
    let width = GAP + columns.min(panels.len().max(1)) as f32 * (PANEL + GAP);
    let height = GAP + rows as f32 * (PANEL + CAPTION + GAP);
    let mut scene = Scene::new(width, height, look.background());
    let n = n.max(1);
    for (k, panel) in panels.iter().enumerate() {
        let x0 = GAP + (k % columns) as f32 * (PANEL + GAP);
        let y0 = GAP + (k / columns) as f32 * (PANEL + CAPTION + GAP);
        let square = Square::at(x0, y0, n);
        frame(&mut scene, k, panel, x0, y0, look);
        grid_and_diagonal(&mut scene, &square, look);
        path(&mut scene, k, panel, &square, look);
        captions(&mut scene, panel, x0, y0, look);
    }
    scene
}

/// The n×n square of one panel: lattice point (a, b) -> a point of the figure,
/// the square's lower-left corner being (0, 0).
struct Square {
    ox: f32,
    oy: f32,
    unit: f32,
    n: usize,
}

impl Square {
    fn at(x0: f32, y0: f32, n: usize) -> Square {
        let unit = (PANEL - 12.0) / n as f32;
        Square {
            ox: x0 + 6.0,
            oy: y0 + 6.0 + n as f32 * unit,
            unit,
            n,
        }
    }

    fn pt(&self, a: usize, b: usize) -> Pt {
        Pt::new(
            self.ox + a as f32 * self.unit,
            self.oy - b as f32 * self.unit,
        )
    }
}

/// The panel's tile and frame (red and thicker for a negative coefficient).
fn frame(scene: &mut Scene, k: usize, panel: &PathPanel, x0: f32, y0: f32, look: &Look) {
    let frame = if panel.negative {
        look.alert()
    } else {
        look.grid()
    };
    scene.push(
        ItemKind::Path {
            cmds: vec![
                PathCmd::MoveTo(Pt::new(x0, y0)),
                PathCmd::LineTo(Pt::new(x0 + PANEL, y0)),
                PathCmd::LineTo(Pt::new(x0 + PANEL, y0 + PANEL + CAPTION)),
                PathCmd::LineTo(Pt::new(x0, y0 + PANEL + CAPTION)),
                PathCmd::Close,
            ],
            stroke: Some(Stroke {
                width: if panel.negative { 1.6 } else { 0.8 },
                color: frame,
            }),
            fill: Some(look.tile()),
        },
        Tag::Panel(k),
    );
}

/// The faint lattice lines of the square and its diagonal, dashed.
fn grid_and_diagonal(scene: &mut Scene, sq: &Square, look: &Look) {
    let n = sq.n;
    let faint = Stroke {
        width: 0.5,
        color: look.grid(),
    };
    for t in 0..=n {
        scene.push(
            ItemKind::Path {
                cmds: vec![PathCmd::MoveTo(sq.pt(t, 0)), PathCmd::LineTo(sq.pt(t, n))],
                stroke: Some(faint),
                fill: None,
            },
            Tag::None,
        );
        scene.push(
            ItemKind::Path {
                cmds: vec![PathCmd::MoveTo(sq.pt(0, t)), PathCmd::LineTo(sq.pt(n, t))],
                stroke: Some(faint),
                fill: None,
            },
            Tag::None,
        );
    }
    let (ox, oy, unit) = (sq.ox, sq.oy, sq.unit);
    let mut dash = Vec::new();
    for t in 0..n * 2 {
        if t % 2 == 0 {
            let a = t as f32 / 2.0;
            let p = Pt::new(ox + a * unit, oy - a * unit);
            let q = Pt::new(ox + (a + 0.5) * unit, oy - (a + 0.5) * unit);
            dash.push(PathCmd::MoveTo(p));
            dash.push(PathCmd::LineTo(q));
        }
    }
    scene.push(
        ItemKind::Path {
            cmds: dash,
            stroke: Some(Stroke {
                width: 0.8,
                color: look.ink(),
            }),
            fill: None,
        },
        Tag::None,
    );
}

/// The lattice path, its north steps coloured by their variable.
fn path(scene: &mut Scene, k: usize, panel: &PathPanel, sq: &Square, look: &Look) {
    let vertices = panel.path.vertices();
    let cmds = PathCmd::polyline(vertices.iter().map(|&(a, b)| sq.pt(a, b)));
    scene.push(
        ItemKind::Path {
            cmds,
            stroke: Some(Stroke {
                width: 2.2,
                color: look.ink(),
            }),
            fill: None,
        },
        Tag::Panel(k),
    );
    for (s, step) in panel.path.steps.iter().enumerate() {
        if let Step::North { var: Some(v) } = step {
            let (a, b) = vertices[s];
            let (c, d) = vertices[s + 1];
            scene.push(
                ItemKind::Path {
                    cmds: vec![PathCmd::MoveTo(sq.pt(a, b)), PathCmd::LineTo(sq.pt(c, d))],
                    stroke: Some(Stroke {
                        width: 2.6,
                        color: label_color(*v, sq.n),
                    }),
                    fill: None,
                },
                Tag::Panel(k),
            );
        }
    }
}

/// The coefficient (in the alert colour when negative) and the monomial under the square.
fn captions(scene: &mut Scene, panel: &PathPanel, x0: f32, y0: f32, look: &Look) {
    let text_color: Color = if panel.negative {
        look.alert()
    } else {
        look.ink()
    };
    scene.label(
        Pt::new(x0 + PANEL / 2.0, y0 + PANEL + 6.0),
        panel.coefficient.clone(),
        11.0,
        text_color,
        Anchor::Center,
    );
    scene.label(
        Pt::new(x0 + PANEL / 2.0, y0 + PANEL + 20.0),
        panel.monomial.clone(),
        9.0,
        look.ink(),
        Anchor::Center,
    );
}

/// The legend of the grid, one paragraph per entry, in our plain notation
/// (indices `_`, exponents `^`): how the standard monomial x^e becomes its
/// path, what the colours and the diagonal mean, and why these monomials:
/// they are the basis of Q[x]/J_n of Aval, Bergeron and Bergeron (Adv. Math.
/// 2004), counted by the Catalan numbers (OEIS A000108).
pub fn legend_paragraphs() -> [&'static str; 4] {
    [
        "x^e = x_1^{e_1} x_2^{e_2} … x_n^{e_n} is the path N^{e_1} E N^{e_2} E … N^{e_n} E N^{n−|e|} from (0,0) to (n,n): E is a step east, N a step north.",
        "The e_i north steps just before the i-th east step stand for x_i and take its colour; the last run, in ink, closes the path.",
        "Standard in lex order x_1 > … > x_n means e_1 + … + e_i ≤ i − 1 for all i: the path stays below the dashed diagonal y = x. There are Catalan(n) such paths, a basis of Q[x]/J_n (Aval–Bergeron–Bergeron 2004).",
        "Under each square: the coefficient, then the monomial; a negative coefficient is red, in a red frame.",
    ]
}

/// The width of the legend column of an exported grid.
pub const LEGEND_WIDTH: f32 = 290.0;
const LEGEND_SIZE: f32 = 9.0;
const LEGEND_LINE: f32 = 13.0;
/// The characters on one line of the legend in an exported figure.
const LEGEND_CHARS: usize = 56;

/// Breaks `text` at spaces into lines of at most `width` characters (a
/// longer word stands on its own line); braces never hold a space in the
/// legend, so every line reads on its own.
pub fn wrap_words(text: &str, width: usize) -> Vec<String> {
    let mut lines = Vec::new();
    let mut line = String::new();
    for word in text.split(' ').filter(|w| !w.is_empty()) {
        let len = line.chars().count();
        if len > 0 && len + 1 + word.chars().count() > width {
            lines.push(std::mem::take(&mut line));
        }
        if !line.is_empty() {
            line.push(' ');
        }
        line.push_str(word);
    }
    if !line.is_empty() {
        lines.push(line);
    }
    lines
}

/// The grid with the legend set in a column to its right, and a swatch of
/// the colour of each variable x_2, ..., x_n that carries north steps (x_1
/// never does: e_1 = 0 for a standard monomial).
pub fn with_legend(grid: &Scene, n: usize, look: &Look) -> Scene {
    let mut scene = grid.clone();
    let x0 = grid.width + GAP;
    let mut y = GAP + LEGEND_SIZE / 2.0;
    for paragraph in legend_paragraphs() {
        for line in wrap_words(paragraph, LEGEND_CHARS) {
            scene.label(Pt::new(x0, y), line, LEGEND_SIZE, look.ink(), Anchor::Left);
            y += LEGEND_LINE;
        }
        y += LEGEND_LINE * 0.5;
    }
    let n = n.max(1);
    let per_row = 6;
    for (k, v) in (2..=n).enumerate() {
        let x = x0 + (k % per_row) as f32 * 46.0;
        let row_y = y + (k / per_row) as f32 * LEGEND_LINE * 1.4;
        scene.push(
            ItemKind::Path {
                cmds: vec![
                    PathCmd::MoveTo(Pt::new(x, row_y)),
                    PathCmd::LineTo(Pt::new(x + 16.0, row_y)),
                ],
                stroke: Some(Stroke {
                    width: 2.6,
                    color: label_color(v, n),
                }),
                fill: None,
            },
            Tag::None,
        );
        scene.label(
            Pt::new(x + 20.0, row_y),
            format!("x{v}"),
            LEGEND_SIZE,
            look.ink(),
            Anchor::Left,
        );
    }
    let rows = n.saturating_sub(1).div_ceil(per_row) as f32;
    let bottom = y + rows * LEGEND_LINE * 1.4 + GAP;
    scene.width = x0 + LEGEND_WIDTH;
    scene.height = scene.height.max(bottom);
    scene
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::math::poly::parse::parse_poly;
    use crate::math::quotient::normal_form::{groebner_basis, normal_form};

    #[test]
    fn a_normal_form_gives_one_panel_per_term() -> MathResult<()> {
        let q = groebner_basis(3)?;
        let nf = normal_form(&q, &parse_poly("x2 x3 - x3^2", Some(3))?)?;
        let panels = panels_of_normal_form(&nf, 3)?;
        assert_eq!(panels.len(), nf.coefficients.len());
        for (p, (_, m, c)) in panels.iter().zip(&nf.coefficients) {
            assert_eq!(p.monomial, m.text(3));
            assert_eq!(p.coefficient, c.to_string());
            assert_eq!(p.path.exponents, m.exps(3));
        }
        Ok(())
    }

    #[test]
    fn the_legend_states_the_path_of_the_definition() {
        // the path of x2 x3 in 3 variables is E N E N E N (lattice_path.rs):
        // the legend's word N^{e_1} E N^{e_2} E N^{e_3} E N^{n-|e|} with e = (0, 1, 1)
        let e = [0u32, 1, 1];
        let n = e.len();
        let total: u32 = e.iter().sum();
        let mut word = String::new();
        for &a in &e {
            word.push_str(&"N".repeat(a as usize));
            word.push('E');
        }
        word.push_str(&"N".repeat(n - total as usize));
        assert_eq!(word, LatticePath::of_monomial(&e).unwrap().word());
        let all = legend_paragraphs().join(" ");
        assert!(all.contains("N^{e_1} E N^{e_2} E … N^{e_n} E N^{n−|e|}"));
        assert!(all.contains("e_1 + … + e_i ≤ i − 1"));
        assert!(all.contains("Catalan(n)"));
    }

    #[test]
    fn the_legend_sits_beside_the_grid() {
        let panels = vec![PathPanel {
            path: LatticePath::of_monomial(&[0, 1, 1]).unwrap(),
            monomial: "x2 x3".into(),
            coefficient: "2".into(),
            negative: false,
        }];
        let look = Look::light();
        let grid = path_grid_scene(&panels, 3, 4, &look);
        let with = with_legend(&grid, 3, &look);
        assert_eq!(with.width, grid.width + GAP + LEGEND_WIDTH);
        let lines: Vec<&str> = with.items[grid.items.len()..]
            .iter()
            .filter_map(|i| match &i.kind {
                ItemKind::Text { text, pos, .. } if pos.x >= grid.width => Some(text.as_str()),
                _ => None,
            })
            .collect();
        assert!(
            lines.iter().all(|l| l.chars().count() <= LEGEND_CHARS),
            "{lines:?}"
        );
        // every word of the legend is in the figure, then one swatch label per x_2, x_3
        let words: Vec<&str> = legend_paragraphs()
            .iter()
            .flat_map(|p| p.split(' '))
            .collect();
        let shown: Vec<&str> = lines.iter().flat_map(|l| l.split(' ')).collect();
        assert_eq!(&shown[..words.len()], &words[..]);
        assert_eq!(&shown[words.len()..], ["x2", "x3"]);
        for line in &lines {
            assert!(line.chars().count() <= LEGEND_CHARS);
        }
    }

    #[test]
    fn words_wrap_at_spaces() {
        assert_eq!(wrap_words("a bb ccc dddd", 6), ["a bb", "ccc", "dddd"]);
        assert_eq!(wrap_words("averylongword x", 4), ["averylongword", "x"]);
        assert!(wrap_words("", 4).is_empty());
    }

    #[test]
    fn one_framed_panel_per_term_and_negatives_in_red() {
        let panels = vec![
            PathPanel {
                path: LatticePath::of_monomial(&[0, 1, 1]).unwrap(),
                monomial: "x2 x3".into(),
                coefficient: "2".into(),
                negative: false,
            },
            PathPanel {
                path: LatticePath::of_monomial(&[0, 0, 2]).unwrap(),
                monomial: "x3^2".into(),
                coefficient: "-1".into(),
                negative: true,
            },
        ];
        let look = Look::light();
        let scene = path_grid_scene(&panels, 3, 4, &look);
        let red_text = scene
            .items
            .iter()
            .filter(|i| matches!(&i.kind, ItemKind::Text { color, text, .. } if *color == look.alert() && text == "-1"))
            .count();
        assert_eq!(red_text, 1);
        let frames = scene
            .items
            .iter()
            .filter(|i| {
                matches!(i.tag, Tag::Panel(_))
                    && matches!(&i.kind, ItemKind::Path { fill: Some(_), .. })
            })
            .count();
        assert_eq!(frames, 2);
    }
}
