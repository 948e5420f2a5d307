//! The exact cone of a clocked design across registers: per output, which inputs really change
//! it from the reset state, the first latency at which each does (cycles between the cycle the
//! input is applied and the cycle the output changes), and the registers that never influence
//! an output (dead state). Three kinds of evidence:
//!
//! - **register pairs**: the design is paired with itself (`product.rs`) and signal
//!   correspondence (`correspond.rs`) proves which of its register bits are constant, equal or
//!   complementary in every state reachable from reset; the logic is reduced by those groups
//!   (each member read through its representative), which behaves as the design on every run
//!   from reset.
//! - **one-cycle dependences** (proved for every cycle): the exact support (`cone::support`) of
//!   every output and register next value of the reduced logic, register outputs free. An input
//!   with no chain of such dependences to an output never changes it, in any cycle of any run
//!   (changing it changes only the registers it feeds; by induction no other register and no
//!   output changes). The shortest chain is a lower bound on the latency for all cycles.
//! - **unrolling from reset** (bounded): the reduced logic unrolled `cycles` times from the reset
//!   state; output `y` in cycle `k` depends on input `x` of cycle `t` when the support engine
//!   finds two input sequences that differ only there and give different values of `y` in cycle
//!   `k` (re-simulated, then replayed on the original design), or does not when the cofactor miter
//!   is UNSAT. The first latency found is `min(k - t)`; it is proved the first when it equals the
//!   one-cycle lower bound, and otherwise holds for the first `cycles` cycles only (reported).

use super::correspond::{self, Classes};
use super::product::{HeldInput, Init, InitUnset, Product, Side};
use super::trace::{replay, InitialValue, Trace, TraceCycle, TraceInput, TraceReset};
use crate::aig::{Aig, Lit};
use crate::design::{Design, Format, InputBit, OutputBit};
use crate::sat::Limits;
use serde::Serialize;
use std::collections::{BTreeMap, VecDeque};

/// Cycles unrolled from reset by default (`cone --cycles`).
pub const DEFAULT_EXACT_CYCLES: usize = 8;
/// The most register bits of a design whose exact cone is built without `--cycles`.
pub const AUTO_EXACT_REGISTERS: usize = 32;
/// The most AIG nodes of a design whose exact cone is built without `--cycles`.
pub const AUTO_EXACT_NODES: usize = 2_000;
/// The largest unrolling (AIG nodes of the design times cycles) the exact cone builds.
pub const MAX_UNROLLED_NODES: usize = 4_000_000;
/// The most claims (output and cycle, input and cycle) the unrolling decides.
pub const MAX_UNROLLED_CLAIMS: usize = 20_000_000;

/// Settings of the exact cone across cycles.
#[derive(Copy, Clone, Debug)]
pub struct ExactOptions {
    /// Cycles from reset unrolled (`0`: no exact cone).
    pub cycles: usize,
    /// How registers without a reset start.
    pub init_unset: InitUnset,
}

/// One (output, input) claim decided by the caller's exact-support engine.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum Claim {
    /// The output depends on the input: on `vector` (every input of the design, the claimed
    /// one at 0) the output is `value`, and with the input at 1 its complement.
    Depends {
        /// Every input's value.
        vector: Vec<bool>,
        /// The output's value on `vector`.
        value: bool,
    },
    /// The output does not depend on it (UNSAT, or no path).
    Independent,
    /// A limit stopped the query.
    Undecided,
}

/// One output's claims: the inputs of its AIG cone (ascending) and one claim each.
#[derive(Clone, Debug)]
pub struct Decided {
    /// Input indices of the design, ascending.
    pub cone: Vec<usize>,
    /// One per entry of `cone`.
    pub claims: Vec<Claim>,
}

impl Decided {
    fn membership(&self, input: usize) -> Option<&Claim> {
        self.cone
            .binary_search(&input)
            .ok()
            .map(|i| &self.claims[i])
    }
}

/// The exact-support engine lent by the caller (the cone audit's; passed in so that `seq`
/// needs nothing from `cone`): decide every claim of `outputs` of a combinational design
/// over the inputs of their AIG cones (given); returns the claims in the order of `outputs`,
/// with the numbers of claims and of undecided ones.
pub type Decide<'a> = dyn Fn(&Design, &[usize], Vec<Vec<usize>>) -> (Vec<Decided>, u64, u64) + 'a;

/// What the exact analysis says about one input of one output.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Influence {
    /// It changes the output; see `first_latency` and `evidence`.
    Depends,
    /// No chain of one-cycle dependences reaches the output: it never changes it (proved for
    /// every cycle of every run).
    Never,
    /// It does not change the output in the cycles unrolled (UNSAT for each), but a chain of
    /// one-cycle dependences exists, so later cycles are not covered.
    NotWithinBound,
    /// A limit stopped a query before anything was found.
    Undecided,
}

/// Two runs from reset that differ only in one input in one cycle and give different values
/// of the output in a later (or the same) cycle.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct InfluenceEvidence {
    /// The cycle whose input is flipped.
    pub applied: usize,
    /// The cycle where the output differs.
    pub observed: usize,
    /// The output's value in cycle `observed` with the input at 0 in cycle `applied` (with it
    /// at 1 the output is the complement).
    pub output_value: bool,
    /// Initial values of registers without a reset.
    pub initial: BTreeMap<String, bool>,
    /// Per cycle `0..=observed`, every per-cycle input (the flipped one at 0).
    pub cycles: Vec<BTreeMap<String, bool>>,
}

/// One input (in the structural cone across cycles) of one output.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct ExactInput {
    /// The input bit.
    pub input: String,
    /// The verdict.
    pub influence: Influence,
    /// The fewest cycles from the input to the output change found (`Depends` only).
    pub first_latency: Option<usize>,
    /// No smaller latency in any cycle: the first latency equals the one-cycle lower bound.
    pub proved_first: bool,
    /// The fewest registers on a chain of one-cycle dependences (a lower bound on the latency
    /// in every cycle); `None`: no chain (`Never`).
    pub lower_bound: Option<usize>,
    /// The two runs (`Depends` only).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub evidence: Option<InfluenceEvidence>,
}

/// One output's exact cone across cycles.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct ExactCone {
    /// The output bit.
    pub output: String,
    /// Its inputs, in the order of the structural cone across cycles.
    pub inputs: Vec<ExactInput>,
}

/// A register bit that never influences an output.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct DeadRegister {
    /// The register bit.
    pub register: String,
    /// `constant 0` / `constant 1` (proved in every reachable state), or `reaches no output`
    /// (no chain of one-cycle dependences to an output).
    pub why: String,
}

/// The exact cones of every output across cycles.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct ExactCones {
    /// Cycles unrolled from reset (the bound of `not_within_bound`).
    pub cycles: usize,
    /// How the run starts, in words.
    pub start: String,
    /// Inputs held at one value (resets inactive, clocks at 0): not analysed.
    pub held: Vec<HeldInput>,
    /// Register bits proved equal (`~` complementary; `0`: constant) in every state reachable
    /// from reset, each group led by its representative.
    pub register_groups: Vec<Vec<String>>,
    /// Per output bit, in output order.
    pub outputs: Vec<ExactCone>,
    /// Registers that never influence an output (proved for every cycle).
    pub dead_registers: Vec<DeadRegister>,
    /// Claims decided and left open by a limit (one-cycle and unrolled together).
    pub claims: u64,
    /// Claims a limit left undecided.
    pub undecided: u64,
}

/// The exact cones across cycles of `d`, for the inputs of `structural` (its structural cones
/// across cycles). `Err` says why there is none (several clocks, too large).
pub fn exact_cones(
    d: &Design,
    structural: &super::CycleCones,
    o: &ExactOptions,
    limits: &Limits,
    decider: &Decide<'_>,
) -> Result<ExactCones, String> {
    let nodes = d.aig.len().saturating_mul(o.cycles);
    if nodes > MAX_UNROLLED_NODES {
        return Err(format!(
            "not built: {} cycles of {} AIG nodes exceed {MAX_UNROLLED_NODES} nodes (use a smaller --cycles)",
            o.cycles,
            d.aig.len()
        ));
    }
    // Claims of the unrolling: (output, cycle k) x (input, cycle t <= k).
    let ports = d
        .inputs
        .iter()
        .filter(|b| !matches!(b.kind, crate::design::InputKind::Register))
        .count();
    let claims = (o.cycles.saturating_mul(o.cycles + 1) / 2)
        .saturating_mul(ports.max(1))
        .saturating_mul(d.outputs.len().max(1));
    if claims > MAX_UNROLLED_CLAIMS {
        return Err(format!(
            "not built: {} cycles of {} outputs and {ports} inputs make about {claims} claims, more than {MAX_UNROLLED_CLAIMS} (use a smaller --cycles)",
            o.cycles,
            d.outputs.len()
        ));
    }
    let mut p = Product::build(d, d, o.init_unset, false, None)
        .map_err(|e| format!("not built: {}", e.diagnostics[0].message))?;
    let nreg = d.registers.len();
    let classes = prove_groups(&mut p, limits);
    // The reduced logic of the reference half: outputs, then register next values.
    let roots: Vec<Lit> = p
        .outputs
        .iter()
        .map(|op| op.lit_r)
        .chain(p.state[..nreg].iter().map(|s| s.next))
        .collect();
    let reduced = correspond::reduce(&mut p, &classes, &roots);
    let nf = p.free.len();
    // One cycle: every input of the product is an input (free inputs, then state bits).
    let step = synthetic(d, p.aig.clone(), reduced.clone(), |k| {
        if k < nf {
            p.free[k].name.clone()
        } else {
            format!("state:{}", p.state[k - nf].name)
        }
    });
    let all: Vec<usize> = (0..step.outputs.len()).collect();
    let (one, s1) = decide(decider, &step, &all);
    // Unrolled from reset.
    let (unrolled, n_init) = unroll(&p, &reduced, nreg, o.cycles);
    let ny = d.outputs.len();
    let observed: Vec<usize> = (0..unrolled.outputs.len()).collect();
    let (many, s2) = decide(decider, &unrolled, &observed);
    let graph = Graph::new(&one, nf, nreg, ny);
    let init_names = init_names(&p, nreg, n_init);
    let held: Vec<HeldInput> = p.held.clone();
    let mut outputs = Vec::new();
    for (y, sc) in structural.outputs.iter().enumerate() {
        let bound = graph.lower_bounds(y);
        let mut inputs = Vec::new();
        for name in sc.inputs.keys() {
            let Some(x) = p.free.iter().position(|f| &f.name == name) else {
                continue; // a held input (reset, clock)
            };
            let lower = bound[x];
            let mut best: Option<(usize, usize, &Claim)> = None;
            let mut open = false;
            for k in 0..o.cycles {
                let r = &many[k * ny + y];
                for t in 0..=k {
                    match r.membership(t * nf + x) {
                        Some(m @ Claim::Depends { .. })
                            if best.is_none_or(|(bk, bt, _)| k - t < bk - bt) =>
                        {
                            best = Some((k, t, m));
                        }
                        Some(Claim::Undecided) => open = true,
                        _ => {}
                    }
                }
            }
            let evidence = best.and_then(|(k, t, m)| {
                evidence(d, &p, &unrolled, &held, &init_names, (k, t, y, x), m)
            });
            let (influence, first) = match (&evidence, lower, open) {
                (Some(e), _, _) => (Influence::Depends, Some(e.observed - e.applied)),
                (None, None, _) => (Influence::Never, None),
                (None, Some(_), true) => (Influence::Undecided, None),
                (None, Some(_), false) if best.is_some() => (Influence::Undecided, None),
                (None, Some(_), false) => (Influence::NotWithinBound, None),
            };
            inputs.push(ExactInput {
                input: name.clone(),
                influence,
                first_latency: first,
                proved_first: first.is_some() && first == lower,
                lower_bound: lower,
                evidence,
            });
        }
        outputs.push(ExactCone {
            output: sc.output.clone(),
            inputs,
        });
    }
    Ok(ExactCones {
        cycles: o.cycles,
        start: start_words(o.init_unset).to_string(),
        held,
        register_groups: group_names(&p, &classes, nreg),
        outputs,
        dead_registers: dead(&p, &classes, &graph, nreg),
        claims: s1.0 + s2.0,
        undecided: s1.1 + s2.1,
    })
}

/// Signal correspondence on the design paired with itself; no groups when a limit stops it.
fn prove_groups(p: &mut Product, limits: &Limits) -> Classes {
    let sim = super::simulate::simulate(p, 64, 4, 0x5E9_0002);
    let mut classes = Classes::from_signatures(p, &sim.signatures);
    classes.refine_by_init(p);
    match correspond::make_inductive(p, &mut classes, limits) {
        Ok(_) => classes,
        Err(_) => Classes::default(),
    }
}

/// A combinational design over `aig` with outputs `roots` and inputs named by `name`.
fn synthetic(d: &Design, aig: Aig, roots: Vec<Lit>, name: impl Fn(usize) -> String) -> Design {
    let inputs = (0..aig.num_inputs())
        .map(|k| InputBit::port(&name(k), None, None))
        .collect();
    let outputs = roots
        .into_iter()
        .enumerate()
        .map(|(k, l)| OutputBit::new(&format!("o{k}"), None, l, None))
        .collect();
    Design {
        name: d.name.clone(),
        format: Format::Bench,
        aig,
        inputs,
        outputs,
        netlist: None,
        warnings: Vec::new(),
        registers: Vec::new(),
        net_names: BTreeMap::new(),
    }
}

/// Decide every claim of `outputs` on their AIG cones; (claims, undecided).
fn decide(decider: &Decide<'_>, d: &Design, outputs: &[usize]) -> (Vec<Decided>, (u64, u64)) {
    let cones = outputs
        .iter()
        .map(|&o| {
            d.aig
                .cone_inputs(&[d.outputs[o].lit])
                .into_iter()
                .map(|k| k as usize)
                .collect()
        })
        .collect();
    let (r, claims, undecided) = decider(d, outputs, cones);
    (r, (claims, undecided))
}

/// The reduced logic unrolled `cycles` times from the reset state: inputs `t * nf + i` (free
/// input `i` of cycle `t`), then one per free initial value; outputs `k * ny + y` (output `y`
/// in cycle `k`). Returns the design and the number of free initial values.
fn unroll(p: &Product, reduced: &[Lit], nreg: usize, cycles: usize) -> (Design, usize) {
    let nf = p.free.len();
    let ny = p.outputs.len();
    let mut g = Aig::new();
    let frees: Vec<Vec<Lit>> = (0..cycles)
        .map(|_| (0..nf).map(|_| g.add_input()).collect())
        .collect();
    let n_init = p.free_init_count(nreg);
    let init: Vec<Lit> = (0..n_init).map(|_| g.add_input()).collect();
    let mut state: Vec<Lit> = p.state[..nreg]
        .iter()
        .map(|s| match s.init {
            Init::Const(v) => Lit::constant(v),
            Init::Free(k, inv) => init[k as usize].xor_complement(inv),
        })
        .collect();
    let mut outs = Vec::new();
    for free in frees.iter() {
        let mut map = vec![Lit::FALSE; p.aig.num_inputs()];
        map[..nf].copy_from_slice(free);
        map[nf..nf + nreg].copy_from_slice(&state);
        let lits = g.import(&p.aig, &map, reduced);
        outs.extend_from_slice(&lits[..ny]);
        state = lits[ny..].to_vec();
    }
    let d = Design {
        name: String::new(),
        format: Format::Bench,
        inputs: (0..g.num_inputs())
            .map(|k| InputBit::port(&format!("u{k}"), None, None))
            .collect(),
        outputs: outs
            .into_iter()
            .enumerate()
            .map(|(k, l)| OutputBit::new(&format!("o{k}"), None, l, None))
            .collect(),
        aig: g,
        netlist: None,
        warnings: Vec::new(),
        registers: Vec::new(),
        net_names: BTreeMap::new(),
    };
    (d, n_init)
}

/// Per free initial value, the reference registers that start at it (with their phase).
fn init_names(p: &Product, nreg: usize, n_init: usize) -> Vec<Vec<(String, bool)>> {
    let mut out = vec![Vec::new(); n_init];
    for s in &p.state[..nreg] {
        if let Init::Free(k, inv) = s.init {
            out[k as usize].push((s.name.clone(), inv));
        }
    }
    out
}

/// The evidence of claim `(k, t, y, x)` (output `y` in cycle `k` depends on input `x` of cycle
/// `t`), replayed on the original design: `None` when the replay does not confirm it.
fn evidence(
    d: &Design,
    p: &Product,
    unrolled: &Design,
    held: &[HeldInput],
    init_names: &[Vec<(String, bool)>],
    (k, t, y, x): (usize, usize, usize, usize),
    m: &Claim,
) -> Option<InfluenceEvidence> {
    let Claim::Depends { vector, value } = m else {
        return None;
    };
    let nf = p.free.len();
    let cycles: Vec<BTreeMap<String, bool>> = (0..=k)
        .map(|c| {
            p.free
                .iter()
                .enumerate()
                // The copy's own unknown-value sources (same names) are not the design's.
                .filter(|(_, f)| f.side != Side::Candidate)
                .map(|(i, f)| (f.name.clone(), vector[c * nf + i]))
                .collect()
        })
        .collect();
    let base = (unrolled.inputs.len() - init_names.len()) as u64;
    let mut initial = BTreeMap::new();
    // Registers without a reset started by --init-unset, then those at free values.
    for s in &p.state[..d.registers.len()] {
        if let (None, Init::Const(v)) = (d.registers[s.register].init, s.init) {
            initial.insert(s.name.clone(), v);
        }
    }
    for (j, regs) in init_names.iter().enumerate() {
        let v = vector[base as usize + j];
        for (name, inv) in regs {
            initial.insert(name.clone(), v ^ inv);
        }
    }
    let e = InfluenceEvidence {
        applied: t,
        observed: k,
        output_value: *value,
        initial,
        cycles,
    };
    let o = p.outputs[y].reference;
    let run = |flip: bool| {
        let tr = e.trace(held, &p.free[x].name, flip);
        replay(d, Side::Reference, &tr)
            .ok()
            .map(|r| r.outputs[k][o])
    };
    let (a, b) = (run(false), run(true));
    if a != Some(*value) || b != Some(!*value) {
        log::debug!(
            "exact cone: output {y} in cycle {k}, input {x} of cycle {t}: the unrolled logic gives {value}, the design replays {a:?} and {b:?}"
        );
        return None;
    }
    Some(e)
}

impl InfluenceEvidence {
    /// One of the two runs as a trace: input `flipped` of cycle `applied` at `value`.
    pub fn trace(&self, held: &[HeldInput], flipped: &str, value: bool) -> Trace {
        Trace {
            reset: TraceReset {
                description: String::new(),
                held: held.to_vec(),
                initial: self
                    .initial
                    .iter()
                    .map(|(r, &v)| InitialValue {
                        side: Side::Both,
                        register: r.clone(),
                        value: v,
                    })
                    .collect(),
            },
            cycles: self
                .cycles
                .iter()
                .enumerate()
                .map(|(c, ins)| TraceCycle {
                    cycle: c,
                    inputs: ins
                        .iter()
                        .map(|(n, &v)| TraceInput {
                            name: n.clone(),
                            side: Side::Both,
                            value: if c == self.applied && n == flipped {
                                value
                            } else {
                                v
                            },
                            candidate_name: None,
                        })
                        .collect(),
                })
                .collect(),
            first_difference: None,
            renamed_outputs: Default::default(),
        }
    }
}

/// The one-cycle dependences of the reduced logic: per output and per register next value,
/// the free inputs and register bits it depends on (an undecided claim counts as a
/// dependence, so that every "never" stays proved).
struct Graph {
    /// Free inputs.
    nf: usize,
    /// Per output: its register bits (reference register indices) and free inputs.
    out_regs: Vec<Vec<usize>>,
    out_ins: Vec<Vec<usize>>,
    /// Per register: the registers and free inputs its next value reads.
    next_regs: Vec<Vec<usize>>,
    next_ins: Vec<Vec<usize>>,
}

impl Graph {
    fn new(one: &[Decided], nf: usize, nreg: usize, ny: usize) -> Graph {
        let split = |r: &Decided| {
            let mut regs = Vec::new();
            let mut ins = Vec::new();
            for (&k, m) in r.cone.iter().zip(&r.claims) {
                if *m == Claim::Independent {
                    continue;
                }
                if k < nf {
                    ins.push(k);
                } else if k < nf + nreg {
                    regs.push(k - nf);
                }
                // Candidate-side state bits never appear in the reference's reduced logic
                // (every group's representative has the smallest state index).
            }
            (regs, ins)
        };
        let (out_regs, out_ins) = one[..ny].iter().map(split).unzip();
        let (next_regs, next_ins) = one[ny..ny + nreg].iter().map(split).unzip();
        Graph {
            nf,
            out_regs,
            out_ins,
            next_regs,
            next_ins,
        }
    }

    /// Per register: the fewest cycles from its current value to output `y` along one-cycle
    /// dependences (`None`: no chain).
    fn register_distance(&self, y: usize) -> Vec<Option<usize>> {
        let n = self.next_regs.len();
        let mut dist = vec![None; n];
        let mut queue = VecDeque::new();
        for &r in &self.out_regs[y] {
            if dist[r].is_none() {
                dist[r] = Some(0);
                queue.push_back(r);
            }
        }
        while let Some(s) = queue.pop_front() {
            // s reaches y in dist[s] cycles; every r that s's next value reads, one more.
            let ds = dist[s].expect("queued");
            for &r in &self.next_regs[s] {
                if dist[r].is_none() {
                    dist[r] = Some(ds + 1);
                    queue.push_back(r);
                }
            }
        }
        dist
    }

    /// Per free input: the one-cycle lower bound on its latency to output `y`.
    fn lower_bounds(&self, y: usize) -> Vec<Option<usize>> {
        let dist = self.register_distance(y);
        let mut out = vec![None; self.nf];
        for &x in &self.out_ins[y] {
            out[x] = Some(0);
        }
        for (r, ins) in self.next_ins.iter().enumerate() {
            if let Some(dr) = dist[r] {
                for &x in ins {
                    let l = dr + 1;
                    if out[x].is_none_or(|v| l < v) {
                        out[x] = Some(l);
                    }
                }
            }
        }
        out
    }
}

/// The groups by register name, representative first.
fn group_names(p: &Product, classes: &Classes, nreg: usize) -> Vec<Vec<String>> {
    let at: BTreeMap<u32, usize> = p.state[..nreg]
        .iter()
        .enumerate()
        .map(|(k, s)| (s.current.node(), k))
        .collect();
    let mut out: Vec<Vec<String>> = Vec::new();
    for g in &classes.groups {
        let names: Vec<String> = g
            .iter()
            .filter_map(|&m| {
                if m.is_const() {
                    return Some(if m.is_complemented() { "1" } else { "0" }.to_string());
                }
                at.get(&m.node()).map(|&k| {
                    let inv = if m.is_complemented() { "~" } else { "" };
                    format!("{inv}{}", p.state[k].name)
                })
            })
            .collect();
        // Only groups with two members of the design itself (or a constant and one).
        if names.len() > 1 {
            out.push(names);
        }
    }
    out
}

/// Registers proved dead: constant ones, and representatives with no chain to an output.
fn dead(p: &Product, classes: &Classes, graph: &Graph, nreg: usize) -> Vec<DeadRegister> {
    let at: BTreeMap<u32, usize> = p.state[..nreg]
        .iter()
        .enumerate()
        .map(|(k, s)| (s.current.node(), k))
        .collect();
    let mut constant: BTreeMap<u32, bool> = BTreeMap::new();
    // Member node -> its representative's register (the reduced logic reads only that one).
    let mut rep: BTreeMap<u32, Option<usize>> = BTreeMap::new();
    for g in &classes.groups {
        for &m in &g[1..] {
            if g[0].is_const() {
                constant.insert(m.node(), g[0].is_complemented() ^ m.is_complemented());
            } else {
                rep.insert(m.node(), at.get(&g[0].node()).copied());
            }
        }
    }
    let mut live = vec![false; nreg];
    for y in 0..graph.out_regs.len() {
        for (r, d) in graph.register_distance(y).into_iter().enumerate() {
            live[r] |= d.is_some();
        }
    }
    let mut out = Vec::new();
    for (k, s) in p.state[..nreg].iter().enumerate() {
        let node = s.current.node();
        let reads = match rep.get(&node) {
            // A member is live when its representative is (a candidate-side one: kept live).
            Some(r) => r.is_none_or(|r| live[r]),
            None => live[k],
        };
        let why = if let Some(&v) = constant.get(&node) {
            format!("constant {}", v as u8)
        } else if reads {
            continue;
        } else {
            "reaches no output".to_string()
        };
        out.push(DeadRegister {
            register: s.name.clone(),
            why,
        });
    }
    out
}

fn start_words(init: InitUnset) -> &'static str {
    match init {
        InitUnset::Free => "registers with a reset start at their reset value, the others at free values; reset ports held inactive, clocks at 0",
        InitUnset::Value(false) => "registers with a reset start at their reset value, the others at 0 (--init-unset 0); reset ports held inactive, clocks at 0",
        InitUnset::Value(true) => "registers with a reset start at their reset value, the others at 1 (--init-unset 1); reset ports held inactive, clocks at 0",
    }
}
