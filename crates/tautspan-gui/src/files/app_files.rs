//! The app's file commands: open, save, save as, export the report; the
//! answers of the dialogs; the unsaved-changes question and the in-app path
//! field. A failed open leaves the current scenario as it was.

use crate::app::{Message, Pending, TautspanApp};
use crate::document::command::Command;
use crate::files::{Purpose, read_scenario, save_scenario, write_atomic};
use egui::{Context, RichText};
use std::path::{Path, PathBuf};

impl TautspanApp {
    /// Open a file; on failure keep the current scenario and show the located error.
    pub fn open_path(&mut self, path: &Path) {
        match read_scenario(path) {
            Ok(dto) => {
                self.doc.replace(dto, Some(path.to_path_buf()));
                self.prefs.remember(path);
                self.message = Some(Message::Info(format!("Opened {}", path.display())));
                self.after_replace();
            }
            Err(e) => self.message = Some(Message::Error(format!("Nothing opened. {e}"))),
        }
    }

    /// Save to a file; on success it becomes the document's file.
    pub fn save_to(&mut self, path: &Path) -> bool {
        match save_scenario(path, &self.doc.dto) {
            Ok(()) => {
                self.doc.path = Some(path.to_path_buf());
                self.doc.dirty = false;
                self.prefs.remember(path);
                self.message = Some(Message::Info(format!("Saved {}", path.display())));
                true
            }
            Err(e) => {
                self.message = Some(Message::Error(format!("Not saved. {e}")));
                false
            }
        }
    }

    /// Why the scenario cannot be saved as it stands: fields holding text
    /// that is not a valid value (the document has only their last valid one).
    fn unsaveable(&self) -> Option<String> {
        let bad = crate::fields::invalid::invalid_fields(&self.fields, &self.doc.dto);
        (!bad.is_empty()).then(|| {
            format!(
                "Not saved: {} {} not a valid value. Correct {} (or undo) and save again.",
                bad.join("; "),
                if bad.len() == 1 { "is" } else { "are" },
                if bad.len() == 1 { "it" } else { "them" }
            )
        })
    }

    pub(crate) fn file_command(&mut self, ctx: &Context, c: Command) {
        if matches!(c, Command::Save | Command::SaveAs | Command::SaveTo(_))
            && let Some(why) = self.unsaveable()
        {
            self.message = Some(Message::Error(why));
            return;
        }
        match c {
            Command::Save => match self.doc.path.clone() {
                Some(p) => {
                    self.save_to(&p);
                }
                None => self.files.ask(Purpose::SaveAs, ctx, Some(&self.doc.save_path_suggestion())),
            },
            Command::SaveAs => self.files.ask(Purpose::SaveAs, ctx, Some(&self.doc.save_path_suggestion())),
            Command::SaveTo(p) => {
                let saved = self.save_to(&p);
                if saved && let Some(next) = self.pending.take() {
                    self.proceed(ctx, next);
                }
            }
            Command::ExportReport => {
                if !self.derived.is_current(&self.doc) {
                    // the report is of the scenario as it is now: wait for its results
                    self.export_waiting = true;
                    self.message =
                        Some(Message::Info("The report follows once the results are up to date.".to_string()));
                    return;
                }
                let Some(solved) = self.derived.solved.as_ref() else {
                    self.message =
                        Some(Message::Error("No report: the scenario has problems to fix first.".to_string()));
                    return;
                };
                let us = self.prefs.units == crate::fields::units_display::UnitSystem::UsCustomary;
                // the file named with its SHA-256 only when what is open is
                // what the file holds (saved, and unchanged on disk since)
                let source = self.doc.path.as_deref().filter(|_| !self.doc.dirty).and_then(|p| {
                    let bytes = std::fs::read(p).ok()?;
                    let text = std::str::from_utf8(&bytes).ok()?;
                    let (on_disk, _) = tautspan_core::file::parse_scenario_text(text).ok()?;
                    (on_disk == *self.doc.dto)
                        .then(|| tautspan_core::report::SourceFile::new(p.display().to_string(), &bytes))
                });
                match crate::document::core_bridge::report_html(&solved.scenario, &solved.analysis, us, source.as_ref())
                {
                    Ok(html) => {
                        self.report_html = Some(html);
                        let near = self.doc.path.as_ref().map(|p| p.with_extension("html"));
                        self.files.ask(Purpose::ExportReport, ctx, near.as_deref());
                    }
                    Err(e) => self.message = Some(Message::Error(format!("No report: {e}."))),
                }
            }
            Command::ExportCsv(text) => {
                self.csv_text = Some(text);
                let near = match &self.doc.path {
                    Some(p) => p.with_extension("csv"),
                    None => PathBuf::from("results.csv"),
                };
                self.files.ask(Purpose::ExportCsv, ctx, Some(&near));
            }
            _ => {}
        }
    }

    fn path_chosen(&mut self, ctx: &Context, purpose: Purpose, path: PathBuf) {
        self.files.prompt = None;
        // a name typed without its extension gets the one the file is written as
        let path = match purpose.extension() {
            Some(ext) if path.extension().is_none() => path.with_extension(ext),
            _ => path,
        };
        match purpose {
            Purpose::Open => self.open_path(&path),
            Purpose::SaveAs => self.file_command(ctx, Command::SaveTo(path)),
            Purpose::ExportReport => {
                if let Some(html) = self.report_html.take() {
                    self.message = Some(match write_atomic(&path, &html) {
                        Ok(()) => Message::Info(format!("Report written to {}", path.display())),
                        Err(e) => Message::Error(format!("Report not written: {}: {e}", path.display())),
                    });
                }
            }
            Purpose::ExportCsv => {
                if let Some(text) = self.csv_text.take() {
                    self.message = Some(match write_atomic(&path, &text) {
                        Ok(()) => Message::Info(format!("Results written to {}", path.display())),
                        Err(e) => Message::Error(format!("Results not written: {}: {e}", path.display())),
                    });
                }
            }
        }
    }

    pub(crate) fn poll_files(&mut self, ctx: &Context) {
        if let Some(answer) = self.files.poll()
            && let Some(p) = answer.path
        {
            self.path_chosen(ctx, answer.purpose, p);
        }
    }

    pub(crate) fn dialogs_ui(&mut self, ctx: &Context, out: &mut Vec<Command>) {
        if let Some(p) = self.pending.clone() {
            let what = match &p {
                Pending::New => "starting a new scenario",
                Pending::Open | Pending::OpenPath(_) => "opening another file",
                Pending::Quit => "closing",
            };
            egui::Modal::new(egui::Id::unique("unsaved")).show(ctx, |ui| {
                ui.heading("Unsaved changes");
                ui.label(format!(
                    "{} has changes that are not saved. Save them before {what}?",
                    self.doc.display_name()
                ));
                ui.horizontal(|ui| {
                    if ui.button("Save").clicked() {
                        match self.doc.path.clone() {
                            Some(path) => out.push(Command::SaveTo(path)),
                            None => self.files.ask(Purpose::SaveAs, ctx, Some(&self.doc.save_path_suggestion())),
                        }
                    }
                    if ui.button("Discard changes").clicked() {
                        self.proceed(ctx, p.clone());
                    }
                    if ui.button("Cancel").clicked() {
                        self.pending = None;
                    }
                });
            });
        }
        let Some(mut prompt) = self.files.prompt.clone() else { return };
        let mut close = false;
        let mut chosen = None;
        egui::Window::new("File path").collapsible(false).resizable(false).show(ctx, |ui| {
            ui.label(RichText::new(&prompt.reason).small());
            ui.horizontal(|ui| {
                let l = ui.label("Path");
                let r = ui.add(egui::TextEdit::singleline(&mut prompt.text).desired_width(360.0)).labelled_by(l.id);
                // the field takes the focus when it opens, so the path can be typed at once
                if !prompt.focused {
                    r.request_focus();
                    prompt.focused = true;
                }
                let enter = r.lost_focus() && ui.input(|i| i.key_pressed(egui::Key::Enter));
                if (ui.button(prompt.purpose.verb()).clicked() || enter) && !prompt.text.trim().is_empty() {
                    chosen = Some(PathBuf::from(prompt.text.trim()));
                }
                if ui.button("Close").clicked() {
                    close = true;
                }
            });
        });
        if let Some(path) = chosen {
            self.path_chosen(ctx, prompt.purpose, path);
        } else if close {
            self.files.prompt = None;
            self.report_html = None;
            self.csv_text = None;
        } else {
            self.files.prompt = Some(prompt);
        }
    }
}
