//! What a picture of P_λ needs: its vertices as text, their drawing
//! coordinates and its edges; the one computation behind the explorer's
//! drawing and `elbowroom figure permutohedron`.

use super::permutohedron::Permutohedron;
use crate::error::{MathError, MathResult};

/// The largest n for which P_λ is drawn (5! = 120 vertices).
pub const MAX_DRAWN_N: usize = 5;

/// The vertices and edges of a permutohedron, with coordinates for drawing.
#[derive(Clone, Debug, PartialEq)]
pub struct PolytopeDrawing {
    /// Each vertex as text, e.g. `(3, 1, 2)`.
    pub labels: Vec<String>,
    /// Coordinates in the hyperplane Σ x_i = Σ λ_i (n - 1 of them per vertex;
    /// floats, for pictures only).
    pub coords: Vec<Vec<f64>>,
    /// Pairs of adjacent vertices.
    pub edges: Vec<(usize, usize)>,
}

impl PolytopeDrawing {
    /// The drawing of P_λ, for n <= [`MAX_DRAWN_N`] (otherwise `OutOfRange`).
    ///
    /// ```
    /// use elbowroom_math::permutohedra::drawing::PolytopeDrawing;
    /// use elbowroom_math::permutohedra::permutohedron::Permutohedron;
    /// use num_rational::BigRational;
    /// let l: Vec<BigRational> = [2, 1, 0].iter().map(|&v: &i64| BigRational::from_integer(v.into())).collect();
    /// let d = PolytopeDrawing::of(&Permutohedron::new(&l).unwrap()).unwrap();
    /// // the hexagon: 6 vertices, 6 edges, plane coordinates
    /// assert_eq!((d.labels.len(), d.edges.len(), d.coords[0].len()), (6, 6, 2));
    /// assert_eq!(d.labels[0], "(2, 1, 0)");
    /// ```
    pub fn of(p: &Permutohedron) -> MathResult<PolytopeDrawing> {
        if p.n() > MAX_DRAWN_N {
            return Err(MathError::OutOfRange(format!(
                "P_λ is drawn for n <= {MAX_DRAWN_N}"
            )));
        }
        let vertices = p.vertices(120)?;
        let edges = p.edges(&vertices);
        let coords = Permutohedron::drawing_coordinates(&vertices);
        let labels = vertices
            .iter()
            .map(|v| {
                let t: Vec<String> = v.iter().map(|x| x.to_string()).collect();
                format!("({})", t.join(", "))
            })
            .collect();
        Ok(PolytopeDrawing {
            labels,
            coords,
            edges,
        })
    }
}
