//! Pieces shared by the commands: reading designs, printing errors, writing files atomically.

use super::files::FileSystem;
use super::Exit;
use crate::design::{Design, Format};
use crate::diag::InputError;
use crate::front::{self, ReadError, Source};
use crate::sat::Limits;
use clap::Args;
use std::io::Write;
use std::path::{Path, PathBuf};

/// The format names on the command line.
#[derive(Copy, Clone, Debug, PartialEq, Eq, clap::ValueEnum)]
pub enum FormatArg {
    /// ISCAS bench format.
    Bench,
    /// IEEE 1364 Verilog and the synthesizable SystemVerilog subset (docs/verilog.md).
    Verilog,
}

impl From<FormatArg> for Format {
    fn from(f: FormatArg) -> Format {
        match f {
            FormatArg::Bench => Format::Bench,
            FormatArg::Verilog => Format::Verilog,
        }
    }
}

/// The run's budget (`--timeout`, `--conflict-limit`), shared by `prove`, `cone`, `stats` and
/// `routes`.
#[derive(Args, Debug, Clone)]
pub struct BudgetArgs {
    /// Stop after this many seconds, reading the designs included; what is still open (output
    /// pairs, claims, select values) is then undecided.
    #[arg(long, value_name = "SECONDS", allow_negative_numbers = true)]
    pub timeout: Option<f64>,
    /// Conflicts allowed per SAT query; a query that needs more leaves its output pair, claim
    /// or route undecided.
    #[arg(long, value_name = "N")]
    pub conflict_limit: Option<u64>,
}

impl BudgetArgs {
    /// The solver limits; the clock starts now.
    pub fn limits(&self) -> Result<crate::sat::Limits, Exit> {
        Ok(crate::sat::Limits::new(
            timeout_of(self.timeout)?,
            self.conflict_limit,
        ))
    }
}

/// The budget and the simulation seed of `prove`, `cone` and `stats`.
#[derive(Args, Debug, Clone)]
pub struct LimitArgs {
    /// `--timeout` and `--conflict-limit`.
    #[command(flatten)]
    pub budget: BudgetArgs,
    /// Seed of the random simulation patterns.
    #[arg(long, default_value_t = 1)]
    pub seed: u64,
}

/// How to read one design given on the command line.
#[derive(Args, Debug, Clone)]
pub struct DesignArgs {
    /// The design's netlist file.
    #[arg(value_name = "DESIGN")]
    pub path: PathBuf,
    /// More Verilog files of the same design.
    #[arg(long = "also", value_name = "FILE")]
    pub also: Vec<PathBuf>,
    /// The input format (default: from the file name, `.bench` or `.v`).
    #[arg(long, value_enum)]
    pub format: Option<FormatArg>,
    /// The top module (Verilog; default: the module nobody instantiates).
    #[arg(long)]
    pub top: Option<String>,
    /// Include directories and macros for the Verilog preprocessor.
    #[command(flatten)]
    pub pre: PreprocArgs,
}

/// The Verilog preprocessor's options on the command line.
#[derive(Args, Debug, Clone, Default)]
pub struct PreprocArgs {
    /// A directory searched for `include files, after the including file's own (repeatable).
    #[arg(short = 'I', long = "include-dir", value_name = "DIR")]
    pub include_dirs: Vec<PathBuf>,
    /// A macro defined before the first file: NAME or NAME=VALUE (repeatable).
    #[arg(short = 'D', long = "define", value_name = "NAME=VALUE", value_parser = parse_define)]
    pub defines: Vec<(String, String)>,
}

fn parse_define(s: &str) -> Result<(String, String), String> {
    front::verilog::preprocess::Options::parse_define(s)
}

impl PreprocArgs {
    /// The options of the reader.
    pub fn options(&self) -> front::verilog::preprocess::Options {
        front::verilog::preprocess::Options {
            include_dirs: self.include_dirs.clone(),
            defines: self.defines.clone(),
            keep_written: false,
        }
    }
}

impl DesignArgs {
    /// Read the design these options name, shown as the phase `reading FILE` of `bar` (a
    /// spinner from `crate::host::spinner`, hidden when no progress is drawn), which is
    /// cleared before an error is printed.
    pub fn load_showing(&self, bar: &indicatif::ProgressBar) -> Result<Design, Exit> {
        bar.set_message(format!("reading {}", self.path.display()));
        let mut paths = vec![self.path.clone()];
        paths.extend(self.also.iter().cloned());
        let src = Source {
            paths,
            format: self.format.map(Format::from),
            top: self.top.clone(),
            preprocess: self.pre.options(),
        };
        let d = front::load(&src, &FileSystem).map_err(|e| {
            bar.finish_and_clear();
            report_input_error(&e)
        })?;
        bar.suspend(|| show_warnings(&d));
        Ok(d)
    }

    /// `d` (read from these options) read again as written, for the cone audit's structural
    /// cones ([`crate::cone::AuditOptions::structure`]): only for a Verilog design without a
    /// complete netlist; `None` otherwise or when the second read fails.
    pub fn load_written(&self, d: &Design) -> Option<Design> {
        let complete = d.netlist.as_ref().is_some_and(|n| n.complete);
        if d.format != Format::Verilog || complete {
            return None;
        }
        let mut paths = vec![self.path.clone()];
        paths.extend(self.also.iter().cloned());
        let mut preprocess = self.pre.options();
        preprocess.keep_written = true;
        let src = Source {
            paths,
            format: self.format.map(Format::from),
            top: self.top.clone(),
            preprocess,
        };
        front::load(&src, &FileSystem).ok()
    }

    /// Read the design under `limits`: when its deadline passes while reading, the run is
    /// undecided (exit code 3, message on standard error).
    pub fn load_within(&self, limits: &Limits) -> Result<Design, Exit> {
        let mut paths = vec![self.path.clone()];
        paths.extend(self.also.iter().cloned());
        let d = load_within(paths, self.format, self.top.clone(), &self.pre, limits)?;
        show_warnings(&d);
        Ok(d)
    }
}

/// The reader's warnings about a design read alone (`cone`, `stats`, `routes`, `eval`), on
/// standard error; `prove` puts them in its report instead.
fn show_warnings(d: &Design) {
    for w in &d.warnings {
        eprintln!("{w}");
    }
}

/// The largest `--timeout` accepted, in seconds (about 31 years).
const TIMEOUT_MAX: f64 = 1e9;

/// A `--timeout` value as a duration; a value that is not a positive number of seconds, or
/// one beyond [`TIMEOUT_MAX`], is a usage error that says which.
pub fn timeout_of(t: Option<f64>) -> Result<Option<std::time::Duration>, Exit> {
    match t {
        None => Ok(None),
        Some(s) if s.is_finite() && s > 0.0 && s < TIMEOUT_MAX => {
            Ok(Some(std::time::Duration::from_secs_f64(s)))
        }
        Some(s) => {
            let (what, help) = if !s.is_finite() {
                (
                    "is not a positive number of seconds",
                    "for example `--timeout 30`",
                )
            } else if s <= 0.0 {
                ("must be positive", "for example `--timeout 30`")
            } else {
                (
                    "is more than the largest limit, 1000000000 seconds",
                    "leave --timeout out to run without a time limit",
                )
            };
            eprintln!("error: --timeout {s} {what}\n  help: {help}");
            Err(Exit::BadInput)
        }
    }
}

/// A time share such as `--diagnosis-time` as a duration (0 allowed: the work is skipped);
/// a value that is not a number of seconds is a usage error.
pub fn seconds_of(flag: &str, s: f64) -> Result<std::time::Duration, Exit> {
    if s.is_finite() && s >= 0.0 {
        Ok(std::time::Duration::from_secs_f64(s.min(TIMEOUT_MAX)))
    } else {
        eprintln!("error: {flag} {s} is not a number of seconds\n  help: for example `{flag} 10`, or 0 to skip it");
        Err(Exit::BadInput)
    }
}

/// Read a design, printing its errors on failure.
pub fn load(
    paths: Vec<PathBuf>,
    format: Option<FormatArg>,
    top: Option<String>,
    pre: &PreprocArgs,
) -> Result<Design, Exit> {
    let src = Source {
        paths,
        format: format.map(Format::from),
        top,
        preprocess: pre.options(),
    };
    front::load(&src, &FileSystem).map_err(|e| report_input_error(&e))
}

/// Read a design under `limits`, printing its errors on failure; when the deadline passes
/// while reading, prints the undecided message and returns [`Exit::Undecided`].
pub fn load_within(
    paths: Vec<PathBuf>,
    format: Option<FormatArg>,
    top: Option<String>,
    pre: &PreprocArgs,
    limits: &Limits,
) -> Result<Design, Exit> {
    let src = Source {
        paths,
        format: format.map(Format::from),
        top,
        preprocess: pre.options(),
    };
    match front::load_until(&src, &FileSystem, &|| limits.expired()) {
        Ok(d) => Ok(d),
        Err(ReadError::Input(e)) => Err(report_input_error(&e)),
        Err(ReadError::Stopped(file)) => Err(report_stopped_reading(&file)),
    }
}

/// The message for a time limit reached while reading; returns the undecided exit code.
pub fn report_stopped_reading(file: &str) -> Exit {
    eprintln!(
        "undecided: the time limit ran out while reading `{file}`; nothing was checked\n  help: the --timeout covers reading the designs too; give a larger one"
    );
    Exit::Undecided
}

/// Print input errors to standard error; returns the bad-input exit code.
pub fn report_input_error(e: &InputError) -> Exit {
    eprintln!("{e}");
    Exit::BadInput
}

/// Print an internal error; returns its exit code.
pub fn report_internal(msg: &str) -> Exit {
    eprintln!("error: {msg}");
    Exit::Internal
}

/// Write `contents` to `path` atomically: a temporary file in the same folder, then a rename.
pub fn write_atomic(path: impl AsRef<Path>, contents: &[u8]) -> Result<(), InputError> {
    let p = path.as_ref();
    let dir = folder_of(p);
    let fail = |e: std::io::Error| write_failure(p, dir, e);
    let mut tmp = tempfile::NamedTempFile::new_in(dir).map_err(fail)?;
    tmp.write_all(contents).map_err(fail)?;
    #[cfg(unix)]
    {
        // A temporary file is private (0600); the result should read like any new file.
        use std::os::unix::fs::PermissionsExt;
        let _ = tmp
            .as_file()
            .set_permissions(std::fs::Permissions::from_mode(0o644));
    }
    tmp.as_file().sync_all().map_err(fail)?;
    tmp.persist(p).map_err(|e| fail(e.error))?;
    Ok(())
}

/// Check, before any work, that [`write_atomic`] can write `path`: it is not a folder and a
/// temporary file can be made beside it (the probe is removed at once). Each path that is
/// `Some` is checked; the first failure is printed and gives [`Exit::BadInput`].
pub fn check_writable<'a>(paths: impl IntoIterator<Item = Option<&'a Path>>) -> Result<(), Exit> {
    for p in paths.into_iter().flatten() {
        let dir = folder_of(p);
        let probe = if p.is_dir() {
            Err(std::io::Error::from(std::io::ErrorKind::IsADirectory))
        } else {
            tempfile::NamedTempFile::new_in(dir).map(drop)
        };
        if let Err(e) = probe {
            return Err(report_input_error(&write_failure(p, dir, e)));
        }
    }
    Ok(())
}

/// The folder a file is written into (`.` for a bare file name).
fn folder_of(p: &Path) -> &Path {
    match p.parent() {
        Some(d) if !d.as_os_str().is_empty() => d,
        _ => Path::new("."),
    }
}

/// The message for a failed write of `path` in `dir`.
fn write_failure(path: &Path, dir: &Path, e: std::io::Error) -> InputError {
    {
        let what = match e.kind() {
            std::io::ErrorKind::NotFound => {
                format!("the folder `{}` does not exist", dir.display())
            }
            std::io::ErrorKind::PermissionDenied => "permission denied".to_string(),
            std::io::ErrorKind::IsADirectory => "it is a folder".to_string(),
            std::io::ErrorKind::NotADirectory => {
                "a part of the path before the file name is not a folder".to_string()
            }
            std::io::ErrorKind::StorageFull => "the disk is full".to_string(),
            _ => {
                // The tempfile crate appends the temporary file's path; keep the cause only.
                let s = e.to_string();
                s.split(" at path ").next().unwrap_or(&s).to_string()
            }
        };
        InputError::plain(
            format!("cannot write `{}`: {what}", path.display()),
            "check that the folder exists and is writable; nothing was written",
        )
    }
}

/// Print to standard output; a closed pipe is not an error.
pub fn print(s: &str) {
    let mut out = std::io::stdout().lock();
    let _ = out.write_all(s.as_bytes());
    let _ = out.flush();
}
