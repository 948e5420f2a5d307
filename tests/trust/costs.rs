//! Issue 13 B5: every output pair's seconds and SAT conflicts in the JSON report, from every
//! engine; the pairs' conflicts add up to the run's; no progress line when standard error is
//! not a terminal.

use crate::common::*;
use serde_json::Value;

const SPEC: &str = "bench-circuits/examples/mux4_spec.bench";
const TREE: &str = "bench-circuits/examples/mux4_tree.bench";
const SWAPPED: &str = "bench-circuits/examples/mux4_swapped.bench";

/// Every pair has `seconds` (a number, not negative) and `conflicts` (a whole number), and
/// the conflicts add up to the run's SAT conflicts. Returns the report.
fn costs_consistent(args: &[&str]) -> Value {
    let mut a = vec!["prove"];
    a.extend_from_slice(args);
    a.push("--json");
    let o = equicone(&a);
    assert!(matches!(code(&o), 0 | 1), "{a:?}: {}", stderr(&o));
    let v: Value = serde_json::from_str(&stdout(&o)).unwrap();
    let mut sum = 0;
    for p in v["pairs"].as_array().unwrap() {
        let s = p["seconds"]
            .as_f64()
            .unwrap_or_else(|| panic!("{a:?}: {p}"));
        assert!(s >= 0.0, "{a:?}: {p}");
        sum += p["conflicts"]
            .as_u64()
            .unwrap_or_else(|| panic!("{a:?}: {p}"));
    }
    assert_eq!(
        Some(sum),
        v["stats"]["sat"]["conflicts"].as_u64(),
        "{a:?}: {v}"
    );
    v
}

#[test]
fn every_engine_gives_each_pair_its_seconds_and_conflicts() {
    for engine in [
        "portfolio",
        "sweep",
        "plain",
        "pairs",
        "exhaustive",
        "bdd",
        "algebra",
    ] {
        for cand in [TREE, SWAPPED] {
            costs_consistent(&[SPEC, cand, "--engine", engine, "--decide-all"]);
        }
    }
    // The portfolio enumerates the 6 inputs of the selector: no SAT solver ran, 0 conflicts.
    let v = costs_consistent(&[SPEC, TREE]);
    assert_eq!(v["verdict"], "equivalent");
    for p in v["pairs"].as_array().unwrap() {
        assert_eq!(p["method"], "exhaustive", "{p}");
        assert_eq!(p["conflicts"], 0, "{p}");
    }
    // One query per pair: decided by SAT, with its conflicts (possibly none) its own.
    let v = costs_consistent(&[SPEC, TREE, "--engine", "pairs"]);
    assert!(
        v["pairs"]
            .as_array()
            .unwrap()
            .iter()
            .any(|p| p["method"] == "sat"),
        "{v}"
    );
}

/// c499 and c1355 compute the same function (published fact, SOURCE.md of the shared ISCAS-85
/// data): proved with SAT, the 32 pairs' conflicts add up to the run's.
#[test]
fn sat_conflicts_of_c499_against_c1355_add_up_per_pair() {
    let Some(dir) = crate::vcommon::shared_dir() else {
        return;
    };
    let (r, c) = (dir.join("c499.bench"), dir.join("c1355.bench"));
    let (r, c) = (r.to_str().unwrap(), c.to_str().unwrap());
    for engine in ["sweep", "pairs"] {
        let v = costs_consistent(&[r, c, "--pair-by", "position", "--engine", engine]);
        assert_eq!(v["verdict"], "equivalent");
        assert_eq!(v["pairs"].as_array().unwrap().len(), 32);
        assert!(v["stats"]["sat"]["calls"].as_u64().unwrap() > 0, "{v}");
    }
}

/// A progress line redraws itself with carriage returns and terminal escapes.
fn no_progress(o: &std::process::Output, args: &[&str]) {
    let e = stderr(o);
    assert!(
        !e.contains('\r') && !e.contains('\u{1b}'),
        "{args:?}: {e:?}"
    );
}

/// Progress lines go to a terminal only: with standard error piped (as here) `routes`,
/// `eval`, `gen` and `merge` draw none (their other messages stay).
#[test]
fn no_progress_lines_when_standard_error_is_piped() {
    let d = scratch("progress");
    let out = d.join("s.v");
    let out = out.to_str().unwrap();
    let runs: Vec<Vec<&str>> = vec![
        vec!["gen", "selector", "--n", "64", "-o", out],
        vec!["routes", out, "--select", "s"],
        vec!["eval", SPEC, "--rest", "0"],
    ];
    for args in &runs {
        let o = equicone(args);
        assert_eq!(code(&o), 0, "{args:?}: {}", stderr(&o));
        no_progress(&o, args);
    }
    let part = |k: &str| d.join(format!("p{k}.json")).to_str().unwrap().to_string();
    for k in ["1", "2"] {
        let shard = format!("{k}/2");
        let o = equicone(&["prove", SPEC, TREE, "--shard", &shard, "--report", &part(k)]);
        assert_eq!(code(&o), 0, "{}", stderr(&o));
    }
    let args = ["merge", &part("1"), &part("2")];
    let o = equicone(&args);
    assert_eq!(code(&o), 0, "{}", stderr(&o));
    no_progress(&o, &args);
}
