//! Helpers of the explain tests: proving a pair in-process with the shared graph kept, random
//! bench pairs, and running Icarus Verilog on several files.

use super::oracle::random::Gates;
use equicone::design::{Design, Format};
use equicone::engine::{self, ProveOptions, ProveReport, Shared};
use equicone::front;
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};
use std::path::Path;
use std::process::Command;
use std::sync::Arc;

/// Read one design from text (`.bench` or `.v` by the name).
pub fn design(name: &str, text: &str) -> Design {
    let f = if name.ends_with(".bench") {
        Format::Bench
    } else {
        Format::Verilog
    };
    front::load_texts(f, &[(Arc::from(name), text.to_string())], None)
        .unwrap_or_else(|e| panic!("{name}: {e}\n{text}"))
}

/// Prove `c` against `r` under `assume`; returns the report and the shared graph it ran on.
pub fn prove(r: &Design, c: &Design, assume: &[&str]) -> (ProveReport, Shared) {
    let assume: Vec<String> = assume.iter().map(|s| s.to_string()).collect();
    let opts = ProveOptions::default();
    let mut shared = engine::pair(r, c, opts.pair_by, false).expect("pairs");
    equicone::assume::apply_to_shared(&mut shared, r, c, &assume).expect("assumption");
    let kept = shared.clone();
    let rep = engine::prove_shared(r, c, shared, &assume, &opts).expect("proves");
    (rep, kept)
}

/// A random bench circuit (the tests' one generator, `tests/oracle/random.rs`) over inputs
/// `i0..` (or a bus `d[0]..` when `bus`), `gates` gates of fan-in at most 3 reading earlier
/// signals, and `outs` outputs; the candidate is the same circuit with one gate that an
/// output reads (of the last third when one is) changed to another kind of the same arity
/// when `mutate`.
pub fn random_bench(
    seed: u64,
    n: usize,
    gates: usize,
    outs: usize,
    bus: bool,
    mutate: bool,
) -> (String, String) {
    let mut rng = StdRng::seed_from_u64(seed);
    let c = Gates::random(&mut rng, n, gates);
    let name = |s: usize| {
        if s >= n {
            format!("g{}", s - n)
        } else if bus {
            format!("d[{s}]")
        } else {
            format!("i{s}")
        }
    };
    let pick: Vec<usize> = (0..outs).map(|k| n + gates - 1 - k * 2).collect();
    // The planted bug is in a gate some output reads, of the last third when there is one.
    let live = c.live(&pick);
    let cone: Vec<usize> = (0..gates).filter(|&g| live[n + g]).collect();
    let late: Vec<usize> = cone
        .iter()
        .copied()
        .filter(|&g| g >= gates * 2 / 3)
        .collect();
    let from = if late.is_empty() { &cone } else { &late };
    let mutated = mutate.then(|| from[rng.gen_range(0..from.len())]);
    let text = |mutated: Option<usize>| {
        let mut s = String::new();
        for i in 0..n {
            s += &format!("INPUT({})\n", name(i));
        }
        for k in 0..pick.len() {
            s += &format!("OUTPUT(y{k})\n");
        }
        s += &c.lines(mutated, &name);
        for (k, &p) in pick.iter().enumerate() {
            s += &format!("y{k} = BUF({})\n", name(p));
        }
        s
    };
    (text(None), text(mutated))
}

/// Compile `files` with Icarus Verilog (top `equicone_tb`) and run it; returns standard output.
pub fn run_iverilog(files: &[&Path]) -> String {
    let dir = tempfile::tempdir().expect("temp dir");
    let out = dir.path().join("tb.vvp");
    let c = Command::new("iverilog")
        .args(["-g2005", "-s", "equicone_tb", "-o"])
        .arg(&out)
        .args(files)
        .output()
        .expect("run iverilog");
    assert!(
        c.status.success(),
        "iverilog failed:\n{}",
        String::from_utf8_lossy(&c.stderr)
    );
    let r = Command::new("vvp")
        .arg("-n")
        .arg(&out)
        .output()
        .expect("run vvp");
    assert!(
        r.status.success(),
        "vvp failed: {}",
        String::from_utf8_lossy(&r.stderr)
    );
    String::from_utf8_lossy(&r.stdout).into_owned()
}
