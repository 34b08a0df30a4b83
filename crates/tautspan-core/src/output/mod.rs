//! The command line's output formats: text, JSON and CSV of an analysis.

mod csv;
mod json;
mod text;

pub use csv::{
    HEADER as CSV_HEADER, caution_line as csv_caution_line, check_csv_rows, field as csv_field, write_csv_rows,
};
pub use json::{check_json, write_check_json};
pub use text::{check_text, comparison_text, table};
