//! The question before a deletion that takes other items with it: the
//! item, everything that goes with it or changes, and the two answers. Yes
//! deletes them all in one undo step; cancel leaves the scenario as it was.

use crate::document::command::Command;
use crate::document::selection::Selection;
use egui::{Context, RichText};

/// The item in words: "node J1".
fn named(sel: &Selection) -> String {
    match sel {
        Selection::None => "nothing".to_string(),
        Selection::Node(id) => format!("node {id}"),
        Selection::Member(id) => format!("member {id}"),
        Selection::Rope(id) => format!("rope {id}"),
        Selection::Mass(id) => format!("mass {id}"),
        Selection::Floor(id) => format!("floor {id}"),
    }
}

/// Show the question while one is pending; an answer clears it.
pub fn ui(ctx: &Context, pending: &mut Option<(Selection, Vec<String>)>, out: &mut Vec<Command>) {
    let Some((sel, goes_with)) = pending.clone() else { return };
    let mut cancel = false;
    egui::Modal::new(egui::Id::unique("confirm-delete")).show(ctx, |ui| {
        ui.heading(format!("Delete {}?", named(&sel)));
        ui.label("These go with it or change:");
        for line in &goes_with {
            ui.label(RichText::new(format!("• {line}")));
        }
        ui.label(RichText::new("Undo brings them all back in one step.").small().weak());
        ui.horizontal(|ui| {
            if ui.button("Delete all").clicked() {
                out.push(Command::ConfirmDelete(sel.clone()));
            }
            if ui.button("Cancel").clicked() {
                cancel = true;
            }
        });
    });
    if cancel || ctx.input(|i| i.key_pressed(egui::Key::Escape)) {
        *pending = None;
    }
}
