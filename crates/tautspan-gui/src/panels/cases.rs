//! The cases panel: the load cases of the scenario (static, swing, drop,
//! sudden), their settings, adding and removing them, and which case the
//! canvas shows.

use crate::document::Document;
use crate::document::command::Command;
use crate::document::derived::Derived;
use crate::document::edits::fresh_id;
use crate::document::rename::IdKind;
use crate::fields::id_field;
use crate::fields::qty_field::{FieldBuffers, QtyField};
use crate::fields::units_display::{Shown, UnitSystem};
use crate::panels::warning_severity::{NEAR_AMBER, OVER_RED, UNCHECKED_VIOLET};
use egui::{RichText, Ui};
use tautspan_core::analysis::State;
use tautspan_core::file::{CaseDto, Qty, ScenarioDto};
use tautspan_core::units::{Dimension, Sign};

fn kind_of(c: &CaseDto) -> &'static str {
    match c {
        CaseDto::Static { .. } => "static",
        CaseDto::Swing { .. } => "swing",
        CaseDto::Drop { .. } => "drop",
        CaseDto::Sudden { .. } => "sudden",
    }
}

/// Draw the cases panel.
pub fn ui(
    ui: &mut Ui,
    doc: &Document,
    derived: &Derived,
    shown: Option<&str>,
    units: UnitSystem,
    bufs: &mut FieldBuffers,
    out: &mut Vec<Command>,
) {
    ui.heading("Cases");
    let shown = shown.or_else(|| doc.dto.cases.first().map(CaseDto::id));
    let masses: Vec<String> = doc.dto.masses.iter().map(|m| m.id.clone()).collect();
    for (i, c) in doc.dto.cases.iter().enumerate() {
        ui.push_id(("case", i), |ui| {
            ui.horizontal(|ui| {
                let id = c.id().to_string();
                let state = derived.solved.as_ref().and_then(|s| {
                    let k = s.analysis.cases.iter().position(|r| r.id == id)?;
                    s.case_summaries.get(k).cloned()
                });
                if ui
                    .selectable_label(shown == Some(id.as_str()), format!("{id} ({})", kind_of(c)))
                    .on_hover_text("Show this case on the canvas")
                    .clicked()
                {
                    out.push(Command::ShowCase(id.clone()));
                }
                if let Some((text, st)) = state {
                    let t = RichText::new(text).small();
                    ui.label(match st {
                        Some(State::Over) => t.strong().color(OVER_RED),
                        Some(State::Unchecked) => t.strong().color(UNCHECKED_VIOLET),
                        Some(State::Near) => t.color(NEAR_AMBER),
                        _ => t.weak(),
                    });
                }
                if ui.small_button("Remove").on_hover_text(format!("Remove case {id}")).clicked() {
                    out.push(Command::edit(move |d| d.cases.retain(|c| c.id() != id)));
                }
            });
            case_fields(ui, &doc.dto, shown, i, c, &masses, units, derived, bufs, out);
        });
    }
    ui.horizontal_wrapped(|ui| {
        let taken = || doc.dto.cases.iter().map(CaseDto::id);
        if ui.button("+ Static").clicked() {
            let id = fresh_id("static", taken());
            out.push(Command::edit(move |d| d.cases.push(CaseDto::Static { id })));
        }
        let Some(mass) = masses.first().cloned() else {
            ui.label(RichText::new("Hang a mass to add swing, drop or sudden cases.").small().weak());
            return;
        };
        if ui.button("+ Swing").clicked() {
            let id = fresh_id("swing", taken());
            let mass = mass.clone();
            out.push(Command::edit(move |d| {
                d.cases.push(CaseDto::Swing { id, mass, release: Qty::from("30 deg"), pivot: None, azimuth: None })
            }));
        }
        if ui.button("+ Drop").clicked() {
            let id = fresh_id("drop", taken());
            let height = Qty::from(if units == UnitSystem::UsCustomary { "4 in" } else { "0.1 m" });
            let mass = mass.clone();
            out.push(Command::edit(move |d| d.cases.push(CaseDto::Drop { id, mass, height })));
        }
        if ui.button("+ Sudden").clicked() {
            let id = fresh_id("sudden", taken());
            out.push(Command::edit(move |d| d.cases.push(CaseDto::Sudden { id, mass })));
        }
    });
}

#[allow(clippy::too_many_arguments)]
fn case_fields(
    ui: &mut Ui,
    dto: &ScenarioDto,
    shown: Option<&str>,
    i: usize,
    c: &CaseDto,
    masses: &[String],
    units: UnitSystem,
    derived: &Derived,
    bufs: &mut FieldBuffers,
    out: &mut Vec<Command>,
) {
    egui::Grid::new(("case-fields", i)).num_columns(2).show(ui, |ui| {
        let renamed = id_field::show(ui, "Case id", bufs, dto, IdKind::Case, c.id(), out);
        if let Some(new) = renamed
            && shown == Some(c.id())
        {
            out.push(Command::ShowCase(new));
        }
        let mass_now = match c {
            CaseDto::Static { .. } => return,
            CaseDto::Swing { mass, .. } | CaseDto::Drop { mass, .. } | CaseDto::Sudden { mass, .. } => mass.clone(),
        };
        let l = ui.label("Mass");
        let mut chosen = mass_now.clone();
        egui::ComboBox::from_id_salt(("case-mass", i))
            .selected_text(&mass_now)
            .show_ui(ui, |ui| {
                for m in masses {
                    ui.selectable_value(&mut chosen, m.clone(), m);
                }
            })
            .response
            .labelled_by(l.id);
        ui.end_row();
        if chosen != mass_now {
            out.push(Command::edit(move |d| {
                if let Some(CaseDto::Swing { mass, .. } | CaseDto::Drop { mass, .. } | CaseDto::Sudden { mass, .. }) =
                    d.cases.get_mut(i)
                {
                    *mass = chosen;
                }
            }));
        }
        match c {
            CaseDto::Swing { release, .. } => {
                // typed, not a slider: a value out of range (200 deg) reaches
                // the core, which says why it is not a swing, instead of being
                // clamped without a word
                QtyField {
                    label: "Release angle",
                    path: format!("cases[{i}].release"),
                    current: Some(release),
                    dimension: Dimension::Angle,
                    sign: Sign::NonNegative,
                    optional: false,
                    hint: "e.g. 30 deg",
                }
                .show(
                    ui,
                    bufs,
                    derived,
                    out,
                    Box::new(move |d, q| {
                        if let (Some(CaseDto::Swing { release, .. }), Some(q)) = (d.cases.get_mut(i), q) {
                            *release = q;
                        }
                    }),
                );
                let azimuth = match c {
                    CaseDto::Swing { azimuth, .. } => azimuth.as_ref(),
                    _ => None,
                };
                QtyField {
                    label: "Swing azimuth",
                    path: format!("cases[{i}].azimuth"),
                    current: azimuth,
                    dimension: Dimension::Angle,
                    sign: Sign::Any,
                    optional: true,
                    hint: "0 deg = elevation",
                }
                .show(
                    ui,
                    bufs,
                    derived,
                    out,
                    Box::new(move |d, q| {
                        if let Some(CaseDto::Swing { azimuth, .. }) = d.cases.get_mut(i) {
                            *azimuth = q;
                        }
                    }),
                );
            }
            CaseDto::Drop { height, .. } => {
                QtyField {
                    label: "Drop height",
                    path: format!("cases[{i}].height"),
                    current: Some(height),
                    dimension: Dimension::Length,
                    sign: Sign::NonNegative,
                    optional: false,
                    hint: units.unit(Shown::SmallLength),
                }
                .show(
                    ui,
                    bufs,
                    derived,
                    out,
                    Box::new(move |d, q| {
                        if let (Some(CaseDto::Drop { height, .. }), Some(q)) = (d.cases.get_mut(i), q) {
                            *height = q;
                        }
                    }),
                );
            }
            _ => {}
        }
    });
    if let Some(dynamic) = derived.case(Some(c.id())).filter(|r| r.id == c.id()).and_then(|r| r.dynamic.as_ref()) {
        ui.label(RichText::new(format!("load factor {:.3}", dynamic.factor)).small().weak())
            .on_hover_text(&dynamic.formula);
    }
}
