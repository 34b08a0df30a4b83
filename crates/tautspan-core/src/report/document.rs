//! The whole report as one self-contained HTML5 document: inline CSS and
//! SVG, no scripts, no fonts or images fetched, every user text escaped.

use super::assumptions::assumptions;
use super::cases::cases;
use super::comparison::comparison;
use super::drawing::{drawing, plan_drawing};
use super::escape::escape;
use super::header::{caution, title_block, verdict};
use super::inputs_members::members;
use super::inputs_other::{floors, masses, nodes};
use super::legend::legend;
use super::source_file::SourceFile;
use super::style::CSS;
use super::unit_system::UnitSystem;
use super::warnings::warnings;
use crate::analysis::Analysis;
use crate::model::Scenario;

/// The report in SI units (kN, m, mm). `date` is printed as given (the
/// caller chooses its form, e.g. `2025-03-14`), which keeps the report a
/// pure function of its inputs.
pub fn html(scenario: &Scenario, analysis: &Analysis, date: &str) -> String {
    html_with_units(scenario, analysis, date, UnitSystem::Si)
}

/// The report in the chosen units.
pub fn html_with_units(scenario: &Scenario, analysis: &Analysis, date: &str, units: UnitSystem) -> String {
    html_for_file(scenario, analysis, date, units, None)
}

/// The report in the chosen units, naming the scenario file it was made
/// from with its SHA-256 (and the file's revision, when it gives one).
pub fn html_for_file(
    scenario: &Scenario,
    analysis: &Analysis,
    date: &str,
    units: UnitSystem,
    source: Option<&SourceFile>,
) -> String {
    let title = if scenario.title.trim().is_empty() { "Load-path check" } else { scenario.title.trim() };
    let body = [
        title_block(scenario, analysis, date, units, source),
        caution(analysis),
        verdict(analysis),
        layout(scenario, analysis, units),
        comparison(scenario, analysis, units),
        warnings(analysis),
        cases(scenario, analysis, units),
        inputs(scenario, analysis, units),
        assumptions(scenario, analysis, units),
        closing(analysis),
    ]
    .concat();
    format!(
        "<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n\
         <meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n\
         <meta name=\"generator\" content=\"Tautspan {}\">\n<title>{} – load-path check</title>\n\
         <style>{CSS}</style>\n</head>\n<body>\n{body}\n</body>\n</html>\n",
        env!("CARGO_PKG_VERSION"),
        escape(title)
    )
}

fn layout(scenario: &Scenario, analysis: &Analysis, units: UnitSystem) -> String {
    let (svg, caption) = drawing(scenario, analysis, units);
    let plan = plan_drawing(scenario, analysis, units)
        .map(|(svg, caption)| format!("<figure class=\"plan\">{svg}<figcaption>{caption}</figcaption></figure>"))
        .unwrap_or_default();
    format!(
        "<section id=\"layout\"><h2>Layout</h2><figure>{svg}{}<figcaption>{caption}</figcaption></figure>{plan}</section>",
        legend(scenario.near_limit)
    )
}

fn inputs(scenario: &Scenario, analysis: &Analysis, units: UnitSystem) -> String {
    format!(
        "<section id=\"inputs\" class=\"page-start\"><h2>Inputs</h2>{}{}{}{}{}</section>",
        members(scenario, analysis, units),
        super::parts::parts_inputs(scenario, units),
        floors(scenario, units),
        masses(scenario, units),
        nodes(scenario, analysis, units)
    )
}

fn closing(analysis: &Analysis) -> String {
    format!(
        "<section id=\"closing\"><h2>Caution</h2>{}\
         <div class=\"signoff\"><div>Prepared by</div><div>Checked by (competent person)</div><div>Date and signature</div></div>\
         <footer>Produced by Tautspan {} from the scenario and its analysis; every figure above comes from that analysis.</footer></section>",
        caution(analysis),
        env!("CARGO_PKG_VERSION")
    )
}
