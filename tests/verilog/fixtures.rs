//! Data-driven fixtures: every tests/data/verilog/err/NAME.v must fail with exactly the text
//! in NAME.expected; every ok/NAME.v must read, with the summary in NAME.expected.

use super::common::data_dir;
use equicone::front::verilog::read_verilog;
use std::sync::Arc;

/// Read fixture `path` (named by its file name) and render the outcome as text.
fn check(path: &std::path::Path) -> String {
    let name = path.file_name().unwrap().to_string_lossy().into_owned();
    let text = std::fs::read_to_string(path).expect("read fixture");
    match read_verilog(&[(Arc::from(name.as_str()), text)], None) {
        Err(e) => format!("{e}\n"),
        Ok(d) => {
            let first = |v: Vec<&String>| format!("{} ({} .. {})", v.len(), v[0], v[v.len() - 1]);
            format!(
                "top: {}\ninputs: {}\noutputs: {}\nwarnings: {}\n",
                d.name,
                first(d.inputs.iter().map(|b| &b.name).collect()),
                first(d.outputs.iter().map(|b| &b.name).collect()),
                d.warnings.len()
            )
        }
    }
}

fn run_dir(sub: &str, want_error: bool) {
    let dir = data_dir().join(sub);
    let mut n = 0;
    let mut paths: Vec<_> = std::fs::read_dir(&dir)
        .expect("fixture dir")
        .map(|e| e.unwrap().path())
        .collect();
    paths.sort();
    for p in paths
        .iter()
        .filter(|p| p.extension().is_some_and(|e| e == "v"))
    {
        let got = check(p);
        let want = std::fs::read_to_string(p.with_extension("expected"))
            .expect("NAME.expected beside the fixture");
        assert_eq!(
            got.contains(": error: "),
            want_error,
            "{}:\n{got}",
            p.display()
        );
        assert_eq!(got, want, "{}", p.display());
        n += 1;
    }
    assert!(n > 0, "no fixtures in {}", dir.display());
}

#[test]
fn err_fixtures_give_their_exact_messages() {
    run_dir("err", true);
}

#[test]
fn ok_fixtures_read() {
    run_dir("ok", false);
}
