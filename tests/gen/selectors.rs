//! Selectors route every in-range select value to its channel, in every style; a tree of 2:1
//! cells has N-1 cells per bit in depth ceil(log2 N) (common practice).

use super::support::{bench, bench_text, bits, eval, ports};
use equicone::gen::{build, clog2, generate, GenFormat, GenSpec, Kind, Op, Style};
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};

#[test]
fn every_select_value_routes_its_channel() {
    let mut rng = StdRng::seed_from_u64(9);
    let mut checked = 0;
    for n in [2, 3, 4, 5, 7, 8, 12, 16, 17, 33, 64] {
        for w in [1, 3, 8] {
            for &style in Kind::Selector.styles() {
                let seeds: &[u64] = if style == Style::Mixed {
                    &[1, 2, 3, 4, 5]
                } else {
                    &[1]
                };
                for &seed in seeds {
                    let spec = GenSpec::new(Kind::Selector, style, n).width(w).seed(seed);
                    let p = ports(&spec);
                    let k = clog2(n);
                    let mut vectors = Vec::new();
                    for s in 0..n {
                        for _ in 0..2 {
                            let d: Vec<bool> = (0..n * w).map(|_| rng.gen()).collect();
                            vectors.push(vec![d, bits(s as u128, k)]);
                        }
                    }
                    for (v, o) in vectors.iter().zip(eval(&bench(&spec), &p, &vectors)) {
                        let s = super::support::value(&v[1]) as usize;
                        assert_eq!(
                            o[0],
                            v[0][s * w..(s + 1) * w],
                            "{n}x{w} {} seed {seed}, s = {s}",
                            style.name()
                        );
                        checked += 1;
                    }
                }
            }
        }
    }
    eprintln!("selectors: {checked} vectors routed correctly");
}

#[test]
fn a_tree_uses_n_minus_one_cells_in_log_depth() {
    for n in 2..=70 {
        for w in [1, 3] {
            let spec = GenSpec::new(Kind::Selector, Style::Tree, n).width(w);
            let c = build(&spec).unwrap();
            assert_eq!(c.count(Op::Mux2), (n - 1) * w, "{n}x{w} tree cells");
            assert_eq!(
                c.gates().len(),
                (n - 1) * w,
                "{n}x{w} tree has only 2:1 cells"
            );
            assert_eq!(
                c.depth(|op| op == Op::Mux2),
                clog2(n) as u32,
                "{n}x{w} tree depth"
            );
            // The printed Verilog has one `?:` assign per cell; bench spells each cell as 3 gates
            // plus one inverter per select bit used.
            let v = generate(&spec, GenFormat::Verilog).unwrap().text;
            assert_eq!(
                v.matches(" ? ").count(),
                (n - 1) * w,
                "{n}x{w} tree Verilog"
            );
            let b = bench(&spec);
            assert_eq!(
                b.gates(),
                3 * (n - 1) * w + clog2(n),
                "{n}x{w} tree bench gates"
            );
        }
    }
}

#[test]
fn non_tree_styles_use_no_two_to_one_cells() {
    for style in [Style::Decoder, Style::Onehot] {
        let c = build(&GenSpec::new(Kind::Selector, style, 12).width(8)).unwrap();
        assert_eq!(c.count(Op::Mux2), 0, "{}", style.name());
    }
    let text = bench_text(&GenSpec::new(Kind::Selector, Style::Spec, 12).width(8));
    assert!(text.contains("# style spec"), "{text}");
}
