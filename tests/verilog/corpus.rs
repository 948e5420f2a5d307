//! The RTL corpus of issue 15: hand-written modules in the styles working engineers write
//! (legacy sensitivity lists, cases without a default that cover every value, macros,
//! SystemVerilog, divisions, gate-level netlists with supply nets and delays, specs that read
//! `x` for unused values). Each file of `tests/data/verilog/corpus/` holds three modules with
//! the same ports: `spec`, an independent gate-level or behavioural counterpart `impl`, and a
//! mutant `bug` of the counterpart.
//!
//! Checks: `impl` is proved equivalent to `spec` and `bug` different (each difference is a
//! re-simulated vector); and Icarus Verilog 11 (`-g2012`), an outside simulator, runs the three
//! modules on every input value: wherever `spec` has a defined bit, `impl` has the same bit and
//! our own evaluation of `spec` agrees; `bug` differs from a defined `spec` bit somewhere; where
//! Icarus shows `x` for `spec`, our three-valued reading of it gives no value either.

use super::common::{iverilog_available, run_iverilog_as};
use equicone::check::{check, CheckRequest, DiagnosisRequest};
use equicone::design::Design;
use equicone::engine::Verdict;
use equicone::front::verilog::read_verilog;
use std::fmt::Write;
use std::path::PathBuf;
use std::sync::Arc;

fn corpus() -> Vec<(String, String)> {
    let dir = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("tests/data/verilog/corpus");
    let mut files: Vec<PathBuf> = std::fs::read_dir(&dir)
        .expect("corpus folder")
        .map(|e| e.expect("entry").path())
        .filter(|p| p.extension().is_some_and(|e| e == "v"))
        .collect();
    files.sort();
    files
        .into_iter()
        .map(|p| {
            let name = p.file_name().unwrap().to_string_lossy().into_owned();
            (name, std::fs::read_to_string(&p).expect("read"))
        })
        .collect()
}

fn top(name: &str, text: &str, module: &str) -> Design {
    read_verilog(&[(Arc::from(name), text.to_string())], Some(module))
        .unwrap_or_else(|e| panic!("{name} ({module}) must read:\n{e}"))
}

fn verdict(r: &Design, c: &Design) -> Verdict {
    let req = CheckRequest {
        diagnosis: DiagnosisRequest::Off,
        ..CheckRequest::new(r, c)
    };
    check(&req).expect("check").verdict()
}

/// Port names with their widths, in declaration order, from the bits the reader lists.
fn ports<'a>(bits: impl Iterator<Item = &'a str>) -> Vec<(String, usize)> {
    let mut out: Vec<(String, usize)> = Vec::new();
    for p in bits {
        match out.last_mut() {
            Some((n, w)) if n == p => *w += 1,
            _ => out.push((p.to_string(), 1)),
        }
    }
    out
}

#[test]
fn every_counterpart_is_equivalent_and_every_mutant_different() {
    let files = corpus();
    assert!(files.len() >= 30, "the corpus has {} modules", files.len());
    for (name, text) in &files {
        let spec = top(name, text, "spec");
        let imp = top(name, text, "impl");
        let bug = top(name, text, "bug");
        assert_eq!(verdict(&spec, &imp), Verdict::Equivalent, "{name}: impl");
        assert_eq!(verdict(&spec, &bug), Verdict::Different, "{name}: bug");
    }
}

#[test]
fn icarus_agrees_on_every_input_value() {
    if !iverilog_available() {
        return;
    }
    for (name, text) in corpus() {
        let spec = top(&name, &text, "spec");
        let ins = ports(
            spec.inputs
                .iter()
                .filter(|b| !b.is_unknown())
                .map(|b| b.port.as_str()),
        );
        let outs = ports(spec.outputs.iter().map(|o| o.port.as_str()));
        let nin: usize = ins.iter().map(|p| p.1).sum();
        assert!(
            nin <= 12,
            "{name}: {nin} input bits is too many to enumerate"
        );
        // The testbench: all three modules on the same inputs, one line per input value with
        // each module's outputs concatenated (first output port first, MSB first).
        let mut tb = text.clone();
        tb += "\nmodule tb;\n";
        for (p, w) in &ins {
            let _ = writeln!(tb, "  reg [{}:0] {p};", w - 1);
        }
        for m in ["spec", "impl", "bug"] {
            for (p, w) in &outs {
                let _ = writeln!(tb, "  wire [{}:0] {m}_{p};", w - 1);
            }
            let conns: Vec<String> = ins
                .iter()
                .map(|(p, _)| format!(".{p}({p})"))
                .chain(outs.iter().map(|(p, _)| format!(".{p}({m}_{p})")))
                .collect();
            let _ = writeln!(tb, "  {m} u_{m} ({});", conns.join(", "));
        }
        let all_in: Vec<&str> = ins.iter().map(|(p, _)| p.as_str()).collect();
        let cat = |m: &str| -> String {
            let v: Vec<String> = outs.iter().map(|(p, _)| format!("{m}_{p}")).collect();
            format!("{{{}}}", v.join(", "))
        };
        let _ = writeln!(
            tb,
            "  integer i;\n  initial begin\n    for (i = 0; i < {}; i = i + 1) begin\n      {{{}}} = i;\n      #10 $display(\"%b %b %b\", {}, {}, {});\n    end\n  end\nendmodule",
            1u64 << nin,
            all_in.join(", "),
            cat("spec"),
            cat("impl"),
            cat("bug")
        );
        let out = run_iverilog_as(&tb, "tb", "-g2012");
        let lines: Vec<&str> = out.lines().collect();
        assert_eq!(lines.len(), 1 << nin, "{name}: one line per input value");
        let mut bug_differs = false;
        let roots: Vec<_> = spec.outputs.iter().map(|o| o.lit).collect();
        for (v, line) in lines.iter().enumerate() {
            let f: Vec<&str> = line.split(' ').collect();
            let (s, i, b) = (f[0].as_bytes(), f[1].as_bytes(), f[2].as_bytes());
            // Our reading of spec at this value: the concatenation's bit k (LSB first) is
            // input bit k of the spec's port bits in reverse declaration order.
            let mut values = vec![false; spec.inputs.len()];
            for (k, &idx) in lsb_order(&spec).iter().enumerate() {
                values[idx] = (v >> k) & 1 == 1;
            }
            let ours = equicone::engine::dont_care::eval_ternary(&spec, &values, &roots);
            let n = s.len();
            for j in 0..n {
                // Text position j is output bit n-1-j of the concatenation (MSB first); the
                // reader lists output bits LSB first per port, ports in declaration order.
                let ours_j = ours[output_index(&spec, n - 1 - j)];
                match s[j] {
                    b'0' | b'1' => {
                        let want = s[j] == b'1';
                        assert_eq!(i[j], s[j], "{name}: impl at input {v:#x}: {line}");
                        assert_eq!(
                            ours_j,
                            Some(want),
                            "{name}: our spec at input {v:#x}: {line}"
                        );
                        bug_differs |= b[j] != s[j];
                    }
                    _ => assert_eq!(ours_j, None, "{name}: Icarus has x at input {v:#x}: {line}"),
                }
            }
        }
        assert!(
            bug_differs,
            "{name}: Icarus sees no difference of the mutant"
        );
        // Our counterexample for the mutant: at that input value Icarus shows a defined spec
        // bit that the mutant does not have (a difference where the reference is defined).
        let bug = top(&name, &text, "bug");
        let req = CheckRequest {
            diagnosis: DiagnosisRequest::Off,
            ..CheckRequest::new(&spec, &bug)
        };
        let rep = check(&req).expect("check").report;
        let cex = &rep.counterexamples[0];
        let mut v = 0usize;
        for (k, &idx) in lsb_order(&spec).iter().enumerate() {
            let want = &spec.inputs[idx].name;
            let bit = cex.inputs.iter().find(|i| &i.name == want).expect("input");
            v |= (bit.value as usize) << k;
        }
        let f: Vec<&[u8]> = lines[v].split(' ').map(str::as_bytes).collect();
        assert!(
            (0..f[0].len()).any(|j| f[0][j] != b'x' && f[0][j] != f[2][j]),
            "{name}: our counterexample {v:#x} is no difference in Icarus: {}",
            lines[v]
        );
    }
}

/// The design's port input bits in the order of the concatenation of all input ports (first
/// port most significant), least significant first. The reader lists ports in declaration
/// order, each LSB first.
fn lsb_order(d: &Design) -> Vec<usize> {
    let bits: Vec<usize> = (0..d.inputs.len())
        .filter(|&i| !d.inputs[i].is_unknown())
        .collect();
    let groups = ports(bits.iter().map(|&i| d.inputs[i].port.as_str()));
    let mut out = Vec::new();
    let mut end = bits.len();
    for (_, w) in groups.iter().rev() {
        out.extend_from_slice(&bits[end - w..end]);
        end -= w;
    }
    out
}

/// The design output index of bit `k` (LSB = 0) of the concatenation of all output ports in
/// declaration order, first port most significant.
fn output_index(d: &Design, k: usize) -> usize {
    // The concatenation's LSB is the last port's LSB; the reader lists ports in order, each
    // LSB first: walk the ports from the last.
    let ports = ports(d.outputs.iter().map(|o| o.port.as_str()));
    let mut base = d.outputs.len();
    let mut k = k;
    for (_, w) in ports.iter().rev() {
        base -= w;
        if k < *w {
            return base + k;
        }
        k -= w;
    }
    unreachable!("bit {k} is outside the outputs")
}

/// `===`/`!==` whose operands may be x (a literal, an out-of-range select, through nets) are
/// refused at the operator, each once, and nothing else is reported.
#[test]
fn case_equality_on_a_value_that_may_be_x_is_refused() {
    let e = super::common::read_err(
        "module m(input [3:0] a, b, input [2:0] s, output y, z);\n  wire [3:0] t = s[2] ? 4'bx : a;\n  wire w = b[s];\n  assign y = a === 4'bx;\n  assign z = (t === b) | (w !== 1'b1);\nendmodule\n",
    );
    assert!(e.contains("t.v:4:16: error: unsupported: `===` on a value that may be x or z (it reads x/z literal 4'bx)"), "{e}");
    assert!(e.contains("t.v:5:17: error: unsupported: `===`"), "{e}");
    assert!(e.contains("t.v:5:29: error: unsupported: `!==` on a value that may be x or z (it reads out-of-range bit-select"), "{e}");
    assert_eq!(e.matches("error:").count(), 3, "{e}");
}
