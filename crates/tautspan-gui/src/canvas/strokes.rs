//! The canvas's many straight strokes (members, their casings, the load
//! path's glow, joint and mass marks) gathered and handed to the painter
//! at once. A small drawing keeps them as shapes, anti-aliased by egui's
//! tessellator; a large one (a net of thousands of members) writes each
//! stroke straight into one mesh as a quad, which is what the tessellator
//! makes of it without anti-aliasing anyway, at a small part of the cost:
//! a frame that redraws a 10,000-member net then spends its time on what
//! changed, not on tessellating strokes.

use egui::epaint::Mesh;
use egui::{Color32, Painter, Pos2, Rect, Shape, Stroke, vec2};

/// Members and joints above which a drawing goes into a mesh.
pub const LARGE_DRAWING: usize = 2_000;

/// Strokes gathered for one hand-over to the painter.
pub struct Strokes {
    shapes: Vec<Shape>,
    /// `Some` for a large drawing: every stroke goes here.
    mesh: Option<Mesh>,
}

impl Strokes {
    /// Gathering for a drawing of `items` members and joints.
    pub fn new(items: usize) -> Self {
        if items > LARGE_DRAWING {
            Self { shapes: Vec::new(), mesh: Some(Mesh::default()) }
        } else {
            Self { shapes: Vec::with_capacity(items * 2), mesh: None }
        }
    }

    /// Room for `quads` strokes or squares, where they go into a mesh (a
    /// large net's mesh grows to megabytes: grown once, not by doubling).
    pub fn with_room_for(mut self, quads: usize) -> Self {
        if let Some(mesh) = &mut self.mesh {
            mesh.reserve_vertices(4 * quads);
            mesh.reserve_triangles(2 * quads);
        }
        self
    }

    /// A straight stroke from `a` to `b` with square-cut ends.
    pub fn segment(&mut self, a: Pos2, b: Pos2, stroke: Stroke) {
        match &mut self.mesh {
            None => self.shapes.push(Shape::line_segment([a, b], stroke)),
            Some(mesh) => quad(mesh, a, b, stroke),
        }
    }

    /// A dashed stroke from `a` to `b`: dashes of `dash`, gaps of `gap` (pt).
    pub fn dashed(&mut self, a: Pos2, b: Pos2, stroke: Stroke, dash: f32, gap: f32) {
        match &mut self.mesh {
            None => self.shapes.extend(Shape::dashed_line(&[a, b], stroke, dash, gap)),
            Some(mesh) => {
                let length = a.distance(b);
                if length <= 0.0 {
                    return;
                }
                let along = (b - a) / length;
                let mut s = 0.0;
                while s < length {
                    let e = (s + dash).min(length);
                    quad(mesh, a + along * s, a + along * e, stroke);
                    s = e + gap;
                }
            }
        }
    }

    /// A filled square of side `side` centred at `p` (a joint's or a
    /// mass's mark where names cannot be read).
    pub fn square(&mut self, p: Pos2, side: f32, colour: Color32) {
        let r = Rect::from_center_size(p, vec2(side, side));
        match &mut self.mesh {
            None => self.shapes.push(Shape::rect_filled(r, 0.0, colour)),
            Some(mesh) => mesh.add_colored_rect(r, colour),
        }
    }

    /// Hand what is gathered to the painter (before anything painted over it).
    pub fn flush(&mut self, painter: &Painter) {
        painter.extend(std::mem::take(&mut self.shapes));
        if let Some(mesh) = &mut self.mesh
            && !mesh.is_empty()
        {
            painter.add(Shape::mesh(std::mem::take(mesh)));
        }
    }
}

/// The quad of a stroke from `a` to `b`, `stroke.width` wide.
fn quad(mesh: &mut Mesh, a: Pos2, b: Pos2, stroke: Stroke) {
    let d = b - a;
    let length = d.length();
    if length.is_nan() || length <= 0.0 || stroke.width <= 0.0 || stroke.color == Color32::TRANSPARENT {
        return;
    }
    let n = vec2(-d.y, d.x) * (0.5 * stroke.width / length);
    let first = mesh.vertices.len() as u32;
    for p in [a + n, a - n, b - n, b + n] {
        mesh.colored_vertex(p, stroke.color);
    }
    mesh.add_triangle(first, first + 1, first + 2);
    mesh.add_triangle(first, first + 2, first + 3);
}

#[cfg(test)]
mod tests {
    use super::*;
    use egui::pos2;

    // A stroke's quad is the rectangle of its width about the segment: its
    // corners lie half the width either side of each end (exact up to f32).
    #[test]
    fn a_stroke_becomes_the_quad_of_its_width() {
        let mut mesh = Mesh::default();
        quad(&mut mesh, pos2(10.0, 10.0), pos2(40.0, 50.0), Stroke::new(4.0, Color32::RED));
        assert_eq!(mesh.vertices.len(), 4);
        assert_eq!(mesh.indices.len(), 6);
        // the segment runs along (3, 4)/5; its normal is (-4, 3)/5, times 2
        let want = [pos2(8.4, 11.2), pos2(11.6, 8.8), pos2(41.6, 48.8), pos2(38.4, 51.2)];
        for (v, w) in mesh.vertices.iter().zip(want) {
            assert!(v.pos.distance(w) < 1e-4, "{:?} vs {w:?}", v.pos);
            assert_eq!(v.color, Color32::RED);
        }
        // nothing for a point or an invisible stroke
        quad(&mut mesh, pos2(1.0, 1.0), pos2(1.0, 1.0), Stroke::new(4.0, Color32::RED));
        quad(&mut mesh, pos2(1.0, 1.0), pos2(5.0, 1.0), Stroke::new(0.0, Color32::RED));
        assert_eq!(mesh.vertices.len(), 4);
    }

    // Dashes of 9 with gaps of 6 along 40 pt: dashes at 0–9, 15–24, 30–39.
    #[test]
    fn a_dashed_stroke_has_its_dashes() {
        let mut s = Strokes::new(LARGE_DRAWING + 1);
        assert!(s.mesh.is_some());
        s.dashed(pos2(0.0, 0.0), pos2(40.0, 0.0), Stroke::new(2.0, Color32::BLUE), 9.0, 6.0);
        let mesh = s.mesh.as_ref().unwrap();
        assert_eq!(mesh.vertices.len(), 12);
        let xs: Vec<f32> = mesh.vertices.iter().step_by(2).map(|v| v.pos.x).collect();
        assert_eq!(xs, vec![0.0, 9.0, 15.0, 24.0, 30.0, 39.0]);
        assert!(Strokes::new(10).mesh.is_none());
    }
}
