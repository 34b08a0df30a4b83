//! The warnings list: the scenario's own warnings and each case's, with the
//! member (or floor, node) they concern; a click selects it. Validation
//! problems are listed here too while the scenario does not validate.

use crate::command::Command;
use crate::derived::Derived;
use crate::document::Document;
use crate::qty_field::ERROR;
use crate::selection::Selection;
use egui::{RichText, Ui};

fn subject_selection(doc: &Document, subject: &str) -> Selection {
    let d = &doc.dto;
    if d.members.iter().any(|m| m.id == subject) {
        Selection::Member(subject.to_string())
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
    let mut any = false;
    let mut item = |ui: &mut Ui, case: Option<&str>, subject: Option<&str>, message: &str| {
        any = true;
        let text = match case {
            Some(c) => format!("[{c}] {message}"),
            None => message.to_string(),
        };
        let sel = subject.map_or(Selection::None, |s| subject_selection(doc, s));
        let r = ui.link(text);
        if r.clicked() {
            if sel != Selection::None {
                out.push(Command::Select(sel));
            }
            if let Some(c) = case {
                out.push(Command::ShowCase(c.to_string()));
            }
        }
    };
    for w in &solved.analysis.warnings {
        item(ui, None, w.subject.as_deref(), &w.message);
    }
    for c in &solved.analysis.cases {
        for w in &c.warning_items {
            item(ui, Some(&c.id), w.subject.as_deref(), &w.message);
        }
    }
    if !any {
        ui.label(RichText::new("None.").weak());
    }
}
