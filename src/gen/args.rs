//! Command-line options of `equicone gen` as a `clap` argument group, for the CLI to flatten
//! into its `gen` subcommand; [`GenArgs::spec`] turns them into a [`GenSpec`].

use super::{Bug, GenFormat, GenSpec, Kind, Style};

/// Options of `equicone gen KIND ...` (the output file `-o` belongs to the CLI).
#[derive(clap::Args, Clone, Debug, PartialEq, Eq)]
pub struct GenArgs {
    /// What to generate.
    #[arg(value_enum)]
    pub kind: Kind,
    /// Size: channels (selector), select bits (decoder), requests (priority), data bits
    /// (shifter), operand bits (adder, multiplier) or gates (random).
    #[arg(long)]
    pub n: usize,
    /// Channel width in bits (selectors only).
    #[arg(long, default_value_t = 1)]
    pub width: usize,
    /// How to build it; the kind's first style when absent (spec, or plain for random).
    #[arg(long, value_enum)]
    pub style: Option<Style>,
    /// Number of primary inputs (random circuits only).
    #[arg(long, default_value_t = 64)]
    pub inputs: usize,
    /// Seed for every choice the generator makes.
    #[arg(long, default_value_t = 1)]
    pub seed: u64,
    /// Plant a bug.
    #[arg(long, value_enum)]
    pub bug: Option<Bug>,
    /// Where to plant the bug: a net name as printed in the file (e.g. `m0_3`, `d[5]`).
    #[arg(long)]
    pub at: Option<String>,
    /// Verilog module name.
    #[arg(long)]
    pub module: Option<String>,
    /// Output format; from the output file's extension when absent (`.bench` is bench),
    /// else Verilog.
    #[arg(long, value_enum)]
    pub format: Option<GenFormat>,
}

impl GenArgs {
    /// The generator request these options describe (checked by [`super::generate`]).
    pub fn spec(&self) -> GenSpec {
        GenSpec {
            kind: self.kind,
            style: self.style.unwrap_or(self.kind.styles()[0]),
            n: self.n,
            width: self.width,
            inputs: self.inputs,
            seed: self.seed,
            bug: self.bug,
            at: self.at.clone(),
            module: self.module.clone(),
        }
    }

    /// The format to write: `--format`, else from the output path's extension, else Verilog.
    pub fn format_for(&self, output: Option<&str>) -> GenFormat {
        self.format.unwrap_or_else(|| match output {
            Some(p) if p.to_ascii_lowercase().ends_with(".bench") => GenFormat::Bench,
            _ => GenFormat::Verilog,
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use clap::Parser;

    #[derive(Parser)]
    struct Cli {
        #[command(flatten)]
        gen: GenArgs,
    }

    fn parse(line: &str) -> GenArgs {
        let words = line.split_whitespace().map(|w| w.trim_matches('\''));
        Cli::try_parse_from(std::iter::once("gen").chain(words))
            .unwrap()
            .gen
    }

    #[test]
    fn options_give_the_spec() {
        let a = parse("selector --n 12 --width 8 --style mixed --seed 3 --bug swap --at m0_3_0");
        let mut want = GenSpec::new(Kind::Selector, Style::Mixed, 12)
            .width(8)
            .seed(3)
            .bug(Bug::Swap);
        want.at = Some("m0_3_0".to_string());
        assert_eq!(a.spec(), want);
        assert_eq!(a.format_for(Some("x.bench")), GenFormat::Bench);
        assert_eq!(
            parse("adder --n 8 --format bench").format_for(Some("x.v")),
            GenFormat::Bench
        );
        assert_eq!(parse("adder --n 8").spec().style, Style::Spec);
        assert_eq!(parse("random --n 8").spec().style, Style::Plain);
    }

    #[test]
    fn every_set_command_line_parses_back_to_its_spec() {
        let mut entries = super::super::set::committed();
        entries.extend(super::super::set::big(1000));
        for e in entries {
            let line = e.spec.command_line(e.format);
            let rest = line.strip_prefix("equicone gen ").expect("command prefix");
            let a = parse(rest);
            assert_eq!(a.spec(), e.spec, "{line}");
            assert_eq!(a.format_for(Some(&e.path)), e.format, "{line}");
        }
    }
}
