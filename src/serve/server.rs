//! The listening socket: tiny_http (a small synchronous HTTP/1.1 server without an async
//! runtime) with a few worker threads, each answering one request at a time through
//! [`super::api::handle`]; the computations inside a request use every core (rayon).

use super::api::{self, Reply, MAX_BODY};
use crate::cli::serve_args::ServeArgs;
use crate::error::CliError;
use crate::exit::Exit;
use std::io::{Read, Write};
use std::net::{IpAddr, SocketAddr};
use std::sync::Arc;
use tiny_http::{Header, Request, Response, Server};

/// Requests answered at once; more wait in the socket's queue.
const WORKERS: usize = 8;

/// Where the page may load anything from: this server only.
const CONTENT_SECURITY: &str = "default-src 'self'; img-src 'self' data: blob:; \
style-src 'self' 'unsafe-inline'; object-src 'none'; base-uri 'none'; frame-ancestors 'none'";

/// Starts the server, prints its address on stdout and answers requests until stopped.
pub fn run(args: &ServeArgs) -> Result<Exit, CliError> {
    let ip: IpAddr = args.bind.trim().parse().map_err(|_| {
        CliError::BadInput(format!(
            "--bind \"{}\": give an IP address, e.g. 127.0.0.1 or ::1",
            args.bind
        ))
    })?;
    if !ip.is_loopback() {
        if !args.allow_remote {
            return Err(CliError::BadInput(format!(
                "--bind {ip} is not a loopback address: the server has no authentication, so \
                 anyone who can reach {ip} could use it; add --allow-remote to accept that"
            )));
        }
        eprintln!(
            "warning: listening on {ip}, not on loopback: the server has no authentication; \
             anyone who can reach this address can use it"
        );
    }
    let server = Server::http(SocketAddr::new(ip, args.port)).map_err(|e| {
        CliError::BadInput(format!("cannot listen on {ip} port {}: {e}", args.port))
    })?;
    let addr = server
        .server_addr()
        .to_ip()
        .ok_or_else(|| CliError::Computation("the server has no IP address".to_string()))?;
    let mut out = std::io::stdout();
    writeln!(out, "http://{addr}/")
        .and_then(|_| out.flush())
        .map_err(|e| CliError::Output(e.to_string()))?;
    eprintln!("zfactor's page is served at http://{addr}/ (stop with Ctrl-C)");
    let hosts = allowed_hosts(addr);
    let server = Arc::new(server);
    let workers: Vec<_> = (0..WORKERS)
        .map(|_| {
            let server = Arc::clone(&server);
            let hosts = hosts.clone();
            std::thread::spawn(move || {
                while let Ok(rq) = server.recv() {
                    answer(rq, hosts.as_deref());
                }
            })
        })
        .collect();
    for w in workers {
        let _ = w.join();
    }
    Ok(Exit::Success)
}

/// The Host headers a loopback server answers (a page elsewhere that points a name of its
/// own at 127.0.0.1 is refused); any host when the user chose a non-loopback address.
fn allowed_hosts(addr: SocketAddr) -> Option<Vec<String>> {
    if !addr.ip().is_loopback() {
        return None;
    }
    let port = addr.port();
    Some(vec![
        format!("127.0.0.1:{port}"),
        format!("localhost:{port}"),
        format!("[::1]:{port}"),
    ])
}

fn answer(mut rq: Request, hosts: Option<&[String]>) {
    let host = rq
        .headers()
        .iter()
        .find(|h| h.field.equiv("Host"))
        .map(|h| h.value.as_str().to_ascii_lowercase());
    let reply = match hosts {
        Some(hosts) if !host.as_ref().is_some_and(|h| hosts.contains(h)) => Reply::error(
            421,
            "this server answers only requests addressed to its loopback address",
            Exit::BadInput,
        ),
        _ => read_and_handle(&mut rq),
    };
    // A length, not chunks: every answer is complete in memory already.
    let mut response = Response::from_data(reply.body)
        .with_status_code(reply.status)
        .with_chunked_threshold(usize::MAX);
    let mut headers = vec![
        ("Content-Type", reply.content_type.to_string()),
        ("X-Content-Type-Options", "nosniff".to_string()),
        ("Content-Security-Policy", CONTENT_SECURITY.to_string()),
        ("Cache-Control", "no-store".to_string()),
    ];
    if let Some(exit) = reply.exit {
        headers.push(("X-Zfactor-Exit", (exit as u8).to_string()));
    }
    if let Some(name) = reply.attachment {
        headers.push((
            "Content-Disposition",
            format!("attachment; filename=\"{name}\""),
        ));
    }
    for (field, value) in headers {
        if let Ok(h) = Header::from_bytes(field.as_bytes(), value.as_bytes()) {
            response.add_header(h);
        }
    }
    // A client that went away has no one to tell.
    let _ = rq.respond(response);
}

fn read_and_handle(rq: &mut Request) -> Reply {
    let too_large = || {
        Reply::error(
            413,
            &format!("the request body is over {MAX_BODY} bytes"),
            Exit::BadInput,
        )
    };
    if rq.body_length().is_some_and(|n| n > MAX_BODY) {
        return too_large();
    }
    let mut body = Vec::new();
    if let Err(e) = rq
        .as_reader()
        .take(MAX_BODY as u64 + 1)
        .read_to_end(&mut body)
    {
        return Reply::error(
            400,
            &format!("cannot read the request: {e}"),
            Exit::BadInput,
        );
    }
    if body.len() > MAX_BODY {
        return too_large();
    }
    let method = rq.method().as_str().to_string();
    let url = rq.url().to_string();
    // A defect in one request must not stop the server: it answers 500 and goes on.
    std::panic::catch_unwind(|| api::handle(&method, &url, &body)).unwrap_or_else(|_| {
        Reply::error(
            500,
            "internal error while answering this request (a defect: please report it with \
             the request)",
            Exit::ComputationFailed,
        )
    })
}
