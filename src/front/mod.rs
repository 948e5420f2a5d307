//! Front-ends: read netlist files into [`Design`]s. Owns format detection, file reading
//! (missing, unreadable, binary and empty files) and the stop condition while reading (a
//! `--timeout` covers reading too).

pub mod bench;
pub mod verilog;

use crate::design::{Design, Format};
use crate::diag::{Diagnostic, InputError, SourcePos};
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

/// Read a file as text, with clear errors for missing, unreadable and binary files, folders,
/// and endless sources: a pipe or device is read in pieces and given up at its first NUL
/// byte, so `/dev/zero` is an error at once rather than a full memory.
pub fn read_text(path: impl AsRef<Path>) -> Result<String, InputError> {
    read_text_until(path, &|| false).map_err(|e| match e {
        ReadError::Input(e) => e,
        ReadError::Stopped(_) => unreachable!("no stop condition"),
    })
}

/// [`read_text`], looking at `stop` after every mebibyte.
pub fn read_text_until(
    path: impl AsRef<Path>,
    stop: &dyn Fn() -> bool,
) -> Result<String, ReadError> {
    use std::io::Read;
    let path = path.as_ref();
    // The name as shown in messages and diagnostics (lossy when it is not UTF-8).
    let name = path.display().to_string();
    let fail =
        |what: String, help: &str| InputError::plain(format!("cannot read `{name}`: {what}"), help);
    let io_fail = |e: std::io::Error| {
        let what = match e.kind() {
            std::io::ErrorKind::NotFound => "no such file".to_string(),
            std::io::ErrorKind::PermissionDenied => "permission denied".to_string(),
            std::io::ErrorKind::NotADirectory => {
                "a part of the path before the file name is not a folder".to_string()
            }
            std::io::ErrorKind::IsADirectory => "it is a folder, not a file".to_string(),
            _ => e.to_string(),
        };
        fail(what, "check the path and that the file is readable")
    };
    let meta = std::fs::metadata(path).map_err(io_fail)?;
    if meta.is_dir() {
        return Err(fail(
            "it is a folder, not a file".to_string(),
            "name a netlist file inside it",
        )
        .into());
    }
    let mut f = std::fs::File::open(path).map_err(io_fail)?;
    let mut bytes = Vec::with_capacity(if meta.is_file() {
        meta.len() as usize + 1
    } else {
        0
    });
    let mut chunk = vec![0u8; 1 << 20];
    loop {
        let n = match f.read(&mut chunk) {
            Ok(0) => break,
            Ok(n) => n,
            Err(e) if e.kind() == std::io::ErrorKind::Interrupted => continue,
            Err(e) => return Err(io_fail(e).into()),
        };
        let nul = chunk[..n].contains(&0);
        bytes.extend_from_slice(&chunk[..n]);
        if nul {
            break;
        }
        if stop() {
            return Err(ReadError::Stopped(name));
        }
    }
    Ok(decode_text(&name, bytes)?)
}

/// Check that `bytes` are text (UTF-8 without NUL bytes) and return them as a string.
pub fn decode_text(path: &str, bytes: Vec<u8>) -> Result<String, InputError> {
    let file: Arc<str> = Arc::from(path);
    if let Some(off) = bytes.iter().position(|&b| b == 0) {
        let (line, col) = line_col(&bytes[..off]);
        return Err(InputError::one(
            Diagnostic::error(
                Some(SourcePos::new(&file, line, col)),
                "the file is not text (it holds a NUL byte)",
            )
            .with_help("give a netlist in bench or Verilog text form"),
        ));
    }
    String::from_utf8(bytes).map_err(|e| {
        let off = e.utf8_error().valid_up_to();
        let (line, col) = line_col(&e.as_bytes()[..off]);
        InputError::one(
            Diagnostic::error(
                Some(SourcePos::new(&file, line, col)),
                "the file is not UTF-8 text",
            )
            .with_help("save the netlist as UTF-8 (or plain ASCII) text"),
        )
    })
}

fn line_col(prefix: &[u8]) -> (u32, u32) {
    let line = prefix.iter().filter(|&&b| b == b'\n').count() as u32 + 1;
    let start = prefix
        .iter()
        .rposition(|&b| b == b'\n')
        .map_or(0, |i| i + 1);
    let col = String::from_utf8_lossy(&prefix[start..]).chars().count() as u32 + 1;
    (line, col)
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

/// Read a design from files.
pub fn load(src: &Source) -> Result<Design, InputError> {
    load_until(src, &|| false).map_err(|e| match e {
        ReadError::Input(e) => e,
        ReadError::Stopped(_) => unreachable!("no stop condition"),
    })
}

/// Read a design from files, looking at `stop` while reading (every mebibyte of a file,
/// every 65,536 lines and gates of a bench file, between the phases of the Verilog reader);
/// when it answers true, reading ends with [`ReadError::Stopped`].
pub fn load_until(src: &Source, stop: &dyn Fn() -> bool) -> Result<Design, ReadError> {
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
    if format == Format::Bench && src.paths.len() == 1 && src.top.is_none() {
        // One bench file: the reader takes the text and drops it early.
        let text = read_text_until(first, stop)?;
        if stop() {
            return Err(ReadError::Stopped(first.display().to_string()));
        }
        return bench::read_bench_text(&Arc::from(first.display().to_string()), text, stop);
    }
    let mut texts = Vec::with_capacity(src.paths.len());
    for p in &src.paths {
        texts.push((
            Arc::<str>::from(p.display().to_string()),
            read_text_until(p, stop)?,
        ));
    }
    if stop() {
        return Err(ReadError::Stopped(first.display().to_string()));
    }
    let d = load_texts_until(format, &texts, src.top.as_deref(), &src.preprocess, stop)?;
    if stop() {
        return Err(ReadError::Stopped(first.display().to_string()));
    }
    Ok(d)
}

/// Read a design from texts already in memory (`(file name, text)` pairs).
pub fn load_texts(
    format: Format,
    texts: &[(Arc<str>, String)],
    top: Option<&str>,
) -> Result<Design, InputError> {
    let opts = verilog::preprocess::Options::default();
    load_texts_until(format, texts, top, &opts, &|| false).map_err(|e| match e {
        ReadError::Input(e) => e,
        ReadError::Stopped(_) => unreachable!("no stop condition"),
    })
}

fn load_texts_until(
    format: Format,
    texts: &[(Arc<str>, String)],
    top: Option<&str>,
    opts: &verilog::preprocess::Options,
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
        Format::Verilog => Ok(verilog::read_verilog_with(texts, top, opts)?),
    }
}
