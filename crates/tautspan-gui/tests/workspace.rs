//! The app as a planner's workspace: warnings most serious first, the
//! canvas coloured by each member's worst case, the results grid with its
//! filters and CSV export, the plots' defaults.

mod common;

use common::{click, harness};
use egui_kittest::Harness;
use egui_kittest::kittest::{NodeT, Queryable};
use tautspan_gui::{Document, Prefs, Shown, TautspanApp, UnitSystem};

#[test]
fn warnings_list_overloads_first_and_advisories_after_them() {
    // the built-in demo: in the 20 mm snatch the drop line is over (218.5 %
    // in `tautspan check`), the two hoists over their WLL, and three members
    // far above their static force (an advisory)
    let h = harness(common::builtin_demo_app());
    let solved = h.state().derived.solved.clone().unwrap_or_else(|| panic!("solved"));
    let over: usize =
        solved.warning_groups.iter().filter(|(_, g)| g.kind.key().ends_with("_over")).map(|(_, g)| g.count).sum();
    assert!(over >= 3, "drop line and two hoists: {over}");
    assert!(
        h.query_by_label_contains(&format!("{over} over")).is_some(),
        "the counts by severity are shown above the list"
    );
    // top to bottom as drawn
    let mut shown: Vec<(f32, String)> = h
        .query_all_by_label_contains("[snatch-20mm]")
        .filter_map(|n| Some((n.rect().top(), n.accesskit_node().label()?)))
        .collect();
    shown.sort_by(|a, b| a.0.total_cmp(&b.0));
    let texts: Vec<String> = shown.into_iter().map(|(_, t)| t).collect();
    assert!(!texts.is_empty());
    let first_note = texts.iter().position(|t| t.starts_with("note ")).unwrap_or_else(|| panic!("{texts:?}"));
    let last_over = texts.iter().rposition(|t| t.starts_with("OVER ")).unwrap_or_else(|| panic!("{texts:?}"));
    assert!(last_over < first_note, "every overload above every advisory: {texts:?}");
    assert!(texts.iter().any(|t| t.starts_with("OVER [snatch-20mm] member drop-line")), "{texts:?}");
    assert!(texts.iter().any(|t| t.starts_with("note [snatch-20mm] 3 members far above their static force")));
}

#[test]
fn the_worst_case_colouring_is_a_toggle_kept_in_the_preferences() {
    let mut h = harness(common::builtin_demo_app());
    assert!(!h.state().prefs.worst_case_colours, "off by default: the canvas shows the case chosen");
    click(&mut h, "Worst case colours");
    assert!(h.state().prefs.worst_case_colours);
    assert!(!h.state().doc.dirty, "a display choice, not an edit");
    click(&mut h, "Worst case colours");
    assert!(!h.state().prefs.worst_case_colours);
}

fn temp_dir(name: &str) -> std::path::PathBuf {
    let d = std::env::temp_dir().join(format!("tautspan-workspace-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap_or_else(|e| panic!("{e}"));
    d
}

/// The app on the mezzanine tripod (scenarios/mezzanine-hoist.ron): three
/// struts standing on a floor with three feet, a chain block, mass "roller".
fn mezzanine_app() -> TautspanApp {
    let loaded = tautspan_core::model::load_scenario(include_str!("../../../scenarios/mezzanine-hoist.ron"))
        .unwrap_or_else(|e| panic!("{e}"));
    let mut app = TautspanApp::with_document(Document::new(loaded.dto, None), Prefs::default());
    app.files.native = false;
    app
}

#[test]
fn the_grid_shows_about_a_third_of_the_window_at_1280_by_800() {
    let mut h = Harness::builder().with_size([1280.0, 800.0]).with_max_steps(16).build_ui_state(
        |ui, app: &mut TautspanApp| {
            app.frame(ui);
            assert!(app.wait_for_results());
        },
        common::builtin_demo_app(),
    );
    h.run();
    // rows are drawn only where they are seen: count the case cells shown
    let ids: Vec<String> = h.state().doc.dto.cases.iter().map(|c| c.id().to_string()).collect();
    let shown: usize = ids.iter().map(|id| h.query_all_by_label(id).count()).sum();
    // 800 / 3 ≈ 267 pt less the tabs, filters and header (≈ 90 pt) at 18 pt a row
    assert!(shown >= 8, "at least 8 rows seen, not 2.5: {shown}");
    // the lower panel's tabs sit about a third of the window up from the bottom
    let top = h.get_by_label("Plots").rect().top();
    assert!(top < 800.0 - 800.0 / 3.0 + 30.0, "tabs at {top}");
}

#[test]
fn the_grid_has_rows_for_floors_feet_parts_and_reactions() {
    let h = harness(mezzanine_app());
    let a = &h.state().derived.solved.as_ref().unwrap_or_else(|| panic!("solved")).analysis;
    let rows = tautspan_gui::results_rows(a, false, false);
    for id in ["leg-a", "mezzanine", "mezzanine/foot-a", "mezzanine/foot-c"] {
        assert!(rows.iter().any(|r| r == id), "{id} in {rows:?}");
    }
    let h = harness(common::builtin_demo_app());
    let a = &h.state().derived.solved.as_ref().unwrap_or_else(|| panic!("solved")).analysis;
    let rows = tautspan_gui::results_rows(a, false, false);
    for id in ["drop-line", "hoist-west/hoist", "beam-west reaction", "beam-east reaction"] {
        assert!(rows.iter().any(|r| r == id), "{id} in {rows:?}");
    }
}

#[test]
fn the_filters_leave_each_problem_once_and_the_csv_is_what_is_shown() {
    let mut h = harness(common::builtin_demo_app());
    click(&mut h, "Over / near / unchecked only");
    click(&mut h, "Worst case per item");
    assert!(h.state().results.filter.problems_only && h.state().results.filter.worst_per_item);
    // in `tautspan check`: drop-line 218.5 %, each hoist 148.1 % in the 20 mm
    // snatch; every other item below the 80 % near-limit in every case
    assert!(h.query_by_label("3 rows").is_some(), "drop line and the two hoists");
    click(&mut h, "Export CSV…");
    let prompt = h.state().files.prompt.clone().unwrap_or_else(|| panic!("the path field opens"));
    assert!(prompt.text.ends_with("results.csv"), "a default name: {}", prompt.text);
    let dir = temp_dir("csv");
    let path = dir.join("grid.csv");
    common::type_into(&mut h, "Path", &path.display().to_string());
    click(&mut h, "Export");
    let text = std::fs::read_to_string(&path).unwrap_or_else(|e| panic!("{e}"));
    let lines: Vec<&str> = text.lines().collect();
    assert_eq!(lines[0], "item,what,case,force (kN),allowable (kN),utilisation (%),state");
    assert_eq!(lines.len(), 4, "the header and the three rows shown: {text}");
    let a = h.state().derived.solved.clone().unwrap_or_else(|| panic!("solved"));
    let snatch = a.analysis.cases.iter().find(|c| c.id == "snatch-20mm").unwrap_or_else(|| panic!("case"));
    let drop = snatch.members.iter().find(|m| m.id == "drop-line").unwrap_or_else(|| panic!("drop-line"));
    let row = lines.iter().find(|l| l.starts_with("drop-line,")).unwrap_or_else(|| panic!("{text}"));
    let f: Vec<&str> = row.split(',').collect();
    assert_eq!((f[1], f[2], f[6]), ("member", "snatch-20mm", "over"));
    // six significant digits of the core's numbers: relative 5e-6
    let close = |csv: &str, si: f64| {
        let v: f64 = csv.parse().unwrap_or_else(|e| panic!("{csv}: {e}"));
        assert!((v - si).abs() <= 5e-6 * si.abs(), "{v} against {si}");
    };
    close(f[3], drop.force_n / 1000.0);
    close(f[4], drop.allowable_n / 1000.0);
    close(f[5], drop.utilisation * 100.0);
    assert!(lines.iter().any(|l| l.starts_with("hoist-west/hoist,rated part,snatch-20mm,")));
    assert!(h.query_by_label_contains("Results written to").is_some());
}

#[test]
fn a_floor_counts_in_the_case_summary() {
    let mut h = harness(mezzanine_app());
    // the hanging case: members at most 26.8 % (block chain), the floor at 11.8 %
    assert!(h.query_by_label("max 27 %").is_some());
    // a rated point load of 3 kN puts foot-c (1.046 kN in `tautspan check`) at 35 %
    let ctx = h.ctx.clone();
    h.state_mut().apply(
        &ctx,
        vec![tautspan_gui::Command::edit(|d| d.floors[0].rated_point = Some(tautspan_core::file::Qty::from("3 kN")))],
    );
    h.run();
    let a = h.state().derived.solved.clone().unwrap_or_else(|| panic!("solved"));
    let foot_max = a.analysis.cases[0].floors[0].feet.iter().map(|x| x.normal_force_n).fold(0.0, f64::max);
    let expected = format!("max {:.0} %", foot_max / 3000.0 * 100.0);
    assert_eq!(expected, "max 35 %", "1.046 / 3 from the printed normal force");
    assert!(h.query_by_label(&expected).is_some(), "the floor's 35 % is not hidden behind the chain's 27 %");
}

#[test]
fn the_plots_draw_the_case_angle_and_the_allowable_and_run_the_dynamic_case() {
    let mut h = harness(common::builtin_demo_app());
    h.state_mut().selection = tautspan_gui::Selection::Member("drop-line".into());
    // the curve's spinner keeps the frames coming: step, not run to a stop
    h.get_by_label("Plots").click();
    h.run_steps(4);
    // the canvas shows the static case; the time history is of the first dynamic one
    assert!(h.state().shown_case.is_none());
    assert!(h.query_by_label("drop-line: time history of case swing-25").is_some());
    // the curve is found on a worker: wait for its key
    let key = "case swing-25: release 25.0°";
    for _ in 0..600 {
        if h.query_by_label(key).is_some() {
            break;
        }
        std::thread::sleep(std::time::Duration::from_millis(100));
        h.run_steps(2);
    }
    assert!(h.query_by_label(key).is_some(), "the case's own angle (its input, 25°) is drawn and named");
    // the drop line's allowable and largest release as `tautspan check` prints them
    assert!(h.query_by_label("allowable 10.08 kN").is_some());
    assert!(h.query_by_label("largest release inside the allowable 73.9°").is_some());
    // showing the snatch case moves the time history to it
    h.state_mut().shown_case = Some("snatch-20mm".into());
    h.run_steps(2);
    assert!(h.query_by_label("drop-line: time history of case snatch-20mm").is_some());
}

#[test]
fn deleting_a_node_in_use_asks_first_and_goes_in_one_undo_step() {
    let mut h = harness(common::demo_app());
    let before = h.state().doc.dto.clone();
    h.state_mut().selection = tautspan_gui::Selection::Node("J2".into());
    click(&mut h, "Edit");
    click(&mut h, "Delete selection  (Del)");
    // J2 carries the chain drop and the load; the load's three dynamic cases go with it
    assert!(h.query_by_label("Delete node J2?").is_some(), "asked first");
    for line in ["• member drop", "• mass load", "• case swing (its mass goes)", "• case snatch (its mass goes)"]
    {
        assert!(h.query_by_label(line).is_some(), "{line} listed");
    }
    assert_eq!(h.state().doc.dto, before, "nothing gone before the answer");
    click(&mut h, "Cancel");
    assert!(h.query_by_label("Delete node J2?").is_none());
    assert_eq!(h.state().doc.dto, before, "cancel keeps everything");
    click(&mut h, "Edit");
    click(&mut h, "Delete selection  (Del)");
    click(&mut h, "Delete all");
    let d = h.state().doc.dto.clone();
    assert!(!d.nodes.iter().any(|n| n.id == "J2") && d.masses.is_empty() && d.members.len() == 2);
    assert_eq!(d.cases.len(), 1, "the static case stays");
    common::click(&mut h, "Edit");
    common::click(&mut h, "Undo  (Ctrl+Z)");
    assert_eq!(h.state().doc.dto, before, "one undo brings all of it back");
    // a member nothing else uses goes at once
    h.state_mut().selection = tautspan_gui::Selection::Member("leg-east".into());
    h.key_press(egui::Key::Delete);
    h.run();
    assert!(h.query_by_label_contains("Delete member").is_none());
    assert_eq!(h.state().doc.dto.members.len(), 2);
}

#[test]
fn an_invalid_field_marks_the_results_stale_and_saving_names_it() {
    let dir = temp_dir("stale");
    let path = dir.join("bridle.ron");
    let mut app = common::demo_app();
    app.doc.path = Some(path.clone());
    let mut h = harness(app);
    h.state_mut().selection = tautspan_gui::Selection::Member("leg-west".into());
    h.run();
    common::type_into(&mut h, "Diameter", "12 mx");
    assert!(h.query_by_label_contains("Results STALE: the diameter of member leg-west holds \"12 mx\"").is_some());
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::S);
    h.run();
    assert!(!path.exists(), "nothing written while the field is invalid");
    let msg = format!("{:?}", h.state().message);
    assert!(msg.contains("Not saved: the diameter of member leg-west holds \\\"12 mx\\\""), "{msg}");
    common::type_into(&mut h, "Diameter", "13 mm");
    assert!(h.query_by_label_contains("Results STALE").is_none(), "valid again: the results are current");
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::S);
    h.run();
    assert!(path.exists(), "saved once valid");
}

#[test]
fn a_release_of_200_degrees_gets_a_message_not_a_clamp() {
    let mut h = harness(common::demo_app());
    common::type_into(&mut h, "Release angle", "200 deg");
    let release = match &h.state().doc.dto.cases[1] {
        tautspan_core::file::CaseDto::Swing { release, .. } => release.0.clone(),
        _ => String::new(),
    };
    assert_eq!(release, "200 deg", "kept as typed, not clamped to 90");
    // the core's message: a release above the pivot's horizontal is not a swing
    // (under the field and in the list of problems)
    assert!(h.query_all_by_label_contains("a release of 200 deg is above the pivot's horizontal").count() >= 1);
}

#[test]
fn the_path_box_takes_the_focus_starts_in_the_files_folder_and_adds_ron() {
    let dir = temp_dir("pathbox");
    let path = dir.join("bridle.ron");
    let mut app = common::demo_app();
    app.doc.path = Some(path.clone());
    let mut h = harness(app);
    click(&mut h, "File");
    click(&mut h, "Save as…  (Ctrl+Shift+S)");
    let prompt = h.state().files.prompt.clone().unwrap_or_else(|| panic!("the path box opens"));
    assert_eq!(prompt.text, path.display().to_string(), "starts at the file itself");
    assert!(h.get_by_role_and_label(egui::accesskit::Role::TextInput, "Path").is_focused(), "takes the focus");
    // typed without an extension: saved as .ron
    let typed = dir.join("copy");
    common::type_into(&mut h, "Path", &typed.display().to_string());
    click(&mut h, "Save");
    let saved = dir.join("copy.ron");
    assert!(saved.exists(), "the .ron is added");
    assert_eq!(h.state().doc.path.as_deref(), Some(saved.as_path()));
    // the recent files list it in the File menu
    click(&mut h, "File");
    click(&mut h, "Open recent");
    assert!(h.query_by_label(&saved.display().to_string()).is_some(), "in File > Open recent");
    assert_eq!(h.state().prefs.recent.first(), Some(&saved));
    h.key_press(egui::Key::Escape);
    h.run();
    // opening starts in the folder of the file open
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::O);
    h.run();
    let prompt = h.state().files.prompt.clone().unwrap_or_else(|| panic!("the path box opens"));
    assert_eq!(prompt.text, format!("{}{}", dir.display(), std::path::MAIN_SEPARATOR));
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn a_new_scenario_is_saved_under_a_name_from_its_title() {
    let mut h = harness(common::blank_app());
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::S);
    h.run();
    let prompt = h.state().files.prompt.clone().unwrap_or_else(|| panic!("the path box opens"));
    assert!(prompt.text.ends_with("new-rig.ron"), "a default name from the title \"New rig\": {}", prompt.text);
}

#[test]
fn the_built_in_demo_has_its_own_title() {
    let h = harness(common::builtin_demo_app());
    let title = h.state().doc.title();
    let own = h.state().doc.dto.title.clone();
    assert!(!own.is_empty() && title.starts_with(&own), "{title}");
    assert!(!title.contains("untitled"));
}

#[test]
fn a_broken_file_is_explained_without_internal_type_names() {
    let dir = temp_dir("typenames");
    let path = dir.join("anch.ron");
    let text = include_str!("fixtures/bridle.ron").replacen("support: Anchor)", "support: Anch)", 1);
    std::fs::write(&path, text).unwrap_or_else(|e| panic!("{e}"));
    let mut h = harness(common::demo_app());
    h.state_mut().open_path(&path);
    h.run();
    let message = format!("{:?}", h.state().message);
    assert!(message.contains("`Anch` is not a valid support; write one of Joint, Anchor, Floor"), "{message}");
    assert!(!message.contains("Dto"), "no type name: {message}");
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn small_lengths_and_roundoff_read_for_people() {
    // the bridle's chain drop stretches a fraction of a millimetre under 400 kg:
    // the member inspector writes stretch in mm, never in m with an exponent
    let mut h = harness(common::demo_app());
    h.state_mut().selection = tautspan_gui::Selection::Member("drop".into());
    h.run();
    let shown: Vec<String> = h
        .query_all_by_label_contains(" kN")
        .filter_map(|n| n.accesskit_node().label())
        .chain(h.query_all_by_label_contains(" mm").filter_map(|n| n.accesskit_node().label()))
        .collect();
    assert!(!shown.is_empty());
    for s in &shown {
        assert!(!s.contains("e-"), "no exponent in {s}");
    }
    assert_eq!(UnitSystem::Si.fmt(9.2e-20, Shown::Force), "0 kN", "below roundoff: 0");
    assert_eq!(UnitSystem::UsCustomary.fmt(1814.36948, Shown::Mass), "2 sh tn", "2 × 2000 lb × 0.45359237 kg");
}

#[test]
fn rope_sizes_and_grades_read_in_us_units_too() {
    // leg-west: 12 mm 6x19 IWRC, grade 1770 N/mm²
    let mut h = harness(common::demo_app());
    h.state_mut().selection = tautspan_gui::Selection::Member("leg-west".into());
    h.run();
    assert!(h.query_by_label_contains("ksi").is_none(), "SI: the grade as listed");
    click(&mut h, "US customary");
    // 12 mm / 25.4 mm per inch (exact) = 0.47244 in
    assert!(h.query_by_label("= 0.4724 in").is_some(), "the size in inches");
    // 1770 N/mm² / 6.894757 N/mm² per ksi (lbf and inch exact) = 256.72 ksi
    assert!(h.query_by_label("= 256.7 ksi").is_some(), "the grade in ksi");
}
