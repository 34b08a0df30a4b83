//! A strut in the member inspector: its Euler load and buckling resistance
//! are shown beside the force; its section is edited there, and without a
//! section the inspector says why the strut is unchecked.

mod common;

use common::{harness, type_into};
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tautspan_gui::{Document, Prefs, Selection, Shown, TautspanApp, UnitSystem};

fn mezzanine_app() -> TautspanApp {
    let text = include_str!("../../../scenarios/mezzanine-hoist.ron");
    let loaded = tautspan_core::model::load_scenario(text).unwrap_or_else(|e| panic!("{e}"));
    let mut app = TautspanApp::with_document(Document::new(loaded.dto, None), Prefs::default());
    app.files.native = false;
    app
}

/// Empty the text field labelled `label` (an optional field: cleared).
fn clear(h: &mut Harness<'_, TautspanApp>, label: &str) {
    h.get_by_role_and_label(Role::TextInput, label).focus();
    h.run();
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::A);
    h.run();
    h.key_press(egui::Key::Backspace);
    h.run();
    h.run();
}

// The mezzanine's 50 x 3 mm aluminium legs: N_cr = pi^2 x 70 GPa x
// 122 810 mm^4 / (2.85 m)^2 = 10.45 kN by hand (Timoshenko & Gere); the
// inspector shows the core's number in the display units.
#[test]
fn the_inspector_shows_a_struts_buckling_check() {
    let mut h = harness(mezzanine_app());
    h.state_mut().selection = Selection::Member("leg-a".to_string());
    h.run();
    let euler = h.state().derived.solved.as_ref().and_then(|s| s.analysis.cases[0].members[0].euler_n);
    let euler = euler.unwrap_or_else(|| panic!("Euler load of leg-a"));
    assert!(((euler - 10.45e3) / 10.45e3).abs() < 5e-3, "{euler}");
    let shown = format!("Euler load {}", UnitSystem::Si.fmt(euler, Shown::Force));
    assert!(h.query_by_label_contains(&shown).is_some(), "the inspector shows {shown}");

    // no wall: a solid round bar of the same outside diameter, far stiffer in buckling
    clear(&mut h, "Section wall");
    let section = h.state().doc.dto.members[0].section.clone();
    assert!(matches!(section, Some(tautspan_core::file::SectionDto::SolidRound { .. })), "{section:?}");
    let solid = h.state().derived.solved.as_ref().and_then(|s| s.analysis.cases[0].members[0].euler_n);
    assert!(solid.is_some_and(|e| e > 1.5 * euler), "{solid:?}");

    // no section at all: unchecked, and the inspector says why (the area
    // typed first agrees with the 50 mm solid's pi/4 x 50^2 = 1963.5 mm^2)
    type_into(&mut h, "Area", "1963.5 mm^2");
    clear(&mut h, "Section outside diameter");
    assert!(h.state().doc.dto.members[0].section.is_none());
    assert!(h.query_all_by_label_contains("section unknown").count() >= 1, "the reason is shown");
}
