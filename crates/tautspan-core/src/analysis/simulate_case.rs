//! Time-domain runs of a scenario's cases: the start state each case
//! implies, the integrator on the scenario's network, and the measured
//! swing period.
//!
//! Start states: a swing starts at rest with the swinging part of the rig
//! (the free nodes reached from the mass without passing the pivot or a
//! support) turned about the pivot by the release angle in the swing's plane,
//! from the static equilibrium; a drop starts from the equilibrium without
//! the mass's weight, the mass moving down at `√(2 g h)` (the speed of a
//! free fall of h onto the unloaded path); a sudden load starts there at
//! rest; the static case starts at its equilibrium.

use crate::model::{Case, Scenario, Support, to_network};
use crate::solve::{SimulateOptions, Simulation, SimulationStart, SolveOptions, StaticSolver, simulate};

/// A case simulated.
#[derive(Debug, Clone)]
pub struct CaseSimulation {
    /// Case id.
    pub case_id: String,
    /// The run.
    pub run: Simulation,
    /// Member ids, in the order of the run's forces.
    pub member_ids: Vec<String>,
    /// Node ids, in the order of the run's positions.
    pub node_ids: Vec<String>,
    /// Swing period measured from the mass's sideways motion, s.
    pub period_s: Option<f64>,
    /// The node of the case's mass.
    pub mass_node: Option<usize>,
}

/// Settings the user may give.
#[derive(Debug, Clone, PartialEq)]
pub struct SimulateRequest {
    /// Simulated time, s.
    pub duration_s: f64,
    /// Time step, s, or automatic.
    pub time_step_s: Option<f64>,
    /// Mass-proportional damping, 1/s.
    pub damping_per_s: f64,
}

impl Default for SimulateRequest {
    fn default() -> Self {
        SimulateRequest { duration_s: 10.0, time_step_s: None, damping_per_s: 0.0 }
    }
}

/// Turn `p` about `c` by `angle` in the vertical plane whose horizontal
/// direction is `(cos ψ, 0, sin ψ)`, ψ = `azimuth`: a positive angle moves a
/// point below `c` towards −that direction (the release side θ = −θ0).
fn rotate_about(p: [f64; 3], c: [f64; 3], angle: f64, azimuth: f64) -> [f64; 3] {
    let snap = |v: f64| if v.abs() < 1e-14 { 0.0 } else { v };
    let (hx, hz) = (snap(azimuth.cos()), snap(azimuth.sin()));
    let d = [p[0] - c[0], p[1] - c[1], p[2] - c[2]];
    // components along the plane's horizontal, up, and across the plane
    let (h, y) = (d[0] * hx + d[2] * hz, d[1]);
    let across = [d[0] - h * hx, 0.0, d[2] - h * hz];
    let (sn, cs) = angle.sin_cos();
    let (h2, y2) = (cs * h - sn * y, sn * h + cs * y);
    [c[0] + across[0] + h2 * hx, c[1] + y2, c[2] + across[2] + h2 * hz]
}

/// The free nodes that swing with the mass: reached from the mass's node
/// through members without passing the pivot or any support.
fn swinging_nodes(s: &Scenario, mass_node: usize, pivot: usize) -> Vec<usize> {
    let mut seen = vec![false; s.nodes.len()];
    let mut stack = vec![mass_node];
    seen[mass_node] = true;
    let mut out = Vec::new();
    while let Some(n) = stack.pop() {
        out.push(n);
        for m in &s.members {
            let other = if m.ends[0] == n {
                m.ends[1]
            } else if m.ends[1] == n {
                m.ends[0]
            } else {
                continue;
            };
            if !seen[other] && other != pivot && s.nodes[other].support == Support::Joint {
                seen[other] = true;
                stack.push(other);
            }
        }
    }
    out
}

/// The pivot a swing turns about: the case's, else the nearest node above
/// the mass that a member joins to it.
fn default_pivot(s: &Scenario, mass_node: usize) -> Option<usize> {
    let y = s.position_m(mass_node)[1];
    s.members
        .iter()
        .filter_map(|m| {
            if m.ends[0] == mass_node {
                Some(m.ends[1])
            } else if m.ends[1] == mass_node {
                Some(m.ends[0])
            } else {
                None
            }
        })
        .filter(|&o| s.position_m(o)[1] > y)
        .min_by(|&a, &b| (s.position_m(a)[1] - y).total_cmp(&(s.position_m(b)[1] - y)))
}

/// The default time step for a case with a mass: a twentieth of the period
/// of the mass on its path's stiffness, `2π √(m / k)`, and at most a 400th of
/// the rigid pendulum period for a swing, so the motion that loads the rig
/// is resolved; stiffer, lighter parts of the rig (a ring between stiff
/// hoists) are left to the integrator, which is unconditionally stable. The
/// user may set a smaller step.
fn default_step(s: &Scenario, case: &Case, solver: &mut StaticSolver, eq: &crate::solve::Equilibrium) -> Option<f64> {
    let m = case.mass()?;
    let node = s.masses[m].node;
    let k = solver.effective_stiffness(eq, node, [0.0, -1.0, 0.0]).ok()?;
    let mass_kg = s.masses[m].mass.value;
    let mut dt = 2.0 * std::f64::consts::PI * (mass_kg / k).sqrt() / 20.0;
    if let Case::Swing { pivot, .. } = case {
        let pv = pivot.or_else(|| default_pivot(s, node))?;
        let (a, b) = (eq.positions_m[pv], eq.positions_m[node]);
        let l = ((a[0] - b[0]).powi(2) + (a[1] - b[1]).powi(2) + (a[2] - b[2]).powi(2)).sqrt();
        dt = dt.min(2.0 * std::f64::consts::PI * (l / s.gravity_m_s2()).sqrt() / 400.0);
    }
    (dt.is_finite() && dt > 0.0).then_some(dt)
}

/// Upward zero crossings of `x(t) − x_ref`, averaged into a period.
pub(super) fn measured_period(t: &[f64], x: &[f64], x_ref: f64) -> Option<f64> {
    let mut crossings = Vec::new();
    for i in 1..t.len() {
        let (a, b) = (x[i - 1] - x_ref, x[i] - x_ref);
        if a < 0.0 && b >= 0.0 {
            let f = a / (a - b);
            crossings.push(t[i - 1] + f * (t[i] - t[i - 1]));
        }
    }
    if crossings.len() < 2 {
        return None;
    }
    Some((crossings[crossings.len() - 1] - crossings[0]) / (crossings.len() - 1) as f64)
}

/// A case made ready to run: its network, start state, time step and the
/// reference the swing period is measured from.
pub(super) struct Prepared {
    pub(super) net: crate::solve::Network,
    pub(super) start: SimulationStart,
    /// The case's default step (`None`: the integrator's automatic rule).
    pub(super) default_step_s: Option<f64>,
    pub(super) mass_node: Option<usize>,
    /// The swing's horizontal direction in plan `(cos ψ, sin ψ)` and the
    /// mass's equilibrium coordinate along it.
    pub(super) swing_axis: Option<([f64; 2], f64)>,
}

/// The case named `case_id`, or the message naming the cases there are.
pub(super) fn find_case<'a>(s: &'a Scenario, case_id: &str) -> Result<&'a Case, String> {
    s.cases.iter().find(|c| c.id() == case_id).ok_or_else(|| {
        format!(
            "case \"{case_id}\" is not in the scenario; its cases are {}",
            s.cases.iter().map(|c| format!("\"{}\"", c.id())).collect::<Vec<_>>().join(", ")
        )
    })
}

/// The network, start state and default step of a case.
pub(super) fn prepare(s: &Scenario, case: &Case) -> Result<Prepared, String> {
    let case_id = case.id();
    let (net, loads) = to_network(s);
    let mut solver = StaticSolver::new(&net).map_err(|e| e.to_string())?;
    let opts = SolveOptions::default();
    let eq = solver.solve(&loads.total_n, None, &opts).map_err(|e| e.to_string())?;
    let g = s.gravity_m_s2();
    let mass_node = case.mass().map(|m| s.masses[m].node);
    let start = match case {
        Case::Static { .. } => SimulationStart { positions_m: Some(eq.positions_m.clone()), velocities_m_per_s: None },
        Case::Swing { mass, release, pivot, azimuth, .. } => {
            let node = s.masses[*mass].node;
            let pivot = pivot
                .or_else(|| default_pivot(s, node))
                .ok_or_else(|| format!("case {case_id}: no pivot above mass {}; give `pivot`", s.masses[*mass].id))?;
            let centre = eq.positions_m[pivot];
            let mut pos = eq.positions_m.clone();
            for n in swinging_nodes(s, node, pivot) {
                pos[n] = rotate_about(eq.positions_m[n], centre, -release.value, azimuth.value);
            }
            // At release the line carries only m g cos θ0: shorten the
            // mass's radius by that much of its static stretch, hold the
            // mass there and let the rest of the rig settle, so the run
            // starts in balance and does not ring from the start state.
            if let Some(k) = s.members.iter().position(|m| m.ends.contains(&node) && m.ends.contains(&pivot)) {
                let rest = s.rest_length_m(k);
                let d: Vec<f64> = (0..3).map(|i| pos[node][i] - centre[i]).collect();
                let r = (d[0] * d[0] + d[1] * d[1] + d[2] * d[2]).sqrt();
                if r > rest {
                    let r_new = rest + (r - rest) * release.value.cos().max(0.0);
                    for i in 0..3 {
                        pos[node][i] = centre[i] + d[i] * r_new / r;
                    }
                }
            }
            let mut held = net.clone();
            held.nodes[node].fixity = crate::solve::Fixity::Fixed;
            held.nodes[node].position_m = pos[node];
            if let Ok(eq_held) = StaticSolver::new(&held).and_then(|mut h| h.solve(&loads.total_n, Some(&pos), &opts)) {
                pos = eq_held.positions_m;
            }
            SimulationStart { positions_m: Some(pos), velocities_m_per_s: None }
        }
        Case::Drop { mass, .. } | Case::Sudden { mass, .. } => {
            let unloaded = loads.with_mass_factor(s, *mass, 0.0);
            let eq0 = solver.solve(&unloaded, Some(&eq.positions_m), &opts).map_err(|e| e.to_string())?;
            let h = if let Case::Drop { height, .. } = case { height.value } else { 0.0 };
            let mut v = vec![[0.0; 3]; s.nodes.len()];
            v[s.masses[*mass].node][1] = -(2.0 * g * h).sqrt();
            SimulationStart { positions_m: Some(eq0.positions_m), velocities_m_per_s: Some(v) }
        }
    };
    let default_step_s = default_step(s, case, &mut solver, &eq);
    let swing_axis = match (case, mass_node) {
        (Case::Swing { azimuth, .. }, Some(n)) => {
            let (hx, hz) = (azimuth.value.cos(), azimuth.value.sin());
            let p = eq.positions_m[n];
            Some(([hx, hz], p[0] * hx + p[2] * hz))
        }
        _ => None,
    };
    Ok(Prepared { net, start, default_step_s, mass_node, swing_axis })
}

/// Simulate a case of a scenario, keeping every step's state in memory
/// (the app's plots). The command line streams instead
/// ([`super::simulate_stream`]). Refused over [`MAX_SIMULATE_STEPS`].
pub fn simulate_case(
    s: &Scenario,
    case_id: &str,
    req: &SimulateRequest,
    progress: &mut dyn FnMut(f64) -> bool,
) -> Result<CaseSimulation, String> {
    let case = find_case(s, case_id)?;
    let p = prepare(s, case)?;
    let time_step_s = req.time_step_s.or(p.default_step_s);
    if let Some(dt) = time_step_s {
        check_step_cap(req.duration_s, dt)?;
    }
    let sim_opts = SimulateOptions {
        duration_s: req.duration_s,
        time_step_s,
        output_interval_s: None,
        mass_damping_per_s: req.damping_per_s,
        newton: SolveOptions::default(),
    };
    if time_step_s.is_none() {
        // the automatic step, found before anything per step is kept
        let probe = simulate(&p.net, &p.start, &sim_opts, &mut |_| false).map_err(|e| e.to_string())?;
        check_step_cap(req.duration_s, probe.time_step_s)?;
    }
    let run = simulate(&p.net, &p.start, &sim_opts, progress).map_err(|e| e.to_string())?;
    let period_s = match (p.swing_axis, p.mass_node) {
        (Some((h, x_ref)), Some(n)) => {
            let x: Vec<f64> = run.positions_m.iter().map(|q| q[n][0] * h[0] + q[n][2] * h[1]).collect();
            measured_period(&run.time_s, &x, x_ref)
        }
        _ => None,
    };
    Ok(CaseSimulation {
        case_id: case_id.to_string(),
        member_ids: s.members.iter().map(|m| m.id.clone()).collect(),
        node_ids: s.nodes.iter().map(|n| n.id.clone()).collect(),
        run,
        period_s,
        mass_node: p.mass_node,
    })
}

/// The most steps a run may take (`duration / step`): ten million, 10 s at
/// a microsecond. A run is refused over it before it starts.
pub const MAX_SIMULATE_STEPS: f64 = 10_000_000.0;

/// The number of steps `duration / step` (rounded up), or the message
/// refusing it over [`MAX_SIMULATE_STEPS`] or for a step that is not a
/// positive number.
pub fn check_step_cap(duration_s: f64, step_s: f64) -> Result<f64, String> {
    if !(step_s.is_finite() && step_s > 0.0) {
        return Err(format!("the time step {step_s} s must be a positive number of seconds"));
    }
    let steps = (duration_s / step_s).ceil().max(1.0);
    if steps > MAX_SIMULATE_STEPS {
        return Err(format!(
            "{} s at a step of {} s is {} steps; the cap is {} steps a run: give a longer --step or a shorter --duration",
            crate::units::format_number(duration_s, 4),
            crate::units::format_number(step_s, 4),
            if steps < 1e18 { crate::units::grouped(steps as u64) } else { format!("{steps:e}") },
            crate::units::grouped(MAX_SIMULATE_STEPS as u64)
        ));
    }
    Ok(steps)
}
