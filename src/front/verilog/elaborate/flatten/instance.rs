//! Module instances inside a module: parameter overrides (with the `defparam`s that name
//! the instance), the sub-module elaborated with its hierarchical prefix, and its port
//! connections (by name or by position; inputs driven from the connected expression,
//! outputs driving the connected nets). An array of instances `u[3:0]` (IEEE 1364-2005
//! clause 12.1.2) is one instance per index, named `u[3]` ... `u[0]`; a connection as wide
//! as the port goes to every instance, one as wide as all their ports together is split,
//! the instance of the right-hand index of the range taking the least significant bits.

use super::super::bits::extend;
use super::super::context::EvalContext;
use super::super::{span, Elaborator, Symbol};
use super::module::{elab_instance, OverrideTarget};
use crate::aig::Lit;
use crate::front::verilog::ast::{Conns, Dir, Expr, Instance, Module};

/// The connections of an array of instances, evaluated once for all of them (by port):
/// `None` before the first instance, `Some(None)` after an error.
type ArrayConns = Vec<Option<Option<Vec<Lit>>>>;
type ArrayTargets = Vec<Option<Option<Vec<(u32, Option<u32>)>>>>;

impl<'a> Elaborator<'a> {
    /// Elaborate instance `inst` written in scope `scope`.
    pub(crate) fn instance(&mut self, scope: u32, inst: &'a Instance) {
        let m = match self.flattening.modules.get(&inst.module) {
            Some(m) => *m,
            None => {
                let n = self.core.name(inst.module);
                self.core.error(
                    inst.pos,
                    format!("unknown module `{n}`"),
                    "give the file that defines it on the command line",
                );
                return;
            }
        };
        let iname = self.core.name(inst.name);
        let mut overrides = Vec::new();
        match &inst.params {
            Some(Conns::Named(v)) => {
                for (s, p, ex) in v {
                    if let Some(ex) = ex {
                        if let Some(val) = self.const_val(scope, ex) {
                            overrides.push((OverrideTarget::ByName(*s), val, *p));
                        }
                    }
                }
            }
            Some(Conns::Ordered(v)) => {
                for (k, ex) in v.iter().enumerate() {
                    if let Some(ex) = ex {
                        if let Some(val) = self.const_val(scope, ex) {
                            overrides.push((OverrideTarget::ByPosition(k), val, ex.pos()));
                        }
                    }
                }
            }
            None => {}
        }
        let Some(r) = &inst.array else {
            return self.instance_one(scope, inst, m, iname.to_string(), overrides, None);
        };
        let Some((a, b)) = self.range_bounds(scope, r) else {
            return;
        };
        let count = span(a, b).unwrap_or(1);
        let mut ins: ArrayConns = vec![None; m.ports.len()];
        let mut outs: ArrayTargets = vec![None; m.ports.len()];
        let step = if a >= b { -1 } else { 1 };
        for k in 0..count as i64 {
            let i = a + k * step;
            // Position from the right-hand index: its slice of a split connection.
            let slot = (i - b).unsigned_abs() as usize;
            let arr = ArrayCtx {
                slot,
                count,
                ins: &mut ins,
                outs: &mut outs,
            };
            self.instance_one(
                scope,
                inst,
                m,
                format!("{iname}[{i}]"),
                overrides.clone(),
                Some(arr),
            );
        }
    }

    /// One instance (of an array: `arr` says which) named `iname` in scope `scope`.
    fn instance_one(
        &mut self,
        scope: u32,
        inst: &'a Instance,
        m: &'a Module,
        iname: String,
        mut overrides: Vec<(
            super::module::OverrideTarget,
            super::super::Value,
            crate::front::verilog::pos::Pos,
        )>,
        mut arr: Option<ArrayCtx>,
    ) {
        let mname = self.core.name(m.name);
        let iname = iname.as_str();
        let prefix = format!("{}{}.", self.core.scopes[scope as usize].prefix, iname);
        overrides.extend(self.flattening.take_defparams(&prefix));
        let child = elab_instance(self, m, prefix, overrides, inst.pos);
        // Connections by port index.
        let mut conn: Vec<Option<&Expr>> = vec![None; m.ports.len()];
        let mut seen = vec![false; m.ports.len()];
        match &inst.conns {
            Conns::Named(v) => {
                for (s, p, ex) in v {
                    match m.ports.iter().position(|q| q.0 == *s) {
                        Some(k) => {
                            if seen[k] {
                                self.core.error(
                                    *p,
                                    format!("port `{}` is connected twice", self.core.name(*s)),
                                    "connect each port once"
                                );
                            }
                            seen[k] = true;
                            conn[k] = ex.as_ref();
                        }
                        None => self.core.error(
                            *p,
                            format!("module `{mname}` has no port `{}`", self.core.name(*s)),
                            "connect only ports the module declares; check the spelling and the module's header"
                        ),
                    }
                }
            }
            Conns::Ordered(v) => {
                if v.len() > m.ports.len() && !(v.len() == 1 && v[0].is_none()) {
                    self.core.error(
                        inst.pos,
                        format!("instance `{iname}` has {} connections but module `{mname}` has {} ports", v.len(), m.ports.len()),
                        "give at most one connection per port, in the order of the module's port list, or connect by name (`.a(x)`)",
                    );
                }
                for (k, ex) in v.iter().enumerate().take(m.ports.len()) {
                    conn[k] = ex.as_ref();
                    seen[k] = true;
                }
            }
        }
        let ctx = EvalContext::new(scope);
        for (k, (ps, _)) in m.ports.iter().enumerate() {
            let pn = self.core.name(*ps);
            let n = match self.core.scopes[child as usize].syms.get(ps) {
                Some(Symbol::Net(n)) => *n,
                _ => {
                    self.core.error(
                        inst.pos,
                        format!("port `{pn}` of module `{mname}` has no declaration"),
                        "declare the port `input` or `output` inside the module",
                    );
                    continue;
                }
            };
            let net = self.core.nets[n as usize].clone();
            let ex = match conn[k] {
                Some(ex) => ex,
                None => {
                    if net.dir == Some(Dir::Input) {
                        self.core.warn(
                            inst.pos,
                            format!("input port `{pn}` of instance `{iname}` is not connected"),
                        );
                    }
                    continue;
                }
            };
            let pw = net.width as usize;
            match net.dir {
                Some(Dir::Input) if arr.is_some() => {
                    let a = arr.as_mut().expect("checked");
                    if a.ins[k].is_none() {
                        let t = self.expr_type(&ctx, ex);
                        let ok = self.array_width(inst, m, k, t.width, pw, a.count);
                        a.ins[k] = Some(ok.then(|| self.eval(&ctx, ex, pw.max(t.width), t.signed)));
                    }
                    let v = match &a.ins[k] {
                        Some(Some(v)) => {
                            let first = if v.len() >= pw * a.count && a.count > 1 {
                                a.slot * pw
                            } else {
                                0
                            };
                            v[first..first + pw].to_vec()
                        }
                        // Reported once; a placeholder avoids "not connected" follow-ons.
                        _ => vec![Lit::FALSE; pw],
                    };
                    for (off, &l) in v.iter().enumerate() {
                        self.core.drive(n, off as u32, l, ex.pos());
                    }
                }
                Some(Dir::Output) if arr.is_some() => {
                    let a = arr.as_mut().expect("checked");
                    if a.outs[k].is_none() {
                        let t = self.targets(&ctx, ex, false);
                        let ok = t
                            .as_ref()
                            .is_some_and(|t| self.array_width(inst, m, k, t.len(), pw, a.count));
                        a.outs[k] = Some(if ok { t } else { None });
                    }
                    if let Some(Some(t)) = &a.outs[k] {
                        let first = if t.len() >= pw * a.count && a.count > 1 {
                            a.slot * pw
                        } else {
                            0
                        };
                        let t = t[first..first + pw].to_vec();
                        let v = self.core.net_bits(n);
                        for (j, (tn, off)) in t.into_iter().enumerate() {
                            if let Some(off) = off {
                                self.core.drive(tn, off, v[j], ex.pos());
                            }
                        }
                    }
                }
                Some(Dir::Input) => {
                    let t = self.expr_type(&ctx, ex);
                    let v = self.eval(&ctx, ex, pw.max(t.width), t.signed);
                    if t.width != pw {
                        self.core.warn(ex.pos(), format!("port connection changes width: port `{pn}` of instance `{iname}` (module `{mname}`) is {pw} bits, the connected expression is {} bits", t.width));
                    }
                    for (off, &l) in v.iter().enumerate().take(pw) {
                        self.core.drive(n, off as u32, l, ex.pos());
                    }
                }
                Some(Dir::Output) => {
                    let t = match self.targets(&ctx, ex, false) {
                        Some(t) => t,
                        None => continue,
                    };
                    if t.len() != pw {
                        self.core.warn(ex.pos(), format!("port connection changes width: port `{pn}` of instance `{iname}` (module `{mname}`) is {pw} bits, the connected net is {} bits", t.len()));
                    }
                    let v = extend(self.core.net_bits(n), t.len().max(pw), net.signed);
                    for (j, (tn, off)) in t.into_iter().enumerate() {
                        if let Some(off) = off {
                            self.core.drive(tn, off, v[j], ex.pos());
                        }
                    }
                }
                None => self.core.error(
                    net.pos,
                    format!(
                        "port `{pn}` of module `{mname}` has no `input` or `output` declaration"
                    ),
                    "declare the port `input` or `output` inside the module",
                ),
            }
        }
    }
}

/// Which instance of an array is elaborated, and the connections shared by all of them.
struct ArrayCtx<'c> {
    slot: usize,
    count: usize,
    ins: &'c mut ArrayConns,
    outs: &'c mut ArrayTargets,
}

impl Elaborator<'_> {
    /// Whether a connection of `width` bits fits port `k` (`pw` bits) of an array of `count`
    /// instances: `pw` (every instance) or `pw * count` (split); an error otherwise.
    fn array_width(
        &mut self,
        inst: &Instance,
        m: &Module,
        k: usize,
        width: usize,
        pw: usize,
        count: usize,
    ) -> bool {
        if width == pw || width == pw * count {
            return true;
        }
        let pn = self.core.name(m.ports[k].0);
        let iname = self.core.name(inst.name);
        self.core.error(
            inst.pos,
            format!("port `{pn}` of the array of instances `{iname}` ({count} instances) is connected to {width} bits; the port is {pw} bits"),
            format!("connect {pw} bits (the same to every instance) or {} bits (split, the instance of the range's right-hand index taking the least significant bits; IEEE 1364-2005 clause 12.1.2)", pw * count),
        );
        false
    }
}
