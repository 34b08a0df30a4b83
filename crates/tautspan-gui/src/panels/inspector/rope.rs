//! The inspector for a rope over sheaves (id, kind, the size, library,
//! rating and termination fields it shares with a member through
//! `line::Line`, its fittings,
//! its unstretched length and which way it runs, its path with each
//! sheave; in the case shown the tension of every span), and a node's
//! sheave (added or removed, tread diameter, bearing).

use super::input::{InspectorInput, item_problems};
use super::line::Line;
use super::member::{kind_picker, library_fields, size_fields};
use crate::document::command::Command;
use crate::document::rename::IdKind;
use crate::fields::qty_field::{FieldBuffers, QtyField};
use crate::fields::units_display::Shown;
use egui::{RichText, Ui};
use tautspan_core::file::RopeDto;
use tautspan_core::library::{Bearing, MemberKind, RopeMotion};
use tautspan_core::units::{Dimension, Sign};

/// The kinds a rope over sheaves may be (the core refuses the others).
const ROPE_KINDS: [MemberKind; 3] = [MemberKind::WireRope, MemberKind::FibreRope, MemberKind::Cable];

/// Draw the rope inspector for `ropes[i]`.
pub fn ui(ui: &mut Ui, input: &InspectorInput<'_>, i: usize, bufs: &mut FieldBuffers, out: &mut Vec<Command>) {
    let dto = &input.doc.dto;
    let r = &dto.ropes[i];
    let line = Line::Rope(i);
    ui.label(RichText::new(format!("Rope {} ({})", r.id, r.path.join(" – "))).strong());
    item_problems(ui, input.derived, &format!("ropes[{i}]"));
    item_problems(ui, input.derived, &format!("ropes[{i}].path"));
    for k in 0..r.path.len() {
        item_problems(ui, input.derived, &format!("ropes[{i}].path[{k}]"));
    }
    // the member fields of the rope, read as a member's
    let m = r.as_member();
    egui::Grid::new("rope-fields").num_columns(2).show(ui, |ui| {
        crate::fields::id_field::show(ui, "Id", bufs, dto, IdKind::Rope, &r.id, out);
        if let Some(kind) = kind_picker(ui, r.kind, &ROPE_KINDS) {
            let units = input.units;
            // a new kind takes a new member's defaults for it, keeping the route
            out.push(Command::edit(move |d| {
                if let Some(r) = d.ropes.get_mut(i) {
                    *r = with_kind(r, kind, units);
                }
            }));
        }
        size_fields(ui, input, line, &m, bufs, out);
        library_fields(ui, input, line, &m, bufs, out);
        if matches!(r.kind, MemberKind::WireRope | MemberKind::Cable) || m.termination_efficiency.is_some() {
            crate::panels::inspector::hitch::termination(ui, input, line, &m, out);
        }
        QtyField {
            label: "Length",
            path: format!("ropes[{i}].length"),
            current: r.length.as_ref(),
            dimension: Dimension::Length,
            sign: Sign::Positive,
            optional: true,
            hint: "drawn length",
        }
        .show(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let Some(r) = d.ropes.get_mut(i) {
                    r.length = q
                }
            }),
        );
        let current = r.motion.unwrap_or_default();
        let options = [(RopeMotion::Hoisting, "hoisting"), (RopeMotion::Lowering, "lowering")];
        if let Some(mo) = crate::panels::inspector::hitch::choice(ui, "Motion", "rope-motion", current, &options) {
            out.push(Command::edit(move |d| {
                if let Some(r) = d.ropes.get_mut(i) {
                    r.motion = Some(mo)
                }
            }));
        }
        let l = ui.label("May go slack");
        let mut may = r.may_go_slack;
        if ui.checkbox(&mut may, "").labelled_by(l.id).changed() {
            out.push(Command::edit(move |d| {
                if let Some(r) = d.ropes.get_mut(i) {
                    r.may_go_slack = may
                }
            }));
        }
        ui.end_row();
    });
    ui.label(RichText::new(current_motion_note(r)).small().weak());
    item_problems(ui, input.derived, &format!("ropes[{i}].termination"));
    crate::panels::inspector::parts::fittings(ui, input, crate::panels::inspector::parts::Host::Rope(i), bufs, out);
    path_list(ui, input, r, out);
    crate::panels::inspector::member::result(ui, input, &r.id);
    spans(ui, input, &r.id);
}

fn current_motion_note(r: &RopeDto) -> String {
    let m = r.motion.unwrap_or_default();
    format!("{}: {}", m.label(), tautspan_core::library::SHEAVE_SOURCE)
}

/// The rope with a new kind: a new member's defaults for that kind, its id,
/// route, length and motion kept.
fn with_kind(r: &RopeDto, kind: MemberKind, units: crate::fields::units_display::UnitSystem) -> RopeDto {
    let m = crate::document::edits::default_member(r.id.clone(), "", "", kind, units);
    RopeDto {
        id: r.id.clone(),
        path: r.path.clone(),
        kind,
        length: r.length.clone(),
        motion: r.motion,
        diameter: m.diameter,
        construction: m.construction,
        grade: m.grade,
        material: m.material,
        rating: m.rating,
        ..RopeDto::default()
    }
}

/// The nodes the rope runs through, each a button that selects it, with its
/// sheave's diameter and bearing.
fn path_list(ui: &mut Ui, input: &InspectorInput<'_>, r: &RopeDto, out: &mut Vec<Command>) {
    ui.separator();
    ui.label(RichText::new("Path").strong());
    let last = r.path.len().saturating_sub(1);
    for (k, id) in r.path.iter().enumerate() {
        let node = input.doc.dto.nodes.iter().find(|n| &n.id == id);
        let what = match node.and_then(|n| n.sheave.as_ref()) {
            _ if k == 0 => "first end".to_string(),
            _ if k == last => "last end".to_string(),
            Some(s) if s.diameter.0.trim().is_empty() => "sheave, diameter not given".to_string(),
            Some(s) => format!("sheave D {}, {}", s.diameter.0, s.bearing.unwrap_or_default().label()),
            None => "no sheave".to_string(),
        };
        ui.horizontal(|ui| {
            if ui.button(id.as_str()).on_hover_text("Select this node").clicked() {
                out.push(Command::Select(crate::document::selection::Selection::Node(id.clone())));
            }
            ui.label(what);
        });
    }
}

/// Each span's tension and length in the case shown (the rope is checked on
/// its largest).
fn spans(ui: &mut Ui, input: &InspectorInput<'_>, id: &str) {
    let Some(case) = input.derived.case(input.case) else { return };
    let Some(r) = case.members.iter().find(|r| r.id == id) else { return };
    if r.segments.is_empty() {
        return;
    }
    let u = input.units;
    ui.label(RichText::new("Spans").strong());
    egui::Grid::new("rope-spans").num_columns(3).striped(true).show(ui, |ui| {
        for s in &r.segments {
            ui.label(format!("{} – {}", s.from, s.to));
            ui.label(format!("tension {}", u.fmt(s.force_n, Shown::Force)));
            ui.label(format!("length {}", u.fmt(s.length_m, Shown::Length)));
            ui.end_row();
        }
    });
}

/// A node's sheave, in the node inspector: a checkbox adds or removes it;
/// a new one's diameter is left for the user to give (the core's error
/// stays beside the field until then).
pub fn sheave(ui: &mut Ui, input: &InspectorInput<'_>, i: usize, bufs: &mut FieldBuffers, out: &mut Vec<Command>) {
    let n = &input.doc.dto.nodes[i];
    ui.separator();
    egui::Grid::new("sheave-fields").num_columns(2).show(ui, |ui| {
        let l = ui.label("Sheave");
        let mut has = n.sheave.is_some();
        if ui.checkbox(&mut has, "ropes run over it").labelled_by(l.id).changed() {
            out.push(Command::edit(move |d| {
                if let Some(n) = d.nodes.get_mut(i) {
                    n.sheave = has.then(crate::document::edits::new_sheave);
                }
            }));
        }
        ui.end_row();
        let Some(s) = &n.sheave else { return };
        QtyField {
            label: "Sheave diameter",
            path: format!("nodes[{i}].sheave.diameter"),
            current: Some(&s.diameter),
            dimension: Dimension::Length,
            sign: Sign::Positive,
            optional: false,
            hint: "tread diameter D (required)",
        }
        .show(
            ui,
            bufs,
            input.derived,
            out,
            Box::new(move |d, q| {
                if let (Some(sh), Some(q)) = (d.nodes.get_mut(i).and_then(|n| n.sheave.as_mut()), q) {
                    sh.diameter = q
                }
            }),
        );
        let options = [
            (Bearing::Frictionless, Bearing::Frictionless.label()),
            (Bearing::Bronze, Bearing::Bronze.label()),
            (Bearing::Roller, Bearing::Roller.label()),
        ];
        let current = s.bearing.unwrap_or_default();
        if let Some(b) = crate::panels::inspector::hitch::choice(ui, "Bearing", "sheave-bearing", current, &options) {
            out.push(Command::edit(move |d| {
                if let Some(sh) = d.nodes.get_mut(i).and_then(|n| n.sheave.as_mut()) {
                    sh.bearing = Some(b)
                }
            }));
        }
    });
    item_problems(ui, input.derived, &format!("nodes[{i}].sheave"));
}
