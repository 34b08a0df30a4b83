//! The drawing's own symbols, in drawing units: an anchor (a wedge on a
//! hatched bar, turned away from its members), a joint (an open ring), a
//! floor bearing (a small wedge on the slab) and a mass (a hung block).

use super::escape::escape;

const INK: &str = "#1b1f24";

/// An anchor at `at`, its hatched bar on the side pointing along `away`
/// (a unit vector in drawing units; (0, −1) puts the bar above).
pub fn anchor(at: [f64; 2], away: [f64; 2]) -> String {
    let angle_deg = away[0].atan2(-away[1]).to_degrees();
    let hatch: String = (0..8)
        .map(|i| {
            let x = -14.0 + 4.0 * f64::from(i);
            format!("M{x} -14 l-4 -6 ")
        })
        .collect();
    format!(
        "<g class=\"anchor\" transform=\"translate({:.2} {:.2}) rotate({angle_deg:.2})\">\
         <path d=\"M0 0 L-8 -14 L8 -14 Z\" fill=\"{INK}\"/>\
         <path d=\"M-16 -14 H16\" stroke=\"{INK}\" stroke-width=\"2\"/>\
         <path d=\"{hatch}\" stroke=\"{INK}\" stroke-width=\"1\"/></g>",
        at[0], at[1]
    )
}

/// A free joint at `at`.
pub fn joint(at: [f64; 2]) -> String {
    format!(
        "<circle class=\"joint\" cx=\"{:.2}\" cy=\"{:.2}\" r=\"4.5\" fill=\"#fff\" stroke=\"{INK}\" stroke-width=\"1.8\"/>",
        at[0], at[1]
    )
}

/// A node bearing on a floor at `at`; the wedge reaches down to the slab top
/// drawn [`BEARING_DROP`] below the node.
pub fn bearing(at: [f64; 2]) -> String {
    format!(
        "<path class=\"bearing\" d=\"M{:.2} {:.2} l-7 {BEARING_DROP} h14 Z\" fill=\"#fff\" stroke=\"{INK}\" stroke-width=\"1.6\"/>",
        at[0], at[1]
    )
}

/// How far below a bearing node the slab top is drawn, drawing units.
pub const BEARING_DROP: f64 = 10.0;

/// A mass hung below `at`, labelled (label already plain text; escaped here).
pub fn mass(at: [f64; 2], label: &str) -> String {
    let (x, y) = (at[0], at[1]);
    format!(
        "<g class=\"mass\"><path d=\"M{x:.2} {y:.2} v12\" stroke=\"{INK}\" stroke-width=\"1.5\"/>\
         <path d=\"M{:.2} {:.2} h20 l5 18 h-30 Z\" fill=\"{INK}\"/>\
         <text x=\"{:.2}\" y=\"{:.2}\" class=\"lbl mass-lbl\">{}</text></g>",
        x - 10.0,
        y + 12.0,
        x + 20.0,
        y + 26.0,
        escape(label)
    )
}
