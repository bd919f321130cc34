//! Which terminal table each job's report is drawn with: the [`JobReport`] of every job.

use crate::render::jobs::JobReport;

macro_rules! job_reports {
    ($($report:ty => $table:path),* $(,)?) => {$(
        impl JobReport for $report {
            fn table(&self) -> String {
                $table(self)
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

job_reports! {
    crate::report::vessel::VesselReport => crate::render::vessel::table,
    crate::report::compress::CompressReport => crate::render::compress::table,
    crate::report::flow::FlowReport => crate::render::flow::table,
    crate::report::process::ProcessReport => crate::render::process::table,
    crate::report::relief::ReliefReport => crate::render::process::relief,
}
