//! The multiplier family (multipliers, multiply-accumulate, squarers; unsigned and signed;
//! array, Wallace, Dadda and radix-4 Booth; every final adder) against Rust's own u128 / i128
//! arithmetic on random and corner vectors, against Icarus Verilog's `*` on 10,000 random
//! vectors each, and against published structure facts.

use super::iverilog;
use super::support::{bench, bits, eval, ports, random_vectors, value};
use equicone::gen::mult::dadda_heights;
use equicone::gen::{build, generate, Bug, GenFormat, GenSpec, Kind, Op, Style};
use std::fmt::Write;
use std::process::Command;

const FINALS: [Style; 4] = [
    Style::Ripple,
    Style::Cla,
    Style::KoggeStone,
    Style::BrentKung,
];

/// Every gate-level variant of `kind` at width `n`: each style, signed and unsigned, each
/// final adder for the tree styles.
fn variants(kind: Kind, n: usize) -> Vec<GenSpec> {
    let mut out = Vec::new();
    for &style in kind.styles() {
        for signed in [false, true] {
            let mut s = GenSpec::new(kind, style, n);
            s.signed = signed;
            if matches!(style, Style::Wallace | Style::Dadda | Style::Booth) {
                for f in FINALS {
                    out.push(s.clone().final_adder(f));
                }
            } else {
                out.push(s);
            }
        }
    }
    out
}

/// Two's complement value of `w` bits.
fn signed_value(b: &[bool]) -> i128 {
    let v = value(b) as i128;
    let w = b.len();
    if w < 128 && b[w - 1] {
        v - (1i128 << w)
    } else {
        v
    }
}

/// The expected product word (2n bits, as u128) of `spec` on the operand bits `v`.
fn expected(spec: &GenSpec, v: &[Vec<bool>]) -> u128 {
    let n = spec.n;
    let w = 2 * n;
    let mask = if w >= 128 {
        u128::MAX
    } else {
        (1u128 << w) - 1
    };
    let r: i128 = if spec.signed {
        let a = signed_value(&v[0]);
        match spec.kind {
            Kind::Squarer => a.wrapping_mul(a),
            Kind::Mac => a
                .wrapping_mul(signed_value(&v[1]))
                .wrapping_add(signed_value(&v[2])),
            _ => a.wrapping_mul(signed_value(&v[1])),
        }
    } else {
        let a = value(&v[0]);
        (match spec.kind {
            Kind::Squarer => a.wrapping_mul(a),
            Kind::Mac => a.wrapping_mul(value(&v[1])).wrapping_add(value(&v[2])),
            _ => a.wrapping_mul(value(&v[1])),
        }) as i128
    };
    (r as u128) & mask
}

/// Corner operand values of `n` bits: 0, 1, all ones (max unsigned, -1 signed), the largest
/// and smallest signed values, alternating bits.
fn corners(n: usize) -> Vec<u128> {
    let max = (1u128 << n) - 1;
    let alt = (0..n).filter(|i| i % 2 == 0).fold(0u128, |v, i| v | 1 << i);
    vec![0, 1, max, max >> 1, 1u128 << (n - 1), alt, max ^ alt]
}

fn check(spec: &GenSpec, random: usize) -> usize {
    let p = ports(spec);
    let b = bench(spec);
    let mut vectors = random_vectors(&p, random, spec.n as u64 + spec.seed);
    let cs = corners(spec.n);
    for &x in &cs {
        for &y in &cs {
            let v: Vec<Vec<bool>> = p
                .inputs
                .iter()
                .enumerate()
                .map(|(k, (_, w, _))| bits(if k == 1 { y } else { x }, *w))
                .collect();
            vectors.push(v);
        }
    }
    let outs = eval(&b, &p, &vectors);
    for (v, o) in vectors.iter().zip(&outs) {
        assert_eq!(
            value(&o[0]),
            expected(spec, v),
            "{}: operands {:?}",
            spec.command_line(GenFormat::Bench),
            v.iter().map(|x| value(x)).collect::<Vec<_>>()
        );
    }
    vectors.len()
}

#[test]
fn every_variant_computes_its_product_against_native_arithmetic() {
    // u128 / i128 products (Rust's own arithmetic), widths with room in 128 bits for 2n.
    let mut checked = 0;
    for kind in [Kind::Multiplier, Kind::Mac, Kind::Squarer] {
        for n in [2, 3, 4, 5, 8, 11, 16] {
            for spec in variants(kind, n) {
                checked += check(&spec, 40);
            }
        }
        for spec in variants(kind, 33).into_iter().chain(variants(kind, 64)) {
            checked += check(&spec, 20);
        }
    }
    eprintln!("multiplier family: {checked} vectors agree with u128/i128 arithmetic");
}

#[test]
fn planted_arithmetic_bugs_change_the_function() {
    // Each planted bug is described and, on some vector, makes the product wrong.
    for (kind, style, bug, signed) in [
        (Kind::Multiplier, Style::Array, Bug::PpBit, false),
        (Kind::Multiplier, Style::Dadda, Bug::SwapCarry, true),
        (Kind::Multiplier, Style::Booth, Bug::BoothSign, true),
        (Kind::Multiplier, Style::Booth, Bug::BoothSign, false),
        (Kind::Mac, Style::Wallace, Bug::SwapCarry, false),
        (Kind::Squarer, Style::Array, Bug::PpBit, false),
    ] {
        for seed in 1..=3 {
            let mut spec = GenSpec::new(kind, style, 8).seed(seed).bug(bug);
            spec.signed = signed;
            let g = generate(&spec, GenFormat::Bench).expect("generates");
            let what = g.mutation.expect("a planted bug is described");
            let p = ports(&spec);
            let b = bench(&spec);
            let vectors = random_vectors(&p, 2000, seed);
            let outs = eval(&b, &p, &vectors);
            let wrong = vectors
                .iter()
                .zip(&outs)
                .filter(|(v, o)| value(&o[0]) != expected(&spec, v))
                .count();
            assert!(wrong > 0, "{what}: no vector shows it");
        }
    }
    // Misplaced requests are refused with a clear message.
    let e = generate(
        &GenSpec::new(Kind::Multiplier, Style::Dadda, 8).bug(Bug::BoothSign),
        GenFormat::Verilog,
    )
    .unwrap_err();
    assert!(e.help.contains("booth"), "{e}");
    let e = generate(
        &GenSpec::new(Kind::Adder, Style::Ripple, 8).bug(Bug::PpBit),
        GenFormat::Verilog,
    )
    .unwrap_err();
    assert!(e.message.contains("does not apply"), "{e}");
    let e = generate(
        &GenSpec::new(Kind::Multiplier, Style::Array, 8).final_adder(Style::Cla),
        GenFormat::Verilog,
    )
    .unwrap_err();
    assert!(e.message.contains("--final-adder"), "{e}");
}

#[test]
fn published_structure_facts() {
    // From memory: an n x n array multiplier has n^2 partial-product bits; radix-4 Booth has
    // about n/2 rows (ceil(n/2) signed; one more digit for unsigned operands of even width);
    // Dadda's stage heights are 2, 3, 4, 6, 9, 13, 19, 28, 42, 63.
    for n in [4, 7, 16] {
        let c = build(&GenSpec::new(Kind::Multiplier, Style::Array, n)).expect("builds");
        // Partial products: the AND gates of two operand bits.
        let pp = c
            .gates()
            .iter()
            .filter(|g| {
                g.op == Op::And
                    && g.ins.len() == 2
                    && g.ins.iter().all(|&i| c.input_port_of(i).is_some())
            })
            .count();
        assert_eq!(pp, n * n, "{n}x{n} array");
        for signed in [false, true] {
            let mut s = GenSpec::new(Kind::Multiplier, Style::Booth, n);
            s.signed = signed;
            let text = build(&s).expect("builds").to_verilog();
            let rows = (0..n)
                .filter(|k| text.contains(&format!("bneg{k}")))
                .count();
            let want = if signed {
                n.div_ceil(2)
            } else {
                (n + 1).div_ceil(2)
            };
            assert_eq!(rows, want, "{n}-bit Booth, signed {signed}");
        }
    }
    assert_eq!(dadda_heights(64), vec![2, 3, 4, 6, 9, 13, 19, 28, 42, 63]);
}

#[test]
fn icarus_verilog_multiplies_like_the_generated_netlists() {
    // Icarus Verilog's own `*` (IEEE 1364-2005 semantics) on 10,000 random vectors per module,
    // computed in the testbench.
    if !iverilog::available("icarus_verilog_multiplies_like_the_generated_netlists") {
        return;
    }
    let mut specs = Vec::new();
    for style in [Style::Array, Style::Wallace, Style::Dadda, Style::Booth] {
        specs.push(GenSpec::new(Kind::Multiplier, style, 8));
        specs.push(GenSpec::new(Kind::Multiplier, style, 7).signed());
    }
    specs.push(GenSpec::new(Kind::Multiplier, Style::Booth, 12).final_adder(Style::KoggeStone));
    specs.push(
        GenSpec::new(Kind::Multiplier, Style::Dadda, 9)
            .signed()
            .final_adder(Style::Cla),
    );
    specs.push(GenSpec::new(Kind::Mac, Style::Booth, 6).signed());
    specs.push(GenSpec::new(Kind::Squarer, Style::Wallace, 8));
    specs.push(GenSpec::new(Kind::Squarer, Style::Array, 7).signed());
    let dir = tempfile::tempdir().expect("temp dir");
    let mut src = String::new();
    let mut tb = String::from("module tb;\n  integer i, bad;\n");
    for (k, spec) in specs.iter().enumerate() {
        let mut spec = spec.clone();
        spec.module = Some(format!("m{k}"));
        src += &generate(&spec, GenFormat::Verilog).expect("generates").text;
        let n = spec.n;
        let s = if spec.signed { " signed" } else { "" };
        let _ = writeln!(
            tb,
            "  reg{s} [{}:0] a{k}, b{k};\n  reg{s} [{}:0] c{k};\n  wire [{}:0] p{k};\n  reg [{}:0] want{k};",
            n - 1,
            2 * n - 1,
            2 * n - 1,
            2 * n - 1
        );
        let conns = match spec.kind {
            Kind::Squarer => format!(".a(a{k}), .p(p{k})"),
            Kind::Mac => format!(".a(a{k}), .b(b{k}), .c(c{k}), .p(p{k})"),
            _ => format!(".a(a{k}), .b(b{k}), .p(p{k})"),
        };
        let _ = writeln!(tb, "  m{k} u{k} ({conns});");
    }
    tb += "  initial begin\n    bad = 0;\n    for (i = 0; i < 10000; i = i + 1) begin\n";
    for (k, spec) in specs.iter().enumerate() {
        let w = 2 * spec.n;
        let _ = writeln!(
            tb,
            "      a{k} = $random; b{k} = $random; c{k} = {{$random, $random}};"
        );
        let expr = match spec.kind {
            Kind::Squarer => format!("a{k} * a{k}"),
            Kind::Mac => format!("a{k} * b{k} + c{k}"),
            _ => format!("a{k} * b{k}"),
        };
        // The operands are extended to the 2n-bit context (sign-extended when signed).
        let _ = writeln!(
            tb,
            "      want{k} = {expr};\n      #1 if (p{k} !== want{k}) begin bad = bad + 1; \
             if (bad < 5) $display(\"MISMATCH {k} %d %d %d: %b vs %b\", a{k}, b{k}, c{k}, p{k}, want{k}); end"
        );
        let _ = w;
    }
    tb += "    end\n    $display(\"DONE %0d\", bad);\n    $finish;\n  end\nendmodule\n";
    src += &tb;
    let file = dir.path().join("mult.v");
    let exe = dir.path().join("mult.vvp");
    std::fs::write(&file, &src).expect("write");
    let out = Command::new("iverilog")
        .args(["-g2005", "-o"])
        .arg(&exe)
        .arg(&file)
        .output()
        .expect("run iverilog");
    assert!(
        out.status.success(),
        "iverilog: {}",
        String::from_utf8_lossy(&out.stderr)
    );
    let run = Command::new("vvp")
        .arg("-n")
        .arg(&exe)
        .output()
        .expect("run vvp");
    let text = String::from_utf8_lossy(&run.stdout);
    assert!(
        text.contains("DONE 0"),
        "Icarus Verilog disagrees:\n{}",
        text.lines().take(10).collect::<Vec<_>>().join("\n")
    );
    eprintln!(
        "iverilog: {} multiplier-family modules agree with `*` on 10,000 vectors each",
        specs.len()
    );
}
