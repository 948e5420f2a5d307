//! Proofs behind `equivalent`: `prove --proof` writes a refutation of a miter that encodes both
//! designs separately; these tests check it with two checkers that are not the solver: the
//! varisat-checker crate (varisat's own format) and a small DRAT checker written from the DRAT
//! definition (tests/oracle/drat.rs).

mod oracle;

mod runner;
use runner::equicone;

fn prove_with_proof(a: &str, b: &str, extra: &[&str], format: &str) -> (String, Vec<u8>) {
    let dir = tempfile::tempdir().unwrap();
    let p = dir.path().join("proof");
    let ps = p.to_str().unwrap();
    let mut args = vec!["prove", a, b, "--proof", ps, "--proof-format", format];
    args.extend_from_slice(extra);
    let o = equicone(&args);
    assert_eq!(
        o.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&o.stderr)
    );
    let cnf = std::fs::read_to_string(format!("{ps}.cnf")).unwrap();
    (cnf, std::fs::read(&p).unwrap())
}

fn check_varisat(cnf: &str, proof: &[u8]) {
    let mut ch = varisat_checker::Checker::new();
    ch.add_dimacs_cnf(cnf.as_bytes()).unwrap();
    ch.check_proof(proof)
        .unwrap_or_else(|e| panic!("varisat-checker rejected the proof: {e}"));
}

#[test]
fn small_pairs_have_drat_proofs_that_check() {
    let pairs: [(&str, &str, &[&str]); 3] = [
        (
            "bench-circuits/examples/mux4_spec.bench",
            "bench-circuits/examples/mux4_tree.bench",
            &[],
        ),
        (
            "src/demo/files/t7_sensor_sel_spec.v",
            "src/demo/files/t7_sensor_sel_r2.v",
            &["--assume", "sel < 12"],
        ),
        (
            "bench-circuits/examples/mux4_tree.bench",
            "bench-circuits/examples/mux4_spec.bench",
            &[],
        ),
    ];
    for (a, b, extra) in pairs {
        let (cnf, proof) = prove_with_proof(a, b, extra, "drat");
        let n = oracle::drat::check(&cnf, &String::from_utf8(proof.clone()).unwrap())
            .unwrap_or_else(|e| panic!("{a} vs {b}: {e}"));
        eprintln!("{a} vs {b}: {n} lemmas checked");
        let (cnf, proof) = prove_with_proof(a, b, extra, "varisat");
        check_varisat(&cnf, &proof);
    }
}

/// The checker can fail: a proof of a different pair's formula, or a truncated proof, is rejected.
#[test]
fn the_drat_checker_rejects_wrong_proofs() {
    let (cnf, proof) = prove_with_proof(
        "src/demo/files/t7_sensor_sel_spec.v",
        "src/demo/files/t7_sensor_sel_r2.v",
        &["--assume", "sel < 12"],
        "drat",
    );
    let text = String::from_utf8(proof).unwrap();
    let lines: Vec<&str> = text.lines().filter(|l| !l.starts_with('d')).collect();
    let truncated = lines[..lines.len() / 2].join("\n");
    assert!(
        oracle::drat::check(&cnf, &truncated).is_err(),
        "a truncated proof must not check"
    );
    assert!(
        oracle::drat::check(&cnf, "1 2 3 0\n0\n").is_err(),
        "an unfounded clause must not check"
    );
}

/// c499 against c1355 (published equal: Hansen, Yalcin and Hayes 1999): the proof in varisat's
/// format checks with varisat-checker.
#[test]
fn c499_c1355_proof_checks() {
    let Some(dir) = oracle::iscas_dir() else {
        return;
    };
    let (a, b) = (dir.join("c499.bench"), dir.join("c1355.bench"));
    let (cnf, proof) = prove_with_proof(
        a.to_str().unwrap(),
        b.to_str().unwrap(),
        &["--pair-by", "position"],
        "varisat",
    );
    check_varisat(&cnf, &proof);
    assert!(
        cnf.contains("c pair "),
        "output pairs are named in the formula"
    );
}
