//! Per-case details: what the case is, whether it solved, the dynamic load
//! factor and the formula it came from, each member's and floor's result
//! and the case's own warnings.

use super::comparison::state_word;
use super::escape::escape;
use super::parts::case_parts;
use super::table::{NONE, table, with_note};
use super::unit_system::{UnitSystem, degrees, number, percent};
use super::warnings::{case_items, item};
use crate::analysis::{ALL_MASSES, Analysis, CaseResult, DynamicLoad, LOAD_PATH_THRESHOLD, LoadPathResult, State};
use crate::model::{Case, Scenario};

/// The per-case section.
pub fn cases(scenario: &Scenario, analysis: &Analysis, units: UnitSystem) -> String {
    let body: String = analysis.cases.iter().map(|c| one(scenario, c, units)).collect();
    let body = if body.is_empty() { "<p>The scenario has no cases.</p>".to_string() } else { body };
    format!("<section id=\"cases\" class=\"page-start\"><h2>Cases in detail</h2>{body}</section>")
}

fn one(scenario: &Scenario, c: &CaseResult, units: UnitSystem) -> String {
    let mut s = format!("<section class=\"case\"><h3>Case {} ({})</h3>", escape(&c.id), escape(&c.kind));
    s.push_str(&format!("<p>{}</p>", describe(scenario, &c.id, units)));
    s.push_str(&solve_line(c, units));
    if let Some(d) = &c.dynamic {
        s.push_str(&dynamic(d, units));
    }
    if !c.members.is_empty() {
        s.push_str(&members(c, units));
    }
    if !c.floors.is_empty() {
        s.push_str(&floors(c, units));
    }
    s.push_str(&case_parts(c, units));
    s.push_str(&load_paths(c));
    if !c.supports.is_empty() {
        s.push_str(&supports(c, units));
    }
    let w = case_items(c);
    if !w.is_empty() {
        s.push_str(&format!("<ul class=\"warnings\">{}</ul>", w.iter().map(|w| item(None, w)).collect::<String>()));
    }
    s.push_str("</section>");
    s
}

/// The case as the scenario defines it, in words.
fn describe(scenario: &Scenario, id: &str, units: UnitSystem) -> String {
    let mass = |i: usize| scenario.masses.get(i).map_or_else(String::new, |m| escape(&m.id));
    let node = |i: usize| scenario.nodes.get(i).map_or_else(String::new, |n| escape(&n.id));
    match scenario.cases.iter().find(|c| c.id() == id) {
        Some(Case::Static { .. }) => "Hanging still under gravity.".to_string(),
        Some(Case::Swing { mass: m, release, pivot, azimuth, .. }) => format!(
            "Mass {} released from rest at {} from the vertical{}; checked over the whole arc from -{r} to +{r} in the plane at azimuth {}, each member, floor and support at its own peak (the angle is in the table).",
            mass(*m),
            degrees(release.value.to_degrees()),
            pivot.map_or_else(String::new, |p| format!(" about node {}", node(p))),
            degrees(azimuth.value.to_degrees()),
            r = degrees(release.value.to_degrees()),
        ),
        Some(Case::Drop { mass: m, height, .. }) => {
            format!("Mass {} falls freely {} before the path takes it.", mass(*m), units.length(height.value))
        }
        Some(Case::Sudden { mass: m, .. }) => {
            format!("The weight of mass {} applied suddenly (a drop of zero height).", mass(*m))
        }
        None => String::new(),
    }
}

fn solve_line(c: &CaseResult, units: UnitSystem) -> String {
    let status = if c.converged { "converged" } else { "did not converge" };
    let mut s = format!(
        "<p>Solver: {status} in {} iterations, out-of-balance force {}.</p>",
        c.iterations,
        units.force(c.residual_n)
    );
    if let Some(e) = &c.error {
        s.push_str(&format!("<p class=\"state-over\">Not solved: {}</p>", escape(e)));
    }
    s
}

fn dynamic(d: &DynamicLoad, units: UnitSystem) -> String {
    let stiffness = d
        .path_stiffness_n_per_m
        .map_or_else(String::new, |k| format!("; path stiffness at the mass {}", units.spring(k)));
    format!(
        "<p>Dynamic load on mass {}: factor {} on its weight, {}{stiffness}.<br><span class=\"note\">{}</span></p>",
        escape(&d.mass),
        number(d.factor),
        units.force(d.load_n),
        escape(&d.formula)
    )
}

/// Above this many members a case shows a summary (members by state and
/// the most utilised) with the full table behind a disclosure.
pub const LARGE_RIG_MEMBERS: usize = 100;

/// Rows of the most utilised members shown in a large rig's summary.
const MOST_UTILISED: usize = 10;

fn members(c: &CaseResult, units: UnitSystem) -> String {
    let full = members_table(c, units, &(0..c.members.len()).collect::<Vec<_>>());
    if c.members.len() <= LARGE_RIG_MEMBERS {
        return full;
    }
    let states = [State::Over, State::Unchecked, State::Near, State::Slack, State::Ok];
    let counts: Vec<String> = states
        .iter()
        .map(|st| (st, c.members.iter().filter(|m| m.state == *st).count()))
        .filter(|(_, n)| *n > 0)
        .map(|(st, n)| format!("{n} {}", state_word(*st)))
        .collect();
    let mut order: Vec<usize> = (0..c.members.len()).collect();
    order.sort_by(|&a, &b| c.members[b].utilisation.total_cmp(&c.members[a].utilisation));
    order.truncate(MOST_UTILISED);
    format!(
        "<p>{} members: {}. The {} most utilised:</p>{}<details><summary>All {} members</summary>{full}</details>",
        c.members.len(),
        counts.join(", "),
        order.len(),
        members_table(c, units, &order),
        c.members.len()
    )
}

fn members_table(c: &CaseResult, units: UnitSystem, which: &[usize]) -> String {
    let struts = c.members.iter().any(|m| m.euler_n.is_some() || m.reason.is_some());
    let rows: Vec<Vec<String>> = which
        .iter()
        .map(|&k| {
            let m = &c.members[k];
            let mut row = vec![
                format!("<b>{}</b>", escape(&m.id)),
                units.force(m.force_n),
                units.force(m.allowable_n),
                percent(m.utilisation),
                state_word(m.state),
                units.small_length(m.stretch_m),
                units.length(m.length_m),
                degrees(m.sling_angle_deg),
            ];
            if struts {
                row.push(m.euler_n.map_or_else(|| NONE.to_string(), |v| units.force(v)));
                let resistance = m.buckling_resistance_n.map_or_else(|| NONE.to_string(), |v| units.force(v));
                row.push(match &m.reason {
                    Some(r) => with_note(&resistance, &escape(r)),
                    None => resistance,
                });
            }
            if c.arc.is_some() {
                row.push(m.peak_at_deg.map_or_else(|| NONE.to_string(), degrees));
            }
            row
        })
        .collect();
    let mut head = vec![
        "Member",
        "Force",
        "Allowable",
        "Utilisation",
        "State",
        "Stretch",
        "Length",
        "Sling angle (from horizontal)",
    ];
    if struts {
        head.extend(["Euler load", "Buckling resistance χ·A·f<sub>y</sub>"]);
    }
    if c.arc.is_some() {
        head.push("Peak at (arc angle)");
    }
    table("case-members", &head, &rows)
}

fn floors(c: &CaseResult, units: UnitSystem) -> String {
    let rows: Vec<Vec<String>> = c
        .floors
        .iter()
        .map(|f| {
            vec![
                format!("<b>{}</b>", escape(&f.id)),
                units.force(f.normal_force_n),
                units.force(f.allowable_n),
                units.small_length(f.deflection_m),
                if f.deflection_limit_m > 0.0 { units.small_length(f.deflection_limit_m) } else { NONE.to_string() },
                percent(f.utilisation),
                state_word(f.state),
            ]
        })
        .collect();
    let head = ["Floor", "Normal force", "Allowable", "Deflection", "Deflection limit", "Utilisation", "State"];
    let feet: Vec<Vec<String>> = c
        .floors
        .iter()
        .flat_map(|f| {
            f.feet.iter().map(move |x| {
                vec![
                    format!("<b>{}</b>", escape(&f.id)),
                    escape(&x.node),
                    units.force(x.normal_force_n),
                    units.force(x.horizontal_n),
                    x.friction_required
                        .map_or_else(|| NONE.to_string(), |m| format!("{m:.3} (limit {:.2})", f.friction_limit)),
                    x.bearing_pressure_pa.map_or_else(|| NONE.to_string(), |p| units.floor_pressure(p)),
                    x.utilisation.map_or_else(|| NONE.to_string(), percent),
                    state_word(x.state),
                ]
            })
        })
        .collect();
    let feet_head =
        ["Floor", "Foot", "Normal force", "Horizontal", "Friction needed", "Bearing pressure", "Utilisation", "State"];
    let mut out = table("case-floors", &head, &rows);
    if !feet.is_empty() {
        out.push_str(&table("case-feet", &feet_head, &feet));
    }
    out
}

/// Above this many masses the per-mass paths go behind a disclosure.
const MANY_MASSES: usize = 10;

/// One path's paragraph: its members and supports with their shares, the
/// counts below the threshold, and the weight not traced where it is worth
/// saying.
fn path_paragraph(p: &LoadPathResult) -> String {
    let share = |ids: &[String], shares: &[f64]| {
        ids.iter().zip(shares).map(|(id, f)| format!("{} {}", escape(id), percent(*f))).collect::<Vec<_>>().join(", ")
    };
    let mut below = String::new();
    if p.not_listed > 0 {
        below.push_str(&format!(" ({} more at or above {})", p.not_listed, percent(LOAD_PATH_THRESHOLD)));
    }
    if p.below_threshold > 0 {
        below.push_str(&format!(" ({} more members below {} each)", p.below_threshold, percent(LOAD_PATH_THRESHOLD)));
    }
    let untraced = if p.untraced_worth_saying() {
        format!(
            " {} of the weight is not traced to a support ({}).",
            percent(p.untraced),
            LoadPathResult::UNTRACED_REASON
        )
    } else {
        String::new()
    };
    format!(
        "<p>Load path of {}: members {}{below} to supports {}.{untraced}</p>",
        if p.mass == ALL_MASSES {
            "all masses together".to_string()
        } else {
            format!("mass <b>{}</b>", escape(&p.mass))
        },
        if p.members.is_empty() { "none".to_string() } else { share(&p.members, &p.shares) },
        if p.supports.is_empty() { "none".to_string() } else { share(&p.supports, &p.support_shares) }
    )
}

fn load_paths(c: &CaseResult) -> String {
    let one = path_paragraph;
    let per_mass: String = c.load_path.iter().map(one).collect();
    match &c.combined_load_path {
        Some(all) if c.load_path.len() > MANY_MASSES => format!(
            "{}<details><summary>The load path of each of the {} masses</summary>{per_mass}</details>",
            one(all),
            c.load_path.len()
        ),
        _ => per_mass,
    }
}

fn supports(c: &CaseResult, units: UnitSystem) -> String {
    let rows: Vec<Vec<String>> = c
        .supports
        .iter()
        .map(|s| {
            let r = s.reaction_n;
            vec![format!("<b>{}</b>", escape(&s.node)), units.force(r[0]), units.force(r[1]), units.force(r[2])]
        })
        .collect();
    table("case-supports", &["Support", "Reaction x", "Reaction y", "Reaction z"], &rows)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn path(untraced: f64) -> LoadPathResult {
        LoadPathResult::one_member(untraced)
    }

    // The untraced part is said from the listing threshold (1 %) up, with
    // its reason; below it the line is as before.
    #[test]
    fn untraced_weight_is_said_from_one_percent() {
        let html = path_paragraph(&path(0.25));
        assert!(html.contains("25\u{a0}% of the weight is not traced to a support (flows too small"), "{html}");
        assert!(!path_paragraph(&path(0.005)).contains("not traced"));
    }
}
