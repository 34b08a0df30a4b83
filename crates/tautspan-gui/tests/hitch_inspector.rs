//! A choker sling bent over a pin in the member inspector: the hitch's mode
//! factor and the D/d efficiency are shown beside the force (they are edited
//! in the same inspector: tests/edit_parts.rs).

mod common;

use common::harness;
use egui_kittest::kittest::Queryable;
use tautspan_gui::{Document, Prefs, Selection, TautspanApp};

// A plumb wire rope, 16 mm, bent over a 160 mm pin (D/d 10 → 0.86, wire rope
// users' manuals curve, from memory) and choked (EN 13414-1 mode factor 0.8,
// from memory): the inspector shows both as the core found them.
#[test]
fn the_inspector_shows_the_hitch_and_the_bend() {
    let text = r#"Scenario(format: 1, title: "choker",
        nodes: [ Node(id: "A", at: ("0 m", "5 m"), support: Anchor), Node(id: "M", at: ("0 m", "1 m")) ],
        members: [ Member(id: "line", ends: ("A", "M"), kind: WireRope, area: "100 mm^2", modulus: "100 GPa",
                          rating: BreakingStrength("100 kN"), termination: FerruleSecured, diameter: "16 mm",
                          bent_over: "160 mm", hitch: Choker) ],
        masses: [ Mass(id: "load", at: "M", mass: "100 kg") ],
        cases: [ Static(id: "s") ])"#;
    let loaded = tautspan_core::model::load_scenario(text).unwrap_or_else(|e| panic!("{e}"));
    let mut app = TautspanApp::with_document(Document::new(loaded.dto, None), Prefs::default());
    app.files.native = false;
    let mut h = harness(app);
    h.state_mut().selection = Selection::Member("line".to_string());
    h.run();
    assert!(h.query_by_label_contains("Hitch mode factor 0.800").is_some(), "the mode factor is shown");
    assert!(h.query_by_label_contains("D/d efficiency 0.860").is_some(), "the bend is shown");
}
