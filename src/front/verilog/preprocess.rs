//! The Verilog preprocessor (IEEE 1364-2005 clause 19; IEEE 1800-2017 clause 22 for the
//! SystemVerilog additions, from memory): `` `define `` with arguments and defaults,
//! `` `undef ``, `` `undefineall ``, `` `ifdef ``/`` `ifndef ``/`` `elsif ``/`` `else ``/
//! `` `endif ``, `` `include `` with search directories, macros from the command line,
//! `` `__FILE__ ``/`` `__LINE__ ``. The directives that do not change the text
//! (`` `timescale ``, `` `default_nettype ``, `` `resetall ``, `` `celldefine ``, ...) pass
//! through to the lexer.
//!
//! The text it gives the lexer carries marks ([`Mark`]) that send every character back to
//! the file, line and column where it was written: an included file's text to that file,
//! a macro's body to its definition, a macro argument to the place of the call. Include
//! loops and macros that expand to themselves are errors, and so is an expansion past
//! [`MAX_EXPANSION`] bytes (a few lines can otherwise ask for gigabytes).

mod macros;
mod text;

use super::lexer::Mark;
use super::pos::Pos;
use crate::diag::{Diagnostic, SourcePos, Stage};
use crate::front::Files;
use macros::Macro;
use std::borrow::Cow;
use std::collections::BTreeMap;
use std::path::{Path, PathBuf};
use std::sync::Arc;
use text::{Cursor, Mapped};

/// Includes and macro expansions nest at most this deep.
pub const MAX_DEPTH: usize = 64;
/// Macro expansions produce at most this many bytes in all.
pub const MAX_EXPANSION: usize = 64 << 20;

/// What the command line adds: include directories (`-I DIR`) and macros (`-D NAME=VALUE`);
/// and how the reader builds the graph.
#[derive(Clone, Debug, Default, PartialEq, Eq)]
pub struct Options {
    /// Searched in order after the directory of the including file.
    pub include_dirs: Vec<PathBuf>,
    /// Macros defined before the first file, in order (`NAME` alone is `NAME=` with an
    /// empty body).
    pub defines: Vec<(String, String)>,
    /// Build the graph as written ([`crate::aig::Aig::as_written`]): the cone audit's
    /// structural cones then hold every input an expression reads, `b` in `a & (b | ~b)`.
    pub keep_written: bool,
}

impl Options {
    /// Parse `-D` values: `NAME` or `NAME=VALUE`; an error message for a bad name.
    pub fn parse_define(s: &str) -> Result<(String, String), String> {
        let (n, v) = s.split_once('=').unwrap_or((s, ""));
        let ok = n
            .bytes()
            .next()
            .is_some_and(|c| c.is_ascii_alphabetic() || c == b'_')
            && n.bytes()
                .all(|c| c.is_ascii_alphanumeric() || c == b'_' || c == b'$');
        if ok {
            Ok((n.to_string(), v.to_string()))
        } else {
            Err(format!("`{n}` is not a macro name"))
        }
    }
}

/// One source file after preprocessing.
pub struct Unit<'a> {
    /// The text for the lexer.
    pub text: Cow<'a, str>,
    /// Where its runs came from (empty: the file itself, unchanged).
    pub marks: Vec<Mark>,
}

/// The result: one unit per source, and the file table (the sources first, in order, then
/// every included file), which positions index.
pub struct Output<'a> {
    /// One per source.
    pub units: Vec<Unit<'a>>,
    /// File names for positions.
    pub files: Vec<Arc<str>>,
    /// Errors found.
    pub errors: Vec<Diagnostic>,
}

/// One open `` `ifdef `` group.
struct Cond {
    /// Where it opened.
    pos: Pos,
    /// The text around it is read.
    outer: bool,
    /// The current branch is read.
    on: bool,
    /// A branch was taken already.
    taken: bool,
    /// `` `else `` seen.
    seen_else: bool,
}

struct Preprocessor<'o> {
    opts: &'o Options,
    /// Where included files come from.
    store: &'o dyn Files,
    /// File names for positions (the sources, then the included files).
    files: Vec<Arc<str>>,
    /// The same files' paths (not necessarily UTF-8), for includes relative to them.
    paths: Vec<PathBuf>,
    macros: BTreeMap<String, Macro>,
    errors: Vec<Diagnostic>,
    /// Included files open now (for loops).
    open_files: Vec<PathBuf>,
    /// Macros expanding now (for recursion).
    expanding: Vec<String>,
    expanded_bytes: usize,
    /// An include was not found: its macros are missing, so uses of undefined macros are
    /// not reported again.
    include_failed: bool,
}

/// Preprocess `sources` (file name, text) whose paths are `paths` (one per source; a
/// missing one is taken from the name), reading included files from `store`. A source
/// without a backtick is passed on as is.
pub fn preprocess<'a>(
    sources: &'a [(Arc<str>, String)],
    paths: &[PathBuf],
    opts: &Options,
    store: &dyn Files,
) -> Output<'a> {
    let mut pre = Preprocessor {
        opts,
        store,
        files: sources.iter().map(|s| s.0.clone()).collect(),
        paths: sources
            .iter()
            .enumerate()
            .map(|(k, s)| {
                paths
                    .get(k)
                    .cloned()
                    .unwrap_or_else(|| PathBuf::from(&*s.0))
            })
            .collect(),
        macros: BTreeMap::new(),
        errors: Vec::new(),
        open_files: Vec::new(),
        expanding: Vec::new(),
        expanded_bytes: 0,
        include_failed: false,
    };
    for (n, v) in &opts.defines {
        pre.macros.insert(n.clone(), Macro::command_line(v));
    }
    let mut units = Vec::with_capacity(sources.len());
    for (k, (_, text)) in sources.iter().enumerate() {
        if !text.as_bytes().contains(&b'`') {
            units.push(Unit {
                text: Cow::Borrowed(text.as_str()),
                marks: Vec::new(),
            });
            continue;
        }
        let start = [Mark {
            off: 0,
            pos: Pos {
                file: k as u32,
                line: 1,
                col: 1,
            },
        }];
        let mut out = Mapped::new();
        pre.open_files.push(pre.paths[k].clone());
        pre.run(&mut Cursor::new(text.as_bytes(), &start), &mut out, 0);
        pre.open_files.pop();
        let s = String::from_utf8(out.text)
            .unwrap_or_else(|e| String::from_utf8_lossy(e.as_bytes()).into_owned());
        units.push(Unit {
            text: Cow::Owned(s),
            marks: out.marks,
        });
    }
    Output {
        units,
        files: pre.files,
        errors: pre.errors,
    }
}

impl Preprocessor<'_> {
    fn error(&mut self, pos: Pos, msg: impl Into<String>, help: &str) {
        let f = self
            .files
            .get(pos.file as usize)
            .cloned()
            .unwrap_or_else(|| Arc::from("?"));
        let d = Diagnostic::error(Some(SourcePos::new(&f, pos.line, pos.col)), msg);
        self.errors
            .push(d.with_help(help).in_stage(Stage::Preprocess));
    }

    /// Read `cur` to its end, writing the text that is in force to `out`.
    fn run(&mut self, cur: &mut Cursor, out: &mut Mapped, depth: usize) {
        let mut conds: Vec<Cond> = Vec::new();
        while !cur.done() {
            let on = conds.last().is_none_or(|c| c.on && c.outer);
            let c = cur.peek(0);
            match c {
                b'/' if cur.peek(1) == b'/' => {
                    while !cur.done() && cur.peek(0) != b'\n' {
                        self.pass(cur, out, on);
                    }
                }
                b'/' if cur.peek(1) == b'*' => {
                    let p = cur.pos;
                    self.pass(cur, out, on);
                    self.pass(cur, out, on);
                    while !cur.done() && !cur.at(b"*/") {
                        self.pass(cur, out, on);
                    }
                    if cur.done() {
                        self.error(
                            p,
                            "unterminated block comment",
                            "close the comment with `*/`",
                        );
                    } else {
                        self.pass(cur, out, on);
                        self.pass(cur, out, on);
                    }
                }
                b'"' => {
                    self.pass(cur, out, on);
                    while !cur.done() && !matches!(cur.peek(0), b'"' | b'\n') {
                        if cur.peek(0) == b'\\' {
                            self.pass(cur, out, on);
                        }
                        self.pass(cur, out, on);
                    }
                    self.pass(cur, out, on);
                }
                b'\\' => {
                    // An escaped name runs to white space; a backtick in it is part of it.
                    while !cur.done() && !cur.peek(0).is_ascii_whitespace() {
                        self.pass(cur, out, on);
                    }
                }
                b'`' => self.directive(cur, out, &mut conds, depth),
                _ => self.pass(cur, out, on),
            }
        }
        for c in conds.iter().rev() {
            self.error(
                c.pos,
                "this `ifdef/`ifndef has no `endif in the same file",
                "close every `ifdef and `ifndef with `endif before the end of its file or macro",
            );
        }
    }

    /// Copy the current byte when `on`; skip it otherwise (newlines are kept, so the lexer's
    /// lines stay close to the file's).
    fn pass(&mut self, cur: &mut Cursor, out: &mut Mapped, on: bool) {
        if on || cur.peek(0) == b'\n' {
            cur.copy_to(out);
        } else {
            cur.bump();
            out.break_run();
        }
    }

    fn directive(
        &mut self,
        cur: &mut Cursor,
        out: &mut Mapped,
        conds: &mut Vec<Cond>,
        depth: usize,
    ) {
        let p = cur.pos;
        let line_start = cur.i;
        cur.bump();
        let Some(name) = cur.ident() else {
            if conds.last().is_none_or(|c| c.on && c.outer) {
                self.error(
                    p,
                    "a backtick must start a compiler directive or a macro name",
                    "write a directive such as `define or the name of a defined macro after the backtick",
                );
            }
            return;
        };
        let on = conds.last().is_none_or(|c| c.on && c.outer);
        match name.as_str() {
            "ifdef" | "ifndef" | "elsif" => {
                cur.skip_blanks();
                let np = cur.pos;
                let Some(m) = cur.ident() else {
                    self.error(
                        np,
                        format!("`{name} needs a macro name"),
                        "write e.g. `ifdef NAME",
                    );
                    return;
                };
                let def = self.macros.contains_key(&m);
                let want = if name == "ifndef" { !def } else { def };
                if name == "elsif" {
                    match conds.last_mut() {
                        Some(c) if !c.seen_else => {
                            c.on = !c.taken && want;
                            c.taken |= want;
                        }
                        _ => self.stray(p, &name),
                    }
                } else {
                    conds.push(Cond {
                        pos: p,
                        outer: on,
                        on: want,
                        taken: want,
                        seen_else: false,
                    });
                }
            }
            "else" => match conds.last_mut() {
                Some(c) if !c.seen_else => {
                    c.on = !c.taken;
                    c.taken = true;
                    c.seen_else = true;
                }
                _ => self.stray(p, &name),
            },
            "endif" => {
                if conds.pop().is_none() {
                    self.stray(p, &name);
                }
            }
            _ if !on => {}
            "define" => self.define(cur, p),
            "undef" => {
                cur.skip_blanks();
                if let Some(m) = cur.ident() {
                    self.macros.remove(&m);
                } else {
                    self.error(p, "`undef needs a macro name", "write e.g. `undef NAME");
                }
            }
            "undefineall" => self.macros.clear(),
            "include" => self.include(cur, out, p, depth),
            "__LINE__" => {
                for b in p.line.to_string().bytes() {
                    out.push(b, p);
                }
                out.break_run();
            }
            "__FILE__" => {
                let f = self.files[p.file as usize].clone();
                let q = format!("{f:?}");
                for b in q.bytes() {
                    out.push(b, p);
                }
                out.break_run();
            }
            "timescale"
            | "default_nettype"
            | "resetall"
            | "celldefine"
            | "endcelldefine"
            | "unconnected_drive"
            | "nounconnected_drive"
            | "line"
            | "pragma"
            | "begin_keywords"
            | "end_keywords"
            | "default_decay_time"
            | "default_trireg_strength"
            | "delay_mode_distributed"
            | "delay_mode_path"
            | "delay_mode_unit"
            | "delay_mode_zero" => {
                // The lexer reads these (or refuses them precisely): pass the line on.
                let text = cur.since(line_start).to_vec();
                out.break_run();
                let mut q = p;
                for b in text {
                    out.push(b, q);
                    q.col += 1;
                }
                out.break_run();
                while !cur.done() && cur.peek(0) != b'\n' {
                    cur.copy_to(out);
                }
            }
            _ => self.use_macro(cur, out, p, name, depth),
        }
    }

    fn stray(&mut self, p: Pos, name: &str) {
        self.error(
            p,
            format!("`{name} without an open `ifdef or `ifndef"),
            "every `elsif, `else and `endif belongs to an `ifdef or `ifndef before it in the same file",
        );
    }

    fn include(&mut self, cur: &mut Cursor, out: &mut Mapped, p: Pos, depth: usize) {
        cur.skip_blanks();
        let close = match cur.peek(0) {
            b'"' => b'"',
            b'<' => b'>',
            _ => {
                self.error(
                    p,
                    "`include needs a file name in quotes",
                    "write e.g. `include \"defs.vh\"",
                );
                return;
            }
        };
        cur.bump();
        let start = cur.i;
        while !cur.done() && !matches!(cur.peek(0), b'\n') && cur.peek(0) != close {
            cur.bump();
        }
        let name = String::from_utf8_lossy(cur.since(start)).into_owned();
        if cur.peek(0) != close {
            self.error(
                p,
                "the file name of this `include is not closed",
                "write e.g. `include \"defs.vh\"",
            );
            return;
        }
        cur.bump();
        if depth >= MAX_DEPTH {
            self.error(
                p,
                format!("includes and macros nest deeper than {MAX_DEPTH} levels"),
                "look for a file that includes itself through others",
            );
            return;
        }
        let Some(path) = self.find_include(p, &name) else {
            let mut dirs: Vec<String> = Vec::new();
            if let Some(d) = self.dir_of(p) {
                let d = d.display().to_string();
                dirs.push(if d.is_empty() { ".".into() } else { d });
            }
            dirs.extend(
                self.opts
                    .include_dirs
                    .iter()
                    .map(|d| d.display().to_string()),
            );
            self.error(
                p,
                format!(
                    "cannot find the included file `{name}` (searched: {})",
                    if dirs.is_empty() {
                        ".".to_string()
                    } else {
                        dirs.join(", ")
                    }
                ),
                "give the directory that holds it with -I DIR",
            );
            self.include_failed = true;
            return;
        };
        let key = self.store.identity(&path);
        if self
            .open_files
            .iter()
            .any(|f| self.store.identity(f) == key)
        {
            let chain: Vec<String> = self
                .open_files
                .iter()
                .map(|f| f.display().to_string())
                .chain([path.display().to_string()])
                .collect();
            self.error(
                p,
                format!("include loop: {}", chain.join(" includes ")),
                "guard the header with `ifndef NAME / `define NAME / `endif, or remove the include",
            );
            return;
        }
        let text = match self.store.read_bytes(&path) {
            Ok(b) => match String::from_utf8(b) {
                Ok(t) => t,
                Err(_) => {
                    self.error(
                        p,
                        format!("the included file `{}` is not UTF-8 text", path.display()),
                        "save it as UTF-8 (or plain ASCII) text",
                    );
                    return;
                }
            },
            Err(e) => {
                self.error(
                    p,
                    format!("cannot read the included file `{}`: {e}", path.display()),
                    "check the file's permissions",
                );
                return;
            }
        };
        let k = self.files.len() as u32;
        self.files
            .push(Arc::from(path.display().to_string().as_str()));
        self.paths.push(path.clone());
        let start = [Mark {
            off: 0,
            pos: Pos {
                file: k,
                line: 1,
                col: 1,
            },
        }];
        self.open_files.push(path);
        out.break_run();
        self.run(&mut Cursor::new(text.as_bytes(), &start), out, depth + 1);
        out.break_run();
        self.open_files.pop();
    }

    /// The directory of the file that `p` is in (for includes relative to it).
    fn dir_of(&self, p: Pos) -> Option<PathBuf> {
        let f = self.paths.get(p.file as usize)?;
        f.parent().map(Path::to_path_buf)
    }

    /// IEEE 1364-2005 clause 19.5 leaves the search to the tool: an absolute name as is;
    /// else the including file's directory, then each `-I` directory in order.
    fn find_include(&self, p: Pos, name: &str) -> Option<PathBuf> {
        let n = Path::new(name);
        if n.is_absolute() {
            return self.store.is_file(n).then(|| n.to_path_buf());
        }
        let mut dirs: Vec<PathBuf> = self.dir_of(p).into_iter().collect();
        dirs.extend(self.opts.include_dirs.iter().cloned());
        dirs.into_iter()
            .map(|d| d.join(n))
            .find(|f| self.store.is_file(f))
    }
}
