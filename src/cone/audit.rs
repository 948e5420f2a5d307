//! The `cone` audit: structural cones, supports, flags and the report, for the selected
//! output bits of one design.

use super::bits::Bits;
use super::expect::Expectation;
use super::names::{compact, input_names, output_names, resolve};
use super::report::{AuditReport, ClaimReport, ClaimVerdict, Flag, InputSummary, OutputAudit};
use super::structural::StructuralGraph;
use super::support::{run, IndependentBy, Membership, SupportOptions, SupportResult};
use crate::design::{Design, InputKind};
use crate::diag::{Diagnostic, InputError};
use crate::sat::Limits;

/// What to audit and how.
#[derive(Clone, Debug, Default)]
pub struct AuditOptions {
    /// Output indices to audit (see [`select_outputs`]); empty means every output.
    pub outputs: Vec<usize>,
    /// The user's expectation (`--expect`).
    pub expect: Option<Expectation>,
    /// Simulation seed and rounds, progress bar.
    pub support: SupportOptions,
    /// Whether the text report lists every claim with its evidence (JSON always does).
    pub text_evidence: bool,
    /// Audit only this shard's share of the selected outputs (`cone --shard K/N`): a partial
    /// report, without the flags that need every output (the merge adds them).
    pub shard: Option<crate::shard::Shard>,
    /// The same design read as written ([`crate::aig::Aig::as_written`]), for the structural
    /// cones of a design without a complete netlist: an input that an expression reads but
    /// that folds away (`b` in `a & (b | ~b)`) is then in the cone and flagged redundant,
    /// not unused. Ignored unless its inputs and outputs are the design's.
    pub structure: Option<std::sync::Arc<Design>>,
    /// Cycles from reset the exact cone across cycles of a clocked design unrolls (`None`:
    /// [`crate::seq::DEFAULT_EXACT_CYCLES`] for designs of at most
    /// [`crate::seq::AUTO_EXACT_REGISTERS`] register bits and
    /// [`crate::seq::AUTO_EXACT_NODES`] AIG nodes, else none; `Some(0)`: only the structural one).
    pub exact_cycles: Option<usize>,
    /// How registers without a reset start, for the exact cone across cycles.
    pub init_unset: crate::seq::InitUnset,
}

/// The structural graph of `design`, from `written` (the same design read as written) when
/// the design has no complete netlist and `written` has the same inputs and outputs.
fn structural_graph(design: &Design, written: Option<&Design>) -> StructuralGraph {
    let graph = StructuralGraph::build(design);
    let Some(w) = written else { return graph };
    let same = graph.source == super::structural::GraphSource::Aig
        && w.inputs.len() == design.inputs.len()
        && w.outputs.len() == design.outputs.len()
        && w.inputs
            .iter()
            .zip(&design.inputs)
            .all(|(a, b)| a.name == b.name)
        && w.outputs
            .iter()
            .zip(&design.outputs)
            .all(|(a, b)| a.name == b.name);
    if !same {
        return graph;
    }
    let mut g = StructuralGraph::build(w);
    if g.source == super::structural::GraphSource::Aig {
        g.source = super::structural::GraphSource::Written;
    }
    g
}

/// Resolve `--output` names (bits, buses, ranges such as `d[0..3]`) to output indices, in
/// the order given, without repeats.
pub fn select_outputs(design: &Design, names: &[String]) -> Result<Vec<usize>, InputError> {
    let outs = output_names(design);
    let mut chosen = Vec::new();
    let mut errors = Vec::new();
    for n in names {
        match resolve(n, &outs, "output", true) {
            Ok(v) => {
                for o in v {
                    if !chosen.contains(&o) {
                        chosen.push(o);
                    }
                }
            }
            Err(e) => errors.push(
                Diagnostic::error(None, format!("--output {n}: {}", e.message)).with_help(e.help),
            ),
        }
    }
    if errors.is_empty() {
        Ok(chosen)
    } else {
        Err(InputError {
            diagnostics: errors,
        })
    }
}

/// Audit the selected outputs of `design`: structural cone, exact support with evidence,
/// flags. Limits leave claims undecided (see [`AuditReport::undecided`]), never guessed.
/// On a clocked design (registers cut: their outputs read as inputs) the report also holds
/// the structural cones across clock cycles of every output
/// ([`AuditReport::across_cycles`]), and an input, register, clock or reset that reaches an
/// output only through registers is not flagged unused.
pub fn audit(design: &Design, opts: &AuditOptions, limits: &Limits) -> AuditReport {
    let all_outputs = opts.outputs.is_empty();
    let mut outputs: Vec<usize> = if all_outputs {
        (0..design.outputs.len()).collect()
    } else {
        opts.outputs.clone()
    };
    let shard = opts
        .shard
        .map(|s| crate::shard::cone::restrict_outputs(&mut outputs, s));
    let graph = structural_graph(design, opts.structure.as_deref());
    let cones: Vec<_> = outputs.iter().map(|&o| graph.cone(o)).collect();
    let bar = super::progress_bar(opts.support.progress, "cone audit");
    let (results, stats) = run(
        design,
        &outputs,
        cones.iter().map(|c| c.inputs.clone()).collect(),
        &opts.support,
        limits,
        &bar,
    );
    bar.finish_and_clear();

    let ins = input_names(design);
    let name = |k: usize| design.inputs[k].name.clone();
    let mut flags = Vec::new();
    let mut audits = Vec::with_capacity(results.len());
    let mut in_cones = vec![0usize; design.inputs.len()];
    let mut in_supports = vec![0usize; design.inputs.len()];
    let mut in_undecided = vec![0usize; design.inputs.len()];
    for (r, cone) in results.iter().zip(&cones) {
        let out = &design.outputs[r.output];
        let support = r.support();
        for &k in &r.cone {
            in_cones[k] += 1;
        }
        for &k in &support {
            in_supports[k] += 1;
        }
        let undecided = r.undecided();
        for &k in &undecided {
            in_undecided[k] += 1;
        }
        let constant = (support.is_empty() && undecided.is_empty())
            .then(|| design.eval(&vec![false; design.inputs.len()])[r.output]);
        if let Some(value) = constant {
            flags.push(Flag::ConstantOutput {
                output: out.name.clone(),
                value,
            });
        }
        let mut redundant: Vec<(usize, IndependentBy)> = r
            .cone
            .iter()
            .zip(&r.claims)
            .filter_map(|(&k, m)| match m {
                Membership::Independent(by) if !design.inputs[k].is_unknown() => Some((k, *by)),
                _ => None,
            })
            .collect();
        redundant.sort_by_key(|&(k, by)| (proof_rank(by), k));
        for (k, by) in redundant {
            flags.push(Flag::RedundantInput {
                output: out.name.clone(),
                input: name(k),
                by,
            });
        }
        for &k in &support {
            if let InputKind::Unknown { pos, what } = &design.inputs[k].kind {
                flags.push(Flag::UnknownInSupport {
                    output: out.name.clone(),
                    source: name(k),
                    what: what.clone(),
                    pos: pos.to_string(),
                });
            }
        }
        let expected = opts.expect.as_ref().and_then(|e| e.entries.get(&r.output));
        if let Some(exp) = expected {
            for &k in &exp.inputs {
                let m = r.membership(k);
                if matches!(m, None | Some(Membership::Independent(_))) {
                    flags.push(Flag::MissingInput {
                        output: out.name.clone(),
                        input: name(k),
                        expected_at: exp.pos.to_string(),
                    });
                }
            }
            for &k in &support {
                if !design.inputs[k].is_unknown() && exp.inputs.binary_search(&k).is_err() {
                    flags.push(Flag::UnexpectedInput {
                        output: out.name.clone(),
                        input: name(k),
                        expected_at: exp.pos.to_string(),
                    });
                }
            }
        }
        audits.push(OutputAudit {
            name: out.name.clone(),
            port: out.port.clone(),
            index: out.index,
            cone_gates: cone.gates,
            cone: r.cone.iter().map(|&k| name(k)).collect(),
            support: support.iter().map(|&k| name(k)).collect(),
            redundant: r.redundant().iter().map(|&k| name(k)).collect(),
            undecided: undecided.iter().map(|&k| name(k)).collect(),
            constant,
            expected: expected.map(|e| e.inputs.iter().map(|&k| name(k)).collect()),
            claims: claims(design, r),
            support_text: compact(&support, &ins),
            cone_text: compact(&r.cone, &ins),
        });
    }
    if let (Some(exp), None) = (&opts.expect, &shard) {
        subset_flags(design, exp, &results, &mut flags);
    }
    if all_outputs && shard.is_none() {
        for k in 0..design.inputs.len() {
            if in_supports[k] == 0 && in_undecided[k] == 0 && !design.inputs[k].is_unknown() {
                flags.push(Flag::UnusedInput {
                    input: name(k),
                    connected: in_cones[k] > 0,
                });
            }
        }
    }
    // A clocked design: the cones across cycles, which clear inputs used only through registers.
    let across_cycles = (design.is_clocked() && shard.is_none()).then(|| {
        let mut c = crate::seq::cycle_cones(design);
        keep_used_across_cycles(&mut flags, design, &c);
        let small = design.registers.len() <= crate::seq::AUTO_EXACT_REGISTERS
            && design.aig.len() <= crate::seq::AUTO_EXACT_NODES;
        let cycles = match opts.exact_cycles {
            Some(k) => k,
            None if small => crate::seq::DEFAULT_EXACT_CYCLES,
            None => {
                c.exact_not_built = Some(format!(
                    "not built by default for {} register bits and {} AIG nodes (at most {} and {}); pass --cycles K to build it (it may take long)",
                    design.registers.len(),
                    design.aig.len(),
                    crate::seq::AUTO_EXACT_REGISTERS,
                    crate::seq::AUTO_EXACT_NODES
                ));
                0
            }
        };
        if cycles > 0 {
            let o = crate::seq::ExactOptions {
                cycles,
                init_unset: opts.init_unset,
            };
            match super::across::exact_across_cycles(design, &c, &o, opts.support.seed, limits) {
                Ok(e) => c.exact = Some(e),
                Err(why) => c.exact_not_built = Some(why),
            }
        }
        c
    });
    let mut notes = Vec::new();
    if let Some(e) = across_cycles
        .as_ref()
        .and_then(|c| c.exact.as_ref().map(|e| (c, e)))
    {
        let audited: std::collections::BTreeSet<&str> =
            audits.iter().map(|o| o.name.as_str()).collect();
        notes = across_cycle_flags(design, e, &audited, all_outputs, &mut flags);
    }
    let inputs = design
        .inputs
        .iter()
        .enumerate()
        .map(|(k, b)| {
            let (kind, what, pos) = match &b.kind {
                InputKind::Port => ("port", None, b.pos.as_ref().map(|p| p.to_string())),
                InputKind::Unknown { pos, what } => {
                    ("unknown", Some(what.clone()), Some(pos.to_string()))
                }
                InputKind::Register => ("register", None, b.pos.as_ref().map(|p| p.to_string())),
            };
            InputSummary {
                name: b.name.clone(),
                kind,
                what,
                pos,
                in_cones: in_cones[k],
                in_supports: in_supports[k],
            }
        })
        .collect();
    AuditReport {
        schema: AuditReport::SCHEMA,
        design: design.name.clone(),
        graph: graph.source,
        all_outputs,
        inputs,
        outputs: audits,
        flags,
        notes,
        stats,
        text_evidence: opts.text_evidence,
        shard,
        across_cycles,
    }
}

/// A clocked design's one-cycle audit reads register outputs as inputs, so an input or a
/// register that reaches an output only through registers, and the clocks and resets, look
/// unused there: drop those `unused input` flags (the cones across cycles list them with their
/// latency; registers that reach no output are listed as dead). An input that reaches no
/// output through any number of cycles stays flagged.
fn keep_used_across_cycles(flags: &mut Vec<Flag>, d: &Design, c: &crate::seq::CycleCones) {
    use std::collections::BTreeSet;
    let mut used: BTreeSet<&str> = c
        .outputs
        .iter()
        .flat_map(|o| o.inputs.keys().chain(o.registers.keys()))
        .map(String::as_str)
        .collect();
    for r in &d.registers {
        used.extend(r.clock.as_deref());
        if let Some(x) = &r.reset {
            used.insert(d.inputs[x.input].name.as_str());
        }
    }
    flags
        .retain(|f| !matches!(f, Flag::UnusedInput { input, .. } if used.contains(input.as_str())));
}

/// The findings of the exact cone across cycles (`e`: the structural cones and the exact ones)
/// as flags on the audited outputs: an input that reaches an output and never changes it in any
/// cycle from reset (not for a pair the one-cycle audit already flags redundant with no
/// register on the way), and, when every output is audited, the exact dead registers (their
/// `unused input` flags of the one-cycle audit dropped: the dead-register flag says more).
/// Returns the notes: inputs that do not change an output in the cycles unrolled, which is
/// no proof for later cycles, so no flag.
fn across_cycle_flags(
    d: &Design,
    (c, e): (&crate::seq::CycleCones, &crate::seq::ExactCones),
    audited: &std::collections::BTreeSet<&str>,
    all_outputs: bool,
    flags: &mut Vec<Flag>,
) -> Vec<String> {
    use crate::seq::Influence;
    // Per register, the inputs (names) its next value reads.
    let loads: Vec<Vec<&str>> = d
        .registers
        .iter()
        .map(|r| {
            d.aig
                .cone_inputs(&[r.next])
                .into_iter()
                .map(|k| d.inputs[k as usize].name.as_str())
                .collect()
        })
        .collect();
    let unknown: std::collections::BTreeSet<&str> = d
        .inputs
        .iter()
        .filter(|b| b.is_unknown())
        .map(|b| b.name.as_str())
        .collect();
    let mut notes = Vec::new();
    for (sc, ec) in c.outputs.iter().zip(&e.outputs) {
        if !audited.contains(sc.output.as_str()) {
            continue;
        }
        for i in &ec.inputs {
            if unknown.contains(i.input.as_str()) {
                continue;
            }
            match i.influence {
                Influence::Never => {
                    let direct = sc.inputs.get(&i.input) == Some(&0);
                    let registers: Vec<String> = d
                        .registers
                        .iter()
                        .zip(&loads)
                        .filter(|(r, l)| {
                            sc.registers.contains_key(&r.name) && l.contains(&i.input.as_str())
                        })
                        .map(|(r, _)| r.name.clone())
                        .collect();
                    let known = flags.iter().any(|f| {
                        matches!(f, Flag::RedundantInput { output, input, .. }
                            if *output == sc.output && *input == i.input)
                    });
                    if known && registers.is_empty() {
                        continue;
                    }
                    flags.push(Flag::RedundantAcrossCycles {
                        output: sc.output.clone(),
                        input: i.input.clone(),
                        direct,
                        registers,
                    });
                }
                Influence::NotWithinBound => notes.push(format!(
                    "{} does not change {} in the first {} cycles from reset (UNSAT in each), and later cycles are not covered: not flagged",
                    i.input, sc.output, e.cycles
                )),
                Influence::Depends | Influence::Undecided => {}
            }
        }
    }
    if all_outputs {
        let dead: std::collections::BTreeSet<&str> = e
            .dead_registers
            .iter()
            .map(|r| r.register.as_str())
            .collect();
        flags.retain(
            |f| !matches!(f, Flag::UnusedInput { input, .. } if dead.contains(input.as_str())),
        );
        for r in &e.dead_registers {
            flags.push(Flag::DeadRegister {
                register: r.register.clone(),
                why: r.why.clone(),
            });
        }
    }
    notes
}

/// Report order of the proofs of redundancy: SAT answers first, then structural ones.
fn proof_rank(by: IndependentBy) -> u8 {
    match by {
        IndependentBy::Unsat => 0,
        IndependentBy::CofactorsMerged => 1,
        IndependentBy::NoPath => 2,
    }
}

fn claims(design: &Design, r: &SupportResult) -> Vec<ClaimReport> {
    r.cone
        .iter()
        .zip(&r.claims)
        .map(|(&k, m)| ClaimReport {
            input: design.inputs[k].name.clone(),
            verdict: match m {
                Membership::Depends { vector, value, by } => ClaimVerdict::Depends {
                    by: *by,
                    vector: {
                        let mut b = Bits::new(r.cone.len());
                        for (i, &j) in r.cone.iter().enumerate() {
                            b.set(i, vector.get(j));
                        }
                        b
                    },
                    output_at_0: *value,
                },
                Membership::Independent(by) => ClaimVerdict::Independent {
                    by: *by,
                    sat: (*by == IndependentBy::Unsat).then_some("unsat"),
                },
                Membership::Undecided(reason) => ClaimVerdict::Undecided { reason: *reason },
            },
        })
        .collect()
}

/// Flag output pairs whose supports nest strictly where the expectations do not.
fn subset_flags(
    design: &Design,
    exp: &Expectation,
    results: &[SupportResult],
    flags: &mut Vec<Flag>,
) {
    let rows: Vec<(usize, Vec<usize>, &Vec<usize>)> = results
        .iter()
        .filter(|r| r.undecided().is_empty())
        .filter_map(|r| {
            exp.entries
                .get(&r.output)
                .map(|e| (r.output, r.support(), &e.inputs))
        })
        .collect();
    let strict = |a: &[usize], b: &[usize]| {
        a.len() < b.len() && a.iter().all(|x| b.binary_search(x).is_ok())
    };
    for (o1, s1, e1) in &rows {
        for (o2, s2, e2) in &rows {
            if o1 != o2 && strict(s1, s2) && !strict(e1, e2) {
                flags.push(Flag::SubsetSupport {
                    output: design.outputs[*o1].name.clone(),
                    of: design.outputs[*o2].name.clone(),
                });
            }
        }
    }
}
