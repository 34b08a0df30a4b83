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
    let (dto, _) = tautspan_core::file::parse_scenario_text(&grid::grid_net(31, "2 kg")).unwrap();
    let mut app = TautspanApp::with_document(Document::new(dto, None), Prefs::default());
    app.files.native = false;
    let mut h = common::harness(app);
    h.state_mut().view.kind = ViewKind::Plan;
    h.state_mut().view.fit_pending = true;
    h.run();
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
