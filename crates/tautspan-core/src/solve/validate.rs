//! Input checks run before any solve: finite numbers, positive stiffnesses
//! and rest lengths, member ends in range, and the load-path connectivity
//! test (every loaded node must reach a support through members).

use super::error::SolveError;
use super::network::{Fixity, Network};

fn invalid(item: impl Into<String>, reason: impl Into<String>) -> SolveError {
    SolveError::InvalidInput { item: item.into(), reason: reason.into() }
}

fn finite3(v: &[f64; 3]) -> bool {
    v.iter().all(|c| c.is_finite())
}

/// Checks every number of the network; returns the first problem found.
pub(crate) fn validate_network(net: &Network) -> Result<(), SolveError> {
    for node in &net.nodes {
        let item = format!("node {}", node.name);
        if !finite3(&node.position_m) {
            return Err(invalid(item, "position is not a finite number"));
        }
        if !finite3(&node.load_n) {
            return Err(invalid(item, "load is not a finite number"));
        }
        if !node.mass_kg.is_finite() || node.mass_kg < 0.0 {
            return Err(invalid(item, "mass must be finite and not negative"));
        }
        if let Fixity::Floor { stiffness_n_per_m } = node.fixity
            && !(stiffness_n_per_m.is_finite() && stiffness_n_per_m > 0.0)
        {
            return Err(invalid(item, "floor stiffness must be finite and positive"));
        }
    }
    let mut on_plate = vec![false; net.nodes.len()];
    for plate in &net.plates {
        let item = format!("floor {}", plate.name);
        let n = plate.nodes.len();
        if plate.flexibility_m_per_n.len() != n * n {
            return Err(invalid(
                item,
                format!("flexibility has {} entries for {n} feet", plate.flexibility_m_per_n.len()),
            ));
        }
        for &i in &plate.nodes {
            let Some(node) = net.nodes.get(i) else {
                return Err(invalid(item, format!("foot index {i} out of range for {} nodes", net.nodes.len())));
            };
            if !matches!(node.fixity, Fixity::Floor { .. }) {
                return Err(invalid(item, format!("foot {} does not rest on a floor", node.name)));
            }
            if std::mem::replace(&mut on_plate[i], true) {
                return Err(invalid(item, format!("foot {} is on more than one floor panel", node.name)));
            }
        }
        let c = &plate.flexibility_m_per_n;
        let symmetric =
            (0..n).all(|i| (0..n).all(|j| (c[i * n + j] - c[j * n + i]).abs() <= 1e-9 * c[i * n + i].abs()));
        if !c.iter().all(|v| v.is_finite()) || !symmetric || crate::library::dense::cholesky(c, n).is_none() {
            return Err(invalid(item, "flexibility must be finite, symmetric and positive definite"));
        }
    }
    for member in &net.members {
        let item = format!("member {}", member.name);
        let [a, b] = member.ends;
        if a >= net.nodes.len() || b >= net.nodes.len() {
            return Err(invalid(item, format!("end index out of range ({a}, {b}) for {} nodes", net.nodes.len())));
        }
        if a == b {
            return Err(invalid(item, "both ends are the same node"));
        }
        if !(member.axial_stiffness_n.is_finite() && member.axial_stiffness_n > 0.0) {
            return Err(invalid(item, "axial stiffness EA must be finite and positive"));
        }
        if !(member.rest_length_m.is_finite() && member.rest_length_m > 0.0) {
            return Err(invalid(item, "rest length must be finite and positive"));
        }
        if let Some(&v) = member.via.iter().find(|&&v| v >= net.nodes.len()) {
            return Err(invalid(item, format!("sheave index {v} out of range for {} nodes", net.nodes.len())));
        }
        if !member.segment_factors.is_empty() && member.segment_factors.len() != member.via.len() + 1 {
            return Err(invalid(
                item,
                format!("{} segment factors for {} segments", member.segment_factors.len(), member.via.len() + 1),
            ));
        }
        if member.segment_factors.iter().any(|w| !(w.is_finite() && *w > 0.0 && *w <= 1.0)) {
            return Err(invalid(item, "segment factors must lie in (0, 1]"));
        }
        if member.segments().any(|(a, b, _)| a == b) {
            return Err(invalid(item, "two consecutive nodes of its path are the same node"));
        }
    }
    Ok(())
}

/// Checks an array given per node (loads, start positions, velocities).
pub(crate) fn validate_per_node(net: &Network, what: &str, values: &[[f64; 3]]) -> Result<(), SolveError> {
    if values.len() != net.nodes.len() {
        return Err(invalid(what, format!("{} entries given for {} nodes", values.len(), net.nodes.len())));
    }
    for (node, v) in net.nodes.iter().zip(values) {
        if !finite3(v) {
            return Err(invalid(format!("{what} of node {}", node.name), "not a finite number"));
        }
    }
    Ok(())
}

/// Connected components of the member graph: `component[node]` and whether
/// each component contains a support (an anchor or a floor node).
#[derive(Debug, Clone)]
pub(crate) struct Components {
    component: Vec<usize>,
    supported: Vec<bool>,
}

impl Components {
    /// Union–find over the members.
    pub(crate) fn new(net: &Network) -> Self {
        let n = net.nodes.len();
        let mut parent: Vec<usize> = (0..n).collect();
        fn find(parent: &mut [usize], mut i: usize) -> usize {
            while parent[i] != i {
                parent[i] = parent[parent[i]];
                i = parent[i];
            }
            i
        }
        for m in &net.members {
            for (a, b, _) in m.segments() {
                let ra = find(&mut parent, a);
                let rb = find(&mut parent, b);
                if ra != rb {
                    parent[ra] = rb;
                }
            }
        }
        let component: Vec<usize> = (0..n).map(|i| find(&mut parent, i)).collect();
        let mut supported = vec![false; n];
        for (i, node) in net.nodes.iter().enumerate() {
            if !matches!(node.fixity, Fixity::Free) {
                supported[component[i]] = true;
            }
        }
        Self { component, supported }
    }

    /// The first loaded node whose component has no support, as an error.
    pub(crate) fn check_loads(&self, net: &Network, loads_n: &[[f64; 3]]) -> Result<(), SolveError> {
        for (i, load) in loads_n.iter().enumerate() {
            let loaded = load.iter().any(|c| *c != 0.0);
            if loaded && !self.supported[self.component[i]] {
                return Err(SolveError::NoLoadPath { node: net.nodes[i].name.clone() });
            }
        }
        Ok(())
    }
}
