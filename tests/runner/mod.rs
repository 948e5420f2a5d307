//! Runs the equicone executable for the integration tests (one helper for every test file).
#![allow(dead_code)]

use std::path::Path;
use std::process::{Command, Output};

/// Run the executable with `args` in the crate's root folder.
pub fn equicone(args: &[&str]) -> Output {
    equicone_in(Path::new(env!("CARGO_MANIFEST_DIR")), args)
}

/// Run the executable with `args` in `dir`.
pub fn equicone_in(dir: &Path, args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_equicone"))
        .args(args)
        .current_dir(dir)
        .output()
        .expect("the binary runs")
}

/// The exit code (the process must have exited, not been killed).
pub fn code(o: &Output) -> i32 {
    o.status.code().expect("exit code")
}

/// Run the executable with arguments that need not be UTF-8 (file names) in `dir`.
pub fn equicone_os<S: AsRef<std::ffi::OsStr>>(dir: &Path, args: &[S]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_equicone"))
        .args(args)
        .current_dir(dir)
        .output()
        .expect("the binary runs")
}
