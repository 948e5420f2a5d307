//! Run generated Verilog in Icarus Verilog (`iverilog` + `vvp`, a general-purpose simulator):
//! one testbench instantiates every case, applies its vectors and prints the outputs.
//! Skips loudly when iverilog is missing, unless EQUICONE_REQUIRE_IVERILOG=1.

use super::support::{Ports, Vector};
use std::fmt::Write;
use std::process::Command;

/// Whether iverilog can be used; panics when it is required but missing.
pub fn available(test: &str) -> bool {
    let ok = Command::new("iverilog")
        .arg("-V")
        .output()
        .is_ok_and(|o| o.status.success())
        && Command::new("vvp").arg("-V").output().is_ok();
    if !ok {
        if std::env::var("EQUICONE_REQUIRE_IVERILOG").as_deref() == Ok("1") {
            panic!("{test}: iverilog/vvp not found but EQUICONE_REQUIRE_IVERILOG=1");
        }
        eprintln!("SKIPPED {test}: iverilog/vvp not found (install Debian package iverilog; set EQUICONE_REQUIRE_IVERILOG=1 to fail instead)");
    }
    ok
}

/// A module to simulate.
pub struct Case {
    pub module: String,
    pub verilog: String,
    pub ports: Ports,
    pub vectors: Vec<Vector>,
}

fn literal(bits: &[bool]) -> String {
    let s: String = bits
        .iter()
        .rev()
        .map(|&b| if b { '1' } else { '0' })
        .collect();
    format!("{}'b{s}", bits.len())
}

/// Simulate every case; per case, per vector, per output port the printed bits (MSB first).
/// Also returns iverilog's compile messages (warnings).
pub fn run(cases: &[Case]) -> (Vec<Vec<Vec<String>>>, String) {
    let dir = tempfile::tempdir().expect("temp dir");
    let mut src = String::new();
    for c in cases {
        src.push_str(&c.verilog);
        src.push('\n');
    }
    src.push_str("module tb;\n");
    for (k, c) in cases.iter().enumerate() {
        let mut conns = Vec::new();
        for (name, w, scalar) in &c.ports.inputs {
            let range = if *scalar {
                String::new()
            } else {
                format!("[{}:0] ", w - 1)
            };
            let _ = writeln!(src, "  reg {range}c{k}_{name};");
            conns.push(format!(".{name}(c{k}_{name})"));
        }
        for (name, w, scalar) in &c.ports.outputs {
            let range = if *scalar {
                String::new()
            } else {
                format!("[{}:0] ", w - 1)
            };
            let _ = writeln!(src, "  wire {range}c{k}_{name};");
            conns.push(format!(".{name}(c{k}_{name})"));
        }
        let _ = writeln!(src, "  {} u{k} ({});", c.module, conns.join(", "));
    }
    src.push_str("  initial begin\n");
    for (k, c) in cases.iter().enumerate() {
        let fmt: Vec<&str> = c.ports.outputs.iter().map(|_| "%b").collect();
        let args: Vec<String> = c
            .ports
            .outputs
            .iter()
            .map(|o| format!("c{k}_{}", o.0))
            .collect();
        for (j, v) in c.vectors.iter().enumerate() {
            for ((name, _, _), bits) in c.ports.inputs.iter().zip(v) {
                let _ = writeln!(src, "    c{k}_{name} = {};", literal(bits));
            }
            let _ = writeln!(
                src,
                "    #1 $display(\"{k} {j} {}\", {});",
                fmt.join(" "),
                args.join(", ")
            );
        }
    }
    src.push_str("    $finish;\n  end\nendmodule\n");
    let file = dir.path().join("all.v");
    let exe = dir.path().join("all.vvp");
    std::fs::write(&file, &src).expect("write testbench");
    let out = Command::new("iverilog")
        .args(["-g2005", "-Wall", "-o"])
        .arg(&exe)
        .arg(&file)
        .output()
        .expect("run iverilog");
    let messages =
        String::from_utf8_lossy(&out.stderr).to_string() + &String::from_utf8_lossy(&out.stdout);
    assert!(
        out.status.success(),
        "iverilog rejected the generated Verilog:\n{messages}"
    );
    let run = Command::new("vvp")
        .arg("-n")
        .arg(&exe)
        .output()
        .expect("run vvp");
    assert!(
        run.status.success(),
        "vvp failed: {}",
        String::from_utf8_lossy(&run.stderr)
    );
    let mut result: Vec<Vec<Vec<String>>> = cases
        .iter()
        .map(|c| vec![Vec::new(); c.vectors.len()])
        .collect();
    for line in String::from_utf8_lossy(&run.stdout).lines() {
        let mut f = line.split_whitespace();
        let (Some(k), Some(j)) = (f.next(), f.next()) else {
            continue;
        };
        let (Ok(k), Ok(j)) = (k.parse::<usize>(), j.parse::<usize>()) else {
            continue;
        };
        result[k][j] = f.map(str::to_string).collect();
    }
    (result, messages)
}
