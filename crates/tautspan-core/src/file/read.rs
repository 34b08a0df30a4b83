//! Reading a scenario file's text into its file types, with located errors.
//! Order: size cap, format number, full parse; validation into the model
//! follows in `crate::model` and is located with the same index.

use super::dto::ScenarioDto;
use super::error::{FileError, FileErrors};
use super::locate::{Location, SpanIndex};
use super::type_words::type_words;
use ron::extensions::Extensions;
use serde::Deserialize;

/// The format numbers this build reads.
pub const FORMATS_READ: &[u32] = &[1];

/// The format number this build writes.
pub const FORMAT_WRITTEN: u32 = 1;

/// Largest scenario file accepted, bytes (16 MiB: a 10,000-member net is
/// about 2 MiB).
pub const MAX_FILE_BYTES: u64 = 16 * 1024 * 1024;

/// The RON options used to read and write scenarios: `Option` fields may be
/// written bare (`design_factor: 5.0`), and nesting is limited so that a
/// hostile file cannot exhaust the stack.
pub fn ron_options() -> ron::Options {
    ron::Options::default().with_default_extension(Extensions::IMPLICIT_SOME).with_recursion_limit(64)
}

#[derive(Deserialize)]
#[serde(rename = "Scenario")]
struct FormatProbe {
    format: Option<i64>,
}

fn located(index: &SpanIndex, path: &str, message: String) -> FileError {
    FileError { file: None, location: index.locate(path), field: Some(path.to_string()), message }
}

/// The reason text of a ron error, reworded where ron's own is terse.
fn ron_message(code: &ron::Error) -> String {
    use ron::Error as E;
    match code {
        // ron names the Rust type it was reading: say what it is in words
        E::NoSuchStructField { expected, found, outer } => {
            let outer = outer.as_deref().map_or_else(|| "this item".to_string(), |o| format!("a {}", type_words(o)));
            format!("unknown field `{found}` in {outer}; the fields are {}", expected.join(", "))
        }
        E::MissingStructField { field, outer } => {
            let outer = outer.as_deref().map_or_else(|| "this item".to_string(), |o| format!("a {}", type_words(o)));
            format!("missing field `{field}` in {outer}")
        }
        E::DuplicateStructField { field, outer } => {
            let outer = outer.as_deref().map_or_else(|| "this item".to_string(), |o| format!("a {}", type_words(o)));
            format!("field `{field}` given twice in {outer}")
        }
        E::NoSuchEnumVariant { expected, found, outer } => {
            let outer = outer.as_deref().map_or_else(|| "value here".to_string(), type_words);
            format!("`{found}` is not a valid {outer}; write one of {}", expected.join(", "))
        }
        other => other.to_string(),
    }
}

/// Parse a scenario's text. Every error carries a line and column, and the
/// field where the scanner can tell.
pub fn parse_scenario_text(text: &str) -> Result<(ScenarioDto, SpanIndex), FileErrors> {
    if text.len() as u64 > MAX_FILE_BYTES {
        return Err(FileErrors(vec![FileError::new(format!(
            "file is {:.1} MiB; the cap is {} MiB for a scenario file",
            text.len() as f64 / 1_048_576.0,
            MAX_FILE_BYTES / 1_048_576
        ))]));
    }
    let index = SpanIndex::scan(text);
    let opts = ron_options();
    let unreadable = |n: i64| {
        FileErrors(vec![located(
            &index,
            "format",
            format!("format {n} is not one this build reads; it reads format {}", list(FORMATS_READ)),
        )])
    };
    match opts.from_str::<ScenarioDto>(text) {
        Ok(dto) if FORMATS_READ.contains(&dto.format) => Ok((dto, index)),
        Ok(dto) => Err(unreadable(i64::from(dto.format))),
        Err(e) => {
            // The format number first, so a newer file is refused for what
            // it is rather than for a field this build does not know (only
            // read again when the file does not parse: one pass otherwise).
            if let Ok(probe) = opts.from_str::<FormatProbe>(text) {
                match probe.format {
                    None => {
                        return Err(FileErrors(vec![located(
                            &index,
                            "format",
                            format!("missing field `format`; this build reads format {}", list(FORMATS_READ)),
                        )]));
                    }
                    Some(n) if !FORMATS_READ.iter().any(|&f| i64::from(f) == n) => return Err(unreadable(n)),
                    Some(_) => {}
                }
            }
            let at = Location { line: e.span.start.line.max(1), column: e.span.start.col.max(1) };
            // ron's span for a value error covers the value; name the field there
            let field = index.path_at(at).map(str::to_string);
            Err(FileErrors(vec![FileError { file: None, location: Some(at), field, message: ron_message(&e.code) }]))
        }
    }
}

fn list(formats: &[u32]) -> String {
    formats.iter().map(u32::to_string).collect::<Vec<_>>().join(", ")
}
