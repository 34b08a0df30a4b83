//! Tautspan's desktop app: lay out anchors, joints, members, floor slabs
//! and masses on an elevation, see every member's force against its
//! allowable for each case, compare the cases, and save the scenario file.
//! All numbers come from `tautspan_core`; this crate draws and edits.

mod app;
mod canvas;
mod document;
mod fields;
mod files;
mod panels;

pub use document::core_bridge;
pub use files::recovery;

pub use app::{Message, Pending, TautspanApp};
pub use canvas::view::{View, ViewKind};
pub use document::command::Command;
pub use document::selection::{Selection, Tool};
pub use document::{Document, blank_scenario};
pub use fields::units_display::{Shown, UnitSystem};
pub use files::prefs::Prefs;

use std::path::PathBuf;

pub use files::recovery::text_of as recovery_text;

/// The ids of the results grid's rows, sorted by item then case, with its
/// two filters ("over / near / unchecked only", "worst case per item").
pub fn results_rows(a: &tautspan_core::analysis::Analysis, problems_only: bool, worst_per_item: bool) -> Vec<String> {
    let filter = panels::results_rows::Filter { problems_only, worst_per_item };
    panels::results_rows::rows(a, filter, panels::results_rows::Sort::default())
        .into_iter()
        .map(|r| r.id.into_owned())
        .collect()
}

/// The demo scenario the app opens when no file is given.
pub const DEMO_SCENARIO: &str = include_str!("../../../scenarios/gantry-swing.ron");

/// The message when there is no display to open a window on.
pub const NO_DISPLAY: &str = "no display found; use `tautspan check FILE` for the command line";

fn display_available() -> bool {
    if !cfg!(target_os = "linux") {
        return true;
    }
    ["DISPLAY", "WAYLAND_DISPLAY", "WAYLAND_SOCKET"].iter().any(|v| std::env::var_os(v).is_some_and(|s| !s.is_empty()))
}

/// Open the app on `file`, or on the built-in demo scenario when `None`.
///
/// # Errors
/// When there is no display, or the window system cannot start.
pub fn run(file: Option<PathBuf>) -> Result<(), String> {
    if !display_available() {
        return Err(NO_DISPLAY.to_string());
    }
    let options = eframe::NativeOptions {
        viewport: egui::ViewportBuilder::default()
            .with_title("Tautspan")
            .with_inner_size([1400.0, 880.0])
            .with_min_inner_size([800.0, 520.0]),
        ..eframe::NativeOptions::default()
    };
    eframe::run_native(
        "Tautspan",
        options,
        Box::new(move |cc| {
            let prefs =
                cc.storage.and_then(|s| eframe::get_value::<Prefs>(s, files::prefs::STORAGE_KEY)).unwrap_or_default();
            Ok(Box::new(TautspanApp::start(file, prefs)))
        }),
    )
    .map_err(|e| {
        let text = e.to_string();
        if text.to_ascii_lowercase().contains("display") {
            format!("{NO_DISPLAY} ({text})")
        } else {
            format!("the window could not open: {text}")
        }
    })
}
