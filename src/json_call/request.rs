//! A request of the web API read as the command line it stands for.
//!
//! The body of `POST /api/<command>` is one JSON object whose keys are the command's long
//! option names, exactly as on the command line (`{"mix": "methane=0.9,ethane=0.1",
//! "temperature": "25 degC", "pressure": "70 barg", "model": "pr,srk"}`). Each command takes
//! a fixed list of options, none of which names a file: the page and the API read and write
//! no file on the server. The options then go through the command line's own parser, so
//! the API has the command line's validation, units and messages by construction.

use serde_json::{Map, Value};

/// What the API refuses before a command runs, with its HTTP status.
#[derive(Debug, Clone, PartialEq)]
pub struct Refusal {
    pub status: u16,
    pub message: String,
}

impl Refusal {
    pub fn new(status: u16, message: impl Into<String>) -> Refusal {
        Refusal {
            status,
            message: message.into(),
        }
    }
}

/// The options of a fluid or mixture (files excluded).
const FLUID: [&str; 5] = ["fluid", "mix", "basis", "normalize", "kij"];

/// A command of the API: its name and the options it takes besides [`FLUID`].
#[derive(Debug, Clone, Copy)]
pub struct Endpoint {
    pub command: &'static str,
    pub options: &'static [&'static str],
}

/// The commands the API runs, with the options each accepts.
pub const ENDPOINTS: [Endpoint; 6] = [
    Endpoint {
        command: "state",
        options: &[
            "temperature",
            "pressure",
            "density",
            "enthalpy",
            "entropy",
            "quality",
            "ambient",
            "model",
            "root",
        ],
    },
    Endpoint {
        command: "saturation",
        options: &["temperature", "pressure", "ambient", "model"],
    },
    Endpoint {
        command: "flash",
        options: &[
            "temperature",
            "pressure",
            "enthalpy",
            "entropy",
            "bubble-pressure",
            "dew-pressure",
            "bubble-temperature",
            "dew-temperature",
            "ambient",
            "model",
        ],
    },
    Endpoint {
        command: "envelope",
        options: &["model", "start-pressure", "ambient"],
    },
    Endpoint {
        command: "compare",
        options: &[
            "temperatures",
            "pressures",
            "ambient",
            "model",
            "reference",
            "tolerance",
        ],
    },
    Endpoint {
        command: "table",
        options: &[
            "temperatures",
            "pressures",
            "ambient",
            "model",
            "properties",
        ],
    },
];

/// The audit's options besides its file and its annotated copy, for the Python binding, which
/// passes the two file names itself (the web API runs no audit: it reads and writes no file).
pub const AUDIT: Endpoint = Endpoint {
    command: "audit",
    options: &[
        "sheet",
        "columns",
        "quantity",
        "model",
        "tolerance",
        "base",
        "ambient",
    ],
};

impl Endpoint {
    /// The endpoint of `command`, if the API runs it.
    pub fn named(command: &str) -> Option<Endpoint> {
        ENDPOINTS.iter().copied().find(|e| e.command == command)
    }

    /// Whether the endpoint takes option `key`.
    pub fn takes(&self, key: &str) -> bool {
        FLUID.contains(&key) || self.options.contains(&key)
    }

    /// Every option the endpoint takes, fluid options first.
    pub fn all_options(&self) -> Vec<&'static str> {
        FLUID.iter().chain(self.options).copied().collect()
    }
}

/// The command-line words of a request body: the program name, the command, each option as
/// `--name=value` (a flag as `--name` when true, left out when false or null), then
/// `--format json`.
pub fn argv(endpoint: Endpoint, body: &[u8]) -> Result<Vec<String>, Refusal> {
    argv_with(endpoint, &[], body)
}

/// [`argv`] with `leading` words (an audit's file) after the command.
pub fn argv_with(
    endpoint: Endpoint,
    leading: &[String],
    body: &[u8],
) -> Result<Vec<String>, Refusal> {
    let value: Value = serde_json::from_slice(body)
        .map_err(|e| Refusal::new(400, format!("the request body is not JSON: {e}")))?;
    let Value::Object(fields) = value else {
        return Err(Refusal::new(
            400,
            "the request body must be one JSON object of options, e.g. {\"fluid\": \"methane\"}",
        ));
    };
    let mut words = vec!["zfactor".to_string(), endpoint.command.to_string()];
    words.extend(leading.iter().cloned());
    words.extend(option_words(endpoint, &fields)?);
    words.extend(["--format".to_string(), "json".to_string()]);
    Ok(words)
}

fn option_words(endpoint: Endpoint, fields: &Map<String, Value>) -> Result<Vec<String>, Refusal> {
    let mut words = Vec::new();
    for (key, value) in fields {
        if !endpoint.takes(key) {
            return Err(Refusal::new(
                400,
                format!(
                    "\"{key}\" is not an option of {} here; it takes: {}",
                    endpoint.command,
                    endpoint.all_options().join(", ")
                ),
            ));
        }
        match value {
            Value::Null | Value::Bool(false) => {}
            Value::Bool(true) => words.push(format!("--{key}")),
            Value::String(s) => words.push(format!("--{key}={s}")),
            Value::Number(n) => words.push(format!("--{key}={n}")),
            Value::Array(_) | Value::Object(_) => {
                return Err(Refusal::new(
                    400,
                    format!(
                        "\"{key}\": give a text (\"25 degC\", \"pr,srk\") or true, as on the \
                         command line"
                    ),
                ))
            }
        }
    }
    Ok(words)
}

#[cfg(test)]
mod tests {
    use super::*;
    use clap::CommandFactory;

    #[test]
    fn a_body_becomes_the_command_line_it_stands_for() {
        let e = Endpoint::named("state").unwrap();
        let body = br#"{"fluid": "methane", "temperature": "-40 degC", "pressure": 50,
                        "normalize": true, "kij": null}"#;
        assert_eq!(
            argv(e, body).unwrap(),
            [
                "zfactor",
                "state",
                "--fluid=methane",
                "--normalize",
                "--pressure=50",
                "--temperature=-40 degC",
                "--format",
                "json"
            ]
        );
    }

    #[test]
    fn options_outside_the_list_and_non_objects_are_refused() {
        let e = Endpoint::named("table").unwrap();
        for body in [
            &br#"{"fluid": "methane", "output": "/etc/passwd"}"#[..],
            br#"{"mix-file": "gas.csv"}"#,
            br#"{"format": "csv"}"#,
            br#"["fluid"]"#,
            br#"{"fluid": ["methane"]}"#,
            b"fluid=methane",
        ] {
            let r = argv(e, body).unwrap_err();
            assert_eq!(r.status, 400, "{}", String::from_utf8_lossy(body));
        }
    }

    /// Every option the API passes on exists on its command, and none of them reads or
    /// writes a file (the command line's file options end in "file", or are output, charts,
    /// states, chart, pv, force, components).
    #[test]
    fn every_option_is_the_commands_own_and_none_touches_a_file() {
        let cli = crate::cli::Cli::command();
        let files = [
            "output",
            "charts",
            "states",
            "chart",
            "pv",
            "force",
            "components",
        ];
        for e in ENDPOINTS {
            let sub = cli.find_subcommand(e.command).unwrap();
            for key in e.all_options() {
                assert!(
                    sub.get_arguments().any(|a| a.get_long() == Some(key)),
                    "{} has no option --{key}",
                    e.command
                );
                assert!(!key.ends_with("file") && !files.contains(&key), "{key}");
            }
        }
    }
}
