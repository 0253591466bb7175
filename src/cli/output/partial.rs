//! What the writer has half done, undone if SIGINT or SIGTERM stops the run: temporary
//! `.taut-partial` files are removed, and a file already renamed into place by a run that writes
//! several is put back from its backup, so that the outputs stay "all or none" (the old files
//! are untouched either way).
//!
//! A watcher thread waits for the signals through `signal-hook`'s iterator (so no `unsafe` code
//! here: the crate's handler only wakes the thread), undoes what the ledger lists and then ends
//! the process as the signal would have.

use std::fs;
use std::path::{Path, PathBuf};
use std::sync::{Mutex, MutexGuard, Once};

use signal_hook::consts::{SIGINT, SIGTERM};
use signal_hook::iterator::Signals;

/// One step to take back.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Undo {
    /// A file this run made (a temporary file, or a new file renamed into place): remove it.
    Remove(PathBuf),
    /// A file this run replaced: rename its backup (a hard link to the old file) back over it.
    PutBack {
        /// The hard link holding the old file.
        backup: PathBuf,
        /// The file as it is now.
        target: PathBuf,
    },
}

static LEDGER: Mutex<Vec<Undo>> = Mutex::new(Vec::new());

/// The ledger, held while the writer changes files so that the watcher never sees half a step.
pub fn ledger() -> MutexGuard<'static, Vec<Undo>> {
    LEDGER
        .lock()
        .unwrap_or_else(|poisoned| poisoned.into_inner())
}

/// Forgets a file the writer removed (or renamed) itself.
pub fn forget(ledger: &mut Vec<Undo>, path: &Path) {
    ledger.retain(|undo| match undo {
        Undo::Remove(made) => made != path,
        Undo::PutBack { target, .. } => target != path,
    });
}

/// Undoes every step listed, newest first, and empties the ledger. Best effort: the run is
/// ending.
pub fn undo_all(ledger: &mut Vec<Undo>) {
    while let Some(undo) = ledger.pop() {
        let _ = match undo {
            Undo::Remove(path) => fs::remove_file(path),
            Undo::PutBack { backup, target } => fs::rename(backup, target),
        };
    }
}

/// Starts the watcher once per process. If the signals cannot be watched (no threads left),
/// the run goes on as it would have without it.
pub fn watch_signals() {
    static STARTED: Once = Once::new();
    STARTED.call_once(|| {
        let Ok(mut signals) = Signals::new([SIGINT, SIGTERM]) else {
            return;
        };
        let _ = std::thread::Builder::new()
            .name("taut-signals".to_string())
            .spawn(move || {
                if let Some(signal) = signals.forever().next() {
                    undo_all(&mut ledger());
                    let _ = signal_hook::low_level::emulate_default_handler(signal);
                    // Only reached if the default action could not be restored.
                    std::process::exit(128 + signal);
                }
            });
    });
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn undo_removes_made_files_and_puts_replaced_ones_back() {
        let folder = tempfile::tempdir().unwrap();
        let made = folder.path().join(".report.txt.1-0.taut-partial");
        fs::write(&made, "half").unwrap();
        let target = folder.path().join("set.yaml");
        let backup = folder.path().join(".set.yaml.1.taut-backup");
        fs::write(&target, "old").unwrap();
        fs::hard_link(&target, &backup).unwrap();
        fs::write(folder.path().join("new"), "new").unwrap();
        fs::rename(folder.path().join("new"), &target).unwrap();
        let mut steps = vec![
            Undo::Remove(made.clone()),
            Undo::PutBack {
                backup: backup.clone(),
                target: target.clone(),
            },
        ];
        let kept = folder.path().join("kept");
        steps.push(Undo::Remove(kept.clone()));
        forget(&mut steps, &kept);
        assert_eq!(steps.len(), 2);
        undo_all(&mut steps);
        assert!(steps.is_empty());
        assert!(!made.exists());
        assert!(!backup.exists());
        assert_eq!(fs::read_to_string(&target).unwrap(), "old");
    }
}
