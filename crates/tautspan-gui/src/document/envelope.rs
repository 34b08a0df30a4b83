//! The worst case of every member over all cases: the result from the case
//! where the member is worst (over first, then unchecked, then the largest
//! utilisation), for the canvas's "worst over all cases" colouring. The
//! numbers are the core's, case by case; nothing is recomputed.

use std::collections::HashMap;
use tautspan_core::analysis::{Analysis, MemberResult, State};

/// How much a result weighs: over, then unchecked, then by utilisation
/// (a non-finite utilisation counts as 0 beside a state that says more).
fn rank(r: &MemberResult) -> (u8, f64) {
    let u = if r.utilisation.is_finite() { r.utilisation } else { 0.0 };
    match r.state {
        State::Over => (2, u),
        State::Unchecked => (1, u),
        _ => (0, u),
    }
}

/// Each member's (and rope's) result in the case where it is worst, by id.
pub fn worst_members(a: &Analysis) -> HashMap<&str, &MemberResult> {
    let mut out: HashMap<&str, &MemberResult> = HashMap::new();
    for c in &a.cases {
        for m in &c.members {
            let slot = out.entry(m.id.as_str()).or_insert(m);
            if rank(m) > rank(slot) {
                *slot = m;
            }
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn each_member_takes_its_worst_case_of_the_core_analysis() {
        // the built-in demo: the drop line is over in the 20 mm snatch
        // (218.5 % in `tautspan check`), 40.9 % hanging
        let loaded = tautspan_core::model::load_scenario(crate::DEMO_SCENARIO).unwrap_or_else(|e| panic!("{e}"));
        let a = tautspan_core::analysis::analyse(&loaded.scenario);
        let worst = worst_members(&a);
        for id in ["hoist-west", "hoist-east", "drop-line"] {
            let max = a
                .cases
                .iter()
                .flat_map(|c| c.members.iter().filter(|m| m.id == id))
                .map(|m| m.utilisation)
                .fold(0.0, f64::max);
            let w = worst.get(id).unwrap_or_else(|| panic!("{id} has a worst case"));
            // the same number taken over, not recomputed: equal to the last bit
            assert!((w.utilisation - max).abs() <= 1e-12 * max, "{id}: {} against {max}", w.utilisation);
        }
        let drop = worst.get("drop-line").unwrap_or_else(|| panic!("drop-line"));
        assert_eq!(drop.state, State::Over);
        assert!((drop.utilisation - 2.185).abs() < 0.0006, "218.5 % as `check` prints it: {}", drop.utilisation);
    }
}
