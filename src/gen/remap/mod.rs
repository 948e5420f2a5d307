//! `gen remap`: rewrite any design into K-input lookup functions over a cut cover of its AIG,
//! each written as an irredundant sum of products (or the complement of one, whichever has
//! fewer literals), so the result computes the same function with almost no internal node in
//! common with the source: a benchmark for proving restructured logic.

pub(crate) mod cuts;
pub mod isop;

use super::emit::{is_identifier, Circuit, Net, Op};
use super::fold::{Fold, Sig};
use super::GenError;
use crate::aig::{Lit, Node};
use crate::design::Design;
use std::collections::BTreeMap;

/// Figures of one remap.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct RemapStats {
    /// Lookup functions written.
    pub luts: usize,
    /// Product terms written (all lookup functions).
    pub cubes: usize,
    /// Lookup functions written as the complement of a sum of products.
    pub complemented: usize,
}

/// The remap of `design` into `k`-input lookup functions (2 <= k <= 6).
pub fn remap(design: &Design, k: usize, module: &str) -> Result<(Circuit, RemapStats), GenError> {
    if !(2..=6).contains(&k) {
        return Err(GenError::new(
            format!("--k {k} is out of range for remap"),
            "give --k between 2 and 6 (inputs per lookup function)",
        ));
    }
    if let Some(u) = design.inputs.iter().find(|b| b.is_unknown()) {
        return Err(GenError::new(
            format!(
                "{} reads an unknown value ({}); remap keeps the ports only",
                design.name, u.name
            ),
            "remove the x/z values or out-of-range selects from the design first",
        ));
    }
    let mut c = Circuit::new(module);
    let inputs = declare_inputs(&mut c, design);
    let prefix = wire_prefix(design);
    let aig = &design.aig;
    let roots: Vec<Lit> = design.outputs.iter().map(|o| o.lit).collect();
    let cover = cuts::cover(aig, &roots, k);
    let mut net: Vec<Option<Sig>> = vec![None; aig.len()];
    for (i, &x) in aig.inputs().iter().enumerate() {
        net[x as usize] = Some(Sig::Net(inputs[i]));
    }
    let mut scratch = vec![None; aig.len()];
    let mut stats = RemapStats {
        luts: 0,
        cubes: 0,
        complemented: 0,
    };
    let mut f = Fold::new(&mut c, &format!("{prefix}x"));
    for &x in &cover.order {
        let leaves = cover.leaves[x as usize]
            .as_ref()
            .expect("cover node has leaves");
        let t = cuts::table(aig, x, leaves, &mut scratch);
        let leaf_sigs: Vec<Sig> = leaves
            .iter()
            .map(|&l| net[l as usize].expect("leaves come first"))
            .collect();
        net[x as usize] = Some(write_lut(
            &mut f,
            t,
            &leaf_sigs,
            &format!("{prefix}{x}"),
            &mut stats,
        ));
    }
    let lit_sig = |f: &mut Fold, l: Lit| -> Sig {
        let s = match aig.node(l.node()) {
            Node::Const => Sig::Zero,
            _ => net[l.index()].expect("output cone is covered"),
        };
        if l.is_complemented() {
            f.not(s)
        } else {
            s
        }
    };
    let mut ports: BTreeMap<usize, Vec<(usize, Net)>> = BTreeMap::new();
    let groups = group(design.outputs.iter().map(|o| (&o.port, o.index, &o.name)));
    for (p, (_, bits)) in groups.iter().enumerate() {
        for &(pos, o) in bits {
            let s = lit_sig(&mut f, design.outputs[o].lit);
            let n = f.net(s);
            ports.entry(p).or_default().push((pos, n));
        }
    }
    drop(f);
    for (p, (name, bits)) in groups.iter().enumerate() {
        let mut nets = ports.remove(&p).unwrap_or_default();
        nets.sort();
        let nets: Vec<Net> = nets.into_iter().map(|(_, n)| n).collect();
        match name {
            PortName::Bus(n) => c.output(n, &nets),
            PortName::Scalar(n) => c.output_scalar(n, nets[0]),
        }
        let _ = bits;
    }
    c.prune();
    c.notes = vec![
        format!(
            "remap of {} into {k}-input lookup functions, each an irredundant sum of products",
            design.name
        ),
        format!(
            "{} lookup functions, {} product terms, {} written as a complemented sum",
            stats.luts, stats.cubes, stats.complemented
        ),
    ];
    Ok((c, stats))
}

/// Write the lookup function `t` over `leaves` as a sum of products (or the complement of one).
fn write_lut(f: &mut Fold, t: u64, leaves: &[Sig], name: &str, stats: &mut RemapStats) -> Sig {
    let mask = if leaves.len() == 6 {
        !0
    } else {
        (1u64 << (1 << leaves.len())) - 1
    };
    let t = t & mask;
    if t == 0 {
        return Sig::Zero;
    }
    if t == mask {
        return Sig::One;
    }
    // Tables of fewer than six leaves repeat; the ISOP works on the full 64-bit form.
    let full = |t: u64| {
        let mut w = t;
        let mut span = 1usize << leaves.len();
        while span < 64 {
            w |= w << span;
            span *= 2;
        }
        w
    };
    let pos = isop::isop(full(t));
    let neg = isop::isop(full(!t & mask));
    let lits = |cs: &[isop::Cube]| cs.iter().map(|c| c.len()).sum::<usize>() + cs.len();
    let complement = lits(&neg) + 1 < lits(&pos);
    let cubes = if complement { neg } else { pos };
    stats.luts += 1;
    stats.cubes += cubes.len();
    stats.complemented += complement as usize;
    let mut terms: Vec<Net> = Vec::with_capacity(cubes.len());
    let mut single: Option<Sig> = None;
    for (j, cube) in cubes.iter().enumerate() {
        let mut ins = Vec::with_capacity(cube.len());
        for (i, &leaf) in leaves.iter().enumerate() {
            if cube.mask >> i & 1 == 1 {
                let l = if cube.pos >> i & 1 == 1 {
                    leaf
                } else {
                    f.not(leaf)
                };
                ins.push(l);
            }
        }
        let term = if ins.len() == 1 {
            ins[0]
        } else {
            let nets: Vec<Net> = ins.iter().map(|&s| f.net(s)).collect();
            Sig::Net(f.c.gate(Op::And, nets, format!("{name}_{j}")))
        };
        if cubes.len() == 1 {
            single = Some(term);
        } else {
            terms.push(f.net(term));
        }
    }
    match (single, complement) {
        (Some(s), false) => s,
        (Some(s), true) => f.not(s),
        (None, c) => {
            let op = if c { Op::Nor } else { Op::Or };
            Sig::Net(f.c.gate(op, terms, name.to_string()))
        }
    }
}

/// A port of the remapped circuit.
enum PortName {
    /// Bits `name[0]` .. `name[w-1]`.
    Bus(String),
    /// One bit named exactly so.
    Scalar(String),
}

/// Group bits `(port, index, full name)` into ports: a port whose indices are exactly 0..w-1
/// becomes a bus; any other bit becomes a scalar port of its full name. Each port lists
/// (position in the port, bit number in the input list).
fn group<'a>(
    bits: impl Iterator<Item = (&'a String, Option<i64>, &'a String)>,
) -> Vec<(PortName, Vec<(usize, usize)>)> {
    let bits: Vec<_> = bits.collect();
    let mut by_port: BTreeMap<&str, Vec<(i64, usize)>> = BTreeMap::new();
    let mut order: Vec<&str> = Vec::new();
    for (k, (port, index, _)) in bits.iter().enumerate() {
        let e = by_port.entry(port.as_str()).or_default();
        if e.is_empty() {
            order.push(port.as_str());
        }
        e.push((index.unwrap_or(-1), k));
    }
    let mut out = Vec::new();
    for port in order {
        let list = &by_port[port];
        let mut idx: Vec<i64> = list.iter().map(|x| x.0).collect();
        idx.sort_unstable();
        let bus = idx.iter().enumerate().all(|(i, &x)| x == i as i64);
        if bus {
            out.push((
                PortName::Bus(port.to_string()),
                list.iter().map(|&(i, k)| (i as usize, k)).collect(),
            ));
        } else {
            for &(_, k) in list {
                let name = bits[k].2;
                if list.len() == 1 && bits[k].1.is_none() {
                    out.push((PortName::Scalar(port.to_string()), vec![(0, k)]));
                } else {
                    out.push((PortName::Scalar(name.clone()), vec![(0, k)]));
                }
            }
        }
    }
    out
}

/// Declare the design's inputs as ports; the net of each input bit, in the design's order.
fn declare_inputs(c: &mut Circuit, design: &Design) -> Vec<Net> {
    let mut nets = vec![None; design.inputs.len()];
    for (name, bits) in group(design.inputs.iter().map(|b| (&b.port, b.index, &b.name))) {
        match name {
            PortName::Bus(n) => {
                let ns = c.input(&n, bits.len());
                for (pos, k) in bits {
                    nets[k] = Some(ns[pos]);
                }
            }
            PortName::Scalar(n) => nets[bits[0].1] = Some(c.input_scalar(&n)),
        }
    }
    nets.into_iter()
        .map(|n| n.expect("every input declared"))
        .collect()
}

/// A wire-name prefix no port name starts with.
fn wire_prefix(design: &Design) -> String {
    let names: Vec<&str> = design
        .inputs
        .iter()
        .map(|b| b.name.as_str())
        .chain(design.outputs.iter().map(|b| b.name.as_str()))
        .collect();
    let mut k = 0;
    loop {
        let p = if k == 0 {
            "rm_".to_string()
        } else {
            format!("rm{k}_")
        };
        if !names.iter().any(|n| n.starts_with(&p)) {
            return p;
        }
        k += 1;
    }
}

/// The remap as bench text. A bench output may also be an input (`INPUT(x)`, `OUTPUT(x)`);
/// the circuit then holds a buffer `x = BUFF(x)`, which bench cannot say, so it is left out.
pub fn to_bench(c: &Circuit) -> String {
    let mut out = String::new();
    for line in c.to_bench().lines() {
        let self_buffer = line
            .split_once(" = BUFF(")
            .is_some_and(|(lhs, rhs)| rhs.strip_suffix(')') == Some(lhs));
        if !self_buffer {
            out.push_str(line);
            out.push('\n');
        }
    }
    out
}

/// Whether every port name of `c` can be written in Verilog.
pub fn verilog_names_ok(c: &Circuit) -> Result<(), GenError> {
    for p in c.inputs().iter().chain(c.outputs()) {
        if !is_identifier(&p.name) {
            return Err(GenError::new(
                format!("port `{}` is not a plain Verilog identifier", p.name),
                "write the remap as bench with --format bench",
            ));
        }
    }
    Ok(())
}
