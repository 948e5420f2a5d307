//! The file system behind the readers' [`Files`] seam: the command line is where files are
//! opened. Design files are read with clear errors for missing, unreadable and binary files,
//! folders and endless sources; included files are found and read here too.

use crate::diag::InputError;
use crate::front::files::{cannot_read, MISSING_HELP};
use crate::front::{decode_text, Files, ReadError};
use std::path::{Path, PathBuf};

/// The files on disk, by path.
pub struct FileSystem;

impl Files for FileSystem {
    fn read_text(&self, path: &Path, stop: &dyn Fn() -> bool) -> Result<String, ReadError> {
        read_text_until(path, stop)
    }

    fn is_file(&self, path: &Path) -> bool {
        path.is_file()
    }

    fn read_bytes(&self, path: &Path) -> std::io::Result<Vec<u8>> {
        std::fs::read(path)
    }

    fn identity(&self, path: &Path) -> PathBuf {
        std::fs::canonicalize(path).unwrap_or_else(|_| path.to_path_buf())
    }
}

/// Read a file as text (a design, port map, cost model, expectation, report or trace), with
/// the errors of [`FileSystem`].
pub fn read_text(path: impl AsRef<Path>) -> Result<String, InputError> {
    read_text_until(path.as_ref(), &|| false).map_err(|e| match e {
        ReadError::Input(e) => e,
        ReadError::Stopped(_) => unreachable!("no stop condition"),
    })
}

/// Read a file as text, looking at `stop` after every mebibyte. A pipe or device is read in
/// pieces and given up at its first NUL byte, so `/dev/zero` is an error at once rather
/// than a full memory.
fn read_text_until(path: &Path, stop: &dyn Fn() -> bool) -> Result<String, ReadError> {
    use std::io::Read;
    // The name as shown in messages and diagnostics (lossy when it is not UTF-8).
    let name = path.display().to_string();
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
        cannot_read(&name, &what, MISSING_HELP)
    };
    let meta = std::fs::metadata(path).map_err(io_fail)?;
    if meta.is_dir() {
        return Err(cannot_read(
            &name,
            "it is a folder, not a file",
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
