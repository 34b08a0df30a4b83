//! The largest load factor on one mass that keeps every member and floor
//! within its allowable, found by a root search on the full nonlinear
//! network, and each item's own limiting factor from the same solves.
//!
//! Method: solve at the weight (the static case) and at twice it; predict
//! each item's limiting factor from the straight line through those two
//! utilisations; bracket the smallest prediction with full solves and close
//! the bracket by Illinois false position (superlinear, never leaves the
//! bracket) to 1e-7 relative on the factor. Every solve is warm-started from
//! a straight-line extrapolation of the two nearest solved states, so each
//! takes few Newton steps. An item's own limit is read from the solved
//! samples by linear interpolation between the two that straddle it, or
//! extrapolated from the two highest (an estimate, for items far from
//! their allowable).

use super::evaluate::{Allowables, utilisations};
use super::illinois::{Bracket, illinois};
use crate::model::{NetworkLoads, Scenario};
use crate::solve::{Equilibrium, SolveOptions, StaticSolver};

/// Largest factor searched: 1000 × the weight.
pub const MAX_FACTOR: f64 = 1000.0;

/// The outcome of a limit search for one mass.
#[derive(Debug, Clone, PartialEq)]
pub struct LimitSearch {
    /// The factor at which the first item reaches its allowable (`None`
    /// when none does up to [`MAX_FACTOR`]; 0 when even no load is too much).
    pub critical: Option<f64>,
    /// Per item (members then floors), its own limiting factor.
    pub items: Vec<Option<f64>>,
    /// The equilibria solved on the way, by load factor: the cases of this
    /// mass start from them (or are one of them: the sudden case is the
    /// factor-2 solve).
    pub samples: Vec<(f64, Equilibrium)>,
}

/// Start positions for load factor `f`: straight-line extrapolation of the
/// solved state nearest to it and the nearest other one far enough from it
/// (at least a tenth of the way to `f`, so that the line is not stretched
/// more than tenfold from two nearly equal solves).
pub(crate) fn predict_start(samples: &[(f64, &Equilibrium)], f: f64) -> Vec<[f64; 3]> {
    let mut near: Vec<&(f64, &Equilibrium)> = samples.iter().collect();
    near.sort_by(|x, y| (x.0 - f).abs().total_cmp(&(y.0 - f).abs()));
    let Some(a) = near.first() else { return Vec::new() };
    let reach = (f - a.0).abs();
    match near.iter().skip(1).find(|b| (b.0 - a.0).abs() >= 0.1 * reach && (b.0 - a.0).abs() > 1e-12) {
        Some(b) if reach > 0.0 => {
            let t = (f - a.0) / (b.0 - a.0);
            a.1.positions_m
                .iter()
                .zip(&b.1.positions_m)
                .map(|(pa, pb)| [pa[0] + t * (pb[0] - pa[0]), pa[1] + t * (pb[1] - pa[1]), pa[2] + t * (pb[2] - pa[2])])
                .collect()
        }
        _ => a.1.positions_m.clone(),
    }
}

struct Sample {
    factor: f64,
    util: Vec<f64>,
    eq: Equilibrium,
}

struct Search<'a> {
    solver: &'a mut StaticSolver,
    s: &'a Scenario,
    a: &'a Allowables,
    loads: &'a NetworkLoads,
    mass: usize,
    samples: Vec<Sample>,
}

impl Search<'_> {
    /// Start positions for `f` from the solved samples.
    fn predict(&self, f: f64) -> Vec<[f64; 3]> {
        let near: Vec<(f64, &Equilibrium)> = self.samples.iter().map(|x| (x.factor, &x.eq)).collect();
        predict_start(&near, f)
    }

    /// The sample solved at factor `f`.
    fn sample(&self, f: f64) -> Option<&Sample> {
        self.samples.iter().find(|x| x.factor == f)
    }

    /// Largest utilisation at factor `f` (solving and recording the sample).
    fn max_util(&mut self, f: f64) -> Option<f64> {
        if let Some(x) = self.samples.iter().find(|x| x.factor == f) {
            return Some(x.util.iter().copied().fold(0.0, f64::max));
        }
        let l = self.loads.with_mass_factor(self.s, self.mass, f);
        let start = self.predict(f);
        let opts = SolveOptions::default();
        let eq = match self.solver.solve(&l, Some(&start), &opts) {
            Ok(eq) => eq,
            // a poor prediction can throw the start too far: retry from the nearest state
            Err(_) => {
                let nearest =
                    self.samples.iter().min_by(|x, y| (x.factor - f).abs().total_cmp(&(y.factor - f).abs()))?;
                let start = nearest.eq.positions_m.clone();
                self.solver.solve(&l, Some(&start), &opts).ok()?
            }
        };
        let util = utilisations(self.s, self.a, &eq);
        let m = util.iter().copied().fold(0.0, f64::max);
        self.samples.push(Sample { factor: f, util, eq });
        Some(m)
    }
}

/// How far past a predicted root the bracketing solve is placed, relative:
/// half the closing tolerance, so that a right prediction closes the
/// bracket at once.
const OVERSHOOT: f64 = 5e-8;

/// The smallest load factor at which any item's utilisation reaches 1 on
/// the straight lines through two solved samples (infinite when no item
/// rises between them).
fn line_prediction(a: &Sample, b: &Sample) -> f64 {
    a.util
        .iter()
        .zip(&b.util)
        .filter(|(ua, ub)| *ub > *ua)
        .map(|(ua, ub)| b.factor + (1.0 - ub) * (b.factor - a.factor) / (ub - ua))
        .fold(f64::INFINITY, f64::min)
}

/// Search the limits of `mass`, from the static equilibrium `static_eq`.
pub fn search_limits(
    solver: &mut StaticSolver,
    s: &Scenario,
    a: &Allowables,
    loads: &NetworkLoads,
    mass: usize,
    static_eq: &Equilibrium,
) -> LimitSearch {
    let util1 = utilisations(s, a, static_eq);
    let n = util1.len();
    let mut sr =
        Search { solver, s, a, loads, mass, samples: vec![Sample { factor: 1.0, util: util1, eq: static_eq.clone() }] };
    let critical = critical(&mut sr);
    let items = (0..n).map(|k| item_factor(&sr.samples, k)).collect();
    let mut samples: Vec<(f64, Equilibrium)> = sr.samples.into_iter().map(|x| (x.factor, x.eq)).collect();
    samples.sort_by(|x, y| x.0.total_cmp(&y.0));
    LimitSearch { critical, items, samples }
}

fn critical(sr: &mut Search<'_>) -> Option<f64> {
    let g1 = sr.max_util(1.0)? - 1.0;
    let (mut lo, mut glo, hi, ghi);
    if g1 > 0.0 {
        let g0 = sr.max_util(0.0)? - 1.0;
        if g0 > 0.0 {
            return Some(0.0);
        }
        (lo, glo, hi, ghi) = (0.0, g0, 1.0, g1);
    } else {
        let g2 = sr.max_util(2.0)? - 1.0;
        if g2 > 0.0 {
            (lo, glo, hi, ghi) = (1.0, g1, 2.0, g2);
        } else {
            // predict from the straight lines through the two samples, then
            // from the two highest: a line is exact for a rig that responds
            // linearly, so the first solves land next to the root; each try
            // steps a hair past the prediction (more each time) to bracket it
            let pred = line_prediction(&sr.samples[0], &sr.samples[1]);
            lo = 2.0;
            glo = g2;
            let mut f = if pred.is_finite() { pred.clamp(2.0 * (1.0 + OVERSHOOT), MAX_FACTOR) } else { 4.0 };
            let mut tries = 0;
            loop {
                let gf = sr.max_util(f)? - 1.0;
                if gf.abs() < 1e-9 {
                    return Some(f);
                }
                if gf > 0.0 {
                    hi = f;
                    ghi = gf;
                    break;
                }
                let below = lo;
                lo = f;
                glo = gf;
                if f >= MAX_FACTOR {
                    return None;
                }
                tries += 1;
                let next = match (sr.sample(below), sr.sample(lo)) {
                    (Some(a), Some(b)) => line_prediction(a, b),
                    _ => f64::INFINITY,
                };
                f = if tries <= 4 && next.is_finite() && next > lo {
                    next * (1.0 + OVERSHOOT * 10f64.powi(tries - 1))
                } else {
                    f * 2.0
                }
                .min(MAX_FACTOR);
            }
        }
    }
    let b = Bracket { lo, g_lo: glo, hi, g_hi: ghi };
    let out = illinois(b, |lo, hi| hi - lo <= 1e-7 * hi, 1e-9, |m| sr.max_util(m).map(|u| u - 1.0).ok_or(())).ok()?;
    Some(0.5 * (out.lo + out.hi))
}

fn item_factor(samples: &[Sample], k: usize) -> Option<f64> {
    let mut pts: Vec<(f64, f64)> = samples.iter().map(|x| (x.factor, x.util[k])).collect();
    pts.sort_by(|x, y| x.0.total_cmp(&y.0));
    if pts.first().is_some_and(|p| p.1 > 1.0) {
        return Some(0.0);
    }
    for w in pts.windows(2) {
        let ((f0, u0), (f1, u1)) = (w[0], w[1]);
        if u0 <= 1.0 && u1 > 1.0 {
            return Some(f0 + (1.0 - u0) / (u1 - u0) * (f1 - f0));
        }
    }
    match pts.as_slice() {
        [.., (f0, u0), (f1, u1)] if u1 > u0 && f1 > f0 => {
            let f = f1 + (1.0 - u1) / ((u1 - u0) / (f1 - f0));
            (f <= MAX_FACTOR).then_some(f)
        }
        _ => None,
    }
}
