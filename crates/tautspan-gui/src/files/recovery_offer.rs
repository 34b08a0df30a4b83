//! The offer, at start, of unsaved work found in the recovery file
//! (`recovery.rs`): restore it as unsaved changes of the file it came from,
//! or discard it.

use crate::app::{Message, TautspanApp};
use crate::fields::qty_field::ERROR;
use egui::RichText;

impl TautspanApp {
    /// The offer of work found in the recovery file: restore it (as
    /// unsaved changes of the file it came from) or discard it.
    pub(crate) fn recovery_ui(&mut self, ctx: &egui::Context) {
        let Some(offer) = self.recovery.offer.clone() else { return };
        let mut answer: Option<bool> = None;
        egui::Modal::new(egui::Id::unique("recovery")).show(ctx, |ui| {
            ui.heading("Unsaved work found");
            match &offer {
                Ok(r) => {
                    let from =
                        r.origin.as_ref().map_or_else(|| "not saved yet".to_string(), |p| p.display().to_string());
                    ui.label(format!(
                        "The last session ended with unsaved changes to \"{}\" ({from}). Restore them?",
                        r.dto.title
                    ));
                }
                Err(e) => {
                    ui.label(RichText::new(e).color(ERROR));
                }
            }
            ui.horizontal(|ui| {
                if offer.is_ok() && ui.button("Restore").clicked() {
                    answer = Some(true);
                }
                if ui.button("Discard").clicked() {
                    answer = Some(false);
                }
            });
        });
        match answer {
            Some(true) => {
                if let Ok(r) = offer {
                    self.doc.replace(r.dto, r.origin);
                    // restored work is unsaved until it is saved
                    self.doc.dirty = true;
                    self.after_replace();
                    self.message = Some(Message::Info("Unsaved work restored: save it to keep it.".to_string()));
                }
                // the restored work is written again at once, under this session
                self.recovery.offer = None;
            }
            Some(false) => self.recovery.clear(),
            None => {}
        }
    }
}
