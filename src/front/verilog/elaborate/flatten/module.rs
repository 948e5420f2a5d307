//! Module bodies: the top module's choice, parameters (with per-instance overrides),
//! declarations, implicit nets, continuous assignments, gate primitives, and generate loops
//! and conditions. Sub-instances are in `instance.rs`, flattened with hierarchical names.

use super::super::bits::{self, extend};
use super::super::context::EvalContext;
use super::super::{span, Elaborator, GateRecord, Symbol, Value, MAX_HIER, MAX_LOOP};
use crate::aig::Lit;
use crate::design::CellKind;
use crate::front::verilog::ast::{
    Conns, Decl, Dir, Expr, GateKind, Instance, Item, Module, NetType, ParamDecl, Range,
};
use crate::front::verilog::pos::Pos;
use crate::front::verilog::symbols::Sym;
use std::collections::HashSet;

/// OverrideTarget parameter an override sets.
#[derive(Clone, Debug)]
pub enum OverrideTarget {
    /// By name.
    ByName(Sym),
    /// By position among the overridable parameters.
    ByPosition(usize),
    /// By name, from a `defparam` (wins over the other two).
    Defparam(Sym),
}

fn walk_instances<'m>(items: &'m [Item], out: &mut Vec<&'m Instance>) {
    // Generate nesting is bounded by the parser's depth limit.
    for it in items {
        match it {
            Item::Inst(i) => out.push(i),
            Item::GenFor(g) => walk_instances(&g.items, out),
            Item::GenIf(g) => {
                walk_instances(&g.1, out);
                walk_instances(&g.2, out);
            }
            _ => {}
        }
    }
}

/// Choose the top module: the one named, or the only one that no module instantiates.
pub fn pick_top<'a>(e: &mut Elaborator<'a>, top: Option<&str>) -> Option<&'a Module> {
    let list = e.flattening.module_list.clone();
    let names = e.core.names;
    let nopos = Pos::default();
    if list.is_empty() {
        let first = Pos {
            file: 0,
            line: 1,
            col: 1,
        };
        e.core.error(
            first,
            "no module found in the Verilog input",
            "a Verilog design needs at least one `module NAME(...); ... endmodule`",
        );
        return None;
    }
    if let Some(t) = top {
        if let Some(m) = list.iter().find(|m| names.name(m.name) == t) {
            return Some(m);
        }
        let all: Vec<&str> = list.iter().map(|m| names.name(m.name)).collect();
        let _ = nopos;
        e.core.errors.push(
            crate::diag::Diagnostic::error(None, format!("top module `{t}` not found"))
                .with_help(format!("modules read: {}", all.join(", "))),
        );
        return None;
    }
    let mut used = HashSet::new();
    for m in &list {
        let mut v = Vec::new();
        walk_instances(&m.items, &mut v);
        for i in v {
            if i.module != m.name {
                used.insert(i.module);
            }
        }
    }
    let cands: Vec<&Module> = list
        .iter()
        .copied()
        .filter(|m| !used.contains(&m.name))
        .collect();
    match cands.len() {
        1 => Some(cands[0]),
        0 => {
            let p = list.first().map_or(nopos, |m| m.pos);
            e.core.error(
                p,
                "no top module: every module is instantiated by another",
                "a module cannot contain itself; remove the instance that closes the cycle",
            );
            None
        }
        _ => {
            // The files after the first (`--also`, `--ref-also`, `--cand-also`) are libraries
            // whose cells nobody need instantiate: the first file's one uninstantiated module
            // is the top, and the choice is reported.
            let main: Vec<&Module> = cands.iter().copied().filter(|m| m.pos.file == 0).collect();
            if let [m] = main[..] {
                let others: Vec<&str> = cands
                    .iter()
                    .filter(|o| o.pos.file != 0)
                    .map(|o| names.name(o.name))
                    .collect();
                let file = e.core.files.first().map_or("", |f| &**f).to_string();
                let shown = if others.len() > 6 {
                    format!("{}, ... ({} modules)", others[..5].join(", "), others.len())
                } else {
                    others.join(", ")
                };
                e.core.warn(
                    m.pos,
                    format!(
                        "top module `{}` chosen: the one module of {file} that no module instantiates (not {shown} of the other files; name another with `--top NAME`, or `--ref-top`/`--cand-top` in `prove` and `cnf`)",
                        names.name(m.name)
                    ),
                );
                return Some(m);
            }
            let all: Vec<&str> = cands.iter().map(|m| names.name(m.name)).collect();
            let p = cands[1].pos;
            e.core.error(
                p,
                format!("several modules could be the top: {}", all.join(", ")),
                "name the top module with `--top NAME` (in `prove` and `cnf`: `--ref-top NAME` for the reference, `--cand-top NAME` for the candidate)",
            );
            None
        }
    }
}

/// Elaborate module `m` as an instance with hierarchical `prefix`; returns its scope.
pub fn elab_instance<'a>(
    e: &mut Elaborator<'a>,
    m: &'a Module,
    prefix: String,
    overrides: Vec<(OverrideTarget, Value, Pos)>,
    pos: Pos,
) -> u32 {
    let idx = e
        .flattening
        .module_list
        .iter()
        .position(|x| std::ptr::eq(*x, m))
        .unwrap_or(0) as u32;
    let scope = e.core.new_scope(None, prefix, idx);
    if e.flattening.path.contains(&m.name) {
        let n = e.core.name(m.name);
        e.core.error(
            pos,
            format!("recursive instantiation of module `{n}`"),
            "a module cannot contain itself, directly or through other modules; remove the instance",
        );
        return scope;
    }
    if e.flattening.path.len() >= MAX_HIER {
        e.core.error(
            pos,
            format!("instance hierarchy deeper than {} levels", MAX_HIER),
            "flatten part of the hierarchy; equicone reads at most 64 levels of instances",
        );
        return scope;
    }
    e.flattening.path.push(m.name);
    let mut ov = overrides;
    e.elab_items(scope, &m.items, m, Some(&mut ov), true);
    for (w, _, p) in ov {
        let mn = e.core.name(m.name);
        let (msg, help) = match w {
            OverrideTarget::ByName(s) => (
                format!("module `{mn}` has no parameter `{}`", e.core.name(s)),
                "override only parameters the module declares (not `localparam`); check the spelling",
            ),
            OverrideTarget::Defparam(s) => (
                format!("`defparam`: module `{mn}` has no parameter `{}`", e.core.name(s)),
                "set only parameters the module declares (not `localparam`); check the spelling",
            ),
            OverrideTarget::ByPosition(k) => (
                format!("module `{mn}` has fewer than {} parameters", k + 1),
                "give no more overrides than the module has parameters, or override by name (`#(.N(8))`)",
            ),
        };
        e.core.error(p, msg, help);
    }
    e.flattening.path.pop();
    scope
}

struct Merged<'m> {
    dir: Option<Dir>,
    ty: Option<NetType>,
    signed: bool,
    range: Option<&'m Range>,
    pos: Pos,
}

impl<'a> Elaborator<'a> {
    pub(crate) fn range_bounds(&mut self, scope: u32, r: &Range) -> Option<(i64, i64)> {
        let m = self.const_int(scope, &r.msb)?;
        let l = self.const_int(scope, &r.lsb)?;
        for (v, e) in [(m, &r.msb), (l, &r.lsb)] {
            if i32::try_from(v).is_err() {
                self.core.error(
                    e.pos(),
                    format!("range bound {v} is outside the 32-bit integers"),
                    "Verilog range bounds are integers (32 bits, signed); use smaller indices",
                );
                return None;
            }
        }
        if span(m, l).is_none() {
            self.core.error(
                r.msb.pos(),
                "range wider than 65536 bits",
                "equicone reads vectors of at most 65536 bits; split the vector",
            );
            return None;
        }
        Some((m, l))
    }

    fn param(
        &mut self,
        scope: u32,
        pd: &ParamDecl,
        overrides: &mut Option<&mut Vec<(OverrideTarget, Value, Pos)>>,
        nth: &mut usize,
    ) {
        for (name, pos, ex) in &pd.assigns {
            let mut val = None;
            if !pd.local {
                if let Some(ov) = overrides.as_deref_mut() {
                    let by_defparam = ov.iter().position(
                        |(w, _, _)| matches!(w, OverrideTarget::Defparam(s) if s == name),
                    );
                    if let Some(k) = by_defparam {
                        // A `defparam` wins over the instance's own values (IEEE 1364-2005
                        // clause 12.2.1, from memory); those are dropped.
                        val = Some(ov.remove(k).1);
                        ov.retain(|(w, _, _)| match w {
                            OverrideTarget::ByName(s) | OverrideTarget::Defparam(s) => s != name,
                            OverrideTarget::ByPosition(k) => *k != *nth,
                        });
                    } else if let Some(k) = ov.iter().position(|(w, _, _)| match w {
                        OverrideTarget::ByName(s) => s == name,
                        OverrideTarget::ByPosition(k) => *k == *nth,
                        OverrideTarget::Defparam(_) => false,
                    }) {
                        val = Some(ov.remove(k).1);
                    }
                }
                *nth += 1;
            }
            let v = match val.or_else(|| self.const_val(scope, ex)) {
                Some(v) => v,
                None => Value {
                    bits: vec![Lit::FALSE; 32],
                    signed: true,
                },
            };
            let (v, msb, lsb) = if pd.integer {
                (
                    Value {
                        bits: extend(v.bits, 32, v.signed),
                        signed: true,
                    },
                    31,
                    0,
                )
            } else if let Some(r) = &pd.range {
                match self.range_bounds(scope, r) {
                    Some((m, l)) => {
                        let w = span(m, l).unwrap_or(1);
                        (
                            Value {
                                bits: extend(v.bits, w, v.signed),
                                signed: pd.signed,
                            },
                            m,
                            l,
                        )
                    }
                    None => (v, 0, 0),
                }
            } else {
                let w = v.bits.len() as i64;
                (
                    Value {
                        bits: v.bits,
                        signed: v.signed || pd.signed,
                    },
                    w - 1,
                    0,
                )
            };
            if self.core.scopes[scope as usize].syms.contains_key(name) {
                let n = self.core.name(*name);
                self.core.error(
                    *pos,
                    format!("`{n}` is declared twice"),
                    "keep one declaration of the name (`output y; reg y;` may be split, but not repeated)",
                );
                continue;
            }
            self.core.scopes[scope as usize]
                .syms
                .insert(*name, Symbol::Param(Box::new((v, msb, lsb))));
        }
    }

    /// Elaborate the items of a module or generate block in scope `scope`.
    pub(crate) fn elab_items(
        &mut self,
        scope: u32,
        items: &'a [Item],
        m: &'a Module,
        mut overrides: Option<&mut Vec<(OverrideTarget, Value, Pos)>>,
        is_module: bool,
    ) {
        // Room for the nets and gates of the items (a flat netlist has a million of each).
        let (mut nnets, mut ngates) = (0, 0);
        for it in items {
            match it {
                Item::Decl(d) => nnets += d.names.len(),
                Item::Gate(..) => ngates += 1,
                _ => {}
            }
        }
        self.core.reserve(scope, nnets);
        self.flattening.gates.reserve(ngates);
        self.flattening.gate_ins.reserve(2 * ngates);
        self.declare_functions(scope, items);
        // A: parameters and genvars, in order.
        let mut nth = 0;
        for it in items {
            match it {
                Item::Param(pd) => self.param(scope, pd, &mut overrides, &mut nth),
                Item::Genvar(v) => {
                    for (s, _) in v {
                        self.core.scopes[scope as usize]
                            .syms
                            .insert(*s, Symbol::Genvar(None));
                    }
                }
                _ => {}
            }
        }
        // B: declarations, merged per name (`output y; reg y;`).
        let mut order: Vec<Sym> = Vec::with_capacity(nnets);
        let mut merged: crate::hash::FastMap<Sym, Merged> = Default::default();
        merged.reserve(nnets);
        let mut inits: Vec<(Sym, Pos, &Expr)> = Vec::new();
        for it in items {
            if let Item::Decl(d) = it {
                self.merge_decl(scope, d, &mut order, &mut merged, &mut inits);
            }
        }
        let ports: HashSet<Sym> = m.ports.iter().map(|p| p.0).collect();
        for s in order {
            let md = &merged[&s];
            let (msb, lsb, vector) = if md.ty == Some(NetType::Integer) {
                (31, 0, true)
            } else if let Some(r) = md.range {
                match self.range_bounds(scope, r) {
                    Some((a, b)) => (a, b, true),
                    None => (0, 0, false),
                }
            } else {
                (0, 0, false)
            };
            if md.dir.is_some() && (!is_module || !ports.contains(&s)) {
                let n = self.core.name(s);
                self.core.error(
                    md.pos,
                    format!("`{n}` is declared as a port but is not in the module's port list"),
                    "add it to the port list in the module header, or declare it `wire`",
                );
            }
            let signed = md.signed || md.ty == Some(NetType::Integer);
            self.core.add_net(
                scope,
                s,
                msb,
                lsb,
                vector,
                signed,
                md.ty.unwrap_or(NetType::Wire),
                md.dir,
                md.pos,
            );
        }
        // C: implicit one-bit wires for names first seen in a port, gate terminal or on the
        // left of a continuous assignment.
        if !m.nettype_none {
            let implicit = |e: &mut Self, ex: &Expr| {
                if let Expr::Ident(s, p) = ex {
                    if e.core.lookup(scope, *s).is_none() {
                        e.core
                            .add_net(scope, *s, 0, 0, false, false, NetType::Wire, None, *p);
                    }
                }
            };
            for it in items {
                match it {
                    Item::Gate(_, t, _) => t.iter().for_each(|ex| implicit(self, ex)),
                    Item::Assign(a, _) => implicit(self, &a.0),
                    Item::Inst(i) => match &i.conns {
                        Conns::Named(v) => v
                            .iter()
                            .filter_map(|c| c.2.as_ref())
                            .for_each(|ex| implicit(self, ex)),
                        Conns::Ordered(v) => v.iter().flatten().for_each(|ex| implicit(self, ex)),
                    },
                    _ => {}
                }
            }
        }
        // D: logic; first the `defparam`s, which wait for the instances they name.
        self.collect_defparams(scope, items);
        for (s, p, ex) in inits {
            self.cont_assign(scope, &Expr::Ident(s, p), ex, p);
        }
        let mut genblk = 0;
        for it in items {
            match it {
                Item::Assign(a, p) => self.cont_assign(scope, &a.0, &a.1, *p),
                Item::Gate(k, t, p) => self.gate(scope, *k, t, *p),
                Item::Inst(i) => self.instance(scope, i),
                Item::Always(b, p) => self.elab_always(scope, b, *p),
                Item::Initial(b, p) => self.elab_initial(scope, b, *p),
                Item::GenFor(g) => {
                    genblk += 1;
                    self.gen_for(scope, g, m, genblk);
                }
                Item::GenIf(g) => {
                    let (c, a, b) = &**g;
                    genblk += 1;
                    let cv = self
                        .const_val(scope, c)
                        .map(|v| v.bits.contains(&Lit::TRUE));
                    if let Some(cv) = cv {
                        let prefix =
                            format!("{}genblk{genblk}.", self.core.scopes[scope as usize].prefix);
                        let child = self.core.new_scope(
                            Some(scope),
                            prefix,
                            self.core.scopes[scope as usize].module,
                        );
                        self.elab_items(child, if cv { a } else { b }, m, None, false);
                    }
                }
                _ => {}
            }
        }
        self.flattening.unresolved_defparams(&mut self.core, scope);
    }

    fn merge_decl<'m>(
        &mut self,
        scope: u32,
        d: &'m Decl,
        order: &mut Vec<Sym>,
        merged: &mut crate::hash::FastMap<Sym, Merged<'m>>,
        inits: &mut Vec<(Sym, Pos, &'m Expr)>,
    ) {
        for (s, p, init) in &d.names {
            if let Some(e) = init {
                inits.push((*s, *p, e));
            }
            if self.core.scopes[scope as usize].syms.contains_key(s) {
                let n = self.core.name(*s);
                self.core.error(
                    *p,
                    format!("`{n}` is declared twice"),
                    "keep one declaration of the name (`output y; reg y;` may be split, but not repeated)",
                );
                continue;
            }
            match merged.get_mut(s) {
                None => {
                    order.push(*s);
                    merged.insert(
                        *s,
                        Merged {
                            dir: d.dir,
                            ty: d.ty,
                            signed: d.signed,
                            range: d.range.as_deref(),
                            pos: *p,
                        },
                    );
                }
                Some(md) => {
                    let n = self.core.name(*s);
                    let clash = (md.dir.is_some() && d.dir.is_some())
                        || (md.ty.is_some() && d.ty.is_some());
                    if clash {
                        self.core.error(
                            *p,
                            format!("`{n}` is declared twice"),
                            "keep one declaration of the name (`output y; reg y;` may be split, but not repeated)",
                        );
                        continue;
                    }
                    if let (Some(a), Some(b)) = (md.range, d.range.as_ref()) {
                        let ra = self.range_bounds(scope, a);
                        let rb = self.range_bounds(scope, b);
                        if ra != rb {
                            self.core.error(
                                *p,
                                format!("`{n}` is declared again with a different range"),
                                "give both declarations of the name the same range",
                            );
                        }
                    }
                    md.dir = md.dir.or(d.dir);
                    md.ty = md.ty.or(d.ty);
                    md.signed |= d.signed;
                    md.range = md.range.or(d.range.as_deref());
                }
            }
        }
    }

    /// `assign lhs = rhs;`
    pub(crate) fn cont_assign(&mut self, scope: u32, lhs: &Expr, rhs: &Expr, pos: Pos) {
        let ctx = EvalContext::new(scope);
        let t = match self.targets(&ctx, lhs, false) {
            Some(t) => t,
            None => return,
        };
        let ty = self.expr_type(&ctx, rhs);
        let w = t.len().max(ty.width);
        let v = self.eval(&ctx, rhs, w, ty.signed);
        for (k, (n, off)) in t.into_iter().enumerate() {
            if let Some(off) = off {
                self.core.drive(n, off, v[k], pos);
            }
        }
    }

    fn gate(&mut self, scope: u32, kind: GateKind, terms: &[Expr], pos: Pos) {
        if terms.len() < 2 {
            self.core.error(
                pos,
                "a gate needs an output and at least one input terminal",
                "write the output terminal first, then the inputs, e.g. `and g1 (y, a, b);`",
            );
            return;
        }
        let (outs, ins) = match kind {
            GateKind::Not | GateKind::Buf => terms.split_at(terms.len() - 1),
            _ => terms.split_at(1),
        };
        let ctx = EvalContext::new(scope);
        let mut lits = Vec::with_capacity(ins.len());
        for t in ins {
            // Plain one-bit net names (the common case in netlists) skip the width
            // computation and the bit vector.
            if let Expr::Ident(s, _) = t {
                if let Some(Symbol::Net(n)) = self.core.lookup(scope, *s) {
                    let net = &self.core.nets[*n as usize];
                    if net.width == 1 {
                        lits.push(self.core.aig.input_lit(net.first as usize));
                        continue;
                    }
                }
            }
            let v = self.eval_self(&ctx, t);
            if v.bits.len() != 1 {
                self.core.error(
                    t.pos(),
                    format!(
                        "gate terminal is {} bits wide; gate terminals must be 1 bit",
                        v.bits.len()
                    ),
                    "connect a one-bit net or a bit-select such as `a[3]`",
                );
            }
            lits.push(v.bits.first().copied().unwrap_or(Lit::FALSE));
        }
        let g = &mut self.core.aig;
        let (cell, out) = match kind {
            GateKind::And => (CellKind::And, g.and_all(&lits)),
            GateKind::Nand => (CellKind::Nand, !g.and_all(&lits)),
            GateKind::Or => (CellKind::Or, g.or_all(&lits)),
            GateKind::Nor => (CellKind::Nor, !g.or_all(&lits)),
            GateKind::Xor => (CellKind::Xor, g.xor_all(&lits)),
            GateKind::Xnor => (CellKind::Xnor, !g.xor_all(&lits)),
            GateKind::Not => (CellKind::Not, !lits[0]),
            GateKind::Buf => (CellKind::Buf, lits[0]),
        };
        let mut shared = None;
        for o in outs {
            // A plain name needs no target list.
            let (t, width) = match o {
                Expr::Ident(s, p) => match self.target_net(scope, *s, *p, false) {
                    Some(n) => ((n, Some(0)), self.core.nets[n as usize].width as usize),
                    None => continue,
                },
                _ => match self.targets(&ctx, o, false) {
                    Some(t) => (t.first().copied().unwrap_or((0, None)), t.len()),
                    None => continue,
                },
            };
            if width != 1 {
                self.core.error(
                    o.pos(),
                    format!(
                        "gate output terminal is {width} bits wide; gate terminals must be 1 bit"
                    ),
                    "connect a one-bit net or a bit-select such as `y[3]`",
                );
                continue;
            }
            if let (n, Some(off)) = t {
                self.core.drive(n, off, out, pos);
                let leaf = self.core.nets[n as usize].first + off;
                if shared.is_none() {
                    shared = Some(self.flattening.gate_ins.len() as u32);
                    self.flattening.gate_ins.extend_from_slice(&lits);
                }
                self.flattening.gates.push(GateRecord {
                    kind: cell,
                    count: lits.len() as u32,
                    first: shared.unwrap_or(0),
                    out: leaf,
                    pos,
                });
            }
        }
    }

    fn gen_for(
        &mut self,
        scope: u32,
        g: &'a crate::front::verilog::ast::GenFor,
        m: &'a Module,
        genblk: usize,
    ) {
        let var = g.init.0;
        if !matches!(self.core.lookup(scope, var), Some(Symbol::Genvar(_))) {
            let n = self.core.name(var);
            self.core.error(
                g.init.1,
                format!("loop variable `{n}` of a generate loop must be declared `genvar`"),
                format!("declare it first: `genvar {n};`"),
            );
            return;
        }
        let mut v = match self.const_int(scope, &g.init.2) {
            Some(v) => v,
            None => return,
        };
        let blk = match g.name {
            Some(n) => self.core.name(n).to_string(),
            None => format!("genblk{genblk}"),
        };
        let mut count = 0;
        loop {
            let prefix = format!("{}{blk}[{v}].", self.core.scopes[scope as usize].prefix);
            let child =
                self.core
                    .new_scope(Some(scope), prefix, self.core.scopes[scope as usize].module);
            let gv = Value {
                bits: bits::constant(v, 32),
                signed: true,
            };
            self.core.scopes[child as usize]
                .syms
                .insert(var, Symbol::Genvar(Some(Box::new(gv))));
            let c = match self.const_val(child, &g.cond) {
                Some(c) => c.bits.contains(&Lit::TRUE),
                None => return,
            };
            if !c {
                return;
            }
            count += 1;
            if count > MAX_LOOP {
                self.core.error(
                    g.pos,
                    format!(
                        "generate loop runs more than {} iterations",
                        MAX_LOOP
                    ),
                    "check the loop's condition and step; equicone unrolls at most 65536 iterations"
                );
                return;
            }
            let before = self.core.errors.len();
            self.elab_items(child, &g.items, m, None, false);
            v = match self.const_int(child, &g.step.2) {
                Some(nv) => nv,
                None => return,
            };
            if self.core.errors.len() > before + 20 {
                return;
            }
        }
    }
}
