//! The canvas's view of the elevation: the map between metres (x right,
//! y up) and screen points, pan, zoom about the pointer, fit-to-view, and
//! the grid step (1-2-5 steps of the display unit) that snapping uses.

use crate::fields::units_display::{Shown, UnitSystem};
use egui::{Pos2, Rect, Vec2, pos2};

/// Width kept free for the legend when fitting, points.
const LEGEND_ROOM: f64 = 220.0;

/// Pan and zoom of the canvas.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct View {
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
    /// Screen point of a world point (m).
    pub fn to_screen(&self, x_m: f64, y_m: f64) -> Pos2 {
        let c = self.rect.center();
        pos2(
            c.x + ((x_m - self.centre_m[0]) * self.px_per_m) as f32,
            c.y - ((y_m - self.centre_m[1]) * self.px_per_m) as f32,
        )
    }

    /// World point (m) under a screen point.
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
