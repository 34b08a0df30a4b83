//! The document folder: what the user made and what is derived from it.
//! `Document` (here), `command` (what the panels ask for), `edits` (the
//! edits themselves), `placing` (nodes placed and moved in x, y and z), `undo`, `rename` (ids renamed with every reference),
//! `selection`; answers come from `solve_worker` (one thread re-solving off
//! the UI thread) into `derived` (the results shown, with each case's line
//! in `case_summary`), through `core_bridge`,
//! the only door to `tautspan_core`'s analysis.
//!
//! The document the app edits: the scenario's file types (quantities as the
//! user typed them), the file it came from, the dirty flag, the revision
//! that tells derived results when to recompute, and undo/redo.

pub(crate) mod case_summary;
pub(crate) mod command;
pub mod core_bridge;
pub(crate) mod derived;
pub(crate) mod edits;
pub(crate) mod envelope;
pub(crate) mod placing;
pub(crate) mod rename;
pub(crate) mod selection;
pub(crate) mod solve_worker;
pub(crate) mod undo;

use crate::document::undo::UndoStack;
use std::path::PathBuf;
use std::sync::Arc;
use tautspan_core::file::ScenarioDto;

/// An open scenario.
#[derive(Debug, Clone, Default)]
pub struct Document {
    /// The scenario as written. Shared with the solve worker, which takes a
    /// reference instead of a copy; an edit copies it only if the worker
    /// still holds the revision being replaced.
    pub dto: Arc<ScenarioDto>,
    /// Where it is saved, if anywhere.
    pub path: Option<PathBuf>,
    /// Changed since opened or saved.
    pub dirty: bool,
    /// Bumped on every change; derived results follow it.
    pub revision: u64,
    /// Undo and redo.
    pub undo: UndoStack,
}

impl Document {
    /// A document on a scenario, clean, with no history.
    pub fn new(dto: ScenarioDto, path: Option<PathBuf>) -> Document {
        Document { dto: Arc::new(dto), path, dirty: false, revision: 1, undo: UndoStack::default() }
    }

    /// Replace the scenario with an opened or new one (history cleared).
    pub fn replace(&mut self, dto: ScenarioDto, path: Option<PathBuf>) {
        self.dto = Arc::new(dto);
        self.path = path;
        self.dirty = false;
        self.revision += 1;
        self.undo.clear();
    }

    /// Apply an edit, recording the state before it for undo.
    pub fn edit(&mut self, merge_key: Option<&str>, apply: impl FnOnce(&mut ScenarioDto)) {
        if self.undo.merges(merge_key) {
            // the undo step already holds the state before this run of edits:
            // no copy of the whole scenario per drag step or keystroke
            apply(Arc::make_mut(&mut self.dto));
            self.undo.record_merged();
            self.dirty = true;
            self.revision += 1;
            return;
        }
        let before: ScenarioDto = (*self.dto).clone();
        apply(Arc::make_mut(&mut self.dto));
        if *self.dto != before {
            self.undo.record(&before, merge_key);
            self.dirty = true;
            self.revision += 1;
        }
    }

    /// Step back one edit.
    pub fn undo(&mut self) -> bool {
        match self.undo.undo(&self.dto) {
            Some(prev) => {
                self.dto = Arc::new(prev);
                self.dirty = true;
                self.revision += 1;
                true
            }
            None => false,
        }
    }

    /// Step forward one edit.
    pub fn redo(&mut self) -> bool {
        match self.undo.redo(&self.dto) {
            Some(next) => {
                self.dto = Arc::new(next);
                self.dirty = true;
                self.revision += 1;
                true
            }
            None => false,
        }
    }

    /// The file name shown in the title ("untitled" before the first save).
    pub fn display_name(&self) -> String {
        match self.path.as_ref().and_then(|p| p.file_name()) {
            Some(n) => n.to_string_lossy().into_owned(),
            // not saved yet: the scenario's own title (the demo's, a new rig's)
            None if !self.dto.title.trim().is_empty() => self.dto.title.trim().to_string(),
            None => "untitled".to_string(),
        }
    }

    /// Where "save as" starts: the file itself, or a name made from the
    /// title in the working folder.
    pub fn save_path_suggestion(&self) -> PathBuf {
        if let Some(p) = &self.path {
            return p.clone();
        }
        let slug: String = self
            .dto
            .title
            .chars()
            .map(|c| if c.is_alphanumeric() { c.to_ascii_lowercase() } else { '-' })
            .collect::<String>()
            .split('-')
            .filter(|s| !s.is_empty())
            .take(6)
            .collect::<Vec<_>>()
            .join("-");
        let name = if slug.is_empty() { "scenario".to_string() } else { slug };
        std::env::current_dir().unwrap_or_default().join(format!("{name}.ron"))
    }

    /// The window title: file name, a dirty marker, the app name.
    pub fn title(&self) -> String {
        format!("{}{} — Tautspan", self.display_name(), if self.dirty { " •" } else { "" })
    }
}

/// A new, empty scenario the user can build from nothing.
pub fn blank_scenario() -> ScenarioDto {
    ScenarioDto {
        format: tautspan_core::file::FORMAT_WRITTEN,
        title: "New rig".to_string(),
        cases: vec![tautspan_core::file::CaseDto::Static { id: "hanging".to_string() }],
        ..ScenarioDto::default()
    }
}
