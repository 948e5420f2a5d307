//! Irredundant sums of products of functions of up to six variables (Minato-Morreale ISOP on
//! 64-bit truth tables; Minato, "Fast generation of irredundant sum-of-products forms from
//! binary decision diagrams", SASIMI 1992, and Morreale's recursive prime-implicant method).
//!
//! A truth table holds bit `m` = f(minterm m), variable i being bit i of m; functions of fewer
//! variables are simply independent of the upper ones.

/// Truth tables of the six variables.
pub use crate::aig::PROJECTIONS as VAR;

/// A product term: variable i is in the cube when bit i of `mask` is set, positive when bit i
/// of `pos` is also set.
#[derive(Copy, Clone, Debug, PartialEq, Eq, PartialOrd, Ord)]
pub struct Cube {
    /// Variables present.
    pub mask: u8,
    /// Of those, the positive ones.
    pub pos: u8,
}

impl Cube {
    /// Number of literals.
    pub fn len(self) -> usize {
        self.mask.count_ones() as usize
    }

    /// Whether the cube has no literal (the constant 1).
    pub fn is_empty(self) -> bool {
        self.mask == 0
    }

    /// The cube's truth table.
    pub fn table(self) -> u64 {
        (0..6).fold(!0u64, |t, i| {
            if self.mask >> i & 1 == 0 {
                t
            } else if self.pos >> i & 1 == 1 {
                t & VAR[i]
            } else {
                t & !VAR[i]
            }
        })
    }
}

/// The negative cofactor with respect to variable `i`, spread over both halves.
pub fn cofactor0(t: u64, i: usize) -> u64 {
    let lo = t & !VAR[i];
    lo | (lo << (1 << i))
}

/// The positive cofactor with respect to variable `i`, spread over both halves.
pub fn cofactor1(t: u64, i: usize) -> u64 {
    let hi = t & VAR[i];
    hi | (hi >> (1 << i))
}

/// Whether `t` depends on variable `i`.
pub fn depends(t: u64, i: usize) -> bool {
    cofactor0(t, i) != cofactor1(t, i)
}

/// An irredundant sum of products of the function `t`.
pub fn isop(t: u64) -> Vec<Cube> {
    let mut cubes = Vec::new();
    let f = cover(t, t, 6, &mut cubes);
    debug_assert_eq!(f, t, "an ISOP covers exactly the function");
    cubes
}

/// Minato-Morreale: cubes of a cover f with `lower` <= f <= `upper`, over variables below `n`;
/// returns f. Recursion depth is at most six.
fn cover(lower: u64, upper: u64, n: usize, out: &mut Vec<Cube>) -> u64 {
    if lower == 0 {
        return 0;
    }
    if upper == !0 {
        out.push(Cube { mask: 0, pos: 0 });
        return !0;
    }
    let Some(i) = (0..n)
        .rev()
        .find(|&i| depends(lower, i) || depends(upper, i))
    else {
        // Unreachable for lower <= upper: a constant pair is handled above.
        unreachable!("isop: lower {lower:x} not below upper {upper:x}");
    };
    let (l0, l1) = (cofactor0(lower, i), cofactor1(lower, i));
    let (u0, u1) = (cofactor0(upper, i), cofactor1(upper, i));
    let start0 = out.len();
    let f0 = cover(l0 & !u1, u0, i, out);
    for c in &mut out[start0..] {
        c.mask |= 1 << i;
    }
    let start1 = out.len();
    let f1 = cover(l1 & !u0, u1, i, out);
    for c in &mut out[start1..] {
        c.mask |= 1 << i;
        c.pos |= 1 << i;
    }
    let rest = (l0 & !f0) | (l1 & !f1);
    let fs = cover(rest, u0 & u1, i, out);
    (f0 & !VAR[i]) | (f1 & VAR[i]) | fs
}

#[cfg(test)]
mod tests {
    use super::*;

    fn sum(cubes: &[Cube]) -> u64 {
        cubes.iter().fold(0, |t, c| t | c.table())
    }

    #[test]
    fn covers_are_exact_and_irredundant() {
        let mut rng = crate::rng::SplitMix64::new(1, 0);
        let mut tables = vec![0, !0, VAR[0], !VAR[3], VAR[0] ^ VAR[1] ^ VAR[2]];
        for _ in 0..300 {
            let x = rng.next_u64();
            tables.push(x);
            tables.push(x & (x >> 3) & (x >> 9));
        }
        for t in tables {
            let cubes = isop(t);
            assert_eq!(sum(&cubes), t, "cover of {t:x}");
            for k in 0..cubes.len() {
                let mut rest = cubes.clone();
                rest.remove(k);
                assert_ne!(sum(&rest), t, "cube {k} of {t:x} is redundant");
                // Each cube is prime: dropping any literal leaves the function.
                let c = cubes[k];
                for i in 0..6 {
                    if c.mask >> i & 1 == 1 {
                        let wider = Cube {
                            mask: c.mask & !(1 << i),
                            pos: c.pos & !(1 << i),
                        };
                        assert_ne!(wider.table() & !t, 0, "cube {k} of {t:x} is not prime");
                    }
                }
            }
        }
    }

    #[test]
    fn parity_of_three_needs_four_cubes() {
        // Common practice: the 3-input parity has four minterms, no two adjacent.
        assert_eq!(isop(VAR[0] ^ VAR[1] ^ VAR[2]).len(), 4);
        assert_eq!(isop(VAR[0] & VAR[1] | VAR[2]).len(), 2);
    }
}
