//! The clocked families of `gen`: each proved equal (by the clocked check) to its `--rename`
//! copy; the one-hot and binary state machines never called different and equal in simulation
//! by the independent cycle simulator (`seq/oracle.rs`, no equicone code); the Verilog output
//! (plain and renamed, registers with their reset values) run by Icarus Verilog (Debian package
//! iverilog) from reset gives, cycle by cycle, the outputs that the oracle computes on the
//! bench output of the same family (flip-flops starting at 0).

use super::seq_oracle::{self, SeqNet};
use equicone::front::bench::read_bench;
use equicone::gen::{self, GenFormat, GenSpec, Kind, Style};
use equicone::seq::{self, InitUnset, SeqOptions};
use rand::rngs::StdRng;
use rand::{Rng, SeedableRng};
use std::collections::BTreeMap;
use std::fmt::Write;
use std::sync::Arc;

fn families() -> Vec<GenSpec> {
    let mut v = Vec::new();
    for n in [2, 5, 8] {
        v.push(GenSpec::new(Kind::RegSelector, Style::Plain, n));
        v.push(GenSpec::new(Kind::Counter, Style::Plain, n));
        v.push(GenSpec::new(Kind::ShiftRegister, Style::Plain, n));
        v.push(GenSpec::new(Kind::Fsm, Style::Onehot, n));
        v.push(GenSpec::new(Kind::Fsm, Style::Binary, n));
        for stages in [1, 2, 3] {
            let mut s = GenSpec::new(Kind::PipeAdder, Style::Plain, n + 1);
            s.stages = stages;
            v.push(s);
        }
        let mut s = GenSpec::new(Kind::RegRandom, Style::Plain, 200 * n);
        s.inputs = 8;
        v.push(s);
    }
    v
}

fn text(spec: &GenSpec, f: GenFormat) -> String {
    gen::generate(spec, f).expect("generates").text
}

fn renamed(spec: &GenSpec, invert: u32, seed: u64) -> GenSpec {
    let mut s = spec.clone();
    s.rename = Some(invert);
    s.seed = seed;
    s
}

fn options() -> SeqOptions {
    SeqOptions {
        init_unset: InitUnset::Value(false),
        cycles: 12,
        ..SeqOptions::default()
    }
}

#[test]
fn every_family_is_proved_equal_to_its_renamed_copy() {
    for spec in families() {
        for (invert, seed) in [(100, 1), (500, 2), (1000, 3)] {
            let r =
                read_bench(&Arc::from("ref.bench"), &text(&spec, GenFormat::Bench)).expect("reads");
            let ct = text(&renamed(&spec, invert, seed), GenFormat::Bench);
            let c = read_bench(&Arc::from("cand.bench"), &ct).expect("reads");
            assert!(
                c.registers.iter().all(|g| g.name.starts_with("st_")),
                "{ct}"
            );
            let rep = seq::check(&r, &c, &options()).expect("checks");
            assert_eq!(
                rep.verdict,
                "equivalent",
                "{}:\n{rep}",
                spec.command_line(GenFormat::Bench)
            );
        }
    }
}

/// Random input sequences by bit name.
fn random_cycles(net: &SeqNet, n: usize, seed: u64) -> Vec<BTreeMap<String, bool>> {
    let mut rng = StdRng::seed_from_u64(seed);
    (0..n)
        .map(|_| net.inputs.iter().map(|i| (i.clone(), rng.gen())).collect())
        .collect()
}

#[test]
fn one_hot_and_binary_state_machines_agree_and_are_never_called_different() {
    for n in [2, 3, 5, 6, 8] {
        let ot = text(&GenSpec::new(Kind::Fsm, Style::Onehot, n), GenFormat::Bench);
        let bt = text(&GenSpec::new(Kind::Fsm, Style::Binary, n), GenFormat::Bench);
        let (on, bn) = (seq_oracle::parse(&ot), seq_oracle::parse(&bt));
        let cycles = random_cycles(&on, 200, n as u64);
        assert_eq!(on.run(&cycles), bn.run(&cycles), "{n} states");
        let r = read_bench(&Arc::from("onehot.bench"), &ot).expect("reads");
        let c = read_bench(&Arc::from("binary.bench"), &bt).expect("reads");
        let rep = seq::check(&r, &c, &options()).expect("checks");
        assert_ne!(rep.verdict, "different", "{n} states:\n{rep}");
    }
}

/// Simulate `verilog` (module `module`, ports clk, rst and the bench's inputs and outputs) under
/// Icarus: reset for one edge, then `cycles`; per cycle the output bits by name.
fn icarus(
    verilog: &str,
    module: &str,
    net: &SeqNet,
    cycles: &[BTreeMap<String, bool>],
) -> Vec<Vec<bool>> {
    // Ports from bit names: `d[3]` -> bus d.
    let port = |b: &str| b.split('[').next().unwrap_or(b).to_string();
    let mut buses: BTreeMap<String, usize> = BTreeMap::new();
    for b in net.inputs.iter().chain(&net.outputs) {
        *buses.entry(port(b)).or_default() += 1;
    }
    let decl = |p: &str, scalar: bool| {
        if scalar {
            String::new()
        } else {
            format!("[{}:0] ", buses[p] - 1)
        }
    };
    let scalar = |p: &str, list: &[String]| list.iter().any(|b| b == p);
    let mut tb = format!("{verilog}\nmodule tb;\n  reg clk, rst;\n");
    let mut conns = vec![".clk(clk)".to_string(), ".rst(rst)".to_string()];
    let mut seen = Vec::new();
    for (list, kind) in [(&net.inputs, "reg"), (&net.outputs, "wire")] {
        for b in list.iter() {
            let p = port(b);
            if seen.contains(&p) {
                continue;
            }
            seen.push(p.clone());
            let _ = writeln!(tb, "  {kind} {}t_{p};", decl(&p, scalar(&p, list)));
            conns.push(format!(".{p}(t_{p})"));
        }
    }
    let _ = writeln!(tb, "  {module} dut({});", conns.join(", "));
    tb += "  initial begin\n    clk = 0; rst = 1;\n";
    for b in &net.inputs {
        let _ = writeln!(tb, "    t_{b} = 0;");
    }
    tb += "    #1 clk = 1; #1 clk = 0; rst = 0; #1;\n";
    for c in cycles {
        for (b, v) in c {
            let _ = writeln!(tb, "    t_{b} = {};", *v as u8);
        }
        let _ = write!(tb, "    #1 $display(\"{}\"", "%b".repeat(net.outputs.len()));
        for o in &net.outputs {
            let _ = write!(tb, ", t_{o}");
        }
        tb += ");\n    clk = 1; #1 clk = 0; #1;\n";
    }
    tb += "    $finish;\n  end\nendmodule\n";
    let out = super::vcommon::run_iverilog(&tb, "tb");
    out.lines()
        .map(|l| l.trim().chars().map(|c| c == '1').collect())
        .collect()
}

#[test]
fn icarus_runs_the_verilog_output_like_the_bench_output() {
    if !super::vcommon::iverilog_available() {
        return;
    }
    let mut checked = 0;
    for (k, spec) in families().into_iter().enumerate() {
        let net = seq_oracle::parse(&text(&spec, GenFormat::Bench));
        let cycles = random_cycles(&net, 40, k as u64);
        let want = net.run(&cycles);
        for s in [spec.clone(), renamed(&spec, 300, k as u64)] {
            let module = s.module.clone().unwrap_or_else(|| s.default_module());
            let got = icarus(&text(&s, GenFormat::Verilog), &module, &net, &cycles);
            assert_eq!(got, want, "{}", s.command_line(GenFormat::Verilog));
            checked += 1;
        }
    }
    eprintln!("Icarus Verilog ran {checked} generated clocked modules");
}

#[test]
fn verilog_output_reads_back_and_is_proved_equal_to_its_renamed_copy_with_inverted_pairs() {
    use equicone::design::Format;
    let read = |name: &str, text: String| {
        equicone::front::load_texts(Format::Verilog, &[(Arc::from(name), text)], None)
            .unwrap_or_else(|e| panic!("{name}: {e}"))
    };
    for spec in families() {
        let r = read("ref.v", text(&spec, GenFormat::Verilog));
        let c = read("cand.v", text(&renamed(&spec, 500, 5), GenFormat::Verilog));
        assert_eq!(r.registers.len(), c.registers.len());
        let rep = seq::check(&r, &c, &SeqOptions::default()).expect("checks");
        let what = spec.command_line(GenFormat::Verilog);
        assert_eq!(rep.verdict, "equivalent", "{what}:\n{rep}");
        // Half the registers are stored inverted: in Verilog (reset values) the pairing says so
        // (a 2-state one-hot machine's two bits are complements, so either pairing is right).
        if !(spec.kind == Kind::Fsm && spec.n == 2) {
            assert!(rep.pairs.iter().any(|p| p.inverted), "{what}:\n{rep}");
        }
    }
}

/// `reg-random --bug invert`: the delay line stores its input inverted, so the designs first
/// differ in cycle 5 after reset, at output `z`, whatever the inputs; the trace replays.
#[test]
fn random_clocked_bug_first_shows_five_cycles_after_reset() {
    let mut spec = GenSpec::new(Kind::RegRandom, Style::Plain, 3000);
    spec.inputs = 16;
    let r = read_bench(&Arc::from("ref.bench"), &text(&spec, GenFormat::Bench)).expect("reads");
    let mut bug = renamed(&spec, 100, 4);
    bug.bug = Some(gen::Bug::Invert);
    let c = read_bench(&Arc::from("bug.bench"), &text(&bug, GenFormat::Bench)).expect("reads");
    let rep = seq::check(&r, &c, &options()).expect("checks");
    assert_eq!(rep.verdict, "different", "{rep}");
    let t = rep.trace.as_ref().expect("a trace");
    let d = t.first_difference.as_ref().expect("replayed");
    assert_eq!(d.cycle, 5, "{rep}");
    assert!(d.outputs.iter().all(|o| o.reference == "z"), "{rep}");
}
