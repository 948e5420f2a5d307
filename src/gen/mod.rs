//! Circuit generators of `equicone gen`: selectors, decoders, priority encoders, barrel
//! shifters, adders, multipliers and random circuits, each in several styles, written as
//! readable Verilog or bench, deterministic for a seed, optionally with one planted bug.
//!
//! Port conventions (the same names in every style of a kind, so `prove` pairs them by name;
//! bit `i` of bus `d` is `d[i]` in Verilog and in bench):
//!
//! | kind | `--n` | inputs | outputs |
//! | --- | --- | --- | --- |
//! | selector | channels N >= 2 | `d[N*W-1:0]` (channel i at `d[i*W +: W]`), `s[K-1:0]`, K = ceil(log2 N) | `y[W-1:0]` = channel `s` |
//! | decoder | select bits k >= 1 | `a[k-1:0]` | `y[2^k-1:0]`, `y[i]` = (a == i) |
//! | priority | requests N >= 2 | `r[N-1:0]` | `y[K-1:0]` = highest i with `r[i]` (0 if none), `v` = any request |
//! | shifter | data bits n >= 2 | `a[n-1:0]`, `s[K-1:0]`, K = ceil(log2 n) | `y[n-1:0]` = `a << s` (zeros shifted in) |
//! | adder | operand bits n >= 1 | `a[n-1:0]`, `b[n-1:0]` | `y[n:0]` = a + b |
//! | multiplier | operand bits n >= 2 | `a[n-1:0]`, `b[n-1:0]` | `p[2n-1:0]` = a * b (`--signed`: two's complement) |
//! | mac | operand bits n >= 2 | `a[n-1:0]`, `b[n-1:0]`, `c[2n-1:0]` | `p[2n-1:0]` = a * b + c (modulo 2^2n) |
//! | squarer | operand bits n >= 2 | `a[n-1:0]` | `p[2n-1:0]` = a * a |
//! | random | gates | `x[I-1:0]` (`--inputs` I) | `y[..]`: every gate without fan-out |
//! | popcount | inputs n >= 2 | `x[n-1:0]` | `y[K-1:0]` = number of ones, K = ceil(log2(n+1)) |
//! | majority | inputs n >= 3 | `x[n-1:0]` | `y` = at least n/2+1 inputs are 1 |
//! | recursive-majority | inputs n = 3^L | `x[n-1:0]` | `y`: majority of three, level by level |
//! | comparator | operand bits n >= 1 | `a[n-1:0]`, `b[n-1:0]` | `lt`, `eq`, `gt` (unsigned) |
//! | divider | operand bits n >= 2 | `a[n-1:0]`, `b[n-1:0]` | `q[n-1:0]` = a / b, `r[n-1:0]` = a % b (b = 0: q all ones, r = a) |
//! | sqrt | root bits n >= 1 | `a[2n-1:0]` | `s[n-1:0]` = floor(sqrt(a)), `r[n:0]` = a - s*s |
//! | arbiter | requesters n >= 2 | `r[n-1:0]`, `p[n-1:0]` | `g[n-1:0]` grants (round robin from the pointer), `v` |
//!
//! `remap` is not built from a size: `equicone gen remap DESIGN --k K` rewrites a design
//! ([`remap::remap`]).
//!
//! A selector whose N is not a power of two leaves select values N..2^K-1 out of range: the
//! spec reads x there (IEEE 1364-2005), gate-level styles give whatever their structure gives,
//! and [`emit::Care`] records the condition so checks only compare in-range vectors.
//!
//! The spec style is a behavioural one-liner in Verilog (`assign y = d[s];`, `assign y = a + b;`,
//! `assign p = a * b;`, ...). Bench has no operators, so in bench the spec style is written as
//! gates: selector as the decoder AND-OR (0 out of range), decoder flat, priority encoder as
//! the chain, shifter as the log shifter, adder as the ripple adder, multiplier as the array.

pub mod clocked;
pub mod emit;
pub mod mutate;
pub mod remap;
pub mod set;

mod arbiter;
mod arith;
mod count;
mod decoder;
mod divide;
mod fold;
pub mod mult;
mod random;
mod selector;
mod shifter;

pub use emit::{Circuit, Net, Op};

use std::fmt;

/// What to generate.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub enum Kind {
    /// N:1 selector of W-bit channels.
    Selector,
    /// k-to-2^k decoder.
    Decoder,
    /// Priority encoder (the highest set request wins).
    Priority,
    /// Barrel shifter (logical left shift).
    Shifter,
    /// Adder of two n-bit numbers.
    Adder,
    /// Multiplier of two n-bit numbers (unsigned, or signed with `--signed`).
    Multiplier,
    /// Multiply-accumulate: a * b + c.
    Mac,
    /// Squarer: a * a.
    Squarer,
    /// Random gate-level circuit (and its locally rewritten copy).
    Random,
    /// Population count (number of ones).
    Popcount,
    /// Majority of n inputs.
    Majority,
    /// Recursive majority of three (n a power of 3).
    RecursiveMajority,
    /// Unsigned magnitude comparator (lt, eq, gt).
    Comparator,
    /// Unsigned divider (quotient and remainder).
    Divider,
    /// Integer square root (root and remainder).
    Sqrt,
    /// Round-robin arbiter.
    Arbiter,
    /// K-input lookup-function rewrite of a design file (`gen remap DESIGN --k K`).
    Remap,
    /// Clocked: N:1 selector of 1-bit channels with a registered output.
    RegSelector,
    /// Clocked: n-bit ripple adder cut into `--stages` register stages.
    PipeAdder,
    /// Clocked: n-bit counter with enable.
    Counter,
    /// Clocked: n-bit shift register.
    ShiftRegister,
    /// Clocked: state machine of n states (styles onehot and binary, same behaviour).
    Fsm,
    /// Clocked: random circuit of n gates and n/50 registers with a 5-register delay line
    /// (`--bug invert`: the delay line stores its input inverted, seen first at cycle 5).
    RegRandom,
}

impl Kind {
    /// Command-line spelling.
    pub fn name(self) -> &'static str {
        match self {
            Kind::Selector => "selector",
            Kind::Decoder => "decoder",
            Kind::Priority => "priority",
            Kind::Shifter => "shifter",
            Kind::Adder => "adder",
            Kind::Multiplier => "multiplier",
            Kind::Mac => "mac",
            Kind::Squarer => "squarer",
            Kind::Random => "random",
            Kind::Popcount => "popcount",
            Kind::Majority => "majority",
            Kind::RecursiveMajority => "recursive-majority",
            Kind::Comparator => "comparator",
            Kind::Divider => "divider",
            Kind::Sqrt => "sqrt",
            Kind::Arbiter => "arbiter",
            Kind::Remap => "remap",
            Kind::RegSelector => "reg-selector",
            Kind::PipeAdder => "pipe-adder",
            Kind::Counter => "counter",
            Kind::ShiftRegister => "shift-register",
            Kind::Fsm => "fsm",
            Kind::RegRandom => "reg-random",
        }
    }

    /// The styles this kind offers; the first is the default.
    pub fn styles(self) -> &'static [Style] {
        use Style::*;
        match self {
            Kind::Selector => &[Spec, Decoder, Tree, Onehot, Mixed],
            Kind::Decoder => &[Spec, Flat, Predecode],
            Kind::Priority => &[Spec, Chain, Tree],
            Kind::Shifter => &[Spec, Log, Decoder],
            Kind::Adder => &[Spec, Ripple, Cla, KoggeStone, BrentKung],
            Kind::Multiplier | Kind::Mac => &[Spec, Array, Wallace, Dadda, Booth],
            Kind::Squarer => &[Spec, Array, Wallace, Dadda],
            Kind::Random => &[Plain, Rewritten],
            Kind::Popcount => &[AdderTree, Csa],
            Kind::Majority => &[Sorting, AdderTree],
            Kind::RecursiveMajority => &[Sop, Select],
            Kind::Comparator => &[Spec, Ripple, Tree],
            Kind::Divider => &[Restoring, NonRestoring],
            Kind::Sqrt => &[Restoring, NonRestoring],
            Kind::Arbiter => &[Chain, KoggeStone],
            Kind::Remap => &[Plain],
            Kind::RegSelector | Kind::PipeAdder | Kind::Counter | Kind::ShiftRegister => &[Plain],
            Kind::Fsm => &[Onehot, Binary],
            Kind::RegRandom => &[Plain],
        }
    }
}

/// How to build it. Each kind accepts the styles of [`Kind::styles`].
#[derive(Copy, Clone, Debug, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub enum Style {
    /// Behavioural one-liner (Verilog); a documented gate form in bench.
    Spec,
    /// Selector: decoder-driven AND-OR (wide decoder ANDs, OR trees of fan-in 4).
    /// Shifter: decoded shift amount driving an AND-OR per output bit.
    Decoder,
    /// Selector: tree of 2:1 cells (N-1 cells per bit, depth ceil(log2 N)).
    /// Priority: tree of (valid, index) pairs merged with 2:1 cells.
    Tree,
    /// Selector: separate predecoded one-hot decoder, then AND-OR with 2-input OR trees.
    Onehot,
    /// Selector: a 2:1-cell tree on some select bits and a decoder AND-OR on the others
    /// (split and order chosen by the seed).
    Mixed,
    /// Decoder: one k-input AND per output over shared inverters.
    Flat,
    /// Decoder: split the select bits in halves, decode each, AND the pairs (recursively).
    Predecode,
    /// Priority: a chain of "some higher request" ORs.
    Chain,
    /// Shifter: ceil(log2 n) levels of 2:1 cells.
    Log,
    /// Adder: ripple carry.
    Ripple,
    /// Adder: carry lookahead in 4-bit groups, hierarchically.
    Cla,
    /// Adder: Kogge-Stone parallel prefix.
    KoggeStone,
    /// Adder: Brent-Kung parallel prefix.
    BrentKung,
    /// Multiplier: array of rows of ripple-carry adders.
    Array,
    /// Multiplier: Wallace carry-save tree and a final adder (`--final-adder`, ripple by default).
    Wallace,
    /// Multiplier: Dadda carry-save tree and a final adder (`--final-adder`, ripple by default).
    Dadda,
    /// Multiplier: radix-4 Booth partial products, a Dadda tree and a final adder.
    Booth,
    /// Random: the random circuit as drawn.
    Plain,
    /// Random: the same circuit after local equivalent rewrites.
    Rewritten,
    /// Popcount, majority: a balanced tree of ripple-carry adders (majority: then a comparison).
    AdderTree,
    /// Popcount: carry-save compression of the weight columns.
    Csa,
    /// Majority: Batcher odd-even merge sorting network.
    Sorting,
    /// Recursive majority: maj(a, b, c) as a&b | a&c | b&c.
    Sop,
    /// Recursive majority: maj(a, b, c) as (a ^ b) ? c : a.
    Select,
    /// Divider, square root: restoring digit recurrence.
    Restoring,
    /// Divider, square root: non-restoring digit recurrence.
    NonRestoring,
    /// State machine: binary state encoding.
    Binary,
}

impl Style {
    /// Command-line spelling.
    pub fn name(self) -> &'static str {
        match self {
            Style::Spec => "spec",
            Style::Decoder => "decoder",
            Style::Tree => "tree",
            Style::Onehot => "onehot",
            Style::Mixed => "mixed",
            Style::Flat => "flat",
            Style::Predecode => "predecode",
            Style::Chain => "chain",
            Style::Log => "log",
            Style::Ripple => "ripple",
            Style::Cla => "cla",
            Style::KoggeStone => "kogge-stone",
            Style::BrentKung => "brent-kung",
            Style::Array => "array",
            Style::Wallace => "wallace",
            Style::Dadda => "dadda",
            Style::Booth => "booth",
            Style::Plain => "plain",
            Style::Rewritten => "rewritten",
            Style::AdderTree => "adder-tree",
            Style::Csa => "csa",
            Style::Sorting => "sorting",
            Style::Sop => "sop",
            Style::Select => "select",
            Style::Restoring => "restoring",
            Style::NonRestoring => "non-restoring",
            Style::Binary => "binary",
        }
    }
}

/// A planted bug.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub enum Bug {
    /// Exchange two wires: the data inputs of a 2:1 cell, or one fan-in each of two gates of
    /// the same type.
    Swap,
    /// A net stuck at 0.
    Stuck0,
    /// A net stuck at 1.
    Stuck1,
    /// A gate's output inverted.
    Invert,
    /// One fan-in of a gate connected to the wrong net.
    Misroute,
    /// Multiplier family: one partial product takes the wrong operand bit.
    PpBit,
    /// Multiplier family: one adder cell's sum and carry exchanged.
    SwapCarry,
    /// Booth multipliers: one row's sign bit enters without its inversion.
    BoothSign,
}

impl Bug {
    /// Command-line spelling.
    pub fn name(self) -> &'static str {
        match self {
            Bug::Swap => "swap",
            Bug::Stuck0 => "stuck0",
            Bug::Stuck1 => "stuck1",
            Bug::Invert => "invert",
            Bug::Misroute => "misroute",
            Bug::PpBit => "pp-bit",
            Bug::SwapCarry => "swap-carry",
            Bug::BoothSign => "booth-sign",
        }
    }
}

/// Output format.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Hash)]
pub enum GenFormat {
    /// IEEE 1364-2005 Verilog.
    Verilog,
    /// ISCAS bench.
    Bench,
}

/// Everything that determines a generated circuit.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct GenSpec {
    /// What to generate.
    pub kind: Kind,
    /// How to build it.
    pub style: Style,
    /// The size; its meaning depends on the kind (see the module documentation).
    pub n: usize,
    /// Selector channel width W (1 for every other kind).
    pub width: usize,
    /// Random circuits: number of primary inputs.
    pub inputs: usize,
    /// Seed for every choice the generator makes.
    pub seed: u64,
    /// A bug to plant.
    pub bug: Option<Bug>,
    /// Where to plant it: a net name as printed (`m0_3`, `d[5]`); chosen by the seed if absent.
    pub at: Option<String>,
    /// Verilog module name; derived from the spec if absent.
    pub module: Option<String>,
    /// Multiplier family: two's complement signed operands.
    pub signed: bool,
    /// Multiplier family, tree styles: the final adder's style (ripple if absent).
    pub final_adder: Option<Style>,
    /// Pipelined adder: register stages.
    pub stages: usize,
    /// Clocked families: rename the registers and store this many per mille inverted.
    pub rename: Option<u32>,
}

impl GenSpec {
    /// A spec with width 1, 64 random inputs, seed 1, no bug.
    pub fn new(kind: Kind, style: Style, n: usize) -> GenSpec {
        GenSpec {
            kind,
            style,
            n,
            width: 1,
            inputs: 64,
            seed: 1,
            bug: None,
            at: None,
            module: None,
            signed: false,
            final_adder: None,
            stages: 2,
            rename: None,
        }
    }

    /// The same spec with signed operands.
    pub fn signed(mut self) -> GenSpec {
        self.signed = true;
        self
    }

    /// The same spec with final adder `style`.
    pub fn final_adder(mut self, style: Style) -> GenSpec {
        self.final_adder = Some(style);
        self
    }

    /// The same spec with channel width `w`.
    pub fn width(mut self, w: usize) -> GenSpec {
        self.width = w;
        self
    }

    /// The same spec with seed `seed`.
    pub fn seed(mut self, seed: u64) -> GenSpec {
        self.seed = seed;
        self
    }

    /// The same spec with bug `bug` (at a seed-chosen place).
    pub fn bug(mut self, bug: Bug) -> GenSpec {
        self.bug = Some(bug);
        self
    }

    /// The module name used when none is given.
    pub fn default_module(&self) -> String {
        let size = match self.kind {
            Kind::Selector => format!("{}x{}", self.n, self.width),
            _ => self.n.to_string(),
        };
        let size = match self.kind {
            Kind::PipeAdder => format!("{size}x{}", self.stages),
            _ => size,
        };
        let bug = if self.bug.is_some() { "_bug" } else { "" };
        let bug = if self.rename.is_some() {
            "_renamed"
        } else {
            bug
        };
        let signed = if self.signed { "_signed" } else { "" };
        let fin = match self.final_adder {
            Some(f) if f != Style::Ripple => format!("_{}", f.name().replace('-', "_")),
            _ => String::new(),
        };
        let kind = if clocked::is_clocked(self.kind) {
            self.kind.name().replace('-', "_")
        } else {
            self.kind.name().to_string()
        };
        format!(
            "{kind}{size}_{}{fin}{signed}{bug}",
            self.style.name().replace('-', "_")
        )
    }

    /// The command line that regenerates this circuit.
    pub fn command_line(&self, format: GenFormat) -> String {
        let mut s = format!("equicone gen {} --n {}", self.kind.name(), self.n);
        if self.kind == Kind::Selector {
            s += &format!(" --width {}", self.width);
        }
        if self.kind == Kind::Random {
            s += &format!(" --inputs {}", self.inputs);
        }
        s += &format!(" --style {} --seed {}", self.style.name(), self.seed);
        if self.signed {
            s += " --signed";
        }
        if let Some(f) = self.final_adder {
            s += &format!(" --final-adder {}", f.name());
        }
        if self.kind == Kind::PipeAdder {
            s += &format!(" --stages {}", self.stages);
        }
        if let Some(r) = self.rename {
            s += &format!(" --rename --invert {}", r as f64 / 1000.0);
        }
        if let Some(b) = self.bug {
            s += &format!(" --bug {}", b.name());
        }
        if let Some(a) = &self.at {
            s += &format!(" --at '{a}'");
        }
        if let Some(m) = &self.module {
            s += &format!(" --module {m}");
        }
        if format == GenFormat::Bench {
            s += " --format bench";
        }
        s
    }
}

/// A bad generator request: what is wrong and what to do (exit code 2 in the CLI).
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct GenError {
    /// What is wrong, in one line.
    pub message: String,
    /// What to do about it.
    pub help: String,
}

impl GenError {
    pub(crate) fn new(message: impl Into<String>, help: impl Into<String>) -> GenError {
        GenError {
            message: message.into(),
            help: help.into(),
        }
    }
}

impl fmt::Display for GenError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        write!(f, "error: {}\n  help: {}", self.message, self.help)
    }
}

impl std::error::Error for GenError {}

impl From<GenError> for crate::diag::InputError {
    fn from(e: GenError) -> Self {
        crate::diag::InputError::plain(e.message, e.help)
    }
}

/// A generated file.
#[derive(Clone, Debug)]
pub struct Generated {
    /// The file text.
    pub text: String,
    /// One line: what the circuit is.
    pub description: String,
    /// The planted bug, described, if any.
    pub mutation: Option<String>,
    /// Number of gates of the gate form (2:1 cells count as one).
    pub gates: usize,
}

/// Generate the circuit `spec` as text in `format`.
pub fn generate(spec: &GenSpec, format: GenFormat) -> Result<Generated, GenError> {
    if clocked::is_clocked(spec.kind) {
        validate(spec)?;
        return clocked::generate(spec, format);
    }
    let (mut c, mutation) = build_with_mutation(spec)?;
    let description = c.notes.first().cloned().unwrap_or_default();
    c.notes.insert(0, spec.command_line(format));
    let text = match format {
        GenFormat::Verilog => c.to_verilog(),
        GenFormat::Bench => c.to_bench(),
    };
    Ok(Generated {
        text,
        description,
        mutation,
        gates: c.gates().len(),
    })
}

/// Build the circuit of `spec` (after the bug, if any) without printing it.
pub fn build(spec: &GenSpec) -> Result<Circuit, GenError> {
    build_with_mutation(spec).map(|(c, _)| c)
}

fn build_with_mutation(spec: &GenSpec) -> Result<(Circuit, Option<String>), GenError> {
    validate(spec)?;
    if clocked::is_clocked(spec.kind) {
        return Err(GenError::new(
            format!(
                "{} is a clocked family, built by gen::clocked",
                spec.kind.name()
            ),
            "use gen::generate or gen::clocked::build",
        ));
    }
    let module = spec.module.clone().unwrap_or_else(|| spec.default_module());
    let mut c = Circuit::new(&module);
    let mut rng = crate::rng::SplitMix64::new(spec.seed, 1);
    let mut arith_bug = None;
    let notes = match spec.kind {
        Kind::Selector => selector::build(&mut c, spec.n, spec.width, spec.style, &mut rng),
        Kind::Decoder => decoder::build_decoder(&mut c, spec.n, spec.style),
        Kind::Priority => decoder::build_priority(&mut c, spec.n, spec.style),
        Kind::Shifter => shifter::build(&mut c, spec.n, spec.style),
        Kind::Adder => arith::build(&mut c, spec.n, spec.style),
        Kind::Multiplier | Kind::Mac | Kind::Squarer => {
            let (notes, planted) = mult::build(&mut c, spec)?;
            arith_bug = planted;
            notes
        }
        Kind::Random => random::build(&mut c, spec.n, spec.inputs, spec.style, spec.seed),
        Kind::Popcount => count::build_popcount(&mut c, spec.n, spec.style),
        Kind::Majority => count::build_majority(&mut c, spec.n, spec.style),
        Kind::RecursiveMajority => count::build_recursive_majority(&mut c, spec.n, spec.style),
        Kind::Comparator => count::build_comparator(&mut c, spec.n, spec.style),
        Kind::Divider => divide::build_divider(&mut c, spec.n, spec.style),
        Kind::Sqrt => divide::build_sqrt(&mut c, spec.n, spec.style),
        Kind::Arbiter => arbiter::build(&mut c, spec.n, spec.style),
        Kind::Remap => unreachable!("validate refuses remap"),
        Kind::RegSelector
        | Kind::PipeAdder
        | Kind::Counter
        | Kind::ShiftRegister
        | Kind::Fsm
        | Kind::RegRandom => {
            unreachable!("refused above")
        }
    };
    c.prune();
    if cfg!(debug_assertions) {
        if let Err(e) = c.check() {
            panic!(
                "generator bug in {}: {e}",
                spec.command_line(GenFormat::Verilog)
            );
        }
    }
    c.notes = notes;
    let mutation = match spec.bug {
        Some(bug) if mult::is_arithmetic_bug(bug) => Some(arith_bug.ok_or_else(|| {
            GenError::new(
                format!("--bug {} found no place in this circuit", bug.name()),
                "try another --seed",
            )
        })?),
        Some(bug) => {
            let (m, what) = mutate::apply(&c, bug, spec.at.as_deref(), spec.seed)?;
            c = m;
            Some(what)
        }
        None => None,
    };
    c.notes.push(format!(
        "mutation: {}",
        mutation.as_deref().unwrap_or("none")
    ));
    Ok((c, mutation))
}

fn validate(spec: &GenSpec) -> Result<(), GenError> {
    let kind = spec.kind.name();
    if spec.kind == Kind::Remap {
        return Err(GenError::new(
            "remap rewrites a design file and has no size",
            "run `equicone gen remap DESIGN --k 6`",
        ));
    }
    if !spec.kind.styles().contains(&spec.style) {
        let names: Vec<&str> = spec.kind.styles().iter().map(|s| s.name()).collect();
        return Err(GenError::new(
            format!(
                "style `{}` does not apply to kind {kind}",
                spec.style.name()
            ),
            format!("use --style with one of: {}", names.join(", ")),
        ));
    }
    let (min, max, what) = match spec.kind {
        Kind::Selector => (2, 1 << 20, "a selector needs at least 2 channels"),
        Kind::Decoder => (1, 20, "a decoder needs 1 to 20 select bits"),
        Kind::Priority => (2, 1 << 20, "a priority encoder needs at least 2 requests"),
        Kind::Shifter => (2, 1 << 16, "a shifter needs at least 2 data bits"),
        Kind::Adder => (1, 1 << 16, "an adder needs operands of at least 1 bit"),
        Kind::Multiplier => (2, 256, "a multiplier needs operands of at least 2 bits"),
        Kind::Mac => (
            2,
            256,
            "a multiply-accumulate unit needs operands of at least 2 bits",
        ),
        Kind::Squarer => (2, 256, "a squarer needs an operand of at least 2 bits"),
        Kind::Random => (1, 20_000_000, "a random circuit needs at least 1 gate"),
        Kind::Popcount => (2, 1 << 16, "a population count needs 2 to 65536 inputs"),
        Kind::Majority => (3, 1 << 16, "a majority needs 3 to 65536 inputs"),
        Kind::RecursiveMajority => (3, 19683, "a recursive majority needs 3 to 3^9 inputs"),
        Kind::Comparator => (1, 1 << 16, "a comparator needs operands of at least 1 bit"),
        Kind::Divider => (2, 256, "a divider needs operands of 2 to 256 bits"),
        Kind::Sqrt => (1, 128, "a square root needs 1 to 128 root bits"),
        Kind::Arbiter => (2, 1 << 14, "an arbiter needs 2 to 16384 requesters"),
        Kind::Remap => unreachable!("handled above"),
        Kind::RegSelector => (
            2,
            1 << 16,
            "a registered selector needs at least 2 channels",
        ),
        Kind::PipeAdder => (1, 1 << 16, "a pipelined adder needs at least 1 bit"),
        Kind::Counter => (1, 1 << 16, "a counter needs at least 1 bit"),
        Kind::ShiftRegister => (1, 1 << 16, "a shift register needs at least 1 bit"),
        Kind::Fsm => (2, 1 << 12, "a state machine needs 2 to 4096 states"),
        Kind::RegRandom => (
            64,
            4_000_000,
            "a random clocked circuit needs at least 64 gates",
        ),
    };
    if spec.n > max {
        return Err(GenError::new(
            format!("--n {} is too large for kind {kind}: at most {max}", spec.n),
            format!("give --n between {min} and {max} for kind {kind}"),
        ));
    }
    if spec.n < min {
        return Err(GenError::new(
            format!("{what} (got --n {})", spec.n),
            format!("give --n between {min} and {max} for kind {kind}"),
        ));
    }
    if spec.kind == Kind::RecursiveMajority && !is_power_of_three(spec.n) {
        return Err(GenError::new(
            format!(
                "a recursive majority needs a power of 3 inputs (got --n {})",
                spec.n
            ),
            "give --n 3, 9, 27, 81, 243, 729, 2187, 6561 or 19683",
        ));
    }
    if spec.width == 0 {
        return Err(GenError::new(
            "--width must be at least 1",
            "give the channel width in bits, e.g. --width 8",
        ));
    }
    if spec.kind != Kind::Selector && spec.width != 1 {
        return Err(GenError::new(
            format!("--width applies to selectors only, not to kind {kind}"),
            "leave --width out; --n sets the size of this kind",
        ));
    }
    if spec.kind == Kind::Selector && (spec.width > 4096 || spec.n * spec.width > 1 << 22) {
        return Err(GenError::new(
            format!("a {}x{} selector is too large", spec.n, spec.width),
            "keep --width at most 4096 and --n times --width at most 4194304",
        ));
    }
    if spec.kind == Kind::Shifter && spec.style == Style::Decoder && spec.n > 4096 {
        return Err(GenError::new(
            format!(
                "a decoder-style shifter of {} bits is too large (about n*n/2 gates)",
                spec.n
            ),
            "use --style log for more than 4096 bits",
        ));
    }
    if spec.kind == Kind::Random && !(2..=1 << 16).contains(&spec.inputs) {
        return Err(GenError::new(
            format!(
                "a random circuit needs 2 to 65536 inputs (got --inputs {})",
                spec.inputs
            ),
            "give --inputs between 2 and 65536",
        ));
    }
    if spec.bug.is_some() && spec.style == Style::Spec {
        return Err(GenError::new(
            "--bug needs a gate-level style; the spec style is a behavioural one-liner",
            format!(
                "choose a gate-level --style for kind {kind}, e.g. {}",
                spec.kind.styles()[1].name()
            ),
        ));
    }
    let family = matches!(spec.kind, Kind::Multiplier | Kind::Mac | Kind::Squarer);
    if spec.signed && !family {
        return Err(GenError::new(
            format!("--signed applies to multipliers, mac and squarers, not to kind {kind}"),
            "leave --signed out",
        ));
    }
    if let Some(f) = spec.final_adder {
        if !family || !matches!(spec.style, Style::Wallace | Style::Dadda | Style::Booth) {
            return Err(GenError::new(
                format!(
                    "--final-adder applies to the wallace, dadda and booth styles, not to {kind} style {}",
                    spec.style.name()
                ),
                "use --style wallace, dadda or booth, or leave --final-adder out",
            ));
        }
        if !matches!(
            f,
            Style::Ripple | Style::Cla | Style::KoggeStone | Style::BrentKung
        ) {
            return Err(GenError::new(
                format!("`{}` is not an adder style", f.name()),
                "use --final-adder ripple, cla, kogge-stone or brent-kung",
            ));
        }
    }
    if let Some(bug) = spec.bug.filter(|&b| mult::is_arithmetic_bug(b)) {
        if !family || (bug == Bug::BoothSign && spec.style != Style::Booth) {
            return Err(GenError::new(
                format!(
                    "--bug {} does not apply to {kind} style {}",
                    bug.name(),
                    spec.style.name()
                ),
                "pp-bit and swap-carry need a gate-level multiplier, mac or squarer; booth-sign \
                 needs --style booth",
            ));
        }
        if spec.at.is_some() {
            return Err(GenError::new(
                format!("--at does not apply to --bug {}", bug.name()),
                "leave --at out; the seed chooses the place (try other --seed values)",
            ));
        }
    }
    if spec.at.is_some() && spec.bug.is_none() {
        return Err(GenError::new(
            "--at names the place of a bug, but no --bug is given",
            "add --bug swap|stuck0|stuck1|invert|misroute, or leave out --at",
        ));
    }
    if let Some(m) = &spec.module {
        if !emit::is_identifier(m) {
            return Err(GenError::new(
                format!("module name `{m}` is not a plain Verilog identifier"),
                "use letters, digits and `_`, starting with a letter",
            ));
        }
    }
    Ok(())
}

fn is_power_of_three(mut n: usize) -> bool {
    while n > 1 && n.is_multiple_of(3) {
        n /= 3;
    }
    n == 1
}

/// ceil(log2 n) for n >= 1.
pub fn clog2(n: usize) -> usize {
    (usize::BITS - (n.max(1) - 1).leading_zeros()) as usize
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn clog2_values() {
        let got: Vec<usize> = [1, 2, 3, 4, 5, 8, 9, 12, 16, 17]
            .iter()
            .map(|&n| clog2(n))
            .collect();
        assert_eq!(got, vec![0, 1, 2, 2, 3, 3, 4, 4, 4, 5]);
    }

    #[test]
    fn bad_requests_get_clear_errors() {
        let e = generate(
            &GenSpec::new(Kind::Selector, Style::Tree, 1),
            GenFormat::Verilog,
        )
        .unwrap_err();
        assert!(e.message.contains("at least 2 channels"), "{e}");
        let e = generate(
            &GenSpec::new(Kind::Selector, Style::Tree, 4).width(0),
            GenFormat::Verilog,
        )
        .unwrap_err();
        assert!(e.message.contains("--width"), "{e}");
        let e = generate(
            &GenSpec::new(Kind::Adder, Style::Tree, 4),
            GenFormat::Verilog,
        )
        .unwrap_err();
        assert!(e.help.contains("ripple"), "{e}");
        let e = generate(
            &GenSpec::new(Kind::Adder, Style::Spec, 4).bug(Bug::Swap),
            GenFormat::Bench,
        )
        .unwrap_err();
        assert!(e.message.contains("gate-level"), "{e}");
    }
}
