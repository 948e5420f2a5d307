//! Icarus Verilog accepts the generated Verilog of every kind and style (spec one-liners,
//! gate-level netlists, mutants) and simulates it to the same values as the bench text of the
//! same spec, evaluated by the test's own evaluator, on random vectors (selects in range).

use super::iverilog::{available, run, Case};
use super::support::{bench, eval, ports, random_vectors};
use equicone::gen::{generate, Bug, GenFormat, GenSpec, Kind};

fn specs() -> Vec<GenSpec> {
    let mut v = Vec::new();
    for (kind, sizes) in [
        (Kind::Selector, vec![2, 12, 16]),
        (Kind::Decoder, vec![1, 3]),
        (Kind::Priority, vec![2, 5, 8]),
        (Kind::Shifter, vec![5, 8]),
        (Kind::Adder, vec![1, 13]),
        (Kind::Multiplier, vec![2, 7]),
        (Kind::Random, vec![300]),
    ] {
        for n in sizes {
            for &style in kind.styles() {
                let mut spec = GenSpec::new(kind, style, n);
                if kind == Kind::Selector && n == 12 {
                    spec.width = 8;
                }
                if kind == Kind::Random {
                    spec.inputs = 16;
                }
                v.push(spec.clone());
                if n > 2 && (kind.styles()[0] != style || kind == Kind::Random) {
                    let bug = [
                        Bug::Swap,
                        Bug::Stuck0,
                        Bug::Stuck1,
                        Bug::Invert,
                        Bug::Misroute,
                    ][v.len() % 5];
                    v.push(spec.bug(bug));
                }
            }
        }
    }
    v
}

#[test]
fn iverilog_agrees_with_the_bench_text() {
    if !available("iverilog_agrees_with_the_bench_text") {
        return;
    }
    let specs = specs();
    let mut cases = Vec::new();
    let mut expected = Vec::new();
    for (k, spec) in specs.iter().enumerate() {
        let mut s = spec.clone();
        s.module = Some(format!("dut{k}"));
        let p = ports(&s);
        let vectors = random_vectors(&p, 40, k as u64);
        let want: Vec<Vec<String>> = eval(&bench(&s), &p, &vectors)
            .into_iter()
            .map(|ports| {
                ports
                    .iter()
                    .map(|bits| {
                        bits.iter()
                            .rev()
                            .map(|&b| if b { '1' } else { '0' })
                            .collect()
                    })
                    .collect()
            })
            .collect();
        expected.push(want);
        cases.push(Case {
            module: format!("dut{k}"),
            verilog: generate(&s, GenFormat::Verilog).unwrap().text,
            ports: p,
            vectors,
        });
    }
    let (got, messages) = run(&cases);
    assert!(
        messages.trim().is_empty(),
        "iverilog -Wall printed:\n{messages}"
    );
    let mut vectors = 0;
    for (k, spec) in specs.iter().enumerate() {
        for (j, want) in expected[k].iter().enumerate() {
            assert_eq!(
                &got[k][j],
                want,
                "{} vector {j}",
                spec.command_line(GenFormat::Verilog)
            );
            vectors += 1;
        }
    }
    eprintln!(
        "iverilog: {} modules, {vectors} vectors agree with the bench text",
        specs.len()
    );
}
