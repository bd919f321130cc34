//! Terminal summary of `zfactor audit`.

use crate::render::number::{opt, sig};
use crate::report::audit::AuditReport;

/// The audit summary as text.
pub fn table(r: &AuditReport) -> String {
    let mut out = format!("audit of {}", r.input);
    if let Some(s) = &r.sheet {
        out.push_str(&format!(" (sheet {s})"));
    }
    out.push_str(&format!(
        "\nrecomputed with {}, tolerance {}%, default base {}, ambient {} kPa\n",
        r.model,
        sig(100.0 * r.tolerance, 3),
        r.default_base,
        sig(r.ambient_pressure_pa / 1e3, 6)
    ));
    out.push_str(&format!(
        "rows read {}, audited {}, within tolerance {}, flagged {}, bad {}; largest deviation \
         {}%\n",
        r.rows_read,
        r.rows_audited,
        r.rows_within_tolerance,
        r.rows_flagged,
        r.rows_bad,
        opt(r.largest_deviation_pct, 4)
    ));
    if !r.causes.is_empty() || r.flagged_unexplained > 0 {
        out.push_str("flagged rows by the cause that reconciles them:\n");
        for (c, n) in &r.causes {
            out.push_str(&format!("  {n:>8}  {c}\n"));
        }
        out.push_str(&format!("  {:>8}  no cause found\n", r.flagged_unexplained));
    }
    if !r.flagged.is_empty() {
        out.push_str("flagged rows (first ones):\n");
        for f in r.flagged.iter().take(20) {
            out.push_str(&format!(
                "  row {}: sheet {}, recomputed {} ({}), deviation {}%{}\n",
                f.row,
                f.sheet_value,
                sig(f.recomputed, 6),
                f.model,
                sig(f.deviation_pct, 4),
                match (&f.note, f.reconciling_causes.is_empty()) {
                    (Some(n), _) => format!(" -> {n}"),
                    (None, true) => String::new(),
                    (None, false) => format!(" -> {}", f.reconciling_causes.join("; ")),
                }
            ));
        }
    }
    if !r.bad.is_empty() {
        out.push_str("bad rows (first ones):\n");
        for b in r.bad.iter().take(20) {
            out.push_str(&format!(
                "  row {}, column {}: {}\n",
                b.row, b.column, b.message
            ));
        }
    }
    out.push_str(&format!(
        "annotated copy: {} ({} s)\n",
        r.output,
        sig(r.elapsed_s, 3)
    ));
    out
}
