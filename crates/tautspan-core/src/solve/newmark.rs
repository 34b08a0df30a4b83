//! Time-domain integration of a [`Network`] (for `tautspan simulate`):
//! lumped masses at the nodes, the static solver's member laws and floor
//! contact, constant external loads (the node loads, i.e. gravity), optional
//! mass-proportional Rayleigh damping `C = α M`, and the Newmark average
//! acceleration rule (β = 1/4, γ = 1/2: unconditionally stable, second order,
//! no numerical damping).
//!
//! Each step minimises the incremental potential
//! `Φ(x) = Π(x) + ½ s (x − z)ᵀ M (x − z)` with `s = 4/Δt² + 2α/Δt` and
//! `z = (4/Δt² x̃ + 2α/Δt xₙ + α vₙ) / s`, `x̃ = xₙ + Δt vₙ + Δt²/4 aₙ`, whose
//! stationarity condition is exactly the Newmark equation
//! `M aₙ₊₁ + C vₙ₊₁ + f_int(xₙ₊₁) = f_ext`. The static solver's damped
//! Newton iteration and sparse factor do the work, so slack members and
//! massless nodes (which then follow quasi-statically) are handled the same
//! way as in the static case.
//!
//! Automatic time step: `Δt = T_min / 60`, `T_min = 2π / ω_max`,
//! `ω_max² = max over nodes with mass of (Σ spring rates of the members and
//! floor at the node) / m`. This resolves the shortest axial period a mass
//! can feel, and with it every snatch (a rope going taut) and floor contact,
//! which last about half such a period; 60 steps per period keep the sampled
//! peak of such an event within ≈ 0.2 % (cos(π/60)) and the period error
//! of the trapezoidal rule, (ωΔt)²/12, below 0.1 %. It is capped at
//! duration / 100 and at the output interval.

use super::assemble::Inertia;
use super::error::SolveError;
use super::factor::Factor;
use super::model::{Model, NONE};
use super::network::Network;
use super::newton::{SolveOptions, Workspace, minimise};
use super::static_solver::force_tolerance;
use super::validate::{Components, validate_network, validate_per_node};

/// Settings of a simulation.
#[derive(Debug, Clone, PartialEq)]
pub struct SimulateOptions {
    /// Simulated time, s.
    pub duration_s: f64,
    /// Time step, s; `None` for the automatic rule of this module.
    pub time_step_s: Option<f64>,
    /// Interval between recorded samples, s; `None` records every step.
    pub output_interval_s: Option<f64>,
    /// Mass-proportional Rayleigh damping α, 1/s (`C = α M`; a mode of
    /// circular frequency ω gets the damping ratio α / 2ω). 0 for none.
    pub mass_damping_per_s: f64,
    /// Settings of the Newton iteration inside each step.
    pub newton: SolveOptions,
}

impl Default for SimulateOptions {
    fn default() -> Self {
        Self {
            duration_s: 10.0,
            time_step_s: None,
            output_interval_s: None,
            mass_damping_per_s: 0.0,
            newton: SolveOptions::default(),
        }
    }
}

/// Initial state; `None` fields mean the drawn positions and rest.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct SimulationStart {
    /// Start position per node (only free coordinates are used), m.
    pub positions_m: Option<Vec<[f64; 3]>>,
    /// Start velocity per node (only free coordinates are used), m/s.
    pub velocities_m_per_s: Option<Vec<[f64; 3]>>,
}

/// Time histories and summary of a simulation.
#[derive(Debug, Clone, PartialEq)]
pub struct Simulation {
    /// Time step used, s.
    pub time_step_s: f64,
    /// Steps taken.
    pub steps: usize,
    /// Sample times, s.
    pub time_s: Vec<f64>,
    /// Node positions per sample, m.
    pub positions_m: Vec<Vec<[f64; 3]>>,
    /// Member forces per sample, tension positive, N.
    pub member_force_n: Vec<Vec<f64>>,
    /// Total energy per sample: kinetic + strain (members and floors) −
    /// work of the constant loads since the drawn position (gravity
    /// potential), J. With damping it falls by the energy dissipated.
    pub energy_j: Vec<f64>,
    /// Kinetic energy per sample, J.
    pub kinetic_energy_j: Vec<f64>,
    /// Energy dissipated by damping up to each sample, J.
    pub dissipated_j: Vec<f64>,
    /// Largest member force over every step (not only the samples), N.
    pub peak_member_force_n: Vec<f64>,
    /// Time of each member's peak, s.
    pub peak_time_s: Vec<f64>,
    /// Energy drift: max over steps of |E + dissipated − E(0)| divided by
    /// the largest kinetic + strain energy reached (0 when nothing moves).
    pub energy_drift: f64,
    /// True when the progress callback stopped the run early.
    pub cancelled: bool,
}

/// The automatic time step of this module's rule, s (`None` when no node
/// with mass has any stiffness attached).
fn automatic_time_step(model: &Model, net: &Network) -> Option<f64> {
    let mut rate = vec![0.0; net.nodes.len()];
    for m in &model.members {
        for n in m.touched() {
            rate[n] += m.k_n_per_m;
        }
    }
    for f in &model.floors {
        for (&node, k) in f.nodes.iter().zip(&f.rate_n_per_m) {
            rate[node] += k;
        }
    }
    let omega2 =
        net.nodes.iter().zip(&rate).filter(|(n, _)| n.mass_kg > 0.0).map(|(n, k)| k / n.mass_kg).fold(0.0, f64::max);
    (omega2 > 0.0).then(|| 2.0 * std::f64::consts::PI / omega2.sqrt() / 60.0)
}

/// Simulates `net` from `start` for `opts.duration_s`. `progress` is called
/// with the completed fraction about 200 times; returning false stops the
/// run (the result then has `cancelled` set and holds what was computed).
///
/// # Errors
/// [`SolveError::InvalidInput`] for a bad network, start arrays, duration
/// or time step, or when no node has mass; [`SolveError::NoLoadPath`],
/// [`SolveError::RunAway`] and [`SolveError::NotConverged`] as in the static
/// solver (the latter for the Newton iteration of one step).
pub fn simulate(
    net: &Network,
    start: &SimulationStart,
    opts: &SimulateOptions,
    progress: &mut dyn FnMut(f64) -> bool,
) -> Result<Simulation, SolveError> {
    let invalid =
        |item: &str, reason: &str| SolveError::InvalidInput { item: item.to_owned(), reason: reason.to_owned() };
    validate_network(net)?;
    if !(opts.duration_s.is_finite() && opts.duration_s > 0.0) {
        return Err(invalid("duration", "must be finite and positive"));
    }
    if !(opts.mass_damping_per_s.is_finite() && opts.mass_damping_per_s >= 0.0) {
        return Err(invalid("mass damping", "must be finite and not negative"));
    }
    if let Some(p) = &start.positions_m {
        validate_per_node(net, "start positions", p)?;
    }
    if let Some(v) = &start.velocities_m_per_s {
        validate_per_node(net, "start velocities", v)?;
    }
    let loads_n: Vec<[f64; 3]> = net.nodes.iter().map(|n| n.load_n).collect();
    Components::new(net).check_loads(net, &loads_n)?;
    let mut model = Model::new(net)?;
    let n = model.n_dofs();
    let mut factor = if n > 0 { Some(Factor::new(model.matrix.symbolic())?) } else { None };
    let mut ws = Workspace::default();

    let auto = automatic_time_step(&model, net);
    let mut dt = match opts.time_step_s {
        Some(dt) if dt.is_finite() && dt > 0.0 => dt,
        Some(_) => return Err(invalid("time step", "must be finite and positive")),
        None => auto.ok_or_else(|| invalid("masses", "no node with mass is attached to a member or floor"))?,
    };
    if opts.time_step_s.is_none() {
        dt = dt.min(opts.duration_s / 100.0);
        if let Some(out) = opts.output_interval_s.filter(|o| o.is_finite() && *o > 0.0) {
            dt = dt.min(out);
        }
    }
    let steps = (opts.duration_s / dt).ceil().max(1.0) as usize;
    let every = match opts.output_interval_s {
        Some(out) if out.is_finite() && out > 0.0 => ((out / dt).round() as usize).max(1),
        _ => 1,
    };

    let mut loads_dof = vec![0.0; n];
    model.gather(&loads_n, &mut loads_dof);
    let mass = model.mass_per_dof_kg.clone();
    let alpha = opts.mass_damping_per_s;
    let tol_n = force_tolerance(&loads_n, &opts.newton);

    let mut pos = model.start_positions(start.positions_m.as_deref());
    let mut vel = vec![0.0; n];
    if let Some(v) = &start.velocities_m_per_s {
        model.gather(v, &mut vel);
    }
    for (v, m) in vel.iter_mut().zip(&mass) {
        if *m <= 0.0 {
            *v = 0.0;
        }
    }
    // Initial acceleration from the equation of motion at the start.
    let mut acc = vec![0.0; n];
    {
        let mut grad = vec![0.0; n];
        let mut mag = vec![0.0; n];
        model.gradient(&pos, &loads_dof, None, &mut grad, &mut mag);
        for i in 0..n {
            if mass[i] > 0.0 {
                acc[i] = (-grad[i] - alpha * mass[i] * vel[i]) / mass[i];
            }
        }
    }

    let n_members = model.members.len();
    let mut sim = Simulation {
        time_step_s: dt,
        steps: 0,
        time_s: Vec::new(),
        positions_m: Vec::new(),
        member_force_n: Vec::new(),
        energy_j: Vec::new(),
        kinetic_energy_j: Vec::new(),
        dissipated_j: Vec::new(),
        peak_member_force_n: vec![f64::NEG_INFINITY; n_members],
        peak_time_s: vec![0.0; n_members],
        energy_drift: 0.0,
        cancelled: false,
    };
    let mut forces = vec![0.0; n_members];
    let mut dissipated = 0.0;
    let kinetic = |vel: &[f64]| -> f64 { 0.5 * vel.iter().zip(&mass).map(|(v, m)| m * v * v).sum::<f64>() };
    let strain = |model: &Model, pos: &[[f64; 3]]| -> f64 { model.energy(pos, &[], None).0 };
    let mut e0 = 0.0;
    let mut max_moving = 0.0_f64;
    let mut max_error = 0.0_f64;
    let report_every = (steps / 200).max(1);

    let mut x_prev = vec![0.0; n];
    let mut x_tilde = vec![0.0; n];
    let mut target = vec![0.0; n];
    let mut x_new = vec![0.0; n];
    let s = 4.0 / (dt * dt) + 2.0 * alpha / dt;
    for step in 0..=steps {
        let t = step as f64 * dt;
        if step > 0 {
            gather_positions(&model, &pos, &mut x_prev);
            for i in 0..n {
                x_tilde[i] = x_prev[i] + dt * vel[i] + 0.25 * dt * dt * acc[i];
                target[i] = (4.0 / (dt * dt) * x_tilde[i] + 2.0 * alpha / dt * x_prev[i] + alpha * vel[i]) / s;
            }
            // Start Newton from the constant-acceleration predictor.
            scatter_positions(&model, &x_tilde, &mut pos);
            minimise(
                &mut model,
                factor.as_mut(),
                &mut ws,
                &mut pos,
                &loads_dof,
                Some(Inertia { scale_per_s2: s, target_m: &target }),
                &opts.newton,
                tol_n,
            )?;
            gather_positions(&model, &pos, &mut x_new);
            for i in 0..n {
                let x_new = x_new[i];
                if mass[i] > 0.0 {
                    let a_new = 4.0 / (dt * dt) * (x_new - x_tilde[i]);
                    let v_new = vel[i] + 0.5 * dt * (acc[i] + a_new);
                    let v_avg = 0.5 * (vel[i] + v_new);
                    dissipated += alpha * mass[i] * v_avg * v_avg * dt;
                    acc[i] = a_new;
                    vel[i] = v_new;
                } else {
                    vel[i] = (x_new - x_prev[i]) / dt;
                }
            }
            sim.steps = step;
        }
        for (f, m) in forces.iter_mut().zip(&model.members) {
            *f = super::assemble::member_state(m, &pos).force_n;
        }
        for (j, f) in forces.iter().enumerate() {
            if *f > sim.peak_member_force_n[j] {
                sim.peak_member_force_n[j] = *f;
                sim.peak_time_s[j] = t;
            }
        }
        let ke = kinetic(&vel);
        let u = strain(&model, &pos);
        let (pot, _) = model.energy(&pos, &loads_dof, None);
        let e = ke + pot;
        if step == 0 {
            e0 = e;
        }
        max_moving = max_moving.max(ke + u);
        max_error = max_error.max((e + dissipated - e0).abs());
        if step % every == 0 || step == steps {
            sim.time_s.push(t);
            sim.positions_m.push(model.to_world(&pos));
            sim.member_force_n.push(forces.clone());
            sim.energy_j.push(e);
            sim.kinetic_energy_j.push(ke);
            sim.dissipated_j.push(dissipated);
        }
        if step % report_every == 0 && !progress(step as f64 / steps as f64) {
            sim.cancelled = true;
            break;
        }
    }
    sim.energy_drift = if max_moving > 0.0 { max_error / max_moving } else { 0.0 };
    for p in &mut sim.peak_member_force_n {
        if !p.is_finite() {
            *p = 0.0;
        }
    }
    Ok(sim)
}

/// Dof values of positions.
fn gather_positions(model: &Model, pos: &[[f64; 3]], out: &mut [f64]) {
    for (node, dofs) in model.node_dofs.iter().enumerate() {
        for ax in 0..3 {
            if dofs[ax] != NONE {
                out[dofs[ax]] = pos[node][ax];
            }
        }
    }
}

/// Writes dof values into positions.
fn scatter_positions(model: &Model, x: &[f64], pos: &mut [[f64; 3]]) {
    for (node, dofs) in model.node_dofs.iter().enumerate() {
        for ax in 0..3 {
            if dofs[ax] != NONE {
                pos[node][ax] = x[dofs[ax]];
            }
        }
    }
}
