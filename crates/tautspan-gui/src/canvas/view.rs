//! The canvas's view: which projection is shown (elevation x–y, plan x–z,
//! side z–y, or the 3-D orbit), the map between the view's two coordinates
//! in metres and screen points, pan, zoom about the pointer, fit-to-view,
//! and the grid step (1-2-5 steps of the display unit) that snapping uses.
//!
//! Every view draws a plane of two world coordinates `(u, v)` in metres,
//! `u` to the right and `v` up on screen: elevation `(x, y)` looking along
//! −z, plan `(x, −z)` looking down (z grows down the screen), side `(z, y)`
//! looking along +x, and the orbit an orthographic view turned by a yaw
//! about y and tilted by a pitch. `to_screen` and `to_world` work in that
//! plane; `project` and `unproject` go between it and the world.

use crate::fields::units_display::{Shown, UnitSystem};
use egui::{Pos2, Rect, Vec2, pos2};

/// Width kept free for the legend when fitting, points.
const LEGEND_ROOM: f64 = 220.0;

/// Which view of the rig the canvas shows.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, serde::Serialize, serde::Deserialize)]
pub enum ViewKind {
    /// x–y, looking along −z (the drawing the file's positions are in).
    #[default]
    Elevation,
    /// x–z, looking down.
    Plan,
    /// z–y, looking along +x.
    Side,
    /// An orthographic 3-D view turned by dragging; for looking and picking.
    Orbit,
}

impl ViewKind {
    /// Every view, in the switch's order.
    pub const ALL: [ViewKind; 4] = [ViewKind::Elevation, ViewKind::Plan, ViewKind::Side, ViewKind::Orbit];

    /// The switch's label.
    pub fn label(self) -> &'static str {
        match self {
            ViewKind::Elevation => "Elevation (x–y)",
            ViewKind::Plan => "Plan (x–z)",
            ViewKind::Side => "Side (z–y)",
            ViewKind::Orbit => "3-D",
        }
    }

    /// Its short name, for a canvas too narrow for [`ViewKind::label`].
    pub fn short_label(self) -> &'static str {
        match self {
            ViewKind::Elevation => "x–y",
            ViewKind::Plan => "x–z",
            ViewKind::Side => "z–y",
            ViewKind::Orbit => "3-D",
        }
    }

    /// The keyboard key that switches to it (with no modifier, outside text fields).
    pub fn key(self) -> egui::Key {
        match self {
            ViewKind::Elevation => egui::Key::Num1,
            ViewKind::Plan => egui::Key::Num2,
            ViewKind::Side => egui::Key::Num3,
            ViewKind::Orbit => egui::Key::Num4,
        }
    }

    /// The names of the two world coordinates it shows, across then up.
    pub fn axes(self) -> Option<[&'static str; 2]> {
        match self {
            ViewKind::Elevation => Some(["x", "y"]),
            ViewKind::Plan => Some(["x", "z"]),
            ViewKind::Side => Some(["z", "y"]),
            ViewKind::Orbit => None,
        }
    }
}

/// Pan and zoom of the canvas.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct View {
    /// Which view is shown.
    pub kind: ViewKind,
    /// The orbit's turn about the vertical, degrees.
    pub yaw_deg: f64,
    /// The orbit's tilt, degrees (positive looks down on the rig).
    pub pitch_deg: f64,
    /// World point at the canvas centre, m.
    pub centre_m: [f64; 2],
    /// Screen points per metre.
    pub px_per_m: f64,
    /// The canvas rectangle of the last frame.
    pub rect: Rect,
    /// Fit to the drawing on the next frame.
    pub fit_pending: bool,
    /// Snap placed and dragged nodes to the grid.
    pub snap: bool,
    /// Draw the solved (deflected) shape of the shown case.
    pub deflected: bool,
    /// How many times the displacements are magnified in the deflected shape.
    pub magnification: u32,
}

impl Default for View {
    fn default() -> Self {
        View {
            kind: ViewKind::Elevation,
            yaw_deg: -35.0,
            pitch_deg: 25.0,
            centre_m: [0.0, 2.0],
            px_per_m: 80.0,
            rect: Rect::from_min_size(Pos2::ZERO, Vec2::new(800.0, 600.0)),
            fit_pending: true,
            snap: true,
            deflected: false,
            magnification: 100,
        }
    }
}

impl View {
    /// A world point (x, y, z) m in the view's plane `(u, v)`, with its
    /// depth (larger is nearer the viewer).
    pub fn project(&self, p: [f64; 3]) -> ([f64; 2], f64) {
        let [x, y, z] = p;
        match self.kind {
            ViewKind::Elevation => ([x, y], z),
            ViewKind::Plan => ([x, -z], y),
            ViewKind::Side => ([z, y], -x),
            ViewKind::Orbit => {
                let (sy, cy) = self.yaw_deg.to_radians().sin_cos();
                let (sp, cp) = self.pitch_deg.to_radians().sin_cos();
                let xr = x * cy + z * sy;
                let zr = -x * sy + z * cy;
                ([xr, y * cp - zr * sp], y * sp + zr * cp)
            }
        }
    }

    /// The world point shown at `uv` in a flat view, keeping from `keep`
    /// the coordinate the view does not show; `None` in the orbit (a screen
    /// point there is a line, not a point).
    pub fn unproject(&self, uv: [f64; 2], keep: [f64; 3]) -> Option<[f64; 3]> {
        let [u, v] = uv;
        match self.kind {
            ViewKind::Elevation => Some([u, v, keep[2]]),
            ViewKind::Plan => Some([u, keep[1], -v]),
            ViewKind::Side => Some([keep[0], v, u]),
            ViewKind::Orbit => None,
        }
    }

    /// Screen point of a world point (x, y, z) m.
    pub fn to_screen_xyz(&self, p: [f64; 3]) -> Pos2 {
        let ([u, v], _) = self.project(p);
        self.to_screen(u, v)
    }

    /// Turn the orbit by a screen drag (half a degree a point; the tilt kept
    /// within ±89° so up stays up).
    pub fn orbit(&mut self, delta: Vec2) {
        self.yaw_deg = (self.yaw_deg - f64::from(delta.x) * 0.5).rem_euclid(360.0);
        self.pitch_deg = (self.pitch_deg + f64::from(delta.y) * 0.5).clamp(-89.0, 89.0);
    }

    /// Screen point of a point of the view's plane (m).
    pub fn to_screen(&self, x_m: f64, y_m: f64) -> Pos2 {
        let c = self.rect.center();
        pos2(
            c.x + ((x_m - self.centre_m[0]) * self.px_per_m) as f32,
            c.y - ((y_m - self.centre_m[1]) * self.px_per_m) as f32,
        )
    }

    /// Point of the view's plane (m) under a screen point.
    pub fn to_world(&self, p: Pos2) -> [f64; 2] {
        let c = self.rect.center();
        [
            self.centre_m[0] + f64::from(p.x - c.x) / self.px_per_m,
            self.centre_m[1] - f64::from(p.y - c.y) / self.px_per_m,
        ]
    }

    /// Pan by a screen drag.
    pub fn pan(&mut self, delta: Vec2) {
        self.centre_m[0] -= f64::from(delta.x) / self.px_per_m;
        self.centre_m[1] += f64::from(delta.y) / self.px_per_m;
    }

    /// Zoom by `factor` keeping the world point under `about` in place.
    pub fn zoom(&mut self, factor: f64, about: Pos2) {
        let before = self.to_world(about);
        self.px_per_m = (self.px_per_m * factor).clamp(2.0, 20_000.0);
        let after = self.to_world(about);
        self.centre_m[0] += before[0] - after[0];
        self.centre_m[1] += before[1] - after[1];
    }

    /// Fit a world box (min, max, m) into the canvas with a margin.
    pub fn fit(&mut self, min: [f64; 2], max: [f64; 2]) {
        let w = (max[0] - min[0]).max(0.5);
        let h = (max[1] - min[1]).max(0.5);
        // the legend takes the top right corner: fit into the room left of it
        let room = (f64::from(self.rect.width()) - LEGEND_ROOM).max(f64::from(self.rect.width()) * 0.5);
        let sx = room * 0.85 / w;
        let sy = f64::from(self.rect.height()) * 0.75 / h;
        self.px_per_m = sx.min(sy).clamp(2.0, 20_000.0);
        let shift_m = (f64::from(self.rect.width()) - room) / 2.0 / self.px_per_m;
        self.centre_m = [(min[0] + max[0]) / 2.0 + shift_m, (min[1] + max[1]) / 2.0];
        self.fit_pending = false;
    }

    /// Grid step in metres: a 1-2-5 step of the display length unit giving
    /// lines about 40 to 100 points apart.
    pub fn grid_step_m(&self, units: UnitSystem) -> f64 {
        let unit_m = units.to_si(Shown::Length);
        let target_m = 50.0 / self.px_per_m;
        let target_u = target_m / unit_m;
        let mag = 10f64.powf(target_u.log10().floor());
        let step_u = [1.0, 2.0, 5.0, 10.0].iter().map(|k| k * mag).find(|s| *s >= target_u).unwrap_or(10.0 * mag);
        step_u * unit_m
    }

    /// A world point snapped to the grid when snapping is on.
    pub fn snapped(&self, p: [f64; 2], units: UnitSystem) -> [f64; 2] {
        if !self.snap {
            return p;
        }
        // snap to a finer step than the drawn grid so placement stays free enough
        let step = self.grid_step_m(units) / 2.0;
        [(p[0] / step).round() * step, (p[1] / step).round() * step]
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn screen_and_world_round_trip() {
        let v = View::default();
        let p = v.to_screen(1.25, -0.5);
        let w = v.to_world(p);
        assert!((w[0] - 1.25).abs() < 1e-4 && (w[1] + 0.5).abs() < 1e-4);
    }

    #[test]
    fn zoom_keeps_the_point_under_the_pointer() {
        let mut v = View::default();
        let about = pos2(100.0, 120.0);
        let before = v.to_world(about);
        v.zoom(1.7, about);
        let after = v.to_world(about);
        assert!((before[0] - after[0]).abs() < 1e-6 && (before[1] - after[1]).abs() < 1e-6);
    }
}

#[cfg(test)]
mod projection_tests {
    use super::*;

    /// Each flat view shows its two coordinates and keeps the third.
    #[test]
    fn flat_views_round_trip_and_keep_the_hidden_coordinate() {
        let p = [1.5, 2.5, -0.75];
        for kind in [ViewKind::Elevation, ViewKind::Plan, ViewKind::Side] {
            let v = View { kind, ..View::default() };
            let (uv, _) = v.project(p);
            assert_eq!(v.unproject(uv, p), Some(p), "{kind:?}");
            // a new position in the view keeps the coordinate it hides
            let moved = v.unproject([9.0, 8.0], p).unwrap_or_default();
            let hidden = match kind {
                ViewKind::Elevation => 2,
                ViewKind::Plan => 1,
                _ => 0,
            };
            assert_eq!(moved[hidden], p[hidden], "{kind:?}");
        }
        let orbit = View { kind: ViewKind::Orbit, ..View::default() };
        assert_eq!(orbit.unproject([0.0, 0.0], p), None);
    }

    /// The orbit is a rotation: lengths are kept (orthographic, no
    /// foreshortening of the depth); with no yaw or pitch it is the elevation.
    #[test]
    fn the_orbit_is_a_rotation() {
        let v = View { kind: ViewKind::Orbit, yaw_deg: 30.0, pitch_deg: 20.0, ..View::default() };
        let p = [1.0, 2.0, 3.0];
        let ([u, w], d) = v.project(p);
        let len = |a: [f64; 3]| (a[0] * a[0] + a[1] * a[1] + a[2] * a[2]).sqrt();
        assert!((len([u, w, d]) - len(p)).abs() < 1e-12);
        let flat = View { kind: ViewKind::Orbit, yaw_deg: 0.0, pitch_deg: 0.0, ..View::default() };
        assert_eq!(flat.project(p), ([1.0, 2.0], 3.0));
    }
}
