//! Dimension lines on the elevation: the rig's overall width (along x) and
//! height (along y) as drawn, each a line with arrowheads, extension lines
//! to the extreme nodes and its value in the report's length unit.

use super::geometry::View;
use super::unit_system::UnitSystem;

/// Overall extent of `points_m` (x, y in metres): (min x, max x, min y, max y);
/// `None` without a finite point.
pub fn extent(points_m: &[[f64; 2]]) -> Option<(f64, f64, f64, f64)> {
    let finite: Vec<&[f64; 2]> = points_m.iter().filter(|p| p[0].is_finite() && p[1].is_finite()).collect();
    if finite.is_empty() {
        return None;
    }
    let f = |k: usize, min: bool| {
        finite
            .iter()
            .map(|p| p[k])
            .fold(if min { f64::INFINITY } else { f64::NEG_INFINITY }, |a, b| if min { a.min(b) } else { a.max(b) })
    };
    Some((f(0, true), f(0, false), f(1, true), f(1, false)))
}

/// Gap between the drawing's content and a dimension line, drawing units.
const OFFSET: f64 = 26.0;

/// Both dimension lines of the nodes at `points_m`: the width above the
/// highest node, the height left of the leftmost one. A zero extent (all
/// nodes on one vertical or one level) draws no line for it.
pub fn dimensions(points_m: &[[f64; 2]], view: &View, units: UnitSystem) -> String {
    let Some((x0, x1, y0, y1)) = extent(points_m) else { return String::new() };
    let mut out = format!("<g class=\"dimensions\"><defs>{ARROW_DEF}</defs>");
    let [left, top] = view.map([x0, y1]);
    let [right, bottom] = view.map([x1, y0]);
    if x1 - x0 > 0.0 {
        let y = top - OFFSET;
        out.push_str(&format!(
            "<g class=\"dimension\" data-dimension=\"width\" data-value-m=\"{w}\">\
             <path d=\"M{left:.2} {top:.2} V{:.2} M{right:.2} {top:.2} V{:.2}\" class=\"dim-ext\"/>\
             <path d=\"M{left:.2} {y:.2} H{right:.2}\" class=\"dim-line\" marker-start=\"url(#dim-arrow)\" marker-end=\"url(#dim-arrow)\"/>\
             <text x=\"{:.2}\" y=\"{:.2}\" class=\"lbl dim\" text-anchor=\"middle\">{}</text></g>",
            y - 4.0,
            y - 4.0,
            (left + right) / 2.0,
            y - 5.0,
            units.length(x1 - x0),
            w = x1 - x0,
        ));
    }
    if y1 - y0 > 0.0 {
        let x = left - OFFSET;
        let mid = (top + bottom) / 2.0;
        out.push_str(&format!(
            "<g class=\"dimension\" data-dimension=\"height\" data-value-m=\"{h}\">\
             <path d=\"M{left:.2} {top:.2} H{:.2} M{left:.2} {bottom:.2} H{:.2}\" class=\"dim-ext\"/>\
             <path d=\"M{x:.2} {top:.2} V{bottom:.2}\" class=\"dim-line\" marker-start=\"url(#dim-arrow)\" marker-end=\"url(#dim-arrow)\"/>\
             <text x=\"{:.2}\" y=\"{mid:.2}\" class=\"lbl dim\" text-anchor=\"middle\" transform=\"rotate(-90 {:.2} {mid:.2})\">{}</text></g>",
            x - 4.0,
            x - 4.0,
            x - 5.0,
            x - 5.0,
            units.length(y1 - y0),
            h = y1 - y0,
        ));
    }
    out.push_str("</g>");
    out
}

/// The arrowhead both dimension lines use.
const ARROW_DEF: &str = "<marker id=\"dim-arrow\" viewBox=\"0 0 10 10\" refX=\"5\" refY=\"5\" markerWidth=\"7\" markerHeight=\"7\" orient=\"auto-start-reverse\">\
<path d=\"M0 1 L10 5 L0 9 z\" fill=\"#1b1f24\"/></marker>";

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn extent_skips_non_finite_points() {
        let e = extent(&[[0.0, 1.0], [f64::NAN, 9.0], [4.0, -2.0]]);
        assert_eq!(e, Some((0.0, 4.0, -2.0, 1.0)));
        assert_eq!(extent(&[]), None);
    }

    /// 4 m wide, 5 m high: the values read "4 m" and "5 m" in SI and
    /// 13.12 ft, 16.40 ft in US units (4 / 0.3048 = 13.123…, 5 / 0.3048 =
    /// 16.404…; 1 ft = 0.3048 m exactly, NIST SP 811 B.8).
    #[test]
    fn both_lines_carry_their_values() {
        let pts = [[0.0, 0.0], [4.0, 5.0], [2.0, 3.0]];
        let view = View::fit(&pts);
        let si = dimensions(&pts, &view, UnitSystem::Si);
        assert!(si.contains("data-dimension=\"width\"") && si.contains(">4\u{a0}m</text>"), "{si}");
        assert!(si.contains("data-dimension=\"height\"") && si.contains(">5\u{a0}m</text>"), "{si}");
        let us = dimensions(&pts, &view, UnitSystem::UsCustomary);
        assert!(us.contains(">13.12\u{a0}ft</text>") && us.contains(">16.4\u{a0}ft</text>"), "{us}");
        // a rig on one level has no height line
        let flat = dimensions(&[[0.0, 1.0], [3.0, 1.0]], &view, UnitSystem::Si);
        assert!(flat.contains("width") && !flat.contains("height"));
    }
}
