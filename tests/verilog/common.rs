//! Helpers shared by the Verilog tests: reading sources, evaluating designs by port values,
//! and running Icarus Verilog when it is installed.

use equicone::design::Design;
use equicone::front::verilog::read_verilog;
use std::collections::HashMap;
use std::path::{Path, PathBuf};
use std::process::Command;
use std::sync::Arc;

/// Read one source text named `t.v`.
pub fn read(src: &str) -> Design {
    match read_verilog(&[(Arc::from("t.v"), src.to_string())], None) {
        Ok(d) => d,
        Err(e) => panic!("unexpected error reading:\n{src}\n---\n{e}"),
    }
}

/// Read and return the error text.
#[allow(dead_code)]
pub fn read_err(src: &str) -> String {
    match read_verilog(&[(Arc::from("t.v"), src.to_string())], None) {
        Ok(_) => panic!("expected an error for:\n{src}"),
        Err(e) => e.to_string(),
    }
}

/// The repository's test data directory.
pub fn data_dir() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/data/verilog")
}

/// Evaluate `d` with port values by name (bit `k` of the value is offset `k`, LSB first);
/// unknown inputs take `unknown(k)`. Returns each output bit by name.
pub fn eval_ports(
    d: &Design,
    ports: &HashMap<String, u128>,
    unknown: &mut dyn FnMut(usize) -> bool,
) -> HashMap<String, bool> {
    // Offsets of bus bits: rank of the bit within its port, ordered as the reader lists them.
    let mut rank: HashMap<&str, usize> = HashMap::new();
    let mut ins = Vec::with_capacity(d.inputs.len());
    for (k, b) in d.inputs.iter().enumerate() {
        if b.is_unknown() {
            ins.push(unknown(k));
            continue;
        }
        let r = rank.entry(b.port.as_str()).or_insert(0);
        let v = ports
            .get(&b.port)
            .copied()
            .unwrap_or_else(|| panic!("no value for port {}", b.port));
        ins.push((v >> *r) & 1 == 1);
        *r += 1;
    }
    let out = d.eval(&ins);
    d.outputs
        .iter()
        .zip(out)
        .map(|(o, v)| (o.name.clone(), v))
        .collect()
}

/// Whether Icarus Verilog can be used; skips loudly (or fails when required) when it is absent.
pub fn iverilog_available() -> bool {
    let ok = Command::new("iverilog")
        .arg("-V")
        .output()
        .is_ok_and(|o| o.status.success() || !o.stdout.is_empty());
    if !ok {
        if std::env::var("EQUICONE_REQUIRE_IVERILOG").as_deref() == Ok("1") {
            panic!("iverilog is required (EQUICONE_REQUIRE_IVERILOG=1) but was not found");
        }
        eprintln!(
            "SKIPPED: iverilog not found; install Icarus Verilog to run the differential tests"
        );
    }
    ok
}

/// Compile and run `src` (with top module `top`) with Icarus Verilog; returns stdout.
pub fn run_iverilog(src: &str, top: &str) -> String {
    run_iverilog_as(src, top, "-g2005")
}

/// [`run_iverilog`] with another language generation (`-g2012` for SystemVerilog).
pub fn run_iverilog_as(src: &str, top: &str, generation: &str) -> String {
    let dir = tempfile::tempdir().expect("temp dir");
    let v = dir.path().join("tb.v");
    std::fs::write(&v, src).expect("write");
    let out = dir.path().join("tb.vvp");
    let c = Command::new("iverilog")
        .args([generation, "-s", top, "-o"])
        .arg(&out)
        .arg(&v)
        .output()
        .expect("run iverilog");
    assert!(
        c.status.success(),
        "iverilog failed:\n{}\n{}",
        String::from_utf8_lossy(&c.stderr),
        src
    );
    let r = Command::new("vvp")
        .arg("-n")
        .arg(&out)
        .output()
        .expect("run vvp");
    assert!(
        r.status.success(),
        "vvp failed: {}",
        String::from_utf8_lossy(&r.stderr)
    );
    String::from_utf8_lossy(&r.stdout).into_owned()
}

/// The ISCAS-85 folder of the shared benchmark data (../shared, see SOURCE.md there): `None`
/// with a SKIPPED line when it is absent, a failure when EQUICONE_REQUIRE_SHARED=1.
pub fn shared_dir() -> Option<PathBuf> {
    super::oracle::iscas_dir()
}

/// Check `src` (top module `top`, the last in the text) on every input value against Icarus
/// Verilog (`generation`, e.g. `-g2012`): each output, as a number, must equal ours. `ins`
/// and `outs` are the ports with their widths. Returns the number of vectors compared (0
/// when iverilog is absent and not required).
#[allow(dead_code)]
pub fn exhaustive_against_icarus(
    src: &str,
    ins: &[(&str, u32)],
    outs: &[(&str, u32)],
    generation: &str,
) -> usize {
    let last = &src[src.rfind("module ").expect("a module")..];
    let name = last.split(['(', ' ', ';']).nth(1).expect("a module name");
    exhaustive_against_icarus_as(src, src, name, ins, outs, generation)
}

/// [`exhaustive_against_icarus`] with the top module named and the text Icarus reads given
/// apart (`theirs`: the same design written with constructs Icarus reads).
#[allow(dead_code)]
pub fn exhaustive_against_icarus_as(
    src: &str,
    theirs: &str,
    name: &str,
    ins: &[(&str, u32)],
    outs: &[(&str, u32)],
    generation: &str,
) -> usize {
    let d = read(src);
    if !iverilog_available() {
        return 0;
    }
    let total: u32 = ins.iter().map(|p| p.1).sum();
    let mut tb = format!("module tb; reg [{}:0] vin_;\n", total - 1);
    let mut conns = Vec::new();
    let mut off = 0;
    for (p, w) in ins {
        conns.push(format!(".{p}(vin_[{}:{off}])", off + w - 1));
        off += w;
    }
    for (p, w) in outs {
        tb += &format!("wire [{}:0] {p};\n", w - 1);
        conns.push(format!(".{p}({p})"));
    }
    tb += &format!(
        "{name} u({});\ninitial begin vin_ = 0; repeat ({}) begin #1 $display(\"%0d{}\", vin_{}); vin_ = vin_ + 1; end end\nendmodule\n",
        conns.join(", "),
        1u64 << total,
        " %0d".repeat(outs.len()),
        outs.iter().map(|(s, _)| format!(", {s}")).collect::<String>()
    );
    let sim = run_iverilog_as(&format!("{theirs}\n{tb}"), "tb", generation);
    let mut n = 0;
    // Icarus's run-time warnings (a `unique case` value unhandled, or inputs still x at time
    // 0) are skipped; every vector is still counted below.
    for line in sim
        .lines()
        .filter(|l| l.starts_with(|c: char| c.is_ascii_digit()))
    {
        let f: Vec<u128> = line
            .split(' ')
            .map(|x| {
                x.parse()
                    .unwrap_or_else(|_| panic!("{name}: Icarus gave `{line}`"))
            })
            .collect();
        let mut ports = HashMap::new();
        let mut off = 0;
        for (p, w) in ins {
            ports.insert(p.to_string(), (f[0] >> off) & ((1 << w) - 1));
            off += w;
        }
        let bits = eval_ports(&d, &ports, &mut |_| false);
        for (k, (p, w)) in outs.iter().enumerate() {
            let ours = if *w == 1 && bits.contains_key(*p) {
                u128::from(bits[*p])
            } else {
                (0..*w).fold(0, |v, j| v | u128::from(bits[&format!("{p}[{j}]")]) << j)
            };
            assert_eq!(ours, f[k + 1], "{name}: {p} for inputs {line}");
        }
        n += 1;
    }
    assert_eq!(n, 1usize << total, "{name}: vectors simulated");
    n
}
