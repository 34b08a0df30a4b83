//! One rendered picture of the app, where a picture is the point: the test
//! bridle in the deflected view (×100), colours by utilisation, the caption
//! and the legend, at 960 × 600. Runs with `--features snapshot`; it needs a
//! wgpu adapter (a software one such as lavapipe will do) and skips, saying
//! so, when the machine has none. Regenerate the image after a deliberate
//! change with `UPDATE_SNAPSHOTS=1 cargo test -p tautspan-gui --features
//! snapshot --test snapshot`.

#![cfg(feature = "snapshot")]
#![allow(clippy::expect_used, clippy::unwrap_used, reason = "tests")]

mod common;

use egui_kittest::Harness;
use egui_kittest::wgpu::WgpuTestRenderer;
use tautspan_gui::TautspanApp;

/// A renderer on the first adapter wgpu finds, or `None` when it finds none
/// (the renderer's constructor panics then; the panic is caught here).
fn renderer() -> Option<WgpuTestRenderer> {
    let hook = std::panic::take_hook();
    std::panic::set_hook(Box::new(|_| {}));
    let r = std::panic::catch_unwind(WgpuTestRenderer::new).ok();
    std::panic::set_hook(hook);
    r
}

#[test]
fn the_deflected_bridle_looks_as_it_did() {
    let Some(renderer) = renderer() else {
        // CI installs lavapipe and must not skip
        assert!(
            std::env::var_os("TAUTSPAN_REQUIRE_WGPU").is_none(),
            "no wgpu adapter, and TAUTSPAN_REQUIRE_WGPU is set (install mesa-vulkan-drivers)"
        );
        eprintln!(
            "SKIPPED the_deflected_bridle_looks_as_it_did: no wgpu adapter on this machine (install mesa-vulkan-drivers for lavapipe)"
        );
        return;
    };
    let mut app = common::demo_app();
    app.view.deflected = true;
    app.prefs.hide_labels = false;
    let mut h = Harness::builder().with_size([960.0, 600.0]).renderer(renderer).build_ui_state(
        |ui, app: &mut TautspanApp| {
            app.frame(ui);
            assert!(app.wait_for_results(), "the solve worker answers within a minute");
        },
        app,
    );
    h.run();
    // the solve time in the status bar is the one thing that varies run to run
    h.state_mut().derived.solve_ms = 1.0;
    h.run();
    h.snapshot("deflected_bridle");
}
