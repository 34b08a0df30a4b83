//! Writing a scenario's file types back to RON text, in the same layout a
//! person would write by hand, with every quantity in the unit it was given.

use super::dto::ScenarioDto;
use super::read::ron_options;
use ron::ser::PrettyConfig;

/// Write a scenario as RON text.
pub fn write_scenario_text(dto: &ScenarioDto) -> Result<String, ron::Error> {
    let pretty = PrettyConfig::new()
        .depth_limit(3)
        .indentor("    ".to_string())
        .separate_tuple_members(false)
        .struct_names(true);
    let body = ron_options().to_string_pretty(dto, pretty)?;
    Ok(format!("// Tautspan scenario, format {}\n{body}\n", dto.format))
}
