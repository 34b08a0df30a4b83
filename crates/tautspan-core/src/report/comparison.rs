//! The inspector's table: per member and floor, the allowable, each case's
//! force with its ratio to static and its utilisation (and state), the
//! governing case and the limits (largest release angle, largest drop
//! height), all as the analysis gives them.

use super::escape::escape;
use super::marks::state_in;
use super::ramp::colour;
use super::table::{NONE, table, with_note};
use super::unit_system::{UnitSystem, degrees, number, percent};
use crate::analysis::{Analysis, ComparisonRow, State};
use crate::model::Scenario;

/// The comparison section.
pub fn comparison(scenario: &Scenario, analysis: &Analysis, units: UnitSystem) -> String {
    if analysis.comparison.is_empty() {
        return section("<p>No comparison: the scenario has no members or floors with results.</p>".to_string());
    }
    let case_heads: Vec<String> = analysis
        .cases
        .iter()
        .map(|c| with_note(&escape(&c.id), &if c.id == c.kind { String::new() } else { escape(&c.kind) }))
        .collect();
    let mut head: Vec<&str> = vec!["Member, floor or rated part", "Allowable"];
    head.extend(case_heads.iter().map(String::as_str));
    head.extend(["Governing case", "Largest release angle", "Largest drop height"]);
    let rows: Vec<Vec<String>> = analysis.comparison.iter().map(|r| row(scenario, analysis, r, units)).collect();
    section(format!(
        "<p>Each case cell: force (tension positive; for a floor, the normal force), its ratio to the static force, and the utilisation (force ÷ allowable) with its state.</p>{}",
        table("comparison", &head, &rows)
    ))
}

fn section(body: String) -> String {
    format!("<section id=\"comparison\"><h2>Static and dynamic comparison</h2>{body}</section>")
}

fn row(scenario: &Scenario, analysis: &Analysis, r: &ComparisonRow, units: UnitSystem) -> Vec<String> {
    let what = match scenario.members.iter().find(|m| m.id == r.id) {
        Some(m) => m.kind.label(),
        None if scenario.floors.iter().any(|f| f.id == r.id) => "floor",
        None if r.id.contains('/') => "rated part",
        None => "",
    };
    let mut cells = vec![with_note(&format!("<b>{}</b>", escape(&r.id)), what), units.force(r.allowable_n)];
    for (i, case) in analysis.cases.iter().enumerate() {
        let force = r.force_n.get(i).copied().flatten();
        let ratio = r.ratio_to_static.get(i).copied().flatten();
        let util = r.utilisation.get(i).copied().flatten();
        cells.push(case_cell(force, ratio, util, state_in(case, &r.id), case.kind == "static", units));
    }
    cells.push(r.governing_case.as_deref().map_or_else(|| NONE.to_string(), escape));
    cells.push(r.limits.release_deg.map_or_else(|| NONE.to_string(), degrees));
    cells.push(r.limits.drop_height_m.map_or_else(|| NONE.to_string(), |h| units.length(h)));
    cells
}

fn case_cell(
    force: Option<f64>,
    ratio: Option<f64>,
    util: Option<f64>,
    state: Option<State>,
    is_static: bool,
    units: UnitSystem,
) -> String {
    let Some(force) = force else {
        return NONE.to_string();
    };
    let mut s = format!("<div class=\"cell-case\"><span>{}</span>", units.force(force));
    if let (Some(r), false) = (ratio, is_static) {
        s.push_str(&format!("<span>× {} static</span>", number(r)));
    }
    if let Some(u) = util {
        s.push_str(&format!("<span><i class=\"swatch\" style=\"background:{}\"></i>{}</span>", colour(u), percent(u)));
    }
    if let Some(state) = state {
        s.push_str(&state_word(state));
    }
    s.push_str("</div>");
    s
}

/// The state as a word with a non-colour cue (bold underline for over).
pub fn state_word(state: State) -> String {
    let (class, word) = match state {
        State::Ok => ("state-ok", "within"),
        State::Near => ("state-near", "near limit"),
        State::Over => ("state-over", "OVER"),
        State::Slack => ("state-slack", "slack"),
        State::Unchecked => ("state-unchecked", "UNCHECKED"),
    };
    format!("<span class=\"{class}\">{word}</span>")
}
