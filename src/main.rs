//! The `equicone` binary: parse the command line, run the library, map the result to an exit code.

use clap::Parser;
use std::process::ExitCode;

fn main() -> ExitCode {
    env_logger::Builder::from_env(env_logger::Env::default().default_filter_or("warn")).init();
    let cli = match equicone::cli::Cli::try_parse() {
        Ok(c) => c,
        Err(e) => {
            let _ = e.print();
            return ExitCode::from(if e.use_stderr() { 2 } else { 0 });
        }
    };
    // Netlists can be deep; give the work a large stack as a second line of defence
    // (the passes themselves iterate rather than recurse on netlist depth).
    let worker = std::thread::Builder::new()
        .stack_size(256 << 20)
        .spawn(move || equicone::cli::run(cli));
    match worker.map(|h| h.join()) {
        Ok(Ok(code)) => ExitCode::from(code as u8),
        _ => ExitCode::from(equicone::cli::Exit::Internal as u8),
    }
}
