//! The printable report: one self-contained HTML file (inline CSS and SVG,
//! nothing fetched) with the title, date, caution, a drawing of the layout,
//! the comparison, per-case details, warnings, inputs and assumptions. The
//! CLI's `report` command and the GUI's export both call [`html`].

mod assumptions;
mod cases;
mod comparison;
mod date;
mod dimensions;
mod document;
mod drawing;
mod escape;
mod geometry;
mod header;
mod inputs_members;
mod inputs_other;
mod legend;
mod marks;
mod parts;
mod ramp;
mod scale_bar;
mod source_file;
mod style;
mod symbols;
mod table;
mod unit_system;
mod warnings;

pub use date::civil_date;
pub use document::{html, html_for_file, html_with_units};
pub use escape::escape;
pub use source_file::SourceFile;
pub use unit_system::{Columns, SHORT_TON_KG, UnitSystem};
