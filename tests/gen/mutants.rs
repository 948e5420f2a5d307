//! Every planted bug changes some output (checked here on the bench text with the test's own
//! evaluator, inside the selector's select range), and is named in the file's header.

use super::support::{bench, bench_text, eval, ports, random_vectors, Vector};
use equicone::gen::{generate, Bug, GenFormat, GenSpec, Kind, Style};

fn bases() -> Vec<GenSpec> {
    let mut v = Vec::new();
    for &style in &Kind::Selector.styles()[1..] {
        v.push(GenSpec::new(Kind::Selector, style, 12).width(3));
        v.push(GenSpec::new(Kind::Selector, style, 8));
    }
    for (kind, n) in [
        (Kind::Decoder, 4),
        (Kind::Priority, 11),
        (Kind::Shifter, 12),
        (Kind::Adder, 16),
        (Kind::Multiplier, 6),
    ] {
        for &style in &kind.styles()[1..] {
            v.push(GenSpec::new(kind, style, n));
        }
    }
    let mut r = GenSpec::new(Kind::Random, Style::Plain, 400);
    r.inputs = 12;
    v.push(r);
    v
}

/// All vectors when the inputs are few, else 4096 random ones.
fn vectors(spec: &GenSpec) -> Vec<Vector> {
    let p = ports(spec);
    let total: usize = p.inputs.iter().map(|i| i.1).sum();
    if total <= 12 && p.care.is_none() {
        return (0..1u64 << total)
            .map(|x| {
                let mut at = 0;
                p.inputs
                    .iter()
                    .map(|(_, w, _)| {
                        let bits = (0..*w).map(|b| (x >> (at + b)) & 1 == 1).collect();
                        at += w;
                        bits
                    })
                    .collect()
            })
            .collect();
    }
    random_vectors(&p, 4096, 77)
}

#[test]
fn every_mutant_differs_from_its_clean_circuit() {
    let bugs = [
        Bug::Swap,
        Bug::Stuck0,
        Bug::Stuck1,
        Bug::Invert,
        Bug::Misroute,
    ];
    let mut count = 0;
    for base in bases() {
        let p = ports(&base);
        let vs = vectors(&base);
        let clean = eval(&bench(&base), &p, &vs);
        assert!(bench_text(&base).contains("# mutation: none"));
        for bug in bugs {
            for seed in 1..=3 {
                let spec = base.clone().bug(bug).seed(seed);
                let g = generate(&spec, GenFormat::Bench)
                    .unwrap_or_else(|e| panic!("{}: {e}", spec.command_line(GenFormat::Bench)));
                let what = g.mutation.clone().expect("a mutation is described");
                assert!(what.starts_with(bug.name()), "{what}");
                assert!(
                    g.text.contains(&format!("# mutation: {what}")),
                    "header names the mutation"
                );
                let got = eval(&super::oracle::parse(&g.text).evaluator(), &p, &vs);
                assert!(
                    got != clean,
                    "{} ({what}) agrees with the clean circuit on {} vectors",
                    spec.command_line(GenFormat::Bench),
                    vs.len()
                );
                let v = generate(&spec, GenFormat::Verilog).unwrap().text;
                assert!(
                    v.contains(&format!("// mutation: {what}")),
                    "Verilog header names the mutation"
                );
                count += 1;
            }
        }
    }
    eprintln!("mutants: {count} mutants all differ from their clean circuits");
}

#[test]
fn a_named_place_is_used_or_refused_clearly() {
    let mut spec = GenSpec::new(Kind::Selector, Style::Tree, 12)
        .width(8)
        .bug(Bug::Swap);
    spec.at = Some("m0_3_0".to_string());
    let g = generate(&spec, GenFormat::Verilog).unwrap();
    let what = g.mutation.unwrap();
    assert!(
        what.contains("`m0_3_0`") && what.contains("`d[48]`") && what.contains("`d[56]`"),
        "{what}"
    );
    assert!(
        g.text.contains("assign m0_3_0 = s[0] ? d[48] : d[56];"),
        "{}",
        g.text
    );

    spec.at = Some("d[5]".to_string());
    let e = generate(&spec, GenFormat::Verilog).unwrap_err();
    assert!(e.message.contains("primary input"), "{e}");
    spec.bug = Some(Bug::Stuck1);
    let g = generate(&spec, GenFormat::Verilog).unwrap();
    assert_eq!(
        g.mutation.as_deref(),
        Some("stuck1: net `d[5]` is stuck at 1")
    );

    spec.at = Some("nosuchnet".to_string());
    let e = generate(&spec, GenFormat::Verilog).unwrap_err();
    assert!(e.message.contains("no net named `nosuchnet`"), "{e}");
}
