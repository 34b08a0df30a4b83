//! A net hung from a row of anchors whose cross members are drawn at their
//! unstretched length: under load some switch between slack and taut right
//! at the solution, which the damped Newton iteration must still settle to
//! the full tolerance (1e-9 of the load on the out-of-balance force).

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::analyse;
use tautspan_core::model::load_scenario;

fn hung_net(cols: usize, rows: usize) -> String {
    use std::fmt::Write;
    let mut s = String::from("Scenario(format: 1, title: \"net\", nodes: [");
    for r in 0..rows {
        for c in 0..cols {
            let support = if r == 0 { ", support: Anchor" } else { "" };
            let _ = write!(
                s,
                "Node(id: \"n{r}_{c}\", at: (\"{} m\", \"{} m\"){support}),",
                c as f64 * 0.5,
                10.0 - r as f64 * 0.5
            );
        }
    }
    s.push_str("], members: [");
    let rope = "kind: WireRope, diameter: \"10 mm\", construction: \"6x19 IWRC\", grade: \"1770\"";
    for r in 0..rows {
        for c in 0..cols {
            if c + 1 < cols && r > 0 {
                let _ = write!(
                    s,
                    "Member(id: \"h{r}_{c}\", ends: (\"n{r}_{c}\", \"n{r}_{}\"), {rope}, may_go_slack: true),",
                    c + 1
                );
            }
            if r + 1 < rows {
                let _ = write!(s, "Member(id: \"v{r}_{c}\", ends: (\"n{r}_{c}\", \"n{}_{c}\"), {rope}),", r + 1);
            }
        }
    }
    let _ = write!(
        s,
        "], masses: [Mass(id: \"load\", at: \"n{}_{}\", mass: \"500 kg\")], cases: [Static(id: \"s\"), Swing(id: \"sw\", mass: \"load\", release: \"30 deg\"), Drop(id: \"d\", mass: \"load\", height: \"5 mm\"), Sudden(id: \"su\", mass: \"load\")])",
        rows - 1,
        cols / 2
    );
    s
}

#[test]
fn hung_net_with_members_at_rest_length_converges() {
    for (cols, rows) in [(5, 5), (11, 11)] {
        let l = load_scenario(&hung_net(cols, rows)).expect("scenario");
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
