//! The scene: a list of stroked or filled paths, circles and text in figure
//! units (1 unit = 1 pt in exports), y pointing down, with tags that say which
//! mathematical object each item draws (for hover, clicks and counting).

/// An sRGB colour with alpha.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub struct Color {
    /// Red.
    pub r: u8,
    /// Green.
    pub g: u8,
    /// Blue.
    pub b: u8,
    /// Alpha (255 = opaque).
    pub a: u8,
}

impl Color {
    /// An opaque colour.
    pub const fn rgb(r: u8, g: u8, b: u8) -> Color {
        Color { r, g, b, a: 255 }
    }

    /// `#rrggbb`.
    pub fn hex(self) -> String {
        format!("#{:02x}{:02x}{:02x}", self.r, self.g, self.b)
    }
}

/// A point in figure units.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Pt {
    /// Horizontal coordinate, growing to the right.
    pub x: f32,
    /// Vertical coordinate, growing downward.
    pub y: f32,
}

impl Pt {
    /// The point (x, y).
    pub const fn new(x: f32, y: f32) -> Pt {
        Pt { x, y }
    }
}

/// One command of a path.
#[derive(Clone, Copy, Debug, PartialEq)]
pub enum PathCmd {
    /// Start a new subpath.
    MoveTo(Pt),
    /// A straight segment.
    LineTo(Pt),
    /// A cubic Bézier segment (two control points, then the end point).
    CubicTo(Pt, Pt, Pt),
    /// Close the subpath.
    Close,
}

impl PathCmd {
    /// The open polyline through the points: a move to the first, lines to the rest.
    pub fn polyline(points: impl IntoIterator<Item = Pt>) -> Vec<PathCmd> {
        points
            .into_iter()
            .enumerate()
            .map(|(i, p)| {
                if i == 0 {
                    PathCmd::MoveTo(p)
                } else {
                    PathCmd::LineTo(p)
                }
            })
            .collect()
    }
}

/// How a path or circle is outlined.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct Stroke {
    /// Line width in figure units.
    pub width: f32,
    /// Line colour.
    pub color: Color,
}

/// Where a text's anchor point sits relative to the text.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum Anchor {
    /// The anchor is the centre of the text.
    Center,
    /// The anchor is the middle of the left edge.
    Left,
    /// The anchor is the middle of the right edge.
    Right,
}

/// What a scene item draws, for hit-testing, highlighting and counting.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum Tag {
    /// Decoration: grid lines, frames, backgrounds.
    None,
    /// A whole pipe or wire, by its label (1-based).
    Pipe(usize),
    /// A cell (row, column), 1-based.
    Cell(usize, usize),
    /// The k-th crossing of a wiring diagram (0-based, in word order).
    Crossing(usize),
    /// The k-th basis element of a grid of diagrams (0-based).
    Panel(usize),
    /// A vertex of a polytope (0-based).
    Vertex(usize),
    /// An internal node of an indexed forest, by its index in the forest's node list (0-based).
    Node(usize),
    /// A text label.
    Label,
}

/// The geometry of an item.
#[derive(Clone, Debug, PartialEq)]
pub enum ItemKind {
    /// A path, stroked and/or filled.
    Path {
        /// The path's commands.
        cmds: Vec<PathCmd>,
        /// The outline, if any.
        stroke: Option<Stroke>,
        /// The fill, if any.
        fill: Option<Color>,
    },
    /// A circle, stroked and/or filled.
    Circle {
        /// Centre.
        center: Pt,
        /// Radius in figure units.
        radius: f32,
        /// The outline, if any.
        stroke: Option<Stroke>,
        /// The fill, if any.
        fill: Option<Color>,
    },
    /// A line of text.
    Text {
        /// The anchor point.
        pos: Pt,
        /// The text (plain; `_` and `^` are not interpreted).
        text: String,
        /// Font size in figure units.
        size: f32,
        /// Text colour.
        color: Color,
        /// How the text sits on its anchor.
        anchor: Anchor,
    },
}

/// One drawn thing and what it stands for.
#[derive(Clone, Debug, PartialEq)]
pub struct Item {
    /// The geometry.
    pub kind: ItemKind,
    /// What it draws.
    pub tag: Tag,
}

/// A whole figure.
#[derive(Clone, Debug, PartialEq)]
pub struct Scene {
    /// Width in figure units.
    pub width: f32,
    /// Height in figure units.
    pub height: f32,
    /// The background colour (exports may make it transparent).
    pub background: Color,
    /// Items in painting order.
    pub items: Vec<Item>,
}

impl Scene {
    /// An empty scene.
    pub fn new(width: f32, height: f32, background: Color) -> Scene {
        Scene {
            width,
            height,
            background,
            items: Vec::new(),
        }
    }

    /// Appends a text label (tagged [`Tag::Label`]).
    pub fn label(&mut self, pos: Pt, text: String, size: f32, color: Color, anchor: Anchor) {
        self.push(
            ItemKind::Text {
                pos,
                text,
                size,
                color,
                anchor,
            },
            Tag::Label,
        );
    }

    /// Appends an item.
    pub fn push(&mut self, kind: ItemKind, tag: Tag) {
        self.items.push(Item { kind, tag });
    }

    /// The distinct pipe labels drawn, in increasing order.
    pub fn pipe_labels(&self) -> Vec<usize> {
        let mut v: Vec<usize> = self
            .items
            .iter()
            .filter_map(|i| match i.tag {
                Tag::Pipe(k) => Some(k),
                _ => None,
            })
            .collect();
        v.sort_unstable();
        v.dedup();
        v
    }
}
