//! Ropes over sheaves in the app: a running block routed A → K → B with the
//! rope tool, its sheave's diameter given in the node inspector, its row in
//! the results agreeing with the statics of a frictionless pulley; a bronze
//! bearing making the spans differ by the lead-line factor, undone in one
//! step; deleting the sheave node taking the rope; a rope file's results
//! mapped to the rope's id; save and open keeping ropes and sheaves.

#![allow(clippy::unwrap_used, clippy::expect_used, reason = "test helpers fail loudly on broken fixtures")]

mod common;

use common::{blank_app, click, click_world, harness, type_into};
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tautspan_core::analysis::MemberResult;
use tautspan_core::file::Qty;
use tautspan_core::library::Bearing;
use tautspan_gui::{Document, Prefs, Selection, Shown, TautspanApp, Tool, UnitSystem};

/// Standard gravity, m/s² (CGPM 1901, ISO 80000-3).
const G: f64 = 9.80665;

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

/// The rope's result in the first case, as the app holds it.
fn rope_result(h: &Harness<'_, TautspanApp>, id: &str) -> MemberResult {
    let solved = h.state().derived.solved.as_ref().expect("solved");
    solved.analysis.cases[0].members.iter().find(|m| m.id == id).cloned().expect("the rope's result")
}

/// Anchors A1 (0, 5 m) and A2 (4 m, 6 m), a joint J1 at (2 m, 3 m) with a
/// mass on it, and a rope routed A1 → J1 → A2 with the rope tool, finished
/// by clicking the last node again.
fn route_running_block() -> Harness<'static, TautspanApp> {
    let mut blank = blank_app();
    // the canvas centred on where the rig goes, whatever room the panels leave it
    blank.view.centre_m = [2.0, 4.0];
    let mut h = harness(blank);
    click(&mut h, "Anchor");
    click_world(&mut h, 0.0, 5.0);
    click_world(&mut h, 4.0, 6.0);
    click(&mut h, "Joint");
    click_world(&mut h, 2.0, 3.0);
    click(&mut h, "Mass");
    click_world(&mut h, 2.0, 3.0);
    click(&mut h, "Rope over sheaves");
    assert_eq!(h.state().tool, Tool::Rope);
    click_world(&mut h, 0.0, 5.0);
    click_world(&mut h, 2.0, 3.0);
    click_world(&mut h, 4.0, 6.0);
    assert!(h.state().doc.dto.ropes.is_empty(), "not placed until finished");
    click_world(&mut h, 4.0, 6.0);
    h
}

#[test]
fn route_a_running_block_and_read_the_pulley_statics() {
    let mut h = route_running_block();
    let dto = h.state().doc.dto.clone();
    assert_eq!(dto.ropes.len(), 1);
    let rope = &dto.ropes[0];
    assert_eq!(rope.path, ["A1", "J1", "A2"]);
    // the new rope takes a new wire rope member's library sizing
    assert_eq!(rope.diameter.as_ref().map(|q| q.0.as_str()), Some("12 mm"));
    assert_eq!(rope.construction.as_deref(), Some("6x19 IWRC"));
    assert_eq!(rope.grade.as_deref(), Some("1770"));
    assert_eq!(h.state().selection, Selection::Rope(rope.id.clone()), "the new rope is selected");
    // the middle node got a sheave whose diameter is the user's to give:
    // no results until then, and the core's located error beside the field
    let j1 = dto.nodes.iter().find(|n| n.id == "J1").unwrap();
    assert!(j1.sheave.as_ref().is_some_and(|s| s.diameter.0.is_empty()));
    assert!(h.state().derived.solved.is_none(), "no results while the sheave has no diameter");
    let problem = h.state().derived.problems.iter().find(|p| p.path == "nodes[2].sheave.diameter").cloned();
    let problem = problem.expect("the core names the missing diameter");
    click(&mut h, "Select");
    click_world(&mut h, 2.0, 3.0);
    assert_eq!(h.state().selection, Selection::Node("J1".into()));
    assert!(h.query_by_label(&problem.message).is_some(), "the error is shown in the inspector");
    type_into(&mut h, "Sheave diameter", "300 mm");
    assert!(h.state().derived.solved.is_some(), "solved once the diameter is given");

    // a weightless rope for the closed form (the pulley statics leave out
    // the rope's own weight); set as the file would say it
    h.state_mut().doc.edit(None, |d| d.ropes[0].linear_mass = Some(Qty::from("0 kg/m")));
    h.run();

    // Statics of a frictionless pulley on a rope: equal tension both sides,
    // so both spans make the same angle φ with the vertical, sin φ = span / L
    // (L the stretched rope, the sum of the solved spans) and T = W / (2 cos φ).
    // Tolerance 1e-7: the solver balances to 1e-9 of the load.
    let r = rope_result(&h, "rope1");
    assert_eq!(r.segments.len(), 2);
    let l: f64 = r.segments.iter().map(|s| s.length_m).sum();
    let phi = (4.0 / l).asin();
    let t = 250.0 * G / (2.0 * phi.cos());
    assert!(rel(r.force_n, t) < 1e-7, "{} vs {t}", r.force_n);
    for s in &r.segments {
        assert!(rel(s.force_n, t) < 1e-7, "span {}–{}: {} vs {t}", s.from, s.to, s.force_n);
    }

    // one row for the rope in the results, under its id, with its force
    click(&mut h, "Results");
    let force = UnitSystem::Si.fmt(r.force_n, Shown::Force);
    assert!(h.query_all_by_label("rope1").count() >= 1, "the rope's row");
    assert!(h.query_all_by_label(&force).count() >= 1, "its force {force}");
    h.get_by_label("rope1").click();
    h.run();
    assert_eq!(h.state().selection, Selection::Rope("rope1".into()), "its row selects the rope");
}

#[test]
fn a_bronze_bearing_raises_the_lead_by_1_09_and_undo_restores() {
    let mut h = route_running_block();
    h.state_mut().doc.edit(None, |d| {
        d.nodes[2].sheave.as_mut().unwrap().diameter = Qty::from("300 mm");
        d.ropes[0].linear_mass = Some(Qty::from("0 kg/m"));
    });
    h.state_mut().selection = Selection::Node("J1".into());
    h.run();
    let frictionless = rope_result(&h, "rope1");
    // the inspector scrolls: bring the box into view first
    h.get_by_role_and_label(Role::ComboBox, "Bearing").scroll_to_me();
    h.run();
    h.get_by_role_and_label(Role::ComboBox, "Bearing").click();
    h.run();
    h.get_by_label(Bearing::Bronze.label()).click();
    h.run();
    assert_eq!(h.state().doc.dto.nodes[2].sheave.as_ref().and_then(|s| s.bearing), Some(Bearing::Bronze));
    // Wire Rope Users Manual, 4th ed.: a plain bearing's factor K = 1.09
    // from the span before the sheave to the span after it, hoisting (the
    // rope hauled in at its last node). The core applies it exactly: 1e-9.
    let r = rope_result(&h, "rope1");
    let ratio = r.segments[1].force_n / r.segments[0].force_n;
    assert!(rel(ratio, 1.09) < 1e-9, "{ratio}");
    assert!(rel(r.force_n, r.segments[1].force_n) < 1e-12, "the rope is checked on its largest span");
    // the inspector of the rope lists each span's tension
    h.state_mut().selection = Selection::Rope("rope1".into());
    h.run();
    for s in &r.segments {
        let text = format!("tension {}", UnitSystem::Si.fmt(s.force_n, Shown::Force));
        assert!(h.query_by_label(&text).is_some(), "{text}");
    }
    // undo: frictionless again, the spans equal
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::Z);
    h.run();
    assert_eq!(h.state().doc.dto.nodes[2].sheave.as_ref().and_then(|s| s.bearing), None);
    let r = rope_result(&h, "rope1");
    assert!(rel(r.segments[1].force_n, r.segments[0].force_n) < 1e-9);
    assert!(rel(r.force_n, frictionless.force_n) < 1e-9);
}

#[test]
fn deleting_the_sheave_node_takes_the_rope_in_one_step() {
    let mut h = route_running_block();
    let routed = h.state().doc.dto.clone();
    click(&mut h, "Select");
    // placing the rope and its new sheave was one undo step
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::Z);
    h.run();
    let d = h.state().doc.dto.clone();
    assert!(d.ropes.is_empty() && d.nodes[2].sheave.is_none() && d.masses.len() == 1, "one undo takes rope and sheave");
    h.key_press_modifiers(egui::Modifiers::COMMAND | egui::Modifiers::SHIFT, egui::Key::Z);
    h.run();
    assert_eq!(h.state().doc.dto, routed, "redo brings both back");
    click_world(&mut h, 2.0, 3.0);
    assert_eq!(h.state().selection, Selection::Node("J1".into()));
    h.key_press(egui::Key::Delete);
    h.run();
    // the rope and the mass go with it: asked first
    assert!(h.query_by_label("Delete node J1?").is_some());
    click(&mut h, "Delete all");
    let d = h.state().doc.dto.clone();
    assert!(d.ropes.is_empty() && d.masses.is_empty() && d.nodes.len() == 2, "the rope and the mass went with J1");
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::Z);
    h.run();
    let d = h.state().doc.dto.clone();
    assert_eq!((d.ropes.len(), d.masses.len(), d.nodes.len()), (1, 1, 3), "one undo brings all back");
}

#[test]
fn escape_cancels_a_route_and_enter_finishes_one() {
    let mut h = harness(blank_app());
    click(&mut h, "Anchor");
    click_world(&mut h, 0.0, 5.0);
    click_world(&mut h, 4.0, 5.0);
    click(&mut h, "Joint");
    click_world(&mut h, 2.0, 3.0);
    click(&mut h, "Rope over sheaves");
    click_world(&mut h, 0.0, 5.0);
    click_world(&mut h, 2.0, 3.0);
    h.key_press(egui::Key::Escape);
    h.run();
    assert!(h.state().canvas.rope_path.is_empty(), "Esc drops the route");
    assert!(h.state().doc.dto.ropes.is_empty());
    click_world(&mut h, 0.0, 5.0);
    click_world(&mut h, 2.0, 3.0);
    h.key_press(egui::Key::Enter);
    h.run();
    assert!(h.state().doc.dto.ropes.is_empty(), "two nodes are no rope: Enter waits for the last end");
    click_world(&mut h, 4.0, 5.0);
    h.key_press(egui::Key::Enter);
    h.run();
    assert_eq!(h.state().doc.dto.ropes.len(), 1);
    assert_eq!(h.state().doc.dto.ropes[0].path, ["A1", "J1", "A2"]);
}

/// The core's running block (tests/ropes_over_sheaves.rs) with a member
/// beside the rope, so the rope's result comes after the members'.
const RUNNING_BLOCK: &str = r#"Scenario(format: 1, title: "running block",
    nodes: [ Node(id: "A", at: ("0 m", "5 m"), support: Anchor),
             Node(id: "B", at: ("4 m", "6 m"), support: Anchor),
             Node(id: "K", at: ("1.8 m", "3.3 m"), sheave: Sheave(diameter: "300 mm")),
             Node(id: "T", at: ("6 m", "5 m"), support: Anchor),
             Node(id: "M", at: ("6 m", "3 m")) ],
    members: [ Member(id: "tag", ends: ("T", "M"), kind: WireRope, diameter: "12 mm", construction: "6x19 IWRC", grade: "1770") ],
    ropes: [ Rope(id: "fall", path: ["A", "K", "B"], kind: WireRope, diameter: "12 mm", area: "100 mm^2",
                  modulus: "200 GPa", rating: BreakingStrength("100 kN"), termination: PouredSocket,
                  linear_mass: "0 kg/m", length: "6 m") ],
    masses: [ Mass(id: "load", at: "K", mass: "500 kg"), Mass(id: "tagged", at: "M", mass: "10 kg") ],
    cases: [ Static(id: "hanging") ])"#;

fn running_block_app() -> TautspanApp {
    let loaded = tautspan_core::model::load_scenario(RUNNING_BLOCK).unwrap_or_else(|e| panic!("{e}"));
    let mut app = TautspanApp::with_document(Document::new(loaded.dto, None), Prefs::default());
    app.files.native = false;
    app
}

#[test]
fn a_rope_file_shows_the_rope_under_its_id_and_the_verdict_selects_it() {
    let mut h = harness(running_block_app());
    click(&mut h, "Results");
    // Same closed form as the core's test: T = W / (2 cos φ), sin φ = span / L,
    // L = 6 m (1 + T/EA) by fixed point; 1e-8 as there
    let ea = 100e-6 * 200e9;
    let w = 500.0 * G;
    let mut t = w;
    for _ in 0..100 {
        let phi = (4.0 / (6.0 * (1.0 + t / ea))).asin();
        t = w / (2.0 * phi.cos());
    }
    let r = rope_result(&h, "fall");
    assert!(rel(r.force_n, t) < 1e-8, "{} vs {t}", r.force_n);
    assert!(h.query_all_by_label("fall").count() >= 1, "a row under the rope's id");
    assert!(h.query_all_by_label(&UnitSystem::Si.fmt(t, Shown::Force)).count() >= 1, "with its largest span");
    // the rope is the worst item (the tag line carries 10 kg): the verdict's button selects it
    let worst = h.query_by_label_contains("worst: rope fall").expect("the verdict names the rope");
    worst.click();
    h.run();
    assert_eq!(h.state().selection, Selection::Rope("fall".into()));
    assert!(h.query_by_label_contains("Rope fall (A – K – B)").is_some(), "the rope inspector");
    // a click on a span selects it too
    click(&mut h, "Select");
    h.state_mut().selection = Selection::None;
    click_world(&mut h, 0.9, 4.15);
    assert_eq!(h.state().selection, Selection::Rope("fall".into()), "picked by its first span");
    // the deflected view draws at the solved positions without losing it
    // (true scale: the block slides a quarter metre to where the spans' angles match)
    h.state_mut().view.deflected = true;
    h.state_mut().view.magnification = 1;
    h.state_mut().selection = Selection::None;
    h.run();
    // K drawn at (1.8, 3.3) m moved by its displacement times the magnification
    let solved = h.state().derived.solved.as_ref().unwrap();
    let k = solved.analysis.cases[0].nodes.iter().find(|n| n.id == "K").unwrap().position_m;
    let mag = f64::from(h.state().view.magnification);
    let shown = [1.8 + (k[0] - 1.8) * mag, 3.3 + (k[1] - 3.3) * mag];
    click_world(&mut h, (shown[0] + 4.0) / 2.0, (shown[1] + 6.0) / 2.0);
    assert_eq!(h.state().selection, Selection::Rope("fall".into()), "picked on its solved second span");
}

#[test]
fn renaming_a_node_follows_into_the_rope_and_saving_keeps_ropes_and_sheaves() {
    let mut h = harness(running_block_app());
    h.state_mut().selection = Selection::Node("K".into());
    h.run();
    type_into(&mut h, "Id", "block");
    h.key_press(egui::Key::Enter);
    h.run();
    assert_eq!(h.state().doc.dto.ropes[0].path, ["A", "block", "B"]);
    assert!(h.state().derived.solved.is_some(), "still solves");

    let dir = std::env::temp_dir().join(format!("tautspan-gui-ropes-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    let path = dir.join("rig.ron");
    click(&mut h, "Select");
    h.key_press_modifiers(egui::Modifiers::COMMAND | egui::Modifiers::SHIFT, egui::Key::S);
    h.run();
    type_into(&mut h, "Path", &path.display().to_string());
    click(&mut h, "Save");
    let text = std::fs::read_to_string(&path).unwrap();
    let loaded = tautspan_core::model::load_scenario(&text).unwrap_or_else(|e| panic!("{e}"));
    assert_eq!(loaded.dto, *h.state().doc.dto, "read back as it was in the app");
    assert!(text.contains("Sheave(") && text.contains("Rope("), "ropes and sheaves written");
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn the_rope_inspector_edits_its_termination_fittings_motion_and_id() {
    use tautspan_core::library::{RopeMotion, Termination};
    let mut h = harness(running_block_app());
    h.state_mut().selection = Selection::Rope("fall".into());
    h.run();
    // the inspector scrolls: bring the box into view first
    h.get_by_role_and_label(Role::ComboBox, "Termination").scroll_to_me();
    h.run();
    h.get_by_role_and_label(Role::ComboBox, "Termination").click();
    h.run();
    h.get_by_label(Termination::HandSplice.label()).click();
    h.run();
    assert_eq!(h.state().doc.dto.ropes[0].termination, Some(Termination::HandSplice));
    // the inspector scrolls: bring the box into view first
    h.get_by_role_and_label(Role::ComboBox, "Motion").scroll_to_me();
    h.run();
    h.get_by_role_and_label(Role::ComboBox, "Motion").click();
    h.run();
    h.get_by_label("lowering").click();
    h.run();
    assert_eq!(h.state().doc.dto.ropes[0].motion, Some(RopeMotion::Lowering));
    // the inspector scrolls: bring the box into view first
    h.get_by_role_and_label(Role::ComboBox, "Add a part").scroll_to_me();
    h.run();
    h.get_by_role_and_label(Role::ComboBox, "Add a part").click();
    h.run();
    h.get_by_label("shackle").click();
    h.run();
    assert_eq!(h.state().doc.dto.ropes[0].fittings.len(), 1, "a shackle in series with the rope");
    type_into(&mut h, "Part 1 WLL", "3.25 t");
    type_into(&mut h, "Diameter", "14 mm");
    assert_eq!(h.state().doc.dto.ropes[0].diameter.as_ref().map(|q| q.0.as_str()), Some("14 mm"));
    type_into(&mut h, "Id", "tag");
    h.key_press(egui::Key::Enter);
    h.run();
    assert_eq!(h.state().doc.dto.ropes[0].id, "fall", "a member's id is refused");
    assert!(h.query_by_label_contains("is already the id of a member").is_some());
    type_into(&mut h, "Id", "hoist-fall");
    h.key_press(egui::Key::Enter);
    h.run();
    assert_eq!(h.state().doc.dto.ropes[0].id, "hoist-fall");
    assert_eq!(h.state().selection, Selection::Rope("hoist-fall".into()));
    assert!(h.state().derived.solved.is_some(), "still solves: {:?}", h.state().derived.problems);
}
