//! The text form of the cone audit report: outputs grouped by bus, runs of bits with the same
//! result written once, evidence on request, then the flags and the claim statistics.

use super::report::{AuditReport, ClaimVerdict, Flag, OutputAudit};
use super::structural::GraphSource;
use super::support::{DependsBy, IndependentBy};
use crate::bitrun::{extends, join_runs, run_label, run_name};
use std::fmt;

impl fmt::Display for AuditReport {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let graph = match self.graph {
            GraphSource::Netlist => "netlist as written",
            GraphSource::Aig => "and-inverter graph",
            GraphSource::Written => "expressions as written",
        };
        writeln!(
            f,
            "cone audit of {} (structural cones from the {graph})",
            self.design
        )?;
        let mut i = 0;
        while i < self.outputs.len() {
            // A bus: consecutive bits of the same vector port.
            let o = &self.outputs[i];
            let mut j = i + 1;
            if o.index.is_some() {
                while j < self.outputs.len()
                    && self.outputs[j].port == o.port
                    && self.outputs[j].index.is_some()
                {
                    j += 1;
                }
            }
            let bus = &self.outputs[i..j];
            if o.index.is_some() {
                writeln!(
                    f,
                    "{} ({} bit{}):",
                    bit_range(&o.port, bus.first(), bus.last()),
                    bus.len(),
                    if bus.len() == 1 { "" } else { "s" }
                )?;
                self.write_bits(f, bus, "  ")?;
            } else {
                self.write_bits(f, bus, "")?;
            }
            i = j;
        }
        let s = &self.stats;
        writeln!(
            f,
            "claims: {} ({} by simulation: {} random, {} replayed SAT models; {} by SAT: {} depends, {} does not depend; {} by structure; {} undecided)",
            s.claims,
            s.by_simulation(),
            s.depends_by_random_simulation,
            s.depends_by_replayed_simulation,
            s.by_sat(),
            s.depends_by_sat,
            s.independent_by_sat,
            s.independent_by_structure,
            s.undecided
        )?;
        if self.flags.is_empty() {
            writeln!(f, "flags: none")?;
        } else {
            writeln!(f, "flags ({}):", self.flags.len())?;
            for line in flag_lines(&self.flags) {
                writeln!(f, "  {line}")?;
            }
        }
        for note in &self.notes {
            writeln!(f, "note: {note}")?;
        }
        let verdict = if self.flagged() {
            format!("{} flagged", self.flags.len())
        } else if self.undecided() {
            format!("nothing flagged, {} claims undecided", self.stats.undecided)
        } else {
            "nothing flagged".to_string()
        };
        writeln!(f, "result: {verdict}")?;
        match &self.across_cycles {
            Some(c) => write!(f, "{c}"),
            None => Ok(()),
        }
    }
}

fn bit_range(port: &str, first: Option<&OutputAudit>, last: Option<&OutputAudit>) -> String {
    match (first.and_then(|o| o.index), last.and_then(|o| o.index)) {
        (Some(a), Some(b)) if a != b => format!("{port}[{a}..{b}]"),
        (Some(a), _) => format!("{port}[{a}]"),
        _ => port.to_string(),
    }
}

impl AuditReport {
    fn write_bits(
        &self,
        f: &mut fmt::Formatter<'_>,
        bits: &[OutputAudit],
        ind: &str,
    ) -> fmt::Result {
        let mut i = 0;
        while i < bits.len() {
            let o = &bits[i];
            let mut j = i + 1;
            // Collapse a run of bits whose results read the same (without evidence only).
            while !self.text_evidence
                && j < bits.len()
                && bits[j].support == o.support
                && bits[j].cone == o.cone
                && bits[j].constant == o.constant
                && bits[j].undecided.is_empty()
                && o.undecided.is_empty()
            {
                j += 1;
            }
            let label = if j - i > 1 {
                bit_range(&o.port, Some(o), Some(&bits[j - 1]))
            } else {
                o.name.clone()
            };
            write_output(f, &label, o, ind)?;
            if self.text_evidence {
                write_evidence(f, o, ind)?;
            }
            i = j;
        }
        Ok(())
    }
}

fn write_output(
    f: &mut fmt::Formatter<'_>,
    label: &str,
    o: &OutputAudit,
    ind: &str,
) -> fmt::Result {
    match o.constant {
        Some(v) => writeln!(
            f,
            "{ind}{label}: constant {} (cone {} input{}, {} gate{})",
            v as u8,
            o.cone.len(),
            plural(o.cone.len()),
            o.cone_gates,
            plural(o.cone_gates)
        )?,
        None => writeln!(
            f,
            "{ind}{label}: support {} of cone {} input{} ({} gate{}): {}",
            o.support.len(),
            o.cone.len(),
            plural(o.cone.len()),
            o.cone_gates,
            plural(o.cone_gates),
            o.support_text
        )?,
    }
    // Redundant inputs grouped by their proof.
    for by in [
        IndependentBy::Unsat,
        IndependentBy::CofactorsMerged,
        IndependentBy::NoPath,
    ] {
        let names: Vec<&str> = o
            .claims
            .iter()
            .filter(|c| matches!(&c.verdict, ClaimVerdict::Independent { by: b, .. } if *b == by))
            .map(|c| c.input.as_str())
            .collect();
        if !names.is_empty() {
            writeln!(f, "{ind}  redundant ({}): {}", proof(by), names.join(", "))?;
        }
    }
    if !o.undecided.is_empty() {
        let und: Vec<String> = o
            .claims
            .iter()
            .filter_map(|c| match &c.verdict {
                ClaimVerdict::Undecided { reason } => Some(format!("{} ({reason})", c.input)),
                _ => None,
            })
            .collect();
        writeln!(f, "{ind}  undecided: {}", und.join(", "))?;
    }
    if let Some(e) = &o.expected {
        writeln!(f, "{ind}  expected {} input{}", e.len(), plural(e.len()))?;
    }
    Ok(())
}

fn write_evidence(f: &mut fmt::Formatter<'_>, o: &OutputAudit, ind: &str) -> fmt::Result {
    for c in &o.claims {
        if let ClaimVerdict::Depends {
            by,
            vector,
            output_at_0,
        } = &c.verdict
        {
            let v0 = *output_at_0 as u8;
            let v1 = !*output_at_0 as u8;
            let shown = if o.cone.len() <= 16 {
                o.cone
                    .iter()
                    .zip(vector.chars())
                    .map(|(n, b)| format!("{n}={b}"))
                    .collect::<Vec<_>>()
                    .join(" ")
            } else {
                format!("cone bits {vector}")
            };
            writeln!(
                f,
                "{ind}    depends on {}: {}={v0} at [{shown}], {}={v1} with {}=1 ({})",
                c.input,
                o.name,
                o.name,
                c.input,
                depends_by(*by)
            )?;
        }
    }
    Ok(())
}

fn plural(n: usize) -> &'static str {
    if n == 1 {
        ""
    } else {
        "s"
    }
}

fn proof(by: IndependentBy) -> &'static str {
    match by {
        IndependentBy::Unsat => "sat: unsat",
        IndependentBy::CofactorsMerged => "cofactors identical after structural hashing",
        IndependentBy::NoPath => "no path after structural hashing",
    }
}

fn depends_by(by: DependsBy) -> &'static str {
    match by {
        DependsBy::RandomSimulation => "random simulation",
        DependsBy::ReplayedSimulation => "simulation of a SAT model",
        DependsBy::Sat => "sat: model",
    }
}

/// One printed flag line before grouping: redundant inputs of one output with one proof, an
/// unused input, or any other flag.
enum Line<'a> {
    Redundant {
        outputs: Vec<&'a str>,
        inputs: Vec<&'a str>,
        by: IndependentBy,
    },
    Unused {
        inputs: Vec<&'a str>,
        connected: bool,
    },
    /// An input that never changes the outputs across cycles (one input, one way in).
    Across {
        outputs: Vec<&'a str>,
        input: &'a str,
        direct: bool,
        registers: &'a [String],
    },
    /// Dead registers with one reason.
    Dead {
        registers: Vec<&'a str>,
        why: &'a str,
    },
    Other(&'a Flag),
}

/// The flags as text lines, with repeats grouped: the redundant inputs of one output and one
/// proof on one line, then the bits of one output bus with the same redundant inputs on one
/// line (the demo's eight `redundant test_mode` lines become one), and the unused bits of one
/// input bus on one line.
fn flag_lines(flags: &[Flag]) -> Vec<String> {
    let mut lines: Vec<Line> = Vec::new();
    for fl in flags {
        match fl {
            Flag::RedundantInput { output, input, by } => {
                if let Some(Line::Redundant {
                    outputs,
                    inputs,
                    by: b,
                }) = lines.last_mut()
                {
                    if outputs.len() == 1 && outputs[0] == output && b == by {
                        inputs.push(input);
                        continue;
                    }
                }
                lines.push(Line::Redundant {
                    outputs: vec![output],
                    inputs: vec![input],
                    by: *by,
                });
            }
            Flag::UnusedInput { input, connected } => {
                if let Some(Line::Unused {
                    inputs,
                    connected: c,
                }) = lines.last_mut()
                {
                    if c == connected && extends(inputs, input) {
                        inputs.push(input);
                        continue;
                    }
                }
                lines.push(Line::Unused {
                    inputs: vec![input],
                    connected: *connected,
                });
            }
            Flag::RedundantAcrossCycles {
                output,
                input,
                direct,
                registers,
            } => {
                if let Some(Line::Across {
                    outputs,
                    input: i,
                    direct: d,
                    registers: r,
                }) = lines.last_mut()
                {
                    if i == input && d == direct && *r == registers && extends(outputs, output) {
                        outputs.push(output);
                        continue;
                    }
                }
                lines.push(Line::Across {
                    outputs: vec![output],
                    input,
                    direct: *direct,
                    registers,
                });
            }
            Flag::DeadRegister { register, why } => {
                if let Some(Line::Dead { registers, why: w }) = lines.last_mut() {
                    if w == why && extends(registers, register) {
                        registers.push(register);
                        continue;
                    }
                }
                lines.push(Line::Dead {
                    registers: vec![register],
                    why,
                });
            }
            other => lines.push(Line::Other(other)),
        }
    }
    // Bits of one output bus with the same redundant inputs and proof.
    let mut grouped: Vec<Line> = Vec::new();
    for l in lines {
        if let (
            Line::Redundant {
                outputs,
                inputs,
                by,
            },
            Some(Line::Redundant {
                outputs: o2,
                inputs: i2,
                by: b2,
            }),
        ) = (&l, grouped.last_mut())
        {
            if outputs.len() == 1 && *i2 == *inputs && b2 == by && extends(o2, outputs[0]) {
                o2.push(outputs[0]);
                continue;
            }
        }
        grouped.push(l);
    }
    grouped
        .into_iter()
        .map(|l| match l {
            Line::Redundant {
                outputs,
                inputs,
                by,
            } => {
                let (noun, verb) = if inputs.len() == 1 {
                    ("input", "is")
                } else {
                    ("inputs", "are")
                };
                let (who, does, its) = if outputs.len() == 1 {
                    (outputs[0].to_string(), "does", "its cone")
                } else {
                    (
                        run_label(&outputs),
                        "do",
                        "each one's cone",
                    )
                };
                format!(
                    "redundant {noun}: {who} {does} not depend on {}, which {verb} wired into {its} ({})",
                    inputs.join(", "),
                    proof(by)
                )
            }
            Line::Unused { inputs, connected } => {
                let who = run_label(&inputs);
                let (noun, verb) = if inputs.len() == 1 {
                    ("input", "reaches")
                } else {
                    ("inputs", "reach")
                };
                let its = if inputs.len() == 1 { "its" } else { "their" };
                if connected {
                    format!("unused {noun}: {who} {verb} no output's support ({its} logic is dead or masked)")
                } else if inputs.len() == 1 {
                    format!("unused input: {who} is not connected to any output")
                } else {
                    format!("unused inputs: {who} are not connected to any output")
                }
            }
            Line::Across {
                outputs,
                input,
                direct,
                registers,
            } => {
                let regs: Vec<(String, String)> =
                    registers.iter().map(|r| (r.clone(), String::new())).collect();
                let regs = join_runs(&regs, run_name).join(", ");
                let through = format!("through register{} {regs}", plural(registers.len()));
                let way = match (direct, registers.is_empty()) {
                    (true, true) => "directly".to_string(),
                    (true, false) => format!("directly and {through}"),
                    (false, _) => through,
                };
                let them = if outputs.len() == 1 { "it" } else { "them" };
                format!(
                    "redundant across cycles: {input} reaches {} {way} and never changes {them} in any cycle from reset (no chain of exact one-cycle dependences)",
                    run_label(&outputs)
                )
            }
            Line::Dead { registers, why } => {
                let (noun, verb, is) = if registers.len() == 1 {
                    ("register", "reaches", "is")
                } else {
                    ("registers", "reach", "are")
                };
                let what = match why {
                    "reaches no output" => format!("{verb} no output in any cycle from reset"),
                    other => format!("{is} {other} in every state reachable from reset"),
                };
                format!("dead {noun}: {} {what}", run_label(&registers))
            }
            Line::Other(fl) => flag_text(fl),
        })
        .collect()
}

fn flag_text(fl: &Flag) -> String {
    match fl {
        Flag::RedundantInput { output, input, by } => format!(
            "redundant input: {output} does not depend on {input}, which is wired into its cone ({})",
            proof(*by)
        ),

        Flag::UnusedInput { input, connected } => {
            if *connected {
                format!("unused input: {input} reaches no output's support (its logic is dead or masked)")
            } else {
                format!("unused input: {input} is not connected to any output")
            }
        }
        Flag::ConstantOutput { output, value } => {
            format!("constant output: {output} is always {}", *value as u8)
        }
        Flag::UnknownInSupport {
            output,
            source,
            what,
            pos,
        } => format!("unknown value in support: {output} depends on {source} ({what} at {pos})"),
        Flag::MissingInput {
            output,
            input,
            expected_at,
        } => format!(
            "missing input: {output} does not depend on {input} (expected at {expected_at})"
        ),
        Flag::UnexpectedInput {
            output,
            input,
            expected_at,
        } => format!(
            "unexpected input: {output} depends on {input}, which the expectation at {expected_at} does not list"
        ),
        Flag::SubsetSupport { output, of } => format!(
            "support subset: the support of {output} is a strict subset of that of {of}, which the expectation does not say"
        ),
        // Written by `flag_lines` itself (grouped).
        Flag::RedundantAcrossCycles { output, input, .. } => {
            format!("redundant across cycles: {input} never changes {output}")
        }
        Flag::DeadRegister { register, why } => format!("dead register: {register} ({why})"),
    }
}
