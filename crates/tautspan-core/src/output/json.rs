//! `check --format json`: one object per file, field names as in the
//! command-line contract (DESIGN.md). Non-finite numbers (an allowable of a
//! floor without ratings) are written as `null`, never as NaN. The object is
//! written as it goes, one member (node, path, row) a line, so a large rig's
//! output never sits whole in memory.

use std::io::{self, Write};

use crate::analysis::{
    Analysis, CaseResult, ComparisonRow, FittingResult, FloorResult, LOAD_PATH_THRESHOLD, LoadPathResult, MemberResult,
    NodeResult, SupportResult, WarningGroup,
};
use serde_json::{Map, Value, json};

fn num(v: f64) -> Value {
    if v.is_finite() { json!(v) } else { Value::Null }
}

/// A rated part: the contract's `kind`, `wll_n`, `force_n`, `utilisation`,
/// `state`, and the name, in-line rating, governing angle, source and reason.
fn part_json(f: &FittingResult) -> Value {
    json!({ "kind": f.kind, "name": f.name, "wll_n": num(f.wll_n), "rated_wll_n": num(f.rated_wll_n),
            "force_n": num(f.force_n), "utilisation": num(f.utilisation), "state": f.state.as_str(),
            "angle_deg": f.angle_deg.map(num), "source": f.source, "reason": f.reason })
}

/// A number as the contract writes it: `null` where not finite.
#[derive(Clone, Copy)]
struct Num(f64);

impl serde::Serialize for Num {
    fn serialize<S: serde::Serializer>(&self, ser: S) -> Result<S::Ok, S::Error> {
        if self.0.is_finite() { ser.serialize_f64(self.0) } else { ser.serialize_none() }
    }
}

/// Shares to six decimals (far below the 1 % threshold; a 71 × 71 net's
/// paths stay a few MB).
struct Shares<'a>(&'a [f64]);

impl serde::Serialize for Shares<'_> {
    fn serialize<S: serde::Serializer>(&self, ser: S) -> Result<S::Ok, S::Error> {
        ser.collect_seq(self.0.iter().map(|v| Num((v * 1e6).round() / 1e6)))
    }
}

/// A member as written (borrowed, so a large rig's members are written
/// without an intermediate value each).
#[derive(serde::Serialize)]
struct MemberOut<'a> {
    id: &'a str,
    force_n: Num,
    allowable_n: Num,
    utilisation: Num,
    state: &'static str,
    stretch_m: Num,
    length_m: Num,
    sling_angle_deg: Num,
    sag_m: Num,
    wave_transit_s: Option<Num>,
    reason: &'a Option<String>,
    peak_at_deg: Option<Num>,
    mode_factor: Option<Num>,
    bend_efficiency: Option<Num>,
    euler_n: Option<Num>,
    buckling_resistance_n: Option<Num>,
    fittings: Vec<Value>,
    /// A rope over sheaves: its spans, each with its own tension.
    #[serde(skip_serializing_if = "Vec::is_empty")]
    segments: Vec<SegmentOut<'a>>,
}

/// One span of a rope over sheaves.
#[derive(serde::Serialize)]
struct SegmentOut<'a> {
    from: &'a str,
    to: &'a str,
    force_n: Num,
    length_m: Num,
}

fn member_out(m: &MemberResult) -> MemberOut<'_> {
    MemberOut {
        id: &m.id,
        force_n: Num(m.force_n),
        allowable_n: Num(m.allowable_n),
        utilisation: Num(m.utilisation),
        state: m.state.as_str(),
        stretch_m: Num(m.stretch_m),
        length_m: Num(m.length_m),
        sling_angle_deg: Num(m.sling_angle_deg),
        sag_m: Num(m.sag_m),
        wave_transit_s: m.wave_transit_s.map(Num),
        reason: &m.reason,
        peak_at_deg: m.peak_at_deg.map(Num),
        mode_factor: m.mode_factor.map(Num),
        bend_efficiency: m.bend_efficiency.map(Num),
        euler_n: m.euler_n.map(Num),
        buckling_resistance_n: m.buckling_resistance_n.map(Num),
        fittings: m.fittings.iter().map(part_json).collect(),
        segments: m
            .segments
            .iter()
            .map(|g| SegmentOut { from: &g.from, to: &g.to, force_n: Num(g.force_n), length_m: Num(g.length_m) })
            .collect(),
    }
}

/// A load path: the contract's `mass`, `members` and `supports` (those
/// carrying at least the threshold share), with the shares, the counts
/// below the threshold and not listed, and the untraced fraction.
#[derive(serde::Serialize)]
struct PathOut<'a> {
    mass: &'a str,
    members: &'a [String],
    supports: &'a [String],
    shares: Shares<'a>,
    below_threshold: usize,
    not_listed: usize,
    support_shares: Shares<'a>,
    supports_below_threshold: usize,
    untraced: Num,
}

fn path_out(p: &LoadPathResult) -> PathOut<'_> {
    PathOut {
        mass: &p.mass,
        members: &p.members,
        supports: &p.supports,
        shares: Shares(&p.shares),
        below_threshold: p.below_threshold,
        not_listed: p.not_listed,
        support_shares: Shares(&p.support_shares),
        supports_below_threshold: p.supports_below_threshold,
        untraced: Num(p.untraced),
    }
}

fn floor_json(f: &FloorResult) -> Value {
    let feet: Vec<Value> = f
        .feet
        .iter()
        .map(|x| {
            json!({ "node": x.node, "normal_force_n": num(x.normal_force_n), "horizontal_n": num(x.horizontal_n),
                    "friction_required": x.friction_required.map(num),
                    "bearing_pressure_pa": x.bearing_pressure_pa.map(num),
                    "utilisation": x.utilisation.map(num), "state": x.state.as_str(), "reason": x.reason })
        })
        .collect();
    json!({ "id": f.id, "normal_force_n": num(f.normal_force_n), "deflection_m": num(f.deflection_m),
            "allowable_n": num(f.allowable_n), "utilisation": num(f.utilisation), "state": f.state.as_str(), "reason": f.reason,
            "deflection_at_m": f.deflection_at_m.map(num), "total_allowable_n": f.total_allowable_n.map(num),
            "friction_limit": num(f.friction_limit), "feet": feet, "peak_at_deg": f.peak_at_deg.map(num) })
}

fn node_json(n: &NodeResult) -> Value {
    let mut o = json!({ "id": n.id, "position_m": n.position_m.map(num) });
    if !n.fittings.is_empty() {
        o["fittings"] = n.fittings.iter().map(part_json).collect();
    }
    o
}

fn support_json(s: &SupportResult) -> Value {
    let r = s.rated.as_ref();
    json!({ "node": s.node, "reaction_n": s.reaction_n.map(num),
            "rated_n": r.map(|r| num(r.wll_n)), "utilisation": r.map(|r| num(r.utilisation)),
            "state": r.map(|r| r.state.as_str()), "peak_at_deg": s.peak_at_deg.map(num) })
}

fn group_json(g: &WarningGroup) -> Value {
    json!({ "kind": g.kind.key(), "count": g.count, "subjects": g.subjects, "message": g.message })
}

/// Writes one JSON object field by field, large arrays one element a line,
/// so nothing of the size of the whole output is held in memory.
struct ObjectWriter<'w, W: Write> {
    w: &'w mut W,
    first: bool,
    indent: &'static str,
}

impl<'w, W: Write> ObjectWriter<'w, W> {
    fn open(w: &'w mut W, indent: &'static str) -> io::Result<Self> {
        w.write_all(b"{")?;
        Ok(ObjectWriter { w, first: true, indent })
    }

    fn key(&mut self, name: &str) -> io::Result<()> {
        if !self.first {
            self.w.write_all(b",")?;
        }
        self.first = false;
        write!(self.w, "\n{}  \"{name}\": ", self.indent)?;
        Ok(())
    }

    fn field<T: serde::Serialize + ?Sized>(&mut self, name: &str, v: &T) -> io::Result<()> {
        self.key(name)?;
        serde_json::to_writer(&mut *self.w, v).map_err(io::Error::other)
    }

    fn array<V: serde::Serialize>(&mut self, name: &str, items: impl IntoIterator<Item = V>) -> io::Result<()> {
        self.key(name)?;
        self.w.write_all(b"[")?;
        let mut any = false;
        for x in items {
            self.w.write_all(if any { b",\n" } else { b"\n" })?;
            any = true;
            write!(self.w, "{}    ", self.indent)?;
            serde_json::to_writer(&mut *self.w, &x).map_err(io::Error::other)?;
        }
        if any { write!(self.w, "\n{}  ]", self.indent) } else { self.w.write_all(b"]") }
    }

    fn close(self) -> io::Result<()> {
        write!(self.w, "\n{}}}", self.indent)
    }
}

fn write_case<W: Write>(w: &mut W, c: &CaseResult) -> io::Result<()> {
    let mut o = ObjectWriter::open(w, "    ")?;
    o.field("id", &c.id)?;
    o.field("kind", &c.kind)?;
    o.field("converged", &c.converged)?;
    o.field("iterations", &c.iterations)?;
    o.field("residual_n", &num(c.residual_n))?;
    if let Some(e) = &c.error {
        o.field("error", e)?;
    }
    if let Some(d) = &c.dynamic {
        let mut dj = json!({ "mass": d.mass, "factor": num(d.factor), "load_n": num(d.load_n), "formula": d.formula });
        if let Some(k) = d.path_stiffness_n_per_m {
            dj["path_stiffness_n_per_m"] = num(k);
        }
        o.field("dynamic", &dj)?;
    }
    if let Some(a) = &c.arc {
        o.field(
            "arc",
            &json!({ "release_deg": num(a.release_deg), "azimuth_deg": num(a.azimuth_deg),
                    "governing_deg": num(a.governing_deg), "angles_deg": a.angles_deg.iter().map(|x| num(*x)).collect::<Vec<_>>() }),
        )?;
    }
    o.array("members", c.members.iter().map(member_out))?;
    o.array("floors", c.floors.iter().map(floor_json))?;
    o.array("nodes", c.nodes.iter().map(node_json))?;
    o.array("supports", c.supports.iter().map(support_json))?;
    o.field("load_path_threshold", &num(LOAD_PATH_THRESHOLD))?;
    o.array("load_path", c.load_path.iter().map(path_out))?;
    if let Some(p) = &c.combined_load_path {
        o.field("combined_load_path", &path_out(p))?;
    }
    let mut limits = Map::new();
    if let Some(r) = c.limits.release_deg {
        limits.insert("release_deg".into(), num(r));
    }
    if let Some(h) = c.limits.drop_height_m {
        limits.insert("drop_height_m".into(), num(h));
    }
    o.field("limits", &Value::Object(limits))?;
    o.field("warnings", &c.warnings)?;
    o.array("warning_groups", c.warning_groups().iter().map(group_json))?;
    o.close()
}

fn comparison_json(r: &ComparisonRow) -> Value {
    json!({ "id": r.id, "static_force_n": r.static_force_n.map(num), "force_n": r.force_n.iter().map(|f| f.map(num)).collect::<Vec<_>>(),
            "ratio_to_static": r.ratio_to_static.iter().map(|f| f.map(num)).collect::<Vec<_>>(),
            "allowable_n": num(r.allowable_n), "utilisation": r.utilisation.iter().map(|f| f.map(num)).collect::<Vec<_>>(),
            "governing_case": r.governing_case,
            "limits": { "release_deg": r.limits.release_deg.map(num), "drop_height_m": r.limits.drop_height_m.map(num) } })
}

/// Write the contract's JSON object for one file's analysis to `w` as it
/// goes (a member, node or path per line), never the whole text at once.
///
/// # Errors
/// Whatever writing to `w` fails with.
pub fn write_check_json<W: Write>(w: &mut W, file: &str, a: &Analysis) -> io::Result<()> {
    let mut o = ObjectWriter::open(w, "")?;
    o.field("file", file)?;
    o.field("title", &a.title)?;
    o.field("caution", &a.caution)?;
    o.field("verdict", a.verdict().as_str())?;
    if let Some(wst) = crate::analysis::worst(a) {
        let kind = match wst.kind {
            crate::analysis::ItemKind::Member => "member",
            crate::analysis::ItemKind::Floor => "floor",
            crate::analysis::ItemKind::Part => "part",
        };
        o.field(
            "worst",
            &json!({ "id": wst.id, "kind": kind, "case": wst.case, "state": wst.state.as_str(),
                     "utilisation": num(wst.utilisation) }),
        )?;
    }
    o.field("scope", &json!({ "checked": a.scope.checked, "not_checked": a.scope.not_checked }))?;
    o.key("cases")?;
    o.w.write_all(b"[")?;
    for (i, c) in a.cases.iter().enumerate() {
        o.w.write_all(if i == 0 { b"\n  " } else { b",\n  " })?;
        write_case(o.w, c)?;
    }
    o.w.write_all(if a.cases.is_empty() { b"]" } else { b"\n  ]" })?;
    o.array("comparison", a.comparison.iter().map(comparison_json))?;
    let groups = a.warning_groups();
    o.field("warnings", &groups.iter().map(|g| g.message.as_str()).collect::<Vec<_>>())?;
    o.array("warning_groups", groups.iter().map(group_json))?;
    o.field("assumptions", &a.assumptions)?;
    o.close()
}

/// The contract's JSON object for one file's analysis, as a value (the
/// same text [`write_check_json`] streams, read back).
pub fn check_json(file: &str, a: &Analysis) -> Value {
    let mut buf = Vec::new();
    match write_check_json(&mut buf, file, a) {
        Ok(()) => serde_json::from_slice(&buf).unwrap_or(Value::Null),
        Err(_) => Value::Null,
    }
}
