//! Diagnostics for bad input: a position (file:line:column), what is wrong and what to do.
//!
//! Every user-facing error of the front-ends and the command line is a [`Diagnostic`];
//! a failed stage returns all of its diagnostics at once as [`InputError`].

use serde::Serialize;
use std::fmt;
use std::sync::Arc;

/// A position in a source file, 1-based line and column (columns count characters).
#[derive(Clone, Debug, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize)]
pub struct SourcePos {
    /// The file as the user named it.
    pub file: Arc<str>,
    /// 1-based line.
    pub line: u32,
    /// 1-based column, in characters.
    pub col: u32,
}

impl SourcePos {
    /// A position in `file` at `line`:`col`.
    pub fn new(file: &Arc<str>, line: u32, col: u32) -> SourcePos {
        SourcePos {
            file: file.clone(),
            line,
            col,
        }
    }
}

impl fmt::Display for SourcePos {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "{}:{}:{}", self.file, self.line, self.col)
    }
}

/// How serious a diagnostic is.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Severity {
    /// The input cannot be used.
    Error,
    /// The input is used, but something deserves a look.
    Warning,
}

/// One message about the user's input.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct Diagnostic {
    /// Error or warning.
    pub severity: Severity,
    /// Where, when the message is about a place in a file.
    pub pos: Option<SourcePos>,
    /// What is wrong, in one line.
    pub message: String,
    /// What to do about it.
    pub help: Option<String>,
}

impl Diagnostic {
    /// An error at `pos`.
    pub fn error(pos: Option<SourcePos>, message: impl Into<String>) -> Diagnostic {
        Diagnostic {
            severity: Severity::Error,
            pos,
            message: message.into(),
            help: None,
        }
    }

    /// A warning at `pos`.
    pub fn warning(pos: Option<SourcePos>, message: impl Into<String>) -> Diagnostic {
        Diagnostic {
            severity: Severity::Warning,
            pos,
            message: message.into(),
            help: None,
        }
    }

    /// The same diagnostic with advice on what to do.
    pub fn with_help(mut self, help: impl Into<String>) -> Diagnostic {
        self.help = Some(help.into());
        self
    }
}

impl fmt::Display for Diagnostic {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let sev = match self.severity {
            Severity::Error => "error",
            Severity::Warning => "warning",
        };
        match &self.pos {
            Some(p) => write!(f, "{p}: {sev}: {}", self.message)?,
            None => write!(f, "{sev}: {}", self.message)?,
        }
        if let Some(h) = &self.help {
            write!(f, "\n  help: {h}")?;
        }
        Ok(())
    }
}

/// Bad input: one or more error diagnostics (exit code 2).
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct InputError {
    /// The errors, in the order found (at least one).
    pub diagnostics: Vec<Diagnostic>,
}

impl InputError {
    /// One error without a position (usage errors, unreadable files).
    pub fn plain(message: impl Into<String>, help: impl Into<String>) -> InputError {
        InputError {
            diagnostics: vec![Diagnostic::error(None, message).with_help(help)],
        }
    }

    /// A single diagnostic.
    pub fn one(d: Diagnostic) -> InputError {
        InputError {
            diagnostics: vec![d],
        }
    }
}

impl From<Diagnostic> for InputError {
    fn from(d: Diagnostic) -> Self {
        InputError::one(d)
    }
}

impl fmt::Display for InputError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        for (i, d) in self.diagnostics.iter().enumerate() {
            if i > 0 {
                writeln!(f)?;
            }
            write!(f, "{d}")?;
        }
        Ok(())
    }
}

impl std::error::Error for InputError {}
