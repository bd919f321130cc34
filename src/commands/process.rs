//! `zfactor process`: a change of state along a named path, per model.

use crate::cli::process_args::{PathArg, ProcessArgs};
use crate::commands::jobs_common::{self as jc, ctx, per_model, Pair};
use crate::error::CliError;
use crate::feed_input;
use crate::report::jobs_common::{Compared, StateReport};
use crate::report::process::{ProcessInput, ProcessReport, ProcessResult};
use eos::jobs::process::{run as run_process, End, Path};
use eos::phase::Phase;
use eos::Model;

/// Computes the report.
pub fn run(args: &ProcessArgs) -> Result<ProcessReport, CliError> {
    let feed = feed_input::read(&args.fluid)?;
    let amb = jc::ambient(&args.shared.ambient)?;
    let t1 = jc::temperature(&args.temperature)?;
    let p1 = jc::pressure(&args.pressure, amb)?;
    let path = match args.path {
        PathArg::Isochoric => Path::Isochoric,
        PathArg::Isobaric => Path::Isobaric,
        PathArg::Isothermal => Path::Isothermal,
        PathArg::Isentropic => Path::Isentropic,
        PathArg::Isenthalpic => Path::Isenthalpic,
    };
    let end = match (&args.to_temperature, &args.to_pressure) {
        (Some(t), None) => End::Temperature(jc::temperature(t)?),
        (None, Some(p)) => End::Pressure(jc::pressure(p, amb)?),
        _ => {
            return Err(CliError::BadInput(
                "give the end of the path: --to-temperature or --to-pressure".to_string(),
            ))
        }
    };
    let fits = matches!(
        (path, end),
        (Path::Isochoric, _)
            | (Path::Isobaric, End::Temperature(_))
            | (
                Path::Isothermal | Path::Isentropic | Path::Isenthalpic,
                End::Pressure(_)
            )
    );
    if !fits {
        let needs = if path == Path::Isobaric {
            "--to-temperature"
        } else {
            "--to-pressure"
        };
        return Err(CliError::BadInput(format!(
            "an {} path ends at a stated {needs}",
            path.as_str()
        )));
    }
    let x = feed.mole.clone();
    let (results, mut warnings) = per_model(&args.shared.model, &feed, |pair| {
        let mut r = one(pair, t1, p1, path, end, &x)?;
        let edge = jc::edge_notes(pair, &feed, &[("start", &r.start), ("end", &r.end)]);
        r.notes.extend(edge);
        Ok(r)
    })?;
    for r in &results {
        warnings.extend(jc::raised(&r.model, &r.notes));
    }
    let (et, ep) = match end {
        End::Temperature(t) => (Some(t), None),
        End::Pressure(p) => (None, Some(p)),
    };
    Ok(ProcessReport {
        tool: format!("zfactor {}", env!("CARGO_PKG_VERSION")),
        fluid: jc::fluid_report(&feed),
        input: ProcessInput {
            path: path.as_str(),
            temperature: args.temperature.clone(),
            pressure: args.pressure.clone(),
            to_temperature: args.to_temperature.clone(),
            to_pressure: args.to_pressure.clone(),
            temperature_k: t1,
            pressure_pa: p1,
            end_temperature_k: et,
            end_pressure_pa: ep,
            ambient_pressure_pa: amb,
            convention: "heat into the fluid, work done by the fluid; du = q - w",
        },
        results,
        warnings,
        caution: crate::CAUTION,
    })
}

fn one(
    pair: &Pair,
    t1: f64,
    p1: f64,
    path: Path,
    end: End,
    x: &[f64],
) -> Result<ProcessResult, CliError> {
    let m: &dyn Model = pair.built.model()?;
    let ig: &dyn Model = &pair.ideal;
    let e = ctx(&pair.built.id);
    let r = run_process(m, t1, p1, x, path, end).map_err(&e)?;
    let ri = run_process(ig, t1, p1, x, path, end).map_err(&e)?;
    let c = Compared::new;
    let mut notes = pair.built.notes.clone();
    for (which, s) in [("start", &r.start), ("end", &r.end)] {
        if s.phase == Phase::TwoPhase {
            notes.push(format!(
                "warning: the {which} state is two-phase (vapour mass fraction {:.4})",
                s.split.as_ref().map_or(f64::NAN, |p| p.vapor_mass_fraction)
            ));
        }
    }
    Ok(ProcessResult {
        model: pair.built.id.clone(),
        model_name: pair.built.name.clone(),
        start: StateReport::from(&r.start),
        end: StateReport::from(&r.end),
        end_temperature_k: c(r.end.t, ri.end.t),
        end_pressure_pa: c(r.end.p, ri.end.p),
        heat_j_kg: c(r.heat, ri.heat),
        work_j_kg: c(r.work, ri.work),
        flow_work_j_kg: c(r.flow_work, ri.flow_work),
        delta_u_j_kg: c(r.du, ri.du),
        delta_h_j_kg: c(r.dh, ri.dh),
        delta_s_j_kg_k: c(r.ds, ri.ds),
        delta_t_k: c(r.dt, ri.dt),
        notes,
    })
}
