//! Force labels beside the members on the canvas, laid out only where they
//! can be read: beside members long enough on screen to carry one, in view,
//! clear of the labels already placed, and at most [`MAX_LABELS`] of them —
//! the selected member first, then the most utilised. Laying out text is the
//! costly part of a frame after a re-solve (every number changes), so a
//! dense rig lays out only what a person could read; the canvas says how
//! many labels it left out, and the results table has every number.

use egui::{Align, Align2, Color32, FontId, Painter, Pos2, Rect, vec2};

/// Most labels laid out in one frame.
pub const MAX_LABELS: usize = 120;

/// Shortest member on screen that carries a label, points.
const MIN_LENGTH_PT: f32 = 48.0;

/// Rough width of one character of the label font, points (for the overlap
/// test before the text is laid out).
const CHAR_WIDTH_PT: f32 = 6.6;

/// A member that may get a label.
pub struct Candidate {
    /// Index of the member in the canvas geometry.
    pub member: usize,
    /// Its ends on screen.
    pub ends: [Pos2; 2],
    /// Its utilisation (the most utilised are labelled first).
    pub utilisation: f64,
    /// It is selected: labelled whatever its length.
    pub picked: bool,
}

/// A label's text on a plain box, so it reads over the grid and members.
pub fn label(painter: &Painter, at: Pos2, anchor: Align2, text: String, colour: Color32) {
    let galley = painter.layout_no_wrap(text, FontId::proportional(12.0), colour);
    let rect = anchor.anchor_size(at, galley.size()).expand(2.0);
    painter.rect_filled(rect, 2.0, Color32::from_rgba_unmultiplied(0xf5, 0xf3, 0xec, 0xe0));
    painter.galley(rect.min + vec2(2.0, 2.0), galley, colour);
}

/// As [`label`], moved down a line at a time until it overlaps none of
/// `placed` (the slabs' labels, so two slabs side by side do not print over
/// each other); its rectangle is added to `placed`.
pub fn label_clear_of(
    painter: &Painter,
    at: Pos2,
    anchor: Align2,
    text: String,
    colour: Color32,
    placed: &mut Vec<Rect>,
) {
    let galley = painter.layout_no_wrap(text, FontId::proportional(12.0), colour);
    let rect = clear_of(anchor.anchor_size(at, galley.size()).expand(2.0), placed);
    placed.push(rect);
    painter.rect_filled(rect, 2.0, Color32::from_rgba_unmultiplied(0xf5, 0xf3, 0xec, 0xe0));
    painter.galley(rect.min + vec2(2.0, 2.0), galley, colour);
}

/// `rect` moved down by its own height plus a gap until it overlaps none of
/// `placed` (at most 50 steps: past that it stays where it got).
pub fn clear_of(mut rect: Rect, placed: &[Rect]) -> Rect {
    for _ in 0..50 {
        if !placed.iter().any(|p| p.intersects(rect)) {
            break;
        }
        rect = rect.translate(vec2(0.0, rect.height() + 2.0));
    }
    rect
}

/// Where a member's label goes: beside its middle, on the side away from
/// the rig's `centre`, so the labels of members meeting at a joint do not
/// sit on each other.
fn placement(ends: [Pos2; 2], centre: Pos2) -> (Pos2, Align2) {
    let [sa, sb] = ends;
    let mid = sa + (sb - sa) * 0.5;
    let dir = (sb - sa).normalized();
    let mut normal = vec2(-dir.y, dir.x);
    if normal.dot(mid - centre) < 0.0 {
        normal = -normal;
    }
    let side = |c: f32| {
        if c > 0.3 {
            Align::Min
        } else if c < -0.3 {
            Align::Max
        } else {
            Align::Center
        }
    };
    (mid + normal * 10.0, Align2([side(normal.x), side(normal.y)]))
}

/// Draw the labels that fit; `text` gives a member's label. Returns how
/// many candidates were left without one.
pub fn draw(
    painter: &Painter,
    view_rect: Rect,
    centre: Pos2,
    mut candidates: Vec<Candidate>,
    colour: Color32,
    text: impl Fn(usize) -> String,
) -> usize {
    let total = candidates.len();
    candidates.retain(|c| {
        let mid = c.ends[0] + (c.ends[1] - c.ends[0]) * 0.5;
        c.picked || (view_rect.contains(mid) && c.ends[0].distance(c.ends[1]) >= MIN_LENGTH_PT)
    });
    candidates.sort_by(|a, b| b.picked.cmp(&a.picked).then(b.utilisation.total_cmp(&a.utilisation)));
    let mut placed: Vec<Rect> = Vec::new();
    for c in candidates {
        if placed.len() >= MAX_LABELS {
            break;
        }
        let t = text(c.member);
        let (at, anchor) = placement(c.ends, centre);
        let size = vec2(t.chars().count() as f32 * CHAR_WIDTH_PT, 14.0);
        let rect = anchor.anchor_size(at, size).expand(2.0);
        if !c.picked && placed.iter().any(|r| r.intersects(rect)) {
            continue;
        }
        placed.push(rect);
        label(painter, at, anchor, t, colour);
    }
    total - placed.len()
}

#[cfg(test)]
mod tests {
    use super::*;
    use egui::pos2;

    fn candidate(member: usize, a: Pos2, b: Pos2, utilisation: f64) -> Candidate {
        Candidate { member, ends: [a, b], utilisation, picked: false }
    }

    #[test]
    fn a_label_over_another_moves_down_until_clear() {
        let first = Rect::from_min_size(pos2(100.0, 200.0), vec2(180.0, 18.0));
        // a second slab's label at nearly the same place: moved one line down
        let second = clear_of(Rect::from_min_size(pos2(140.0, 205.0), vec2(180.0, 18.0)), &[first]);
        assert!(!second.intersects(first));
        assert_eq!(second.min, pos2(140.0, 225.0), "one line (18 + 2) down");
        // a third over both: below both
        let third = clear_of(Rect::from_min_size(pos2(120.0, 200.0), vec2(180.0, 18.0)), &[first, second]);
        assert!(!third.intersects(first) && !third.intersects(second));
        // one already clear stays
        let apart = Rect::from_min_size(pos2(400.0, 200.0), vec2(100.0, 18.0));
        assert_eq!(clear_of(apart, &[first, second]), apart);
    }

    #[test]
    fn short_or_crowded_members_get_no_label() {
        let ctx = egui::Context::default();
        let mut left_out = Vec::new();
        let mut output = ctx.run_ui(egui::RawInput::default(), |ui| {
            let painter = ui.painter().clone();
            let view = Rect::from_min_size(Pos2::ZERO, vec2(800.0, 600.0));
            let centre = pos2(400.0, 300.0);
            let text = |k: usize| format!("M{k} 1.234 kN");
            // ten members 20 points long: too short to carry a label
            let short = (0..10)
                .map(|k| {
                    let x = 20.0 + 60.0 * k as f32;
                    candidate(k, pos2(x, 100.0), pos2(x, 120.0), 0.5)
                })
                .collect();
            left_out.push(draw(&painter, view, centre, short, Color32::BLACK, text));
            // two long members drawn over each other: one label, the more utilised
            let twins = vec![
                candidate(0, pos2(100.0, 400.0), pos2(300.0, 400.0), 0.2),
                candidate(1, pos2(100.0, 400.0), pos2(300.0, 400.0), 0.9),
            ];
            left_out.push(draw(&painter, view, centre, twins, Color32::BLACK, text));
            // the selected member is labelled however short
            let picked = vec![Candidate { picked: true, ..candidate(0, pos2(50.0, 50.0), pos2(50.0, 60.0), 0.1) }];
            left_out.push(draw(&painter, view, centre, picked, Color32::BLACK, text));
        });
        output.textures_delta.clear();
        assert_eq!(left_out, [10, 1, 0]);
    }
}
