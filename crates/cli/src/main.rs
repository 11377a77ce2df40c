//! `framewise`: the kernel on the command line, JSON in and out (DESIGN.md §8).

/// Prints a line to stdout; a closed pipe (`framewise eval … | head`) is not an error.
macro_rules! out {
    ($($arg:tt)*) => {{
        use std::io::Write as _;
        let _ = writeln!(std::io::stdout().lock(), $($arg)*);
    }};
}

mod cmd_import;

use framewise_formats::{report_to_json, scenario_from_json};
use framewise_kernel::{evaluate, FieldError, Report};
mod cmd_link;

use std::io::Read;
use std::process::ExitCode;

const USAGE: &str = "usage: framewise <command> [FILE|-]

commands:
  eval FILE|-    read a scenario (JSON) and print the report as JSON
  draw FILE|-    read a scenario and print the first bike's side view as SVG
  link FILE|-    read a scenario and print its share link fragment (with the leading #)
  open LINK      read a link (fragment with or without #, or a whole URL), print the scenario
  import CHART|- read a pasted geometry chart and print its size run as JSON
  catalogue      print the frame measurements (key, label, definition, unit, ranges) as JSON
  help           show this text";

fn read_input(path: Option<&str>) -> Result<String, String> {
    match path {
        None => Err(format!(
            "missing FILE (use - for standard input)\n\n{USAGE}"
        )),
        Some("-") => {
            let mut s = String::new();
            std::io::stdin()
                .read_to_string(&mut s)
                .map_err(|e| format!("cannot read standard input: {e}"))?;
            Ok(s)
        }
        Some(p) => std::fs::read_to_string(p).map_err(|e| format!("cannot read {p}: {e}")),
    }
}

fn error_report(e: FieldError) -> Report {
    Report {
        version: framewise_kernel::report::REPORT_VERSION,
        bikes: Vec::new(),
        errors: vec![e],
    }
}

fn eval_report(path: Option<&str>) -> Result<Report, String> {
    let text = read_input(path)?;
    Ok(match scenario_from_json(&text) {
        Ok(s) => evaluate(&s),
        Err(e) => error_report(e),
    })
}

fn run(args: &[String]) -> Result<ExitCode, String> {
    let cmd = args.first().map(String::as_str);
    let file = args.get(1).map(String::as_str);
    match cmd {
        Some("eval") => {
            let report = eval_report(file)?;
            out!("{}", report_to_json(&report));
            for e in &report.errors {
                eprintln!("error: {e}");
            }
            Ok(if report.errors.is_empty() {
                ExitCode::SUCCESS
            } else {
                ExitCode::FAILURE
            })
        }
        Some("draw") => {
            let report = eval_report(file)?;
            for e in &report.errors {
                eprintln!("error: {e}");
            }
            match (report.errors.is_empty(), report.bikes.first()) {
                (true, Some(b)) => {
                    out!("{}", framewise_draw::draw_bike(b));
                    Ok(ExitCode::SUCCESS)
                }
                (true, None) => Err("the scenario has no bike to draw".into()),
                _ => Ok(ExitCode::FAILURE),
            }
        }
        // Share links (issue 6): see cmd_link.rs.
        Some("link") => {
            out!("{}", cmd_link::link(&read_input(file)?)?);
            Ok(ExitCode::SUCCESS)
        }
        Some("open") => {
            let text = file.ok_or_else(|| format!("missing LINK\n\n{USAGE}"))?;
            out!("{}", cmd_link::open(text)?);
            Ok(ExitCode::SUCCESS)
        }
        Some("import") => cmd_import::run(file),
        Some("catalogue") => {
            let json = serde_json::to_string_pretty(framewise_kernel::CATALOGUE)
                .map_err(|e| format!("cannot write the catalogue: {e}"))?;
            out!("{json}");
            Ok(ExitCode::SUCCESS)
        }
        Some("help" | "-h" | "--help") => {
            out!("{USAGE}");
            Ok(ExitCode::SUCCESS)
        }
        Some(other) => Err(format!("unknown command \"{other}\"\n\n{USAGE}")),
        None => Err(USAGE.to_string()),
    }
}

fn main() -> ExitCode {
    let args: Vec<String> = std::env::args().skip(1).collect();
    match run(&args) {
        Ok(code) => code,
        Err(msg) => {
            eprintln!("framewise: {msg}");
            ExitCode::from(2)
        }
    }
}
