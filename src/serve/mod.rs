//! `zfactor serve`: the local web page and its JSON API, on this machine's loopback address
//! unless the user asks otherwise.
//!
//! - [`server`]: the listening socket and its worker threads (tiny_http);
//! - [`api`]: a request in, a reply out (routes, statuses, limits), no socket;
//! - the commands run from JSON options: [`crate::json_call`];
//! - [`workbook`]: the page's .xlsx download, built in memory;
//! - [`assets`]: the page's files, embedded.

pub mod api;
pub mod assets;
pub mod server;
pub mod workbook;
