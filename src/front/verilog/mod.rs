//! The Verilog front-end: an IEEE 1364-2005 synthesizable subset, read by a hand-written
//! lexer and recursive-descent parser and elaborated bit-exactly into a [`Design`].
//!
//! Entry point: [`read_verilog`]. The rules for widths, signedness and unknown values are
//! documented in `docs/verilog.md`.

pub mod ast;
mod elaborate;
mod fasthash;
pub mod lexer;
mod parse_expr;
mod parse_gate;
mod parse_gen;
mod parse_stmt;
pub mod parser;
pub mod symbols;

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
    // Parsing and elaboration recurse over expression syntax (bounded by the parser's
    // nesting limit); a dedicated thread gives that recursion a known, ample stack. The
    // thread is scoped, so it reads the sources in place (no copy of a large text).
    std::thread::scope(|s| {
        let h = std::thread::Builder::new()
            .name("verilog-reader".into())
            .stack_size(256 << 20)
            .spawn_scoped(s, || read_inner(sources, top));
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

/// What to do about a lexer or parser error.
fn syntax_help(msg: &str) -> &'static str {
    if msg.starts_with("unsupported:") {
        "equicone reads the IEEE 1364-2005 subset listed in docs/verilog.md; rewrite this within it"
    } else if msg.contains("wider than 65536 bits") {
        "write literals of at most 65536 bits; build wider constants by concatenation"
    } else if msg.contains("does not fit in") {
        "give the literal enough bits for its digits (e.g. `8'h1f`), or drop the extra digits"
    } else if msg.starts_with("missing `endmodule`") {
        "close each module with `endmodule` before the next one starts"
    } else if msg.starts_with("nesting deeper") {
        "split the expression or statement with intermediate wires"
    } else {
        "correct the syntax here; the Verilog subset read is listed in docs/verilog.md"
    }
}

fn read_inner(sources: &[(Arc<str>, String)], top: Option<&str>) -> Result<Design, InputError> {
    let mut names = symbols::Interner::new();
    let mut mods = Vec::new();
    let mut diags = Vec::new();
    let files: Vec<Arc<str>> = sources.iter().map(|s| s.0.clone()).collect();
    for (k, (file, text)) in sources.iter().enumerate() {
        let mut p = parser::Parser::new(text, k as u32, &mut names);
        mods.extend(p.file());
        let mut errs = std::mem::take(&mut p.errors);
        errs.sort_by_key(|e| (e.0.line, e.0.col));
        for (pos, msg) in errs {
            let help = syntax_help(&msg);
            diags.push(
                Diagnostic::error(Some(SourcePos::new(file, pos.line, pos.col)), msg)
                    .with_help(help),
            );
        }
    }
    if !diags.is_empty() {
        return Err(InputError { diagnostics: diags });
    }
    elaborate::elaborate(&names, &files, mods, top)
}
