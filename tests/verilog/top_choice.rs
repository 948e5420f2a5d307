//! The top module of a design read with library files (`--also`, `--ref-also`,
//! `--cand-also`): a cell library holds cells nobody instantiates, so the first file's one
//! uninstantiated module is the top, and the report says which module was chosen (text and
//! JSON); the top-module options still choose another.

use super::runner::{code, equicone_in};

const REF: &str = "module dec(input [1:0] a, input en, output [3:0] y);
  assign y = en ? (4'b0001 << a) : 4'b0000;
endmodule
";

/// The decoder from library cells (a selector cell of the library is unused).
const NET: &str = "module dec(input [1:0] a, input en, output [3:0] y);
  wire n0, n1;
  INVX1 i0 (.A(a[0]), .Y(n0));
  INVX1 i1 (.A(a[1]), .Y(n1));
  AND3X1 g0 (.A(n1), .B(n0), .C(en), .Y(y[0]));
  AND3X1 g1 (.A(n1), .B(a[0]), .C(en), .Y(y[1]));
  AND3X1 g2 (.A(a[1]), .B(n0), .C(en), .Y(y[2]));
  AND3X1 g3 (.A(a[1]), .B(a[0]), .C(en), .Y(y[3]));
endmodule
";

const CELLS: &str = "module INVX1(input A, output Y); assign Y = ~A; endmodule
module AND3X1(input A, input B, input C, output Y); assign Y = A & B & C; endmodule
module MUX2X1(input A, input B, input S, output Y); assign Y = S ? B : A; endmodule
";

fn files() -> tempfile::TempDir {
    let dir = tempfile::tempdir().expect("temp dir");
    for (name, text) in [("ref.v", REF), ("net.v", NET), ("cells.v", CELLS)] {
        std::fs::write(dir.path().join(name), text).expect("write");
    }
    dir
}

#[test]
fn the_main_files_module_is_the_top_over_the_librarys_unused_cells() {
    let dir = files();
    let o = equicone_in(
        dir.path(),
        &["prove", "ref.v", "net.v", "--cand-also", "cells.v"],
    );
    let out = String::from_utf8_lossy(&o.stdout);
    let err = String::from_utf8_lossy(&o.stderr);
    assert_eq!(code(&o), 0, "{out}\n{err}");
    assert!(out.contains("candidate   dec"), "{out}");
    assert!(
        out.contains(
            "net.v:1:1: warning: top module `dec` chosen: the one module of net.v that no module instantiates (not MUX2X1 of the other files"
        ),
        "{out}"
    );
    let o = equicone_in(
        dir.path(),
        &[
            "prove",
            "ref.v",
            "net.v",
            "--cand-also",
            "cells.v",
            "--json",
        ],
    );
    assert_eq!(code(&o), 0);
    let j: serde_json::Value = serde_json::from_slice(&o.stdout).expect("JSON");
    assert_eq!(j["candidate"], "dec");
    let warnings = j["warnings"].as_array().expect("warnings");
    assert!(
        warnings.iter().any(|w| w
            .as_str()
            .is_some_and(|w| w.contains("top module `dec` chosen"))),
        "{warnings:?}"
    );
}

#[test]
fn the_top_module_option_still_chooses() {
    let dir = files();
    let o = equicone_in(
        dir.path(),
        &[
            "eval", "net.v", "--also", "cells.v", "--top", "MUX2X1", "--rest", "1",
        ],
    );
    let out = String::from_utf8_lossy(&o.stdout);
    assert_eq!(code(&o), 0, "{out}\n{}", String::from_utf8_lossy(&o.stderr));
    assert!(out.contains("design   MUX2X1"), "{out}");
    assert!(!out.contains("chosen"), "{out}");
}

#[test]
fn two_uninstantiated_modules_in_the_main_file_are_still_an_error() {
    let dir = files();
    let two = format!("{NET}module spare(input a, output y); assign y = a; endmodule\n");
    std::fs::write(dir.path().join("two.v"), two).expect("write");
    let o = equicone_in(
        dir.path(),
        &["prove", "ref.v", "two.v", "--cand-also", "cells.v"],
    );
    let err = String::from_utf8_lossy(&o.stderr);
    assert_eq!(code(&o), 2, "{err}");
    assert!(
        err.contains("several modules could be the top: dec, spare, MUX2X1"),
        "{err}"
    );
}
