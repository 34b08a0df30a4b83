//! The printable report: well-formed, self-contained (nothing fetched),
//! complete (every member, floor, mass and node named), carrying the caution
//! at top and bottom, and escaping user text.

#[path = "report_support.rs"]
mod report_support;

use report_support::{BRIDLE, SINGLE, assert_well_formed, load};
use tautspan_core::CAUTION;
use tautspan_core::analysis::{Analysis, analyse};
use tautspan_core::report::{UnitSystem, escape, html, html_with_units};

fn report(text: &str) -> String {
    let scenario = load(text);
    let analysis = analyse(&scenario);
    html(&scenario, &analysis, "2025-03-14")
}

#[test]
fn is_well_formed_html5() {
    for text in [SINGLE, BRIDLE] {
        let doc = report(text);
        assert!(doc.starts_with("<!DOCTYPE html>"));
        assert_well_formed(&doc);
    }
}

#[test]
fn names_every_member_floor_mass_and_node() {
    let scenario = load(BRIDLE);
    let doc = html(&scenario, &analyse(&scenario), "2025-03-14");
    let ids = scenario
        .members
        .iter()
        .map(|m| &m.id)
        .chain(scenario.floors.iter().map(|f| &f.id))
        .chain(scenario.masses.iter().map(|m| &m.id))
        .chain(scenario.nodes.iter().map(|n| &n.id));
    for id in ids {
        // In the drawing (bold id label) and in the tables.
        assert!(doc.matches(&format!(">{}<", escape(id))).count() >= 2, "{id} missing");
    }
    assert!(doc.contains("class=\"floor\""), "the floor is drawn");
    assert!(doc.contains("class=\"anchor\""), "the anchors are drawn");
    assert!(doc.contains("class=\"mass\""), "the mass is drawn");
}

#[test]
fn carries_the_caution_top_and_bottom() {
    let doc = report(SINGLE);
    let escaped = escape(CAUTION);
    let first = doc.find(&escaped).expect("caution present");
    let last = doc.rfind(&escaped).expect("caution present");
    assert!(first < doc.find("id=\"layout\"").unwrap(), "caution before the drawing");
    assert!(last > doc.find("id=\"assumptions\"").unwrap(), "caution after the assumptions");
}

#[test]
fn fetches_nothing_and_runs_nothing() {
    for text in [SINGLE, BRIDLE] {
        let doc = report(text).to_ascii_lowercase();
        for bad in
            ["http://", "https://", "//cdn", "<script", "<link", "<img", "<iframe", "@import", "src=", "@font-face"]
        {
            assert!(!doc.contains(bad), "report contains {bad}");
        }
        // url() only to fragments inside the document (patterns, gradients).
        for (i, _) in doc.match_indices("url(") {
            assert!(doc[i + 4..].starts_with('#'), "external url( at {i}");
        }
        for (i, _) in doc.match_indices("href=") {
            assert!(doc[i + 5..].starts_with("\"#"), "external href at {i}");
        }
    }
}

#[test]
fn escapes_user_text() {
    let text = SINGLE
        .replace("Single sling", "<script>alert('t')</script> & \\\"x\\\"")
        .replace("Notes for a colleague.", "a < b > c & <b>bold</b>")
        .replace("\"sling\"", "\"s<i>ling\"");
    let doc = report(&text);
    assert!(!doc.to_ascii_lowercase().contains("<script"), "title is escaped");
    assert!(doc.contains("&lt;script&gt;alert(&#39;t&#39;)&lt;/script&gt; &amp; &quot;x&quot;"));
    assert!(doc.contains("a &lt; b &gt; c &amp; &lt;b&gt;bold&lt;/b&gt;"));
    assert!(doc.contains("s&lt;i&gt;ling") && !doc.contains("s<i>ling"));
    assert_well_formed(&doc);
}

#[test]
fn has_every_section() {
    let doc = report(BRIDLE);
    for id in ["layout", "comparison", "warnings", "cases", "inputs", "assumptions", "closing"] {
        assert!(doc.contains(&format!("<section id=\"{id}\"")), "section {id}");
    }
    for words in [
        "minimum breaking strength",
        "Design factor",
        "Governing case",
        "Largest release angle",
        "Largest drop height",
        "Gravity g = 9.80665\u{a0}m/s²",
        "Utilisation",
    ] {
        assert!(doc.contains(words), "{words}");
    }
    assert!(
        doc.contains("<svg class=\"layout\"")
            && doc.contains("class=\"scale-bar\"")
            && doc.contains("<svg class=\"legend\"")
    );
}

#[test]
fn prints_the_core_numbers() {
    let scenario = load(SINGLE);
    let analysis = analyse(&scenario);
    let doc = html(&scenario, &analysis, "2025-03-14");
    let fmt = |n: f64| tautspan_core::units::format_number(n / 1000.0, 3);
    for row in &analysis.comparison {
        assert!(doc.contains(&format!("{}\u{a0}kN", fmt(row.allowable_n))), "allowable of {}", row.id);
        for f in row.force_n.iter().flatten() {
            assert!(doc.contains(&format!("{}\u{a0}kN", fmt(*f))), "force {f} of {}", row.id);
        }
    }
    for case in &analysis.cases {
        if let Some(d) = &case.dynamic {
            assert!(doc.contains(&escape(&d.formula)), "formula of {}", case.id);
        }
    }
    // every assumption but gravity, which the report states in its own units
    for a in analysis.assumptions.iter().filter(|a| !a.starts_with("Gravity ")) {
        assert!(doc.contains(&escape(a)), "assumption {a}");
    }
    assert_eq!(doc.matches("Gravity").count(), 1, "gravity stated once");
}

#[test]
fn us_customary_units() {
    let scenario = load(BRIDLE);
    let doc = html_with_units(&scenario, &analyse(&scenario), "2025-03-14", UnitSystem::UsCustomary);
    assert!(doc.contains("\u{a0}lbf") && doc.contains("\u{a0}ft") && doc.contains("\u{a0}in²"));
    assert!(!doc.contains("\u{a0}kN"), "no SI forces in a US report");
    assert_well_formed(&doc);
}

#[test]
fn marks_over_and_slack_members_in_the_drawing() {
    // The swing case takes the sling past its allowable (tiny working load
    // limit); the thick line and the OVER word must appear.
    let text = SINGLE.replace("BreakingStrength(\"90.7 kN\")", "WorkingLoadLimit(\"2 kN\")");
    let doc = report(&text);
    assert!(doc.contains("OVER"), "state word");
    assert!(doc.contains("stroke-width=\"9.0\""), "thick line for over");
    assert!(doc.contains("verdict fail"));
}

#[test]
fn dashes_a_member_slack_in_the_static_case() {
    let text = SINGLE
        .replace(
            "Node(id: \"J1\", at: (\"0 m\", \"2 m\")),",
            "Node(id: \"J1\", at: (\"0 m\", \"2 m\")), Node(id: \"T1\", at: (\"2 m\", \"1 m\"), support: Anchor),",
        )
        .replace(
            "rating: BreakingStrength(\"90.7 kN\")),",
            "rating: BreakingStrength(\"90.7 kN\")),
             Member(id: \"tag\", ends: (\"J1\", \"T1\"), kind: FibreRope, diameter: \"10 mm\",
                    material: \"polyester\", rating: BreakingStrength(\"20 kN\"), slack: \"0.3 m\", may_go_slack: true),",
        );
    let scenario = load(&text);
    let analysis = analyse(&scenario);
    let hanging = &analysis.cases[0];
    assert_eq!(
        hanging.members.iter().find(|m| m.id == "tag").map(|m| m.state),
        Some(tautspan_core::analysis::State::Slack)
    );
    let doc = html(&scenario, &analysis, "2025-03-14");
    let tag = doc.find("<title>tag:").expect("tag drawn");
    assert!(doc[tag..tag + 600].contains("stroke-dasharray"), "slack member dashed");
    let sling = doc.find("<title>sling:").expect("sling drawn");
    assert!(!doc[sling..sling + 400].contains("stroke-dasharray"), "taut member solid");
    assert!(doc.contains(">slack<"), "state word");
}

#[test]
fn renders_without_any_results() {
    // An analysis with nothing in it (e.g. the GUI exporting before a solve)
    // still gives a complete, well-formed report from the drawn geometry.
    let scenario = load(BRIDLE);
    let empty = Analysis {
        title: scenario.title.clone(),
        caution: CAUTION.to_string(),
        cases: vec![],
        comparison: vec![],
        warnings: vec![],
        assumptions: vec![],
        scope: Default::default(),
    };
    let doc = html(&scenario, &empty, "");
    assert_well_formed(&doc);
    assert!(doc.contains("as drawn: no static case was solved"));
    assert!(doc.contains(&escape(CAUTION)));
    for m in &scenario.members {
        assert!(doc.contains(&escape(&m.id)));
    }
}

#[test]
fn same_input_same_report() {
    assert_eq!(report(BRIDLE), report(BRIDLE));
}

// The verdict's words and the scope (what is and is not checked) are in the
// report; a swing case says it was checked over the whole arc and gives
// each member's peak angle.
#[test]
fn carries_the_scope_and_the_arc() {
    let doc = report(BRIDLE);
    assert!(doc.contains("<section id=\"scope\">") && doc.contains("Not checked (a competent person must):"));
    for line in tautspan_core::analysis::scope(&load(BRIDLE)).not_checked {
        assert!(doc.contains(&escape(&line)), "{line}");
    }
    assert!(load(BRIDLE).cases.iter().any(|c| c.kind_name() == "swing"));
    assert!(doc.contains("checked over the whole arc") && doc.contains("Peak at (arc angle)"));
}

#[test]
fn lists_rated_parts_with_rating_and_source() {
    let text = std::fs::read_to_string(concat!(env!("CARGO_MANIFEST_DIR"), "/../../scenarios/roller-two-leg-pick.ron"))
        .expect("example");
    let scenario = load(&text);
    let analysis = analyse(&scenario);
    let doc = html(&scenario, &analysis, "2025-03-14");
    assert_well_formed(&doc);
    assert!(doc.contains("<h3>Rated parts</h3>"));
    // each part by its id, its WLL and the mass-to-force source (ISO 80000-3)
    for id in [
        "leg-north/shackle",
        "hoist/hoist",
        "hoist/eye bolt",
        "beam-north/beam clamp",
        "link/master link",
        "beam-north/anchor",
    ] {
        assert!(doc.contains(&escape(id)), "{id}");
    }
    assert!(doc.contains("standard gravity 9.80665 m/s^2 (ISO 80000-3)"));
    // the per-case table and the comparison rows; the angle convention in the header
    assert!(doc.contains("case-parts") && doc.contains("rated part"));
    assert!(doc.contains("Sling angle (from horizontal)"));
    // 1 t = 9.80665 kN printed to 3 significant digits: 9.81 kN
    assert!(doc.contains("9.81\u{a0}kN"));
}

// The report shows each strut's Euler load and buckling resistance in the
// case tables, and the compression check (curve, chi, source) in the inputs:
// the mezzanine tripod's 50 x 3 mm aluminium legs, N_cr = pi^2 x 70 000 x
// 122 810 / 2850^2 = 10.45 kN by hand (Timoshenko & Gere), class B.
#[test]
fn shows_the_buckling_check_of_struts() {
    let text = std::fs::read_to_string(format!("{}/../../scenarios/mezzanine-hoist.ron", env!("CARGO_MANIFEST_DIR")))
        .expect("example");
    let scenario = load(&text);
    let analysis = analyse(&scenario);
    let doc = html(&scenario, &analysis, "2025-03-14");
    assert!(doc.contains("Euler load") && doc.contains("Buckling resistance"));
    let leg = &analysis.cases[0].members[0];
    let euler = leg.euler_n.expect("euler");
    assert!(((euler - 10.45e3) / 10.45e3).abs() < 5e-3, "{euler}");
    let fmt = |n: f64| tautspan_core::units::format_number(n / 1000.0, 3);
    assert!(doc.contains(&format!("{}\u{a0}kN", fmt(euler))));
    assert!(doc.contains("EN 1999-1-1 6.3.1.2, buckling class B") && doc.contains("tube 50 x 3 mm"));
    assert_well_formed(&doc);
}

/// The value of a dimension line (`width` or `height`) in one drawing's SVG.
fn dimension_m(svg: &str, which: &str) -> f64 {
    let key = format!("data-dimension=\"{which}\" data-value-m=\"");
    let at = svg.find(&key).unwrap_or_else(|| panic!("no {which} dimension")) + key.len();
    svg[at..].split('"').next().and_then(|v| v.parse().ok()).unwrap_or(f64::NAN)
}

/// A four-leg bridle spread in plan: anchors at (±1 m, ±0.5 m) in x–z, a
/// ring below the middle. The report adds the plan (seen from above) with
/// its overall extents dimensioned: 2 m along x and 1 m along z, the
/// anchors' spacing as drawn (symmetric, so the solve moves no node in
/// plan; tolerance 1e-6 m for the solver's own drift). A rig in one
/// vertical plane and on no floor gets no plan: it would be a line.
#[test]
fn adds_a_dimensioned_plan_when_the_rig_is_spread_in_z() {
    let text = r#"Scenario(format: 1, title: "Four-leg spread",
        nodes: [
            Node(id: "A1", at: ("-1 m", "3 m", "-0.5 m"), support: Anchor),
            Node(id: "A2", at: ("1 m", "3 m", "-0.5 m"), support: Anchor),
            Node(id: "A3", at: ("1 m", "3 m", "0.5 m"), support: Anchor),
            Node(id: "A4", at: ("-1 m", "3 m", "0.5 m"), support: Anchor),
            Node(id: "ring", at: ("0 m", "1 m", "0 m")),
        ],
        members: [
            Member(id: "leg-1", ends: ("A1", "ring"), kind: Chain, diameter: "8 mm", grade: "80"),
            Member(id: "leg-2", ends: ("A2", "ring"), kind: Chain, diameter: "8 mm", grade: "80"),
            Member(id: "leg-3", ends: ("A3", "ring"), kind: Chain, diameter: "8 mm", grade: "80"),
            Member(id: "leg-4", ends: ("A4", "ring"), kind: Chain, diameter: "8 mm", grade: "80"),
        ],
        masses: [ Mass(id: "crate", at: "ring", mass: "1000 kg") ],
        cases: [ Static(id: "hanging") ])"#;
    let page = report(text);
    assert_well_formed(&page);
    let start = page.find("<svg class=\"layout plan\"").unwrap_or_else(|| panic!("a plan drawing"));
    let plan = &page[start..start + page[start..].find("</svg>").unwrap_or(0)];
    assert!((dimension_m(plan, "width") - 2.0).abs() < 1e-6, "{plan}");
    assert!((dimension_m(plan, "height") - 1.0).abs() < 1e-6);
    for id in ["A1", "A2", "A3", "A4", "ring", "leg-1", "leg-4"] {
        assert!(plan.contains(&format!(">{id}</text>")), "{id} named in the plan");
    }
    assert!(page.contains("Plan (seen from above: x to the right, z down the page)"));
    // a single sling lies in x–y: no plan; a rig on a floor slab shows the
    // panel in plan (4 m × 4 m, outlined)
    assert!(!report(SINGLE).contains("layout plan"));
    let with_floor = report(BRIDLE);
    assert!(with_floor.contains("<svg class=\"layout plan\""));
    assert_well_formed(&with_floor);
}
