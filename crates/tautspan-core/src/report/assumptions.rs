//! The assumptions: gravity (in the report's units) and the scenario's thresholds
//! where the analysis does not state them itself, then every
//! assumption, formula and source the analysis lists.

use super::escape::escape;
use super::unit_system::{UnitSystem, number, percent};
use crate::analysis::Analysis;
use crate::model::Scenario;

/// The assumptions section.
pub fn assumptions(scenario: &Scenario, analysis: &Analysis, units: UnitSystem) -> String {
    let mut items =
        vec![format!("Gravity g = {}, acting downwards (−y).", units.acceleration(scenario.gravity_m_s2()))];
    let says = |word: &str| analysis.assumptions.iter().any(|a| a.to_ascii_lowercase().contains(word));
    if !says("near limit") {
        items.push(format!(
            "A member or floor is near its limit from a utilisation of {}.",
            percent(scenario.near_limit)
        ));
    }
    if !says("ratio warning") {
        items.push(format!(
            "A dynamic case is flagged when its force exceeds {} × the static force.",
            number(scenario.dynamic_ratio_warning)
        ));
    }
    // the analysis states g in SI; the report states it in its own units above
    items.extend(analysis.assumptions.iter().filter(|a| !a.starts_with("Gravity ")).map(|a| escape(a)));
    let list: String = items.iter().map(|i| format!("<li>{i}</li>")).collect();
    format!(
        "<section id=\"assumptions\"><h2>Assumptions, formulas and sources</h2><ul class=\"assumptions\">{list}</ul></section>"
    )
}
