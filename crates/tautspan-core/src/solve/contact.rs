//! Contact of the feet on one floor panel: with the plate's flexibility C
//! at the feet and each foot's penetration p (drawn height − height, how
//! far the rig would push the foot into the undeflected floor), find the
//! feet's forces P ≥ 0 with the plate's deflection w = C P meeting every
//! foot in contact (w_i = p_i where P_i > 0) and lying below every lifted
//! one (w_i ≥ p_i where P_i = 0). This is the minimum of
//! `½ Pᵀ C P − pᵀ P` over P ≥ 0 (C symmetric positive definite, so the
//! minimum is unique), found by the Lawson–Hanson active-set method
//! (Lawson & Hanson, *Solving Least Squares Problems*, 1974, ch. 23, in its
//! quadratic-programme form). The plate's potential as the rig sees it is
//! `Φ(p) = ½ P·p`; its gradient in p is P and its Hessian, on the set of
//! feet in contact A, `(C_AA)⁻¹`.

use crate::library::dense::{cholesky, solve_in_place};

/// Forces P ≥ 0 of the feet (N) for penetrations `p` (m), `flex` row-major n × n.
pub(crate) fn contact_forces(flex: &[f64], p: &[f64]) -> Vec<f64> {
    let n = p.len();
    let mut force = vec![0.0; n];
    if p.iter().all(|v| *v <= 0.0) {
        return force;
    }
    let scale = p.iter().fold(0.0_f64, |m, v| m.max(v.abs()));
    let tol = 1e-13 * scale;
    let mut free = vec![false; n];
    let mut z = vec![0.0; n];
    warm_start(flex, p, &mut free, &mut force);
    for _ in 0..(4 * n + 8) {
        // gradient of ½PᵀCP − pᵀP at the bound variables
        let mut pick = None;
        let mut most = -tol;
        for i in (0..n).filter(|&i| !free[i]) {
            let g: f64 = (0..n).map(|j| flex[i * n + j] * force[j]).sum::<f64>() - p[i];
            if g < most {
                most = g;
                pick = Some(i);
            }
        }
        let Some(i) = pick else { break };
        free[i] = true;
        for _ in 0..(n + 2) {
            let Some((idx, rhs)) = solve_on_free(flex, p, &free) else { return force };
            z.fill(0.0);
            for (&k, v) in idx.iter().zip(&rhs) {
                z[k] = *v;
            }
            if idx.iter().all(|&k| z[k] > 0.0) {
                force.copy_from_slice(&z);
                break;
            }
            let mut alpha = 1.0_f64;
            for &k in &idx {
                if z[k] <= 0.0 {
                    let d = force[k] - z[k];
                    if d > 0.0 {
                        alpha = alpha.min(force[k] / d);
                    } else {
                        alpha = 0.0;
                    }
                }
            }
            for &k in &idx {
                force[k] += alpha * (z[k] - force[k]);
                if force[k] <= 0.0 || (z[k] <= 0.0 && force[k] <= 1e-15 * scale) {
                    force[k] = 0.0;
                    free[k] = false;
                }
            }
            if !free.iter().any(|f| *f) {
                break;
            }
        }
    }
    force
}

/// The feet in contact `free` (indices, ascending) and their forces with
/// the plate meeting each of them: `C_FF P_F = p_F`. `None` where `C_FF`
/// does not factor.
fn solve_on_free(flex: &[f64], p: &[f64], free: &[bool]) -> Option<(Vec<usize>, Vec<f64>)> {
    let n = p.len();
    let idx: Vec<usize> = (0..n).filter(|&k| free[k]).collect();
    let m = idx.len();
    let sub: Vec<f64> = idx.iter().flat_map(|&r| idx.iter().map(move |&c| flex[r * n + c])).collect();
    let l = cholesky(&sub, m)?;
    let mut rhs: Vec<f64> = idx.iter().map(|&r| p[r]).collect();
    solve_in_place(&l, m, &mut rhs);
    Some((idx, rhs))
}

/// A feasible start for the active-set method, so a floor whose feet all
/// press (the usual case) costs one factorisation instead of one per foot:
/// take the feet pressed into the undeflected floor as the contact set,
/// solve `C_SS P_S = p_S`, drop the feet that come out pulling, and repeat
/// until every foot in the set pushes. That force (zero off the set) is
/// feasible and optimal on its set, which is where the method may start;
/// its outer loop then adds any foot still wrongly off. Where the set
/// empties or a factorisation fails, the method starts from zero as before.
fn warm_start(flex: &[f64], p: &[f64], free: &mut [bool], force: &mut [f64]) {
    let n = p.len();
    for (f, v) in free.iter_mut().zip(p) {
        *f = *v > 0.0;
    }
    for _ in 0..=n {
        if !free.iter().any(|f| *f) {
            break;
        }
        let Some((idx, rhs)) = solve_on_free(flex, p, free) else { break };
        if rhs.iter().all(|v| *v > 0.0) {
            for (&k, v) in idx.iter().zip(&rhs) {
                force[k] = *v;
            }
            return;
        }
        for (&k, v) in idx.iter().zip(&rhs) {
            if *v <= 0.0 {
                free[k] = false;
            }
        }
    }
    free.fill(false);
    force.fill(0.0);
}

/// Which feet are in contact: a positive force, or touching with no gap
/// (`(C P)_i ≥ p_i` fails only by roundoff), so a foot that just meets the
/// floor stiffens the tangent as a single spring at zero penetration does.
pub(crate) fn in_contact(flex: &[f64], p: &[f64], force: &[f64]) -> Vec<bool> {
    let n = p.len();
    (0..n)
        .map(|i| {
            if force[i] > 0.0 {
                return true;
            }
            let w: f64 = (0..n).map(|j| flex[i * n + j] * force[j]).sum();
            p[i] >= w
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn check_complementarity(flex: &[f64], p: &[f64], f: &[f64]) {
        let n = p.len();
        for i in 0..n {
            let w: f64 = (0..n).map(|j| flex[i * n + j] * f[j]).sum();
            assert!(f[i] >= 0.0);
            if f[i] > 0.0 {
                assert!((w - p[i]).abs() < 1e-12 * p.iter().fold(0.0_f64, |m, v| m.max(v.abs())), "{i}: {w} {}", p[i]);
            } else {
                assert!(w >= p[i] - 1e-15, "{i}: lifted foot below the plate: {w} < {}", p[i]);
            }
        }
    }

    // All feet pressed: P = C⁻¹ p (checked by C P = p). One foot pulled up
    // past the plate's own deflection there: it lifts off, and the plate
    // under it still deflects from the others (w_i > p_i). The conditions
    // are the contact problem's definition (Signorini), so the check is exact
    // up to roundoff.
    #[test]
    fn contact_and_lift_off() {
        let flex = [2.0e-6, 0.8e-6, 0.3e-6, 0.8e-6, 1.5e-6, 0.5e-6, 0.3e-6, 0.5e-6, 1.8e-6];
        let p = [3.0e-3, 2.5e-3, 2.0e-3];
        let f = contact_forces(&flex, &p);
        assert!(f.iter().all(|v| *v > 0.0));
        check_complementarity(&flex, &p, &f);
        let p = [3.0e-3, 2.5e-3, -1.0e-3];
        let f = contact_forces(&flex, &p);
        assert_eq!(f[2], 0.0);
        check_complementarity(&flex, &p, &f);
        // a foot with a small positive penetration can still lift: the others
        // press the plate down further than it
        let p = [3.0e-3, 2.5e-3, 0.2e-3];
        let f = contact_forces(&flex, &p);
        assert_eq!(f[2], 0.0);
        check_complementarity(&flex, &p, &f);
        assert_eq!(in_contact(&flex, &p, &f), vec![true, true, false]);
        assert_eq!(contact_forces(&flex, &[-1.0, -2.0, 0.0]), vec![0.0; 3]);
    }

    // 64 feet on a 6 m simply supported panel (its flexibility from the
    // plate kernel), the rig tilted so that it presses one side in and
    // pulls the other up: the warm start takes the pressed feet, drops
    // those that pull, and the active-set loop finishes. The answer meets
    // the contact conditions (exact up to roundoff), some feet lift and
    // some press, and every foot pressed clear of the plate lifts.
    #[test]
    fn many_feet_tilted_meet_the_contact_conditions() {
        let pts: Vec<[f64; 2]> = (0..64).map(|k| [0.6 + 0.68 * (k % 8) as f64, 0.6 + 0.68 * (k / 8) as f64]).collect();
        let flex = crate::library::navier_flexibility_matrix([6.0, 6.0], 5.0e7, &pts, 200);
        for tilt in [0.0, 0.5e-3, 2.0e-3] {
            let p: Vec<f64> = pts.iter().map(|q| 1.0e-3 - tilt * (q[0] - 3.0)).collect();
            let f = contact_forces(&flex, &p);
            check_complementarity(&flex, &p, &f);
            assert!(f.iter().any(|v| *v > 0.0));
            if tilt >= 2.0e-3 {
                assert!(f.contains(&0.0), "a steep tilt lifts the far side");
            }
            for (pi, fi) in p.iter().zip(&f) {
                if *pi <= 0.0 {
                    assert_eq!(*fi, 0.0);
                }
            }
        }
    }
}

#[cfg(test)]
mod kernel_tests {
    use crate::solve::model::Model;
    use crate::solve::{Fixity, NetNode, NetPlate, Network};

    fn plate_net() -> Network {
        let flex = vec![2.0e-6, 0.8e-6, 0.8e-6, 1.5e-6];
        let foot = |name: &str, x: f64, k: f64| NetNode {
            name: name.into(),
            position_m: [x, 0.0, 0.0],
            fixity: Fixity::Floor { stiffness_n_per_m: k },
            load_n: [0.0, -1e3, 0.0],
            mass_kg: 0.0,
        };
        Network {
            nodes: vec![foot("a", 0.0, 1.0 / 2.0e-6), foot("b", 1.0, 1.0 / 1.5e-6)],
            members: Vec::new(),
            plates: vec![NetPlate { name: "slab".into(), nodes: vec![0, 1], flexibility_m_per_n: flex }],
        }
    }

    // The plate's potential, its gradient and its tangent agree with each
    // other: the step-wise energy change equals the difference of totals
    // (also across a change of the contact set), the gradient equals the
    // central difference of the energy (1e-6: O(h²) with h = 1e-9 m), and the
    // tangent equals the difference of gradients inside one contact set
    // (exact for a quadratic: 1e-6 for roundoff).
    #[test]
    fn energy_gradient_and_tangent_agree() {
        let net = plate_net();
        let model = Model::new(&net).expect("model");
        let loads = [-1e3, -1e3];
        // displacements from the drawing (the kernels' state)
        let pos0 = vec![[0.0, -3.0e-3, 0.0], [0.0, -2.0e-3, 0.0]];
        let e = |p: &[[f64; 3]]| model.energy(p, &loads, None).0;
        let mut delta = Vec::new();
        for step in [[-1.0e-4, 2.0e-4], [1.0e-3, 2.4e-3]] {
            let mut pos1 = pos0.clone();
            model.add_step(&pos0, &step, &mut pos1);
            let (d, _) = model.energy_change(&pos0, &step, &loads, None, &mut delta);
            let diff = e(&pos1) - e(&pos0);
            assert!(((d - diff) / diff).abs() < 1e-9, "step {step:?}: {d} vs {diff}");
        }
        let (mut g, mut mag) = (vec![0.0; 2], vec![0.0; 2]);
        model.gradient(&pos0, &loads, None, &mut g, &mut mag);
        let h = 1e-9;
        for k in 0..2 {
            let mut s = [0.0; 2];
            s[k] = h;
            let (mut p, mut m) = (pos0.clone(), pos0.clone());
            model.add_step(&pos0, &s, &mut p);
            model.add_step(&pos0, &[-s[0], -s[1]], &mut m);
            let fd = (e(&p) - e(&m)) / (2.0 * h);
            assert!(((fd - g[k]) / g[k]).abs() < 1e-6, "dof {k}: {fd} vs {}", g[k]);
        }
        let mut values = vec![0.0; model.matrix.val().len()];
        model.tangent(&pos0, None, &mut values);
        let sym = model.matrix.symbolic();
        let at = |r: usize, c: usize| -> f64 {
            let (lo, hi) = (sym.col_ptr()[c], sym.col_ptr()[c + 1]);
            sym.row_idx()[lo..hi].iter().position(|&x| x == r).map_or(0.0, |p| values[lo + p])
        };
        let inv = crate::library::dense::inverse(&net.plates[0].flexibility_m_per_n, 2).expect("SPD");
        assert!((at(0, 0) - inv[0]).abs() < 1e-6 * inv[0]);
        assert!((at(1, 0) - inv[2]).abs() < 1e-6 * inv[0]);
        assert!((at(1, 1) - inv[3]).abs() < 1e-6 * inv[0]);
    }
}
