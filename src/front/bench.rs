//! Reader for the ISCAS bench format: `INPUT(x)`, `OUTPUT(x)`, `y = GATE(a, b, ...)`, `#` comments.
//!
//! Gate keywords match in any case (AND NAND OR NOR XOR XNOR NOT BUF BUFF). Signals may be used
//! before they are defined; an output may also be an input. Names may contain any character but
//! white space and `( ) , = #`, so bit names such as `d[3]` are plain names here. All errors of a
//! file are collected; elaboration into the AIG is iterative, so a deep chain cannot overflow.

use crate::aig::{Aig, Lit};
use crate::design::{split_bit, Cell, CellKind, Design, Format, InputBit, Netlist, OutputBit};
use crate::diag::{Diagnostic, InputError, SourcePos};
use std::collections::HashMap;
use std::sync::Arc;

/// A gate definition as parsed.
struct GateDef {
    kind: CellKind,
    inputs: Vec<(String, SourcePos)>,
    pos: SourcePos,
}

/// Everything a bench file declares.
#[derive(Default)]
struct Parsed {
    inputs: Vec<(String, SourcePos)>,
    outputs: Vec<(String, SourcePos)>,
    gates: Vec<(String, GateDef)>,
}

/// Read a bench netlist from `text`; `file` is the name used in messages.
pub fn read_bench(file: &Arc<str>, text: &str) -> Result<Design, InputError> {
    let parsed = parse(file, text)?;
    elaborate(file, parsed)
}

fn parse(file: &Arc<str>, text: &str) -> Result<Parsed, InputError> {
    let mut p = Parsed::default();
    let mut errors = Vec::new();
    for (ln, raw) in text.lines().enumerate() {
        let line_no = ln as u32 + 1;
        let line = match raw.find('#') {
            Some(i) => &raw[..i],
            None => raw,
        };
        if line.trim().is_empty() {
            continue;
        }
        if let Err(d) = parse_line(file, line_no, line, &mut p) {
            errors.push(d);
        }
    }
    if errors.is_empty() && p.outputs.is_empty() {
        let msg = if p.inputs.is_empty() && p.gates.is_empty() {
            "the file declares nothing: no INPUT, OUTPUT or gate lines"
        } else {
            "the design has no OUTPUT lines, so there is nothing to check"
        };
        errors.push(
            Diagnostic::error(Some(SourcePos::new(file, 1, 1)), msg).with_help(
                "a bench file needs lines such as `INPUT(a)`, `OUTPUT(y)` and `y = NAND(a, b)`",
            ),
        );
    }
    if errors.is_empty() {
        Ok(p)
    } else {
        Err(InputError {
            diagnostics: errors,
        })
    }
}

/// A cursor over one line that tracks the character column.
struct Cursor<'a> {
    file: &'a Arc<str>,
    line: u32,
    chars: Vec<char>,
    at: usize,
}

impl Cursor<'_> {
    fn pos(&self) -> SourcePos {
        SourcePos::new(self.file, self.line, self.at as u32 + 1)
    }
    fn skip_ws(&mut self) {
        while self.at < self.chars.len() && self.chars[self.at].is_whitespace() {
            self.at += 1;
        }
    }
    fn peek(&mut self) -> Option<char> {
        self.skip_ws();
        self.chars.get(self.at).copied()
    }
    fn name(&mut self) -> Option<(String, SourcePos)> {
        self.skip_ws();
        let pos = self.pos();
        let start = self.at;
        while self.at < self.chars.len() && is_name_char(self.chars[self.at]) {
            self.at += 1;
        }
        if self.at == start {
            None
        } else {
            Some((self.chars[start..self.at].iter().collect(), pos))
        }
    }
    fn expect(&mut self, c: char, what: &str) -> Result<(), Diagnostic> {
        match self.peek() {
            Some(x) if x == c => {
                self.at += 1;
                Ok(())
            }
            Some(x) => Err(Diagnostic::error(
                Some(self.pos()),
                format!("expected `{c}` {what}, found `{x}`"),
            )),
            None => Err(Diagnostic::error(
                Some(self.pos()),
                format!("expected `{c}` {what}, found the end of the line"),
            )),
        }
    }
    fn expect_end(&mut self) -> Result<(), Diagnostic> {
        if self.peek().is_none() {
            return Ok(());
        }
        let pos = self.pos();
        let rest: String = self.chars[self.at..]
            .iter()
            .take_while(|c| !c.is_whitespace())
            .take(20)
            .collect();
        Err(Diagnostic::error(
            Some(pos),
            format!("unexpected `{rest}` after the end of the statement"),
        )
        .with_help("write one statement per line; comments start with `#`"))
    }
}

fn is_name_char(c: char) -> bool {
    !c.is_whitespace() && !matches!(c, '(' | ')' | ',' | '=' | '#')
}

fn parse_line(file: &Arc<str>, line: u32, text: &str, p: &mut Parsed) -> Result<(), Diagnostic> {
    let mut cur = Cursor {
        file,
        line,
        chars: text.chars().collect(),
        at: 0,
    };
    let (first, first_pos) = cur.name().ok_or_else(|| {
        let c = cur.peek().unwrap_or(' ');
        Diagnostic::error(
            Some(cur.pos()),
            format!("unexpected `{c}` at the start of a statement"),
        )
        .with_help("statements are `INPUT(name)`, `OUTPUT(name)` or `name = GATE(a, b, ...)`")
    })?;
    match cur.peek() {
        Some('(') => {
            let upper = first.to_ascii_uppercase();
            if upper != "INPUT" && upper != "OUTPUT" {
                return Err(Diagnostic::error(
                    Some(first_pos),
                    format!("`{first}(...)` is not a declaration"),
                )
                .with_help("declarations are `INPUT(name)` and `OUTPUT(name)`; a gate is `name = GATE(a, b)`"));
            }
            cur.expect('(', "after the keyword")?;
            let (name, npos) = cur.name().ok_or_else(|| {
                Diagnostic::error(Some(cur.pos()), format!("{upper} needs a signal name"))
            })?;
            cur.expect(')', "to close the declaration")?;
            cur.expect_end()?;
            if upper == "INPUT" {
                p.inputs.push((name, npos));
            } else {
                p.outputs.push((name, npos));
            }
            Ok(())
        }
        Some('=') => {
            cur.at += 1;
            let (gname, gpos) = cur.name().ok_or_else(|| {
                Diagnostic::error(Some(cur.pos()), "expected a gate type after `=`")
                    .with_help("for example `y = NAND(a, b)`")
            })?;
            let kind = gate_kind(&gname).ok_or_else(|| unknown_gate(&gname, &gpos))?;
            cur.expect('(', "after the gate type")?;
            let mut inputs = Vec::new();
            if cur.peek() != Some(')') {
                loop {
                    let arg = cur.name().ok_or_else(|| {
                        Diagnostic::error(
                            Some(cur.pos()),
                            "expected a signal name in the gate's input list",
                        )
                    })?;
                    inputs.push(arg);
                    match cur.peek() {
                        Some(',') => cur.at += 1,
                        _ => break,
                    }
                }
            }
            cur.expect(')', "to close the gate's input list")?;
            cur.expect_end()?;
            check_arity(kind, &gname, inputs.len(), &gpos)?;
            p.gates.push((
                first,
                GateDef {
                    kind,
                    inputs,
                    pos: first_pos,
                },
            ));
            Ok(())
        }
        Some(c) => Err(Diagnostic::error(
            Some(cur.pos()),
            format!("expected `(` or `=` after `{first}`, found `{c}`"),
        )
        .with_help("statements are `INPUT(name)`, `OUTPUT(name)` or `name = GATE(a, b, ...)`")),
        None => Err(Diagnostic::error(
            Some(cur.pos()),
            format!("the statement ends after `{first}`"),
        )
        .with_help("statements are `INPUT(name)`, `OUTPUT(name)` or `name = GATE(a, b, ...)`")),
    }
}

fn gate_kind(name: &str) -> Option<CellKind> {
    Some(match name.to_ascii_uppercase().as_str() {
        "AND" => CellKind::And,
        "NAND" => CellKind::Nand,
        "OR" => CellKind::Or,
        "NOR" => CellKind::Nor,
        "XOR" => CellKind::Xor,
        "XNOR" => CellKind::Xnor,
        "NOT" => CellKind::Not,
        "BUF" | "BUFF" => CellKind::Buf,
        _ => return None,
    })
}

fn unknown_gate(name: &str, pos: &SourcePos) -> Diagnostic {
    let upper = name.to_ascii_uppercase();
    if upper == "DFF" || upper == "LATCH" {
        Diagnostic::error(
            Some(pos.clone()),
            format!("unsupported: sequential element `{name}`"),
        )
        .with_help("equicone checks combinational logic; cut the design at its flip-flops and check the logic between them")
    } else {
        Diagnostic::error(Some(pos.clone()), format!("unknown gate type `{name}`"))
            .with_help("known gates: AND NAND OR NOR XOR XNOR NOT BUF BUFF (any case)")
    }
}

fn check_arity(kind: CellKind, name: &str, n: usize, pos: &SourcePos) -> Result<(), Diagnostic> {
    let ok = match kind {
        CellKind::Not | CellKind::Buf => n == 1,
        _ => n >= 1,
    };
    if ok {
        return Ok(());
    }
    let want = match kind {
        CellKind::Not | CellKind::Buf => "exactly 1 input".to_string(),
        _ => "at least 1 input".to_string(),
    };
    Err(Diagnostic::error(
        Some(pos.clone()),
        format!("gate `{name}` has {n} inputs but needs {want}"),
    )
    .with_help(match kind {
        CellKind::Not | CellKind::Buf => {
            "an inverter or buffer takes one signal, e.g. `y = NOT(a)`"
        }
        _ => "list the gate's inputs, e.g. `y = AND(a, b)`",
    }))
}

/// Where a signal comes from.
#[derive(Copy, Clone)]
enum Source {
    Input(usize),
    Gate(usize),
}

fn elaborate(file: &Arc<str>, p: Parsed) -> Result<Design, InputError> {
    let mut errors = Vec::new();
    let mut def: HashMap<&str, (Source, &SourcePos)> =
        HashMap::with_capacity(p.inputs.len() + p.gates.len());
    for (k, (name, pos)) in p.inputs.iter().enumerate() {
        if let Some((_, first)) = def.insert(name, (Source::Input(k), pos)) {
            errors.push(redefined(name, pos, first));
        }
    }
    for (g, (name, gate)) in p.gates.iter().enumerate() {
        if let Some((_, first)) = def.get(name.as_str()) {
            errors.push(redefined(name, &gate.pos, first));
            continue;
        }
        def.insert(name, (Source::Gate(g), &gate.pos));
    }
    let undefined = |name: &str, pos: &SourcePos| {
        Diagnostic::error(
            Some(pos.clone()),
            format!("signal `{name}` is used but never defined"),
        )
        .with_help(format!(
            "declare it with `INPUT({name})` or define it with `{name} = GATE(...)`"
        ))
    };
    for (_, gate) in &p.gates {
        for (a, apos) in &gate.inputs {
            if !def.contains_key(a.as_str()) {
                errors.push(undefined(a, apos));
            }
        }
    }
    for (o, opos) in &p.outputs {
        if !def.contains_key(o.as_str()) {
            errors.push(undefined(o, opos));
        }
    }
    if !errors.is_empty() {
        return Err(InputError {
            diagnostics: errors,
        });
    }

    let mut aig = Aig::new();
    aig.reserve(p.gates.len() * 2);
    let mut inputs = Vec::with_capacity(p.inputs.len());
    let mut input_lits = Vec::with_capacity(p.inputs.len());
    for (name, pos) in &p.inputs {
        input_lits.push(aig.add_input());
        let (port, index) = split_bit(name);
        let mut bit = InputBit::port(port, index, Some(pos.clone()));
        bit.name = name.clone();
        inputs.push(bit);
    }
    // Gate literals, built in dependency order with an explicit stack (no recursion).
    let resolve = |name: &str| def[name].0;
    let mut lit: Vec<Option<Lit>> = vec![None; p.gates.len()];
    let mut on_stack = vec![false; p.gates.len()];
    let mut fanin = Vec::new();
    for start in 0..p.gates.len() {
        if lit[start].is_some() {
            continue;
        }
        let mut stack: Vec<(usize, usize)> = vec![(start, 0)];
        on_stack[start] = true;
        while let Some(&mut (g, ref mut next)) = stack.last_mut() {
            let gate = &p.gates[g].1;
            if *next < gate.inputs.len() {
                let arg = &gate.inputs[*next].0;
                *next += 1;
                if let Source::Gate(h) = resolve(arg) {
                    if lit[h].is_none() {
                        if on_stack[h] {
                            let from = stack.iter().position(|&(x, _)| x == h).unwrap_or(0);
                            let names: Vec<&str> = stack[from..]
                                .iter()
                                .map(|&(x, _)| p.gates[x].0.as_str())
                                .collect();
                            return Err(cycle_error(&names, &p.gates[h].1.pos));
                        }
                        on_stack[h] = true;
                        stack.push((h, 0));
                    }
                }
                continue;
            }
            fanin.clear();
            for (a, _) in &gate.inputs {
                fanin.push(match resolve(a) {
                    Source::Input(k) => input_lits[k],
                    Source::Gate(h) => lit[h].expect("fan-in built before its gate"),
                });
            }
            lit[g] = Some(build_gate(&mut aig, gate.kind, &fanin));
            on_stack[g] = false;
            stack.pop();
        }
    }
    let signal_lit = |name: &str| match resolve(name) {
        Source::Input(k) => input_lits[k],
        Source::Gate(g) => lit[g].expect("every gate is built"),
    };
    let outputs: Vec<OutputBit> = p
        .outputs
        .iter()
        .map(|(name, pos)| {
            let (port, index) = split_bit(name);
            let mut bit = OutputBit::new(port, index, signal_lit(name), Some(pos.clone()));
            bit.name = name.clone();
            bit
        })
        .collect();
    let netlist = build_netlist(&p, &def);
    let design = Design {
        name: file.to_string(),
        format: Format::Bench,
        aig,
        inputs,
        outputs,
        netlist: Some(netlist),
        warnings: Vec::new(),
    };
    design.debug_check();
    Ok(design)
}

fn redefined(name: &str, pos: &SourcePos, first: &SourcePos) -> Diagnostic {
    Diagnostic::error(
        Some(pos.clone()),
        format!("signal `{name}` is defined twice (first at {first})"),
    )
    .with_help("every signal is an INPUT or the output of exactly one gate; rename one of them")
}

fn cycle_error(names: &[&str], pos: &SourcePos) -> InputError {
    let mut ring: Vec<&str> = names.to_vec();
    ring.push(names[0]);
    InputError::one(
        Diagnostic::error(
            Some(pos.clone()),
            format!("combinational cycle through {} signals: {}", names.len(), ring.join(" -> ")),
        )
        .with_help("equicone checks combinational logic; break the loop (a loop through a latch or flip-flop must be cut)"),
    )
}

/// The AIG literal of one gate over its fan-in literals.
pub fn build_gate(aig: &mut Aig, kind: CellKind, fanin: &[Lit]) -> Lit {
    match kind {
        CellKind::And => aig.and_all(fanin),
        CellKind::Nand => !aig.and_all(fanin),
        CellKind::Or => aig.or_all(fanin),
        CellKind::Nor => !aig.or_all(fanin),
        CellKind::Xor => aig.xor_all(fanin),
        CellKind::Xnor => !aig.xor_all(fanin),
        CellKind::Not => !fanin[0],
        CellKind::Buf => fanin[0],
        CellKind::Mux2 => aig.mux(fanin[0], fanin[1], fanin[2]),
    }
}

fn build_netlist(p: &Parsed, def: &HashMap<&str, (Source, &SourcePos)>) -> Netlist {
    let mut signals: Vec<String> = p.inputs.iter().map(|(n, _)| n.clone()).collect();
    signals.extend(p.gates.iter().map(|(n, _)| n.clone()));
    let id = |name: &str| -> u32 {
        match def[name].0 {
            Source::Input(k) => k as u32,
            Source::Gate(g) => (p.inputs.len() + g) as u32,
        }
    };
    let cells = p
        .gates
        .iter()
        .enumerate()
        .map(|(g, (_, gate))| Cell {
            kind: gate.kind,
            inputs: gate.inputs.iter().map(|(a, _)| id(a)).collect(),
            output: (p.inputs.len() + g) as u32,
            pos: Some(gate.pos.clone()),
        })
        .collect();
    Netlist {
        signals,
        cells,
        inputs: (0..p.inputs.len() as u32).collect(),
        outputs: p.outputs.iter().map(|(n, _)| id(n)).collect(),
        complete: true,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn read(text: &str) -> Result<Design, InputError> {
        read_bench(&Arc::from("t.bench"), text)
    }

    #[test]
    fn reads_gates_in_any_order_and_case() {
        let d = read("OUTPUT(y)\ny = nand(a, t)\nt = Xor(a, b) # comment\nINPUT(a)\nINPUT(b)\n")
            .unwrap();
        for v in 0..4u32 {
            let (a, b) = (v & 1 == 1, v & 2 == 2);
            assert_eq!(d.eval(&[a, b]), vec![!(a & (a ^ b))]);
        }
    }

    #[test]
    fn output_may_be_an_input() {
        let d = read("INPUT(a)\nOUTPUT(a)\n").unwrap();
        assert_eq!(d.eval(&[true]), vec![true]);
    }

    #[test]
    fn cycle_is_reported_with_its_signals() {
        let e = read("INPUT(a)\nOUTPUT(y)\ny = AND(a, z)\nz = NOT(y)\n").unwrap_err();
        let s = e.to_string();
        assert!(
            s.contains("t.bench:3:1: error: combinational cycle through 2 signals: y -> z -> y"),
            "{s}"
        );
    }

    #[test]
    fn collects_several_errors() {
        let e = read("INPUT(a)\nOUTPUT(y)\ny = FOO(a)\nq = NOT(a, a)\n").unwrap_err();
        assert_eq!(e.diagnostics.len(), 2, "{e}");
        let s = e.to_string();
        assert!(
            s.contains("t.bench:3:5: error: unknown gate type `FOO`"),
            "{s}"
        );
        assert!(
            s.contains("t.bench:4:5: error: gate `NOT` has 2 inputs but needs exactly 1 input"),
            "{s}"
        );
    }
}
