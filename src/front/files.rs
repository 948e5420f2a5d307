//! The source-loading seam: the readers open no file themselves. They ask a [`Files`] for
//! the text of a design file and, for the Verilog preprocessor's `` `include ``, whether a
//! candidate file exists and what it holds. The command line passes the file system
//! (`cli::files::FileSystem`); tests and other library callers may pass [`MemoryFiles`].
//! Paths stay [`PathBuf`]s from the caller to the store, so their names need not be UTF-8;
//! messages show them lossily.

use super::ReadError;
use crate::diag::{Diagnostic, InputError, SourcePos};
use std::collections::BTreeMap;
use std::path::{Path, PathBuf};
use std::sync::Arc;

/// Where the readers get their text. Shared by the two threads that read a pair of designs,
/// hence `Sync`.
pub trait Files: Sync {
    /// The text of the design file `path`, checked to be text (see [`decode_text`]); the
    /// store looks at `stop` while it reads and gives [`ReadError::Stopped`] when it holds.
    fn read_text(&self, path: &Path, stop: &dyn Fn() -> bool) -> Result<String, ReadError>;
    /// Whether `path` names a file that can be read (the `` `include `` search).
    fn is_file(&self, path: &Path) -> bool;
    /// The bytes of an included file.
    fn read_bytes(&self, path: &Path) -> std::io::Result<Vec<u8>>;
    /// One name per file, so that two paths to the same file compare equal (include loops);
    /// the path as given by default.
    fn identity(&self, path: &Path) -> PathBuf {
        path.to_path_buf()
    }
}

/// Files held in memory by path (no file system): for tests, embedded designs and callers
/// that have the texts already. A path not in it does not exist.
#[derive(Clone, Debug, Default)]
pub struct MemoryFiles {
    files: BTreeMap<PathBuf, Vec<u8>>,
}

impl MemoryFiles {
    /// An empty store: every lookup misses.
    pub fn new() -> Self {
        Self::default()
    }

    /// Add (or replace) the file `path` holding `bytes`.
    pub fn insert(&mut self, path: impl Into<PathBuf>, bytes: impl Into<Vec<u8>>) {
        self.files.insert(path.into(), bytes.into());
    }

    /// The store with the file added.
    pub fn with(mut self, path: impl Into<PathBuf>, bytes: impl Into<Vec<u8>>) -> Self {
        self.insert(path, bytes);
        self
    }
}

impl Files for MemoryFiles {
    fn read_text(&self, path: &Path, _stop: &dyn Fn() -> bool) -> Result<String, ReadError> {
        let name = path.display().to_string();
        match self.files.get(path) {
            Some(b) => Ok(decode_text(&name, b.clone())?),
            None => Err(cannot_read(&name, "no such file", MISSING_HELP).into()),
        }
    }

    fn is_file(&self, path: &Path) -> bool {
        self.files.contains_key(path)
    }

    fn read_bytes(&self, path: &Path) -> std::io::Result<Vec<u8>> {
        self.files
            .get(path)
            .cloned()
            .ok_or_else(|| std::io::Error::from(std::io::ErrorKind::NotFound))
    }
}

/// The help line for a design file that cannot be opened.
pub const MISSING_HELP: &str = "check the path and that the file is readable";

/// The error for a design file that cannot be read: `cannot read `NAME`: WHAT`.
pub fn cannot_read(name: &str, what: &str, help: &str) -> InputError {
    InputError::plain(format!("cannot read `{name}`: {what}"), help)
}

/// Check that `bytes` are text (UTF-8 without NUL bytes) and return them as a string; the
/// error names the line and column of the first bad byte of the file `path`.
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

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn memory_files_find_what_was_put_in_and_nothing_else() {
        let m = MemoryFiles::new().with("d/a.v", "module m; endmodule\n");
        assert!(m.is_file(Path::new("d/a.v")));
        assert!(!m.is_file(Path::new("d/b.v")));
        assert_eq!(
            m.read_text(Path::new("d/a.v"), &|| false).unwrap(),
            "module m; endmodule\n"
        );
        match m.read_text(Path::new("d/b.v"), &|| false) {
            Err(ReadError::Input(e)) => assert_eq!(
                e.to_string(),
                "error: cannot read `d/b.v`: no such file\n  help: check the path and that the file is readable"
            ),
            _ => panic!("a missing file must be an input error"),
        }
        assert_eq!(
            m.read_bytes(Path::new("x")).unwrap_err().kind(),
            std::io::ErrorKind::NotFound
        );
    }

    #[test]
    fn decoding_names_the_first_bad_byte() {
        let e = decode_text("f.v", b"ab\ncd\0".to_vec()).unwrap_err();
        assert!(e
            .to_string()
            .starts_with("f.v:2:3: error: the file is not text"));
        let e = decode_text("f.v", b"a\xff".to_vec()).unwrap_err();
        assert!(e
            .to_string()
            .starts_with("f.v:1:2: error: the file is not UTF-8"));
    }
}
