//! The solved shape against the drawing: a node that ends far from where it
//! is drawn, or a member that turns over (points the opposite way to its
//! drawing), means the rig does not stand as drawn — a line drawn above
//! its anchor hangs below it, a level line swings down — and the answer is
//! for another rig than the one the planner meant. Such a case is warned,
//! naming the node or member, how far and the limit, and the warning counts
//! against the verdict (`Analysis::verdict`): never a plain `within`.
//!
//! The drawing is judged by the rig hanging still under its weights: a
//! swing shows the rig at a point of its arc, off the drawing by design,
//! and a drop or a sudden load stretches it by what it is checked for. So
//! the static case carries the warning; a scenario without one carries it
//! on every case, from the static solve they all start from.

use super::results::{CaseResult, Warning};
use super::warning_kind::WarningKind;
use crate::model::{Case, Scenario};
use crate::units::Sig;

/// A node may move this fraction of the rig's size (the diagonal of the
/// drawing's bounding box) from its drawn position (practice: the members'
/// own stretch under their allowable is well under 2 % for steel and about
/// 10 % for the softest fibre rope, so a move of a tenth of the whole rig
/// is no stretch but a change of shape).
pub const SHAPE_MOVE_FRACTION: f64 = 0.10;

/// The least move warned, m: on a rig of a few centimetres a tenth of its
/// size is within the stretch and sag of its members.
pub const SHAPE_MOVE_FLOOR_M: f64 = 0.05;

/// The rig's size: the diagonal of the drawing's bounding box, m.
pub fn rig_size_m(s: &Scenario) -> f64 {
    let mut lo = [f64::INFINITY; 3];
    let mut hi = [f64::NEG_INFINITY; 3];
    for k in 0..s.nodes.len() {
        let p = s.position_m(k);
        for ax in 0..3 {
            lo[ax] = lo[ax].min(p[ax]);
            hi[ax] = hi[ax].max(p[ax]);
        }
    }
    let d2: f64 = (0..3).map(|ax| (hi[ax] - lo[ax]).powi(2)).sum();
    if d2.is_finite() { d2.sqrt() } else { 0.0 }
}

/// The largest move from the drawing that is not warned, m.
pub fn shape_move_limit_m(s: &Scenario) -> f64 {
    (SHAPE_MOVE_FRACTION * rig_size_m(s)).max(SHAPE_MOVE_FLOOR_M)
}

/// Warnings for a case whose static shape is far from the drawing: a
/// static case's own, or, in a scenario without a static case, the static
/// solve's (`static_r`) on every case.
pub fn drawn_shape_warnings(s: &Scenario, case: &Case, r: &CaseResult, static_r: Option<&CaseResult>) -> Vec<Warning> {
    let shape = match case {
        Case::Static { .. } => r,
        _ if s.cases.iter().any(|c| matches!(c, Case::Static { .. })) => return Vec::new(),
        _ => match static_r {
            Some(st) => st,
            None => return Vec::new(),
        },
    };
    if shape.nodes.len() != s.nodes.len() || shape.members.len() != s.members.len() {
        return Vec::new();
    }
    let size = rig_size_m(s);
    let limit = shape_move_limit_m(s);
    let judged = if std::ptr::eq(shape, r) { "" } else { " (hanging still, before the case's load)" };
    let mut w = Vec::new();
    for (k, n) in shape.nodes.iter().enumerate() {
        let d = s.position_m(k);
        let p = n.position_m;
        let moved = (p[0] - d[0]).hypot(p[1] - d[1]).hypot(p[2] - d[2]);
        if moved > limit {
            w.push(Warning {
                kind: WarningKind::FarFromDrawing,
                subject: Some(n.id.clone()),
                message: format!(
                    "node {}: ends {} m from where it is drawn in case {}{judged}, over the limit {} m ({} % of the rig's size {} m); the rig does not stand as drawn (a line drawn above its anchor hangs below it, a level line swings down): check the drawing",
                    n.id,
                    Sig(moved, 4),
                    r.id,
                    Sig(limit, 3),
                    Sig(SHAPE_MOVE_FRACTION * 100.0, 3),
                    Sig(size, 4)
                ),
            });
        }
    }
    for m in &s.members {
        if m.run.is_some() {
            continue;
        }
        let [a, b] = m.ends;
        let (da, db) = (s.position_m(a), s.position_m(b));
        let (pa, pb) = (shape.nodes[a].position_m, shape.nodes[b].position_m);
        let drawn = [0, 1, 2].map(|ax| db[ax] - da[ax]);
        let solved = [0, 1, 2].map(|ax| pb[ax] - pa[ax]);
        let dot: f64 = (0..3).map(|ax| drawn[ax] * solved[ax]).sum();
        let norms = drawn[0].hypot(drawn[1]).hypot(drawn[2]) * solved[0].hypot(solved[1]).hypot(solved[2]);
        if norms > 0.0 && dot < 0.0 {
            let angle = (dot / norms).clamp(-1.0, 1.0).acos().to_degrees();
            w.push(Warning {
                kind: WarningKind::FarFromDrawing,
                subject: Some(m.id.clone()),
                message: format!(
                    "member {}: turns over in case {}{judged}: it points {} deg away from its drawn direction (the limit is 90 deg: past it the member points back along itself); the rig does not stand as drawn: check the drawing",
                    m.id,
                    r.id,
                    Sig(angle, 3)
                ),
            });
        }
    }
    w
}
