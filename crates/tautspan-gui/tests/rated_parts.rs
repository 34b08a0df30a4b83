//! Rated parts in the app: the results table has a row per fitting and
//! anchor rating, and the member and node inspectors list each part with
//! its utilisation.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

mod common;

use common::harness;
use egui_kittest::kittest::Queryable;
use tautspan_gui::{Document, Prefs, TautspanApp};

fn roller_app() -> TautspanApp {
    let text = include_str!("../../../scenarios/roller-two-leg-pick.ron");
    let loaded = tautspan_core::model::load_scenario(text).unwrap_or_else(|e| panic!("{e}"));
    let mut app = TautspanApp::with_document(Document::new(loaded.dto, None), Prefs::default());
    app.files.native = false;
    app
}

#[test]
fn results_table_and_inspectors_show_the_parts() {
    let mut h = harness(roller_app());
    // the results table (the default lower tab), sorted by utilisation, has
    // the weakest parts at the top: the beam clamps
    h.get_by_label("Utilisation").click();
    h.run();
    assert!(h.query_all_by_label("beam-north/beam clamp").count() >= 1, "the beam clamp's rows");
    // the member inspector lists the member's parts with their utilisation
    h.state_mut().selection = tautspan_gui::Selection::Member("hoist".to_string());
    h.run();
    assert!(h.query_by_label_contains("Rated parts").is_some());
    assert!(h.query_by_label_contains("hoist (hoist): ").is_some());
    assert!(h.query_by_label_contains("eye bolt (eye bolt): ").is_some());
    assert!(h.query_by_label_contains("sling angle 90.0° from horizontal").is_some());
    // a node's part: the beam clamp at its anchor, with the anchor's rating
    h.query_all_by_label("beam-north/beam clamp").next().unwrap().click();
    h.run();
    assert_eq!(h.state().selection, tautspan_gui::Selection::Node("beam-north".to_string()));
    assert!(h.query_by_label_contains("beam clamp (fitting): ").is_some());
    assert!(h.query_by_label_contains("anchor (anchor): ").is_some());
}
