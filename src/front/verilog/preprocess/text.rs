//! Text that remembers where it came from: a byte buffer with marks (byte offset ->
//! file, line, column), read by a cursor that keeps the position of its current byte, and
//! written by copying bytes with their positions.

use crate::front::verilog::lexer::Mark;
use crate::front::verilog::pos::Pos;

/// Text with the origin of its bytes.
#[derive(Clone, Debug, Default)]
pub struct Mapped {
    /// The bytes (UTF-8; copies never split a character).
    pub text: Vec<u8>,
    /// Where runs of the text start, sorted by offset.
    pub marks: Vec<Mark>,
    /// The next byte pushed starts a new run.
    need_mark: bool,
}

impl Mapped {
    /// Empty text whose first byte will carry a mark.
    pub fn new() -> Mapped {
        Mapped {
            text: Vec::new(),
            marks: Vec::new(),
            need_mark: true,
        }
    }

    /// Text written at `pos`, as is.
    pub fn from_text(text: &str, pos: Pos) -> Mapped {
        Mapped {
            text: text.as_bytes().to_vec(),
            marks: vec![Mark { off: 0, pos }],
            need_mark: false,
        }
    }

    /// Push one byte that was written at `pos`.
    pub fn push(&mut self, b: u8, pos: Pos) {
        if self.need_mark {
            self.marks.push(Mark {
                off: self.text.len(),
                pos,
            });
            self.need_mark = false;
        }
        self.text.push(b);
    }

    /// The next byte pushed comes from somewhere else.
    pub fn break_run(&mut self) {
        self.need_mark = true;
    }

    /// Append another mapped text.
    pub fn append(&mut self, other: &Mapped) {
        let base = self.text.len();
        self.text.extend_from_slice(&other.text);
        self.marks.extend(other.marks.iter().map(|m| Mark {
            off: m.off + base,
            pos: m.pos,
        }));
        self.need_mark = true;
    }

    /// Drop trailing blanks (spaces, tabs, carriage returns).
    pub fn trim_end(&mut self) {
        while matches!(self.text.last(), Some(b' ' | b'\t' | b'\r')) {
            self.text.pop();
        }
        let n = self.text.len();
        while self.marks.last().is_some_and(|m| m.off >= n) {
            self.marks.pop();
        }
    }
}

/// A reader over mapped text that knows the position of its current byte.
pub struct Cursor<'t> {
    text: &'t [u8],
    marks: &'t [Mark],
    /// Offset of the current byte.
    pub i: usize,
    mark_index: usize,
    /// Position of the current byte.
    pub pos: Pos,
    /// A mark was crossed since the last [`Cursor::take_jump`].
    jumped: bool,
}

impl<'t> Cursor<'t> {
    /// A cursor at the start of `text`.
    pub fn new(text: &'t [u8], marks: &'t [Mark]) -> Cursor<'t> {
        let mut c = Cursor {
            text,
            marks,
            i: 0,
            mark_index: 0,
            pos: Pos {
                file: 0,
                line: 1,
                col: 1,
            },
            jumped: true,
        };
        c.apply();
        c
    }

    fn apply(&mut self) {
        while let Some(m) = self.marks.get(self.mark_index) {
            if m.off > self.i {
                break;
            }
            if m.off == self.i {
                self.pos = m.pos;
                self.jumped = true;
            }
            self.mark_index += 1;
        }
    }

    /// Whether the text is used up.
    pub fn done(&self) -> bool {
        self.i >= self.text.len()
    }

    /// The byte `k` places ahead (0 past the end).
    pub fn peek(&self, k: usize) -> u8 {
        self.text.get(self.i + k).copied().unwrap_or(0)
    }

    /// Whether the text at the cursor starts with `s`.
    pub fn at(&self, s: &[u8]) -> bool {
        self.text[self.i.min(self.text.len())..].starts_with(s)
    }

    /// Move past the current byte.
    pub fn bump(&mut self) {
        if let Some(&c) = self.text.get(self.i) {
            self.i += 1;
            if c == b'\n' {
                self.pos.line += 1;
                self.pos.col = 1;
            } else if c & 0xC0 != 0x80 {
                self.pos.col += 1;
            }
            self.apply();
        }
    }

    /// Copy the current byte into `out` with its position and move past it.
    pub fn copy_to(&mut self, out: &mut Mapped) {
        if self.done() {
            return;
        }
        if std::mem::take(&mut self.jumped) {
            out.break_run();
        }
        out.push(self.text[self.i], self.pos);
        self.bump();
    }

    /// Move past blanks on this line (spaces and tabs).
    pub fn skip_blanks(&mut self) {
        while matches!(self.peek(0), b' ' | b'\t' | b'\r') {
            self.bump();
        }
    }

    /// Read an identifier (letters, digits, `_`, `$`; not starting with a digit or `$`).
    pub fn ident(&mut self) -> Option<String> {
        let c = self.peek(0);
        if !(c.is_ascii_alphabetic() || c == b'_') {
            return None;
        }
        let start = self.i;
        while matches!(self.peek(0), b'a'..=b'z' | b'A'..=b'Z' | b'0'..=b'9' | b'_' | b'$') {
            self.bump();
        }
        Some(String::from_utf8_lossy(&self.text[start..self.i]).into_owned())
    }

    /// The bytes from `start` to the current offset.
    pub fn since(&self, start: usize) -> &'t [u8] {
        &self.text[start..self.i]
    }
}
