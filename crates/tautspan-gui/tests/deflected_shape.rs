//! The deflected shape as a user meets it: a toolbar switch redraws the
//! canvas at the core's solved positions with the displacements magnified,
//! says so on the canvas, and picks nodes where they are now drawn.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "tests")]

mod common;

use common::{click, click_world, demo_app, harness};
use egui::accesskit::Role;
use egui_kittest::kittest::Queryable;
use tautspan_gui::Selection;

#[test]
fn the_deflected_shape_draws_the_solved_positions_magnified() {
    let mut h = harness(demo_app());
    assert!(h.query_by_label_contains("exaggerated").is_none(), "no caption in the drawn view");

    // J2 is drawn at (0, 2) m; the core's solution of the first case moves it
    let solved = {
        let case = &h.state().derived.solved.as_ref().unwrap().analysis.cases[0];
        case.nodes.iter().find(|n| n.id == "J2").unwrap().position_m
    };
    let deflected = [100.0 * solved[0], 2.0 + 100.0 * (solved[1] - 2.0)];
    let view = h.state().view;
    let shift_pt = view.to_screen(deflected[0], deflected[1]).distance(view.to_screen(0.0, 2.0));
    // clear of the 9 pt node pick radius (canvas/mod.rs `hit`), with a margin
    assert!(shift_pt > 11.0, "×100 moves J2 clear of where it is drawn ({shift_pt} pt)");

    click(&mut h, "Deflected shape");
    assert!(h.state().view.deflected);
    assert!(
        h.query_by_label_contains("Deflected shape ×100, exaggerated · case hanging").is_some(),
        "the canvas says the shape is exaggerated and by how much"
    );
    click_world(&mut h, deflected[0], deflected[1]);
    assert_eq!(h.state().selection, Selection::Node("J2".to_string()), "J2 is picked where it is drawn deflected");

    // at ×1 the caption says true scale
    h.get_by_role_and_label(Role::ComboBox, "Magnification").click();
    h.run();
    click(&mut h, "×1");
    assert_eq!(h.state().view.magnification, 1);
    assert!(h.query_by_label_contains("true scale (×1)").is_some());
    assert!(h.query_by_label_contains("exaggerated").is_none());

    // back to the drawn view: no caption, and the point below J2 is no longer J2
    click(&mut h, "Deflected shape");
    assert!(h.query_by_label_contains("· case hanging").is_none(), "caption gone");
    h.state_mut().selection = Selection::None;
    click_world(&mut h, deflected[0], deflected[1]);
    assert_ne!(h.state().selection, Selection::Node("J2".to_string()), "J2 is back where it is drawn");
}
