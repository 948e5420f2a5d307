//! Typed errors of the lexer and the parser: each kind carries its own `help:` line, chosen
//! where the error is made (never by reading the message back).

use super::pos::Pos;
use crate::diag::{Diagnostic, Kind, SourcePos, Stage};
use std::sync::Arc;

/// What went wrong while reading the text.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum SyntaxKind {
    /// Text that does not follow the grammar.
    Syntax,
    /// A construct outside the subset read (the message starts `unsupported:`).
    Unsupported,
    /// A literal wider than the widest one read.
    LiteralTooWide,
    /// A literal whose digits do not fit in its size.
    LiteralOverflow,
    /// A module without its `endmodule`.
    MissingEndmodule,
    /// Nesting past the parser's limit.
    TooDeep,
    /// A delay, read and ignored (a warning).
    DelayIgnored,
    /// A `specify` block or `specparam`, read and ignored (a warning).
    TimingIgnored,
}

impl SyntaxKind {
    /// What to do about an error of this kind.
    pub fn help(self) -> &'static str {
        match self {
            SyntaxKind::Unsupported => {
                "equicone reads the IEEE 1364-2005 subset listed in docs/verilog.md; rewrite this within it"
            }
            SyntaxKind::LiteralTooWide => {
                "write literals of at most 65536 bits; build wider constants by concatenation"
            }
            SyntaxKind::LiteralOverflow => {
                "give the literal enough bits for its digits (e.g. `8'h1f`), or drop the extra digits"
            }
            SyntaxKind::MissingEndmodule => {
                "close each module with `endmodule` before the next one starts"
            }
            SyntaxKind::TooDeep => "split the expression or statement with intermediate wires",
            SyntaxKind::DelayIgnored => {
                "equicone compares the logic only; delays do not change what is proved"
            }
            SyntaxKind::TimingIgnored => {
                "equicone compares the logic only; path delays and timing checks do not change what is proved"
            }
            SyntaxKind::Syntax => {
                "correct the syntax here; the Verilog subset read is listed in docs/verilog.md"
            }
        }
    }
}

/// One lexer or parser error.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct SyntaxError {
    /// The lexer or the parser.
    pub stage: Stage,
    /// Where it is.
    pub pos: Pos,
    /// What kind of error (gives the help line).
    pub kind: SyntaxKind,
    /// The message.
    pub message: String,
    /// For `expected X, found Y`: where `, found Y` starts in the message.
    pub found_at: Option<u32>,
}

impl SyntaxError {
    /// An error of `kind` at `pos`, found by `stage` ([`Stage::Lex`] or [`Stage::Parse`]).
    pub fn new(
        stage: Stage,
        pos: Pos,
        kind: SyntaxKind,
        message: impl Into<String>,
    ) -> SyntaxError {
        SyntaxError {
            stage,
            pos,
            kind,
            message: message.into(),
            found_at: None,
        }
    }

    /// The diagnostic for the user: an error (or, for the kinds read and ignored, a
    /// warning) in `files[pos.file]`, with its kind's help line.
    pub fn diagnostic(&self, files: &[Arc<str>]) -> Diagnostic {
        let file = files
            .get(self.pos.file as usize)
            .cloned()
            .unwrap_or_else(|| Arc::from("?"));
        let pos = Some(SourcePos::new(&file, self.pos.line, self.pos.col));
        let d = match self.kind {
            SyntaxKind::DelayIgnored | SyntaxKind::TimingIgnored => {
                Diagnostic::warning(pos, self.message.clone())
            }
            _ => Diagnostic::error(pos, self.message.clone()),
        };
        let kind = match self.kind {
            SyntaxKind::Syntax => Kind::Grammar {
                found_at: self.found_at,
            },
            _ => Kind::Other,
        };
        d.with_help(self.kind.help())
            .in_stage(self.stage)
            .of_kind(kind)
    }
}
