//! `prove --explain`: the difference cubes of every differing output pair of a report, in the
//! report's JSON form and its text form.

use super::cubes::{cover_pair, CoverEnd, CubeLimits};
use super::notation::{merge_pairs, term_text};
use crate::design::Design;
use crate::engine::{ProveReport, Shared, Verdict};
use crate::sat::Limits;
use serde::Serialize;
use std::fmt::Write;

/// The cubes of the differing output pairs.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Explanation {
    /// The cube limit per output pair.
    pub max_cubes: usize,
    /// One entry per explained output pair, in pair order.
    pub pairs: Vec<PairCubes>,
    /// Differing output pairs left unexplained because of the pair limit.
    pub skipped_pairs: usize,
}

/// The cubes of one differing output pair.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct PairCubes {
    /// Reference output bit.
    pub reference: String,
    /// Candidate output bit.
    pub candidate: String,
    /// Inputs in the cone of the pair and the assumptions (the space the count refers to).
    pub inputs: usize,
    /// `complete`, `cube_limit`, or the SAT limit that stopped the enumeration.
    pub end: CoverEnd,
    /// Exact number of differing vectors over those inputs (complete covers only): a number,
    /// or a decimal string above 2^64-1.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub differing_vectors: Option<serde_json::Value>,
    /// Disjoint cubes: input bit name -> value; inputs not named are free.
    pub cubes: Vec<serde_json::Map<String, serde_json::Value>>,
    /// The text notation (cubes that differ only in two flipped inputs merged into one line).
    pub terms: Vec<String>,
}

/// Explain the differing pairs of `rep` (at most `max_pairs` of them) over `shared`, which
/// must be the shared graph the report was proved on, assumptions applied.
pub fn explain(
    shared: &Shared,
    r: &Design,
    c: &Design,
    rep: &ProveReport,
    cl: &CubeLimits,
    max_pairs: usize,
    limits: &Limits,
) -> Explanation {
    let names: Vec<String> = (0..shared.aig.num_inputs())
        .map(|k| shared.input_name(k, r, c).0.to_string())
        .collect();
    let mut pairs = Vec::new();
    let mut skipped = 0;
    for (p, pr) in rep.pairs.iter().enumerate() {
        if pr.status() != Verdict::Different {
            continue;
        }
        if pairs.len() >= max_pairs {
            skipped += 1;
            continue;
        }
        let first: Option<Vec<bool>> = pr
            .verdict
            .counterexample()
            .and_then(|i| rep.counterexamples.get(i))
            .map(|cx| cx.inputs.iter().map(|v| v.value).collect());
        let cov = cover_pair(shared, p, first.as_deref(), cl, limits);
        let cubes = cov
            .cubes
            .iter()
            .map(|cube| {
                cube.lits
                    .iter()
                    .map(|&(k, b)| (names[k].clone(), serde_json::Value::from(b as u8)))
                    .collect()
            })
            .collect();
        let terms = merge_pairs(&cov.cubes, &names)
            .iter()
            .map(|t| term_text(t, &names))
            .collect();
        pairs.push(PairCubes {
            reference: pr.reference.clone(),
            candidate: pr.candidate.clone(),
            inputs: cov.inputs.len(),
            end: cov.end,
            differing_vectors: cov.differing.map(|n| match u64::try_from(n) {
                Ok(v) => v.into(),
                Err(_) => n.to_string().into(),
            }),
            cubes,
            terms,
        });
    }
    Explanation {
        max_cubes: cl.max_cubes,
        pairs,
        skipped_pairs: skipped,
    }
}

/// The text form: per pair, how far the cover goes, then one line per term.
pub fn explanation_text(e: &Explanation) -> String {
    let any_joined = e.pairs.iter().any(|p| p.terms.len() < p.cubes.len());
    let mut s = format!(
        "difference cubes (input values under which the pair differs; inputs not shown are free{})\n",
        if any_joined {
            "; `x!=y` or `x==y` on a line stands for two cubes"
        } else {
            ""
        }
    );
    for p in &e.pairs {
        let name = if p.reference == p.candidate {
            p.reference.clone()
        } else {
            format!("{} / {}", p.reference, p.candidate)
        };
        let how = match (p.end, &p.differing_vectors) {
            (CoverEnd::Complete, Some(n)) => format!(
                "complete, {} of 2^{} vectors over its {} inputs differ",
                n.to_string().trim_matches('"'),
                p.inputs,
                p.inputs
            ),
            (CoverEnd::Complete, None) => format!("complete, over {} inputs", p.inputs),
            (CoverEnd::CubeLimit, _) => format!(
                "incomplete: stopped at the limit of {} cubes (raise it with --explain-cubes)",
                e.max_cubes
            ),
            (CoverEnd::Stopped(r), _) => format!("incomplete: {r}"),
        };
        let n = p.cubes.len();
        // `x!=y` (or `x==y`) on one line stands for two cubes; say so when lines were joined.
        let joined = if p.terms.len() < n {
            format!(" in {} lines", p.terms.len())
        } else {
            String::new()
        };
        let _ = writeln!(
            s,
            "  {name}: {n} cube{}{joined}, {how}",
            if n == 1 { "" } else { "s" }
        );
        for t in &p.terms {
            let _ = writeln!(s, "    {t}");
        }
    }
    if e.skipped_pairs > 0 {
        let _ = writeln!(
            s,
            "  ... {} more differing output pair{} not explained (pair limit)",
            e.skipped_pairs,
            if e.skipped_pairs == 1 { "" } else { "s" }
        );
    }
    s
}
