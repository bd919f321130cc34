//! Which renderer draws each report: the [`Output`] of every report printed through
//! [`crate::render::output::render`].

use crate::error::CliError;
use crate::render::output::Output;
use crate::render::{audit, compress, csv, envelope, flash, flow, jobs, process, table, vessel};
use crate::render::{saturation_csv, saturation_table};
use crate::report;
use crate::report::{audit::AuditReport, compress::CompressReport, flow::FlowReport};
use crate::report::{process::ProcessReport, relief::ReliefReport, vessel::VesselReport};

macro_rules! outputs {
    ($($report:ty => $text:expr, $csv:expr;)*) => {$(
        impl Output for $report {
            fn text(&self) -> String {
                $text(self)
            }
            fn csv(&self) -> Result<String, CliError> {
                $csv(self)
            }
            fn warnings(&self) -> &[String] {
                &self.warnings
            }
            fn caution(&self) -> &str {
                self.caution
            }
        }
    )*};
}

/// A job's table with the caution under it.
fn with_caution(table: String, caution: &str) -> String {
    format!("{table}caution: {caution} Defer to local codes and licensed review.\n")
}

/// Jobs: the table with the caution under it; CSV one row per model.
macro_rules! job_outputs {
    ($($report:ty => $table:path;)*) => {
        outputs! {$(
            $report => |r: &$report| with_caution($table(r), r.caution), jobs::csv_rows;
        )*}
    };
}

outputs! {
    report::state::StateReport => table::state, csv::state;
    report::flash::FlashReport => flash::text, flash::csv;
    report::envelope::EnvelopeReport => envelope::text, envelope::csv;
    report::saturation::SaturationReport => saturation_table::render, saturation_csv::render;
    AuditReport => |r: &AuditReport| with_caution(audit::table(r), r.caution),
        |_| Err(CliError::BadInput(
            "the audit summary is a table or JSON; the annotated copy is the CSV".to_string(),
        ));
}

job_outputs! {
    VesselReport => vessel::table;
    CompressReport => compress::table;
    FlowReport => flow::table;
    ProcessReport => process::table;
    ReliefReport => process::relief;
}
