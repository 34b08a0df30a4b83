//! What the canvas reads each frame: the document, its analysis, the case
//! shown, the selection, the tool and the display choices. Shared by the
//! canvas's tools and its drawing.

use crate::document::Document;
use crate::document::derived::Derived;
use crate::document::selection::{Selection, Tool};
use crate::fields::units_display::UnitSystem;

/// Everything the canvas reads.
pub struct CanvasInput<'a> {
    /// The document.
    pub doc: &'a Document,
    /// Its analysis.
    pub derived: &'a Derived,
    /// The case shown.
    pub case: Option<&'a str>,
    /// The selection.
    pub selection: &'a Selection,
    /// The tool.
    pub tool: Tool,
    /// Display units.
    pub units: UnitSystem,
    /// Draw force labels.
    pub labels: bool,
    /// Colour each member by its worst case over all cases, not the case shown.
    pub worst_case: bool,
}
