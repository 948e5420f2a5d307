//! Write an N:1 selector (N = 2^k) in bench format to standard output, for the cone
//! benchmarks: `cargo run --release --example selector_bench -- tree 12 > sel4096.bench`.
//! `tree`: a tree of 2:1 selectors, each as OR(AND(s, t), AND(NOT s, e)); `decoder`: k
//! inverters, N k-input decoder ANDs, N data ANDs and one N-input OR.

use std::fmt::Write;

fn main() {
    let args: Vec<String> = std::env::args().collect();
    let style = args.get(1).map(String::as_str).unwrap_or("tree");
    let k: usize = match args.get(2).map(|s| s.parse()) {
        Some(Ok(k)) if (1..=20).contains(&k) => k,
        _ => {
            eprintln!("usage: selector_bench tree|decoder K   (N = 2^K data inputs, 1 <= K <= 20)");
            std::process::exit(2);
        }
    };
    let n = 1usize << k;
    let mut s = String::new();
    let _ = writeln!(
        s,
        "# {n}:1 selector ({style}), data d[0..{}], select s[0..{}]",
        n - 1,
        k - 1
    );
    for i in 0..n {
        let _ = writeln!(s, "INPUT(d[{i}])");
    }
    for j in 0..k {
        let _ = writeln!(s, "INPUT(s[{j}])");
    }
    let _ = writeln!(s, "OUTPUT(y)");
    for j in 0..k {
        let _ = writeln!(s, "ns{j} = NOT(s[{j}])");
    }
    match style {
        "tree" => {
            let mut layer: Vec<String> = (0..n).map(|i| format!("d[{i}]")).collect();
            for lvl in 0..k {
                let mut next = Vec::new();
                for (j, pair) in layer.chunks(2).enumerate() {
                    let out = if lvl + 1 == k {
                        "y".to_string()
                    } else {
                        format!("m{lvl}_{j}")
                    };
                    let _ = writeln!(s, "t{lvl}_{j} = AND(s[{lvl}], {})", pair[1]);
                    let _ = writeln!(s, "e{lvl}_{j} = AND(ns{lvl}, {})", pair[0]);
                    let _ = writeln!(s, "{out} = OR(t{lvl}_{j}, e{lvl}_{j})");
                    next.push(out);
                }
                layer = next;
            }
        }
        "decoder" => {
            let mut terms = Vec::new();
            for i in 0..n {
                let lits: Vec<String> = (0..k)
                    .map(|j| {
                        if i >> j & 1 == 1 {
                            format!("s[{j}]")
                        } else {
                            format!("ns{j}")
                        }
                    })
                    .collect();
                let _ = writeln!(s, "dec{i} = AND({})", lits.join(", "));
                let _ = writeln!(s, "t{i} = AND(dec{i}, d[{i}])");
                terms.push(format!("t{i}"));
            }
            let _ = writeln!(s, "y = OR({})", terms.join(", "));
        }
        other => {
            eprintln!("unknown style `{other}`: use tree or decoder");
            std::process::exit(2);
        }
    }
    print!("{s}");
}
