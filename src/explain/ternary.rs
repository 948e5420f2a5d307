//! Ternary (0, 1, unknown) simulation of one AIG cone, for lifting a vector into a cube: an
//! input set to unknown that leaves the root at a known value does not matter for that vector.

use crate::aig::{Aig, Lit, Node};

/// A ternary value: known 0, known 1, or unknown.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum Tern {
    /// Known 0.
    Zero,
    /// Known 1.
    One,
    /// Either value.
    X,
}

impl Tern {
    /// The known value `b`.
    pub fn of(b: bool) -> Tern {
        if b {
            Tern::One
        } else {
            Tern::Zero
        }
    }

    fn not(self) -> Tern {
        match self {
            Tern::Zero => Tern::One,
            Tern::One => Tern::Zero,
            Tern::X => Tern::X,
        }
    }

    fn and(self, o: Tern) -> Tern {
        match (self, o) {
            (Tern::Zero, _) | (_, Tern::Zero) => Tern::Zero,
            (Tern::One, Tern::One) => Tern::One,
            _ => Tern::X,
        }
    }
}

/// The nodes of one root's cone in topological order, and a value buffer for them.
pub struct Cone {
    root: Lit,
    nodes: Vec<u32>,
    /// Primary input numbers (AIG input order) found in the cone, ascending.
    pub inputs: Vec<usize>,
    values: Vec<Tern>,
}

impl Cone {
    /// The cone of `root` in `aig` (an explicit stack: no recursion on depth).
    pub fn new(aig: &Aig, root: Lit) -> Cone {
        let mut seen = vec![false; aig.len()];
        let mut stack = vec![root.node()];
        let mut nodes = Vec::new();
        let mut inputs = Vec::new();
        while let Some(n) = stack.pop() {
            if std::mem::replace(&mut seen[n as usize], true) {
                continue;
            }
            nodes.push(n);
            match aig.node(n) {
                Node::And(a, b) => {
                    stack.push(a.node());
                    stack.push(b.node());
                }
                Node::Input(k) => inputs.push(k as usize),
                Node::Const => {}
            }
        }
        nodes.sort_unstable();
        inputs.sort_unstable();
        Cone {
            root,
            nodes,
            inputs,
            values: vec![Tern::X; aig.len()],
        }
    }

    /// Number of nodes in the cone.
    pub fn len(&self) -> usize {
        self.nodes.len()
    }

    /// Whether the cone holds no node (never: the root is in it).
    pub fn is_empty(&self) -> bool {
        self.nodes.is_empty()
    }

    /// The root's value when AIG input `k` takes `value(k)`.
    pub fn eval(&mut self, aig: &Aig, value: &dyn Fn(usize) -> Tern) -> Tern {
        for &n in &self.nodes {
            let v = match aig.node(n) {
                Node::Const => Tern::Zero,
                Node::Input(k) => value(k as usize),
                Node::And(a, b) => self.lit(a).and(self.lit(b)),
            };
            self.values[n as usize] = v;
        }
        self.lit(self.root)
    }

    fn lit(&self, l: Lit) -> Tern {
        let v = self.values[l.index()];
        if l.is_complemented() {
            v.not()
        } else {
            v
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn unknown_inputs_propagate_only_where_they_matter() {
        let mut g = Aig::new();
        let a = g.add_input();
        let b = g.add_input();
        let c = g.add_input();
        let ab = g.and(a, b);
        let f = g.or(ab, c);
        let mut cone = Cone::new(&g, f);
        assert_eq!(cone.inputs, vec![0, 1, 2]);
        // c = 1 decides the OR whatever a and b are.
        let v = |k: usize| if k == 2 { Tern::One } else { Tern::X };
        assert_eq!(cone.eval(&g, &v), Tern::One);
        // a = 0, c = 0 decide it too; b alone unknown with a = 1 does not.
        let v = |k: usize| [Tern::Zero, Tern::X, Tern::Zero][k];
        assert_eq!(cone.eval(&g, &v), Tern::Zero);
        let v = |k: usize| [Tern::One, Tern::X, Tern::Zero][k];
        assert_eq!(cone.eval(&g, &v), Tern::X);
    }
}
