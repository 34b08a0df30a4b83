//! `check --format text`: aligned tables readable in a terminal, the
//! caution first and last.

use crate::CAUTION;
use crate::analysis::{Analysis, CaseResult, LOAD_PATH_THRESHOLD, LoadPathResult};
use crate::report::{Columns, UnitSystem};
use crate::units::format_number;
use std::fmt::Write;

/// A value (SI) in the column unit `unit` (symbol, SI value of one), four
/// significant digits; `-` where not finite or where the division overflows.
fn conv(v: f64, unit: (&str, f64), digits: usize) -> String {
    let x = v / unit.1;
    if x.is_finite() { format_number(x, digits) } else { "-".to_string() }
}

fn kn(u: &Columns, v: f64) -> String {
    conv(v, u.force, 4)
}

/// A column header with its SI unit word replaced by the chosen system's:
/// `kN` by the force unit, `mm` by the small length, `m` by the length,
/// `kPa` by the pressure.
fn head(h: &str, u: &Columns) -> String {
    h.split(' ')
        .map(|w| match w {
            "kN" => u.force.0,
            "mm" => u.small.0,
            "m" => u.length.0,
            "kPa" => u.pressure.0,
            w => w,
        })
        .collect::<Vec<_>>()
        .join(" ")
}

fn heads(hs: &[&str], u: &Columns) -> Vec<String> {
    hs.iter().map(|h| head(h, u)).collect()
}

fn pct(v: f64) -> String {
    if v.is_finite() { format!("{:.1}", v * 100.0) } else { "-".to_string() }
}

/// A table with a header row, columns padded to their widest cell; numeric
/// columns right-aligned.
pub fn table(header: &[&str], rows: &[Vec<String>], right: &[bool]) -> String {
    let mut widths: Vec<usize> = header.iter().map(|h| h.chars().count()).collect();
    for r in rows {
        for (i, c) in r.iter().enumerate() {
            if i < widths.len() {
                widths[i] = widths[i].max(c.chars().count());
            }
        }
    }
    let mut out = String::new();
    let line = |cells: Vec<String>, out: &mut String| {
        let mut s = String::new();
        for (i, c) in cells.iter().enumerate() {
            let w = widths.get(i).copied().unwrap_or(0);
            let pad = w.saturating_sub(c.chars().count());
            if right.get(i).copied().unwrap_or(false) {
                s.push_str(&" ".repeat(pad));
                s.push_str(c);
            } else {
                s.push_str(c);
                s.push_str(&" ".repeat(pad));
            }
            s.push_str("  ");
        }
        out.push_str(s.trim_end());
        out.push('\n');
    };
    line(header.iter().map(|h| h.to_string()).collect(), &mut out);
    line(widths.iter().map(|w| "-".repeat(*w)).collect(), &mut out);
    for r in rows {
        line(r.clone(), &mut out);
    }
    out
}

fn case_text(c: &CaseResult, out: &mut String, u: &Columns) {
    let _ = writeln!(out, "\nCase {} ({})", c.id, c.kind);
    if let Some(e) = &c.error {
        let _ = writeln!(out, "  not solved: {e}");
        return;
    }
    if let Some(d) = &c.dynamic {
        let _ = writeln!(
            out,
            "  load on mass {}: {} {} = {} x weight; {}",
            d.mass,
            kn(u, d.load_n),
            u.force.0,
            format_number(d.factor, 4),
            d.formula
        );
    }
    let _ = writeln!(out, "  converged in {} iterations, out-of-balance {:.2e} N", c.iterations, c.residual_n);
    let waves = matches!(c.kind.as_str(), "drop" | "sudden");
    let swing = c.arc.is_some();
    if let Some(a) = &c.arc {
        let _ = writeln!(
            out,
            "  swept over the arc: {} angles from -{} to +{} deg (azimuth {} deg); each member at its own peak (\"peak at deg\"); shape shown at {} deg",
            a.angles_deg.len(),
            format_number(a.release_deg, 4),
            format_number(a.release_deg, 4),
            format_number(a.azimuth_deg, 4),
            format_number(a.governing_deg, 4)
        );
    }
    let rows: Vec<Vec<String>> = c
        .members
        .iter()
        .map(|m| {
            let mut row = vec![
                m.id.clone(),
                kn(u, m.force_n),
                kn(u, m.allowable_n),
                pct(m.utilisation),
                m.state.as_str().to_string(),
                conv(m.stretch_m, u.small, 4),
                conv(m.sag_m, u.small, 3),
                format_number(m.sling_angle_deg, 3),
            ];
            if waves {
                row.push(m.wave_transit_s.map_or("-".into(), |t| format_number(t * 1e3, 3)));
            }
            if swing {
                row.push(m.peak_at_deg.map_or("-".into(), |t| format_number(t, 3)));
            }
            row
        })
        .collect();
    let mut header = heads(
        &[
            "member",
            "force kN",
            "allowable kN",
            "util %",
            "state",
            "stretch mm",
            "sag mm",
            "sling angle deg from horizontal",
        ],
        u,
    );
    let mut right = vec![false, true, true, true, false, true, true, true];
    if waves {
        header.push("wave transit ms".into());
        right.push(true);
    }
    if swing {
        header.push("peak at deg".into());
        right.push(true);
    }
    let header: Vec<&str> = header.iter().map(String::as_str).collect();
    out.push_str(&indent(&table(&header, &rows, &right)));
    for m in &c.members {
        if let (Some(e), Some(b)) = (m.euler_n, m.buckling_resistance_n) {
            let _ = writeln!(
                out,
                "  strut {}: Euler load {} {f}, buckling resistance chi A f_y {} {f}",
                m.id,
                kn(u, e),
                kn(u, b),
                f = u.force.0
            );
        }
        if let Some(r) = &m.reason {
            let _ = writeln!(out, "  unchecked {}: {r}", m.id);
        }
        if !m.segments.is_empty() {
            let spans: Vec<String> =
                m.segments.iter().map(|g| format!("{}-{} {} {}", g.from, g.to, kn(u, g.force_n), u.force.0)).collect();
            let _ = writeln!(out, "  rope {} over sheaves, tension per span: {}", m.id, spans.join(", "));
        }
    }
    if !c.floors.is_empty() {
        let rows: Vec<Vec<String>> = c
            .floors
            .iter()
            .map(|f| {
                vec![
                    f.id.clone(),
                    kn(u, f.normal_force_n),
                    kn(u, f.allowable_n),
                    conv(f.deflection_m, u.small, 4),
                    conv(f.deflection_limit_m, u.small, 4),
                    pct(f.utilisation),
                    f.state.as_str().to_string(),
                ]
            })
            .collect();
        let h = heads(&["floor", "normal kN", "allowable kN", "deflection mm", "limit mm", "util %", "state"], u);
        out.push_str(&indent(&table(
            &h.iter().map(String::as_str).collect::<Vec<_>>(),
            &rows,
            &[false, true, true, true, true, true, false],
        )));
        let feet: Vec<Vec<String>> = c
            .floors
            .iter()
            .flat_map(|f| {
                f.feet.iter().map(move |x| {
                    vec![
                        f.id.clone(),
                        x.node.clone(),
                        kn(u, x.normal_force_n),
                        kn(u, x.horizontal_n),
                        x.friction_required.map_or_else(|| "-".to_string(), |m| format_number(m, 3)),
                        format_number(f.friction_limit, 3),
                        x.bearing_pressure_pa.map_or_else(|| "-".to_string(), |p| conv(p, u.pressure, 4)),
                        x.utilisation.map_or_else(|| "-".to_string(), pct),
                        x.state.as_str().to_string(),
                    ]
                })
            })
            .collect();
        if !feet.is_empty() {
            let h = heads(
                &["floor", "foot", "normal kN", "horizontal kN", "friction", "limit", "bearing kPa", "util %", "state"],
                u,
            );
            out.push_str(&indent(&table(
                &h.iter().map(String::as_str).collect::<Vec<_>>(),
                &feet,
                &[false, false, true, true, true, true, true, true, false],
            )));
        }
    }
    let parts: Vec<Vec<String>> = c
        .part_ids()
        .into_iter()
        .zip(c.parts())
        .map(|(id, p)| {
            vec![
                id,
                p.kind.clone(),
                kn(u, p.force_n),
                kn(u, p.wll_n),
                kn(u, p.rated_wll_n),
                pct(p.utilisation),
                p.state.as_str().to_string(),
                p.angle_deg.map_or("-".into(), |a| format_number(a, 3)),
            ]
        })
        .collect();
    if !parts.is_empty() {
        let h = heads(
            &["rated part", "kind", "force kN", "WLL used kN", "WLL rated kN", "util %", "state", "angle deg"],
            u,
        );
        out.push_str(&indent(&table(
            &h.iter().map(String::as_str).collect::<Vec<_>>(),
            &parts,
            &[false, false, true, true, true, true, false, true],
        )));
        let _ = writeln!(
            out,
            "  (angle: an eye bolt's pull from its axis; a hoist's line from plumb. A fitting at a joint carries the resultant of the members above it.)"
        );
    }
    // a few masses: each path; many: the combined path, each mass's in JSON
    if c.load_path.len() <= PATHS_IN_TEXT {
        for p in &c.load_path {
            path_line(out, &format!("load path of {}", p.mass), p);
        }
    } else if let Some(p) = &c.combined_load_path {
        path_line(out, &format!("load path of all {} masses together", c.load_path.len()), p);
        let _ = writeln!(out, "  (each mass's own path: --format json, `load_path`)");
    }
    if let Some(r) = c.limits.release_deg {
        let _ = writeln!(out, "  largest release angle inside the allowable: {} deg", format_number(r, 4));
    }
    if let Some(h) = c.limits.drop_height_m {
        let _ = writeln!(out, "  largest drop height inside the allowable: {} {}", conv(h, u.length, 4), u.length.0);
    }
    for w in &c.warnings {
        let _ = writeln!(out, "  warning: {w}");
    }
}

/// Up to this many masses the text lists each one's path.
const PATHS_IN_TEXT: usize = 10;

/// Members (and supports) named in a path's line; the rest are counted.
const PATH_ITEMS_IN_TEXT: usize = 8;

/// "a 50 %, b 50 %" of the largest shares, "and N more" for the rest listed.
fn shares_text(ids: &[String], shares: &[f64]) -> String {
    let mut order: Vec<usize> = (0..ids.len()).collect();
    order.sort_by(|&a, &b| shares[b].total_cmp(&shares[a]));
    let shown: Vec<String> =
        order.iter().take(PATH_ITEMS_IN_TEXT).map(|&k| format!("{} {} %", ids[k], pct(shares[k]))).collect();
    let more = ids.len().saturating_sub(PATH_ITEMS_IN_TEXT);
    if more > 0 { format!("{} and {more} more", shown.join(", ")) } else { shown.join(", ") }
}

fn path_line(out: &mut String, what: &str, p: &LoadPathResult) {
    let mut below = String::new();
    if p.not_listed > 0 {
        below.push_str(&format!(
            " (+{} more at or above {} %)",
            p.not_listed,
            format_number(LOAD_PATH_THRESHOLD * 100.0, 3)
        ));
    }
    if p.below_threshold > 0 {
        below.push_str(&format!(
            " (+{} members below {} % each)",
            p.below_threshold,
            format_number(LOAD_PATH_THRESHOLD * 100.0, 3)
        ));
    }
    let untraced = if p.untraced_worth_saying() {
        format!(" ({} % of the weight not traced to a support: {})", pct(p.untraced), LoadPathResult::UNTRACED_REASON)
    } else {
        String::new()
    };
    let _ = writeln!(
        out,
        "  {what}: {}{below} -> {}{untraced}",
        shares_text(&p.members, &p.shares),
        shares_text(&p.supports, &p.support_shares)
    );
}

fn indent(s: &str) -> String {
    s.lines().map(|l| format!("  {l}\n")).collect()
}

/// The comparison table: static force, each case's force and utilisation,
/// governing case and limits per member and floor.
pub fn comparison_text(a: &Analysis) -> String {
    comparison_text_in(a, UnitSystem::Si)
}

/// [`comparison_text`] in the chosen units.
pub fn comparison_text_in(a: &Analysis, units: UnitSystem) -> String {
    let u = &units.columns();
    let mut header: Vec<String> = vec!["item".into(), head("static kN", u)];
    for c in &a.cases {
        header.push(format!("{} {}", c.id, u.force.0));
        header.push("x static".into());
        header.push("util %".into());
    }
    header.extend([head("allowable kN", u), "governs".into(), "max release deg".into(), head("max drop m", u)]);
    let rows: Vec<Vec<String>> = a
        .comparison
        .iter()
        .map(|r| {
            let mut row = vec![r.id.clone(), r.static_force_n.map_or("-".into(), |v| kn(u, v))];
            for i in 0..a.cases.len() {
                row.push(r.force_n.get(i).copied().flatten().map_or("-".into(), |v| kn(u, v)));
                row.push(r.ratio_to_static.get(i).copied().flatten().map_or("-".into(), |x| format_number(x, 3)));
                row.push(r.utilisation.get(i).copied().flatten().map_or("-".into(), pct));
            }
            row.push(kn(u, r.allowable_n));
            row.push(r.governing_case.clone().unwrap_or_else(|| "-".into()));
            row.push(r.limits.release_deg.map_or("-".into(), |x| format_number(x, 3)));
            row.push(r.limits.drop_height_m.map_or("-".into(), |x| conv(x, u.length, 3)));
            row
        })
        .collect();
    let h: Vec<&str> = header.iter().map(String::as_str).collect();
    let right: Vec<bool> = (0..h.len()).map(|i| i != 0 && h[i] != "governs").collect();
    table(&h, &rows, &right)
}

/// The whole text report of one file, in SI units.
pub fn check_text(file: &str, a: &Analysis) -> String {
    check_text_in(file, a, UnitSystem::Si)
}

/// The whole text report of one file in the chosen units (the file keeps
/// its own; only what is printed changes).
pub fn check_text_in(file: &str, a: &Analysis, units: UnitSystem) -> String {
    let u = &units.columns();
    let mut out = String::new();
    let _ = writeln!(out, "{file}: {}", a.title);
    let _ = writeln!(out, "CAUTION: {CAUTION}");
    let _ = writeln!(out, "Units: {}", units.name());
    for c in &a.cases {
        case_text(c, &mut out, u);
    }
    if !a.comparison.is_empty() {
        let _ = writeln!(out, "\nComparison (per member, floor and rated part, every case)");
        out.push_str(&indent(&comparison_text_in(a, units)));
    }
    if !a.warnings.is_empty() {
        let _ = writeln!(out);
        for g in a.warning_groups() {
            let _ = writeln!(out, "warning: {}", g.message);
        }
    }
    out.push_str(&scope_text(a));
    let _ = writeln!(out, "\nCAUTION: {CAUTION}");
    out
}

/// The verdict and the scope: what was checked and what was not.
pub fn scope_text(a: &Analysis) -> String {
    let mut out = String::new();
    let _ = writeln!(out, "\nVerdict: {}", a.verdict().words());
    if let Some(w) = crate::analysis::worst(a) {
        let _ = writeln!(out, "  {}", w.line());
    }
    let _ = writeln!(out, "Checked:");
    for c in &a.scope.checked {
        let _ = writeln!(out, "  - {c}");
    }
    let _ = writeln!(out, "Not checked (a competent person must):");
    for c in &a.scope.not_checked {
        let _ = writeln!(out, "  - {c}");
    }
    out
}

#[cfg(test)]
mod path_line_tests {
    use super::*;

    // The untraced part of a path is said from the listing threshold (1 %)
    // up, with its reason; below it the line is as before.
    #[test]
    fn untraced_weight_is_said_from_one_percent() {
        let path = LoadPathResult::one_member;
        let mut out = String::new();
        path_line(&mut out, "load path of w", &path(0.25));
        assert!(out.contains("(25.0 % of the weight not traced to a support: flows too small to follow"), "{out}");
        let mut out = String::new();
        path_line(&mut out, "load path of w", &path(0.005));
        assert!(!out.contains("not traced"), "{out}");
    }
}
