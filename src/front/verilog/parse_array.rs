//! Arrays, lowered while parsing to one flat vector each (memories and arrays of nets,
//! IEEE 1364-2005 clause 4.9; packed and unpacked dimensions and the `[N]` size form,
//! IEEE 1800-2017 clauses 7.4-7.4.6; from memory): `reg [7:0] mem [0:15]` is declared as
//! `reg [127:0] mem` and `logic [3:0][7:0] w` as `logic [31:0] w`, and every select of
//! such a name becomes one select of the flat vector (`mem[a]` is `mem[a*8 +: 8]`,
//! `w[i][j]` is `w[i*8 + j*1]`). The elaborator then reads and writes arrays with the selects
//! it already has: a variable word read is a selector over the words (an address past the
//! words reads x, as a simulator reads it), a variable word write decodes the address
//! (`stmt/window.rs`), and each word of a memory written in a clocked block becomes
//! registers named `mem[k]` after their flat bits.
//!
//! Layout: dimension k's index i sits at position `pos_k(i)`, and the element at flat offset
//! `sum_k pos_k(i_k) * stride_k`, where `stride_k` is the number of bits of one element of
//! dimension k. In a packed dimension the right-hand bound is the least significant, as in
//! a vector (i minus it for `[hi:lo]`, it minus i for `[lo:hi]`), so a packed array is
//! exactly the vector SystemVerilog makes of it; in an unpacked one `pos_k(i)` is i minus
//! the lower bound, so word a of `reg [7:0] mem [0:15]` is the flat bits `mem[8a+7:8a]`
//! (the names its registers get).
//!
//! Refused (`unsupported:` at the place): a whole unpacked array or a slice of its words
//! (read and write them a word at a time), unpacked array ports, arrays of structs,
//! initial values of arrays, and a select after a part-select.

use super::ast::*;
use super::lexer::Punct;
use super::parse_types::{bin, const_of, num, pos_in, width_of, TypeDef};
use super::parser::{ParseResult, Parser};
use super::pos::Pos;
use super::sv_types::ArrayShape;
use super::symbols::Sym;

/// A range as a type, for the width and position helpers of `parse_types.rs`.
fn vector(r: &Range) -> TypeDef {
    TypeDef {
        signed: false,
        integer: false,
        range: Some(r.clone()),
        fields: None,
    }
}

/// `a * b`, folded when both are constants. A variable operand keeps the constant factor, so
/// the product is computed at 32 bits at least (an index sum never wraps in its own width).
fn mul(a: Expr, b: Expr, p: Pos) -> Expr {
    match (const_of(&a), const_of(&b)) {
        (Some(x), Some(y)) => num(x * y, p),
        _ => Expr::Chain(Box::new(a), vec![(BinOp::Mul, p, b)]),
    }
}

/// `desc` for a dimension written `[hi:lo]`, `asc` for `[lo:hi]` (a conditional when the
/// bounds are not literal numbers; the elaborator folds it).
fn by_dir(r: &Range, desc: Expr, asc: Expr, p: Pos) -> Expr {
    match (const_of(&r.msb), const_of(&r.lsb)) {
        (Some(m), Some(l)) if m >= l => desc,
        (Some(_), Some(_)) => asc,
        _ => {
            let c = Expr::Chain(Box::new(r.msb.clone()), vec![(BinOp::Ge, p, r.lsb.clone())]);
            Expr::Cond(Box::new([c, desc, asc]), p)
        }
    }
}

/// Position of index `i` in dimension `r`: the packed rule of `pos_in` for a packed
/// dimension; for an unpacked one (whose layout no source text can see), the distance from
/// the lower bound, so that word `a` of `mem [0:15]` holds flat bits `a*W` and up.
fn position(r: &Range, unpacked: bool, i: Expr, p: Pos) -> Expr {
    if !unpacked {
        return pos_in(&vector(r), i, p);
    }
    let from = |b: &Expr| bin(i.clone(), BinOp::Sub, b.clone(), p);
    by_dir(r, from(&r.lsb), from(&r.msb), p)
}

/// Bits of one element of each dimension (the product of the widths of the later ones).
fn strides(dims: &[Range], p: Pos) -> Vec<Expr> {
    let mut out = vec![num(1, p); dims.len()];
    for k in (0..dims.len().saturating_sub(1)).rev() {
        out[k] = mul(out[k + 1].clone(), width_of(&vector(&dims[k + 1]), p), p);
        if let Some(v) = const_of(&out[k]) {
            out[k] = num(v, p);
        }
    }
    out
}

/// The flat range `[total-1:0]` of dimensions `dims`.
fn flat_range(dims: &[Range], p: Pos) -> Range {
    let total = mul(
        strides(dims, p)[0].clone(),
        width_of(&vector(&dims[0]), p),
        p,
    );
    Range {
        msb: bin(total, BinOp::Sub, num(1, p), p),
        lsb: num(0, p),
    }
}

/// Whether `e` is the marker `$signed(...)` that a signed word read is wrapped in (written
/// at the very place of its argument, which no source text can do).
fn is_marker(e: &Expr, signed: Sym) -> bool {
    matches!(e, Expr::Call(s, p, a) if *s == signed && a.len() == 1 && a[0].pos() == *p)
}

impl Parser<'_, '_> {
    /// After the first packed range of a declaration: further packed ranges make it a packed
    /// array, declared as one flat vector (its dimensions kept for the selects).
    pub(super) fn packed_dims(&mut self, d: &mut Decl) -> ParseResult<()> {
        if !self.peek_p(Punct::LBrack) {
            return Ok(());
        }
        let Some(first) = d.range.take() else {
            return Ok(());
        };
        let mut dims = vec![*first];
        while self.peek_p(Punct::LBrack) {
            dims.push(self.range()?);
        }
        d.range = Some(Box::new(flat_range(&dims, d.pos)));
        self.sv.decl_packed = Some(dims);
        Ok(())
    }

    /// A name just declared by head `d`: remember it when the head has several packed
    /// dimensions; forget an array of that name otherwise (a function's local shadows it).
    pub(super) fn note_packed_name(&mut self, n: Sym) {
        match self.sv.decl_packed.clone() {
            Some(dims) => {
                let shape = ArrayShape {
                    dims,
                    unpacked: 0,
                    signed: false,
                };
                self.sv.arrays.insert(n, shape);
            }
            None => {
                self.sv.arrays.remove(&n);
            }
        }
    }

    /// At `[` after name `n` (at `p`) of declaration head `d`: the unpacked dimensions
    /// (`[0:15]`, `[15:0]`, or `[16]` for `[0:15]`). Returns the declaration of the flat
    /// vector that holds the array.
    pub(super) fn unpacked_decl(&mut self, d: &Decl, n: Sym, p: Pos) -> ParseResult<Decl> {
        let at = self.peek_pos();
        let name = self.names.name(n).to_string();
        if d.dir.is_some() {
            return Err(self.unsupported(at, format!("unpacked array port `{name}` (declare the port as one flat vector, e.g. `[N*W-1:0]`, and select its words with `[k*W +: W]`)")));
        }
        if self.sv.decl_struct.is_some() {
            return Err(self.unsupported(at, format!("array of structs `{name}` (declare a packed struct with the elements as members, or one array per member)")));
        }
        let mut unpacked = Vec::new();
        while self.eat_p(Punct::LBrack) {
            let a = self.expr()?;
            let r = if self.eat_p(Punct::Colon) {
                Range {
                    msb: a,
                    lsb: self.expr()?,
                }
            } else {
                // `[N]` is `[0:N-1]` (IEEE 1800-2017 clause 7.4.2, from memory).
                let ap = a.pos();
                Range {
                    msb: num(0, ap),
                    lsb: bin(a, BinOp::Sub, num(1, ap), ap),
                }
            };
            self.expect_p(Punct::RBrack, "`]` closing the array dimension")?;
            unpacked.push(r);
        }
        if self.peek_p(Punct::Assign) {
            let q = self.peek_pos();
            return Err(self.unsupported(
                q,
                format!("initial value of array `{name}` (assign its words in an always block, or under a reset)"),
            ));
        }
        let packed: Vec<Range> = match (&self.sv.decl_packed, &d.range, d.ty) {
            (Some(dims), _, _) => dims.clone(),
            (None, Some(r), _) => vec![(**r).clone()],
            (None, None, Some(NetType::Integer)) => vec![Range {
                msb: num(31, p),
                lsb: num(0, p),
            }],
            _ => Vec::new(),
        };
        let count = unpacked.len();
        let mut dims = unpacked;
        dims.extend(packed);
        let ty = match d.ty {
            Some(NetType::Integer) | None => Some(NetType::Reg),
            t => t,
        };
        let flat = Decl {
            dir: None,
            ty,
            signed: d.signed,
            range: Some(Box::new(flat_range(&dims, p))),
            names: vec![(n, p, None)],
            pos: d.pos,
        };
        let shape = ArrayShape {
            dims,
            unpacked: count,
            signed: d.signed,
        };
        self.sv.arrays.insert(n, shape);
        Ok(flat)
    }

    /// After name `s` (at `pos`) in an expression or an assignment target (`lvalue`): when
    /// `s` is an array, its selects as one select of the flat vector; `None` when it is not
    /// an array, or a packed one named whole.
    pub(super) fn array_ref(
        &mut self,
        s: Sym,
        pos: Pos,
        lvalue: bool,
    ) -> ParseResult<Option<Expr>> {
        let Some(shape) = self.sv.arrays.get(&s).cloned() else {
            return Ok(None);
        };
        let name = self.names.name(s).to_string();
        let mut sels = Vec::new();
        while self.peek_p(Punct::LBrack) {
            let at = self.peek_pos();
            sels.push((self.select()?, at));
        }
        let k = sels.len();
        if k == 0 {
            if shape.unpacked == 0 {
                return Ok(None);
            }
            return Err(self.unsupported(
                pos,
                format!("whole unpacked array `{name}` (read and assign it one word at a time, `{name}[i]`)"),
            ));
        }
        if k > shape.dims.len() {
            let at = sels[shape.dims.len()].1;
            let n = shape.dims.len();
            return Err(self.error(
                at,
                format!("`{name}` has {n} dimension(s) but is selected {k} times"),
            ));
        }
        let strides = strides(&shape.dims, pos);
        let mut offset = num(0, pos);
        for (j, (sel, at)) in sels[..k - 1].iter().enumerate() {
            let Select::Bit(i) = sel else {
                return Err(self.unsupported(
                    *at,
                    format!("a part-select of `{name}` before another select (select single indices first, the range last)"),
                ));
            };
            let at_j = position(&shape.dims[j], j < shape.unpacked, i.clone(), pos);
            let here = mul(at_j, strides[j].clone(), pos);
            offset = bin(offset, BinOp::Add, here, pos);
        }
        let (last, at) = sels.pop().expect("at least one select");
        let d = &shape.dims[k - 1];
        let s_k = strides[k - 1].clone();
        if k <= shape.unpacked && !matches!(last, Select::Bit(_)) || k < shape.unpacked {
            return Err(self.unsupported(
                at,
                format!("a slice of the words of unpacked array `{name}` (select one word, `{name}[i]`, and assign the words one at a time)"),
            ));
        }
        let t = vector(d);
        let one = |x: i64| num(x, pos);
        // Least significant position of the selected elements, and how many.
        let (lo, count) = match &last {
            Select::Bit(i) => (position(d, k <= shape.unpacked, i.clone(), pos), one(1)),
            Select::Part(m, l) => {
                if let (Some(mv), Some(lv), Some(dm), Some(dl)) =
                    (const_of(m), const_of(l), const_of(&d.msb), const_of(&d.lsb))
                {
                    if mv != lv && (mv > lv) != (dm >= dl) {
                        return Err(self.error(
                            at,
                            format!("part-select `[{mv}:{lv}]` of `{name}` is in the opposite direction to its dimension `[{dm}:{dl}]` (write the bounds in the declaration's order)"),
                        ));
                    }
                }
                let w = width_of(
                    &vector(&Range {
                        msb: m.clone(),
                        lsb: l.clone(),
                    }),
                    pos,
                );
                (pos_in(&t, l.clone(), pos), w)
            }
            Select::Up(b, w) | Select::Down(b, w) => {
                let p0 = pos_in(&t, b.clone(), pos);
                let back = bin(
                    p0.clone(),
                    BinOp::Sub,
                    bin(w.clone(), BinOp::Sub, one(1), pos),
                    pos,
                );
                let lo = if matches!(last, Select::Up(..)) {
                    by_dir(d, p0, back, pos)
                } else {
                    by_dir(d, back, p0, pos)
                };
                (lo, w.clone())
            }
        };
        let base = bin(offset, BinOp::Add, mul(lo, s_k.clone(), pos), pos);
        let width = mul(count, s_k, pos);
        let sel = if const_of(&width) == Some(1) {
            Select::Bit(base)
        } else {
            Select::Up(base, width)
        };
        let e = Expr::Index(s, pos, Box::new(sel));
        if !lvalue && shape.signed && k == shape.unpacked && matches!(last, Select::Bit(_)) {
            let signed = self.names.intern("$signed");
            return Ok(Some(Expr::Call(signed, pos, vec![e])));
        }
        Ok(Some(e))
    }

    /// The target of a continuous assignment, without the `$signed` a signed word read
    /// carries (parsed as an expression).
    pub(super) fn strip_signed_marker(&mut self, e: Expr) -> Expr {
        let signed = self.names.intern("$signed");
        if is_marker(&e, signed) {
            if let Expr::Call(_, _, mut a) = e {
                return a.remove(0);
            }
            unreachable!("a marker is a call");
        }
        match e {
            Expr::Concat(items, p) => Expr::Concat(
                items
                    .into_iter()
                    .map(|x| self.strip_signed_marker(x))
                    .collect(),
                p,
            ),
            other => other,
        }
    }
}
