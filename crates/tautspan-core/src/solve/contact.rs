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
            let idx: Vec<usize> = (0..n).filter(|&k| free[k]).collect();
            let m = idx.len();
            let sub: Vec<f64> = idx.iter().flat_map(|&r| idx.iter().map(move |&c| flex[r * n + c])).collect();
            let Some(l) = cholesky(&sub, m) else { return force };
            let mut rhs: Vec<f64> = idx.iter().map(|&r| p[r]).collect();
            solve_in_place(&l, m, &mut rhs);
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
}
