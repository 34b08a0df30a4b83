//! How a member is rigged, edited in the member inspector: its hitch
//! (straight, choker, basket) with the choke angle under ASME rules and the
//! basket's leg angle, a wire rope's termination (or an efficiency of the
//! user's own), and the pin or sheave diameter it is bent over (D/d). Every
//! change is one edit; what the core refuses is shown under its field in
//! the core's words.

use super::input::{InspectorInput, item_problems};
use super::line::Line;
use crate::document::command::Command;
use crate::fields::qty_field::{FieldBuffers, QtyField};
use crate::fields::units_display::Shown;
use egui::{RichText, Ui};
use tautspan_core::file::MemberDto;
use tautspan_core::library::{Hitch, MemberKind, Rules, Termination, UNSTATED_TERMINATION_EFFICIENCY};
use tautspan_core::units::{Dimension, Sign};

/// The terminations in the library, in the order offered.
pub const TERMINATIONS: [Termination; 5] = [
    Termination::FerruleSecured,
    Termination::HandSplice,
    Termination::WedgeSocket,
    Termination::PouredSocket,
    Termination::WireRopeGrips,
];

/// A labelled choice from a few values in a grid row; the new value when
/// the user picked another one.
pub fn choice<T: PartialEq + Copy>(
    ui: &mut Ui,
    label: &str,
    salt: &str,
    current: T,
    options: &[(T, &str)],
) -> Option<T> {
    let l = ui.label(label);
    let mut chosen = current;
    let text = options.iter().find(|(v, _)| *v == current).map_or("", |(_, t)| *t);
    egui::ComboBox::from_id_salt(salt)
        .selected_text(text)
        .show_ui(ui, |ui| {
            for (v, t) in options {
                ui.selectable_value(&mut chosen, *v, *t);
            }
        })
        .response
        .labelled_by(l.id);
    ui.end_row();
    (chosen != current).then_some(chosen)
}

/// A hitch as offered: not stated, or one of the three.
fn hitch_options() -> [(Option<Hitch>, &'static str); 4] {
    [
        (None, "not stated"),
        (Some(Hitch::Straight), "straight"),
        (Some(Hitch::Choker), "choker"),
        (Some(Hitch::Basket), "basket"),
    ]
}

/// A new hitch on a member. An angle that only the old hitch reads goes
/// with it (a choke angle off a basket): the core would refuse it, and undo
/// brings it back.
pub fn set_hitch(m: &mut MemberDto, hitch: Option<Hitch>) {
    m.hitch = hitch;
    if hitch != Some(Hitch::Choker) {
        m.choke_angle = None;
    }
    if hitch != Some(Hitch::Basket) {
        m.basket_angle = None;
    }
}

/// How the termination is given.
#[derive(Debug, Clone, Copy, PartialEq)]
enum TerminationChoice {
    /// Neither: the core takes the lowest common efficiency and says so.
    Unstated,
    /// One of the library's terminations.
    Library(Termination),
    /// An efficiency of the user's own.
    Own,
}

/// Draw the rigging section for `members[i]`.
pub fn ui(ui: &mut Ui, input: &InspectorInput<'_>, i: usize, bufs: &mut FieldBuffers, out: &mut Vec<Command>) {
    let m = &input.doc.dto.members[i];
    let rope = matches!(m.kind, MemberKind::WireRope | MemberKind::Cable);
    let sling = m.kind != MemberKind::Rod;
    let rules = input.doc.dto.rules.unwrap_or_default();
    let any = m.hitch.is_some()
        || m.termination.is_some()
        || m.termination_efficiency.is_some()
        || m.bent_over.is_some()
        || m.choke_angle.is_some()
        || m.basket_angle.is_some();
    if !sling && !any {
        return;
    }
    ui.separator();
    ui.label(RichText::new("Rigging").strong());
    let p = |s: &str| format!("members[{i}].{s}");
    item_problems(ui, input.derived, &p("hitch"));
    item_problems(ui, input.derived, &p("termination"));
    egui::Grid::new("member-rigging").num_columns(2).show(ui, |ui| {
        if (sling || m.hitch.is_some())
            && let Some(h) = choice(ui, "Hitch", "hitch", m.hitch, &hitch_options())
        {
            out.push(Command::edit(move |d| {
                if let Some(m) = d.members.get_mut(i) {
                    set_hitch(m, h);
                }
            }));
        }
        // under EN a choker has no angle reduction: the field shows only under
        // ASME, or when an angle is written (so the core's refusal is seen)
        if (m.hitch == Some(Hitch::Choker) && rules == Rules::Asme) || m.choke_angle.is_some() {
            QtyField {
                label: "Choke angle",
                path: p("choke_angle"),
                current: m.choke_angle.as_ref(),
                dimension: Dimension::Angle,
                sign: Sign::NonNegative,
                optional: true,
                hint: "e.g. 120 deg",
            }
            .show(
                ui,
                bufs,
                input.derived,
                out,
                Box::new(move |d, q| {
                    if let Some(m) = d.members.get_mut(i) {
                        m.choke_angle = q
                    }
                }),
            );
        }
        if m.hitch == Some(Hitch::Basket) || m.basket_angle.is_some() {
            QtyField {
                label: "Basket legs from vertical",
                path: p("basket_angle"),
                current: m.basket_angle.as_ref(),
                dimension: Dimension::Angle,
                sign: Sign::NonNegative,
                optional: true,
                hint: "legs parallel",
            }
            .show(
                ui,
                bufs,
                input.derived,
                out,
                Box::new(move |d, q| {
                    if let Some(m) = d.members.get_mut(i) {
                        m.basket_angle = q
                    }
                }),
            );
        }
        if rope || m.termination.is_some() || m.termination_efficiency.is_some() {
            termination(ui, input, Line::Member(i), m, out);
        }
        if rope || m.bent_over.is_some() {
            QtyField {
                label: "Bent over (pin D)",
                path: p("bent_over"),
                current: m.bent_over.as_ref(),
                dimension: Dimension::Length,
                sign: Sign::Positive,
                optional: true,
                hint: input.units.unit(Shown::SmallLength),
            }
            .show(
                ui,
                bufs,
                input.derived,
                out,
                Box::new(move |d, q| {
                    if let Some(m) = d.members.get_mut(i) {
                        m.bent_over = q
                    }
                }),
            );
        }
    });
    if m.hitch == Some(Hitch::Choker) && rules == Rules::En {
        ui.label(RichText::new("Rules EN: the choke mode factor has no angle reduction (scenario settings).").weak());
    }
}

/// A wire rope's termination (from the library, or an efficiency of the
/// user's own) in a grid row, for a member or a rope (`m` its fields as written).
pub fn termination(ui: &mut Ui, input: &InspectorInput<'_>, line: Line, m: &MemberDto, out: &mut Vec<Command>) {
    let current = match (m.termination, m.termination_efficiency) {
        (Some(t), _) => TerminationChoice::Library(t),
        (None, Some(_)) => TerminationChoice::Own,
        (None, None) => TerminationChoice::Unstated,
    };
    let mut options: Vec<(TerminationChoice, &str)> = vec![(TerminationChoice::Unstated, "not stated")];
    options.extend(TERMINATIONS.iter().map(|t| (TerminationChoice::Library(*t), t.label())));
    options.push((TerminationChoice::Own, "efficiency of my own"));
    if let Some(c) = choice(ui, "Termination", "termination", current, &options) {
        out.push(Command::edit(move |d| {
            line.edit(d, |m| {
                let (t, e) = match c {
                    TerminationChoice::Unstated => (None, None),
                    TerminationChoice::Library(t) => (Some(t), None),
                    // starts at the value the core takes when none is stated, so the answer does not jump
                    TerminationChoice::Own => (None, Some(UNSTATED_TERMINATION_EFFICIENCY)),
                };
                (*m.termination, *m.termination_efficiency) = (t, e);
            })
        }));
    }
    let Some(mut v) = m.termination_efficiency else { return };
    let l = ui.label("Termination efficiency");
    ui.vertical(|ui| {
        // no range: a value outside 0.01–1 is the core's to refuse, shown below
        let r = ui.add(egui::DragValue::new(&mut v).speed(0.005).max_decimals(3)).labelled_by(l.id);
        if r.changed() {
            out.push(Command::edit_merged(line.path("termination_efficiency"), move |d| {
                line.edit(d, |m| *m.termination_efficiency = Some(v))
            }));
        }
        if r.drag_stopped() || r.lost_focus() {
            out.push(Command::SealUndo);
        }
        for p in input.derived.problems_at(&line.path("termination_efficiency")) {
            ui.label(RichText::new(&p.message).color(crate::fields::qty_field::ERROR).small());
        }
    });
    ui.end_row();
}

#[cfg(test)]
mod tests {
    use super::*;
    use tautspan_core::file::Qty;

    #[test]
    fn a_new_hitch_drops_the_angle_only_the_old_one_reads() {
        let mut m =
            MemberDto { hitch: Some(Hitch::Choker), choke_angle: Some(Qty::from("120 deg")), ..Default::default() };
        set_hitch(&mut m, Some(Hitch::Choker));
        assert!(m.choke_angle.is_some(), "the same hitch keeps its angle");
        set_hitch(&mut m, Some(Hitch::Basket));
        assert_eq!((m.hitch, m.choke_angle.as_ref()), (Some(Hitch::Basket), None));
        m.basket_angle = Some(Qty::from("30 deg"));
        set_hitch(&mut m, None);
        assert_eq!(m.basket_angle, None);
    }
}
