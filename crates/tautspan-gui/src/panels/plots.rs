//! Plots: the selected member's peak force over the swing's arc
//! against release angle, with its allowable and the largest release angle
//! inside it marked; and its time history from the core's simulation. Both
//! run on worker threads (progress shown, the simulation can be cancelled),
//! so the UI never waits on them.

use crate::document::Document;
use crate::document::core_bridge::{CurvePoint, simulate, swing_curve};
use crate::document::derived::Derived;
use crate::document::selection::Selection;
use crate::fields::units_display::{Shown, UnitSystem};
use egui::{Color32, RichText, Ui};
use egui_plot::{HLine, Legend, Line, LineStyle, Plot, VLine};
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
        let pts: Vec<[f64; 2]> = points.iter().map(|p| [p.release_deg, units.value(p.force_n, Shown::Force)]).collect();
        let unit = units.unit(Shown::Force);
        Plot::new("swing-curve")
            .legend(Legend::default())
            .x_axis_label("release angle from vertical (deg)")
            .y_axis_label(format!("force ({unit})"))
            .height(ui.available_height().max(120.0))
            .show(ui, |p| {
                p.line(Line::new("peak over the arc", pts).color(Color32::from_rgb(0x2a, 0x7a, 0xd8)).width(2.0));
                if let Some(a) = allowable {
                    p.hline(
                        HLine::new("allowable", units.value(a, Shown::Force))
                            .color(Color32::from_rgb(0xb0, 0x3a, 0x2e))
                            .style(LineStyle::dashed_loose()),
                    );
                }
                if let Some(d) = limit {
                    p.vline(
                        VLine::new(format!("largest release inside allowable {d:.1}°"), d)
                            .color(Color32::from_rgb(0xd1, 0x93, 0x2a)),
                    );
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
        ui.label(RichText::new(format!("{member}: time history of case {}", shown.unwrap_or("(first)"))).strong());
        let Some(solved) = derived.solved.as_ref() else { return };
        let case_id =
            shown.map(str::to_string).or_else(|| doc.dto.cases.first().map(|c| c.id().to_string())).unwrap_or_default();
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
        if *k != key {
            ui.label(RichText::new("The scenario changed since this run; run it again.").small().weak());
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
                Plot::new("time-history")
                    .legend(Legend::default())
                    .x_axis_label("time (s)")
                    .y_axis_label(format!("force ({})", units.unit(Shown::Force)))
                    .height(ui.available_height().max(120.0))
                    .show(ui, |p| {
                        p.line(Line::new("member force", pts).color(Color32::from_rgb(0x2a, 0x7a, 0xd8)));
                        if let Some(a) = allowable {
                            p.hline(
                                HLine::new("allowable", units.value(a, Shown::Force))
                                    .color(Color32::from_rgb(0xb0, 0x3a, 0x2e))
                                    .style(LineStyle::dashed_loose()),
                            );
                        }
                    });
            }
        }
    }
}
