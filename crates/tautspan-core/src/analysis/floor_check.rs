//! One floor in one equilibrium: each foot's normal force, the horizontal
//! reaction it needs and the friction coefficient that takes (against the
//! floor's limit), its bearing pressure and its check against the rated
//! concentrated load; the floor's total against the rated uniform load ×
//! area (necessary, not sufficient), and the largest deflection over the
//! whole panel against span / limit.

use super::allowable::NEEDS_RATED_POINT;
use super::evaluate::Allowables;
use super::results::{FloorResult, FootResult, State};
use crate::model::{Floor, Scenario};
use crate::solve::Equilibrium;
use crate::units::format_number;

fn state_of(utilisation: f64, near: f64) -> State {
    if utilisation > 1.0 + 1e-9 {
        State::Over
    } else if utilisation >= near {
        State::Near
    } else {
        State::Ok
    }
}

/// Largest deflection over the panel (m) and where in plan (x, z), m:
/// the plate's field searched over the panel, and never less than the
/// deflection under a foot from the flexibility the solver used.
fn largest_deflection(f: &Floor, forces: &[f64]) -> (f64, [f64; 2]) {
    let [ox, oz] = [f.origin[0].value, f.origin[1].value];
    let Some(plate) = &f.plate else { return (0.0, [ox + 0.5 * f.span[0].value, oz + 0.5 * f.span[1].value]) };
    let (mut w, mut at) = plate.max_deflection(forces);
    let c = plate.flexibility_m_per_n();
    let n = forces.len();
    for i in 0..n {
        let wi: f64 = (0..n).map(|j| c[i * n + j] * forces[j]).sum();
        if wi >= w {
            (w, at) = (wi, plate.feet()[i]);
        }
    }
    (w, [ox + at[0], oz + at[1]])
}

/// The floors' results of one equilibrium. `load_scale_n` (Σ |load|) sets
/// the level below which a horizontal reaction is roundoff.
pub(super) fn floor_results(s: &Scenario, a: &Allowables, eq: &Equilibrium, load_scale_n: f64) -> Vec<FloorResult> {
    let h_tol = 1e-9 * load_scale_n + 1e-9;
    s.floors
        .iter()
        .enumerate()
        .map(|(k, f)| {
            let point = f.rated_point.map(|p| p.value);
            let total_allowable_n = f.rated_uniform.map(|q| q.value * f.area_m2());
            let pad_m2 = f.pad.map(|[x, z]| x.value * z.value);
            let mut feet = Vec::with_capacity(f.feet.len());
            for &i in &f.feet {
                let normal = eq.floor_force_n[i];
                let r = eq.reaction_n[i];
                let horizontal = r[0].hypot(r[2]);
                let node = &s.nodes[i].id;
                let friction_required = (normal > 0.0).then(|| if horizontal > h_tol { horizontal / normal } else { 0.0 });
                let utilisation = point.map(|p| normal / p);
                let (state, reason) = if normal <= 0.0 {
                    if horizontal > h_tol {
                        let why = format!(
                            "foot {node} has lifted off yet needs a horizontal reaction of {} kN: with no normal force no friction holds it",
                            format_number(horizontal / 1e3, 4)
                        );
                        (State::Over, Some(why))
                    } else {
                        (State::Slack, None)
                    }
                } else if friction_required.is_some_and(|mu| mu > f.friction_limit) {
                    let mu = friction_required.unwrap_or(0.0);
                    let why = format!(
                        "foot {node} needs friction {} (horizontal {} kN on normal {} kN) against the limit {} ({}): over by {} %",
                        format_number(mu, 3),
                        format_number(horizontal / 1e3, 4),
                        format_number(normal / 1e3, 4),
                        format_number(f.friction_limit, 3),
                        f.friction_source,
                        format_number(100.0 * (mu / f.friction_limit - 1.0), 3)
                    );
                    (State::Over, Some(why))
                } else {
                    match utilisation {
                        Some(u) => (state_of(u, s.near_limit), None),
                        None => (State::Unchecked, Some(NEEDS_RATED_POINT.to_string())),
                    }
                };
                feet.push(FootResult {
                    node: node.clone(),
                    normal_force_n: normal,
                    horizontal_n: horizontal,
                    friction_required,
                    bearing_pressure_pa: pad_m2.map(|area| normal / area),
                    utilisation,
                    state,
                    reason,
                });
            }
            let forces: Vec<f64> = feet.iter().map(|x| x.normal_force_n).collect();
            let total: f64 = forces.iter().sum();
            let (deflection_m, deflection_at_m) = largest_deflection(f, &forces);
            let limit = a.floor_deflection_m[k];
            let utilisation = feet
                .iter()
                .filter_map(|x| x.utilisation)
                .chain(total_allowable_n.map(|t| total / t))
                .chain(std::iter::once(deflection_m / limit))
                .fold(0.0, f64::max);
            let unchecked: Vec<&str> =
                feet.iter().filter(|x| x.state == State::Unchecked).map(|x| x.node.as_str()).collect();
            let (state, reason) = if feet.iter().any(|x| x.state == State::Over) || utilisation > 1.0 + 1e-9 {
                (State::Over, None)
            } else if !unchecked.is_empty() {
                (State::Unchecked, Some(format!("feet {} carry load with no point rating: {NEEDS_RATED_POINT}", unchecked.join(", "))))
            } else if point.is_none() && total_allowable_n.is_none() {
                (State::Unchecked, Some(format!("no rating given: {NEEDS_RATED_POINT}")))
            } else if !feet.is_empty() && total <= 0.0 {
                (State::Slack, None)
            } else {
                (state_of(utilisation, s.near_limit), None)
            };
            FloorResult {
                id: f.id.clone(),
                normal_force_n: total,
                deflection_m,
                deflection_at_m,
                allowable_n: a.floor_n[k],
                total_allowable_n,
                friction_limit: f.friction_limit,
                feet,
                deflection_limit_m: limit,
                utilisation,
                state,
                reason,
                peak_at_deg: None,
            }
        })
        .collect()
}
