//! The drawing's legend: the utilisation ramp with its ticks (0, the
//! near-limit threshold, 100 %), the line styles (dashed: slack; thick: over)
//! and the symbols.

use super::drawing::{LINE_WIDTH, OVER_WIDTH};
use super::ramp::{RAMP_MAX, gradient_stops};
use super::symbols::{anchor, bearing, joint, mass};
use super::unit_system::percent;

const WIDTH: f64 = 760.0;
const BAR_X: f64 = 20.0;
const BAR_W: f64 = 300.0;

/// The legend as an inline SVG; `near_limit` is the scenario's threshold.
pub fn legend(near_limit: f64) -> String {
    let mut svg = format!(
        "<svg class=\"legend\" viewBox=\"0 0 {WIDTH:.0} 110\" role=\"img\" aria-label=\"Legend\">\
         <defs><linearGradient id=\"ramp\" x1=\"0\" x2=\"1\" y1=\"0\" y2=\"0\">{}</linearGradient></defs>\
         <text x=\"{BAR_X}\" y=\"14\" class=\"lbl\">Shade: highest utilisation over all cases</text>\
         <rect x=\"{BAR_X}\" y=\"22\" width=\"{BAR_W}\" height=\"14\" fill=\"url(#ramp)\" stroke=\"#1b1f24\" stroke-width=\"0.8\"/>",
        gradient_stops()
    );
    let mut ticks =
        vec![(0.0, "0 %".to_string()), (1.0, "100 %".to_string()), (RAMP_MAX, format!("≥ {}", percent(RAMP_MAX)))];
    if near_limit > 0.05 && near_limit < 0.95 {
        ticks.push((near_limit, percent(near_limit)));
    }
    for (u, text) in ticks {
        let x = BAR_X + BAR_W * u / RAMP_MAX;
        svg.push_str(&format!(
            "<path d=\"M{x:.2} 36 v5\" stroke=\"#1b1f24\"/><text x=\"{x:.2}\" y=\"52\" class=\"lbl small\" text-anchor=\"middle\">{text}</text>"
        ));
    }
    svg.push_str(&line_samples());
    svg.push_str(&symbol_samples());
    svg.push_str("</svg>");
    svg
}

fn line_samples() -> String {
    let sample = |y: f64, width: f64, dash: &str, text: &str| {
        format!(
            "<path d=\"M360 {y} h44\" stroke=\"#1b1f24\" stroke-width=\"{:.1}\"{dash}/>\
             <path d=\"M360 {y} h44\" stroke=\"#8cc4b8\" stroke-width=\"{width:.1}\"{dash}/>\
             <text x=\"412\" y=\"{:.1}\" class=\"lbl small\">{text}</text>",
            width + 2.4,
            y + 4.0
        )
    };
    [
        sample(20.0, LINE_WIDTH, "", "member or rope"),
        sample(42.0, LINE_WIDTH, " stroke-dasharray=\"9 6\"", "slack in the static case"),
        sample(64.0, OVER_WIDTH, "", "over allowable in some case"),
    ]
    .concat()
}

fn symbol_samples() -> String {
    let label = |x: f64, y: f64, text: &str| format!("<text x=\"{x}\" y=\"{y}\" class=\"lbl small\">{text}</text>");
    [
        anchor([610.0, 30.0], [0.0, -1.0]),
        label(632.0, 26.0, "anchor"),
        joint([610.0, 52.0]),
        label(632.0, 56.0, "joint"),
        bearing([610.0, 68.0]),
        "<rect x=\"598\" y=\"78\" width=\"24\" height=\"6\" fill=\"url(#hatch)\" stroke=\"#1b1f24\" stroke-width=\"0.8\"/>".to_string(),
        label(632.0, 82.0, "bearing on a floor"),
        mass([700.0, 36.0], ""),
        label(716.0, 26.0, "mass"),
        "<circle cx=\"700\" cy=\"98\" r=\"6\" fill=\"none\" stroke=\"#1b1f24\" stroke-width=\"1.6\"/>".to_string(),
        label(716.0, 102.0, "sheave"),
    ]
    .concat()
}
