//! The multi-leg sling helper: the user clicks a hook point and 2 to 4
//! pick points on the canvas (in plan, typically), chooses what the legs
//! are (a copy of a member already drawn, or a library rope or chain whose
//! size and grade are in the library's tables; nothing is chosen for the
//! user), sees the legs' lengths and their mismatch, and places the legs as
//! one edit. Once solved it shows each leg's force and share of the load
//! beside the standard's rating of the sling, which for 3 and 4 legs counts
//! only two legs as carrying the load (the core's multi-leg advisory, shown
//! as the core words it).

use crate::canvas::CanvasState;
use crate::canvas::geometry::Geometry;
use crate::canvas::input::CanvasInput;
use crate::document::command::Command;
use crate::document::edits;
use crate::document::selection::Selection;
use crate::fields::units_display::{Shown, UnitSystem};
use egui::{RichText, Ui};
use tautspan_core::analysis::WarningKind;
use tautspan_core::file::{MemberDto, ScenarioDto};
use tautspan_core::library::MemberKind;

/// Most pick points a sling of the standard's table has.
pub const MAX_PICKS: usize = 4;

/// What the legs are made of.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum LegSource {
    /// A copy of this member (kind, size, grade, rating, fittings).
    Like(String),
    /// A new member of this kind as the library sizes it.
    Library(MemberKind),
}

/// The helper's state between frames.
#[derive(Debug, Clone, Default)]
pub struct SlingHelper {
    /// The helper's window is open.
    pub open: bool,
    /// Canvas clicks on nodes go to the helper.
    pub picking: bool,
    /// The hook point, then the pick points, as node ids.
    pub points: Vec<String>,
    /// What the legs are made of, once the user has chosen.
    pub source: Option<LegSource>,
}

impl SlingHelper {
    /// Open (starting afresh) or close the helper.
    pub fn toggle(&mut self) {
        *self = SlingHelper { open: !self.open, picking: !self.open, ..SlingHelper::default() };
    }

    /// A node clicked while picking: the hook first, then up to four pick points.
    pub fn pick(&mut self, id: String) {
        if !self.points.contains(&id) && self.points.len() < 1 + MAX_PICKS {
            self.points.push(id);
        }
    }

    /// The hook and the pick points so far.
    pub fn route(&self) -> &[String] {
        &self.points
    }
}

/// The library members offered as legs: only those whose size and grade
/// are in the library's tables in the display units (a size chosen for the
/// user outside a table would be no default at all).
fn library_choices(units: UnitSystem) -> Vec<MemberKind> {
    match units {
        // 12 mm 6x19 IWRC 1770 (wire rope table) and 10 mm grade 80 (EN 818-2 table)
        UnitSystem::Si => vec![MemberKind::WireRope, MemberKind::Chain],
        UnitSystem::UsCustomary => Vec::new(),
    }
}

fn describe(m: &MemberDto) -> String {
    let mut parts = vec![m.kind.label().to_lowercase()];
    parts.extend(m.diameter.as_ref().map(|d| d.0.clone()));
    parts.extend(m.construction.clone());
    parts.extend(m.grade.as_ref().map(|g| format!("grade {g}")));
    parts.join(" ")
}

fn source_label(s: &LegSource, units: UnitSystem) -> String {
    match s {
        LegSource::Like(id) => format!("like member {id}"),
        LegSource::Library(k) => {
            format!("library {}", describe(&edits::default_member(String::new(), "", "", *k, units)))
        }
    }
}

/// The legs as placed: each a member from the hook to a pick point.
fn place_legs(d: &mut ScenarioDto, points: &[String], source: &LegSource, units: UnitSystem) -> Selection {
    let Some((hook, picks)) = points.split_first() else { return Selection::None };
    let like = match source {
        LegSource::Like(id) => d.members.iter().find(|m| &m.id == id).cloned(),
        LegSource::Library(_) => None,
    };
    let mut first = None;
    for p in picks {
        let id = match (&like, source) {
            (Some(m), _) => {
                let taken = d.members.iter().map(|m| m.id.as_str()).chain(d.ropes.iter().map(|r| r.id.as_str()));
                let id = edits::fresh_id("leg", taken);
                d.members.push(MemberDto { id: id.clone(), ends: (hook.clone(), p.clone()), ..m.clone() });
                id
            }
            (None, LegSource::Library(k)) => edits::add_member(d, hook, p, *k, units),
            (None, LegSource::Like(_)) => continue,
        };
        first.get_or_insert(id);
    }
    first.map_or(Selection::None, Selection::Member)
}

/// The leg member between the hook and a pick point, if placed.
fn leg_between<'a>(dto: &'a ScenarioDto, hook: &str, pick: &str) -> Option<&'a MemberDto> {
    dto.members.iter().find(|m| (m.ends.0 == hook && m.ends.1 == pick) || (m.ends.0 == pick && m.ends.1 == hook))
}

fn distance(geo: &Geometry, a: &str, b: &str) -> Option<f64> {
    let (a, b) = (geo.node(a)?.xyz_m, geo.node(b)?.xyz_m);
    Some(((a[0] - b[0]).powi(2) + (a[1] - b[1]).powi(2) + (a[2] - b[2]).powi(2)).sqrt())
}

/// The helper's window.
pub fn window(ui: &mut Ui, state: &mut CanvasState, drawn: &Geometry, input: &CanvasInput<'_>, out: &mut Vec<Command>) {
    let helper = &mut state.sling;
    if !helper.open {
        return;
    }
    let units = input.units;
    let mut open = true;
    egui::Window::new("Multi-leg sling")
        .open(&mut open)
        .default_pos(ui.max_rect().right_top() + egui::vec2(-360.0, 60.0))
        .resizable(false)
        .show(ui.ctx(), |ui| {
            let points = helper.points.clone();
            let (hook, picks) = match points.split_first() {
                Some((h, p)) => (Some(h.as_str()), p),
                None => (None, &[][..]),
            };
            let step = match (hook, picks.len()) {
                (None, _) => "Click the hook point (the node the legs gather at).".to_string(),
                (Some(_), n) if n < MAX_PICKS => format!("Click pick point {} (plan is the handy view).", n + 1),
                _ => "Four pick points: the most a sling of the tables has.".to_string(),
            };
            ui.label(step);
            ui.label(format!("Hook: {}", hook.unwrap_or("—")));
            ui.label(format!("Pick points: {}", if picks.is_empty() { "—".to_string() } else { picks.join(", ") }));
            // leg lengths and their mismatch
            let lengths: Vec<f64> =
                hook.map_or_else(Vec::new, |h| picks.iter().filter_map(|p| distance(drawn, h, p)).collect());
            for (p, l) in picks.iter().zip(&lengths) {
                ui.label(format!("leg to {p}: {}", units.fmt(*l, Shown::Length)));
            }
            if lengths.len() >= 2 {
                let (lo, hi) = lengths.iter().fold((f64::INFINITY, 0.0f64), |(a, b), l| (a.min(*l), b.max(*l)));
                ui.label(format!(
                    "Leg-length mismatch: {} ({:.1} % of the shortest leg)",
                    units.fmt(hi - lo, Shown::Length),
                    (hi - lo) / lo * 100.0
                ));
            }
            // what the legs are made of: the user chooses
            let l = ui.label("Legs");
            let selected = helper.source.as_ref().map_or_else(|| "choose…".to_string(), |s| source_label(s, units));
            egui::ComboBox::from_id_salt("sling-legs")
                .selected_text(selected)
                .show_ui(ui, |ui| {
                    for m in input.doc.dto.members.iter().take(60) {
                        let s = LegSource::Like(m.id.clone());
                        let text = format!("like member {} ({})", m.id, describe(m));
                        ui.selectable_value(&mut helper.source, Some(s), text);
                    }
                    for k in library_choices(units) {
                        let s = LegSource::Library(k);
                        let text = source_label(&s, units);
                        ui.selectable_value(&mut helper.source, Some(s), text);
                    }
                })
                .response
                .labelled_by(l.id);
            if library_choices(units).is_empty() {
                ui.label(RichText::new("No library leg in US sizes: copy a member drawn with its rating.").small());
            }
            let ready = hook.is_some() && picks.len() >= 2 && helper.source.is_some();
            ui.horizontal(|ui| {
                if ui.add_enabled(ready, egui::Button::new("Place legs")).clicked()
                    && let Some(source) = helper.source.clone()
                {
                    let points = points.clone();
                    out.push(Command::place(move |d| place_legs(d, &points, &source, units)));
                    helper.picking = false;
                }
                if ui.button("Start again").clicked() {
                    helper.points.clear();
                    helper.picking = true;
                }
            });
            if let Some(h) = hook {
                results(ui, input, h, picks);
            }
        });
    if !open {
        state.sling = SlingHelper::default();
    }
}

/// The placed legs' solved forces and shares beside the standard's rating.
fn results(ui: &mut Ui, input: &CanvasInput<'_>, hook: &str, picks: &[String]) {
    let dto = &input.doc.dto;
    let legs: Vec<&MemberDto> = picks.iter().filter_map(|p| leg_between(dto, hook, p)).collect();
    if legs.len() < 2 {
        return;
    }
    let Some(case) = input.derived.case(input.case) else { return };
    ui.separator();
    ui.label(RichText::new(format!("Solved, case {}", case.id)).strong());
    let forces: Vec<(String, f64, f64)> = legs
        .iter()
        .filter_map(|m| case.members.iter().find(|r| r.id == m.id))
        .map(|r| (r.id.clone(), r.force_n, r.force_n.max(0.0) * r.sling_angle_deg.to_radians().sin()))
        .collect();
    let vertical: f64 = forces.iter().map(|f| f.2).sum();
    for (id, f, v) in &forces {
        let share = if vertical > 0.0 { v / vertical * 100.0 } else { 0.0 };
        ui.label(format!("{id}: {}, {share:.1} % of the load", input.units.fmt(*f, Shown::Force)));
    }
    if legs.len() >= 3 {
        ui.label(
            "The standard's rating of a 3- or 4-leg sling counts only two legs as carrying the load \
             (a rigid load shares unevenly); each leg is still checked on its solved force.",
        );
        let advice =
            case.warning_items.iter().find(|w| w.kind == WarningKind::MultiLeg && w.subject.as_deref() == Some(hook));
        match advice {
            Some(w) => ui.label(RichText::new(&w.message).small()),
            None => ui.label(RichText::new("The solve does not count these legs as one sling (no advisory).").small()),
        };
    } else {
        ui.label("Two legs: each leg is rated on its own solved force.");
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn legs_copied_from_a_member_take_its_sizing_and_fresh_ids() {
        let mut d = ScenarioDto::default();
        let like = edits::default_member("bridle".to_string(), "X", "Y", MemberKind::Chain, UnitSystem::Si);
        d.members.push(like.clone());
        let points: Vec<String> = ["H", "P1", "P2", "P3"].map(String::from).to_vec();
        let picked = place_legs(&mut d, &points, &LegSource::Like("bridle".into()), UnitSystem::Si);
        assert_eq!(picked, Selection::Member("leg1".into()));
        let legs: Vec<&MemberDto> = d.members.iter().skip(1).collect();
        assert_eq!(legs.iter().map(|m| m.id.as_str()).collect::<Vec<_>>(), ["leg1", "leg2", "leg3"]);
        for (m, p) in legs.iter().zip(["P1", "P2", "P3"]) {
            assert_eq!(m.ends, ("H".to_string(), p.to_string()));
            assert_eq!((m.kind, &m.diameter, &m.grade), (like.kind, &like.diameter, &like.grade));
        }
    }

    #[test]
    fn the_helper_takes_a_hook_and_at_most_four_distinct_pick_points() {
        let mut s = SlingHelper::default();
        s.toggle();
        assert!(s.open && s.picking);
        for id in ["H", "P1", "P1", "P2", "P3", "P4", "P5"] {
            s.pick(id.to_string());
        }
        assert_eq!(s.route(), ["H", "P1", "P2", "P3", "P4"]);
        s.toggle();
        assert!(!s.open && s.route().is_empty());
    }

    #[test]
    fn no_library_leg_is_offered_outside_the_tables() {
        assert!(library_choices(UnitSystem::UsCustomary).is_empty());
        assert_eq!(library_choices(UnitSystem::Si), [MemberKind::WireRope, MemberKind::Chain]);
    }
}
