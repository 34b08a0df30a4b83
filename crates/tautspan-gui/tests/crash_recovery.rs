//! Crash recovery as a user meets it: the app process is killed (SIGKILL)
//! after an edit; the next start offers the edit back, and restoring it
//! brings the scenario back as unsaved changes.

mod common;

use common::{click, harness, type_into};
use egui_kittest::kittest::Queryable;
use std::path::PathBuf;
use std::time::{Duration, Instant};
use tautspan_gui::{Prefs, TautspanApp};

/// Set on the child process: the folder its recovery file goes in.
const CHILD_DIR: &str = "TAUTSPAN_TEST_RECOVERY_CHILD_DIR";

const EDITED: &str = "Edited before the crash";

fn recovery_file(dir: &std::path::Path) -> PathBuf {
    dir.join("unsaved-scenario.ron")
}

/// The app process the test below starts and kills: it opens the demo with
/// recovery on, edits the title, and keeps running until it is killed.
#[test]
#[ignore = "started as a child process by the crash recovery test"]
fn child_app_edits_and_runs_until_killed() {
    let Some(dir) = std::env::var_os(CHILD_DIR) else { return };
    let mut app = TautspanApp::start_with_recovery(None, Prefs::default(), Some(recovery_file(&PathBuf::from(dir))));
    app.files.native = false;
    let mut h = harness(app);
    type_into(&mut h, "Title", EDITED);
    assert!(h.state().doc.dirty);
    loop {
        h.run();
        std::thread::sleep(Duration::from_millis(200));
    }
}

/// Kills the child app should the test fail before it does.
struct KillOnDrop(std::process::Child);

impl Drop for KillOnDrop {
    fn drop(&mut self) {
        let _ = self.0.kill();
        let _ = self.0.wait();
    }
}

#[cfg(unix)]
#[test]
fn an_edit_survives_the_app_being_killed_and_is_offered_back() {
    use std::os::unix::process::ExitStatusExt;
    let dir = std::env::temp_dir().join(format!("tautspan-crash-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap_or_else(|e| panic!("{e}"));
    let file = recovery_file(&dir);
    let exe = std::env::current_exe().unwrap_or_else(|e| panic!("{e}"));
    let mut child = KillOnDrop(
        std::process::Command::new(exe)
            .args(["--ignored", "--exact", "child_app_edits_and_runs_until_killed", "--nocapture"])
            .env(CHILD_DIR, &dir)
            .stdout(std::process::Stdio::null())
            .stderr(std::process::Stdio::null())
            .spawn()
            .unwrap_or_else(|e| panic!("{e}")),
    );
    // the edit is written within the interval after it is made
    let deadline = Instant::now() + Duration::from_secs(120);
    while !std::fs::read_to_string(&file).is_ok_and(|t| t.contains(EDITED)) {
        assert!(Instant::now() < deadline, "the recovery file holds the edit within two minutes");
        assert!(child.0.try_wait().ok().flatten().is_none(), "the app process is still running");
        std::thread::sleep(Duration::from_millis(100));
    }
    child.0.kill().unwrap_or_else(|e| panic!("{e}"));
    let status = child.0.wait().unwrap_or_else(|e| panic!("{e}"));
    assert_eq!(status.signal(), Some(9), "killed with SIGKILL: no chance to clean up");
    assert!(file.exists(), "the unsaved work is still there after the kill");

    // the next start offers it back
    let mut app = TautspanApp::start_with_recovery(None, Prefs::default(), Some(file.clone()));
    app.files.native = false;
    let mut h = harness(app);
    assert!(h.query_by_label("Unsaved work found").is_some());
    assert!(h.query_by_label_contains(EDITED).is_some(), "the offer names the work");
    assert_ne!(h.state().doc.dto.title, EDITED, "nothing replaced before the answer");
    click(&mut h, "Restore");
    assert_eq!(h.state().doc.dto.title, EDITED, "the edit is back");
    assert!(h.state().doc.dirty, "as unsaved changes");
    assert!(h.query_by_label("Unsaved work found").is_none());
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn discarding_the_offer_removes_the_work() {
    let dir = std::env::temp_dir().join(format!("tautspan-discard-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap_or_else(|e| panic!("{e}"));
    let file = recovery_file(&dir);
    let loaded = tautspan_core::model::load_scenario(tautspan_gui::DEMO_SCENARIO).unwrap_or_else(|e| panic!("{e}"));
    let text = tautspan_gui::recovery_text(&loaded.dto, None).unwrap_or_else(|e| panic!("{e}"));
    std::fs::write(&file, text).unwrap_or_else(|e| panic!("{e}"));
    let mut h = harness(TautspanApp::start_with_recovery(None, Prefs::default(), Some(file.clone())));
    click(&mut h, "Discard");
    assert!(!file.exists(), "discarded: removed");
    assert!(!h.state().doc.dirty);
    let _ = std::fs::remove_dir_all(&dir);
}
