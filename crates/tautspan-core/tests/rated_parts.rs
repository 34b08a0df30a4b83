//! Rated parts in the load path against hand statics and published tables:
//! fittings in series on members, a master link at a node on the resultant,
//! eye bolts derated by angle, rated anchors, hoist side pull, the verdict
//! and the warnings they give; and the sling-angle warning given to sling
//! legs only (not guys or ties).

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::{Analysis, State, Verdict, WarningKind, analyse};
use tautspan_core::model::load_scenario;
use tautspan_core::output::check_json;

/// Standard gravity, m/s² (CGPM 1901, ISO 80000-3): a WLL in tonnes is that weight.
const G: f64 = 9.80665;

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

fn analysed(text: &str) -> Analysis {
    let l = load_scenario(text).unwrap_or_else(|e| panic!("{e}"));
    analyse(&l.scenario)
}

/// Some case has a warning containing `needle` (each warning on its own:
/// `warnings` holds one group per kind, whose text is the first one's).
fn warned(a: &Analysis, needle: &str) -> bool {
    a.cases.iter().any(|c| c.warning_items.iter().any(|w| w.message.contains(needle)))
}

/// As [`warned`], of the given kind (the kind its group is named by).
fn warned_as(a: &Analysis, kind: WarningKind, needle: &str) -> bool {
    a.cases.iter().any(|c| c.warning_items.iter().any(|w| w.kind == kind && w.message.contains(needle)))
}

/// A symmetric two-leg bridle: anchors at (±`half` m, 5 m), the ring at
/// (0, 3 m), `mass` at the ring; stiff weightless legs (EA = 1e9 N, so the
/// stretch moves the angle by under 1e-5 relative). `leg` and `ring` are
/// extra fields for the west leg and the ring node; `anchor` for node A.
fn bridle(half: &str, mass: &str, leg: &str, ring: &str, anchor: &str) -> String {
    format!(
        r#"Scenario(format: 1, title: "bridle",
        nodes: [ Node(id: "A", at: ("-{half}", "5 m"), support: Anchor{anchor}), Node(id: "B", at: ("{half}", "5 m"), support: Anchor),
                 Node(id: "R", at: ("0 m", "3 m"){ring}) ],
        members: [ Member(id: "west", ends: ("A", "R"), kind: WireRope, area: "1000 mm^2", modulus: "1000 GPa", rating: BreakingStrength("500 kN"), linear_mass: "0 kg/m"{leg}),
                   Member(id: "east", ends: ("B", "R"), kind: WireRope, area: "1000 mm^2", modulus: "1000 GPa", rating: BreakingStrength("500 kN"), linear_mass: "0 kg/m") ],
        masses: [ Mass(id: "load", at: "R", mass: "{mass}") ],
        cases: [ Static(id: "s") ])"#
    )
}

#[test]
fn master_link_at_the_ring_carries_the_hung_weight() {
    // statics of the ring: the two legs' pulls sum to the weight, whatever
    // the spread (tolerance 1e-6: the solver balances to 1e-9 of the load)
    for half in ["1 m", "2 m", "4 m"] {
        let a = analysed(&bridle(half, "1000 kg", "", r#", fittings: [MasterLink(wll: "2 t")]"#, ""));
        let ring = a.cases[0].nodes.iter().find(|n| n.id == "R").unwrap();
        let link = &ring.fittings[0];
        assert_eq!(link.kind, "master_link");
        assert!(rel(link.force_n, 1000.0 * G) < 1e-6, "{half}: {}", link.force_n);
        // 2 t = 2000 kg x 9.80665 m/s^2 (ISO 80000-3), exact to rounding
        assert!(rel(link.wll_n, 2000.0 * G) < 1e-12);
        assert!((link.utilisation - 0.5).abs() < 1e-6, "{}", link.utilisation);
        assert_eq!(link.state, State::Ok);
        // the comparison has its row, id "node/part"
        assert!(a.comparison.iter().any(|r| r.id == "R/master link"));
    }
}

#[test]
fn shackle_on_a_leg_carries_the_leg_force_and_counts_in_the_verdict() {
    // leg force W / (2 sin β), tan β = 2 / 1 (statics of a symmetric
    // bridle); tolerance 1e-4 for the stiff legs' stretch
    let beta = 2.0_f64.atan2(1.0);
    let leg = 1000.0 * G / (2.0 * beta.sin());
    let a = analysed(&bridle("1 m", "1000 kg", r#", fittings: [Shackle(wll: "1 t")]"#, "", ""));
    let s = &a.cases[0].members[0].fittings[0];
    assert!(rel(s.force_n, leg) < 1e-4, "{} vs {leg}", s.force_n);
    assert!(rel(s.utilisation, leg / G / 1000.0) < 1e-4);
    assert_eq!(a.verdict(), Verdict::Within);

    // a 0.5 t shackle on the same leg: 5482 N over 4903 N, over by 11.8 %
    let a = analysed(&bridle("1 m", "1000 kg", r#", fittings: [Shackle(wll: "0.5 t")]"#, "", ""));
    let s = &a.cases[0].members[0].fittings[0];
    assert_eq!(s.state, State::Over);
    assert!(rel(s.utilisation, leg / (500.0 * G)) < 1e-4, "{}", s.utilisation);
    assert_eq!(a.verdict(), Verdict::NotWithin);
    assert!(
        warned_as(&a, WarningKind::PartOver, "shackle west/shackle:") && warned(&a, "is over its WLL 4.903 kN"),
        "{:?}",
        a.cases[0].warnings
    );
    // the member itself is well within: the part alone fails the verdict
    assert_eq!(a.cases[0].members[0].state, State::Ok);
    // JSON: the member entry has fittings[] with kind, wll_n, force_n, utilisation, state
    let j = check_json("x.ron", &a);
    let f = &j["cases"][0]["members"][0]["fittings"][0];
    assert_eq!(f["kind"], "shackle");
    assert_eq!(f["state"], "over");
    assert!(rel(f["wll_n"].as_f64().unwrap(), 500.0 * G) < 1e-12);
    assert!(rel(f["force_n"].as_f64().unwrap(), leg) < 1e-4);
    assert_eq!(j["verdict"], "not_within");
}

#[test]
fn eye_bolts_are_derated_by_the_angle_from_their_axis() {
    // the west leg runs at atan(1/2) = 26.57 deg from the vertical; a
    // vertical shoulder eye bolt at its foot is pulled 26.57 deg from its
    // axis: the 30 deg row, 65 % (published shoulder eye bolt table, ASME
    // B30.26 practice). Angle to 1e-3 deg (stretch of the stiff legs).
    let angle = 1.0_f64.atan2(2.0).to_degrees();
    let a = analysed(&bridle(
        "1 m",
        "1000 kg",
        r#", fittings: [EyeBolt(wll: "2 t", axis: (0, 1, 0), shoulder: true)]"#,
        "",
        "",
    ));
    let e = &a.cases[0].members[0].fittings[0];
    assert!((e.angle_deg.unwrap() - angle).abs() < 1e-3, "{:?}", e.angle_deg);
    assert!(rel(e.wll_n, 0.65 * 2000.0 * G) < 1e-12, "{}", e.wll_n);
    assert!(rel(e.rated_wll_n, 2000.0 * G) < 1e-12);
    assert!(e.source.contains("ASME B30.26"));

    // the axis along the leg: in line, full WLL
    let a = analysed(&bridle(
        "1 m",
        "1000 kg",
        r#", fittings: [EyeBolt(wll: "2 t", axis: (1, -2, 0), shoulder: true)]"#,
        "",
        "",
    ));
    let e = &a.cases[0].members[0].fittings[0];
    assert!(e.angle_deg.unwrap() < 1e-3 && rel(e.wll_n, 2000.0 * G) < 1e-12, "{e:?}");

    // a wider spread, 4 m half: 63.4 deg from vertical, the 90 deg row, 25 %
    let a = analysed(&bridle(
        "4 m",
        "100 kg",
        r#", fittings: [EyeBolt(wll: "2 t", axis: (0, 1, 0), shoulder: true)]"#,
        "",
        "",
    ));
    assert!(rel(a.cases[0].members[0].fittings[0].wll_n, 0.25 * 2000.0 * G) < 1e-12);

    // a plain eye bolt pulled 26.6 deg off its axis: rated in line only
    // (ASME B30.26), so over whatever the load, with the reason given
    let a = analysed(&bridle("1 m", "10 kg", r#", fittings: [EyeBolt(wll: "2 t", axis: (0, 1, 0))]"#, "", ""));
    let e = &a.cases[0].members[0].fittings[0];
    assert_eq!(e.state, State::Over);
    assert!(e.reason.as_deref().unwrap().contains("in-line pull only"), "{e:?}");
    assert_eq!(a.verdict(), Verdict::NotWithin);
    assert!(warned_as(
        &a,
        WarningKind::PartOver,
        "eye bolt west/eye bolt: OVER in case s: plain (shoulderless) eye bolt pulled 26.6 deg"
    ));
}

#[test]
fn rated_anchor_is_checked_on_the_reaction() {
    // anchor A's reaction equals the west leg's pull: W / (2 sin β),
    // tan β = 2 (statics); tolerance 1e-4 for the stiff legs' stretch
    let beta = 2.0_f64.atan2(1.0);
    let leg = 1000.0 * G / (2.0 * beta.sin());
    let a = analysed(&bridle("1 m", "1000 kg", "", "", r#", rated: "10 kN""#));
    let sup = a.cases[0].supports.iter().find(|s| s.node == "A").unwrap();
    let r = sup.rated.as_ref().unwrap();
    assert!(rel(r.force_n, leg) < 1e-4 && rel(r.utilisation, leg / 10_000.0) < 1e-4, "{r:?}");
    assert_eq!(a.verdict(), Verdict::Within);
    let j = check_json("x.ron", &a);
    assert_eq!(j["cases"][0]["supports"][0]["rated_n"], 10_000.0);
    assert_eq!(j["cases"][0]["supports"][0]["state"], "ok");
    assert!(j["cases"][0]["supports"][1]["rated_n"].is_null());
    // B has no rating: the scope says so
    assert!(a.scope.not_checked.iter().any(|l| l.starts_with("anchors without a rating")));
    assert!(a.scope.checked.iter().any(|l| l.starts_with("fittings entered")));

    // rated 5 kN: 5482 N is over
    let a = analysed(&bridle("1 m", "1000 kg", "", "", r#", rated: "5 kN""#));
    assert_eq!(a.verdict(), Verdict::NotWithin);
    assert!(
        warned_as(&a, WarningKind::PartOver, "rated anchor A/anchor: 5.482 kN is over its WLL 5 kN"),
        "{:?}",
        a.cases[0].warnings
    );
}

/// A hoist hung from anchor A at (`x` m, 5 m) down to the load at (0, 1 m),
/// the load held sideways by a level tag line to anchor T at (-3 m, 1 m).
fn hoist_rig(x: &str, hoist: &str) -> String {
    format!(
        r#"Scenario(format: 1, title: "hoist",
        nodes: [ Node(id: "A", at: ("{x}", "5 m"), support: Anchor), Node(id: "T", at: ("-3 m", "1 m"), support: Anchor),
                 Node(id: "M", at: ("0 m", "1 m")) ],
        members: [ Member(id: "hoist", ends: ("A", "M"), kind: Chain, area: "100 mm^2", modulus: "1000 GPa", rating: WorkingLoadLimit("20 kN"), linear_mass: "0 kg/m",
                          fittings: [{hoist}]),
                   Member(id: "tag", ends: ("T", "M"), kind: FibreRope, area: "100 mm^2", modulus: "1000 GPa", rating: BreakingStrength("50 kN"), linear_mass: "0 kg/m", may_go_slack: true) ],
        masses: [ Mass(id: "load", at: "M", mass: "500 kg") ],
        cases: [ Static(id: "s") ])"#
    )
}

#[test]
fn hoist_side_pull_against_the_makers_limit() {
    // the hoist line from (0.4, 5) to (0, 1): atan(0.4 / 4) = 5.71 deg off plumb
    let off = 0.4_f64.atan2(4.0).to_degrees();
    let a = analysed(&hoist_rig("0.4 m", r#"Hoist(wll: "1 t", max_off_plumb: "3 deg")"#));
    let h = &a.cases[0].members[0].fittings[0];
    assert!((h.angle_deg.unwrap() - off).abs() < 1e-3, "{h:?}");
    assert_eq!(h.state, State::Over);
    assert!(h.reason.as_deref().unwrap().contains("beyond the maker's side-pull limit of 3 deg"), "{h:?}");
    assert_eq!(a.verdict(), Verdict::NotWithin);

    // within a 10 deg limit: its rating alone governs
    let a = analysed(&hoist_rig("0.4 m", r#"Hoist(wll: "1 t", max_off_plumb: "10 deg")"#));
    assert_eq!(a.cases[0].members[0].fittings[0].state, State::Ok);
    assert!(!warned(&a, "off plumb"));

    // no limit entered: no made-up default, an advisory with the angle
    let a = analysed(&hoist_rig("0.4 m", r#"Hoist(wll: "1 t")"#));
    assert_eq!(a.cases[0].members[0].fittings[0].state, State::Ok);
    assert!(warned_as(
        &a,
        WarningKind::HoistSidePull,
        "hoist hoist/hoist: pulled 5.71 deg off plumb in case s; no side-pull limit entered"
    ));

    // plumb: nothing to ask
    let a = analysed(&hoist_rig("0 m", r#"Hoist(wll: "1 t")"#));
    assert!(!warned(&a, "off plumb"), "{:?}", a.cases[0].warnings);
}

#[test]
fn a_fitting_in_a_strut_is_unchecked() {
    // a rod pushed by a prop: a shackle is rated in tension
    let text = r#"Scenario(format: 1, title: "strut",
        nodes: [ Node(id: "A", at: ("0 m", "0 m"), support: Anchor), Node(id: "B", at: ("2 m", "0 m"), support: Anchor),
                 Node(id: "T", at: ("1 m", "1 m")) ],
        members: [ Member(id: "left", ends: ("A", "T"), kind: Rod, area: "500 mm^2", modulus: "200 GPa", rating: Yield("235 MPa"), linear_mass: "0 kg/m",
                          fittings: [Shackle(wll: "2 t")]),
                   Member(id: "right", ends: ("B", "T"), kind: Rod, area: "500 mm^2", modulus: "200 GPa", rating: Yield("235 MPa"), linear_mass: "0 kg/m") ],
        masses: [ Mass(id: "load", at: "T", mass: "100 kg") ],
        cases: [ Static(id: "s") ])"#;
    let a = analysed(text);
    let s = &a.cases[0].members[0].fittings[0];
    assert_eq!(s.state, State::Unchecked, "{s:?}");
    assert!(s.reason.as_deref().unwrap().contains("in compression"));
    assert_ne!(a.verdict(), Verdict::Within);
}

#[test]
fn sling_angle_warning_for_sling_legs_only() {
    // a flat bridle (the ring raised to 4 m): legs at atan(1/3) = 18.4 deg
    // from horizontal meet at the loaded ring: sling legs below 30 deg (ASME B30.9)
    let flat = bridle("3 m", "100 kg", "", "", "").replace(r#"("0 m", "3 m")"#, r#"("0 m", "4 m")"#);
    let a = analysed(&flat);
    assert!(
        warned_as(&a, WarningKind::LowSlingAngle, "member west: sling angle 18.4 deg from horizontal is below 30 deg"),
        "{:?}",
        a.cases[0].warnings
    );

    // a guy: the load hangs from T on a line from A above, and a guy from T
    // runs down to a ground anchor G at atan(3/10) = 16.7 deg; the guy's
    // lower end hangs nothing, so it is no sling leg
    let guy = r#"Scenario(format: 1, title: "guy",
        nodes: [ Node(id: "A", at: ("1 m", "10 m"), support: Anchor), Node(id: "G", at: ("-10 m", "2 m"), support: Anchor),
                 Node(id: "T", at: ("0 m", "5 m")) ],
        members: [ Member(id: "main", ends: ("A", "T"), kind: WireRope, area: "100 mm^2", modulus: "100 GPa", rating: BreakingStrength("100 kN")),
                   Member(id: "guy", ends: ("G", "T"), kind: WireRope, area: "100 mm^2", modulus: "100 GPa", rating: BreakingStrength("100 kN")) ],
        masses: [ Mass(id: "load", at: "T", mass: "500 kg") ],
        cases: [ Static(id: "s") ])"#;
    let a = analysed(guy);
    let g = &a.cases[0].members[1];
    assert!(g.force_n > 0.0 && g.sling_angle_deg < 30.0, "{g:?}");
    assert!(!warned(&a, "sling angle"), "{:?}", a.cases[0].warnings);
}

#[test]
fn bad_parts_are_located_errors() {
    let base = bridle("1 m", "100 kg", r#", fittings: [Shackle(wll: "1 t")]"#, "", "");
    for (from, to, field, needle) in [
        (r#"Shackle(wll: "1 t")"#, r#"Shackle(wll: "2 m")"#, "members[0].fittings[0].wll", "a rated load is a force"),
        (
            r#"Shackle(wll: "1 t")"#,
            r#"EyeBolt(wll: "1 t", axis: (0, 0, 0))"#,
            "members[0].fittings[0].axis",
            "not zero",
        ),
        (
            r#"Shackle(wll: "1 t")"#,
            r#"Hoist(wll: "1 t", max_off_plumb: "95 deg")"#,
            "members[0].fittings[0].max_off_plumb",
            "below 90 deg",
        ),
        (
            r#"Node(id: "R", at: ("0 m", "3 m")"#,
            r#"Node(id: "R", at: ("0 m", "3 m"), rated: "5 kN""#,
            "nodes[2].rated",
            "not an anchor",
        ),
        (
            r#"Node(id: "R", at: ("0 m", "3 m")"#,
            r#"Node(id: "R", at: ("0 m", "3 m"), fittings: [Hoist(wll: "1 t")]"#,
            "nodes[2].fittings[0]",
            "part of a member",
        ),
    ] {
        assert!(base.contains(from), "{from}");
        let text = base.replacen(from, to, 1);
        let err = load_scenario(&text).err().unwrap_or_else(|| panic!("accepted {to}"));
        let first = &err.0[0];
        assert!(first.location.is_some(), "{first}");
        assert_eq!(first.field.as_deref(), Some(field), "{first}");
        assert!(first.message.contains(needle), "{first}");
    }
    // an eye bolt without its axis: no axis is assumed
    let text = base.replacen(r#"Shackle(wll: "1 t")"#, r#"EyeBolt(wll: "1 t")"#, 1);
    let err = load_scenario(&text).err().unwrap().to_string();
    assert!(err.contains("axis"), "{err}");
}

#[test]
fn sling_angle_warning_for_legs_gathered_at_the_hook() {
    // a two-leg sling from a crane hook (anchor H) to the two lifting points
    // of a load, the load's body a stiff rod between them; the legs meet at
    // the hook with the load below it: legs at atan(1/3) = 18.4 deg from
    // horizontal (ASME B30.9: below 30 deg needs a qualified person); stiff
    // legs, so the stretch moves the angle by under 0.01 deg
    let text = r#"Scenario(format: 1, title: "two-leg sling",
        nodes: [ Node(id: "H", at: ("0 m", "5 m"), support: Anchor),
                 Node(id: "P1", at: ("-3 m", "4 m")), Node(id: "P2", at: ("3 m", "4 m")) ],
        members: [ Member(id: "leg-1", ends: ("H", "P1"), kind: WireRope, area: "1000 mm^2", modulus: "1000 GPa", rating: BreakingStrength("100 kN")),
                   Member(id: "leg-2", ends: ("H", "P2"), kind: WireRope, area: "1000 mm^2", modulus: "1000 GPa", rating: BreakingStrength("100 kN")),
                   Member(id: "body", ends: ("P1", "P2"), kind: Rod, area: "5000 mm^2", modulus: "200 GPa", rating: Yield("235 MPa")) ],
        masses: [ Mass(id: "m1", at: "P1", mass: "100 kg"), Mass(id: "m2", at: "P2", mass: "100 kg") ],
        cases: [ Static(id: "s") ])"#;
    let a = analysed(text);
    assert!(
        warned_as(&a, WarningKind::LowSlingAngle, "member leg-1: sling angle 18.4 deg from horizontal is below 30 deg"),
        "{:?}",
        a.cases[0].warnings
    );
    assert!(warned_as(&a, WarningKind::LowSlingAngle, "member leg-2: sling angle 18.4 deg"));
    // the load's body is a level strut, not a leg
    assert!(!warned(&a, "member body: sling angle") && !warned(&a, "member body: runs level"));
}
