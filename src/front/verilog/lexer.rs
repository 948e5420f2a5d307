//! The Verilog lexer: source text to tokens with positions, one token at a time (the parser
//! keeps a small lookahead), so a million-gate netlist is never held as a token vector.

use super::pos::Pos;
use super::symbols::{Interner, Sym};
use super::syntax_error::{SyntaxError, SyntaxKind};
use crate::diag::Stage;

/// One 4-state bit of a literal.
pub const B0: u8 = 0;
/// A one bit.
pub const B1: u8 = 1;
/// An `x` bit.
pub const BX: u8 = 2;
/// A `z` (or `?`) bit.
pub const BZ: u8 = 3;

/// A number literal, already sized: `bits.len() == width`, least significant bit first.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct NumLit {
    /// Bits, LSB first; each one of [`B0`], [`B1`], [`BX`], [`BZ`].
    pub bits: Vec<u8>,
    /// Whether the literal is signed (unsized decimal, or an `'s` base).
    pub signed: bool,
    /// Whether a size was given.
    pub sized: bool,
    /// The text as written (for messages and unknown-input names).
    pub text: Box<str>,
}

/// Punctuation and operators.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
#[allow(missing_docs)]
pub enum Punct {
    LParen,
    RParen,
    LBrack,
    RBrack,
    LBrace,
    RBrace,
    Comma,
    Semi,
    Colon,
    Dot,
    Hash,
    At,
    /// The `'` of a cast `W'(x)`, `T'(x)`, `signed'(x)` (IEEE 1800-2017 clause 6.24).
    Tick,
    Assign,
    Question,
    Plus,
    Minus,
    Star,
    Slash,
    Percent,
    Bang,
    Tilde,
    Amp,
    Pipe,
    Caret,
    TildeAmp,
    TildePipe,
    TildeCaret,
    CaretTilde,
    AmpAmp,
    PipePipe,
    EqEq,
    BangEq,
    EqEqEq,
    BangEqEq,
    Lt,
    Le,
    Gt,
    Ge,
    Shl,
    Shr,
    AShl,
    AShr,
    Power,
    PlusColon,
    MinusColon,
}

/// A token kind.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum TokenKind {
    /// An identifier or keyword.
    Ident(Sym),
    /// A system name such as `$signed`.
    SystemName(Sym),
    /// A number.
    Number(Box<NumLit>),
    /// An operator or punctuation.
    Punct(Punct),
    /// A string literal (never part of the subset).
    StringLiteral,
    /// A real number (never part of the subset).
    Real,
    /// End of the file.
    Eof,
}

/// A token with its position.
#[derive(Clone, Debug)]
pub struct Token {
    /// What it is.
    pub kind: TokenKind,
    /// Where it starts.
    pub pos: Pos,
}

/// The lexer over one file.
pub struct Lexer<'s> {
    src: &'s [u8],
    /// Byte offset of the next character.
    offset: usize,
    line: u32,
    col: u32,
    file: u32,
    /// Lexical errors found so far.
    pub errors: Vec<SyntaxError>,
    /// Whether `` `default_nettype none`` is in force at the current point.
    pub nettype_none: bool,
    /// Where the text came from (the preprocessor's marks; empty: this file, as is).
    marks: &'s [Mark],
    /// The next mark to apply.
    mark_index: usize,
    /// The byte offset of that mark (`usize::MAX` when there is none).
    next_mark: usize,
}

/// A mark of preprocessed text: from byte `off` on, the text came from `pos` (and runs on
/// from there character by character until the next mark).
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub struct Mark {
    /// Byte offset in the preprocessed text.
    pub off: usize,
    /// Where the byte at `off` was written.
    pub pos: Pos,
}

fn is_ident_start(c: u8) -> bool {
    c.is_ascii_alphabetic() || c == b'_'
}

fn is_ident_char(c: u8) -> bool {
    c.is_ascii_alphanumeric() || c == b'_' || c == b'$'
}

impl<'s> Lexer<'s> {
    /// A lexer over `src`, which is file number `file` (for the unit tests).
    #[cfg(test)]
    pub fn new(src: &'s str, file: u32) -> Lexer<'s> {
        Lexer::with_marks(src, file, &[])
    }

    /// A lexer over preprocessed text: positions follow `marks` (sorted by offset) back to
    /// the files the text came from; before the first mark they are in file `file`.
    pub fn with_marks(src: &'s str, file: u32, marks: &'s [Mark]) -> Lexer<'s> {
        let mut lexer = Lexer {
            src: src.as_bytes(),
            offset: 0,
            line: 1,
            col: 1,
            file,
            errors: Vec::new(),
            nettype_none: false,
            marks,
            mark_index: 0,
            next_mark: marks.first().map_or(usize::MAX, |m| m.off),
        };
        lexer.apply_marks();
        lexer
    }

    /// Take the position of every mark at the current offset.
    fn apply_marks(&mut self) {
        while self.next_mark <= self.offset {
            let m = self.marks[self.mark_index];
            if m.off == self.offset {
                (self.file, self.line, self.col) = (m.pos.file, m.pos.line, m.pos.col);
            }
            self.mark_index += 1;
            self.next_mark = self
                .marks
                .get(self.mark_index)
                .map_or(usize::MAX, |m| m.off);
        }
    }

    fn pos(&self) -> Pos {
        Pos {
            file: self.file,
            line: self.line,
            col: self.col,
        }
    }

    fn peek(&self, k: usize) -> u8 {
        self.src.get(self.offset + k).copied().unwrap_or(0)
    }

    fn bump(&mut self) {
        if let Some(&c) = self.src.get(self.offset) {
            self.offset += 1;
            if c == b'\n' {
                self.line += 1;
                self.col = 1;
            } else if c & 0xC0 != 0x80 {
                self.col += 1;
            }
            if self.offset >= self.next_mark {
                self.apply_marks();
            }
        }
    }

    fn err(&mut self, pos: Pos, msg: impl Into<String>) {
        self.err_of(pos, SyntaxKind::Syntax, msg);
    }

    fn err_of(&mut self, pos: Pos, kind: SyntaxKind, msg: impl Into<String>) {
        self.errors
            .push(SyntaxError::new(Stage::Lex, pos, kind, msg));
    }

    /// Skip white space, comments, attributes and the directives that do not change logic.
    fn skip_trivia(&mut self, names: &mut Interner) {
        loop {
            let c = self.peek(0);
            if c == b' ' || c == b'\t' || c == b'\r' || c == b'\n' || c == 0x0C {
                self.bump();
            } else if c == b'/' && self.peek(1) == b'/' {
                while self.offset < self.src.len() && self.peek(0) != b'\n' {
                    self.bump();
                }
            } else if c == b'/' && self.peek(1) == b'*' {
                let p = self.pos();
                self.bump();
                self.bump();
                loop {
                    if self.offset >= self.src.len() {
                        self.err(p, "unterminated block comment");
                        break;
                    }
                    if self.peek(0) == b'*' && self.peek(1) == b'/' {
                        self.bump();
                        self.bump();
                        break;
                    }
                    self.bump();
                }
            } else if c == b'(' && self.peek(1) == b'*' && !self.star_closes_paren() {
                // An attribute instance `(* ... *)`: it carries no logic.
                let p = self.pos();
                self.bump();
                self.bump();
                loop {
                    if self.offset >= self.src.len() {
                        self.err(p, "unterminated attribute `(* ... *)`");
                        break;
                    }
                    if self.peek(0) == b'*' && self.peek(1) == b')' {
                        self.bump();
                        self.bump();
                        break;
                    }
                    self.bump();
                }
            } else if c == b'`' {
                self.directive(names);
            } else {
                return;
            }
        }
    }

    /// After `(*`: whether the next non-blank character is `)` (the event control `@(*)`).
    fn star_closes_paren(&self) -> bool {
        let mut k = self.offset + 2;
        while k < self.src.len() && self.src[k].is_ascii_whitespace() {
            k += 1;
        }
        self.src.get(k) == Some(&b')')
    }

    fn directive(&mut self, _names: &mut Interner) {
        let p = self.pos();
        self.bump();
        let start = self.offset;
        while is_ident_char(self.peek(0)) {
            self.bump();
        }
        let name = String::from_utf8_lossy(&self.src[start..self.offset]).into_owned();
        let line_start = self.offset;
        while self.offset < self.src.len() && self.peek(0) != b'\n' {
            self.bump();
        }
        let rest = String::from_utf8_lossy(&self.src[line_start..self.offset]);
        let rest = rest.split("//").next().unwrap_or("").trim().to_string();
        match name.as_str() {
            "timescale" | "celldefine" | "endcelldefine" => {}
            // IEEE 1364-2005 clause 19.6: back to the defaults (nets are implicit again).
            "resetall" => self.nettype_none = false,
            "default_nettype" => match rest.as_str() {
                "none" => self.nettype_none = true,
                "wire" => self.nettype_none = false,
                _ => self.err_of(
                    p,
                    SyntaxKind::Unsupported,
                    format!("unsupported: `default_nettype {rest}"),
                ),
            },
            _ => self.err_of(
                p,
                SyntaxKind::Unsupported,
                format!("unsupported: compiler directive `{name}"),
            ),
        }
    }

    /// Skip an identifier that is not a keyword (a gate instance name nobody looks up)
    /// without interning it; `None`, consuming nothing but trivia, when something else
    /// comes next.
    pub fn skip_name(&mut self, names: &mut Interner) -> Option<Pos> {
        self.skip_trivia(names);
        let pos = self.pos();
        let c = self.peek(0);
        let mut j = self.offset;
        if is_ident_start(c) {
            while j < self.src.len() && is_ident_char(self.src[j]) {
                j += 1;
            }
            let s = std::str::from_utf8(&self.src[self.offset..j]).unwrap_or("?");
            if super::symbols::is_keyword_text(s) {
                return None;
            }
        } else if c == b'\\' && self.offset < self.src.len() {
            while j < self.src.len() && !self.src[j].is_ascii_whitespace() {
                j += 1;
            }
        } else {
            return None;
        }
        while self.offset < j {
            self.bump();
        }
        Some(pos)
    }

    /// The next token.
    pub fn next_token(&mut self, names: &mut Interner) -> Token {
        self.skip_trivia(names);
        let pos = self.pos();
        let c = self.peek(0);
        if self.offset >= self.src.len() {
            return Token {
                kind: TokenKind::Eof,
                pos,
            };
        }
        if is_ident_start(c) {
            let start = self.offset;
            while is_ident_char(self.peek(0)) {
                self.bump();
            }
            let s = std::str::from_utf8(&self.src[start..self.offset]).unwrap_or("?");
            return Token {
                kind: TokenKind::Ident(names.intern(s)),
                pos,
            };
        }
        if c == b'\\' {
            self.bump();
            let start = self.offset;
            while self.offset < self.src.len() && !self.peek(0).is_ascii_whitespace() {
                self.bump();
            }
            let s = String::from_utf8_lossy(&self.src[start..self.offset]).into_owned();
            let sym = if names.get(&s).is_some_and(super::symbols::is_keyword) {
                names.intern(&format!("\\{s}"))
            } else {
                names.intern(&s)
            };
            return Token {
                kind: TokenKind::Ident(sym),
                pos,
            };
        }
        if c == b'$' {
            let start = self.offset;
            self.bump();
            while is_ident_char(self.peek(0)) {
                self.bump();
            }
            let s = std::str::from_utf8(&self.src[start..self.offset]).unwrap_or("$");
            return Token {
                kind: TokenKind::SystemName(names.intern(s)),
                pos,
            };
        }
        if c.is_ascii_digit() || c == b'\'' {
            return self.number(pos);
        }
        if c == b'"' {
            self.bump();
            while self.offset < self.src.len() && self.peek(0) != b'"' && self.peek(0) != b'\n' {
                if self.peek(0) == b'\\' {
                    self.bump();
                }
                self.bump();
            }
            self.bump();
            return Token {
                kind: TokenKind::StringLiteral,
                pos,
            };
        }
        let three = [c, self.peek(1), self.peek(2)];
        let (p, n) = match &three {
            b"===" => (Punct::EqEqEq, 3),
            b"!==" => (Punct::BangEqEq, 3),
            b"<<<" => (Punct::AShl, 3),
            b">>>" => (Punct::AShr, 3),
            _ => match &three[..2] {
                b"~&" => (Punct::TildeAmp, 2),
                b"~|" => (Punct::TildePipe, 2),
                b"~^" => (Punct::TildeCaret, 2),
                b"^~" => (Punct::CaretTilde, 2),
                b"&&" => (Punct::AmpAmp, 2),
                b"||" => (Punct::PipePipe, 2),
                b"==" => (Punct::EqEq, 2),
                b"!=" => (Punct::BangEq, 2),
                b"<=" => (Punct::Le, 2),
                b">=" => (Punct::Ge, 2),
                b"<<" => (Punct::Shl, 2),
                b">>" => (Punct::Shr, 2),
                b"**" => (Punct::Power, 2),
                b"+:" => (Punct::PlusColon, 2),
                b"-:" => (Punct::MinusColon, 2),
                _ => match c {
                    b'(' => (Punct::LParen, 1),
                    b')' => (Punct::RParen, 1),
                    b'[' => (Punct::LBrack, 1),
                    b']' => (Punct::RBrack, 1),
                    b'{' => (Punct::LBrace, 1),
                    b'}' => (Punct::RBrace, 1),
                    b',' => (Punct::Comma, 1),
                    b';' => (Punct::Semi, 1),
                    b':' => (Punct::Colon, 1),
                    b'.' => (Punct::Dot, 1),
                    b'#' => (Punct::Hash, 1),
                    b'@' => (Punct::At, 1),
                    b'=' => (Punct::Assign, 1),
                    b'?' => (Punct::Question, 1),
                    b'+' => (Punct::Plus, 1),
                    b'-' => (Punct::Minus, 1),
                    b'*' => (Punct::Star, 1),
                    b'/' => (Punct::Slash, 1),
                    b'%' => (Punct::Percent, 1),
                    b'!' => (Punct::Bang, 1),
                    b'~' => (Punct::Tilde, 1),
                    b'&' => (Punct::Amp, 1),
                    b'|' => (Punct::Pipe, 1),
                    b'^' => (Punct::Caret, 1),
                    b'<' => (Punct::Lt, 1),
                    b'>' => (Punct::Gt, 1),
                    _ => {
                        let ch = std::str::from_utf8(&self.src[self.offset..])
                            .ok()
                            .and_then(|s| s.chars().next())
                            .unwrap_or('?');
                        self.err(pos, format!("unexpected character `{ch}`"));
                        self.bump();
                        while self.offset < self.src.len() && self.src[self.offset] & 0xC0 == 0x80 {
                            self.bump();
                        }
                        return self.next_token(names);
                    }
                },
            },
        };
        for _ in 0..n {
            self.bump();
        }
        Token {
            kind: TokenKind::Punct(p),
            pos,
        }
    }

    fn skip_ws(&mut self) {
        while matches!(self.peek(0), b' ' | b'\t' | b'\r' | b'\n') {
            self.bump();
        }
    }

    fn digits(&mut self, allow: impl Fn(u8) -> bool) -> String {
        let mut s = String::new();
        while allow(self.peek(0)) || self.peek(0) == b'_' {
            if self.peek(0) != b'_' {
                s.push(self.peek(0) as char);
            }
            self.bump();
        }
        s
    }

    fn number(&mut self, pos: Pos) -> Token {
        if self.peek(0) == b'\'' && self.peek(1) == b'(' {
            // The `'` of a cast; the parser reads what stands before it and the `( ... )`.
            self.bump();
            return Token {
                kind: TokenKind::Punct(Punct::Tick),
                pos,
            };
        }
        let start = self.offset;
        let mut size: Option<String> = None;
        if self.peek(0).is_ascii_digit() {
            let d = self.digits(|c| c.is_ascii_digit());
            if self.peek(0) == b'.' && self.peek(1).is_ascii_digit()
                || matches!(self.peek(0), b'e' | b'E')
            {
                while self.peek(0).is_ascii_alphanumeric()
                    || matches!(self.peek(0), b'.' | b'_' | b'+' | b'-')
                {
                    self.bump();
                }
                return Token {
                    kind: TokenKind::Real,
                    pos,
                };
            }
            let save = (self.offset, self.line, self.col, self.file, self.mark_index);
            self.skip_ws();
            if self.peek(0) != b'\'' || self.peek(1) == b'(' {
                // A plain decimal number (before a cast's `'(`, its width).
                (self.offset, self.line, self.col, self.file, self.mark_index) = save;
                self.next_mark = self
                    .marks
                    .get(self.mark_index)
                    .map_or(usize::MAX, |m| m.off);
                let text = String::from_utf8_lossy(&self.src[start..self.offset]).into_owned();
                let bits = decimal_bits(&d);
                let width = if bits.len() <= 32 { 32 } else { bits.len() + 1 };
                return Token {
                    kind: TokenKind::Number(Box::new(NumLit {
                        bits: extend(bits, width, false),
                        signed: true,
                        sized: false,
                        text: text.into(),
                    })),
                    pos,
                };
            }
            size = Some(d);
        }
        // Based literal: ' [s] base digits
        self.bump();
        if size.is_none() && matches!(self.peek(0), b'0' | b'1') && !is_ident_char(self.peek(1)) {
            // SystemVerilog `'0` / `'1` (IEEE 1800-2017 clause 5.7.1, from memory): every
            // bit of the context's width is that bit.
            let one = self.peek(0) == b'1';
            self.bump();
            return Token {
                kind: TokenKind::Number(Box::new(NumLit {
                    bits: vec![if one { B1 } else { B0 }],
                    signed: false,
                    sized: false,
                    text: if one { "'1" } else { "'0" }.into(),
                })),
                pos,
            };
        }
        let mut signed = false;
        if matches!(self.peek(0), b's' | b'S') {
            signed = true;
            self.bump();
        }
        let base = self.peek(0).to_ascii_lowercase();
        let radix_bits = match base {
            b'b' => 1,
            b'o' => 3,
            b'h' => 4,
            b'd' => 0,
            b'{' => {
                // An assignment pattern `'{...}` (IEEE 1800-2017 clause 10.9, from memory): not
                // read yet. The bracketed text is skipped whole, so the error is the only one.
                let mut depth = 0usize;
                while self.offset < self.src.len() {
                    let c = self.peek(0);
                    self.bump();
                    if c == b'{' {
                        depth += 1;
                    } else if c == b'}' {
                        depth -= 1;
                        if depth == 0 {
                            break;
                        }
                    }
                }
                self.err_of(
                    pos,
                    SyntaxKind::Unsupported,
                    "unsupported: assignment pattern `'{...}`; write a concatenation `{...}` instead",
                );
                return Token {
                    kind: TokenKind::Number(Box::new(NumLit {
                        bits: vec![B0; 32],
                        signed: false,
                        sized: false,
                        text: "'{...}".into(),
                    })),
                    pos,
                };
            }
            _ => {
                self.err(
                    pos,
                    "malformed number: expected a base `b`, `o`, `d` or `h` after `'`",
                );
                return Token {
                    kind: TokenKind::Number(Box::new(NumLit {
                        bits: vec![B0; 32],
                        signed: false,
                        sized: false,
                        text: "'?".into(),
                    })),
                    pos,
                };
            }
        };
        self.bump();
        self.skip_ws();
        let ds =
            self.digits(|c| c.is_ascii_hexdigit() || matches!(c, b'x' | b'X' | b'z' | b'Z' | b'?'));
        let text =
            String::from_utf8_lossy(&self.src[start..self.offset]).replace(char::is_whitespace, "");
        if ds.is_empty() {
            self.err(pos, format!("malformed number `{text}`: no digits"));
        }
        let mut bits: Vec<u8> = Vec::new();
        if radix_bits == 0 {
            let lower = ds.to_ascii_lowercase();
            if lower.chars().all(|c| c.is_ascii_digit()) {
                bits = decimal_bits(&lower);
            } else if lower.len() == 1 && matches!(lower.as_bytes()[0], b'x' | b'z' | b'?') {
                bits = vec![if lower == "x" { BX } else { BZ }];
            } else {
                self.err(pos, format!("malformed decimal number `{text}`"));
            }
        } else {
            for ch in ds.bytes().rev() {
                let ch = ch.to_ascii_lowercase();
                let (v, special) = match ch {
                    b'x' => (0, Some(BX)),
                    b'z' | b'?' => (0, Some(BZ)),
                    _ => ((ch as char).to_digit(16).unwrap_or(0), None),
                };
                if special.is_none() && v >= (1 << radix_bits) {
                    self.err(
                        pos,
                        format!("digit `{}` is not valid in `{text}`", ch as char),
                    );
                }
                for k in 0..radix_bits {
                    bits.push(special.unwrap_or(((v >> k) & 1) as u8));
                }
            }
        }
        let (width, sized) = match &size {
            Some(s) => match s.parse::<u32>() {
                Ok(0) | Err(_) => {
                    self.err(pos, format!("bad size in number `{text}`"));
                    // Its digits' own width: no follow-on "does not fit" error.
                    (bits.len().max(1), true)
                }
                // IEEE 1364-2005 clause 3.5.1 lets a tool limit the size of an integer constant
                // to no less than 65,536 bits (from memory); wider literals cost memory out of
                // all proportion to their text (docs/robustness.md lists the cases found).
                Ok(w) if w > (1 << 16) => {
                    self.err_of(
                        pos,
                        SyntaxKind::LiteralTooWide,
                        format!("number `{text}` is wider than 65536 bits"),
                    );
                    (bits.len().max(1), true)
                }
                Ok(w) => (w as usize, true),
            },
            None => (bits.len().max(32), false),
        };
        // Drop leading zero bits beyond the width; other bits lost are a truncation.
        let top_fill = match bits.last() {
            Some(&b) if b == BX || b == BZ => b,
            _ => B0,
        };
        if bits.len() > width && bits[width..].iter().any(|&b| b != B0) {
            self.err_of(
                pos,
                SyntaxKind::LiteralOverflow,
                format!("number `{text}` does not fit in {width} bits"),
            );
        }
        let mut v = bits;
        v.truncate(width);
        while v.len() < width {
            v.push(top_fill);
        }
        Token {
            kind: TokenKind::Number(Box::new(NumLit {
                bits: v,
                signed,
                sized,
                text: text.into(),
            })),
            pos,
        }
    }
}

/// Bits of a decimal digit string, LSB first (at least one bit).
pub fn decimal_bits(d: &str) -> Vec<u8> {
    // Repeated division of the decimal digit vector by two.
    let mut digits: Vec<u8> = d.bytes().map(|c| c - b'0').collect();
    let mut out = Vec::new();
    while digits.iter().any(|&x| x != 0) {
        let mut rem = 0u8;
        for x in digits.iter_mut() {
            let cur = rem * 10 + *x;
            *x = cur / 2;
            rem = cur % 2;
        }
        out.push(rem);
        while digits.first() == Some(&0) {
            digits.remove(0);
        }
    }
    if out.is_empty() {
        out.push(B0);
    }
    out
}

fn extend(mut bits: Vec<u8>, width: usize, _signed: bool) -> Vec<u8> {
    bits.resize(width, B0);
    bits
}

#[cfg(test)]
mod tests {
    use super::*;

    fn toks(s: &str) -> Vec<TokenKind> {
        let mut names = Interner::new();
        let mut lexer = Lexer::new(s, 0);
        let mut v = Vec::new();
        loop {
            let t = lexer.next_token(&mut names);
            if t.kind == TokenKind::Eof {
                break;
            }
            v.push(t.kind);
        }
        assert!(lexer.errors.is_empty(), "{:?}", lexer.errors);
        v
    }

    fn num(s: &str) -> NumLit {
        match toks(s).pop() {
            Some(TokenKind::Number(n)) => *n,
            t => panic!("not a number: {t:?}"),
        }
    }

    #[test]
    fn numbers_are_sized_and_extended() {
        let n = num("8'hA5");
        assert_eq!(n.bits, vec![1, 0, 1, 0, 0, 1, 0, 1]);
        assert!(!n.signed && n.sized);
        let n = num("4'bx1");
        assert_eq!(n.bits, vec![1, BX, BX, BX]);
        let n = num("12");
        assert_eq!(n.bits.len(), 32);
        assert!(n.signed);
        assert_eq!(&n.bits[..4], &[0, 0, 1, 1]);
        let n = num("4 'sd 5");
        assert!(n.signed && n.bits == vec![1, 0, 1, 0]);
        assert_eq!(num("'hz").bits, vec![BZ; 32]);
        assert_eq!(decimal_bits("1000000000000"), {
            let v = 1_000_000_000_000u64;
            (0..40).map(|k| ((v >> k) & 1) as u8).collect::<Vec<_>>()
        });
    }

    #[test]
    fn operators_and_comments() {
        let t = toks("a ~^ b /* c */ // d\n >>> (* keep *) @(*)");
        assert!(matches!(t[1], TokenKind::Punct(Punct::TildeCaret)));
        assert!(matches!(t[3], TokenKind::Punct(Punct::AShr)));
        assert!(matches!(t[4], TokenKind::Punct(Punct::At)));
        assert!(matches!(t[6], TokenKind::Punct(Punct::Star)));
        assert_eq!(t.len(), 8);
    }

    #[test]
    fn positions_count_lines_and_columns() {
        let mut names = Interner::new();
        let mut lexer = Lexer::new("a\n  bb", 3);
        let _ = lexer.next_token(&mut names);
        let t = lexer.next_token(&mut names);
        assert_eq!(
            t.pos,
            Pos {
                file: 3,
                line: 2,
                col: 3
            }
        );
    }
}
