//! One line of a bench file: the statement it holds (`INPUT(x)`, `OUTPUT(x)` or
//! `y = GATE(a, ...)`), gate keywords and arities, and the line's syntax errors. Positions are
//! byte offsets until a message needs a character column.

use crate::design::CellKind;
use crate::diag::{Diagnostic, SourcePos};
use std::sync::Arc;

/// Help for a statement that stops before its end (a file cut off, or a statement split
/// over lines).
const TRUNCATED: &str = "the statement stops at the end of the line: write each statement whole on one line (`INPUT(a)`, `y = NAND(a, b)`); if the file was cut off, write it out again";

/// Help for a statement of the wrong shape.
const SHAPES: &str =
    "statements are `INPUT(name)`, `OUTPUT(name)` or `name = GATE(a, b, ...)`, one per line";

/// A statement of one line with the byte offset of its name; a gate's fan-in names and their
/// byte offsets go to a buffer the caller reuses.
pub(super) enum Stmt<'t> {
    Input(&'t str, usize),
    Output(&'t str, usize),
    Gate(&'t str, usize, CellKind),
    /// `q = DFF(d)`: a D flip-flop on the one implicit clock (ISCAS-89); `d` is in the fan-in.
    Dff(&'t str, usize),
}

/// The 1-based character column of byte offset `byte` of `line`.
pub(super) fn col_of(line: &str, byte: usize) -> u32 {
    let prefix = &line.as_bytes()[..byte];
    if prefix.is_ascii() {
        byte as u32 + 1
    } else {
        line[..byte].chars().count() as u32 + 1
    }
}

/// A cursor over one line (byte offsets; columns are computed only for messages).
struct Cursor<'a, 't> {
    file: &'a Arc<str>,
    line: u32,
    text: &'t str,
    at: usize,
}

impl<'t> Cursor<'_, 't> {
    fn pos(&self) -> SourcePos {
        SourcePos::new(self.file, self.line, col_of(self.text, self.at))
    }
    fn pos_at(&self, at: usize) -> SourcePos {
        SourcePos::new(self.file, self.line, col_of(self.text, at))
    }
    fn skip_ws(&mut self) {
        let rest = &self.text[self.at..];
        self.at += rest.len() - rest.trim_start().len();
    }
    fn peek(&mut self) -> Option<char> {
        self.skip_ws();
        self.text[self.at..].chars().next()
    }
    /// A name and its byte offset.
    fn name(&mut self) -> Option<(&'t str, usize)> {
        self.skip_ws();
        let start = self.at;
        let rest = &self.text[start..];
        let len = rest.find(|c: char| !is_name_char(c)).unwrap_or(rest.len());
        if len == 0 {
            None
        } else {
            self.at += len;
            Some((&rest[..len], start))
        }
    }
    fn expect(&mut self, c: char, what: &str) -> Result<(), Diagnostic> {
        match self.peek() {
            Some(x) if x == c => {
                self.at += c.len_utf8();
                Ok(())
            }
            Some(x) => Err(Diagnostic::error(
                Some(self.pos()),
                format!("expected `{c}` {what}, found `{x}`"),
            )
            .with_help(SHAPES)),
            None => Err(Diagnostic::error(
                Some(self.pos()),
                format!("expected `{c}` {what}, found the end of the line"),
            )
            .with_help(TRUNCATED)),
        }
    }
    fn expect_end(&mut self) -> Result<(), Diagnostic> {
        if self.peek().is_none() {
            return Ok(());
        }
        let pos = self.pos();
        let rest: String = self.text[self.at..]
            .chars()
            .take_while(|c| !c.is_whitespace())
            .take(20)
            .collect();
        Err(Diagnostic::error(
            Some(pos),
            format!("unexpected `{rest}` after the end of the statement"),
        )
        .with_help("write one statement per line; comments start with `#`"))
    }
}

fn is_name_char(c: char) -> bool {
    !c.is_whitespace() && !matches!(c, '(' | ')' | ',' | '=' | '#')
}

/// Parse one line (without its comment); a gate's fan-ins go to `fanin`.
pub(super) fn parse_line<'t>(
    file: &Arc<str>,
    line: u32,
    text: &'t str,
    fanin: &mut Vec<(&'t str, usize)>,
) -> Result<Stmt<'t>, Diagnostic> {
    let mut cur = Cursor {
        file,
        line,
        text,
        at: 0,
    };
    let (first, first_at) = cur.name().ok_or_else(|| {
        let c = cur.peek().unwrap_or(' ');
        Diagnostic::error(
            Some(cur.pos()),
            format!("unexpected `{c}` at the start of a statement"),
        )
        .with_help("statements are `INPUT(name)`, `OUTPUT(name)` or `name = GATE(a, b, ...)`")
    })?;
    match cur.peek() {
        Some('(') => {
            let upper = first.to_ascii_uppercase();
            if upper != "INPUT" && upper != "OUTPUT" {
                return Err(Diagnostic::error(
                    Some(cur.pos_at(first_at)),
                    format!("`{first}(...)` is not a declaration"),
                )
                .with_help("declarations are `INPUT(name)` and `OUTPUT(name)`; a gate is `name = GATE(a, b)`"));
            }
            cur.expect('(', "after the keyword")?;
            let (name, at) = cur.name().ok_or_else(|| {
                Diagnostic::error(Some(cur.pos()), format!("{upper} needs a signal name"))
                    .with_help(if cur.peek().is_none() {
                        TRUNCATED
                    } else {
                        SHAPES
                    })
            })?;
            cur.expect(')', "to close the declaration")?;
            cur.expect_end()?;
            Ok(if upper == "INPUT" {
                Stmt::Input(name, at)
            } else {
                Stmt::Output(name, at)
            })
        }
        Some('=') => {
            cur.at += 1;
            let (gname, gat) = cur.name().ok_or_else(|| {
                Diagnostic::error(Some(cur.pos()), "expected a gate type after `=`").with_help(
                    if cur.peek().is_none() {
                        TRUNCATED
                    } else {
                        "for example `y = NAND(a, b)`"
                    },
                )
            })?;
            let gpos = cur.pos_at(gat);
            let dff = gname.eq_ignore_ascii_case("DFF");
            let kind = match dff {
                true => CellKind::Buf,
                false => gate_kind(gname).ok_or_else(|| unknown_gate(gname, &gpos))?,
            };
            fanin.clear();
            if let Some(kind) = constant_kind(gname) {
                // `y = VDD` or `y = VDD()`: a constant, stored as a gate with no inputs.
                if cur.peek() == Some('(') {
                    cur.at += 1;
                    cur.expect(')', "after a constant: it takes no inputs")?;
                }
                cur.expect_end()?;
                return Ok(Stmt::Gate(first, first_at, kind));
            }
            cur.expect('(', "after the gate type")?;
            if cur.peek() != Some(')') {
                loop {
                    let arg = cur.name().ok_or_else(|| {
                        Diagnostic::error(
                            Some(cur.pos()),
                            "expected a signal name in the gate's input list",
                        )
                        .with_help(if cur.peek().is_none() {
                            TRUNCATED
                        } else {
                            SHAPES
                        })
                    })?;
                    fanin.push(arg);
                    match cur.peek() {
                        Some(',') => cur.at += 1,
                        _ => break,
                    }
                }
            }
            cur.expect(')', "to close the gate's input list")?;
            cur.expect_end()?;
            if dff && fanin.len() != 1 {
                return Err(Diagnostic::error(
                    Some(gpos),
                    format!(
                        "flip-flop `{gname}` has {} inputs but needs exactly 1",
                        fanin.len()
                    ),
                )
                .with_help("a D flip-flop takes its data signal, e.g. `q = DFF(d)`"));
            }
            check_arity(kind, gname, fanin.len(), &gpos)?;
            Ok(match dff {
                true => Stmt::Dff(first, first_at),
                false => Stmt::Gate(first, first_at, kind),
            })
        }
        Some(c) => Err(Diagnostic::error(
            Some(cur.pos()),
            format!("expected `(` or `=` after `{first}`, found `{c}`"),
        )
        .with_help("statements are `INPUT(name)`, `OUTPUT(name)` or `name = GATE(a, b, ...)`")),
        None => Err(Diagnostic::error(
            Some(cur.pos()),
            format!("the statement ends after `{first}`"),
        )
        .with_help("statements are `INPUT(name)`, `OUTPUT(name)` or `name = GATE(a, b, ...)`")),
    }
}

fn gate_kind(name: &str) -> Option<CellKind> {
    Some(match name.to_ascii_uppercase().as_str() {
        "AND" => CellKind::And,
        "NAND" => CellKind::Nand,
        "OR" => CellKind::Or,
        "NOR" => CellKind::Nor,
        "XOR" => CellKind::Xor,
        "XNOR" => CellKind::Xnor,
        "NOT" => CellKind::Not,
        "BUF" | "BUFF" => CellKind::Buf,
        // `MUX(s, a, b)` is `s ? a : b`: the select first, then the input taken when it is 1,
        // then the one taken when it is 0 (the order of Verilog's `s ? a : b`).
        "MUX" => CellKind::Mux2,
        // Constants: an AND of no inputs is 1, an OR of no inputs is 0 (see `constant_kind`).
        "VDD" => CellKind::And,
        "GND" => CellKind::Or,
        _ => return None,
    })
}

/// The gate a constant keyword stands for: `VDD` (1) is an AND of no inputs, `GND` (0) an OR of
/// no inputs; every evaluator of the netlist gives those values for an empty fan-in.
pub(super) fn constant_kind(name: &str) -> Option<CellKind> {
    if name.eq_ignore_ascii_case("VDD") {
        Some(CellKind::And)
    } else if name.eq_ignore_ascii_case("GND") {
        Some(CellKind::Or)
    } else {
        None
    }
}

fn unknown_gate(name: &str, pos: &SourcePos) -> Diagnostic {
    let upper = name.to_ascii_uppercase();
    if upper == "LATCH" {
        Diagnostic::error(
            Some(pos.clone()),
            format!("unsupported: sequential element `{name}`"),
        )
        .with_help("equicone reads edge-triggered flip-flops (`q = DFF(d)`) but not level-sensitive latches; replace the latch with a DFF or cut the design there")
    } else {
        Diagnostic::error(Some(pos.clone()), format!("unknown gate type `{name}`"))
            .with_help("known gates: AND NAND OR NOR XOR XNOR NOT BUF BUFF MUX DFF and the constants VDD GND (any case)")
    }
}

fn check_arity(kind: CellKind, name: &str, n: usize, pos: &SourcePos) -> Result<(), Diagnostic> {
    let ok = match kind {
        CellKind::Not | CellKind::Buf => n == 1,
        CellKind::Mux2 => n == 3,
        _ => n >= 1,
    };
    if ok {
        return Ok(());
    }
    let want = match kind {
        CellKind::Not | CellKind::Buf => "exactly 1 input".to_string(),
        CellKind::Mux2 => "exactly 3 inputs".to_string(),
        _ => "at least 1 input".to_string(),
    };
    Err(Diagnostic::error(
        Some(pos.clone()),
        format!("gate `{name}` has {n} inputs but needs {want}"),
    )
    .with_help(match kind {
        CellKind::Not | CellKind::Buf => {
            "an inverter or buffer takes one signal, e.g. `y = NOT(a)`"
        }
        CellKind::Mux2 => "a 2:1 selector takes the select, then the input for select 1, then the input for select 0: `y = MUX(s, a, b)` is `s ? a : b`",
        _ => "list the gate's inputs, e.g. `y = AND(a, b)`",
    }))
}
