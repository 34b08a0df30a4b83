//! The warnings list: the scenario's own warnings and each case's, with the
//! member (or floor, node) they concern; a click selects it. Most serious
//! first (over, slack, unchecked, near, then advisories in quieter type;
//! `warning_severity.rs`), with the counts of each above. Validation
//! problems are listed here too while the scenario does not validate.

use crate::document::Document;
use crate::document::command::Command;
use crate::document::derived::Derived;
use crate::document::selection::Selection;
use crate::fields::qty_field::ERROR;
use crate::panels::warning_severity::{Severity, by_severity, counts};
use egui::{RichText, Ui};

/// Warning groups listed before the rest are offered behind a button.
const SHOWN_FIRST: usize = 20;

fn subject_selection(doc: &Document, subject: &str) -> Selection {
    let d = &doc.dto;
    if d.members.iter().any(|m| m.id == subject) {
        Selection::Member(subject.to_string())
    } else if d.ropes.iter().any(|r| r.id == subject) {
        Selection::Rope(subject.to_string())
    } else if d.nodes.iter().any(|n| n.id == subject) {
        Selection::Node(subject.to_string())
    } else if d.floors.iter().any(|f| f.id == subject) {
        Selection::Floor(subject.to_string())
    } else if d.masses.iter().any(|m| m.id == subject) {
        Selection::Mass(subject.to_string())
    } else {
        Selection::None
    }
}

/// Which item a field path (`members[2].area`) belongs to.
fn path_selection(doc: &Document, path: &str) -> Selection {
    let index = |prefix: &str| -> Option<usize> { path.strip_prefix(prefix)?.split(']').next()?.parse().ok() };
    let d = &doc.dto;
    if let Some(m) = index("members[").and_then(|i| d.members.get(i)) {
        Selection::Member(m.id.clone())
    } else if let Some(r) = index("ropes[").and_then(|i| d.ropes.get(i)) {
        Selection::Rope(r.id.clone())
    } else if let Some(n) = index("nodes[").and_then(|i| d.nodes.get(i)) {
        Selection::Node(n.id.clone())
    } else if let Some(f) = index("floors[").and_then(|i| d.floors.get(i)) {
        Selection::Floor(f.id.clone())
    } else if let Some(m) = index("masses[").and_then(|i| d.masses.get(i)) {
        Selection::Mass(m.id.clone())
    } else {
        Selection::None
    }
}

/// Draw the warnings (and validation problems).
pub fn ui(ui: &mut Ui, doc: &Document, derived: &Derived, out: &mut Vec<Command>) {
    ui.heading("Warnings");
    if !derived.problems.is_empty() {
        ui.label(RichText::new("The scenario does not validate:").color(ERROR));
        for p in &derived.problems {
            let sel = path_selection(doc, &p.path);
            if ui.link(RichText::new(format!("{}: {}", p.path, p.message)).color(ERROR)).clicked()
                && sel != Selection::None
            {
                out.push(Command::Select(sel));
            }
        }
        return;
    }
    let Some(solved) = derived.solved.as_ref() else { return };
    // one line per kind and case (grouped off the UI thread), the first
    // subjects named and "and N more"; a click selects the first subject
    let groups = &solved.warning_groups;
    let total = groups.len();
    if total == 0 {
        ui.label(RichText::new("None.").weak());
        return;
    }
    let summary: Vec<String> = counts(groups).iter().map(|(s, n)| format!("{n} {}", s.summary_words(*n))).collect();
    ui.label(RichText::new(summary.join(" · ")).strong());
    let show_all_id = ui.scope_id().with("show-all-warnings");
    let show_all = ui.data(|d| d.get_temp::<bool>(show_all_id)).unwrap_or(false);
    let shown = if show_all { total } else { total.min(SHOWN_FIRST) };
    for (severity, (case, g)) in by_severity(groups).into_iter().take(shown) {
        let text = match case {
            Some(c) => format!("{} [{c}] {}", severity.mark(), g.message),
            None => format!("{} {}", severity.mark(), g.message),
        };
        let text = match severity.colour() {
            Some(c) if severity == Severity::Over || severity == Severity::Slack => {
                RichText::new(text).color(c).strong()
            }
            Some(c) => RichText::new(text).color(c),
            None => RichText::new(text).weak().small(),
        };
        if ui.link(text).clicked() {
            if let Some(sel) = g.subjects.first().map(|s| subject_selection(doc, s))
                && sel != Selection::None
            {
                out.push(Command::Select(sel));
            }
            if let Some(c) = case {
                out.push(Command::ShowCase(c.clone()));
            }
        }
    }
    if total > shown && ui.button(format!("Show all {total} warnings ({} more)", total - shown)).clicked() {
        ui.data_mut(|d| d.insert_temp(show_all_id, true));
    }
}
