//! Renaming ids in the inspector and the cases panel: every reference
//! follows, the rename is one undo step, and an empty or taken id is refused
//! beside the field with the clash named.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "tests")]

mod common;

use common::{demo_app, harness, type_into};
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tautspan_core::file::CaseDto;
use tautspan_gui::{Selection, TautspanApp};

fn enter(h: &mut Harness<'_, TautspanApp>) {
    h.key_press(egui::Key::Enter);
    h.run();
}

fn case_mass(c: &CaseDto) -> Option<&str> {
    match c {
        CaseDto::Static { .. } => None,
        CaseDto::Swing { mass, .. } | CaseDto::Drop { mass, .. } | CaseDto::Sudden { mass, .. } => Some(mass),
    }
}

#[test]
fn renaming_a_node_carries_its_members_and_is_one_undo_step() {
    let mut h = harness(demo_app());
    h.state_mut().selection = Selection::Node("J1".to_string());
    h.run();
    type_into(&mut h, "Id", "master-link");
    assert!(h.state().doc.dto.nodes.iter().any(|n| n.id == "J1"), "not renamed while typing");
    enter(&mut h);

    let d = h.state().doc.dto.clone();
    assert!(d.nodes.iter().any(|n| n.id == "master-link") && !d.nodes.iter().any(|n| n.id == "J1"));
    let ends: Vec<(&str, &str)> = d.members.iter().map(|m| (m.ends.0.as_str(), m.ends.1.as_str())).collect();
    assert_eq!(ends, [("A1", "master-link"), ("A2", "master-link"), ("master-link", "J2")], "member ends follow");
    assert_eq!(h.state().selection, Selection::Node("master-link".to_string()), "the selection follows");
    assert!(h.state().derived.problems.is_empty(), "the scenario still validates");
    let solved = h.state().derived.solved.as_ref().unwrap();
    assert!(solved.analysis.cases[0].nodes.iter().any(|n| n.id == "master-link"), "the results use the new id");

    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::Z);
    h.run();
    let d = &h.state().doc.dto;
    assert!(d.nodes.iter().any(|n| n.id == "J1"), "one undo brings the old id back");
    assert!(d.members.iter().all(|m| m.ends.0 != "master-link" && m.ends.1 != "master-link"), "and every reference");
    assert_eq!(h.state().selection, Selection::None, "nothing left selected under the undone id");
}

#[test]
fn a_taken_or_empty_id_is_refused_beside_the_field() {
    let mut h = harness(demo_app());
    let before = h.state().doc.dto.clone();
    h.state_mut().selection = Selection::Node("J2".to_string());
    h.run();
    type_into(&mut h, "Id", "A1");
    assert!(
        h.query_by_label_contains("\"A1\" is already the id of a node").is_some(),
        "the clash is named beside the field"
    );
    enter(&mut h);
    assert_eq!(h.state().doc.dto, before, "nothing renamed");
    assert!(!h.state().doc.dirty);

    type_into(&mut h, "Id", "x");
    h.key_press(egui::Key::Backspace);
    h.run();
    assert!(h.query_by_label_contains("needs an id").is_some(), "an empty id is refused");
    enter(&mut h);
    assert_eq!(h.state().doc.dto, before, "nothing renamed");

    // a member may not take a node's id either: warnings name items by id alone
    h.state_mut().selection = Selection::Member("drop".to_string());
    h.run();
    type_into(&mut h, "Id", "J1");
    assert!(h.query_by_label_contains("\"J1\" is already the id of a node").is_some());
}

#[test]
fn renaming_a_mass_and_a_case_updates_the_cases() {
    let mut h = harness(demo_app());
    h.state_mut().selection = Selection::Mass("load".to_string());
    h.run();
    type_into(&mut h, "Id", "motor");
    enter(&mut h);
    let d = &h.state().doc.dto;
    assert_eq!(d.masses[0].id, "motor");
    let masses: Vec<&str> = d.cases.iter().filter_map(case_mass).collect();
    assert_eq!(masses, ["motor", "motor", "motor"], "every dynamic case follows the mass");
    assert_eq!(h.state().selection, Selection::Mass("motor".to_string()));

    // the first case's id field in the cases panel
    let field = h.query_all_by_role_and_label(Role::TextInput, "Case id").next().expect("a case id field");
    field.focus();
    h.run();
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::A);
    h.run();
    h.query_all_by_role_and_label(Role::TextInput, "Case id").next().unwrap().type_text("at rest");
    h.run();
    enter(&mut h);
    assert_eq!(h.state().doc.dto.cases[0].id(), "at rest");
    assert_eq!(h.state().shown_case.as_deref(), Some("at rest"), "the canvas keeps showing the renamed case");
    let ids: Vec<String> =
        h.state().derived.solved.as_ref().unwrap().analysis.cases.iter().map(|c| c.id.clone()).collect();
    assert_eq!(ids[0], "at rest", "the results carry the new case id");
}
