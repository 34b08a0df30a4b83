//! The command line's output formats: text, JSON and CSV of an analysis.

mod csv;
mod json;
mod text;

pub use csv::{
    HEADER as CSV_HEADER, caution_line as csv_caution_line, check_csv_rows, field as csv_field,
    header_in as csv_header_in, write_csv_rows, write_csv_rows_in,
};
pub use json::{check_json, write_check_json};
pub use text::{check_text, check_text_in, comparison_text, comparison_text_in, table};
