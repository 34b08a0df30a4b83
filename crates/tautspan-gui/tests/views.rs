//! The canvas's plan, side and 3-D views: the view switch (buttons and
//! keys), picking in plan two nodes that coincide in the elevation, the
//! chooser when a click lands on several items, the cursor readout, the
//! solved (x, y, z) in the node inspector, and rigs built only by clicking
//! in the views: a four-leg sling spread in plan, a tripod on a slab, a
//! rope over a running block in the side view; each checked against hand
//! statics of the solved shape.

#![allow(clippy::unwrap_used, clippy::expect_used, reason = "test helpers fail loudly on broken fixtures")]

mod common;

use common::{blank_app, click, harness, type_into};
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::{NodeT, Queryable};
use tautspan_core::analysis::CaseResult;
use tautspan_gui::{Document, Prefs, Selection, TautspanApp, ViewKind};

/// Standard gravity, m/s² (CGPM 1901, ISO 80000-3); the scenarios use it.
const G: f64 = 9.80665;

/// The solver's answers are in equilibrium to 1e-9 of the load on the
/// out-of-balance force (DEVELOPERS.md); 1e-6 leaves room for the sums below.
const STATICS_TOL: f64 = 1e-6;

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

/// Click the canvas at a world point (x, y, z) m, in whatever view is shown.
fn click_xyz(h: &mut Harness<'_, TautspanApp>, p: [f64; 3]) {
    let s = h.state().view.to_screen_xyz(p);
    h.event(egui::Event::PointerMoved(s));
    h.run();
    for pressed in [true, false] {
        h.event(egui::Event::PointerButton {
            pos: s,
            button: egui::PointerButton::Primary,
            pressed,
            modifiers: egui::Modifiers::NONE,
        });
    }
    h.run();
}

fn hover_xyz(h: &mut Harness<'_, TautspanApp>, p: [f64; 3]) {
    let s = h.state().view.to_screen_xyz(p);
    h.event(egui::Event::PointerMoved(s));
    h.run();
}

/// Zoom and pan the canvas so the view's plane point `centre` is in the
/// middle at `px_per_m` (what the wheel and a drag do; set directly so the
/// test does not depend on the blank scenario's first fit).
fn frame_on(h: &mut Harness<'_, TautspanApp>, centre: [f64; 2], px_per_m: f64) {
    let v = &mut h.state_mut().view;
    v.fit_pending = false;
    v.centre_m = centre;
    v.px_per_m = px_per_m;
    h.run();
}

/// The app on a scenario text.
fn app_on(text: &str) -> TautspanApp {
    let loaded = tautspan_core::model::load_scenario(text).unwrap_or_else(|e| panic!("{e}"));
    let mut app = TautspanApp::with_document(Document::new(loaded.dto, None), Prefs::default());
    app.files.native = false;
    app
}

/// Two wire ropes hung side by side in depth: in the elevation their
/// joints J1 and J2 (and anchors) lie on top of each other.
const TWO_DEEP: &str = r#"Scenario(
    format: 1,
    title: "Two hangers one behind the other",
    nodes: [
        Node(id: "A1", at: ("0 m", "3 m", "-1 m"), support: Anchor),
        Node(id: "A2", at: ("0 m", "3 m", "1 m"), support: Anchor),
        Node(id: "J1", at: ("0 m", "1 m", "-1 m")),
        Node(id: "J2", at: ("0 m", "1 m", "1 m")),
    ],
    members: [
        Member(id: "back", ends: ("A1", "J1"), kind: WireRope, area: "50 mm^2", modulus: "100 GPa", rating: WorkingLoadLimit("20 kN")),
        Member(id: "front", ends: ("A2", "J2"), kind: WireRope, area: "50 mm^2", modulus: "100 GPa", rating: WorkingLoadLimit("20 kN")),
    ],
    masses: [ Mass(id: "m1", at: "J1", mass: "500 kg"), Mass(id: "m2", at: "J2", mass: "500 kg") ],
    cases: [ Static(id: "hanging") ],
)"#;

#[test]
fn the_view_switch_and_picking_in_plan_what_coincides_in_the_elevation() {
    let mut h = harness(app_on(TWO_DEEP));
    assert_eq!(h.state().view.kind, ViewKind::Elevation);
    // in the elevation J1 and J2 are one point: a click there opens the chooser
    click_xyz(&mut h, [0.0, 1.0, -1.0]);
    assert!(h.query_by_label("Node J1").is_some() && h.query_by_label("Node J2").is_some(), "the chooser names both");
    assert_eq!(h.state().selection, Selection::None, "nothing picked until the user chooses");
    click(&mut h, "Node J2");
    assert_eq!(h.state().selection, Selection::Node("J2".into()));
    assert!(h.query_by_label("Node J1").is_none(), "the chooser closes once an item is picked");

    // in plan they are apart and each is picked at once
    click(&mut h, "Plan (x–z)");
    assert_eq!(h.state().view.kind, ViewKind::Plan);
    click_xyz(&mut h, [0.0, 1.0, -1.0]);
    // the plan shows J1 over A1 (and J2 over A2): the chooser again, J1 or A1
    assert!(h.query_by_label("Node A1").is_some());
    click(&mut h, "Node J1");
    assert_eq!(h.state().selection, Selection::Node("J1".into()));

    // the side view shows z across: J1 and J2 apart, below their anchors
    h.key_press(egui::Key::Num3);
    h.run();
    assert_eq!(h.state().view.kind, ViewKind::Side);
    click_xyz(&mut h, [0.0, 1.0, 1.0]);
    assert_eq!(h.state().selection, Selection::Node("J2".into()), "one node under the click: no chooser");
    // the 3-D view by key, and back to plan by its key
    h.key_press(egui::Key::Num4);
    h.run();
    assert_eq!(h.state().view.kind, ViewKind::Orbit);
    h.key_press(egui::Key::Num2);
    h.run();
    assert_eq!(h.state().view.kind, ViewKind::Plan);
}

#[test]
fn the_chooser_offers_crossing_members_and_closes_on_escape() {
    // two members crossing in the elevation at (1 m, 1 m), away from any node
    let text = r#"Scenario(
        format: 1,
        title: "Crossing ties",
        nodes: [
            Node(id: "A1", at: ("0 m", "2 m"), support: Anchor),
            Node(id: "A2", at: ("2 m", "2 m"), support: Anchor),
            Node(id: "A3", at: ("0 m", "0 m"), support: Anchor),
            Node(id: "A4", at: ("2 m", "0 m"), support: Anchor),
        ],
        members: [
            Member(id: "tie-1", ends: ("A1", "A4"), kind: WireRope, area: "50 mm^2", modulus: "100 GPa", rating: WorkingLoadLimit("20 kN")),
            Member(id: "tie-2", ends: ("A2", "A3"), kind: WireRope, area: "50 mm^2", modulus: "100 GPa", rating: WorkingLoadLimit("20 kN")),
        ],
        cases: [ Static(id: "hanging") ],
    )"#;
    let mut h = harness(app_on(text));
    click_xyz(&mut h, [1.0, 1.0, 0.0]);
    assert!(h.query_by_label("Member tie-1").is_some() && h.query_by_label("Member tie-2").is_some());
    h.key_press(egui::Key::Escape);
    h.run();
    assert!(h.query_by_label("Member tie-1").is_none(), "Esc closes the chooser");
    // one member alone under the click is picked at once
    click_xyz(&mut h, [0.25, 1.75, 0.0]);
    assert_eq!(h.state().selection, Selection::Member("tie-1".into()));
}

#[test]
fn the_readout_gives_the_coordinates_of_the_view_under_the_cursor() {
    let mut h = harness(app_on(TWO_DEEP));
    // snapping is for placing: the readout is where the pointer is; pick points on the 1-2-5 grid
    hover_xyz(&mut h, [1.5, 2.0, 0.0]);
    assert!(h.query_by_label_contains("x 1.5 m   y 2 m").is_some(), "elevation: x and y");
    click(&mut h, "Plan (x–z)");
    hover_xyz(&mut h, [1.5, 0.0, -0.5]);
    assert!(h.query_by_label_contains("x 1.5 m   z -500 mm").is_some(), "plan: x and z (under a metre in mm)");
    click(&mut h, "Side (z–y)");
    hover_xyz(&mut h, [0.0, 2.5, 0.75]);
    assert!(h.query_by_label_contains("z 750 mm   y 2.5 m").is_some(), "side: z and y");
    // placing: the readout says which height new nodes keep
    click(&mut h, "Plan (x–z)");
    click(&mut h, "Joint");
    hover_xyz(&mut h, [1.0, 0.0, 1.0]);
    assert!(h.query_by_label_contains("new nodes at y 0 m (none selected)").is_some());
    click(&mut h, "3-D");
    hover_xyz(&mut h, [1.0, 0.0, 1.0]);
    assert!(h.query_by_label_contains("use plan, elevation or side to place").is_some());
}

#[test]
fn the_legend_folds_away_and_back() {
    let mut h = harness(app_on(TWO_DEEP));
    assert!(!h.state().canvas.legend_hidden);
    click(&mut h, "Hide legend");
    assert!(h.state().canvas.legend_hidden);
    click(&mut h, "Show legend");
    assert!(!h.state().canvas.legend_hidden);
}

#[test]
fn the_inspector_shows_the_solved_position_in_x_y_and_z() {
    let mut h = harness(app_on(TWO_DEEP));
    click(&mut h, "Plan (x–z)");
    click_xyz(&mut h, [0.0, 1.0, 1.0]);
    click(&mut h, "Node J2");
    // the hanger stretches by W L / (E A) (Hooke's law on a bar): 500 kg ×
    // g × 2 m / (100 GPa × 50 mm²) = 1.96133 mm; x and z stay (the rope hangs plumb)
    let stretch = 500.0 * G * 2.0 / (100e9 * 50e-6);
    let y = 1.0 - stretch;
    // lengths under a metre are shown in mm (the display rule)
    let text = format!(
        "Solved position: x 0 m, y {}, z 1 m",
        tautspan_gui::UnitSystem::Si.fmt(y, tautspan_gui::Shown::Length)
    );
    assert!(text.contains(" mm, z 1 m"), "{text}");
    assert!(h.query_by_label(&text).is_some(), "expected \"{text}\"");
    let case = case0(&h);
    let r = case.nodes.iter().find(|n| n.id == "J2").unwrap();
    assert!((r.position_m[1] - y).abs() < 1e-9 * 2.0, "{} against {y}", r.position_m[1]);
    assert_eq!(r.position_m[2], 1.0);
}

fn case0(h: &Harness<'_, TautspanApp>) -> CaseResult {
    h.state().derived.solved.as_ref().expect("solved").analysis.cases[0].clone()
}

/// The solved position of a node.
fn at(case: &CaseResult, id: &str) -> [f64; 3] {
    case.nodes.iter().find(|n| n.id == id).unwrap_or_else(|| panic!("no node {id}")).position_m
}

/// Angle from the vertical of the line a–b, cosine.
fn cos_from_vertical(a: [f64; 3], b: [f64; 3]) -> f64 {
    let d = [b[0] - a[0], b[1] - a[1], b[2] - a[2]];
    d[1].abs() / (d[0] * d[0] + d[1] * d[1] + d[2] * d[2]).sqrt()
}

/// A member's own weight, N, from the model's mass per length and its drawn length.
fn own_weight_n(h: &Harness<'_, TautspanApp>, id: &str) -> f64 {
    let s = &h.state().derived.solved.as_ref().unwrap().scenario;
    let m = s.members.iter().find(|m| m.id == id).unwrap();
    let [a, b] = m.ends;
    let (pa, pb) = (s.position_m(a), s.position_m(b));
    let l = ((pa[0] - pb[0]).powi(2) + (pa[1] - pb[1]).powi(2) + (pa[2] - pb[2]).powi(2)).sqrt();
    m.linear_mass.value * l * G
}

fn choose(h: &mut Harness<'_, TautspanApp>, combo: &str, option: &str) {
    h.get_by_role_and_label(Role::ComboBox, combo).click();
    h.run();
    click(h, option);
}

/// Join `a` to `b` with the member tool already chosen.
fn join(h: &mut Harness<'_, TautspanApp>, a: [f64; 3], b: [f64; 3]) {
    click_xyz(h, a);
    click_xyz(h, b);
}

#[test]
fn build_a_four_leg_sling_spread_in_plan_and_check_the_leg_statics() {
    let mut h = harness(blank_app());
    // the load's four pick points, placed in plan at y = 0 (nothing selected)
    click(&mut h, "Plan (x–z)");
    frame_on(&mut h, [0.0, 0.0], 120.0);
    click(&mut h, "Joint");
    let c = 0.5;
    let corners = [[-c, 0.0, -c], [c, 0.0, -c], [c, 0.0, c], [-c, 0.0, c]];
    for p in corners {
        click_xyz(&mut h, p);
    }
    let ids: Vec<String> = h.state().doc.dto.nodes.iter().map(|n| n.id.clone()).collect();
    assert_eq!(ids, ["J1", "J2", "J3", "J4"]);
    assert!(h.state().doc.dto.nodes.iter().all(|n| n.at.y.0 == "0 m"), "plan keeps the height");
    assert_eq!(h.state().doc.dto.nodes[2].at.z.as_ref().map(|z| z.0.as_str()), Some("0.5 m"));
    // the rigid load: rods round the square and across it
    choose(&mut h, "Member kind", "rod");
    for (a, b) in [(0, 1), (1, 2), (2, 3), (3, 0), (0, 2), (1, 3)] {
        join(&mut h, corners[a], corners[b]);
    }
    assert_eq!(h.state().doc.dto.members.len(), 6);
    click(&mut h, "Mass");
    for p in corners {
        click_xyz(&mut h, p);
    }
    assert_eq!(h.state().doc.dto.masses.len(), 4);
    // the hook: placed in the elevation with nothing selected (so at z = 0)
    h.key_press(egui::Key::Escape);
    h.key_press(egui::Key::Escape);
    h.run();
    assert_eq!(h.state().selection, Selection::None);
    click(&mut h, "Elevation (x–y)");
    frame_on(&mut h, [0.0, 1.0], 120.0);
    click(&mut h, "Anchor");
    let hook = [0.0, 2.0, 0.0];
    click_xyz(&mut h, hook);
    assert_eq!(h.state().selection, Selection::Node("A1".into()));
    // the helper: hook then the four pick points, in plan
    click(&mut h, "Plan (x–z)");
    click(&mut h, "Multi-leg sling…");
    click_xyz(&mut h, hook);
    for p in corners {
        click_xyz(&mut h, p);
    }
    assert!(h.query_by_label("Pick points: J1, J2, J3, J4").is_some());
    // equal legs: no mismatch
    assert!(h.query_by_label_contains("Leg-length mismatch: 0 m (0.0 %").is_some());
    assert!(h.get_by_label("Place legs").accesskit_node().is_disabled(), "no leg chosen for the user yet");
    choose(&mut h, "Legs", "library wire rope 12 mm 6x19 IWRC grade 1770");
    click(&mut h, "Place legs");
    let dto = h.state().doc.dto.clone();
    let legs: Vec<_> = dto.members.iter().filter(|m| m.ends.0 == "A1").collect();
    assert_eq!(legs.len(), 4, "one leg to each pick point");
    assert!(legs.iter().all(|m| m.diameter.as_ref().is_some_and(|d| d.0 == "12 mm")));

    // statics of the solved shape: every corner hangs on one leg (the rods
    // are level and carry no vertical force), so by symmetry each leg holds a
    // quarter of the weight below it, T = W / (4 cos β), β from vertical.
    // W: the four masses, the rods (their whole weight, lumped half at each
    // end, all at the corners) and the lower half of each leg (the model lumps
    // half of each member's own weight at each end).
    let case = case0(&h);
    let rods: f64 = ["R1", "R2", "R3", "R4", "R5", "R6"].iter().map(|id| own_weight_n(&h, id)).sum();
    let leg_ids: Vec<String> = legs.iter().map(|m| m.id.clone()).collect();
    let legs_w: f64 = leg_ids.iter().map(|id| own_weight_n(&h, id)).sum();
    let w = 4.0 * 250.0 * G + rods + legs_w / 2.0;
    for (id, pick) in leg_ids.iter().zip(["J1", "J2", "J3", "J4"]) {
        let t = case.members.iter().find(|m| &m.id == id).unwrap().force_n;
        let expect = w / (4.0 * cos_from_vertical(at(&case, "A1"), at(&case, pick)));
        assert!(rel(t, expect) < STATICS_TOL, "{id}: {t} N against W/(4 cos β) = {expect} N");
    }
    // the helper shows the solved shares beside the standard's two-leg rating
    assert_eq!(h.query_all_by_label_contains("25.0 % of the load").count(), 4, "a quarter each, by symmetry");
    assert!(h.query_by_label_contains("counts only two legs").is_some());
}

/// Solve the 3 × 3 system `[c0 c1 c2] f = r` by Cramer's rule.
fn solve3(c: [[f64; 3]; 3], r: [f64; 3]) -> [f64; 3] {
    let det = |m: [[f64; 3]; 3]| {
        m[0][0] * (m[1][1] * m[2][2] - m[2][1] * m[1][2]) - m[1][0] * (m[0][1] * m[2][2] - m[2][1] * m[0][2])
            + m[2][0] * (m[0][1] * m[1][2] - m[1][1] * m[0][2])
    };
    let d = det(c);
    std::array::from_fn(|k| {
        let mut m = c;
        m[k] = r;
        det(m) / d
    })
}

fn unit(a: [f64; 3], b: [f64; 3]) -> [f64; 3] {
    let d = [b[0] - a[0], b[1] - a[1], b[2] - a[2]];
    let l = (d[0] * d[0] + d[1] * d[1] + d[2] * d[2]).sqrt();
    d.map(|x| x / l)
}

#[test]
fn build_a_tripod_on_a_slab_and_check_the_joint_statics() {
    let mut h = harness(blank_app());
    click(&mut h, "Plan (x–z)");
    frame_on(&mut h, [0.0, 0.0], 120.0);
    // three feet 120° apart on a circle of 1 m: off the grid, so snapping off
    click(&mut h, "Snap to grid");
    assert!(!h.state().view.snap);
    click(&mut h, "Floor node");
    let s3 = 3f64.sqrt() / 2.0;
    let feet = [[1.0, 0.0, 0.0], [-0.5, 0.0, s3], [-0.5, 0.0, -s3]];
    for p in feet {
        click_xyz(&mut h, p);
    }
    let dto = h.state().doc.dto.clone();
    assert_eq!(dto.floors.len(), 1, "each next foot stands on the selected foot's slab");
    assert_eq!(dto.nodes.len(), 3);
    // the apex, placed in the elevation with nothing selected (z = 0)
    h.key_press(egui::Key::Escape);
    h.key_press(egui::Key::Escape);
    h.run();
    click(&mut h, "Elevation (x–y)");
    frame_on(&mut h, [0.0, 1.0], 120.0);
    click(&mut h, "Snap to grid");
    click(&mut h, "Joint");
    let apex = [0.0, 2.0, 0.0];
    click_xyz(&mut h, apex);
    assert_eq!(h.state().selection, Selection::Node("J1".into()));
    // the legs, in plan where the feet are apart
    click(&mut h, "Plan (x–z)");
    choose(&mut h, "Member kind", "rod");
    for f in feet {
        join(&mut h, apex, f);
    }
    click(&mut h, "Mass");
    click_xyz(&mut h, apex);
    assert_eq!(h.state().doc.dto.members.len(), 3);
    assert_eq!(h.state().doc.dto.masses.len(), 1);

    // method of joints at the apex, on the solved shape: the three leg
    // forces N_i (tension positive) pull the apex along the unit vectors e_i
    // from apex to foot and balance the load there, Σ N_i e_i = W_a ŷ, with W_a the mass and half of each
    // leg's own weight (the model lumps half of each member at each end).
    let case = case0(&h);
    // the tripod stands: the apex stays up (not the inverted, hanging
    // equilibrium that a re-solve warm-started from the two-leg rig, a
    // mechanism swung below its feet, would keep)
    assert!(at(&case, "J1")[1] > 1.9, "apex at {:?}", at(&case, "J1"));
    let ids = ["R1", "R2", "R3"];
    let feet_ids = ["P1", "P2", "P3"];
    let a = at(&case, "J1");
    let e: Vec<[f64; 3]> = feet_ids.iter().map(|f| unit(a, at(&case, f))).collect();
    let weights: Vec<f64> = ids.iter().map(|id| own_weight_n(&h, id)).collect();
    let w_apex = 250.0 * G + weights.iter().sum::<f64>() / 2.0;
    let c = solve3([e[0], e[1], e[2]], [0.0, w_apex, 0.0]);
    for (k, id) in ids.iter().enumerate() {
        let f = case.members.iter().find(|m| &m.id == id).unwrap().force_n;
        assert!(f < 0.0, "{id} in compression");
        assert!(rel(f, c[k]) < STATICS_TOL, "{id}: {f} N against the joint statics {} N", c[k]);
        // β close to atan(1 / 2) for the drawn tripod: the closed form of the symmetric one,
        // C = W / (3 cos β), to the stretch of the legs and the slab's give
        let closed = w_apex / (3.0 * (2.0 / 5f64.sqrt()));
        assert!(rel(-f, closed) < 1e-3, "{id}: {f} N against W/(3 cos β) = {closed} N");
    }
    // each foot's normal force: its leg's push down on it, N_i e_iy (both
    // negative), plus the half of the leg lumped at the foot; together the
    // whole weight
    let floor = &case.floors[0];
    for (k, f) in feet_ids.iter().enumerate() {
        let foot = floor.feet.iter().find(|x| x.node == *f).unwrap();
        let expect = c[k] * e[k][1] + weights[k] / 2.0;
        assert!(rel(foot.normal_force_n, expect) < STATICS_TOL, "{f}: {} against {expect}", foot.normal_force_n);
    }
    let total: f64 = floor.feet.iter().map(|f| f.normal_force_n).sum();
    assert!(rel(total, 250.0 * G + weights.iter().sum::<f64>()) < STATICS_TOL);
}

#[test]
fn build_a_rope_over_a_running_block_in_the_side_view() {
    let mut h = harness(blank_app());
    h.key_press(egui::Key::Num3);
    h.run();
    assert_eq!(h.state().view.kind, ViewKind::Side);
    frame_on(&mut h, [0.0, 3.5], 60.0);
    // anchors 4 m apart across z, the block 2 m below between them
    click(&mut h, "Anchor");
    let (a1, a2, block) = ([0.0, 5.0, -2.0], [0.0, 5.0, 2.0], [0.0, 3.0, 0.0]);
    click_xyz(&mut h, a1);
    click_xyz(&mut h, a2);
    click(&mut h, "Joint");
    click_xyz(&mut h, block);
    click(&mut h, "Mass");
    click_xyz(&mut h, block);
    click(&mut h, "Rope over sheaves");
    for p in [a1, block, a2, a2] {
        click_xyz(&mut h, p);
    }
    let dto = h.state().doc.dto.clone();
    assert_eq!(dto.ropes.len(), 1);
    assert_eq!(dto.ropes[0].path, ["A1", "J1", "A2"]);
    assert_eq!(dto.nodes[1].at.z.as_ref().map(|z| z.0.as_str()), Some("2 m"), "the side view sets z");
    assert!(dto.nodes.iter().all(|n| n.at.x.0 == "0 m"), "and keeps x");
    // the block's sheave: its diameter is the user's to give (not a coordinate)
    click(&mut h, "Select");
    click_xyz(&mut h, block);
    assert_eq!(h.state().selection, Selection::Node("J1".into()));
    type_into(&mut h, "Sheave diameter", "300 mm");
    assert!(h.state().derived.solved.is_some());

    // statics of a frictionless running block: one tension T in both spans,
    // T (cos φ1 + cos φ2) = W_J (φ from the vertical, on the solved shape),
    // W_J the mass and half of each span's own weight (lumped at the span's ends)
    let case = case0(&h);
    let r = case.members.iter().find(|m| m.id == "rope1").unwrap();
    let j = at(&case, "J1");
    let cos = cos_from_vertical(j, at(&case, "A1")) + cos_from_vertical(j, at(&case, "A2"));
    let s = &h.state().derived.solved.as_ref().unwrap().scenario;
    let mu = s.members.iter().find(|m| m.id == "rope1").unwrap().linear_mass.value;
    let drawn_len = 2.0 * (2.0f64 * 2.0 + 2.0 * 2.0).sqrt();
    let w = 250.0 * G + mu * drawn_len * G / 2.0;
    let t = w / cos;
    for seg in &r.segments {
        assert!(rel(seg.force_n, t) < STATICS_TOL, "span {}–{}: {} vs {t}", seg.from, seg.to, seg.force_n);
    }
}

#[test]
fn a_node_dragged_in_plan_moves_in_x_and_z_and_keeps_its_height() {
    let mut h = harness(app_on(TWO_DEEP));
    click(&mut h, "Plan (x–z)");
    frame_on(&mut h, [0.0, 0.0], 100.0);
    // in plan J1 sits under A1 on one point: a drag takes the nearest of the
    // two, and whichever it is moves in x and z and keeps its height
    let from = h.state().view.to_screen_xyz([0.0, 1.0, -1.0]);
    let to = h.state().view.to_screen_xyz([1.0, 1.0, -0.5]);
    common::press_and_move(&mut h, from, to, 8);
    common::release(&mut h, to);
    let dragged = match h.state().selection.clone() {
        Selection::Node(id) => id,
        other => panic!("a node is dragged, not {other:?}"),
    };
    let n = h.state().doc.dto.nodes.iter().find(|n| n.id == dragged).unwrap().clone();
    assert_eq!(n.at.x.0, "1 m", "x from the plan, on the grid");
    assert_eq!(n.at.z.as_ref().map(|z| z.0.as_str()), Some("-0.5 m"), "z from the plan");
    let height = if dragged.starts_with('A') { "3 m" } else { "1 m" };
    assert_eq!(n.at.y.0, height, "the height the plan does not show is kept");
    // one undo step takes the whole drag back
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::Z);
    h.run();
    let n = h.state().doc.dto.nodes.iter().find(|n| n.id == dragged).unwrap().clone();
    assert_eq!((n.at.x.0.as_str(), n.at.z.as_ref().map(|z| z.0.as_str())), ("0 m", Some("-1 m")));
}

/// A small window: the view switch takes its short names so it never runs
/// under the legend's switch, and the legend, with no room beside the rig,
/// is not drawn over it (nor its switch).
#[test]
fn a_small_canvas_keeps_the_switch_short_and_the_legend_off_the_rig() {
    let mut h = Harness::builder()
        .with_size([960.0, 600.0])
        .build_ui_state(|ui, app: &mut TautspanApp| app.frame(ui), app_on(TWO_DEEP));
    h.run();
    assert!(h.query_by_label("x–z").is_some(), "short names on a narrow canvas");
    assert!(h.query_by_label("Plan (x–z)").is_none());
    assert!(h.query_by_label("Hide legend").is_none() && h.query_by_label("Show legend").is_none());
    h.get_by_label("x–z").click();
    h.run();
    assert_eq!(h.state().view.kind, ViewKind::Plan);
}
