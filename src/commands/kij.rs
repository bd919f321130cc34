//! `zfactor kij`: the built-in interaction parameters with their sources, filtered by
//! component and model family.

use crate::cli::KijArgs;
use crate::error::CliError;
use crate::report::kij::{KijReport, KijRow};
use fluids::KijFamily;

/// What the report says about the user's own values.
const NOTE: &str = "SRK uses the Peng-Robinson value of a pair that has no SRK value, and \
says so; a pair with no value is zero. Set your own with --kij \"a-b=value\" (@pr or @srk for \
one family) or --kij-file FILE on any command that takes a mixture.";

/// Lists the built-in k_ij of the pairs asked for.
pub fn run(args: &KijArgs) -> Result<KijReport, CliError> {
    if args.names.len() > 2 {
        return Err(CliError::BadInput(format!(
            "give at most two components (the pairs of one, or one pair); got {}",
            args.names.len()
        )));
    }
    let ids: Vec<String> = args
        .names
        .iter()
        .map(|c| fluids::find(c).map(|r| r.id.clone()))
        .collect::<Result<_, _>>()?;
    let family = match &args.family {
        None => None,
        Some(f) => Some(KijFamily::parse(f).ok_or_else(|| {
            CliError::BadInput(format!(
                "--family \"{f}\": write pr (Peng-Robinson, PR78 too) or srk"
            ))
        })?),
    };
    let rows: Vec<KijRow> = fluids::kij::table()
        .into_iter()
        .filter(|k| ids.iter().all(|id| &k.a == id || &k.b == id))
        .filter(|k| family.map_or(true, |f| f == k.fitted_for))
        .map(|k| KijRow {
            family: k.fitted_for.key(),
            a: k.a,
            b: k.b,
            value: k.value,
            confidence: format!("{:?}", k.confidence).to_ascii_lowercase(),
            plausible_range: k.plausible_range,
            source_key: k.source_key,
            source: k.source,
            notes: k.notes,
        })
        .collect();
    if rows.is_empty() && !ids.is_empty() {
        return Err(CliError::BadInput(format!(
            "no built-in k_ij for {}{}: such pairs are zero unless you set them (--kij)",
            ids.join("-"),
            family.map_or(String::new(), |f| format!(" in the {} family", f.key()))
        )));
    }
    Ok(KijReport {
        components: ids,
        family: family.map(KijFamily::key),
        rows,
        note: NOTE,
    })
}
