//! Struts checked for buckling through the whole chain (file → model →
//! solver → checks), and the member defaults that must not err on the
//! unsafe side: chain WLL from the EN 818-2 table, textile slings at 7, wire
//! rope terminations, the duty over people or lifting persons. Each expected
//! value is worked by hand beside the check with its source.

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::{Analysis, State, Verdict, analyse};
use tautspan_core::model::load_scenario;

const G: f64 = 9.80665;

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

fn analysed(text: &str) -> Analysis {
    let l = load_scenario(text).unwrap_or_else(|e| panic!("{e}"));
    analyse(&l.scenario)
}

/// A jib: a level strut from the wall foot (0, 0) to the tip (2.6 m, 0) and
/// a tie from the wall at (0, 2.6 m) to the tip, mass at the tip. By statics
/// the strut carries W in compression and the tie W √2 (a 45° tie).
fn jib(strut: &str, mass: &str, cases: &str) -> String {
    format!(
        r#"Scenario(format: 1, title: "jib",
        nodes: [ Node(id: "W0", at: ("0 m", "0 m"), support: Anchor), Node(id: "W1", at: ("0 m", "2.6 m"), support: Anchor),
                 Node(id: "T", at: ("2.6 m", "0 m")) ],
        members: [ Member(id: "strut", ends: ("W0", "T"), kind: Rod, {strut}, linear_mass: "0 kg/m"),
                   Member(id: "tie", ends: ("W1", "T"), kind: WireRope, area: "200 mm^2", modulus: "100 GPa",
                          rating: BreakingStrength("2000 kN"), termination: PouredSocket, linear_mass: "0 kg/m") ],
        masses: [ Mass(id: "load", at: "T", mass: "{mass}") ],
        cases: [ {cases} ])"#
    )
}

const CHS_48: &str = r#"section: Tube(outer: "48.3 mm", wall: "3.2 mm"), material: "steel", rating: Yield("235 MPa")"#;

// CHS 48.3 x 3.2 S235, L = 2.6 m, K = 1, E = 210 GPa (EN 1993-1-1 3.2.6),
// default curve c (EN 1993-1-1 Table 6.2, cold formed or unknown finish):
//   A = pi (48.3^2 - 41.9^2) / 4 = 453.4 mm^2, I = 115 860 mm^4,
//   N_cr = pi^2 E I / L^2 = 35.52 kN, lambda = sqrt(106.55 / 35.52) = 1.732,
//   Phi = 2.375, chi = 0.2500, N_b = chi A f_y = 26.64 kN,
//   compression allowable N_b / 2.0 (ASME BTH-1 cat. A) = 13.32 kN;
//   tension (yield) allowable 106.55 / 2 = 53.27 kN.
// 2039 kg at the tip: W = 20.0 kN of compression in the strut: 37.5 % of the
// yield allowable but 150 % of the buckling allowable, and 56 % of N_cr.
// Tolerances: 0.5 % on N_cr and N_b (four-figure hand arithmetic); 1 % on
// the strut force (the tip moves under load: large-displacement solve).
#[test]
fn strut_at_low_yield_utilisation_is_over_its_buckling_allowable() {
    let a = analysed(&jib(CHS_48, "2039 kg", r#"Static(id: "s")"#));
    let m = &a.cases[0].members[0];
    assert!(rel(-m.force_n, 2039.0 * G) < 1e-2, "{}", m.force_n);
    assert!(rel(m.euler_n.unwrap(), 35.52e3) < 5e-3, "{:?}", m.euler_n);
    assert!(rel(m.buckling_resistance_n.unwrap(), 26.64e3) < 5e-3, "{:?}", m.buckling_resistance_n);
    assert!(rel(m.allowable_n, 13.32e3) < 5e-3, "{}", m.allowable_n);
    assert!(-m.force_n / 53.27e3 < 0.4, "yield utilisation is low");
    assert_eq!(m.state, State::Over);
    assert_eq!(a.verdict(), Verdict::NotWithin);
    assert!(a.cases[0].warnings.iter().any(|w| w.contains("over its buckling allowable")), "{:?}", a.cases[0].warnings);
    // the tie in tension keeps its tension allowable: 2000 kN x 1.0 / 5
    let tie = &a.cases[0].members[1];
    assert!(rel(tie.allowable_n, 400e3) < 1e-12);
    assert_eq!(tie.euler_n, None);
}

// Hot-finished tube, curve a (EN 1993-1-1 Table 6.2): chi = 0.2896 by hand
// (Phi = 2.161), N_b = 30.86 kN; K = 0.7 shortens the buckling length:
// N_cr = 35.52 / 0.49 = 72.49 kN (closed form, Timoshenko & Gere).
#[test]
fn curve_and_effective_length_factor_from_the_file() {
    let a = analysed(&jib(&format!("{CHS_48}, buckling_curve: \"a\""), "500 kg", r#"Static(id: "s")"#));
    let m = &a.cases[0].members[0];
    assert!(rel(m.buckling_resistance_n.unwrap(), 0.2896 * 453.4e-6 * 235e6) < 5e-3);
    let a = analysed(&jib(&format!("{CHS_48}, effective_length_factor: 0.7"), "500 kg", r#"Static(id: "s")"#));
    let m = &a.cases[0].members[0];
    assert!(rel(m.euler_n.unwrap(), 35.52e3 / 0.49) < 5e-3);
    assert_eq!(m.state, State::Ok);
}

// A strut without a section cannot be checked in compression: unchecked with
// the reason, the verdict unchecked (exit 1 from `check`, see cli_check.rs).
// Solid round given instead: 30 mm S235, A = 706.9 mm^2, I = 39 761 mm^4,
// N_cr = pi^2 x 210 000 x 39 761 / 2600^2 = 12.19 kN (closed form).
#[test]
fn strut_without_a_section_is_unchecked() {
    let a = analysed(&jib(
        r#"area: "453 mm^2", material: "steel", rating: Yield("235 MPa")"#,
        "200 kg",
        r#"Static(id: "s")"#,
    ));
    let m = &a.cases[0].members[0];
    assert_eq!(m.state, State::Unchecked);
    let reason = m.reason.as_deref().unwrap();
    assert!(reason.contains("rod strut in compression") && reason.contains("section unknown"), "{reason}");
    assert_eq!(a.verdict(), Verdict::Unchecked);
    assert_eq!(m.euler_n, None);
    // its warning, of the kind member_unchecked, carries the reason
    let w = a.cases[0]
        .warning_items
        .iter()
        .find(|w| w.kind == tautspan_core::analysis::WarningKind::MemberUnchecked)
        .expect("a member_unchecked warning");
    assert!(w.message.contains("UNCHECKED") && w.message.contains(reason), "{}", w.message);

    let a = analysed(&jib(
        r#"section: SolidRound(diameter: "30 mm"), material: "steel", rating: Yield("235 MPa")"#,
        "200 kg",
        r#"Static(id: "s")"#,
    ));
    assert!(rel(a.cases[0].members[0].euler_n.unwrap(), 12.19e3) < 5e-3);
    assert_eq!(a.verdict(), Verdict::Within);

    // no curve for titanium; a working load limit is not a yield stress
    for strut in [
        r#"section: Tube(outer: "48.3 mm", wall: "3.2 mm"), material: "titanium", rating: Yield("275 MPa")"#,
        r#"section: Tube(outer: "48.3 mm", wall: "3.2 mm"), material: "steel", rating: WorkingLoadLimit("20 kN")"#,
    ] {
        let a = analysed(&jib(strut, "200 kg", r#"Static(id: "s")"#));
        assert_eq!(a.cases[0].members[0].state, State::Unchecked, "{strut}");
        assert_eq!(a.verdict(), Verdict::Unchecked);
    }
}

// A rod in tension needs no section: the jib turned over (strut above, tie
// below would compress the rope), so hang the mass from a rod instead.
#[test]
fn rod_in_tension_needs_no_section() {
    let text = r#"Scenario(format: 1, title: "hanger",
        nodes: [ Node(id: "A", at: ("0 m", "3 m"), support: Anchor), Node(id: "M", at: ("0 m", "0 m")) ],
        members: [ Member(id: "hanger", ends: ("A", "M"), kind: Rod, area: "100 mm^2", material: "steel") ],
        masses: [ Mass(id: "load", at: "M", mass: "100 kg") ],
        cases: [ Static(id: "s") ])"#;
    let a = analysed(text);
    assert_eq!(a.cases[0].members[0].state, State::Ok);
    assert_eq!(a.verdict(), Verdict::Within);
}

// The limit search respects the buckling allowable, over the whole arc. The
// mass swings at the tip T; by statics at T (tie at 45 deg, strut level) a
// line pull T(theta) = W (3 cos theta - 2 cos theta0) at theta compresses the
// strut by C = T(theta) (cos theta - sin theta) (rigid-line swing, Meriam &
// Kraige; the peak is on the side that pushes the tip back, off the lowest
// point). The release limit is the theta0 whose largest C over the arc is the
// compression allowable 13.32 kN; found here by bisection on a 0.01 deg grid.
// The jib is near linear: 1 % on the angle. The yield allowable would give
// no limit below 90 deg.
#[test]
fn release_limit_respects_the_buckling_allowable() {
    let a = analysed(&jib(CHS_48, "500 kg", r#"Static(id: "s"), Swing(id: "w", mass: "load", release: "10 deg")"#));
    let w = &a.cases.iter().find(|c| c.id == "w").unwrap();
    let r = w.limits.release_deg.expect("limit");
    let weight = 500.0 * G;
    let peak = |theta0: f64| {
        (0..=(2.0 * theta0 * 100.0) as usize)
            .map(|i| (-theta0 + i as f64 / 100.0).to_radians())
            .map(|t| weight * (3.0 * t.cos() - 2.0 * theta0.to_radians().cos()) * (t.cos() - t.sin()))
            .fold(0.0, f64::max)
    };
    let (mut lo, mut hi) = (0.0_f64, 90.0_f64);
    for _ in 0..50 {
        let mid = 0.5 * (lo + hi);
        if peak(mid) > 13.32e3 { hi = mid } else { lo = mid }
    }
    assert!(rel(r, lo) < 1e-2, "{r} vs {lo}");
    // the lowest-point check alone would have allowed far more
    let lowest_only = ((3.0 - 13.32e3 / weight) / 2.0).acos().to_degrees();
    assert!(lowest_only > r + 5.0, "{lowest_only} vs {r}");
}

/// A file that must be refused, with the field named and the message.
fn refused(text: &str, field: &str, needle: &str) {
    let errs = load_scenario(text).expect_err("must be refused");
    assert!(
        errs.0.iter().any(|e| e.field.as_deref() == Some(field) && e.message.contains(needle) && e.location.is_some()),
        "{field} / {needle}: {errs:?}"
    );
}

#[test]
fn bad_sections_and_defaults_are_located_errors() {
    let rope_line = |m: &str| {
        format!(
            r#"Scenario(format: 1, title: "line",
        nodes: [ Node(id: "A", at: ("0 m", "5 m"), support: Anchor), Node(id: "M", at: ("0 m", "1 m")) ],
        members: [ Member(id: "line", ends: ("A", "M"), {m}) ],
        masses: [ Mass(id: "load", at: "M", mass: "100 kg") ],
        cases: [ Static(id: "s") ])"#
        )
    };
    let wire = r#"kind: WireRope, area: "100 mm^2", modulus: "100 GPa", rating: BreakingStrength("100 kN")"#;
    let table: Vec<(String, &str, &str)> = vec![
        (
            jib(r#"section: Tube(outer: "40 mm", wall: "20 mm"), material: "steel""#, "10 kg", r#"Static(id: "s")"#),
            "members[0].section.wall",
            "half the outside diameter",
        ),
        (
            jib(
                r#"section: Tube(outer: "48.3 mm", wall: "3.2 mm"), area: "500 mm^2", material: "steel""#,
                "10 kg",
                r#"Static(id: "s")"#,
            ),
            "members[0].area",
            "disagrees",
        ),
        (
            jib(
                r#"section: SolidRound(diameter: "30 mm"), diameter: "30 mm", material: "steel""#,
                "10 kg",
                r#"Static(id: "s")"#,
            ),
            "members[0].diameter",
            "not both",
        ),
        (
            jib(&format!("{CHS_48}, buckling_curve: \"e\""), "10 kg", r#"Static(id: "s")"#),
            "members[0].buckling_curve",
            "a0, a, b, c, d",
        ),
        (
            jib(&format!("{CHS_48}, effective_length_factor: 0.1"), "10 kg", r#"Static(id: "s")"#),
            "members[0].effective_length_factor",
            "between 0.5",
        ),
        (rope_line(&format!("{wire}, section: SolidRound(diameter: \"30 mm\")")), "members[0].section", "tension only"),
        (
            rope_line(&format!("{wire}, termination: HandSplice, termination_efficiency: 0.9")),
            "members[0].termination",
            "not both",
        ),
        (rope_line(r#"kind: Chain, diameter: "9 mm", grade: "80""#), "members[0].diameter", "EN 818-2"),
        (rope_line(r#"kind: Chain, diameter: "10 mm", grade: "100""#), "members[0].rating", "grade 100"),
        (
            rope_line(r#"kind: Chain, diameter: "10 mm", grade: "80", design_factor: 5.0"#),
            "members[0].design_factor",
            "EN 818-2",
        ),
        (rope_line(&format!("{wire}, sling: Roundsling")), "members[0].sling", "EN 1492"),
    ];
    for (text, field, needle) in &table {
        refused(text, field, needle);
    }
    // an area that agrees with the section to 0.5 % is accepted (catalogue rounding)
    let ok = jib(
        r#"section: Tube(outer: "48.3 mm", wall: "3.2 mm"), area: "4.53 cm^2", material: "steel""#,
        "10 kg",
        r#"Static(id: "s")"#,
    );
    assert!(load_scenario(&ok).is_ok());
}

/// One line of `member` holding 100 kg, at `duty`.
fn line(member: &str, duty: &str) -> Analysis {
    analysed(&format!(
        r#"Scenario(format: 1, title: "line", {duty}
        nodes: [ Node(id: "A", at: ("0 m", "5 m"), support: Anchor), Node(id: "M", at: ("0 m", "1 m")) ],
        members: [ Member(id: "line", ends: ("A", "M"), {member}) ],
        masses: [ Mass(id: "load", at: "M", mass: "100 kg") ],
        cases: [ Static(id: "s") ])"#
    ))
}

// Each default with its source, by hand:
// - grade 80 chain 8 mm: EN 818-2 WLL 2.0 t = 19.61 kN (not MBF/4 = 20.1 kN);
//   13 mm: 5.3 t = 51.98 kN.
// - wire rope MBS 100 kN, termination not stated: x 0.80 (lowest common,
//   EN 13414-1 / practice, from memory) / 5 (ASME B30.9) = 16 kN; ferrule
//   secured 0.90: 18 kN.
// - polyester roundsling MBS 70 kN: / 7 (EN 1492-2) = 10 kN; the same as a
//   plain fibre rope: / 5 (ASME B30.9, from memory) = 14 kN.
// - over people: wire rope 100 x 0.9 / 10 = 9 kN; chain 8 mm WLL / 2 = 9.807 kN
//   (twice the normal factor, practice); lifting persons roundsling 70 / 14 = 5 kN
//   (2006/42/EC Annex I, from memory).
// Exact arithmetic, 1e-9.
#[test]
fn member_defaults_with_their_sources() {
    let fibre = r#"kind: FibreRope, diameter: "16 mm", material: "polyester", rating: BreakingStrength("70 kN")"#;
    let table: Vec<(String, &str, f64, &str)> = vec![
        (r#"kind: Chain, diameter: "8 mm", grade: "80""#.into(), "", 2000.0 * G, "EN 818-2"),
        (r#"kind: Chain, diameter: "13 mm", grade: "80""#.into(), "", 5300.0 * G, "EN 818-2"),
        (r#"kind: WireRope, area: "100 mm^2", modulus: "100 GPa", rating: BreakingStrength("100 kN")"#.into(), "", 16e3, "not stated"),
        (r#"kind: WireRope, area: "100 mm^2", modulus: "100 GPa", rating: BreakingStrength("100 kN"), termination: FerruleSecured"#.into(), "", 18e3, "ferrule"),
        (format!("{fibre}, sling: Roundsling"), "", 10e3, "EN 1492-2"),
        (fibre.to_string(), "", 14e3, "B30.9"),
        (r#"kind: WireRope, area: "100 mm^2", modulus: "100 GPa", rating: BreakingStrength("100 kN"), termination: FerruleSecured"#.into(), "duty: OverPeople,", 9e3, "over people"),
        (r#"kind: Chain, diameter: "8 mm", grade: "80""#.into(), "duty: OverPeople,", 1000.0 * G, "over people"),
        (format!("{fibre}, sling: Roundsling"), "duty: LiftingPersons,", 5e3, "2006/42/EC"),
    ];
    for (member, duty, allowable, source) in &table {
        let a = line(member, duty);
        let l = load_scenario(&format!(
            r#"Scenario(format: 1, title: "line", {duty}
            nodes: [ Node(id: "A", at: ("0 m", "5 m"), support: Anchor), Node(id: "M", at: ("0 m", "1 m")) ],
            members: [ Member(id: "line", ends: ("A", "M"), {member}) ],
            masses: [ Mass(id: "load", at: "M", mass: "100 kg") ], cases: [ Static(id: "s") ])"#
        ))
        .unwrap();
        let got = a.cases[0].members[0].allowable_n;
        assert!(rel(got, *allowable) < 1e-9, "{member} {duty}: {got} vs {allowable}");
        let words = tautspan_core::analysis::member_allowable(&l.scenario.members[0]).explanation;
        assert!(words.contains(source), "{member} {duty}: {words}");
    }
}

// A factor set in the file below the duty's default warns, naming both.
#[test]
fn design_factor_below_the_duty_default_warns() {
    let a = line(
        r#"kind: WireRope, area: "100 mm^2", modulus: "100 GPa", rating: BreakingStrength("100 kN"), termination: PouredSocket, design_factor: 6.0"#,
        "duty: OverPeople,",
    );
    assert!(
        a.warnings.iter().any(|w| w.message.contains("design factor 6 is below") && w.message.contains("over people")),
        "{:?}",
        a.warnings
    );
    assert!(a.assumptions.iter().any(|s| s.contains("Duty: over people")));
}
