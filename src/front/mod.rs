//! Front-ends: read netlist files into [`Design`]s. Owns format detection, the checks that
//! a file is text, and the stop condition while reading (a `--timeout` covers reading too).
//! The files themselves come through the [`Files`] seam (`files.rs`): no reader opens one.

pub mod bench;
pub mod files;
pub mod verilog;

pub use files::{decode_text, Files, MemoryFiles};

use crate::design::{Design, Format};
use crate::diag::InputError;
use std::path::{Path, PathBuf};
use std::sync::Arc;

/// Why reading gave no design.
#[derive(Debug)]
pub enum ReadError {
    /// Bad input (exit code 2).
    Input(InputError),
    /// The stop condition (a time limit) held before the design was read; the file named.
    Stopped(String),
}

impl From<InputError> for ReadError {
    fn from(e: InputError) -> Self {
        ReadError::Input(e)
    }
}

/// Guess the format from a file name: `.bench` is bench, `.v`/`.vh`/`.sv` is Verilog.
pub fn format_from_name(path: impl AsRef<Path>) -> Option<Format> {
    let ext = path.as_ref().extension()?.to_str()?.to_ascii_lowercase();
    match ext.as_str() {
        "bench" | "bch" => Some(Format::Bench),
        "v" | "vh" | "verilog" | "sv" | "svh" => Some(Format::Verilog),
        _ => None,
    }
}

/// Which files make one design and how to read them.
#[derive(Clone, Debug, Default)]
pub struct Source {
    /// The files, in order (several Verilog files may form one design); their names need
    /// not be UTF-8 (messages show them lossily).
    pub paths: Vec<PathBuf>,
    /// The format; `None` guesses from the first file's name.
    pub format: Option<Format>,
    /// The top module (Verilog only).
    pub top: Option<String>,
    /// Include directories and command-line macros (Verilog only).
    pub preprocess: verilog::preprocess::Options,
}

/// Read a design from the files `files` holds.
pub fn load(src: &Source, files: &dyn Files) -> Result<Design, InputError> {
    load_until(src, files, &|| false).map_err(|e| match e {
        ReadError::Input(e) => e,
        ReadError::Stopped(_) => unreachable!("no stop condition"),
    })
}

/// Read a design from the files `files` holds, looking at `stop` while reading (the store
/// looks at it while reading a file, the bench reader every 65,536 lines and gates, the
/// Verilog reader between its phases); when it answers true, reading ends with
/// [`ReadError::Stopped`].
pub fn load_until(
    src: &Source,
    files: &dyn Files,
    stop: &dyn Fn() -> bool,
) -> Result<Design, ReadError> {
    let first = src
        .paths
        .first()
        .ok_or_else(|| InputError::plain("no input file given", "name a netlist file"))?;
    let format =
        match src.format.or_else(|| format_from_name(first)) {
            Some(f) => f,
            None => return Err(InputError::plain(
                format!(
                    "cannot tell the format of `{}` from its name",
                    first.display()
                ),
                "use a `.bench` or `.v` file name, or say `--format bench` or `--format verilog`",
            )
            .into()),
        };
    let clock = std::time::Instant::now();
    let done = |d: Result<Design, ReadError>| {
        if let Ok(d) = &d {
            log::debug!(
                "read `{}`: {} inputs, {} AND nodes, by {:.2?}; memory {}",
                first.display(),
                d.inputs.len(),
                d.aig.num_ands(),
                clock.elapsed(),
                crate::host::now_note()
            );
        }
        d
    };
    if format == Format::Bench && src.paths.len() == 1 && src.top.is_none() {
        // One bench file: the reader takes the text and drops it early.
        let text = files.read_text(first, stop)?;
        if stop() {
            return Err(ReadError::Stopped(first.display().to_string()));
        }
        return done(bench::read_bench_text(
            &Arc::from(first.display().to_string()),
            text,
            stop,
        ));
    }
    let mut texts = Vec::with_capacity(src.paths.len());
    for p in &src.paths {
        texts.push((
            Arc::<str>::from(p.display().to_string()),
            files.read_text(p, stop)?,
        ));
    }
    if stop() {
        return Err(ReadError::Stopped(first.display().to_string()));
    }
    let d = load_texts_until(
        format,
        &texts,
        &src.paths,
        src.top.as_deref(),
        &src.preprocess,
        files,
        stop,
    )?;
    if stop() {
        return Err(ReadError::Stopped(first.display().to_string()));
    }
    done(Ok(d))
}

/// Read a design from texts already in memory (`(file name, text)` pairs); a Verilog
/// `` `include `` finds nothing (use [`load`] with [`MemoryFiles`] for that).
pub fn load_texts(
    format: Format,
    texts: &[(Arc<str>, String)],
    top: Option<&str>,
) -> Result<Design, InputError> {
    let opts = verilog::preprocess::Options::default();
    let paths: Vec<PathBuf> = texts.iter().map(|t| PathBuf::from(&*t.0)).collect();
    let none = MemoryFiles::new();
    load_texts_until(format, texts, &paths, top, &opts, &none, &|| false).map_err(|e| match e {
        ReadError::Input(e) => e,
        ReadError::Stopped(_) => unreachable!("no stop condition"),
    })
}

/// `texts` with their `paths` (the names in `texts` show them, lossily); `files` serves
/// the Verilog includes.
fn load_texts_until(
    format: Format,
    texts: &[(Arc<str>, String)],
    paths: &[PathBuf],
    top: Option<&str>,
    opts: &verilog::preprocess::Options,
    files: &dyn Files,
    stop: &dyn Fn() -> bool,
) -> Result<Design, ReadError> {
    match format {
        Format::Bench => {
            if texts.len() != 1 {
                return Err(InputError::plain(
                    "a bench design is one file",
                    "give one .bench file per design",
                )
                .into());
            }
            if top.is_some() {
                return Err(InputError::plain(
                    "a top module was given for a bench file",
                    "the top-module options are for Verilog; drop them for bench files",
                )
                .into());
            }
            bench::read_bench_until(&texts[0].0, &texts[0].1, stop)
        }
        Format::Verilog => Ok(verilog::read_sources(texts, paths, top, opts, files)?),
    }
}
