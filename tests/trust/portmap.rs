//! `--port-map FILE`: renamed buses and single bits paired by a file, the rest by name, in
//! `prove` and `cnf`; errors at file:line:column. The counterexample of a swapped bus is
//! driven into both designs by Icarus Verilog (Debian package iverilog) under each design's
//! own names, and the `cnf` miter is solved by batsat (crates.io), both outside the project.

use crate::common::*;
use crate::vcommon::{iverilog_available, run_iverilog};

const REFERENCE: &str =
    "module r(input [3:0] data, input en, input [1:0] k, output [3:0] y, output ok);
assign y = en ? data : 4'd0;
assign ok = ^data & k[0] & ~k[1];
endmodule
";
/// `data` renamed `din` and declared ascending, `en` renamed `enable`, bus `k` split into
/// two single bits, output `ok` renamed `good`.
const CANDIDATE: &str =
    "module c(input [0:3] din, input enable, input k_lo, input k_hi, output [3:0] y, output good);
assign y = enable ? {din[0], din[1], din[2], din[3]} : 4'd0;
assign good = ^din & k_lo & ~k_hi;
endmodule
";
/// As [`CANDIDATE`] with the two least significant bits of `din` crossed on `y`.
const SWAPPED: &str =
    "module c(input [0:3] din, input enable, input k_lo, input k_hi, output [3:0] y, output good);
assign y = enable ? {din[0], din[1], din[3], din[2]} : 4'd0;
assign good = ^din & k_lo & ~k_hi;
endmodule
";
const MAP: &str =
    "# renamed ports\ndata din\nen enable   # one bit\nk[0] k_lo\nk[1] k_hi\nok good\n";

/// `NAME[..]=W'b.... (N)` and `NAME=V` items of a printed line: (NAME, N).
fn numbers(line: &str) -> Vec<(String, u64)> {
    let mut out = Vec::new();
    let words: Vec<&str> = line.split_whitespace().collect();
    for (k, w) in words.iter().enumerate() {
        if let Some((name, _)) = w.split_once('[').filter(|_| w.contains("'b")) {
            let n = words[k + 1].trim_matches(|c| c == '(' || c == ')');
            out.push((name.to_string(), n.parse().unwrap()));
        } else if let Some((name, v)) = w.split_once('=') {
            out.push((name.to_string(), v.parse().unwrap()));
        }
    }
    out
}

#[test]
fn a_port_map_pairs_renamed_buses_and_bits() {
    let d = scratch("portmap");
    let r = write(&d, "r.v", REFERENCE);
    let c = write(&d, "c.v", CANDIDATE);
    let m = write(&d, "m.map", MAP);
    // Without the map the names do not meet.
    let o = equicone(&["prove", &r, &c]);
    assert_eq!(code(&o), 2, "{}", stdout(&o));
    let o = equicone(&["prove", &r, &c, "--port-map", &m]);
    assert_eq!(code(&o), 0, "{}{}", stdout(&o), stderr(&o));
    let text = stdout(&o);
    assert!(
        text.contains("pairing     by name (renamed bits by the port map "),
        "{text}"
    );
    // The bus pairs by significance: data[0] with din[3].
    assert!(
        text.contains(
            "  inputs   data[3:0] <-> din[0:3], en <-> enable, k[0] <-> k_lo, k[1] <-> k_hi\n"
        ),
        "{text}"
    );
    assert!(text.contains("  outputs  ok <-> good\n"), "{text}");
    assert!(text.contains("  y[3]         equivalent"), "{text}");
    // The JSON names the map.
    let j = equicone(&["prove", &r, &c, "--port-map", &m, "--json"]);
    let v: serde_json::Value = serde_json::from_slice(&j.stdout).unwrap();
    assert!(v["port_map"].as_str().unwrap().ends_with("m.map"));
    assert_eq!(v["paired"].as_array().unwrap().len(), 5, "{v}");
}

#[test]
fn a_difference_under_a_port_map_replays_in_icarus_by_both_names() {
    let d = scratch("portmap-diff");
    let r = write(&d, "r.v", REFERENCE);
    let c = write(&d, "c.v", SWAPPED);
    let m = write(&d, "m.map", MAP);
    let o = equicone(&["prove", &r, &c, "--port-map", &m]);
    assert_eq!(code(&o), 1, "{}{}", stdout(&o), stderr(&o));
    let text = stdout(&o);
    let lines: Vec<&str> = text.lines().collect();
    let at = lines
        .iter()
        .position(|l| *l == "  inputs, by the reference's names")
        .expect("reference names");
    let rv = numbers(lines[at + 1]);
    assert_eq!(lines[at + 2], "  the same inputs, by the candidate's names");
    let cv = numbers(lines[at + 3]);
    assert_eq!(rv.len(), 3, "{text}");
    assert_eq!(cv.len(), 4, "{text}");
    // `eval --vector` of the JSON report replays on each design by its own names.
    let j = equicone(&["prove", &r, &c, "--port-map", &m, "--json"]);
    let report = write(&d, "out.json", &stdout(&j));
    for design in [&r, &c] {
        let e = equicone(&["eval", design, "--vector", &report]);
        assert_eq!(code(&e), 0, "{}", stderr(&e));
    }
    if !iverilog_available() {
        return;
    }
    let set = |vals: &[(String, u64)]| -> String {
        vals.iter()
            .map(|(n, v)| format!("  {n} = {v};\n"))
            .collect()
    };
    let tb = format!(
        "{REFERENCE}{SWAPPED}module equicone_tb;\nreg [3:0] data; reg en; reg [1:0] k;\nreg [0:3] din; reg enable, k_lo, k_hi;\nwire [3:0] yr, yc; wire okr, okc;\nr ur(.data(data), .en(en), .k(k), .y(yr), .ok(okr));\nc uc(.din(din), .enable(enable), .k_lo(k_lo), .k_hi(k_hi), .y(yc), .good(okc));\ninitial begin\n{}{}  #1 $display(\"%b %b %b %b\", yr, yc, okr, okc);\nend\nendmodule\n",
        set(&rv),
        set(&cv)
    );
    let out = run_iverilog(&tb, "equicone_tb");
    let got: Vec<&str> = out.split_whitespace().collect();
    assert_eq!(got.len(), 4, "{out}");
    // The outputs the report calls different differ in Icarus, the others agree.
    for (bit, name) in ["y[0]", "y[1]", "y[2]", "y[3]"].iter().enumerate() {
        let k = 3 - bit;
        let differs = got[0].as_bytes()[k] != got[1].as_bytes()[k];
        let reported = text.contains(&format!("    {name}  "));
        assert_eq!(differs, reported, "{name}: Icarus {out} vs report\n{text}");
    }
    assert_eq!(got[2], got[3], "{out}");
}

#[test]
fn cnf_pairs_by_the_port_map() {
    let d = scratch("portmap-cnf");
    let r = write(&d, "r.v", REFERENCE);
    let m = write(&d, "m.map", MAP);
    for (cand, satisfiable) in [(CANDIDATE, false), (SWAPPED, true)] {
        let c = write(&d, "c.v", cand);
        let f = d.join("m.cnf");
        let o = equicone(&["cnf", &r, &c, "--port-map", &m, "-o", f.to_str().unwrap()]);
        assert_eq!(code(&o), 0, "{}", stderr(&o));
        let text = std::fs::read_to_string(&f).unwrap();
        // batsat, a SAT solver outside the project: satisfiable exactly when they differ.
        assert_eq!(batsat_satisfiable(&text), satisfiable, "{cand}");
    }
}

#[test]
fn port_map_errors_point_into_the_file() {
    let d = scratch("portmap-errors");
    let r = write(&d, "r.v", REFERENCE);
    let c = write(&d, "c.v", CANDIDATE);
    let m = write(
        &d,
        "bad.map",
        "data din\nen[0] enable\nk k_lo\nok\nok good extra\n",
    );
    let o = equicone(&["prove", &r, &c, "--port-map", &m]);
    assert_eq!(code(&o), 2);
    let e = stderr(&o);
    assert!(
        e.contains("bad.map:4:1: error: a line of a port map needs two names"),
        "{e}"
    );
    assert!(
        e.contains("bad.map:5:9: error: unexpected `extra` after the two names"),
        "{e}"
    );
    let m = write(&d, "bad2.map", "data din\nen[0] enable\nk k_lo\n");
    let o = equicone(&["cnf", &r, &c, "--port-map", &m, "-o", "/dev/null"]);
    assert_eq!(code(&o), 2);
    let e = stderr(&o);
    assert!(
        e.contains("bad2.map:2:1: error: the reference has no port or bit `en[0]`"),
        "{e}"
    );
    assert!(
        e.contains(
            "bad2.map:3:1: error: `k` has 2 bits in the reference but `k_lo` 1 in the candidate"
        ),
        "{e}"
    );
    assert!(e.contains("help: "), "{e}");
    // A map cannot be mixed with pairing by position.
    let m = write(&d, "m.map", MAP);
    let o = equicone(&["prove", &r, &c, "--port-map", &m, "--pair-by", "position"]);
    assert_eq!(code(&o), 2);
    let o = equicone(&[
        "prove",
        &r,
        &c,
        "--port-map",
        &d.join("none.map").to_string_lossy(),
    ]);
    assert_eq!(code(&o), 2);
    assert!(stderr(&o).contains("no such file"), "{}", stderr(&o));
}
