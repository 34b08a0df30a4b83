//! A floor panel under its feet: the flexibility matrix at the feet's real
//! positions (simply supported: the Navier series summed along one
//! direction in closed form, [`navier_flexibility_matrix`];
//! clamped: the Ritz solution, [`ClampedPlate`]) and the deflection field
//! of the feet's forces over the whole panel with its largest value.
//!
//! Both kernels are normalised so that a load at the panel centre gives
//! exactly the tabulated coefficient of [`point_load_coefficient`] (T&W's
//! α, the spring a single central foot has always had): the factor is
//! within 0.25 % of 1 for simply supported panels (the table's rounding)
//! and within 1 % for clamped ones (the Ritz solution's stiff bias, which
//! the table corrects); tests below.
//!
//! The largest deflection is searched on a 14 × 14 grid of the panel plus
//! the feet themselves, then refined from the best two points by compass
//! search down to 1e-4 of the span; the result is the largest deflection
//! to the series' accuracy (about 1e-4 relative simply supported, 1 %
//! clamped; see the kernels), the search adding well under that (tests).

use super::plate_clamped::{ClampedPlate, RITZ_TERMS};
use super::plate_navier::{FIELD_TERMS, FLEXIBILITY_TERMS, NavierField};
use super::plate_single_series::navier_flexibility_matrix;
use super::slab::{Edges, point_load_coefficient};

/// The plate of one panel with its feet, in the panel's local coordinates
/// (m, from the panel's corner: x along the first span, z the second).
#[derive(Debug, Clone, PartialEq)]
pub struct PlatePanel {
    span: [f64; 2],
    rigidity: f64,
    feet: Vec<[f64; 2]>,
    flexibility: Vec<f64>,
    clamped: Option<ClampedPlate>,
    /// Clamped: per foot, the Ritz coefficients of a unit load there.
    unit_fields: Vec<Vec<f64>>,
    /// Tabulated centre coefficient ÷ the kernel's own (see the module note).
    normalisation: f64,
}

impl PlatePanel {
    /// The plate of a panel `span` (m) with rigidity `rigidity` (N·m) and
    /// feet at `feet` (local, m; inside the panel). `None` for a degenerate
    /// panel (the clamped Ritz system does not factor).
    pub fn new(edges: Edges, span: [f64; 2], rigidity: f64, feet: &[[f64; 2]]) -> Option<Self> {
        let n = feet.len();
        let mut flexibility = vec![0.0; n * n];
        let centre = [0.5 * span[0], 0.5 * span[1]];
        let short = span[0].min(span[1]);
        let table = point_load_coefficient(edges, span[0], span[1]) * short * short / rigidity;
        let (clamped, unit_fields, normalisation) = match edges {
            Edges::SimplySupported => {
                let at_centre = navier_flexibility_matrix(span, rigidity, &[centre], FLEXIBILITY_TERMS)[0];
                let normalisation = table / at_centre;
                flexibility = navier_flexibility_matrix(span, rigidity, feet, FLEXIBILITY_TERMS);
                for c in &mut flexibility {
                    *c *= normalisation;
                }
                (None, Vec::new(), normalisation)
            }
            Edges::Clamped => {
                let plate = ClampedPlate::new(span, rigidity, RITZ_TERMS)?;
                let normalisation = table / plate.deflection(&plate.unit_load(centre), centre);
                let fields: Vec<Vec<f64>> = feet.iter().map(|&p| plate.unit_load(p)).collect();
                for i in 0..n {
                    for j in 0..=i {
                        // symmetric by construction; averaged against roundoff
                        let c = 0.5
                            * normalisation
                            * (plate.deflection(&fields[j], feet[i]) + plate.deflection(&fields[i], feet[j]));
                        flexibility[i * n + j] = c;
                        flexibility[j * n + i] = c;
                    }
                }
                (Some(plate), fields, normalisation)
            }
        };
        if !(normalisation.is_finite() && normalisation > 0.0) {
            return None;
        }
        Some(Self { span, rigidity, feet: feet.to_vec(), flexibility, clamped, unit_fields, normalisation })
    }

    /// Flexibility at the feet, row-major n × n, m/N: `w_i = Σ_j C_ij P_j`.
    pub fn flexibility_m_per_n(&self) -> &[f64] {
        &self.flexibility
    }

    /// Tabulated centre coefficient ÷ the kernel's own.
    pub fn normalisation(&self) -> f64 {
        self.normalisation
    }

    /// The feet, local (m).
    pub fn feet(&self) -> &[[f64; 2]] {
        &self.feet
    }

    /// A deflection field of the feet's forces `forces` (N, pressing down).
    fn field(&self, forces: &[f64]) -> Box<dyn Fn([f64; 2]) -> f64 + '_> {
        let scaled: Vec<f64> = forces.iter().map(|f| f * self.normalisation).collect();
        let forces = &scaled;
        match &self.clamped {
            None => {
                let f = NavierField::new(self.span, self.rigidity, &self.feet, forces, FIELD_TERMS);
                Box::new(move |p| f.at(p))
            }
            Some(plate) => {
                let mut c = vec![0.0; self.unit_fields.first().map_or(0, Vec::len)];
                for (u, &f) in self.unit_fields.iter().zip(forces) {
                    for (ci, ui) in c.iter_mut().zip(u) {
                        *ci += f * ui;
                    }
                }
                Box::new(move |p| plate.deflection(&c, p))
            }
        }
    }

    /// Deflection at `at` (local, m) under the feet's forces, m (down positive).
    pub fn deflection_at(&self, forces: &[f64], at: [f64; 2]) -> f64 {
        (self.field(forces))(at)
    }

    /// Largest deflection over the panel and where (local, m).
    pub fn max_deflection(&self, forces: &[f64]) -> (f64, [f64; 2]) {
        if forces.iter().all(|f| *f == 0.0) {
            return (0.0, [0.5 * self.span[0], 0.5 * self.span[1]]);
        }
        let w = self.field(forces);
        const GRID: usize = 14;
        let mut pts: Vec<([f64; 2], f64)> = Vec::new();
        for i in 1..GRID {
            for j in 1..GRID {
                let p = [self.span[0] * i as f64 / GRID as f64, self.span[1] * j as f64 / GRID as f64];
                pts.push((p, w(p)));
            }
        }
        for &p in &self.feet {
            pts.push((p, w(p)));
        }
        pts.sort_by(|a, b| b.1.total_cmp(&a.1));
        let inside = |p: [f64; 2]| [p[0].clamp(0.0, self.span[0]), p[1].clamp(0.0, self.span[1])];
        let mut best = pts[0];
        for &(start, value) in pts.iter().take(2) {
            let (mut p, mut v) = (start, value);
            let mut h = [self.span[0] / GRID as f64, self.span[1] / GRID as f64];
            while h[0] > 1e-4 * self.span[0] || h[1] > 1e-4 * self.span[1] {
                let mut moved = false;
                for d in [
                    [1.0, 0.0],
                    [-1.0, 0.0],
                    [0.0, 1.0],
                    [0.0, -1.0],
                    [1.0, 1.0],
                    [-1.0, -1.0],
                    [1.0, -1.0],
                    [-1.0, 1.0],
                ] {
                    let q = inside([p[0] + d[0] * h[0], p[1] + d[1] * h[1]]);
                    let wq = w(q);
                    if wq > v {
                        (p, v) = (q, wq);
                        moved = true;
                        break;
                    }
                }
                if !moved {
                    h = [0.5 * h[0], 0.5 * h[1]];
                }
            }
            if v > best.1 {
                best = (p, v);
            }
        }
        (best.1, best.0)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::library::slab::point_load_coefficient;

    // One foot at the centre: the flexibility is T&W's α a² / D exactly (the
    // normalisation; roundoff only), the normalisation is within the stated
    // bounds for both edge kinds and several ratios, and the largest
    // deflection is under the foot.
    #[test]
    fn single_centre_foot() {
        for (edges, bound) in [(Edges::SimplySupported, 2.5e-3), (Edges::Clamped, 1e-2)] {
            for span in [[4.0, 4.0], [3.0, 4.2], [5.0, 2.5]] {
                let centre = [span[0] / 2.0, span[1] / 2.0];
                let panel = PlatePanel::new(edges, span, 1.0e7, &[centre]).expect("panel");
                let a = f64::min(span[0], span[1]);
                let alpha = point_load_coefficient(edges, span[0], span[1]);
                let c = panel.flexibility_m_per_n()[0];
                assert!((c * 1.0e7 / (a * a) - alpha).abs() / alpha < 1e-12);
                assert!((panel.normalisation() - 1.0).abs() < bound, "{edges:?} {span:?}: {}", panel.normalisation());
            }
        }
        let d = 30e9 * 0.15f64.powi(3) / (12.0 * (1.0 - 0.04));
        let panel = PlatePanel::new(Edges::SimplySupported, [4.0, 4.0], d, &[[2.0, 2.0]]).expect("panel");
        let c = panel.flexibility_m_per_n()[0];
        let (wmax, at) = panel.max_deflection(&[10e3]);
        // the field's 120 terms against the feet's 200: 2e-4
        assert!(((wmax - 10e3 * c) / (10e3 * c)).abs() < 2e-4, "{wmax} {}", 10e3 * c);
        assert!((at[0] - 2.0).abs() < 1e-3 && (at[1] - 2.0).abs() < 1e-3);
    }

    // Two feet: the search finds at least the largest value of a dense
    // 60 × 60 scan of the same field (plus the feet), and no more than
    // 0.2 % above it (the scan's spacing, 1/60 of the span, misses the top
    // of a smooth peak by about that), for both edge kinds.
    #[test]
    fn search_matches_a_dense_scan() {
        for edges in [Edges::SimplySupported, Edges::Clamped] {
            let feet = [[1.2, 1.5], [2.9, 1.7]];
            let panel = PlatePanel::new(edges, [4.0, 3.0], 5.0e6, &feet).expect("panel");
            let forces = [4.0e3, 2.5e3];
            let (wmax, _) = panel.max_deflection(&forces);
            let mut scan: f64 = feet.iter().map(|&p| panel.deflection_at(&forces, p)).fold(0.0, f64::max);
            for i in 1..60 {
                for j in 1..60 {
                    scan = scan.max(panel.deflection_at(&forces, [4.0 * i as f64 / 60.0, 3.0 * j as f64 / 60.0]));
                }
            }
            assert!(wmax >= scan * (1.0 - 1e-6), "{edges:?}: search {wmax} scan {scan}");
            assert!(wmax <= scan * (1.0 + 2e-3), "{edges:?}: search {wmax} scan {scan}");
        }
    }
}
