//! The one writer of reports, string-set files and (later) pictures.
//!
//! The rules, in the words of `taut help output-files`:
//! - `-` is standard output; a closed standard output is an error (exit 1), a reader that stopped
//!   early (`| head`) is not.
//! - Nothing is written over one of the command's own inputs (compared by device and inode, so
//!   `./x`, `x` and a symlink to `x` are the same file), and no two outputs go to the same place.
//!   This is checked before anything is written.
//! - A regular file is written to a temporary file beside it, then renamed over it: it appears
//!   whole or not at all. A symlink is followed (the link stays, its target gets the report); the
//!   target's permission bits (and, where allowed, its owner) are kept; a read-only file (no
//!   write bit at all, even when running as root) or one the user may not write is refused.
//! - Anything that is not a regular file (`/dev/null`, a FIFO, a terminal) and every path under
//!   `/dev/` or `/proc/` (`/dev/stdout`) is opened for writing and written through, never
//!   replaced.
//! - Several outputs of one run (`--save-set` and `-o`) are written both or neither: all
//!   temporary files are written first, then the streams, then the renames; if a rename fails,
//!   the files renamed before it are put back.

use std::ffi::OsString;
use std::fs::{self, File, OpenOptions};
use std::io::{self, ErrorKind, Write};
use std::os::fd::AsFd;
use std::os::unix::fs::{MetadataExt, PermissionsExt};
use std::path::{Path, PathBuf};
use std::sync::OnceLock;

use taut::error::{Error, Result};

use super::partial;

/// Where an output goes: standard output (`-`) or a path.
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum Target {
    /// Standard output.
    Stdout,
    /// A file (or device, FIFO, symlink) by path.
    Path(PathBuf),
}

impl From<OsString> for Target {
    fn from(text: OsString) -> Self {
        if text == "-" {
            Target::Stdout
        } else {
            Target::Path(PathBuf::from(text))
        }
    }
}

/// The files a command reads, so that no output lands on one of them.
#[derive(Debug, Default, Clone)]
pub struct Inputs {
    paths: Vec<PathBuf>,
    standard_input: bool,
}

impl Inputs {
    /// No inputs yet.
    pub fn new() -> Self {
        Self::default()
    }

    /// An input file path (`-` is standard input).
    pub fn file(&mut self, path: impl AsRef<Path>) -> &mut Self {
        let path = path.as_ref();
        if path == Path::new("-") {
            self.standard_input = true;
        } else {
            self.paths.push(path.to_path_buf());
        }
        self
    }

    /// An instrument or tuning spec that may name a file (`x.yaml`, `x.yaml@A4=415`); names and
    /// inline specs that are no file are harmless here.
    pub fn spec(&mut self, spec: &str) -> &mut Self {
        self.file(spec.trim());
        if let Some((body, _)) = spec.trim().rsplit_once('@') {
            self.file(body.trim());
        }
        self
    }

    /// The same, for an optional spec.
    pub fn maybe_spec(&mut self, spec: Option<&str>) -> &mut Self {
        if let Some(spec) = spec {
            self.spec(spec);
        }
        self
    }

    /// Device and inode of every input that exists.
    fn identities(&self) -> Vec<(u64, u64, &Path)> {
        let mut found: Vec<(u64, u64, &Path)> = self
            .paths
            .iter()
            .filter_map(|path| {
                fs::metadata(path)
                    .ok()
                    .map(|m| (m.dev(), m.ino(), path.as_path()))
            })
            .collect();
        if self.standard_input {
            if let Ok(meta) = fs::metadata("/dev/stdin") {
                found.push((meta.dev(), meta.ino(), Path::new("standard input")));
            }
        }
        found
    }

    /// Device, inode and path of every input: those named here and every file the run has
    /// read (the library notes each file where it opens it, so a tuning named inside an
    /// instrument's variants or a survey's settings counts as well as the files on the command
    /// line).
    fn all(&self) -> Vec<(u64, u64, PathBuf)> {
        let mut found: Vec<(u64, u64, PathBuf)> = self
            .identities()
            .into_iter()
            .map(|(dev, ino, path)| (dev, ino, path.to_path_buf()))
            .collect();
        found.extend(
            taut::input::opened::opened()
                .into_iter()
                .map(|o| (o.device, o.inode, o.path)),
        );
        found
    }
}

static STDOUT_OPEN_AT_START: OnceLock<bool> = OnceLock::new();

/// Records whether standard output was open when the program started, before any file was
/// opened: a closed descriptor 1 would otherwise be reused by the first file `taut` opens.
pub fn note_standard_output() {
    let _ = STDOUT_OPEN_AT_START.get_or_init(|| !closed_at_start());
}

/// Whether descriptor 1 was closed when the program started. Rust's start-up code reopens a
/// closed descriptor 1 on `/dev/null` for reading and writing before `main` runs; a shell's
/// `>/dev/null` opens it for writing only. So on Linux, `/dev/null` open for reading and writing
/// as standard output means it was closed (`1<>/dev/null` looks the same and is taken as closed).
fn closed_at_start() -> bool {
    use std::os::unix::fs::FileTypeExt;
    if io::stdout().as_fd().try_clone_to_owned().is_err() {
        return true;
    }
    // Device number 1:3 is /dev/null on Linux.
    let is_null = fs::metadata("/proc/self/fd/1")
        .is_ok_and(|meta| meta.file_type().is_char_device() && meta.rdev() == 0x103);
    if !is_null {
        return false;
    }
    const ACCESS_MODE: u32 = 0o3;
    const READ_WRITE: u32 = 0o2;
    fs::read_to_string("/proc/self/fdinfo/1")
        .ok()
        .and_then(|info| {
            info.lines()
                .find_map(|line| line.strip_prefix("flags:"))
                .and_then(|flags| u32::from_str_radix(flags.trim(), 8).ok())
        })
        .is_some_and(|flags| flags & ACCESS_MODE == READ_WRITE)
}

/// The option that sends a command's output to standard output when it is not given: `--output`
/// for reports, `--dir` for manual pages; [`STANDARD_OUTPUT_ONLY`] for output that has no file
/// option (completions, help topics).
pub const STANDARD_OUTPUT_ONLY: &str = "standard output";

/// What to do about a closed standard output, in terms of the options of the command that
/// printed it (`flag` is the option whose absence sent the output there).
fn closed_hint(flag: &str) -> (String, String) {
    match flag {
        "--output" => (
            "give `-o FILE` or redirect it".to_string(),
            "give `-o /dev/null`".to_string(),
        ),
        "--dir" => (
            "redirect it (`> taut.1`), or give `--dir FOLDER` to write every page as a file"
                .to_string(),
            "give `--dir FOLDER`, or redirect it with `> /dev/null`".to_string(),
        ),
        _ => (
            "redirect it to a file (`> FILE`)".to_string(),
            "redirect it with `> /dev/null`".to_string(),
        ),
    }
}

fn standard_output(flag: &str) -> io::Result<File> {
    let (hint, null_hint) = closed_hint(flag);
    if !STDOUT_OPEN_AT_START.get().copied().unwrap_or(true) {
        // Indistinguishable from a closed one: /dev/null opened for reading and writing, as
        // Python's `subprocess.DEVNULL` and Node's `'ignore'` open it (measured: the same
        // `/proc/self/fdinfo/1` flags as the runtime's reopening), so say how to avoid it.
        return Err(io::Error::other(format!(
            "standard output is closed; {hint}\n  help: a read-write /dev/null (Python's `subprocess.DEVNULL`) looks closed too: {null_hint}",
        )));
    }
    // A duplicate of descriptor 1 as a plain file: the standard library's own handle treats a
    // closed descriptor as a silent success, which would lose the report without a word.
    io::stdout()
        .as_fd()
        .try_clone_to_owned()
        .map(File::from)
        .map_err(|_| io::Error::other(format!("standard output is closed; {hint}")))
}

/// One output of a run.
struct Planned {
    flag: &'static str,
    target: Option<Target>,
    bytes: Vec<u8>,
}

/// How a planned output will be written.
enum Method {
    Stdout,
    /// Opened for writing and written through (devices, FIFOs, `/dev/…`, `/proc/…`).
    Through(PathBuf),
    /// Temporary file beside `path`, then a rename; `existing` holds the file's metadata.
    Replace {
        path: PathBuf,
        existing: Option<fs::Metadata>,
    },
}

/// All the outputs of one run, written both (all) or neither (none).
pub struct Outputs<'a> {
    inputs: &'a Inputs,
    planned: Vec<Planned>,
}

impl<'a> Outputs<'a> {
    /// No outputs yet; none will be written over `inputs`.
    pub fn new(inputs: &'a Inputs) -> Self {
        Outputs {
            inputs,
            planned: Vec::new(),
        }
    }

    /// Adds an output given by option `flag`; `None` (no option) is standard output.
    pub fn add(&mut self, flag: &'static str, target: Option<Target>, bytes: Vec<u8>) {
        self.planned.push(Planned {
            flag,
            target,
            bytes,
        });
    }

    /// Checks every output, then writes them all, or none.
    pub fn write(self) -> Result<()> {
        let methods = self.check()?;
        write_all(&self.planned, &methods)
    }

    fn check(&self) -> Result<Vec<Method>> {
        let inputs = self.inputs.all();
        let mut methods: Vec<Method> = Vec::with_capacity(self.planned.len());
        let mut places: Vec<(Place, &'static str)> = Vec::new();
        for planned in &self.planned {
            let method = match &planned.target {
                None | Some(Target::Stdout) => Method::Stdout,
                Some(Target::Path(path)) => method_for(path)?,
            };
            let place = place_of(&method);
            if let Place::File(dev, ino) = place {
                if let Some((_, _, input)) = inputs.iter().find(|(d, i, _)| (*d, *i) == (dev, ino))
                {
                    return Err(same_as_input(planned, input));
                }
            }
            if let Some((_, earlier)) = places
                .iter()
                .find(|(p, _)| *p == place && place != Place::Shared)
            {
                return Err(Error::input(format!(
                    "{} and {earlier} name the same place; give each its own file",
                    planned.flag
                ))
                .in_origin(planned.flag));
            }
            places.push((place, planned.flag));
            methods.push(method);
        }
        Ok(methods)
    }
}

fn same_as_input(planned: &Planned, input: &Path) -> Error {
    let shown = match &planned.target {
        Some(Target::Path(path)) => path.display().to_string(),
        _ => "-".to_string(),
    };
    Error::input(format!(
        "`{shown}` is one of this command's inputs (`{}`); taut does not write over its inputs",
        input.display()
    ))
    .in_origin(planned.flag)
    .help("write the output to another file")
}

/// What two outputs are compared by.
#[derive(Debug, Clone, PartialEq, Eq)]
enum Place {
    Stdout,
    /// An existing file: device and inode.
    File(u64, u64),
    /// A file still to be created, by its absolute path.
    New(PathBuf),
    /// A character device (`/dev/null`), which any number of outputs may share.
    Shared,
}

fn place_of(method: &Method) -> Place {
    match method {
        Method::Stdout => Place::Stdout,
        Method::Through(path) => match fs::metadata(path) {
            Ok(meta) if meta.file_type().is_char_device_like() => Place::Shared,
            Ok(meta) => Place::File(meta.dev(), meta.ino()),
            Err(_) => Place::New(path.clone()),
        },
        Method::Replace {
            existing: Some(meta),
            ..
        } => Place::File(meta.dev(), meta.ino()),
        Method::Replace {
            path,
            existing: None,
        } => Place::New(absolute(path)),
    }
}

trait CharDevice {
    fn is_char_device_like(&self) -> bool;
}

impl CharDevice for fs::FileType {
    fn is_char_device_like(&self) -> bool {
        use std::os::unix::fs::FileTypeExt;
        self.is_char_device()
    }
}

/// `path` made absolute with its folder's symlinks resolved, for comparing files not yet made.
fn absolute(path: &Path) -> PathBuf {
    let folder = folder_of(path);
    let folder = fs::canonicalize(folder).unwrap_or_else(|_| folder.to_path_buf());
    match path.file_name() {
        Some(name) => folder.join(name),
        None => folder,
    }
}

fn folder_of(path: &Path) -> &Path {
    match path.parent() {
        Some(parent) if !parent.as_os_str().is_empty() => parent,
        _ => Path::new("."),
    }
}

fn write_error(path: &Path, source: io::Error) -> Error {
    Error::Write {
        path: path.to_path_buf(),
        source,
    }
}

/// Decides how `path` is written, and refuses folders and read-only files.
fn method_for(path: &Path) -> Result<Method> {
    let fail = |source: io::Error| write_error(path, source);
    let under_system = path.starts_with("/dev") || path.starts_with("/proc");
    match fs::metadata(path) {
        Ok(meta) if meta.is_dir() => Err(fail(io::Error::other("it is a folder"))),
        Ok(meta) if !meta.is_file() || under_system => Ok(Method::Through(path.to_path_buf())),
        Ok(meta) => {
            let real = fs::canonicalize(path).map_err(fail)?;
            if meta.permissions().mode() & 0o222 == 0 {
                return Err(fail(io::Error::other(format!(
                    "it is read-only (mode {:04o}); taut does not replace read-only files — make it writable or choose another file",
                    meta.permissions().mode() & 0o7777
                ))));
            }
            // Opening without truncating checks the user's own right to write (for root this
            // always succeeds; the mode check above covers root).
            if let Err(err) = OpenOptions::new().write(true).open(&real) {
                if err.kind() == ErrorKind::PermissionDenied {
                    return Err(fail(err));
                }
            }
            Ok(Method::Replace {
                path: real,
                existing: Some(meta),
            })
        }
        Err(err) if err.kind() == ErrorKind::NotFound => {
            if under_system {
                return Err(fail(err));
            }
            Ok(Method::Replace {
                path: dangling_target(path),
                existing: None,
            })
        }
        Err(err) => Err(fail(err)),
    }
}

/// For a symlink whose target does not exist yet, the target (so the link is kept); otherwise
/// `path` itself.
fn dangling_target(path: &Path) -> PathBuf {
    let mut current = path.to_path_buf();
    for _ in 0..40 {
        match fs::read_link(&current) {
            Ok(next) => current = folder_of(&current).join(next),
            Err(_) => return current,
        }
    }
    current
}

/// A temporary file made and filled beside its target, not yet renamed.
struct Prepared {
    temporary: PathBuf,
    target: PathBuf,
    backup: Option<PathBuf>,
}

fn write_all(planned: &[Planned], methods: &[Method]) -> Result<()> {
    // 1. Every file's contents into a temporary file beside it.
    let mut prepared: Vec<Prepared> = Vec::new();
    let forget = |prepared: &[Prepared]| {
        let mut ledger = partial::ledger();
        for p in prepared {
            // Best effort: the temporary files are ours and must not be left behind.
            let _ = fs::remove_file(&p.temporary);
            partial::forget(&mut ledger, &p.temporary);
        }
    };
    for (planned, method) in planned.iter().zip(methods) {
        if let Method::Replace { path, existing } = method {
            match prepare(path, existing.as_ref(), &planned.bytes) {
                Ok(temporary) => prepared.push(Prepared {
                    temporary,
                    target: path.clone(),
                    backup: None,
                }),
                Err(err) => {
                    forget(&prepared);
                    return Err(err);
                }
            }
        }
    }
    // 2. The streams, which cannot be taken back: if one fails, no file is touched.
    for (planned, method) in planned.iter().zip(methods) {
        let written = match method {
            Method::Stdout => write_stdout(&planned.bytes, planned.flag),
            Method::Through(path) => write_through(path, &planned.bytes),
            Method::Replace { .. } => Ok(()),
        };
        if let Err(err) = written {
            forget(&prepared);
            return Err(err);
        }
    }
    // 3. The renames; a failure puts back what was renamed before it. The ledger is held
    // throughout (renames are quick), so a signal is handled before or after, never between
    // a rename and its note.
    let mut ledger = partial::ledger();
    for index in 0..prepared.len() {
        let backup = keep_backup(&prepared[index].target);
        if let Some(backup) = &backup {
            ledger.push(partial::Undo::Remove(backup.clone()));
        }
        prepared[index].backup = backup;
        if let Err(err) = fs::rename(&prepared[index].temporary, &prepared[index].target) {
            for done in &prepared[..index] {
                let _ = match &done.backup {
                    Some(backup) => fs::rename(backup, &done.target),
                    None => fs::remove_file(&done.target),
                };
            }
            for p in &prepared[index..] {
                let _ = fs::remove_file(&p.temporary);
                if let Some(backup) = &p.backup {
                    let _ = fs::remove_file(backup);
                }
            }
            settle(&mut ledger, &prepared);
            return Err(write_error(&prepared[index].target, err));
        }
        // Renamed: on a signal now, the old file comes back (or the new one goes).
        let p = &prepared[index];
        partial::forget(&mut ledger, &p.temporary);
        if let Some(backup) = &p.backup {
            partial::forget(&mut ledger, backup);
        }
        ledger.push(match &p.backup {
            Some(backup) => partial::Undo::PutBack {
                backup: backup.clone(),
                target: p.target.clone(),
            },
            None => partial::Undo::Remove(p.target.clone()),
        });
    }
    for p in &prepared {
        if let Some(backup) = &p.backup {
            let _ = fs::remove_file(backup);
        }
    }
    settle(&mut ledger, &prepared);
    Ok(())
}

/// Takes every step of these outputs off the ledger: they are done (or undone) for good.
fn settle(ledger: &mut Vec<partial::Undo>, prepared: &[Prepared]) {
    for p in prepared {
        partial::forget(ledger, &p.temporary);
        partial::forget(ledger, &p.target);
        if let Some(backup) = &p.backup {
            partial::forget(ledger, backup);
        }
    }
}

/// A hard link to the file about to be replaced, so a later failure can put it back (only
/// needed when a run writes more than one file; harmless otherwise).
fn keep_backup(target: &Path) -> Option<PathBuf> {
    if !target.exists() {
        return None;
    }
    let name = target.file_name()?.to_string_lossy().to_string();
    let backup = folder_of(target).join(format!(".{name}.{}.taut-backup", std::process::id()));
    fs::hard_link(target, &backup).ok().map(|()| backup)
}

/// Writes `bytes` to a new temporary file beside `target`, with the target's mode (and owner,
/// where allowed), synced to disk; returns its path.
fn prepare(target: &Path, existing: Option<&fs::Metadata>, bytes: &[u8]) -> Result<PathBuf> {
    let fail = |source: io::Error| write_error(target, source);
    let file_name = target
        .file_name()
        .ok_or_else(|| fail(io::Error::other("the path names no file")))?;
    let folder = folder_of(target);
    for attempt in 0..100 {
        let temporary = folder.join(format!(
            ".{}.{}-{attempt}.taut-partial",
            file_name.to_string_lossy(),
            std::process::id()
        ));
        // Made and noted under the ledger's lock, so a signal cannot fall between the two.
        let mut ledger = partial::ledger();
        let mut file = match OpenOptions::new()
            .write(true)
            .create_new(true)
            .open(&temporary)
        {
            Ok(file) => file,
            Err(err) if err.kind() == ErrorKind::AlreadyExists => continue,
            Err(err) => return Err(fail(folder_refused(target, folder, err))),
        };
        ledger.push(partial::Undo::Remove(temporary.clone()));
        drop(ledger);
        let written = (|| {
            if let Some(meta) = existing {
                file.set_permissions(fs::Permissions::from_mode(meta.permissions().mode()))?;
                // Only root may give a file away; anyone else keeps their own files anyway.
                let _ = std::os::unix::fs::fchown(&file, Some(meta.uid()), Some(meta.gid()));
            }
            file.write_all(bytes)?;
            file.sync_all()
        })();
        return match written {
            Ok(()) => Ok(temporary),
            Err(err) => {
                let mut ledger = partial::ledger();
                let _ = fs::remove_file(&temporary);
                partial::forget(&mut ledger, &temporary);
                Err(fail(err))
            }
        };
    }
    Err(fail(io::Error::other(
        "could not create a temporary file beside it",
    )))
}

/// The reason a temporary file could not be made beside `target`, saying why the folder matters
/// when the folder refused it: the file itself may be writable, but the writer never writes
/// into it; it makes a new file beside it and renames that into place, so that the file is
/// replaced whole or not at all, and both steps need the right to change the folder.
fn folder_refused(target: &Path, folder: &Path, err: io::Error) -> io::Error {
    if err.kind() != ErrorKind::PermissionDenied {
        return err;
    }
    let name = target.file_name().map_or_else(
        || target.display().to_string(),
        |n| n.to_string_lossy().to_string(),
    );
    io::Error::new(
        ErrorKind::PermissionDenied,
        format!(
            "{err}: the folder `{}` does not let taut create files. taut never writes into `{name}` itself: it writes a new file beside it and renames that over it, so the file is replaced whole or not at all, and that needs the right to create files in the folder, not only to write the file\n  help: make the folder writable (`chmod u+w`), or write to another folder and copy the file",
            folder.display()
        ),
    )
}

/// Writes to standard output; a reader that stopped early (`taut … | head`) is not an error,
/// a closed standard output is.
fn write_stdout(bytes: &[u8], flag: &str) -> Result<()> {
    let fail = |source: io::Error| write_error(Path::new("standard output"), source);
    let mut stdout = standard_output(flag).map_err(fail)?;
    match stdout.write_all(bytes).and_then(|()| stdout.flush()) {
        Ok(()) => Ok(()),
        Err(err) if err.kind() == ErrorKind::BrokenPipe => Ok(()),
        Err(err) => Err(fail(err)),
    }
}

/// Opens a device, FIFO or `/dev/…` path for writing (appending, as a shell's `>>` would, so a
/// `/dev/stdout` that is a file keeps what is in it) and writes through.
fn write_through(path: &Path, bytes: &[u8]) -> Result<()> {
    let fail = |source: io::Error| write_error(path, source);
    let mut file = OpenOptions::new().append(true).open(path).map_err(fail)?;
    match file.write_all(bytes).and_then(|()| file.flush()) {
        Ok(()) => Ok(()),
        Err(err) if err.kind() == ErrorKind::BrokenPipe => Ok(()),
        Err(err) => Err(fail(err)),
    }
}

/// Writes raw bytes (a report, a picture, a data file) given by option `flag` to `target`
/// (`None` or `-`: standard output) under the same rules as every output: never over one of
/// `inputs`, a regular file whole or not at all, devices written through.
pub fn write_bytes(
    flag: &'static str,
    target: Option<&Target>,
    bytes: Vec<u8>,
    inputs: &Inputs,
) -> Result<()> {
    let mut outputs = Outputs::new(inputs);
    outputs.add(flag, target.cloned(), bytes);
    outputs.write()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn to(path: &Path) -> Target {
        Target::Path(path.to_path_buf())
    }

    #[test]
    fn replaces_a_file_whole_and_leaves_no_temporary_file() {
        let folder = tempfile::tempdir().unwrap();
        let path = folder.path().join("report.json");
        fs::write(&path, "old").unwrap();
        write_bytes(
            "-o",
            Some(&to(&path)),
            b"new contents".to_vec(),
            &Inputs::new(),
        )
        .unwrap();
        assert_eq!(fs::read_to_string(&path).unwrap(), "new contents");
        assert_eq!(fs::read_dir(folder.path()).unwrap().count(), 1);
    }

    #[test]
    fn refuses_a_folder_and_a_missing_folder_without_leaving_anything() {
        let folder = tempfile::tempdir().unwrap();
        assert!(write_bytes(
            "-o",
            Some(&to(folder.path())),
            b"x".to_vec(),
            &Inputs::new()
        )
        .is_err());
        let missing = folder.path().join("no/such/folder/out.txt");
        let err =
            write_bytes("-o", Some(&to(&missing)), b"x".to_vec(), &Inputs::new()).unwrap_err();
        assert_eq!(err.exit_code(), taut::error::EXIT_FAILURE);
        assert_eq!(fs::read_dir(folder.path()).unwrap().count(), 0);
    }

    #[test]
    fn a_failed_second_rename_puts_the_first_file_back() {
        let folder = tempfile::tempdir().unwrap();
        let first = folder.path().join("set.yaml");
        fs::write(&first, "old set").unwrap();
        let blocked = folder.path().join("report");
        fs::create_dir(&blocked).unwrap();
        fs::write(blocked.join("inside"), "x").unwrap();
        // The folder is found at the check and refused before anything is written.
        let inputs = Inputs::new();
        let mut outputs = Outputs::new(&inputs);
        outputs.add("--save-set", Some(to(&first)), b"new set".to_vec());
        outputs.add("--output", Some(to(&blocked)), b"report".to_vec());
        assert!(outputs.write().is_err());
        assert_eq!(fs::read_to_string(&first).unwrap(), "old set");
        // A rename that fails after the check (onto a folder that is not empty): the first
        // file, already renamed, is put back from its backup.
        let planned = [
            Planned {
                flag: "--save-set",
                target: Some(to(&first)),
                bytes: b"new set".to_vec(),
            },
            Planned {
                flag: "--output",
                target: Some(to(&blocked)),
                bytes: b"report".to_vec(),
            },
        ];
        let methods = [
            Method::Replace {
                path: first.clone(),
                existing: fs::metadata(&first).ok(),
            },
            Method::Replace {
                path: blocked.clone(),
                existing: None,
            },
        ];
        assert!(write_all(&planned, &methods).is_err());
        assert_eq!(fs::read_to_string(&first).unwrap(), "old set");
        let names: Vec<String> = fs::read_dir(folder.path())
            .unwrap()
            .map(|e| e.unwrap().file_name().to_string_lossy().to_string())
            .collect();
        assert!(
            names.iter().all(|n| !n.contains("taut-")),
            "left behind: {names:?}"
        );
    }
}
