//! Replays saved differential-test failures (tests/data/verilog/regress/*.v with the
//! simulator's output beside it in *.expect), so a fixed bug stays fixed without iverilog.

use super::common::data_dir;
use super::iverilog_diff::{compare, vars};

#[test]
fn saved_regressions_still_match() {
    let dir = data_dir().join("regress");
    let mut n = 0;
    for entry in std::fs::read_dir(&dir).expect("regress dir") {
        let p = entry.expect("entry").path();
        if p.extension().and_then(|e| e.to_str()) != Some("v") {
            continue;
        }
        let module = std::fs::read_to_string(&p).expect("read");
        let expect = std::fs::read_to_string(p.with_extension("expect"))
            .expect("expect file beside the fixture");
        let vs = vars();
        let mut vectors = Vec::new();
        let mut lines = Vec::new();
        for l in expect.lines() {
            let (ins, outs) = l.split_once(" -> ").expect("`inputs -> outputs`");
            let vals: Vec<u64> = ins
                .split_whitespace()
                .map(|kv| {
                    kv.split_once('=')
                        .expect("name=value")
                        .1
                        .parse()
                        .expect("number")
                })
                .collect();
            vectors.push(vals);
            lines.push(outs.to_string());
        }
        let widths: Vec<u32> = lines[0]
            .split_whitespace()
            .map(|w| w.len() as u32)
            .collect();
        if let Err(m) = compare(&module, &vs, &widths, &vectors, &lines, 7) {
            panic!("{}: {m}", p.display());
        }
        n += 1;
    }
    assert!(
        n > 0,
        "no fixture replayed from {}: the folder must hold at least one",
        dir.display()
    );
    eprintln!("replayed {n} regression fixtures");
}
