//! Sheaves a rope runs over: the bearing's friction as a factor on the
//! tension from one side of a sheave to the other, and the lead-line pull of
//! a reeved block.
//!
//! Source: Wire Rope Technical Board, *Wire Rope Users Manual*, 4th ed.,
//! "lead-line factor" section: the tension rises by a factor K at each
//! sheave the rope is hauled over, K = 1.09 for plain (bronze-bushed)
//! bearings and 1.04 for anti-friction (roller) bearings; for n parts of
//! line the lead-line pull is `W · Kⁿ (K − 1) / (Kⁿ − 1)` (the manual's
//! table gives 0.309 for 4 parts on plain bearings), and every extra
//! lead-in sheave multiplies it by K again.

use serde::{Deserialize, Serialize};

/// A sheave's bearing, as written in a file.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default, Serialize, Deserialize)]
pub enum Bearing {
    /// No friction: the same tension on both sides (the ideal the closed
    /// forms use; for comparison and for sheaves whose friction is small
    /// enough to leave out, said in the output).
    #[default]
    Frictionless,
    /// A plain bearing: a bronze bush on the pin.
    Bronze,
    /// An anti-friction bearing: rollers or balls.
    Roller,
}

/// Where the bearing factors come from.
pub const SHEAVE_SOURCE: &str = "Wire Rope Technical Board, Wire Rope Users Manual, 4th ed., lead-line factors: K = 1.09 plain bearing, 1.04 anti-friction bearing";

impl Bearing {
    /// The tension ratio K across one sheave when the rope is hauled over it
    /// (tight side ÷ slack side).
    pub fn factor(self) -> f64 {
        match self {
            Bearing::Frictionless => 1.0,
            Bearing::Bronze => 1.09,
            Bearing::Roller => 1.04,
        }
    }

    /// Words for the output.
    pub fn label(self) -> &'static str {
        match self {
            Bearing::Frictionless => "frictionless",
            Bearing::Bronze => "bronze bush (plain bearing)",
            Bearing::Roller => "roller bearing",
        }
    }
}

/// Which way the rope runs over its sheaves while the load is carried: the
/// friction of every bearing acts against the motion, so the tension rises
/// towards the end that is hauled in.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Default, Serialize, Deserialize)]
pub enum RopeMotion {
    /// Hauled in at the path's last node (the lead line): the load rises and
    /// the lead line pulls hardest. The usual governing case for the rope.
    #[default]
    Hoisting,
    /// Paid out at the path's last node: the load is lowered and the dead
    /// end (the path's first node) pulls hardest.
    Lowering,
}

impl RopeMotion {
    /// Words for the output.
    pub fn label(self) -> &'static str {
        match self {
            RopeMotion::Hoisting => "hoisting (hauled in at the last node of its path)",
            RopeMotion::Lowering => "lowering (paid out at the last node of its path)",
        }
    }
}

/// The tension of each segment of a rope ÷ its largest, for the sheaves'
/// factors `k` in path order (one per sheave passed, so one fewer than the
/// segments). Hoisting: each sheave multiplies the tension by its K towards
/// the last node; lowering: divides it.
pub fn segment_factors(k: &[f64], motion: RopeMotion) -> Vec<f64> {
    let mut t = Vec::with_capacity(k.len() + 1);
    t.push(1.0);
    for &f in k {
        let last = t[t.len() - 1];
        t.push(match motion {
            RopeMotion::Hoisting => last * f,
            RopeMotion::Lowering => last / f,
        });
    }
    let max = t.iter().copied().fold(0.0, f64::max);
    t.iter().map(|v| v / max).collect()
}

/// Lead-line pull ÷ load for `parts` parts of line on sheaves of factor
/// `k`, the lead coming off the last sheave: `Kⁿ (K − 1) / (Kⁿ − 1)`, and
/// `1 / n` without friction.
pub fn lead_line_factor(parts: u32, k: f64) -> f64 {
    let n = f64::from(parts);
    if k == 1.0 { 1.0 / n } else { k.powf(n) * (k - 1.0) / (k.powf(n) - 1.0) }
}

#[cfg(test)]
mod tests {
    use super::*;

    // Wire Rope Users Manual, 4th ed., lead-line factor table: 4 parts of
    // line on plain bearings 0.309 (three figures printed: tolerance 5e-4);
    // and its worked example with two extra lead-in sheaves,
    // 0.309 × 1.09 × 1.09 = 0.367 (three figures).
    #[test]
    fn published_lead_line_factors() {
        let f = lead_line_factor(4, Bearing::Bronze.factor());
        assert!((f - 0.309).abs() < 5e-4, "{f}");
        let extra = f * Bearing::Bronze.factor().powi(2);
        assert!((extra - 0.367).abs() < 5e-4, "{extra}");
        // no friction: W / n exactly
        assert!((lead_line_factor(4, 1.0) - 0.25).abs() < 1e-15);
    }

    // Segment factors by hand: two sheaves of K = 1.09, hoisting: tensions
    // 1 : 1.09 : 1.1881, divided by the largest; lowering reverses them.
    #[test]
    fn segment_factors_by_hand() {
        let k = [1.09, 1.09];
        let h = segment_factors(&k, RopeMotion::Hoisting);
        let expect = [1.0 / 1.1881, 1.09 / 1.1881, 1.0];
        for (a, b) in h.iter().zip(expect) {
            assert!((a - b).abs() < 1e-15);
        }
        let l = segment_factors(&k, RopeMotion::Lowering);
        for (a, b) in l.iter().zip(expect.iter().rev()) {
            assert!((a - b).abs() < 1e-15);
        }
        assert_eq!(segment_factors(&[1.0, 1.0], RopeMotion::Hoisting), vec![1.0, 1.0, 1.0]);
    }
}
