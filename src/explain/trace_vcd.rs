//! The Value Change Dump of a trace of clocked designs: one scope per design (named after it)
//! with its input and output ports and a nested `registers` scope with its register bits, and a
//! `trace` scope with `clock`, `reset`, the `cycle` number and `differs`.
//!
//! Time line (1 ns units): a reset step at time 0 (`reset` 1, reset ports at their active
//! value, the other inputs x, registers at their reset or initial values) with a clock edge at
//! 5; cycle k at time 10(k+1) (inputs applied, registers in the state of cycle k, outputs as the
//! trace reads them, `differs` whether an output pair differs), its clock edge at 10(k+1)+5
//! (`clock` 1 and the designs' clock ports 1; registers take their next values and the outputs
//! follow them); the dump closes at 10(n+1).

use super::trace_run::{run, DesignRun};
use super::vcd::{write_vcd_at, Bits, VcdScope, VcdVar};
use super::waves::{ports, scope_name, scope_names, Port};
use crate::design::{Design, InputKind};
use crate::seq::{Side, Trace};

/// The role of a design input in the dump.
#[derive(Copy, Clone, PartialEq, Eq)]
enum Role {
    Clock,
    /// A reset port; its active value.
    Reset(bool),
    Other,
}

/// One design's part of the dump.
struct Part<'d> {
    d: &'d Design,
    /// Non-register inputs, as variables.
    ins: Vec<Port>,
    outs: Vec<Port>,
    regs: Vec<Port>,
    /// Per design input.
    role: Vec<Role>,
    run: DesignRun,
}

impl<'d> Part<'d> {
    fn new(d: &'d Design, side: Side, t: &Trace) -> Result<Part<'d>, String> {
        let run = run(d, side, t)?;
        let in_idx: Vec<usize> = (0..d.inputs.len())
            .filter(|&k| !matches!(d.inputs[k].kind, InputKind::Register))
            .collect();
        let in_names: Vec<&str> = in_idx.iter().map(|&k| d.inputs[k].name.as_str()).collect();
        let mut ins = ports(&in_names);
        for p in &mut ins {
            for b in &mut p.bits {
                *b = in_idx[*b];
            }
        }
        let out_names: Vec<&str> = d.outputs.iter().map(|b| b.name.as_str()).collect();
        let reg_names: Vec<&str> = d.registers.iter().map(|r| r.name.as_str()).collect();
        let mut role = vec![Role::Other; d.inputs.len()];
        for h in &t.reset.held {
            if let Some(n) = h.name_on(side) {
                if let Some(k) = d.input_index(n) {
                    role[k] = if h.role == "clock" {
                        Role::Clock
                    } else {
                        Role::Reset(!h.value)
                    };
                }
            }
        }
        Ok(Part {
            d,
            ins,
            outs: ports(&out_names),
            regs: ports(&reg_names),
            role,
            run,
        })
    }

    fn scope(&self, name: String) -> VcdScope {
        let vars = self
            .ins
            .iter()
            .chain(&self.outs)
            .map(|p| p.var.clone())
            .collect();
        let mut s = VcdScope::flat(name, vars);
        if !self.regs.is_empty() {
            s.children.push(VcdScope::flat(
                "registers",
                self.regs.iter().map(|p| p.var.clone()).collect(),
            ));
        }
        s
    }

    /// Values from per-input values (None: x), outputs (None: x) and register values.
    fn values(&self, ins: &[Option<bool>], outs: Option<&[bool]>, state: &[bool]) -> Vec<Bits> {
        let mut v: Vec<Bits> = Vec::new();
        for p in &self.ins {
            v.push(p.bits.iter().map(|&k| ins[k]).collect());
        }
        for p in &self.outs {
            v.push(p.bits.iter().map(|&k| outs.map(|o| o[k])).collect());
        }
        for p in &self.regs {
            v.push(p.bits.iter().map(|&k| Some(state[k])).collect());
        }
        v
    }

    /// The reset step: reset ports active, clocks at `clock`, other inputs x.
    fn reset_step(&self, clock: bool) -> Vec<Bits> {
        let ins: Vec<Option<bool>> = self
            .role
            .iter()
            .map(|r| match r {
                Role::Clock => Some(clock),
                Role::Reset(active) => Some(*active),
                Role::Other => None,
            })
            .collect();
        self.values(&ins, None, &self.run.state(self.d, 0))
    }

    /// Cycle `k` before its clock edge, or just after it (`edge`).
    fn cycle_step(&self, k: usize, edge: bool) -> Vec<Bits> {
        let mut full = self.run.inputs[k].clone();
        for (i, r) in self.role.iter().enumerate() {
            if *r == Role::Clock {
                full[i] = edge;
            }
        }
        let state = self.run.state(self.d, k + edge as usize);
        for (r, &v) in self.d.registers.iter().zip(&state) {
            full[r.input] = v;
        }
        let outs = if edge {
            self.d.eval(&full)
        } else {
            self.run.outputs[k].clone()
        };
        let ins: Vec<Option<bool>> = full.iter().map(|&b| Some(b)).collect();
        self.values(&ins, Some(&outs), &state)
    }
}

fn trace_scope() -> VcdScope {
    let one = |n: &str| VcdVar {
        name: n.into(),
        range: None,
        width: 1,
    };
    VcdScope::flat(
        "trace",
        vec![
            one("clock"),
            one("reset"),
            VcdVar {
                name: "cycle".into(),
                range: Some((31, 0)),
                width: 32,
            },
            one("differs"),
        ],
    )
}

fn trace_values(
    clock: bool,
    reset: bool,
    cycle: Option<usize>,
    differs: Option<bool>,
) -> Vec<Bits> {
    vec![
        vec![Some(clock)],
        vec![Some(reset)],
        (0..32)
            .rev()
            .map(|j| cycle.map(|c| (c >> j) & 1 == 1))
            .collect(),
        vec![differs],
    ]
}

/// The dump of `parts` along a trace of `n` cycles; `differs(k)` for cycle k.
fn dump(
    comment: &str,
    parts: &[(&Part, String)],
    n: usize,
    differs: &dyn Fn(usize) -> Option<bool>,
) -> String {
    let mut scopes: Vec<VcdScope> = parts
        .iter()
        .map(|(p, name)| p.scope(name.clone()))
        .collect();
    scopes.push(trace_scope());
    let mut steps: Vec<(u64, Vec<Bits>)> = Vec::new();
    for clock in [false, true] {
        let mut step: Vec<Bits> = Vec::new();
        for (p, _) in parts {
            step.extend(p.reset_step(clock));
        }
        step.extend(trace_values(clock, true, None, None));
        steps.push((clock as u64 * 5, step));
    }
    for k in 0..n {
        for edge in [false, true] {
            let mut step: Vec<Bits> = Vec::new();
            for (p, _) in parts {
                step.extend(p.cycle_step(k, edge));
            }
            step.extend(trace_values(edge, false, Some(k), differs(k)));
            steps.push((10 * (k as u64 + 1) + 5 * edge as u64, step));
        }
    }
    let timed: Vec<(u64, &[Bits])> = steps.iter().map(|(t, s)| (*t, &s[..])).collect();
    write_vcd_at(comment, &scopes, &timed, 10 * (n as u64 + 1))
}

/// The dump of a trace on both designs (`prove --vcd` on clocked designs).
pub fn trace_vcd(r: &Design, c: &Design, t: &Trace) -> Result<String, String> {
    let (rn, cn) = scope_names(r, c);
    let rp = Part::new(r, Side::Reference, t)?;
    let cp = Part::new(c, Side::Candidate, t)?;
    let pairs = t.output_pairs(r, c);
    let differs = |k: usize| {
        Some(
            pairs
                .iter()
                .any(|&(i, j)| rp.run.outputs[k][i] != cp.run.outputs[k][j]),
        )
    };
    let comment = format!(
        "equicone trace: reference {} (scope {rn}), candidate {} (scope {cn}); reset step at 0, cycle k at 10(k+1) with its clock edge 5 later",
        r.name, c.name
    );
    Ok(dump(
        &comment,
        &[(&rp, rn), (&cp, cn)],
        t.cycles.len(),
        &differs,
    ))
}

/// The dump of one design along a trace (`eval --trace --vcd`).
pub fn design_trace_vcd(d: &Design, side: Side, t: &Trace) -> Result<String, String> {
    let name = scope_name(d);
    let p = Part::new(d, side, t)?;
    let comment = format!(
        "equicone eval: design {} (scope {name}) along a trace; reset step at 0, cycle k at 10(k+1) with its clock edge 5 later",
        d.name
    );
    Ok(dump(&comment, &[(&p, name)], t.cycles.len(), &|_| None))
}
