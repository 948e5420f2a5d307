//! The README's JSON schemas name every `method` value the code can emit: the words are
//! collected from the source (the `word()` tables of the engine's methods and the portfolio's
//! stages, and the clocked report's methods), so a new method fails here until documented.

use std::path::Path;

fn source(path: &str) -> String {
    std::fs::read_to_string(Path::new(env!("CARGO_MANIFEST_DIR")).join(path)).unwrap()
}

/// The quoted words after `PREFIX::Variant => "` in `text`.
fn table_words(text: &str, prefix: &str) -> Vec<String> {
    text.lines()
        .filter_map(|l| {
            let l = l.trim();
            let rest = l.strip_prefix(prefix)?;
            let (_, word) = rest.split_once("=> \"")?;
            Some(word.split('"').next()?.to_string())
        })
        .collect()
}

#[test]
fn every_method_word_is_in_the_readme() {
    let readme = source("README.md");
    let start = readme
        .find("## The JSON report of `prove`")
        .expect("schema section");
    let end = readme[start..].find("## Input formats").expect("its end") + start;
    let schema = &readme[start..end];
    let mut words = table_words(&source("src/engine/result.rs"), "Method::");
    assert!(words.len() >= 8, "{words:?}");
    words.push("none".to_string());
    // The portfolio's stages, wherever in the engine their table is.
    let engine: String =
        std::fs::read_dir(Path::new(env!("CARGO_MANIFEST_DIR")).join("src/engine"))
            .unwrap()
            .map(|e| e.unwrap().path())
            .filter(|p| p.extension().is_some_and(|x| x == "rs"))
            .map(|p| std::fs::read_to_string(p).unwrap())
            .collect();
    let mut stages = table_words(&engine, "Stage::");
    stages.sort();
    stages.dedup();
    assert!(stages.len() >= 4, "{stages:?}");
    words.extend(stages);
    let missing: Vec<&String> = words
        .iter()
        .filter(|w| !schema.contains(&format!("\"{w}\"")))
        .collect();
    assert!(
        missing.is_empty(),
        "methods the README's schema does not list: {missing:?}"
    );
    // The clocked report: every `OutputStatus::Equivalent("...")` and the words of its
    // `method` table.
    let seq: String = ["src/seq/mod.rs", "src/seq/report.rs"]
        .iter()
        .map(|p| source(p))
        .collect();
    let mut clocked: Vec<String> = seq
        .match_indices("OutputStatus::Equivalent(\"")
        .map(|(i, m)| seq[i + m.len()..].split('"').next().unwrap().to_string())
        .collect();
    let block = seq
        .split("method: match st {")
        .nth(1)
        .expect("the method table");
    let block = &block[..block.find("},").expect("its end")];
    clocked.extend(table_words(block, "OutputStatus::"));
    assert!(clocked.len() >= 3, "{clocked:?}");
    let at = readme
        .find("\"kind\": \"clocked\"")
        .expect("clocked schema");
    let para = &readme[at..at + 600];
    let missing: Vec<&String> = clocked
        .iter()
        .filter(|w| !para.contains(&format!("\"{w}\"")))
        .collect();
    assert!(
        missing.is_empty(),
        "clocked methods the README does not list: {missing:?}"
    );
}

/// `eval --json` and `routes --json` carry `schema`.
#[test]
fn eval_and_routes_json_carry_a_schema() {
    use crate::common::*;
    let e = equicone(&[
        "eval",
        "bench-circuits/examples/mux4_spec.bench",
        "--set",
        "s=2",
        "--set",
        "d=4",
        "--json",
    ]);
    assert_eq!(code(&e), 0, "{}", stderr(&e));
    let v: serde_json::Value = serde_json::from_str(&stdout(&e)).unwrap();
    assert_eq!(v["schema"], 1);
    let e = equicone(&[
        "routes",
        "bench-circuits/examples/mux4_spec.bench",
        "--select",
        "s",
        "--json",
    ]);
    assert_eq!(code(&e), 0, "{}", stderr(&e));
    let v: serde_json::Value = serde_json::from_str(&stdout(&e)).unwrap();
    assert_eq!(v["schema"], 1);
    // Without --select, routes takes the usual select name the design has, as prove's
    // diagnosis does; a design with none is a usage error naming the option.
    let d = equicone(&[
        "routes",
        "bench-circuits/examples/mux4_spec.bench",
        "--json",
    ]);
    assert_eq!(code(&d), 0, "{}", stderr(&d));
    let w: serde_json::Value = serde_json::from_str(&stdout(&d)).unwrap();
    assert_eq!(
        (w["select"].clone(), w["tables"].clone()),
        (v["select"].clone(), v["tables"].clone())
    );
    let n = equicone(&["routes", "bench-circuits/decoder/dec3_flat.bench"]);
    assert_eq!(code(&n), 2, "{}", stderr(&n));
    assert!(stderr(&n).contains("--select BUS"), "{}", stderr(&n));
}
