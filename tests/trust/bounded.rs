//! The diagnosis of a difference is bounded: its own time share (`--diagnosis-time`, 0 turns it
//! off), reported as partial when cut, its seconds in the figures line.

use crate::common::*;

fn selectors(d: &std::path::Path) -> (String, String) {
    let r = d.join("s.v");
    let c = d.join("sb.v");
    let (r, c) = (
        r.to_str().unwrap().to_string(),
        c.to_str().unwrap().to_string(),
    );
    for (out, bug) in [(&r, None), (&c, Some("swap"))] {
        let mut args = vec![
            "gen", "selector", "--n", "1024", "--style", "tree", "-o", out,
        ];
        if let Some(b) = bug {
            args.extend(["--bug", b]);
        }
        let o = equicone(&args);
        assert_eq!(code(&o), 0, "{}", stderr(&o));
    }
    (r, c)
}

#[test]
fn the_diagnosis_has_its_own_share_and_says_when_it_was_cut() {
    let d = scratch("diag");
    let (r, c) = selectors(&d);
    // Off: no diagnosis at all, the verdict unchanged.
    let o = equicone(&["prove", &r, &c, "--diagnosis-time", "0", "--json"]);
    assert_eq!(code(&o), 1);
    let v: serde_json::Value = serde_json::from_str(&stdout(&o)).unwrap();
    assert!(v.get("diagnosis").is_none());
    // A share far too small for 1024 route proofs per design: partial, and said so.
    let o = equicone(&["prove", &r, &c, "--diagnosis-time", "0.001", "--json"]);
    assert_eq!(code(&o), 1);
    let v: serde_json::Value = serde_json::from_str(&stdout(&o)).unwrap();
    assert_eq!(v["diagnosis"]["partial"], true, "{}", stdout(&o));
    assert!(v["diagnosis"]["seconds"].as_f64().is_some());
    let o = equicone(&["prove", &r, &c, "--diagnosis-time", "0.001"]);
    let text = stdout(&o);
    assert!(
        text.contains("\ndiagnosis   partial: a limit cut it"),
        "{text}"
    );
    assert!(!text.contains("the same inputs on both sides"), "{text}");
    let figures = text.lines().find(|l| l.starts_with("figures")).unwrap();
    assert!(figures.contains("; diagnosis "), "{figures}");
    let o = equicone(&["prove", &r, &c, "--diagnosis-time", "-1"]);
    assert_eq!(code(&o), 2);
    assert!(stderr(&o).contains("--diagnosis-time -1 is not a number of seconds"));
}

/// Flags that repeat per bit are grouped by bus: the demo's redundant `test_mode`, and the
/// unused bits of an input bus.
#[test]
fn repeated_flags_are_grouped_by_bus() {
    let o = equicone(&["cone", "src/demo/files/t7_sensor_sel_r2.v"]);
    assert_eq!(code(&o), 1);
    let text = stdout(&o);
    assert!(
        text.contains("  redundant input: y[0..7] (8 bits) do not depend on test_mode, which is wired into each one's cone (sat: unsat)\n"),
        "{text}"
    );
    assert_eq!(text.matches("redundant input:").count(), 1, "{text}");
    let d = scratch("unused");
    let f = write(
        &d,
        "u.v",
        "module u(input [3:0] a, input b, output y);\nassign y = b;\nendmodule\n",
    );
    let o = equicone(&["cone", &f]);
    assert_eq!(code(&o), 1);
    assert!(
        stdout(&o).contains("  unused inputs: a[0..3] (4 bits) are not connected to any output\n"),
        "{}",
        stdout(&o)
    );
}
