//! Flags: a masked input, unused inputs, constant outputs, `--expect` differences, support
//! subsets, unknown-value sources, and claims left undecided by a limit.

use crate::common::{bench, check_evidence};
use equicone::cone::{
    audit, compare_supports, parse_expect, select_outputs, AuditOptions, ClaimVerdict, Flag,
    IndependentBy,
};
use equicone::design::{InputBit, InputKind};
use equicone::diag::SourcePos;
use equicone::sat::Limits;
use std::sync::Arc;

const MASKED: &str =
    "INPUT(a)\nINPUT(t)\nOUTPUT(y)\nn = NOT(t)\np = AND(a, t)\nq = AND(a, n)\ny = OR(p, q)\n";

#[test]
fn masked_input_is_redundant_and_the_real_one_is_not() {
    // y = (a & t) | (a & !t) = a.
    let d = bench(MASKED);
    let r = audit(&d, &AuditOptions::default(), &Limits::none());
    let o = &r.outputs[0];
    assert_eq!(o.support, vec!["a"]);
    assert_eq!(o.redundant, vec!["t"]);
    assert!(r.flags.contains(&Flag::RedundantInput {
        output: "y".into(),
        input: "t".into(),
        by: IndependentBy::CofactorsMerged
    }));
    assert!(r.flags.contains(&Flag::UnusedInput {
        input: "t".into(),
        connected: true
    }));
    assert!(!r
        .flags
        .iter()
        .any(|f| matches!(f, Flag::RedundantInput { input, .. } if input == "a")));
    assert!(r.flagged());
    assert_eq!(check_evidence(&d, &r), 1);
    let text = r.to_string();
    assert!(
        text.contains("y: support 1 of cone 2 inputs (4 gates): a\n"),
        "{text}"
    );
    assert!(
        text.contains("  redundant (cofactors identical after structural hashing): t\n"),
        "{text}"
    );
    assert!(text.contains("  redundant input: y does not depend on t, which is wired into its cone (cofactors identical after structural hashing)\n"), "{text}");
}

#[test]
fn redundancy_that_needs_sat_says_unsat_and_a_tight_limit_leaves_it_undecided() {
    // y = a ^ (t & p1) ^ (t & p2), with p1 and p2 the same 10-input parity built in two
    // association orders: equal functions, different graphs, so t is masked only
    // semantically and structural hashing cannot see it.
    let mut s = String::from("INPUT(a)\nINPUT(t)\n");
    for i in 0..10 {
        s.push_str(&format!("INPUT(b{i})\n"));
    }
    s.push_str("OUTPUT(y)\n");
    s.push_str("l0 = XOR(b0, b1)\n");
    for i in 2..10 {
        s.push_str(&format!("l{} = XOR(l{}, b{i})\n", i - 1, i - 2));
    }
    s.push_str("r0 = XOR(b8, b9)\n");
    for i in (0..8).rev() {
        s.push_str(&format!("r{} = XOR(b{i}, r{})\n", 8 - i, 7 - i));
    }
    s.push_str("u = AND(t, l8)\nv = AND(t, r8)\nw = XOR(u, v)\ny = XOR(a, w)\n");
    let d = bench(&s);
    let r = audit(&d, &AuditOptions::default(), &Limits::none());
    let o = &r.outputs[0];
    assert_eq!(o.support, vec!["a"], "{r}");
    let t = o.claims.iter().find(|c| c.input == "t").unwrap();
    assert_eq!(
        t.verdict,
        ClaimVerdict::Independent {
            by: IndependentBy::Unsat,
            sat: Some("unsat")
        }
    );
    let text = r.to_string();
    assert!(
        text.contains("  redundant (sat: unsat): t, b0, b1,"),
        "{text}"
    );
    assert!(
        text.contains("  redundant inputs: y does not depend on t, b0, b1,"),
        "{text}"
    );
    assert_eq!(r.stats.independent_by_sat, 11, "{:?}", r.stats);

    let tight = Limits::new(None, Some(1));
    let r = audit(&d, &AuditOptions::default(), &tight);
    assert!(r.undecided(), "{r}");
    assert!(r.outputs[0].undecided.contains(&"t".to_string()), "{r}");
    assert!(!r
        .flags
        .iter()
        .any(|f| matches!(f, Flag::RedundantInput { input, .. } if input == "t")));
    assert!(r.to_string().contains("t (conflict limit reached)"), "{r}");
    assert!(
        !r.flagged(),
        "undecided inputs are neither redundant nor unused: {r}"
    );
}

#[test]
fn constant_and_unconnected() {
    let d = bench("INPUT(a)\nINPUT(b)\nINPUT(c)\nOUTPUT(y)\nOUTPUT(z)\nn = NOT(a)\ny = AND(a, n)\nz = BUF(b)\n");
    let r = audit(&d, &AuditOptions::default(), &Limits::none());
    assert_eq!(r.outputs[0].constant, Some(false));
    assert!(r.flags.contains(&Flag::ConstantOutput {
        output: "y".into(),
        value: false
    }));
    assert!(r.flags.contains(&Flag::RedundantInput {
        output: "y".into(),
        input: "a".into(),
        by: IndependentBy::NoPath
    }));
    assert!(r.flags.contains(&Flag::UnusedInput {
        input: "c".into(),
        connected: false
    }));
    assert!(r.flags.contains(&Flag::UnusedInput {
        input: "a".into(),
        connected: true
    }));
    assert!(!r
        .flags
        .iter()
        .any(|f| matches!(f, Flag::UnusedInput { input, .. } if input == "b")));
    // Auditing only z says nothing about unused inputs.
    let opts = AuditOptions {
        outputs: select_outputs(&d, &["z".to_string()]).unwrap(),
        ..AuditOptions::default()
    };
    let r = audit(&d, &opts, &Limits::none());
    assert!(!r.flagged(), "{r}");
    assert!(select_outputs(&d, &["w".to_string()]).is_err());
}

#[test]
fn expectations_flag_missing_unexpected_and_subsets() {
    let d = bench("INPUT(a)\nINPUT(b)\nINPUT(c)\nINPUT(d)\nOUTPUT(y1)\nOUTPUT(y2)\ny1 = AND(a, b)\ny2 = AND(a, b, c)\n");
    let exp = parse_expect(&Arc::from("e.txt"), "y1: a b d\ny2: a, b, c\n", &d).unwrap();
    let r = audit(
        &d,
        &AuditOptions {
            expect: Some(exp),
            ..AuditOptions::default()
        },
        &Limits::none(),
    );
    assert!(r.flags.contains(&Flag::MissingInput {
        output: "y1".into(),
        input: "d".into(),
        expected_at: "e.txt:1:1".into()
    }));
    assert!(r.flags.contains(&Flag::SubsetSupport {
        output: "y1".into(),
        of: "y2".into()
    }));
    let exp = parse_expect(&Arc::from("e.txt"), "y1: a\ny2: a, b, c\n", &d).unwrap();
    let r = audit(
        &d,
        &AuditOptions {
            expect: Some(exp),
            ..AuditOptions::default()
        },
        &Limits::none(),
    );
    assert!(r.flags.contains(&Flag::UnexpectedInput {
        output: "y1".into(),
        input: "b".into(),
        expected_at: "e.txt:1:1".into()
    }));
    // Exactly as expected: only the unconnected input d is flagged.
    let exp = parse_expect(
        &Arc::from("e.json"),
        "{\"y1\": [\"a\", \"b\"], \"y2\": \"a b c\"}",
        &d,
    )
    .unwrap();
    let r = audit(
        &d,
        &AuditOptions {
            expect: Some(exp),
            ..AuditOptions::default()
        },
        &Limits::none(),
    );
    assert_eq!(
        r.flags,
        vec![Flag::UnusedInput {
            input: "d".into(),
            connected: false
        }]
    );
}

#[test]
fn unknown_sources_are_labelled_and_flagged_when_read() {
    // Turn input u into an unknown-value source, as a Verilog front-end does for an x.
    let mut d = bench("INPUT(a)\nINPUT(u)\nINPUT(v)\nOUTPUT(y)\nOUTPUT(z)\ny = XOR(a, u)\nn = NOT(v)\np = AND(a, v)\nq = AND(a, n)\nz = OR(p, q)\n");
    let file: Arc<str> = Arc::from("sel.v");
    for (k, what) in [(1, "x literal"), (2, "out-of-range select")] {
        d.inputs[k] = InputBit {
            kind: InputKind::Unknown {
                pos: SourcePos::new(&file, 7, 3),
                what: what.to_string(),
            },
            ..d.inputs[k].clone()
        };
    }
    let r = audit(&d, &AuditOptions::default(), &Limits::none());
    assert_eq!(r.inputs[1].kind, "unknown");
    assert!(r.flags.contains(&Flag::UnknownInSupport {
        output: "y".into(),
        source: "u".into(),
        what: "x literal".into(),
        pos: "sel.v:7:3".into()
    }));
    // The masked unknown source v is neither redundant-flagged nor unused-flagged.
    assert_eq!(r.flags.len(), 1, "{r}");
}

#[test]
fn prove_hint_shows_a_miswired_input() {
    let r = bench("INPUT(s)\nINPUT(d0)\nINPUT(d1)\nINPUT(d2)\nOUTPUT(y)\nn = NOT(s)\np = AND(s, d1)\nq = AND(n, d0)\ny = OR(p, q)\n");
    let c = bench("INPUT(s)\nINPUT(d0)\nINPUT(d1)\nINPUT(d2)\nOUTPUT(y)\nn = NOT(s)\np = AND(s, d2)\nq = AND(n, d0)\ny = OR(p, q)\n");
    let cmp = compare_supports(&r, 0, &c, 0, &Limits::none());
    assert_eq!(cmp.reference, vec!["s", "d0", "d1"]);
    assert_eq!(cmp.candidate, vec!["s", "d0", "d2"]);
    assert_eq!(cmp.only_reference, vec!["d1"]);
    assert_eq!(cmp.only_candidate, vec!["d2"]);
}

#[test]
fn dot_marks_the_masked_input() {
    let d = bench(MASKED);
    let r = audit(&d, &AuditOptions::default(), &Limits::none());
    assert_eq!(r.dot_default_output(), Some("y"));
    let dot = equicone::cone::dot::dot(&d, &r, "y").unwrap();
    assert!(dot.starts_with("digraph cone {"));
    assert!(dot.contains("fillcolor=\"#f4a6a6\""));
}

/// The library audit of a clocked design (registers cut: their outputs read as inputs) does not
/// flag an input that reaches an output only through registers; an input that feeds only a
/// register read by nothing stays flagged, and that register is flagged dead (by the exact cone
/// across cycles, instead of as an unused input). The answer is worked out by hand
/// from the gate lines: `a` reaches `y` through `q1` then `q2` (latency 2), `b` in the same
/// cycle, `c` only the dead register `q3`.
#[test]
fn clocked_audit_keeps_inputs_used_across_cycles() {
    let d = bench(
        "INPUT(a)\nINPUT(b)\nINPUT(c)\nOUTPUT(y)\nq1 = DFF(a)\nq2 = DFF(q1)\nq3 = DFF(c)\ny = AND(q2, b)\n",
    );
    let r = audit(&d, &AuditOptions::default(), &Limits::none());
    let unused: Vec<&str> = r
        .flags
        .iter()
        .filter_map(|f| match f {
            Flag::UnusedInput { input, .. } => Some(input.as_str()),
            _ => None,
        })
        .collect();
    assert_eq!(unused, ["c"], "{r}");
    assert!(
        r.flags.contains(&Flag::DeadRegister {
            register: "q3".to_string(),
            why: "reaches no output".to_string()
        }),
        "{r}"
    );
    let across = r.across_cycles.as_ref().expect("a clocked design");
    assert_eq!(across.outputs[0].inputs.get("a"), Some(&2));
    assert_eq!(across.outputs[0].inputs.get("b"), Some(&0));
    assert_eq!(across.dead_registers, ["q3"]);
    // The text and JSON forms carry the section across cycles.
    assert!(r.to_string().contains("dead registers (1,"), "{r}");
    assert!(r.to_json().contains("\"across_cycles\""));
    // A combinational design has none.
    let comb = audit(&bench(MASKED), &AuditOptions::default(), &Limits::none());
    assert!(comb.across_cycles.is_none());
}

/// ISCAS-89 s27 (shared data, published suite): G2 reaches G17 only through a flip-flop, so
/// the one-cycle audit alone would call it unused; the library audit does not flag it.
#[test]
fn s27_inputs_through_flip_flops_are_not_unused() {
    let Some(dir) = crate::common::iscas_dir() else {
        return;
    };
    let path = dir.join("..").join("iscas89").join("s27.bench");
    let text = std::fs::read_to_string(&path).expect("s27.bench in the shared data");
    let d = equicone::read_bench(&Arc::from("s27.bench"), &text).expect("s27 reads");
    let r = audit(&d, &AuditOptions::default(), &Limits::none());
    assert!(
        !r.flags
            .iter()
            .any(|f| matches!(f, Flag::UnusedInput { .. })),
        "{r}"
    );
    assert_eq!(
        r.across_cycles.as_ref().unwrap().outputs[0]
            .inputs
            .get("G2"),
        Some(&1)
    );
}
