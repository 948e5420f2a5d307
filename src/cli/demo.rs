//! `equicone demo`: the built-in Tidewater 7 scenario, from files embedded in the binary.

use super::common::{print, report_input_error, report_internal, write_atomic};
use super::Exit;
use clap::Args;
use std::path::PathBuf;

/// Options of `demo`.
#[derive(Args, Debug)]
pub struct DemoArgs {
    /// Write the demo's netlists into this folder instead of running it.
    #[arg(long, value_name = "DIR")]
    write: Option<PathBuf>,
}

/// Run `demo`.
pub fn run(a: &DemoArgs) -> Exit {
    if let Some(dir) = &a.write {
        // The folder is created when missing (with its parents), like `mkdir -p`.
        if let Err(e) = std::fs::create_dir_all(dir) {
            return report_input_error(&crate::InputError::plain(
                format!("cannot create the folder `{}`: {e}", dir.display()),
                "give a folder path that can be created or already exists",
            ));
        }
        for (name, text) in crate::demo::FILES {
            let path = dir.join(name);
            if let Err(e) = write_atomic(&path, text.as_bytes()) {
                return report_input_error(&e);
            }
            eprintln!("wrote {}", path.display());
        }
        let at = |name: &str| dir.join(name);
        // The testbench names the netlists it includes (lossily when not UTF-8).
        let files = match crate::demo::trace_files(
            &at("t7_sensor_reg_spec.v").display().to_string(),
            &at("t7_sensor_reg_r5.v").display().to_string(),
        ) {
            Ok(f) => f,
            Err(m) => return report_internal(&m),
        };
        for (name, text) in files {
            let path = at(&name);
            if let Err(e) = write_atomic(&path, text.as_bytes()) {
                return report_input_error(&e);
            }
            eprintln!("wrote {}", path.display());
        }
        return Exit::Ok;
    }
    match crate::demo::run() {
        Ok(text) => {
            print(&text);
            Exit::Ok
        }
        Err(m) => report_internal(&m),
    }
}
