//! Every warning in one list: those about the scenario as a whole (design
//! factors, inputs), then each case's, each with its subject where the
//! analysis names one.

use super::escape::escape;
use crate::analysis::{Analysis, CaseResult, Warning, WarningGroup, WarningKind};

/// The warnings section.
pub fn warnings(analysis: &Analysis) -> String {
    let mut items: Vec<String> = grouped(analysis.warning_groups()).iter().map(|w| item(None, w)).collect();
    for case in &analysis.cases {
        items.extend(case_items(case).iter().map(|w| item(Some(&case.id), w)));
    }
    let body = if items.is_empty() {
        "<p>No warnings.</p>".to_string()
    } else {
        format!("<ul class=\"warnings\">{}</ul>", items.concat())
    };
    format!("<section id=\"warnings\"><h2>Warnings</h2>{body}</section>")
}

/// A case's warnings, one per kind (a single one with its subject); the
/// plain strings when it has no items.
pub fn case_items(case: &CaseResult) -> Vec<Warning> {
    if case.warning_items.is_empty() {
        case.warnings
            .iter()
            .map(|m| Warning { kind: WarningKind::CaseFailed, subject: None, message: m.clone() })
            .collect()
    } else {
        grouped(case.warning_groups())
    }
}

fn grouped(groups: Vec<WarningGroup>) -> Vec<Warning> {
    groups
        .into_iter()
        .map(|g| Warning {
            kind: g.kind,
            subject: if g.count == 1 { g.subjects.into_iter().next() } else { None },
            message: g.message,
        })
        .collect()
}

/// One warning as a list item.
pub fn item(case: Option<&str>, w: &Warning) -> String {
    let mut who = Vec::new();
    if let Some(c) = case {
        who.push(format!("case {}", escape(c)));
    }
    if let Some(s) = &w.subject {
        who.push(escape(s));
    }
    let who =
        if who.is_empty() { String::new() } else { format!("<span class=\"subject\">{}:</span> ", who.join(", ")) };
    format!("<li>{who}{}</li>", escape(&w.message))
}
