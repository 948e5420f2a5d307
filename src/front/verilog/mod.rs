//! The Verilog front-end: an IEEE 1364-2005 synthesizable subset, read by a hand-written
//! lexer and recursive-descent parser and elaborated bit-exactly into a [`Design`].
//!
//! Entry point: [`read_verilog`]. The rules for widths, signedness and unknown values are
//! documented in `docs/verilog.md`.

pub(crate) mod ast;
mod elaborate;

pub(crate) mod lexer;
mod parse_array;
mod parse_clocked;
mod parse_decl;
mod parse_expr;
mod parse_func;
mod parse_gate;
mod parse_gen;
mod parse_package;
mod parse_recover;
mod parse_stmt;
mod parse_types;
mod parse_udp;
pub(crate) mod parser;
pub mod pos;
pub mod preprocess;
mod sv_types;
pub mod symbols;
pub mod syntax_error;

use crate::design::Design;
use crate::diag::{InputError, Stage};
use crate::front::Files;
use std::path::PathBuf;
use std::sync::Arc;

/// Read Verilog sources (file name as the user gave it, and its text) into one design whose
/// top module is `top`, or the only module nobody instantiates.
///
/// Input bits come first for each top-level input port, in declaration order, each bus
/// least significant bit first; unknown-value sources (`x`/`z` literals, out-of-range
/// selects) follow as inputs of kind [`crate::design::InputKind::Unknown`].
///
/// ```
/// use std::sync::Arc;
/// let src = "module m(input [1:0] a, output y); assign y = ^a; endmodule";
/// let d = equicone::front::verilog::read_verilog(&[(Arc::from("m.v"), src.to_string())], None).unwrap();
/// assert_eq!(d.inputs[1].name, "a[1]");
/// assert_eq!(d.eval(&[true, false]), vec![true]);
/// ```
pub fn read_verilog(
    sources: &[(Arc<str>, String)],
    top: Option<&str>,
) -> Result<Design, InputError> {
    read_verilog_with(sources, top, &preprocess::Options::default())
}

/// [`read_verilog`] with macros and include directories; the texts are all there is, so an
/// `` `include `` finds nothing (read through [`crate::front::load`] with a
/// [`crate::front::Files`] store for that).
pub fn read_verilog_with(
    sources: &[(Arc<str>, String)],
    top: Option<&str>,
    opts: &preprocess::Options,
) -> Result<Design, InputError> {
    let paths: Vec<PathBuf> = sources.iter().map(|s| PathBuf::from(&*s.0)).collect();
    read_sources(
        sources,
        &paths,
        top,
        opts,
        &crate::front::MemoryFiles::new(),
    )
}

/// Read Verilog sources whose real paths are `paths` (one per source; the names in
/// `sources` show them, lossily), `` `include `` finding its files through `files`.
pub(crate) fn read_sources(
    sources: &[(Arc<str>, String)],
    paths: &[PathBuf],
    top: Option<&str>,
    opts: &preprocess::Options,
    files: &dyn Files,
) -> Result<Design, InputError> {
    // Parsing and elaboration recurse over expression syntax (bounded by the parser's
    // nesting limit); a dedicated thread gives that recursion a known, ample stack. The
    // thread is scoped, so it reads the sources in place (no copy of a large text).
    std::thread::scope(|s| {
        let h = std::thread::Builder::new()
            .name("verilog-reader".into())
            .stack_size(256 << 20)
            .spawn_scoped(s, || read_inner(sources, paths, top, opts, files));
        match h {
            Ok(h) => match h.join() {
                Ok(r) => r,
                Err(_) => Err(InputError::plain(
                    "internal error while reading Verilog",
                    "please report this input as a bug",
                )),
            },
            Err(_) => read_inner_fallback(),
        }
    })
}

fn read_inner_fallback() -> Result<Design, InputError> {
    Err(InputError::plain(
        "could not start the Verilog reader thread",
        "retry with more memory available",
    ))
}

fn read_inner(
    sources: &[(Arc<str>, String)],
    paths: &[PathBuf],
    top: Option<&str>,
    opts: &preprocess::Options,
    files: &dyn Files,
) -> Result<Design, InputError> {
    // IEEE 1364-2005 clause 19: the preprocessor runs first, over all files in order (a
    // macro defined in one file is in force in the next).
    let clock = std::time::Instant::now();
    let pre = preprocess::preprocess(sources, paths, opts, files);
    log::debug!(
        "verilog: preprocessed by {:.2?}; memory {}",
        clock.elapsed(),
        crate::host::now_note()
    );
    if !pre.errors.is_empty() {
        return Err(InputError {
            diagnostics: pre.errors,
        });
    }
    let files = pre.files;
    let mut names = symbols::Interner::new();
    let mut mods = Vec::new();
    let mut diags = Vec::new();
    let mut warnings = Vec::new();
    let mut sv = sv_types::SvScope::default();
    for (k, unit) in pre.units.iter().enumerate() {
        let mut p = parser::Parser::with_marks(&unit.text, k as u32, &unit.marks, &mut names);
        p.sv = sv;
        mods.extend(p.file());
        sv = std::mem::take(&mut p.sv);
        for w in std::mem::take(&mut p.warnings) {
            warnings.push(w.diagnostic(&files));
        }
        let mut errs = std::mem::take(&mut p.errors);
        errs.sort_by_key(|e| (e.pos.file != k as u32, e.pos.file, e.pos.line, e.pos.col));
        diags.extend(errs.iter().map(|e| e.diagnostic(&files)));
    }
    log::debug!(
        "verilog: parsed {} module(s), {} names, by {:.2?}; memory {}",
        mods.len(),
        names.len(),
        clock.elapsed(),
        crate::host::now_note()
    );
    if !diags.is_empty() {
        return Err(InputError { diagnostics: diags });
    }
    let mut d = elaborate::elaborate(&names, &files, mods, top, opts.keep_written)
        .map_err(|e| e.in_stage(Stage::Elaborate))?;
    for w in &mut d.warnings {
        w.stage = Stage::Elaborate;
    }
    if !warnings.is_empty() {
        warnings.append(&mut d.warnings);
        d.warnings = warnings;
    }
    log::debug!(
        "verilog: elaborated by {:.2?}: {} inputs, {} AND nodes; memory {}",
        clock.elapsed(),
        d.inputs.len(),
        d.aig.num_ands(),
        crate::host::now_note()
    );
    Ok(d)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::diag::{Kind, Severity};

    fn first_error(src: &str) -> crate::diag::Diagnostic {
        let e = read_verilog(&[(Arc::from("t.v"), src.to_string())], None).unwrap_err();
        e.diagnostics[0].clone()
    }

    #[test]
    fn each_stage_marks_its_errors() {
        let d = first_error("`endif\nmodule m(output y); assign y = 1; endmodule\n");
        assert_eq!(d.stage, Stage::Preprocess, "{d}");
        let d = first_error("module m(output y); assign y = 70000'h0; endmodule\n");
        assert_eq!((d.stage, d.kind), (Stage::Lex, Kind::Other), "{d}");
        let d = first_error("module m(output y) assign y = 1; endmodule\n");
        assert_eq!(d.stage, Stage::Parse, "{d}");
        assert!(matches!(d.kind, Kind::Grammar { .. }), "{d}");
        let d = first_error("module m(output y); assign y = q; endmodule\n");
        assert_eq!(
            (d.stage, d.kind),
            (Stage::Elaborate, Kind::UndeclaredName),
            "{d}"
        );
        let d = first_error("module m(output y); assign y = 1; assign y = 2; endmodule\n");
        assert_eq!((d.stage, d.kind), (Stage::Elaborate, Kind::Other), "{d}");
        let e = crate::front::bench::read_bench(&Arc::from("t.bench"), "OUTPUT(y)\ny = FOO(a)\n")
            .unwrap_err();
        assert_eq!(e.diagnostics[0].stage, Stage::Bench);
    }

    #[test]
    fn the_delay_warning_carries_its_help_from_the_parser() {
        let src = "module m(input a, output y); assign #1 y = a; endmodule\n";
        let d = read_verilog(&[(Arc::from("t.v"), src.to_string())], None).unwrap();
        let w = &d.warnings[0];
        assert_eq!((w.severity, w.stage), (Severity::Warning, Stage::Parse));
        assert_eq!(
            w.help.as_deref(),
            Some("equicone compares the logic only; delays do not change what is proved")
        );
    }
}
