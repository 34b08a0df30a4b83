//! The canvas folder: the drawing the rig is built on. This file holds the
//! tools, picking and drag; `input` what the canvas is given, `draw` the
//! painting, `geometry` the positions drawn, `labels` the force labels,
//! `deflected` the solved shape, `view` the projection, pan and zoom,
//! `overlay` the widgets over the drawing (view switch, chooser, cursor
//! readout, legend switch), `sling` the multi-leg sling helper.
//!
//! The canvas: the rig in elevation (x–y), plan (x–z), side (z–y) or a 3-D
//! orbit, with the tools that place and move things (each flat view sets
//! the two coordinates it shows and keeps the third), and a tooltip naming
//! a member's fittings. It reads the document and the analysis, and returns
//! commands; it never edits the document itself. Drawing is in `draw`.

pub(crate) mod deflected;
pub(crate) mod draw;
pub(crate) mod geometry;
pub(crate) mod input;
pub(crate) mod labels;
pub(crate) mod overlay;
pub(crate) mod sling;
mod strokes;
pub(crate) mod view;

use crate::canvas::geometry::Geometry;
use crate::canvas::view::{View, ViewKind};
use crate::document::Document;
use crate::document::command::Command;
use crate::document::edits;
use crate::document::placing;
use crate::document::selection::{Selection, Tool};
use crate::fields::units_display::UnitSystem;
use draw::Deflection;
use egui::{Pos2, Sense, Ui};
pub use input::CanvasInput;
use std::sync::Arc;
use tautspan_core::file::SupportDto;

/// The canvas's own state between frames.
#[derive(Debug, Default, Clone)]
pub struct CanvasState {
    /// The geometry of the document revision it was read from.
    geometry: Option<(u64, Arc<Geometry>)>,
    /// The first node picked with the member tool.
    pub member_start: Option<String>,
    /// The nodes picked so far with the rope tool, in order.
    pub rope_path: Vec<String>,
    /// The node being dragged.
    pub dragging: Option<String>,
    /// Panning with a drag on the background.
    pub panning: bool,
    /// The geometry as the view shows it, for the revision and view it was projected for.
    projected: Option<(u64, ProjectionKey, Arc<Geometry>)>,
    /// The chooser open over the canvas: where, and the items under the click.
    pub chooser: Option<(Pos2, Vec<Selection>)>,
    /// The legend folded away.
    pub legend_hidden: bool,
    /// The multi-leg sling helper.
    pub sling: sling::SlingHelper,
    /// The painted drawing of the last frame and what it was painted from:
    /// painted again only when one of those changed.
    painted: Option<(PaintKey, Arc<Vec<egui::Shape>>)>,
}

/// The canvas input and the screen's scale.
struct KeyInput<'a> {
    input: &'a CanvasInput<'a>,
    pixels_per_point: f32,
}

impl<'a> std::ops::Deref for KeyInput<'a> {
    type Target = CanvasInput<'a>;
    fn deref(&self) -> &CanvasInput<'a> {
        self.input
    }
}

/// Everything the painted drawing depends on.
#[derive(Debug, Clone, PartialEq)]
struct PaintKey {
    revision: u64,
    projection: ProjectionKey,
    view: (f64, f64, f64, egui::Rect, bool, u32, f32),
    selection: Selection,
    case: Option<String>,
    results: (u64, usize),
    labels: bool,
    units: UnitSystem,
    picking: (Option<String>, Vec<String>, Vec<String>, Option<Pos2>),
    legend: bool,
    /// The whole drawing, or what stays while a node is dragged.
    part: draw::Part,
}

impl PaintKey {
    fn of(state: &CanvasState, view: &View, input: &KeyInput<'_>, hover: Option<Pos2>) -> PaintKey {
        let routing = state.member_start.is_some() || !state.rope_path.is_empty();
        PaintKey {
            revision: input.doc.revision,
            projection: ProjectionKey::of(view),
            view: (
                view.centre_m[0],
                view.centre_m[1],
                view.px_per_m,
                view.rect,
                view.deflected,
                view.magnification,
                input.pixels_per_point,
            ),
            selection: input.selection.clone(),
            case: input.case.map(str::to_string),
            results: (input.derived.revision, input.derived.solved.as_ref().map_or(0, |s| Arc::as_ptr(s) as usize)),
            labels: input.labels,
            units: input.units,
            // the pointer matters only while a dashed line follows it
            picking: (
                state.member_start.clone(),
                state.rope_path.clone(),
                state.sling.points.clone(),
                hover.filter(|_| routing),
            ),
            legend: !state.legend_hidden && overlay::legend_fits(view.rect),
            part: draw::Part::All,
        }
    }
}

/// What a projected geometry depends on besides the document.
#[derive(Debug, Clone, Copy, PartialEq)]
struct ProjectionKey {
    kind: ViewKind,
    yaw_deg: f64,
    pitch_deg: f64,
}

impl ProjectionKey {
    fn of(view: &View) -> ProjectionKey {
        ProjectionKey { kind: view.kind, yaw_deg: view.yaw_deg, pitch_deg: view.pitch_deg }
    }
}

impl CanvasState {
    /// The document's geometry, read again only when its revision changed.
    /// The canvas holds its copy only for the frame, so following an edit
    /// in place does not copy it.
    fn geometry(&mut self, doc: &Document) -> Arc<Geometry> {
        if let Some((rev, g)) = &mut self.geometry {
            // a drag moves one node a frame: follow it in place when the items are the same
            if *rev == doc.revision || Arc::make_mut(g).follow(&doc.dto) {
                *rev = doc.revision;
                return g.clone();
            }
        }
        let g = Arc::new(Geometry::of(&doc.dto));
        self.geometry = Some((doc.revision, g.clone()));
        g
    }

    /// The geometry as `view` shows it, projected again only when the
    /// revision or the view's turn changed (the elevation is the geometry itself).
    fn projected(&mut self, doc: &Document, view: &View) -> Arc<Geometry> {
        let drawn = self.geometry(doc);
        if view.kind == ViewKind::Elevation {
            return drawn;
        }
        let key = ProjectionKey::of(view);
        if let Some((rev, k, g)) = &self.projected
            && *rev == doc.revision
            && *k == key
        {
            return g.clone();
        }
        let g = Arc::new(drawn.projected(view));
        self.projected = Some((doc.revision, key, g.clone()));
        g
    }
}

/// What is under a screen point: the nearest item, nodes first.
fn hit(geo: &Geometry, view: &View, p: Pos2) -> Selection {
    hits(geo, view, p).into_iter().next().unwrap_or_default()
}

/// Every item of the first kind found under a screen point, nearest first:
/// the nodes within reach; else the masses, members and ropes; else the
/// slabs. More than one is what the chooser offers (a node at the end of a
/// member is not a choice: the node is what is meant).
pub(crate) fn hits(geo: &Geometry, view: &View, p: Pos2) -> Vec<Selection> {
    fn within(cands: impl Iterator<Item = (f32, Selection)>, radius: f32) -> Vec<Selection> {
        let mut v: Vec<(f32, Selection)> = cands.filter(|(d, _)| *d <= radius).collect();
        v.sort_by(|a, b| a.0.total_cmp(&b.0));
        v.into_iter().map(|(_, s)| s).collect()
    }
    let nodes = within(
        geo.nodes.iter().map(|n| (view.to_screen(n.pos_m[0], n.pos_m[1]).distance(p), Selection::Node(n.id.clone()))),
        9.0,
    );
    if !nodes.is_empty() {
        return nodes;
    }
    let mut found: Vec<Selection> = geo
        .masses
        .iter()
        .filter(|m| draw::mass_rect(geo, view, m).is_some_and(|r| r.expand(2.0).contains(p)))
        .map(|m| Selection::Mass(m.id.clone()))
        .collect();
    let span = |a: &str, b: &str| {
        let (a, b) = (geo.node(a)?, geo.node(b)?);
        let (sa, sb) = (view.to_screen(a.pos_m[0], a.pos_m[1]), view.to_screen(b.pos_m[0], b.pos_m[1]));
        Some(segment_distance(p, sa, sb))
    };
    let members =
        geo.members.iter().filter_map(|m| Some((span(&m.ends.0, &m.ends.1)?, Selection::Member(m.id.clone()))));
    // a rope is picked by any of its spans
    let ropes = geo.ropes.iter().filter_map(|r| {
        let d = r.spans().filter_map(|(a, b)| span(a, b)).min_by(f32::total_cmp)?;
        Some((d, Selection::Rope(r.id.clone())))
    });
    found.extend(within(members.chain(ropes), 6.0));
    if !found.is_empty() {
        return found;
    }
    let mut floors: Vec<Selection> = Vec::new();
    for f in &geo.floors {
        let s = Selection::Floor(f.floor_id.clone());
        if f.rect_screen(view).contains(p) && !floors.contains(&s) {
            floors.push(s);
        }
    }
    floors
}

/// The point of the view's plane a placement or drag at screen point `p`
/// lands on: on the grid when snapping is on, and each coordinate on a
/// node's (other than `moving`) when the pointer is within 6 points of it
/// along that axis, so nodes line up with the ones already drawn.
fn snap_point(geo: &Geometry, view: &View, p: Pos2, units: UnitSystem, moving: Option<&str>) -> [f64; 2] {
    let mut uv = view.snapped(view.to_world(p), units);
    if view.snap {
        let (mut best_x, mut best_y) = (6.0f32, 6.0f32);
        for n in geo.nodes.iter().filter(|n| Some(n.id.as_str()) != moving) {
            let s = view.to_screen(n.pos_m[0], n.pos_m[1]);
            if (s.x - p.x).abs() < best_x {
                best_x = (s.x - p.x).abs();
                uv[0] = n.pos_m[0];
            }
            if (s.y - p.y).abs() < best_y {
                best_y = (s.y - p.y).abs();
                uv[1] = n.pos_m[1];
            }
        }
    }
    uv
}

/// The slab of the selected floor node, or the selected slab: where the
/// floor node tool puts the next foot (with neither, it makes a new slab).
fn selected_slab(input: &CanvasInput<'_>) -> Option<String> {
    match input.selection {
        Selection::Floor(f) => Some(f.clone()),
        Selection::Node(id) => input.doc.dto.nodes.iter().find(|n| &n.id == id).and_then(|n| match &n.support {
            SupportDto::Floor(f) => Some(f.clone()),
            _ => None,
        }),
        _ => None,
    }
}

/// The coordinates a new node keeps from outside the view: the selected
/// node's, else 0.
pub(crate) fn kept_coordinates(drawn: &Geometry, selection: &Selection) -> [f64; 3] {
    match selection {
        Selection::Node(id) => drawn.node(id).map_or([0.0; 3], |n| n.xyz_m),
        _ => [0.0; 3],
    }
}

/// The tooltip naming a member's fittings, when the pointer is on that
/// member or its parts mark.
fn parts_tip(geo: &Geometry, view: &View, over: &Selection, p: Pos2) -> Option<String> {
    let on_mark = geo.members.iter().find(|m| {
        !m.parts.is_empty()
            && geo.node(&m.ends.0).zip(geo.node(&m.ends.1)).is_some_and(|(a, b)| {
                let (sa, sb) = (view.to_screen(a.pos_m[0], a.pos_m[1]), view.to_screen(b.pos_m[0], b.pos_m[1]));
                draw::parts_mark_at(sa, sb).distance(p) <= 8.0
            })
    });
    let m = on_mark.or_else(|| match over {
        Selection::Member(id) => geo.members.iter().find(|m| &m.id == id),
        _ => None,
    })?;
    parts_text(&m.id, &m.parts)
}

/// The text naming a member's fittings (none without parts).
pub fn parts_text(member: &str, parts: &[String]) -> Option<String> {
    if parts.is_empty() {
        return None;
    }
    Some(format!("Fittings on {member}:\n{}", parts.iter().map(|p| format!("• {p}")).collect::<Vec<_>>().join("\n")))
}

fn segment_distance(p: Pos2, a: Pos2, b: Pos2) -> f32 {
    let ab = b - a;
    let len2 = ab.length_sq();
    if len2 <= f32::EPSILON {
        return p.distance(a);
    }
    let t = ((p - a).dot(ab) / len2).clamp(0.0, 1.0);
    p.distance(a + ab * t)
}

/// Draw the canvas and turn pointer input into commands.
pub fn ui(ui: &mut Ui, state: &mut CanvasState, view: &mut View, input: &CanvasInput<'_>, out: &mut Vec<Command>) {
    let size = ui.available_size();
    let (rect, response) = ui.allocate_exact_size(size, Sense::click_and_drag());
    response.widget_info(|| egui::WidgetInfo::labeled(egui::Role::Canvas, true, "Canvas"));
    view.rect = rect;
    overlay::view_keys(ui, view);
    let drawn = state.geometry(input.doc);
    let shown = state.projected(input.doc, view);
    // the deflected view draws and picks at the solved positions; nodes are
    // dragged in the drawn view only
    let deflected = if view.deflected {
        input.derived.solved.as_ref().zip(input.derived.case(input.case)).map(|(s, c)| {
            let by = deflected::displacements(s, c);
            (
                deflected::displaced(&drawn, &by, f64::from(view.magnification), view),
                deflected::caption(&c.id, view.magnification),
            )
        })
    } else {
        None
    };
    let geo: &Geometry = deflected.as_ref().map_or(&shown, |(g, _)| g);
    if view.fit_pending && rect.width() > 10.0 {
        if let Some((min, max)) = shown.bounds() {
            view.fit(min, max);
        } else {
            view.fit_pending = false;
        }
    }

    // zoom with the wheel (or a pinch) about the pointer
    if let Some(p) = response.hover_pos() {
        let (scroll, pinch) = ui.input(|i| (i.smooth_scroll_delta.y, i.zoom_delta()));
        let factor = f64::from(pinch) * (f64::from(scroll) / 300.0).exp();
        if (factor - 1.0).abs() > 1e-4 {
            view.zoom(factor, p);
        }
    }
    if response.dragged_by(egui::PointerButton::Middle) || response.dragged_by(egui::PointerButton::Secondary) {
        view.pan(response.drag_delta());
    }

    let pointer = response.interact_pointer_pos().or_else(|| response.hover_pos());
    let units = input.units;
    let flat = view.kind != ViewKind::Orbit;
    let keep = kept_coordinates(&drawn, input.selection);
    if state.sling.picking {
        if response.clicked()
            && let Some(p) = pointer
            && let Selection::Node(id) = hit(geo, view, p)
        {
            state.sling.pick(id);
        }
        background_pan(state, view, &response);
    } else {
        match input.tool {
            Tool::Select => {
                select_tool(state, view, geo, &response, pointer, units, deflected.is_none() && flat, out);
            }
            Tool::Anchor | Tool::Joint | Tool::FloorNode => {
                if response.clicked()
                    && let Some(p) = pointer
                {
                    match hit(geo, view, p) {
                        Selection::Node(id) => out.push(Command::Select(Selection::Node(id))),
                        _ => {
                            let uv = snap_point(geo, view, p, units, None);
                            if let Some(xyz) = view.unproject(uv, keep) {
                                let tool = input.tool;
                                // a foot next to a selected foot or slab stands on the same slab
                                let slab = selected_slab(input);
                                out.push(Command::place(move |d| {
                                    let id = match (tool, slab) {
                                        (Tool::Anchor, _) => placing::add_node_at(d, xyz, SupportDto::Anchor, units),
                                        (Tool::FloorNode, Some(f)) => {
                                            placing::add_node_at(d, xyz, SupportDto::Floor(f), units)
                                        }
                                        (Tool::FloorNode, None) => placing::add_floor_node_at(d, xyz, units),
                                        _ => placing::add_node_at(d, xyz, SupportDto::Joint, units),
                                    };
                                    Selection::Node(id)
                                }));
                            }
                        }
                    }
                }
                background_pan(state, view, &response);
            }
            Tool::Member(kind) => {
                if response.clicked()
                    && let Some(p) = pointer
                {
                    if let Selection::Node(id) = hit(geo, view, p) {
                        match state.member_start.take() {
                            Some(first) if first != id => {
                                out.push(Command::place(move |d| {
                                    Selection::Member(edits::add_member(d, &first, &id, kind, units))
                                }));
                            }
                            _ => state.member_start = Some(id),
                        }
                    } else {
                        state.member_start = None;
                    }
                }
                background_pan(state, view, &response);
            }
            Tool::Rope => {
                if response.clicked()
                    && let Some(p) = pointer
                    && let Selection::Node(id) = hit(geo, view, p)
                {
                    // the last node clicked again (or the second click of a double click) finishes
                    if state.rope_path.last() == Some(&id) {
                        out.extend(finish_rope(state, units));
                    } else {
                        state.rope_path.push(id);
                    }
                } else if response.double_clicked() {
                    out.extend(finish_rope(state, units));
                }
                background_pan(state, view, &response);
            }
            Tool::Mass => {
                if response.clicked()
                    && let Some(p) = pointer
                    && let Selection::Node(id) = hit(geo, view, p)
                {
                    out.push(Command::place(move |d| Selection::Mass(edits::add_mass(d, &id, units))));
                }
                background_pan(state, view, &response);
            }
        }
    }
    if let Some(p) = response.hover_pos()
        && matches!(input.tool, Tool::Select)
        && state.dragging.is_none()
    {
        let over = hit(geo, view, p);
        if over != Selection::None {
            ui.ctx().set_cursor_icon(egui::CursorIcon::PointingHand);
        }
        if let Some(text) = parts_tip(geo, view, &over, p) {
            response.clone().on_hover_text_at_pointer(text);
        }
    }

    let painter = ui.painter_at(rect);
    let key_input = KeyInput { input, pixels_per_point: ui.ctx().pixels_per_point() };
    let mut key = PaintKey::of(state, view, &key_input, response.hover_pos());
    // a node of a large drawing dragged: what does not move is drawn once
    // and kept (its key leaves out the revision the drag changes), and each
    // frame draws the node with its members on top; a floor's foot moves
    // its slab too, and the deflected view moves everything, so those are
    // drawn whole
    let dragged = state.dragging.as_deref().and_then(|id| geo.node_index(id)).filter(|&k| {
        geo.members.len() + geo.nodes.len() > strokes::LARGE_DRAWING
            && deflected.is_none()
            && !matches!(geo.nodes[k].support, SupportDto::Floor(_))
    });
    if let Some(k) = dragged {
        key.revision = u64::MAX;
        key.part = draw::Part::Without(k);
    }
    let picking_of = |part: draw::Part| draw::Picking {
        member_start: state.member_start.as_deref(),
        rope_path: &state.rope_path,
        hover: response.hover_pos(),
        sling: state.sling.route(),
        legend: !state.legend_hidden && overlay::legend_fits(view.rect),
        part,
    };
    match &state.painted {
        // nothing the drawing depends on changed: the last frame's shapes again
        Some((k, shapes)) if *k == key => painter.extend(shapes.iter().cloned()),
        _ => {
            let layer = painter.layer_id();
            let first = ui.ctx().graphics(|g| g.get(layer).map_or(0, |l| l.next_idx().0));
            let deflection = deflected.as_ref().map(|_| Deflection { drawn: &shown });
            draw::draw(&painter, view, geo, input, &picking_of(key.part), deflection.as_ref());
            let shapes: Vec<egui::Shape> = ui.ctx().graphics(|g| {
                g.get(layer).map_or_else(Vec::new, |l| l.all_entries().skip(first).map(|c| c.shape.clone()).collect())
            });
            state.painted = Some((key, Arc::new(baked(ui.ctx(), rect, shapes))));
        }
    }
    if let Some(k) = dragged {
        draw::draw(&painter, view, geo, input, &picking_of(draw::Part::Only(k)), None);
    }
    if let Some((_, caption)) = &deflected {
        draw::deflection_caption(ui, view, caption);
    } else if view.deflected {
        draw::deflection_caption(ui, view, "Deflected shape: no results to show yet");
    }
    let placing = matches!(input.tool, Tool::Anchor | Tool::Joint | Tool::FloorNode) && !state.sling.picking;
    overlay::ui(ui, state, view, &response, input, keep, placing, out);
    sling::window(ui, state, &drawn, input, out);
}

/// Shapes above which a drawing is tessellated without anti-aliased edges.
const MANY_SHAPES: usize = 5_000;

/// The painted shapes with every run of strokes and fills between two texts
/// tessellated once into one mesh, so a kept drawing costs a copy of its
/// vertices each frame instead of tessellating its strokes again (tens of
/// thousands on a large net). Texts stay shapes (they are laid out on the
/// font atlas); the order of painting is kept.
fn baked(ctx: &egui::Context, clip: egui::Rect, shapes: Vec<egui::Shape>) -> Vec<egui::Shape> {
    use egui::Shape;
    let mut options = ctx.tessellation_options(|o| *o);
    // a large net's strokes lie a few pixels apart: anti-aliased edges add
    // little there and cost most of the tessellation, so they are left off
    options.feathering = options.feathering && shapes.len() <= MANY_SHAPES;
    let atlas = ctx.fonts(|f| f.font_image_size());
    let mut tessellator = egui::epaint::Tessellator::new(ctx.pixels_per_point(), options, atlas, Vec::new());
    tessellator.set_clip_rect(clip);
    let mut out = Vec::new();
    let mut mesh = egui::epaint::Mesh::default();
    let flush = |mesh: &mut egui::epaint::Mesh, out: &mut Vec<Shape>| {
        if !mesh.is_empty() {
            out.push(Shape::mesh(std::mem::take(mesh)));
        }
    };
    for shape in shapes {
        match shape {
            Shape::Text(_) | Shape::Mesh(_) | Shape::Callback(_) => {
                flush(&mut mesh, &mut out);
                out.push(shape);
            }
            other => tessellator.tessellate_shape(other, &mut mesh),
        }
    }
    flush(&mut mesh, &mut out);
    out
}

/// The rope routed so far with the rope tool, placed as one edit (one undo
/// step) and selected; `None`, with the route kept, while it has fewer than
/// three nodes (a rope runs over at least one sheave).
pub fn finish_rope(state: &mut CanvasState, units: UnitSystem) -> Option<Command> {
    if state.rope_path.len() < 3 {
        return None;
    }
    let path = std::mem::take(&mut state.rope_path);
    Some(Command::place(move |d| Selection::Rope(edits::add_rope(d, &path, units))))
}

fn background_pan(state: &mut CanvasState, view: &mut View, response: &egui::Response) {
    if response.drag_started_by(egui::PointerButton::Primary) {
        state.panning = true;
    }
    if state.panning && response.dragged_by(egui::PointerButton::Primary) {
        if view.kind == ViewKind::Orbit {
            view.orbit(response.drag_delta());
        } else {
            view.pan(response.drag_delta());
        }
    }
    if response.drag_stopped() {
        state.panning = false;
    }
}

#[allow(clippy::too_many_arguments, reason = "the canvas's pieces, passed apart to keep the borrows short")]
fn select_tool(
    state: &mut CanvasState,
    view: &mut View,
    geo: &Geometry,
    response: &egui::Response,
    pointer: Option<Pos2>,
    units: UnitSystem,
    can_drag: bool,
    out: &mut Vec<Command>,
) {
    if response.clicked()
        && let Some(p) = pointer
    {
        let under = hits(geo, view, p);
        if under.len() > 1 {
            // several items under the click: the chooser names them, the user picks one
            state.chooser = Some((p, under));
        } else {
            state.chooser = None;
            out.push(Command::Select(under.into_iter().next().unwrap_or_default()));
        }
    }
    if response.drag_started_by(egui::PointerButton::Primary)
        && let Some(p) = response.interact_pointer_pos()
    {
        // the press point, not where the pointer is after the drag threshold
        let press = response.ctx.input(|i| i.pointer.press_origin()).unwrap_or(p);
        match hit(geo, view, press) {
            Selection::Node(id) if can_drag => {
                out.push(Command::Select(Selection::Node(id.clone())));
                state.dragging = Some(id);
            }
            _ => state.panning = true,
        }
    }
    if response.dragged_by(egui::PointerButton::Primary) {
        if let (Some(id), Some(p)) = (state.dragging.clone(), pointer) {
            let [u, v] = snap_point(geo, view, p, units, Some(&id));
            let to = geo.node(&id).and_then(|n| {
                let moved = (n.pos_m[0] - u).abs() > 1e-9 || (n.pos_m[1] - v).abs() > 1e-9;
                if moved { view.unproject([u, v], n.xyz_m) } else { None }
            });
            if let Some(xyz) = to {
                let key = format!("drag:{id}");
                out.push(Command::edit_merged(key, move |d| placing::move_node_to(d, &id, xyz, units)));
            }
        } else if state.panning {
            if view.kind == ViewKind::Orbit {
                view.orbit(response.drag_delta());
            } else {
                view.pan(response.drag_delta());
            }
        }
    }
    if response.drag_stopped() {
        if state.dragging.take().is_some() {
            out.push(Command::SealUndo);
        }
        state.panning = false;
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_tooltip_names_each_part() {
        assert_eq!(parts_text("leg", &[]), None);
        let parts = vec!["shackle, WLL 3.25 t".to_string(), "swivel, WLL 20 kN".to_string()];
        assert_eq!(
            parts_text("leg", &parts).as_deref(),
            Some("Fittings on leg:\n• shackle, WLL 3.25 t\n• swivel, WLL 20 kN")
        );
    }
}
