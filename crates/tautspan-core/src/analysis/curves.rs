//! Curves for plots: member forces against release angle for a swing case's
//! mass (each point the largest force over the whole arc, from the same
//! sweep as the check), and the rigid single-line tension along one swing.

use super::evaluate::Allowables;
use super::formulas::swing_tension_factor;
use super::swing_arc::{SwingSetup, sweep};
use crate::model::{Scenario, to_network};
use crate::solve::{SolveOptions, StaticSolver};

/// Member forces at their peak over the arc against release angle.
#[derive(Debug, Clone, PartialEq)]
pub struct ReleaseCurve {
    /// Release angles, degrees.
    pub release_deg: Vec<f64>,
    /// Per angle, the force in each member at its own peak over the arc, N.
    pub member_force_n: Vec<Vec<f64>>,
}

/// Sweep the whole arc (the same sweep as the swing case's check) at each
/// release angle for `mass` (index into the scenario's masses) in the plane
/// at `azimuth_rad`. Angles whose sweep fails, and releases above 90°
/// (not a swing: the line goes slack), are left out.
pub fn release_curve(s: &Scenario, mass: usize, azimuth_rad: f64, release_deg: &[f64]) -> Result<ReleaseCurve, String> {
    if mass >= s.masses.len() {
        return Err(format!("mass index {mass} out of range"));
    }
    let (net, loads) = to_network(s);
    let allow = Allowables::of(s);
    let mut solver = StaticSolver::new(&net).map_err(|e| e.to_string())?;
    let opts = SolveOptions::default();
    let start = solver.solve(&loads.total_n, None, &opts).map_err(|e| e.to_string())?;
    let mut out = ReleaseCurve { release_deg: Vec::new(), member_force_n: Vec::new() };
    for &deg in release_deg.iter().filter(|d| d.is_finite() && **d >= 0.0 && **d <= 90.0 + 1e-9) {
        let setup = SwingSetup { mass, release_rad: deg.to_radians(), azimuth_rad };
        if let Ok(arc) = sweep(&mut solver, s, &allow, &loads, setup, &start) {
            let forces = (0..s.members.len()).map(|k| arc.samples[arc.peak_of(s, k)].eq.member_force_n[k]).collect();
            out.release_deg.push(deg);
            out.member_force_n.push(forces);
        }
    }
    Ok(out)
}

/// Rigid single line: tension ÷ weight at angles across one swing from
/// −θ0 to θ0 (`3 cos θ − 2 cos θ0`), `points` samples.
pub fn single_line_swing(release_deg: f64, points: usize) -> Vec<(f64, f64)> {
    let r = release_deg.to_radians();
    let n = points.max(2);
    (0..n)
        .map(|i| {
            let th = -r + 2.0 * r * i as f64 / (n - 1) as f64;
            (th.to_degrees(), swing_tension_factor(th, r))
        })
        .collect()
}
