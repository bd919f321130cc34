//! A progress bar on stderr for long grids, shown only when both stdout and stderr are
//! terminals (never in pipes, files or tests) and the work is long enough to need one.

use indicatif::{ProgressBar, ProgressStyle};
use std::io::IsTerminal;

/// Fewer states than this finish too quickly for a bar to help.
pub const MIN_STATES: usize = 20_000;

/// A bar for `total` states, or `None` when it should not be shown.
pub fn bar(total: usize, what: &str) -> Option<ProgressBar> {
    if total < MIN_STATES || !std::io::stderr().is_terminal() || !std::io::stdout().is_terminal() {
        return None;
    }
    let pb = ProgressBar::new(total as u64);
    let style = ProgressStyle::with_template("{msg} [{bar:40}] {pos}/{len} states, {eta} left")
        .map(|s| s.progress_chars("=> "))
        .unwrap_or_else(|_| ProgressStyle::default_bar());
    pb.set_style(style);
    pb.set_message(what.to_string());
    Some(pb)
}

/// Advances `bar` by `n` (nothing when there is no bar).
pub fn inc(bar: &Option<ProgressBar>, n: u64) {
    if let Some(b) = bar {
        b.inc(n);
    }
}

/// Removes the bar from the terminal.
pub fn finish(bar: Option<ProgressBar>) {
    if let Some(b) = bar {
        b.finish_and_clear();
    }
}
