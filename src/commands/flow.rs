//! `zfactor flow`: one flow of gas as mass, amount, and volume at every named base condition
//! and at flowing conditions, using each model's Z at each condition.

use crate::cli::flow_args::FlowArgs;
use crate::commands::jobs_common::{self as jc, ctx, molar_flow, per_model, Flow, Pair};
use crate::error::CliError;
use crate::feed_input;
use crate::report::flow::{FlowInput, FlowReport, FlowResult, VolumeAt};
use crate::report::jobs_common::Compared;
use eos::jobs::base_conditions::{molar_volume, NAMED};
use eos::jobs::BaseConditions;
use eos::need::Need;
use eos::state::RootChoice;
use eos::Model;

/// Computes the report.
pub fn run(args: &FlowArgs) -> Result<FlowReport, CliError> {
    let feed = feed_input::read_gas(&args.fluid, &args.gravity)?;
    let amb = jc::ambient(&args.shared.ambient)?;
    let base = args.base.as_deref().map(|b| jc::base(b, amb)).transpose()?;
    let flow = jc::flow(&args.flow, "--flow", base)?;
    let actual = match (&args.temperature, &args.pressure) {
        (Some(t), Some(p)) => Some((jc::temperature(t)?, jc::pressure(p, amb)?)),
        _ => None,
    };
    if matches!(flow, Flow::Actual(_)) && actual.is_none() {
        return Err(CliError::BadInput(format!(
            "--flow \"{}\" is an actual volume flow: give the flowing --temperature and \
             --pressure",
            args.flow
        )));
    }
    let x = feed.mole.clone();
    let (results, mut warnings) = per_model(&args.shared.model, &feed, |pair| {
        one(pair, flow, actual, &x)
    })?;
    for r in &results {
        for v in r.volumes.iter().filter(|v| v.phase == "two-phase") {
            warnings.push(format!(
                "{}: the feed splits into vapour and liquid at the {} conditions ({} K, {} bar \
                 abs): the volume there is that of both phases together, not of a gas flow",
                r.model,
                v.base,
                v.temperature_k,
                v.pressure_pa / crate::units::PA_PER_BAR
            ));
        }
    }
    let (kind, value_si, b) = match flow {
        Flow::Mass(q) => ("mass", q, None),
        Flow::Molar(q) => ("molar", q, None),
        Flow::Actual(q) => ("actual volume", q, None),
        Flow::Standard(q, b) => ("standard volume", q, Some(b.into())),
    };
    Ok(FlowReport {
        tool: format!("zfactor {}", env!("CARGO_PKG_VERSION")),
        fluid: jc::fluid_report(&feed),
        input: FlowInput {
            flow: args.flow.clone(),
            temperature: args.temperature.clone(),
            pressure: args.pressure.clone(),
            kind,
            value_si,
            base: b,
            actual_temperature_k: actual.map(|a| a.0),
            actual_pressure_pa: actual.map(|a| a.1),
            ambient_pressure_pa: amb,
        },
        results,
        iso6976_summation: summation(&feed),
        warnings,
        caution: crate::CAUTION,
    })
}

fn one(
    pair: &Pair,
    flow: Flow,
    actual: Option<(f64, f64)>,
    x: &[f64],
) -> Result<FlowResult, CliError> {
    let ig: &dyn Model = &pair.ideal;
    let e = ctx(&pair.built.id);
    let at = actual.unwrap_or((f64::NAN, f64::NAN));
    // The model's own molar mass where it has one (a reference formulation's), else the
    // components'.
    let mm = pair
        .built
        .helmholtz()
        .map_or_else(|| ig.molar_mass(x), |m| m.molar_mass(x));
    let n = match flow {
        Flow::Mass(q) => q / mm,
        Flow::Molar(q) => q,
        Flow::Actual(q) => q / volume_at(pair, at.0, at.1, x).map_err(&e)?.0,
        Flow::Standard(q, b) => q / volume_at(pair, b.t, b.p, x).map_err(&e)?.0,
    };
    let ni = molar_flow(ig, flow, x, at).map_err(&e)?;
    let mut conds: Vec<BaseConditions> = NAMED.to_vec();
    if let Flow::Standard(_, b) = flow {
        if !NAMED.iter().any(|k| k.id == b.id) {
            conds.insert(0, b);
        }
    }
    let mut volumes = Vec::new();
    let named = conds.iter().map(|b| (b.id.to_string(), b.t, b.p));
    let flowing = actual.map(|(t, p)| ("actual".to_string(), t, p));
    for (base, t, p) in named.chain(flowing) {
        let (v, z, phase) = volume_at(pair, t, p, x).map_err(&e)?;
        let (vi, _) = molar_volume(ig, t, p, x).map_err(&e)?;
        volumes.push(VolumeAt {
            base,
            temperature_k: t,
            pressure_pa: p,
            z,
            phase,
            volume_flow_m3_s: Compared::new(n * v, ni * vi),
        });
    }
    Ok(FlowResult {
        model: pair.built.id.clone(),
        model_name: pair.built.name.clone(),
        mass_flow_kg_s: n * mm,
        mass_flow: Compared::new(n * mm, ni * mm),
        molar_flow_mol_s: Compared::new(n, ni),
        volumes,
        notes: pair.built.notes.clone(),
    })
}

/// Molar volume, Z and phase name at (T, P): a model with a Helmholtz energy through the
/// phase-checked state of `base_conditions`, a model explicit in (T, P) (the gas-gravity
/// correlations, Lee-Kesler, IF97) from its Z alone, as a flow of gas needs.
fn volume_at(pair: &Pair, t: f64, p: f64, x: &[f64]) -> Result<(f64, f64, String), eos::Error> {
    match pair.built.helmholtz() {
        Some(m) => molar_volume(m, t, p, x).map(|(v, s)| (v, s.z, s.phase.to_string())),
        None => pair
            .built
            .at_tp_need(t, p, x, RootChoice::LowestGibbs, Need::Volumetric)
            .map(|s| (1.0 / s.props.rho, s.props.z, s.phase.to_string())),
    }
}

/// The fluid's Z by the ISO 6976 summation method, or why there is none.
fn summation(feed: &crate::feed::Feed) -> crate::report::flow::Summation {
    use crate::compare::iso6976_sum;
    use crate::report::flow::{Summation, SummationZ};
    if feed.gravity.is_some() {
        return Summation {
            method: iso6976_sum::METHOD,
            values: Vec::new(),
            unavailable: Some("a gas known by its gravity has no composition to sum over".into()),
        };
    }
    let ids = feed.ids();
    match iso6976_sum::all_temperatures(&ids, &feed.mole) {
        Ok(values) => Summation {
            method: iso6976_sum::METHOD,
            values: values
                .into_iter()
                .map(|s| SummationZ {
                    temperature_k: s.t,
                    pressure_pa: iso6976_sum::P_REF,
                    z: s.z,
                    confidence: s.confidence,
                })
                .collect(),
            unavailable: None,
        },
        Err(e) => Summation {
            method: iso6976_sum::METHOD,
            values: Vec::new(),
            unavailable: Some(e.to_string()),
        },
    }
}
