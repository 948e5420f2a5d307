//! Command-line mirrors of the generator's enums (`gen` kinds, styles, bugs, formats), with
//! the same variants and help text as the library types in `gen/`, which carry no
//! argument-parser derives.

use crate::gen::{Bug, GenFormat, Kind, Style};

cli_enum! {
    /// What to generate (`gen KIND`).
    KindArg => Kind {
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
}

cli_enum! {
    /// How to build it (`--style`, `--final-adder`).
    StyleArg => Style {
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
}

cli_enum! {
    /// A planted bug (`--bug`).
    BugArg => Bug {
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
}

cli_enum! {
    /// Output format (`--format`).
    FormatArg => GenFormat {
        /// IEEE 1364-2005 Verilog.
        Verilog,
        /// ISCAS bench.
        Bench,
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use clap::ValueEnum;

    #[test]
    fn option_spellings_match_the_library_names() {
        for s in StyleArg::value_variants() {
            let name = Style::from(*s).name();
            assert_eq!(s.to_possible_value().unwrap().get_name(), name);
        }
        for k in KindArg::value_variants() {
            let name = Kind::from(*k).name();
            assert_eq!(k.to_possible_value().unwrap().get_name(), name);
        }
        for b in BugArg::value_variants() {
            let name = Bug::from(*b).name();
            assert_eq!(b.to_possible_value().unwrap().get_name(), name);
        }
    }
}
