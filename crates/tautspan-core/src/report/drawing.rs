//! The layout drawing: an inline SVG elevation (x–y, y up) of the rig in the
//! static case's solved geometry, members shaded by their highest
//! utilisation (see `ramp`), dashed when slack, thicker when over, with
//! anchors, joints, floors and masses as simple symbols, member ids and a
//! scale bar.

use super::escape::escape;
use super::geometry::{Elevation, Projection, View, elevation, projected};
use super::marks::{Mark, mark};
use super::ramp::colour;
use super::scale_bar::scale_bar;
use super::symbols::{BEARING_DROP, anchor, bearing, joint, mass};
use super::unit_system::{UnitSystem, percent};
use crate::analysis::Analysis;
use crate::model::{Scenario, Support};

/// Shaded line width of a member, drawing units.
pub const LINE_WIDTH: f64 = 5.0;
/// Shaded line width of a member over its allowable in some case.
pub const OVER_WIDTH: f64 = 9.0;

/// A floor slab as drawn: x extent and top in metres, thickness in metres.
struct Slab {
    index: usize,
    centre_x_m: f64,
    top_m: f64,
}

/// The drawing and a one-line caption of what it shows.
pub fn drawing(scenario: &Scenario, analysis: &Analysis, units: UnitSystem) -> (String, String) {
    let elev = elevation(scenario, analysis);
    let slabs = slabs(scenario, &elev);
    let view = View::fit(&fit_points(scenario, &elev, &slabs));
    let mut svg = format!(
        "<svg class=\"layout\" viewBox=\"0 0 {:.0} {:.0}\" role=\"img\" aria-label=\"Layout elevation\">",
        view.width, view.height
    );
    svg.push_str(DEFS);
    svg.push_str(&slabs.iter().map(|s| slab(scenario, analysis, &elev, &view, s)).collect::<String>());
    svg.push_str(&members(scenario, analysis, &elev, &view));
    svg.push_str(&nodes(scenario, &elev, &view));
    svg.push_str(&masses(scenario, &elev, &view, units));
    svg.push_str(&super::dimensions::dimensions(&elev.xy_m, &view, units));
    svg.push_str(&scale_bar([18.0, view.height - 14.0], view.scale, units));
    svg.push_str(&axes([view.width - 40.0, view.height - 14.0]));
    svg.push_str("</svg>");
    (svg, caption(&elev))
}

/// The plan (the rig seen from above, x to the right, z down the page) and
/// its caption, drawn as the elevation is: members shaded by their highest
/// utilisation, node and mass symbols, floor panels as outlines, overall
/// dimensions. `None` for a rig that lies in one vertical plane (x–y): its
/// plan would be a line.
pub fn plan_drawing(scenario: &Scenario, analysis: &Analysis, units: UnitSystem) -> Option<(String, String)> {
    let plan = projected(scenario, analysis, Projection::Plan);
    let (z0, z1) =
        plan.xy_m.iter().map(|p| p[1]).fold((f64::INFINITY, f64::NEG_INFINITY), |(a, b), z| (a.min(z), b.max(z)));
    let has_floor = !scenario.floors.is_empty();
    let spread = z1 - z0 > 1e-3;
    if !spread && !has_floor {
        return None;
    }
    let panels: Vec<[[f64; 2]; 2]> = scenario
        .floors
        .iter()
        .map(|f| {
            let [ox, oz] = [f.origin[0].value, f.origin[1].value];
            [[ox, -oz], [ox + f.span[0].value, -(oz + f.span[1].value)]]
        })
        .collect();
    let mut pts = plan.xy_m.clone();
    pts.extend(panels.iter().flatten().copied());
    let view = View::fit(&pts);
    let mut svg = format!(
        "<svg class=\"layout plan\" viewBox=\"0 0 {:.0} {:.0}\" role=\"img\" aria-label=\"Layout plan\">",
        view.width, view.height
    );
    svg.push_str(DEFS);
    for (f, [a, b]) in scenario.floors.iter().zip(&panels) {
        let ([xa, ya], [xb, yb]) = (view.map(*a), view.map(*b));
        let m = mark(analysis, plan.case, &f.id);
        let stroke_w = if m.over { 3.5 } else { 1.5 };
        svg.push_str(&format!(
            "<g class=\"floor\"><title>{}</title><rect x=\"{:.2}\" y=\"{:.2}\" width=\"{:.2}\" height=\"{:.2}\" fill=\"url(#hatch)\" fill-opacity=\"0.35\" stroke=\"#1b1f24\" stroke-width=\"{stroke_w}\"/>\
             <text x=\"{:.2}\" y=\"{:.2}\" class=\"lbl id\">{}</text></g>",
            title(&f.id, &m),
            xa.min(xb),
            ya.min(yb),
            (xb - xa).abs(),
            (yb - ya).abs(),
            xa.min(xb) + 4.0,
            ya.max(yb) - 6.0,
            escape(&f.id)
        ));
    }
    svg.push_str(&members(scenario, analysis, &plan, &view));
    svg.push_str(&nodes(scenario, &plan, &view));
    svg.push_str(&masses(scenario, &plan, &view, units));
    svg.push_str(&super::dimensions::dimensions(&plan.xy_m, &view, units));
    svg.push_str(&scale_bar([18.0, view.height - 14.0], view.scale, units));
    svg.push_str(&plan_axes([view.width - 40.0, view.height - 38.0]));
    svg.push_str("</svg>");
    let caption = match plan.case {
        Some(c) => format!(
            "Plan (seen from above: x to the right, z down the page) in the solved geometry of static case “{}”; floor panels outlined; overall x and z extents dimensioned between the extreme nodes.",
            escape(&c.id)
        ),
        None => "Plan (seen from above: x to the right, z down the page) as drawn: no static case was solved; floor panels outlined; overall x and z extents dimensioned between the extreme nodes.".to_string(),
    };
    Some((svg, caption))
}

/// A small x–z axis cross for the plan at `at`, arrows right (x) and down (z).
fn plan_axes(at: [f64; 2]) -> String {
    let (x, y) = (at[0], at[1]);
    format!(
        "<g class=\"axes\" stroke=\"#1b1f24\" stroke-width=\"1.2\" fill=\"none\">\
         <path d=\"M{x:.2} {y:.2} h24 m-5 -3 l5 3 l-5 3 M{x:.2} {y:.2} v24 m-3 -5 l3 5 l3 -5\"/></g>\
         <text x=\"{:.2}\" y=\"{:.2}\" class=\"lbl\">x</text><text x=\"{:.2}\" y=\"{:.2}\" class=\"lbl\">z</text>",
        x + 27.0,
        y + 4.0,
        x - 4.0,
        y + 36.0
    )
}

fn caption(elev: &Elevation) -> String {
    match elev.case {
        Some(c) => format!(
            "Elevation (x to the right, y up) in the solved geometry of static case “{}”; overall width and height dimensioned between the extreme nodes.",
            escape(&c.id)
        ),
        None => "Elevation (x to the right, y up) as drawn: no static case was solved; overall width and height dimensioned between the extreme nodes.".to_string(),
    }
}

const DEFS: &str = "<defs><pattern id=\"hatch\" width=\"7\" height=\"7\" patternUnits=\"userSpaceOnUse\" patternTransform=\"rotate(45)\">\
<path d=\"M0 0 V7\" stroke=\"#1b1f24\" stroke-width=\"1\" stroke-opacity=\"0.55\"/></pattern></defs>";

fn slabs(scenario: &Scenario, elev: &Elevation) -> Vec<Slab> {
    (0..scenario.floors.len())
        .filter_map(|index| {
            let on: Vec<[f64; 2]> = scenario
                .nodes
                .iter()
                .zip(&elev.xy_m)
                .filter(|(n, _)| n.support == Support::Floor(index))
                .map(|(_, p)| *p)
                .collect();
            if on.is_empty() {
                return None;
            }
            let centre_x_m = on.iter().map(|p| p[0]).sum::<f64>() / on.len() as f64;
            let top_m = on.iter().map(|p| p[1]).fold(f64::INFINITY, f64::min);
            Some(Slab { index, centre_x_m, top_m })
        })
        .collect()
}

fn fit_points(scenario: &Scenario, elev: &Elevation, slabs: &[Slab]) -> Vec<[f64; 2]> {
    let mut pts = elev.xy_m.clone();
    for s in slabs {
        let f = &scenario.floors[s.index];
        let half = f.span[0].value / 2.0;
        pts.push([s.centre_x_m - half, s.top_m - f.thickness.value]);
        pts.push([s.centre_x_m + half, s.top_m]);
    }
    pts
}

fn slab(scenario: &Scenario, analysis: &Analysis, elev: &Elevation, view: &View, s: &Slab) -> String {
    let f = &scenario.floors[s.index];
    let half = f.span[0].value / 2.0;
    let [x0, y0] = view.map([s.centre_x_m - half, s.top_m]);
    let w = f.span[0].value * view.scale;
    let h = (f.thickness.value * view.scale).max(9.0);
    let m = mark(analysis, elev.case, &f.id);
    let fill = m.utilisation.map_or_else(|| "#ffffff".to_string(), colour);
    let dash = if m.slack { " stroke-dasharray=\"6 4\"" } else { "" };
    let stroke_w = if m.over { 3.5 } else { 1.5 };
    let y = y0 + BEARING_DROP;
    format!(
        "<g class=\"floor\"><title>{}</title>\
         <rect x=\"{x0:.2}\" y=\"{y:.2}\" width=\"{w:.2}\" height=\"{h:.2}\" fill=\"{fill}\" stroke=\"#1b1f24\" stroke-width=\"{stroke_w}\"{dash}/>\
         <rect x=\"{x0:.2}\" y=\"{y:.2}\" width=\"{w:.2}\" height=\"{h:.2}\" fill=\"url(#hatch)\"/>\
         <text x=\"{x0:.2}\" y=\"{:.2}\" class=\"lbl id\">{}</text></g>",
        title(&f.id, &m),
        y + h + 14.0,
        escape(&f.id)
    )
}

fn title(id: &str, m: &Mark) -> String {
    let u = m.utilisation.map_or_else(|| "no result".to_string(), percent);
    escape(&format!("{id}: highest utilisation {u}"))
}

fn members(scenario: &Scenario, analysis: &Analysis, elev: &Elevation, view: &View) -> String {
    let mut lines = String::new();
    let mut labels = String::new();
    for member in &scenario.members {
        // a rope over sheaves is drawn through its path; its id on its longest span
        let pts: Vec<[f64; 2]> = member.path().iter().map(|&k| view.map(elev.xy_m[k])).collect();
        let (pa, pb) = pts
            .windows(2)
            .map(|w| (w[0], w[1]))
            .max_by(|x, y| {
                let l = |p: &([f64; 2], [f64; 2])| (p.1[0] - p.0[0]).hypot(p.1[1] - p.0[1]);
                l(x).total_cmp(&l(y))
            })
            .unwrap_or((pts[0], pts[pts.len() - 1]));
        let m = mark(analysis, elev.case, &member.id);
        let width = if m.over { OVER_WIDTH } else { LINE_WIDTH };
        let dash = if m.slack { " stroke-dasharray=\"9 6\"" } else { "" };
        let shade = m.utilisation.map_or_else(|| "#ffffff".to_string(), colour);
        let mut d = format!("M{:.2} {:.2}", pts[0][0], pts[0][1]);
        for p in &pts[1..] {
            d.push_str(&format!(" L{:.2} {:.2}", p[0], p[1]));
        }
        lines.push_str(&format!(
            "<g class=\"member\"><title>{}</title>\
             <path d=\"{d}\" stroke=\"#1b1f24\" stroke-width=\"{:.1}\" stroke-linecap=\"butt\"{dash}/>\
             <path d=\"{d}\" stroke=\"{shade}\" stroke-width=\"{width:.1}\" stroke-linecap=\"butt\"{dash}/></g>",
            title(&member.id, &m),
            width + 2.4
        ));
        labels.push_str(&member_label(pa, pb, &member.id));
    }
    lines + &labels
}

/// The id beside the member's midpoint, offset across it.
fn member_label(pa: [f64; 2], pb: [f64; 2], id: &str) -> String {
    let (dx, dy) = (pb[0] - pa[0], pb[1] - pa[1]);
    let len = dx.hypot(dy).max(1e-9);
    let (nx, ny) = (-dy / len, dx / len);
    // Put the label on the upper-right side of the line.
    let (nx, ny) = if ny > 0.0 || (ny == 0.0 && nx < 0.0) { (-nx, -ny) } else { (nx, ny) };
    let (x, y) = ((pa[0] + pb[0]) / 2.0 + nx * 12.0, (pa[1] + pb[1]) / 2.0 + ny * 12.0 + 4.0);
    let anchor = if nx > 0.3 {
        "start"
    } else if nx < -0.3 {
        "end"
    } else {
        "middle"
    };
    format!("<text x=\"{x:.2}\" y=\"{y:.2}\" class=\"lbl id\" text-anchor=\"{anchor}\">{}</text>", escape(id))
}

fn nodes(scenario: &Scenario, elev: &Elevation, view: &View) -> String {
    scenario
        .nodes
        .iter()
        .enumerate()
        .map(|(i, node)| {
            let p = view.map(elev.xy_m[i]);
            let mut taken = directions(scenario, elev, view, i);
            let away = away_from(&taken);
            let mut symbol = match node.support {
                Support::Anchor => anchor(p, away),
                Support::Floor(_) => bearing(p),
                Support::Joint => joint(p),
            };
            if node.sheave.is_some() {
                // a sheave: an open ring round the node
                symbol.push_str(&format!(
                    "<circle cx=\"{:.2}\" cy=\"{:.2}\" r=\"7\" fill=\"none\" stroke=\"#1b1f24\" stroke-width=\"1.6\" class=\"sheave\"/>",
                    p[0], p[1]
                ));
            }
            match node.support {
                Support::Anchor => taken.push(away),
                Support::Floor(_) => taken.push([0.0, 1.0]),
                Support::Joint => {}
            }
            let side = label_side(&taken);
            node_label(p, side, &node.id, symbol)
        })
        .collect()
}

/// The node's symbol and its id placed 14 units along `side` (a unit vector).
fn node_label(p: [f64; 2], side: [f64; 2], id: &str, symbol: String) -> String {
    let anchor = if side[0] > 0.3 {
        "start"
    } else if side[0] < -0.3 {
        "end"
    } else {
        "middle"
    };
    let (x, y) = (p[0] + side[0] * 14.0, p[1] + side[1] * 14.0 + 4.0);
    format!(
        "{symbol}<text x=\"{x:.2}\" y=\"{y:.2}\" class=\"lbl node-id\" text-anchor=\"{anchor}\">{}</text>",
        escape(id)
    )
}

/// Unit vectors (drawing units, y down) from node `i` along each of its
/// members, and straight down when a mass hangs there.
fn directions(scenario: &Scenario, elev: &Elevation, view: &View, i: usize) -> Vec<[f64; 2]> {
    let p = view.map(elev.xy_m[i]);
    let mut dirs: Vec<[f64; 2]> = scenario
        .members
        .iter()
        .flat_map(|m| {
            // a rope: each of its spans; a member: its ends (no allocation)
            let spans = if m.run.is_some() { m.segments() } else { Vec::new() };
            spans.into_iter().chain(m.run.is_none().then_some((m.ends[0], m.ends[1], 1.0)))
        })
        .filter_map(|(a, b, _)| match (a, b) {
            (a, b) if a == i => Some(b),
            (a, b) if b == i => Some(a),
            _ => None,
        })
        .filter_map(|other| {
            let q = view.map(elev.xy_m[other]);
            let l = (q[0] - p[0]).hypot(q[1] - p[1]);
            (l > 1e-9).then(|| [(q[0] - p[0]) / l, (q[1] - p[1]) / l])
        })
        .collect();
    if scenario.masses.iter().any(|m| m.node == i) {
        dirs.push([0.0, 1.0]);
    }
    dirs
}

/// The unit vector opposite the mean of `dirs`; straight up when they cancel.
fn away_from(dirs: &[[f64; 2]]) -> [f64; 2] {
    let (sx, sy) = dirs.iter().fold((0.0, 0.0), |(x, y), d| (x + d[0], y + d[1]));
    let l = f64::hypot(sx, sy);
    if l < 1e-6 { [0.0, -1.0] } else { [-sx / l, -sy / l] }
}

/// Of eight compass directions (up-right first), the one farthest in angle
/// from every direction already taken by a member, mass or symbol.
fn label_side(taken: &[[f64; 2]]) -> [f64; 2] {
    let mut best = ([0.707, -0.707], f64::NEG_INFINITY);
    for k in 0..8 {
        let a = std::f64::consts::FRAC_PI_4 * f64::from(k) - std::f64::consts::FRAC_PI_4;
        let c = [a.cos(), a.sin()];
        let clearance = taken.iter().map(|d| 1.0 - (c[0] * d[0] + c[1] * d[1])).fold(2.0, f64::min);
        if clearance > best.1 + 1e-9 {
            best = (c, clearance);
        }
    }
    best.0
}

fn masses(scenario: &Scenario, elev: &Elevation, view: &View, units: UnitSystem) -> String {
    scenario
        .masses
        .iter()
        .map(|m| mass(view.map(elev.xy_m[m.node]), &format!("{} {}", m.id, units.mass(m.mass.value))))
        .collect()
}

/// A small x–y axis cross at `at` (its origin), arrows right and up.
fn axes(at: [f64; 2]) -> String {
    let (x, y) = (at[0], at[1]);
    format!(
        "<g class=\"axes\" stroke=\"#1b1f24\" stroke-width=\"1.2\" fill=\"none\">\
         <path d=\"M{x:.2} {y:.2} h24 m-5 -3 l5 3 l-5 3 M{x:.2} {y:.2} v-24 m-3 5 l3 -5 l3 5\"/></g>\
         <text x=\"{:.2}\" y=\"{:.2}\" class=\"lbl\">x</text><text x=\"{:.2}\" y=\"{:.2}\" class=\"lbl\">y</text>",
        x + 27.0,
        y + 4.0,
        x - 4.0,
        y - 28.0
    )
}
