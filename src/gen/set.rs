//! The benchmark set of `bench-circuits/`: which circuits, in which formats, under which paths.
//! `examples/gen_set.rs` (run by `scripts/gen-bench-circuits`) writes it through [`generate`].
//!
//! [`generate`]: super::generate

use super::{Bug, GenFormat, GenSpec, Kind, Style};

/// One file of the set.
#[derive(Clone, Debug)]
pub struct SetEntry {
    /// Path relative to the set's folder, e.g. `selector/sel64_tree.v`.
    pub path: String,
    /// What to generate.
    pub spec: GenSpec,
    /// In which format.
    pub format: GenFormat,
}

/// Folder (relative to the set's folder) of the large circuits that are generated on demand
/// and not committed.
pub const BIG_DIR: &str = "generated";

fn both(out: &mut Vec<SetEntry>, stem: String, spec: GenSpec) {
    for (ext, format) in [("v", GenFormat::Verilog), ("bench", GenFormat::Bench)] {
        out.push(SetEntry {
            path: format!("{stem}.{ext}"),
            spec: spec.clone(),
            format,
        });
    }
}

fn one(out: &mut Vec<SetEntry>, stem: String, spec: GenSpec, format: GenFormat) {
    let ext = if format == GenFormat::Verilog {
        "v"
    } else {
        "bench"
    };
    out.push(SetEntry {
        path: format!("{stem}.{ext}"),
        spec,
        format,
    });
}

/// The committed set (small files, Verilog and bench for each circuit).
pub fn committed() -> Vec<SetEntry> {
    let mut v = Vec::new();
    // Selector families: decoder-based against tree, N = 2^6 ... 2^11 here, larger on demand.
    for k in 6..=11 {
        let n = 1usize << k;
        for style in [Style::Spec, Style::Decoder, Style::Tree] {
            both(
                &mut v,
                format!("selector/sel{n}_{}", style.name()),
                GenSpec::new(Kind::Selector, style, n),
            );
        }
    }
    // The buoy telemetry selector shape: 12 channels of 8 bits, every style.
    for style in Kind::Selector.styles() {
        both(
            &mut v,
            format!("selector/sel12x8_{}", style.name()),
            GenSpec::new(Kind::Selector, *style, 12).width(8),
        );
    }
    // Adders: ripple against prefix, n = 32 ... 1024.
    for k in 5..=10 {
        let n = 1usize << k;
        for style in [
            Style::Spec,
            Style::Ripple,
            Style::Cla,
            Style::KoggeStone,
            Style::BrentKung,
        ] {
            both(
                &mut v,
                format!("adder/add{n}_{}", style.name()),
                GenSpec::new(Kind::Adder, style, n),
            );
        }
    }
    // Multipliers: array against carry-save trees, n = 4 ... 16.
    for n in [4, 6, 8, 10, 12, 14, 16] {
        for style in Kind::Multiplier.styles() {
            both(
                &mut v,
                format!("multiplier/mul{n}_{}", style.name()),
                GenSpec::new(Kind::Multiplier, *style, n),
            );
        }
    }
    // Smaller kinds.
    for k in [3, 4, 6, 8] {
        for style in Kind::Decoder.styles() {
            both(
                &mut v,
                format!("decoder/dec{k}_{}", style.name()),
                GenSpec::new(Kind::Decoder, *style, k),
            );
        }
    }
    for n in [5, 8, 16, 64] {
        for style in Kind::Priority.styles() {
            both(
                &mut v,
                format!("priority/prio{n}_{}", style.name()),
                GenSpec::new(Kind::Priority, *style, n),
            );
        }
    }
    for n in [8, 12, 32, 64] {
        for style in Kind::Shifter.styles() {
            both(
                &mut v,
                format!("shifter/shl{n}_{}", style.name()),
                GenSpec::new(Kind::Shifter, *style, n),
            );
        }
    }
    // A small random circuit and its rewritten copy.
    for style in Kind::Random.styles() {
        let mut spec = GenSpec::new(Kind::Random, *style, 5000);
        spec.inputs = 64;
        both(&mut v, format!("random/rand5k_{}", style.name()), spec);
    }
    // Mutants: one of each bug on a few circuits, seed 1.
    let bugs = [
        Bug::Swap,
        Bug::Stuck0,
        Bug::Stuck1,
        Bug::Invert,
        Bug::Misroute,
    ];
    let bases = [
        (
            "sel12x8_tree",
            GenSpec::new(Kind::Selector, Style::Tree, 12).width(8),
        ),
        (
            "sel12x8_mixed",
            GenSpec::new(Kind::Selector, Style::Mixed, 12).width(8),
        ),
        (
            "sel64_decoder",
            GenSpec::new(Kind::Selector, Style::Decoder, 64),
        ),
        (
            "add32_kogge-stone",
            GenSpec::new(Kind::Adder, Style::KoggeStone, 32),
        ),
        (
            "mul8_dadda",
            GenSpec::new(Kind::Multiplier, Style::Dadda, 8),
        ),
    ];
    for (stem, base) in bases {
        for bug in bugs {
            both(
                &mut v,
                format!("mutants/{stem}_{}", bug.name()),
                base.clone().bug(bug),
            );
        }
    }
    v
}

/// The large circuits, generated on demand into [`BIG_DIR`]: selectors N = 2^12 ... 2^16
/// (decoder and tree), and a random circuit of `random_gates` gates with its rewritten copy.
pub fn big(random_gates: usize) -> Vec<SetEntry> {
    let mut v = Vec::new();
    for k in 12..=16 {
        let n = 1usize << k;
        for style in [Style::Spec, Style::Decoder, Style::Tree] {
            both(
                &mut v,
                format!("{BIG_DIR}/selector/sel{n}_{}", style.name()),
                GenSpec::new(Kind::Selector, style, n),
            );
        }
    }
    for style in Kind::Random.styles() {
        let mut spec = GenSpec::new(Kind::Random, *style, random_gates);
        spec.inputs = 256;
        one(
            &mut v,
            format!("{BIG_DIR}/random/rand_{}", style.name()),
            spec,
            GenFormat::Bench,
        );
    }
    v
}
