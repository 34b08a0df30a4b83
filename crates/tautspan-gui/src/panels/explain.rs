//! Hover explanations of results, so an inspector can follow every number:
//! the allowable's formula with its inputs and the design factor's source,
//! the stiffness, the case's dynamic load and its formula. All text is the
//! core's own (notes on the model, explanations of the analysis).

use crate::document::core_bridge::{Solved, allowable_explanation, compression_explanation};
use crate::fields::units_display::{Shown, UnitSystem, fmt_utilisation};

/// The explanation of a member's result in a case.
pub fn member_result(solved: &Solved, case_id: &str, member_id: &str, units: UnitSystem) -> String {
    let s = &solved.scenario;
    let Some(idx) = s.members.iter().position(|m| m.id == member_id) else { return String::new() };
    let m = &s.members[idx];
    let case = solved.analysis.cases.iter().find(|c| c.id == case_id);
    let r = case.and_then(|c| c.members.iter().find(|r| r.id == member_id));
    let mut lines = Vec::new();
    if let Some(r) = r {
        lines.push(format!(
            "Utilisation = |force| / allowable = {} / {} = {} ({})",
            units.fmt(r.force_n.abs(), Shown::Force),
            units.fmt(r.allowable_n, Shown::Force),
            fmt_utilisation(r.utilisation),
            r.state.as_str()
        ));
        lines.push(format!(
            "Stretch {} over length {}; sling angle {:.1}° from horizontal.",
            units.fmt(r.stretch_m, Shown::SmallLength),
            units.fmt(r.length_m, Shown::Length),
            r.sling_angle_deg
        ));
    }
    lines.push(format!("Allowable: {}", allowable_explanation(s, idx)));
    if let Some(c) = compression_explanation(s, idx) {
        lines.push(format!("In compression: {c}"));
    }
    if let Some(reason) = r.and_then(|r| r.reason.as_ref()) {
        lines.push(format!("Unchecked: {reason}"));
    }
    lines.push(format!(
        "Design factor {}{}; default {} from {}.",
        m.design_factor.value,
        if m.design_factor.from_file { " (set in the file)" } else { " (the default)" },
        m.design_factor.default.value,
        m.design_factor.default.source
    ));
    lines.push(format!("Stiffness: {}.", m.stiffness_note));
    lines.push(format!("Rating: {}.", m.rating_note));
    lines.push(format!("Efficiency: {}.", m.efficiency_note));
    if let Some(d) = case.and_then(|c| c.dynamic.as_ref()) {
        lines.push(format!(
            "Case load on {}: {} × weight = {} — {}",
            d.mass,
            tautspan_core::units::format_number(d.factor, 4),
            units.fmt(d.load_n, Shown::Force),
            d.formula
        ));
    }
    if let Some(c) = case {
        lines.push(format!(
            "Solver: {} in {} iterations, residual {}.",
            if c.converged { "converged" } else { "NOT converged" },
            c.iterations,
            units.fmt(c.residual_n, Shown::Force)
        ));
    }
    lines.join("\n")
}
