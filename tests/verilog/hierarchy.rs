//! Netlists in the shapes other tools write: ISCAS-85 circuits (open benchmark data in
//! ../shared/bench-data/iscas85, see SOURCE.md there) cut into a set of modules, written out
//! as hierarchical Verilog with ANSI and non-ANSI headers, named port connections in any
//! order, vector ports connected by concatenations, escaped identifiers, long runs of
//! `assign` expressions (some nested), and gate primitives; then read and proved equal to
//! the bench file. Icarus Verilog (a general-purpose simulator) checks that the written
//! text is legal Verilog with the bench file's function on random vectors.

use super::common::{iverilog_available, read, run_iverilog, shared_dir};
use equicone::check::{check, CheckRequest, DiagnosisRequest};
use equicone::engine::Verdict;
use equicone::front::bench::read_bench;
use equicone::Design;
use std::collections::{HashMap, HashSet};
use std::fmt::Write;
use std::path::PathBuf;
use std::sync::Arc;

/// One gate of a bench file: output, function (lower case), inputs.
struct Gate {
    out: String,
    f: String,
    ins: Vec<String>,
}

struct Bench {
    inputs: Vec<String>,
    outputs: Vec<String>,
    gates: Vec<Gate>,
    /// Gate indices in an order where each reads only inputs and earlier gates (the tests'
    /// one topological sort, `oracle::Net::order`).
    order: Vec<usize>,
}

/// The bench text through the tests' one bench reader (`tests/oracle`), gate names in lower
/// case as Verilog writes its primitives.
fn parse(text: &str) -> Bench {
    let net = super::oracle::parse(text);
    let order = net.order();
    Bench {
        order,
        inputs: net.inputs,
        outputs: net.outputs,
        gates: net
            .gates
            .into_iter()
            .map(|(out, f, ins)| Gate {
                out,
                f: f.to_ascii_lowercase(),
                ins,
            })
            .collect(),
    }
}

/// A gate as a Verilog expression over operand texts.
fn expr(f: &str, ins: &[String]) -> String {
    let join = |op: &str| ins.join(op);
    match f {
        "and" => join(" & "),
        "nand" => format!("~({})", join(" & ")),
        "or" => join(" | "),
        "nor" => format!("~({})", join(" | ")),
        "xor" => join(" ^ "),
        "xnor" => format!("~({})", join(" ^ ")),
        "not" => format!("~{}", ins[0]),
        "buf" | "buff" => ins[0].clone(),
        other => panic!("unexpected bench gate {other}"),
    }
}

/// The gate function with the complemented output.
fn complement(f: &str) -> &'static str {
    match f {
        "and" => "nand",
        "nand" => "and",
        "or" => "nor",
        "nor" => "or",
        "xor" => "xnor",
        "xnor" => "xor",
        "not" => "buf",
        "buf" | "buff" => "not",
        other => panic!("unexpected bench gate {other}"),
    }
}

/// How one module of the set is written.
#[derive(Clone, Copy, PartialEq)]
enum Style {
    /// ANSI header with vector ports, one `assign` per gate, gates read once inlined.
    AnsiAssign,
    /// Non-ANSI header, gate primitives with instance names, escaped internal names.
    PortListGates,
}

/// The bench netlist cut into `parts` modules in topological order, plus a top module
/// `top` with the bench file's ports that instantiates them with named connections.
/// With `mutate`, the first gate of the set computes its complement (AND for NAND, ...).
fn hierarchical(b: &Bench, parts: usize, mutate: bool) -> String {
    let order = &b.order;
    let chunk = order.len().div_ceil(parts);
    let pos: HashMap<&str, usize> = order
        .iter()
        .enumerate()
        .map(|(p, &k)| (b.gates[k].out.as_str(), p / chunk))
        .collect();
    let outputs: HashSet<&str> = b.outputs.iter().map(String::as_str).collect();
    let mut mutated = !mutate;
    let mut out = String::from("// Written by equicone's tests from an ISCAS-85 bench file.\n");
    let mut top_wires: Vec<String> = Vec::new();
    let mut insts = String::new();
    for (m, gates) in order.chunks(chunk).enumerate() {
        let style = if m % 2 == 0 {
            Style::AnsiAssign
        } else {
            Style::PortListGates
        };
        let here: HashSet<&str> = gates.iter().map(|&k| b.gates[k].out.as_str()).collect();
        // Ports: signals read here but made elsewhere; signals made here and read later.
        let mut ins: Vec<&str> = Vec::new();
        for &k in gates {
            for i in &b.gates[k].ins {
                if !here.contains(i.as_str()) && !ins.contains(&i.as_str()) {
                    ins.push(i);
                }
            }
        }
        let mut uses: HashMap<&str, usize> = HashMap::new();
        let mut used_later: HashSet<&str> = HashSet::new();
        for g in &b.gates {
            for i in &g.ins {
                if here.contains(i.as_str()) {
                    if pos[g.out.as_str()] == m {
                        *uses.entry(i).or_insert(0) += 1;
                    } else {
                        used_later.insert(i);
                    }
                }
            }
        }
        let outs: Vec<&str> = gates
            .iter()
            .map(|&k| b.gates[k].out.as_str())
            .filter(|o| used_later.contains(o) || outputs.contains(o))
            .collect();
        let is_out: HashSet<&str> = outs.iter().copied().collect();
        for o in &outs {
            if !outputs.contains(o) {
                top_wires.push(o.to_string());
            }
        }
        let mname = format!("part{m}");
        let mut body = String::new();
        match style {
            Style::AnsiAssign => {
                // Vector ports `pi`/`po`, unpacked into named wires; internal gates read
                // once are inlined into their reader (nesting at most 8 deep).
                let _ = writeln!(
                    out,
                    "module {mname}(input wire [{}:0] pi, output wire [{}:0] po);",
                    ins.len() - 1,
                    outs.len() - 1
                );
                for (j, i) in ins.iter().enumerate() {
                    let _ = writeln!(body, "  wire {i} = pi[{j}];");
                }
                let mut text: HashMap<&str, (String, usize)> = HashMap::new();
                for &k in gates {
                    let g = &b.gates[k];
                    let mut depth = 0;
                    let args: Vec<String> = g
                        .ins
                        .iter()
                        .map(|i| match text.get(i.as_str()) {
                            Some((t, d))
                                if uses.get(i.as_str()) == Some(&1)
                                    && !is_out.contains(i.as_str())
                                    && *d < 8 =>
                            {
                                depth = depth.max(d + 1);
                                format!("({t})")
                            }
                            _ => i.clone(),
                        })
                        .collect();
                    let mut f = g.f.as_str();
                    if !mutated {
                        f = complement(f);
                        mutated = true;
                    }
                    let e = expr(f, &args);
                    let inlined = uses.get(g.out.as_str()) == Some(&1)
                        && !is_out.contains(g.out.as_str())
                        && depth < 8;
                    if !inlined {
                        let _ = writeln!(body, "  wire {};\n  assign {} = {e};", g.out, g.out);
                    } else {
                        // Written anyway as a named wire nobody reads (tools leave such
                        // wires), while its reader uses the expression itself.
                        let _ = writeln!(body, "  wire {}_unused = {e};", g.out);
                    }
                    text.insert(&g.out, (e, depth));
                }
                for (j, o) in outs.iter().enumerate() {
                    let _ = writeln!(body, "  assign po[{j}] = {o};");
                }
            }
            Style::PortListGates => {
                let ports: Vec<String> = ins
                    .iter()
                    .map(|i| format!("p_{i}"))
                    .chain(outs.iter().map(|o| format!("q_{o}")))
                    .collect();
                let _ = writeln!(out, "module {mname}({});", ports.join(", "));
                for i in &ins {
                    let _ = writeln!(body, "  input p_{i};");
                }
                for o in &outs {
                    let _ = writeln!(body, "  output q_{o};");
                }
                let name = |s: &str| -> String {
                    if ins.contains(&s) {
                        format!("p_{s}")
                    } else {
                        format!("\\n/{s} ")
                    }
                };
                for &k in gates {
                    let g = &b.gates[k];
                    let _ = writeln!(body, "  wire {};", name(&g.out));
                }
                for &k in gates {
                    let g = &b.gates[k];
                    let mut f = if g.f == "buff" { "buf" } else { g.f.as_str() };
                    if !mutated {
                        f = complement(f);
                        mutated = true;
                    }
                    let args: Vec<String> = g.ins.iter().map(|i| name(i)).collect();
                    let _ = writeln!(
                        body,
                        "  {f} \\g/{} ({}, {});",
                        g.out,
                        name(&g.out),
                        args.join(", ")
                    );
                }
                for o in &outs {
                    let _ = writeln!(body, "  assign q_{o} = {};", name(o));
                }
            }
        }
        out += &body;
        out += "endmodule\n\n";
        // The instance in the top module: named connections, outputs first, inputs in
        // reverse order, so connections must be matched by name.
        match style {
            Style::AnsiAssign => {
                let rev = |v: &[&str]| {
                    v.iter()
                        .rev()
                        .map(|s| s.to_string())
                        .collect::<Vec<_>>()
                        .join(", ")
                };
                let _ = writeln!(
                    insts,
                    "  {mname} u{m} (.po({{{}}}), .pi({{{}}}));",
                    rev(&outs),
                    rev(&ins)
                );
            }
            Style::PortListGates => {
                let conns: Vec<String> = outs
                    .iter()
                    .map(|o| format!(".q_{o}({o})"))
                    .chain(ins.iter().rev().map(|i| format!(".p_{i}({i})")))
                    .collect();
                let _ = writeln!(
                    insts,
                    "  {mname} u{m} (\n    {}\n  );",
                    conns.join(",\n    ")
                );
            }
        }
    }
    let ports: Vec<String> = b
        .inputs
        .iter()
        .map(|i| format!("input {i}"))
        .chain(b.outputs.iter().map(|o| format!("output {o}")))
        .collect();
    let _ = writeln!(out, "module top(\n  {}\n);", ports.join(",\n  "));
    for w in &top_wires {
        let _ = writeln!(out, "  wire {w};");
    }
    out += &insts;
    out += "endmodule\n";
    out
}

fn prove(r: &Design, c: &Design) -> Verdict {
    let req = CheckRequest {
        diagnosis: DiagnosisRequest::Off,
        ..CheckRequest::new(r, c)
    };
    check(&req).expect("check").verdict()
}

/// c2670 and c7552 are left out: some of their outputs are also inputs, which a Verilog
/// port list cannot say with one name (SOURCE.md).
const CIRCUITS: [&str; 7] = ["c432", "c499", "c880", "c1355", "c1908", "c3540", "c5315"];

#[test]
fn iscas_circuits_as_hierarchical_module_sets_prove_equal_to_their_bench_files() {
    let Some(dir) = shared_dir() else { return };
    for name in CIRCUITS {
        let text = std::fs::read_to_string(dir.join(format!("{name}.bench"))).expect("read bench");
        let bd = read_bench(&Arc::from(format!("{name}.bench")), &text).expect("bench reader");
        let b = parse(&text);
        let written = hierarchical(&b, 6, false);
        if let Some(dump) = std::env::var_os("EQUICONE_DUMP_HIERARCHY") {
            std::fs::write(PathBuf::from(dump).join(format!("{name}.v")), &written).expect("dump");
        }
        let v = read(&written);
        assert_eq!(v.name, "top", "{name}");
        assert_eq!(v.inputs.len(), b.inputs.len(), "{name}");
        assert_eq!(v.outputs.len(), b.outputs.len(), "{name}");
        assert_eq!(prove(&bd, &v), Verdict::Equivalent, "{name}");
        let bad = read(&hierarchical(&b, 6, true));
        assert!(
            prove(&bd, &bad) == Verdict::Different,
            "{name}: one gate written with its output complemented must be found"
        );
    }
}

/// Icarus Verilog simulates the written module set on random vectors; every output must
/// match the bench file as equicone's bench reader evaluates it.
#[test]
fn icarus_verilog_agrees_with_the_bench_files_on_the_written_module_sets() {
    let Some(dir) = shared_dir() else { return };
    if !iverilog_available() {
        return;
    }
    for name in ["c432", "c880"] {
        let text = std::fs::read_to_string(dir.join(format!("{name}.bench"))).expect("read bench");
        let bd = read_bench(&Arc::from(format!("{name}.bench")), &text).expect("bench reader");
        let b = parse(&text);
        let mut src = hierarchical(&b, 6, false);
        let mut rng = equicone::rng::SplitMix64::new(1, 0);
        let mut vectors = Vec::new();
        for _ in 0..32 {
            let v: Vec<bool> = (0..b.inputs.len())
                .map(|_| rng.next_u64() & 1 == 1)
                .collect();
            vectors.push(v);
        }
        src += "module tb;\n";
        for i in &b.inputs {
            let _ = writeln!(src, "  reg {i};");
        }
        for o in &b.outputs {
            let _ = writeln!(src, "  wire {o};");
        }
        let conns: Vec<String> = b
            .inputs
            .iter()
            .chain(&b.outputs)
            .map(|p| format!(".{p}({p})"))
            .collect();
        let _ = writeln!(src, "  top dut({});\n  initial begin", conns.join(", "));
        let fmt = "%b".repeat(b.outputs.len());
        let outs = b.outputs.join(", ");
        for v in &vectors {
            for (i, x) in b.inputs.iter().zip(v) {
                let _ = write!(src, " {i} = {};", *x as u8);
            }
            let _ = writeln!(src, "\n    #1 $display(\"{fmt}\", {outs});");
        }
        src += "  end\nendmodule\n";
        let got = run_iverilog(&src, "tb");
        let lines: Vec<&str> = got.lines().collect();
        assert_eq!(lines.len(), vectors.len(), "{name}: {got}");
        // The bench design's inputs are in INPUT order, as the vectors are.
        for (v, line) in vectors.iter().zip(lines) {
            let want: String = bd
                .eval(v)
                .iter()
                .map(|&x| if x { '1' } else { '0' })
                .collect();
            assert_eq!(line, want, "{name}");
        }
    }
}
