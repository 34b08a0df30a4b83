//! A case run in the time domain with its history streamed: each step's
//! state goes to a sink as it is computed and only the summary (each
//! member's peak and its time, the swing period, the energy drift) is kept,
//! so memory does not grow with the number of steps.
//!
//! The integrator (`solve::simulate`) keeps every sample of a run, so the
//! run is made in chunks of a bounded number of steps, each starting from
//! where the last ended. Newmark's average acceleration rule is the
//! trapezoidal rule on the velocities, `x₁ − x₀ = Δt (v₀ + v₁) / 2`, so each
//! chunk's end velocity follows exactly from its positions; the
//! acceleration the next chunk starts with is found from the equation of
//! motion, which each step satisfies to the Newton tolerance. The run is
//! the same as one long run to that tolerance (tested).
//!
//! Before the run: the step count is capped ([`super::MAX_SIMULATE_STEPS`]), and a
//! step coarser than [`COARSE_STEP_FRACTION`] of the shortest period of a
//! member and one of the scenario's masses at its end is noted:
//! `T = 2π √(m / k)`, `k = EA / L0`, `m` the mass lumped at that node (a
//! one-degree-of-freedom spring and mass, any dynamics text). An automatic
//! step is made no coarser than that, so only a step given is noted. Ten steps a period sample a sine's peak to within
//! `1 − cos(π/10)` = 5 % and keep the trapezoidal rule's period error,
//! `(ωΔt)² / 12`, under 3.3 %; coarser, the peaks are not to be trusted.

use super::simulate_case::{Prepared, SimulateRequest, check_step_cap, find_case, prepare};
use crate::model::Scenario;
use crate::solve::{Fixity, SimulateOptions, SimulationStart, SolveOptions, simulate};

/// A step longer than this fraction of the shortest member-mass period is
/// noted as too coarse (see the module doc).
pub const COARSE_STEP_FRACTION: f64 = 0.1;

/// Bytes of samples a chunk may hold (positions and forces of each step).
const CHUNK_BYTES: usize = 32 << 20;
/// Steps a chunk takes at most, and at least.
const CHUNK_STEPS: (usize, usize) = (16, 4096);

/// One step's state, handed to the sink.
#[derive(Debug, Clone, Copy)]
pub struct Sample<'a> {
    /// Time from the start, s.
    pub time_s: f64,
    /// Member forces, tension positive, N (the scenario's member order).
    pub member_force_n: &'a [f64],
    /// Node positions, m (the scenario's node order).
    pub positions_m: &'a [[f64; 3]],
    /// Total energy (kinetic + strain − work of the constant loads), J.
    pub energy_j: f64,
}

/// The shortest period of a member and a mass at its end.
#[derive(Debug, Clone, PartialEq)]
pub struct ShortestPeriod {
    /// The member's id.
    pub member: String,
    /// The node whose mass it carries.
    pub node: String,
    /// Its spring rate `EA / L0`, N/m.
    pub rate_n_per_m: f64,
    /// The mass lumped at the node, kg.
    pub mass_kg: f64,
    /// `2π √(m / k)`, s.
    pub period_s: f64,
}

/// The shortest period over every member and a free node at one of its
/// ends that carries one of the scenario's masses (`mass_nodes`), with the
/// node's whole lumped mass (a rope over sheaves counts at its two ends);
/// `None` when no member holds a mass. Nodes whose only mass is the
/// members' own weight (a ring between stiff hoists) are left out: their
/// fast ringing is not the motion that loads the rig, and the implicit
/// integrator is stable over it.
pub fn shortest_period(net: &crate::solve::Network, mass_nodes: &[usize]) -> Option<ShortestPeriod> {
    let mut carries = vec![false; net.nodes.len()];
    for &n in mass_nodes {
        if let Some(c) = carries.get_mut(n) {
            *c = true;
        }
    }
    let mut best: Option<ShortestPeriod> = None;
    for m in &net.members {
        if !(m.rest_length_m > 0.0 && m.axial_stiffness_n > 0.0) {
            continue;
        }
        let k = m.axial_stiffness_n / m.rest_length_m;
        for &e in &m.ends {
            let node = &net.nodes[e];
            if node.mass_kg <= 0.0 || matches!(node.fixity, Fixity::Fixed) || !carries.get(e).copied().unwrap_or(false)
            {
                continue;
            }
            let period_s = 2.0 * std::f64::consts::PI * (node.mass_kg / k).sqrt();
            if period_s.is_finite() && best.as_ref().is_none_or(|b| period_s < b.period_s) {
                best = Some(ShortestPeriod {
                    member: m.name.clone(),
                    node: node.name.clone(),
                    rate_n_per_m: k,
                    mass_kg: node.mass_kg,
                    period_s,
                });
            }
        }
    }
    best
}

/// Why a run was not planned.
#[derive(Debug, Clone, PartialEq)]
pub enum PlanError {
    /// The request is at fault (no such case, over the step cap).
    Input(String),
    /// The rig could not be brought to its start state.
    Rig(String),
}

impl std::fmt::Display for PlanError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            PlanError::Input(m) | PlanError::Rig(m) => f.write_str(m),
        }
    }
}

/// A run ready to start: what it will do and what is to be said first.
pub struct SimulationPlan {
    case_id: String,
    net: crate::solve::Network,
    start: SimulationStart,
    mass_node: Option<usize>,
    swing_axis: Option<([f64; 2], f64)>,
    damping_per_s: f64,
    /// The time step, s.
    pub time_step_s: f64,
    /// Steps to take (`duration / step`, rounded up).
    pub steps: usize,
    /// Member ids, in the order of the samples' forces.
    pub member_ids: Vec<String>,
    /// Node ids, in the order of the samples' positions.
    pub node_ids: Vec<String>,
    /// The shortest member-mass period, when a member holds a mass.
    pub shortest: Option<ShortestPeriod>,
    /// Warnings to print with the output (a step too coarse).
    pub warnings: Vec<String>,
}

/// What a streamed run leaves: its summary.
#[derive(Debug, Clone, PartialEq)]
pub struct SimulationSummary {
    /// Steps taken.
    pub steps: usize,
    /// Time of the last step, s.
    pub duration_s: f64,
    /// Largest force of each member over every step, N.
    pub peak_member_force_n: Vec<f64>,
    /// Time of each member's peak, s.
    pub peak_time_s: Vec<f64>,
    /// Swing period measured from the mass's motion along the swing, s.
    pub period_s: Option<f64>,
    /// Energy drift, as `solve::Simulation::energy_drift`.
    pub energy_drift: f64,
    /// True when the progress callback stopped the run.
    pub cancelled: bool,
    /// True when the sink refused a sample (its output failed).
    pub sink_failed: bool,
}

/// Plan a streamed run of a case: the step (the request's, the case's
/// default, or the integrator's automatic rule), the step cap, the coarse
/// step warning.
pub fn plan_simulation(s: &Scenario, case_id: &str, req: &SimulateRequest) -> Result<SimulationPlan, PlanError> {
    if !(req.duration_s.is_finite() && req.duration_s > 0.0) {
        return Err(PlanError::Input(format!(
            "the duration {} s must be a positive number of seconds",
            req.duration_s
        )));
    }
    if let Some(dt) = req.time_step_s {
        check_step_cap(req.duration_s, dt).map_err(PlanError::Input)?;
    }
    let case = find_case(s, case_id).map_err(PlanError::Input)?;
    let Prepared { net, start, default_step_s, mass_node, swing_axis, .. } =
        prepare(s, case).map_err(PlanError::Rig)?;
    let mass_nodes: Vec<usize> = s.masses.iter().map(|m| m.node).collect();
    let shortest = shortest_period(&net, &mass_nodes);
    let time_step_s = match req.time_step_s {
        Some(dt) => dt,
        None => {
            let dt = match default_step_s {
                Some(dt) => dt,
                None => {
                    // the integrator's automatic step: a run stopped before its first step
                    let opts = options(req.duration_s, None, req.damping_per_s);
                    simulate(&net, &start, &opts, &mut |_| false)
                        .map_err(|e| PlanError::Rig(e.to_string()))?
                        .time_step_s
                }
            };
            // an automatic step is never coarser than the rule below warns of
            shortest.as_ref().map_or(dt, |p| dt.min(COARSE_STEP_FRACTION * p.period_s))
        }
    };
    let steps = check_step_cap(req.duration_s, time_step_s).map_err(PlanError::Input)? as usize;
    let mut warnings = Vec::new();
    if let Some(p) = &shortest
        && time_step_s > COARSE_STEP_FRACTION * p.period_s
    {
        warnings.push(format!(
            "the time step {} s is coarser than a tenth of the shortest period of a member and its mass: member {} with {} kg at node {} rings at 2π√(m/k) = {} s (k = EA/L0 = {} N/m); peaks may be missed or overshot: give --step \"{} ms\" or less",
            crate::units::format_number(time_step_s, 4),
            p.member,
            crate::units::format_number(p.mass_kg, 4),
            p.node,
            crate::units::format_number(p.period_s, 4),
            crate::units::format_number(p.rate_n_per_m, 4),
            crate::units::format_number(COARSE_STEP_FRACTION * p.period_s * 1000.0, 3),
        ));
    }
    Ok(SimulationPlan {
        case_id: case_id.to_string(),
        net,
        start,
        mass_node,
        swing_axis,
        damping_per_s: req.damping_per_s,
        time_step_s,
        steps,
        member_ids: s.members.iter().map(|m| m.id.clone()).collect(),
        node_ids: s.nodes.iter().map(|n| n.id.clone()).collect(),
        shortest,
        warnings,
    })
}

fn options(duration_s: f64, time_step_s: Option<f64>, damping_per_s: f64) -> SimulateOptions {
    SimulateOptions {
        duration_s,
        time_step_s,
        output_interval_s: None,
        mass_damping_per_s: damping_per_s,
        newton: SolveOptions::default(),
    }
}

/// Upward crossings of a coordinate through its reference, counted as they come.
#[derive(Default)]
struct Crossings {
    prev: Option<(f64, f64)>,
    first: Option<f64>,
    last: f64,
    count: usize,
}

impl Crossings {
    fn push(&mut self, t: f64, x: f64) {
        if let Some((t0, a)) = self.prev
            && a < 0.0
            && x >= 0.0
        {
            let tc = t0 + a / (a - x) * (t - t0);
            self.first.get_or_insert(tc);
            self.last = tc;
            self.count += 1;
        }
        self.prev = Some((t, x));
    }

    fn period(&self) -> Option<f64> {
        let first = self.first?;
        (self.count >= 2).then(|| (self.last - first) / (self.count - 1) as f64)
    }
}

impl SimulationPlan {
    /// The case's id.
    pub fn case_id(&self) -> &str {
        &self.case_id
    }

    /// Run the plan: each step's state goes to `sink` (returning false stops
    /// the run: its output failed); `progress` gets the completed fraction
    /// and returns false to cancel.
    ///
    /// # Errors
    /// The integrator's, as text (a step whose iteration did not converge).
    pub fn run(
        &self,
        sink: &mut dyn FnMut(&Sample<'_>) -> bool,
        progress: &mut dyn FnMut(f64) -> bool,
    ) -> Result<SimulationSummary, String> {
        let n_members = self.net.members.len();
        let per_sample = self.net.nodes.len() * 24 + n_members * 8 + 64;
        let chunk = (CHUNK_BYTES / per_sample.max(1)).clamp(CHUNK_STEPS.0, CHUNK_STEPS.1);
        let dt = self.time_step_s;
        let mut out = SimulationSummary {
            steps: 0,
            duration_s: 0.0,
            peak_member_force_n: vec![f64::NEG_INFINITY; n_members],
            peak_time_s: vec![0.0; n_members],
            period_s: None,
            energy_drift: 0.0,
            cancelled: false,
            sink_failed: false,
        };
        let mut start = self.start.clone();
        let mut crossings = Crossings::default();
        let (mut e0, mut dissipated_before, mut max_error, mut max_moving) = (None, 0.0, 0.0_f64, 0.0_f64);
        while out.steps < self.steps {
            let n = chunk.min(self.steps - out.steps);
            // n steps exactly: the integrator takes ceil(duration / step)
            let opts = options((n as f64 - 0.5) * dt, Some(dt), self.damping_per_s);
            let done = out.steps;
            let total = self.steps as f64;
            let mut inner = |f: f64| progress((done as f64 + f * n as f64) / total);
            let run = simulate(&self.net, &start, &opts, &mut inner).map_err(|e| e.to_string())?;
            let t0 = done as f64 * dt;
            let first = usize::from(done > 0);
            let chunk_e0 = run.energy_j.first().copied().unwrap_or(0.0);
            let e0 = *e0.get_or_insert(chunk_e0);
            let mut chunk_error = 0.0_f64;
            let mut chunk_kinetic = 0.0_f64;
            for k in 0..run.time_s.len() {
                let (e, d) = (run.energy_j[k], run.dissipated_j[k]);
                chunk_error = chunk_error.max((e + d - chunk_e0).abs());
                chunk_kinetic = chunk_kinetic.max(run.kinetic_energy_j[k]);
                if k < first {
                    continue;
                }
                let t = t0 + run.time_s[k];
                max_error = max_error.max((e + dissipated_before + d - e0).abs());
                for (j, &f) in run.member_force_n[k].iter().enumerate() {
                    if f > out.peak_member_force_n[j] {
                        out.peak_member_force_n[j] = f;
                        out.peak_time_s[j] = t;
                    }
                }
                if let (Some((h, x_ref)), Some(node)) = (self.swing_axis, self.mass_node) {
                    let p = run.positions_m[k][node];
                    crossings.push(t, p[0] * h[0] + p[2] * h[1] - x_ref);
                }
                let sample = Sample {
                    time_s: t,
                    member_force_n: &run.member_force_n[k],
                    positions_m: &run.positions_m[k],
                    energy_j: e,
                };
                if !sink(&sample) {
                    out.sink_failed = true;
                    break;
                }
                out.duration_s = t;
            }
            // the chunk's own drift gives its largest kinetic + strain energy
            let moving = if run.energy_drift > 0.0 { chunk_error / run.energy_drift } else { chunk_kinetic };
            max_moving = max_moving.max(moving);
            dissipated_before += run.dissipated_j.last().copied().unwrap_or(0.0);
            out.steps = done + run.steps;
            if run.cancelled || out.sink_failed || run.steps < n {
                out.cancelled = run.cancelled;
                break;
            }
            start = next_start(&self.net, &start, &run.positions_m, dt);
        }
        out.energy_drift = if max_moving > 0.0 { max_error / max_moving } else { 0.0 };
        for p in &mut out.peak_member_force_n {
            if !p.is_finite() {
                *p = 0.0;
            }
        }
        out.period_s = crossings.period();
        Ok(out)
    }
}

/// The state a chunk ends in, as the next one's start: the last positions,
/// and the velocities by the trapezoidal rule from the chunk's positions.
fn next_start(
    net: &crate::solve::Network,
    start: &SimulationStart,
    positions: &[Vec<[f64; 3]>],
    dt: f64,
) -> SimulationStart {
    let mut v = start.velocities_m_per_s.clone().unwrap_or_else(|| vec![[0.0; 3]; net.nodes.len()]);
    for (i, node) in net.nodes.iter().enumerate() {
        if node.mass_kg <= 0.0 {
            v[i] = [0.0; 3];
        }
    }
    for w in positions.windows(2) {
        for (i, vi) in v.iter_mut().enumerate() {
            for ax in 0..3 {
                vi[ax] = 2.0 * (w[1][i][ax] - w[0][i][ax]) / dt - vi[ax];
            }
        }
    }
    SimulationStart { positions_m: positions.last().cloned(), velocities_m_per_s: Some(v) }
}
