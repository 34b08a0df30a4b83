//! The results grid: every member, rated part (fittings, anchor ratings),
//! floor, floor foot and unrated anchor reaction in every case — force,
//! allowable or WLL, utilisation, state and the limits (largest release
//! angle, largest drop height) — sortable by any column, filtered to the
//! items over, near or unchecked and to each item's worst case, and
//! exported as CSV as shown (`results_rows.rs` builds the rows). A click on
//! a row selects its item; hovering a row explains the numbers.

use crate::document::command::Command;
use crate::document::derived::Derived;
use crate::document::selection::Selection;
use crate::fields::units_display::{Shown, UnitSystem, fmt_utilisation};
use crate::panels::results_rows::{Column, Filter, Row, RowKind, Sort, all_rows, csv, shown_order};
use crate::panels::warning_severity::{NEAR_AMBER, OVER_RED, UNCHECKED_VIOLET};
use egui::{RichText, Ui};
use std::sync::Arc;
use tautspan_core::analysis::State;

/// The grid's sort and filters, kept for the session.
#[derive(Debug, Clone, PartialEq, Eq, Default)]
pub struct ResultsView {
    /// Sorting.
    pub sort: Sort,
    /// Which rows.
    pub filter: Filter,
    /// The rows shown, in order, for the results, filter and sort they were
    /// found for (the results by their allocation: a new analysis is a new one).
    order: Option<(usize, Filter, Sort, Vec<usize>)>,
}

const COLUMNS: [(&str, Column, f32); 6] = [
    ("Item", Column::Member, 170.0),
    ("Case", Column::Case, 100.0),
    ("Force", Column::Force, 100.0),
    ("Allowable", Column::Allowable, 100.0),
    ("Utilisation", Column::Utilisation, 90.0),
    ("State", Column::State, 80.0),
];

/// Width of the limits column, pt.
const LIMITS_W: f32 = 170.0;

/// A state's word, coloured: over red, near amber, unchecked violet.
pub fn state_text(state: Option<State>) -> RichText {
    let Some(s) = state else { return RichText::new("not checked").weak() };
    let t = RichText::new(s.as_str());
    match s {
        State::Over => t.strong().color(OVER_RED),
        State::Near => t.strong().color(NEAR_AMBER),
        State::Unchecked => t.strong().color(UNCHECKED_VIOLET),
        State::Slack | State::Ok => t,
    }
}

/// A label of a fixed width, cut with "…" rather than widening its column.
fn cell(ui: &mut Ui, w: f32, h: f32, text: impl Into<egui::WidgetText>) {
    ui.add_sized([w, h], egui::Label::new(text).truncate());
}

/// Draw the grid.
pub fn ui(
    ui: &mut Ui,
    derived: &Derived,
    selection: &Selection,
    view: &mut ResultsView,
    units: UnitSystem,
    out: &mut Vec<Command>,
) {
    let Some(solved) = derived.solved.as_ref() else {
        ui.label("No results: the scenario has problems (listed beside the fields and in the warnings).");
        return;
    };
    let a = &solved.analysis;
    let all = all_rows(a);
    let key = Arc::as_ptr(solved) as usize;
    let order = match view.order.take() {
        Some((k, f, s, order)) if k == key && f == view.filter && s == view.sort => order,
        _ => shown_order(&all, view.filter, view.sort),
    };
    view.order = Some((key, view.filter, view.sort, order.clone()));
    let rows: Vec<&Row<'_>> = order.iter().filter_map(|&i| all.get(i)).collect();
    ui.horizontal(|ui| {
        ui.checkbox(&mut view.filter.problems_only, "Over / near / unchecked only");
        ui.checkbox(&mut view.filter.worst_per_item, "Worst case per item");
        ui.label(RichText::new(format!("{} rows", rows.len())).weak());
        if ui.button("Export CSV…").on_hover_text("Write the rows shown to a CSV file").clicked() {
            let shown: Vec<Row<'_>> = rows.iter().map(|r| (*r).clone()).collect();
            out.push(Command::ExportCsv(csv(a, &shown, units)));
        }
    });
    ui.horizontal(|ui| {
        for (name, col, w) in COLUMNS {
            let arrow = if view.sort.column == col { if view.sort.descending { " v" } else { " ^" } } else { "" };
            let b = ui.add_sized([w, 20.0], egui::Button::new(RichText::new(format!("{name}{arrow}")).strong()));
            if b.on_hover_text(format!("Sort by {}", name.to_lowercase())).clicked() {
                if view.sort.column == col {
                    view.sort.descending = !view.sort.descending;
                } else {
                    view.sort = Sort {
                        column: col,
                        descending: matches!(col, Column::Force | Column::Utilisation | Column::State),
                    };
                }
            }
        }
        ui.add_sized([LIMITS_W, 20.0], egui::Label::new(RichText::new("Limits").strong()));
    });
    ui.separator();
    let row_h = 18.0;
    egui::ScrollArea::vertical().auto_shrink([false, false]).show_rows(ui, row_h, rows.len(), |ui, range| {
        for &r in &rows[range] {
            let case = &a.cases[r.case];
            let resp = ui.horizontal(|ui| {
                // a part selects what it belongs to: its member, else its node
                let target = match r.kind {
                    RowKind::Floor | RowKind::Foot => Selection::Floor(r.owner.to_string()),
                    RowKind::Reaction => Selection::Node(r.owner.to_string()),
                    RowKind::Member | RowKind::Part => {
                        // a member's row is its own; a part's owner is its member or node
                        if r.kind == RowKind::Member || case.members.iter().any(|m| m.id == *r.owner) {
                            // ropes are among the members' results
                            Selection::of_member_result(&solved.scenario, &r.owner)
                        } else {
                            Selection::Node(r.owner.to_string())
                        }
                    }
                };
                let picked = matches!(r.kind, RowKind::Member | RowKind::Floor) && *selection == target;
                let b = egui::Button::selectable(picked, r.id.as_ref()).truncate();
                if ui.add_sized([COLUMNS[0].2, row_h], b).clicked() {
                    out.push(Command::Select(target));
                    out.push(Command::ShowCase(case.id.clone()));
                }
                cell(ui, COLUMNS[1].2, row_h, case.id.as_str());
                cell(ui, COLUMNS[2].2, row_h, units.fmt(r.force_n, Shown::Force));
                let allowable = r.allowable_n.map_or_else(|| "–".to_string(), |v| units.fmt(v, Shown::Force));
                cell(ui, COLUMNS[3].2, row_h, allowable);
                cell(ui, COLUMNS[4].2, row_h, r.utilisation.map_or_else(|| "–".to_string(), fmt_utilisation));
                cell(ui, COLUMNS[5].2, row_h, state_text(r.state));
                // the comparison lists the members in their order: looked up
                // by position first, so a row does not scan every member
                let limits = (r.kind == RowKind::Member)
                    .then(|| {
                        a.comparison
                            .get(r.order.saturating_sub(1))
                            .filter(|row| row.id == *r.id)
                            .or_else(|| a.comparison.iter().find(|row| row.id == *r.id))
                            .map(|row| &row.limits)
                    })
                    .flatten();
                let text = limits
                    .map(|l| {
                        let mut parts = Vec::new();
                        if case.kind == "swing"
                            && let Some(d) = l.release_deg
                        {
                            parts.push(format!("release ≤ {d:.1}°"));
                        }
                        if (case.kind == "drop" || case.kind == "sudden")
                            && let Some(h) = l.drop_height_m
                        {
                            parts.push(format!("drop ≤ {}", units.fmt(h, Shown::SmallLength)));
                        }
                        parts.join(", ")
                    })
                    .unwrap_or_default();
                cell(ui, LIMITS_W, row_h, text);
            });
            resp.response.on_hover_ui(|ui| {
                ui.set_max_width(520.0);
                match (r.kind, r.part, r.foot) {
                    (_, Some(p), _) => crate::panels::parts_view::part(ui, p, units),
                    (_, _, Some((f, x))) => {
                        let mu = x.friction_required.map_or_else(|| "–".to_string(), |m| format!("{m:.3}"));
                        ui.label(format!(
                            "Foot {} on {}: normal force {}, friction needed {mu} (the floor's limit {:.2}).",
                            x.node,
                            f.id,
                            units.fmt(x.normal_force_n, Shown::Force),
                            f.friction_limit
                        ));
                        if let Some(why) = &x.reason {
                            ui.label(why);
                        }
                    }
                    (RowKind::Floor, _, _) => {
                        ui.label(format!(
                            "Floor {}: normal force of all its feet {}, largest deflection {} (limit {}).",
                            r.id,
                            units.fmt(r.force_n, Shown::Force),
                            case.floors
                                .iter()
                                .find(|f| f.id == *r.id)
                                .map_or_else(String::new, |f| units.fmt(f.deflection_m, Shown::SmallLength)),
                            case.floors
                                .iter()
                                .find(|f| f.id == *r.id)
                                .map_or_else(String::new, |f| units.fmt(f.deflection_limit_m, Shown::SmallLength)),
                        ));
                    }
                    (RowKind::Reaction, _, _) => {
                        ui.label("The anchor's reaction: shown, not checked (the anchor has no rating entered).");
                    }
                    _ => {
                        ui.label(crate::panels::explain::member_result(solved, &case.id, &r.id, units));
                    }
                }
            });
        }
    });
}
