//! The web API and the page's files: a request (method, path, body) in, a [`Reply`] out.
//! No socket here, so every route is tested as a plain function call; [`super::server`]
//! puts replies on the wire.
//!
//! `POST /api/<command>` for state, saturation, flash, envelope, compare and table runs the
//! command with the options of the body ([`super::request`]) and answers the same JSON as
//! `zfactor <command> ... --format json` prints. How an outcome maps to HTTP:
//!
//! | outcome                                   | exit code | HTTP status |
//! |-------------------------------------------|-----------|-------------|
//! | result                                    | 0         | 200         |
//! | result with warnings (in `warnings`)      | 3         | 200         |
//! | input refused (the command line's message) | 2        | 422         |
//! | computation failed                        | 1         | 500         |
//! | body not a JSON object, unknown option    | 2         | 400         |
//! | body or grid over the limits              | 2         | 413         |
//!
//! The exit code of the command line is also sent as the header `X-Zfactor-Exit`.

use super::assets;
use super::request::{self, Endpoint, Refusal};
use super::workbook;
use crate::cli::{Cli, Command, FluidsArgs, Format, ModelsArgs};
use crate::commands::{compare, envelope, flash, fluids, models, saturation, state, table};
use crate::compare::grid;
use crate::error::CliError;
use crate::exit::Exit;
use crate::render::json;
use crate::render::output::Output;
use crate::{input_notes, units};
use clap::Parser;

/// The largest request body, in bytes.
pub const MAX_BODY: usize = 1 << 20;
/// The most states a comparison or a table computes for one request (the command line has
/// no such limit; a page does not show more).
pub const MAX_STATES: usize = 10_000;

/// An answer to one request.
#[derive(Debug, Clone)]
pub struct Reply {
    pub status: u16,
    pub content_type: &'static str,
    pub body: Vec<u8>,
    /// The command line's exit code for the same request, for API calls.
    pub exit: Option<Exit>,
    /// A file name to offer the download under.
    pub attachment: Option<&'static str>,
}

const JSON: &str = "application/json; charset=utf-8";

impl Reply {
    fn json(status: u16, body: String, exit: Option<Exit>) -> Reply {
        Reply {
            status,
            content_type: JSON,
            body: body.into_bytes(),
            exit,
            attachment: None,
        }
    }

    /// An error: `{"error": message, "exit": code}`.
    pub fn error(status: u16, message: &str, exit: Exit) -> Reply {
        let body = serde_json::json!({ "error": message, "exit": exit as u8 });
        Reply::json(status, format!("{body}\n"), Some(exit))
    }

    fn refused(r: Refusal) -> Reply {
        Reply::error(r.status, &r.message, Exit::BadInput)
    }

    fn from_error(e: &CliError) -> Reply {
        let exit = e.exit_code();
        let status = match exit {
            Exit::BadInput => 422,
            _ => 500,
        };
        Reply::error(status, &e.to_string(), exit)
    }
}

/// Answers one request. `body` is at most [`MAX_BODY`] bytes (the server refuses longer
/// ones before reading them).
pub fn handle(method: &str, path: &str, body: &[u8]) -> Reply {
    let path = path.split(['?', '#']).next().unwrap_or(path);
    if let Some(command) = path.strip_prefix("/api/") {
        return api(method, command, body);
    }
    match assets::find(path) {
        Some(asset) if method == "GET" || method == "HEAD" => Reply {
            status: 200,
            content_type: asset.content_type,
            body: asset.bytes.to_vec(),
            exit: None,
            attachment: None,
        },
        Some(_) => method_not_allowed("GET"),
        None => Reply::error(404, &format!("nothing at {path}"), Exit::BadInput),
    }
}

fn method_not_allowed(allowed: &str) -> Reply {
    Reply::error(
        405,
        &format!("use {allowed} for this address"),
        Exit::BadInput,
    )
}

fn api(method: &str, command: &str, body: &[u8]) -> Reply {
    match (command, method) {
        ("models", "GET") => listing(|| {
            models::run(&ModelsArgs {
                id: None,
                format: Format::Json,
            })
            .and_then(|r| json::to_string(&r))
        }),
        ("fluids", "GET") => listing(|| {
            fluids::run(&FluidsArgs {
                name: None,
                search: None,
                format: Format::Json,
            })
            .and_then(|r| json::to_string(&r))
        }),
        ("about", "GET") => {
            let body = serde_json::json!({
                "tool": concat!("zfactor ", env!("CARGO_PKG_VERSION")),
                "demo_gas": crate::commands::demo::DEMO_GAS,
                "commands": request::ENDPOINTS.map(|e| e.command),
                "max_states": MAX_STATES,
                "max_body_bytes": MAX_BODY,
                "caution": crate::CAUTION,
            });
            Reply::json(200, format!("{body:#}\n"), Some(Exit::Success))
        }
        ("models" | "fluids" | "about", _) => method_not_allowed("GET"),
        ("xlsx", "POST") => match workbook::from_json(body) {
            Ok(bytes) => Reply {
                status: 200,
                content_type: workbook::CONTENT_TYPE,
                body: bytes,
                exit: Some(Exit::Success),
                attachment: Some("zfactor.xlsx"),
            },
            Err(r) => Reply::refused(r),
        },
        ("xlsx", _) => method_not_allowed("POST"),
        _ => match Endpoint::named(command) {
            Some(e) if method == "POST" => run(e, body),
            Some(_) => method_not_allowed("POST"),
            None => Reply::error(
                404,
                &format!(
                    "no API command \"{command}\"; there are: {}, models, fluids, about, xlsx",
                    request::ENDPOINTS.map(|e| e.command).join(", ")
                ),
                Exit::BadInput,
            ),
        },
    }
}

fn listing(f: impl FnOnce() -> Result<String, CliError>) -> Reply {
    match f() {
        Ok(body) => Reply::json(200, body, Some(Exit::Success)),
        Err(e) => Reply::from_error(&e),
    }
}

/// Runs an API command: parsed by the command line's parser, checked against the limits,
/// then the command's own run; its report as JSON with the input notes among its warnings.
fn run(endpoint: Endpoint, body: &[u8]) -> Reply {
    let words = match request::argv(endpoint, body) {
        Ok(w) => w,
        Err(r) => return Reply::refused(r),
    };
    let cli = match Cli::try_parse_from(&words) {
        Ok(c) => c,
        Err(e) => return Reply::error(422, e.to_string().trim_end(), Exit::BadInput),
    };
    let (outcome, notes) = input_notes::scoped(|| match check_size(&cli.command) {
        Err(r) => Err(Reply::refused(r)),
        Ok(()) => report(&cli.command).map_err(|e| Reply::from_error(&e)),
    });
    match outcome {
        Ok((text, warnings)) => {
            let exit = if warnings.is_empty() && notes.is_empty() {
                Exit::Success
            } else {
                Exit::SuccessWithWarnings
            };
            Reply::json(200, with_notes(text, &notes), Some(exit))
        }
        Err(reply) => reply,
    }
}

/// The report's JSON with the input notes added to its `warnings` (the command line prints
/// them on stderr as warnings).
fn with_notes(text: String, notes: &[String]) -> String {
    if notes.is_empty() {
        return text;
    }
    let Ok(mut value) = serde_json::from_str::<serde_json::Value>(&text) else {
        return text;
    };
    if let Some(serde_json::Value::Array(w)) = value.get_mut("warnings") {
        w.extend(notes.iter().cloned().map(serde_json::Value::String));
    }
    json::to_string(&value).unwrap_or(text)
}

/// Refuses a comparison or table of more than [`MAX_STATES`] states (413). Axes that cannot
/// be read are left to the command, which says why.
fn check_size(command: &Command) -> Result<(), Refusal> {
    let (t, p, ambient) = match command {
        Command::Compare(a) => match (&a.temperatures, &a.pressures) {
            (Some(t), Some(p)) => (t, p, &a.ambient),
            _ => return Ok(()),
        },
        Command::Table(a) => (&a.temperatures, &a.pressures, &a.ambient),
        _ => return Ok(()),
    };
    let Ok(ambient) = units::ambient_pressure(ambient) else {
        return Ok(());
    };
    let nt = grid::parse_axis(t, units::temperature).map_or(0, |v| v.len());
    let np = grid::parse_axis(p, |s| units::pressure_reading(s, ambient).map(|r| r.0))
        .map_or(0, |v| v.len());
    if nt.saturating_mul(np) > MAX_STATES {
        return Err(Refusal::new(
            413,
            format!(
                "{nt} temperatures x {np} pressures = {} states; the web API computes at most \
             {MAX_STATES} per request (the command line has no such limit)",
                nt.saturating_mul(np)
            ),
        ));
    }
    Ok(())
}

/// The report of an API command as JSON, with its warnings.
fn report(command: &Command) -> Result<(String, Vec<String>), CliError> {
    fn out<R: Output>(r: &R) -> Result<(String, Vec<String>), CliError> {
        Ok((json::to_string(r)?, r.warnings().to_vec()))
    }
    match command {
        Command::State(a) => out(&state::run(a)?),
        Command::Saturation(a) => out(&saturation::run(a)?),
        Command::Flash(a) => out(&flash::run(a)?),
        Command::Envelope(a) => out(&envelope::run(a)?),
        Command::Compare(a) => {
            let r = compare::run(a)?;
            Ok((json::to_string(&r)?, r.warnings.clone()))
        }
        Command::Table(a) => {
            let mut text = Vec::new();
            let warnings = table::write(a, &mut text, None)?;
            let text = String::from_utf8(text).map_err(|e| CliError::Output(e.to_string()))?;
            Ok((text, warnings))
        }
        _ => Err(CliError::BadInput(
            "this command is not served by the web API".to_string(),
        )),
    }
}
