//! Text to validated scenario in one call, every problem located by line,
//! column and field.

use super::build::build;
use super::scenario::Scenario;
use crate::file::{FileError, FileErrors, ScenarioDto, SpanIndex, parse_scenario_text};

/// A scenario read from text: the file types as written (kept for saving
/// back unchanged) and the validated model.
#[derive(Debug, Clone)]
pub struct Loaded {
    /// The file types, as written.
    pub dto: ScenarioDto,
    /// The validated model.
    pub scenario: Scenario,
}

/// Parse and validate a scenario's text.
pub fn load_scenario(text: &str) -> Result<Loaded, FileErrors> {
    let (dto, index) = parse_scenario_text(text)?;
    match build(&dto) {
        Ok(scenario) => Ok(Loaded { dto, scenario }),
        Err(problems) => Err(locate_problems(&index, problems)),
    }
}

/// Attach line and column to validation problems.
pub fn locate_problems(index: &SpanIndex, problems: Vec<super::build::Problem>) -> FileErrors {
    FileErrors(
        problems
            .into_iter()
            .map(|p| FileError { file: None, location: index.locate(&p.path), field: Some(p.path), message: p.message })
            .collect(),
    )
}
