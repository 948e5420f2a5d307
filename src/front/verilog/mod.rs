//! The Verilog front-end: an IEEE 1364-2005 synthesizable subset, read by a hand-written
//! lexer and recursive-descent parser and elaborated bit-exactly into a [`Design`].
//!
//! Entry point: [`read_verilog`]. The rules for widths, signedness and unknown values are
//! documented in `docs/verilog.md`.

pub mod ast;
mod elaborate;

pub mod lexer;
mod parse_expr;
mod parse_gate;
mod parse_gen;
mod parse_stmt;
pub mod parser;
pub mod pos;
pub mod preprocess;
pub mod symbols;
pub mod syntax_error;

use crate::design::Design;
use crate::diag::{Diagnostic, InputError, SourcePos};
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

/// [`read_verilog`] with include directories and macros from the command line.
pub fn read_verilog_with(
    sources: &[(Arc<str>, String)],
    top: Option<&str>,
    opts: &preprocess::Options,
) -> Result<Design, InputError> {
    // Parsing and elaboration recurse over expression syntax (bounded by the parser's
    // nesting limit); a dedicated thread gives that recursion a known, ample stack. The
    // thread is scoped, so it reads the sources in place (no copy of a large text).
    std::thread::scope(|s| {
        let h = std::thread::Builder::new()
            .name("verilog-reader".into())
            .stack_size(256 << 20)
            .spawn_scoped(s, || read_inner(sources, top, opts));
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
    top: Option<&str>,
    opts: &preprocess::Options,
) -> Result<Design, InputError> {
    // IEEE 1364-2005 clause 19: the preprocessor runs first, over all files in order (a
    // macro defined in one file is in force in the next).
    let pre = preprocess::preprocess(sources, opts);
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
    for (k, unit) in pre.units.iter().enumerate() {
        let mut p = parser::Parser::with_marks(&unit.text, k as u32, &unit.marks, &mut names);
        mods.extend(p.file());
        for w in std::mem::take(&mut p.warnings) {
            let pos = SourcePos::new(&files[w.pos.file as usize], w.pos.line, w.pos.col);
            warnings.push(Diagnostic::warning(Some(pos), w.message).with_help(
                "equicone compares the logic only; delays do not change what is proved",
            ));
        }
        let mut errs = std::mem::take(&mut p.errors);
        errs.sort_by_key(|e| (e.pos.file != k as u32, e.pos.file, e.pos.line, e.pos.col));
        for e in errs {
            let file = &files[e.pos.file as usize];
            let pos = SourcePos::new(file, e.pos.line, e.pos.col);
            diags.push(Diagnostic::error(Some(pos), e.message).with_help(e.kind.help()));
        }
    }
    if !diags.is_empty() {
        return Err(InputError { diagnostics: diags });
    }
    let mut d = elaborate::elaborate(&names, &files, mods, top)?;
    if !warnings.is_empty() {
        warnings.append(&mut d.warnings);
        d.warnings = warnings;
    }
    Ok(d)
}
