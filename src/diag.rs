//! Diagnostics for bad input: a position (file:line:column), what is wrong and what to do.
//!
//! Every user-facing error of the front-ends and the command line is a [`Diagnostic`];
//! a failed stage returns all of its diagnostics at once as [`InputError`]. Each diagnostic
//! knows the [`Stage`] that made it and, where a caller treats some apart, its [`Kind`]; both
//! are set where the diagnostic is made, so no caller reads the message's words back.

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

/// The stage of reading the input that made a diagnostic.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Default)]
pub enum Stage {
    /// The command line and the files it names other than designs (vectors, expectations,
    /// cost models, shard results, outputs to write).
    #[default]
    CliInput,
    /// The Verilog preprocessor (`` `define ``, `` `include ``, conditionals).
    Preprocess,
    /// The Verilog lexer (tokens and literals).
    Lex,
    /// The Verilog parser (the grammar of the subset).
    Parse,
    /// The Verilog elaborator (names, widths, drivers, hierarchy).
    Elaborate,
    /// The bench reader.
    Bench,
    /// An `--assume` expression (the wrapper around it, and what it may read).
    Assume,
}

/// What kind of problem a diagnostic reports, for the kinds a caller treats apart.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Default)]
pub enum Kind {
    /// Anything else.
    #[default]
    Other,
    /// Text that does not follow the grammar (the reader's generic syntax error, whose help
    /// speaks of the subset as a whole). For a message `expected X, found Y`, `found_at` is
    /// where `, found Y` starts.
    Grammar {
        /// Byte offset of `, found` in the message.
        found_at: Option<u32>,
    },
    /// A name used but not declared (the elaborator's; an assumption's reader gives its own
    /// help for it, naming the ports).
    UndeclaredName,
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
    /// The stage that made it (not part of the text or JSON forms).
    #[serde(skip)]
    pub stage: Stage,
    /// What kind of problem (not part of the text or JSON forms).
    #[serde(skip)]
    pub kind: Kind,
}

impl Diagnostic {
    /// An error at `pos`.
    pub fn error(pos: Option<SourcePos>, message: impl Into<String>) -> Diagnostic {
        Diagnostic {
            severity: Severity::Error,
            pos,
            message: message.into(),
            help: None,
            stage: Stage::CliInput,
            kind: Kind::Other,
        }
    }

    /// A warning at `pos`.
    pub fn warning(pos: Option<SourcePos>, message: impl Into<String>) -> Diagnostic {
        Diagnostic {
            severity: Severity::Warning,
            pos,
            message: message.into(),
            help: None,
            stage: Stage::CliInput,
            kind: Kind::Other,
        }
    }

    /// The same diagnostic with advice on what to do.
    pub fn with_help(mut self, help: impl Into<String>) -> Diagnostic {
        self.help = Some(help.into());
        self
    }

    /// The same diagnostic, made by `stage`.
    pub fn in_stage(mut self, stage: Stage) -> Diagnostic {
        self.stage = stage;
        self
    }

    /// The same diagnostic, of kind `kind`.
    pub fn of_kind(mut self, kind: Kind) -> Diagnostic {
        self.kind = kind;
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

    /// The same errors, each marked as made by `stage` (for a stage whose diagnostics are
    /// all made by one reader, marked where the reader returns them).
    pub fn in_stage(mut self, stage: Stage) -> InputError {
        for d in &mut self.diagnostics {
            d.stage = stage;
        }
        self
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

/// How many diagnostics of one file the text form of an [`InputError`] shows; the rest are
/// counted in one closing line per file (a Verilog file read as bench gives one error per
/// line, thousands of them, where the first few already say what is wrong).
pub const SHOWN_PER_FILE: usize = 20;

impl fmt::Display for InputError {
    /// Every diagnostic in order, but at most [`SHOWN_PER_FILE`] per file, then
    /// `... and N more errors in FILE` for each file that had more. Diagnostics without a
    /// position are always shown.
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        // (file, shown, hidden), in the order the files first appear.
        let mut per_file: Vec<(&str, usize, usize)> = Vec::new();
        let mut first = true;
        for d in &self.diagnostics {
            if let Some(p) = &d.pos {
                let k = match per_file.iter().position(|e| e.0 == &*p.file) {
                    Some(k) => k,
                    None => {
                        per_file.push((&p.file, 0, 0));
                        per_file.len() - 1
                    }
                };
                if per_file[k].1 >= SHOWN_PER_FILE {
                    per_file[k].2 += 1;
                    continue;
                }
                per_file[k].1 += 1;
            }
            if !first {
                writeln!(f)?;
            }
            first = false;
            write!(f, "{d}")?;
        }
        for (file, _, hidden) in per_file {
            if hidden > 0 {
                let s = if hidden == 1 { "" } else { "s" };
                write!(f, "\n... and {hidden} more error{s} in {file}")?;
            }
        }
        Ok(())
    }
}

impl std::error::Error for InputError {}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn text_form_shows_at_most_twenty_errors_per_file() {
        let (a, b): (Arc<str>, Arc<str>) = (Arc::from("a.bench"), Arc::from("b.v"));
        let mut diagnostics = Vec::new();
        for line in 1..=25 {
            diagnostics.push(Diagnostic::error(Some(SourcePos::new(&a, line, 1)), "bad"));
            if line <= 21 {
                diagnostics.push(Diagnostic::error(
                    Some(SourcePos::new(&b, line, 2)),
                    "worse",
                ));
            }
        }
        diagnostics.push(Diagnostic::error(None, "no place"));
        let text = InputError { diagnostics }.to_string();
        let lines: Vec<&str> = text.lines().collect();
        assert_eq!(lines.len(), 20 + 20 + 1 + 2, "{text}");
        assert!(text.contains("a.bench:20:1: error: bad"), "{text}");
        assert!(!text.contains("a.bench:21:1"), "{text}");
        assert!(text.contains("b.v:20:2: error: worse"), "{text}");
        assert!(!text.contains("b.v:21:2"), "{text}");
        assert!(text.contains("error: no place"), "{text}");
        assert_eq!(lines[41], "... and 5 more errors in a.bench");
        assert_eq!(lines[42], "... and 1 more error in b.v");
    }

    #[test]
    fn text_form_of_few_errors_is_complete() {
        let f: Arc<str> = Arc::from("c.bench");
        let e = InputError {
            diagnostics: (1..=20)
                .map(|l| Diagnostic::error(Some(SourcePos::new(&f, l, 1)), "x"))
                .collect(),
        };
        let text = e.to_string();
        assert_eq!(text.lines().count(), 20);
        assert!(!text.contains("more error"));
    }
}
