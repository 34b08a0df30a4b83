//! A large net on the canvas: thousands of members are written straight
//! into meshes (one quad a stroke) rather than tessellated one by one, and
//! the drawing must still show what a small one shows: every member in the
//! colour of its utilisation, and every joint marked.

mod common;

#[path = "../../tautspan-core/tests/common/grid_net.rs"]
mod grid;

use egui::Color32;
use tautspan_core::colour_ramp::rgb;
use tautspan_gui::{Document, Prefs, TautspanApp, ViewKind};

/// The app on the 31 × 31 square net (1,860 members, 961 joints), solved,
/// shown whole in plan.
fn net_in_plan() -> egui_kittest::Harness<'static, TautspanApp> {
    let (dto, _) =
        tautspan_core::file::parse_scenario_text(&grid::grid_net(31, "2 kg")).unwrap_or_else(|e| panic!("{e:?}"));
    let mut app = TautspanApp::with_document(Document::new(dto, None), Prefs::default());
    app.files.native = false;
    let mut h = common::harness(app);
    h.state_mut().view.kind = ViewKind::Plan;
    h.state_mut().view.fit_pending = true;
    h.run();
    h
}

fn vertex_colours(h: &egui_kittest::Harness<'_, TautspanApp>) -> Vec<(egui::Pos2, Color32)> {
    let mut out = Vec::new();
    for clipped in &h.output().shapes {
        if let egui::Shape::Mesh(mesh) = &clipped.shape {
            out.extend(mesh.vertices.iter().map(|v| (v.pos, v.color)));
        }
    }
    out
}

// The 31 × 31 square net (1,860 members, 961 joints) in plan, solved: the
// stroke of each of several members sampled along the net has a vertex in
// the ramp's colour of that member's utilisation (as the report and a
// small drawing colour it), within the stroke's half-width of the
// member's mid-line; and the joints' marks are there, one square of ink
// per joint at least.
#[test]
fn a_large_net_is_drawn_in_its_utilisation_colours() {
    let h = net_in_plan();
    let solved = h.state().derived.solved.clone().unwrap();
    let case = &solved.analysis.cases[0];
    assert!(case.converged);
    let drawn = vertex_colours(&h);
    assert!(drawn.len() > 8 * 1_800, "two quads a member at least: {} vertices", drawn.len());
    let view = h.state().view;
    for m in case.members.iter().step_by(97) {
        let [r, g, b] = rgb(m.utilisation);
        let want = Color32::from_rgb(r, g, b);
        let member = solved.scenario.members.iter().find(|s| s.id == m.id).unwrap();
        let ends = member.ends.map(|k| view.to_screen_xyz(solved.scenario.nodes[k].position.map(|c| c.value)));
        let mid = ends[0] + (ends[1] - ends[0]) * 0.5;
        let near = drawn.iter().any(|(p, c)| *c == want && p.distance(mid) <= 0.5 * ends[0].distance(ends[1]) + 3.0);
        assert!(near, "member {} ({:.1} %) in {want:?} near {mid:?}", m.id, m.utilisation * 100.0);
    }
    let ink = drawn.iter().filter(|(_, c)| *c == Color32::from_rgb(0x2b, 0x2d, 0x33)).count();
    // 29 × 29 interior joints (the 120 on the edge are anchors, drawn as such)
    assert!(ink >= 4 * 841, "a square of ink a joint: {ink} ink vertices");
}

/// Ink squares (a joint's mark where names cannot be read) centred within
/// 1 pt of `p`.
fn joint_mark_at(drawn: &[(egui::Pos2, Color32)], p: egui::Pos2) -> bool {
    let ink = Color32::from_rgb(0x2b, 0x2d, 0x33);
    // a 6 pt square: its corners 3 pt either side of the centre
    drawn.iter().filter(|(q, c)| *c == ink && (q.x - p.x).abs() <= 4.0 && (q.y - p.y).abs() <= 4.0).count() >= 4
}

// Dragging a joint of the large net in plan: while the pointer moves, the
// kept drawing has no mark where the joint was and the frame draws it where
// it is now, with its members ending there; after the release the whole
// drawing is made again at the new place (one joint mark, at the new
// place only).
#[test]
fn a_joint_dragged_on_a_large_net_is_drawn_where_it_is() {
    let mut h = net_in_plan();
    // close in, centred on the joint, so the grid snaps to the half metre
    // (its step: the first of 1, 2, 5 × 10ⁿ m at least 50 pt)
    h.state_mut().view.px_per_m = 120.0;
    let centre = h.state().view.project([15.0, 0.0, 15.0]).0;
    h.state_mut().view.centre_m = centre;
    h.run();
    let view = h.state().view;
    let from = view.to_screen_xyz([15.0, 0.0, 15.0]);
    let to = view.to_screen_xyz([15.5, 0.0, 15.0]);
    assert!(joint_mark_at(&vertex_colours(&h), from), "the joint is marked before the drag");
    common::press_and_move(&mut h, from, to, 5);
    assert_eq!(h.state().canvas.dragging.as_deref(), Some("n15_15"));
    let x = h.state().doc.dto.nodes.iter().find(|n| n.id == "n15_15").map(|n| n.at.x.0.clone());
    assert_eq!(x.as_deref(), Some("15.5 m"));
    let during = vertex_colours(&h);
    assert!(!joint_mark_at(&during, from), "no mark left where the joint was");
    assert!(joint_mark_at(&during, to), "the joint is drawn where it is now");
    common::release(&mut h, to);
    assert!(h.state().canvas.dragging.is_none());
    let after = vertex_colours(&h);
    assert!(!joint_mark_at(&after, from) && joint_mark_at(&after, to));
    // the neighbour's members still end at the neighbour
    assert!(joint_mark_at(&after, view.to_screen_xyz([14.0, 0.0, 15.0])));
}
