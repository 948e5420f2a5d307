//! Declarations: the head of a net, variable or port declaration (direction, type, sign,
//! range), parameter heads, ranges, and delays (skipped with one warning).

use super::ast::*;
use super::lexer::{Punct, TokenKind};
use super::parser::{ParseResult, Parser};
use super::symbols::{kw, Sym};
use super::syntax_error::{SyntaxError, SyntaxKind};
use crate::diag::Stage;

impl Parser<'_, '_> {
    /// Direction, type, `signed` and range of a declaration (names not yet read).
    pub(super) fn decl_head(&mut self) -> ParseResult<Decl> {
        self.sv.decl_struct = None;
        self.sv.decl_packed = None;
        let pos = self.peek_pos();
        let mut d = Decl {
            dir: None,
            ty: None,
            signed: false,
            range: None,
            names: Vec::new(),
            pos,
        };
        if self.starts_type() {
            self.typed_decl(&mut d)?;
            return Ok(d);
        }
        let t = self.bump();
        match t.kind {
            TokenKind::Ident(k) if k == kw::INPUT => d.dir = Some(Dir::Input),
            TokenKind::Ident(k) if k == kw::OUTPUT => d.dir = Some(Dir::Output),
            TokenKind::Ident(k) if k == kw::INOUT => {
                return Err(self.unsupported(pos, "`inout` port (only `input` and `output` ports are supported; split the port into an input and an output)"));
            }
            TokenKind::Ident(k) if k == kw::WIRE || k == kw::TRI => d.ty = Some(NetType::Wire),
            TokenKind::Ident(k) if k == kw::SUPPLY0 || k == kw::SUPPLY1 => {
                d.ty = Some(NetType::Wire)
            }
            TokenKind::Ident(k) if k == kw::REG => d.ty = Some(NetType::Reg),
            TokenKind::Ident(k) if k == kw::INTEGER || self.is_int(k) => {
                d.ty = Some(NetType::Integer)
            }
            TokenKind::Ident(k) if self.is_sv_type(k) => d.ty = Some(NetType::Logic),
            _ => unreachable!("decl_head called on a declaration keyword"),
        }
        if d.dir.is_some() {
            if self.eat_kw(kw::WIRE) || self.eat_kw(kw::TRI) {
                d.ty = Some(NetType::Wire);
            } else if self.eat_kw(kw::REG) {
                d.ty = Some(NetType::Reg);
            } else if self.eat_kw(kw::INTEGER) {
                d.ty = Some(NetType::Integer);
            } else if self.starts_type() {
                self.typed_decl(&mut d)?;
                return Ok(d);
            } else if let TokenKind::Ident(k) = self.peek().kind {
                if self.is_int(k) {
                    self.bump();
                    d.ty = Some(NetType::Integer);
                } else if self.is_sv_type(k) {
                    self.bump();
                    d.ty = Some(NetType::Logic);
                }
            }
        }
        if d.ty == Some(NetType::Integer) {
            d.signed = true;
        } else {
            if self.eat_kw(kw::SIGNED) {
                d.signed = true;
            }
            if self.peek_p(Punct::LBrack) {
                d.range = Some(Box::new(self.range()?));
                self.packed_dims(&mut d)?;
            }
        }
        Ok(d)
    }

    /// After a packed range: a second one (`logic [7:0][3:0] d`, IEEE 1800-2017 clause
    /// 7.4.1, from memory) is `unsupported:`.
    pub(super) fn refuse_packed_dims(&mut self) -> ParseResult<()> {
        if self.peek_p(Punct::LBrack) {
            let p = self.peek_pos();
            return Err(self.unsupported(
                p,
                "packed multidimensional array (`[7:0][3:0]`; declare one flat vector, e.g. `[31:0]`, and select its parts with `[k*4 +: 4]`)",
            ));
        }
        Ok(())
    }

    /// A declaration of a SystemVerilog data type (a typedef name, `enum`, `struct packed`,
    /// `byte`, ...): the vector it stands for.
    pub(super) fn typed_decl(&mut self, d: &mut Decl) -> ParseResult<()> {
        let td = self.data_type()?;
        d.ty = Some(if td.integer {
            NetType::Integer
        } else {
            NetType::Logic
        });
        d.signed = td.signed;
        d.range = td.range.clone().map(Box::new);
        if td.fields.is_some() {
            self.sv.decl_struct = Some(td);
        }
        Ok(())
    }

    /// SystemVerilog's `logic` and `bit` (not keywords of IEEE 1364, so looked up by name:
    /// a 1364 design may use them as names, and does not put them before a declaration).
    pub(super) fn is_sv_type(&self, k: Sym) -> bool {
        matches!(self.names.name(k), "logic" | "bit")
    }

    /// SystemVerilog `int` (IEEE 1800-2017 clause 6.11, from memory: a 32-bit signed
    /// two-state integer), read as `integer`: the two agree wherever no x is stored.
    pub(super) fn is_int(&self, k: Sym) -> bool {
        self.names.name(k) == "int"
    }

    /// At `#`: skip a delay (`#3`, `#1.5`, `#D`, `#(1, 2)`, `#(1:2:3)`), warning once per file
    /// that delays are ignored (equivalence is about the logic at rest; IEEE 1364-2005
    /// clause 7.14 gives gate delays, clause 6.1.3 assignment delays).
    pub(super) fn skip_delay(&mut self) -> ParseResult<()> {
        let pos = self.bump().pos;
        if self.eat_p(Punct::LParen) {
            let mut nest = 1usize;
            while nest > 0 {
                match self.bump().kind {
                    TokenKind::Punct(Punct::LParen) => nest += 1,
                    TokenKind::Punct(Punct::RParen) => nest -= 1,
                    TokenKind::Eof => return Err(self.error(pos, "unclosed delay `#(`")),
                    _ => {}
                }
            }
        } else {
            match self.peek().kind {
                TokenKind::Number(_) | TokenKind::Real | TokenKind::Ident(_) => {
                    self.bump();
                }
                _ => return Err(self.error(pos, "expected a delay value after `#`")),
            }
        }
        if !self
            .warnings
            .iter()
            .any(|w| w.kind == SyntaxKind::DelayIgnored)
        {
            self.warnings.push(SyntaxError::new(
                Stage::Parse,
                pos,
                SyntaxKind::DelayIgnored,
                "delays are ignored (this is the first; the logic is read as if every delay were 0)",
            ));
        }
        Ok(())
    }

    /// `[msb:lsb]`
    pub fn range(&mut self) -> ParseResult<Range> {
        self.expect_p(Punct::LBrack, "`[`")?;
        let msb = self.expr()?;
        self.expect_p(Punct::Colon, "`:` in a range")?;
        let lsb = self.expr()?;
        self.expect_p(Punct::RBrack, "`]`")?;
        Ok(Range { msb, lsb })
    }

    pub(super) fn param_head(&mut self, local: bool) -> ParseResult<ParamDecl> {
        let mut pd = ParamDecl {
            local,
            signed: false,
            integer: false,
            range: None,
            assigns: Vec::new(),
        };
        let next = self.peek().kind.clone();
        let int = matches!(next, TokenKind::Ident(k) if self.is_int(k));
        let sv = matches!(next, TokenKind::Ident(k) if self.is_sv_type(k) || k == kw::REG);
        if self.eat_kw(kw::INTEGER) || (int && self.eat_p_any()) {
            pd.integer = true;
            pd.signed = true;
        } else if sv || self.starts_type() {
            // `parameter logic [3:0] P`, `parameter word_t P` (IEEE 1800-2017 clause 6.20.1,
            // from memory).
            let t = self.data_type()?;
            pd.integer = t.integer;
            pd.signed = t.signed;
            pd.range = t.range;
        } else {
            if self.eat_kw(kw::SIGNED) {
                pd.signed = true;
            }
            if self.peek_p(Punct::LBrack) {
                pd.range = Some(self.range()?);
            }
        }
        Ok(pd)
    }
}
