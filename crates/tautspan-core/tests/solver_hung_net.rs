//! A net hung from a row of anchors whose cross members are drawn at their
//! unstretched length: under load some switch between slack and taut right
//! at the solution, which the damped Newton iteration must still settle to
//! the full tolerance (1e-9 of the load on the out-of-balance force).

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::analyse;
use tautspan_core::model::load_scenario;

#[path = "common/hung_net.rs"]
mod common;
use common::hung_net;

#[test]
fn hung_net_with_members_at_rest_length_converges() {
    // also the benchmark's net held on three sides, cross members pretensioned
    for (cols, rows, slack, sides) in [(5, 5, "0 m", false), (11, 11, "0 m", false), (12, 11, "-1 mm", true)] {
        let l = load_scenario(&hung_net(cols, rows, slack, sides)).expect("scenario");
        let a = analyse(&l.scenario);
        for c in &a.cases {
            assert!(c.converged, "{cols}x{rows} {}: {:?}", c.id, c.error);
        }
        // the columns carry the whole weight: Σ vertical reactions = Σ weights
        let s = &a.cases[0];
        let up: f64 = s.supports.iter().map(|r| r.reaction_n[1]).sum();
        let own: f64 = l
            .scenario
            .members
            .iter()
            .map(|m| {
                m.linear_mass.value
                    * l.scenario.rest_length_m(l.scenario.members.iter().position(|x| x.id == m.id).unwrap())
            })
            .sum();
        let w = (500.0 + own) * 9.80665;
        assert!(((up - w) / w).abs() < 1e-9, "{up} vs {w}");
    }
}
