//! Arguments of `zfactor serve`: the local web page and its JSON API.

use clap::Args;

/// Arguments of `zfactor serve`.
#[derive(Debug, Args)]
pub struct ServeArgs {
    /// Port to listen on; 0 takes a free port (the address is printed on stdout).
    #[arg(long, default_value_t = 8760)]
    pub port: u16,
    /// Address to listen on. Only a loopback address (127.0.0.1, ::1) is accepted unless
    /// --allow-remote is given.
    #[arg(long, default_value = "127.0.0.1")]
    pub bind: String,
    /// Accept a non-loopback --bind address. The server has no authentication: anyone who
    /// can reach the address can use it.
    #[arg(long)]
    pub allow_remote: bool,
}
