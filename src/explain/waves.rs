//! From designs and input vectors to the variables and values of a Value Change Dump: one
//! scope per design named after it, its input and output ports (buses as vectors in their
//! declared bit order), optionally the internal nets of a set of output cones, and a
//! `compare` scope with the vector number and whether any output pair differs.

use super::nets::{cone_signals, net_values};
use super::vcd::{write_vcd, Bits, VcdScope, VcdVar};
use crate::design::{split_bit, Design};
use crate::engine::{Counterexample, Shared};

/// One port as a VCD variable: the design's bit positions, most significant first.
pub(super) struct Port {
    pub(super) var: VcdVar,
    pub(super) bits: Vec<usize>,
}

/// Group named bits (listed least significant bit first within a bus, as the readers list
/// them) into variables: a bus with consecutive indices becomes one vector.
pub(super) fn ports(names: &[&str]) -> Vec<Port> {
    let mut out: Vec<Port> = Vec::new();
    let mut i = 0;
    while i < names.len() {
        let (port, idx) = split_bit(names[i]);
        let mut j = i + 1;
        if idx.is_some() {
            while j < names.len()
                && split_bit(names[j]).0 == port
                && split_bit(names[j]).1.is_some()
            {
                j += 1;
            }
        }
        let idxs: Vec<i64> = (i..j).map(|k| split_bit(names[k]).1.unwrap_or(0)).collect();
        let step = if idxs.len() > 1 { idxs[1] - idxs[0] } else { 1 };
        let consecutive = step.abs() == 1 && idxs.windows(2).all(|w| w[1] - w[0] == step);
        match idx {
            Some(_) if consecutive => out.push(Port {
                var: VcdVar {
                    name: port.to_string(),
                    range: Some((idxs[idxs.len() - 1], idxs[0])),
                    width: j - i,
                },
                bits: (i..j).rev().collect(),
            }),
            _ => {
                for (k, name) in names.iter().enumerate().take(j).skip(i) {
                    out.push(Port {
                        var: VcdVar {
                            name: name.to_string(),
                            range: None,
                            width: 1,
                        },
                        bits: vec![k],
                    });
                }
            }
        }
        i = j;
    }
    out
}

/// Scope name: the design's name without folders and extension, word characters only.
pub fn scope_name(d: &Design) -> String {
    let base = d.name.rsplit(['/', '\\']).next().unwrap_or(&d.name);
    let base = base
        .strip_suffix(".bench")
        .or_else(|| base.strip_suffix(".v"))
        .unwrap_or(base);
    let s: String = base
        .chars()
        .map(|ch| {
            if ch.is_ascii_alphanumeric() || ch == '_' {
                ch
            } else {
                '_'
            }
        })
        .collect();
    if s.is_empty() || s.starts_with(|c: char| c.is_ascii_digit()) {
        format!("d_{s}")
    } else {
        s
    }
}

/// The scopes of two designs, distinct even when the designs have the same name.
pub fn scope_names(r: &Design, c: &Design) -> (String, String) {
    let (a, b) = (scope_name(r), scope_name(c));
    if a == b {
        (format!("{a}__reference"), format!("{b}__candidate"))
    } else {
        (a, b)
    }
}

/// One design's part of the dump.
struct Side<'d> {
    d: &'d Design,
    ins: Vec<Port>,
    outs: Vec<Port>,
    /// Internal nets shown (netlist signal numbers).
    nets: Vec<u32>,
}

impl<'d> Side<'d> {
    fn new(d: &'d Design, net_outputs: Option<&[usize]>) -> Side<'d> {
        let in_names: Vec<&str> = d.inputs.iter().map(|b| b.name.as_str()).collect();
        let out_names: Vec<&str> = d.outputs.iter().map(|b| b.name.as_str()).collect();
        let mut nets = Vec::new();
        if let (Some(outs), Some(nl)) = (net_outputs, &d.netlist) {
            if nl.outputs.len() == d.outputs.len() {
                let roots: Vec<u32> = outs.iter().map(|&o| nl.outputs[o]).collect();
                nets = cone_signals(nl, &roots)
                    .into_iter()
                    .filter(|&s| {
                        let n = nl.signals[s as usize].as_str();
                        d.input_index(n).is_none() && d.output_index(n).is_none()
                    })
                    .collect();
            }
        }
        Side {
            ins: ports(&in_names),
            outs: ports(&out_names),
            d,
            nets,
        }
    }

    fn scope(&self, name: String) -> VcdScope {
        let mut vars: Vec<VcdVar> = self
            .ins
            .iter()
            .chain(&self.outs)
            .map(|p| p.var.clone())
            .collect();
        if let Some(nl) = &self.d.netlist {
            for &s in &self.nets {
                vars.push(VcdVar {
                    name: nl.signals[s as usize].clone(),
                    range: None,
                    width: 1,
                });
            }
        }
        VcdScope::flat(name, vars)
    }

    /// The values of one vector (one value per design input), in variable order.
    fn values(&self, inputs: &[bool]) -> Vec<Bits> {
        let outs = self.d.eval(inputs);
        let mut v: Vec<Bits> = Vec::new();
        for p in &self.ins {
            v.push(p.bits.iter().map(|&k| Some(inputs[k])).collect());
        }
        for p in &self.outs {
            v.push(p.bits.iter().map(|&k| Some(outs[k])).collect());
        }
        if !self.nets.is_empty() {
            let nv = net_values(self.d, inputs);
            for &s in &self.nets {
                v.push(vec![nv.as_ref().and_then(|n| n[s as usize])]);
            }
        }
        v
    }
}

/// The dump of the counterexamples of a proof: both designs, one time step per vector.
/// With `nets`, the internal nets of the cones of every output that differs in some vector.
pub fn counterexample_vcd(
    r: &Design,
    c: &Design,
    shared: &Shared,
    cxs: &[Counterexample],
    nets: bool,
) -> String {
    let vectors: Vec<Vec<bool>> = cxs
        .iter()
        .map(|cx| cx.inputs.iter().map(|v| v.value).collect())
        .collect();
    let (rn, cn) = scope_names(r, c);
    let (mut rd, mut cd) = (Vec::new(), Vec::new());
    if nets {
        for cx in cxs {
            for d in &cx.differing {
                if let Some(i) = r.output_index(&d.reference) {
                    rd.push(i);
                }
                if let Some(i) = c.output_index(&d.candidate) {
                    cd.push(i);
                }
            }
        }
    }
    let rs = Side::new(r, nets.then_some(&rd[..]));
    let cs = Side::new(c, nets.then_some(&cd[..]));
    let scopes = vec![
        rs.scope(rn.clone()),
        cs.scope(cn.clone()),
        VcdScope::flat(
            "compare",
            vec![
                VcdVar {
                    name: "vector".into(),
                    range: Some((31, 0)),
                    width: 32,
                },
                VcdVar {
                    name: "differs".into(),
                    range: None,
                    width: 1,
                },
            ],
        ),
    ];
    let mut steps = Vec::new();
    for (t, v) in vectors.iter().enumerate() {
        let rv: Vec<bool> = shared.ref_input.iter().map(|&k| v[k]).collect();
        let cv: Vec<bool> = shared.cand_input.iter().map(|&k| v[k]).collect();
        let mut step = rs.values(&rv);
        step.extend(cs.values(&cv));
        let ro = r.eval(&rv);
        let co = c.eval(&cv);
        let differs = shared.pairs.iter().any(|&(a, b)| ro[a] != co[b]);
        step.push(
            (0..32)
                .rev()
                .map(|j| Some(((t + 1) >> j) & 1 == 1))
                .collect(),
        );
        step.push(vec![Some(differs)]);
        steps.push(step);
    }
    let comment = format!(
        "equicone counterexamples: reference {} (scope {rn}), candidate {} (scope {cn}); one time step per vector",
        r.name, c.name
    );
    write_vcd(&comment, &scopes, &steps)
}

/// The dump of one design under one vector (`eval --vcd`); with `nets`, every internal net of
/// its netlist.
pub fn design_vcd(d: &Design, inputs: &[bool], nets: bool) -> String {
    let all: Vec<usize> = (0..d.outputs.len()).collect();
    let side = Side::new(d, nets.then_some(&all[..]));
    let name = scope_name(d);
    let scopes = vec![side.scope(name.clone())];
    let steps = vec![side.values(inputs)];
    write_vcd(
        &format!(
            "equicone eval: design {} (scope {name}); one vector",
            d.name
        ),
        &scopes,
        &steps,
    )
}
