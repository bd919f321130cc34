//! A natural gas by its specific gravity (`--gravity`, with `--n2`, `--co2`, `--h2s`) as a
//! feed for the gas-gravity Z correlations: its hydrocarbon part (a record of its own, with the
//! molar mass the gravity leaves it once the non-hydrocarbons are taken out; see
//! [`eos::gas_gravity::inerts`]) and the non-hydrocarbons given, in mole fractions.

use crate::cli::gravity_args::GravityArgs;
use crate::cli::Basis;
use crate::error::CliError;
use crate::feed::{Feed, GravityGas};
use eos::gas_gravity::inerts::{hydrocarbon_gravity, InertFractions};

const FRACTION: &str = "a mole fraction from 0 to 1, or a percentage, e.g. 0.02 or 2%";

/// The feed of `--gravity`, or None when it is not given.
pub fn read(args: &GravityArgs) -> Result<Option<Feed>, CliError> {
    let Some(typed) = args.gravity.as_deref() else {
        let given = [
            ("--n2", &args.n2),
            ("--co2", &args.co2),
            ("--h2s", &args.h2s),
        ];
        if let Some((name, _)) = given.iter().find(|(_, v)| v.is_some()) {
            return Err(CliError::BadInput(format!(
                "{name} is a fraction of the gas given by --gravity; for a mixture given by \
                 its components write it in --mix (\"methane=0.9,co2=0.1\")"
            )));
        }
        return Ok(None);
    };
    let gravity: f64 = typed.trim().parse().map_err(|_| {
        CliError::BadInput(format!(
            "--gravity \"{typed}\": give the gas's specific gravity as a number (molar mass \
             over air's), e.g. 0.65"
        ))
    })?;
    let fraction = |v: &Option<String>, what: &'static str| -> Result<f64, CliError> {
        let Some(s) = v else { return Ok(0.0) };
        let y = crate::units::fraction(s, what, FRACTION)?;
        if !(0.0..1.0).contains(&y) {
            return Err(CliError::BadInput(format!(
                "{what} \"{s}\": {FRACTION}, below 1 (the rest is the hydrocarbon gas)"
            )));
        }
        Ok(y)
    };
    let y = InertFractions {
        n2: fraction(&args.n2, "--n2")?,
        co2: fraction(&args.co2, "--co2")?,
        h2s: fraction(&args.h2s, "--h2s")?,
    };
    let bad = |why: String| CliError::BadInput(format!("--gravity {}: {why}", typed.trim()));
    let g_hc = hydrocarbon_gravity(gravity, &y).map_err(|e| bad(e.to_string()))?;
    let hc = fluids::gravity_gas::hydrocarbon_gas(g_hc).map_err(|_| {
        let with = if y == InertFractions::default() {
            String::new()
        } else {
            format!(
                "; with these non-hydrocarbons the hydrocarbon part would have gravity {g_hc:.4}"
            )
        };
        bad(format!(
            "a natural gas has a gravity from methane's (0.553) to 2{with}; check the gravity \
             and the fractions"
        ))
    })?;
    let mut records = vec![hc];
    let mut mole = vec![1.0 - y.n2 - y.co2 - y.h2s];
    for (id, yi) in [("nitrogen", y.n2), ("co2", y.co2), ("h2s", y.h2s)] {
        if yi > 0.0 {
            records.push(fluids::find(id)?);
            mole.push(yi);
        }
    }
    let m: Vec<f64> = records.iter().map(|r| r.molar_mass_kg_mol).collect();
    let mass = eos::composition::mole_to_mass(&mole, &m);
    Ok(Some(Feed {
        records,
        as_entered: mole.clone(),
        basis: Basis::Mole,
        percent: false,
        normalized_from: None,
        mole,
        mass,
        kij: Vec::new(),
        gravity: Some(GravityGas {
            typed: typed.trim().to_string(),
            gravity,
            n2: y.n2,
            co2: y.co2,
            h2s: y.h2s,
        }),
    }))
}
