//! The verdict a planner sees at once: always on screen, naming the worst
//! item and its case; a click selects it and shows that case; the scope
//! (what is and is not checked) one click away.

mod common;

use common::harness;
use egui_kittest::kittest::Queryable;
use tautspan_gui::Selection;

#[test]
fn the_verdict_bar_names_the_worst_item_and_selects_it() {
    // the built-in demo: the gantry's 20 mm snatch puts the drop line over
    let mut h = harness(common::builtin_demo_app());
    assert!(h.query_by_label_contains("Verdict: NOT WITHIN").is_some(), "the verdict is shown");
    let worst = h.get_by_label_contains("worst: member drop-line in case snatch-20mm");
    worst.click();
    h.run();
    assert_eq!(h.state().selection, Selection::Member("drop-line".into()));
    assert_eq!(h.state().shown_case.as_deref(), Some("snatch-20mm"));
    h.get_by_label("Scope: what is and is not checked").click();
    h.run();
    assert!(h.query_by_label_contains("Not checked (a competent person must)").is_some());
    assert!(h.query_by_label_contains("swing: every member over the whole arc").is_some());
}
