//! The multiplier family: n x n multipliers (`p[2n-1:0]` = a * b), multiply-accumulate units
//! (`p[2n-1:0]` = a * b + c, modulo 2^(2n)) and squarers (`p[2n-1:0]` = a * a), unsigned or
//! two's complement signed (`--signed`).
//!
//! Partial products ([`partial`]): an AND array (Baugh-Wooley when signed), radix-4 Booth
//! (style `booth`), or the folded squarer; reduction ([`reduce`]): an array of ripple-carry
//! rows, or Wallace or Dadda trees (Booth rows go through a Dadda tree) with a final adder
//! chosen by `--final-adder` (ripple, cla, kogge-stone, brent-kung). The spec style is the
//! Verilog one-liner (`a * b`, `$signed(a) * $signed(b)`, `a * b + c`, `a * a`); in bench it is
//! written as the array.
//!
//! Arithmetic bugs planted here (the place chosen by the seed): a partial product taking the
//! wrong operand bit (`pp-bit`), one adder cell's sum and carry exchanged (`swap-carry`), a
//! Booth row's sign bit entering without its inversion (`booth-sign`).

mod partial;
mod reduce;

pub use reduce::dadda_heights;

use super::emit::{Circuit, Net, Op};
use super::{Bug, GenError, GenSpec, Kind, Style};
use crate::rng::SplitMix64;

/// Where an arithmetic bug goes: the index of the partial product, adder cell or Booth row
/// that gets it, counted in construction order.
#[derive(Clone, Debug, Default)]
pub(super) struct Plant {
    pp_at: Option<usize>,
    cell_at: Option<usize>,
    row_at: Option<usize>,
    pp: usize,
    cells: usize,
    rows: usize,
    what: Option<String>,
}

impl Plant {
    fn hit(at: Option<usize>, count: &mut usize) -> bool {
        let h = at == Some(*count);
        *count += 1;
        h
    }

    /// The next partial product: whether it gets the bug.
    pub(super) fn next_pp(&mut self) -> bool {
        Plant::hit(self.pp_at, &mut self.pp)
    }

    /// The next adder cell with a carry: whether it gets the bug.
    pub(super) fn next_cell(&mut self) -> bool {
        Plant::hit(self.cell_at, &mut self.cells)
    }

    /// The next Booth row: whether it gets the bug.
    pub(super) fn next_booth_row(&mut self) -> bool {
        Plant::hit(self.row_at, &mut self.rows)
    }

    /// Describe the planted bug.
    pub(super) fn note(&mut self, what: String) {
        self.what = Some(what);
    }
}

/// What the builders share: the circuit, the bug plan and the constant nets.
pub(super) struct Ctx<'a> {
    pub c: &'a mut Circuit,
    pub plant: Plant,
    pub zero: Net,
    pub one: Net,
}

/// Whether `bug` is one planted by this module.
pub fn is_arithmetic_bug(bug: Bug) -> bool {
    matches!(bug, Bug::PpBit | Bug::SwapCarry | Bug::BoothSign)
}

/// Build the circuit of `spec` (a multiplier-family kind) into `c`; returns the notes and the
/// planted arithmetic bug, if any.
pub(super) fn build(
    c: &mut Circuit,
    spec: &GenSpec,
) -> Result<(Vec<String>, Option<String>), GenError> {
    let bug = spec.bug.filter(|&b| is_arithmetic_bug(b));
    let Some(bug) = bug else {
        let (notes, _) = build_with(c, spec, Plant::default());
        return Ok((notes, None));
    };
    // A first build counts the places, the seed picks one, the second build plants it.
    let mut scratch = Circuit::new("scratch");
    let (_, counted) = build_with(&mut scratch, spec, Plant::default());
    let mut rng = SplitMix64::new(spec.seed, 7);
    let mut plant = Plant::default();
    let (count, slot) = match bug {
        Bug::PpBit => (counted.pp, &mut plant.pp_at),
        Bug::SwapCarry => (counted.cells, &mut plant.cell_at),
        _ => (counted.rows, &mut plant.row_at),
    };
    if count == 0 {
        return Err(GenError::new(
            format!("this circuit has no place for --bug {}", bug.name()),
            "--bug booth-sign needs --style booth; pp-bit and swap-carry need a gate-level style",
        ));
    }
    *slot = Some(rng.below(count));
    let (notes, planted) = build_with(c, spec, plant);
    Ok((notes, planted.what))
}

fn build_with(c: &mut Circuit, spec: &GenSpec, plant: Plant) -> (Vec<String>, Plant) {
    let n = spec.n;
    let w = 2 * n;
    let signed = spec.signed;
    let a = c.input("a", n);
    let b = if spec.kind == Kind::Squarer {
        Vec::new()
    } else {
        c.input("b", n)
    };
    let acc = if spec.kind == Kind::Mac {
        c.input("c", w)
    } else {
        Vec::new()
    };
    let zero = c.gate(Op::Const0, vec![], "zero");
    let one = c.gate(Op::Const1, vec![], "one");
    let mut x = Ctx {
        c,
        plant,
        zero,
        one,
    };
    let sign = if signed { "signed" } else { "unsigned" };
    let (what, expr) = match (spec.kind, signed) {
        (Kind::Squarer, false) => ("squarer", "a * a".to_string()),
        (Kind::Squarer, true) => ("squarer", "$signed(a) * $signed(a)".to_string()),
        (Kind::Mac, false) => ("multiply-accumulate", "a * b + c".to_string()),
        (Kind::Mac, true) => (
            "multiply-accumulate",
            "$signed(a) * $signed(b) + $signed(c)".to_string(),
        ),
        (_, false) => ("multiplier", "a * b".to_string()),
        (_, true) => ("multiplier", "$signed(a) * $signed(b)".to_string()),
    };
    let mut notes = vec![format!(
        "{n}x{n} {sign} {what}: a[{}:0]{}{} in; p[{}:0] = {expr} (modulo 2^{w})",
        n - 1,
        if b.is_empty() {
            String::new()
        } else {
            format!(", b[{}:0]", n - 1)
        },
        if acc.is_empty() {
            String::new()
        } else {
            format!(", c[{}:0]", w - 1)
        },
        w - 1
    )];
    let mut rows = match (spec.kind, spec.style) {
        (Kind::Squarer, _) => partial::squarer(&mut x, &a, signed),
        (_, Style::Booth) => partial::booth(&mut x, &a, &b, signed, w),
        _ => partial::and_array(&mut x, &a, &b, signed),
    };
    let pp_rows = rows.len();
    if !acc.is_empty() {
        rows.push(acc.iter().copied().enumerate().collect());
    }
    let fin = spec.final_adder.unwrap_or(Style::Ripple);
    let bits: Vec<Option<Net>> = match spec.style {
        Style::Spec | Style::Array => {
            notes.push(if spec.style == Style::Spec {
                format!("style spec: `p = {expr};` in bench written as the array")
            } else {
                format!(
                    "style array: {pp_rows} partial-product rows added one after the other by \
                     ripple-carry rows r{{row}}_{{weight}}"
                )
            });
            reduce::array(&mut x, &rows, w)
        }
        style => {
            let dadda = style != Style::Wallace;
            let (bits, stages) = reduce::tree(&mut x, &rows, w, dadda, fin);
            notes.push(format!(
                "style {}: {pp_rows} partial-product rows{}, a {} tree of {stages} stages of full \
                 and half adders, then a {} final adder",
                style.name(),
                if style == Style::Booth {
                    " (radix-4 Booth digits)"
                } else {
                    ""
                },
                if dadda { "Dadda" } else { "Wallace" },
                fin.name()
            ));
            bits
        }
    };
    let Ctx { c, plant, zero, .. } = x;
    let p: Vec<Net> = bits.into_iter().map(|b| b.unwrap_or(zero)).collect();
    c.output("p", &p);
    if spec.style == Style::Spec {
        c.behaviour = vec![format!("assign p = {expr};")];
    }
    (notes, plant)
}
