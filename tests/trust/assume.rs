//! `--assume` over a pin of the candidate alone (a scan pin), and `cnf --assume`: the formula
//! asserts the assumptions and records them in its comments, and so does the `--proof` CNF.

use crate::common::*;

/// The reference `y = a[0] & b`; the candidate adds a scan pin that selects `a[1]` instead.
fn scan_pair(d: &std::path::Path) -> (String, String) {
    let r = write(
        d,
        "r.v",
        "module r(input [1:0] a, input b, output y);\nassign y = a[0] & b;\nendmodule\n",
    );
    let c = write(
        d,
        "c.v",
        "module c(input [1:0] a, input b, input scan, output y);\nassign y = scan ? a[1] : (a[0] & b);\nendmodule\n",
    );
    (r, c)
}

#[test]
fn a_candidate_only_pin_can_be_tied_by_an_assumption() {
    let d = scratch("scan");
    let (r, c) = scan_pair(&d);
    let free = ["--free-extra-inputs"];
    let o = equicone(
        &[
            &["prove", &r, &c][..],
            &free[..],
            &["--assume", "scan == 0"],
        ]
        .concat(),
    );
    assert_eq!(code(&o), 0, "{}{}", stdout(&o), stderr(&o));
    assert!(stdout(&o).contains("assuming    scan == 0"));
    // Without the assumption the scan pin makes a difference.
    let o = equicone(&[&["prove", &r, &c][..], &free[..]].concat());
    assert_eq!(code(&o), 1, "{}", stdout(&o));
    // Tied the other way it differs too.
    let o = equicone(&[&["prove", &r, &c][..], &free[..], &["--assume", "scan"]].concat());
    assert_eq!(code(&o), 1, "{}", stdout(&o));
    // A name neither design has is still an error.
    let o = equicone(&[&["prove", &r, &c][..], &free[..], &["--assume", "scn == 0"]].concat());
    assert_eq!(code(&o), 2);
    assert!(
        stderr(&o).contains("undeclared name `scn`"),
        "{}",
        stderr(&o)
    );
}

/// `cnf --assume`: satisfiable (a difference exists) without the assumption, unsatisfiable
/// with it, decided by batsat reading the file; the comments name each assumption.
#[test]
fn cnf_asserts_and_records_the_assumptions() {
    let d = scratch("cnf");
    let (r, c) = scan_pair(&d);
    let out = d.join("m.cnf");
    let out = out.to_str().unwrap();
    let base = ["cnf", &r, &c, "--free-extra-inputs", "-o", out];
    let o = equicone(&base);
    assert_eq!(code(&o), 0, "{}", stderr(&o));
    let text = std::fs::read_to_string(out).unwrap();
    assert!(batsat_satisfiable(&text));
    assert!(!text.contains("c assume"));
    let o = equicone(&[&base[..], &["--assume", "scan == 0", "--assume", "b | !b"]].concat());
    assert_eq!(code(&o), 0, "{}", stderr(&o));
    let text = std::fs::read_to_string(out).unwrap();
    assert!(!batsat_satisfiable(&text), "{text}");
    assert!(text.contains("c assume scan == 0\nc assume b | !b\nc assumptions "));
}

/// The `--proof` formula records the assumptions it asserts.
#[test]
fn the_proof_cnf_records_the_assumptions() {
    let d = scratch("proof");
    let (r, c) = scan_pair(&d);
    let p = d.join("p.drat");
    let p = p.to_str().unwrap();
    let o = equicone(&[
        "prove",
        &r,
        &c,
        "--free-extra-inputs",
        "--assume",
        "scan == 0",
        "--proof",
        p,
    ]);
    assert_eq!(code(&o), 0, "{}", stderr(&o));
    let cnf = std::fs::read_to_string(format!("{p}.cnf")).unwrap();
    assert!(cnf.contains("c assume scan == 0\nc assumptions "), "{cnf}");
    assert!(!batsat_satisfiable(&cnf));
}
