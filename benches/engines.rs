//! `cargo bench --bench engines`: the default engine (`sweep`) against the single-call miter
//! (`--engine plain`) on generated pairs, measured in one run and reported as ratios (the
//! fastest of three runs each). The full table, with an external solver, is `scripts/bench`.
//!
//! Pairs: a 4096:1 selector (decoder-based against a tree of 2:1 selectors) and a 128-bit
//! adder (ripple against Kogge-Stone), both from `equicone::gen`.

use equicone::engine::{prove, EngineKind, ProveOptions, Verdict};
use equicone::front::load_texts;
use equicone::gen::{self, GenFormat, GenSpec, Kind, Style};
use equicone::{Design, Format};
use std::sync::Arc;
use std::time::Instant;

fn design(spec: &GenSpec) -> Design {
    let g = gen::generate(spec, GenFormat::Bench).unwrap_or_else(|e| panic!("{e}"));
    load_texts(Format::Bench, &[(Arc::from("gen.bench"), g.text)], None)
        .unwrap_or_else(|e| panic!("{e}"))
}

/// Fastest of three proofs, in seconds; every one must say equivalent.
fn time(r: &Design, c: &Design, engine: EngineKind) -> f64 {
    let opts = ProveOptions {
        engine,
        ..ProveOptions::default()
    };
    (0..3)
        .map(|_| {
            let t = Instant::now();
            let rep = prove(r, c, &opts).unwrap_or_else(|_| panic!("prove failed"));
            assert_eq!(rep.verdict, Verdict::Equivalent, "{}", engine.name());
            t.elapsed().as_secs_f64()
        })
        .fold(f64::INFINITY, f64::min)
}

fn main() {
    let rows = [
        (
            "selector 4096:1, decoder vs tree",
            GenSpec::new(Kind::Selector, Style::Decoder, 4096),
            GenSpec::new(Kind::Selector, Style::Tree, 4096),
        ),
        (
            "adder 128 bit, ripple vs Kogge-Stone",
            GenSpec::new(Kind::Adder, Style::Ripple, 128),
            GenSpec::new(Kind::Adder, Style::KoggeStone, 128),
        ),
    ];
    println!("| pair | sweep s | plain s | plain/sweep |");
    println!("|---|---|---|---|");
    for (name, r, c) in rows {
        let (r, c) = (design(&r), design(&c));
        let sweep = time(&r, &c, EngineKind::Sweep);
        let plain = time(&r, &c, EngineKind::Plain);
        println!(
            "| {name} | {sweep:.3} | {plain:.3} | {:.1}x |",
            plain / sweep
        );
    }
}
