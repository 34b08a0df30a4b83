//! Member and floor kinematics, and the three quantities the damped Newton
//! iteration needs at a trial configuration: total potential energy, its
//! gradient (minus the out-of-balance force) and the tangent stiffness,
//! scattered into the fixed sparsity pattern of [`Model`].
//!
//! Member law: `T = k (L − L0)`, `k = EA / L0`, zero for a tension-only
//! member when `L ≤ L0`. Tangent of one member, in the 3 × 3 block form
//! `[[Kb, −Kb], [−Kb, Kb]]`: `Kb = k e⊗e` (material, when the member is
//! active) `+ (T / L)(I − e⊗e)` (geometric). Floor: a lone foot is the
//! compression-only spring `F = k_f max(0, y0 − y)` on the node's y
//! coordinate; the feet of one panel are coupled through the plate
//! ([`contact`](super::contact)): potential `½ P·p`, gradient `−P` on the
//! feet's y, tangent `(C_AA)⁻¹` on the feet in contact A.

use super::contact::{contact_forces, in_contact};
use super::model::{FloorData, MemberData, Model, NONE, RunData};

/// The state of one member at a configuration.
#[derive(Debug, Clone, Copy)]
pub(crate) struct MemberState {
    /// Current length, m.
    pub length_m: f64,
    /// Axial force, tension positive, N.
    pub force_n: f64,
    /// Unit vector from end 0 to end 1 (zero for a zero-length member).
    pub e: [f64; 3],
    /// Whether the material term `k e⊗e` belongs in the tangent (taut, or a
    /// rod). A tension-only member exactly at its rest length counts as
    /// taut: the one-sided stiffness lets a drawn-taut rope respond at once.
    pub material: bool,
}

/// The vector from `a` to `b` and its length, from their drawn chord `d0`
/// and displacements `u`.
fn chord(u: &[[f64; 3]], a: usize, b: usize, d0: [f64; 3]) -> ([f64; 3], f64) {
    let d = [0, 1, 2].map(|ax| d0[ax] + (u[b][ax] - u[a][ax]));
    (d, (d[0] * d[0] + d[1] * d[1] + d[2] * d[2]).sqrt())
}

/// A rope's segments at `pos`: per segment its unit vector, length and factor.
pub(crate) fn run_segments<'a>(
    run: &'a RunData,
    pos: &'a [[f64; 3]],
) -> impl Iterator<Item = ([f64; 3], f64, f64)> + 'a {
    run.segments.iter().zip(&run.chords).map(move |(&(a, b, w), &d0)| {
        let (d, l) = chord(pos, run.nodes[a], run.nodes[b], d0);
        let e = if l > 0.0 { [d[0] / l, d[1] / l, d[2] / l] } else { [0.0; 3] };
        (e, l, w)
    })
}

/// Length, force and direction of a member at positions `pos`. For a rope
/// over sheaves the length is the weighted length `Λ = Σ w_i L_i` and the
/// direction is zero (each segment has its own, see [`run_segments`]).
pub(crate) fn member_state(m: &MemberData, pos: &[[f64; 3]]) -> MemberState {
    if let Some(run) = &m.run {
        let length_m: f64 = run_segments(run, pos).map(|(_, l, w)| w * l).sum();
        let stretch = length_m - m.rest_m;
        let (force_n, material) =
            if m.tension_only && stretch <= 0.0 { (0.0, stretch == 0.0) } else { (m.k_n_per_m * stretch, true) };
        return MemberState { length_m, force_n, e: [0.0; 3], material };
    }
    let (d, length_m) = chord(pos, m.ends[0], m.ends[1], m.d0_m);
    let e = if length_m > 1e-12 * m.rest_m { [d[0] / length_m, d[1] / length_m, d[2] / length_m] } else { [0.0; 3] };
    let stretch = length_m - m.rest_m;
    let (force_n, material) = if m.tension_only {
        if stretch > 0.0 { (m.k_n_per_m * stretch, true) } else { (0.0, stretch == 0.0) }
    } else {
        (m.k_n_per_m * stretch, true)
    };
    MemberState { length_m, force_n, e, material }
}

/// Strain energy of a member at a state, J.
fn member_energy(m: &MemberData, s: &MemberState) -> f64 {
    let stretch = s.length_m - m.rest_m;
    if m.tension_only && stretch <= 0.0 { 0.0 } else { 0.5 * m.k_n_per_m * stretch * stretch }
}

/// An extra quadratic term `½ s Σ m_i (x_i − z_i)²` over the dofs with mass:
/// the inertia (and mass-proportional damping) of one implicit time step.
#[derive(Debug, Clone, Copy)]
pub(crate) struct Inertia<'a> {
    /// The factor `s`, 1/s².
    pub scale_per_s2: f64,
    /// The target `z` per dof, m.
    pub target_m: &'a [f64],
}

impl FloorData {
    /// Penetrations `y0 − y` of the feet (positive pressed in): minus the
    /// feet's vertical displacements, m.
    fn penetrations(&self, u: &[[f64; 3]]) -> Vec<f64> {
        self.nodes.iter().map(|&n| -u[n][1]).collect()
    }

    /// The feet's normal forces at penetrations `p`, N (≥ 0).
    pub(crate) fn forces(&self, p: &[f64]) -> Vec<f64> {
        match self.single_k {
            Some(k) => vec![if p[0] > 0.0 { k * p[0] } else { 0.0 }],
            None => contact_forces(&self.flex, p),
        }
    }

    /// The feet's normal forces at positions `pos`, N.
    pub(crate) fn forces_at(&self, pos: &[[f64; 3]]) -> Vec<f64> {
        self.forces(&self.penetrations(pos))
    }
}

impl Model {
    /// Value of a dof at positions `pos`.
    fn dof_value(&self, pos: &[[f64; 3]], dof: usize) -> f64 {
        pos[self.dof_node[dof]][self.dof_axis[dof]]
    }

    /// Total potential (strain − work of the loads from the drawn position,
    /// plus the inertia term) and a magnitude scale for judging roundoff, J.
    pub(crate) fn energy(&self, pos: &[[f64; 3]], loads_dof: &[f64], inertia: Option<Inertia<'_>>) -> (f64, f64) {
        let mut phi = 0.0;
        let mut scale = 0.0;
        for m in &self.members {
            let s = member_state(m, pos);
            let u = member_energy(m, &s);
            phi += u;
            scale += u + s.force_n.abs() * s.length_m;
        }
        for f in &self.floors {
            let p = f.penetrations(pos);
            if let Some(k) = f.single_k {
                if p[0] > 0.0 {
                    let u = 0.5 * k * p[0] * p[0];
                    phi += u;
                    scale += u + k * p[0] * p[0];
                }
                continue;
            }
            let force = f.forces(&p);
            let u = 0.5 * force.iter().zip(&p).map(|(a, b)| a * b).sum::<f64>();
            phi += u;
            scale += u + force.iter().zip(&p).map(|(a, b)| a * b.abs()).sum::<f64>();
        }
        for (dof, load) in loads_dof.iter().enumerate() {
            let x = self.dof_value(pos, dof);
            phi -= load * x;
            scale += load.abs() * x.abs();
        }
        if let Some(inn) = inertia {
            for (dof, z) in inn.target_m.iter().enumerate() {
                let m = self.mass_per_dof_kg[dof];
                if m > 0.0 {
                    let x = self.dof_value(pos, dof);
                    let u = 0.5 * inn.scale_per_s2 * m * (x - z) * (x - z);
                    phi += u;
                    scale += u + inn.scale_per_s2 * m * (x - z).abs() * x.abs();
                }
            }
        }
        (phi, scale)
    }

    /// Change of the total potential from `pos` to `pos + step` (one value
    /// per dof), computed from the step itself so that it keeps its relative
    /// accuracy when it is many orders below the total (near equilibrium the
    /// difference of two totals is roundoff), with a magnitude scale of the
    /// summed terms for judging what is left of roundoff, J.
    ///
    /// Per member `ΔL = (2 d·δ + δ·δ) / (L + L')` (d the member vector, δ its
    /// change) and `ΔU = ½ k ΔL (e + e')` while taut on both sides, the
    /// one-sided forms where it goes slack or taut; likewise for floors and
    /// the inertia term; the loads contribute `−f·step` exactly.
    pub(crate) fn energy_change(
        &self,
        pos: &[[f64; 3]],
        step: &[f64],
        loads_dof: &[f64],
        inertia: Option<Inertia<'_>>,
        delta: &mut Vec<[f64; 3]>,
    ) -> (f64, f64) {
        delta.clear();
        delta.resize(pos.len(), [0.0; 3]);
        for (node, dofs) in self.node_dofs.iter().enumerate() {
            for ax in 0..3 {
                if dofs[ax] != NONE {
                    delta[node][ax] = step[dofs[ax]];
                }
            }
        }
        let mut dphi = 0.0;
        let mut scale = 0.0;
        let one_sided = |e0: f64, e1: f64, de: f64, k: f64| -> f64 {
            match (e0 > 0.0, e1 > 0.0) {
                (true, true) => 0.5 * k * de * (e0 + e1),
                (true, false) => -0.5 * k * e0 * e0,
                (false, true) => 0.5 * k * e1 * e1,
                (false, false) => 0.0,
            }
        };
        // the change of a chord's length, accurate when far below the length
        let chord_change = |a: usize, b: usize, d0: [f64; 3]| -> Option<(f64, f64)> {
            let d = chord(pos, a, b, d0).0;
            let dd = [delta[b][0] - delta[a][0], delta[b][1] - delta[a][1], delta[b][2] - delta[a][2]];
            if dd == [0.0; 3] {
                return None;
            }
            let l0 = (d[0] * d[0] + d[1] * d[1] + d[2] * d[2]).sqrt();
            let d1 = [d[0] + dd[0], d[1] + dd[1], d[2] + dd[2]];
            let l1 = (d1[0] * d1[0] + d1[1] * d1[1] + d1[2] * d1[2]).sqrt();
            let num =
                2.0 * (d[0] * dd[0] + d[1] * dd[1] + d[2] * dd[2]) + (dd[0] * dd[0] + dd[1] * dd[1] + dd[2] * dd[2]);
            Some((l0, if l0 + l1 > 0.0 { num / (l0 + l1) } else { 0.0 }))
        };
        for m in &self.members {
            let (l0, dl) = match &m.run {
                Some(run) => {
                    let (mut l0, mut dl, mut moved) = (0.0, 0.0, false);
                    for (&(a, b, w), &d0) in run.segments.iter().zip(&run.chords) {
                        let (na, nb) = (run.nodes[a], run.nodes[b]);
                        match chord_change(na, nb, d0) {
                            Some((l, d)) => {
                                moved = true;
                                l0 += w * l;
                                dl += w * d;
                            }
                            None => l0 += w * chord(pos, na, nb, d0).1,
                        }
                    }
                    if !moved {
                        continue;
                    }
                    (l0, dl)
                }
                None => match chord_change(m.ends[0], m.ends[1], m.d0_m) {
                    Some(v) => v,
                    None => continue,
                },
            };
            let e0 = l0 - m.rest_m;
            let e1 = e0 + dl;
            let du =
                if m.tension_only { one_sided(e0, e1, dl, m.k_n_per_m) } else { 0.5 * m.k_n_per_m * dl * (e0 + e1) };
            dphi += du;
            scale += du.abs() + m.k_n_per_m * dl.abs() * (e0.abs() + e1.abs() + l0 * f64::EPSILON);
        }
        for f in &self.floors {
            if let Some(k) = f.single_k {
                let dy = step[f.dofs[0]];
                if dy == 0.0 {
                    continue;
                }
                let p0 = f.penetrations(pos)[0];
                let p1 = p0 - dy;
                let du = one_sided(p0, p1, -dy, k);
                dphi += du;
                scale += du.abs() + k * dy.abs() * (p0.abs() + p1.abs());
                continue;
            }
            let dp: Vec<f64> = f.dofs.iter().map(|&d| -step[d]).collect();
            if dp.iter().all(|v| *v == 0.0) {
                continue;
            }
            let p0 = f.penetrations(pos);
            let p1: Vec<f64> = p0.iter().zip(&dp).map(|(a, b)| a + b).collect();
            let (f0, f1) = (f.forces(&p0), f.forces(&p1));
            // Φ1 − Φ0 = ½(P0 + P1)·Δp + ½(P1·p0 − P0·p1); the bracket is zero
            // while the contact set stays the same (P = (C_AA)⁻¹ p there, symmetric)
            let dot = |a: &[f64], b: &[f64]| a.iter().zip(b).map(|(x, y)| x * y).sum::<f64>();
            let mut du = 0.5 * f0.iter().zip(&f1).zip(&dp).map(|((a, b), d)| (a + b) * d).sum::<f64>();
            let same = f0.iter().zip(&f1).all(|(a, b)| (*a > 0.0) == (*b > 0.0));
            if !same {
                du += 0.5 * (dot(&f1, &p0) - dot(&f0, &p1));
            }
            dphi += du;
            scale += du.abs()
                + f0.iter()
                    .zip(&f1)
                    .zip(&dp)
                    .zip(&f.nodes)
                    .map(|(((a, b), d), _)| (a.abs() + b.abs()) * d.abs())
                    .sum::<f64>();
        }
        for (l, s) in loads_dof.iter().zip(step) {
            dphi -= l * s;
            scale += (l * s).abs();
        }
        if let Some(inn) = inertia {
            for (dof, z) in inn.target_m.iter().enumerate() {
                let m = self.mass_per_dof_kg[dof];
                if m > 0.0 {
                    let x = self.dof_value(pos, dof);
                    let s = step[dof];
                    let du = 0.5 * inn.scale_per_s2 * m * s * (2.0 * (x - z) + s);
                    dphi += du;
                    scale += du.abs() + inn.scale_per_s2 * m * s.abs() * ((x - z).abs() + x.abs() * f64::EPSILON);
                }
            }
        }
        (dphi, scale)
    }

    /// Gradient of the total potential (= internal − external force) per
    /// dof into `grad`, and per dof the sum of magnitudes of the terms (for
    /// the roundoff floor of the convergence test) into `mag`.
    pub(crate) fn gradient(
        &self,
        pos: &[[f64; 3]],
        loads_dof: &[f64],
        inertia: Option<Inertia<'_>>,
        grad: &mut [f64],
        mag: &mut [f64],
    ) {
        for (g, l) in grad.iter_mut().zip(loads_dof) {
            *g = -l;
        }
        for (m, l) in mag.iter_mut().zip(loads_dof) {
            *m = l.abs();
        }
        for m in &self.members {
            let s = member_state(m, pos);
            let roundoff = s.force_n.abs() + m.k_n_per_m * s.length_m;
            if let Some(run) = &m.run {
                for ((e, _, w), &(a, b, _)) in run_segments(run, pos).zip(&run.segments) {
                    for (node, sign) in [(run.nodes[a], -1.0), (run.nodes[b], 1.0)] {
                        for (&d, c) in self.node_dofs[node].iter().zip(e) {
                            if d != NONE {
                                grad[d] += sign * s.force_n * w * c;
                                mag[d] += roundoff;
                            }
                        }
                    }
                }
                continue;
            }
            for (end, sign) in [(0usize, -1.0), (1usize, 1.0)] {
                let dofs = self.node_dofs[m.ends[end]];
                for (&d, e) in dofs.iter().zip(s.e) {
                    if d != NONE {
                        // Tension pulls end 0 towards end 1 (+e) and end 1 back (−e).
                        grad[d] += sign * s.force_n * e;
                        mag[d] += roundoff;
                    }
                }
            }
        }
        for f in &self.floors {
            let p = f.penetrations(pos);
            if let Some(k) = f.single_k {
                if p[0] > 0.0 {
                    grad[f.dofs[0]] -= k * p[0];
                    mag[f.dofs[0]] += k * p[0];
                }
                continue;
            }
            let force = f.forces(&p);
            for (i, &d) in f.dofs.iter().enumerate() {
                if force[i] > 0.0 {
                    grad[d] -= force[i];
                    mag[d] += force[i];
                }
            }
        }
        if let Some(inn) = inertia {
            for (dof, z) in inn.target_m.iter().enumerate() {
                let m = self.mass_per_dof_kg[dof];
                if m > 0.0 {
                    let x = self.dof_value(pos, dof);
                    grad[dof] += inn.scale_per_s2 * m * (x - z);
                    mag[dof] += inn.scale_per_s2 * m * (x.abs() + z.abs());
                }
            }
        }
    }

    /// Tangent stiffness (lower triangle) at `pos` into `values` (the value
    /// array of [`Model::matrix`]'s pattern).
    pub(crate) fn tangent(&self, pos: &[[f64; 3]], inertia: Option<Inertia<'_>>, values: &mut [f64]) {
        values.fill(0.0);
        for (m, slots) in self.members.iter().zip(&self.member_slots) {
            if let Some(run) = &m.run {
                run_tangent(m, run, pos, values);
                continue;
            }
            let s = member_state(m, pos);
            let kmat = if s.material { m.k_n_per_m } else { 0.0 };
            let kgeo = if s.length_m > 0.0 { s.force_n / s.length_m } else { 0.0 };
            if kmat == 0.0 && kgeo == 0.0 {
                continue;
            }
            let mut kb = [[0.0; 3]; 3];
            for (i, row) in kb.iter_mut().enumerate() {
                for (j, v) in row.iter_mut().enumerate() {
                    let ee = s.e[i] * s.e[j];
                    let id = if i == j { 1.0 } else { 0.0 };
                    *v = kmat * ee + kgeo * (id - ee);
                }
            }
            for p in 0..6 {
                for q in 0..6 {
                    let slot = slots[p * 6 + q];
                    if slot != NONE {
                        let sign = if (p < 3) == (q < 3) { 1.0 } else { -1.0 };
                        values[slot] += sign * kb[p % 3][q % 3];
                    }
                }
            }
        }
        for f in &self.floors {
            let p = f.penetrations(pos);
            if let Some(k) = f.single_k {
                if p[0] >= 0.0 {
                    values[self.diag_slots[f.dofs[0]]] += k;
                }
                continue;
            }
            let force = f.forces(&p);
            let active: Vec<usize> =
                in_contact(&f.flex, &p, &force).iter().enumerate().filter(|(_, a)| **a).map(|(i, _)| i).collect();
            let (n, m) = (f.nodes.len(), active.len());
            let sub: Vec<f64> = active.iter().flat_map(|&r| active.iter().map(move |&c| f.flex[r * n + c])).collect();
            let Some(k) = crate::library::dense::inverse(&sub, m) else { continue };
            for (a, &i) in active.iter().enumerate() {
                for (b, &j) in active.iter().enumerate() {
                    // each lower-triangle slot once: (i, j) with dof_i ≥ dof_j
                    if f.dofs[i] >= f.dofs[j] {
                        values[f.slots[i * n + j]] += k[a * m + b];
                    }
                }
            }
        }
        if let Some(inn) = inertia {
            for (dof, &m) in self.mass_per_dof_kg.iter().enumerate() {
                if m > 0.0 {
                    values[self.diag_slots[dof]] += inn.scale_per_s2 * m;
                }
            }
        }
    }
}

/// A rope's tangent into `values`: the material term `κ g gᵀ` with
/// `g = ∂Λ/∂x` (each segment adds `± w_i e_i` at its two nodes), which
/// couples every node of the path, plus each segment's geometric term
/// `(T w_i / L_i)(I − e_i e_iᵀ)`.
fn run_tangent(m: &MemberData, run: &RunData, pos: &[[f64; 3]], values: &mut [f64]) {
    let s = member_state(m, pos);
    let n = 3 * run.nodes.len();
    let mut g = vec![0.0; n];
    let mut block = vec![0.0; n * n];
    for ((e, l, w), &(a, b, _)) in run_segments(run, pos).zip(&run.segments) {
        for ax in 0..3 {
            g[3 * a + ax] -= w * e[ax];
            g[3 * b + ax] += w * e[ax];
        }
        let kgeo = if l > 0.0 { s.force_n * w / l } else { 0.0 };
        if kgeo == 0.0 {
            continue;
        }
        for i in 0..3 {
            for j in 0..3 {
                let v = kgeo * (if i == j { 1.0 } else { 0.0 } - e[i] * e[j]);
                block[(3 * a + i) * n + 3 * a + j] += v;
                block[(3 * b + i) * n + 3 * b + j] += v;
                block[(3 * a + i) * n + 3 * b + j] -= v;
                block[(3 * b + i) * n + 3 * a + j] -= v;
            }
        }
    }
    if s.material {
        for p in 0..n {
            for q in 0..n {
                block[p * n + q] += m.k_n_per_m * g[p] * g[q];
            }
        }
    }
    for (slot, v) in run.slots.iter().zip(&block) {
        if *slot != NONE {
            values[*slot] += v;
        }
    }
}

#[cfg(test)]
mod rope_kernel_tests {
    use crate::solve::model::Model;
    use crate::solve::{AxialLaw, Fixity, NetMember, NetNode, Network};

    /// A rope from anchor A over free sheave nodes K and M to anchor B, with
    /// a bearing factor on the first span, stretched (taut) at the start.
    fn rope_net() -> Network {
        let node = |name: &str, p: [f64; 3], fixity| NetNode {
            name: name.into(),
            position_m: p,
            fixity,
            load_n: [0.0, -2e3, 0.0],
            mass_kg: 0.0,
        };
        let mut rope = NetMember::straight("r", [0, 3], 1e6, 8.0, AxialLaw::TensionOnly);
        rope.via = vec![1, 2];
        rope.segment_factors = vec![1.0 / 1.09, 1.0, 1.0];
        Network {
            nodes: vec![
                node("A", [0.0, 5.0, 0.0], Fixity::Fixed),
                node("K", [1.0, 2.0, 0.3], Fixity::Free),
                node("M", [2.2, 2.5, -0.2], Fixity::Free),
                node("B", [3.0, 5.0, 0.5], Fixity::Fixed),
            ],
            members: vec![rope],
            plates: Vec::new(),
        }
    }

    // The rope's potential ½κ(Λ − Λ0)², its gradient and its tangent agree:
    // the step-wise energy change equals the difference of totals (1e-9),
    // the gradient equals the central difference of the energy (1e-6: O(h²)
    // with h = 1e-7 m) and the tangent the central difference of the
    // gradient (1e-5, same reason).
    #[test]
    fn energy_gradient_and_tangent_agree() {
        let net = rope_net();
        let model = Model::new(&net).expect("model");
        let n = model.n_dofs();
        let loads = vec![-2e3 / 3.0; n];
        let mut pos0: Vec<[f64; 3]> = net.nodes.iter().map(|x| x.position_m).collect();
        pos0[1] = [1.1, 1.0, 0.4];
        pos0[2] = [2.3, 1.2, -0.3];
        // the kernels' state is the displacement from the drawing
        let pos0: Vec<[f64; 3]> = model.start_positions(Some(&pos0));
        let e = |p: &[[f64; 3]]| model.energy(p, &loads, None).0;
        let mut delta = Vec::new();
        let step: Vec<f64> = (0..n).map(|k| 1e-3 * (k as f64 + 1.0).sin()).collect();
        let mut pos1 = pos0.clone();
        model.add_step(&pos0, &step, &mut pos1);
        let (d, _) = model.energy_change(&pos0, &step, &loads, None, &mut delta);
        let diff = e(&pos1) - e(&pos0);
        assert!(((d - diff) / diff).abs() < 1e-9, "{d} vs {diff}");

        let grad = |p: &[[f64; 3]]| {
            let (mut g, mut mag) = (vec![0.0; n], vec![0.0; n]);
            model.gradient(p, &loads, None, &mut g, &mut mag);
            g
        };
        let g0 = grad(&pos0);
        let mut values = vec![0.0; model.matrix.val().len()];
        model.tangent(&pos0, None, &mut values);
        let sym = model.matrix.symbolic();
        let at = |r: usize, c: usize| -> f64 {
            let (r, c) = (r.max(c), r.min(c));
            let (lo, hi) = (sym.col_ptr()[c], sym.col_ptr()[c + 1]);
            sym.row_idx()[lo..hi].iter().position(|&x| x == r).map_or(0.0, |p| values[lo + p])
        };
        let h = 1e-7;
        let scale = values.iter().fold(0.0_f64, |a, v| a.max(v.abs()));
        for k in 0..n {
            let mut s = vec![0.0; n];
            s[k] = h;
            let (mut p, mut m) = (pos0.clone(), pos0.clone());
            model.add_step(&pos0, &s, &mut p);
            let minus: Vec<f64> = s.iter().map(|v| -v).collect();
            model.add_step(&pos0, &minus, &mut m);
            let fd = (e(&p) - e(&m)) / (2.0 * h);
            assert!(
                (fd - g0[k]).abs() < 1e-6 * g0.iter().fold(0.0_f64, |a, v| a.max(v.abs())),
                "dof {k}: {fd} vs {}",
                g0[k]
            );
            let (gp, gm) = (grad(&p), grad(&m));
            for r in 0..n {
                let col = (gp[r] - gm[r]) / (2.0 * h);
                assert!((col - at(r, k)).abs() < 1e-5 * scale, "K[{r},{k}]: {col} vs {}", at(r, k));
            }
        }
    }
}
