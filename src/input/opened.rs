//! Every file this run has opened for reading, noted where it is read ([`super::yaml::read_text`]
//! is the one function that opens input files), so that the writer can refuse an output aimed at
//! any of them: the instrument, a set, a layout, survey settings, the tunings any of these name,
//! stock files, standard input. Listing inputs by hand per command missed the files a file names.

use std::fs::Metadata;
use std::path::{Path, PathBuf};
use std::sync::Mutex;

/// One file read during this run, with the identity it had when it was opened.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Opened {
    /// The path as it was given (or `standard input`).
    pub path: PathBuf,
    /// Device number of the file read.
    pub device: u64,
    /// Inode number of the file read.
    pub inode: u64,
}

static OPENED: Mutex<Vec<Opened>> = Mutex::new(Vec::new());

/// Notes that `path` (with metadata `meta`, taken from the open file) was read. A file read
/// many times (2000 survey entries naming one tuning) is noted once.
pub(crate) fn note(path: &Path, meta: &Metadata) {
    let (device, inode) = identity(meta);
    let mut opened = OPENED
        .lock()
        .unwrap_or_else(|poisoned| poisoned.into_inner());
    if !opened
        .iter()
        .any(|o| o.device == device && o.inode == inode)
    {
        opened.push(Opened {
            path: path.to_path_buf(),
            device,
            inode,
        });
    }
}

/// Every file read so far in this run, in the order first read.
pub fn opened() -> Vec<Opened> {
    OPENED
        .lock()
        .unwrap_or_else(|poisoned| poisoned.into_inner())
        .clone()
}

#[cfg(unix)]
fn identity(meta: &Metadata) -> (u64, u64) {
    use std::os::unix::fs::MetadataExt;
    (meta.dev(), meta.ino())
}

#[cfg(not(unix))]
fn identity(_meta: &Metadata) -> (u64, u64) {
    (0, 0)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_file_read_through_the_reader_is_noted_once() {
        let folder = tempfile::tempdir().unwrap();
        let path = folder.path().join("t.yaml");
        std::fs::write(&path, "divisions: 7\n").unwrap();
        crate::input::yaml::read_text(&path).unwrap();
        crate::input::yaml::read_text(&path).unwrap();
        let meta = std::fs::metadata(&path).unwrap();
        let (device, inode) = identity(&meta);
        let found = opened()
            .into_iter()
            .filter(|o| o.device == device && o.inode == inode)
            .count();
        assert_eq!(found, 1);
    }
}
