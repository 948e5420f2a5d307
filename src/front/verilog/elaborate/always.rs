//! `always @*` blocks: symbolic execution of blocking assignments, `if`, `case`/`casez` and
//! constant-bound `for` loops; a variable left unassigned on some path is a latch error.

use super::super::ast::{CaseStmt, Expr, ForStmt, NetType, Select, Stmt};
use super::super::lexer::{Pos, B0, B1};
use super::bits::{self, extend};
use super::expr::Cx;
use super::{Elab, Symbol};
use crate::aig::Lit;
use std::collections::BTreeMap;

/// The state of one variable bit during symbolic execution.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum BState {
    /// Assigned on every path so far, with this value.
    Set(Lit),
    /// Not assigned on some path; the statement that has such a path, if any.
    Unset(Option<Pos>),
}

/// Current values of the variables an always block has assigned.
#[derive(Clone, Debug, Default)]
pub struct Env {
    vars: BTreeMap<u32, Vec<BState>>,
}

impl Env {
    /// The current value of bit `off` of net `n`, if assigned.
    pub fn bit(&self, n: u32, off: usize) -> Option<Lit> {
        match self.vars.get(&n)?.get(off)? {
            BState::Set(l) => Some(*l),
            BState::Unset(_) => None,
        }
    }

    /// Replace the bits of net `n` by their current values where assigned.
    pub fn overlay(&self, n: u32, bits: &mut [Lit]) {
        if let Some(v) = self.vars.get(&n) {
            for (b, s) in bits.iter_mut().zip(v) {
                if let BState::Set(l) = s {
                    *b = *l;
                }
            }
        }
    }
}

/// One assignment target bit: net and offset (`None` offset: outside the range, dropped).
pub type Target = (u32, Option<u32>);

impl Elab<'_> {
    /// Elaborate one `always @*` block in scope `sc`.
    pub(super) fn elab_always(&mut self, sc: u32, body: &Stmt, pos: Pos) {
        let mut env = Env::default();
        self.exec(sc, body, &mut env);
        let mut latch: BTreeMap<u32, Pos> = BTreeMap::new();
        for (n, states) in &env.vars {
            if self.nets[*n as usize].ty == NetType::Integer {
                continue;
            }
            for (off, st) in states.iter().enumerate() {
                match st {
                    BState::Set(l) => self.drive(*n, off as u32, *l, pos),
                    BState::Unset(Some(p)) => {
                        latch.entry(*n).or_insert(*p);
                        // Reported as a latch below; a placeholder driver avoids a
                        // follow-on "never driven" message for the same bits.
                        self.drive(*n, off as u32, Lit::FALSE, pos);
                    }
                    BState::Unset(None) => {}
                }
            }
        }
        for (n, p) in latch {
            let nm = self.net_name(n);
            let line = p.line;
            self.error(
                p,
                format!("`{nm}` is not assigned on every path through the always block (the statement at line {line} has a path without an assignment); it would infer a latch"),
                "assign it a default value at the top of the block, or add the missing `else`/`default`",
            );
        }
    }

    fn exec(&mut self, sc: u32, st: &Stmt, env: &mut Env) {
        match st {
            Stmt::Null => {}
            Stmt::Block(v) => {
                for s in v {
                    self.exec(sc, s, env);
                }
            }
            Stmt::Assign(lhs, rhs, pos) => self.proc_assign(sc, lhs, rhs, *pos, env),
            Stmt::If(c, t, e, pos) => {
                let cb = {
                    let cx = Cx {
                        sc,
                        env: Some(env),
                        constant: false,
                    };
                    self.eval_bool(&cx, c)
                };
                if cb == Lit::TRUE {
                    return self.exec(sc, t, env);
                }
                if cb == Lit::FALSE {
                    if let Some(e) = e {
                        self.exec(sc, e, env);
                    }
                    return;
                }
                let mut te = env.clone();
                self.exec(sc, t, &mut te);
                let mut ee = env.clone();
                if let Some(e) = e {
                    self.exec(sc, e, &mut ee);
                }
                *env = self.merge(cb, te, ee, *pos);
            }
            Stmt::Case(c) => self.exec_case(sc, c, env),
            Stmt::For(f) => self.exec_for(sc, f, env),
        }
    }

    /// `c ? t : e` per variable bit; a bit unset on either side stays unset.
    fn merge(&mut self, c: Lit, t: Env, e: Env, pos: Pos) -> Env {
        if c == Lit::TRUE {
            return t;
        }
        if c == Lit::FALSE {
            return e;
        }
        let mut out = Env::default();
        let keys: Vec<u32> = t.vars.keys().chain(e.vars.keys()).copied().collect();
        for n in keys {
            if out.vars.contains_key(&n) {
                continue;
            }
            let w = self.nets[n as usize].width as usize;
            let unset = vec![BState::Unset(None); w];
            let tv = t.vars.get(&n).unwrap_or(&unset);
            let ev = e.vars.get(&n).unwrap_or(&unset);
            let merged = tv
                .iter()
                .zip(ev)
                .map(|(a, b)| match (a, b) {
                    (BState::Set(x), BState::Set(y)) => BState::Set(self.g.mux(c, *x, *y)),
                    (BState::Unset(p), BState::Unset(q)) => BState::Unset(p.or(*q)),
                    (BState::Unset(p), _) | (_, BState::Unset(p)) => {
                        BState::Unset(Some(p.unwrap_or(pos)))
                    }
                })
                .collect();
            out.vars.insert(n, merged);
        }
        out
    }

    fn proc_assign(&mut self, sc: u32, lhs: &Expr, rhs: &Expr, pos: Pos, env: &mut Env) {
        // A variable index on the left: r[i] = v writes bit i when i is in range.
        if let Expr::Index(sym, ipos, sel) = lhs {
            if let Select::Bit(ix) = &**sel {
                let iv = {
                    let cx = Cx {
                        sc,
                        env: Some(env),
                        constant: false,
                    };
                    self.eval_self(&cx, ix)
                };
                if !bits::is_const(&iv.bits) {
                    if let Some(n) = self.target_net(sc, *sym, *ipos, true) {
                        let cx = Cx {
                            sc,
                            env: Some(env),
                            constant: false,
                        };
                        let t = self.ty(&cx, rhs);
                        let v = self.eval(&cx, rhs, t.w.max(1), t.s)[0];
                        let net = self.nets[n as usize].clone();
                        let w = net.width as usize;
                        let ww = iv.bits.len() + 66;
                        let ie = extend(iv.bits.clone(), ww, iv.signed);
                        let entry = env
                            .vars
                            .entry(n)
                            .or_insert_with(|| vec![BState::Unset(None); w]);
                        for (off, slot) in entry.iter_mut().enumerate() {
                            let idx = bits::constant(net.index(off as u32), ww);
                            let hit = bits::eq(&mut self.g, &ie, &idx);
                            *slot = match *slot {
                                _ if hit == Lit::FALSE => *slot,
                                BState::Set(old) => BState::Set(self.g.mux(hit, v, old)),
                                BState::Unset(_) if hit == Lit::TRUE => BState::Set(v),
                                BState::Unset(p) => BState::Unset(Some(p.unwrap_or(pos))),
                            };
                        }
                    }
                    return;
                }
            }
        }
        let cx = Cx {
            sc,
            env: Some(env),
            constant: false,
        };
        let targets = match self.targets(&cx, lhs, true) {
            Some(t) => t,
            None => return,
        };
        let t = self.ty(&cx, rhs);
        let w = targets.len().max(t.w);
        let v = self.eval(&cx, rhs, w, t.s);
        for (k, (n, off)) in targets.iter().enumerate() {
            if let Some(off) = off {
                let width = self.nets[*n as usize].width as usize;
                let e = env
                    .vars
                    .entry(*n)
                    .or_insert_with(|| vec![BState::Unset(None); width]);
                e[*off as usize] = BState::Set(v[k]);
            }
        }
    }

    /// The net named `sym`, checked as an assignment target (`procedural`: a `reg`).
    pub(super) fn target_net(
        &mut self,
        sc: u32,
        sym: super::Sym,
        pos: Pos,
        procedural: bool,
    ) -> Option<u32> {
        let nm = || self.name(sym);
        match self.lookup(sc, sym) {
            Some(&Symbol::Net(n)) => {
                let ty = self.nets[n as usize].ty;
                if procedural && ty == NetType::Wire {
                    let nm = nm();
                    self.error(
                        pos,
                        format!("procedural assignment to wire `{nm}`"),
                        "declare it `reg` to assign it in an always block",
                    );
                    return None;
                }
                if !procedural && ty != NetType::Wire {
                    let nm = nm();
                    self.error(
                        pos,
                        format!("continuous assignment to variable `{nm}`"),
                        "declare it `wire`, or assign it in an always block",
                    );
                    return None;
                }
                Some(n)
            }
            Some(_) => {
                let nm = nm();
                self.error(
                    pos,
                    format!("`{nm}` is not a net or variable and cannot be assigned"),
                    "assign a net (`wire`) or a variable (`reg`); parameters and genvars are constants",
                );
                None
            }
            None => {
                let nm = nm();
                self.error(
                    pos,
                    format!("undeclared name `{nm}`"),
                    "declare it (`wire`, `reg`, `input`, `output`, `parameter`) before this use, or check the spelling",
                );
                None
            }
        }
    }

    /// Target bits of an assignment, least significant first.
    pub(super) fn targets(&mut self, cx: &Cx, lhs: &Expr, procedural: bool) -> Option<Vec<Target>> {
        match lhs {
            Expr::Ident(s, p) => {
                let n = self.target_net(cx.sc, *s, *p, procedural)?;
                Some(
                    (0..self.nets[n as usize].width)
                        .map(|k| (n, Some(k)))
                        .collect(),
                )
            }
            Expr::Index(s, p, sel) => {
                let n = self.target_net(cx.sc, *s, *p, procedural)?;
                let net = self.nets[n as usize].clone();
                let ccx = Cx {
                    sc: cx.sc,
                    env: cx.env,
                    constant: false,
                };
                let idx: Vec<i64> = match &**sel {
                    Select::Bit(i) => {
                        let v = self.eval_self(&ccx, i);
                        match bits::to_i64(&v.bits, v.signed) {
                            Some(k) => vec![k],
                            None => {
                                self.error(
                                    *p,
                                    "unsupported: variable index on the left of a continuous assignment",
                                    "use a constant index, or assign the vector in an `always @*` block",
                                );
                                return None;
                            }
                        }
                    }
                    Select::Part(m, l) => {
                        let (m, l) = (self.const_int(cx.sc, m)?, self.const_int(cx.sc, l)?);
                        if (m > l) != (net.msb >= net.lsb) && m != l && net.width > 1 {
                            self.error(
                                *p,
                                "part-select in the opposite direction to the declaration",
                                "write the bounds in the declaration's order, e.g. `[7:4]` for `[7:0]`"
                            );
                            return None;
                        }
                        let Some(w) = super::span(m, l) else {
                            self.error(
                                *p,
                                "part-select wider than 65536 bits",
                                "select at most the declared bits of the vector",
                            );
                            return None;
                        };
                        let step = if l <= m { 1 } else { -1 };
                        (0..w as i64).map(|j| l + j * step).collect()
                    }
                    Select::Up(b, w) | Select::Down(b, w) => {
                        let w = self.const_int(cx.sc, w)?;
                        if w <= 0 || w as usize > super::MAX_WIDTH {
                            self.error(
                                *p,
                                "indexed part-select width must be a positive constant of at most 65536",
                                "give the number of bits to select, e.g. `d[s +: 8]`"
                            );
                            return None;
                        }
                        let v = self.eval_self(&ccx, b);
                        let b = match bits::to_i64(&v.bits, v.signed) {
                            Some(b) => b,
                            None => {
                                self.error(
                                    *p,
                                    "unsupported: variable indexed part-select on the left of an assignment",
                                    "use a constant base, or assign each possible window under an `if`/`case`",
                                );
                                return None;
                            }
                        };
                        let lo = if matches!(&**sel, Select::Up(..)) {
                            b
                        } else {
                            b.saturating_sub(w - 1)
                        };
                        let mut v: Vec<i64> = (0..w).map(|j| lo.saturating_add(j)).collect();
                        if net.msb < net.lsb {
                            v.reverse();
                        }
                        v
                    }
                };
                let out: Vec<Target> = idx.iter().map(|&i| (n, net.offset(i))).collect();
                if out.iter().any(|t| t.1.is_none()) {
                    self.warn(
                        *p,
                        "assignment to bits outside the declared range is dropped",
                    );
                }
                Some(out)
            }
            Expr::Concat(items, _) => {
                let mut out = Vec::new();
                for it in items.iter().rev() {
                    out.extend(self.targets(cx, it, procedural)?);
                }
                Some(out)
            }
            other => {
                self.error(
                    other.pos(),
                    "not an assignable expression (expected a name, a select or a concatenation)",
                    "assign a name, a bit or part-select of it, or a concatenation of those",
                );
                None
            }
        }
    }

    fn exec_case(&mut self, sc: u32, c: &CaseStmt, env: &mut Env) {
        let cx = Cx {
            sc,
            env: Some(env),
            constant: false,
        };
        let mut t = self.ty(&cx, &c.expr);
        for (labels, _) in &c.items {
            for l in labels {
                let u = self.ty(&cx, l);
                t.w = t.w.max(u.w);
                t.s = t.s && u.s;
            }
        }
        let sel = self.eval(&cx, &c.expr, t.w, t.s);
        let mut conds = Vec::with_capacity(c.items.len());
        for (labels, _) in &c.items {
            let mut any = Lit::FALSE;
            for l in labels {
                let hit = match l {
                    Expr::Num(n, p) if n.bits.iter().any(|&b| b != B0 && b != B1) => {
                        if !c.casez {
                            self.error(
                                *p,
                                format!("unsupported: x/z bits in a `case` item (`{}`)", n.text),
                                "use `casez` with `?` or `z` for don't-care bits",
                            );
                            Lit::FALSE
                        } else {
                            // Don't-care (z/?) bits are skipped; x bits are unsupported.
                            let mut b = n.bits.clone();
                            let fill = if n.signed && t.s {
                                *b.last().unwrap_or(&B0)
                            } else {
                                B0
                            };
                            b.resize(t.w, fill);
                            let mut eqs = Vec::new();
                            for (k, &bit) in b.iter().enumerate() {
                                match bit {
                                    B0 => eqs.push(!sel[k]),
                                    B1 => eqs.push(sel[k]),
                                    super::super::lexer::BZ => {}
                                    _ => {
                                        self.error(
                                            *p,
                                            format!("unsupported: x bits in a `casez` item (`{}`); use `?`", n.text),
                                            "write don't-care bits as `?` or `z` in `casez` items",
                                        );
                                        break;
                                    }
                                }
                            }
                            self.g.and_all(&eqs)
                        }
                    }
                    _ => {
                        let v = self.eval(&cx, l, t.w, t.s);
                        bits::eq(&mut self.g, &sel, &v)
                    }
                };
                any = self.g.or(any, hit);
            }
            conds.push(any);
        }
        let mut acc = env.clone();
        if let Some(d) = &c.default {
            self.exec(sc, d, &mut acc);
        }
        for (k, (_, st)) in c.items.iter().enumerate().rev() {
            let mut e = env.clone();
            self.exec(sc, st, &mut e);
            acc = self.merge(conds[k], e, acc, c.pos);
        }
        *env = acc;
    }

    fn exec_for(&mut self, sc: u32, f: &ForStmt, env: &mut Env) {
        let var = Expr::Ident(f.init.0, f.init.1);
        self.proc_assign(sc, &var, &f.init.2, f.init.1, env);
        let mut count = 0;
        loop {
            let c = {
                let cx = Cx {
                    sc,
                    env: Some(env),
                    constant: false,
                };
                self.eval_bool(&cx, &f.cond)
            };
            if c == Lit::FALSE {
                break;
            }
            if c != Lit::TRUE {
                self.error(
                    f.cond.pos(),
                    "for-loop condition is not constant; loop bounds must be constants",
                    "bound the loop by constants or parameters, e.g. `for (i = 0; i < N; i = i + 1)`"
                );
                break;
            }
            count += 1;
            if count > super::MAX_LOOP {
                self.error(
                    f.pos,
                    format!("for loop runs more than {} iterations", super::MAX_LOOP),
                    "check the loop's condition and step; equicone unrolls at most 65536 iterations"
                );
                break;
            }
            let before = self.errors.len();
            self.exec(sc, &f.body, env);
            let var = Expr::Ident(f.step.0, f.step.1);
            self.proc_assign(sc, &var, &f.step.2, f.step.1, env);
            if self.errors.len() > before {
                break;
            }
        }
    }
}
