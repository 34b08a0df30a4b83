//! Damped Newton minimisation of the total potential (Levenberg–Marquardt
//! with energy-based step acceptance). Shared by the static solver and by
//! every time step of the implicit integrator (which adds an inertia term).
//!
//! Each iteration solves `(K + λ I) Δ = −g` with the sparse Cholesky factor
//! (K the tangent, g the gradient = minus the out-of-balance force). A step
//! is accepted when it lowers the potential; λ then shrinks by the gain
//! ratio rule of Nielsen (1999), otherwise λ grows and the step is retried.
//! The damping makes the shifted matrix positive definite however singular
//! or indefinite K is (slack members, flat lines, rods in compression), and
//! turns the step into a short gradient step far from equilibrium. The
//! change of potential is computed from the step itself
//! ([`Model::energy_change`]), so it stays accurate to the last steps,
//! where the difference of two totals would be roundoff; only where even
//! that change is below its own roundoff is a step judged by the
//! out-of-balance force instead. A step rejected at a kink (a member going
//! slack or taut) goes to the minimum along its direction; near the
//! solution a watchdog lets full Newton steps through (see [`minimise`]).

use super::assemble::Inertia;
use super::error::SolveError;
use super::factor::Factor;
use super::model::Model;

/// Settings of the damped Newton iteration.
#[derive(Debug, Clone, PartialEq)]
pub struct SolveOptions {
    /// Trial steps (factorisations) allowed before giving up.
    pub max_iterations: usize,
    /// Convergence: out-of-balance force at every free dof below this
    /// fraction of the total applied load magnitude (Σ |load| over nodes),
    /// or, at a dof where the forces and stiffnesses meeting there are so
    /// large that their roundoff alone exceeds it, below 16 ε of their sum
    /// (Σ |force| + EA·L/L0 of the members, the floor forces, the load):
    /// the tolerance comes from forces and stiffnesses, never from where
    /// the rig is drawn (the kernels work in displacements).
    pub relative_tolerance: f64,
    /// Absolute floor of the force tolerance, N.
    pub absolute_tolerance_n: f64,
    /// A node that moves farther than this many model sizes (bounding-box
    /// diagonal of the drawing, at least 1 m) from its drawn position runs away.
    pub runaway_factor: f64,
    /// Starting Levenberg–Marquardt damping as a fraction of the largest
    /// spring rate at one node.
    pub initial_damping: f64,
}

impl Default for SolveOptions {
    fn default() -> Self {
        Self {
            max_iterations: 500,
            relative_tolerance: 1e-9,
            absolute_tolerance_n: 1e-9,
            runaway_factor: 1e3,
            initial_damping: 1e-6,
        }
    }
}

/// Iterations made, the residual reached and the tolerance it met.
#[derive(Debug, Clone, Copy)]
pub(crate) struct NewtonOutcome {
    pub iterations: usize,
    pub residual_n: f64,
    pub tolerance_n: f64,
}

/// The tolerance of one dof: `tol_n`, or the roundoff its summed
/// magnitudes leave (16 ε of them) where that is larger.
fn dof_tolerance(tol_n: f64, mag: f64) -> f64 {
    tol_n.max(16.0 * f64::EPSILON * mag)
}

/// The largest tolerance over the dofs (see [`dof_tolerance`]).
fn max_tolerance(mag: &[f64], tol_n: f64) -> f64 {
    mag.iter().fold(tol_n, |t, &m| t.max(dof_tolerance(tol_n, m)))
}

/// Buffers reused across solves.
#[derive(Debug, Clone, Default)]
pub(crate) struct Workspace {
    grad: Vec<f64>,
    mag: Vec<f64>,
    trial_grad: Vec<f64>,
    trial_mag: Vec<f64>,
    step: Vec<f64>,
    k_values: Vec<f64>,
    trial_pos: Vec<[f64; 3]>,
    delta: Vec<[f64; 3]>,
    best_pos: Vec<[f64; 3]>,
    best_grad: Vec<f64>,
    best_mag: Vec<f64>,
}

/// Largest |g_i| and its dof, and whether every dof is within tolerance
/// (the tolerance, or 16 ε of the magnitudes summed into that dof, which is
/// the level roundoff alone leaves).
fn residual(grad: &[f64], mag: &[f64], tol_n: f64) -> (f64, usize, bool) {
    let mut worst = 0.0;
    let mut at = 0;
    let mut ok = true;
    for (i, (g, m)) in grad.iter().zip(mag).enumerate() {
        let a = g.abs();
        let t = dof_tolerance(tol_n, *m);
        if !a.is_finite() || !t.is_finite() || a > t {
            ok = false;
        }
        if a > worst || a.is_nan() {
            worst = a;
            at = i;
        }
    }
    (worst, at, ok)
}

/// Minimises the potential over the free dofs, starting from and updating
/// `pos`. `factor` must belong to `model`'s pattern (None when no dofs).
#[allow(clippy::too_many_arguments)]
pub(crate) fn minimise(
    model: &mut Model,
    factor: Option<&mut Factor>,
    ws: &mut Workspace,
    pos: &mut [[f64; 3]],
    loads_dof: &[f64],
    inertia: Option<Inertia<'_>>,
    opts: &SolveOptions,
    tol_n: f64,
) -> Result<NewtonOutcome, SolveError> {
    let n = model.n_dofs();
    let Some(factor) = factor else {
        return Ok(NewtonOutcome { iterations: 0, residual_n: 0.0, tolerance_n: tol_n });
    };
    ws.grad.resize(n, 0.0);
    ws.mag.resize(n, 0.0);
    ws.trial_grad.resize(n, 0.0);
    ws.trial_mag.resize(n, 0.0);
    ws.step.resize(n, 0.0);
    ws.k_values.resize(model.matrix.val().len(), 0.0);
    ws.trial_pos.clear();
    ws.trial_pos.extend_from_slice(pos);

    let max_mass = model.mass_per_dof_kg.iter().copied().fold(0.0, f64::max);
    let kscale = model.stiffness_scale_n_per_m + inertia.map_or(0.0, |i| i.scale_per_s2 * max_mass);
    let lambda_min = 1e-15 * kscale;
    let lambda_max = 1e20 * kscale;
    let mut lambda = (opts.initial_damping * kscale).max(lambda_min);
    let mut nu = 2.0;
    let runaway_m = opts.runaway_factor * model.model_size_m;

    model.gradient(pos, loads_dof, inertia, &mut ws.grad, &mut ws.mag);
    let mut iterations = 0;
    let not_converged = |model: &Model, iterations: usize, grad: &[f64], mag: &[f64]| {
        let (res, at, _) = residual(grad, mag, tol_n);
        SolveError::NotConverged {
            iterations,
            residual_n: res,
            tolerance_n: mag.get(at).map_or(tol_n, |&m| dof_tolerance(tol_n, m)),
            worst_node: model.node_name(model.dof_node[at]),
        }
    };
    // Watchdog (Chamberlain et al., 1982) for the last stage: near the
    // solution the full Newton step is taken even when it does not lower
    // the potential, because there it is a kink that hides the progress
    // (members at their rest length switching between slack and taut), and
    // the generalised Newton step converges where the monotone safeguards
    // creep. The state before the first such step is kept; if a few steps
    // later the out-of-balance force is not below it, the iteration goes
    // back to it and carries on monotone.
    let mut watch = Watchdog { saved_res: None, free_steps: WATCHDOG_STEPS, enabled: true };
    loop {
        let (res, _, converged) = residual(&ws.grad, &ws.mag, tol_n);
        if converged {
            return Ok(NewtonOutcome { iterations, residual_n: res, tolerance_n: max_tolerance(&ws.mag, tol_n) });
        }
        let res = match watch.saved_res {
            Some(saved) if res < saved => {
                // progress past the saved state: it is no longer needed
                watch.saved_res = None;
                res
            }
            Some(saved) if watch.free_steps == 0 => {
                pos.copy_from_slice(&ws.best_pos);
                ws.grad.copy_from_slice(&ws.best_grad);
                ws.mag.copy_from_slice(&ws.best_mag);
                watch.saved_res = None;
                watch.enabled = false;
                saved
            }
            _ => res,
        };
        model.tangent(pos, inertia, &mut ws.k_values);
        loop {
            if iterations >= opts.max_iterations || lambda > lambda_max {
                return Err(not_converged(model, iterations, &ws.grad, &ws.mag));
            }
            iterations += 1;
            let values = model.matrix.val_mut();
            values.copy_from_slice(&ws.k_values);
            for &slot in &model.diag_slots {
                values[slot] += lambda;
            }
            if !factor.factorize(model.matrix.as_ref()) {
                lambda = (lambda * nu).max(1e-9 * kscale);
                nu *= 2.0;
                continue;
            }
            for (s, g) in ws.step.iter_mut().zip(&ws.grad) {
                *s = -g;
            }
            factor.solve_in_place(&mut ws.step);
            if !ws.step.iter().all(|s| s.is_finite()) {
                lambda = (lambda * nu).max(1e-9 * kscale);
                nu *= 2.0;
                continue;
            }
            model.add_step(pos, &ws.step, &mut ws.trial_pos);
            let (dphi, dscale) = model.energy_change(pos, &ws.step, loads_dof, inertia, &mut ws.delta);
            let actual = -dphi;
            let step2: f64 = ws.step.iter().map(|s| s * s).sum();
            let gdx: f64 = -ws.step.iter().zip(&ws.grad).map(|(s, g)| s * g).sum::<f64>();
            let predicted = 0.5 * (gdx + lambda * step2);
            let roundoff = 64.0 * f64::EPSILON * dscale;
            let at_roundoff = actual.abs() <= roundoff;
            let mut have_trial_grad = false;
            let mut accept = if at_roundoff {
                model.gradient(&ws.trial_pos, loads_dof, inertia, &mut ws.trial_grad, &mut ws.trial_mag);
                have_trial_grad = true;
                // at roundoff the energy cannot rank the steps; the sum of
                // squared out-of-balance forces can
                let norm2 = |g: &[f64]| g.iter().map(|v| v * v).sum::<f64>();
                let (res_t, _, _) = residual(&ws.trial_grad, &ws.trial_mag, tol_n);
                res_t < res || norm2(&ws.trial_grad) < norm2(&ws.grad)
            } else {
                actual > 0.0 && actual.is_finite()
            };
            let mut forced = false;
            if !accept
                && watch.enabled
                && watch.free_steps > 0
                && watch.saved_res.unwrap_or(res) <= WATCHDOG_NEAR * tol_n
                && actual.is_finite()
            {
                if watch.saved_res.is_none() {
                    ws.best_pos.clear();
                    ws.best_pos.extend_from_slice(pos);
                    ws.best_grad.clone_from(&ws.grad);
                    ws.best_mag.clone_from(&ws.mag);
                    watch.saved_res = Some(res);
                }
                watch.free_steps -= 1;
                accept = true;
                forced = true;
            }
            let mut line_searched = false;
            if !accept && actual.is_finite() {
                // The step crossed a kink (a member going slack or taut, a
                // floor contact opening): the quadratic model was wrong past
                // it, not the direction. Go to the minimum along the
                // direction, found from the directional derivative.
                let (step, grad) = (std::mem::take(&mut ws.step), std::mem::take(&mut ws.grad));
                let found = line_minimum(model, pos, &step, &grad, loads_dof, inertia, ws);
                (ws.step, ws.grad) = (step, grad);
                if let Some(alpha) = found {
                    let scaled: Vec<f64> = ws.step.iter().map(|s| alpha * s).collect();
                    let (d2, s2) = model.energy_change(pos, &scaled, loads_dof, inertia, &mut ws.delta);
                    let (res_t, _, _) = residual(&ws.trial_grad, &ws.trial_mag, tol_n);
                    if d2 <= 64.0 * f64::EPSILON * s2 && res_t.is_finite() {
                        accept = true;
                        have_trial_grad = true;
                        line_searched = true;
                    }
                }
            }
            if !accept {
                lambda *= nu;
                nu *= 2.0;
                continue;
            }
            if let Some((node, distance_m)) = model.farthest(&ws.trial_pos)
                && distance_m > runaway_m
            {
                return Err(SolveError::RunAway {
                    node: model.node_name(node),
                    distance_m,
                    model_size_m: model.model_size_m,
                });
            }
            if !have_trial_grad {
                model.gradient(&ws.trial_pos, loads_dof, inertia, &mut ws.trial_grad, &mut ws.trial_mag);
            }
            pos.copy_from_slice(&ws.trial_pos);
            std::mem::swap(&mut ws.grad, &mut ws.trial_grad);
            std::mem::swap(&mut ws.mag, &mut ws.trial_mag);
            // a step accepted at roundoff (energy change unmeasurable, the
            // out-of-balance fell) is a good step: the gain ratio means
            // nothing there, and reading it as 0 would double λ on every
            // such step and stall the soft dofs
            let rho = if line_searched || forced {
                0.5
            } else if at_roundoff {
                1.0
            } else if predicted > 0.0 {
                (actual / predicted).clamp(0.0, 1.0)
            } else {
                1.0
            };
            lambda = (lambda * (1.0 / 3.0_f64).max(1.0 - (2.0 * rho - 1.0).powi(3))).max(lambda_min);
            nu = 2.0;
            break;
        }
    }
}

/// Full Newton steps the watchdog may take without lowering the potential.
const WATCHDOG_STEPS: usize = 6;

/// The watchdog acts once the out-of-balance force is within this many
/// force tolerances (1e5 × 1e-9 of the load by default: the last stage of
/// the iteration, where the active set is nearly settled).
const WATCHDOG_NEAR: f64 = 1e5;

struct Watchdog {
    /// Out-of-balance force of the saved state, while one is kept.
    saved_res: Option<f64>,
    /// Forced steps left in this solve.
    free_steps: usize,
    /// Off after a return to the saved state.
    enabled: bool,
}

/// Moves `ws.trial_pos` (and its gradient) to the minimum of the potential
/// along `step` from `pos`, between 0 and the full step: the root of the
/// directional derivative `g(x + α d)·d`, by Illinois false position. The
/// potential is convex along any line for tension-only members and floors,
/// so that root is the minimum. False when the full step is still downhill
/// (no bracket) or no useful fraction of the step is found.
fn line_minimum(
    model: &Model,
    pos: &[[f64; 3]],
    step: &[f64],
    grad: &[f64],
    loads_dof: &[f64],
    inertia: Option<Inertia<'_>>,
    ws: &mut Workspace,
) -> Option<f64> {
    let dot = |g: &[f64]| g.iter().zip(step).map(|(a, b)| a * b).sum::<f64>();
    let d0 = dot(grad);
    if d0.is_nan() || d0 >= 0.0 {
        return None;
    }
    let mut scaled = vec![0.0; step.len()];
    let mut eval = |alpha: f64, ws: &mut Workspace| -> f64 {
        for (o, s) in scaled.iter_mut().zip(step) {
            *o = alpha * s;
        }
        model.add_step(pos, &scaled, &mut ws.trial_pos);
        model.gradient(&ws.trial_pos, loads_dof, inertia, &mut ws.trial_grad, &mut ws.trial_mag);
        dot(&ws.trial_grad)
    };
    let (mut lo, mut flo) = (0.0, d0);
    let (mut hi, mut fhi) = (1.0, eval(1.0, ws));
    if fhi.is_nan() || fhi <= 0.0 {
        return None;
    }
    let mut alpha = 0.5;
    let mut side = 0i8;
    for _ in 0..30 {
        alpha = hi - fhi * (hi - lo) / (fhi - flo);
        if !(alpha > lo && alpha < hi) {
            alpha = 0.5 * (lo + hi);
        }
        let f = eval(alpha, ws);
        if f.abs() <= 1e-6 * d0.abs() {
            break;
        }
        if f > 0.0 {
            hi = alpha;
            fhi = f;
            if side == 1 {
                flo *= 0.5;
            }
            side = 1;
        } else {
            lo = alpha;
            flo = f;
            if side == -1 {
                fhi *= 0.5;
            }
            side = -1;
        }
    }
    // leave the trial state at the accepted α
    let _ = eval(alpha, ws);
    (alpha > 1e-6).then_some(alpha)
}
