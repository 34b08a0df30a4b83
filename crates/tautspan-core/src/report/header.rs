//! The top of the report: title, date, units, the scenario's notes, the
//! caution and the overall verdict with the highest utilisation found.

use super::escape::escape;
use super::marks::state_in;
use super::source_file::SourceFile;
use super::unit_system::{UnitSystem, percent};
use crate::analysis::{Analysis, State, Verdict};
use crate::model::Scenario;

/// The caution box (used at the top and at the bottom).
pub fn caution(analysis: &Analysis) -> String {
    let text = if analysis.caution.trim().is_empty() { crate::CAUTION } else { analysis.caution.as_str() };
    format!("<div class=\"caution\" role=\"note\"><span class=\"tag\">CAUTION</span>{}</div>", escape(text))
}

/// Title block: kind of document, title, date, units, the file with its
/// SHA-256 and revision, notes.
pub fn title_block(
    scenario: &Scenario,
    analysis: &Analysis,
    date: &str,
    units: UnitSystem,
    source: Option<&SourceFile>,
) -> String {
    let revision = scenario.revision.as_deref().map_or_else(
        || "<span class=\"none\">not given in the file</span>".to_string(),
        |r| format!("<span class=\"revision\">{}</span>", escape(r)),
    );
    let file = source.map_or_else(String::new, |f| {
        format!(
            "<dt>File</dt><dd class=\"file\">{}</dd><dt>SHA-256</dt><dd><code class=\"sha256\">{}</code></dd>",
            escape(&f.name),
            escape(&f.sha256)
        )
    });
    let title = if scenario.title.trim().is_empty() { analysis.title.as_str() } else { scenario.title.as_str() };
    let notes = if scenario.notes.trim().is_empty() {
        "<span class=\"none\">none</span>".to_string()
    } else {
        format!("<span class=\"notes\">{}</span>", escape(scenario.notes.trim()))
    };
    format!(
        "<header class=\"top\"><p class=\"doc-kind\">Load-path check report</p><h1>{}</h1>\
         <dl class=\"meta\"><dt>Date</dt><dd>{}</dd><dt>Units</dt><dd>{}</dd>{file}<dt>Revision</dt><dd>{revision}</dd>\
         <dt>Cases</dt><dd>{}</dd><dt>Notes</dt><dd>{notes}</dd></dl></header>",
        escape(title),
        escape(date),
        units.name(),
        case_list(scenario)
    )
}

fn case_list(scenario: &Scenario) -> String {
    if scenario.cases.is_empty() {
        return "<span class=\"none\">none</span>".to_string();
    }
    scenario.cases.iter().map(|c| format!("{} ({})", escape(c.id()), c.kind_name())).collect::<Vec<_>>().join(", ")
}

/// The overall verdict and where the highest utilisation is.
pub fn verdict(analysis: &Analysis) -> String {
    let (class, head) = match analysis.verdict() {
        Verdict::Within => (
            "verdict",
            "Every item this tool checks is within its allowable in every case (see the scope below for what it does not check).".to_string(),
        ),
        Verdict::NotWithin => {
            ("verdict fail", format!("<span class=\"tag\">NOT WITHIN ALLOWABLE</span> {}", faults(analysis)))
        }
        Verdict::Unchecked => {
            ("verdict fail", format!("<span class=\"tag\">UNCHECKED</span> {}", unchecked(analysis)))
        }
    };
    format!("<div class=\"{class}\"><strong>{head}</strong>{}</div>{}", highest(analysis), scope(analysis))
}

/// What the inputs cannot check, by name, with the reason.
fn unchecked(analysis: &Analysis) -> String {
    let mut seen: Vec<String> = Vec::new();
    for c in &analysis.cases {
        let items = c
            .members
            .iter()
            .filter(|m| m.state == State::Unchecked)
            .map(|m| (&m.id, &m.reason))
            .chain(c.floors.iter().filter(|f| f.state == State::Unchecked).map(|f| (&f.id, &f.reason)));
        for (id, reason) in items {
            let line = match reason {
                Some(r) => format!("{} ({})", escape(id), escape(r)),
                None => escape(id),
            };
            if !seen.contains(&line) {
                seen.push(line);
            }
        }
    }
    format!("cannot be checked from the inputs: {}.", seen.join("; "))
}

/// What is checked and, by name, what is not.
pub fn scope(analysis: &Analysis) -> String {
    let list = |v: &[String]| v.iter().map(|t| format!("<li>{}</li>", escape(t))).collect::<String>();
    format!(
        "<section id=\"scope\"><h2>Scope</h2><p>Checked:</p><ul>{}</ul>\
         <p>Not checked (a competent person must):</p><ul>{}</ul></section>",
        list(&analysis.scope.checked),
        list(&analysis.scope.not_checked)
    )
}

/// What keeps the rig from being within allowable, by name.
fn faults(analysis: &Analysis) -> String {
    let mut parts = Vec::new();
    let over: Vec<String> = analysis
        .comparison
        .iter()
        .filter_map(|row| {
            let cases: Vec<String> = analysis
                .cases
                .iter()
                .filter(|c| state_in(c, &row.id) == Some(State::Over))
                .map(|c| escape(&c.id))
                .collect();
            (!cases.is_empty()).then(|| format!("{} ({})", escape(&row.id), cases.join(", ")))
        })
        .collect();
    if !over.is_empty() {
        parts.push(format!("over its allowable: {}", over.join("; ")));
    }
    let unsolved: Vec<String> =
        analysis.cases.iter().filter(|c| !c.converged || c.error.is_some()).map(|c| escape(&c.id)).collect();
    if !unsolved.is_empty() {
        parts.push(format!("not solved: case {}", unsolved.join(", ")));
    }
    if parts.is_empty() {
        parts.push("a member meant to carry went slack (see the warnings)".to_string());
    }
    format!("{}.", parts.join("; "))
}

/// “Highest utilisation: member X, case Y, 87 %”, from the comparison.
fn highest(analysis: &Analysis) -> String {
    let mut best: Option<(&str, &str, f64)> = None;
    for row in &analysis.comparison {
        for (case, u) in analysis.cases.iter().zip(&row.utilisation) {
            if let Some(u) = u.filter(|u| u.is_finite())
                && best.is_none_or(|b| u > b.2)
            {
                best = Some((&row.id, &case.id, u));
            }
        }
    }
    match best {
        Some((id, case, u)) => {
            format!(
                "<p>Highest utilisation: <b>{}</b> in case <b>{}</b>, {}.</p>",
                escape(id),
                escape(case),
                percent(u)
            )
        }
        None => "<p>No utilisation was found: no case gave results.</p>".to_string(),
    }
}
