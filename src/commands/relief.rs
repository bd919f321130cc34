//! `zfactor relief`: Z, the real-gas isentropic exponent, the critical pressure ratio, the
//! API 520 gas coefficient C and the molar mass at relieving conditions, per model, with a
//! warning where Z is outside 0.8 to 1.1.

use crate::cli::relief_args::ReliefArgs;
use crate::commands::jobs_common::{self as jc, ctx, per_model, Pair};
use crate::error::CliError;
use crate::feed_input;
use crate::report::jobs_common::{Compared, StateReport};
use crate::report::relief::{ReliefInput, ReliefReport, ReliefResult};
use eos::jobs::relief::{self, Z_RANGE};

/// Computes the report.
pub fn run(args: &ReliefArgs) -> Result<ReliefReport, CliError> {
    let feed = feed_input::read(&args.fluid)?;
    let amb = jc::ambient(&args.shared.ambient)?;
    let t = jc::temperature(&args.temperature)?;
    let p = jc::pressure(&args.pressure, amb)?;
    let x = feed.mole.clone();
    let (results, mut warnings) = per_model(&args.shared.model, &feed, |pair| {
        let mut r = one(pair, t, p, &x)?;
        let edge = jc::edge_notes(pair, &feed, &[("relieving state", &r.state)]);
        r.notes.extend(edge);
        Ok(r)
    })?;
    for r in &results {
        warnings.extend(jc::raised(&r.model, &r.notes));
        if r.z_outside_range {
            warnings.push(format!(
                "{}: Z = {:.4} is outside {}-{}: ideal-gas relief sizing formulas lose \
                 accuracy there (common practice); use a real-gas method",
                r.model, r.z.value, Z_RANGE.0, Z_RANGE.1
            ));
        }
    }
    Ok(ReliefReport {
        tool: format!("zfactor {}", env!("CARGO_PKG_VERSION")),
        fluid: jc::fluid_report(&feed),
        input: ReliefInput {
            temperature: args.temperature.clone(),
            pressure: args.pressure.clone(),
            temperature_k: t,
            pressure_pa: p,
            ambient_pressure_pa: amb,
            z_range: Z_RANGE,
        },
        results,
        warnings,
        caution: crate::CAUTION,
    })
}

fn one(pair: &Pair, t: f64, p: f64, x: &[f64]) -> Result<ReliefResult, CliError> {
    let e = ctx(&pair.built.id);
    let Some(model) = pair.built.helmholtz() else {
        return explicit(pair, t, p, x);
    };
    let r = relief::at(model, t, p, x).map_err(&e)?;
    let ri = relief::at(&pair.ideal, t, p, x).map_err(&e)?;
    Ok(ReliefResult {
        model: pair.built.id.clone(),
        model_name: pair.built.name.clone(),
        z: Compared::new(r.z, ri.z),
        isentropic_exponent: Compared::new(r.k_real, ri.k_ideal),
        critical_pressure_ratio: Compared::new(
            relief::critical_pressure_ratio(r.k_real).map_err(&e)?,
            relief::critical_pressure_ratio(ri.k_ideal).map_err(&e)?,
        ),
        sizing_coefficient_c: Compared::new(
            relief::sizing_coefficient(r.k_real).map_err(&e)?,
            relief::sizing_coefficient(ri.k_ideal).map_err(&e)?,
        ),
        molar_mass_kg_mol: r.molar_mass,
        z_outside_range: r.z_outside_range,
        state: StateReport::from(&r.state),
        notes: pair.built.notes.clone(),
    })
}

/// Relief inputs from a model explicit in (T, P) (Lee-Kesler, the gas-gravity correlations,
/// IF97): Z from the model, k = -(v/P)(dP/dv)_s from its properties (for the gas-gravity
/// correlations, derived from Z and the components' ideal-gas cp, as `state` does).
fn explicit(pair: &Pair, t: f64, p: f64, x: &[f64]) -> Result<ReliefResult, CliError> {
    let e = ctx(&pair.built.id);
    let id = pair.built.id.as_str();
    let st = pair
        .built
        .at_tp(t, p, x, eos::state::RootChoice::LowestGibbs)
        .map_err(&e)?;
    let pr = &st.props;
    if matches!(st.phase, eos::phase::Phase::Liquid) {
        return Err(CliError::BadInput(format!(
            "model {id}: the fluid is liquid at the relieving conditions: gas relief inputs do \
             not apply"
        )));
    }
    let k = pr.isentropic_exponent.ok_or_else(|| {
        CliError::Computation(format!(
            "model {id} gives no isentropic exponent at the relieving conditions"
        ))
    })?;
    let ri = relief::at(&pair.ideal, t, p, x).map_err(&e)?;
    let m = pr.molar_mass;
    Ok(ReliefResult {
        model: pair.built.id.clone(),
        model_name: pair.built.name.clone(),
        z: Compared::new(pr.z, ri.z),
        isentropic_exponent: Compared::new(k, ri.k_ideal),
        critical_pressure_ratio: Compared::new(
            relief::critical_pressure_ratio(k).map_err(&e)?,
            relief::critical_pressure_ratio(ri.k_ideal).map_err(&e)?,
        ),
        sizing_coefficient_c: Compared::new(
            relief::sizing_coefficient(k).map_err(&e)?,
            relief::sizing_coefficient(ri.k_ideal).map_err(&e)?,
        ),
        molar_mass_kg_mol: m,
        z_outside_range: pr.z < Z_RANGE.0 || pr.z > Z_RANGE.1,
        state: jc::explicit_state(&st, t, p),
        notes: pair.built.notes.clone(),
    })
}
