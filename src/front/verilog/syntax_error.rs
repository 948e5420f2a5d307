//! Typed errors of the lexer and the parser: each kind carries its own `help:` line, chosen
//! where the error is made (never by reading the message back).

use super::pos::Pos;

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
            SyntaxKind::Syntax => {
                "correct the syntax here; the Verilog subset read is listed in docs/verilog.md"
            }
        }
    }
}

/// One lexer or parser error.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct SyntaxError {
    /// Where it is.
    pub pos: Pos,
    /// What kind of error (gives the help line).
    pub kind: SyntaxKind,
    /// The message.
    pub message: String,
}

impl SyntaxError {
    /// An error of `kind` at `pos`.
    pub fn new(pos: Pos, kind: SyntaxKind, message: impl Into<String>) -> SyntaxError {
        SyntaxError {
            pos,
            kind,
            message: message.into(),
        }
    }
}
