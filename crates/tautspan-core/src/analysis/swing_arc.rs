//! A swing checked over its whole arc, not only at the lowest point.
//!
//! A mass released from rest at θ0 pulls its line, at every angle θ of the
//! swing, with `T(θ) = m g (3 cos θ − 2 cos θ0)` along the line (rigid line;
//! energy balance plus the centripetal force in normal–tangential
//! coordinates, e.g. Meriam & Kraige, *Engineering Mechanics: Dynamics*).
//! The line's tension peaks at the lowest point, but the rest of the rig
//! need not: the share of each bridle leg or hoist changes with the line's
//! direction. So the network is solved quasi-statically with that load on
//! the mass's node, pointing along `(sin θ cos ψ, −cos θ, sin θ sin ψ)` (ψ
//! the swing plane's azimuth), for θ from −θ0 to +θ0, and every item takes
//! its own largest utilisation and the angle where it occurs.
//!
//! Sampling: a grid no coarser than [`GRID_STEP_DEG`], then, for every item,
//! the parabola through its highest sample and the two beside it estimates
//! the true peak; where the estimate is more than [`PEAK_TOLERANCE`] above
//! the sample, both neighbouring intervals are halved, until no item asks
//! for more (or [`MAX_SAMPLES`]). The sampled peak is then within 0.1 % of
//! the item's maximum on a smooth curve; at a kink (a leg going slack) the
//! halving closes in on the kink itself.
//!
//! The release-angle limit uses the same sweep: the largest θ0 in
//! [0, 90°] whose arc keeps every item within its allowable, by Illinois
//! false position on θ0 (`illinois.rs`) (each evaluation a full sweep), and each item's own
//! limit by linear interpolation between the sweeps that straddle it.

use super::evaluate::{Allowables, utilisations};
use super::formulas::swing_tension_factor;
use super::illinois::{Bracket, illinois};
use crate::model::{NetworkLoads, Scenario};
use crate::solve::{Equilibrium, SolveOptions, StaticSolver};

/// The coarsest spacing of the first grid, degrees.
pub const GRID_STEP_DEG: f64 = 5.0;

/// The parabolic peak estimate may exceed the sampled peak by this much,
/// relative, before the intervals beside it are halved: half the 0.1 %
/// asked of the peak, so the sampled value is within it with room to spare.
pub const PEAK_TOLERANCE: f64 = 5e-4;

/// At most this many angles per sweep.
pub const MAX_SAMPLES: usize = 400;

/// The narrowest interval the refinement halves, radians (0.01°): on a
/// smooth peak the tolerance is met long before; at a kink the sampled
/// peak is then within slope × 0.01° of the kink's value.
pub const MIN_INTERVAL_RAD: f64 = 1.745e-4;

/// In the release-limit search only items within this fraction of the
/// sweep's highest utilisation are refined: the others cannot govern, and
/// their own limits are estimates interpolated between sweeps.
pub const LIMIT_FOCUS: f64 = 0.9;

/// The first grid's spacing in the release-limit search, degrees: coarser
/// than the case's own sweep; the focused refinement finds the governing
/// peak to the same tolerance.
pub const LIMIT_GRID_STEP_DEG: f64 = 10.0;

/// Angles closer than this are one, radians (about 0.0006°).
const SAME_ANGLE_RAD: f64 = 1e-5;

/// The release-angle limit is closed to this, radians (about 0.0006°).
const LIMIT_TOLERANCE_RAD: f64 = 1e-5;

/// One solved angle of the arc.
#[derive(Debug, Clone)]
pub struct ArcSample {
    /// Swing angle from the vertical, radians (signed along the plane).
    pub theta_rad: f64,
    /// Utilisation of every member then every floor.
    pub util: Vec<f64>,
    /// The equilibrium at that angle.
    pub eq: Equilibrium,
}

/// A whole arc, sampled.
#[derive(Debug, Clone)]
pub struct Arc {
    /// Release angle, radians.
    pub release_rad: f64,
    /// Samples in increasing angle.
    pub samples: Vec<ArcSample>,
}

/// The quantity an item's peak is taken by: its utilisation where that is a
/// finite number at every sample, else the size of its force (an item
/// without a usable allowable still has a largest force).
fn measures(s: &Scenario, samples: &[ArcSample], k: usize) -> Vec<f64> {
    let finite = samples.iter().all(|x| x.util.get(k).is_some_and(|u| u.is_finite()));
    samples
        .iter()
        .map(|x| {
            if finite {
                x.util[k]
            } else if k < s.members.len() {
                x.eq.member_force_n[k].abs()
            } else {
                0.0
            }
        })
        .collect()
}

fn argmax(v: &[f64]) -> usize {
    let mut best = 0;
    for (i, x) in v.iter().enumerate() {
        if *x > v[best] {
            best = i;
        }
    }
    best
}

impl Arc {
    /// Index of the sample where item `k` (members then floors) peaks.
    pub fn peak_of(&self, s: &Scenario, k: usize) -> usize {
        argmax(&measures(s, &self.samples, k))
    }

    /// Each item's largest utilisation over the arc.
    pub fn item_max(&self) -> Vec<f64> {
        let n = self.samples.first().map_or(0, |x| x.util.len());
        (0..n).map(|k| self.samples.iter().map(|x| x.util[k]).filter(|u| u.is_finite()).fold(0.0, f64::max)).collect()
    }

    /// The sample holding the case's largest utilisation.
    pub fn governing(&self) -> usize {
        let per: Vec<f64> =
            self.samples.iter().map(|x| x.util.iter().copied().filter(|u| u.is_finite()).fold(0.0, f64::max)).collect();
        argmax(&per)
    }

    /// The sample nearest the lowest point.
    pub fn lowest(&self) -> usize {
        let mut best = 0;
        for (i, x) in self.samples.iter().enumerate() {
            if x.theta_rad.abs() < self.samples[best].theta_rad.abs() {
                best = i;
            }
        }
        best
    }
}

/// The node loads at swing angle θ: the mass's weight replaced by the line
/// tension `T(θ)` along the line's direction; everything else unchanged.
pub fn arc_loads(
    s: &Scenario,
    loads: &NetworkLoads,
    mass: usize,
    release_rad: f64,
    azimuth_rad: f64,
    theta_rad: f64,
) -> Vec<[f64; 3]> {
    let mut l = loads.total_n.clone();
    let node = s.masses[mass].node;
    let w = loads.mass_weight_n[mass];
    let t = w * swing_tension_factor(theta_rad, release_rad);
    let (sn, cs) = theta_rad.sin_cos();
    // exact zeros keep a flat rig in its plane (cos 90° is not 0 in floating point)
    let snap = |v: f64| if v.abs() < 1e-14 { 0.0 } else { v };
    let (hx, hz) = (snap(azimuth_rad.cos()), snap(azimuth_rad.sin()));
    l[node][0] += t * snap(sn * hx);
    l[node][1] += w - t * cs;
    l[node][2] += t * snap(sn * hz);
    l
}

/// The swing parameters a sweep needs.
#[derive(Debug, Clone, Copy)]
pub struct SwingSetup {
    /// Mass index.
    pub mass: usize,
    /// Release angle, radians (0 to π/2).
    pub release_rad: f64,
    /// Azimuth of the swing plane, radians.
    pub azimuth_rad: f64,
}

struct Sweeper<'a> {
    solver: &'a mut StaticSolver,
    s: &'a Scenario,
    a: &'a Allowables,
    loads: &'a NetworkLoads,
    setup: SwingSetup,
}

impl Sweeper<'_> {
    fn solve_at(&mut self, theta: f64, start: &[[f64; 3]], fallback: &[[f64; 3]]) -> Result<ArcSample, String> {
        let SwingSetup { mass, release_rad, azimuth_rad } = self.setup;
        let l = arc_loads(self.s, self.loads, mass, release_rad, azimuth_rad, theta);
        let opts = SolveOptions::default();
        let eq = match self.solver.solve(&l, Some(start), &opts) {
            Ok(eq) => eq,
            Err(_) => self.solver.solve(&l, Some(fallback), &opts).map_err(|e| {
                format!("the rig could not be solved at swing angle {:.3} deg: {e}", theta.to_degrees())
            })?,
        };
        let util = utilisations(self.s, self.a, &eq);
        Ok(ArcSample { theta_rad: theta, util, eq })
    }
}

/// Angles at which the arc asks for more samples: for each item, the
/// parabola through its peak sample and two neighbours.
fn refinements(s: &Scenario, samples: &[ArcSample], focus: f64) -> Vec<f64> {
    let n_items = samples.first().map_or(0, |x| x.util.len());
    let th: Vec<f64> = samples.iter().map(|x| x.theta_rad).collect();
    let n = th.len();
    let mut out: Vec<f64> = Vec::new();
    if n < 3 {
        return out;
    }
    let all: Vec<Vec<f64>> = (0..n_items).map(|k| measures(s, samples, k)).collect();
    let overall: f64 = all.iter().flatten().filter(|v| v.is_finite()).fold(0.0, |m, v| f64::max(m, v.abs()));
    // the highest utilisation, for the focus: items far below it cannot govern
    let top_util = samples.iter().flat_map(|x| x.util.iter().copied()).filter(|u| u.is_finite()).fold(0.0, f64::max);
    for (k, m) in all.iter().enumerate() {
        let b = argmax(m);
        if !(m[b].is_finite()) || m[b] <= 1e-9 * overall {
            continue;
        }
        let item_top = samples[b].util.get(k).copied().unwrap_or(f64::NAN);
        if focus > 0.0 && item_top.is_finite() && item_top < focus * top_util {
            continue;
        }
        let c = b.clamp(1, n - 2);
        let (x0, x1, x2) = (th[c - 1], th[c], th[c + 1]);
        let (y0, y1, y2) = (m[c - 1], m[c], m[c + 1]);
        let den = (x1 - x0) * (y1 - y2) - (x1 - x2) * (y1 - y0);
        if den.abs() < 1e-300 {
            continue;
        }
        let xv = x1 - 0.5 * ((x1 - x0).powi(2) * (y1 - y2) - (x1 - x2).powi(2) * (y1 - y0)) / den;
        let (lo, hi) = if b == 0 {
            (th[0], th[1])
        } else if b == n - 1 {
            (th[n - 2], th[n - 1])
        } else {
            (th[b - 1], th[b + 1])
        };
        let xv = xv.clamp(lo, hi);
        // the parabola through the three points, at its vertex (Lagrange form)
        let yv = y0 * (xv - x1) * (xv - x2) / ((x0 - x1) * (x0 - x2))
            + y1 * (xv - x0) * (xv - x2) / ((x1 - x0) * (x1 - x2))
            + y2 * (xv - x0) * (xv - x1) / ((x2 - x0) * (x2 - x1));
        if yv > m[b] + PEAK_TOLERANCE * m[b].abs() {
            // intervals narrower than MIN_INTERVAL_RAD are not halved again:
            // a kink (a member going slack) is then pinned to within it
            if b > 0 && th[b] - th[b - 1] > MIN_INTERVAL_RAD {
                out.push(0.5 * (th[b - 1] + th[b]));
            }
            if b + 1 < n && th[b + 1] - th[b] > MIN_INTERVAL_RAD {
                out.push(0.5 * (th[b] + th[b + 1]));
            }
        }
    }
    out.sort_by(f64::total_cmp);
    out.dedup_by(|a, b| (*a - *b).abs() < SAME_ANGLE_RAD);
    out.retain(|t| th.iter().all(|x| (x - t).abs() >= SAME_ANGLE_RAD));
    out
}

/// Sweep the arc of a swing released at `setup.release_rad`, starting from
/// the equilibrium `start` (the hanging rig).
///
/// # Errors
/// When the rig cannot be solved at some angle, with that angle named.
pub fn sweep(
    solver: &mut StaticSolver,
    s: &Scenario,
    a: &Allowables,
    loads: &NetworkLoads,
    setup: SwingSetup,
    start: &Equilibrium,
) -> Result<Arc, String> {
    sweep_planned(solver, s, a, loads, setup, start, Plan { focus: 0.0, grid_deg: GRID_STEP_DEG, prior: None })
}

/// How a sweep is made: which items are refined, the first grid's spacing,
/// and a sweep of a nearby release to start each solve from.
#[derive(Clone, Copy)]
struct Plan<'a> {
    /// Refine only the items within this fraction of the highest utilisation (0: every item).
    focus: f64,
    /// The first grid's largest spacing, degrees.
    grid_deg: f64,
    /// A sweep at a nearby release: each solve starts from its nearest angle.
    prior: Option<&'a Arc>,
}

/// The prior sweep's state nearest angle `theta`.
fn nearest(prior: Option<&Arc>, theta: f64) -> Option<&[[f64; 3]]> {
    let p = prior?;
    let x = p.samples.iter().min_by(|a, b| (a.theta_rad - theta).abs().total_cmp(&(b.theta_rad - theta).abs()))?;
    Some(&x.eq.positions_m)
}

/// As [`sweep`], made as `plan` says.
fn sweep_planned(
    solver: &mut StaticSolver,
    s: &Scenario,
    a: &Allowables,
    loads: &NetworkLoads,
    setup: SwingSetup,
    start: &Equilibrium,
    plan: Plan<'_>,
) -> Result<Arc, String> {
    let focus = plan.focus;
    let r = setup.release_rad;
    let mut sw = Sweeper { solver, s, a, loads, setup };
    let n_half = ((r.to_degrees() / plan.grid_deg).ceil() as usize).max(4);
    let mut samples: Vec<ArcSample> = Vec::new();
    let zero_start = nearest(plan.prior, 0.0).unwrap_or(&start.positions_m);
    let zero = sw.solve_at(0.0, zero_start, &start.positions_m)?;
    if r <= SAME_ANGLE_RAD {
        return Ok(Arc { release_rad: r, samples: vec![zero] });
    }
    // march out from the lowest point to each side, each solve started
    // from the one before (the rig turns a little at a time)
    let mut right: Vec<ArcSample> = Vec::new();
    let mut left: Vec<ArcSample> = Vec::new();
    for side in [1.0, -1.0] {
        let mut prev = zero.eq.positions_m.clone();
        for i in 1..=n_half {
            let theta = side * r * i as f64 / n_half as f64;
            let x = match nearest(plan.prior, theta) {
                // from the nearby sweep's state at about this angle, else from the angle before
                Some(p) => sw.solve_at(theta, p, &prev)?,
                None => sw.solve_at(theta, &prev, &zero.eq.positions_m)?,
            };
            prev = x.eq.positions_m.clone();
            if side > 0.0 { right.push(x) } else { left.push(x) }
        }
    }
    left.reverse();
    samples.extend(left);
    samples.push(zero);
    samples.extend(right);
    for _ in 0..16 {
        let more = refinements(s, &samples, focus);
        if more.is_empty() || samples.len() + more.len() > MAX_SAMPLES {
            break;
        }
        for t in more {
            let at = samples.partition_point(|x| x.theta_rad < t);
            let near = if at == 0 {
                0
            } else if at >= samples.len() || (samples[at - 1].theta_rad - t).abs() < (samples[at].theta_rad - t).abs() {
                at - 1
            } else {
                at
            };
            // start from the straight line between the two neighbours
            let start_pos: Vec<[f64; 3]> = if at > 0 && at < samples.len() {
                let (p, q) = (&samples[at - 1], &samples[at]);
                let f = (t - p.theta_rad) / (q.theta_rad - p.theta_rad);
                p.eq.positions_m
                    .iter()
                    .zip(&q.eq.positions_m)
                    .map(|(u, v)| [0, 1, 2].map(|i| u[i] + f * (v[i] - u[i])))
                    .collect()
            } else {
                samples[near].eq.positions_m.clone()
            };
            let fallback = samples[near].eq.positions_m.clone();
            let x = sw.solve_at(t, &start_pos, &fallback)?;
            samples.insert(at, x);
        }
    }
    Ok(Arc { release_rad: r, samples })
}

/// The release-angle limits of a swing: the largest release (at most 90°)
/// whose arc keeps every item within its allowable, and each item's own.
#[derive(Debug, Clone, PartialEq)]
pub struct ReleaseLimits {
    /// Largest release for the whole rig, degrees (0: even hanging still is too much).
    pub critical_deg: Option<f64>,
    /// Per item (members then floors), degrees (0: over even hanging still).
    pub items_deg: Vec<Option<f64>>,
}

/// Search the release-angle limits, given the sweep already done for the
/// case (`case_arc`) and the hanging equilibrium's utilisations (θ0 = 0).
///
/// # Errors
/// When a sweep cannot be solved.
pub fn release_limits(
    solver: &mut StaticSolver,
    s: &Scenario,
    a: &Allowables,
    loads: &NetworkLoads,
    setup: SwingSetup,
    start: &Equilibrium,
    case_arc: &Arc,
) -> Result<ReleaseLimits, String> {
    let hang = utilisations(s, a, start);
    // (release, each item's largest utilisation over the arc)
    let mut pts: Vec<(f64, Vec<f64>)> =
        vec![(0.0, hang.iter().map(|u| if u.is_finite() { *u } else { 0.0 }).collect())];
    pts.push((case_arc.release_rad, case_arc.item_max()));
    let half_pi = std::f64::consts::FRAC_PI_2;
    let mut last: Option<Arc> = None;
    let mut eval = |rel: f64, pts: &mut Vec<(f64, Vec<f64>)>| -> Result<f64, String> {
        if let Some(p) = pts.iter().find(|p| (p.0 - rel).abs() < SAME_ANGLE_RAD) {
            return Ok(p.1.iter().copied().fold(0.0, f64::max) - 1.0);
        }
        let plan = Plan { focus: LIMIT_FOCUS, grid_deg: LIMIT_GRID_STEP_DEG, prior: last.as_ref().or(Some(case_arc)) };
        let arc = sweep_planned(solver, s, a, loads, SwingSetup { release_rad: rel, ..setup }, start, plan)?;
        let m = arc.item_max();
        let g = m.iter().copied().fold(0.0, f64::max) - 1.0;
        pts.push((rel, m));
        last = Some(arc);
        Ok(g)
    };
    let g0 = eval(0.0, &mut pts)?;
    let critical = if g0 > 0.0 {
        Some(0.0)
    } else {
        let g90 = eval(half_pi, &mut pts)?;
        if g90 <= 0.0 {
            Some(half_pi)
        } else {
            // Illinois false position on the release angle
            let gc = eval(case_arc.release_rad, &mut pts)?;
            let b = if gc > 0.0 {
                Bracket { lo: 0.0, g_lo: g0, hi: case_arc.release_rad, g_hi: gc }
            } else {
                Bracket { lo: case_arc.release_rad, g_lo: gc, hi: half_pi, g_hi: g90 }
            };
            let out = illinois(b, |lo, hi| hi - lo <= LIMIT_TOLERANCE_RAD, 1e-7, |m| eval(m, &mut pts))?;
            // the lower end of the bracket is the one known to be within
            Some(out.lo)
        }
    };
    if !pts.iter().any(|p| (p.0 - half_pi).abs() < SAME_ANGLE_RAD) && critical.is_some() {
        eval(half_pi, &mut pts)?;
    }
    pts.sort_by(|x, y| x.0.total_cmp(&y.0));
    let n = pts.first().map_or(0, |p| p.1.len());
    let items_deg = (0..n)
        .map(|k| {
            if pts[0].1[k] > 1.0 {
                return Some(0.0);
            }
            for w in pts.windows(2) {
                let ((r0, u0), (r1, u1)) = ((w[0].0, w[0].1[k]), (w[1].0, w[1].1[k]));
                if u0 <= 1.0 && u1 > 1.0 {
                    return Some((r0 + (1.0 - u0) / (u1 - u0) * (r1 - r0)).to_degrees());
                }
            }
            Some(90.0)
        })
        .collect();
    Ok(ReleaseLimits { critical_deg: critical.map(f64::to_degrees), items_deg })
}
