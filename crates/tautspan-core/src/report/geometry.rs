//! The elevation the drawing shows: node positions in x–y from the first
//! solved static case (drawn positions when no static case was solved), and
//! the map from metres to drawing units with y up.

use crate::analysis::{Analysis, CaseResult};
use crate::model::Scenario;

/// Node positions for the drawing and where they came from.
#[derive(Debug, Clone)]
pub struct Elevation<'a> {
    /// (x, y) per scenario node, m.
    pub xy_m: Vec<[f64; 2]>,
    /// The static case the positions were solved in, if any.
    pub case: Option<&'a CaseResult>,
}

/// The first converged static case without an error.
pub fn static_case(analysis: &Analysis) -> Option<&CaseResult> {
    analysis.cases.iter().find(|c| c.kind == "static" && c.converged && c.error.is_none())
}

/// Which two coordinates a drawing shows.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Projection {
    /// x to the right, y up (looking along −z).
    Elevation,
    /// x to the right, z down the page: the rig seen from above (the app's
    /// plan view draws it the same way).
    Plan,
}

impl Projection {
    /// The drawing's (right, up) coordinates of a point (x, y, z), m.
    pub fn of(self, p: [f64; 3]) -> [f64; 2] {
        match self {
            Projection::Elevation => [p[0], p[1]],
            Projection::Plan => [p[0], -p[2]],
        }
    }
}

/// Positions from the static case where it has the node, drawn otherwise.
pub fn elevation<'a>(scenario: &Scenario, analysis: &'a Analysis) -> Elevation<'a> {
    projected(scenario, analysis, Projection::Elevation)
}

/// As [`elevation`], in any projection.
pub fn projected<'a>(scenario: &Scenario, analysis: &'a Analysis, projection: Projection) -> Elevation<'a> {
    let case = static_case(analysis);
    let xy_m = scenario
        .nodes
        .iter()
        .enumerate()
        .map(|(i, node)| {
            let solved = case.and_then(|c| c.nodes.iter().find(|n| n.id == node.id));
            match solved {
                Some(n) if n.position_m.iter().all(|v| v.is_finite()) => projection.of(n.position_m),
                _ => projection.of(scenario.position_m(i)),
            }
        })
        .collect();
    Elevation { xy_m, case }
}

/// A map from metres (y up) to drawing units (y down) inside a margin.
#[derive(Debug, Clone, Copy)]
pub struct View {
    /// Drawing units per metre.
    pub scale: f64,
    min_x_m: f64,
    max_y_m: f64,
    margin: f64,
    /// Drawing width, units.
    pub width: f64,
    /// Drawing height, units.
    pub height: f64,
}

/// Drawing width in SVG user units (the SVG scales to the page width).
pub const DRAWING_WIDTH: f64 = 760.0;
const MARGIN: f64 = 56.0;
const MAX_HEIGHT: f64 = 400.0;
const MIN_HEIGHT: f64 = 220.0;

impl View {
    /// Fit the points (m) into the drawing, keeping their aspect ratio.
    pub fn fit(points_m: &[[f64; 2]]) -> View {
        let finite = points_m.iter().filter(|p| p[0].is_finite() && p[1].is_finite());
        let (mut lo, mut hi) = ([f64::INFINITY; 2], [f64::NEG_INFINITY; 2]);
        for p in finite {
            for k in 0..2 {
                lo[k] = lo[k].min(p[k]);
                hi[k] = hi[k].max(p[k]);
            }
        }
        if !lo[0].is_finite() {
            (lo, hi) = ([0.0; 2], [1.0; 2]);
        }
        // A vertical or horizontal rig still gets some room across.
        let span = (hi[0] - lo[0]).max(hi[1] - lo[1]).max(0.5);
        let (wx, wy) = ((hi[0] - lo[0]).max(span / 3.0), (hi[1] - lo[1]).max(span / 4.0));
        let (cx, cy) = ((lo[0] + hi[0]) / 2.0, (lo[1] + hi[1]) / 2.0);
        let inner_w = DRAWING_WIDTH - 2.0 * MARGIN;
        let scale = (inner_w / wx).min((MAX_HEIGHT - 2.0 * MARGIN) / wy);
        let height = (wy * scale + 2.0 * MARGIN).max(MIN_HEIGHT);
        let inner_h = height - 2.0 * MARGIN;
        View {
            scale,
            min_x_m: cx - inner_w / scale / 2.0,
            max_y_m: cy + inner_h / scale / 2.0,
            margin: MARGIN,
            width: DRAWING_WIDTH,
            height,
        }
    }

    /// A point (m, y up) in drawing units (y down).
    pub fn map(&self, p_m: [f64; 2]) -> [f64; 2] {
        [self.margin + (p_m[0] - self.min_x_m) * self.scale, self.margin + (self.max_y_m - p_m[1]) * self.scale]
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn y_points_up_and_aspect_is_kept() {
        let v = View::fit(&[[0.0, 0.0], [4.0, 2.0]]);
        let (a, b) = (v.map([0.0, 0.0]), v.map([4.0, 2.0]));
        assert!(b[1] < a[1], "higher point is drawn higher");
        let (dx, dy) = (b[0] - a[0], a[1] - b[1]);
        assert!((dx / dy - 2.0).abs() < 1e-9);
        assert!(a[0] >= 0.0 && b[0] <= v.width && b[1] >= 0.0 && a[1] <= v.height);
    }

    #[test]
    fn degenerate_and_empty_inputs_stay_finite() {
        for pts in [vec![], vec![[1.0, 1.0]], vec![[0.0, 0.0], [0.0, 5.0]]] {
            let v = View::fit(&pts);
            assert!(v.scale.is_finite() && v.scale > 0.0);
            assert!(v.height.is_finite());
        }
    }
}
