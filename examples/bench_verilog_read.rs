//! Benchmark helper for scripts/bench-verilog-read: `gen N FILE` writes a flat gate-level
//! netlist of N primitives (a random DAG of 2-input gates and inverters over 64 inputs);
//! `read FILE` reads and elaborates it with the Verilog front-end and prints the time taken.

use std::fmt::Write as _;
use std::sync::Arc;
use std::time::Instant;

fn gen(n: usize, path: &str) {
    let mut s = String::with_capacity(n * 40);
    let ins = 64;
    s.push_str("module flat(");
    let ports: Vec<String> = (0..ins)
        .map(|i| format!("input i{i}"))
        .chain((0..64).map(|o| format!("output o{o}")))
        .collect();
    s.push_str(&ports.join(", "));
    s.push_str(");\n");
    for chunk in (0..n).collect::<Vec<_>>().chunks(32) {
        let names: Vec<String> = chunk.iter().map(|k| format!("n{k}")).collect();
        let _ = writeln!(s, "  wire {};", names.join(", "));
    }
    let mut rng = equicone::rng::SplitMix64::new(0x2545_F491_4F6C_DD1D, 0);
    let mut rnd = move |m: usize| rng.below(m);
    let kinds = ["and", "nand", "or", "nor", "xor", "xnor", "not", "buf"];
    for k in 0..n {
        let src = |r: &mut dyn FnMut(usize) -> usize| {
            // Mostly recent signals, sometimes inputs: long paths and wide fan-out.
            if k < 8 || r(8) == 0 {
                format!("i{}", r(ins))
            } else {
                format!("n{}", k - 1 - r(k.min(1000)))
            }
        };
        let kind = kinds[rnd(kinds.len())];
        let a = src(&mut rnd);
        if kind == "not" || kind == "buf" {
            let _ = writeln!(s, "  {kind} g{k} (n{k}, {a});");
        } else {
            let b = src(&mut rnd);
            let _ = writeln!(s, "  {kind} g{k} (n{k}, {a}, {b});");
        }
    }
    for o in 0..64 {
        let _ = writeln!(s, "  buf (o{o}, n{});", n - 1 - o);
    }
    s.push_str("endmodule\n");
    std::fs::write(path, s).expect("write netlist");
}

fn main() {
    let args: Vec<String> = std::env::args().collect();
    match args.get(1).map(String::as_str) {
        Some("gen") if args.len() == 4 => gen(args[2].parse().expect("N"), &args[3]),
        Some("read") if args.len() == 3 => {
            let t = Instant::now();
            let text = std::fs::read_to_string(&args[2]).expect("read file");
            let d = equicone::front::verilog::read_verilog(
                &[(Arc::from(args[2].as_str()), text)],
                None,
            )
            .unwrap_or_else(|e| panic!("{e}"));
            let nl = d.netlist.as_ref().map(|n| n.cells.len()).unwrap_or(0);
            println!(
                "read and elaborated {} primitives in {:.2} s: {} inputs, {} outputs, {} AIG ands",
                nl,
                t.elapsed().as_secs_f64(),
                d.inputs.len(),
                d.outputs.len(),
                d.aig.num_ands()
            );
        }
        _ => {
            eprintln!("usage: bench_verilog_read gen N FILE | read FILE");
            std::process::exit(2);
        }
    }
}
