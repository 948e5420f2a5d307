//! The text form of a clocked check's report; a trace prints as a table, one row per cycle from
//! reset, one column per input bus (its value as a number, bit j of the number being the bus bit with
//! the j-th smallest index; buses over 16 bits in hexadecimal, `N'h...`) and the differing outputs as `reference/candidate` values.

use super::product::Side;
use super::report::SeqReport;
use super::trace::Trace;
use crate::design::split_bit;
use std::collections::BTreeMap;
use std::fmt::{self, Write};

/// Column key of an input bit: (bus, side, the candidate's bus when a port map renames it).
type Column = (String, Side, Option<String>);

/// A column and its bits: (bit index, position in the cycle's inputs), by index.
type Bits = (Column, Vec<(Option<i64>, usize)>);

/// The columns of a trace's inputs, in first-appearance order, with each bit's (index, position).
fn columns(t: &Trace) -> Vec<Bits> {
    let mut cols: Vec<Bits> = Vec::new();
    if let Some(c0) = t.cycles.first() {
        let mut at: BTreeMap<Column, usize> = BTreeMap::new();
        for (k, i) in c0.inputs.iter().enumerate() {
            let (port, index) = split_bit(&i.name);
            let cand = i
                .candidate_name
                .as_deref()
                .map(|n| split_bit(n).0.to_string())
                .filter(|n| n != port);
            let key = (port.to_string(), i.side, cand);
            let slot = *at.entry(key.clone()).or_insert_with(|| {
                cols.push((key, Vec::new()));
                cols.len() - 1
            });
            cols[slot].1.push((index, k));
        }
        for c in &mut cols {
            c.1.sort();
        }
    }
    cols
}

/// Buses wider than this print in hexadecimal (`N'h...`, as in combinational counterexamples),
/// narrower ones as decimal numbers.
const WIDE: usize = 16;

/// Write `t` as a table; `outputs` holds per cycle the (reference, candidate) values of the
/// outputs that differ at the first difference.
pub fn trace_table(t: &Trace, outputs: &[Vec<(bool, bool)>]) -> String {
    let mut s = String::new();
    let cols = columns(t);
    let mut header = vec!["cycle".to_string()];
    for ((port, side, cand), _) in &cols {
        header.push(match side {
            Side::Both => match cand {
                Some(cn) => format!("{port}|{cn}"),
                None => port.clone(),
            },
            Side::Reference => format!("{port}(ref)"),
            Side::Candidate => format!("{port}(cand)"),
        });
    }
    let fd = t.first_difference.as_ref();
    if let Some(fd) = fd {
        for d in &fd.outputs {
            header.push(if d.reference == d.candidate {
                d.reference.clone()
            } else {
                format!("{}|{}", d.reference, d.candidate)
            });
        }
    }
    let mut rows = vec![header];
    for (ci, c) in t.cycles.iter().enumerate() {
        let mut row = vec![c.cycle.to_string()];
        for (_, bits) in &cols {
            if bits.len() == 1 && bits[0].0.is_none() {
                row.push((c.inputs[bits[0].1].value as u8).to_string());
            } else if bits.len() > WIDE {
                // Wide buses as the combinational counterexamples print them: `N'h...`.
                let msb_first: Vec<bool> =
                    bits.iter().rev().map(|&(_, k)| c.inputs[k].value).collect();
                row.push(crate::design::hex_text(&msb_first));
            } else {
                let v = bits
                    .iter()
                    .enumerate()
                    .filter(|&(_, &(_, k))| c.inputs[k].value)
                    .fold(0u32, |acc, (j, _)| acc | 1 << j);
                row.push(v.to_string());
            }
        }
        if let Some(o) = outputs.get(ci) {
            for (a, b) in o {
                row.push(format!("{}/{}", *a as u8, *b as u8));
            }
        }
        rows.push(row);
    }
    let ncol = rows[0].len();
    let width: Vec<usize> = (0..ncol)
        .map(|j| {
            rows.iter()
                .map(|r| r.get(j).map_or(0, |x| x.len()))
                .max()
                .unwrap_or(0)
        })
        .collect();
    for (ri, r) in rows.iter().enumerate() {
        let mut line = String::from("  ");
        for (j, cell) in r.iter().enumerate() {
            let _ = write!(line, "{:>w$}  ", cell, w = width[j]);
        }
        let mut line = line.trim_end().to_string();
        if ri > 0 && fd.is_some_and(|f| f.cycle + 1 == ri) {
            line.push_str("   <- first difference");
        }
        s.push_str(&line);
        s.push('\n');
    }
    s
}

impl fmt::Display for SeqReport {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        writeln!(
            f,
            "clocked check: reference {} ({} register bits), candidate {} ({} register bits)",
            self.reference, self.registers[0], self.candidate, self.registers[1]
        )?;
        writeln!(f, "scope: {}", self.scope)?;
        if !self.held.is_empty() {
            let h: Vec<String> = self
                .held
                .iter()
                .map(|h| {
                    let name = match &h.candidate_name {
                        Some(cn) => format!("{} <-> {cn}", h.name),
                        None => h.name.clone(),
                    };
                    format!("{name}={} ({})", h.value as u8, h.role)
                })
                .collect();
            writeln!(f, "held in every cycle: {}", h.join(", "))?;
        }
        if !self.paired.is_empty() {
            writeln!(
                f,
                "ports renamed by the port map {}:",
                self.port_map.as_deref().unwrap_or("-")
            )?;
            f.write_str(&crate::engine::pair_runs::runs_text(&self.paired))?;
        }
        if !self.without_reset.is_empty() {
            let how = match self.init_unset.as_str() {
                "free" if self.port_map.is_some() => "start at free values (a register and its same-named or port-map partner share one)"
                    .to_string(),
                "free" => "start at free values (a register and its same-named partner share one)"
                    .to_string(),
                v => format!("start at {v} (--init-unset {v})"),
            };
            writeln!(
                f,
                "registers without a reset ({}) {how}: {}",
                self.without_reset.len(),
                self.without_reset.join(", ")
            )?;
        }
        writeln!(
            f,
            "register pairs ({}), inductive from reset:",
            self.pairs.len()
        )?;
        let w = self
            .pairs
            .iter()
            .map(|p| p.reference.len())
            .max()
            .unwrap_or(0);
        for p in &self.pairs {
            let inv = if p.inverted { "!" } else { "" };
            let how = if p.inverted {
                format!("by {}, inverted", p.found_by)
            } else {
                format!("by {}", p.found_by)
            };
            writeln!(f, "  {:<w$} = {inv}{}   {how}", p.reference, p.candidate)?;
        }
        writeln!(f, "  evidence: {}", self.pairing_evidence)?;
        if !self.assumed_start_equal.is_empty() {
            let v: Vec<String> = self
                .assumed_start_equal
                .iter()
                .map(|s| {
                    let inv = if s.inverted { "!" } else { "" };
                    format!("{} = {inv}{}", s.reference, s.candidate)
                })
                .collect();
            writeln!(
                f,
                "assumption (port map {}): these registers without a reset start equal, so the verdict covers only runs that power up so: {}",
                self.port_map.as_deref().unwrap_or("-"),
                v.join(", ")
            )?;
        }
        if !self.unpaired.is_empty() {
            writeln!(f, "unpaired registers ({}):", self.unpaired.len())?;
            for u in &self.unpaired {
                writeln!(f, "  {} {}: {}", u.side.word(), u.register, u.note)?;
            }
        }
        for m in &self.name_mismatches {
            writeln!(
                f,
                "names match but not paired: reference {} / candidate {}: {}",
                m.reference, m.candidate, m.evidence
            )?;
        }
        for m in &self.map_mismatches {
            writeln!(
                f,
                "in the port map but not paired: reference {} / candidate {}: {}",
                m.reference, m.candidate, m.evidence
            )?;
        }
        writeln!(f, "output pairs:")?;
        for o in &self.outputs {
            let name = if o.reference == o.candidate {
                o.reference.clone()
            } else {
                format!("{} / {}", o.reference, o.candidate)
            };
            if o.status == "undecided" {
                // No method decided it: say what was checked rather than a method of "none".
                writeln!(
                    f,
                    "  {name}: undecided (not proved; no difference in the cycles checked from reset)"
                )?;
            } else {
                writeln!(f, "  {name}: {} ({})", o.status, o.method)?;
            }
        }
        if let Some(t) = &self.trace {
            let fd = t.first_difference.as_ref().expect("a shown trace differs");
            writeln!(
                f,
                "trace: the designs first differ in cycle {} after reset (replayed on both designs)",
                fd.cycle
            )?;
            writeln!(f, "  reset: {}", t.reset.description)?;
            if !t.reset.initial.is_empty() {
                let v: Vec<String> = t
                    .reset
                    .initial
                    .iter()
                    .map(|i| format!("{} {}={}", i.side.word(), i.register, i.value as u8))
                    .collect();
                writeln!(f, "  initial values: {}", v.join(", "))?;
                let sides: std::collections::BTreeSet<&str> =
                    t.reset.initial.iter().map(|i| i.side.word()).collect();
                if sides.len() > 1 {
                    writeln!(
                        f,
                        "  (registers without a reset start at free values, so the two designs may power up differently, as here; only same-named registers share one value: if both always power up alike, give their registers the same names or pair them in a port map, --port-map)"
                    )?;
                }
            }
            f.write_str(&trace_table(t, &self.trace_outputs))?;
        } else if !self.open_under_cut.is_empty() {
            writeln!(
                f,
                "not proved under the register pairing: {}",
                self.open_under_cut.join(", ")
            )?;
            if let Some(k) = &self.k_induction {
                match k.proved_at {
                    Some(d) => {
                        writeln!(
                            f,
                            "proved by k-induction at depth {d}: the unrolling from reset found no difference in cycles 0..{}, and on every loop-free run of {} cycles (register pairs holding) outputs that agree in the first {d} agree in the last",
                            d.saturating_sub(1),
                            d + 1
                        )?;
                        if let Some(r) = self.stopped {
                            writeln!(f, "stopped: {r}")?;
                        }
                        return writeln!(f, "verdict: {}", self.verdict);
                    }
                    None => writeln!(
                        f,
                        "k-induction up to depth {} did not prove them (--k-induction K to go deeper)",
                        k.bound
                    )?,
                }
            }
            writeln!(
                f,
                "no difference in the first {} cycles from reset (bounded unrolling; --cycles to check more); this is not a proof",
                self.cycles_checked
            )?;
        }
        if let Some(r) = self.stopped {
            writeln!(f, "stopped: {r}")?;
        }
        writeln!(f, "verdict: {}", self.verdict)
    }
}
