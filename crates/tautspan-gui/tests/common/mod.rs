//! Shared helpers of the app tests: a harness on the whole app, clicks at
//! world positions on the canvas, typing into a labelled field.

#![allow(dead_code)]

use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use tautspan_gui::{Document, Prefs, TautspanApp, blank_scenario};

/// A harness on the whole app. After each frame it waits for the solve
/// worker's answer to the current revision, so every test step sees the
/// results of what it just did (the app itself never waits). The worker's
/// answer asks for a repaint of its own, which can land a frame after the
/// one that waited for it: a few more steps than kittest's default 4 let
/// the app settle without making a test depend on thread timing.
pub fn harness(app: TautspanApp) -> Harness<'static, TautspanApp> {
    let mut h = Harness::builder().with_size([1400.0, 900.0]).with_max_steps(16).build_ui_state(
        |ui, app: &mut TautspanApp| {
            app.frame(ui);
            assert!(app.wait_for_results(), "the solve worker answers within a minute");
        },
        app,
    );
    h.run();
    h
}

pub fn blank_app() -> TautspanApp {
    let mut app = TautspanApp::with_document(Document::new(blank_scenario(), None), Prefs::default());
    app.files.native = false;
    app
}

/// The app on the test bridle (tests/fixtures/bridle.ron): anchors A1, A2,
/// joints J1, J2, legs leg-west and leg-east, a chain drop, mass "load".
pub fn demo_app() -> TautspanApp {
    let loaded =
        tautspan_core::model::load_scenario(include_str!("../fixtures/bridle.ron")).unwrap_or_else(|e| panic!("{e}"));
    let mut app = TautspanApp::with_document(Document::new(loaded.dto, None), Prefs::default());
    app.files.native = false;
    app
}

/// The app on the built-in demo.
pub fn builtin_demo_app() -> TautspanApp {
    let mut app = TautspanApp::demo(Prefs::default());
    app.files.native = false;
    app
}

/// The primary button pressed or released at a screen point.
pub fn button(h: &mut Harness<'_, TautspanApp>, pos: egui::Pos2, pressed: bool) {
    h.event(egui::Event::PointerButton {
        pos,
        button: egui::PointerButton::Primary,
        pressed,
        modifiers: egui::Modifiers::NONE,
    });
}

/// Press at `from` and move to `to` in `steps` frames, the button held
/// (a drag under way: `release` ends it).
pub fn press_and_move(h: &mut Harness<'_, TautspanApp>, from: egui::Pos2, to: egui::Pos2, steps: u32) {
    h.event(egui::Event::PointerMoved(from));
    h.run();
    button(h, from, true);
    h.run();
    for k in 1..=steps {
        h.event(egui::Event::PointerMoved(from + (to - from) * (k as f32 / steps as f32)));
        h.run();
    }
}

/// Release the button at `at`, ending a drag.
pub fn release(h: &mut Harness<'_, TautspanApp>, at: egui::Pos2) {
    button(h, at, false);
    h.run();
}

/// Click the canvas at a world point (m).
pub fn click_world(h: &mut Harness<'_, TautspanApp>, x_m: f64, y_m: f64) {
    let p = h.state().view.to_screen(x_m, y_m);
    h.event(egui::Event::PointerMoved(p));
    h.run();
    button(h, p, true);
    button(h, p, false);
    h.run();
}

/// Replace the text of the text field labelled `label`.
pub fn type_into(h: &mut Harness<'_, TautspanApp>, label: &str, text: &str) {
    h.get_by_role_and_label(Role::TextInput, label).focus();
    h.run();
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::A);
    h.run();
    h.get_by_role_and_label(Role::TextInput, label).type_text(text);
    h.run();
}

/// Click a button by its exact label.
pub fn click(h: &mut Harness<'_, TautspanApp>, label: &str) {
    h.get_by_label(label).click();
    h.run();
}
