//! Unsaved work survives the app being killed: a child process runs the
//! app, makes an edit and is killed with SIGKILL once the recovery copy is
//! on disk; the next start offers the edit back. Discarding the offer
//! removes the copy, and saving removes it too.

mod common;

use common::{click, harness};
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use std::path::{Path, PathBuf};
use std::time::{Duration, Instant};
use tautspan_gui::recovery::{FILE_NAME, find};
use tautspan_gui::{Command, Prefs, TautspanApp};

/// Set in the child process: the state folder it keeps its copy in.
const CHILD_DIR: &str = "TAUTSPAN_TEST_RECOVERY_CHILD_DIR";
const EDITED_TITLE: &str = "Loft hoist, edited before the crash";

fn temp_dir(name: &str) -> PathBuf {
    let d = std::env::temp_dir().join(format!("tautspan-gui-recovery-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap_or_else(|e| panic!("{e}"));
    d
}

/// The child: the app on the demo with its copy in `dir`, one edit, then
/// frames until it is killed.
fn run_child(dir: &Path) -> ! {
    let mut app = TautspanApp::start_in(None, Prefs::default(), Some(dir.to_path_buf()));
    app.files.native = false;
    app.recovery.interval = Duration::ZERO;
    let mut h =
        Harness::builder().with_size([1200.0, 800.0]).build_ui_state(|ui, app: &mut TautspanApp| app.frame(ui), app);
    h.step();
    let ctx = h.ctx.clone();
    h.state_mut().apply(&ctx, vec![Command::edit(|d| d.title = EDITED_TITLE.to_string())]);
    loop {
        h.step();
        std::thread::sleep(Duration::from_millis(20));
    }
}

#[test]
fn an_edit_survives_the_app_being_killed() {
    if let Some(dir) = std::env::var_os(CHILD_DIR) {
        run_child(Path::new(&dir));
    }
    let dir = temp_dir("killed");
    let exe = std::env::current_exe().unwrap_or_else(|e| panic!("{e}"));
    let mut child = std::process::Command::new(exe)
        .args(["an_edit_survives_the_app_being_killed", "--exact", "--test-threads=1"])
        .env(CHILD_DIR, &dir)
        .stdout(std::process::Stdio::null())
        .stderr(std::process::Stdio::null())
        .spawn()
        .unwrap_or_else(|e| panic!("{e}"));
    // wait until the copy holding the edit is on disk
    let start = Instant::now();
    let mut copied = false;
    while start.elapsed() < Duration::from_secs(120) {
        if let Ok(Some(f)) = find(&dir)
            && f.dto.title == EDITED_TITLE
        {
            copied = true;
            break;
        }
        std::thread::sleep(Duration::from_millis(50));
    }
    // SIGKILL: no destructor, no save, no goodbye
    child.kill().unwrap_or_else(|e| panic!("{e}"));
    let status = child.wait().unwrap_or_else(|e| panic!("{e}"));
    assert!(copied, "the child wrote its unsaved edit within two minutes");
    assert!(!status.success(), "the child was killed, not finished");

    // the next start offers the edit back
    let mut app = TautspanApp::start_in(None, Prefs::default(), Some(dir.clone()));
    app.files.native = false;
    assert!(app.recovered.is_some(), "the copy is found at start");
    let mut h = harness(app);
    assert!(h.query_by_label_contains("Unsaved work found").is_some());
    assert!(h.query_by_label_contains(EDITED_TITLE).is_some(), "the offer names the work by its title");
    click(&mut h, "Restore unsaved work");
    assert_eq!(h.state().doc.dto.title, EDITED_TITLE);
    assert!(h.state().doc.dirty, "restored work is unsaved work");
    assert!(h.state().recovered.is_none());
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn discarding_the_offer_removes_the_copy() {
    let dir = temp_dir("discard");
    let dto = tautspan_core::file::parse_scenario_text(tautspan_gui::DEMO_SCENARIO)
        .map(|(d, _)| d)
        .unwrap_or_else(|e| panic!("{e:?}"));
    let mut edited = dto.clone();
    edited.title = EDITED_TITLE.to_string();
    let text = tautspan_gui::recovery::text_of(None, &edited).unwrap_or_else(|e| panic!("{e}"));
    std::fs::write(dir.join(FILE_NAME), text).unwrap_or_else(|e| panic!("{e}"));
    let mut app = TautspanApp::start_in(None, Prefs::default(), Some(dir.clone()));
    app.files.native = false;
    let mut h = harness(app);
    click(&mut h, "Discard it");
    assert!(!dir.join(FILE_NAME).exists(), "the copy is gone");
    assert_eq!(h.state().doc.dto.title, dto.title, "the demo stays open");
    assert!(!h.state().doc.dirty);
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn saving_removes_the_copy() {
    let dir = temp_dir("saved");
    let mut app = TautspanApp::start_in(None, Prefs::default(), Some(dir.clone()));
    app.files.native = false;
    app.recovery.interval = Duration::ZERO;
    let mut h = harness(app);
    let ctx = h.ctx.clone();
    h.state_mut().apply(&ctx, vec![Command::edit(|d| d.title = EDITED_TITLE.to_string())]);
    h.run();
    let appeared = wait_until(|| dir.join(FILE_NAME).exists());
    assert!(appeared, "an unsaved edit is copied");
    let saved = dir.join("saved.ron");
    assert!(h.state_mut().save_to(&saved), "saved");
    h.run();
    assert!(wait_until(|| !dir.join(FILE_NAME).exists()), "the copy goes once the work is saved");
    let _ = std::fs::remove_dir_all(&dir);
}

fn wait_until(mut f: impl FnMut() -> bool) -> bool {
    let start = Instant::now();
    while start.elapsed() < Duration::from_secs(30) {
        if f() {
            return true;
        }
        std::thread::sleep(Duration::from_millis(20));
    }
    false
}
