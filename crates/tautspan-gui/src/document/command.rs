//! What panels ask the app to do. Panels draw and return commands; the app
//! applies them after the frame, so the document never changes mid-draw.

use crate::document::selection::{Selection, Tool};
use std::path::PathBuf;
use tautspan_core::file::ScenarioDto;

/// An edit of the document; may return a new selection (the placed item).
pub type EditFn = Box<dyn FnOnce(&mut ScenarioDto) -> Option<Selection>>;

/// A request from a panel.
pub enum Command {
    /// Change the scenario. Edits with the same `merge_key` in a row make one undo step.
    Edit {
        /// Edits with the same key in a row merge into one undo step.
        merge_key: Option<String>,
        /// The change.
        apply: EditFn,
    },
    /// End the current merged undo step (a drag or a text edit finished).
    SealUndo,
    /// Select something.
    Select(Selection),
    /// Choose a canvas tool.
    SetTool(Tool),
    /// Undo one edit.
    Undo,
    /// Redo one edit.
    Redo,
    /// Delete the selection (asks first when other items go with it).
    DeleteSelection,
    /// Delete this item and what goes with it, in one undo step (the answer to the question).
    ConfirmDelete(Selection),
    /// Cancel the tool in progress, then the selection.
    Escape,
    /// Place the rope routed so far with the rope tool.
    FinishRope,
    /// Start a new scenario (asks first when there are unsaved changes).
    New,
    /// Open a file through the dialog (asks first when there are unsaved changes).
    Open,
    /// Open a given file (asks first when there are unsaved changes).
    OpenPath(PathBuf),
    /// Save to the current file, or ask where.
    Save,
    /// Save under a new name.
    SaveAs,
    /// Save to a given file.
    SaveTo(PathBuf),
    /// Export the report.
    ExportReport,
    /// Export this CSV text (the results grid as shown).
    ExportCsv(String),
    /// Show this case on the canvas.
    ShowCase(String),
    /// Fit the drawing to the canvas.
    FitView,
    /// Close the app (asks first when there are unsaved changes).
    Quit,
}

impl Command {
    /// An edit without merging.
    pub fn edit(apply: impl FnOnce(&mut ScenarioDto) + 'static) -> Command {
        Command::Edit {
            merge_key: None,
            apply: Box::new(move |d| {
                apply(d);
                None
            }),
        }
    }

    /// An edit that merges with the previous edit of the same key.
    pub fn edit_merged(key: impl Into<String>, apply: impl FnOnce(&mut ScenarioDto) + 'static) -> Command {
        Command::Edit {
            merge_key: Some(key.into()),
            apply: Box::new(move |d| {
                apply(d);
                None
            }),
        }
    }

    /// An edit that selects what it placed.
    pub fn place(apply: impl FnOnce(&mut ScenarioDto) -> Selection + 'static) -> Command {
        Command::Edit { merge_key: None, apply: Box::new(move |d| Some(apply(d))) }
    }
}
