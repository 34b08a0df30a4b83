//! The largest load factor on one mass that keeps every member and floor
//! within its allowable, found by a bracketed root search on the full
//! network (Illinois false position: superlinear, never leaves the bracket),
//! and per-item limits from a sweep of load factors.

use super::evaluate::{Allowables, max_utilisation, utilisations};
use crate::model::{NetworkLoads, Scenario};
use crate::solve::{Equilibrium, SolveOptions, StaticSolver};

/// Largest factor searched: 1000 × the weight.
pub const MAX_FACTOR: f64 = 1000.0;

/// Solve at load factor `factor` on `mass`, warm-started from `start`.
pub fn solve_at(
    solver: &mut StaticSolver,
    s: &Scenario,
    loads: &NetworkLoads,
    mass: usize,
    factor: f64,
    start: &Equilibrium,
) -> Option<Equilibrium> {
    let l = loads.with_mass_factor(s, mass, factor);
    solver.solve(&l, Some(&start.positions_m), &SolveOptions::default()).ok()
}

/// The load factor at which the first member or floor reaches its
/// allowable; `None` when no factor ≥ 0 up to [`MAX_FACTOR`] brings any item
/// to its allowable, `Some(f < 1)` when even less than the weight is too much.
pub fn critical_factor(
    solver: &mut StaticSolver,
    s: &Scenario,
    a: &Allowables,
    loads: &NetworkLoads,
    mass: usize,
    static_eq: &Equilibrium,
) -> Option<f64> {
    let g = |solver: &mut StaticSolver, f: f64, start: &Equilibrium| -> Option<(f64, Equilibrium)> {
        let eq = solve_at(solver, s, loads, mass, f, start)?;
        Some((max_utilisation(s, a, &eq) - 1.0, eq))
    };
    let g1 = max_utilisation(s, a, static_eq) - 1.0;
    // bracket [lo, hi] with g(lo) ≤ 0 < g(hi)
    let (mut lo, mut glo, mut hi, mut ghi, mut near_eq);
    if g1 > 0.0 {
        let (g0, eq0) = g(solver, 0.0, static_eq)?;
        if g0 > 0.0 {
            return Some(0.0);
        }
        (lo, glo, hi, ghi, near_eq) = (0.0, g0, 1.0, g1, eq0);
    } else {
        lo = 1.0;
        glo = g1;
        near_eq = static_eq.clone();
        let mut f = 2.0;
        loop {
            let (gf, eq) = g(solver, f, &near_eq)?;
            if gf > 0.0 {
                hi = f;
                ghi = gf;
                break;
            }
            lo = f;
            glo = gf;
            near_eq = eq;
            if f >= MAX_FACTOR {
                return None;
            }
            f = (f * 2.0).min(MAX_FACTOR);
        }
    }
    // Illinois false position
    let mut side = 0i8;
    for _ in 0..60 {
        if (hi - lo) <= 1e-7 * hi {
            break;
        }
        let mut m = hi - ghi * (hi - lo) / (ghi - glo);
        if !(m > lo && m < hi) {
            m = 0.5 * (lo + hi);
        }
        let (gm, eq) = g(solver, m, &near_eq)?;
        if gm > 0.0 {
            hi = m;
            ghi = gm;
            if side == 1 {
                glo *= 0.5;
            }
            side = 1;
        } else {
            lo = m;
            glo = gm;
            near_eq = eq;
            if side == -1 {
                ghi *= 0.5;
            }
            side = -1;
        }
        if gm.abs() < 1e-9 {
            return Some(m);
        }
    }
    Some(0.5 * (lo + hi))
}

/// Per item (members then floors): the load factor at which it reaches its
/// allowable, interpolated linearly on a sweep of factors up to three times
/// the critical factor (at least 5, the swing's 180° factor), and beyond the
/// sweep extrapolated linearly from its last two points (an estimate for
/// items far from their allowable; `None` when the trend never reaches it).
pub fn item_factors(
    solver: &mut StaticSolver,
    s: &Scenario,
    a: &Allowables,
    loads: &NetworkLoads,
    mass: usize,
    static_eq: &Equilibrium,
    critical: Option<f64>,
) -> Vec<Option<f64>> {
    let top = critical.map_or(5.0, |c| (3.0 * c).clamp(5.0, MAX_FACTOR));
    let mut sweep = vec![0.0, 1.0, 1.5, 2.0, 3.0, 5.0];
    let mut f = 5.0;
    while f < top {
        f = (f * 2.0).min(top);
        sweep.push(f);
    }
    let n = s.members.len() + s.floors.len();
    let mut out = vec![None; n];
    let mut prev: Option<(f64, Vec<f64>)> = None;
    let mut start = static_eq.clone();
    for f in sweep {
        let Some(eq) = solve_at(solver, s, loads, mass, f, &start) else { break };
        let u = utilisations(s, a, &eq);
        if let Some((pf, pu)) = &prev {
            for k in 0..n {
                if out[k].is_none() && pu[k] <= 1.0 && u[k] > 1.0 {
                    let t = (1.0 - pu[k]) / (u[k] - pu[k]);
                    out[k] = Some(pf + t * (f - pf));
                }
            }
        } else {
            for (k, uk) in u.iter().enumerate() {
                if *uk > 1.0 {
                    out[k] = Some(0.0);
                }
            }
        }
        prev = Some((f, u));
        start = eq;
        if out.iter().all(Option::is_some) {
            break;
        }
    }
    // beyond the sweep: extend each remaining item's last slope
    if let Some((pf, pu)) = prev
        && let Some(eq_lo) = solve_at(solver, s, loads, mass, pf * 0.8, &start)
    {
        let ul = utilisations(s, a, &eq_lo);
        for k in 0..n {
            let slope = (pu[k] - ul[k]) / (0.2 * pf);
            if out[k].is_none() && slope > 0.0 {
                let f = pf + (1.0 - pu[k]) / slope;
                out[k] = (f <= MAX_FACTOR).then_some(f);
            }
        }
    }
    out
}
