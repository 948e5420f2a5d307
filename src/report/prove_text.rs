//! The text form of a proof report.

use crate::check::CheckOutcome;
use crate::diagnose::Diagnosis;
use crate::engine::pair_runs::pair_label;
use crate::engine::{Method, ProveReport, Side, Verdict};
use crate::report::values::{group_declared, wrap};
use std::fmt::Write;

/// Output pairs listed one by one when there are at most this many; beyond it only the
/// pairs that are not equivalent are listed.
const LIST_ALL: usize = 32;

/// Counterexamples printed in full; the JSON report holds them all.
const SHOW_CEX: usize = 2;

/// The human-readable report of a check session.
pub fn check_text(o: &CheckOutcome) -> String {
    let mut s = prove_text(&o.report, o.diagnosis.as_ref());
    if let Some(e) = &o.explanation {
        s += &crate::explain::explanation_text(e);
    }
    s
}

/// The human-readable report of a proof run, with the diagnosis of a difference when there is one.
pub fn prove_text(r: &ProveReport, diagnosis: Option<&Diagnosis>) -> String {
    let mut s = String::new();
    let n = r.pairs.len();
    let _ = writeln!(s, "reference   {}", r.reference);
    let _ = writeln!(s, "candidate   {}", r.candidate);
    let by = match r.pair_by {
        crate::engine::PairBy::Name => "by name",
        crate::engine::PairBy::Position => "by position (bits matched in declaration order)",
    };
    let map = match &r.port_map {
        Some(f) => format!(" (renamed bits by the port map {f})"),
        None => String::new(),
    };
    let _ = writeln!(s, "pairing     {by}{map}, {n} output pair{}", plural(n));
    s += &crate::engine::pair_runs::runs_text(&r.paired);
    for a in &r.assumptions {
        let _ = writeln!(s, "assuming    {a}");
    }
    for f in &r.free_inputs {
        let _ = writeln!(
            s,
            "free input  {f} (no partner; the verdict covers both of its values)"
        );
    }
    if !r.unknowns.is_empty() {
        for u in r.unknowns.iter().take(8) {
            let _ = writeln!(s, "unknown     {u}");
        }
        if r.unknowns.len() > 8 {
            let _ = writeln!(
                s,
                "unknown     ... and {} more sources",
                r.unknowns.len() - 8
            );
        }
        // Reference unknowns read as don't-cares are explained by the `don't-care` line; the
        // advice is for unknowns that are free inputs (the candidate's, or all under
        // --strict-unknowns).
        let only_dont_cares =
            r.dont_care_pairs > 0 && r.unknowns.iter().all(|u| u.starts_with("reference:"));
        if r.assumptions.is_empty() && !only_dont_cares {
            let _ = writeln!(s, "            {}", crate::engine::unknowns::ADVICE);
        }
    }
    if r.dont_care_pairs > 0 {
        let n = r.dont_care_pairs;
        let _ = writeln!(
            s,
            "don't-care  {n} output pair{} where the reference may be x: compared only where it is defined (the candidate may do anything else; --strict-unknowns requires a match)",
            plural(n)
        );
    }
    let methods = |v: Verdict| {
        let mut parts = Vec::new();
        for m in [
            Method::Structure,
            Method::Sweep,
            Method::Simulation,
            Method::Sat,
            Method::Split,
            Method::Exhaustive,
            Method::Bdd,
            Method::Algebra,
        ] {
            let k = r
                .pairs
                .iter()
                .filter(|p| p.status() == v && p.verdict.method() == Some(m))
                .count();
            if k > 0 {
                parts.push(format!("{k} by {}", m.word()));
            }
        }
        parts.join(", ")
    };
    let (eq, diff, und) = (
        r.count(Verdict::Equivalent),
        r.count(Verdict::Different),
        r.count(Verdict::Undecided),
    );
    let head = match r.verdict {
        Verdict::Equivalent => format!(
            "EQUIVALENT: all {n} output pair{} agree on every input vector ({})",
            plural(n),
            methods(Verdict::Equivalent)
        ),
        Verdict::Different => format!(
            "DIFFERENT: {diff} of {n} output pair{} {}; {eq} equivalent, {und} undecided",
            plural(n),
            if diff == 1 { "differs" } else { "differ" }
        ),
        Verdict::Undecided => format!(
            "UNDECIDED: {und} of {n} output pair{} open within the limits; {eq} equivalent",
            plural(n)
        ),
    };
    let _ = writeln!(s, "verdict     {head}");
    let _ = writeln!(s, "scope       {}", r.scope);
    if n > 0 && (n <= LIST_ALL || r.verdict != Verdict::Equivalent) {
        let _ = writeln!(
            s,
            "\noutput pairs{}",
            if n > LIST_ALL {
                " (not equivalent)"
            } else {
                ""
            }
        );
        let w = r
            .pairs
            .iter()
            .map(|p| pair_label(&p.reference, &p.candidate).len())
            .max()
            .unwrap_or(0);
        for p in &r.pairs {
            if n > LIST_ALL && p.status() == Verdict::Equivalent {
                continue;
            }
            let mut line = format!(
                "  {:w$}  {:10}  {}",
                pair_label(&p.reference, &p.candidate),
                p.status().word(),
                p.verdict.method().map_or("-", Method::word)
            );
            if let Some(k) = p.verdict.counterexample() {
                let _ = write!(line, "  counterexample {}", k + 1);
            }
            if let Some(st) = p.verdict.stopped() {
                let _ = write!(line, "  ({st})");
            }
            let _ = writeln!(s, "{}", line.trim_end());
        }
    }
    for (k, c) in r.counterexamples.iter().enumerate().take(SHOW_CEX) {
        let _ = writeln!(
            s,
            "\ncounterexample {} (found by {}, re-simulated on both designs)",
            k + 1,
            c.found_by.word()
        );
        let shared: Vec<(&str, bool)> = c
            .inputs
            .iter()
            .filter(|i| i.side == Side::Both)
            .map(|i| (i.name.as_str(), i.value))
            .collect();
        let asc = &r.ascending_ports;
        // Renamed bits, or a bus declared [7:0] on one side and [0:7] on the other: the
        // candidate's view of the same vector is printed too.
        let renamed =
            c.inputs.iter().any(|i| i.candidate_name.is_some()) || asc.reference != asc.candidate;
        let _ = writeln!(
            s,
            "  inputs{}",
            if renamed {
                ", by the reference's names"
            } else {
                ""
            }
        );
        s += &wrap(&group_declared(shared, &asc.reference), "    ", 100);
        if renamed {
            let theirs: Vec<(&str, bool)> = c
                .inputs
                .iter()
                .filter(|i| i.side == Side::Both)
                .map(|i| (i.candidate_name.as_deref().unwrap_or(&i.name), i.value))
                .collect();
            let _ = writeln!(s, "  the same inputs, by the candidate's names");
            s += &wrap(&group_declared(theirs, &asc.candidate), "    ", 100);
        }
        for side in [Side::Reference, Side::Candidate] {
            let own: Vec<(&str, bool)> = c
                .inputs
                .iter()
                .filter(|i| i.side == side && !i.moot)
                .map(|i| (i.name.as_str(), i.value))
                .collect();
            if !own.is_empty() {
                let _ = writeln!(
                    s,
                    "  free inputs of the {} (unknown values or unpaired ports)",
                    side.word()
                );
                let mine = match side {
                    Side::Candidate => &asc.candidate,
                    _ => &asc.reference,
                };
                s += &wrap(&group_declared(own, mine), "    ", 100);
            }
        }
        let _ = writeln!(s, "  differing outputs (reference / candidate)");
        for d in &c.differing {
            let _ = writeln!(
                s,
                "    {}  {} / {}",
                pair_label(&d.reference, &d.candidate),
                d.reference_value as u8,
                d.candidate_value as u8
            );
        }
    }
    if r.counterexamples.len() > SHOW_CEX {
        let _ = writeln!(
            s,
            "\ncounterexamples {}..{}: in the JSON report (--json, or --report FILE); each replays with `equicone eval`",
            SHOW_CEX + 1,
            r.counterexamples.len()
        );
    }
    if let Some(d) = diagnosis {
        s += &crate::diagnose::diagnosis_text(d);
    }
    let st = &r.stats;
    let _ = write!(
        s,
        "\nfigures     engine {}; AIG {} nodes shared (reference {} ANDs, candidate {} ANDs); {} random patterns; {} SAT calls, {} conflicts; {:.3} s",
        r.engine.name(), st.shared_nodes, st.reference_ands, st.candidate_ands, st.sim_patterns, st.sat.calls, st.sat.conflicts, st.seconds
    );
    match diagnosis {
        Some(d) => {
            let _ = writeln!(s, "; diagnosis {:.3} s", d.seconds);
        }
        None => s.push('\n'),
    }
    if st.seconds >= SLOWEST_AFTER_SECONDS {
        s += &slowest_line(r);
    }
    for w in &r.warnings {
        let _ = writeln!(s, "{w}");
    }
    s
}

/// Runs at least this long (seconds) print their slowest output pairs.
const SLOWEST_AFTER_SECONDS: f64 = 1.0;

/// Output pairs named on the `slowest` line.
const SLOWEST_SHOWN: usize = 3;

/// `slowest     y[3] 1.204 s, 5120 conflicts; ...`: the pairs that cost the most time (ties
/// in pair order), or nothing when no pair took measurable time.
fn slowest_line(r: &ProveReport) -> String {
    let mut order: Vec<usize> = (0..r.pairs.len())
        .filter(|&k| r.pairs[k].cost.seconds > 0.0)
        .collect();
    order.sort_by(|&a, &b| {
        r.pairs[b]
            .cost
            .seconds
            .total_cmp(&r.pairs[a].cost.seconds)
            .then(a.cmp(&b))
    });
    if order.is_empty() {
        return String::new();
    }
    let parts: Vec<String> = order
        .iter()
        .take(SLOWEST_SHOWN)
        .map(|&k| {
            let p = &r.pairs[k];
            format!(
                "{} {:.3} s, {} conflict{}",
                pair_label(&p.reference, &p.candidate),
                p.cost.seconds,
                p.cost.conflicts,
                if p.cost.conflicts == 1 { "" } else { "s" }
            )
        })
        .collect();
    format!(
        "slowest     {} (per output pair; shared work split evenly)\n",
        parts.join("; ")
    )
}

fn plural(n: usize) -> &'static str {
    if n == 1 {
        ""
    } else {
        "s"
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use std::sync::Arc;

    fn report() -> ProveReport {
        let read = |t: &str| crate::front::bench::read_bench(&Arc::from("t.bench"), t).unwrap();
        let r = read("INPUT(a)\nINPUT(b)\nOUTPUT(x)\nOUTPUT(y)\nOUTPUT(z)\nx = AND(a, b)\ny = OR(a, b)\nz = XOR(a, b)\n");
        let c = read("INPUT(a)\nINPUT(b)\nOUTPUT(x)\nOUTPUT(y)\nOUTPUT(z)\nx = AND(b, a)\ny = OR(b, a)\nz = XOR(b, a)\n");
        crate::engine::prove(&r, &c, &Default::default()).unwrap()
    }

    /// Issue 13 B5: a run of a second or more names its slowest pairs, by seconds then pair
    /// order; a quick run does not.
    #[test]
    fn long_runs_name_their_slowest_pairs() {
        let mut r = report();
        assert!(!prove_text(&r, None).contains("\nslowest"));
        r.stats.seconds = 2.5;
        for (k, s) in [0.5, 1.25, 0.5].into_iter().enumerate() {
            r.pairs[k].cost.seconds = s;
            r.pairs[k].cost.conflicts = k as u64;
        }
        let text = prove_text(&r, None);
        let line = text.lines().find(|l| l.starts_with("slowest")).unwrap();
        assert_eq!(
            line,
            "slowest     y 1.250 s, 1 conflict; x 0.500 s, 0 conflicts; z 0.500 s, 2 conflicts (per output pair; shared work split evenly)"
        );
        // No pair took measurable time: no line.
        for p in &mut r.pairs {
            p.cost = Default::default();
        }
        assert!(!prove_text(&r, None).contains("\nslowest"));
    }
}
