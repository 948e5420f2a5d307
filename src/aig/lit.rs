//! Literals of the and-inverter graph: a node index with a complement bit in the low bit.

use std::fmt;

/// A reference to an AIG node, possibly complemented.
///
/// The encoding is `2 * node + complement`. Node 0 is the constant-false node, so
/// [`Lit::FALSE`] is `0` and [`Lit::TRUE`] is `1`.
#[derive(Copy, Clone, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub struct Lit(u32);

impl Lit {
    /// The constant false literal.
    pub const FALSE: Lit = Lit(0);
    /// The constant true literal.
    pub const TRUE: Lit = Lit(1);

    /// The literal of node `node`, complemented when `complement` is true.
    #[inline]
    pub fn from_node(node: u32, complement: bool) -> Lit {
        debug_assert!(node < (1 << 31), "AIG node index overflow");
        Lit((node << 1) | complement as u32)
    }

    /// The literal from its raw encoding `2 * node + complement`.
    #[inline]
    pub fn from_raw(raw: u32) -> Lit {
        Lit(raw)
    }

    /// The constant literal for `value`.
    #[inline]
    pub fn constant(value: bool) -> Lit {
        Lit(value as u32)
    }

    /// Raw encoding `2 * node + complement`.
    #[inline]
    pub fn raw(self) -> u32 {
        self.0
    }

    /// Index of the node this literal refers to.
    #[inline]
    pub fn node(self) -> u32 {
        self.0 >> 1
    }

    /// Index of the node as `usize`, for indexing vectors.
    #[inline]
    pub fn index(self) -> usize {
        (self.0 >> 1) as usize
    }

    /// Whether the literal is complemented.
    #[inline]
    pub fn is_complemented(self) -> bool {
        self.0 & 1 == 1
    }

    /// A 64-bit word of all ones for a complemented literal, else zero: XOR it onto a node's
    /// simulation word to get the literal's word.
    #[inline]
    pub fn complement_mask(self) -> u64 {
        0u64.wrapping_sub(u64::from(self.0 & 1))
    }

    /// The uncomplemented literal of the same node.
    #[inline]
    pub fn regular(self) -> Lit {
        Lit(self.0 & !1)
    }

    /// Complement the literal when `c` is true.
    #[inline]
    pub fn xor_complement(self, c: bool) -> Lit {
        Lit(self.0 ^ c as u32)
    }

    /// Whether the literal is one of the two constants.
    #[inline]
    pub fn is_const(self) -> bool {
        self.0 < 2
    }
}

impl std::ops::Not for Lit {
    type Output = Lit;
    #[inline]
    fn not(self) -> Lit {
        Lit(self.0 ^ 1)
    }
}

impl fmt::Debug for Lit {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self.0 {
            0 => write!(f, "0"),
            1 => write!(f, "1"),
            _ => write!(
                f,
                "{}n{}",
                if self.is_complemented() { "!" } else { "" },
                self.node()
            ),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn encoding_round_trips() {
        let l = Lit::from_node(7, true);
        assert_eq!(l.node(), 7);
        assert!(l.is_complemented());
        assert_eq!(!l, Lit::from_node(7, false));
        assert_eq!((!l).regular(), l.regular());
        assert_eq!(!Lit::FALSE, Lit::TRUE);
        assert!(Lit::TRUE.is_const() && !l.is_const());
    }
}
