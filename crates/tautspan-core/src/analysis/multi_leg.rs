//! Multi-leg slings beside the standard's rating. EN 818-4 and EN 13414-2
//! rate a sling of three or four legs on a rigid load as if only two legs
//! carried it (a rigid load shares unevenly among more than two legs; from
//! memory, not re-read). Where three or more sling legs come up to one
//! gathering point (a master link or hook), an advisory states that rating
//! side by side with the solve: the standard's vertical capacity
//! `2 × weakest leg's allowable × cos β` (β the largest leg angle from
//! vertical, in the solved geometry) against the vertical load the legs
//! carry, and each leg's solved force. It is advice: the members are still
//! checked each on its own solved force.

use super::results::{CaseResult, Warning};
use crate::model::Scenario;
use crate::units::Sig;

/// Legs the standard counts for a sling of three or more legs on a rigid load.
pub const COUNTED_LEGS: f64 = 2.0;

/// One gathering point: the node, its legs' ids and solved forces, and the
/// two numbers side by side.
#[derive(Debug, Clone, PartialEq)]
pub struct MultiLeg {
    /// Node id of the gathering point.
    pub node: String,
    /// Legs (member ids) with their solved forces, N.
    pub legs: Vec<(String, f64)>,
    /// `2 × weakest allowable × cos β_max`, N.
    pub standard_vertical_n: f64,
    /// The legs' vertical components summed, N.
    pub carried_vertical_n: f64,
    /// Largest leg angle from vertical, degrees.
    pub beta_max_deg: f64,
    /// The weakest leg's allowable, N.
    pub weakest_allowable_n: f64,
}

/// Gathering points of three or more sling legs in a solved case
/// (`legs` from `sling_legs`).
pub fn multi_legs(s: &Scenario, r: &CaseResult, legs: &[bool]) -> Vec<MultiLeg> {
    let y = |k: usize| r.nodes.get(k).map_or_else(|| s.position_m(k)[1], |n| n.position_m[1]);
    let mut at: Vec<Vec<usize>> = vec![Vec::new(); s.nodes.len()];
    for (i, m) in s.members.iter().enumerate() {
        if !legs.get(i).copied().unwrap_or(false) {
            continue;
        }
        let [a, b] = m.ends;
        at[if y(a) >= y(b) { a } else { b }].push(i);
    }
    at.iter()
        .enumerate()
        .filter(|(_, v)| v.len() >= 3)
        .filter_map(|(k, v)| {
            let rs: Vec<_> = v.iter().filter_map(|&i| r.members.get(i)).collect();
            if rs.len() != v.len() {
                return None;
            }
            let weakest = rs.iter().map(|m| m.allowable_n).fold(f64::INFINITY, f64::min);
            let beta_max = rs.iter().map(|m| 90.0 - m.sling_angle_deg).fold(0.0, f64::max);
            let carried: f64 = rs.iter().map(|m| m.force_n.max(0.0) * m.sling_angle_deg.to_radians().sin()).sum();
            Some(MultiLeg {
                node: s.nodes[k].id.clone(),
                legs: rs.iter().map(|m| (m.id.clone(), m.force_n)).collect(),
                standard_vertical_n: COUNTED_LEGS * weakest * beta_max.to_radians().cos(),
                carried_vertical_n: carried,
                beta_max_deg: beta_max,
                weakest_allowable_n: weakest,
            })
        })
        .collect()
}

/// The advisory for each gathering point of three or more legs.
pub fn multi_leg_warnings(s: &Scenario, r: &CaseResult, legs: &[bool]) -> Vec<Warning> {
    multi_legs(s, r, legs)
        .into_iter()
        .map(|g| {
            let shares: Vec<String> =
                g.legs.iter().map(|(id, f)| format!("{id} {} kN", Sig(f / 1e3, 4))).collect();
            let over = g.carried_vertical_n > g.standard_vertical_n;
            Warning {
                kind: super::warning_kind::WarningKind::MultiLeg,
                subject: Some(g.node.clone()),
                message: format!(
                    "gathering point {}: {} sling legs in case {}; EN 818-4 / EN 13414-2 count two legs of a 3- or 4-leg sling on a rigid load (from memory): 2 x weakest leg allowable {} kN x cos {} deg = {} kN vertical, against {} kN carried{}; the solve shares it: {}",
                    g.node,
                    g.legs.len(),
                    r.id,
                    Sig(g.weakest_allowable_n / 1e3, 4),
                    Sig(g.beta_max_deg, 3),
                    Sig(g.standard_vertical_n / 1e3, 4),
                    Sig(g.carried_vertical_n / 1e3, 4),
                    if over { " (OVER the two-leg rating)" } else { "" },
                    shares.join(", ")
                ),
            }
        })
        .collect()
}
