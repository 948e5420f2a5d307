//! Fuzz campaigns for the readers (bench, Verilog, `--expect`, cost model, `--assume`), run by
//! `scripts/fuzz`: grammar-aware inputs and byte mutations (generators in
//! `tests/fuzzgen/mod.rs`), each run under a panic hook with a time check; a watchdog stops the
//! campaign on an input that runs over 10 s, and a counting allocator records the largest
//! memory any one input needed.
//!
//! Usage: `fuzz_readers [--reader NAME|all] [--execs N] [--seed S] [--slow-ms MS]
//! [--only INDEX] [--save DIR]`. Input INDEX of seed S is the same on every machine, so a
//! failure is replayed with `--only INDEX`; `--save DIR` writes failing inputs there.

#[path = "../tests/fuzzgen/mod.rs"]
mod fuzzgen;

use fuzzgen::Reader;
use std::alloc::{GlobalAlloc, Layout, System};
use std::process::ExitCode;
use std::sync::atomic::{AtomicU64, AtomicUsize, Ordering};
use std::sync::Arc;
use std::time::{Duration, Instant};

/// The system allocator with a count of live bytes and their high-water mark.
struct Counting;

static LIVE: AtomicUsize = AtomicUsize::new(0);
static PEAK: AtomicUsize = AtomicUsize::new(0);

unsafe impl GlobalAlloc for Counting {
    unsafe fn alloc(&self, l: Layout) -> *mut u8 {
        let p = System.alloc(l);
        if !p.is_null() {
            let now = LIVE.fetch_add(l.size(), Ordering::Relaxed) + l.size();
            PEAK.fetch_max(now, Ordering::Relaxed);
        }
        p
    }
    unsafe fn dealloc(&self, p: *mut u8, l: Layout) {
        System.dealloc(p, l);
        LIVE.fetch_sub(l.size(), Ordering::Relaxed);
    }
    unsafe fn realloc(&self, p: *mut u8, l: Layout, new: usize) -> *mut u8 {
        let q = System.realloc(p, l, new);
        if !q.is_null() {
            if new > l.size() {
                let now = LIVE.fetch_add(new - l.size(), Ordering::Relaxed) + new - l.size();
                PEAK.fetch_max(now, Ordering::Relaxed);
            } else {
                LIVE.fetch_sub(l.size() - new, Ordering::Relaxed);
            }
        }
        q
    }
}

#[global_allocator]
static GLOBAL: Counting = Counting;

struct Opts {
    readers: Vec<Reader>,
    execs: u64,
    seed: u64,
    slow: Duration,
    only: Option<u64>,
    save: Option<std::path::PathBuf>,
}

fn parse_args() -> Result<Opts, String> {
    let mut o = Opts {
        readers: Reader::ALL.to_vec(),
        execs: 10_000,
        seed: 1,
        slow: Duration::from_millis(1000),
        only: None,
        save: None,
    };
    let mut args = std::env::args().skip(1);
    while let Some(a) = args.next() {
        let mut val = || args.next().ok_or(format!("{a} needs a value"));
        match a.as_str() {
            "--reader" => {
                let v = val()?;
                if v != "all" {
                    o.readers = v
                        .split(',')
                        .map(|n| Reader::from_name(n).ok_or(format!("unknown reader {n}")))
                        .collect::<Result<_, _>>()?;
                }
            }
            "--execs" => o.execs = val()?.parse().map_err(|e| format!("--execs: {e}"))?,
            "--seed" => o.seed = val()?.parse().map_err(|e| format!("--seed: {e}"))?,
            "--slow-ms" => {
                o.slow = Duration::from_millis(val()?.parse().map_err(|e| format!("{e}"))?)
            }
            "--only" => o.only = Some(val()?.parse().map_err(|e| format!("--only: {e}"))?),
            "--save" => o.save = Some(val()?.into()),
            _ => return Err(format!("unknown argument {a}")),
        }
    }
    Ok(o)
}

/// Seed files: the committed fixtures and examples of each format.
fn seeds(reader: Reader) -> Vec<Vec<u8>> {
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR"));
    let (dirs, ext): (&[&str], &str) = match reader {
        Reader::Bench => (
            &[
                "tests/data/bench/err",
                "bench-circuits/examples",
                "bench-circuits/mutants",
            ],
            "bench",
        ),
        Reader::Verilog => (
            &[
                "tests/data/verilog/ok",
                "tests/data/verilog/err",
                "src/demo/files",
            ],
            "v",
        ),
        _ => (&[], ""),
    };
    let mut out = Vec::new();
    for d in dirs {
        let Ok(rd) = std::fs::read_dir(root.join(d)) else {
            continue;
        };
        let mut paths: Vec<_> = rd.filter_map(|e| e.ok().map(|e| e.path())).collect();
        paths.sort();
        for p in paths {
            if p.extension().is_some_and(|e| e == ext) {
                if let Ok(b) = std::fs::read(&p) {
                    if b.len() < 200_000 {
                        out.push(b);
                    }
                }
            }
        }
    }
    out
}

fn main() -> ExitCode {
    let o = match parse_args() {
        Ok(o) => o,
        Err(e) => {
            eprintln!("fuzz_readers: {e}");
            return ExitCode::from(2);
        }
    };
    let ctx = fuzzgen::context_design();
    // The watchdog: the index in flight and when it started.
    let current = Arc::new(AtomicU64::new(u64::MAX));
    let started = Arc::new(AtomicU64::new(0));
    let epoch = Instant::now();
    {
        let (current, started) = (current.clone(), started.clone());
        std::thread::spawn(move || loop {
            std::thread::sleep(Duration::from_millis(500));
            let i = current.load(Ordering::SeqCst);
            let t0 = started.load(Ordering::SeqCst);
            if i != u64::MAX && epoch.elapsed().as_millis() as u64 > t0 + 10_000 {
                eprintln!("HANG: input {i} has run over 10 s; replay with --only {i}");
                std::process::exit(1);
            }
        });
    }
    let mut failures = 0u64;
    for &reader in &o.readers {
        let seeds = seeds(reader);
        let range = match o.only {
            Some(i) => i..i + 1,
            None => 0..o.execs,
        };
        let t = Instant::now();
        let (mut accepted, mut rejected, mut bytes) = (0u64, 0u64, 0u64);
        let mut worst = (Duration::ZERO, 0u64);
        let mut worst_mem = (0usize, 0u64);
        for i in range.clone() {
            let input = fuzzgen::input(reader, o.seed, i, &seeds);
            bytes += input.len() as u64;
            if o.only.is_some() {
                println!("{}", String::from_utf8_lossy(&input));
            }
            let base = LIVE.load(Ordering::Relaxed);
            PEAK.store(base, Ordering::Relaxed);
            started.store(epoch.elapsed().as_millis() as u64, Ordering::SeqCst);
            current.store(i, Ordering::SeqCst);
            let t1 = Instant::now();
            let res = fuzzgen::run(reader, &input, &ctx, o.slow);
            let took = t1.elapsed();
            current.store(u64::MAX, Ordering::SeqCst);
            let mem = PEAK.load(Ordering::Relaxed).saturating_sub(base);
            if took > worst.0 {
                worst = (took, i);
            }
            if mem > worst_mem.0 {
                worst_mem = (mem, i);
            }
            match res {
                Ok(fuzzgen::Outcome::Accepted) => accepted += 1,
                Ok(fuzzgen::Outcome::Rejected) => rejected += 1,
                Err(f) => {
                    failures += 1;
                    println!(
                        "FAIL {} seed {} input {i}: {}",
                        reader.name(),
                        o.seed,
                        f.what.lines().next().unwrap_or("")
                    );
                    if let Some(dir) = &o.save {
                        let _ = std::fs::create_dir_all(dir);
                        let p = dir.join(format!("{}-{}-{i}.in", reader.name(), o.seed));
                        let _ = std::fs::write(&p, &input);
                    }
                }
            }
        }
        let n = range.end - range.start;
        println!(
            "{:8} execs {n} accepted {accepted} rejected {rejected} bytes {bytes} seconds {:.1} \
             slowest {:.1} ms (input {}) most memory {:.1} MiB (input {})",
            reader.name(),
            t.elapsed().as_secs_f64(),
            worst.0.as_secs_f64() * 1e3,
            worst.1,
            worst_mem.0 as f64 / (1 << 20) as f64,
            worst_mem.1
        );
    }
    let hwm = std::fs::read_to_string("/proc/self/status")
        .ok()
        .and_then(|s| {
            s.lines()
                .find(|l| l.starts_with("VmHWM"))
                .map(|l| l.split_whitespace().nth(1).unwrap_or("?").to_string())
        })
        .unwrap_or_else(|| "?".into());
    println!("failures {failures} peak RSS {hwm} kB");
    if failures == 0 {
        ExitCode::SUCCESS
    } else {
        ExitCode::FAILURE
    }
}
