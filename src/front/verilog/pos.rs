//! Source positions of the Verilog reader: file number, line and column, shared by the
//! preprocessor, the lexer, the parser, the syntax tree and the elaborator.

/// A position: file number (index into the reader's source list), 1-based line and column.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Default, PartialOrd, Ord, Hash)]
pub struct Pos {
    /// Index of the source file.
    pub file: u32,
    /// 1-based line.
    pub line: u32,
    /// 1-based column, in characters.
    pub col: u32,
}
