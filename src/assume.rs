//! Assumptions (`--assume EXPR`): Boolean conditions over a design's input ports, written in
//! Verilog expression syntax and elaborated by the Verilog front-end, under which equivalence,
//! supports and routes are asked. Several assumptions must all hold.
//!
//! Each expression becomes a one-line module whose ports are the design's input ports; its
//! logic is imported into the AIG at hand with inputs matched by name. An assumption that no
//! input vector satisfies is an error, never a vacuous proof.

use crate::aig::{Aig, Lit};
use crate::design::Design;
use crate::diag::{Diagnostic, InputError, Kind, SourcePos, Stage};
use crate::front::verilog::read_verilog;
use crate::sat::{Limits, Sat, SatResult};
use std::collections::BTreeMap;
use std::sync::Arc;

/// Line of the synthetic module on which the expression stands.
const EXPR_LINE: u32 = 3;

/// Elaborate `exprs` over the input ports of `designs` (their union: the reference's and the
/// candidate's, so that a pin of one side alone can be tied) and import their conjunction
/// into `aig`, whose inputs for the port bits are given by `input_of(bit name)`. An
/// expression that reads a bit `input_of` does not know (a port of the other design only) is
/// an error naming it.
pub fn constraint(
    designs: &[&Design],
    exprs: &[String],
    aig: &mut Aig,
    input_of: &dyn Fn(&str) -> Option<Lit>,
) -> Result<Lit, InputError> {
    let mut all = Lit::TRUE;
    for (k, e) in exprs.iter().enumerate() {
        let lit = one(designs, k, e, aig, input_of)?;
        all = aig.and(all, lit);
    }
    Ok(all)
}

/// Ports of `designs` as (name, lowest index, highest index) for vectors, in first-seen order.
fn ports(designs: &[&Design]) -> Vec<(String, Option<(i64, i64)>)> {
    let mut order: Vec<String> = Vec::new();
    let mut range: BTreeMap<String, Option<(i64, i64)>> = BTreeMap::new();
    for b in designs
        .iter()
        .flat_map(|d| d.inputs.iter())
        .filter(|b| !b.is_unknown())
    {
        let e = range.entry(b.port.clone()).or_insert_with(|| {
            order.push(b.port.clone());
            b.index.map(|i| (i, i))
        });
        if let (Some((lo, hi)), Some(i)) = (e.as_mut(), b.index) {
            *lo = (*lo).min(i);
            *hi = (*hi).max(i);
        }
    }
    order
        .into_iter()
        .map(|p| {
            let r = range[&p];
            (p, r)
        })
        .collect()
}

fn one(
    designs: &[&Design],
    k: usize,
    expr: &str,
    aig: &mut Aig,
    input_of: &dyn Fn(&str) -> Option<Lit>,
) -> Result<Lit, InputError> {
    let label: Arc<str> = Arc::from(format!("--assume #{}", k + 1));
    if expr.contains('\n') || expr.contains(';') || expr.trim().is_empty() {
        return Err(InputError::one(
            Diagnostic::error(
                Some(SourcePos::new(&label, 1, 1)),
                "an assumption is one Verilog expression on one line",
            )
            .with_help("for example `--assume 'sel < 12'`")
            .in_stage(Stage::Assume),
        ));
    }
    let ports = ports(designs);
    // A bus declared `[0:7]` is declared so here too, so that `a == 1` means what it means
    // in the design (the lowest index is the most significant bit).
    let ascending: std::collections::BTreeSet<String> = designs
        .first()
        .map(|d| d.ascending_ports())
        .unwrap_or_default();
    let decls: Vec<String> = ports
        .iter()
        .map(|(p, r)| match r {
            Some((lo, hi)) if ascending.contains(p) => {
                format!("input wire [{lo}:{hi}] {}", verilog_name(p))
            }
            Some((lo, hi)) => format!("input wire [{hi}:{lo}] {}", verilog_name(p)),
            None => format!("input wire {}", verilog_name(p)),
        })
        .collect();
    let names: Vec<String> = ports.iter().map(|(p, _)| verilog_name(p)).collect();
    let text = format!(
        "module equicone_assumption({}, output wire equicone_ok);\nassign equicone_ok = |(\n{expr}\n);\nendmodule\n",
        decls.join(", ")
    );
    let a = read_verilog(&[(label.clone(), text)], Some("equicone_assumption"))
        .map_err(|e| {
            // The reader's advice for a syntax error or a name that is not declared speaks of
            // modules; here the ports are what the user can name.
            let generic: Vec<bool> = e
                .diagnostics
                .iter()
                .map(|d| d.help.is_none() || matches!(d.kind, Kind::Grammar { .. } | Kind::UndeclaredName))
                .collect();
            let mut e = relocate(e, &label, expr.chars().count() as u32);
            for (d, generic) in e.diagnostics.iter_mut().zip(generic) {
                if generic {
                    d.help = Some(format!(
                        "an assumption is a Verilog expression over the input ports ({}), e.g. `--assume 'sel < 12'`",
                        shorten(&names)
                    ));
                }
            }
            e
        })?;
    if let Some(u) = a.inputs.iter().find(|b| b.is_unknown()) {
        let col = u
            .pos
            .as_ref()
            .filter(|p| p.line == EXPR_LINE)
            .map_or(1, |p| p.col);
        return Err(InputError::one(
            Diagnostic::error(
                Some(SourcePos::new(&label, 1, col)),
                "the assumption can read an unknown value (an x or z bit, or a select out of range)",
            )
            .with_help("write the condition without x/z literals or out-of-range selects")
            .in_stage(Stage::Assume),
        ));
    }
    let root = a.outputs[0].lit;
    let read = a.aig.cone_inputs(&[root]);
    let mut map = vec![Lit::FALSE; a.inputs.len()];
    for (i, b) in a.inputs.iter().enumerate() {
        match input_of(&b.name) {
            Some(l) => map[i] = l,
            None if read.contains(&(i as u32)) => {
                return Err(InputError::one(
                    Diagnostic::error(
                        Some(SourcePos::new(&label, 1, 1)),
                        format!(
                            "the assumption reads `{}`, which this design does not have",
                            b.name
                        ),
                    )
                    .with_help(
                        "an assumption over a pin of one design only applies where that pin exists",
                    ),
                ))
            }
            // Declared but not read: its value does not matter.
            None => {}
        }
    }
    Ok(aig.import(&a.aig, &map, &[root])[0])
}

/// A port name as a Verilog identifier: plain when it is one, else escaped (`\\1 `), as bench
/// names such as ISCAS-85's `1` or `G1gat.x` need.
fn verilog_name(p: &str) -> String {
    let mut cs = p.chars();
    let plain = cs
        .next()
        .is_some_and(|c| c.is_ascii_alphabetic() || c == '_')
        && cs.all(|c| c.is_ascii_alphanumeric() || c == '_' || c == '$');
    if plain {
        p.to_string()
    } else {
        format!("\\{p} ")
    }
}

/// The first few names of a list, for a message.
fn shorten(names: &[String]) -> String {
    let mut s = names
        .iter()
        .take(8)
        .map(|n| n.trim_end().to_string())
        .collect::<Vec<_>>()
        .join(", ");
    if names.len() > 8 {
        s.push_str(&format!(", ... ({} ports)", names.len()));
    }
    s
}

/// Move positions in the synthetic module back to the user's expression.
fn relocate(mut e: InputError, label: &Arc<str>, len: u32) -> InputError {
    for d in &mut e.diagnostics {
        if let Some(p) = &mut d.pos {
            if p.file == *label {
                if p.line != EXPR_LINE {
                    // Before the expression: its start; after it: just past its end.
                    p.col = if p.line < EXPR_LINE { 1 } else { len + 1 };
                    if p.line > EXPR_LINE {
                        // What was found there is the wrapper's text, not the user's.
                        if let Kind::Grammar { found_at: Some(i) } = d.kind {
                            d.message.truncate(i as usize);
                            d.message += ", found the end of the assumption";
                        }
                    }
                }
                p.line = 1;
            }
        }
    }
    e
}

/// Fail when no input vector satisfies `c` (a literal of `aig`).
pub fn check_satisfiable(aig: &Aig, c: Lit, exprs: &[String]) -> Result<(), InputError> {
    if c == Lit::TRUE || exprs.is_empty() {
        return Ok(());
    }
    let limits = Limits::none();
    let mut sat = Sat::new(&limits);
    let mut ts = crate::cnf::Tseitin::new();
    let l = ts.lit(aig, &mut sat, c);
    if sat.solve(&[l]) == SatResult::Unsat {
        return Err(InputError::plain(
            format!(
                "no input vector satisfies the assumptions: {}",
                exprs.join(" && ")
            ),
            "an unsatisfiable assumption would make every claim vacuous; correct or drop it",
        )
        .in_stage(Stage::Assume));
    }
    Ok(())
}

/// A copy of `d` with the assumptions built into its AIG, and their literal there.
pub fn on_design(d: &Design, exprs: &[String]) -> Result<(Design, Lit), InputError> {
    let mut out = d.clone();
    if exprs.is_empty() {
        return Ok((out, Lit::TRUE));
    }
    let names: BTreeMap<String, Lit> = d
        .inputs
        .iter()
        .enumerate()
        .map(|(k, b)| (b.name.clone(), d.aig.input_lit(k)))
        .collect();
    let c = constraint(&[d], exprs, &mut out.aig, &|n| names.get(n).copied())?;
    check_satisfiable(&out.aig, c, exprs)?;
    Ok((out, c))
}

/// Build the assumptions into a proof's shared AIG and set its constraint; fails when they
/// are unsatisfiable. Names are the reference's port bits, then the candidate's that the
/// reference lacks (an input of the candidate alone, such as a scan pin left free by
/// `--free-extra-inputs`, can be tied; with `--pair-by position` the candidate's names work
/// too).
pub fn apply_to_shared(
    shared: &mut crate::engine::Shared,
    r: &Design,
    c: &Design,
    exprs: &[String],
) -> Result<(), InputError> {
    if exprs.is_empty() {
        return Ok(());
    }
    let mut by_name: BTreeMap<String, Lit> = BTreeMap::new();
    for (d, map) in [(r, &shared.ref_input), (c, &shared.cand_input)] {
        for (i, &k) in map.iter().enumerate() {
            if k != usize::MAX && !d.inputs[i].is_unknown() {
                by_name
                    .entry(d.inputs[i].name.clone())
                    .or_insert_with(|| shared.aig.input_lit(k));
            }
        }
    }
    let mut aig = std::mem::take(&mut shared.aig);
    let c = constraint(&[r, c], exprs, &mut aig, &|n| by_name.get(n).copied())
        .and_then(|c| check_satisfiable(&aig, c, exprs).map(|_| c));
    shared.aig = aig;
    shared.constraint = c?;
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    fn design() -> Design {
        let src = "module m(input [1:0] s, input d, output y); assign y = d & s[0]; endmodule";
        crate::front::verilog::read_verilog(&[(Arc::from("m.v"), src.to_string())], None).unwrap()
    }

    fn error(expr: &str) -> Diagnostic {
        let d = design();
        let mut aig = Aig::new();
        let e = constraint(&[&d], &[expr.to_string()], &mut aig, &|_| None).unwrap_err();
        e.diagnostics[0].clone()
    }

    const PORT_HELP: &str =
        "an assumption is a Verilog expression over the input ports (s, d), e.g. `--assume 'sel < 12'`";

    #[test]
    fn a_name_that_is_not_a_port_gets_the_ports_help() {
        let d = error("s < q");
        assert_eq!(d.stage, Stage::Elaborate);
        assert_eq!(d.pos.as_ref().map(|p| p.col), Some(5), "{d}");
        assert_eq!(d.help.as_deref(), Some(PORT_HELP));
    }

    #[test]
    fn a_grammar_error_gets_the_ports_help() {
        let d = error("s <");
        assert!(matches!(d.kind, Kind::Grammar { .. }), "{d}");
        assert_eq!(d.help.as_deref(), Some(PORT_HELP));
    }

    #[test]
    fn other_errors_keep_their_own_help() {
        let d = error("s;");
        assert_eq!(d.stage, Stage::Assume);
        assert_eq!(d.help.as_deref(), Some("for example `--assume 'sel < 12'`"));
        // A port read where a constant is needed: the reader's own advice stays.
        let d = error("d[s:0]");
        assert_eq!(d.stage, Stage::Elaborate);
        assert_ne!(d.help.as_deref(), Some(PORT_HELP), "{d}");
    }
}
