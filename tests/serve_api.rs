//! `zfactor serve` on an ephemeral loopback port: the JSON API against the command line's
//! own JSON for the same options (the API must be the command line by another road), its
//! refusals and limits with their HTTP statuses, the page's files, and a bounded load test
//! (1,008 requests from 16 concurrent clients, loopback only).

use std::io::{BufRead, BufReader, Read, Write};
use std::net::TcpStream;
use std::process::{Child, Command, Stdio};
use std::time::{Duration, Instant};

const BIN: &str = env!("CARGO_BIN_EXE_zfactor");
/// The demo's gas (a mixture of the house's own fictional station, common practice
/// composition of a lean pipeline gas).
const GAS: &str = "methane=0.889,ethane=0.054,propane=0.016,n-butane=0.004,isobutane=0.003,\
nitrogen=0.018,carbon dioxide=0.016";

/// A server started for one test, stopped when dropped; its client is one deref away.
struct Server {
    child: Child,
    client: Client,
}

/// Requests to a server's port, each on its own connection.
#[derive(Clone, Copy)]
struct Client {
    port: u16,
}

impl std::ops::Deref for Server {
    type Target = Client;
    fn deref(&self) -> &Client {
        &self.client
    }
}

impl Server {
    fn start(extra: &[&str]) -> Server {
        let mut child = Command::new(BIN)
            .args(["serve", "--port", "0"])
            .args(extra)
            .stdout(Stdio::piped())
            .stderr(Stdio::null())
            .spawn()
            .unwrap();
        let mut line = String::new();
        BufReader::new(child.stdout.take().unwrap())
            .read_line(&mut line)
            .unwrap();
        let addr = line
            .trim()
            .strip_prefix("http://127.0.0.1:")
            .and_then(|r| r.strip_suffix('/'))
            .unwrap_or_else(|| panic!("address line {line:?}"));
        Server {
            child,
            client: Client {
                port: addr.parse().unwrap(),
            },
        }
    }
}

impl Client {
    fn host(&self) -> String {
        format!("127.0.0.1:{}", self.port)
    }

    fn post(&self, path: &str, body: &str) -> Answer {
        self.send("POST", path, body.as_bytes(), &self.host())
    }

    fn get(&self, path: &str) -> Answer {
        self.send("GET", path, b"", &self.host())
    }

    /// One HTTP/1.1 request on its own connection.
    fn send(&self, method: &str, path: &str, body: &[u8], host: &str) -> Answer {
        let mut s = TcpStream::connect(("127.0.0.1", self.port)).unwrap();
        s.set_read_timeout(Some(Duration::from_secs(60))).unwrap();
        let head = format!(
            "{method} {path} HTTP/1.1\r\nHost: {host}\r\nContent-Type: application/json\r\n\
             Content-Length: {}\r\nConnection: close\r\n\r\n",
            body.len()
        );
        s.write_all(head.as_bytes()).unwrap();
        // A refused body may be answered before it is all sent; the answer still comes.
        let _ = s.write_all(body);
        let mut raw = Vec::new();
        s.read_to_end(&mut raw).unwrap();
        Answer::parse(&raw)
    }
}

impl Drop for Server {
    fn drop(&mut self) {
        let _ = self.child.kill();
        let _ = self.child.wait();
    }
}

struct Answer {
    status: u16,
    headers: Vec<(String, String)>,
    body: Vec<u8>,
}

impl Answer {
    fn parse(raw: &[u8]) -> Answer {
        let split = raw
            .windows(4)
            .position(|w| w == b"\r\n\r\n")
            .expect("no header end");
        let head = String::from_utf8_lossy(&raw[..split]).into_owned();
        let mut lines = head.lines();
        let status = lines
            .next()
            .unwrap()
            .split(' ')
            .nth(1)
            .unwrap()
            .parse()
            .unwrap();
        let headers = lines
            .filter_map(|l| l.split_once(':'))
            .map(|(k, v)| (k.trim().to_ascii_lowercase(), v.trim().to_string()))
            .collect();
        Answer {
            status,
            headers,
            body: raw[split + 4..].to_vec(),
        }
    }

    fn header(&self, name: &str) -> Option<&str> {
        self.headers
            .iter()
            .find(|(k, _)| k == name)
            .map(|(_, v)| v.as_str())
    }

    fn text(&self) -> String {
        String::from_utf8(self.body.clone()).unwrap()
    }

    fn json(&self) -> serde_json::Value {
        serde_json::from_slice(&self.body).unwrap()
    }
}

/// The command line's stdout, stderr and exit code for `args`.
fn cli(args: &[&str]) -> (String, String, i32) {
    let out = Command::new(BIN).args(args).output().unwrap();
    (
        String::from_utf8(out.stdout).unwrap(),
        String::from_utf8(out.stderr).unwrap(),
        out.status.code().unwrap(),
    )
}

#[test]
fn every_command_answers_what_the_command_line_prints() {
    let server = Server::start(&[]);
    let cases: [(&str, serde_json::Value, Vec<&str>); 6] = [
        (
            "state",
            serde_json::json!({"mix": GAS, "temperature": "15 degC", "pressure": "70 barg",
                               "model": "pr,srk,lk"}),
            vec![
                "state",
                "--mix",
                GAS,
                "-t",
                "15 degC",
                "-p",
                "70 barg",
                "-m",
                "pr,srk,lk",
            ],
        ),
        (
            "saturation",
            serde_json::json!({"fluid": "propane", "temperature": "20 degC", "model": "pr"}),
            vec![
                "saturation",
                "--fluid",
                "propane",
                "-t",
                "20 degC",
                "-m",
                "pr",
            ],
        ),
        (
            "flash",
            serde_json::json!({"mix": "methane=0.8,propane=0.2", "temperature": "-40 degC",
                               "pressure": "30 bar", "model": "pr"}),
            vec![
                "flash",
                "--mix",
                "methane=0.8,propane=0.2",
                "-t",
                "-40 degC",
                "-p",
                "30 bar",
                "-m",
                "pr",
            ],
        ),
        (
            "envelope",
            serde_json::json!({"mix": GAS, "model": "srk"}),
            vec!["envelope", "--mix", GAS, "-m", "srk"],
        ),
        (
            "compare",
            serde_json::json!({"fluid": "nitrogen", "temperatures": "150..300 K n 4",
                               "pressures": "1..300 bar n 5", "model": "pr,srk,lk"}),
            vec![
                "compare",
                "--fluid",
                "nitrogen",
                "-t",
                "150..300 K n 4",
                "-p",
                "1..300 bar n 5",
                "-m",
                "pr,srk,lk",
            ],
        ),
        (
            "table",
            serde_json::json!({"fluid": "carbon dioxide", "temperatures": "300 K,350 K",
                               "pressures": "10 bar,100 bar", "model": "reference",
                               "properties": "z,density,h,cp"}),
            vec![
                "table",
                "--fluid",
                "carbon dioxide",
                "-t",
                "300 K,350 K",
                "-p",
                "10 bar,100 bar",
                "-m",
                "reference",
                "--properties",
                "z,density,h,cp",
            ],
        ),
    ];
    for (command, body, mut args) in cases {
        args.extend(["--format", "json"]);
        let (stdout, _, code) = cli(&args);
        let a = server.post(&format!("/api/{command}"), &body.to_string());
        assert_eq!(a.status, 200, "{command}: {}", a.text());
        assert_eq!(
            a.text(),
            stdout,
            "{command}: the API's JSON is the command line's"
        );
        assert_eq!(a.header("x-zfactor-exit"), Some(code.to_string().as_str()));
        assert_eq!(
            a.header("content-type"),
            Some("application/json; charset=utf-8")
        );
    }
}

#[test]
fn refusals_carry_the_command_lines_message_and_a_status_for_each_kind() {
    let server = Server::start(&[]);
    // Refused input: 422, with the message the command line prints (exit 2 there).
    let (_, stderr, code) = cli(&[
        "state", "--fluid", "methane", "-t", "25 degX", "-p", "1 bar",
    ]);
    assert_eq!(code, 2);
    let a = server.post(
        "/api/state",
        r#"{"fluid": "methane", "temperature": "25 degX", "pressure": "1 bar"}"#,
    );
    assert_eq!(a.status, 422);
    assert_eq!(a.header("x-zfactor-exit"), Some("2"));
    let message = a.json()["error"].as_str().unwrap().to_string();
    assert_eq!(format!("zfactor: {message}\n"), stderr);
    // An unknown fluid.
    let a = server.post(
        "/api/state",
        r#"{"fluid": "unobtainium", "temperature": "300 K", "pressure": "1 bar"}"#,
    );
    assert_eq!(a.status, 422, "{}", a.text());
    // Options that name files, or that the command does not have: 400 before anything runs.
    for body in [
        r#"{"fluid": "methane", "temperatures": "300 K", "pressures": "1 bar", "output": "x.csv"}"#,
        r#"{"mix-file": "/etc/passwd"}"#,
        r#"{"fluid": "methane", "format": "csv"}"#,
        "not json",
        "[1, 2]",
    ] {
        let a = server.post("/api/table", body);
        assert_eq!(a.status, 400, "{body}: {}", a.text());
        assert!(a.json()["error"].is_string());
    }
    // A result with warnings: 200, exit 3, the warnings in the body.
    let a = server.post(
        "/api/state",
        r#"{"fluid": "methane", "temperature": "700 K", "pressure": "900 bar", "model": "dak"}"#,
    );
    assert_eq!(a.status, 200);
    assert_eq!(a.header("x-zfactor-exit"), Some("3"));
    assert!(!a.json()["warnings"].as_array().unwrap().is_empty());
    // Wrong method, unknown address.
    assert_eq!(server.get("/api/state").status, 405);
    assert_eq!(server.post("/", "{}").status, 405);
    assert_eq!(server.get("/api/nothing").status, 404);
    assert_eq!(server.get("/etc/passwd").status, 404);
    assert_eq!(server.get("/../Cargo.toml").status, 404);
}

#[test]
fn limits_on_body_grid_and_host() {
    let server = Server::start(&[]);
    let big = format!(r#"{{"fluid": "{}"}}"#, "m".repeat(2 << 20));
    let a = server.post("/api/state", &big);
    assert_eq!(a.status, 413);
    let a = server.post(
        "/api/compare",
        r#"{"fluid": "methane", "temperatures": "200..400 K n 101", "pressures": "1..100 bar n 100"}"#,
    );
    assert_eq!(a.status, 413, "{}", a.text());
    assert!(a.json()["error"].as_str().unwrap().contains("10100 states"));
    // A page elsewhere that points a name of its own at this machine is refused.
    let a = server.send("GET", "/", b"", "attacker.example:80");
    assert_eq!(a.status, 421);
    let a = server.send("GET", "/", b"", &format!("localhost:{}", server.port));
    assert_eq!(a.status, 200);
}

#[test]
fn the_page_its_files_and_the_workbook() {
    let server = Server::start(&[]);
    let page = server.get("/");
    assert_eq!(page.status, 200);
    assert!(page
        .header("content-type")
        .unwrap()
        .starts_with("text/html"));
    let csp = page.header("content-security-policy").unwrap();
    assert!(csp.contains("default-src 'self'"), "{csp}");
    let html = page.text();
    // Everything the page loads comes from the server itself.
    for src in [
        "/page.js",
        "/page.css",
        "/vendor/uPlot.iife.min.js",
        "/vendor/uPlot.min.css",
    ] {
        assert!(html.contains(src), "{src}");
        assert_eq!(server.get(src).status, 200, "{src}");
    }
    assert!(!html.contains("http://") && !html.contains("https://"));
    let about = server.get("/api/about").json();
    assert_eq!(about["demo_gas"], GAS);
    let models = server.get("/api/models").json();
    assert_eq!(models["models"].as_array().unwrap().len(), 16);
    let a = server.post(
        "/api/xlsx",
        r#"{"sheets": [{"name": "side by side", "rows": [["model", "Z"], ["pr", 0.9]]}]}"#,
    );
    assert_eq!(a.status, 200);
    assert_eq!(
        a.header("content-disposition"),
        Some("attachment; filename=\"zfactor.xlsx\"")
    );
    assert_eq!(&a.body[..2], b"PK");
}

#[test]
fn a_non_loopback_address_needs_the_users_consent() {
    let (_, stderr, code) = cli(&["serve", "--bind", "0.0.0.0", "--port", "0"]);
    assert_eq!(code, 2);
    assert!(stderr.contains("--allow-remote"), "{stderr}");
    assert!(stderr.contains("no authentication"), "{stderr}");
    let (_, stderr, code) = cli(&["serve", "--bind", "localhost:80"]);
    assert_eq!(code, 2, "{stderr}");
}

/// 1,008 requests from 16 concurrent clients on loopback, each on its own connection: a
/// state of the demo gas with Peng-Robinson, the page and the catalogue in turn. No request
/// may fail; p50 and p99 are printed (`cargo test --test serve_api -- --nocapture`).
#[test]
fn load_on_loopback() {
    const CLIENTS: usize = 16;
    const EACH: usize = 63;
    let server = Server::start(&[]);
    let client = server.client;
    let started = Instant::now();
    let handles: Vec<_> = (0..CLIENTS)
        .map(|c| {
            std::thread::spawn(move || {
                let body = serde_json::json!({"mix": GAS, "temperature": "15 degC",
                                              "pressure": "70 barg", "model": "pr"})
                .to_string();
                let mut times = Vec::with_capacity(EACH);
                let mut errors = 0;
                for k in 0..EACH {
                    let t0 = Instant::now();
                    let a = match (c + k) % 3 {
                        0 | 1 => client.post("/api/state", &body),
                        _ => client.get(if k % 2 == 0 { "/" } else { "/api/models" }),
                    };
                    times.push(t0.elapsed());
                    if a.status != 200 {
                        errors += 1;
                    }
                }
                (times, errors)
            })
        })
        .collect();
    let mut times = Vec::new();
    let mut errors = 0;
    for h in handles {
        let (t, e) = h.join().unwrap();
        times.extend(t);
        errors += e;
    }
    let wall = started.elapsed();
    times.sort();
    let at = |q: f64| times[((times.len() as f64 * q) as usize).min(times.len() - 1)];
    println!(
        "load: {} requests from {CLIENTS} clients in {:.2} s, 0 errors expected, {errors} seen; \
         p50 {:.1} ms, p99 {:.1} ms",
        times.len(),
        wall.as_secs_f64(),
        at(0.50).as_secs_f64() * 1e3,
        at(0.99).as_secs_f64() * 1e3
    );
    assert_eq!(times.len(), CLIENTS * EACH);
    assert_eq!(errors, 0);
}
