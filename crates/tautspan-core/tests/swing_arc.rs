//! The swing checked over its whole arc, against a hand statics solution of
//! a two-leg bridle: rigid lines, the legs solved at the ring for every θ
//! with the line tension `T(θ) = W (3 cos θ − 2 cos θ0)` along the line
//! (rigid pendulum, energy and centripetal balance in normal–tangential
//! coordinates; Meriam & Kraige, *Engineering Mechanics: Dynamics*).

#![allow(clippy::expect_used, clippy::unwrap_used, reason = "test helpers fail loudly on broken fixtures")]

use tautspan_core::analysis::{Analysis, CaseResult, analyse};
use tautspan_core::model::load_scenario;

const G: f64 = 9.80665;

fn rel(a: f64, b: f64) -> f64 {
    ((a - b) / b).abs()
}

fn analysed(text: &str) -> Analysis {
    let l = load_scenario(text).unwrap_or_else(|e| panic!("{e}"));
    analyse(&l.scenario)
}

fn case<'a>(a: &'a Analysis, id: &str) -> &'a CaseResult {
    a.cases.iter().find(|c| c.id == id).unwrap_or_else(|| panic!("case {id}"))
}

/// Two legs from anchors at (∓s, 4 m) to a ring at (0, 4 − s) (each leg 45°
/// from the vertical), a 2 m line from the ring to the mass. Very stiff
/// members (EA 1e11 N) stand for rigid lines: stretch changes the geometry
/// by about 1e-7, far below the tolerances. `plane` "xy" lays the bridle in
/// the elevation; "zy" turns the whole rig 90° about y into the side view.
fn bridle(plane: &str, release: &str, azimuth: &str) -> String {
    let s = 1.5;
    let at = |h: f64, y: f64| match plane {
        "xy" => format!("(\"{h} m\", \"{y} m\", \"0 m\")"),
        _ => format!("(\"0 m\", \"{y} m\", \"{h} m\")"),
    };
    let stiff = r#"kind: WireRope, area: "1000 mm^2", modulus: "100000 GPa", rating: BreakingStrength("1000 kN")"#;
    format!(
        r#"Scenario(format: 1, title: "bridle",
        nodes: [ Node(id: "A1", at: {a1}, support: Anchor), Node(id: "A2", at: {a2}, support: Anchor),
                 Node(id: "R", at: {r}), Node(id: "M", at: {m}) ],
        members: [ Member(id: "leg-1", ends: ("A1", "R"), {stiff}),
                   Member(id: "leg-2", ends: ("A2", "R"), {stiff}),
                   Member(id: "line", ends: ("R", "M"), {stiff}) ],
        masses: [ Mass(id: "load", at: "M", mass: "500 kg") ],
        cases: [ Static(id: "s"), Swing(id: "w", mass: "load", release: "{release}", pivot: "R", azimuth: "{azimuth}") ])"#,
        a1 = at(-s, 4.0),
        a2 = at(s, 4.0),
        r = at(0.0, 4.0 - s),
        m = at(0.0, 4.0 - s - 2.0),
    )
}

/// Hand statics at the ring for one θ: legs at ±α from the vertical, the
/// line pulling the ring with T(θ) at θ; T1 = T sin(α + θ) / sin 2α for the
/// leg on the −θ side, T2 = T sin(α − θ) / sin 2α (balance of the ring's x
/// and y forces).
fn legs_by_hand(theta: f64, theta0: f64, alpha: f64) -> (f64, f64) {
    let t = 500.0 * G * (3.0 * theta.cos() - 2.0 * theta0.cos());
    let d = (2.0 * alpha).sin();
    (t * (alpha + theta).sin() / d, t * (alpha - theta).sin() / d)
}

/// The largest leg-1 tension by hand over the arc, on a 0.001° grid, and its angle.
fn hand_peak(theta0_deg: f64) -> (f64, f64) {
    let (alpha, theta0) = (45f64.to_radians(), theta0_deg.to_radians());
    let mut best = (0.0, 0.0);
    let n = (2.0 * theta0_deg * 1000.0) as usize;
    for i in 0..=n {
        let th = -theta0 + 2.0 * theta0 * i as f64 / n as f64;
        let (t1, _) = legs_by_hand(th, theta0, alpha);
        if t1 > best.0 {
            best = (t1, th.to_degrees());
        }
    }
    best
}

// A two-leg bridle swung in its own plane: one leg peaks about 15° off the
// lowest point, ~14 % above its lowest-point value. The tool's peak agrees
// with the hand solution to 0.1 % (what the sweep promises; the stiff legs'
// stretch adds ~1e-7) and is clearly above the lowest-point value.
#[test]
fn bridle_leg_peaks_off_the_lowest_point() {
    for release in [20.0, 40.0] {
        let a = analysed(&bridle("xy", &format!("{release} deg"), "0 deg"));
        let w = case(&a, "w");
        let (peak, at) = hand_peak(release);
        let (low, _) = legs_by_hand(0.0, release.to_radians(), 45f64.to_radians());
        // which leg is on the −θ side depends on the sign convention; both legs peak at ±at
        for id in ["leg-1", "leg-2"] {
            let m = w.members.iter().find(|m| m.id == id).expect("leg");
            assert!(rel(m.force_n, peak) < 1e-3, "{release} {id}: {} vs hand {peak}", m.force_n);
            let p = m.peak_at_deg.expect("peak angle");
            // the curve is flat at its peak: 0.05 % of force spans about ±1.5°
            assert!((p.abs() - at.abs()).abs() < 1.5, "{release} {id}: at {p} vs hand {at}");
        }
        if release == 40.0 {
            assert!(peak / low > 1.13 && peak / low < 1.15, "{}", peak / low);
            let m = &w.members[0];
            assert!(m.force_n > 1.13 * low, "the sweep found {} against {low} at the lowest point", m.force_n);
        }
        // the line itself peaks at the lowest point: W (3 − 2 cos θ0)
        let line = w.members.iter().find(|m| m.id == "line").expect("line");
        assert!(rel(line.force_n, 500.0 * G * (3.0 - 2.0 * release.to_radians().cos())) < 1e-6);
        assert!(line.peak_at_deg.expect("angle").abs() < 1e-9);
        let arc = w.arc.as_ref().expect("arc summary");
        assert!(arc.angles_deg.first().is_some_and(|t| (t + release).abs() < 1e-9));
        assert!(arc.angles_deg.last().is_some_and(|t| (t - release).abs() < 1e-9));
    }
}

// The same rig turned into the z–y plane and swung at azimuth 90° is the
// same problem: the same peak to 1e-6 (only roundoff and solver tolerance
// differ). Swung across its own plane instead (azimuth 90° on the x–y
// bridle) the ring turns with the load and the legs share equally:
// T1 = T2 = T(θ) / (2 cos α), largest at the lowest point.
#[test]
fn azimuth_turns_the_swing_plane() {
    let a = analysed(&bridle("xy", "40 deg", "0 deg"));
    let b = analysed(&bridle("zy", "40 deg", "90 deg"));
    for (ma, mb) in case(&a, "w").members.iter().zip(&case(&b, "w").members) {
        assert!(rel(mb.force_n, ma.force_n) < 1e-6, "{}: {} vs {}", ma.id, ma.force_n, mb.force_n);
    }
    let c = analysed(&bridle("xy", "40 deg", "90 deg"));
    let lowest = 500.0 * G * (3.0 - 2.0 * 40f64.to_radians().cos()) / (2.0 * 45f64.to_radians().cos());
    for m in &case(&c, "w").members[..2] {
        assert!(rel(m.force_n, lowest) < 1e-6, "{}: {} vs {lowest}", m.id, m.force_n);
    }
}

// The release-angle limit comes from the same sweep: at the reported limit
// the leg's arc peak equals its allowable. Hand: find θ0 where the hand
// peak of leg 1 equals 1000 kN / 5 = 200 kN... scaled: with a 500 kg mass the
// legs never reach 200 kN, so the allowable is set by a WLL to make it bind.
#[test]
fn release_limit_uses_the_arc() {
    let text = bridle("xy", "20 deg", "0 deg").replace(
        r#"Member(id: "leg-1", ends: ("A1", "R"), kind: WireRope, area: "1000 mm^2", modulus: "100000 GPa", rating: BreakingStrength("1000 kN")"#,
        r#"Member(id: "leg-1", ends: ("A1", "R"), kind: WireRope, area: "1000 mm^2", modulus: "100000 GPa", rating: WorkingLoadLimit("6 kN")"#,
    );
    let a = analysed(&text);
    let limit = case(&a, "w").limits.release_deg.expect("limit");
    // by hand: bisect θ0 on the hand peak of leg 1 against 6 kN
    let (mut lo, mut hi) = (0.0_f64, 90.0_f64);
    for _ in 0..60 {
        let mid = 0.5 * (lo + hi);
        if hand_peak(mid).0 > 6000.0 { hi = mid } else { lo = mid }
    }
    // the hand grid is 0.001°, the tool's peak within 0.05 %: 0.05° on the limit
    assert!((limit - lo).abs() < 0.05, "tool {limit} vs hand {lo}");
    // a lowest-point-only check would allow more: the leg's lowest-point
    // value reaches 6 kN only at a larger release
    let lowest_only = {
        let (mut lo, mut hi) = (0.0_f64, 90.0_f64);
        for _ in 0..60 {
            let mid = 0.5 * (lo + hi);
            if legs_by_hand(0.0, mid.to_radians(), 45f64.to_radians()).0 > 6000.0 { hi = mid } else { lo = mid }
        }
        lo
    };
    assert!(lowest_only > limit + 1.0, "{lowest_only} vs {limit}");
}
