//! Painting the elevation: paper, grid and scale bar, floor slabs, members
//! and ropes over sheaves (a polyline through their path, sheaves as plain
//! rings of their diameter) shaded by utilisation (dashed when slack, heavy and hatched when over),
//! a small diamond on members that carry fittings, force labels, nodes with our own symbols, masses, the selected mass's
//! load path, the legend, and in the deflected view the drawn shape faint
//! beneath with the caption. Positions come from the document (what the
//! user drew) or, deflected, from the core's solved positions; forces from
//! the core's analysis. The geometry is read in `geometry`, the force labels
//! placed in `labels`.

use super::input::CanvasInput;
use super::strokes::Strokes;
use crate::canvas::geometry::{GeoFloor, GeoMass, Geometry};
use crate::canvas::labels::{self, Candidate, label};
use crate::canvas::view::{View, ViewKind};
use crate::document::selection::Selection;
use crate::fields::units_display::{Shown, UnitSystem, fmt_utilisation};
use egui::{Align2, Color32, FontId, Painter, Pos2, Rect, Shape, Stroke, pos2, vec2};
use std::cell::OnceCell;
use std::collections::HashMap;
use tautspan_core::analysis::MemberResult;
use tautspan_core::analysis::State;
use tautspan_core::colour_ramp::{RAMP_MAX, rgb};
use tautspan_core::file::SupportDto;

const PAPER: Color32 = Color32::from_rgb(0xf5, 0xf3, 0xec);
const GRID: Color32 = Color32::from_rgb(0xe2, 0xdf, 0xd5);
const GRID_AXIS: Color32 = Color32::from_rgb(0xc9, 0xc4, 0xb6);
const INK: Color32 = Color32::from_rgb(0x2b, 0x2d, 0x33);
const CASING: Color32 = Color32::from_rgb(0x55, 0x58, 0x60);
const PICK: Color32 = Color32::from_rgb(0x1f, 0x5f, 0xd6);
const PATH_GLOW: Color32 = Color32::from_rgba_premultiplied(0x2a, 0x7a, 0xd8, 0x55);
const UNSOLVED: Color32 = Color32::from_rgb(0x9a, 0x9c, 0xa3);

/// The block drawn for a mass, below its node.
pub fn mass_rect(geo: &Geometry, view: &View, m: &GeoMass) -> Option<Rect> {
    let n = geo.node(&m.at)?;
    let p = view.to_screen(n.pos_m[0], n.pos_m[1]);
    Some(Rect::from_center_size(p + vec2(0.0, 30.0), vec2(34.0, 20.0)))
}

fn draw_grid(painter: &Painter, view: &View, units: UnitSystem) {
    let rect = view.rect;
    painter.rect_filled(rect, 0.0, PAPER);
    let step = view.grid_step_m(units);
    // the 3-D view has no plane of its own to rule: paper and scale bar only
    let ruled = view.kind != ViewKind::Orbit;
    let lo = view.to_world(rect.left_bottom());
    let hi = view.to_world(rect.right_top());
    let mut x = (lo[0] / step).floor() * step;
    while ruled && x <= hi[0] {
        let sx = view.to_screen(x, 0.0).x;
        let c = if x.abs() < step * 1e-6 { GRID_AXIS } else { GRID };
        painter.line_segment([pos2(sx, rect.top()), pos2(sx, rect.bottom())], Stroke::new(1.0, c));
        x += step;
    }
    let mut y = (lo[1] / step).floor() * step;
    while ruled && y <= hi[1] {
        let sy = view.to_screen(0.0, y).y;
        let c = if y.abs() < step * 1e-6 { GRID_AXIS } else { GRID };
        painter.line_segment([pos2(rect.left(), sy), pos2(rect.right(), sy)], Stroke::new(1.0, c));
        y += step;
    }
    // scale bar: one grid step, bottom left
    let w = (step * view.px_per_m) as f32;
    let a = rect.left_bottom() + vec2(16.0, -18.0);
    let b = a + vec2(w, 0.0);
    painter.line_segment([a, b], Stroke::new(2.0, INK));
    for p in [a, b] {
        painter.line_segment([p - vec2(0.0, 5.0), p + vec2(0.0, 5.0)], Stroke::new(2.0, INK));
    }
    painter.text(
        b + vec2(8.0, 0.0),
        Align2::LEFT_CENTER,
        units.fmt(step, Shown::Length),
        FontId::proportional(12.0),
        INK,
    );
}

fn hatch_over(painter: &Painter, a: Pos2, b: Pos2, colour: Color32) {
    let d = b - a;
    let len = d.length();
    if len < 1.0 {
        return;
    }
    let along = d / len;
    let across = vec2(-along.y, along.x);
    let mut s = 6.0;
    while s < len - 4.0 {
        let c = a + along * s;
        painter
            .line_segment([c - across * 7.0 - along * 3.0, c + across * 7.0 + along * 3.0], Stroke::new(2.0, colour));
        s += 10.0;
    }
}

fn anchor_symbol(painter: &Painter, p: Pos2, stroke: Stroke) {
    // a solid block with three short ties above it: fixed to structure
    painter.rect_filled(Rect::from_center_size(p, vec2(11.0, 11.0)), 1.0, INK);
    for k in [-4.0, 0.0, 4.0] {
        painter.line_segment([p + vec2(k - 2.0, -12.0), p + vec2(k + 2.0, -7.0)], stroke);
    }
    painter.line_segment([p + vec2(-8.0, -7.0), p + vec2(8.0, -7.0)], stroke);
}

/// Where a member's parts mark sits: a quarter of the way from its first
/// end, clear of the force label at the middle.
pub fn parts_mark_at(a: Pos2, b: Pos2) -> Pos2 {
    a + (b - a) * 0.25
}

/// The mark of a member that carries fittings: a small white diamond with
/// a dark edge, on the member; with more than one part, their number beside it.
fn parts_mark(painter: &Painter, p: Pos2, count: usize) {
    let r = 5.5;
    painter.add(Shape::convex_polygon(
        vec![p + vec2(0.0, -r), p + vec2(r, 0.0), p + vec2(0.0, r), p + vec2(-r, 0.0)],
        Color32::WHITE,
        Stroke::new(1.5, INK),
    ));
    if count > 1 {
        painter.text(p + vec2(r + 2.0, 0.0), Align2::LEFT_CENTER, count.to_string(), FontId::proportional(10.0), INK);
    }
}

fn draw_floor(painter: &Painter, view: &View, f: &GeoFloor, picked: bool) {
    let r = f.rect_screen(view);
    painter.rect_filled(r, 0.0, Color32::from_rgb(0xd8, 0xd3, 0xc4));
    let step = 9.0;
    let mut x = r.left() - r.height();
    while x < r.right() {
        let a = pos2(x.max(r.left()), r.bottom() - (x.max(r.left()) - x));
        let b = pos2((x + r.height()).min(r.right()), r.bottom() - ((x + r.height()).min(r.right()) - x));
        painter.line_segment([a, b], Stroke::new(1.0, Color32::from_rgb(0x9e, 0x97, 0x84)));
        x += step;
    }
    let edge = if picked { Stroke::new(2.5, PICK) } else { Stroke::new(1.5, INK) };
    painter.rect_stroke(r, 0.0, edge, egui::StrokeKind::Inside);
}

/// What a placing tool has picked so far, drawn as a dashed line to the pointer.
pub struct Picking<'a> {
    /// The member tool's first node.
    pub member_start: Option<&'a str>,
    /// The rope tool's nodes so far.
    pub rope_path: &'a [String],
    /// The pointer over the canvas.
    pub hover: Option<Pos2>,
    /// The multi-leg sling helper's hook and pick points so far.
    pub sling: &'a [String],
    /// Draw the legend (the user may fold it away).
    pub legend: bool,
    /// All of the drawing, or the part that stays or moves while a node is dragged.
    pub part: Part,
}

/// Which part of the drawing to draw. While a node of a large drawing is
/// dragged, everything that does not move is drawn once and kept; each
/// frame draws only the dragged node with its members and mass on top.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Part {
    /// The whole drawing.
    All,
    /// All but the node (an index into the geometry's nodes), its members,
    /// ropes and mass.
    Without(usize),
    /// Only the node, its members, ropes and mass.
    Only(usize),
}

impl Part {
    /// Whether an item touching these nodes is drawn.
    fn keeps(self, touches: impl Fn(usize) -> bool) -> bool {
        match self {
            Part::All => true,
            Part::Without(k) => !touches(k),
            Part::Only(k) => touches(k),
        }
    }

    /// Whether the parts that never move are drawn (grid, floors, legend,
    /// labels, the routing lines).
    fn still(self) -> bool {
        !matches!(self, Part::Only(_))
    }
}

/// Smallest radius a sheave is drawn with, points, so a small sheave far
/// out still shows.
const SHEAVE_MIN_RADIUS_PT: f32 = 7.0;

/// A sheave: a plain ring of its tread diameter on screen (at least
/// [`SHEAVE_MIN_RADIUS_PT`]) with a hub mark; red-edged while its diameter
/// is not given.
fn sheave_symbol(painter: &Painter, view: &View, p: Pos2, diameter_m: Option<f64>) {
    let r = diameter_m.map_or(0.0, |d| (d / 2.0 * view.px_per_m) as f32).max(SHEAVE_MIN_RADIUS_PT);
    let edge = if diameter_m.is_some() { INK } else { crate::fields::qty_field::ERROR };
    painter.circle_filled(p, r, Color32::from_rgba_unmultiplied(0xff, 0xff, 0xfb, 0xb0));
    painter.circle_stroke(p, r, Stroke::new(2.0, edge));
    painter.circle_stroke(p, (r * 0.35).min(4.0), Stroke::new(1.0, edge));
}

/// Paint everything.
pub fn draw(
    painter: &Painter,
    view: &View,
    geo: &Geometry,
    input: &CanvasInput<'_>,
    picking: &Picking<'_>,
    deflection: Option<&Deflection<'_>>,
) {
    let (member_start, hover) = (picking.member_start, picking.hover);
    let units = input.units;
    let part = picking.part;
    if part.still() {
        draw_grid(painter, view, units);
    }
    if let Some(d) = deflection.filter(|_| part.still()) {
        draw_ghost(painter, view, d.drawn);
    }
    let case = input.derived.case(input.case);
    let mut panels_drawn: Vec<&str> = Vec::new();
    let (mut floor_labelled, mut floor_labels): (Vec<&str>, Vec<Rect>) = (Vec::new(), Vec::new());
    for f in geo.floors.iter().filter(|_| part.still()) {
        let picked = *input.selection == Selection::Floor(f.floor_id.clone());
        // plan and 3-D show the panel: once per slab, however many feet stand on it
        if matches!(view.kind, ViewKind::Plan | ViewKind::Orbit) {
            if panels_drawn.contains(&f.floor_id.as_str()) {
                continue;
            }
            panels_drawn.push(&f.floor_id);
        }
        if view.kind == ViewKind::Orbit {
            let edge = if picked { Stroke::new(2.5, PICK) } else { Stroke::new(1.5, INK) };
            let corners = f.panel_corners(view).to_vec();
            painter.add(Shape::convex_polygon(corners, Color32::from_rgba_unmultiplied(0xd8, 0xd3, 0xc4, 0xa0), edge));
            continue;
        }
        draw_floor(painter, view, f, picked);
        // one label a slab (an elevation draws a slab under each of its
        // feet), under the slab's whole extent, kept clear of the labels
        // already placed
        if floor_labelled.contains(&f.floor_id.as_str()) {
            continue;
        }
        floor_labelled.push(&f.floor_id);
        if let Some(fr) = case.and_then(|c| c.floors.iter().find(|r| r.id == f.floor_id)) {
            let r = geo
                .floors
                .iter()
                .filter(|g| g.floor_id == f.floor_id)
                .map(|g| g.rect_screen(view))
                .fold(f.rect_screen(view), |a, b| a.union(b));
            let text = format!(
                "{}: normal force {} · deflection {} · {}",
                f.floor_id,
                units.fmt(fr.normal_force_n, Shown::Force),
                units.fmt(fr.deflection_m, Shown::SmallLength),
                fmt_utilisation(fr.utilisation)
            );
            labels::label_clear_of(
                painter,
                r.center_bottom() + vec2(0.0, 4.0),
                Align2::CENTER_TOP,
                text,
                INK,
                &mut floor_labels,
            );
        }
    }

    // load path of the selected mass (or the mass at the selected node)
    let path_mass = match input.selection {
        Selection::Mass(id) => Some(id.clone()),
        Selection::Node(n) => geo.masses.iter().find(|m| &m.at == n).map(|m| m.id.clone()),
        _ => None,
    };
    // members carrying at least the threshold share of its weight, with their shares
    let path: HashMap<&str, f64> = path_mass
        .and_then(|m| case?.load_path.iter().find(|p| p.mass == m))
        .map(|p| p.members.iter().map(String::as_str).zip(p.shares.iter().copied()).collect())
        .unwrap_or_default();

    // each member's worst case over all cases, when that colouring is on
    let worst: Option<HashMap<&str, &MemberResult>> = match input.derived.solved.as_ref() {
        Some(s) if input.worst_case => Some(crate::document::envelope::worst_members(&s.analysis)),
        _ => None,
    };
    // a case's results are in the order of the members, then the ropes;
    // looked up by id only when the drawing and the results differ (an edit
    // not yet solved), so a frame of a large net does not hash every id
    let by_id: OnceCell<HashMap<&str, &MemberResult>> = OnceCell::new();
    let result_at = |k: usize, id: &str| -> Option<&MemberResult> {
        if let Some(w) = &worst {
            return w.get(id).copied();
        }
        let c = case?;
        match c.members.get(k) {
            Some(r) if r.id == id => Some(r),
            _ => by_id.get_or_init(|| c.members.iter().map(|r| (r.id.as_str(), r)).collect()).get(id).copied(),
        }
    };
    // labels go on the side of each member away from the middle of the rig,
    // so the labels of members meeting at a joint do not sit on each other
    let centre = {
        let pts: Vec<Pos2> = geo.nodes.iter().map(|n| view.to_screen(n.pos_m[0], n.pos_m[1])).collect();
        let n = pts.len().max(1) as f32;
        pts.iter().fold(Pos2::ZERO, |acc, p| acc + p.to_vec2() / n)
    };
    let mut labels = Vec::new();
    // every member's strokes gathered and handed to the painter at once (a
    // large net has tens of thousands; one call each costs more than drawing)
    let mut shapes = Strokes::new(geo.members.len() + geo.nodes.len()).with_room_for(2 * geo.members.len());
    for (k, m) in geo.members_in_order() {
        if !part.keeps(|n| m.end_at.is_some_and(|e| e.contains(&n))) {
            continue;
        }
        let Some((a, b)) = geo.ends(m) else { continue };
        let (sa, sb) = (view.to_screen(a.pos_m[0], a.pos_m[1]), view.to_screen(b.pos_m[0], b.pos_m[1]));
        let picked = matches!(input.selection, Selection::Member(id) if *id == m.id);
        // a member under a pixel on screen (seen end on, or far out) cannot be read: its
        // ends' marks show where it is
        if (sb - sa).length_sq() < 1.0 && !picked {
            continue;
        }
        if !view.rect.expand(8.0).intersects(Rect::from_two_pos(sa, sb)) {
            continue;
        }
        let result = result_at(k, &m.id);
        if let Some(share) = path.get(m.id.as_str()) {
            // the glow widens with the member's share of the mass's weight
            shapes.segment(sa, sb, Stroke::new(8.0 + 8.0 * share.clamp(0.0, 1.0) as f32, PATH_GLOW));
        }
        if picked {
            shapes.segment(sa, sb, Stroke::new(11.0, PICK));
        }
        line(&mut shapes, painter, sa, sb, result);
        if !m.parts.is_empty() {
            shapes.flush(painter);
            parts_mark(painter, parts_mark_at(sa, sb), m.parts.len());
        }
        if input.labels
            && let Some(r) = result
        {
            labels.push(Candidate { member: k, ends: [sa, sb], utilisation: r.utilisation, picked });
        }
    }
    // ropes: each span drawn as a member is, shaded by the rope's
    // utilisation (on its largest span); the label on its longest span on screen
    let on_screen = |a: &str, b: &str| {
        let (a, b) = (geo.node(a)?, geo.node(b)?);
        Some((view.to_screen(a.pos_m[0], a.pos_m[1]), view.to_screen(b.pos_m[0], b.pos_m[1])))
    };
    let on_rope =
        |r: &crate::canvas::geometry::GeoRope, n: usize| geo.nodes.get(n).is_some_and(|node| r.path.contains(&node.id));
    for (k, r) in geo.ropes.iter().enumerate() {
        if !part.keeps(|n| on_rope(r, n)) {
            continue;
        }
        let spans: Vec<(Pos2, Pos2)> = r.spans().filter_map(|(a, b)| on_screen(a, b)).collect();
        let result = result_at(geo.members.len() + k, &r.id);
        let picked = matches!(input.selection, Selection::Rope(id) if *id == r.id);
        for &(sa, sb) in &spans {
            if let Some(share) = path.get(r.id.as_str()) {
                shapes.segment(sa, sb, Stroke::new(8.0 + 8.0 * share.clamp(0.0, 1.0) as f32, PATH_GLOW));
            }
            if picked {
                shapes.segment(sa, sb, Stroke::new(11.0, PICK));
            }
            line(&mut shapes, painter, sa, sb, result);
        }
        let longest = spans.iter().max_by(|x, y| x.0.distance(x.1).total_cmp(&y.0.distance(y.1)));
        if input.labels
            && let (Some(res), Some(&(sa, sb))) = (result, longest)
        {
            let member = geo.members.len() + k;
            labels.push(Candidate { member, ends: [sa, sb], utilisation: res.utilisation, picked });
        }
    }
    shapes.flush(painter);
    for (i, n) in geo.nodes.iter().enumerate() {
        if !part.keeps(|k| k == i) {
            continue;
        }
        if let Some(d) = n.sheave_m {
            sheave_symbol(painter, view, view.to_screen(n.pos_m[0], n.pos_m[1]), d);
        }
    }

    if input.labels && part.still() {
        let hidden = labels::draw(painter, view.rect, centre, labels, INK, |k| {
            // candidates past the members are the ropes, in order
            let id = match geo.members.get(k) {
                Some(m) => m.id.as_str(),
                None => geo.ropes.get(k - geo.members.len()).map_or("", |r| r.id.as_str()),
            };
            match result_at(k, id) {
                Some(r) if r.state == State::Slack => format!("{id} slack"),
                // a rope's force is its largest span's tension
                Some(r) if !r.segments.is_empty() => format!("{id} {} max", units.fmt(r.force_n, Shown::Force)),
                Some(r) => format!("{id} {}", units.fmt(r.force_n, Shown::Force)),
                None => id.to_string(),
            }
        });
        if hidden > 0 {
            let text = format!(
                "{hidden} force label(s) left out: members too short on screen or crowded. Zoom in, or read the results table."
            );
            painter.text(
                view.rect.left_bottom() + vec2(16.0, -40.0),
                Align2::LEFT_BOTTOM,
                text,
                FontId::proportional(11.0),
                CASING,
            );
        }
    }

    if let (Some(start), Some(h)) = (member_start.and_then(|s| geo.node(s)).filter(|_| part.still()), hover) {
        let s = view.to_screen(start.pos_m[0], start.pos_m[1]);
        painter.extend(Shape::dashed_line(&[s, h], Stroke::new(2.0, PICK), 6.0, 4.0));
    }
    // the sling helper's legs so far: from the hook to each pick point
    if let Some(hook) = picking.sling.first().and_then(|id| geo.node(id)).filter(|_| part.still()) {
        let h = view.to_screen(hook.pos_m[0], hook.pos_m[1]);
        for n in picking.sling.iter().skip(1).filter_map(|id| geo.node(id)) {
            painter.extend(Shape::dashed_line(
                &[h, view.to_screen(n.pos_m[0], n.pos_m[1])],
                Stroke::new(2.0, PICK),
                6.0,
                4.0,
            ));
        }
        painter.circle_stroke(h, 14.0, Stroke::new(2.0, PICK));
    }
    // the rope routed so far, on to the pointer
    let mut route: Vec<Pos2> = picking
        .rope_path
        .iter()
        .filter_map(|id| geo.node(id))
        .map(|n| view.to_screen(n.pos_m[0], n.pos_m[1]))
        .collect();
    if !route.is_empty() && part.still() {
        route.extend(hover);
        painter.extend(Shape::dashed_line(&route, Stroke::new(2.0, PICK), 6.0, 4.0));
    }

    // names and mass boxes only where they can be read: with more joints
    // than fit one a 40 × 40 pt square of the canvas, a small mark instead
    let readable = view.rect.area() / geo.nodes.len().max(1) as f32 >= READABLE_PT * READABLE_PT;
    let mut marks = Strokes::new(geo.members.len() + geo.nodes.len()).with_room_for(geo.masses.len());
    for m in geo.masses.iter() {
        if part != Part::All && !part.keeps(|k| geo.nodes.get(k).is_some_and(|n| n.id == m.at)) {
            continue;
        }
        let (Some(n), Some(r)) = (geo.node(&m.at), mass_rect(geo, view, m)) else { continue };
        let picked = matches!(input.selection, Selection::Mass(id) if *id == m.id);
        if !readable && !picked {
            let p = view.to_screen(n.pos_m[0], n.pos_m[1]);
            marks.square(p + vec2(0.0, 6.0), 5.0, MASS_FILL);
            continue;
        }
        let p = view.to_screen(n.pos_m[0], n.pos_m[1]);
        painter.line_segment([p, r.center_top()], Stroke::new(1.5, INK));
        painter.rect_filled(r, 3.0, MASS_FILL);
        if picked {
            painter.rect_stroke(r.expand(2.0), 3.0, Stroke::new(2.5, PICK), egui::StrokeKind::Outside);
        }
        let text = m.kg.map_or_else(|| m.id.clone(), |kg| units.fmt(kg, Shown::Mass));
        painter.text(r.center(), Align2::CENTER_CENTER, text, FontId::proportional(11.0), Color32::WHITE);
    }

    marks.flush(painter);
    let stroke = Stroke::new(1.5, INK);
    let mut joints: Vec<Shape> = Vec::with_capacity(geo.nodes.len() * 2);
    // where names cannot be read, a joint is a small square: thousands of
    // circles would only cover each other, at most of a frame's cost
    let mut joint_marks = Strokes::new(geo.members.len() + geo.nodes.len()).with_room_for(2 * geo.nodes.len());
    let mut names: Vec<(Pos2, &str)> = Vec::new();
    for (i, n) in geo.nodes.iter().enumerate() {
        if !part.keeps(|k| k == i) {
            continue;
        }
        let p = view.to_screen(n.pos_m[0], n.pos_m[1]);
        if matches!(input.selection, Selection::Node(id) if *id == n.id)
            || member_start == Some(n.id.as_str())
            || picking.rope_path.contains(&n.id)
            || picking.sling.contains(&n.id)
        {
            painter.circle_stroke(p, 11.0, Stroke::new(2.5, PICK));
        }
        match n.support {
            SupportDto::Anchor => anchor_symbol(painter, p, stroke),
            SupportDto::Joint if !readable => {
                joint_marks.square(p, 6.0, INK);
                joint_marks.square(p, 3.0, Color32::WHITE);
            }
            SupportDto::Joint => {
                joints.push(Shape::circle_filled(p, 5.5, Color32::WHITE));
                joints.push(Shape::circle_stroke(p, 5.5, Stroke::new(2.0, INK)));
            }
            SupportDto::Floor(_) => {
                painter.add(Shape::convex_polygon(
                    vec![p + vec2(-7.0, 0.0), p + vec2(7.0, 0.0), p + vec2(0.0, -9.0)],
                    Color32::WHITE,
                    Stroke::new(2.0, INK),
                ));
            }
        }
        if readable {
            names.push((p, n.id.as_str()));
        }
    }
    painter.extend(joints);
    joint_marks.flush(painter);
    // nodes on one screen point (one above the other in plan, one behind
    // the other in the elevation) share one label naming them all
    let mut shared: Vec<(Pos2, String)> = Vec::new();
    for (p, id) in names {
        match shared.iter_mut().find(|(q, _)| q.distance(p) < 2.0) {
            Some((_, text)) => {
                text.push_str(", ");
                text.push_str(id);
            }
            None => shared.push((p, id.to_string())),
        }
    }
    for (p, text) in shared {
        painter.text(p + vec2(9.0, 9.0), Align2::LEFT_TOP, text, FontId::proportional(11.0), CASING);
    }
    // in the deflected view the caption holds the top left; the legend goes below it
    let legend_top = if deflection.is_some() { CAPTION_HEIGHT + 16.0 } else { 12.0 } + LEGEND_SWITCH_HEIGHT;
    if !picking.legend || !part.still() {
        return;
    }
    legend(painter, view, input.derived.solved.as_ref().map(|s| s.scenario.near_limit).unwrap_or(0.8), legend_top);
    if input.worst_case {
        label(
            painter,
            view.rect.left_bottom() + vec2(10.0, -24.0),
            Align2::LEFT_BOTTOM,
            "Colours and labels: each member's worst case over all cases".to_string(),
            INK,
        );
    }
}

/// One member or rope span into `shapes`: shaded by utilisation, dashed
/// when slack, heavy and hatched when over, grey before there are results.
fn line(shapes: &mut Strokes, painter: &Painter, sa: Pos2, sb: Pos2, result: Option<&MemberResult>) {
    let (col, width, state) = match result {
        Some(r) => (colour(r.utilisation), if r.state == State::Over { 6.0 } else { 3.5 }, Some(r.state)),
        None => (UNSOLVED, 3.0, None),
    };
    if state == Some(State::Slack) {
        shapes.dashed(sa, sb, Stroke::new(width + 1.5, CASING), 9.0, 6.0);
        shapes.dashed(sa, sb, Stroke::new(width, col), 9.0, 6.0);
    } else {
        shapes.segment(sa, sb, Stroke::new(width + 2.0, CASING));
        shapes.segment(sa, sb, Stroke::new(width, col));
        if state == Some(State::Over) {
            shapes.flush(painter);
            hatch_over(painter, sa, sb, CASING);
        }
    }
}

/// Canvas room a joint needs, pt square, for its name and mass box to be
/// drawn (fewer room: they would only cover each other).
const READABLE_PT: f32 = 40.0;

/// Fill of a mass's box.
const MASS_FILL: Color32 = Color32::from_rgb(0x4b, 0x4f, 0x5a);

/// Height the legend's fold switch takes above it, pt.
pub const LEGEND_SWITCH_HEIGHT: f32 = 26.0;

/// Height the deflected view's caption takes at the top of the canvas, pt.
const CAPTION_HEIGHT: f32 = 48.0;

/// The deflected view: the geometry as drawn, shown faint under the
/// deflected one.
pub struct Deflection<'a> {
    /// The geometry as drawn.
    pub drawn: &'a Geometry,
}

/// The deflected view's caption over the canvas's top left corner (the
/// legend moves down below it), naming the case and the magnification (a
/// widget, so it can be read out).
pub fn deflection_caption(ui: &mut egui::Ui, view: &View, caption: &str) {
    let at = Rect::from_min_max(
        view.rect.left_top() + vec2(12.0, 10.0 + super::overlay::SWITCH_HEIGHT),
        view.rect.right_bottom(),
    );
    ui.scope_builder(egui::UiBuilder::new().max_rect(at), |ui| {
        ui.set_clip_rect(view.rect);
        let line = |text: egui::RichText| egui::Label::new(text).wrap_mode(egui::TextWrapMode::Extend);
        egui::Frame::new()
            .fill(Color32::from_rgba_unmultiplied(0xff, 0xff, 0xfb, 0xee))
            .stroke(Stroke::new(1.5, PICK))
            .corner_radius(3.0)
            .inner_margin(6.0)
            .show(ui, |ui| {
                // the key words come first, so a narrow canvas cuts only the case name
                ui.add(line(egui::RichText::new(caption).size(14.0).color(INK).strong()));
                ui.add(line(
                    egui::RichText::new("grey dashes: as drawn · nodes move in the drawn view")
                        .size(11.0)
                        .color(CASING),
                ));
            });
    });
}

/// The drawn shape under the deflected one: thin dashed members, small rings.
fn draw_ghost(painter: &Painter, view: &View, geo: &Geometry) {
    let stroke = Stroke::new(1.5, UNSOLVED);
    for m in geo.members.iter() {
        let (Some(a), Some(b)) = (geo.node(&m.ends.0), geo.node(&m.ends.1)) else { continue };
        let (sa, sb) = (view.to_screen(a.pos_m[0], a.pos_m[1]), view.to_screen(b.pos_m[0], b.pos_m[1]));
        painter.extend(Shape::dashed_line(&[sa, sb], stroke, 5.0, 4.0));
    }
    for r in &geo.ropes {
        let pts: Vec<Pos2> =
            r.path.iter().filter_map(|id| geo.node(id)).map(|n| view.to_screen(n.pos_m[0], n.pos_m[1])).collect();
        painter.extend(Shape::dashed_line(&pts, stroke, 5.0, 4.0));
    }
    for n in &geo.nodes {
        painter.circle_stroke(view.to_screen(n.pos_m[0], n.pos_m[1]), 3.5, stroke);
    }
}

fn legend(painter: &Painter, view: &View, near: f64, top: f32) {
    let w = 190.0;
    let origin = view.rect.right_top() + vec2(-w - 14.0, top);
    let frame = Rect::from_min_size(origin, vec2(w, 112.0));
    painter.rect_filled(frame, 4.0, Color32::from_rgba_unmultiplied(0xff, 0xff, 0xfb, 0xe8));
    painter.rect_stroke(frame, 4.0, Stroke::new(1.0, GRID_AXIS), egui::StrokeKind::Inside);
    painter.text(origin + vec2(8.0, 6.0), Align2::LEFT_TOP, "Utilisation", FontId::proportional(12.0), INK);
    let bar = Rect::from_min_size(origin + vec2(8.0, 24.0), vec2(w - 16.0, 10.0));
    let n = 52;
    for i in 0..n {
        let t0 = i as f32 / n as f32;
        let t1 = (i + 1) as f32 / n as f32;
        let r = Rect::from_min_max(
            pos2(bar.left() + bar.width() * t0, bar.top()),
            pos2(bar.left() + bar.width() * t1 + 0.5, bar.bottom()),
        );
        painter.rect_filled(r, 0.0, colour(f64::from(t0) * RAMP_MAX));
    }
    painter.rect_stroke(bar, 0.0, Stroke::new(1.0, CASING), egui::StrokeKind::Outside);
    for u in [0.0, near, 1.0] {
        let x = bar.left() + bar.width() * (u / RAMP_MAX) as f32;
        painter.line_segment([pos2(x, bar.bottom()), pos2(x, bar.bottom() + 4.0)], Stroke::new(1.0, INK));
        painter.text(
            pos2(x, bar.bottom() + 5.0),
            Align2::CENTER_TOP,
            format!("{:.0}%", u * 100.0),
            FontId::proportional(10.0),
            INK,
        );
    }
    let row = |k: f32| origin + vec2(8.0, 56.0 + k * 17.0);
    let a = row(0.0);
    painter.extend(Shape::dashed_line(&[a, a + vec2(30.0, 0.0)], Stroke::new(3.0, CASING), 6.0, 4.0));
    painter.text(a + vec2(38.0, 0.0), Align2::LEFT_CENTER, "dashed: slack", FontId::proportional(11.0), INK);
    let b = row(1.0);
    painter.line_segment([b, b + vec2(30.0, 0.0)], Stroke::new(6.0, colour(1.2)));
    hatch_over(painter, b, b + vec2(30.0, 0.0), CASING);
    painter.text(b + vec2(38.0, 0.0), Align2::LEFT_CENTER, "heavy, hatched: over", FontId::proportional(11.0), INK);
    let c = row(2.0);
    painter.line_segment([c, c + vec2(30.0, 0.0)], Stroke::new(12.0, PATH_GLOW));
    painter.text(c + vec2(38.0, 0.0), Align2::LEFT_CENTER, "load path of the mass", FontId::proportional(11.0), INK);
}

/// The core's utilisation ramp as an egui colour.
fn colour(utilisation: f64) -> Color32 {
    let [r, g, b] = rgb(utilisation);
    Color32::from_rgb(r, g, b)
}
