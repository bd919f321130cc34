//! `zfactor fluids`: list, search or show component data with their sources.

use crate::cli::FluidsArgs;
use crate::error::CliError;
use crate::report::fluids::FluidsReport;

/// Builds the report for one component, a search, or the whole list.
pub fn run(args: &FluidsArgs) -> Result<FluidsReport, CliError> {
    if let Some(name) = &args.name {
        let rec = fluids::find(name)?;
        return Ok(FluidsReport {
            query: Some(name.clone()),
            components: vec![rec],
        });
    }
    if let Some(text) = &args.search {
        let found = fluids::search(text);
        if found.is_empty() {
            return Err(CliError::BadInput(format!(
                "no component matches \"{text}\"; run `zfactor fluids` for the full list"
            )));
        }
        return Ok(FluidsReport {
            query: Some(text.clone()),
            components: found,
        });
    }
    Ok(FluidsReport {
        query: None,
        components: fluids::all().iter().collect(),
    })
}
