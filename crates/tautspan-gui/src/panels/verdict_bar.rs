//! The verdict of the whole scenario, always on screen: within what this
//! tool checks, not within, or unchecked, with the worst item and its case
//! (a click selects it and shows that case), and the scope: what is checked
//! and, by name, what is not.

use crate::document::command::Command;
use crate::document::derived::Derived;
use crate::document::selection::Selection;
use egui::{Color32, RichText, Ui};
use tautspan_core::analysis::{Analysis, ItemKind, State, Verdict};

/// Green-free colours so the verdict does not lean on a red/green pair:
/// a dark blue band for within, the app's error colour for the rest.
const WITHIN: Color32 = Color32::from_rgb(0x4a, 0x8a, 0xc8);
const AGAINST: Color32 = crate::fields::qty_field::ERROR;
const UNCHECKED: Color32 = Color32::from_rgb(0xe8, 0xb0, 0x3a);

/// The verdict in words for the bar.
pub fn verdict_text(a: &Analysis) -> (&'static str, Color32) {
    match a.verdict() {
        Verdict::Within => ("WITHIN what this tool checks", WITHIN),
        Verdict::NotWithin => ("NOT WITHIN the allowables", AGAINST),
        Verdict::Unchecked => ("UNCHECKED: part of the load path cannot be checked from the inputs", UNCHECKED),
    }
}

/// Draw the bar.
pub fn ui(ui: &mut Ui, derived: &Derived, out: &mut Vec<Command>) {
    let Some(solved) = &derived.solved else {
        ui.horizontal(|ui| {
            let text = if derived.problems.is_empty() {
                "Verdict: solving…".to_string()
            } else {
                format!("Verdict: none, the scenario has {} problem(s) to fix first", derived.problems.len())
            };
            ui.label(RichText::new(text).strong().color(AGAINST));
        });
        return;
    };
    let a = &solved.analysis;
    ui.horizontal_wrapped(|ui| {
        let (words, colour) = verdict_text(a);
        ui.label(RichText::new(format!("Verdict: {words}")).strong().color(colour));
        if derived.is_updating() {
            ui.label(RichText::new("(updating)").weak());
        }
        let unsolved: Vec<&str> =
            a.cases.iter().filter(|c| !c.converged || c.error.is_some()).map(|c| c.id.as_str()).collect();
        if !unsolved.is_empty() {
            ui.label(RichText::new(format!("not solved: {}", unsolved.join(", "))).color(AGAINST));
        }
        if let Some(w) = &solved.worst {
            let what = if w.state == State::Unchecked || !w.utilisation.is_finite() {
                w.amount(3)
            } else {
                format!("{:.1} %", w.utilisation * 100.0)
            };
            let rope = solved.scenario.members.iter().any(|m| m.id == w.id && m.run.is_some());
            let kind = match w.kind {
                ItemKind::Floor => "floor",
                ItemKind::Part => "rated part",
                ItemKind::Member if rope => "rope",
                ItemKind::Member => "member",
            };
            let label = format!("worst: {kind} {} in case {}, {what}", w.id, w.case);
            let colour = match w.state {
                State::Over => AGAINST,
                State::Unchecked => UNCHECKED,
                _ => ui.visuals().text_color(),
            };
            if ui
                .add(egui::Button::new(RichText::new(label).color(colour)).small())
                .on_hover_text("Select it (a rated part: the member or node it is on) and show that case")
                .clicked()
            {
                let is_member = solved.scenario.members.iter().any(|m| m.id == w.host);
                let sel = match w.kind {
                    ItemKind::Floor => Selection::Floor(w.id.clone()),
                    _ if is_member => Selection::of_member_result(&solved.scenario, &w.host),
                    _ => Selection::Node(w.host.clone()),
                };
                out.push(Command::Select(sel));
                out.push(Command::ShowCase(w.case.clone()));
            }
        }
        ui.menu_button("Scope: what is and is not checked", |ui| {
            ui.label(RichText::new("Checked").strong());
            for c in &a.scope.checked {
                ui.label(format!("• {c}"));
            }
            ui.separator();
            ui.label(RichText::new("Not checked (a competent person must)").strong());
            for c in &a.scope.not_checked {
                ui.label(format!("• {c}"));
            }
        });
    });
}
