//! The preprocessor (IEEE 1364-2005 clause 19): macros with arguments, conditionals,
//! includes through search directories, command-line macros, positions through includes
//! and macro bodies, include loops and recursive macros refused. Icarus Verilog reads the
//! same macro-heavy files and must compute the same outputs.

use super::common::{eval_ports, iverilog_available, run_iverilog};
use equicone::front::verilog::preprocess::Options;
use equicone::front::verilog::read_verilog_with;
use equicone::front::{load, MemoryFiles, Source};
use std::collections::HashMap;
use std::ffi::OsStr;
use std::os::unix::ffi::OsStrExt;
use std::path::{Path, PathBuf};
use std::sync::Arc;

/// Read `dir/file` from the in-memory store `files` (the library opens no file itself).
fn read_in(
    files: &MemoryFiles,
    dir: &Path,
    file: &str,
    opts: &Options,
) -> Result<equicone::Design, String> {
    let src = Source {
        paths: vec![dir.join(file)],
        format: None,
        top: None,
        preprocess: opts.clone(),
    };
    load(&src, files).map_err(|e| e.to_string())
}

fn write(files: &mut MemoryFiles, dir: &Path, file: &str, text: &str) {
    files.insert(dir.join(file), text);
}

/// Write `dir/file` on disk (for the command-line tests).
fn write_disk(dir: &Path, file: &str, text: &str) {
    let p = dir.join(file);
    std::fs::create_dir_all(p.parent().unwrap()).unwrap();
    std::fs::write(p, text).unwrap();
}

const DEFS: &str = "`ifndef DEFS_VH
`define DEFS_VH
`define W 4
`define MAXOF(a, b) ((a) > (b) ? (a) : (b))
`define SUM3(a, b, c = 4'd1) ((a) + (b) + (c))
`define BAD(x) (x +)
`endif
";

const TOP: &str = "`timescale 1ns/1ps
`include \"defs.vh\"
`include \"defs.vh\"
module top(input [`W-1:0] a, b, output [`W-1:0] y, output [`W-1:0] s, output z);
`ifdef USE_MIN
  assign y = (a < b) ? a : b;
`elsif USE_XOR
  assign y = a ^ b;
`else
  assign y = `MAXOF(a, b);
`endif
  assign s = `SUM3(a, b, ) + `SUM3(a, b, 4'd2);
  assign z = `ZV;
endmodule
";

fn value(d: &equicone::Design, a: u128, b: u128, port: &str) -> u128 {
    let ports: HashMap<String, u128> = [("a".to_string(), a), ("b".to_string(), b)].into();
    let bits = eval_ports(d, &ports, &mut |_| false);
    (0..4).fold(0, |v, k| {
        v | (u128::from(bits.get(&format!("{port}[{k}]")).copied().unwrap_or(false)) << k)
    })
}

#[test]
fn macros_conditionals_and_search_directories() {
    let dir = Path::new("proj");
    let mut files = MemoryFiles::new();
    write(&mut files, dir, "inc/defs.vh", DEFS);
    write(&mut files, dir, "top.v", TOP);
    let base = Options {
        include_dirs: vec![dir.join("inc")],
        defines: vec![("ZV".into(), "1'b1".into())],
        keep_written: false,
    };
    for (extra, f) in [
        (
            None,
            (|a: u128, b: u128| a.max(b)) as fn(u128, u128) -> u128,
        ),
        (Some("USE_MIN"), |a, b| a.min(b)),
        (Some("USE_XOR"), |a, b| a ^ b),
    ] {
        let mut o = base.clone();
        o.defines
            .extend(extra.map(|n| (n.to_string(), String::new())));
        let d = read_in(&files, dir, "top.v", &o).unwrap();
        for a in 0..16 {
            for b in 0..16 {
                assert_eq!(value(&d, a, b, "y"), f(a, b), "{extra:?} a={a} b={b}");
                assert_eq!(
                    value(&d, a, b, "s"),
                    (2 * a + 2 * b + 3) % 16,
                    "a={a} b={b}"
                );
            }
        }
    }
    // Without -I the header is not found: one error per include, none for its macros.
    let e = read_in(&files, dir, "top.v", &Options::default()).unwrap_err();
    assert!(
        e.contains("top.v:2:1: error: cannot find the included file `defs.vh`"),
        "{e}"
    );
    assert!(
        e.contains("help: give the directory that holds it with -I DIR"),
        "{e}"
    );
    assert!(!e.contains("undefined macro"), "{e}");
    // Without ZV: the use is named.
    let o = Options {
        include_dirs: base.include_dirs.clone(),
        defines: vec![],
        keep_written: false,
    };
    let e = read_in(&files, dir, "top.v", &o).unwrap_err();
    assert!(e.contains("top.v:13:14: error: undefined macro `ZV"), "{e}");
}

#[test]
fn positions_point_into_the_included_file_and_the_macro_body() {
    let dir = Path::new("proj");
    let mut files = MemoryFiles::new();
    write(&mut files, dir, "defs.vh", DEFS);
    write(
        &mut files,
        dir,
        "bad.v",
        "`include \"defs.vh\"\nmodule m(input [3:0] a, output y);\n  assign y = `BAD(a);\nendmodule\n",
    );
    let e = read_in(&files, dir, "bad.v", &Options::default()).unwrap_err();
    // The `)` that ends the body of BAD, on line 6 column 20 of defs.vh.
    assert!(
        e.contains("defs.vh:6:20: error: expected an expression"),
        "{e}"
    );
    // An error in the text after an include and a macro use still has its own line.
    write(
        &mut files,
        dir,
        "late.v",
        "`include \"defs.vh\"\nmodule m(input [`W-1:0] a, output y);\n  assign y = `MAXOF(a, 1) & ;\nendmodule\n",
    );
    let e = read_in(&files, dir, "late.v", &Options::default()).unwrap_err();
    assert!(
        e.contains("late.v:3:29: error: expected an expression, found `;`"),
        "{e}"
    );
    // Elaboration errors too: an undeclared name passed as a macro argument.
    write(
        &mut files,
        dir,
        "elab.v",
        "`include \"defs.vh\"\nmodule m(input [3:0] a, output [3:0] y);\n  assign y =\n    `MAXOF(a, nope);\nendmodule\n",
    );
    let e = read_in(&files, dir, "elab.v", &Options::default()).unwrap_err();
    assert!(e.contains("elab.v:4:15: error:"), "{e}");
    assert!(e.contains("nope"), "{e}");
}

#[test]
fn include_loops_recursive_macros_and_stray_directives_are_errors() {
    let dir = Path::new("proj");
    let mut files = MemoryFiles::new();
    write(&mut files, dir, "one.vh", "`include \"two.vh\"\n");
    write(&mut files, dir, "two.vh", "`include \"one.vh\"\n");
    write(
        &mut files,
        dir,
        "loop.v",
        "`include \"one.vh\"\nmodule m(output y); assign y = 1; endmodule\n",
    );
    let e = read_in(&files, dir, "loop.v", &Options::default()).unwrap_err();
    assert!(e.contains("two.vh:1:1: error: include loop:"), "{e}");
    assert!(e.contains("one.vh includes"), "{e}");
    let cases = [
        ("`define A (1 + `A)\nmodule m(output y); assign y = `A; endmodule\n", "t.v:1:16: error: macro recursion: `A uses `A"),
        ("`define A `B\n`define B (`A)\nmodule m(output y); assign y = `A; endmodule\n", "t.v:2:12: error: macro recursion: `A uses `B uses `A"),
        ("`endif\nmodule m(output y); assign y = 1; endmodule\n", "t.v:1:1: error: `endif without an open `ifdef"),
        ("`ifdef X\nmodule m(output y); assign y = 1; endmodule\n", "t.v:1:1: error: this `ifdef/`ifndef has no `endif"),
        ("`define F(a, b) (a & b)\nmodule m(output y); assign y = `F(1, 1, 1); endmodule\n", "t.v:2:32: error: macro `F takes 2 arguments, 3 given"),
        ("`define F(a, b) (a & b)\nmodule m(output y); assign y = `F; endmodule\n", "t.v:2:32: error: macro `F needs its arguments in parentheses"),
        // Doubling at each of 40 levels would give 2^40 copies: stopped.
        ("`define L0 1\n`define L1 `L0+`L0\n`define L2 `L1+`L1\n`define L3 `L2+`L2\n`define L4 `L3+`L3\n`define L5 `L4+`L4\n`define L6 `L5+`L5\n`define L7 `L6+`L6\n`define L8 `L7+`L7\n`define L9 `L8+`L8\n`define L10 `L9+`L9\n`define L11 `L10+`L10\n`define L12 `L11+`L11\n`define L13 `L12+`L12\n`define L14 `L13+`L13\n`define L15 `L14+`L14\n`define L16 `L15+`L15\n`define L17 `L16+`L16\n`define L18 `L17+`L17\n`define L19 `L18+`L18\n`define L20 `L19+`L19\n`define L21 `L20+`L20\n`define L22 `L21+`L21\n`define L23 `L22+`L22\n`define L24 `L23+`L23\n`define L25 `L24+`L24\nmodule m(output [31:0] y); assign y = `L25; endmodule\n", "error: macro expansion produces more than 64 MiB of text"),
    ];
    for (src, want) in cases {
        let r = read_verilog_with(
            &[(Arc::from("t.v"), src.to_string())],
            None,
            &Options::default(),
        );
        let e = r.err().map(|e| e.to_string()).unwrap_or_default();
        assert!(e.contains(want), "{src}\n---\n{e}");
    }
}

#[test]
fn the_command_line_takes_include_directories_and_macros() {
    let dir = tempfile::tempdir().unwrap();
    write_disk(dir.path(), "inc/defs.vh", DEFS);
    write_disk(dir.path(), "top.v", TOP);
    let exe = env!("CARGO_BIN_EXE_equicone");
    let top = dir.path().join("top.v");
    let inc = dir.path().join("inc");
    let out = std::process::Command::new(exe)
        .args([
            "eval", "--set", "a=5", "--set", "b=9", "-D", "ZV=1'b0", "--define", "USE_XOR", "-I",
        ])
        .arg(&inc)
        .arg(&top)
        .output()
        .unwrap();
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(
        out.status.success(),
        "{text}{}",
        String::from_utf8_lossy(&out.stderr)
    );
    assert!(text.contains("y[3:0]=4'b1100 (12)"), "{text}");
    assert!(text.contains("z=0"), "{text}");
    let out = std::process::Command::new(exe)
        .args(["prove", "-D", "ZV=1", "-I"])
        .arg(&inc)
        .arg(&top)
        .arg(&top)
        .output()
        .unwrap();
    assert_eq!(
        out.status.code(),
        Some(0),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let out = std::process::Command::new(exe)
        .args(["stats", "-D", "9X=1"])
        .arg(&top)
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(2));
}

/// A design folder whose name is not UTF-8 (the byte 0xff): the include beside the design
/// and one through `-I` are found, since paths are kept as paths from the caller to the
/// file store (a lossy name, `d\u{fffd}`, would name another folder).
#[test]
fn includes_are_found_in_a_folder_whose_name_is_not_utf8() {
    let folder = Path::new(OsStr::from_bytes(b"d\xff"));
    assert!(folder.to_str().is_none());
    // The library, with the files in memory.
    let mut files = MemoryFiles::new();
    write(&mut files, folder, "defs.vh", DEFS);
    write(&mut files, folder, "top.v", TOP);
    let o = Options {
        defines: vec![("ZV".into(), "1'b1".into())],
        ..Options::default()
    };
    let d = read_in(&files, folder, "top.v", &o).unwrap();
    assert_eq!(value(&d, 3, 9, "y"), 9);
    // An include found through the other folder's name is not the lossy name's.
    let mut lossy = MemoryFiles::new();
    write(&mut lossy, Path::new("d\u{fffd}"), "defs.vh", DEFS);
    write(&mut lossy, folder, "top.v", TOP);
    let e = read_in(&lossy, folder, "top.v", &o).unwrap_err();
    assert!(e.contains("cannot find the included file `defs.vh`"), "{e}");
    // The command line, on disk: beside the design, and in a -I folder of that name.
    let dir = tempfile::tempdir().unwrap();
    let here: PathBuf = dir.path().join(folder);
    write_disk(&here, "defs.vh", DEFS);
    write_disk(&here, "top.v", TOP);
    write_disk(&here, "inc/defs.vh", DEFS);
    write_disk(&here, "sub/top.v", TOP);
    let exe = env!("CARGO_BIN_EXE_equicone");
    for (top, inc) in [
        (here.join("top.v"), None),
        (here.join("sub/top.v"), Some(here.join("inc"))),
    ] {
        let mut cmd = std::process::Command::new(exe);
        cmd.args(["eval", "--set", "a=5", "--set", "b=9", "-D", "ZV=1'b1"]);
        if let Some(inc) = &inc {
            cmd.arg("-I").arg(inc);
        }
        let out = cmd.arg(&top).output().unwrap();
        let text = String::from_utf8_lossy(&out.stdout);
        assert!(
            out.status.success(),
            "{text}{}",
            String::from_utf8_lossy(&out.stderr)
        );
        assert!(text.contains("y[3:0]=4'b1001 (9)"), "{text}");
    }
}

/// Icarus Verilog 11 reads the same files (its own preprocessor, `-I` and `-D`) and must
/// compute the same outputs for every input value.
#[test]
fn icarus_verilog_expands_the_macros_the_same_way() {
    if !iverilog_available() {
        return;
    }
    let mut src = DEFS.replace("`define BAD(x) (x +)\n", "");
    src += &TOP
        .replace("`include \"defs.vh\"\n", "")
        .replace("`ZV", "1'b1");
    let design = src.clone();
    src += "module tb; reg [3:0] a, b; wire [3:0] y, s; wire z; top t(a, b, y, s, z);
integer i; initial for (i = 0; i < 256; i = i + 1) begin {a, b} = i; #1 $display(\"%0d %0d %0d %0d\", a, b, y, s); end
endmodule\n";
    let out = run_iverilog(&src, "tb");
    let d = read_verilog_with(&[(Arc::from("t.v"), design)], None, &Options::default()).unwrap();
    let mut n = 0;
    for line in out.lines() {
        let v: Vec<u128> = line.split(' ').map(|x| x.parse().unwrap()).collect();
        assert_eq!(value(&d, v[0], v[1], "y"), v[2], "{line}");
        assert_eq!(value(&d, v[0], v[1], "s"), v[3], "{line}");
        n += 1;
    }
    assert_eq!(n, 256);
}
