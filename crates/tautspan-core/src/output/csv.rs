//! `check --format csv`: one row per case and item (member, floor or rated part), with
//! the case's limits; the caution on a leading `#` line.

use std::io::{self, Write};

use crate::CAUTION;
use crate::analysis::Analysis;
use crate::report::UnitSystem;
use crate::units::unit;

/// Quote a CSV field when it needs it (RFC 4180).
pub fn field(s: &str) -> String {
    if s.contains([',', '"', '\n', '\r']) { format!("\"{}\"", s.replace('"', "\"\"")) } else { s.to_string() }
}

fn num(v: f64) -> String {
    if v.is_finite() { format!("{v}") } else { String::new() }
}

fn opt(v: Option<f64>) -> String {
    v.map(num).unwrap_or_default()
}

/// The CSV header line.
pub const HEADER: &str = "file,case,kind,item,item_type,force_n,allowable_n,utilisation,state,stretch_m,deflection_m,ratio_to_static,governing_case,release_limit_deg,drop_limit_m,sling_angle_from_horizontal_deg,euler_n,buckling_resistance_n";

/// The SI columns renamed in US customary units (lbf, in, ft), and the
/// divisor that takes each from SI.
const US_COLUMNS: &[(&str, &str, &str)] = &[
    ("force_n", "force_lbf", "lbf"),
    ("allowable_n", "allowable_lbf", "lbf"),
    ("stretch_m", "stretch_in", "in"),
    ("deflection_m", "deflection_in", "in"),
    ("drop_limit_m", "drop_limit_ft", "ft"),
    ("euler_n", "euler_lbf", "lbf"),
    ("buckling_resistance_n", "buckling_resistance_lbf", "lbf"),
];

/// The header line in the chosen units: SI's [`HEADER`], or the same columns
/// with the unit in each name changed (`force_lbf`, `stretch_in`, `drop_limit_ft`).
pub fn header_in(units: UnitSystem) -> String {
    match units {
        UnitSystem::Si => HEADER.to_string(),
        UnitSystem::UsCustomary => HEADER
            .split(',')
            .map(|c| US_COLUMNS.iter().find(|u| u.0 == c).map_or(c, |u| u.1))
            .collect::<Vec<_>>()
            .join(","),
    }
}

/// Divisors from SI to the written unit: (force, small length, length).
#[derive(Clone, Copy)]
struct Scale {
    force: f64,
    small: f64,
    length: f64,
}

impl Scale {
    fn of(units: UnitSystem) -> Scale {
        // the file table's exact factors (NIST SP 811 B.8); 1 where SI
        let f = |s: &str| unit(s).map_or(1.0, |u| u.to_si);
        match units {
            UnitSystem::Si => Scale { force: 1.0, small: 1.0, length: 1.0 },
            UnitSystem::UsCustomary => Scale { force: f("lbf"), small: f("in"), length: f("ft") },
        }
    }
}

/// The caution line (as a `#` comment) for the top of a CSV output.
pub fn caution_line() -> String {
    format!("# {CAUTION}")
}

/// The verdict and scope of one file as `#` comment lines.
pub fn scope_lines(file: &str, a: &Analysis) -> String {
    let mut out = format!("# {file}: verdict {}\n", a.verdict().words());
    if a.cases.iter().any(|c| c.parts().next().is_some()) {
        out.push_str(&format!(
            "# {file}: rows of item_type part: item is owner/part (leg-1/shackle, A1/anchor), force_n the force the part carries, allowable_n its WLL used (an eye bolt's derated by its angle from the axis)\n"
        ));
    }
    for c in &a.scope.checked {
        out.push_str(&format!("# {file}: checked: {c}\n"));
    }
    for c in &a.scope.not_checked {
        out.push_str(&format!("# {file}: not checked: {c}\n"));
    }
    out
}

/// The rows of one file (no header), after its verdict and scope lines.
pub fn check_csv_rows(file: &str, a: &Analysis) -> String {
    let mut buf = Vec::new();
    // writing to memory cannot fail
    let _ = write_csv_rows(&mut buf, file, a);
    String::from_utf8_lossy(&buf).into_owned()
}

/// Write the rows of one file (no header), after its verdict and scope
/// lines, to `w` row by row (a large rig's table never sits whole in memory).
///
/// # Errors
/// Whatever writing to `w` fails with.
pub fn write_csv_rows<W: Write>(w: &mut W, file: &str, a: &Analysis) -> io::Result<()> {
    write_csv_rows_in(w, file, a, UnitSystem::Si)
}

/// [`write_csv_rows`] in the chosen units (the columns of [`header_in`]).
///
/// # Errors
/// Whatever writing to `w` fails with.
pub fn write_csv_rows_in<W: Write>(w: &mut W, file: &str, a: &Analysis, units: UnitSystem) -> io::Result<()> {
    let sc = Scale::of(units);
    let force = |v: f64| num(v / sc.force);
    let small = |v: f64| num(v / sc.small);
    w.write_all(scope_lines(file, a).as_bytes())?;
    for (ci, c) in a.cases.iter().enumerate() {
        let lim = (opt(c.limits.release_deg), opt(c.limits.drop_height_m.map(|h| h / sc.length)));
        for (k, m) in c.members.iter().enumerate() {
            let row = a.comparison.get(k);
            writeln!(
                w,
                "{}",
                [
                    field(file),
                    field(&c.id),
                    field(&c.kind),
                    field(&m.id),
                    "member".into(),
                    force(m.force_n),
                    force(m.allowable_n),
                    num(m.utilisation),
                    m.state.as_str().into(),
                    small(m.stretch_m),
                    String::new(),
                    opt(row.and_then(|r| r.ratio_to_static.get(ci).copied().flatten())),
                    field(row.and_then(|r| r.governing_case.as_deref()).unwrap_or("")),
                    lim.0.clone(),
                    lim.1.clone(),
                    num(m.sling_angle_deg),
                    opt(m.euler_n.map(|v| v / sc.force)),
                    opt(m.buckling_resistance_n.map(|v| v / sc.force)),
                ]
                .join(","),
            )?;
        }
        for (k, f) in c.floors.iter().enumerate() {
            let row = a.comparison.get(c.members.len() + k);
            writeln!(
                w,
                "{}",
                [
                    field(file),
                    field(&c.id),
                    field(&c.kind),
                    field(&f.id),
                    "floor".into(),
                    force(f.normal_force_n),
                    force(f.allowable_n),
                    num(f.utilisation),
                    f.state.as_str().into(),
                    String::new(),
                    small(f.deflection_m),
                    opt(row.and_then(|r| r.ratio_to_static.get(ci).copied().flatten())),
                    field(row.and_then(|r| r.governing_case.as_deref()).unwrap_or("")),
                    lim.0.clone(),
                    lim.1.clone(),
                    String::new(),
                    String::new(),
                    String::new(),
                ]
                .join(","),
            )?;
            for x in &f.feet {
                // a foot: force its normal force, allowable the rated
                // concentrated load (empty without one), item "floor/node"
                writeln!(
                    w,
                    "{}",
                    [
                        field(file),
                        field(&c.id),
                        field(&c.kind),
                        field(&format!("{}/{}", f.id, x.node)),
                        "foot".into(),
                        force(x.normal_force_n),
                        if x.utilisation.is_some() { force(f.allowable_n) } else { String::new() },
                        opt(x.utilisation),
                        x.state.as_str().into(),
                        String::new(),
                        String::new(),
                        String::new(),
                        String::new(),
                        lim.0.clone(),
                        lim.1.clone(),
                        String::new(),
                        String::new(),
                        String::new(),
                    ]
                    .join(","),
                )?;
            }
        }
        // rated parts after the floors, as in the comparison
        let first = c.members.len() + c.floors.len();
        for (k, (id, p)) in c.part_ids().into_iter().zip(c.parts()).enumerate() {
            let row = a.comparison.get(first + k);
            writeln!(
                w,
                "{}",
                [
                    field(file),
                    field(&c.id),
                    field(&c.kind),
                    field(&id),
                    "part".into(),
                    force(p.force_n),
                    force(p.wll_n),
                    num(p.utilisation),
                    p.state.as_str().into(),
                    String::new(),
                    String::new(),
                    opt(row.and_then(|r| r.ratio_to_static.get(ci).copied().flatten())),
                    field(row.and_then(|r| r.governing_case.as_deref()).unwrap_or("")),
                    lim.0.clone(),
                    lim.1.clone(),
                    String::new(),
                    String::new(),
                    String::new(),
                ]
                .join(","),
            )?;
        }
    }
    Ok(())
}
