//! Macros: reading a `` `define `` (formal arguments with defaults, a body continued over
//! lines with a backslash), reading the actual arguments of a use, substituting them into
//! the body (with `` `` `` pasting and `` `" `` quotes, IEEE 1800-2017 clause 22.5.1, from
//! memory) and expanding the result again, with a guard against recursion.

use super::text::{Cursor, Mapped};
use super::{Preprocessor, MAX_DEPTH, MAX_EXPANSION};
use crate::front::verilog::pos::Pos;

/// One defined macro.
#[derive(Clone, Debug)]
pub struct Macro {
    /// Formal arguments with their default texts; `None`: no argument list at all.
    params: Option<Vec<(String, Option<Mapped>)>>,
    /// The body, with positions into its definition.
    body: Mapped,
}

impl Macro {
    /// A macro given on the command line (`-D NAME=VALUE`).
    pub fn command_line(value: &str) -> Macro {
        // Positions in a command-line macro point at "line 0" of the first file; they are
        // reported as the place of the use (see `use_macro`).
        Macro {
            params: None,
            body: Mapped::from_text(value, Pos::default()),
        }
    }
}

impl Preprocessor<'_> {
    /// After `` `define ``: read the name, formals and body, up to the end of the line.
    pub(super) fn define(&mut self, cur: &mut Cursor, p: Pos) {
        cur.skip_blanks();
        let Some(name) = cur.ident() else {
            self.error(
                p,
                "`define needs a macro name",
                "write e.g. `define WIDTH 8",
            );
            skip_line(cur);
            return;
        };
        if is_directive(&name) {
            self.error(
                p,
                format!("`{name}` is a compiler directive and cannot be a macro name"),
                "choose another name",
            );
            skip_line(cur);
            return;
        }
        let mut params = None;
        if cur.peek(0) == b'(' {
            cur.bump();
            let mut list: Vec<(String, Option<Mapped>)> = Vec::new();
            loop {
                skip_space(cur);
                let Some(f) = cur.ident() else {
                    self.error(
                        cur.pos,
                        format!("expected a formal argument name in `define {name}"),
                        "write the arguments as `define NAME(a, b) ...",
                    );
                    skip_line(cur);
                    return;
                };
                skip_space(cur);
                let mut default = None;
                if cur.peek(0) == b'=' {
                    cur.bump();
                    let (d, _) = read_arg(cur);
                    default = Some(d);
                }
                list.push((f, default));
                skip_space(cur);
                match cur.peek(0) {
                    b',' => cur.bump(),
                    b')' => {
                        cur.bump();
                        break;
                    }
                    _ => {
                        self.error(
                            cur.pos,
                            format!("expected `,` or `)` in the arguments of `define {name}"),
                            "write the arguments as `define NAME(a, b) ...",
                        );
                        skip_line(cur);
                        return;
                    }
                }
            }
            params = Some(list);
        }
        cur.skip_blanks();
        let mut body = Mapped::new();
        while !cur.done() {
            match cur.peek(0) {
                b'\n' => break,
                b'\\' if cur.peek(1) == b'\n' => {
                    cur.bump();
                    cur.copy_to(&mut body);
                }
                b'\\' if cur.peek(1) == b'\r' && cur.peek(2) == b'\n' => {
                    cur.bump();
                    cur.bump();
                    cur.copy_to(&mut body);
                }
                b'/' if cur.peek(1) == b'/' => {
                    while !cur.done() && cur.peek(0) != b'\n' {
                        cur.bump();
                    }
                }
                b'"' => {
                    cur.copy_to(&mut body);
                    while !cur.done() && !matches!(cur.peek(0), b'"' | b'\n') {
                        cur.copy_to(&mut body);
                    }
                    cur.copy_to(&mut body);
                }
                _ => cur.copy_to(&mut body),
            }
        }
        body.trim_end();
        self.macros.insert(name, Macro { params, body });
    }

    /// After `` `NAME ``: expand the macro into `out`.
    pub(super) fn use_macro(
        &mut self,
        cur: &mut Cursor,
        out: &mut Mapped,
        p: Pos,
        name: String,
        depth: usize,
    ) {
        let Some(m) = self.macros.get(&name).cloned() else {
            if self.include_failed {
                return;
            }
            self.error(
                p,
                format!("undefined macro `{name}"),
                "define it with `define before this line, or on the command line with -D NAME=VALUE",
            );
            return;
        };
        if let Some(at) = self.expanding.iter().position(|n| *n == name) {
            let chain: Vec<String> = self.expanding[at..]
                .iter()
                .chain([&name])
                .map(|n| format!("`{n}"))
                .collect();
            self.error(
                p,
                format!("macro recursion: {}", chain.join(" uses ")),
                "a macro may not use itself, directly or through other macros",
            );
            return;
        }
        if depth >= MAX_DEPTH {
            self.error(
                p,
                format!("macros and includes nest deeper than {MAX_DEPTH} levels"),
                "simplify the macros",
            );
            return;
        }
        let mut text = Mapped::new();
        match &m.params {
            None => text.append(&m.body),
            Some(formals) => {
                // IEEE 1364-2005 clause 19.3.1: white space may stand between the name and `(`.
                let mut k = 0;
                while matches!(cur.peek(k), b' ' | b'\t' | b'\r' | b'\n') {
                    k += 1;
                }
                if cur.peek(k) != b'(' {
                    self.error(
                        p,
                        format!("macro `{name} needs its arguments in parentheses"),
                        "write the use as `NAME(a, b)",
                    );
                    return;
                }
                skip_space(cur);
                cur.bump();
                let mut actuals = Vec::new();
                loop {
                    let (a, end) = read_arg(cur);
                    actuals.push(a);
                    match end {
                        b',' => cur.bump(),
                        b')' => {
                            cur.bump();
                            break;
                        }
                        _ => {
                            self.error(
                                p,
                                format!("the arguments of macro `{name} are not closed by `)`"),
                                "close the argument list",
                            );
                            return;
                        }
                    }
                }
                if actuals.len() == 1 && formals.is_empty() && is_blank(&actuals[0]) {
                    actuals.clear();
                }
                if actuals.len() > formals.len() {
                    self.error(
                        p,
                        format!(
                            "macro `{name} takes {} arguments, {} given",
                            formals.len(),
                            actuals.len()
                        ),
                        "give one argument per formal argument of the `define",
                    );
                    return;
                }
                let mut args = Vec::with_capacity(formals.len());
                for (j, (f, default)) in formals.iter().enumerate() {
                    match (actuals.get(j).filter(|a| !is_blank(a)), default) {
                        (Some(a), _) => args.push(a.clone()),
                        (None, Some(d)) => args.push(d.clone()),
                        (None, None) if actuals.len() > j => args.push(Mapped::new()),
                        (None, None) => {
                            self.error(
                                p,
                                format!("macro `{name} needs a value for its argument `{f}`"),
                                "give one argument per formal argument of the `define",
                            );
                            return;
                        }
                    }
                }
                substitute(&m.body, formals, &args, &mut text);
            }
        }
        self.expanded_bytes += text.text.len();
        if self.expanded_bytes > MAX_EXPANSION {
            self.error(
                p,
                format!(
                    "macro expansion produces more than {} MiB of text",
                    MAX_EXPANSION >> 20
                ),
                "look for macros that use other macros several times over",
            );
            return;
        }
        if text.marks.first().is_some_and(|m| m.pos.line == 0) {
            // A command-line macro: its text is placed at the use.
            text.marks[0].pos = p;
        }
        let errors_before = self.errors.len();
        self.expanding.push(name);
        out.break_run();
        let bytes = std::mem::take(&mut text.text);
        let marks = std::mem::take(&mut text.marks);
        self.run(&mut Cursor::new(&bytes, &marks), out, depth + 1);
        out.break_run();
        self.expanding.pop();
        if self.errors.len() > errors_before + 20 {
            self.errors.truncate(errors_before + 20);
        }
    }
}

/// The directives, which no macro may be named after.
fn is_directive(n: &str) -> bool {
    matches!(
        n,
        "define"
            | "undef"
            | "undefineall"
            | "ifdef"
            | "ifndef"
            | "elsif"
            | "else"
            | "endif"
            | "include"
            | "timescale"
            | "default_nettype"
            | "resetall"
            | "celldefine"
            | "endcelldefine"
            | "line"
            | "pragma"
            | "__FILE__"
            | "__LINE__"
    )
}

fn is_blank(m: &Mapped) -> bool {
    m.text.iter().all(|b| b.is_ascii_whitespace())
}

fn skip_line(cur: &mut Cursor) {
    while !cur.done() && cur.peek(0) != b'\n' {
        if cur.peek(0) == b'\\' && cur.peek(1) == b'\n' {
            cur.bump();
        }
        cur.bump();
    }
}

fn skip_space(cur: &mut Cursor) {
    while cur.peek(0).is_ascii_whitespace() && !cur.done() {
        cur.bump();
    }
}

/// Read one actual (or default) argument: up to a `,` or `)` outside brackets and strings.
/// Returns the text (surrounding blanks trimmed) and the byte that ended it (0 at the end).
fn read_arg(cur: &mut Cursor) -> (Mapped, u8) {
    skip_space(cur);
    let mut a = Mapped::new();
    let mut nest = 0usize;
    while !cur.done() {
        let c = cur.peek(0);
        match c {
            b'(' | b'[' | b'{' => nest += 1,
            b')' | b']' | b'}' if nest > 0 => nest -= 1,
            b',' | b')' if nest == 0 => {
                a.trim_end();
                return (a, c);
            }
            b'"' => {
                cur.copy_to(&mut a);
                while !cur.done() && !matches!(cur.peek(0), b'"' | b'\n') {
                    cur.copy_to(&mut a);
                }
            }
            _ => {}
        }
        cur.copy_to(&mut a);
    }
    a.trim_end();
    (a, 0)
}

/// The body with each formal replaced by its argument; `` `` `` joins and `` `" `` is `"`.
fn substitute(
    body: &Mapped,
    formals: &[(String, Option<Mapped>)],
    args: &[Mapped],
    out: &mut Mapped,
) {
    let mut cur = Cursor::new(&body.text, &body.marks);
    let mut in_str = false;
    while !cur.done() {
        let c = cur.peek(0);
        if c == b'`' && cur.peek(1) == b'`' {
            cur.bump();
            cur.bump();
            out.break_run();
            continue;
        }
        if c == b'`' && cur.peek(1) == b'"' {
            cur.bump();
            in_str = !in_str;
            cur.copy_to(out);
            continue;
        }
        if c == b'"' {
            in_str = !in_str;
        }
        if !in_str && (c.is_ascii_alphabetic() || c == b'_') {
            let start = cur.pos;
            let mut word = Mapped::new();
            while matches!(cur.peek(0), b'a'..=b'z' | b'A'..=b'Z' | b'0'..=b'9' | b'_' | b'$') {
                cur.copy_to(&mut word);
            }
            match formals.iter().position(|(f, _)| f.as_bytes() == word.text) {
                Some(k) => out.append(&args[k]),
                None => {
                    out.break_run();
                    for (j, b) in word.text.iter().enumerate() {
                        let mut q = start;
                        q.col += j as u32;
                        out.push(*b, q);
                    }
                    out.break_run();
                }
            }
            continue;
        }
        if c == b'\\' {
            while !cur.done() && !cur.peek(0).is_ascii_whitespace() {
                cur.copy_to(out);
            }
            continue;
        }
        cur.copy_to(out);
    }
}

/// A check that `MAX_DEPTH` stays within what the recursion of `run` can take.
const _: () = assert!(MAX_DEPTH <= 256);
