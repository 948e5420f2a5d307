//! Calls of functions declared in the design (IEEE 1364-2005 clause 10.4.2): each call
//! runs the function's body symbolically like a combinational always block (`always.rs`),
//! in a fresh scope whose inputs are bound to the argument bits; the value of the
//! function's name at the end is the call's value. Variables other than the inputs start
//! unknown (as an `automatic` function's do); recursion and assignments to variables outside
//! the function are refused.

use super::super::context::{BitState, EvalContext};
use super::super::expr::ExprType;
use super::super::{span, Elaborator, Sym, Symbol, Value};
use super::clocked::NON_BLOCKING;
use crate::aig::Lit;
use crate::front::verilog::ast::{Dir, Expr, Item, NetType};
use crate::front::verilog::pos::Pos;

/// Deepest nesting of function calls (a function calling a function ...).
const MAX_CALL_DEPTH: usize = 64;

impl<'a> Elaborator<'a> {
    /// Declare the functions among `items` in `scope` (before the parameters, which may call
    /// them).
    pub(crate) fn declare_functions(&mut self, scope: u32, items: &'a [Item]) {
        for it in items {
            if let Item::Function(f) = it {
                if self.core.scopes[scope as usize].syms.contains_key(&f.name) {
                    let n = self.core.name(f.name);
                    self.core.error(
                        f.pos,
                        format!("function `{n}` is declared twice"),
                        "give each function of a module its own name",
                    );
                    continue;
                }
                let id = self.lowering.funcs.len() as u32;
                self.lowering.funcs.push((f, scope));
                self.core.scopes[scope as usize]
                    .syms
                    .insert(f.name, Symbol::Func(id));
            }
        }
    }

    /// The function `sym` names in `scope`; reported when it names something else.
    fn function_of(&mut self, scope: u32, sym: Sym, pos: Pos) -> Option<u32> {
        let name = self.core.name(sym);
        if self
            .lowering
            .calls
            .iter()
            .any(|&c| self.lowering.funcs[c as usize].0.name == sym)
        {
            self.core.error(
                pos,
                format!("unsupported: recursive call of function `{name}`"),
                "write the recursion as a `for` loop with constant bounds",
            );
            return None;
        }
        match self.core.lookup(scope, sym) {
            Some(Symbol::Func(id)) => Some(*id),
            Some(_) => {
                self.core.error(
                    pos,
                    format!("`{name}` is called but is not a function"),
                    "call a function declared with `function ... endfunction` in this module",
                );
                None
            }
            None => {
                self.core.error(
                    pos,
                    format!("undeclared function `{name}`"),
                    "declare it with `function ... endfunction` in this module (functions of packages and tasks are not read)",
                );
                None
            }
        }
    }

    /// Result bounds, signedness and variable type of function `id`.
    fn result_shape(&mut self, id: u32) -> (i64, i64, bool, NetType) {
        let (f, dscope) = self.lowering.funcs[id as usize];
        let ty = f.ret.ty.unwrap_or(NetType::Reg);
        if ty == NetType::Integer {
            return (31, 0, true, ty);
        }
        let (m, l) = match &f.ret.range {
            Some(r) => self.range_bounds(dscope, r).unwrap_or((0, 0)),
            None => (0, 0),
        };
        (m, l, f.ret.signed, ty)
    }

    /// The self-determined type of a call of `sym` (its result's), without running it.
    pub(crate) fn call_type(&mut self, scope: u32, sym: Sym) -> ExprType {
        match self.core.lookup(scope, sym) {
            Some(Symbol::Func(id)) => {
                let (m, l, signed, _) = self.result_shape(*id);
                ExprType {
                    width: span(m, l).unwrap_or(1),
                    signed,
                }
            }
            _ => ExprType {
                width: 1,
                signed: false,
            },
        }
    }

    /// Evaluate a call of a declared function (self-determined); `None` after an error.
    pub(crate) fn call_function(
        &mut self,
        ctx: &EvalContext,
        sym: Sym,
        pos: Pos,
        args: &[Expr],
    ) -> Option<Value> {
        let id = self.function_of(ctx.scope, sym, pos)?;
        let (f, dscope) = self.lowering.funcs[id as usize];
        let fname = self.core.name(sym);
        if self.lowering.calls.len() >= MAX_CALL_DEPTH {
            self.core.error(
                pos,
                format!("function calls nested deeper than {MAX_CALL_DEPTH} levels"),
                "call fewer functions inside one another",
            );
            return None;
        }
        let before = self.core.errors.len();
        let prefix = format!("{}{fname}.", self.core.scopes[dscope as usize].prefix);
        let module = self.core.scopes[dscope as usize].module;
        let fscope = self.core.new_scope(Some(dscope), prefix, module);
        let (m, l, signed, ty) = self.result_shape(id);
        let vector = f.ret.range.is_some() || ty == NetType::Integer;
        let ret = self
            .core
            .add_net(fscope, f.name, m, l, vector, signed, ty, None, f.pos);
        let mut locals = vec![ret];
        let mut inputs = Vec::new();
        for d in &f.decls {
            let ty = match d.ty {
                None | Some(NetType::Wire) => NetType::Reg,
                Some(t) => t,
            };
            let (m, l, vector) = if ty == NetType::Integer {
                (31, 0, true)
            } else if let Some(r) = &d.range {
                match self.range_bounds(fscope, r) {
                    Some((a, b)) => (a, b, true),
                    None => (0, 0, false),
                }
            } else {
                (0, 0, false)
            };
            let signed = d.signed || ty == NetType::Integer;
            for (n, p, _) in &d.names {
                if self.core.scopes[fscope as usize].syms.contains_key(n) {
                    let nm = self.core.name(*n);
                    self.core.error(
                        *p,
                        format!("`{nm}` is declared twice in function `{fname}`"),
                        "give each argument and variable of a function its own name",
                    );
                    continue;
                }
                let net = self
                    .core
                    .add_net(fscope, *n, m, l, vector, signed, ty, d.dir, *p);
                if d.dir == Some(Dir::Input) {
                    inputs.push(net);
                } else {
                    locals.push(net);
                }
            }
        }
        if self.core.errors.len() > before {
            return None;
        }
        if args.len() != inputs.len() {
            let (want, got) = (inputs.len(), args.len());
            self.core.error(
                pos,
                format!("function `{fname}` takes {want} argument(s), this call gives {got}"),
                "give one argument per `input` of the function, in their order",
            );
            return None;
        }
        let outside = ctx.env.cloned().unwrap_or_default();
        let mut env = outside.clone();
        // Arguments: assigned to the inputs (sized as assignments, IEEE 1364-2005 10.4.2).
        for (a, &n) in args.iter().zip(&inputs) {
            let w = self.core.nets[n as usize].width as usize;
            let t = self.expr_type(ctx, a);
            let mut v = self.eval(ctx, a, w.max(t.width), t.signed);
            v.truncate(w);
            env.vars
                .insert(n, v.into_iter().map(BitState::Set).collect());
        }
        for &n in &locals {
            let net = &self.core.nets[n as usize];
            let (w, p, nm) = (net.width as usize, net.pos, self.core.name(net.name));
            let what = format!("initial value of `{nm}` in function `{fname}`");
            let u = self.core.unknown_bits(w, p, &what, fscope);
            env.vars
                .insert(n, u.into_iter().map(BitState::Set).collect());
        }
        self.lowering.calls.push(id);
        self.exec(fscope, &f.body, &mut env);
        self.lowering.calls.pop();
        // No side effects: the variables outside the function keep their values.
        let changed = env.vars.iter().find(|(n, st)| {
            let net = &self.core.nets[(**n & !NON_BLOCKING) as usize];
            net.scope != fscope && outside.vars.get(n) != Some(st)
        });
        if let Some((n, _)) = changed {
            let nm = self.core.net_name(*n & !NON_BLOCKING);
            self.core.error(
                pos,
                format!("unsupported: function `{fname}` assigns `{nm}`, which is not its own variable"),
                "let the function assign only its name and its own variables, and assign the result at the call",
            );
            return None;
        }
        let w = self.core.nets[ret as usize].width as usize;
        let bits = (0..w)
            .map(|k| env.bit(ret, k).unwrap_or(Lit::FALSE))
            .collect();
        Some(Value { bits, signed })
    }
}
