//! A user builds a two-leg bridle from nothing with the canvas tools, sets
//! the mass in the inspector, and reads member forces in the results table
//! that match the core's own solution of the same scenario. Then undo and
//! redo step through the edits.

mod common;

use common::{blank_app, click, click_world, harness, type_into};
use egui_kittest::kittest::Queryable;
use tautspan_gui::{Selection, Shown, UnitSystem};

#[test]
fn build_a_two_leg_bridle_and_read_the_forces() {
    let mut h = harness(blank_app());

    click(&mut h, "Anchor");
    click_world(&mut h, -1.5, 5.0);
    click_world(&mut h, 1.5, 5.0);
    click(&mut h, "Joint");
    click_world(&mut h, 0.0, 3.0);
    assert_eq!(h.state().doc.dto.nodes.len(), 3, "two anchors and a joint placed");

    click(&mut h, "Member");
    click_world(&mut h, -1.5, 5.0);
    click_world(&mut h, 0.0, 3.0);
    click_world(&mut h, 1.5, 5.0);
    click_world(&mut h, 0.0, 3.0);
    assert_eq!(h.state().doc.dto.members.len(), 2, "two legs placed");

    click(&mut h, "Mass");
    click_world(&mut h, 0.0, 3.0);
    assert!(matches!(h.state().selection, Selection::Mass(_)), "the new mass is selected");

    type_into(&mut h, "Mass", "400 kg");
    assert_eq!(h.state().doc.dto.masses[0].mass.0, "400 kg", "kept as typed");

    // the core's own answer for the same document
    let dto = h.state().doc.dto.clone();
    let scenario = tautspan_core::model::build(&dto).unwrap_or_else(|p| panic!("{p:?}"));
    let analysis = tautspan_core::analysis::analyse(&scenario);
    let case = &analysis.cases[0];
    assert!(case.converged);
    for m in &case.members {
        // symmetric legs: each carries W / (2 sin θ); the table shows the core's number
        let text = UnitSystem::Si.fmt(m.force_n, Shown::Force);
        assert!(h.query_all_by_label(&text).count() >= 1, "table shows {text} for {}", m.id);
        assert!(m.force_n > 400.0 * 9.80665 / 2.0, "each leg carries more than half the weight");
    }
    // the app re-solves warm-started from its previous answer: the same
    // equilibrium to the solver's residual tolerance (1e-9 of the forces),
    // so the forces agree to 1e-7 relative
    let shown = h.state().derived.solved.as_ref().map(|s| s.analysis.cases[0].members[0].force_n).unwrap_or_default();
    let core = case.members[0].force_n;
    assert!((shown - core).abs() <= 1e-7 * core.abs(), "the app's numbers are the core's: {shown} against {core}");

    // undo the mass edit, then the mass, and redo both
    click(&mut h, "Select");
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::Z);
    h.run();
    assert_eq!(h.state().doc.dto.masses[0].mass.0, "250 kg", "undo restores the default mass");
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::Z);
    h.run();
    assert!(h.state().doc.dto.masses.is_empty(), "undo removes the mass");
    let shift_cmd = egui::Modifiers::COMMAND | egui::Modifiers::SHIFT;
    h.key_press_modifiers(shift_cmd, egui::Key::Z);
    h.run();
    h.key_press_modifiers(shift_cmd, egui::Key::Z);
    h.run();
    assert_eq!(h.state().doc.dto.masses[0].mass.0, "400 kg", "redo brings both back");
}

#[test]
fn a_fraction_where_a_length_belongs_is_refused_inline() {
    let mut h = harness(common::demo_app());
    h.state_mut().selection = Selection::Member("leg-west".to_string());
    h.run();
    type_into(&mut h, "Diameter", "3/4");
    assert_eq!(
        h.state().doc.dto.members[0].diameter.as_ref().map(|q| q.0.as_str()),
        Some("12 mm"),
        "the document keeps its last good value"
    );
    // beside the field, and in the verdict bar's line saying the results are stale
    assert!(h.query_all_by_label_contains("3/4").count() >= 2, "the parser's message is shown beside the field");
    type_into(&mut h, "Diameter", "0.75 in");
    assert_eq!(h.state().doc.dto.members[0].diameter.as_ref().map(|q| q.0.as_str()), Some("0.75 in"), "kept as typed");
}

#[test]
fn dragging_a_node_re_solves_live_and_is_one_undo_step() {
    let mut h = harness(common::demo_app());
    let solves = h.state().derived.solves;
    let from = h.state().view.to_screen(0.0, 3.5);
    let to = h.state().view.to_screen(0.5, 3.5);
    common::press_and_move(&mut h, from, to, 5);
    common::release(&mut h, to);
    let j1 = h.state().doc.dto.nodes.iter().find(|n| n.id == "J1").map(|n| n.at.x.0.clone());
    assert_eq!(j1.as_deref(), Some("0.5 m"), "snapped to the grid, in the unit it was written in");
    assert!(h.state().derived.solves > solves, "re-solved while dragging");
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::Z);
    h.run();
    let j1 = h.state().doc.dto.nodes.iter().find(|n| n.id == "J1").map(|n| n.at.x.0.clone());
    assert_eq!(j1.as_deref(), Some("0 m"), "one undo step takes the whole drag back");
}
