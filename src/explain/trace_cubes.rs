//! Difference cubes of a trace of clocked designs (`prove --explain` on a clocked difference):
//! both designs unrolled from the reset state over the trace's cycles up to the first
//! difference (per-cycle inputs shared by name, held inputs at their values, registers without
//! a reset at the trace's initial values), the first differing output pair's XOR in that cycle
//! as the root, and the cubes of that root enumerated as for combinational pairs (ternary
//! simulation, then SAT-based lifting on the unrolled frames). A cube fixes some inputs in some
//! cycles; every input sequence that agrees with it makes the pair differ in that cycle.
//!
//! Notation: one line per cube, cycles in order, `cycle 0: en=1; cycle 2: sel=3, d[0]=1`
//! (within a cycle, buses by value as in the combinational notation); `always` when no input
//! matters.

use super::cubes::{cover_root, CoverEnd, CubeLimits};
use super::notation::{merge_pairs, term_text, Term};
use super::trace_run::initial_state;
use crate::aig::{Aig, Lit};
use crate::design::{Design, InputKind};
use crate::sat::Limits;
use crate::seq::{Side, Trace};
use serde::Serialize;
use std::collections::BTreeMap;
use std::fmt::Write;

/// The inputs one cube fixes in one cycle.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct CycleInputs {
    /// The cycle from reset.
    pub cycle: usize,
    /// Input bit name -> value.
    pub inputs: serde_json::Map<String, serde_json::Value>,
}

/// The cubes of a trace's first differing output pair.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct TraceCubes {
    /// Reference output bit.
    pub reference: String,
    /// Candidate output bit.
    pub candidate: String,
    /// The cycle in which the pair differs.
    pub cycle: usize,
    /// Input bits over all cycles up to it that reach the pair (the space the count refers to).
    pub inputs: usize,
    /// `complete`, `cube_limit`, or the SAT limit that stopped the enumeration.
    pub end: CoverEnd,
    /// The cube limit.
    pub max_cubes: usize,
    /// Exact number of differing input sequences over those inputs (complete covers only).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub differing_sequences: Option<serde_json::Value>,
    /// Disjoint cubes: per cube, the cycles with fixed inputs; other inputs and cycles are free.
    pub cubes: Vec<Vec<CycleInputs>>,
    /// The text notation, one line per cube.
    pub terms: Vec<String>,
}

/// Unrolled frames of one design: per cycle, its output literals.
fn unroll(
    aig: &mut Aig,
    d: &Design,
    side: Side,
    t: &Trace,
    vars: &[Vec<Lit>],
    upto: usize,
) -> Result<Vec<Vec<Lit>>, String> {
    let held: BTreeMap<&str, bool> = t
        .reset
        .held
        .iter()
        .filter_map(|h| Some((h.name_on(side)?, h.value)))
        .collect();
    let mut state: Vec<Lit> = initial_state(d, side, t)?
        .into_iter()
        .map(Lit::constant)
        .collect();
    let mut reg_of = vec![usize::MAX; d.inputs.len()];
    for (i, r) in d.registers.iter().enumerate() {
        reg_of[r.input] = i;
    }
    let mut roots: Vec<Lit> = d.outputs.iter().map(|o| o.lit).collect();
    roots.extend(d.registers.iter().map(|r| r.next));
    let n = d.outputs.len();
    let mut outs = Vec::new();
    for (k, cyc) in t.cycles.iter().enumerate().take(upto + 1) {
        let mut map = Vec::with_capacity(d.inputs.len());
        for (i, b) in d.inputs.iter().enumerate() {
            map.push(match b.kind {
                InputKind::Register => state[reg_of[i]],
                _ => match held.get(b.name.as_str()) {
                    Some(&v) => Lit::constant(v),
                    None => {
                        let j = cyc
                            .inputs
                            .iter()
                            .position(|x| x.name_on(side) == Some(b.name.as_str()))
                            .ok_or_else(|| {
                                format!(
                                    "cycle {k} of the trace gives no value for input `{}` of {}",
                                    b.name, d.name
                                )
                            })?;
                        vars[k][j]
                    }
                },
            });
        }
        let lits = aig.import(&d.aig, &map, &roots);
        outs.push(lits[..n].to_vec());
        state = lits[n..].to_vec();
    }
    Ok(outs)
}

/// The cubes of the first differing output pair of trace `t` (which must carry its first
/// difference).
pub fn trace_cubes(
    r: &Design,
    c: &Design,
    t: &Trace,
    cl: &CubeLimits,
    limits: &Limits,
) -> Result<TraceCubes, String> {
    let fd = t
        .first_difference
        .as_ref()
        .ok_or("the trace has no difference to explain")?;
    let od = fd
        .outputs
        .first()
        .ok_or("the trace's difference names no output")?;
    let (i, j) = match (r.output_index(&od.reference), c.output_index(&od.candidate)) {
        (Some(i), Some(j)) => (i, j),
        _ => return Err(format!("output {} is not in both designs", od.reference)),
    };
    let k = fd.cycle;
    let mut aig = Aig::new();
    // (cycle, position in the cycle's input list) of each unrolled input.
    let mut at: Vec<(usize, usize)> = Vec::new();
    let mut vars: Vec<Vec<Lit>> = Vec::new();
    let mut first: Vec<bool> = Vec::new();
    for (cy, cyc) in t.cycles.iter().enumerate().take(k + 1) {
        let mut v = Vec::new();
        for (p, x) in cyc.inputs.iter().enumerate() {
            v.push(aig.add_input());
            at.push((cy, p));
            first.push(x.value);
        }
        vars.push(v);
    }
    let ro = unroll(&mut aig, r, Side::Reference, t, &vars, k)?;
    let co = unroll(&mut aig, c, Side::Candidate, t, &vars, k)?;
    let (a, b) = (ro[k][i], co[k][j]);
    let root = aig.xor(a, b);
    let cov = cover_root(aig, root, Some(&first), cl, limits);
    let names: Vec<String> = at
        .iter()
        .map(|&(cy, p)| t.cycles[cy].inputs[p].name.clone())
        .collect();
    let mut cubes = Vec::new();
    for cube in &cov.cubes {
        let mut by_cycle: BTreeMap<usize, serde_json::Map<String, serde_json::Value>> =
            BTreeMap::new();
        for &(u, v) in &cube.lits {
            by_cycle
                .entry(at[u].0)
                .or_default()
                .insert(names[u].clone(), serde_json::Value::from(v as u8));
        }
        cubes.push(
            by_cycle
                .into_iter()
                .map(|(cycle, inputs)| CycleInputs { cycle, inputs })
                .collect(),
        );
    }
    // Text: cubes equal but for two flipped inputs of one cycle merge into a relation.
    // (Names qualified by cycle, so that a bus is one cycle's bits.)
    let qualified: Vec<String> = at
        .iter()
        .zip(&names)
        .map(|(&(cy, _), n)| format!("c{cy}.{n}"))
        .collect();
    let terms = merge_pairs(&cov.cubes, &qualified)
        .iter()
        .map(|term| term_line(term, &at, t))
        .collect();
    Ok(TraceCubes {
        reference: od.reference.clone(),
        candidate: od.candidate.clone(),
        cycle: k,
        inputs: cov.inputs.len(),
        end: cov.end,
        max_cubes: cl.max_cubes,
        differing_sequences: cov.differing.map(|n| match u64::try_from(n) {
            Ok(v) => v.into(),
            Err(_) => n.to_string().into(),
        }),
        cubes,
        terms,
    })
}

/// One line of the text form: per cycle, its fixed inputs (and a relation between two of them).
fn term_line(term: &Term, at: &[(usize, usize)], t: &Trace) -> String {
    let mut by_cycle: BTreeMap<usize, Term> = BTreeMap::new();
    for &(u, v) in &term.fixed {
        let (cy, p) = at[u];
        by_cycle
            .entry(cy)
            .or_insert(Term {
                fixed: Vec::new(),
                relation: None,
            })
            .fixed
            .push((p, v));
    }
    let mut extra = None;
    if let Some((x, y, eq)) = term.relation {
        let ((cx, px), (cy, py)) = (at[x], at[y]);
        if cx == cy {
            by_cycle
                .entry(cx)
                .or_insert(Term {
                    fixed: Vec::new(),
                    relation: None,
                })
                .relation = Some((px, py, eq));
        } else {
            let n = |c: usize, p: usize| format!("{} (cycle {c})", t.cycles[c].inputs[p].name);
            let op = if eq { "==" } else { "!=" };
            extra = Some(format!("{}{op}{}", n(cx, px), n(cy, py)));
        }
    }
    let mut parts: Vec<String> = by_cycle
        .iter()
        .map(|(cy, term)| {
            let names: Vec<String> = t.cycles[*cy]
                .inputs
                .iter()
                .map(|x| x.name.clone())
                .collect();
            format!("cycle {cy}: {}", term_text(term, &names))
        })
        .collect();
    parts.extend(extra);
    if parts.is_empty() {
        "always".to_string()
    } else {
        parts.join("; ")
    }
}

/// The text form: how far the cover goes, then one line per cube.
pub fn trace_cubes_text(e: &TraceCubes) -> String {
    let joined = e.terms.len() < e.cubes.len();
    let mut s = format!(
        "difference cubes of the trace (inputs from reset under which the pair differs in cycle {}; inputs and cycles not shown are free; registers without a reset start as in the trace{})\n",
        e.cycle,
        if joined {
            "; `x!=y` or `x==y` on a line stands for two cubes"
        } else {
            ""
        }
    );
    let name = if e.reference == e.candidate {
        e.reference.clone()
    } else {
        format!("{} / {}", e.reference, e.candidate)
    };
    let how = match (e.end, &e.differing_sequences) {
        (CoverEnd::Complete, Some(n)) => format!(
            "complete, {} of 2^{} input sequences over its {} input bits differ",
            n.to_string().trim_matches('"'),
            e.inputs,
            e.inputs
        ),
        (CoverEnd::Complete, None) => format!("complete, over {} input bits", e.inputs),
        (CoverEnd::CubeLimit, _) => format!(
            "incomplete: stopped at the limit of {} cubes (raise it with --explain-cubes)",
            e.max_cubes
        ),
        (CoverEnd::Stopped(r), _) => format!("incomplete: {r}"),
    };
    let n = e.cubes.len();
    let lines = if joined {
        format!(" in {} lines", e.terms.len())
    } else {
        String::new()
    };
    let _ = writeln!(
        s,
        "  {name} in cycle {}: {n} cube{}{lines}, {how}",
        e.cycle,
        if n == 1 { "" } else { "s" }
    );
    for t in &e.terms {
        let _ = writeln!(s, "    {t}");
    }
    s
}
