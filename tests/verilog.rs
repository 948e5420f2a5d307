//! Integration tests of the Verilog front-end.

use equicone::front::verilog::read_verilog;
use std::sync::Arc;

fn read(src: &str) -> equicone::Design {
    match read_verilog(&[(Arc::from("t.v"), src.to_string())], None) {
        Ok(d) => d,
        Err(e) => panic!("{e}"),
    }
}

#[test]
fn smoke() {
    let d = read("module m(input [3:0] a, input [3:0] b, output [4:0] y, output z);\n assign y = a + b;\n and g(z, a[0], b[1]);\nendmodule\n");
    let names: Vec<_> = d.inputs.iter().map(|b| b.name.clone()).collect();
    assert_eq!(names[0], "a[0]");
    let mut ins = vec![false; 8];
    ins[0] = true;
    ins[1] = true;
    ins[2] = true;
    ins[3] = true; // a = 15
    ins[4] = true; // b = 1
    let out = d.eval(&ins);
    assert_eq!(out, vec![false, false, false, false, true, false]);
}
