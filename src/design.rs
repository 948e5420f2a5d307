//! A design after reading: its AIG, the names of its input and output bits, the gate-level
//! netlist as written (for cost and delay), and where each name came from.
//!
//! **Invariant:** AIG input `k` is `inputs[k]`; every output literal refers to this design's AIG.

use crate::aig::{Aig, Lit};
use crate::diag::{Diagnostic, SourcePos};
use serde::Serialize;

/// What an AIG input stands for.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case", tag = "kind")]
pub enum InputKind {
    /// A bit of a primary input port; paired with the other design's input of the same name.
    Port,
    /// An unknown value (`x`/`z` literal, out-of-range select) at this place in the source,
    /// modelled as a free input of this design only: the other design must match whatever it is.
    Unknown {
        /// Where the unknown value arises.
        pos: SourcePos,
        /// What produces it, e.g. "out-of-range select d[s]".
        what: String,
    },
    /// The current value of a register bit (the state cut): `registers[k].input` names it.
    Register,
}

/// One input bit.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct InputBit {
    /// The bit's name: `name` for a scalar, `name[i]` for a bit of a bus.
    pub name: String,
    /// The port (bus) name without the index.
    pub port: String,
    /// The bit index within the bus, for a vector port.
    pub index: Option<i64>,
    /// Port bit or unknown value.
    pub kind: InputKind,
    /// Where the port is declared.
    pub pos: Option<SourcePos>,
}

impl InputBit {
    /// A port bit named `name` (scalar) or `port[index]`.
    pub fn port(port: &str, index: Option<i64>, pos: Option<SourcePos>) -> InputBit {
        InputBit {
            name: bit_name(port, index),
            port: port.to_string(),
            index,
            kind: InputKind::Port,
            pos,
        }
    }

    /// Whether this is an unknown-value source rather than a port bit.
    pub fn is_unknown(&self) -> bool {
        matches!(self.kind, InputKind::Unknown { .. })
    }
}

/// One output bit.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct OutputBit {
    /// The bit's name: `name` for a scalar, `name[i]` for a bit of a bus.
    pub name: String,
    /// The port (bus) name without the index.
    pub port: String,
    /// The bit index within the bus, for a vector port.
    pub index: Option<i64>,
    /// The function of the bit in the design's AIG.
    #[serde(skip)]
    pub lit: Lit,
    /// Where the port is declared.
    pub pos: Option<SourcePos>,
}

impl OutputBit {
    /// An output bit named `name` (scalar) or `port[index]` driven by `lit`.
    pub fn new(port: &str, index: Option<i64>, lit: Lit, pos: Option<SourcePos>) -> OutputBit {
        OutputBit {
            name: bit_name(port, index),
            port: port.to_string(),
            index,
            lit,
            pos,
        }
    }
}

/// `port` or `port[index]`.
pub fn bit_name(port: &str, index: Option<i64>) -> String {
    match index {
        Some(i) => format!("{port}[{i}]"),
        None => port.to_string(),
    }
}

/// `N'h...` of bits given most significant first, digits grouped by four with `_` (the form
/// counterexamples and trace tables print beside wide buses).
pub fn hex_text(bits: &[bool]) -> String {
    let n = bits.len();
    let digits: Vec<char> = (0..n.div_ceil(4))
        .rev()
        .map(|d| {
            // Digit d covers bits 4d..4d+3 counted from the least significant end.
            let v = (0..4)
                .filter(|&j| 4 * d + j < n && bits[n - 1 - (4 * d + j)])
                .fold(0u32, |acc, j| acc | 1 << j);
            char::from_digit(v, 16).expect("a hexadecimal digit")
        })
        .collect();
    let mut s = format!("{n}'h");
    for (i, c) in digits.iter().enumerate() {
        if i > 0 && (digits.len() - i).is_multiple_of(4) {
            s.push('_');
        }
        s.push(*c);
    }
    s
}

/// Split a bit name `d[12]` into (`d`, 12); anything else is a scalar.
pub fn split_bit(name: &str) -> (&str, Option<i64>) {
    if let Some(open) = name.rfind('[') {
        if name.ends_with(']') && open > 0 {
            if let Ok(i) = name[open + 1..name.len() - 1].parse::<i64>() {
                return (&name[..open], Some(i));
            }
        }
    }
    (name, None)
}

/// Gate types of the netlist as written.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum CellKind {
    /// AND of its inputs.
    And,
    /// NAND of its inputs.
    Nand,
    /// OR of its inputs.
    Or,
    /// NOR of its inputs.
    Nor,
    /// XOR (odd parity) of its inputs.
    Xor,
    /// XNOR (even parity) of its inputs.
    Xnor,
    /// Inverter.
    Not,
    /// Buffer.
    Buf,
    /// 2:1 selector cell: inputs `[s, t, e]`, output `s ? t : e`.
    Mux2,
}

impl CellKind {
    /// Lower-case name, as in cost-model files and reports.
    pub fn name(self) -> &'static str {
        match self {
            CellKind::And => "and",
            CellKind::Nand => "nand",
            CellKind::Or => "or",
            CellKind::Nor => "nor",
            CellKind::Xor => "xor",
            CellKind::Xnor => "xnor",
            CellKind::Not => "not",
            CellKind::Buf => "buf",
            CellKind::Mux2 => "mux2",
        }
    }

    /// All kinds, in report order.
    pub const ALL: [CellKind; 9] = [
        CellKind::And,
        CellKind::Nand,
        CellKind::Or,
        CellKind::Nor,
        CellKind::Xor,
        CellKind::Xnor,
        CellKind::Not,
        CellKind::Buf,
        CellKind::Mux2,
    ];
}

/// One gate of the netlist as written.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct Cell {
    /// Gate type.
    pub kind: CellKind,
    /// Fan-in signals (indices into [`Netlist::signals`]).
    pub inputs: Vec<u32>,
    /// The driven signal.
    pub output: u32,
    /// Where the gate is written.
    pub pos: Option<SourcePos>,
}

/// The gate-level netlist as written, for cost and delay. Front-ends that read behavioural
/// code describe only what maps to gates one to one; [`Netlist::complete`] says whether this
/// is the whole design.
#[derive(Clone, Debug, Default, PartialEq, Eq, Serialize)]
pub struct Netlist {
    /// Signal names.
    pub signals: Vec<String>,
    /// Gates, in any order.
    pub cells: Vec<Cell>,
    /// Signals that are primary inputs.
    pub inputs: Vec<u32>,
    /// Signals that are primary outputs.
    pub outputs: Vec<u32>,
    /// True when every gate of the design is in `cells` (a pure gate-level netlist).
    pub complete: bool,
    /// The signal each register of the design loads (its input), in the order of
    /// [`Design::registers`]; empty when the front-end does not name them.
    pub register_inputs: Vec<u32>,
}

/// The input format of a file.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Format {
    /// ISCAS bench format.
    Bench,
    /// IEEE 1364 Verilog subset.
    Verilog,
}

/// A design ready for checking.
#[derive(Clone, Debug)]
pub struct Design {
    /// How reports name the design (the file name, or the top module and file).
    pub name: String,
    /// The format it was read from.
    pub format: Format,
    /// The logic.
    pub aig: Aig,
    /// Input bits; `inputs[k]` is AIG input `k`.
    pub inputs: Vec<InputBit>,
    /// Output bits, in declaration order.
    pub outputs: Vec<OutputBit>,
    /// The netlist as written, when the front-end keeps one.
    pub netlist: Option<Netlist>,
    /// Warnings found while reading (e.g. width changes at port connections).
    pub warnings: Vec<Diagnostic>,
    /// Register bits (empty for combinational designs); see [`Register`].
    pub registers: Vec<Register>,
    /// AND nodes of `aig` (by node index) named after the nets that carry them, in declaration
    /// order, `~w` for a node that is net `w` inverted: kept by the Verilog reader when there
    /// is no complete netlist as written (RTL), for pictures of the logic (`cone --dot`);
    /// empty otherwise. The AIG itself holds no names.
    pub net_names: std::collections::BTreeMap<u32, Vec<String>>,
}

/// The clock edge a register samples on.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum ClockEdge {
    /// `posedge`, and the implicit clock of a bench `DFF`.
    Rising,
    /// `negedge`.
    Falling,
}

/// How a register is reset: by a port bit, active high or low, synchronously or not.
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct RegisterReset {
    /// The reset port bit (an input of kind [`InputKind::Port`]).
    pub input: usize,
    /// The port value that resets.
    pub active: bool,
    /// Asynchronous (in the event list) rather than synchronous.
    pub asynchronous: bool,
}

/// One register bit, cut into logic: AIG input `input` carries its current value and `next`
/// its value after the clock edge (enables and synchronous reset folded in).
#[derive(Clone, Debug, PartialEq, Eq, Serialize)]
pub struct Register {
    /// The bit's name: `q` or `q[3]`.
    pub name: String,
    /// The variable (bus) name without the index.
    pub port: String,
    /// The bit index, for a vector register.
    pub index: Option<i64>,
    /// The AIG input holding the current value.
    pub input: usize,
    /// The next value.
    #[serde(skip)]
    pub next: Lit,
    /// The clock's name (`None`: the one implicit clock of a bench file).
    pub clock: Option<String>,
    /// The edge it samples on.
    pub edge: ClockEdge,
    /// The value reset gives it; `None`: no reset, a free initial value.
    pub init: Option<bool>,
    /// Its reset, if any.
    pub reset: Option<RegisterReset>,
    /// Where it is declared.
    pub pos: Option<SourcePos>,
}

impl Design {
    /// Ports (inputs and outputs) declared with an ascending range in Verilog (`[0:7]`: the
    /// lowest index is the most significant bit). The Verilog reader lists the bits of every
    /// port from the least significant, so these are the ports whose first two bits listed
    /// have falling indices. Bench names carry no declared range: none.
    pub fn ascending_ports(&self) -> std::collections::BTreeSet<String> {
        let mut out = std::collections::BTreeSet::new();
        if self.format != Format::Verilog {
            return out;
        }
        let mut first: std::collections::BTreeMap<&str, (i64, bool)> = Default::default();
        let bits = self
            .inputs
            .iter()
            .filter(|b| !b.is_unknown())
            .map(|b| (b.port.as_str(), b.index))
            .chain(self.outputs.iter().map(|o| (o.port.as_str(), o.index)));
        for (port, index) in bits {
            let Some(i) = index else { continue };
            match first.get_mut(port) {
                None => {
                    first.insert(port, (i, false));
                }
                Some((f, seen)) if !*seen => {
                    *seen = true;
                    if i < *f {
                        out.insert(port.to_string());
                    }
                }
                Some(_) => {}
            }
        }
        out
    }

    /// Index of the input bit named `name`.
    pub fn input_index(&self, name: &str) -> Option<usize> {
        self.inputs.iter().position(|b| b.name == name)
    }

    /// Index of the output bit named `name`.
    pub fn output_index(&self, name: &str) -> Option<usize> {
        self.outputs.iter().position(|b| b.name == name)
    }

    /// Number of port input bits (unknown-value sources and register bits not counted).
    pub fn num_port_inputs(&self) -> usize {
        self.inputs
            .iter()
            .filter(|b| matches!(b.kind, InputKind::Port))
            .count()
    }

    /// Whether the design has registers (a clocked design).
    pub fn is_clocked(&self) -> bool {
        !self.registers.is_empty()
    }

    /// Evaluate every output for one assignment of the AIG inputs.
    pub fn eval(&self, inputs: &[bool]) -> Vec<bool> {
        let roots: Vec<Lit> = self.outputs.iter().map(|o| o.lit).collect();
        crate::aig::eval(&self.aig, inputs, &roots)
    }

    /// Check the design's invariants (debug builds only).
    pub fn debug_check(&self) {
        #[cfg(debug_assertions)]
        {
            self.aig.check();
            assert_eq!(
                self.aig.num_inputs(),
                self.inputs.len(),
                "input table out of sync"
            );
            for o in &self.outputs {
                assert!(
                    o.lit.index() < self.aig.len(),
                    "output {} out of range",
                    o.name
                );
            }
        }
    }
}
