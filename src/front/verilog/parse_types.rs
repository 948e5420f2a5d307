//! SystemVerilog user types and packages, resolved while parsing (IEEE 1800-2017, from
//! memory): `typedef` (clause 6.18), `enum` (6.19), packed `struct` (7.2.1), `package` and
//! `import` (26.2-26.3), `$bits` of a type (20.6.2). Nothing of them reaches the elaborator:
//! a typed name becomes a plain vector, enum members become `localparam`s of the base type,
//! a member access `s.f` becomes a part select of `s`, and a package's parameters are copied
//! into each module that imports or names it.
//!
//! **Invariant:** the scope ([`SvScope`]) lives across the files of one design (a package or
//! a `$unit` typedef in one file serves the next); its per-module part is reset at each
//! `module`.

use super::ast::*;
use super::lexer::{NumLit, Punct, TokenKind, B0, B1};
use super::parser::{ParseResult, Parser};
use super::pos::Pos;
pub use super::sv_types::{Field, Package, TypeDef};
use super::symbols::Sym;
use std::rc::Rc;

/// A 32-bit signed literal.
pub fn num(v: i64, p: Pos) -> Expr {
    let neg = v < 0;
    let m = v.unsigned_abs();
    let bits = (0..32)
        .map(|i| if (m >> i) & 1 == 1 { B1 } else { B0 })
        .collect();
    let lit = Expr::Num(
        Box::new(NumLit {
            bits,
            signed: true,
            sized: false,
            text: m.to_string().into(),
        }),
        p,
    );
    if neg {
        Expr::Unary(UnOp::Neg, p, Box::new(lit))
    } else {
        lit
    }
}

pub(super) fn const_of(e: &Expr) -> Option<i64> {
    match e {
        Expr::Num(n, _) if n.bits.len() <= 62 && n.bits.iter().all(|&b| b == B0 || b == B1) => {
            let mut v = 0i64;
            for (i, &b) in n.bits.iter().enumerate() {
                if b == B1 {
                    v |= 1 << i;
                }
            }
            if n.signed && n.bits.last() == Some(&B1) {
                v -= 1 << n.bits.len();
            }
            Some(v)
        }
        Expr::Unary(UnOp::Neg, _, a) => const_of(a).map(|v| -v),
        _ => None,
    }
}

pub(super) fn bin(a: Expr, op: BinOp, b: Expr, p: Pos) -> Expr {
    match (const_of(&a), const_of(&b), op) {
        (Some(x), Some(y), BinOp::Add) => num(x + y, p),
        (Some(x), Some(y), BinOp::Sub) => num(x - y, p),
        (Some(0), _, BinOp::Add) => b,
        (_, Some(0), BinOp::Add | BinOp::Sub) => a,
        _ => Expr::Chain(Box::new(a), vec![(op, p, b)]),
    }
}

/// Bits of a type, as a constant expression.
pub fn width_of(t: &TypeDef, p: Pos) -> Expr {
    match (&t.range, t.integer) {
        (_, true) => num(32, p),
        (None, false) => num(1, p),
        (Some(r), false) => match (const_of(&r.msb), const_of(&r.lsb)) {
            (Some(m), Some(l)) => num((m - l).abs() + 1, p),
            _ => {
                let down = bin(
                    bin(r.msb.clone(), BinOp::Sub, r.lsb.clone(), p),
                    BinOp::Add,
                    num(1, p),
                    p,
                );
                let up = bin(
                    bin(r.lsb.clone(), BinOp::Sub, r.msb.clone(), p),
                    BinOp::Add,
                    num(1, p),
                    p,
                );
                let c = Expr::Chain(Box::new(r.msb.clone()), vec![(BinOp::Ge, p, r.lsb.clone())]);
                Expr::Cond(Box::new([c, down, up]), p)
            }
        },
    }
}

/// Position within a member of its index `i` (0 = its least significant bit).
pub(super) fn pos_in(t: &TypeDef, i: Expr, p: Pos) -> Expr {
    match &t.range {
        None => bin(i, BinOp::Sub, num(0, p), p),
        Some(r) => match (const_of(&r.msb), const_of(&r.lsb)) {
            (Some(m), Some(l)) if m >= l => bin(i, BinOp::Sub, num(l, p), p),
            (Some(_), Some(l)) => bin(num(l, p), BinOp::Sub, i, p),
            _ => {
                let c = Expr::Chain(Box::new(r.msb.clone()), vec![(BinOp::Ge, p, r.lsb.clone())]);
                let d = bin(i.clone(), BinOp::Sub, r.lsb.clone(), p);
                let u = bin(r.lsb.clone(), BinOp::Sub, i, p);
                Expr::Cond(Box::new([c, d, u]), p)
            }
        },
    }
}

/// Whether a member's range is written low to high (`[0:7]`), when known.
fn ascending(t: &TypeDef) -> bool {
    match &t.range {
        Some(r) => matches!((const_of(&r.msb), const_of(&r.lsb)), (Some(m), Some(l)) if m < l),
        None => false,
    }
}

impl Parser<'_, '_> {
    pub(super) fn name_is(&self, k: Sym, s: &str) -> bool {
        self.names.name(k) == s
    }

    pub(super) fn peek_name_is(&mut self, s: &str) -> bool {
        match self.peek().kind {
            TokenKind::Ident(k) => self.name_is(k, s),
            _ => false,
        }
    }

    /// The type named `k` where the parser stands (a typedef of the module, of an imported
    /// package, or of `$unit`).
    pub(super) fn lookup_type(&self, k: Sym) -> Option<TypeDef> {
        if let Some(t) = self.sv.mod_types.get(&k) {
            return Some(t.clone());
        }
        for p in &self.sv.imports {
            if let Some(t) = self.sv.packages.get(p).and_then(|pk| pk.types.get(&k)) {
                return Some(t.clone());
            }
        }
        self.sv.unit_types.get(&k).cloned()
    }

    pub(super) fn is_package(&self, k: Sym) -> bool {
        self.sv.packages.contains_key(&k)
    }

    /// Whether a data type starts here (a built-in type keyword of SystemVerilog, a typedef
    /// name, or `pkg::`).
    pub(super) fn starts_type(&mut self) -> bool {
        let TokenKind::Ident(k) = self.peek().kind else {
            return false;
        };
        if matches!(
            self.names.name(k),
            "enum" | "struct" | "union" | "byte" | "shortint" | "longint"
        ) {
            return true;
        }
        if self.lookup_type(k).is_some() {
            return true;
        }
        self.is_package(k) && self.peek2().kind == TokenKind::Punct(Punct::Colon)
    }

    /// `pkg::` after the package name: the package is used by this module; reads the name
    /// after `::`.
    pub(super) fn scoped(&mut self, pkg: Sym, pos: Pos) -> ParseResult<(Sym, Pos)> {
        self.expect_p(Punct::Colon, "`::` after a package name")?;
        self.expect_p(Punct::Colon, "`::` after a package name")?;
        if !self.is_package(pkg) {
            let n = self.names.name(pkg).to_string();
            return Err(self.error(pos, format!("unknown package `{n}` (declare it with `package {n}; ... endpackage` before this use)")));
        }
        if !self.sv.used.contains(&pkg) {
            self.sv.used.push(pkg);
        }
        self.ident("a name declared in the package")
    }

    /// A data type: `logic|bit|reg [signed] [range]`, `int`, `integer`, `byte`,
    /// `shortint`, `longint`, `enum ...`, `struct packed ...`, a typedef name or `pkg::name`.
    pub(super) fn data_type(&mut self) -> ParseResult<TypeDef> {
        let t = self.peek().clone();
        let TokenKind::Ident(k) = t.kind else {
            let d = self.describe(&t.kind);
            return Err(self.unexpected(t.pos, "a type", &d));
        };
        let name = self.names.name(k).to_string();
        let mut td = TypeDef {
            signed: false,
            integer: false,
            range: None,
            fields: None,
        };
        match name.as_str() {
            "enum" => return self.enum_type(),
            "struct" => return self.struct_type(),
            "union" => return Err(self.unsupported(t.pos, "`union`")),
            "logic" | "bit" | "reg" => {
                self.bump();
                td.signed = self.eat_kw(super::symbols::kw::SIGNED);
                if !td.signed && self.peek_name_is("unsigned") {
                    self.bump();
                }
                if self.peek_p(Punct::LBrack) {
                    td.range = Some(self.range()?);
                }
            }
            "int" | "integer" => {
                self.bump();
                td.integer = true;
                td.signed = true;
            }
            "byte" | "shortint" | "longint" => {
                self.bump();
                let w = match name.as_str() {
                    "byte" => 8,
                    "shortint" => 16,
                    _ => 64,
                };
                td.signed = true;
                td.range = Some(Range {
                    msb: num(w - 1, t.pos),
                    lsb: num(0, t.pos),
                });
            }
            _ => {
                self.bump();
                let found = if self.is_package(k) && self.peek_p(Punct::Colon) {
                    let (n, p) = self.scoped(k, t.pos)?;
                    let ty = self
                        .sv
                        .packages
                        .get(&k)
                        .and_then(|pk| pk.types.get(&n))
                        .cloned();
                    if ty.is_none() {
                        let tn = self.names.name(n).to_string();
                        return Err(
                            self.error(p, format!("package `{name}` declares no type `{tn}`"))
                        );
                    }
                    ty
                } else {
                    self.lookup_type(k)
                };
                match found {
                    Some(ty) => td = ty,
                    None => return Err(self.unexpected(t.pos, "a type", &format!("`{name}`"))),
                }
            }
        }
        if self.peek_p(Punct::LBrack) {
            return Err(self.unsupported_here("more than one packed dimension (`[a][b]`, or a range after a type name); declare a plain vector"));
        }
        Ok(td)
    }

    /// `enum [base] { A [= v], B, ... }`: the members become `localparam`s of the base type
    /// (implicit values count up from the previous member, the first being 0; clause 6.19).
    pub(super) fn enum_type(&mut self) -> ParseResult<TypeDef> {
        let pos = self.bump().pos;
        let base = if self.peek_p(Punct::LBrace) {
            TypeDef {
                signed: true,
                integer: true,
                range: None,
                fields: None,
            }
        } else if self.peek_p(Punct::LBrack) {
            // `enum [1:0] {...}`: an implicit `logic`.
            TypeDef {
                signed: false,
                integer: false,
                range: Some(self.range()?),
                fields: None,
            }
        } else {
            self.data_type()?
        };
        if base.fields.is_some() {
            return Err(self.unsupported(pos, "an enum whose base type is a struct"));
        }
        self.expect_p(Punct::LBrace, "`{` of the enum members")?;
        let mut prev: Option<Sym> = None;
        loop {
            let (n, p) = self.ident("an enum member name")?;
            if self.peek_p(Punct::LBrack) {
                return Err(self.unsupported_here("enum member ranges (`NAME[N]`)"));
            }
            let v = if self.eat_p(Punct::Assign) {
                self.expr()?
            } else {
                match prev {
                    Some(q) => bin(Expr::Ident(q, p), BinOp::Add, num(1, p), p),
                    None => num(0, p),
                }
            };
            self.sv.pending.push(ParamDecl {
                local: true,
                signed: base.signed,
                integer: base.integer,
                range: base.range.clone(),
                assigns: vec![(n, p, v)],
            });
            prev = Some(n);
            if !self.eat_p(Punct::Comma) {
                break;
            }
        }
        self.expect_p(Punct::RBrace, "`}` closing the enum members")?;
        Ok(base)
    }

    /// `struct packed [signed] { type a, b; type c; }`: a vector whose first member is the
    /// most significant (clause 7.2.1).
    pub(super) fn struct_type(&mut self) -> ParseResult<TypeDef> {
        let pos = self.bump().pos;
        if !self.peek_name_is("packed") {
            return Err(self.unsupported(pos, "unpacked `struct` (write `struct packed`)"));
        }
        self.bump();
        let signed = self.eat_kw(super::symbols::kw::SIGNED);
        self.expect_p(Punct::LBrace, "`{` of the struct members")?;
        let mut members: Vec<(Sym, TypeDef)> = Vec::new();
        while !self.eat_p(Punct::RBrace) {
            let ty = self.data_type()?;
            loop {
                let (n, p) = self.ident("a struct member name")?;
                if members.iter().any(|m| m.0 == n) {
                    let nm = self.names.name(n).to_string();
                    return Err(self.error(p, format!("struct member `{nm}` declared twice")));
                }
                if self.peek_p(Punct::LBrack) {
                    return Err(self.unsupported_here("unpacked dimensions on a struct member"));
                }
                members.push((n, ty.clone()));
                if !self.eat_p(Punct::Comma) {
                    break;
                }
            }
            self.expect_p(Punct::Semi, "`;` after a struct member")?;
        }
        if members.is_empty() {
            return Err(self.error(pos, "a struct needs at least one member"));
        }
        let mut off = num(0, pos);
        let mut fields = Vec::with_capacity(members.len());
        for (n, ty) in members.into_iter().rev() {
            let w = width_of(&ty, pos);
            fields.push(Field {
                name: n,
                ty,
                off: off.clone(),
            });
            off = bin(off, BinOp::Add, w, pos);
        }
        fields.reverse();
        Ok(TypeDef {
            signed,
            integer: false,
            range: Some(Range {
                msb: bin(off, BinOp::Sub, num(1, pos), pos),
                lsb: num(0, pos),
            }),
            fields: Some(Rc::new(fields)),
        })
    }

    /// `typedef type name;` (the `typedef` keyword next). Returns the name and type; enum
    /// members wait in `pending` for the caller.
    pub(super) fn typedef(&mut self) -> ParseResult<(Sym, TypeDef)> {
        let pos = self.bump().pos;
        let ty = match self.data_type() {
            Ok(t) => t,
            Err(e) => return self.typedef_after_error(e),
        };
        let (n, _) = self.ident("the new type's name")?;
        if self.peek_p(Punct::LBrack) {
            return Err(self.unsupported_here("unpacked dimensions in a `typedef` (arrays)"));
        }
        if self.peek_p(Punct::Semi) {
            self.bump();
            return Ok((n, ty));
        }
        let _ = pos;
        let t = self.peek().clone();
        let d = self.describe(&t.kind);
        Err(self.unexpected(t.pos, "`;` after the typedef", &d))
    }

    /// After an error in a `typedef`'s type (already reported): the new type's name is the
    /// last name before the `;`; it is declared as one bit, so that declarations of the type
    /// give no follow-on error (the read fails on the first error anyway). Without a name,
    /// the error stands and the caller skips the declaration.
    fn typedef_after_error(&mut self, e: super::parser::Stop) -> ParseResult<(Sym, TypeDef)> {
        let mut name = None;
        let mut depth = 0usize;
        loop {
            match self.peek().kind {
                TokenKind::Eof => return Err(e),
                TokenKind::Punct(Punct::LBrace) => depth += 1,
                TokenKind::Punct(Punct::RBrace) => depth = depth.saturating_sub(1),
                TokenKind::Punct(Punct::Semi) if depth == 0 => break,
                TokenKind::Ident(k) if k == super::symbols::kw::ENDMODULE => return Err(e),
                TokenKind::Ident(k) if depth == 0 => name = Some(k),
                _ => {}
            }
            self.bump();
        }
        let Some(n) = name else { return Err(e) };
        self.bump();
        let ty = TypeDef {
            signed: false,
            integer: false,
            range: None,
            fields: None,
        };
        Ok((n, ty))
    }

    /// Enum members read by the last type.
    pub(super) fn take_pending(&mut self) -> Vec<ParamDecl> {
        std::mem::take(&mut self.sv.pending)
    }

    /// Remember the names of a declaration of struct type (for `s.member`).
    pub(super) fn note_struct_names(&mut self, names: &[(Sym, Pos, Option<Box<Expr>>)]) {
        if let Some(t) = self.sv.decl_struct.clone() {
            for n in names {
                self.sv.structs.insert(n.0, t.clone());
            }
        }
    }

    /// `$bits(` next to a type: its width; `None` when the argument is an expression.
    pub(super) fn bits_of_type(&mut self) -> ParseResult<Option<Expr>> {
        let p = self.peek_pos();
        let is_type = match self.peek().kind {
            TokenKind::Ident(k) => {
                matches!(
                    self.names.name(k),
                    "logic" | "bit" | "reg" | "int" | "integer" | "byte" | "shortint" | "longint"
                ) || (self.starts_type() && !self.sv.structs.contains_key(&k))
            }
            _ => false,
        };
        if !is_type {
            return Ok(None);
        }
        let t = self.data_type()?;
        let _ = self.take_pending();
        Ok(Some(width_of(&t, p)))
    }

    /// After a name `s` of struct type: `s.a.b` and an optional select of the member, as a
    /// select of `s`. `None` when `s` is not a struct or no `.` follows.
    pub(super) fn struct_member(&mut self, s: Sym, pos: Pos) -> ParseResult<Option<Expr>> {
        if !self.peek_p(Punct::Dot) {
            return Ok(None);
        }
        let Some(mut ty) = self.sv.structs.get(&s).cloned() else {
            return Ok(None);
        };
        let mut off = num(0, pos);
        while self.peek_p(Punct::Dot) {
            let Some(fields) = ty.fields.clone() else {
                break;
            };
            self.bump();
            let (m, mp) = self.ident("a struct member name")?;
            let Some(f) = fields.iter().find(|f| f.name == m) else {
                let (sn, mn) = (
                    self.names.name(s).to_string(),
                    self.names.name(m).to_string(),
                );
                return Err(self.error(mp, format!("`{sn}` has no member `{mn}`")));
            };
            off = bin(off, BinOp::Add, f.off.clone(), mp);
            ty = f.ty.clone();
        }
        if self.peek_p(Punct::Dot) {
            return Err(self.unsupported_here("`.` after a member that is not a struct"));
        }
        let sel = if self.peek_p(Punct::LBrack) {
            if ty.range.is_none() && !ty.integer {
                return Err(self.unsupported_here("a select of a one-bit struct member"));
            }
            if ty.integer {
                ty.range = Some(Range {
                    msb: num(31, pos),
                    lsb: num(0, pos),
                });
            }
            let asc = ascending(&ty);
            let at = |i: Expr| bin(off.clone(), BinOp::Add, pos_in(&ty, i, pos), pos);
            match self.select()? {
                Select::Bit(i) => Select::Bit(at(i)),
                Select::Part(a, b) => Select::Part(at(a), at(b)),
                Select::Up(b, w) if asc => Select::Down(at(b), w),
                Select::Down(b, w) if asc => Select::Up(at(b), w),
                Select::Up(b, w) => Select::Up(at(b), w),
                Select::Down(b, w) => Select::Down(at(b), w),
            }
        } else if ty.range.is_none() && !ty.integer {
            Select::Bit(off)
        } else {
            let w = width_of(&ty, pos);
            let top = bin(
                bin(off.clone(), BinOp::Add, w, pos),
                BinOp::Sub,
                num(1, pos),
                pos,
            );
            Select::Part(top, off)
        };
        if self.peek_p(Punct::LBrack) {
            return Err(self.unsupported_here("multiple selects (arrays of vectors)"));
        }
        Ok(Some(Expr::Index(s, pos, Box::new(sel))))
    }
}
