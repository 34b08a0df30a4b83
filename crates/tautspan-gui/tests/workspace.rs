//! The app as a planner's workspace: warnings most serious first, the
//! canvas coloured by each member's worst case, the results grid with its
//! filters and CSV export, the plots' defaults.

mod common;

use common::{click, harness};
use egui_kittest::kittest::{NodeT, Queryable};

#[test]
fn warnings_list_overloads_first_and_advisories_after_them() {
    // the built-in demo: in the 20 mm snatch the drop line is over (218.5 %
    // in `tautspan check`), the two hoists over their WLL, and three members
    // far above their static force (an advisory)
    let h = harness(common::builtin_demo_app());
    let solved = h.state().derived.solved.clone().unwrap_or_else(|| panic!("solved"));
    let over: usize =
        solved.warning_groups.iter().filter(|(_, g)| g.kind.key().ends_with("_over")).map(|(_, g)| g.count).sum();
    assert!(over >= 3, "drop line and two hoists: {over}");
    assert!(
        h.query_by_label_contains(&format!("{over} over")).is_some(),
        "the counts by severity are shown above the list"
    );
    // top to bottom as drawn
    let mut shown: Vec<(f32, String)> = h
        .query_all_by_label_contains("[snatch-20mm]")
        .filter_map(|n| Some((n.rect().top(), n.accesskit_node().label()?)))
        .collect();
    shown.sort_by(|a, b| a.0.total_cmp(&b.0));
    let texts: Vec<String> = shown.into_iter().map(|(_, t)| t).collect();
    assert!(!texts.is_empty());
    let first_note = texts.iter().position(|t| t.starts_with("note ")).unwrap_or_else(|| panic!("{texts:?}"));
    let last_over = texts.iter().rposition(|t| t.starts_with("OVER ")).unwrap_or_else(|| panic!("{texts:?}"));
    assert!(last_over < first_note, "every overload above every advisory: {texts:?}");
    assert!(texts.iter().any(|t| t.starts_with("OVER [snatch-20mm] member drop-line")), "{texts:?}");
    assert!(texts.iter().any(|t| t.starts_with("note [snatch-20mm] 3 members far above their static force")));
}

#[test]
fn the_worst_case_colouring_is_a_toggle_kept_in_the_preferences() {
    let mut h = harness(common::builtin_demo_app());
    assert!(!h.state().prefs.worst_case_colours, "off by default: the canvas shows the case chosen");
    click(&mut h, "Worst case colours");
    assert!(h.state().prefs.worst_case_colours);
    assert!(!h.state().doc.dirty, "a display choice, not an edit");
    click(&mut h, "Worst case colours");
    assert!(!h.state().prefs.worst_case_colours);
}
