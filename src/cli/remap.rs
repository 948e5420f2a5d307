//! `equicone gen remap DESIGN --k K`: read a design and write its lookup-function rewrite.

use super::common::{load, print, report_input_error, write_atomic, PreprocArgs};
use super::Exit;
use crate::diag::InputError;
use crate::gen::{remap, GenFormat};
use std::path::Path;

/// Run `gen remap`.
pub fn run(
    design: Option<&Path>,
    k: usize,
    pre: &PreprocArgs,
    (module, format, output): (Option<&str>, GenFormat, Option<&Path>),
) -> Exit {
    let Some(path) = design else {
        return report_input_error(&InputError::plain(
            "gen remap needs a design file",
            "run `equicone gen remap DESIGN --k 6` with a bench or Verilog file",
        ));
    };
    let d = match load(vec![path.to_path_buf()], None, None, pre) {
        Ok(d) => d,
        Err(e) => return e,
    };
    let module = module.unwrap_or("remapped");
    if !crate::gen::emit::is_identifier(module) {
        return report_input_error(&InputError::plain(
            format!("module name `{module}` is not a plain Verilog identifier"),
            "use letters, digits and `_`, starting with a letter",
        ));
    }
    let (mut c, stats) = match remap::remap(&d, k, module) {
        Ok(x) => x,
        Err(e) => return report_input_error(&e.into()),
    };
    let mut cmd = format!("equicone gen remap {} --k {k}", path.display());
    if format == GenFormat::Bench {
        cmd += " --format bench";
    }
    c.notes.insert(0, cmd);
    let text = match format {
        GenFormat::Bench => remap::to_bench(&c),
        GenFormat::Verilog => {
            if let Err(e) = remap::verilog_names_ok(&c) {
                return report_input_error(&e.into());
            }
            c.to_verilog()
        }
    };
    match output {
        None => print(&text),
        Some(out) => {
            if let Err(e) = write_atomic(out, text.as_bytes()) {
                return report_input_error(&e);
            }
            eprintln!(
                "wrote {}: {} lookup functions of at most {k} inputs, {} product terms",
                out.display(),
                stats.luts,
                stats.cubes
            );
        }
    }
    Exit::Ok
}
