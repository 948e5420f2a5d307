//! A tiny bench-text evaluator written for these tests only, independent of the generator's IR
//! and of the project's bench reader: parse `INPUT`, `OUTPUT` and `x = GATE(...)` lines, order
//! the gates by their fan-ins (Kahn's algorithm) and evaluate 64 patterns per word.

use std::collections::HashMap;

pub struct Bench {
    pub inputs: Vec<String>,
    pub outputs: Vec<String>,
    /// Gates in evaluation order: (output slot, gate name, input slots).
    order: Vec<(usize, String, Vec<usize>)>,
    slots: usize,
    input_slot: Vec<usize>,
    output_slot: Vec<usize>,
}

fn inside(line: &str) -> Option<&str> {
    let open = line.find('(')?;
    let close = line.rfind(')')?;
    Some(line[open + 1..close].trim())
}

impl Bench {
    pub fn parse(text: &str) -> Bench {
        let mut inputs = Vec::new();
        let mut outputs = Vec::new();
        let mut gates: Vec<(String, String, Vec<String>)> = Vec::new();
        for raw in text.lines() {
            let line = raw.split('#').next().unwrap().trim();
            if line.is_empty() {
                continue;
            }
            if let Some(rest) = line.strip_prefix("INPUT") {
                inputs.push(inside(rest).expect("INPUT(name)").to_string());
            } else if let Some(rest) = line.strip_prefix("OUTPUT") {
                outputs.push(inside(rest).expect("OUTPUT(name)").to_string());
            } else {
                let (lhs, rhs) = line.split_once('=').expect("gate line has `=`");
                let open = rhs.find('(').expect("gate has `(`");
                let op = rhs[..open].trim().to_ascii_uppercase();
                let args = inside(rhs).expect("gate args");
                let ins = args.split(',').map(|a| a.trim().to_string()).collect();
                gates.push((lhs.trim().to_string(), op, ins));
            }
        }
        let mut slot: HashMap<String, usize> = HashMap::new();
        for name in inputs.iter().chain(gates.iter().map(|g| &g.0)) {
            let n = slot.len();
            assert!(
                slot.insert(name.clone(), n).is_none(),
                "`{name}` defined twice"
            );
        }
        // Kahn: a gate is ready when all its fan-ins are inputs or evaluated gates.
        let gate_of: HashMap<&str, usize> = gates
            .iter()
            .enumerate()
            .map(|(i, g)| (g.0.as_str(), i))
            .collect();
        let mut waiting = vec![0usize; gates.len()];
        let mut readers: Vec<Vec<usize>> = vec![Vec::new(); gates.len()];
        for (i, g) in gates.iter().enumerate() {
            for a in &g.2 {
                assert!(slot.contains_key(a), "`{a}` used but never defined");
                if let Some(&d) = gate_of.get(a.as_str()) {
                    waiting[i] += 1;
                    readers[d].push(i);
                }
            }
        }
        let mut ready: Vec<usize> = (0..gates.len()).filter(|&i| waiting[i] == 0).collect();
        let mut order = Vec::with_capacity(gates.len());
        while let Some(i) = ready.pop() {
            let g = &gates[i];
            order.push((
                slot[&g.0],
                g.1.clone(),
                g.2.iter().map(|a| slot[a]).collect(),
            ));
            for &r in &readers[i] {
                waiting[r] -= 1;
                if waiting[r] == 0 {
                    ready.push(r);
                }
            }
        }
        assert_eq!(order.len(), gates.len(), "combinational loop");
        let input_slot = inputs.iter().map(|n| slot[n]).collect();
        let output_slot = outputs.iter().map(|n| slot[n]).collect();
        Bench {
            inputs,
            outputs,
            order,
            slots: slot.len(),
            input_slot,
            output_slot,
        }
    }

    /// Number of gate lines.
    pub fn gates(&self) -> usize {
        self.order.len()
    }

    /// Evaluate: one word per input (file order) -> one word per output (file order).
    pub fn eval(&self, inputs: &[u64]) -> Vec<u64> {
        assert_eq!(inputs.len(), self.inputs.len());
        let mut v = vec![0u64; self.slots];
        for (&s, &w) in self.input_slot.iter().zip(inputs) {
            v[s] = w;
        }
        for (out, op, ins) in &self.order {
            let vals = ins.iter().map(|&i| v[i]);
            v[*out] = match op.as_str() {
                "AND" => vals.fold(!0, |a, b| a & b),
                "NAND" => !vals.fold(!0, |a, b| a & b),
                "OR" => vals.fold(0, |a, b| a | b),
                "NOR" => !vals.fold(0, |a, b| a | b),
                "XOR" => vals.fold(0, |a, b| a ^ b),
                "XNOR" => !vals.fold(0, |a, b| a ^ b),
                "NOT" => !v[ins[0]],
                "BUF" | "BUFF" => v[ins[0]],
                other => panic!("unknown gate {other}"),
            };
        }
        self.output_slot.iter().map(|&s| v[s]).collect()
    }
}

/// `d[3]` -> (`d`, 3); `v` -> (`v`, 0).
pub fn split_bit(name: &str) -> (&str, u32) {
    match name.find('[') {
        Some(i) => (
            &name[..i],
            name[i + 1..name.len() - 1].parse().expect("bit index"),
        ),
        None => (name, 0),
    }
}
