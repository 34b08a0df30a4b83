//! From file types to the validated model: every quantity parsed in its
//! dimension, every reference resolved, every member's stiffness and rating
//! found from the file or the library. Problems are collected (not only the
//! first) and each names its field path; the file layer adds line and column.

use super::build_fittings::{Host, build_fittings, build_rated, build_rated_direction};
use super::build_ropes::{build_ropes, build_sheave};
use super::floor_feet::place_feet;
use super::plausible::{AREA, COORDINATE, DROP_HEIGHT, MASS, MODULUS, Plausible, SECTION_LENGTH};
use super::scenario::{
    Bend, Case, DEFAULT_FRICTION_LIMIT, DesignFactor, Floor, Mass, Member, Node, Rating, Scenario, Strut, Support,
};
use crate::file::{CaseDto, FloorDto, MemberDto, Qty, RatingDto, ScenarioDto, SectionDto, SupportDto};
use crate::library::{BEND_SOURCE, HitchField, ModeFactor, Rules, bend_efficiency, mode_factor};
use crate::library::{
    ChainGrade, Construction, Material, MemberKind, ROPE_GRADES, chain_area_m2, chain_linear_mass_kg_m,
    default_elongation_at_20pct, fibre_axial_stiffness_n, fibre_linear_mass_kg_m, point_stiffness_n_per_m,
    rope_linear_mass_kg_m,
};
use crate::library::{CurveError, Duty, Section, UNSTATED_TERMINATION_EFFICIENCY, curve_for};
use crate::units::{Dimension, Sign, format_number, parse_quantity};
use std::collections::HashMap;
use uom::si::f64::{Acceleration, Angle, Area, Force, Length, LinearMassDensity, Mass as MassQ, Pressure};
use uom::si::{
    acceleration::meter_per_second_squared, angle::radian, area::square_meter, force::newton, length::meter,
    linear_mass_density::kilogram_per_meter, mass::kilogram, pressure::pascal,
};

/// Standard gravity, m/s² (CGPM 1901; ISO 80000-3).
pub const STANDARD_GRAVITY_M_S2: f64 = 9.806_65;

/// One problem found while validating, at a field path.
#[derive(Debug, Clone, PartialEq)]
pub struct Problem {
    /// Field path (`members[2].area`).
    pub path: String,
    /// What is wrong.
    pub message: String,
}

/// A field's path (`members[3].diameter`), written out only when a problem
/// needs it: validation of a large rig looks up many fields and finds few
/// problems.
#[derive(Debug, Clone, Copy)]
struct Field {
    section: &'static str,
    index: usize,
    name: &'static str,
}

impl std::fmt::Display for Field {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "{}[{}].{}", self.section, self.index, self.name)
    }
}

pub(super) struct Ctx {
    problems: Vec<Problem>,
}

impl Ctx {
    pub(super) fn err(&mut self, path: impl std::fmt::Display, message: impl Into<String>) {
        let (path, message) = (path.to_string(), message.into());
        // a value given but refused has its own message: not also "missing"
        if message.starts_with("missing") && self.problems.iter().any(|p| p.path == path) {
            return;
        }
        self.problems.push(Problem { path, message });
    }

    pub(super) fn qty(
        &mut self,
        q: &Qty,
        path: impl std::fmt::Display + Copy,
        dim: Dimension,
        sign: Sign,
    ) -> Option<f64> {
        let v = self.qty_unguarded(q, path, dim, sign)?;
        match super::plausible::implausible_magnitude(v, &q.0) {
            Some(why) => {
                self.err(path, why);
                None
            }
            None => Some(v),
        }
    }

    /// A quantity parsed, before any plausibility check.
    fn qty_unguarded(
        &mut self,
        q: &Qty,
        path: impl std::fmt::Display + Copy,
        dim: Dimension,
        sign: Sign,
    ) -> Option<f64> {
        match parse_quantity(&q.0, dim, sign) {
            Ok(v) => Some(v),
            Err(e) => {
                self.err(path, e.to_string());
                None
            }
        }
    }

    /// As [`Ctx::qty`], then refused when outside its plausible range.
    pub(super) fn plausible_qty(
        &mut self,
        q: &Qty,
        path: impl std::fmt::Display + Copy,
        dim: Dimension,
        sign: Sign,
        range: Plausible,
    ) -> Option<f64> {
        // the quantity's own range says more than the general magnitude guard
        let v = self.qty_unguarded(q, path, dim, sign)?;
        match range.outside(v, &q.0) {
            Some(message) => {
                self.err(path, message);
                None
            }
            None => Some(v),
        }
    }

    pub(super) fn opt_qty(
        &mut self,
        q: &Option<Qty>,
        path: impl std::fmt::Display + Copy,
        dim: Dimension,
        sign: Sign,
    ) -> Option<f64> {
        q.as_ref().and_then(|q| self.qty(q, path, dim, sign))
    }

    fn number(&mut self, v: f64, path: impl std::fmt::Display + Copy, lo: f64, hi: f64, what: &str) -> Option<f64> {
        if v.is_finite() && v >= lo && v <= hi {
            Some(v)
        } else {
            self.err(path, format!("{v} is out of range: {what}"));
            None
        }
    }
}

fn ids<'a>(ctx: &mut Ctx, list: impl Iterator<Item = &'a str>, section: &str, what: &str) -> HashMap<String, usize> {
    let mut map = HashMap::new();
    for (i, id) in list.enumerate() {
        let path = format!("{section}[{i}].id");
        if id.trim().is_empty() {
            ctx.err(path, format!("{what} id is empty; give each {what} a name"));
        } else if let Some(first) = map.get(id) {
            ctx.err(path, format!("duplicate {what} id \"{id}\" (first used by {section}[{first}])"));
        } else {
            map.insert(id.to_string(), i);
        }
    }
    map
}

/// Validate a scenario's file types into the model.
pub fn build(dto: &ScenarioDto) -> Result<Scenario, Vec<Problem>> {
    let mut ctx = Ctx { problems: Vec::new() };
    let gravity = match &dto.gravity {
        Some(q) => ctx.qty(q, "gravity", Dimension::Acceleration, Sign::Positive).unwrap_or(STANDARD_GRAVITY_M_S2),
        None => STANDARD_GRAVITY_M_S2,
    };
    let near_limit = match dto.near_limit {
        Some(v) => {
            ctx.number(v, "near_limit", 0.01, 1.0, "near_limit is a utilisation between 0.01 and 1").unwrap_or(0.8)
        }
        None => 0.8,
    };
    let dynamic_ratio_warning = match dto.dynamic_ratio_warning {
        Some(v) => ctx
            .number(
                v,
                "dynamic_ratio_warning",
                1.0,
                1e6,
                "dynamic_ratio_warning is a multiple of the static force, at least 1",
            )
            .unwrap_or(2.0),
        None => 2.0,
    };

    let node_ids = ids(&mut ctx, dto.nodes.iter().map(|n| n.id.as_str()), "nodes", "node");
    let floor_ids = ids(&mut ctx, dto.floors.iter().map(|f| f.id.as_str()), "floors", "floor");
    let member_ids = ids(&mut ctx, dto.members.iter().map(|m| m.id.as_str()), "members", "member");
    let rope_ids = ids(&mut ctx, dto.ropes.iter().map(|r| r.id.as_str()), "ropes", "rope");
    let _ = rope_ids;
    // one set of ids over the drawing: the rule the app applies when an id is typed
    for (path, message) in super::ids::id_clashes(dto) {
        ctx.err(path, message);
    }
    let mass_ids = ids(&mut ctx, dto.masses.iter().map(|m| m.id.as_str()), "masses", "mass");
    let _ = ids(&mut ctx, dto.cases.iter().map(CaseDto::id), "cases", "case");
    let _ = member_ids;

    let floors: Vec<Floor> = dto.floors.iter().enumerate().filter_map(|(i, f)| build_floor(&mut ctx, i, f)).collect();

    let mut nodes = Vec::with_capacity(dto.nodes.len());
    for (i, n) in dto.nodes.iter().enumerate() {
        let p = format!("nodes[{i}].at");
        let x = ctx.plausible_qty(&n.at.x, &format!("{p}.0"), Dimension::Length, Sign::Any, COORDINATE);
        let y = ctx.plausible_qty(&n.at.y, &format!("{p}.1"), Dimension::Length, Sign::Any, COORDINATE);
        let z = match &n.at.z {
            Some(z) => ctx.plausible_qty(z, &format!("{p}.2"), Dimension::Length, Sign::Any, COORDINATE),
            None => Some(0.0),
        };
        let support = match &n.support {
            SupportDto::Joint => Support::Joint,
            SupportDto::Anchor => Support::Anchor,
            SupportDto::Floor(f) => match floor_ids.get(f) {
                Some(&k) => Support::Floor(k),
                None => {
                    let known = if dto.floors.is_empty() {
                        "no floors are defined; add one under `floors`".to_string()
                    } else {
                        format!(
                            "the floors are {}",
                            dto.floors.iter().map(|f| format!("\"{}\"", f.id)).collect::<Vec<_>>().join(", ")
                        )
                    };
                    ctx.err(format!("nodes[{i}].support"), format!("floor \"{f}\" is not defined; {known}"));
                    Support::Joint
                }
            },
        };
        let (rated_direction, rated_across) = build_rated_direction(&mut ctx, i, n);
        nodes.push(Node {
            id: n.id.clone(),
            position: [
                Length::new::<meter>(x.unwrap_or(0.0)),
                Length::new::<meter>(y.unwrap_or(0.0)),
                Length::new::<meter>(z.unwrap_or(0.0)),
            ],
            support,
            rated: build_rated(&mut ctx, i, &n.rated, support),
            fittings: build_fittings(&mut ctx, "nodes", i, Host::Node, &n.fittings),
            sheave: n.sheave.as_ref().and_then(|sh| build_sheave(&mut ctx, i, sh)),
            rated_direction,
            rated_across,
        });
    }

    // pairs a member joins get the member's own zero-length error instead
    let joined: std::collections::HashSet<(usize, usize)> = dto
        .members
        .iter()
        .filter_map(|m| Some((*node_ids.get(&m.ends.0)?, *node_ids.get(&m.ends.1)?)))
        .map(|(a, b)| (a.min(b), a.max(b)))
        .collect();
    coincident_nodes(&mut ctx, &nodes, &joined);

    let mut floors = floors;
    for (path, message) in place_feet(&mut floors, &nodes) {
        ctx.err(path, message);
    }

    let node_ref = |ctx: &mut Ctx, id: &str, path: String, what: &str| -> Option<usize> {
        match node_ids.get(id) {
            Some(&k) => Some(k),
            None => {
                ctx.err(path, format!("{what} names node \"{id}\", which does not exist"));
                None
            }
        }
    };

    let mut members = Vec::with_capacity(dto.members.len());
    for (i, m) in dto.members.iter().enumerate() {
        let a = node_ref(&mut ctx, &m.ends.0, format!("members[{i}].ends.0"), "member end");
        let b = node_ref(&mut ctx, &m.ends.1, format!("members[{i}].ends.1"), "member end");
        let (Some(a), Some(b)) = (a, b) else { continue };
        if a == b {
            ctx.err(
                format!("members[{i}].ends"),
                format!("both ends are node \"{}\"; a member joins two different nodes", m.ends.0),
            );
            continue;
        }
        let pa = &nodes[a].position;
        let pb = &nodes[b].position;
        let drawn = ((pb[0].value - pa[0].value).powi(2)
            + (pb[1].value - pa[1].value).powi(2)
            + (pb[2].value - pa[2].value).powi(2))
        .sqrt();
        if drawn < COINCIDENT_M {
            ctx.err(
                format!("members[{i}].ends"),
                format!(
                    "its two ends \"{}\" and \"{}\" coincide (closer than 0.001 mm): a zero-length member; move one node or remove the member",
                    m.ends.0, m.ends.1
                ),
            );
            continue;
        }
        if let Some(mut member) =
            build_member(&mut ctx, "members", i, m, dto.duty.unwrap_or_default(), dto.rules.unwrap_or_default())
        {
            member.ends = [a, b];
            if drawn + member.slack.value <= 1e-9 {
                ctx.err(
                    format!("members[{i}].slack"),
                    format!(
                        "slack {:.4} m leaves no unstretched length (drawn length {:.4} m); pretension must be less than the length",
                        member.slack.value, drawn
                    ),
                );
            }
            if let Some(v) = member.wave_speed_m_s.filter(|v| !v.is_finite() || *v <= 0.0) {
                ctx.err(format!("members[{i}]"), format!("wave speed {v} is not a positive number"));
            }
            members.push(member);
        }
    }

    members.extend(build_ropes(
        &mut ctx,
        &dto.ropes,
        &nodes,
        &node_ids,
        dto.duty.unwrap_or_default(),
        dto.rules.unwrap_or_default(),
    ));

    let mut masses = Vec::with_capacity(dto.masses.len());
    for (i, m) in dto.masses.iter().enumerate() {
        let node = node_ref(&mut ctx, &m.at, format!("masses[{i}].at"), "mass");
        let kg = ctx.plausible_qty(&m.mass, &format!("masses[{i}].mass"), Dimension::Mass, Sign::Positive, MASS);
        if let Some(k) = node
            && nodes[k].support == Support::Anchor
        {
            ctx.err(
                format!("masses[{i}].at"),
                format!(
                    "mass \"{}\" is at anchor \"{}\": an anchor takes the weight straight into its support and no member carries it, so there is nothing to check; hang the mass from a joint below the anchor",
                    m.id, nodes[k].id
                ),
            );
            continue;
        }
        if let (Some(node), Some(kg)) = (node, kg) {
            masses.push(Mass { id: m.id.clone(), node, mass: MassQ::new::<kilogram>(kg) });
        }
    }

    let mass_ref = |ctx: &mut Ctx, id: &str, path: String| -> Option<usize> {
        match mass_ids.get(id) {
            Some(&k) => Some(k),
            None => {
                let known = if dto.masses.is_empty() {
                    "no masses are defined".to_string()
                } else {
                    format!(
                        "the masses are {}",
                        dto.masses.iter().map(|m| format!("\"{}\"", m.id)).collect::<Vec<_>>().join(", ")
                    )
                };
                ctx.err(path, format!("case names mass \"{id}\", which does not exist; {known}"));
                None
            }
        }
    };

    let mut cases = Vec::with_capacity(dto.cases.len());
    if dto.cases.is_empty() {
        ctx.err("cases", "no load cases; add at least `Static(id: \"hanging\")`");
    }
    for (i, c) in dto.cases.iter().enumerate() {
        let case = match c {
            CaseDto::Static { id } => Some(Case::Static { id: id.clone() }),
            CaseDto::Swing { id, mass, release, pivot, azimuth } => {
                let m = mass_ref(&mut ctx, mass, format!("cases[{i}].mass"));
                let r = ctx.qty(release, &format!("cases[{i}].release"), Dimension::Angle, Sign::NonNegative);
                let pv = match pivot {
                    Some(p) => node_ref(&mut ctx, p, format!("cases[{i}].pivot"), "swing pivot").map(Some),
                    None => Some(None),
                };
                let az = match azimuth {
                    Some(a) => ctx.qty(a, &format!("cases[{i}].azimuth"), Dimension::Angle, Sign::Any),
                    None => Some(0.0),
                };
                let pv = match (pv, m.and_then(|m| masses.get(m))) {
                    (Some(Some(p)), Some(ms)) if p == ms.node => {
                        ctx.err(
                            format!("cases[{i}].pivot"),
                            format!(
                                "the pivot \"{}\" is the node mass \"{}\" hangs at: a swing turns about a point above the mass on its line; name that node, or leave `pivot` out for the nearest one above",
                                nodes[p].id, ms.id
                            ),
                        );
                        None
                    }
                    (pv, _) => pv,
                };
                let r = r.and_then(|r| {
                    if r > std::f64::consts::FRAC_PI_2 + 1e-12 {
                        let fall = match (m, pv) {
                            (Some(m), Some(Some(p))) if m < masses.len() => {
                                let (a, b) = (&nodes[p].position, &nodes[masses[m].node].position);
                                let l = (0..3).map(|k| (a[k].value - b[k].value).powi(2)).sum::<f64>().sqrt();
                                format!(
                                    " (here 2 x {} m x |cos {} deg| = {} m)",
                                    crate::units::format_number(l, 4),
                                    crate::units::format_number(r.to_degrees(), 4),
                                    crate::units::format_number(2.0 * l * r.cos().abs(), 4)
                                )
                            }
                            _ => String::new(),
                        };
                        ctx.err(
                            format!("cases[{i}].release"),
                            format!(
                                "a release of {} deg is above the pivot's horizontal: the line goes slack at release and the mass falls 2 L |cos theta0|{fall} before it snatches the line, so it is not a swing; check it as a Drop case of that height (the swing that follows is at most a 90 deg swing), or give a release of 90 deg or less",
                                crate::units::format_number(r.to_degrees(), 4)
                            ),
                        );
                        None
                    } else {
                        Some(r)
                    }
                });
                match (m, r, pv, az) {
                    (Some(mass), Some(r), Some(pivot), Some(az)) => Some(Case::Swing {
                        id: id.clone(),
                        mass,
                        release: Angle::new::<radian>(r),
                        pivot,
                        azimuth: Angle::new::<radian>(az),
                    }),
                    _ => None,
                }
            }
            CaseDto::Drop { id, mass, height } => {
                let m = mass_ref(&mut ctx, mass, format!("cases[{i}].mass"));
                let h = ctx.plausible_qty(
                    height,
                    &format!("cases[{i}].height"),
                    Dimension::Length,
                    Sign::NonNegative,
                    DROP_HEIGHT,
                );
                match (m, h) {
                    (Some(mass), Some(h)) => Some(Case::Drop { id: id.clone(), mass, height: Length::new::<meter>(h) }),
                    _ => None,
                }
            }
            CaseDto::Sudden { id, mass } => {
                mass_ref(&mut ctx, mass, format!("cases[{i}].mass")).map(|mass| Case::Sudden { id: id.clone(), mass })
            }
        };
        if let Some(case) = case {
            cases.push(case);
        }
    }

    if !ctx.problems.is_empty() {
        return Err(ctx.problems);
    }
    Ok(Scenario {
        title: dto.title.clone(),
        revision: dto.revision.as_deref().map(str::trim).filter(|r| !r.is_empty()).map(str::to_string),
        notes: dto.notes.clone(),
        gravity: Acceleration::new::<meter_per_second_squared>(gravity),
        near_limit,
        dynamic_ratio_warning,
        duty: dto.duty.unwrap_or_default(),
        rules: dto.rules.unwrap_or_default(),
        nodes,
        members,
        floors,
        masses,
        cases,
    })
}

/// Two nodes closer than this are at the same place, and a member shorter
/// than it has no length, m (0.001 mm: far below any drawing's precision,
/// far above the rounding of coordinates within 10,000 km of zero).
pub const COINCIDENT_M: f64 = 1e-6;

/// Refuses nodes drawn at the same place (a joint there would not be
/// connected to the other, which is never what the drawing means). Each
/// node is reported once, against the first node drawn at its place. The
/// nodes go into a grid of cells of [`COINCIDENT_M`]; a cell keeps only nodes
/// that are apart from each other (or joined by a member), so it holds a
/// handful at most, and a rig of n nodes costs n lookups of 27 cells even
/// when a file repeats one node thousands of times.
fn coincident_nodes(ctx: &mut Ctx, nodes: &[Node], joined: &std::collections::HashSet<(usize, usize)>) {
    let at = |k: usize| nodes[k].position.map(|c| c.value);
    // coordinates are within ±1e7 m (checked before), so a cell index fits
    // an i64 with room; a non-finite coordinate has its own error already
    let cell = |p: [f64; 3]| p.map(|c| (c / COINCIDENT_M).floor() as i64);
    let mut grid: std::collections::HashMap<[i64; 3], Vec<usize>> = std::collections::HashMap::new();
    for b in 0..nodes.len() {
        let pb = at(b);
        let home = cell(pb);
        let mut first: Option<usize> = None;
        for dx in -1..=1 {
            for dy in -1..=1 {
                for dz in -1..=1 {
                    let key = [home[0] + dx, home[1] + dy, home[2] + dz];
                    for &a in grid.get(&key).map_or(&[][..], Vec::as_slice) {
                        let pa = at(a);
                        let d = ((pb[0] - pa[0]).powi(2) + (pb[1] - pa[1]).powi(2) + (pb[2] - pa[2]).powi(2)).sqrt();
                        if d < COINCIDENT_M && !joined.contains(&(a, b)) && first.is_none_or(|f| a < f) {
                            first = Some(a);
                        }
                    }
                }
            }
        }
        match first {
            Some(a) => ctx.err(
                format!("nodes[{b}].at"),
                format!(
                    "node \"{}\" is at the same place as node \"{}\" (nodes[{a}]), closer than 0.001 mm; join them into one node or move one apart",
                    nodes[b].id, nodes[a].id
                ),
            ),
            None => grid.entry(home).or_default().push(b),
        }
    }
}

fn material_of(ctx: &mut Ctx, name: &Option<String>, path: impl std::fmt::Display + Copy) -> Option<Material> {
    let name = name.as_ref()?;
    match Material::from_name(name) {
        Some(m) => Some(m),
        None => {
            ctx.err(path, format!("material \"{name}\" is not in the library; it knows {}", Material::names()));
            None
        }
    }
}

fn build_floor(ctx: &mut Ctx, i: usize, f: &FloorDto) -> Option<Floor> {
    let p = |s: &'static str| Field { section: "floors", index: i, name: s };
    let sx = ctx.qty(&f.span.0, p("span.0"), Dimension::Length, Sign::Positive);
    let sz = ctx.qty(&f.span.1, p("span.1"), Dimension::Length, Sign::Positive);
    let t = ctx.qty(&f.thickness, p("thickness"), Dimension::Length, Sign::Positive);
    let material = material_of(ctx, &f.material, p("material"));
    let modulus = match (&f.modulus, material) {
        (Some(q), _) => ctx.qty(q, p("modulus"), Dimension::Pressure, Sign::Positive),
        (None, Some(m)) => Some(m.data().modulus_pa),
        (None, None) => {
            ctx.err(
                p("modulus"),
                "missing: give the slab's `modulus` (e.g. \"30 GPa\") or a `material` (e.g. \"concrete\")",
            );
            None
        }
    };
    let poisson = match (f.poisson, material) {
        (Some(v), _) if v.is_finite() && (0.0..0.5).contains(&v) => Some(v),
        (Some(v), _) => {
            ctx.err(
                p("poisson"),
                format!(
                    "{v} is out of range: Poisson's ratio ν must satisfy 0 ≤ ν < 0.5 (0.5 itself is refused: an incompressible solid, not a floor slab; concrete is about 0.2)"
                ),
            );
            None
        }
        (None, Some(m)) => Some(m.data().poisson),
        (None, None) => {
            ctx.err(p("poisson"), "missing: give `poisson` (0.2 for concrete) or a `material`");
            None
        }
    };
    let rated_uniform = ctx.opt_qty(&f.rated_uniform, p("rated_uniform"), Dimension::Pressure, Sign::Positive);
    let rated_point = ctx.opt_qty(&f.rated_point, p("rated_point"), Dimension::Force, Sign::Positive);
    let pad = match &f.pad {
        Some((a, b)) => {
            let a = ctx.qty(a, p("pad.0"), Dimension::Length, Sign::Positive);
            let b = ctx.qty(b, p("pad.1"), Dimension::Length, Sign::Positive);
            Some([a?, b?])
        }
        None => None,
    };
    let deflection_limit = match f.deflection_limit {
        Some(v) => {
            ctx.number(v, p("deflection_limit"), 1.0, 1e6, "deflection_limit is span / N with N ≥ 1 (360 is usual)")?
        }
        None => 360.0,
    };
    let origin = match &f.origin {
        Some((x, z)) => {
            let x = ctx.qty(x, p("origin.0"), Dimension::Length, Sign::Any);
            let z = ctx.qty(z, p("origin.1"), Dimension::Length, Sign::Any);
            Some([x?, z?])
        }
        None => None,
    };
    let friction_limit = match f.friction_limit {
        // below 0.01 no grip can be relied on (tie the feet instead), and a
        // limit of about zero would make every share of it infinite
        Some(v) => Some(ctx.number(
            v,
            p("friction_limit"),
            0.01,
            2.0,
            "a friction coefficient between 0.01 and 2 (below 0.01 no grip may be relied on: tie the feet)",
        )?),
        None => None,
    };
    let (sx, sz, t, e, nu) = (sx?, sz?, t?, modulus?, poisson?);
    Some(Floor {
        id: f.id.clone(),
        span: [Length::new::<meter>(sx), Length::new::<meter>(sz)],
        thickness: Length::new::<meter>(t),
        modulus: Pressure::new::<pascal>(e),
        poisson: nu,
        edges: f.edges,
        rated_uniform: rated_uniform.map(Pressure::new::<pascal>),
        rated_point: rated_point.map(Force::new::<newton>),
        pad: pad.map(|[a, b]| [Length::new::<meter>(a), Length::new::<meter>(b)]),
        deflection_limit,
        stiffness_n_per_m: point_stiffness_n_per_m(f.edges, sx, sz, t, e, nu),
        origin: origin
            .map_or([Length::new::<meter>(0.0); 2], |[x, z]| [Length::new::<meter>(x), Length::new::<meter>(z)]),
        origin_given: origin.is_some(),
        friction_limit: friction_limit.unwrap_or(DEFAULT_FRICTION_LIMIT),
        friction_source: if friction_limit.is_some() {
            "given in the file"
        } else {
            "EN 1993-1-8:2005 §6.2.2(6), C_f,d for a base plate on sand-cement mortar"
        },
        feet: Vec::new(),
        plate: None,
    })
}

fn fraction(ctx: &mut Ctx, v: Option<f64>, path: impl std::fmt::Display + Copy, what: &str) -> f64 {
    match v {
        Some(v) => ctx.number(v, path, 0.01, 1.0, &format!("{what} is a fraction between 0.01 and 1")).unwrap_or(1.0),
        None => 1.0,
    }
}

/// A rod's section from the file: every length positive, a tube's wall
/// less than half its outside diameter.
fn build_section(ctx: &mut Ctx, i: usize, s: &SectionDto) -> Option<Section> {
    let p = |s: &'static str| Field { section: "members", index: i, name: s };
    match s {
        SectionDto::Tube { outer, wall } => {
            let o = ctx.plausible_qty(outer, p("section.outer"), Dimension::Length, Sign::Positive, SECTION_LENGTH);
            let t = ctx.plausible_qty(wall, p("section.wall"), Dimension::Length, Sign::Positive, SECTION_LENGTH);
            let (o, t) = (o?, t?);
            if t >= o / 2.0 {
                ctx.err(
                    p("section.wall"),
                    format!(
                        "wall {} mm is not less than half the outside diameter {} mm; for a solid bar write SolidRound(diameter: ...)",
                        format_number(t * 1e3, 4),
                        format_number(o * 1e3, 4)
                    ),
                );
                return None;
            }
            Some(Section::Tube { outer_m: o, wall_m: t })
        }
        SectionDto::SolidRound { diameter } => ctx
            .plausible_qty(diameter, p("section.diameter"), Dimension::Length, Sign::Positive, SECTION_LENGTH)
            .map(|d| Section::SolidRound { diameter_m: d }),
    }
}

/// Area given beside a section: they must agree to this, relative (a
/// rounded catalogue area passes; a different tube does not).
const AREA_AGREEMENT: f64 = 0.005;

/// Effective length factor K when the file gives none: 1.0, both ends pinned
/// (Euler's fundamental case, Timoshenko & Gere; the system length as
/// buckling length, EN 1993-1-1 6.3.1.3). Fixed ends shorten it (0.5–0.7),
/// a free end lengthens it (2.0): give `effective_length_factor` then.
pub const DEFAULT_EFFECTIVE_LENGTH_FACTOR: f64 = 1.0;

/// A member from its file type; `list` is `members` or `ropes` (where a
/// rope's member fields are, for the error paths).
pub(super) fn build_member(
    ctx: &mut Ctx,
    list: &'static str,
    i: usize,
    m: &MemberDto,
    duty: Duty,
    rules: Rules,
) -> Option<Member> {
    let p = |s: &'static str| Field { section: list, index: i, name: s };
    let kind = m.kind;
    let section = m.section.as_ref().and_then(|s| build_section(ctx, i, s));
    if kind != MemberKind::Rod {
        for (given, name) in [
            (m.section.is_some(), "section"),
            (m.buckling_curve.is_some(), "buckling_curve"),
            (m.effective_length_factor.is_some(), "effective_length_factor"),
        ] {
            if given {
                ctx.err(
                    p(name),
                    format!("`{name}` is for the buckling check of a rod; a {} carries tension only", kind.label()),
                );
            }
        }
    }
    if m.sling.is_some() && kind != MemberKind::FibreRope {
        ctx.err(
            p("sling"),
            format!(
                "`sling` marks a fibre member as a textile sling (EN 1492); a {} is not one (wire rope slings take `termination`)",
                kind.label()
            ),
        );
    }
    let material = material_of(ctx, &m.material, p("material"));
    let diameter = ctx.opt_qty(&m.diameter, p("diameter"), Dimension::Length, Sign::Positive).and_then(|d| {
        match super::plausible::implausible_diameter(kind, d) {
            Some(why) => {
                ctx.err(p("diameter"), why);
                None
            }
            None => Some(d),
        }
    });
    let area_given =
        m.area.as_ref().and_then(|q| ctx.plausible_qty(q, p("area"), Dimension::Area, Sign::Positive, AREA));
    let modulus_given = m
        .modulus
        .as_ref()
        .and_then(|q| ctx.plausible_qty(q, p("modulus"), Dimension::Pressure, Sign::Positive, MODULUS));
    let slack = ctx.opt_qty(&m.slack, p("slack"), Dimension::Length, Sign::Any).unwrap_or(0.0);
    let linear_mass_given = ctx.opt_qty(&m.linear_mass, p("linear_mass"), Dimension::LinearDensity, Sign::NonNegative);

    let construction = match &m.construction {
        Some(c) => match Construction::from_name(c) {
            Some(c) => Some(c),
            None => {
                ctx.err(
                    p("construction"),
                    format!("construction \"{c}\" is not in the library; it knows {}", Construction::names()),
                );
                return None;
            }
        },
        None => None,
    };
    if construction.is_some() && !matches!(kind, MemberKind::WireRope | MemberKind::Cable) {
        ctx.err(
            p("construction"),
            format!("a rope construction applies to wire rope or cable, not to {}", kind.label()),
        );
    }
    let chain_grade = if kind == MemberKind::Chain {
        match &m.grade {
            Some(g) => match ChainGrade::from_name(g) {
                Some(g) => Some(g),
                None => {
                    ctx.err(p("grade"), format!("chain grade \"{g}\" is not in the library; it knows 80 and 100"));
                    return None;
                }
            },
            None => None,
        }
    } else {
        None
    };
    let rope_grade_pa = if matches!(kind, MemberKind::WireRope | MemberKind::Cable) {
        match &m.grade {
            Some(g) => {
                let digits: String = g.chars().filter(char::is_ascii_digit).collect();
                match digits.parse::<f64>() {
                    Ok(v) if ROPE_GRADES.contains(&v) => Some(v * 1e6),
                    _ => {
                        ctx.err(
                            p("grade"),
                            format!("rope grade \"{g}\" is not one of 1570, 1770, 1960, 2160 (N/mm^2)"),
                        );
                        return None;
                    }
                }
            }
            None => None,
        }
    } else {
        None
    };

    let rating_given = match &m.rating {
        Some(RatingDto::BreakingStrength(q)) => ctx
            .qty(q, p("rating"), Dimension::Force, Sign::Positive)
            .map(|v| (Rating::BreakingStrength(Force::new::<newton>(v)), "given in the file".to_string())),
        Some(RatingDto::WorkingLoadLimit(q)) => ctx.qty(q, p("rating"), Dimension::Force, Sign::Positive).map(|v| {
            (Rating::WorkingLoadLimit(Force::new::<newton>(v)), "working load limit given in the file".to_string())
        }),
        Some(RatingDto::Yield(q)) => ctx
            .qty(q, p("rating"), Dimension::Pressure, Sign::Positive)
            .map(|v| (Rating::Yield(Pressure::new::<pascal>(v)), "yield stress given in the file".to_string())),
        None => None,
    };
    if m.rating.is_some() && rating_given.is_none() {
        return None;
    }

    let circle = diameter.map(|d| std::f64::consts::FRAC_PI_4 * d * d);
    // area
    let (area, area_note) = match kind {
        MemberKind::WireRope | MemberKind::Cable => match (area_given, diameter, construction) {
            (Some(a), _, _) => (Some(a), "area given".to_string()),
            (None, Some(d), Some(c)) => {
                (Some(c.metallic_area_m2(d)), format!("metallic area C d^2, C = {} ({})", c.area_factor(), c.name()))
            }
            (None, Some(_), None) => {
                ctx.err(p("construction"), "missing: a wire rope given by `diameter` needs its `construction` (e.g. \"6x19 IWRC\"), or give `area`");
                (None, String::new())
            }
            (None, None, _) => {
                ctx.err(p("area"), "missing: give `area` (metallic area) or `diameter` with `construction`");
                (None, String::new())
            }
        },
        MemberKind::Chain => match (area_given, diameter) {
            (Some(a), _) => (Some(a), "area given".to_string()),
            (None, Some(d)) => (Some(chain_area_m2(d)), "both legs of a link, 2 x pi d^2/4".to_string()),
            (None, None) => {
                ctx.err(p("diameter"), "missing: a chain needs its nominal `diameter` (with `grade`) or `area`");
                (None, String::new())
            }
        },
        MemberKind::Rod if section.is_some() || m.section.is_some() => match (section, area_given, diameter) {
            (None, _, _) => (None, String::new()),
            (Some(_), _, Some(_)) => {
                ctx.err(p("diameter"), "give the rod's `section` or its `diameter`, not both");
                (None, String::new())
            }
            (Some(sec), Some(a), None) if (a - sec.area_m2()).abs() > AREA_AGREEMENT * sec.area_m2() => {
                ctx.err(
                    p("area"),
                    format!(
                        "area {} mm^2 disagrees with the section's {} mm^2 ({}) by more than 0.5 %; leave `area` out or make them agree",
                        format_number(a * 1e6, 4),
                        format_number(sec.area_m2() * 1e6, 4),
                        sec.describe()
                    ),
                );
                (None, String::new())
            }
            (Some(sec), _, None) => (Some(sec.area_m2()), format!("{}: pi (D^2 - d^2) / 4", sec.describe())),
        },
        MemberKind::Rod | MemberKind::FibreRope => match (area_given, circle) {
            (Some(a), _) => (Some(a), "area given".to_string()),
            (None, Some(a)) => (Some(a), "circle of the nominal diameter".to_string()),
            (None, None) => {
                ctx.err(p("area"), "missing: give `area` or `diameter`");
                (None, String::new())
            }
        },
    };
    let area = area?;

    // rating
    let (rating, rating_note) = match (rating_given, kind) {
        (Some(r), _) => r,
        (None, MemberKind::WireRope | MemberKind::Cable) => match (diameter, construction, rope_grade_pa) {
            (Some(d), Some(c), Some(g)) => (
                Rating::BreakingStrength(Force::new::<newton>(c.min_breaking_force_n(d, g))),
                format!(
                    "minimum breaking force K d^2 R_r, K = {} ({}, grade {:.0}); {}",
                    c.breaking_factor(),
                    c.name(),
                    g / 1e6,
                    c.source()
                ),
            ),
            _ => {
                ctx.err(p("rating"), "missing: give `rating` (e.g. BreakingStrength(\"90.7 kN\")) or `diameter`, `construction` and `grade`");
                return None;
            }
        },
        (None, MemberKind::Chain) => match (diameter, chain_grade) {
            (Some(d), Some(g)) => match g.tabulated_wll_kg(d) {
                Some(kg) => (
                    Rating::WorkingLoadLimit(Force::new::<newton>(kg * STANDARD_GRAVITY_M_S2)),
                    format!(
                        "EN 818-2 grade 8 single-leg working load limit for {} mm: {} t (the standard's table, from memory) x standard gravity",
                        format_number(d * 1e3, 4),
                        format_number(kg / 1e3, 4)
                    ),
                ),
                None if g == ChainGrade::Grade80 => {
                    ctx.err(
                        p("diameter"),
                        format!(
                            "{} mm is not a size in the EN 818-2 grade 8 table ({} mm); give a tabulated size or the chain's `rating: WorkingLoadLimit(\"... t\")` from its certificate",
                            format_number(d * 1e3, 4),
                            g.tabulated_sizes()
                        ),
                    );
                    return None;
                }
                None => {
                    ctx.err(
                        p("rating"),
                        format!(
                            "no working load limit table for grade {} chain here: give `rating: WorkingLoadLimit(\"... t\")` from its certificate",
                            g.name()
                        ),
                    );
                    return None;
                }
            },
            _ => {
                ctx.err(p("rating"), "missing: give `rating` or the chain's `diameter` and `grade` (80 or 100)");
                return None;
            }
        },
        (None, MemberKind::Rod) => match material.and_then(|m| m.data().yield_pa.map(|y| (m, y))) {
            Some((mat, y)) => (
                Rating::Yield(Pressure::new::<pascal>(y)),
                format!("nominal yield of {} ({})", mat.name(), mat.data().source),
            ),
            None => {
                ctx.err(p("rating"), "missing: give `rating` (e.g. Yield(\"235 MPa\")) or a metal `material`");
                return None;
            }
        },
        (None, MemberKind::FibreRope) => {
            ctx.err(
                p("rating"),
                "missing: a fibre rope needs its `rating`, e.g. BreakingStrength(\"32 kN\") from the maker's data",
            );
            return None;
        }
    };

    // stiffness
    let (ea, stiffness_note) = match kind {
        MemberKind::FibreRope => {
            let at = match m.elongation_at_pct {
                Some(v) => ctx.number(v, p("elongation_at_pct"), 1.0, 100.0, "percent of break, 1 to 100")? / 100.0,
                None => 0.2,
            };
            let elong = match (m.elongation_pct, material) {
                (Some(e), _) => Some((
                    ctx.number(e, p("elongation_pct"), 0.01, 100.0, "elastic elongation in percent, 0.01 to 100")?
                        / 100.0,
                    "given".to_string(),
                )),
                (None, Some(mat)) => default_elongation_at_20pct(mat, m.braided.unwrap_or(true)).map(|e| {
                    (
                        e,
                        format!(
                            "library default for {} {} (Handbook of Fibre Rope Technology, from memory)",
                            mat.name(),
                            if m.braided.unwrap_or(true) { "braid" } else { "3-strand" }
                        ),
                    )
                }),
                (None, None) => None,
            };
            match (modulus_given, elong, rating) {
                (Some(e), _, _) => (e * area, "E A with the modulus given".to_string()),
                (None, Some((el, note)), Rating::BreakingStrength(f)) => (
                    fibre_axial_stiffness_n(f.value, at, el),
                    format!("EA = {:.0} % of break / {:.2} % elongation ({note})", at * 100.0, el * 100.0),
                ),
                _ => {
                    ctx.err(p("elongation_pct"), "missing: a fibre rope's stiffness needs `elongation_pct` (elastic stretch at 20 % of break) with a BreakingStrength rating, a fibre `material`, or a `modulus`");
                    return None;
                }
            }
        }
        _ => {
            let (e, note) = match (modulus_given, construction, material, kind) {
                (Some(e), _, _, _) => (e, "modulus given".to_string()),
                (None, Some(c), _, _) => {
                    (c.effective_modulus_pa(), format!("effective rope modulus for {} (Feyrer, from memory)", c.name()))
                }
                (None, None, Some(mat), _) => {
                    (mat.data().modulus_pa, format!("{} ({})", mat.name(), mat.data().source))
                }
                (None, None, None, MemberKind::Chain) => (
                    Material::Steel.data().modulus_pa,
                    "steel, EN 1993-1-1; chain stiffer than real (link bending ignored)".to_string(),
                ),
                _ => {
                    ctx.err(
                        p("modulus"),
                        "missing: give `modulus` (e.g. \"100 GPa\"), a `construction`, or a `material`",
                    );
                    return None;
                }
            };
            (e * area, format!("E A, {note}; area: {area_note}"))
        }
    };

    // own weight
    let (linear_mass, weight_note) = match linear_mass_given {
        Some(w) => (w, "given".to_string()),
        None => match (kind, construction, chain_grade, material, diameter) {
            (MemberKind::WireRope | MemberKind::Cable, Some(_), _, _, _) => {
                (rope_linear_mass_kg_m(area), "metallic area x 7850 kg/m^3 x 1.1 (estimate)".to_string())
            }
            (MemberKind::Chain, _, _, _, Some(d)) => {
                (chain_linear_mass_kg_m(d), "0.0222 d^2 kg/m (rule of thumb)".to_string())
            }
            (MemberKind::FibreRope, _, _, Some(mat), Some(d)) => {
                (fibre_linear_mass_kg_m(mat, d), "fibre density x 0.6 packing (estimate)".to_string())
            }
            (MemberKind::Rod | MemberKind::WireRope | MemberKind::Cable, _, _, Some(mat), _) => {
                (mat.data().density_kg_m3 * area, format!("{} density x area", mat.name()))
            }
            _ => (0.0, "not known, left out (give `linear_mass`)".to_string()),
        },
    };
    let wave_speed_m_s = if linear_mass > 0.0 { Some((ea / linear_mass).sqrt()) } else { None };

    let default = kind.default_for(m.sling, duty);
    let duty_multiplier = duty.multiplier().0;
    if m.design_factor.is_some() && m.rating.is_none() && kind == MemberKind::Chain {
        ctx.err(
            p("design_factor"),
            "the chain's working load limit comes from the EN 818-2 table, which already holds its design factor 4; leave `design_factor` out, or give `rating: BreakingStrength(...)` to apply your own",
        );
    }
    let design_factor = match m.design_factor {
        Some(v) => DesignFactor {
            value: ctx.number(v, p("design_factor"), 1.0, 100.0, "a design factor is between 1 and 100")?,
            from_file: true,
            default,
            duty_multiplier,
        },
        None => DesignFactor { value: default.value, from_file: false, default, duty_multiplier },
    };
    let termination_note = match (m.termination, m.termination_efficiency, kind) {
        (Some(_), Some(_), _) => {
            ctx.err(
                p("termination"),
                "give the rope's `termination` or a `termination_efficiency` that overrides it, not both",
            );
            None
        }
        (Some(_), None, k) if !matches!(k, MemberKind::WireRope | MemberKind::Cable) => {
            ctx.err(
                p("termination"),
                format!("a wire rope termination applies to wire rope or cable, not to {}", k.label()),
            );
            None
        }
        (Some(t), None, _) => {
            Some((t.efficiency(), format!("termination {} {} ({})", t.label(), t.efficiency(), t.source())))
        }
        (None, None, MemberKind::WireRope) => Some((
            UNSTATED_TERMINATION_EFFICIENCY,
            format!(
                "termination not stated: {UNSTATED_TERMINATION_EFFICIENCY} taken, the lowest of the common terminations (hand splice, wedge socket, wire rope grips; EN 13414-1 / practice, from memory); give `termination`"
            ),
        )),
        _ => None,
    };
    let te = match &termination_note {
        Some((e, _)) => *e,
        None => fraction(ctx, m.termination_efficiency, p("termination_efficiency"), "termination efficiency"),
    };
    let ke = fraction(ctx, m.knot_efficiency, p("knot_efficiency"), "knot efficiency");
    if m.knot_efficiency.is_some() && kind != MemberKind::FibreRope {
        ctx.err(p("knot_efficiency"), "a knot or hitch efficiency applies to fibre rope only");
    }
    let mut parts = Vec::new();
    if let Some((_, note)) = &termination_note {
        parts.push(note.clone());
    } else if m.termination_efficiency.is_some() {
        parts.push(format!("termination {te}"));
    }
    if m.knot_efficiency.is_some() {
        parts.push(format!("knot {ke} (CI 1401: knots can cut strength by up to half)"));
    }
    let bend = build_bend(ctx, i, m, kind, diameter);
    if let Some(b) = &bend {
        parts.push(b.note.clone());
    }
    let be = bend.as_ref().map_or(1.0, |b| b.efficiency);
    let efficiency_note = if parts.is_empty() { "none applied".to_string() } else { parts.join(" x ") };
    let hitch = build_hitch(ctx, i, m, kind, rules);

    let strut = if kind == MemberKind::Rod {
        let effective_length_factor = match m.effective_length_factor {
            Some(v) => ctx.number(
                v,
                p("effective_length_factor"),
                0.5,
                10.0,
                "the effective length factor K is between 0.5 (both ends fixed) and 10",
            )?,
            None => DEFAULT_EFFECTIVE_LENGTH_FACTOR,
        };
        let curve = match section {
            Some(sec) => match curve_for(material, sec, m.buckling_curve.as_deref()) {
                Ok(c) => Ok(c),
                Err(CurveError::Unknown(msg)) => {
                    ctx.err(p("buckling_curve"), msg);
                    return None;
                }
                Err(CurveError::NoCurve(why)) => Err(why),
            },
            None => Err("section unknown, give section: Tube(outer, wall) or SolidRound(diameter) for the buckling check (EN 1993-1-1 6.3.1)".to_string()),
        };
        Some(Strut { section, curve, effective_length_factor, k_from_file: m.effective_length_factor.is_some() })
    } else {
        None
    };

    Some(Member {
        id: m.id.clone(),
        ends: [0, 0],
        kind,
        area: Area::new::<square_meter>(area),
        axial_stiffness: Force::new::<newton>(ea),
        stiffness_note,
        rating,
        rating_note,
        design_factor,
        efficiency: te * ke * be,
        efficiency_note,
        slack: Length::new::<meter>(slack),
        linear_mass: LinearMassDensity::new::<kilogram_per_meter>(linear_mass),
        weight_note,
        wave_speed_m_s,
        may_go_slack: m.may_go_slack,
        diameter: diameter.map(Length::new::<meter>),
        construction,
        chain_grade,
        material,
        fittings: build_fittings(ctx, list, i, Host::Member, &m.fittings),
        strut,
        hitch,
        bend,
        run: None,
    })
}

/// A sling's hitch: only on tension members, its mode factor under the
/// scenario's rules (library/hitch.rs).
fn build_hitch(ctx: &mut Ctx, i: usize, m: &MemberDto, kind: MemberKind, rules: Rules) -> Option<ModeFactor> {
    let p = |s: &'static str| Field { section: "members", index: i, name: s };
    let Some(hitch) = m.hitch else {
        for (given, name) in [(m.choke_angle.is_some(), "choke_angle"), (m.basket_angle.is_some(), "basket_angle")] {
            if given {
                ctx.err(p(name), format!("`{name}` needs a `hitch` on the member"));
            }
        }
        return None;
    };
    if kind == MemberKind::Rod {
        ctx.err(
            p("hitch"),
            "a hitch is how a sling is rigged; a rod is no sling (hitches apply to wire rope, fibre rope, chain and cable)",
        );
        return None;
    }
    let deg = 180.0 / std::f64::consts::PI;
    let choke = ctx.opt_qty(&m.choke_angle, p("choke_angle"), Dimension::Angle, Sign::NonNegative).map(|a| a * deg);
    let basket = ctx.opt_qty(&m.basket_angle, p("basket_angle"), Dimension::Angle, Sign::NonNegative).map(|a| a * deg);
    if (m.choke_angle.is_some() && choke.is_none()) || (m.basket_angle.is_some() && basket.is_none()) {
        return None;
    }
    match mode_factor(rules, hitch, choke, basket) {
        Ok(f) => Some(f),
        Err((field, why)) => {
            let name = match field {
                HitchField::ChokeAngle => "choke_angle",
                HitchField::BasketAngle => "basket_angle",
            };
            ctx.err(p(name), why);
            None
        }
    }
}

/// A wire rope bent over a pin or sheave of diameter D: the D/d efficiency
/// (library/bend.rs); needs the rope's nominal diameter d.
fn build_bend(ctx: &mut Ctx, i: usize, m: &MemberDto, kind: MemberKind, d: Option<f64>) -> Option<Bend> {
    let p = |s: &'static str| Field { section: "members", index: i, name: s };
    let q = m.bent_over.as_ref()?;
    if !matches!(kind, MemberKind::WireRope | MemberKind::Cable) {
        ctx.err(
            p("bent_over"),
            format!("the D/d bending efficiency is for wire rope or cable, not for {}", kind.label()),
        );
        return None;
    }
    let pin = ctx.qty(q, p("bent_over"), Dimension::Length, Sign::Positive)?;
    let Some(d) = d else {
        ctx.err(
            p("bent_over"),
            "the D/d efficiency needs the rope's nominal diameter d: give `diameter` (e.g. \"16 mm\")",
        );
        return None;
    };
    let ratio = pin / d;
    match bend_efficiency(ratio) {
        Ok(e) => Some(Bend {
            pin: Length::new::<meter>(pin),
            ratio,
            efficiency: e,
            note: format!(
                "bent over D {} mm, D/d {} -> {} ({BEND_SOURCE})",
                format_number(pin * 1e3, 4),
                format_number(ratio, 3),
                format_number(e, 3)
            ),
        }),
        Err(why) => {
            ctx.err(p("bent_over"), why);
            None
        }
    }
}
