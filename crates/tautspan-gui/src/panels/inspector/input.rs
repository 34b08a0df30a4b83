//! What the inspector's sections are given, and the problems of a whole
//! item shown at its top; shared by every section of the inspector.

use crate::document::Document;
use crate::document::derived::Derived;
use crate::document::selection::Selection;
use crate::fields::qty_field::ERROR;
use crate::fields::units_display::UnitSystem;
use egui::{RichText, Ui};

/// Everything the inspector reads.
pub struct InspectorInput<'a> {
    /// The document.
    pub doc: &'a Document,
    /// Its analysis.
    pub derived: &'a Derived,
    /// The selection.
    pub selection: &'a Selection,
    /// The case shown.
    pub case: Option<&'a str>,
    /// Display units.
    pub units: UnitSystem,
}

/// Problems of a whole item (not of one field) shown at its top.
pub fn item_problems(ui: &mut Ui, derived: &Derived, path: &str) {
    for p in derived.problems.iter().filter(|p| p.path == path) {
        ui.label(RichText::new(&p.message).color(ERROR).small());
    }
}
