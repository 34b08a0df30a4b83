//! Reading a scenario file's text into its file types, with located errors.
//! Order: size cap, format number, full parse; validation into the model
//! follows in `crate::model` and is located with the same index.

use super::dto::ScenarioDto;
use super::error::{FileError, FileErrors};
use super::locate::{Location, MAX_NESTING, SpanIndex};
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
    // an empty text has no place of its own: its start
    let location = index.locate(path).or(Some(Location { line: 1, column: 1 }));
    FileError { file: None, location, field: Some(path.to_string()), message }
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
    if let Some(at) = super::nesting::too_deep(text) {
        return Err(FileErrors(vec![FileError {
            file: None,
            location: Some(at),
            field: None,
            message: format!(
                "brackets nested more than {MAX_NESTING} deep; a scenario nests about 6 deep (Scenario, a list, an item, its fields)"
            ),
        }]));
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
        Ok(dto) if FORMATS_READ.contains(&dto.format) => {
            let over = super::caps::over_caps(&dto);
            if over.is_empty() {
                Ok((dto, index))
            } else {
                Err(FileErrors(over.into_iter().map(|(field, message)| located(&index, field, message)).collect()))
            }
        }
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
                            format!(
                                "missing field `format` in Scenario; this build reads format {}: add `format: {FORMAT_WRITTEN},` as its first field",
                                list(FORMATS_READ)
                            ),
                        )]));
                    }
                    Some(n) if !FORMATS_READ.iter().any(|&f| i64::from(f) == n) => return Err(unreadable(n)),
                    Some(_) => {}
                }
            }
            let at = Location { line: e.span.start.line.max(1), column: e.span.start.col.max(1) };
            if let ron::Error::MissingStructField { field, outer } = &e.code {
                // ron reports a missing field at the struct's closing
                // bracket; name the struct and place the error at its opening
                let open = index.opening_of(at).unwrap_or(at);
                let path = index.path_at(open).map_or_else(|| field.to_string(), |p| format!("{p}.{field}"));
                let outer = outer.as_deref().unwrap_or("this item");
                return Err(FileErrors(vec![FileError {
                    file: None,
                    location: Some(open),
                    field: Some(path),
                    message: format!(
                        "missing field `{field}` in {outer} (the {outer} opening here, closing at line {} column {})",
                        at.line, at.column
                    ),
                }]));
            }
            // ron's span for a value error covers the value; name the field there
            let field = index.path_at(at);
            Err(FileErrors(vec![FileError { file: None, location: Some(at), field, message: ron_message(&e.code) }]))
        }
    }
}

fn list(formats: &[u32]) -> String {
    formats.iter().map(u32::to_string).collect::<Vec<_>>().join(", ")
}
