//! A generated net of wire rope for the solver tests and the dynamic-case
//! benchmark (one generator for both): `cols` × `rows` nodes in the x–y
//! plane at 0.5 m pitch, the top row anchored (and, with `side_anchors`,
//! both side columns too), vertical members down every column and cross
//! members between neighbours in each row below the top, drawn at their
//! unstretched length plus `cross_slack` (a negative value pretensions
//! them where the sides are held; zero leaves them switching between slack
//! and taut at the solution, the hardest case for the solver). A 500 kg
//! mass hangs at the middle of the bottom row, with a static, a swing
//! (30°), a drop (5 mm) and a sudden case. Members between two anchors
//! carry nothing and are left out.

use std::fmt::Write;

pub fn hung_net(cols: usize, rows: usize, cross_slack: &str, side_anchors: bool) -> String {
    let anchored = |r: usize, c: usize| r == 0 || (side_anchors && (c == 0 || c + 1 == cols));
    let mut s = String::from("Scenario(format: 1, title: \"generated net\", nodes: [");
    for r in 0..rows {
        for c in 0..cols {
            let support = if anchored(r, c) { ", support: Anchor" } else { "" };
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
            if c + 1 < cols && r > 0 && !(anchored(r, c) && anchored(r, c + 1)) {
                let _ = write!(
                    s,
                    "Member(id: \"h{r}_{c}\", ends: (\"n{r}_{c}\", \"n{r}_{}\"), {rope}, may_go_slack: true, slack: \"{cross_slack}\"),",
                    c + 1
                );
            }
            if r + 1 < rows && !(anchored(r, c) && anchored(r + 1, c)) {
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
