//! Plots: the selected member's peak force over the swing's arc
//! against release angle, with its allowable, the case's own release angle
//! and the largest release angle inside the allowable drawn as lines, tick
//! labels on both axes and the key above the plot, off the curve; and its
//! time history from the core's simulation, of the dynamic case shown (the
//! first dynamic case while a static one is shown). Both run on worker
//! threads (progress shown, the simulation can be cancelled), so the UI
//! never waits on them.

use crate::document::Document;
use crate::document::core_bridge::{CurvePoint, simulate, swing_curve};
use crate::document::derived::Derived;
use crate::document::selection::Selection;
use crate::fields::units_display::{Shown, UnitSystem};
use egui::{Color32, RichText, Ui};
use egui_plot::{GridMark, HLine, Line, LineStyle, Plot, VLine};
use std::ops::RangeInclusive;
use std::sync::Arc;
use std::sync::atomic::{AtomicBool, AtomicU32, Ordering};
use std::sync::mpsc::{Receiver, TryRecvError, channel};
use tautspan_core::analysis::CaseSimulation;
use tautspan_core::file::CaseDto;

/// Angles of the curve, degrees.
const ANGLES: [f64; 19] =
    [0.0, 5.0, 10.0, 15.0, 20.0, 25.0, 30.0, 35.0, 40.0, 45.0, 50.0, 55.0, 60.0, 65.0, 70.0, 75.0, 80.0, 85.0, 90.0];

type CurveKey = (u64, String, String);
type Curve = Result<Vec<CurvePoint>, String>;

/// A simulation running on a worker thread.
struct SimJob {
    progress: Arc<AtomicU32>,
    cancel: Arc<AtomicBool>,
    rx: Receiver<Result<CaseSimulation, String>>,
    key: (u64, String),
}

/// The plots' state: caches and running jobs.
#[derive(Default)]
pub struct Plots {
    curve: Option<(CurveKey, Curve)>,
    curve_job: Option<(CurveKey, Receiver<Curve>)>,
    sim: Option<((u64, String), Result<CaseSimulation, String>)>,
    sim_job: Option<SimJob>,
}

impl std::fmt::Debug for Plots {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("Plots").field("curve_cached", &self.curve.is_some()).finish()
    }
}

/// Colour of the member's force.
const CURVE: Color32 = Color32::from_rgb(0x2a, 0x7a, 0xd8);
/// Colour of the allowable.
const ALLOWABLE: Color32 = Color32::from_rgb(0xb0, 0x3a, 0x2e);
/// Colour of the largest release inside the allowable.
const LIMIT: Color32 = Color32::from_rgb(0xd1, 0x93, 0x2a);
/// Colour of the case's own release angle.
const CASE_ANGLE: Color32 = Color32::from_rgb(0x3c, 0x8c, 0x4a);

/// A tick label on the release-angle axis: whole degrees.
pub fn angle_tick(mark: GridMark, _range: &RangeInclusive<f64>) -> String {
    format!("{:.0}°", mark.value)
}

/// A tick label on a force axis: the number in the display unit, as many
/// decimals as the step between ticks needs.
pub fn force_tick(mark: GridMark, _range: &RangeInclusive<f64>) -> String {
    let decimals = if mark.step_size >= 1.0 { 0 } else { (-mark.step_size.log10()).ceil() as usize };
    let v = if mark.value.abs() < mark.step_size * 1e-6 { 0.0 } else { mark.value };
    format!("{v:.decimals$}")
}

/// The key of a plot, above it: one coloured entry per line.
fn plot_key(ui: &mut Ui, entries: &[(Color32, String)]) {
    ui.horizontal_wrapped(|ui| {
        for (c, text) in entries {
            let (r, _) = ui.allocate_exact_size(egui::vec2(16.0, 10.0), egui::Sense::hover());
            ui.painter().line_segment([r.left_center(), r.right_center()], egui::Stroke::new(2.5, *c));
            ui.label(RichText::new(text).color(*c).small());
        }
    });
}

/// The case a time history runs: the case shown when it is dynamic, else
/// the first dynamic case (a static case has no history to run).
pub fn history_case<'a>(doc: &'a Document, shown: Option<&str>) -> Option<&'a CaseDto> {
    let dynamic = || doc.dto.cases.iter().filter(|c| !matches!(c, CaseDto::Static { .. }));
    dynamic().find(|c| Some(c.id()) == shown).or_else(|| dynamic().next())
}

/// What to say over a finished run: `None` when it is of the case and the
/// results shown; else that the scenario changed (another revision), or
/// that the run is of another case.
pub fn run_note(run: &(u64, String), now: &(u64, String)) -> Option<String> {
    if run.0 != now.0 {
        Some("The scenario changed since this run; run it again.".to_string())
    } else if run.1 != now.1 {
        Some(format!("This run is of case {}; run again for case {}.", run.1, now.1))
    } else {
        None
    }
}

fn swing_case<'a>(doc: &'a Document, shown: Option<&str>) -> Option<&'a CaseDto> {
    let swings = || doc.dto.cases.iter().filter(|c| matches!(c, CaseDto::Swing { .. }));
    swings().find(|c| Some(c.id()) == shown).or_else(|| swings().next())
}

impl Plots {
    /// Draw both plots for the selected member.
    pub fn ui(
        &mut self,
        ui: &mut Ui,
        doc: &Document,
        derived: &Derived,
        selection: &Selection,
        shown: Option<&str>,
        units: UnitSystem,
    ) {
        let Selection::Member(member) = selection else {
            ui.label("Select a member to plot its force against release angle and its time history.");
            return;
        };
        let Some(solved) = derived.solved.as_ref() else {
            ui.label("No results: the scenario has problems.");
            return;
        };
        let allowable = solved
            .analysis
            .cases
            .first()
            .and_then(|c| c.members.iter().find(|m| &m.id == member))
            .map(|m| m.allowable_n);
        ui.columns(2, |cols| {
            self.curve_ui(&mut cols[0], doc, derived, member, shown, allowable, units);
            self.sim_ui(&mut cols[1], doc, derived, member, shown, allowable, units);
        });
    }

    #[allow(clippy::too_many_arguments)]
    fn curve_ui(
        &mut self,
        ui: &mut Ui,
        doc: &Document,
        derived: &Derived,
        member: &str,
        shown: Option<&str>,
        allowable: Option<f64>,
        units: UnitSystem,
    ) {
        let Some(case) = swing_case(doc, shown) else {
            ui.label("Add a swing case to see force against release angle.");
            return;
        };
        ui.label(
            RichText::new(format!("{member}: peak force over the arc against release angle (case {})", case.id()))
                .strong(),
        );
        // keyed by the revision of the results, not the document: while they
        // update, the curve belongs to the scenario they were found for
        let key: CurveKey = (derived.revision, case.id().to_string(), member.to_string());
        let done = self.curve_job.as_ref().and_then(|(_, rx)| match rx.try_recv() {
            Ok(points) => Some(points),
            Err(TryRecvError::Empty) => None,
            Err(TryRecvError::Disconnected) => Some(Err("the curve's worker stopped without an answer".to_string())),
        });
        if let Some(points) = done
            && let Some((k, _)) = self.curve_job.take()
        {
            self.curve = Some((k, points));
        }
        let fresh = self.curve.as_ref().is_some_and(|(k, _)| *k == key);
        let running = self.curve_job.as_ref().is_some_and(|(k, _)| *k == key);
        // one curve job at a time: while a node is dragged the results change
        // every few frames, and the newest key is started when the job in
        // hand is done, not beside it
        if !fresh && self.curve_job.is_none() {
            let (tx, rx) = channel();
            let Some(solved) = derived.solved.clone() else { return };
            let (c, m) = (key.1.clone(), key.2.clone());
            let ctx = ui.ctx().clone();
            std::thread::spawn(move || {
                let _ = tx.send(swing_curve(&solved.scenario, &c, &m, &ANGLES));
                ctx.request_repaint();
            });
            self.curve_job = Some((key.clone(), rx));
        }
        if running || !fresh {
            ui.horizontal(|ui| {
                ui.spinner();
                ui.label("re-solving at each release angle…");
            });
        }
        let Some((_, points)) = &self.curve else { return };
        let points = match points {
            Ok(p) => p,
            Err(e) => {
                ui.label(RichText::new(e).color(crate::fields::qty_field::ERROR));
                return;
            }
        };
        let limit = derived
            .solved
            .as_ref()
            .and_then(|s| s.analysis.comparison.iter().find(|r| r.id == member))
            .and_then(|r| r.limits.release_deg);
        // the case's own release angle, as the core swept it
        let own = derived
            .solved
            .as_ref()
            .and_then(|s| s.analysis.cases.iter().find(|c| c.id == case.id()))
            .and_then(|c| c.arc.as_ref())
            .map(|a| a.release_deg);
        let pts: Vec<[f64; 2]> = points.iter().map(|p| [p.release_deg, units.value(p.force_n, Shown::Force)]).collect();
        let unit = units.unit(Shown::Force);
        let mut entries = vec![(CURVE, "peak force over the arc".to_string())];
        if let Some(a) = allowable {
            entries.push((ALLOWABLE, format!("allowable {}", units.fmt(a, Shown::Force))));
        }
        if let Some(d) = own {
            entries.push((CASE_ANGLE, format!("case {}: release {d:.1}°", case.id())));
        }
        if let Some(d) = limit {
            entries.push((LIMIT, format!("largest release inside the allowable {d:.1}°")));
        }
        plot_key(ui, &entries);
        Plot::new("swing-curve")
            .x_axis_label("release angle from vertical (deg)")
            .y_axis_label(format!("force ({unit})"))
            .show_axes([true, true])
            .x_axis_formatter(angle_tick)
            .y_axis_formatter(force_tick)
            .y_axis_min_width(44.0)
            .include_x(0.0)
            .include_x(90.0)
            .include_y(0.0)
            .height(ui.available_height().max(120.0))
            .show(ui, |p| {
                p.line(Line::new("peak force over the arc", pts).color(CURVE).width(2.0));
                if let Some(a) = allowable {
                    p.hline(
                        HLine::new("allowable", units.value(a, Shown::Force))
                            .color(ALLOWABLE)
                            .style(LineStyle::dashed_loose()),
                    );
                }
                if let Some(d) = own {
                    p.vline(VLine::new("case release", d).color(CASE_ANGLE).style(LineStyle::dashed_dense()));
                }
                if let Some(d) = limit {
                    p.vline(VLine::new("largest release inside the allowable", d).color(LIMIT));
                }
            });
    }

    #[allow(clippy::too_many_arguments)]
    fn sim_ui(
        &mut self,
        ui: &mut Ui,
        doc: &Document,
        derived: &Derived,
        member: &str,
        shown: Option<&str>,
        allowable: Option<f64>,
        units: UnitSystem,
    ) {
        let Some(case) = history_case(doc, shown) else {
            ui.label("Add a swing, drop or sudden case to run a time history.");
            return;
        };
        let case_id = case.id().to_string();
        ui.label(RichText::new(format!("{member}: time history of case {case_id}")).strong());
        let Some(solved) = derived.solved.as_ref() else { return };
        let key = (derived.revision, case_id.clone());
        if let Some(job) = &self.sim_job
            && let Ok(r) = job.rx.try_recv()
        {
            self.sim = Some((job.key.clone(), r));
            self.sim_job = None;
        }
        ui.horizontal(|ui| {
            if let Some(job) = &self.sim_job {
                let f = f32::from_bits(job.progress.load(Ordering::Relaxed));
                ui.add(egui::ProgressBar::new(f).show_percentage().desired_width(160.0));
                if ui.button("Cancel").clicked() {
                    job.cancel.store(true, Ordering::Relaxed);
                }
                ui.ctx().request_repaint_after(std::time::Duration::from_millis(100));
            } else if ui.button("Run simulation").clicked() {
                let progress = Arc::new(AtomicU32::new(0));
                let cancel = Arc::new(AtomicBool::new(false));
                let (tx, rx) = channel();
                let (p, c) = (progress.clone(), cancel.clone());
                let solved = solved.clone();
                let case = case_id.clone();
                let ctx = ui.ctx().clone();
                std::thread::spawn(move || {
                    let mut report = |f: f64| {
                        p.store((f as f32).to_bits(), Ordering::Relaxed);
                        !c.load(Ordering::Relaxed)
                    };
                    let _ = tx.send(simulate(&solved.scenario, &case, 6.0, &mut report));
                    ctx.request_repaint();
                });
                self.sim_job = Some(SimJob { progress, cancel, rx, key: key.clone() });
            }
        });
        let Some((k, result)) = &self.sim else { return };
        if let Some(note) = run_note(k, &key) {
            ui.label(RichText::new(note).small().weak());
        }
        match result {
            Err(e) => {
                ui.label(RichText::new(e).color(crate::fields::qty_field::ERROR));
            }
            Ok(run) => {
                let Some(idx) = run.member_ids.iter().position(|m| m == member) else { return };
                let sim = &run.run;
                let pts: Vec<[f64; 2]> = sim
                    .time_s
                    .iter()
                    .zip(&sim.member_force_n)
                    .filter_map(|(t, f)| Some([*t, units.value(*f.get(idx)?, Shown::Force)]))
                    .collect();
                let peak = sim.peak_member_force_n.get(idx).copied().unwrap_or(0.0);
                if let Some(p) = run.period_s {
                    ui.label(format!("measured swing period {p:.2} s"));
                }
                ui.label(format!(
                    "peak {} at {:.2} s; energy drift {:.2} %{}",
                    units.fmt(peak, Shown::Force),
                    sim.peak_time_s.get(idx).copied().unwrap_or(0.0),
                    sim.energy_drift * 100.0,
                    if sim.cancelled { " (cancelled early)" } else { "" }
                ));
                let mut entries = vec![(CURVE, format!("member force, case {}", k.1))];
                if let Some(a) = allowable {
                    entries.push((ALLOWABLE, format!("allowable {}", units.fmt(a, Shown::Force))));
                }
                plot_key(ui, &entries);
                Plot::new("time-history")
                    .x_axis_label("time (s)")
                    .y_axis_label(format!("force ({})", units.unit(Shown::Force)))
                    .show_axes([true, true])
                    .y_axis_formatter(force_tick)
                    .y_axis_min_width(44.0)
                    .include_y(0.0)
                    .height(ui.available_height().max(120.0))
                    .show(ui, |p| {
                        p.line(Line::new("member force", pts).color(CURVE));
                        if let Some(a) = allowable {
                            p.hline(
                                HLine::new("allowable", units.value(a, Shown::Force))
                                    .color(ALLOWABLE)
                                    .style(LineStyle::dashed_loose()),
                            );
                        }
                    });
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_run_is_stale_only_when_the_scenario_changed() {
        let run = (4, "swing-25".to_string());
        assert_eq!(run_note(&run, &(4, "swing-25".to_string())), None);
        let other_case = run_note(&run, &(4, "snatch-20mm".to_string())).unwrap_or_default();
        assert!(other_case.contains("of case swing-25") && !other_case.contains("changed"), "{other_case}");
        let changed = run_note(&run, &(5, "swing-25".to_string())).unwrap_or_default();
        assert!(changed.contains("scenario changed"), "{changed}");
    }

    #[test]
    fn tick_labels_read_as_numbers() {
        let mark = |value, step_size| GridMark { value, step_size };
        assert_eq!(angle_tick(mark(30.0, 10.0), &(0.0..=90.0)), "30°");
        assert_eq!(force_tick(mark(12.0, 2.0), &(0.0..=20.0)), "12");
        assert_eq!(force_tick(mark(0.25, 0.05), &(0.0..=1.0)), "0.25");
        // a tick a hair off zero from the spacing's arithmetic reads 0
        assert_eq!(force_tick(mark(-1e-17, 0.5), &(0.0..=5.0)), "0.0");
    }
}
