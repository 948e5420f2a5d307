//! Module instances inside a module: parameter overrides, the sub-module elaborated with
//! its hierarchical prefix, and its port connections (by name or by position; inputs
//! driven from the connected expression, outputs driving the connected nets).

use super::super::bits::extend;
use super::super::context::EvalContext;
use super::super::{Elaborator, Symbol};
use super::module::{elab_instance, OverrideTarget};
use crate::front::verilog::ast::{Conns, Dir, Expr, Instance};

impl<'a> Elaborator<'a> {
    /// Elaborate instance `inst` written in scope `scope`.
    pub(crate) fn instance(&mut self, scope: u32, inst: &'a Instance) {
        let m = match self.modules.get(&inst.module) {
            Some(m) => *m,
            None => {
                let n = self.name(inst.module);
                self.error(
                    inst.pos,
                    format!("unknown module `{n}`"),
                    "give the file that defines it on the command line",
                );
                return;
            }
        };
        let mname = self.name(m.name);
        let iname = self.name(inst.name);
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
        let prefix = format!("{}{}.", self.scopes[scope as usize].prefix, iname);
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
                                self.error(
                                    *p,
                                    format!("port `{}` is connected twice", self.name(*s)),
                                    "connect each port once"
                                );
                            }
                            seen[k] = true;
                            conn[k] = ex.as_ref();
                        }
                        None => self.error(
                            *p,
                            format!("module `{mname}` has no port `{}`", self.name(*s)),
                            "connect only ports the module declares; check the spelling and the module's header"
                        ),
                    }
                }
            }
            Conns::Ordered(v) => {
                if v.len() > m.ports.len() && !(v.len() == 1 && v[0].is_none()) {
                    self.error(
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
            let pn = self.name(*ps);
            let n = match self.scopes[child as usize].syms.get(ps) {
                Some(Symbol::Net(n)) => *n,
                _ => {
                    self.error(
                        inst.pos,
                        format!("port `{pn}` of module `{mname}` has no declaration"),
                        "declare the port `input` or `output` inside the module",
                    );
                    continue;
                }
            };
            let net = self.nets[n as usize].clone();
            let ex = match conn[k] {
                Some(ex) => ex,
                None => {
                    if net.dir == Some(Dir::Input) {
                        self.warn(
                            inst.pos,
                            format!("input port `{pn}` of instance `{iname}` is not connected"),
                        );
                    }
                    continue;
                }
            };
            let pw = net.width as usize;
            match net.dir {
                Some(Dir::Input) => {
                    let t = self.expr_type(&ctx, ex);
                    let v = self.eval(&ctx, ex, pw.max(t.width), t.signed);
                    if t.width != pw {
                        self.warn(ex.pos(), format!("port connection changes width: port `{pn}` of instance `{iname}` (module `{mname}`) is {pw} bits, the connected expression is {} bits", t.width));
                    }
                    for (off, &l) in v.iter().enumerate().take(pw) {
                        self.drive(n, off as u32, l, ex.pos());
                    }
                }
                Some(Dir::Output) => {
                    let t = match self.targets(&ctx, ex, false) {
                        Some(t) => t,
                        None => continue,
                    };
                    if t.len() != pw {
                        self.warn(ex.pos(), format!("port connection changes width: port `{pn}` of instance `{iname}` (module `{mname}`) is {pw} bits, the connected net is {} bits", t.len()));
                    }
                    let v = extend(self.net_bits(n), t.len().max(pw), net.signed);
                    for (j, (tn, off)) in t.into_iter().enumerate() {
                        if let Some(off) = off {
                            self.drive(tn, off, v[j], ex.pos());
                        }
                    }
                }
                None => self.error(
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
