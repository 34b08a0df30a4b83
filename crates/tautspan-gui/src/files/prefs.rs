//! The preferences kept between runs with eframe's storage: display units,
//! recent files, which lower tab is shown. Panel sizes persist with egui's
//! own memory, which eframe saves alongside.

use crate::fields::units_display::UnitSystem;
use serde::{Deserialize, Serialize};
use std::path::PathBuf;

/// Key under which the preferences are stored.
pub const STORAGE_KEY: &str = "tautspan-prefs";

/// Most recent files listed.
const RECENT_MAX: usize = 8;

/// The lower panel's tabs.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, Serialize, Deserialize)]
pub enum LowerTab {
    /// Members × cases.
    #[default]
    Results,
    /// Peak force against release angle, time history.
    Plots,
}

/// Preferences kept between runs.
#[derive(Debug, Clone, PartialEq, Default, Serialize, Deserialize)]
#[serde(default)]
pub struct Prefs {
    /// SI or US customary.
    pub units: UnitSystem,
    /// Recently opened or saved files, newest first.
    pub recent: Vec<PathBuf>,
    /// The lower panel's tab.
    pub lower_tab: LowerTab,
    /// Draw force labels on the canvas.
    pub hide_labels: bool,
    /// Colour the canvas's members by their worst case over all cases.
    pub worst_case_colours: bool,
}

impl Prefs {
    /// Put a file at the top of the recent list.
    pub fn remember(&mut self, path: &std::path::Path) {
        self.recent.retain(|p| p != path);
        self.recent.insert(0, path.to_path_buf());
        self.recent.truncate(RECENT_MAX);
    }
}
