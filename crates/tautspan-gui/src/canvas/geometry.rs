//! The drawing's geometry read from the document: nodes at their drawn
//! positions (with their sheaves), members by their end ids (with their
//! rated parts named), ropes by their paths, masses, and the slabs under floor
//! nodes. Items that do not parse are left out (their fields say why). A
//! drag moves one node a frame, so the geometry can follow such an edit in
//! place instead of being read afresh.

use crate::canvas::view::View;
use egui::{Rect, pos2};
use std::collections::HashMap;
use std::sync::Arc;
use tautspan_core::file::{ScenarioDto, SupportDto};
use tautspan_core::units::{Dimension, Sign, parse_quantity};

/// A node as drawn.
#[derive(Debug, Clone)]
pub struct GeoNode {
    /// Id.
    pub id: String,
    /// Drawn position in the view's plane (u, v), m: (x, y) until projected.
    pub pos_m: [f64; 2],
    /// Drawn position (x, y, z), m.
    pub xyz_m: [f64; 3],
    /// Depth in the view (larger is nearer the viewer).
    pub depth: f64,
    /// How it is held.
    pub support: SupportDto,
    /// Its sheave's tread diameter, m: `None` without a sheave, `Some(None)`
    /// while the diameter does not parse (drawn at the smallest size).
    pub sheave_m: Option<Option<f64>>,
    /// The (x, y, z) text the position was read from: a drag re-reads only what changed.
    read_from: [String; 3],
}

/// A member as drawn.
#[derive(Debug, Clone)]
pub struct GeoMember {
    /// Id.
    pub id: String,
    /// End node ids.
    pub ends: (String, String),
    /// The rated parts in series with it, as written (name or kind, WLL).
    pub parts: Vec<String>,
    /// Where its ends are in `Geometry::nodes`, when both are drawn.
    pub end_at: Option<[usize; 2]>,
}

/// A rope over sheaves as drawn: a polyline through its path.
#[derive(Debug, Clone)]
pub struct GeoRope {
    /// Id.
    pub id: String,
    /// The node ids it runs through, end to end.
    pub path: Vec<String>,
}

impl GeoRope {
    /// Its spans as pairs of node ids, in path order.
    pub fn spans(&self) -> impl Iterator<Item = (&str, &str)> {
        self.path.windows(2).map(|w| (w[0].as_str(), w[1].as_str()))
    }
}

/// A mass as drawn.
#[derive(Debug, Clone)]
pub struct GeoMass {
    /// Id.
    pub id: String,
    /// Node id.
    pub at: String,
    /// Mass, kg, when it parses.
    pub kg: Option<f64>,
    /// The text `kg` was read from.
    read_from: String,
}

/// A slab under a floor node.
#[derive(Debug, Clone)]
pub struct GeoFloor {
    /// The slab's id.
    pub floor_id: String,
    /// The floor node's id.
    pub node_id: String,
    /// The node's position in the view's plane, m.
    pub at_m: [f64; 2],
    /// The node's position (x, y, z), m.
    pub xyz_m: [f64; 3],
    /// Span along x, m.
    pub span_m: f64,
    /// Span along z, m.
    pub span_z_m: f64,
    /// The panel's corner of least x and z, m: the file's `origin`, or
    /// where the core puts a panel without one (centred under its feet).
    pub origin_m: [f64; 2],
    /// Thickness, m.
    pub thickness_m: f64,
}

impl GeoFloor {
    /// The slab's rectangle on screen: in elevation and side its section
    /// under the node (thickness at least 8 points so it reads), in plan
    /// its panel; in the orbit a small square at the node (the panel is
    /// drawn there as a projected outline, `panel_corners`).
    pub fn rect_screen(&self, view: &View) -> Rect {
        use crate::canvas::view::ViewKind;
        let t = ((self.thickness_m * view.px_per_m) as f32).max(8.0);
        match view.kind {
            ViewKind::Plan => {
                let [x0, z0] = self.origin_m;
                let a = view.to_screen(x0, -z0);
                let b = view.to_screen(x0 + self.span_m, -(z0 + self.span_z_m));
                return Rect::from_two_pos(a, b);
            }
            ViewKind::Side => {
                let left = view.to_screen(self.at_m[0] - self.span_z_m / 2.0, self.at_m[1]);
                let right = view.to_screen(self.at_m[0] + self.span_z_m / 2.0, self.at_m[1]);
                return Rect::from_min_max(pos2(left.x, left.y), pos2(right.x, right.y + t));
            }
            ViewKind::Orbit => {
                return Rect::from_center_size(view.to_screen(self.at_m[0], self.at_m[1]), egui::vec2(8.0, 8.0));
            }
            ViewKind::Elevation => {}
        }
        let left = view.to_screen(self.at_m[0] - self.span_m / 2.0, self.at_m[1]);
        let right = view.to_screen(self.at_m[0] + self.span_m / 2.0, self.at_m[1]);
        Rect::from_min_max(pos2(left.x, left.y), pos2(right.x, right.y + t))
    }
}

impl GeoFloor {
    /// The panel's four corners at the node's height, on screen (for the orbit).
    pub fn panel_corners(&self, view: &View) -> [egui::Pos2; 4] {
        let [x0, z0] = self.origin_m;
        let (x1, z1) = (x0 + self.span_m, z0 + self.span_z_m);
        let y = self.xyz_m[1];
        [[x0, y, z0], [x1, y, z0], [x1, y, z1], [x0, y, z1]].map(|p| view.to_screen_xyz(p))
    }
}

/// The drawing's geometry, read from the document.
#[derive(Debug, Clone, Default)]
pub struct Geometry {
    /// Nodes whose positions parse.
    pub nodes: Vec<GeoNode>,
    /// Members (shared between the drawn and the projected geometry).
    pub members: Arc<Vec<GeoMember>>,
    /// The order members are painted in, far to near in the orbit (indices
    /// into `members`); empty: as listed.
    order: Vec<usize>,
    /// Ropes over sheaves.
    pub ropes: Vec<GeoRope>,
    /// Masses.
    pub masses: Arc<Vec<GeoMass>>,
    /// Slabs under floor nodes.
    pub floors: Vec<GeoFloor>,
    /// Node index by id.
    index: Arc<HashMap<String, usize>>,
}

fn len(text: &str) -> Option<f64> {
    parse_quantity(text, Dimension::Length, Sign::Any).ok()
}

/// A node's (x, y, z), m (z absent is 0), when it parses.
fn xyz_of(n: &tautspan_core::file::NodeDto) -> Option<[f64; 3]> {
    let z = match &n.at.z {
        Some(z) => len(&z.0)?,
        None => 0.0,
    };
    Some([len(&n.at.x.0)?, len(&n.at.y.0)?, z])
}

fn mass_kg(text: &str) -> Option<f64> {
    parse_quantity(text, Dimension::Mass, Sign::Positive).ok()
}

/// A node's position as written (z empty when not given).
fn read_from(n: &tautspan_core::file::NodeDto) -> [String; 3] {
    [n.at.x.0.clone(), n.at.y.0.clone(), n.at.z.as_ref().map_or_else(String::new, |q| q.0.clone())]
}

fn sheave_of(n: &tautspan_core::file::NodeDto) -> Option<Option<f64>> {
    n.sheave.as_ref().map(|s| parse_quantity(&s.diameter.0, Dimension::Length, Sign::Positive).ok())
}

fn ropes_of(dto: &ScenarioDto) -> Vec<GeoRope> {
    dto.ropes.iter().map(|r| GeoRope { id: r.id.clone(), path: r.path.clone() }).collect()
}

fn parts_of(fittings: &[tautspan_core::file::FittingDto]) -> Vec<String> {
    fittings.iter().map(crate::panels::inspector::parts::describe).collect()
}

/// The slabs under the floor nodes.
fn floors_of(nodes: &[GeoNode], dto: &ScenarioDto) -> Vec<GeoFloor> {
    nodes
        .iter()
        .filter_map(|n| {
            let SupportDto::Floor(fid) = &n.support else { return None };
            let f = dto.floors.iter().find(|f| &f.id == fid)?;
            let span_m = len(&f.span.0.0).unwrap_or(1.0).abs();
            let span_z_m = len(&f.span.1.0).unwrap_or(1.0).abs();
            // the panel's corner: the file's origin, or centred under its feet as the core places it
            let origin_m = f.origin.as_ref().and_then(|(x, z)| Some([len(&x.0)?, len(&z.0)?])).unwrap_or_else(|| {
                let feet: Vec<&GeoNode> = nodes.iter().filter(|m| m.support == n.support).collect();
                let k = feet.len().max(1) as f64;
                let cx = feet.iter().map(|m| m.xyz_m[0]).sum::<f64>() / k;
                let cz = feet.iter().map(|m| m.xyz_m[2]).sum::<f64>() / k;
                [cx - span_m / 2.0, cz - span_z_m / 2.0]
            });
            Some(GeoFloor {
                floor_id: fid.clone(),
                node_id: n.id.clone(),
                at_m: n.pos_m,
                xyz_m: n.xyz_m,
                span_m,
                span_z_m,
                origin_m,
                thickness_m: len(&f.thickness.0).unwrap_or(0.15).abs(),
            })
        })
        .collect()
}

impl Geometry {
    /// Read the geometry of a document (items that do not parse are left out).
    pub fn of(dto: &ScenarioDto) -> Geometry {
        let nodes: Vec<GeoNode> = dto
            .nodes
            .iter()
            .filter_map(|n| {
                let xyz_m = xyz_of(n)?;
                Some(GeoNode {
                    id: n.id.clone(),
                    pos_m: [xyz_m[0], xyz_m[1]],
                    xyz_m,
                    depth: xyz_m[2],
                    support: n.support.clone(),
                    sheave_m: sheave_of(n),
                    read_from: read_from(n),
                })
            })
            .collect();
        let floors = floors_of(&nodes, dto);
        let index: HashMap<String, usize> = nodes.iter().enumerate().map(|(i, n)| (n.id.clone(), i)).collect();
        let members = dto
            .members
            .iter()
            .map(|m| GeoMember {
                id: m.id.clone(),
                ends: m.ends.clone(),
                parts: parts_of(&m.fittings),
                end_at: index.get(&m.ends.0).zip(index.get(&m.ends.1)).map(|(&a, &b)| [a, b]),
            })
            .collect();
        Geometry {
            index: Arc::new(index),
            members: Arc::new(members),
            order: Vec::new(),
            ropes: ropes_of(dto),
            masses: Arc::new(
                dto.masses
                    .iter()
                    .map(|m| GeoMass {
                        id: m.id.clone(),
                        at: m.at.clone(),
                        kg: mass_kg(&m.mass.0),
                        read_from: m.mass.0.clone(),
                    })
                    .collect(),
            ),
            nodes,
            floors,
        }
    }

    /// Bring the geometry up to an edit of `dto` that moved things but kept
    /// the same nodes, members and masses (a drag, a typed coordinate or
    /// mass): positions are read again, nothing else is rebuilt. False, with
    /// nothing changed, when the items themselves changed.
    pub fn follow(&mut self, dto: &ScenarioDto) -> bool {
        let same = self.nodes.len() == dto.nodes.len()
            && self.nodes.iter().zip(&dto.nodes).all(|(g, n)| g.id == n.id && g.support == n.support)
            && self.members.len() == dto.members.len()
            && self.members.iter().zip(&dto.members).all(|(g, m)| g.id == m.id && g.ends == m.ends)
            && self.ropes.len() == dto.ropes.len()
            && self.ropes.iter().zip(&dto.ropes).all(|(g, r)| g.id == r.id && g.path == r.path)
            && self.masses.len() == dto.masses.len()
            && self.masses.iter().zip(&dto.masses).all(|(g, m)| g.id == m.id && g.at == m.at);
        if !same {
            return false;
        }
        // only the coordinates whose text changed are read again (a drag
        // changes one node's; reading all of a large net's costs a frame)
        let mut moved = Vec::new();
        for (k, (g, n)) in self.nodes.iter().zip(&dto.nodes).enumerate() {
            let z_text = n.at.z.as_ref().map_or("", |q| q.0.as_str());
            if g.read_from[0] != n.at.x.0 || g.read_from[1] != n.at.y.0 || g.read_from[2] != z_text {
                let Some(p) = xyz_of(n) else { return false };
                moved.push((k, p));
            }
        }
        for (k, p) in moved {
            let (g, n) = (&mut self.nodes[k], &dto.nodes[k]);
            g.pos_m = [p[0], p[1]];
            g.xyz_m = p;
            g.depth = p[2];
            g.read_from = read_from(n);
        }
        for (g, n) in self.nodes.iter_mut().zip(&dto.nodes) {
            // a sheave added, removed or resized in place
            if g.sheave_m.is_some() || n.sheave.is_some() {
                g.sheave_m = sheave_of(n);
            }
        }
        // masses and members are shared with the projected copy: copied
        // only when one of them changed
        if self.masses.iter().zip(&dto.masses).any(|(g, m)| g.read_from != m.mass.0) {
            for (g, m) in Arc::make_mut(&mut self.masses).iter_mut().zip(&dto.masses) {
                if g.read_from != m.mass.0 {
                    g.kg = mass_kg(&m.mass.0);
                    g.read_from.clone_from(&m.mass.0);
                }
            }
        }
        // the parts may have been edited in place (a WLL typed)
        if self.members.iter().zip(&dto.members).any(|(g, m)| !(g.parts.is_empty() && m.fittings.is_empty())) {
            for (g, m) in Arc::make_mut(&mut self.members).iter_mut().zip(&dto.members) {
                if !(g.parts.is_empty() && m.fittings.is_empty()) {
                    g.parts = parts_of(&m.fittings);
                }
            }
        }
        self.floors = floors_of(&self.nodes, dto);
        true
    }

    /// The members with their indices, in the order they are painted (far
    /// to near in the orbit).
    pub fn members_in_order(&self) -> impl Iterator<Item = (usize, &GeoMember)> {
        let natural = self.order.is_empty().then_some(0..self.members.len());
        natural.into_iter().flatten().chain(self.order.iter().copied()).map(|k| (k, &self.members[k]))
    }

    /// A member's two ends, when both are drawn.
    pub fn ends(&self, m: &GeoMember) -> Option<(&GeoNode, &GeoNode)> {
        let [a, b] = m.end_at?;
        Some((self.nodes.get(a)?, self.nodes.get(b)?))
    }

    /// The geometry as `view` shows it: every position in the view's plane,
    /// and in the orbit the members and ropes ordered far to near, so the
    /// near ones are painted over the far ones.
    pub fn projected(&self, view: &View) -> Geometry {
        let mut out = self.clone();
        for n in &mut out.nodes {
            (n.pos_m, n.depth) = view.project(n.xyz_m);
        }
        for f in &mut out.floors {
            f.at_m = view.project(f.xyz_m).0;
        }
        if view.kind == crate::canvas::view::ViewKind::Orbit {
            let depth = |m: &GeoMember| m.end_at.map_or(0.0, |[a, b]| out.nodes[a].depth + out.nodes[b].depth);
            let mut order: Vec<(f64, usize)> = out.members.iter().enumerate().map(|(k, m)| (depth(m), k)).collect();
            order.sort_by(|a, b| a.0.total_cmp(&b.0));
            out.order = order.into_iter().map(|(_, k)| k).collect();
            let rope_depth = |r: &GeoRope| {
                r.path.iter().filter_map(|id| out.node(id)).map(|n| n.depth).sum::<f64>() / r.path.len().max(1) as f64
            };
            let mut ropes: Vec<(f64, GeoRope)> = out.ropes.iter().map(|r| (rope_depth(r), r.clone())).collect();
            ropes.sort_by(|a, b| a.0.total_cmp(&b.0));
            out.ropes = ropes.into_iter().map(|(_, r)| r).collect();
        }
        out
    }

    /// Where a node is in `nodes`, by id.
    pub fn node_index(&self, id: &str) -> Option<usize> {
        self.index.get(id).copied()
    }

    /// A node by id.
    pub fn node(&self, id: &str) -> Option<&GeoNode> {
        self.index.get(id).and_then(|&i| self.nodes.get(i))
    }

    /// The drawing's extent, m, slabs included.
    pub fn bounds(&self) -> Option<([f64; 2], [f64; 2])> {
        let mut pts: Vec<[f64; 2]> = self.nodes.iter().map(|n| n.pos_m).collect();
        for f in &self.floors {
            pts.push([f.at_m[0] - f.span_m / 2.0, f.at_m[1] - f.thickness_m]);
            pts.push([f.at_m[0] + f.span_m / 2.0, f.at_m[1]]);
        }
        let first = *pts.first()?;
        let (mut min, mut max) = (first, first);
        for p in pts {
            for k in 0..2 {
                min[k] = min[k].min(p[k]);
                max[k] = max[k].max(p[k]);
            }
        }
        // room below for the masses
        min[1] -= 0.6;
        Some((min, max))
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn geometry_reads_positions_in_any_unit() {
        let dto: ScenarioDto =
            tautspan_core::file::parse_scenario_text(crate::DEMO_SCENARIO).map(|(d, _)| d).unwrap_or_default();
        let g = Geometry::of(&dto);
        assert!(g.nodes.len() >= 2);
        assert!(g.bounds().is_some());
    }

    #[test]
    fn following_a_move_matches_reading_afresh() {
        let mut dto: ScenarioDto =
            tautspan_core::file::parse_scenario_text(crate::DEMO_SCENARIO).map(|(d, _)| d).unwrap_or_default();
        let mut g = Geometry::of(&dto);
        crate::document::edits::move_node(&mut dto, &g.nodes[1].id.clone(), 0.25, 1.75, crate::UnitSystem::Si);
        assert!(g.follow(&dto), "same items: followed in place");
        let fresh = Geometry::of(&dto);
        let pos = |g: &Geometry| g.nodes.iter().map(|n| n.pos_m).collect::<Vec<_>>();
        assert_eq!(pos(&g), pos(&fresh));
        // a mass typed in another unit, then a coordinate that no longer reads
        if let Some(m) = dto.masses.first_mut() {
            m.mass.0 = "2 t".to_string();
            assert!(g.follow(&dto));
            assert_eq!(g.masses[0].kg, Some(2000.0));
        }
        let x0 = g.nodes[0].pos_m;
        dto.nodes[0].at.x.0 = "12 furlongs".to_string();
        assert!(!g.follow(&dto), "a coordinate that does not read: read afresh instead");
        assert_eq!(g.nodes[0].pos_m, x0, "nothing changed by a follow that failed");
        dto.nodes.pop();
        assert!(!g.follow(&dto), "a node removed: read afresh instead");
    }

    #[test]
    fn the_orbit_paints_far_to_near_and_shares_the_members() {
        let dto: ScenarioDto =
            tautspan_core::file::parse_scenario_text(crate::DEMO_SCENARIO).map(|(d, _)| d).unwrap_or_default();
        let g = Geometry::of(&dto);
        let natural: Vec<usize> = g.members_in_order().map(|(k, _)| k).collect();
        assert_eq!(natural, (0..g.members.len()).collect::<Vec<_>>());
        let view = View { kind: crate::canvas::view::ViewKind::Orbit, yaw_deg: 30.0, ..View::default() };
        let p = g.projected(&view);
        assert!(Arc::ptr_eq(&p.members, &g.members), "projecting copies no member");
        let depth = |m: &GeoMember| m.end_at.map_or(0.0, |[a, b]| p.nodes[a].depth + p.nodes[b].depth);
        let order: Vec<f64> = p.members_in_order().map(|(_, m)| depth(m)).collect();
        assert_eq!(order.len(), g.members.len());
        assert!(order.windows(2).all(|w| w[0] <= w[1]), "far to near: {order:?}");
        let mut seen: Vec<usize> = p.members_in_order().map(|(k, _)| k).collect();
        seen.sort_unstable();
        assert_eq!(seen, natural, "every member once");
    }

    #[test]
    fn members_know_where_their_ends_are() {
        let dto: ScenarioDto =
            tautspan_core::file::parse_scenario_text(crate::DEMO_SCENARIO).map(|(d, _)| d).unwrap_or_default();
        let g = Geometry::of(&dto);
        for m in g.members.iter() {
            let (a, b) = g.ends(m).unwrap_or_else(|| panic!("{}", m.id));
            assert_eq!((a.id.as_str(), b.id.as_str()), (m.ends.0.as_str(), m.ends.1.as_str()));
        }
    }
}
