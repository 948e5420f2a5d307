//! Helpers of the explain tests: proving a pair in-process with the shared graph kept, random
//! bench pairs, and running Icarus Verilog on several files.

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

/// A random bench circuit over inputs `i0..` (or a bus `d[0]..` when `bus`), `gates` gates of
/// fan-in at most 3 reading earlier signals, and `outs` outputs; the candidate is the same
/// circuit with gate `mutate` (when given) changed to another kind of the same arity.
pub fn random_bench(
    seed: u64,
    n: usize,
    gates: usize,
    outs: usize,
    bus: bool,
    mutate: bool,
) -> (String, String) {
    let mut rng = StdRng::seed_from_u64(seed);
    let name = |i: usize| {
        if bus {
            format!("d[{i}]")
        } else {
            format!("i{i}")
        }
    };
    let mut sig: Vec<String> = (0..n).map(name).collect();
    let kinds2 = ["AND", "OR", "NAND", "NOR", "XOR", "XNOR"];
    let mut lines = Vec::new();
    for g in 0..gates {
        let arity = if rng.gen_bool(0.15) {
            1
        } else {
            rng.gen_range(2..=3)
        };
        let args: Vec<String> = (0..arity)
            .map(|_| sig[rng.gen_range(0..sig.len())].clone())
            .collect();
        let kind = if arity == 1 {
            "NOT"
        } else {
            kinds2[rng.gen_range(0..kinds2.len())]
        };
        lines.push((format!("g{g}"), kind, args));
        sig.push(format!("g{g}"));
    }
    let pick: Vec<usize> = (0..outs).map(|k| n + gates - 1 - k * 2).collect();
    let text = |lines: &[(String, &str, Vec<String>)]| {
        let mut s = String::new();
        for i in 0..n {
            s += &format!("INPUT({})\n", name(i));
        }
        for (k, _) in pick.iter().enumerate() {
            s += &format!("OUTPUT(y{k})\n");
        }
        for (o, kd, a) in lines {
            s += &format!("{o} = {kd}({})\n", a.join(", "));
        }
        for (k, &p) in pick.iter().enumerate() {
            s += &format!("y{k} = BUF({})\n", sig[p]);
        }
        s
    };
    let reference = text(&lines);
    let mut cand = lines.clone();
    if mutate {
        // A gate in the last third, so that it reaches an output.
        let g = rng.gen_range(gates * 2 / 3..gates);
        cand[g].1 = match cand[g].1 {
            "NOT" => "BUFF",
            "AND" => "NAND",
            "OR" => "XOR",
            "NAND" => "OR",
            "NOR" => "AND",
            "XOR" => "XNOR",
            _ => "OR",
        };
    }
    (reference, text(&cand))
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
