//! File names that are not UTF-8 (Linux allows any bytes but `/` and NUL): they are read,
//! named lossily in messages, and written to.

use super::common::{code, scratch, stderr, write};
use crate::runner::equicone_os;
use std::ffi::{OsStr, OsString};
use std::os::unix::ffi::OsStrExt;

/// ISCAS-85 c17, as published with the benchmark set (common practice).
const C17: &str = "INPUT(1)\nINPUT(2)\nINPUT(3)\nINPUT(6)\nINPUT(7)\nOUTPUT(22)\nOUTPUT(23)\n\
10 = NAND(1, 3)\n11 = NAND(3, 6)\n16 = NAND(2, 11)\n19 = NAND(11, 7)\n22 = NAND(10, 16)\n23 = NAND(16, 19)\n";

/// c17 with each NAND written as NOT of AND (De Morgan: the same functions).
const C17_AND_NOT: &str = "INPUT(1)\nINPUT(2)\nINPUT(3)\nINPUT(6)\nINPUT(7)\nOUTPUT(22)\nOUTPUT(23)\n\
a10 = AND(1, 3)\n10 = NOT(a10)\na11 = AND(3, 6)\n11 = NOT(a11)\na16 = AND(2, 11)\n16 = NOT(a16)\n\
a19 = AND(11, 7)\n19 = NOT(a19)\na22 = AND(10, 16)\n22 = NOT(a22)\na23 = AND(16, 19)\n23 = NOT(a23)\n";

/// `r<0xff>.bench`: not valid UTF-8.
fn bad_name(stem: &[u8]) -> OsString {
    let mut b = stem.to_vec();
    b.extend_from_slice(b"\xff.bench");
    OsStr::from_bytes(&b).to_os_string()
}

#[test]
fn a_design_whose_file_name_is_not_utf8_is_read_and_proved() {
    let d = scratch("non-utf8-prove");
    let name = bad_name(b"r");
    assert!(name.to_str().is_none(), "the name must not be UTF-8");
    std::fs::write(d.join(&name), C17).unwrap();
    write(&d, "cand.bench", C17_AND_NOT);
    let report = bad_name(b"rep");
    let args = [
        OsStr::new("prove"),
        name.as_os_str(),
        OsStr::new("cand.bench"),
        OsStr::new("--report"),
        report.as_os_str(),
    ];
    let o = equicone_os(&d, &args);
    assert_eq!(code(&o), 0, "{}", stderr(&o));
    // The report was written under the very name given, byte for byte.
    let json = std::fs::read_to_string(d.join(&report)).expect("the report is written");
    assert!(json.contains("\"equivalent\""), "{json}");
}

#[test]
fn a_syntax_error_names_a_non_utf8_file_lossily_with_line_and_column() {
    let d = scratch("non-utf8-error");
    let name = bad_name(b"r");
    std::fs::write(d.join(&name), "INPUT(a)\nOUTPUT(y)\ny = AND(a,\n").unwrap();
    write(&d, "cand.bench", "INPUT(a)\nOUTPUT(y)\ny = BUF(a)\n");
    let args = [
        OsStr::new("prove"),
        name.as_os_str(),
        OsStr::new("cand.bench"),
    ];
    let o = equicone_os(&d, &args);
    assert_eq!(code(&o), 2, "{}", stderr(&o));
    let err = stderr(&o);
    // U+FFFD stands for the byte that is not UTF-8, as `Path::display` shows it.
    assert!(err.contains("r\u{fffd}.bench:3:"), "{err}");
}
