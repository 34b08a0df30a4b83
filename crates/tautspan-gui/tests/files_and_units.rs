//! Files and units as a user meets them: the SI / US customary switch
//! changes the displayed numbers; a broken file opens nothing, shows where
//! it is broken and keeps the scenario that was open; a saved file opens
//! back to the same scenario and the same numbers; unsaved changes are
//! guarded.

mod common;

use common::{click, demo_app, harness, type_into};
use egui_kittest::kittest::Queryable;
use tautspan_gui::{Shown, UnitSystem};

/// The member forces of the first case the app shows.
fn first_case_forces(app: &tautspan_gui::TautspanApp) -> Vec<f64> {
    app.derived
        .solved
        .as_ref()
        .map(|s| s.analysis.cases[0].members.iter().map(|m| m.force_n).collect())
        .unwrap_or_default()
}

fn temp_dir(name: &str) -> std::path::PathBuf {
    let d = std::env::temp_dir().join(format!("tautspan-gui-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap_or_else(|e| panic!("{e}"));
    d
}

#[test]
fn the_unit_switch_changes_the_displayed_text() {
    let mut h = harness(demo_app());
    let force = h.state().derived.solved.as_ref().map(|s| s.analysis.cases[0].members[0].force_n).unwrap_or_default();
    let si = UnitSystem::Si.fmt(force, Shown::Force);
    let us = UnitSystem::UsCustomary.fmt(force, Shown::Force);
    assert!(si.ends_with("kN") && us.ends_with("lbf"));
    assert!(h.query_all_by_label(&si).count() >= 1, "SI shows {si}");
    click(&mut h, "US customary");
    assert_eq!(h.state().prefs.units, UnitSystem::UsCustomary);
    assert!(h.query_all_by_label(&us).count() >= 1, "US customary shows {us}");
    assert_eq!(h.query_all_by_label(&si).count(), 0, "no SI force left in the table");
    assert!(!h.state().doc.dirty, "the display units are not an edit of the scenario");
}

#[test]
fn the_built_in_demo_opens_and_solves() {
    let h = harness(common::builtin_demo_app());
    let solved = h.state().derived.solved.as_ref().map(|s| s.analysis.cases.iter().all(|c| c.converged));
    assert_eq!(solved, Some(true), "every case of the demo converges");
    assert!(h.query_by_label_contains("Planning aid only").is_some(), "the caution is shown");
    let n = h.state().doc.dto.cases.len();
    let status = format!("of {n} cases converged");
    assert!(h.query_by_label_contains(&status).is_some(), "the status bar shows convergence: {status}");
    assert!(h.query_by_label_contains("solved in").is_some(), "and the solve time");
    assert!(h.query_by_label_contains("updating results").is_none(), "the results are current");
}

#[test]
fn a_broken_file_shows_the_error_and_keeps_the_open_scenario() {
    let dir = temp_dir("broken");
    let path = dir.join("broken.ron");
    let text = "Scenario(\n    format: 1,\n    title: \"broken\",\n    nodes: [ Node(id: \"A1\", at: (0, \"6 m\"), support: Anchor) ],\n)\n";
    std::fs::write(&path, text).unwrap_or_else(|e| panic!("{e}"));
    let mut h = harness(demo_app());
    let before = h.state().doc.dto.clone();
    click(&mut h, "File");
    click(&mut h, "Open…  (Ctrl+O)");
    type_into(&mut h, "Path", &path.display().to_string());
    click(&mut h, "Open");
    assert_eq!(h.state().doc.dto, before, "the open scenario is kept");
    let shown = h.query_by_label_contains("Nothing opened").map(|n| n.value().unwrap_or_default());
    assert!(shown.is_some(), "the error is shown");
    let message = match &h.state().message {
        Some(tautspan_gui::Message::Error(m)) => m.clone(),
        other => panic!("expected an error, got {other:?}"),
    };
    assert!(message.contains("broken.ron:4:"), "names the file and line: {message}");
    assert!(message.contains("bare number"), "says what is wrong: {message}");
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn save_then_open_round_trips_and_unsaved_changes_are_guarded() {
    let dir = temp_dir("roundtrip");
    let path = dir.join("rig.ron");
    let mut h = harness(demo_app());
    h.state_mut().selection = tautspan_gui::Selection::Mass("load".to_string());
    h.run();
    type_into(&mut h, "Mass", "0.5 t");
    assert!(h.state().doc.dirty);
    click(&mut h, "Select");
    h.key_press_modifiers(egui::Modifiers::COMMAND | egui::Modifiers::SHIFT, egui::Key::S);
    h.run();
    type_into(&mut h, "Path", &path.display().to_string());
    click(&mut h, "Save");
    assert!(path.exists(), "saved");
    assert!(!h.state().doc.dirty, "clean after saving");
    assert_eq!(h.state().doc.path.as_deref(), Some(path.as_path()));
    let saved = h.state().doc.dto.clone();
    let forces = first_case_forces(h.state());

    // the file reads back through the core exactly as it was in the app
    let text = std::fs::read_to_string(&path).unwrap_or_else(|e| panic!("{e}"));
    let loaded = tautspan_core::model::load_scenario(&text).unwrap_or_else(|e| panic!("{e}"));
    assert_eq!(loaded.dto, *saved);
    assert!(text.contains("\"0.5 t\""), "the unit typed is kept in the file");

    // start a new scenario, change it, then open the saved file: the app asks first
    click(&mut h, "File");
    click(&mut h, "New  (Ctrl+N)");
    assert_eq!(h.state().doc.dto.title, "New rig", "New went through: nothing was unsaved");
    type_into(&mut h, "Title", "changed");
    assert!(h.state().doc.dirty);
    click(&mut h, "File");
    click(&mut h, "Open…  (Ctrl+O)");
    assert!(h.state().pending.is_some(), "asks about the unsaved changes");
    click(&mut h, "Discard changes");
    type_into(&mut h, "Path", &path.display().to_string());
    click(&mut h, "Open");
    assert_eq!(h.state().doc.dto, saved, "the saved scenario is back");
    h.run();
    let again = first_case_forces(h.state());
    // the earlier numbers were warm-started from the edit before them, these
    // are solved afresh: the same equilibrium to the solver's tolerance
    // (residual 1e-9 of the forces), so 1e-7 relative
    assert_eq!(again.len(), forces.len());
    for (a, f) in again.iter().zip(&forces) {
        assert!((a - f).abs() <= 1e-7 * f.abs(), "same numbers: {a} against {f}");
    }
    assert_eq!(h.state().prefs.recent.first(), Some(&path), "listed in recent files");
    let _ = std::fs::remove_dir_all(&dir);
}

/// The report exported from the app names the scenario file with its
/// SHA-256 when what is open is what the file holds (the digest is the
/// core's FIPS 180-4 function, itself checked against the standard's test
/// vectors), and leaves the digest out once there are unsaved changes.
#[test]
fn the_exported_report_names_the_saved_file_and_its_digest() {
    let dir = temp_dir("report-digest");
    let scenario = dir.join("bridle.ron");
    let mut h = harness(demo_app());
    assert!(h.state_mut().save_to(&scenario), "saved");
    h.run();
    let bytes = std::fs::read(&scenario).unwrap_or_else(|e| panic!("{e}"));
    let digest = tautspan_core::report::SourceFile::new("x", &bytes).sha256;
    let export = |h: &mut egui_kittest::Harness<'static, tautspan_gui::TautspanApp>, out: &std::path::Path| {
        let ctx = h.ctx.clone();
        h.state_mut().apply(&ctx, vec![tautspan_gui::Command::ExportReport]);
        h.run();
        type_into(h, "Path", &out.display().to_string());
        click(h, "Export");
        std::fs::read_to_string(out).unwrap_or_else(|e| panic!("{e}"))
    };
    let clean = export(&mut h, &dir.join("clean.html"));
    assert!(clean.contains(&digest), "the saved file's SHA-256 is in the report");
    assert!(clean.contains("bridle.ron"));
    // an unsaved change: the open scenario is no longer the file's
    let ctx = h.ctx.clone();
    h.state_mut().apply(&ctx, vec![tautspan_gui::Command::edit(|d| d.title = "changed".to_string())]);
    h.run();
    let dirty = export(&mut h, &dir.join("dirty.html"));
    assert!(!dirty.contains(&digest), "no digest for a scenario with unsaved changes");
    let _ = std::fs::remove_dir_all(&dir);
}
