//! The web API and the page's files: a request (method, path, body) in, a [`Reply`] out.
//! No socket here, so every route is tested as a plain function call; [`super::server`]
//! puts replies on the wire.
//!
//! `POST /api/<command>` for state, saturation, flash, envelope, compare and table runs the
//! command with the options of the body ([`crate::json_call`]) and answers the same JSON as
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
use super::workbook;
use crate::cli::{FluidsArgs, Format, ModelsArgs};
use crate::commands::{fluids, models};
use crate::error::CliError;
use crate::exit::Exit;
use crate::json_call::{self, request};
use crate::render::json;

/// The largest request body, in bytes.
pub const MAX_BODY: usize = 1 << 20;
/// The most states a comparison or a table computes for one request.
pub use crate::json_call::MAX_STATES;

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

    fn from_error(e: &CliError) -> Reply {
        let f = json_call::Failure::from(e);
        Reply::error(f.status, &f.message, f.exit)
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
            Err(r) => Reply::error(r.status, &r.message, Exit::BadInput),
        },
        ("xlsx", _) => method_not_allowed("POST"),
        _ => match request::Endpoint::named(command) {
            Some(_) if method == "POST" => run(command, body),
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

/// Runs an API command through [`crate::json_call::call`].
fn run(command: &str, body: &[u8]) -> Reply {
    match json_call::call(command, body) {
        Ok(a) => Reply::json(200, a.json, Some(a.exit)),
        Err(f) => Reply::error(f.status, &f.message, f.exit),
    }
}
