//! Curves for plots: member forces against release angle for a swing case's
//! mass (each point a full network solve at the lowest-point load), and the
//! rigid single-line tension along one swing.

use super::formulas::{swing_factor, swing_tension_factor};
use crate::model::{Scenario, to_network};
use crate::solve::{SolveOptions, StaticSolver};

/// Member forces at the lowest point against release angle.
#[derive(Debug, Clone, PartialEq)]
pub struct ReleaseCurve {
    /// Release angles, degrees.
    pub release_deg: Vec<f64>,
    /// Per angle, the force in each member, N.
    pub member_force_n: Vec<Vec<f64>>,
}

/// Solve the network at each release angle for `mass` (index into the
/// scenario's masses). Angles whose solve fails are left out.
pub fn release_curve(s: &Scenario, mass: usize, release_deg: &[f64]) -> Result<ReleaseCurve, String> {
    if mass >= s.masses.len() {
        return Err(format!("mass index {mass} out of range"));
    }
    let (net, loads) = to_network(s);
    let mut solver = StaticSolver::new(&net).map_err(|e| e.to_string())?;
    let opts = SolveOptions::default();
    let mut start = solver.solve(&loads.total_n, None, &opts).map_err(|e| e.to_string())?;
    let mut out = ReleaseCurve { release_deg: Vec::new(), member_force_n: Vec::new() };
    for &deg in release_deg {
        let l = loads.with_mass_factor(s, mass, swing_factor(deg.to_radians()));
        if let Ok(eq) = solver.solve(&l, Some(&start.positions_m), &opts) {
            out.release_deg.push(deg);
            out.member_force_n.push(eq.member_force_n.clone());
            start = eq;
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
