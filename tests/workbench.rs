//! The selector workbench end to end: generated selectors of every style against the one-line
//! spec (N = 2..300, `--assume s < N` where N is not a power of two), and generated mutants found
//! different with counterexamples that Icarus Verilog (an independent simulator) confirms.

use equicone::assume;
use equicone::check::{check, CheckRequest, DiagnosisRequest};
use equicone::design::Format;
use equicone::engine::{self, Counterexample, ProveOptions, ProveReport, Verdict};
use equicone::front::load_texts;
use equicone::gen::{self, Bug, GenFormat, GenSpec, Kind, Style};
use equicone::Design;
use std::collections::BTreeMap;
use std::fmt::Write;
use std::process::Command;
use std::sync::Arc;

fn verilog(spec: &GenSpec) -> (String, Design) {
    let g = gen::generate(spec, GenFormat::Verilog).unwrap_or_else(|e| panic!("{e}"));
    let d = load_texts(
        Format::Verilog,
        &[(Arc::from("gen.v"), g.text.clone())],
        None,
    )
    .unwrap_or_else(|e| panic!("{e}\n{}", g.text));
    (g.text, d)
}

fn prove(r: &Design, c: &Design, assumptions: &[String]) -> ProveReport {
    let req = CheckRequest {
        assumptions: assumptions.to_vec(),
        diagnosis: DiagnosisRequest::Off,
        ..CheckRequest::new(r, c)
    };
    check(&req).unwrap_or_else(|e| panic!("{e}")).report
}

fn range_assumption(n: usize) -> Vec<String> {
    if n.is_power_of_two() {
        Vec::new()
    } else {
        vec![format!("s < {n}")]
    }
}

/// Every style of N:1 selector (width 1) for N = 2..300 equals the one-line spec `y = d[s]`.
#[test]
fn every_selector_style_equals_the_spec() {
    let mut proofs = 0;
    for n in 2..=300usize {
        let (_, spec) = verilog(&GenSpec::new(Kind::Selector, Style::Spec, n));
        for style in [Style::Decoder, Style::Tree, Style::Onehot, Style::Mixed] {
            let (_, cand) = verilog(&GenSpec::new(Kind::Selector, style, n).seed(n as u64));
            let rep = prove(&spec, &cand, &range_assumption(n));
            assert_eq!(rep.verdict, Verdict::Equivalent, "N = {n}, style {style:?}");
            proofs += 1;
        }
    }
    eprintln!("{proofs} selector proofs");
}

/// Without the range assumption, a non-power-of-two spec reads x for out-of-range selects. By
/// default that x is a don't-care (equal, one pair per output bit counted); under the strict
/// reading a candidate cannot match it for every value: the tool says different.
#[test]
fn out_of_range_selects_are_dont_cares_unless_strict() {
    let (_, spec) = verilog(&GenSpec::new(Kind::Selector, Style::Spec, 12));
    let (_, cand) = verilog(&GenSpec::new(Kind::Selector, Style::Tree, 12));
    let rep = prove(&spec, &cand, &[]);
    assert_eq!(rep.verdict, Verdict::Equivalent);
    assert_eq!(rep.dont_care_pairs, spec.outputs.len());
    let mut req = CheckRequest {
        diagnosis: DiagnosisRequest::Off,
        ..CheckRequest::new(&spec, &cand)
    };
    req.options.strict_unknowns = true;
    let rep = check(&req).unwrap_or_else(|e| panic!("{e}")).report;
    assert_eq!(rep.verdict, Verdict::Different);
    assert_eq!(rep.dont_care_pairs, 0);
    let s: u32 = rep.counterexamples[0]
        .inputs
        .iter()
        .filter_map(|i| {
            i.name
                .strip_prefix("s[")
                .map(|k| (k.trim_end_matches(']').parse::<u32>().unwrap(), i.value))
        })
        .map(|(k, v)| (v as u32) << k)
        .sum();
    assert!(s >= 12, "the counterexample selects out of range (s = {s})");
}

fn iverilog_available() -> bool {
    let ok = Command::new("iverilog")
        .arg("-V")
        .output()
        .is_ok_and(|o| o.status.success());
    if !ok {
        if std::env::var("EQUICONE_REQUIRE_IVERILOG").as_deref() == Ok("1") {
            panic!("iverilog is required (EQUICONE_REQUIRE_IVERILOG=1) but was not found");
        }
        eprintln!("SKIPPED: iverilog not found (install Debian package iverilog; EQUICONE_REQUIRE_IVERILOG=1 makes this a failure)");
    }
    ok
}

/// Bus values of a counterexample's shared inputs: port -> bits by index.
fn buses(c: &Counterexample) -> BTreeMap<String, BTreeMap<i64, bool>> {
    let mut m: BTreeMap<String, BTreeMap<i64, bool>> = BTreeMap::new();
    for i in c
        .inputs
        .iter()
        .filter(|i| i.side == equicone::engine::Side::Both)
    {
        let (port, idx) = equicone::design::split_bit(&i.name);
        m.entry(port.to_string())
            .or_default()
            .insert(idx.unwrap_or(0), i.value);
    }
    m
}

/// Simulate both modules in iverilog on each counterexample; returns, per case, the printed
/// output of (reference, candidate) as `name=bits` lines.
fn iverilog_outputs(
    cases: &[(String, String, String, String, &Counterexample, &Design)],
) -> Vec<(String, String)> {
    let dir = tempfile::tempdir().unwrap();
    let mut src = String::new();
    let mut tb = String::from("module tb;\n");
    for (k, (rt, rm, ct, cm, cex, d)) in cases.iter().enumerate() {
        src += rt;
        src += ct;
        let mut conns = Vec::new();
        for (port, bits) in buses(cex) {
            let w = bits.len();
            let val: String = bits
                .values()
                .rev()
                .map(|&b| if b { '1' } else { '0' })
                .collect();
            let _ = writeln!(tb, "  wire [{}:0] i{k}_{port} = {w}'b{val};", w - 1);
            conns.push(format!(".{port}(i{k}_{port})"));
        }
        let mut outs: BTreeMap<String, usize> = BTreeMap::new();
        for o in &d.outputs {
            *outs.entry(o.port.clone()).or_default() += 1;
        }
        for (tag, module) in [("r", rm), ("c", cm)] {
            let mut oc = conns.clone();
            for (port, w) in &outs {
                let _ = writeln!(tb, "  wire [{}:0] {tag}{k}_{port};", w - 1);
                oc.push(format!(".{port}({tag}{k}_{port})"));
            }
            let _ = writeln!(tb, "  {module} u{tag}{k} ({});", oc.join(", "));
        }
        let _ = write!(tb, "  initial #{} begin", k + 1);
        for tag in ["r", "c"] {
            for port in outs.keys() {
                let _ = write!(tb, " $display(\"{k} {tag} {port}=%b\", {tag}{k}_{port});");
            }
        }
        tb += " end\n";
    }
    tb += "endmodule\n";
    src += &tb;
    let file = dir.path().join("all.v");
    std::fs::write(&file, &src).unwrap();
    let exe = dir.path().join("sim");
    let c = Command::new("iverilog")
        .args(["-g2005", "-o"])
        .arg(&exe)
        .arg(&file)
        .output()
        .unwrap();
    assert!(
        c.status.success(),
        "iverilog: {}",
        String::from_utf8_lossy(&c.stderr)
    );
    let r = Command::new("vvp").arg("-n").arg(&exe).output().unwrap();
    let text = String::from_utf8_lossy(&r.stdout).into_owned();
    (0..cases.len())
        .map(|k| {
            let pick = |tag: &str| {
                text.lines()
                    .filter_map(|l| l.strip_prefix(&format!("{k} {tag} ")))
                    .collect::<Vec<_>>()
                    .join(" ")
            };
            (pick("r"), pick("c"))
        })
        .collect()
}

/// Mutants of every gate-level kind are found different, and Icarus Verilog, run on the
/// generated files, reproduces each counterexample's output values on both designs.
#[test]
fn mutants_are_caught_and_iverilog_confirms_the_counterexamples() {
    if !iverilog_available() {
        return;
    }
    let plans: Vec<(Kind, Style, usize)> = vec![
        (Kind::Selector, Style::Tree, 12),
        (Kind::Selector, Style::Decoder, 16),
        (Kind::Selector, Style::Onehot, 9),
        (Kind::Selector, Style::Mixed, 32),
        (Kind::Decoder, Style::Flat, 4),
        (Kind::Priority, Style::Chain, 8),
        (Kind::Shifter, Style::Log, 8),
        (Kind::Adder, Style::KoggeStone, 8),
        (Kind::Multiplier, Style::Array, 4),
    ];
    let bugs = [
        Bug::Swap,
        Bug::Stuck0,
        Bug::Stuck1,
        Bug::Invert,
        Bug::Misroute,
    ];
    let mut cases = Vec::new();
    let mut reports = Vec::new();
    for (i, &(kind, style, n)) in plans.iter().enumerate() {
        let mut spec = GenSpec::new(kind, Style::Spec, n);
        spec.module = Some(format!("ref{i}"));
        let (rt, r) = verilog(&spec);
        for (j, &bug) in bugs.iter().enumerate() {
            let mut m = GenSpec::new(kind, style, n).seed(7 + j as u64).bug(bug);
            m.module = Some(format!("mut{i}_{j}"));
            let Ok(g) = gen::generate(&m, GenFormat::Verilog) else {
                continue;
            };
            let c = load_texts(
                Format::Verilog,
                &[(Arc::from("mut.v"), g.text.clone())],
                None,
            )
            .unwrap();
            let assumption = if kind == Kind::Selector {
                range_assumption(n)
            } else {
                Vec::new()
            };
            let rep = prove(&r, &c, &assumption);
            assert_eq!(
                rep.verdict,
                Verdict::Different,
                "{kind:?} {style:?} {bug:?}: {:?}",
                g.mutation
            );
            reports.push((
                rt.clone(),
                format!("ref{i}"),
                g.text,
                format!("mut{i}_{j}"),
                rep,
                r.clone(),
            ));
        }
    }
    for (rt, rm, ct, cm, rep, d) in &reports {
        cases.push((
            rt.clone(),
            rm.clone(),
            ct.clone(),
            cm.clone(),
            &rep.counterexamples[0],
            d,
        ));
    }
    // iverilog wants each module once: keep the first copy of every reference text.
    let mut seen = std::collections::BTreeSet::new();
    let cases: Vec<_> = cases
        .into_iter()
        .map(|(rt, rm, ct, cm, cex, d)| {
            let rt = if seen.insert(rm.clone()) {
                rt
            } else {
                String::new()
            };
            (rt, rm, ct, cm, cex, d)
        })
        .collect();
    let outs = iverilog_outputs(&cases);
    for ((_, rm, _, cm, cex, _), (ro, co)) in cases.iter().zip(&outs) {
        assert_ne!(ro, co, "{rm} vs {cm}: iverilog shows no difference");
        for d in &cex.differing {
            let (port, idx) = equicone::design::split_bit(&d.reference);
            let bit = |printed: &str| -> bool {
                let v = printed
                    .split_whitespace()
                    .find_map(|kv| kv.strip_prefix(&format!("{port}=")))
                    .unwrap();
                let k = idx.unwrap_or(0) as usize;
                v.as_bytes()[v.len() - 1 - k] == b'1'
            };
            assert_eq!(bit(ro), d.reference_value, "{rm}: {}", d.reference);
            assert_eq!(bit(co), d.candidate_value, "{cm}: {}", d.candidate);
        }
    }
    assert!(outs.len() >= 40, "only {} mutants", outs.len());
    eprintln!("{} mutants confirmed by iverilog", outs.len());
}

/// Route tables of generated selectors follow the construction: output bit b at select value v
/// follows d[v*W + b] (common practice for this packing); for N not a power of two the values
/// past N are excluded by the assumption. Swapping two data lines shows exactly those rows.
#[test]
fn route_tables_match_the_construction() {
    use equicone::routes::{route_table, select_bits, Route};
    use equicone::sat::Limits;
    for (n, w, style) in [
        (4, 2, Style::Tree),
        (12, 3, Style::Decoder),
        (16, 1, Style::Onehot),
        (10, 2, Style::Mixed),
    ] {
        let (text, d) = verilog(&GenSpec::new(Kind::Selector, style, n).width(w));
        let (d, c) = assume::on_design(&d, &range_assumption(n)).unwrap();
        let sel = select_bits(&d, "s").unwrap();
        for b in 0..w {
            let out = d.output_index(&format!("y[{b}]")).unwrap();
            let t = route_table(&d, out, "s", &sel, c, &Limits::none());
            for (v, r) in t.routes.iter().enumerate() {
                let want = if v < n {
                    Route::Input {
                        name: format!("d[{}]", v * w + b),
                        inverted: false,
                    }
                } else {
                    Route::Excluded
                };
                assert_eq!(*r, want, "N={n} W={w} {style:?} y[{b}] s={v}");
            }
        }
        if style == Style::Tree {
            // Cross d[2] and d[6] (channels 1 and 3, bit 0) in the text.
            let swapped = text
                .replace("d[2]", "d[TMP]")
                .replace("d[6]", "d[2]")
                .replace("d[TMP]", "d[6]");
            let d2 = load_texts(Format::Verilog, &[(Arc::from("sw.v"), swapped)], None).unwrap();
            let t = route_table(
                &d2,
                d2.output_index("y[0]").unwrap(),
                "s",
                &sel,
                equicone::Lit::TRUE,
                &Limits::none(),
            );
            let wrong: Vec<usize> = (0..n)
                .filter(|&v| {
                    t.routes[v]
                        != Route::Input {
                            name: format!("d[{}]", v * w),
                            inverted: false,
                        }
                })
                .collect();
            assert_eq!(wrong, vec![1, 3]);
        }
    }
}

/// A 1024:1 selector, decoder-driven against a tree: too hard for one small SAT budget, so the
/// default engine splits on the select inputs; the verdict, and the counterexample for a crossed
/// pair of data lines, are the same as the single-call miter's (`--engine plain`).
#[test]
fn large_selectors_are_decided_like_the_single_call_miter() {
    use equicone::engine::EngineKind;
    let (_, dec) = verilog(&GenSpec::new(Kind::Selector, Style::Decoder, 1024));
    let (text, tree) = verilog(&GenSpec::new(Kind::Selector, Style::Tree, 1024));
    let crossed = text
        .replace("d[700]", "d[TMP]")
        .replace("d[701]", "d[700]")
        .replace("d[TMP]", "d[701]");
    let crossed = load_texts(Format::Verilog, &[(Arc::from("x.v"), crossed)], None).unwrap();
    for engine in [EngineKind::Sweep, EngineKind::Plain] {
        let opts = ProveOptions {
            engine,
            ..ProveOptions::default()
        };
        let rep = engine::prove(&dec, &tree, &opts).unwrap_or_else(|_| panic!("prove"));
        assert_eq!(rep.verdict, Verdict::Equivalent, "{engine:?}");
        let rep = engine::prove(&dec, &crossed, &opts).unwrap_or_else(|_| panic!("prove"));
        assert_eq!(rep.verdict, Verdict::Different, "{engine:?}");
        let s: usize = rep.counterexamples[0]
            .inputs
            .iter()
            .filter_map(|i| {
                i.name
                    .strip_prefix("s[")
                    .map(|k| (k.trim_end_matches(']').parse::<usize>().unwrap(), i.value))
            })
            .map(|(k, v)| (v as usize) << k)
            .sum();
        assert!(
            s == 700 || s == 701,
            "{engine:?}: the counterexample selects a crossed line (s = {s})"
        );
    }
}
