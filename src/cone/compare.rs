//! Supports side by side for one output pair of two designs: what the candidate reads that
//! the reference does not, and the reverse. Prove shows this when an output pair differs; it
//! is the quickest hint to a miswired input. Inputs are matched by name.

use super::support::{support, supports, SupportOptions, SupportResult};
use crate::design::Design;
use crate::sat::Limits;
use serde::Serialize;
use std::collections::BTreeSet;
use std::fmt;

/// The supports of an output pair and their differences (input names).
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct SupportComparison {
    /// The reference output bit.
    pub reference_output: String,
    /// The candidate output bit.
    pub candidate_output: String,
    /// The reference output's support, in the reference's input order.
    pub reference: Vec<String>,
    /// The candidate output's support, in the candidate's input order.
    pub candidate: Vec<String>,
    /// Inputs the reference reads and the candidate does not (missing in the candidate).
    pub only_reference: Vec<String>,
    /// Inputs the candidate reads and the reference does not.
    pub only_candidate: Vec<String>,
    /// Inputs whose membership a limit left open, on either side (not in the differences).
    pub undecided: Vec<String>,
}

impl SupportComparison {
    /// Whether the two supports differ.
    pub fn differs(&self) -> bool {
        !self.only_reference.is_empty() || !self.only_candidate.is_empty()
    }
}

/// Compute both supports of the output pair (`ref_output` of `reference`, `cand_output` of
/// `candidate`) and compare them by input name.
pub fn compare_supports(
    reference: &Design,
    ref_output: usize,
    candidate: &Design,
    cand_output: usize,
    limits: &Limits,
) -> SupportComparison {
    let r = support(reference, ref_output, limits);
    let c = support(candidate, cand_output, limits);
    compare_results(reference, &r, candidate, &c)
}

/// Both supports of several output pairs (`(reference output, candidate output)`), each
/// design's outputs in one run that shares its simulation, compared by input name.
pub fn compare_supports_many(
    reference: &Design,
    candidate: &Design,
    pairs: &[(usize, usize)],
    opts: &SupportOptions,
    limits: &Limits,
) -> Vec<SupportComparison> {
    let ro: Vec<usize> = pairs.iter().map(|p| p.0).collect();
    let co: Vec<usize> = pairs.iter().map(|p| p.1).collect();
    let (rr, rs) = supports(reference, &ro, opts, limits);
    let (cr, cs) = supports(candidate, &co, opts, limits);
    log::debug!(
        "supports of {} differing pair(s): reference {rs:?}; candidate {cs:?}",
        pairs.len()
    );
    rr.iter()
        .zip(&cr)
        .map(|(r, c)| compare_results(reference, r, candidate, c))
        .collect()
}

/// Compare two support results already computed.
pub fn compare_results(
    reference: &Design,
    r: &SupportResult,
    candidate: &Design,
    c: &SupportResult,
) -> SupportComparison {
    let names = |d: &Design, v: Vec<usize>| -> Vec<String> {
        v.into_iter().map(|k| d.inputs[k].name.clone()).collect()
    };
    let rs = names(reference, r.support());
    let cs = names(candidate, c.support());
    let mut undecided: BTreeSet<String> = names(reference, r.undecided()).into_iter().collect();
    undecided.extend(names(candidate, c.undecided()));
    let rset: BTreeSet<&String> = rs.iter().collect();
    let cset: BTreeSet<&String> = cs.iter().collect();
    let only_reference = rs
        .iter()
        .filter(|n| !cset.contains(n) && !undecided.contains(*n))
        .cloned()
        .collect();
    let only_candidate = cs
        .iter()
        .filter(|n| !rset.contains(n) && !undecided.contains(*n))
        .cloned()
        .collect();
    SupportComparison {
        reference_output: reference.outputs[r.output].name.clone(),
        candidate_output: candidate.outputs[c.output].name.clone(),
        reference: rs,
        candidate: cs,
        only_reference,
        only_candidate,
        undecided: undecided.into_iter().collect(),
    }
}

impl fmt::Display for SupportComparison {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        writeln!(
            f,
            "supports of {} (reference) and {} (candidate): {} and {} inputs",
            self.reference_output,
            self.candidate_output,
            self.reference.len(),
            self.candidate.len()
        )?;
        let cset: BTreeSet<&String> = self.candidate.iter().collect();
        let rset: BTreeSet<&String> = self.reference.iter().collect();
        let width = self
            .reference
            .iter()
            .map(|s| s.chars().count())
            .max()
            .unwrap_or(0)
            .max("reference".len());
        writeln!(f, "  {:<width$}  candidate", "reference")?;
        // One row per input: the reference's order first, then what only the candidate reads.
        let rows = self
            .reference
            .iter()
            .chain(self.candidate.iter().filter(|c| !rset.contains(c)));
        for name in rows {
            let (l, r) = (rset.contains(name), cset.contains(name));
            let left = if l { name.as_str() } else { "" };
            let right = if r { name.as_str() } else { "" };
            let note = match (l, r) {
                (true, false) => "   <- only the reference reads it",
                (false, true) => "   <- only the candidate reads it",
                _ => "",
            };
            writeln!(f, "  {left:<width$}  {right}{note}")?;
        }
        if !self.undecided.is_empty() {
            writeln!(f, "  undecided: {}", self.undecided.join(", "))?;
        }
        if !self.differs() {
            writeln!(f, "  the supports are the same")?;
        }
        Ok(())
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::front::bench::read_bench;
    use std::sync::Arc;

    #[test]
    fn a_miswired_input_shows_on_both_sides() {
        let hdr = "INPUT(a)\nINPUT(b)\nINPUT(c)\nOUTPUT(y)\n";
        let r = read_bench(&Arc::from("r.bench"), &format!("{hdr}y = AND(a, b)\n")).unwrap();
        let c = read_bench(&Arc::from("c.bench"), &format!("{hdr}y = AND(a, c)\n")).unwrap();
        let cmp = compare_supports(&r, 0, &c, 0, &Limits::none());
        assert_eq!(cmp.only_reference, vec!["b"]);
        assert_eq!(cmp.only_candidate, vec!["c"]);
        assert!(cmp.differs());
        let text = cmp.to_string();
        let lines: Vec<&str> = text.lines().collect();
        assert_eq!(lines[2], "  a          a", "{text}");
        assert!(
            lines[3].starts_with("  b ") && lines[3].ends_with("<- only the reference reads it"),
            "{text}"
        );
        assert!(
            lines[4].ends_with("  c   <- only the candidate reads it"),
            "{text}"
        );
    }
}
