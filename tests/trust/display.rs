//! Display: pairing by position printed by bus, counterexamples with both sides' names,
//! replay on the candidate, `<->` for "paired with", wide values in hexadecimal, negative
//! numbers for `--set`.

use crate::common::*;

const P1: &str = "module p1(input [3:0] a, input s, output [1:0] y);\nassign y = s ? a[3:2] : a[1:0];\nendmodule\n";
const P2: &str = "module p2(input [0:3] b, input t, output [1:0] z);\nassign z = t ? {b[0], b[1]} : {b[3], b[3]};\nendmodule\n";

#[test]
fn position_pairing_prints_the_pairing_and_both_names() {
    let d = scratch("position");
    let (r, c) = (write(&d, "p1.v", P1), write(&d, "p2.v", P2));
    let o = equicone(&["prove", &r, &c, "--pair-by", "position"]);
    assert_eq!(code(&o), 1);
    let text = stdout(&o);
    for want in [
        "  inputs   a[3:0] <-> b[0:3], s <-> t\n",
        "  outputs  y[1:0] <-> z[1:0]\n",
        "  y[1] <-> z[1]  different",
        "  inputs, by the reference's names\n",
        "  the same inputs, by the candidate's names\n",
    ] {
        assert!(text.contains(want), "missing {want:?} in\n{text}");
    }
    // Supports compared by paired bits: y[1] reads a[3] and a[1] (s=0 path); z[1] reads
    // b[0] (= a[3]) and b[3] (= a[0]): the difference is a[1] against b[3], not every bit.
    assert!(
        text.contains("    read by the reference only: a[1]\n"),
        "{text}"
    );
    assert!(
        text.contains("    read by the candidate only: b[3]\n"),
        "{text}"
    );
}

/// `eval --vector` of a position-paired report on the candidate uses the candidate's names
/// and reproduces the candidate's printed output; an unknown name is an error.
#[test]
fn eval_vector_replays_on_the_candidate_by_its_names() {
    let d = scratch("vector");
    let (r, c) = (write(&d, "p1.v", P1), write(&d, "p2.v", P2));
    let o = equicone(&["prove", &r, &c, "--pair-by", "position", "--json"]);
    assert_eq!(code(&o), 1);
    let json = write(&d, "out.json", &stdout(&o));
    let v: serde_json::Value = serde_json::from_str(&stdout(&o)).unwrap();
    let diff = &v["counterexamples"][0]["differing"][0];
    let (rv, cv) = (
        diff["reference_value"].as_bool().unwrap(),
        diff["candidate_value"].as_bool().unwrap(),
    );
    let bit = |text: &str, name: &str| -> bool {
        // `y[1:0]=2'bXY (N)`: bit 1 is X.
        let pat = format!("{name}[1:0]=2'b");
        let at = text.find(&pat).expect("output printed") + pat.len();
        &text[at..at + 1] == "1"
    };
    let e = equicone(&["eval", &c, "--vector", &json]);
    assert_eq!(code(&e), 0, "{}", stderr(&e));
    assert_eq!(bit(&stdout(&e), "z"), cv, "{}", stdout(&e));
    let e = equicone(&["eval", &r, "--vector", &json]);
    assert_eq!(code(&e), 0, "{}", stderr(&e));
    assert_eq!(bit(&stdout(&e), "y"), rv, "{}", stdout(&e));
    // The reference's names do not fit the candidate.
    let e = equicone(&["eval", &c, "--vector", &json, "--side", "reference"]);
    assert_eq!(code(&e), 2);
    assert!(
        stderr(&e).contains("the design has no input `a[0]`"),
        "{}",
        stderr(&e)
    );
    let bad = write(&d, "bad.json", "{\"a[0]\": 1, \"q\": 0}");
    let e = equicone(&["eval", &r, "--vector", &bad, "--rest", "0"]);
    assert_eq!(code(&e), 2);
    assert!(
        stderr(&e).contains("`--vector ") && stderr(&e).contains("the design has no input `q`")
    );
}

#[test]
fn wide_values_show_hexadecimal_and_negative_numbers_set_twos_complement() {
    let d = scratch("wide");
    let w = write(
        &d,
        "w.v",
        "module w(input signed [19:0] a, output [19:0] y);\nassign y = a;\nendmodule\n",
    );
    let e = equicone(&["eval", &w, "--set", "a=0xabcde"]);
    assert_eq!(code(&e), 0, "{}", stderr(&e));
    // 0xabcde = 703710 (from memory: 10*65536 + 11*4096 + 12*256 + 13*16 + 14).
    assert!(
        stdout(&e).contains("y[19:0]=20'b1010_1011_1100_1101_1110 (20'ha_bcde = 703710)"),
        "{}",
        stdout(&e)
    );
    let e = equicone(&["eval", &w, "--set", "a=-2"]);
    assert_eq!(code(&e), 0, "{}", stderr(&e));
    assert!(
        stdout(&e).contains("y[19:0]=20'b1111_1111_1111_1111_1110 (20'hf_fffe = 1048574)"),
        "{}",
        stdout(&e)
    );
    let e = equicone(&["eval", &w, "--set", "a=-524289"]);
    assert_eq!(code(&e), 2);
    assert!(stderr(&e)
        .contains("does not fit in 20 bits as a two's complement number (at least -524288)"));
}

/// Issue 13 D: `cone --dot` of Verilog RTL labels the gates with the nets written in the source
/// (a node that is a net inverted as `~net`), the same picture every run.
#[test]
fn dot_of_verilog_names_the_nets_as_written() {
    let d = scratch("dot-names");
    let v = write(
        &d,
        "w.v",
        "module w(input a, input b, input c, input [1:0] k, output y);\n  wire t1;\n  wire [1:0] t2;\n  reg r;\n  assign t1 = a & b;\n  assign t2 = {~(t1 | c), k[0] & k[1]};\n  always @* r = t2[1] ^ t2[0];\n  assign y = r ^ a;\nendmodule\n",
    );
    let dot = d.join("w.dot");
    let dot = dot.to_str().unwrap();
    let o = equicone(&["cone", &v, "--dot", dot]);
    assert_eq!(code(&o), 0, "{}", stderr(&o));
    let first = std::fs::read_to_string(dot).unwrap();
    for name in ["t1\\n", "t2[1]\\n", "t2[0]\\n", "r\\n", "y\\n"] {
        assert!(
            first.contains(&format!("label=\"{name}"))
                || first.contains(&format!("label=\"~{name}")),
            "{name} missing:\n{first}"
        );
    }
    let o = equicone(&["cone", &v, "--dot", dot]);
    assert_eq!(code(&o), 0);
    assert_eq!(std::fs::read_to_string(dot).unwrap(), first);
}
