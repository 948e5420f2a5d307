//! Diagnosis of a difference: for the output pairs that differ, both supports side by side
//! (what one design reads that the other does not), and for selector-like outputs both designs'
//! route tables over the select bus, with the select values whose routes differ.

use crate::aig::Lit;
use crate::cone::{SupportComparison, SupportOptions};
use crate::design::Design;
use crate::engine::{ProveReport, Verdict};
use crate::routes::{self, Route};
use crate::sat::Limits;
use serde::Serialize;
use std::collections::{BTreeMap, BTreeSet};

/// Route tables of one differing output pair.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct RouteDiff {
    /// Reference output bit.
    pub reference: String,
    /// Candidate output bit.
    pub candidate: String,
    /// Reference route per select value.
    pub reference_routes: Vec<Route>,
    /// Candidate route per select value.
    pub candidate_routes: Vec<Route>,
    /// Select values whose routes are proved different (both routes decided).
    pub differing_values: Vec<usize>,
    /// Select values where a limit left either route undecided: no claim either way.
    pub undecided_values: Vec<usize>,
}

/// What the diagnosis found.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct Diagnosis {
    /// Supports of the differing output pairs (at most [`MAX_TABLES`]).
    pub supports: Vec<SupportComparison>,
    /// The select bus used for route tables, if any.
    pub select: Option<String>,
    /// One entry per differing output pair (at most [`MAX_TABLES`]).
    pub routes: Vec<RouteDiff>,
    /// A limit (the diagnosis's time share, the run's `--timeout`, the conflict limit, the
    /// supports' work bounds on wide cones) cut it: some supports or routes are undecided,
    /// which makes no claim either way.
    pub partial: bool,
    /// Wall-clock seconds the diagnosis took.
    pub seconds: f64,
}

/// Route tables are built for at most this many differing output pairs.
pub const MAX_TABLES: usize = 16;

/// SAT queries the supports make on each design, over all differing outputs; an output whose
/// claims left open by simulation do not fit in what is left keeps them undecided (the high
/// bits of a wide multiplier: hundreds of claims, each query as hard as the multiplier).
pub const MAX_SAT_QUERIES: usize = 64;

/// Rounds of random flip simulation of the supports (each round flips every input over up
/// to 4,096 patterns on each design; a round that decides nothing new ends them earlier).
pub const SIMULATION_ROUNDS: usize = 2;

/// Nodes an output's cone may hold for the supports to query SAT on it; a wider one keeps the
/// claims simulation left open undecided. Each query costs about its cone in encoding and
/// propagation whatever the conflict limit: on the high bits of a 64x64 multiplier (about
/// 40,000 nodes each) four queries took 2 s of CPU time and decided nothing. ISCAS-85 cones
/// (c7552, the largest: about 3,500 AND nodes) stay below it.
pub const MAX_SAT_CONE: usize = 12_000;

/// Node-words a round of the supports' flip simulation may evaluate (inputs with open claims
/// times nodes times words): 2^26, so a 64x64 multiplier (128 inputs, about 40,000 nodes a
/// design) gets 13 words of patterns instead of 64 (its high bits depend on the low inputs
/// through carry chains that more patterns rarely sensitize), while a design of up to 8,000
/// nodes with 128 inputs, every ISCAS-85 circuit among them, keeps all 64.
pub const MAX_FLIP_WORK: u64 = 1 << 26;

/// Conflicts each of those queries may take (or the run's `--conflict-limit`, if lower).
pub const SAT_CONFLICTS: u64 = 1_000;

/// Bus names tried when no select bus is named.
const USUAL_SELECTS: [&str; 4] = ["sel", "s", "select", "addr"];

/// The select bus to use: `named`, or a usual name present in both designs.
pub fn pick_select(r: &Design, c: &Design, named: Option<&str>) -> Option<String> {
    let ok = |bus: &str| routes::select_bits(r, bus).is_ok() && routes::select_bits(c, bus).is_ok();
    match named {
        Some(b) => ok(b).then(|| b.to_string()),
        None => USUAL_SELECTS.iter().find(|b| ok(b)).map(|b| b.to_string()),
    }
}

/// Diagnose the differing pairs of `rep`: supports always; route tables over `select` when
/// given. `constraints` are the assumption literals of each design's own AIG (`Lit::TRUE` when
/// none); the designs passed must hold them.
pub fn diagnose(
    r: &Design,
    c: &Design,
    rep: &ProveReport,
    select: Option<&str>,
    constraints: (Lit, Lit),
    limits: &Limits,
) -> Option<Diagnosis> {
    if rep.verdict != Verdict::Different {
        return None;
    }
    let start = std::time::Instant::now();
    let differing: Vec<(usize, usize)> = rep
        .pairs
        .iter()
        .filter(|p| p.status() == Verdict::Different)
        .take(MAX_TABLES)
        .filter_map(|p| Some((r.output_index(&p.reference)?, c.output_index(&p.candidate)?)))
        .collect();
    // Unknown-value sources belong to one design: the other can never read them, so they are no
    // hint to a miswired input (and an assumption may exclude the cases that read them).
    let is_unknown =
        |d: &Design, n: &String| d.input_index(n).is_some_and(|k| d.inputs[k].is_unknown());
    // Paired bits whose names differ (`--pair-by position`): the candidate's name of each
    // reference bit, so that supports are compared by paired bits, not by names.
    let partner: BTreeMap<&str, &str> = rep
        .counterexamples
        .first()
        .map(|cx| {
            cx.inputs
                .iter()
                .filter_map(|i| Some((i.name.as_str(), i.candidate_name.as_deref()?)))
                .collect()
        })
        .unwrap_or_default();
    let opts = SupportOptions {
        max_sat_queries: Some(MAX_SAT_QUERIES),
        max_sat_cone: Some(MAX_SAT_CONE),
        max_flip_work: Some(MAX_FLIP_WORK),
        max_rounds: SIMULATION_ROUNDS,
        ..SupportOptions::default()
    };
    let mut support_limits = limits.clone();
    support_limits.conflicts_per_query = Some(
        limits
            .conflicts_per_query
            .map_or(SAT_CONFLICTS, |k| k.min(SAT_CONFLICTS)),
    );
    let supports: Vec<SupportComparison> =
        crate::cone::compare_supports_many(r, c, &differing, &opts, &support_limits)
            .into_iter()
            .map(|mut cmp| {
                if !partner.is_empty() {
                    by_partner(&mut cmp, &partner);
                }
                cmp.only_reference.retain(|n| !is_unknown(r, n));
                cmp.only_candidate.retain(|n| !is_unknown(c, n));
                cmp
            })
            .collect();
    let mut routes_out = Vec::new();
    let sel = select.and_then(|bus| {
        let rs = routes::select_bits(r, bus).ok()?;
        let cs = routes::select_bits(c, bus).ok()?;
        (rs.len() == cs.len()).then_some((bus, rs, cs))
    });
    if let Some((bus, rs, cs)) = &sel {
        for &(ri, ci) in &differing {
            let rt = routes::route_table(r, ri, bus, rs, constraints.0, limits);
            let ct = routes::route_table(c, ci, bus, cs, constraints.1, limits);
            let (mut differing_values, undecided_values) = partition_values(&rt.routes, &ct.routes);
            // Where the reference follows one of its unknown values and unknowns are
            // don't-cares, the candidate may do anything: not a difference.
            if rep.dont_care_pairs > 0 {
                differing_values.retain(
                    |&v| !matches!(&rt.routes[v], Route::Input { name, .. } if is_unknown(r, name)),
                );
            }
            routes_out.push(RouteDiff {
                reference: r.outputs[ri].name.clone(),
                candidate: c.outputs[ci].name.clone(),
                reference_routes: rt.routes,
                candidate_routes: ct.routes,
                differing_values,
                undecided_values,
            });
        }
    }
    let partial = limits.expired()
        || supports
            .iter()
            .any(|c: &SupportComparison| !c.undecided.is_empty())
        || routes_out.iter().any(|t| !t.undecided_values.is_empty());
    Some(Diagnosis {
        supports,
        select: sel.map(|(b, _, _)| b.to_string()),
        routes: routes_out,
        partial,
        seconds: start.elapsed().as_secs_f64(),
    })
}

/// Recompute the differences of `cmp` with each reference bit standing for its partner's
/// name in the candidate (bits without a renamed partner keep their own names).
fn by_partner(cmp: &mut SupportComparison, partner: &BTreeMap<&str, &str>) {
    let theirs = |n: &String| partner.get(n.as_str()).map_or(n.clone(), |p| p.to_string());
    let undecided: BTreeSet<String> = cmp.undecided.iter().cloned().collect();
    let rset: BTreeSet<String> = cmp.reference.iter().map(theirs).collect();
    let cset: BTreeSet<&String> = cmp.candidate.iter().collect();
    cmp.only_reference = cmp
        .reference
        .iter()
        .filter(|n| !cset.contains(&theirs(n)) && !undecided.contains(*n))
        .cloned()
        .collect();
    cmp.only_candidate = cmp
        .candidate
        .iter()
        .filter(|n| !rset.contains(*n) && !undecided.contains(*n))
        .cloned()
        .collect();
}

/// The select values whose routes are proved different (both decided, not excluded, not
/// equal), and those where either route is undecided.
fn partition_values(r: &[Route], c: &[Route]) -> (Vec<usize>, Vec<usize>) {
    let open = |x: &Route| matches!(x, Route::Undecided { .. });
    let (mut differing, mut undecided) = (Vec::new(), Vec::new());
    for (v, (a, b)) in r.iter().zip(c).enumerate() {
        if matches!(a, Route::Excluded) || matches!(b, Route::Excluded) {
            continue;
        }
        if open(a) || open(b) {
            undecided.push(v);
        } else if a != b {
            differing.push(v);
        }
    }
    (differing, undecided)
}

/// Text form: supports that differ, then both route tables compressed with every differing
/// select value marked with `!`.
pub fn diagnosis_text(d: &Diagnosis) -> String {
    let mut s = String::new();
    if d.partial {
        s += "\ndiagnosis   partial: a limit cut it (its time share, --diagnosis-time, the run's --timeout, or its work bounds on wide cones); undecided entries make no claim\n";
    }
    let differ: Vec<&SupportComparison> = d.supports.iter().filter(|c| c.differs()).collect();
    if !d.supports.is_empty() {
        let open: usize = d.supports.iter().map(|c| c.undecided.len()).sum();
        if differ.is_empty() && open == 0 {
            s += &format!(
                "\nsupports of the differing outputs: the same inputs on both sides ({} pair{} compared)\n",
                d.supports.len(),
                if d.supports.len() == 1 { "" } else { "s" }
            );
        } else if differ.is_empty() {
            s += &format!(
                "\nsupports of the differing outputs: no difference among the inputs decided; {open} input{} undecided (a limit stopped them; no claim)\n",
                if open == 1 { "" } else { "s" }
            );
        } else {
            s += "\nsupports that differ (exact, decided by simulation and SAT)\n";
            for c in differ {
                let label =
                    crate::engine::pair_runs::pair_label(&c.reference_output, &c.candidate_output);
                s += &format!("  {label}\n");
                if !c.only_reference.is_empty() {
                    s += &format!(
                        "    read by the reference only: {}\n",
                        c.only_reference.join(", ")
                    );
                }
                if !c.only_candidate.is_empty() {
                    s += &format!(
                        "    read by the candidate only: {}\n",
                        c.only_candidate.join(", ")
                    );
                }
            }
        }
    }
    let Some(select) = &d.select else { return s };
    s += &format!(
        "\nroute tables over `{select}` for the differing outputs (each route proved by constant folding or SAT)\n"
    );
    let mut at = 0;
    while at < d.routes.len() {
        let t = &d.routes[at];
        let alike = alike_run(&d.routes[at..]);
        at += alike;
        let label = crate::engine::pair_runs::pair_label(&t.reference, &t.candidate);
        if alike == 1 {
            s += &format!("  {label}\n");
        } else {
            let last = &d.routes[at - 1];
            let span = |first: &str, last: &str| {
                let (bus, a) = crate::design::split_bit(first);
                let b = crate::design::split_bit(last).1;
                format!("{bus}[{}..{}]", a.unwrap_or(0), b.unwrap_or(0))
            };
            let group = crate::engine::pair_runs::pair_label(
                &span(&t.reference, &last.reference),
                &span(&t.candidate, &last.candidate),
            );
            s += &format!(
                "  {group} ({alike} bits with the same routes, each input index shifted by the bit's offset; shown for {label})\n"
            );
        }
        let rr = routes::render(select, &routes::compress(&t.reference_routes));
        let cr = routes::render(select, &routes::compress(&t.candidate_routes));
        s += &format!("    reference  {}\n", rr.join("; "));
        s += &format!("    candidate  {}\n", cr.join("; "));
        for &v in &t.differing_values {
            s += &format!(
                "    {select} {v}: reference {}, candidate {}  !\n",
                t.reference_routes[v].text(),
                t.candidate_routes[v].text()
            );
        }
        if !t.undecided_values.is_empty() {
            s += &format!(
                "    undecided at {} select value{} (a limit stopped a route proof; no claim): {select} {}\n",
                t.undecided_values.len(),
                if t.undecided_values.len() == 1 { "" } else { "s" },
                value_runs(&t.undecided_values, 8)
            );
        }
    }
    s
}

/// How many tables from the first of `tables` on are alike: output bits `y[k]`, `y[k+1]`, ...
/// (on both sides) whose routes equal the first table's with every input index shifted by the
/// same offset (`y[0]` routes `ch[8]` where `y[1]` routes `ch[9]`), and the same select values
/// differ or stay undecided. The text report prints such a run once.
fn alike_run(tables: &[RouteDiff]) -> usize {
    use crate::design::split_bit;
    let Some(first) = tables.first() else {
        return 0;
    };
    let shifted = |a: &str, b: &str, by: i64| {
        let (pa, ia) = split_bit(a);
        let (pb, ib) = split_bit(b);
        pa == pb && matches!((ia, ib), (Some(x), Some(y)) if x + by == y)
    };
    let route_shifted = |a: &Route, b: &Route, by: i64| match (a, b) {
        (
            Route::Input {
                name: na,
                inverted: ia,
            },
            Route::Input {
                name: nb,
                inverted: ib,
            },
        ) => ia == ib && shifted(na, nb, by),
        _ => a == b,
    };
    let mut n = 1;
    for (j, t) in tables.iter().enumerate().skip(1) {
        let by = j as i64;
        let alike = shifted(&first.reference, &t.reference, by)
            && shifted(&first.candidate, &t.candidate, by)
            && t.differing_values == first.differing_values
            && t.undecided_values == first.undecided_values
            && t.reference_routes.len() == first.reference_routes.len()
            && t.candidate_routes.len() == first.candidate_routes.len()
            && (first.reference_routes.iter().zip(&t.reference_routes))
                .all(|(a, b)| route_shifted(a, b, by))
            && (first.candidate_routes.iter().zip(&t.candidate_routes))
                .all(|(a, b)| route_shifted(a, b, by));
        if !alike {
            break;
        }
        n += 1;
    }
    n
}

/// Sorted values as runs `3, 7..9, 12`, at most `most` runs, then `... (N more)`.
fn value_runs(values: &[usize], most: usize) -> String {
    let mut runs: Vec<(usize, usize)> = Vec::new();
    for &v in values {
        match runs.last_mut() {
            Some((_, to)) if *to + 1 == v => *to = v,
            _ => runs.push((v, v)),
        }
    }
    let mut parts: Vec<String> = runs
        .iter()
        .take(most)
        .map(|&(a, b)| {
            if a == b {
                a.to_string()
            } else {
                format!("{a}..{b}")
            }
        })
        .collect();
    if runs.len() > most {
        parts.push(format!("... ({} more)", runs.len() - most));
    }
    parts.join(", ")
}

#[cfg(test)]
mod tests {
    use super::*;

    fn routes(texts: &[&str]) -> Vec<Route> {
        texts
            .iter()
            .map(|t| match *t {
                "?" => Route::Undecided {
                    reason: crate::sat::StopReason::Timeout,
                },
                n => Route::Input {
                    name: n.to_string(),
                    inverted: false,
                },
            })
            .collect()
    }

    /// Issue 13 A3: `!` marks only values whose routes are both decided and differ; the
    /// undecided ones are listed apart and counted.
    #[test]
    fn undecided_routes_are_not_marked_as_differences() {
        let d = Diagnosis {
            supports: Vec::new(),
            select: Some("s".into()),
            routes: vec![RouteDiff {
                reference: "y".into(),
                candidate: "y".into(),
                reference_routes: routes(&["d0", "d1", "?", "d3"]),
                candidate_routes: routes(&["d0", "d2", "d2", "?"]),
                differing_values: vec![1],
                undecided_values: vec![2, 3],
            }],
            partial: true,
            seconds: 0.0,
        };
        let t = &d.routes[0];
        let (differing, undecided) = partition_values(&t.reference_routes, &t.candidate_routes);
        assert_eq!((differing, undecided), (vec![1], vec![2, 3]));
        let t = diagnosis_text(&d);
        assert_eq!(t.matches('!').count(), 1, "{t}");
        assert!(t.contains("s 1: reference d1, candidate d2  !"), "{t}");
        assert!(
            t.contains(
                "undecided at 2 select values (a limit stopped a route proof; no claim): s 2..3"
            ),
            "{t}"
        );
        assert_eq!(value_runs(&[1, 2, 3, 5, 9, 10], 2), "1..3, 5, ... (1 more)");
    }

    /// Output bits whose route tables differ only by a shift of every input index (the bits of
    /// one selected word) print once, as a run; a bit that breaks the pattern starts its own.
    #[test]
    fn alike_route_tables_print_once_as_a_run() {
        let table = |bit: usize, swap: bool| {
            let r: Vec<String> = (0..4).map(|v| format!("ch[{}]", 8 * v + bit)).collect();
            let mut c = r.clone();
            if swap {
                c.swap(1, 2);
            }
            let as_refs = |v: &[String]| routes(&v.iter().map(|x| x.as_str()).collect::<Vec<_>>());
            RouteDiff {
                reference: format!("y[{bit}]"),
                candidate: format!("y[{bit}]"),
                reference_routes: as_refs(&r),
                candidate_routes: as_refs(&c),
                differing_values: if swap { vec![1, 2] } else { vec![] },
                undecided_values: vec![],
            }
        };
        let d = Diagnosis {
            supports: Vec::new(),
            select: Some("sel".into()),
            routes: vec![
                table(0, true),
                table(1, true),
                table(2, true),
                table(3, false),
            ],
            partial: false,
            seconds: 0.0,
        };
        assert_eq!(alike_run(&d.routes), 3);
        assert_eq!(alike_run(&d.routes[3..]), 1);
        let t = diagnosis_text(&d);
        assert!(
            t.contains("  y[0..2] (3 bits with the same routes, each input index shifted by the bit's offset; shown for y[0])"),
            "{t}"
        );
        assert!(
            t.contains("sel 1: reference ch[8], candidate ch[16]  !"),
            "{t}"
        );
        assert_eq!(t.matches('!').count(), 2, "{t}");
        assert!(t.contains("\n  y[3]\n"), "{t}");
    }
}
