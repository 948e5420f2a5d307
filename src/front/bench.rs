//! Reader for the ISCAS bench format: `INPUT(x)`, `OUTPUT(x)`, `y = GATE(a, b, ...)`, `#` comments.
//!
//! Gate keywords match in any case (AND NAND OR NOR XOR XNOR NOT BUF BUFF, `MUX(s, a, b)` for
//! `s ? a : b`, and the constants `y = VDD` and `y = GND`). Signals may be used
//! before they are defined; an output may also be an input. Names may contain any character but
//! white space and `( ) , = #`, so bit names such as `d[3]` are plain names here. All errors of a
//! file are collected; elaboration into the AIG is iterative, so a deep chain cannot overflow.

mod line;

use super::ReadError;
use crate::aig::{Aig, Lit};
use crate::design::{
    split_bit, Cell, CellKind, ClockEdge, Design, Format, InputBit, InputKind, Netlist, OutputBit,
    Register,
};
use crate::diag::{Diagnostic, InputError, SourcePos, Stage};
use crate::hash::FastMap;
use line::{col_of, parse_line, Stmt};
use std::sync::Arc;

/// Lines (and gates) between two looks at the stop condition while reading.
const POLL_EVERY: usize = 1 << 16;

/// A signal id (order of first mention) that is not yet defined.
const UNDEFINED: u32 = u32::MAX;

/// A place in the file: 1-based line and character column.
#[derive(Copy, Clone)]
struct Pos {
    line: u32,
    col: u32,
}

impl Pos {
    fn at(self, file: &Arc<str>) -> SourcePos {
        SourcePos::new(file, self.line, self.col)
    }
}

/// A gate as parsed, over interned signal ids; its fan-ins are `args[first..first + count]`.
struct GateDef {
    output: u32,
    kind: CellKind,
    first: u32,
    count: u32,
    pos: Pos,
}

/// Everything a bench file declares, with names interned: no string is kept per use, and the
/// names point into the text until the netlist's own copies are made.
struct Parsed<'t> {
    ids: FastMap<&'t str, u32>,
    inputs: Vec<(u32, Pos)>,
    outputs: Vec<(u32, Pos)>,
    gates: Vec<GateDef>,
    args: Vec<u32>,
    /// `q = DFF(d)` lines: (q, d); each q is also in `inputs` (the state cut).
    dffs: Vec<(u32, u32)>,
}

impl<'t> Parsed<'t> {
    fn id(&mut self, name: &'t str) -> u32 {
        let next = self.ids.len() as u32;
        *self.ids.entry(name).or_insert(next)
    }
}

/// Read a bench netlist from `text`; `file` is the name used in messages.
pub fn read_bench(file: &Arc<str>, text: &str) -> Result<Design, InputError> {
    read_bench_until(file, text, &|| false).map_err(|e| match e {
        ReadError::Input(e) => e,
        ReadError::Stopped(_) => unreachable!("no stop condition"),
    })
}

/// Read a bench netlist, looking at `stop` every 65,536 lines and gates; when it answers
/// true, reading ends with [`ReadError::Stopped`].
pub fn read_bench_until(
    file: &Arc<str>,
    text: &str,
    stop: &dyn Fn() -> bool,
) -> Result<Design, ReadError> {
    let read = || elaborate(file, parse_to_netlist(file, text, stop)?, stop);
    in_bench_stage(read())
}

/// [`read_bench_until`] taking the text, which is dropped as soon as the netlist holds its
/// own copies of the names (before the AIG is built), to lower the peak memory.
pub fn read_bench_text(
    file: &Arc<str>,
    text: String,
    stop: &dyn Fn() -> bool,
) -> Result<Design, ReadError> {
    let read = move || {
        let compact = parse_to_netlist(file, &text, stop)?;
        drop(text);
        elaborate(file, compact, stop)
    };
    in_bench_stage(read())
}

/// A bench reader's result with its diagnostics marked as made by the bench stage.
fn in_bench_stage(r: Result<Design, ReadError>) -> Result<Design, ReadError> {
    match r {
        Ok(mut d) => {
            for w in &mut d.warnings {
                w.stage = Stage::Bench;
            }
            Ok(d)
        }
        Err(ReadError::Input(e)) => Err(ReadError::Input(e.in_stage(Stage::Bench))),
        Err(stopped) => Err(stopped),
    }
}

/// The parse result without the text: the netlist as written plus the input and output
/// positions (signal, place) and the flip-flops (output signal, data signal).
type Compact = (Netlist, Vec<(u32, Pos)>, Vec<(u32, Pos)>, Vec<(u32, u32)>);

fn stopped(file: &Arc<str>) -> ReadError {
    ReadError::Stopped(file.to_string())
}

fn parse_to_netlist(
    file: &Arc<str>,
    text: &str,
    stop: &dyn Fn() -> bool,
) -> Result<Compact, ReadError> {
    // A UTF-8 byte-order mark (some editors write one) is not part of the first line.
    let text = text.strip_prefix('\u{feff}').unwrap_or(text);
    let mut p = Parsed {
        ids: FastMap::default(),
        inputs: Vec::new(),
        outputs: Vec::new(),
        gates: Vec::new(),
        args: Vec::new(),
        dffs: Vec::new(),
    };
    let mut errors = Vec::new();
    let mut fanin: Vec<(&str, usize)> = Vec::new();
    for (ln, raw) in text.lines().enumerate() {
        if ln % POLL_EVERY == POLL_EVERY - 1 && stop() {
            return Err(stopped(file));
        }
        let line_no = ln as u32 + 1;
        let line = match raw.find('#') {
            Some(i) => &raw[..i],
            None => raw,
        };
        if line.trim().is_empty() {
            continue;
        }
        let pos = |byte: usize| Pos {
            line: line_no,
            col: col_of(line, byte),
        };
        match parse_line(file, line_no, line, &mut fanin) {
            Err(d) => errors.push(d),
            Ok(_) if !errors.is_empty() => {}
            Ok(Stmt::Input(name, at)) => {
                let id = p.id(name);
                p.inputs.push((id, pos(at)));
            }
            Ok(Stmt::Output(name, at)) => {
                let id = p.id(name);
                p.outputs.push((id, pos(at)));
            }
            Ok(Stmt::Dff(name, at)) => {
                let q = p.id(name);
                let d = p.id(fanin[0].0);
                p.inputs.push((q, pos(at)));
                p.args.push(d);
                p.dffs.push((q, d));
            }
            Ok(Stmt::Gate(name, at, kind)) => {
                let output = p.id(name);
                let first = p.args.len() as u32;
                for &(a, _) in &fanin {
                    let id = p.id(a);
                    p.args.push(id);
                }
                p.gates.push(GateDef {
                    output,
                    kind,
                    first,
                    count: fanin.len() as u32,
                    pos: pos(at),
                });
            }
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
    if !errors.is_empty() {
        return Err(ReadError::Input(InputError {
            diagnostics: errors,
        }));
    }
    check_definitions(file, text, &p)?;
    if stop() {
        return Err(stopped(file));
    }
    // Netlist numbering: inputs first, then gates in file order.
    let Parsed {
        ids,
        inputs,
        outputs,
        gates,
        args,
        dffs,
    } = p;
    let mut number = vec![UNDEFINED; ids.len()];
    for (k, &(id, _)) in inputs.iter().enumerate() {
        number[id as usize] = k as u32;
    }
    for (g, gate) in gates.iter().enumerate() {
        number[gate.output as usize] = (inputs.len() + g) as u32;
    }
    let mut signals = vec![String::new(); inputs.len() + gates.len()];
    for (name, id) in ids {
        signals[number[id as usize] as usize] = name.to_string();
    }
    let cells: Vec<Cell> = gates
        .iter()
        .map(|g| Cell {
            kind: g.kind,
            inputs: args[g.first as usize..(g.first + g.count) as usize]
                .iter()
                .map(|&a| number[a as usize])
                .collect(),
            output: number[g.output as usize],
            pos: Some(g.pos.at(file)),
        })
        .collect();
    let inputs: Vec<(u32, Pos)> = inputs
        .iter()
        .map(|&(id, pos)| (number[id as usize], pos))
        .collect();
    let outputs: Vec<(u32, Pos)> = outputs
        .iter()
        .map(|&(id, pos)| (number[id as usize], pos))
        .collect();
    // A constant (`VDD`, `GND`) is a cell with no inputs, which cost and delay tables and the
    // Verilog writer do not describe: the netlist is then kept as partial, as the Verilog
    // reader keeps one whose gates read supply nets.
    let has_constant = cells.iter().any(|c: &Cell| c.inputs.is_empty());
    let netlist = Netlist {
        signals,
        cells,
        inputs: inputs.iter().map(|&(s, _)| s).collect(),
        outputs: outputs.iter().map(|&(s, _)| s).collect(),
        complete: !has_constant,
        register_inputs: dffs.iter().map(|&(_, d)| number[d as usize]).collect(),
    };
    let dffs = dffs
        .iter()
        .map(|&(q, d)| (number[q as usize], number[d as usize]))
        .collect();
    Ok((netlist, inputs, outputs, dffs))
}

/// Every signal defined once and every used signal defined; all such errors of the file.
fn check_definitions(file: &Arc<str>, text: &str, p: &Parsed<'_>) -> Result<(), InputError> {
    let mut errors = Vec::new();
    // Where each signal is defined (the first definition), and the later definitions.
    let mut def: Vec<Option<Pos>> = vec![None; p.ids.len()];
    let mut again: Vec<(u32, Pos, Pos)> = Vec::new();
    let defs = p.inputs.iter().copied();
    for (id, pos) in defs.chain(p.gates.iter().map(|g| (g.output, g.pos))) {
        match def[id as usize] {
            Some(first) => again.push((id, pos, first)),
            None => def[id as usize] = Some(pos),
        }
    }
    // Names by id, for messages (built only when there is something to report).
    let names = || {
        let mut v = vec![""; p.ids.len()];
        for (&n, &id) in &p.ids {
            v[id as usize] = n;
        }
        v
    };
    if !again.is_empty() {
        let names = names();
        for (id, pos, first) in again {
            errors.push(redefined(
                names[id as usize],
                &pos.at(file),
                &first.at(file),
            ));
        }
    }
    // An output declared twice would be paired twice in one design and refused in the other.
    let mut declared: Vec<Option<Pos>> = vec![None; p.ids.len()];
    let mut twice: Vec<(u32, Pos, Pos)> = Vec::new();
    for &(o, pos) in &p.outputs {
        match declared[o as usize] {
            Some(first) => twice.push((o, pos, first)),
            None => declared[o as usize] = Some(pos),
        }
    }
    if !twice.is_empty() {
        let names = names();
        for (o, pos, first) in twice {
            errors.push(output_twice(
                names[o as usize],
                &pos.at(file),
                &first.at(file),
            ));
        }
    }
    let undefined_args = p.args.iter().any(|&a| def[a as usize].is_none());
    let undefined_outputs = p.outputs.iter().any(|&(o, _)| def[o as usize].is_none());
    if undefined_args {
        // Positions of uses are not kept; read the gate lines again for them.
        let mut fanin = Vec::new();
        for (ln, raw) in text.lines().enumerate() {
            let line = raw.split('#').next().unwrap_or("");
            if let Ok(Stmt::Gate(..) | Stmt::Dff(..)) =
                parse_line(file, ln as u32 + 1, line, &mut fanin)
            {
                for &(a, at) in &fanin {
                    if def[p.ids[a] as usize].is_none() {
                        errors.push(undefined(
                            a,
                            &SourcePos::new(file, ln as u32 + 1, col_of(line, at)),
                        ));
                    }
                }
            }
        }
    }
    if undefined_outputs {
        let names = names();
        for &(o, pos) in &p.outputs {
            if def[o as usize].is_none() {
                errors.push(undefined(names[o as usize], &pos.at(file)));
            }
        }
    }
    if errors.is_empty() {
        Ok(())
    } else {
        Err(InputError {
            diagnostics: errors,
        })
    }
}

fn undefined(name: &str, pos: &SourcePos) -> Diagnostic {
    Diagnostic::error(
        Some(pos.clone()),
        format!("signal `{name}` is used but never defined"),
    )
    .with_help(format!(
        "declare it with `INPUT({name})` or define it with `{name} = GATE(...)`"
    ))
}

/// Build the AIG from the netlist as written: gates in dependency order with an explicit
/// stack (no recursion), so a deep chain cannot overflow.
fn elaborate(
    file: &Arc<str>,
    (netlist, in_pos, out_pos, dffs): Compact,
    stop: &dyn Fn() -> bool,
) -> Result<Design, ReadError> {
    let ni = netlist.inputs.len();
    let cells = &netlist.cells;
    let mut aig = Aig::new();
    // About 1.3 AND nodes per gate on random logic (5.2 million for 4 million gates); the hash
    // table grows once on XOR-heavy netlists, where twice the gates would waste memory
    // everywhere else.
    aig.reserve(cells.len() + cells.len() / 4);
    let mut inputs = Vec::with_capacity(ni);
    let mut is_register = vec![false; ni];
    for &(q, _) in &dffs {
        is_register[q as usize] = true;
    }
    for (k, &(s, pos)) in in_pos.iter().enumerate() {
        let lit = aig.add_input();
        debug_assert_eq!(lit, aig.input_lit(k));
        let name = &netlist.signals[s as usize];
        let (port, index) = split_bit(name);
        let mut bit = InputBit::port(port, index, Some(pos.at(file)));
        bit.name = name.clone();
        if is_register[s as usize] {
            bit.kind = InputKind::Register;
        }
        inputs.push(bit);
    }
    // Literal of every signal; a gate's is set once it is built.
    let mut lit: Vec<Option<Lit>> = (0..ni).map(|k| Some(aig.input_lit(k))).collect();
    lit.resize(ni + cells.len(), None);
    let mut on_stack = vec![false; cells.len()];
    let mut fanin = Vec::new();
    let mut built = 0usize;
    for start in 0..cells.len() {
        if lit[ni + start].is_some() {
            continue;
        }
        let mut stack: Vec<(usize, usize)> = vec![(start, 0)];
        on_stack[start] = true;
        while let Some(&mut (g, ref mut next)) = stack.last_mut() {
            let cell = &cells[g];
            if *next < cell.inputs.len() {
                let s = cell.inputs[*next] as usize;
                *next += 1;
                if s >= ni && lit[s].is_none() {
                    let h = s - ni;
                    if on_stack[h] {
                        let from = stack.iter().position(|&(x, _)| x == h).unwrap_or(0);
                        let names: Vec<&str> = stack[from..]
                            .iter()
                            .map(|&(x, _)| netlist.signals[ni + x].as_str())
                            .collect();
                        let pos = cells[h].pos.clone().unwrap_or(SourcePos::new(file, 1, 1));
                        return Err(ReadError::Input(cycle_error(&names, &pos)));
                    }
                    on_stack[h] = true;
                    stack.push((h, 0));
                }
                continue;
            }
            fanin.clear();
            fanin.extend(
                cell.inputs
                    .iter()
                    .map(|&s| lit[s as usize].expect("fan-in built before its gate")),
            );
            lit[ni + g] = Some(build_gate(&mut aig, cell.kind, &fanin));
            on_stack[g] = false;
            stack.pop();
            built += 1;
            if built.is_multiple_of(POLL_EVERY) && stop() {
                return Err(stopped(file));
            }
        }
    }
    drop(on_stack);
    let outputs: Vec<OutputBit> = out_pos
        .iter()
        .map(|&(s, pos)| {
            let name = &netlist.signals[s as usize];
            let (port, index) = split_bit(name);
            let l = lit[s as usize].expect("every gate is built");
            let mut bit = OutputBit::new(port, index, l, Some(pos.at(file)));
            bit.name = name.clone();
            bit
        })
        .collect();
    let registers = dff_registers(&inputs, &dffs, &lit);
    let design = Design {
        name: file.to_string(),
        format: Format::Bench,
        aig,
        inputs,
        outputs,
        netlist: Some(netlist),
        warnings: Vec::new(),
        registers,
        net_names: Default::default(),
    };
    design.debug_check();
    Ok(design)
}

/// The registers of `q = DFF(d)` lines: rising edge of the one implicit clock, no reset
/// (the published ISCAS-89 files define no initial state).
fn dff_registers(inputs: &[InputBit], dffs: &[(u32, u32)], lit: &[Option<Lit>]) -> Vec<Register> {
    dffs.iter()
        .map(|&(q, d)| {
            let b = &inputs[q as usize];
            Register {
                name: b.name.clone(),
                port: b.port.clone(),
                index: b.index,
                input: q as usize,
                next: lit[d as usize].expect("every signal is built"),
                clock: None,
                edge: ClockEdge::Rising,
                init: None,
                reset: None,
                pos: b.pos.clone(),
            }
        })
        .collect()
}

fn redefined(name: &str, pos: &SourcePos, first: &SourcePos) -> Diagnostic {
    Diagnostic::error(
        Some(pos.clone()),
        format!("signal `{name}` is defined twice (first at {first})"),
    )
    .with_help("every signal is an INPUT or the output of exactly one gate; rename one of them")
}

fn output_twice(name: &str, pos: &SourcePos, first: &SourcePos) -> Diagnostic {
    Diagnostic::error(
        Some(pos.clone()),
        format!("output `{name}` is declared twice (first at {first})"),
    )
    .with_help("declare each OUTPUT once; delete one of the two lines")
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

    /// Issue 13 D: a byte-order mark before the first line is accepted.
    #[test]
    fn a_byte_order_mark_is_skipped() {
        let d = read("\u{feff}INPUT(a)\nOUTPUT(y)\ny = NOT(a)\n").unwrap();
        assert_eq!(d.inputs.len(), 1);
        assert_eq!(d.outputs.len(), 1);
    }

    /// Issue 15 item 8: `MUX(s, a, b)` is `s ? a : b`; `VDD` and `GND` are 1 and 0, with or
    /// without `()`, in any case; the netlist with constants is kept as partial.
    #[test]
    fn mux_and_constants() {
        let text = "INPUT(s)\nINPUT(a)\nINPUT(b)\nOUTPUT(y)\nOUTPUT(one)\nOUTPUT(zero)\n\
                    y = MUX(s, a, b)\none = vdd\nzero = GND()\n";
        let d = read(text).unwrap();
        let roots: Vec<Lit> = d.outputs.iter().map(|o| o.lit).collect();
        for v in 0..8u32 {
            let ins = [v & 1 != 0, v & 2 != 0, v & 4 != 0];
            let out = crate::aig::eval(&d.aig, &ins, &roots);
            let want = if ins[0] { ins[1] } else { ins[2] };
            assert_eq!(out, vec![want, true, false], "s a b = {ins:?}");
        }
        assert!(!d.netlist.as_ref().unwrap().complete);
        let no_const = read("INPUT(s)\nINPUT(a)\nINPUT(b)\nOUTPUT(y)\ny = mux(s, a, b)\n").unwrap();
        assert!(no_const.netlist.as_ref().unwrap().complete);
    }

    #[test]
    fn mux_arity_and_constant_inputs_are_errors() {
        let e = read("INPUT(s)\nINPUT(a)\nOUTPUT(y)\ny = MUX(s, a)\n").unwrap_err();
        let t = e.to_string();
        assert!(
            t.contains("4:5") && t.contains("needs exactly 3 inputs"),
            "{t}"
        );
        assert!(t.contains("`y = MUX(s, a, b)` is `s ? a : b`"), "{t}");
        let e = read("INPUT(a)\nOUTPUT(y)\ny = VDD(a)\n")
            .unwrap_err()
            .to_string();
        assert!(e.contains("3:9") && e.contains("it takes no inputs"), "{e}");
    }

    /// Issue 13 A5: a duplicate OUTPUT line is an error naming both lines, whichever side.
    #[test]
    fn an_output_declared_twice_is_an_error() {
        let e = read("INPUT(a)\nOUTPUT(y)\nOUTPUT(y)\ny = NOT(a)\n").unwrap_err();
        let m = e.to_string();
        assert!(
            m.contains("t.bench:3:8: error: output `y` is declared twice (first at t.bench:2:8)"),
            "{m}"
        );
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

    /// A chain of `n` inverters after an input.
    fn chain(n: usize) -> String {
        let mut t = String::from("INPUT(q0)\nOUTPUT(y)\n");
        for i in 1..=n {
            t += &format!("q{i} = NOT(q{})\n", i - 1);
        }
        t + &format!("y = BUFF(q{n})\n")
    }

    #[test]
    fn the_stop_condition_ends_parsing_and_elaboration() {
        let text = chain(200_000);
        let file: Arc<str> = Arc::from("c.bench");
        // Stop conditions answering true on their k-th look: the parser looks every
        // 65,536 lines (three times here), once after the definitions are checked, and the
        // elaboration every 65,536 gates.
        for (k, phase) in [(1, "parse"), (4, "after the checks"), (5, "elaboration")] {
            let calls = std::cell::Cell::new(0);
            let stop = || {
                calls.set(calls.get() + 1);
                calls.get() >= k
            };
            match read_bench_until(&file, &text, &stop) {
                Err(ReadError::Stopped(f)) => assert_eq!(f, "c.bench"),
                Err(ReadError::Input(e)) => panic!("{phase}: {e}"),
                Ok(_) => panic!("{phase}: not stopped"),
            }
            assert_eq!(calls.get(), k, "{phase}");
        }
        let d = read_bench_until(&file, &text, &|| false).unwrap_or_else(|_| panic!("read"));
        assert_eq!(d.eval(&[true]), vec![true]);
    }

    #[test]
    fn undefined_uses_are_found_again_with_their_positions() {
        let e = read("INPUT(a)\nOUTPUT(y)\n  y = AND(a,  zz, ww)\nq = OR(zz, a)\nOUTPUT(r)\n")
            .unwrap_err();
        let s = e.to_string();
        let want = [
            "t.bench:3:15: error: signal `zz` is used but never defined",
            "t.bench:3:19: error: signal `ww` is used but never defined",
            "t.bench:4:8: error: signal `zz` is used but never defined",
            "t.bench:5:8: error: signal `r` is used but never defined",
        ];
        for w in want {
            assert!(s.contains(w), "{w}\n{s}");
        }
        assert_eq!(e.diagnostics.len(), 4, "{s}");
    }

    #[test]
    fn columns_count_characters() {
        let e = read("INPUT(é)\nOUTPUT(y)\ny = AND(é, ü)\n").unwrap_err();
        assert!(
            e.to_string()
                .contains("t.bench:3:12: error: signal `ü` is used but never defined"),
            "{e}"
        );
    }
}
