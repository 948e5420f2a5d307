//! Combinational user-defined primitives (IEEE 1364-2005 clause 8, from memory): the
//! `primitive ... table ... endtable endprimitive` blocks that cell libraries use for muxes and
//! other small cells. A combinational table is read as a module whose output is the OR of the
//! rows that give 1; input combinations no row covers give `x`, as a simulator gives them.
//! Sequential primitives (a `reg` output, `initial`, a current-state column, edges) are refused.
//!
//! Table entries read (clause 8.1.6, from memory): inputs `0`, `1`, `x`, `?` (any of 0, 1, x)
//! and `b` (0 or 1); outputs `0`, `1`, `x`. The logic is two-valued, so a row that needs an input
//! at `x` never applies and is dropped.

use super::ast::{BinOp, Expr, Item, Module, NetType, UnOp};
use super::lexer::{NumLit, Punct, TokenKind, B0, B1, BX};
use super::parser::Parser;
use super::pos::Pos;
use super::symbols::{kw, Sym};

/// The most inputs a combinational primitive may have (IEEE 1364-2005 clause 8.1.4 allows 10
/// for combinational ones; from memory).
const MAX_INPUTS: usize = 10;

/// One row: an entry per input, the output entry, where the row starts.
struct Row {
    inputs: Vec<char>,
    output: char,
    pos: Pos,
}

impl Parser<'_, '_> {
    /// After `primitive`: read a combinational primitive as a module; `None` after an error
    /// (recorded, and the text skipped past `endprimitive`).
    pub(super) fn primitive(&mut self, pos: Pos) -> Option<Module> {
        let m = self.primitive_inner(pos);
        if m.is_none() {
            while !matches!(self.peek().kind, TokenKind::Eof) && !self.peek_kw(kw::ENDPRIMITIVE) {
                self.bump();
            }
            self.eat_kw(kw::ENDPRIMITIVE);
        }
        m
    }

    fn primitive_inner(&mut self, pos: Pos) -> Option<Module> {
        let (name, _) = self.ident("a primitive name").ok()?;
        let mut m = Module {
            name,
            ports: Vec::new(),
            items: Vec::new(),
            pos,
            nettype_none: false,
        };
        self.header(&mut m).ok()?;
        loop {
            let t = self.peek().clone();
            match t.kind {
                TokenKind::Ident(k) if k == kw::TABLE => break,
                TokenKind::Ident(k) if k == kw::INITIAL => {
                    self.sequential(t.pos, "an `initial` value");
                    return None;
                }
                TokenKind::Ident(k) if k == kw::ENDPRIMITIVE => {
                    self.error(t.pos, "a primitive needs a `table`");
                    return None;
                }
                TokenKind::Eof => {
                    self.error(t.pos, "missing `table ... endtable endprimitive`");
                    return None;
                }
                _ => self.item(&mut m.items).ok()?,
            }
        }
        for item in &m.items {
            if let Item::Decl(d) = item {
                if d.ty == Some(NetType::Reg) {
                    self.sequential(d.pos, "a `reg` output");
                    return None;
                }
                if d.range.is_some() {
                    self.error(d.pos, "the ports of a primitive are single bits");
                    return None;
                }
            }
        }
        let table_pos = self.bump().pos;
        let Some(&(out, out_pos)) = m.ports.first() else {
            self.error(
                pos,
                "a primitive needs ports: its output first, then its inputs",
            );
            return None;
        };
        let inputs: Vec<(Sym, Pos)> = m.ports[1..].to_vec();
        if inputs.is_empty() || inputs.len() > MAX_INPUTS {
            self.error(
                out_pos,
                format!(
                    "a combinational primitive has 1 to {MAX_INPUTS} inputs; this one has {}",
                    inputs.len()
                ),
            );
            return None;
        }
        let rows = self.table_rows(inputs.len())?;
        self.expect_kw(kw::ENDPRIMITIVE).ok()?;
        let rhs = self.table_logic(&inputs, &rows, table_pos)?;
        m.items.push(Item::Assign(
            Box::new((Expr::Ident(out, out_pos), rhs)),
            table_pos,
        ));
        Some(m)
    }

    /// Record that sequential primitives are not read.
    fn sequential(&mut self, pos: Pos, what: &str) {
        self.unsupported(
            pos,
            format!("sequential user-defined primitive ({what}: a latch or flip-flop table); write the register as `always @(posedge clk)` in a module instead"),
        );
    }

    /// The rows up to `endtable`, each with `n` input entries and an output.
    fn table_rows(&mut self, n: usize) -> Option<Vec<Row>> {
        let mut rows = Vec::new();
        loop {
            let start = self.peek().clone();
            if let TokenKind::Ident(k) = start.kind {
                if k == kw::ENDTABLE {
                    self.bump();
                    return Some(rows);
                }
            }
            let mut fields: Vec<String> = vec![String::new()];
            loop {
                let t = self.bump();
                match t.kind {
                    TokenKind::Punct(Punct::Semi) => break,
                    TokenKind::Punct(Punct::Colon) => fields.push(String::new()),
                    TokenKind::Punct(Punct::Question) => fields.last_mut()?.push('?'),
                    TokenKind::Punct(Punct::Minus)
                    | TokenKind::Punct(Punct::Star)
                    | TokenKind::Punct(Punct::LParen) => {
                        self.sequential(t.pos, "an edge or a `-` entry");
                        return None;
                    }
                    TokenKind::Number(lit) => fields.last_mut()?.push_str(&lit.text),
                    TokenKind::Ident(s) if s != kw::ENDTABLE && s != kw::ENDPRIMITIVE => {
                        let text = self.names.name(s).to_string();
                        fields.last_mut()?.push_str(&text);
                    }
                    _ => {
                        let d = self.describe(&t.kind);
                        self.unexpected(
                            t.pos,
                            "a table entry (`0`, `1`, `x`, `?`, `b`), `:` or `;`",
                            &d,
                        );
                        return None;
                    }
                }
            }
            if fields.len() == 3 {
                self.sequential(start.pos, "a current-state column");
                return None;
            }
            let entries =
                |f: &str| -> Vec<char> { f.chars().map(|c| c.to_ascii_lowercase()).collect() };
            let ok_in = |c: &char| matches!(c, '0' | '1' | 'x' | '?' | 'b');
            let (ins, outs) = match fields.as_slice() {
                [i, o] => (entries(i), entries(o)),
                _ => {
                    self.error(start.pos, "a table row is `inputs : output ;`");
                    return None;
                }
            };
            if ins.iter().any(|c| matches!(c, 'r' | 'f' | 'p' | 'n')) {
                self.sequential(start.pos, "an edge entry");
                return None;
            }
            if ins.len() != n || !ins.iter().all(ok_in) {
                self.error(
                    start.pos,
                    format!("a table row needs {n} input entries, each `0`, `1`, `x`, `?` or `b`, before its `:`"),
                );
                return None;
            }
            let output = match outs.as_slice() {
                [c @ ('0' | '1' | 'x')] => *c,
                _ => {
                    self.error(start.pos, "a table row's output is `0`, `1` or `x`");
                    return None;
                }
            };
            rows.push(Row {
                inputs: ins,
                output,
                pos: start.pos,
            });
        }
    }

    /// The output as an expression of the inputs: the rows giving 1, and where some input
    /// combination is covered by no row, `x` there. Rows that contradict each other are an error.
    fn table_logic(&mut self, inputs: &[(Sym, Pos)], rows: &[Row], at: Pos) -> Option<Expr> {
        let n = inputs.len();
        let matches = |r: &Row, m: usize| {
            r.inputs.iter().enumerate().all(|(i, &c)| {
                let v = m >> i & 1 == 1;
                match c {
                    '0' => !v,
                    '1' => v,
                    '?' | 'b' => true,
                    _ => false,
                }
            })
        };
        let mut covered = true;
        for m in 0..1usize << n {
            let mut first: Option<&Row> = None;
            for r in rows.iter().filter(|r| r.output != 'x' && matches(r, m)) {
                match first {
                    None => first = Some(r),
                    Some(f) if f.output != r.output => {
                        let vector: Vec<String> = inputs
                            .iter()
                            .enumerate()
                            .map(|(i, (s, _))| format!("{}={}", self.names.name(*s), m >> i & 1))
                            .collect();
                        let msg = format!(
                            "this row gives {} where the row at line {} gives {}, for {} (a table must not contradict itself)",
                            r.output, f.pos.line, f.output, vector.join(" ")
                        );
                        self.error(r.pos, msg);
                        return None;
                    }
                    Some(_) => {}
                }
            }
            covered &= first.is_some();
        }
        let side = |v: char| -> Expr {
            let terms: Vec<Expr> = rows
                .iter()
                .filter(|r| r.output == v && !r.inputs.contains(&'x'))
                .map(|r| row_term(r, inputs))
                .collect();
            any_of(terms, at)
        };
        let ones = side('1');
        if covered {
            return Some(ones);
        }
        let zeros = side('0');
        let inner = Expr::Cond(Box::new([zeros, bit(B0, at), bit(BX, at)]), at);
        Some(Expr::Cond(Box::new([ones, bit(B1, at), inner]), at))
    }
}

/// The AND of a row's literals (`1` when every entry is `?` or `b`).
fn row_term(r: &Row, inputs: &[(Sym, Pos)]) -> Expr {
    let mut lits = r
        .inputs
        .iter()
        .zip(inputs)
        .filter_map(|(&c, &(s, p))| match c {
            '1' => Some(Expr::Ident(s, p)),
            '0' => Some(Expr::Unary(UnOp::Not, p, Box::new(Expr::Ident(s, p)))),
            _ => None,
        });
    let Some(first) = lits.next() else {
        return bit(B1, r.pos);
    };
    let rest: Vec<(BinOp, Pos, Expr)> = lits.map(|e| (BinOp::And, e.pos(), e)).collect();
    if rest.is_empty() {
        first
    } else {
        Expr::Chain(Box::new(first), rest)
    }
}

/// The OR of `terms` (`0` when there are none).
fn any_of(terms: Vec<Expr>, at: Pos) -> Expr {
    let mut it = terms.into_iter();
    let Some(first) = it.next() else {
        return bit(B0, at);
    };
    let rest: Vec<(BinOp, Pos, Expr)> = it.map(|e| (BinOp::Or, e.pos(), e)).collect();
    if rest.is_empty() {
        first
    } else {
        Expr::Chain(Box::new(first), rest)
    }
}

/// A one-bit literal.
fn bit(b: u8, at: Pos) -> Expr {
    let text = match b {
        B0 => "1'b0",
        B1 => "1'b1",
        _ => "1'bx (no row of the primitive's table covers these inputs)",
    };
    Expr::Num(
        Box::new(NumLit {
            bits: vec![b],
            signed: false,
            sized: true,
            text: text.into(),
        }),
        at,
    )
}
