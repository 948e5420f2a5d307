//! Coefficients of the word polynomials: integers modulo 2^n, as a masked `u128` when
//! n <= 128 and as a fixed number of 64-bit limbs above (a 4097-bit adder output word).
//!
//! Only the operations backward rewriting needs: powers of two, `self += other * s` for a
//! small signed `s` (the coefficients of a gate polynomial), zero tests and trailing zeros.

use std::fmt::Debug;

/// A ring Z / 2^bits of coefficients.
pub trait Coef: Clone + PartialEq + Debug + Send {
    /// Zero of the ring with `bits` bits.
    fn zero(bits: u32) -> Self;
    /// 2^k modulo 2^bits.
    fn pow2(k: u32, bits: u32) -> Self;
    /// `self += other * s` modulo 2^bits.
    fn add_scaled(&mut self, other: &Self, s: i64, bits: u32);
    /// Whether this is zero.
    fn is_zero(&self) -> bool;
    /// Number of trailing zero bits (`bits` for zero).
    fn trailing_zeros(&self, bits: u32) -> u32;
}

fn mask128(bits: u32) -> u128 {
    if bits >= 128 {
        u128::MAX
    } else {
        (1u128 << bits) - 1
    }
}

impl Coef for u128 {
    fn zero(_bits: u32) -> Self {
        0
    }

    fn pow2(k: u32, bits: u32) -> Self {
        if k >= bits {
            0
        } else {
            1u128 << k
        }
    }

    fn add_scaled(&mut self, other: &Self, s: i64, bits: u32) {
        let prod = other.wrapping_mul(s as i128 as u128);
        *self = self.wrapping_add(prod) & mask128(bits);
    }

    fn is_zero(&self) -> bool {
        *self == 0
    }

    fn trailing_zeros(&self, bits: u32) -> u32 {
        u128::trailing_zeros(*self).min(bits)
    }
}

/// A coefficient of more than 128 bits: little-endian limbs, the top limb masked.
#[derive(Clone, PartialEq, Eq, Debug)]
pub struct Wide(Box<[u64]>);

fn limbs(bits: u32) -> usize {
    (bits as usize).div_ceil(64)
}

impl Wide {
    fn mask(&mut self, bits: u32) {
        let r = bits % 64;
        if r != 0 {
            if let Some(top) = self.0.last_mut() {
                *top &= (1u64 << r) - 1;
            }
        }
    }
}

impl Coef for Wide {
    fn zero(bits: u32) -> Self {
        Wide(vec![0; limbs(bits)].into_boxed_slice())
    }

    fn pow2(k: u32, bits: u32) -> Self {
        let mut w = Wide::zero(bits);
        if k < bits {
            w.0[(k / 64) as usize] = 1u64 << (k % 64);
        }
        w
    }

    fn add_scaled(&mut self, other: &Self, s: i64, bits: u32) {
        // other * |s| limb by limb, then add it or subtract it.
        let m = s.unsigned_abs();
        let mut carry_mul: u128 = 0;
        let mut carry_add: u128 = 0;
        let mut borrow: bool = false;
        for (x, &y) in self.0.iter_mut().zip(other.0.iter()) {
            let p = (y as u128) * (m as u128) + carry_mul;
            carry_mul = p >> 64;
            let p = p as u64;
            if s >= 0 {
                let t = (*x as u128) + (p as u128) + carry_add;
                *x = t as u64;
                carry_add = t >> 64;
            } else {
                let (d1, b1) = x.overflowing_sub(p);
                let (d2, b2) = d1.overflowing_sub(borrow as u64);
                *x = d2;
                borrow = b1 || b2;
            }
        }
        self.mask(bits);
    }

    fn is_zero(&self) -> bool {
        self.0.iter().all(|&x| x == 0)
    }

    fn trailing_zeros(&self, bits: u32) -> u32 {
        for (i, &x) in self.0.iter().enumerate() {
            if x != 0 {
                return (i as u32 * 64 + x.trailing_zeros()).min(bits);
            }
        }
        bits
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn narrow_wraps_modulo_two_to_the_bits() {
        let mut c = u128::pow2(3, 4); // 8 mod 16
        c.add_scaled(&u128::pow2(3, 4), 1, 4);
        assert!(c.is_zero());
        let mut d = u128::zero(8);
        d.add_scaled(&1, -2, 8);
        assert_eq!(d, 254);
        assert_eq!(Coef::trailing_zeros(&d, 8), 1);
    }

    #[test]
    fn wide_agrees_with_narrow_below_128_bits() {
        // The same sequence of operations in both representations, compared limb by limb.
        let bits = 100;
        let mut n = u128::zero(bits);
        let mut w = Wide::zero(bits);
        for (k, s) in [(99, 3i64), (0, -5), (64, 7), (63, -2), (98, 4), (1, -1)] {
            n.add_scaled(&u128::pow2(k, bits), s, bits);
            w.add_scaled(&Wide::pow2(k, bits), s, bits);
            assert_eq!(w.0[0], n as u64);
            assert_eq!(w.0[1], (n >> 64) as u64);
        }
        assert_eq!(Coef::trailing_zeros(&n, bits), w.trailing_zeros(bits));
    }

    #[test]
    fn wide_wraps_at_the_top_limb() {
        let bits = 130;
        let mut w = Wide::pow2(129, bits);
        w.add_scaled(&Wide::pow2(129, bits), 1, bits);
        assert!(w.is_zero());
        assert!(Wide::pow2(130, bits).is_zero());
    }
}
