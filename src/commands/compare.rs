//! `zfactor compare`: every selected model over a T-P grid or a list of states, against a
//! reference model, the built-in ISO 6976 data set or the user's reference data; statistics
//! per model and region, the spread between models where there is no reference, the
//! ideal-gas map and the model advice.

use crate::cli::CompareArgs;
use crate::compare::advice::{self, Candidate};
use crate::compare::data_file::{self, Contents, Need, Options, RefValue};
use crate::compare::engine::{self, Against, Answer, PointInput, PointResult};
use crate::compare::grid;
use crate::compare::ideal_map;
use crate::compare::iso6976;
use crate::compare::region::Region;
use crate::compare::stats::Accumulator;
use crate::error::CliError;
use crate::feed::{self, Feed};
use crate::models::{self, BuiltModel};
use crate::range::StateCheck;
use crate::report::compare::{
    Band, CompareReport, GridAxes, IdealGasMap, ModelStats, PointReport, PointValue, ReferenceInfo,
    RegionStats, StateAt,
};
use crate::units;
use eos::constants::R;

/// What the models are compared against.
enum Reference {
    Model(BuiltModel),
    Data { id: String, citation: String },
    Nothing,
}

/// Where a point came from in a file.
#[derive(Debug, Clone, Default)]
struct PointMeta {
    line: Option<usize>,
    source: Option<String>,
}

/// The states and their origin.
struct States {
    points: Vec<PointInput>,
    meta: Vec<PointMeta>,
    grid: Option<(Vec<f64>, Vec<f64>)>,
    /// (origin, T column, P column) of a file.
    file: Option<(String, String, String)>,
    skipped: Vec<String>,
    from: &'static str,
}

/// Reads "1,2,5" (percent, a trailing % allowed) into ascending distinct tolerances.
pub fn parse_tolerances(text: &str) -> Result<Vec<f64>, CliError> {
    let mut out = Vec::new();
    for part in text.split(',').map(str::trim).filter(|s| !s.is_empty()) {
        let num = part.trim_end_matches('%').trim();
        let v: f64 = num.parse().map_err(|_| {
            CliError::BadInput(format!(
                "--tolerance \"{text}\": \"{part}\" is not a number (percent, e.g. \"1,2,5\")"
            ))
        })?;
        if !(v.is_finite() && v > 0.0) {
            return Err(CliError::BadInput(format!(
                "--tolerance \"{text}\": \"{part}\" must be a percentage above zero"
            )));
        }
        out.push(v);
    }
    if out.is_empty() {
        return Err(CliError::BadInput(format!(
            "--tolerance \"{text}\" names no tolerance; write percentages, e.g. \"1,2,5\""
        )));
    }
    out.sort_by(f64::total_cmp);
    out.dedup_by(|a, b| (*a - *b).abs() <= 1e-12 * b.abs());
    Ok(out)
}

fn read_file(path: &str) -> Result<String, CliError> {
    std::fs::read_to_string(path)
        .map_err(|e| CliError::BadInput(format!("cannot read \"{path}\": {e}")))
}

fn from_contents(c: Contents, origin: &str, from: &'static str) -> States {
    let points = c
        .rows
        .iter()
        .map(|r| PointInput {
            t: r.t,
            p: r.p,
            data: r.value,
            two_phase: r.two_phase,
        })
        .collect();
    let meta = c
        .rows
        .iter()
        .map(|r| PointMeta {
            line: Some(r.line),
            source: (!r.source.is_empty()).then(|| r.source.clone()),
        })
        .collect();
    States {
        points,
        meta,
        grid: None,
        file: Some((origin.to_string(), c.t_column, c.p_column)),
        skipped: c.skipped,
        from,
    }
}

/// The grid or the states file.
fn states_of(args: &CompareArgs, feed: &Feed, ambient: f64) -> Result<States, CliError> {
    if let Some(path) = &args.states {
        let text = read_file(path)?;
        let c = data_file::read(
            &text,
            path,
            Options {
                need: Need::States,
                molar_mass: feed.molar_mass(),
                ambient_pa: ambient,
                skip_bad_rows: args.skip_bad_rows,
            },
        )
        .map_err(|e| CliError::BadInput(e.to_string()))?;
        let mut s = from_contents(c, path, "states file");
        // A states file carries no reference values even when it has a Z column.
        for p in &mut s.points {
            p.data = None;
        }
        return Ok(s);
    }
    let (Some(tt), Some(pp)) = (&args.temperatures, &args.pressures) else {
        return Err(CliError::BadInput(
            "give the states: --temperatures and --pressures (lists or ranges), or --states \
             FILE, or a reference with its own states (--reference iso6976, --reference-file)"
                .to_string(),
        ));
    };
    let t = grid::parse_axis(tt, units::temperature)
        .map_err(|e| CliError::BadInput(format!("--temperatures: {e}")))?;
    let p = grid::parse_axis(pp, |s| units::pressure_reading(s, ambient).map(|r| r.0))
        .map_err(|e| CliError::BadInput(format!("--pressures: {e}")))?;
    grid::check_size(t.len(), p.len()).map_err(CliError::BadInput)?;
    let mut points = Vec::with_capacity(t.len() * p.len());
    for &ti in &t {
        for &pj in &p {
            points.push(PointInput {
                t: ti,
                p: pj,
                data: None,
                two_phase: false,
            });
        }
    }
    let meta = vec![PointMeta::default(); points.len()];
    Ok(States {
        points,
        meta,
        grid: Some((t, p)),
        file: None,
        skipped: Vec::new(),
        from: "grid",
    })
}

/// The rows of the ISO 6976 data set for the (pure) fluid of `feed`.
fn iso_states(feed: &Feed) -> Result<States, CliError> {
    let all = iso6976::rows().map_err(|e| CliError::Computation(e.to_string()))?;
    let mut names: Vec<String> = Vec::new();
    for r in &all.rows {
        if let Some(c) = &r.component {
            if !names.contains(c) {
                names.push(c.clone());
            }
        }
    }
    let refuse = |why: &str| {
        CliError::BadInput(format!(
            "--reference iso6976: {why}; the data set has pure {}",
            names.join(", ")
        ))
    };
    if !feed.is_pure() {
        return Err(refuse("it holds pure gases only, not mixtures"));
    }
    let id = &feed.records[0].id;
    let rows: Vec<_> = all
        .rows
        .into_iter()
        .filter(|r| {
            r.component
                .as_deref()
                .and_then(|c| fluids::find(c).ok())
                .is_some_and(|c| &c.id == id)
        })
        .collect();
    if rows.is_empty() {
        return Err(refuse(&format!(
            "it has no values for {}",
            feed.records[0].name
        )));
    }
    let c = Contents {
        rows,
        skipped: Vec::new(),
        t_column: all.t_column,
        p_column: all.p_column,
    };
    Ok(from_contents(
        c,
        "built-in data set iso6976",
        "reference data",
    ))
}

/// The reference and the states to compare at.
fn reference_and_states(
    args: &CompareArgs,
    feed: &Feed,
    ambient: f64,
) -> Result<(Reference, States), CliError> {
    let grid_given = args.temperatures.is_some() || args.pressures.is_some();
    match (&args.reference, &args.reference_file) {
        (Some(r), None) if r.trim().eq_ignore_ascii_case(iso6976::ID) => {
            if grid_given || args.states.is_some() {
                return Err(CliError::BadInput(
                    "--reference iso6976 brings its own states; leave out --temperatures, \
                     --pressures and --states"
                        .to_string(),
                ));
            }
            Ok((
                Reference::Data {
                    id: iso6976::ID.to_string(),
                    citation: iso6976::CITATION.to_string(),
                },
                iso_states(feed)?,
            ))
        }
        (Some(r), None) => {
            let id = r.trim().to_ascii_lowercase();
            let built = models::build(&id, feed).map_err(|e| match e {
                CliError::BadInput(m) => CliError::BadInput(format!(
                    "--reference \"{r}\": {m}, or {} for the built-in data set",
                    iso6976::ID
                )),
                other => other,
            })?;
            Ok((Reference::Model(built), states_of(args, feed, ambient)?))
        }
        (None, Some(path)) => {
            if grid_given || args.states.is_some() {
                return Err(CliError::BadInput(
                    "--reference-file brings its own states; leave out --temperatures, \
                     --pressures and --states"
                        .to_string(),
                ));
            }
            let text = read_file(path)?;
            let mut c = data_file::read(
                &text,
                path,
                Options {
                    need: Need::Reference,
                    molar_mass: feed.molar_mass(),
                    ambient_pa: ambient,
                    skip_bad_rows: args.skip_bad_rows,
                },
            )
            .map_err(|e| CliError::BadInput(e.to_string()))?;
            if feed.is_pure() {
                let id = &feed.records[0].id;
                c.rows.retain(|r| {
                    r.component
                        .as_deref()
                        .map_or(true, |name| fluids::find(name).is_ok_and(|f| &f.id == id))
                });
                if c.rows.is_empty() {
                    return Err(CliError::BadInput(format!(
                        "{path}: no row is for {} (see its component column)",
                        feed.records[0].name
                    )));
                }
            }
            Ok((
                Reference::Data {
                    id: path.clone(),
                    citation: "the source column of the file, per point".to_string(),
                },
                from_contents(c, path, "reference data"),
            ))
        }
        _ => {
            // No reference named: a pure fluid with a reference formulation is compared with
            // it (IAPWS-95 for water, and the reference equations of the other gases).
            if models::applies("reference", feed) {
                let built = models::build("reference", feed)?;
                return Ok((Reference::Model(built), states_of(args, feed, ambient)?));
            }
            Ok((Reference::Nothing, states_of(args, feed, ambient)?))
        }
    }
}

/// Runs the comparison, writes the charts asked for, and prints the report.
pub fn dispatch(args: &CompareArgs) -> Result<crate::exit::Exit, CliError> {
    let mut report = run(args)?;
    if let Some(dir) = &args.charts {
        let mut inputs: Vec<&std::path::Path> = Vec::new();
        for f in [&args.states, &args.reference_file].into_iter().flatten() {
            inputs.push(std::path::Path::new(f));
        }
        report.charts = crate::render::chart::write_all(
            &report,
            std::path::Path::new(dir),
            args.chart_format,
            args.force,
            &inputs,
        )?;
    }
    crate::render::compare::render(&report, args.format)?;
    Ok(super::exit_for(&report.warnings))
}

/// Runs the comparison.
pub fn run(args: &CompareArgs) -> Result<CompareReport, CliError> {
    let feed = feed::read(&args.fluid)?;
    let ambient = units::ambient_pressure(&args.ambient)?;
    let tolerances = parse_tolerances(&args.tolerance)?;
    let (reference, mut states) = reference_and_states(args, &feed, ambient)?;
    let mut warnings = Vec::new();
    let mut ids = models::resolve_ids(&args.model, &feed)?;
    if let Reference::Model(r) = &reference {
        // "all" includes the reference formulation, which is then the reference and not a
        // compared model: nothing the user must read. Only a list that names it is warned.
        let named = !args.model.trim().eq_ignore_ascii_case("all");
        if ids.contains(&r.id) {
            ids.retain(|i| i != &r.id);
            if named {
                warnings.push(format!(
                    "{} is the reference and is left out of the compared models",
                    r.id
                ));
            }
        }
    }
    if ids.is_empty() {
        return Err(CliError::BadInput(
            "no model left to compare: the only model asked for is the reference".to_string(),
        ));
    }
    let built: Vec<BuiltModel> = ids
        .iter()
        .map(|id| models::build(id, &feed))
        .collect::<Result<_, _>>()?;
    let namer = models::build("pr", &feed)?;
    let dyn_models: Vec<&BuiltModel> = built.iter().collect();
    let against = match &reference {
        Reference::Model(b) => Against::Model(b),
        Reference::Data { .. } => Against::Data,
        Reference::Nothing => Against::Nothing,
    };
    let total = states.points.len() * (dyn_models.len() + 1);
    let bar = crate::progress::bar(total, "comparing");
    let step = (dyn_models.len() + 1) as u64;
    let (mut results, screened) = engine::evaluate(
        &dyn_models,
        &against,
        &namer,
        &feed.mole,
        &states.points,
        || crate::progress::inc(&bar, step),
    );
    crate::progress::finish(bar);

    // Rows of a file that a model cannot compute: refused, or skipped with --skip-bad-rows.
    if let Some((origin, tcol, pcol)) = &states.file {
        let mut keep = vec![true; results.len()];
        for (k, r) in results.iter().enumerate() {
            let failure = r.ref_error.clone().or_else(|| {
                r.answers.iter().find_map(|a| match a {
                    Answer::Failed(e) => Some(e.clone()),
                    Answer::Ok { .. } => None,
                })
            });
            if let Some(e) = failure {
                let line = states.meta[k].line.unwrap_or(0);
                let msg = format!(
                    "{origin}, line {line}, columns \"{tcol}\" and \"{pcol}\": the state is \
                     outside a model's range: {e}"
                );
                if args.skip_bad_rows {
                    states.skipped.push(msg);
                    keep[k] = false;
                } else {
                    return Err(CliError::BadInput(format!(
                        "{msg} (pass --skip-bad-rows to leave such rows out)"
                    )));
                }
            }
        }
        let mut it = keep.iter();
        results.retain(|_| *it.next().unwrap_or(&true));
        let mut it = keep.iter();
        states.points.retain(|_| *it.next().unwrap_or(&true));
        let mut it = keep.iter();
        states.meta.retain(|_| *it.next().unwrap_or(&true));
        if results.is_empty() {
            return Err(CliError::BadInput(format!(
                "{origin}: every row was skipped: {}",
                states.skipped.join("; ")
            )));
        }
    }
    if !states.skipped.is_empty() {
        warnings.push(format!(
            "{} row(s) skipped (--skip-bad-rows); see \"skipped\"",
            states.skipped.len()
        ));
    }

    let has_reference = !matches!(reference, Reference::Nothing);
    let stats: Vec<ModelStats> = built
        .iter()
        .enumerate()
        .map(|(k, b)| model_stats(k, b, &results, &states.points, has_reference))
        .collect();
    for s in &stats {
        if s.points_failed > 0 {
            warnings.push(format!(
                "{} could not compute {} of {} states (see the points' \"error\")",
                s.model,
                s.points_failed,
                results.len()
            ));
        }
    }
    let ref_failed = results.iter().filter(|r| r.ref_error.is_some()).count();
    if ref_failed > 0 {
        warnings.push(format!(
            "the reference could not compute {ref_failed} of {} states; they are left out",
            results.len()
        ));
    }
    let excluded_two_phase = results
        .iter()
        .filter(|r| r.region == Region::TwoPhase)
        .count();

    let reference_model = match &reference {
        Reference::Model(b) => Some(b),
        _ => None,
    };
    let points = point_reports(
        &built,
        &dyn_models,
        reference_model,
        &results,
        &states,
        &feed,
    );
    let flagged = points
        .iter()
        .filter(|p| p.values.iter().any(|v| v.flag.is_some()))
        .count();
    let reference_flagged = points.iter().filter(|p| p.reference_flag.is_some()).count();
    if flagged > 0 {
        warnings.push(format!(
            "at {flagged} of {} states a model is outside its range or in the solid region \
             (see the points' \"flag\"): its values there are extrapolations",
            points.len()
        ));
    }
    if reference_flagged > 0 {
        warnings.push(format!(
            "at {reference_flagged} of {} states the reference itself is outside its range or \
             in the solid region (see the points' \"reference_flag\"): deviations there are \
             measured against an extrapolation",
            points.len()
        ));
    }
    let band = if has_reference {
        None
    } else {
        band_of(&built, &points)
    };
    let ideal_gas_map = states
        .grid
        .as_ref()
        .and_then(|(t, p)| ideal_map_of(&reference, &built, &results, t, p, &tolerances));
    let reference_name = match &reference {
        Reference::Model(b) => b.id.clone(),
        Reference::Data { id, .. } => id.clone(),
        Reference::Nothing => String::new(),
    };
    let advice = if has_reference {
        let candidates: Vec<Candidate> = stats
            .iter()
            .map(|s| Candidate {
                model: s.model.clone(),
                stats: s
                    .mean_abs_dev_pct
                    .map(|mean| crate::compare::stats::DeviationStats {
                        points: s.points_used,
                        mean_abs_dev_pct: mean,
                        max_abs_dev_pct: s.max_abs_dev_pct.unwrap_or(f64::INFINITY),
                        bias_pct: s.bias_pct.unwrap_or(0.0),
                        max_at: 0,
                    }),
                failed: s.points_failed,
            })
            .collect();
        advice::advise(&candidates, &tolerances, &reference_name)
    } else {
        Vec::new()
    };
    let mut regions: Vec<Region> = results.iter().map(|r| r.region).collect();
    regions.sort();
    regions.dedup();
    let comp_ids: Vec<&str> = feed.records.iter().map(|r| r.id.as_str()).collect();
    let mut model_ids: Vec<&str> = ids.iter().map(String::as_str).collect();
    if let Reference::Model(b) = &reference {
        model_ids.push(&b.id);
    }
    let weaknesses = advice::weaknesses(&comp_ids, &model_ids, &regions);
    let reference_info = match &reference {
        Reference::Model(b) => ReferenceInfo {
            kind: "model",
            id: Some(b.id.clone()),
            citation: Some(b.citation.clone()),
        },
        Reference::Data { id, citation } => ReferenceInfo {
            kind: "data",
            id: Some(id.clone()),
            citation: Some(citation.clone()),
        },
        Reference::Nothing => ReferenceInfo {
            kind: "none",
            id: None,
            citation: None,
        },
    };
    Ok(CompareReport {
        tool: format!("zfactor {}", env!("CARGO_PKG_VERSION")),
        fluid: feed.label(),
        composition: super::state::composition_rows(&feed),
        reference: reference_info,
        states_from: states.from.to_string(),
        phase_check: crate::phase_screen::method_note(screened),
        grid: states.grid.as_ref().map(|(t, p)| GridAxes {
            temperatures_k: t.clone(),
            pressures_pa: p.clone(),
        }),
        models: stats,
        excluded_two_phase,
        points,
        band,
        ideal_gas_map,
        advice,
        weaknesses,
        skipped_rows: states.skipped.len(),
        skipped: states.skipped,
        charts: Vec::new(),
        warnings,
        caution: crate::CAUTION,
    })
}

fn at(points: &[PointInput], k: usize) -> StateAt {
    StateAt {
        temperature_k: points[k].t,
        pressure_pa: points[k].p,
    }
}

/// Statistics of model `k` over every point and per region.
fn model_stats(
    k: usize,
    b: &BuiltModel,
    results: &[PointResult],
    points: &[PointInput],
    has_reference: bool,
) -> ModelStats {
    let mut all = Accumulator::new();
    let mut per: Vec<(Region, Accumulator)> = Region::ALL
        .iter()
        .filter(|r| r.is_used())
        .map(|&r| (r, Accumulator::new()))
        .collect();
    let mut failed = 0;
    for (i, r) in results.iter().enumerate() {
        if matches!(r.answers[k], Answer::Failed(_)) {
            failed += 1;
        }
        if !r.region.is_used() {
            continue;
        }
        if let Some(d) = r.dev_pct[k] {
            all.add(i, d);
            if let Some((_, acc)) = per.iter_mut().find(|(reg, _)| *reg == r.region) {
                acc.add(i, d);
            }
        }
    }
    let s = all.finish().filter(|_| has_reference);
    ModelStats {
        model: b.id.clone(),
        model_name: b.name.clone(),
        citation: b.citation.clone(),
        mean_abs_dev_pct: s.map(|s| s.mean_abs_dev_pct),
        max_abs_dev_pct: s.map(|s| s.max_abs_dev_pct),
        bias_pct: s.map(|s| s.bias_pct),
        max_at: s.map(|s| at(points, s.max_at)),
        points_used: s.map_or(0, |s| s.points),
        points_failed: failed,
        regions: per
            .iter()
            .filter_map(|(reg, acc)| {
                acc.finish().map(|s| RegionStats {
                    region: reg.as_str(),
                    points: s.points,
                    mean_abs_dev_pct: s.mean_abs_dev_pct,
                    max_abs_dev_pct: s.max_abs_dev_pct,
                    bias_pct: s.bias_pct,
                    max_at: at(points, s.max_at),
                })
            })
            .collect(),
        notes: b.notes.clone(),
    }
}

fn point_reports(
    built: &[BuiltModel],
    dyn_models: &[&BuiltModel],
    reference: Option<&BuiltModel>,
    results: &[PointResult],
    states: &States,
    feed: &Feed,
) -> Vec<PointReport> {
    let mm = feed.molar_mass();
    let checks: Vec<StateCheck> = built.iter().map(|b| StateCheck::new(b, feed)).collect();
    let reference_check = reference.map(|b| StateCheck::new(b, feed));
    results
        .iter()
        .zip(&states.points)
        .zip(&states.meta)
        .map(|((r, pt), meta)| {
            let reference_z = match pt.data {
                Some(RefValue::Z(z)) => Some(z),
                _ => r.ref_rho.map(|rho| pt.p / (rho * R * pt.t)),
            };
            PointReport {
                temperature_k: pt.t,
                pressure_pa: pt.p,
                phase: r.region.as_str(),
                line: meta.line,
                source: meta.source.clone(),
                reference_z,
                reference_density_kg_m3: r.ref_rho.map(|rho| rho * mm),
                reference_flag: reference_check
                    .as_ref()
                    .zip(r.ref_rho)
                    .and_then(|(c, rho)| c.flag(pt.t, pt.p, rho)),
                values: built
                    .iter()
                    .zip(&checks)
                    .zip(&r.answers)
                    .zip(&r.dev_pct)
                    .map(|(((b, c), a), d)| PointValue {
                        flag: a.rho().and_then(|rho| c.flag(pt.t, pt.p, rho)),
                        model: b.id.clone(),
                        z: a.z(),
                        molar_density_mol_m3: a.rho(),
                        mass_density_kg_m3: a.rho().map(|rho| rho * mm),
                        deviation_pct: *d,
                        error: match a {
                            Answer::Failed(e) => Some(e.clone()),
                            Answer::Ok { .. } => None,
                        },
                    })
                    .collect(),
                spread_pct: engine::spread_pct(dyn_models, &r.answers),
            }
        })
        .collect()
}

fn band_of(built: &[BuiltModel], points: &[PointReport]) -> Option<Band> {
    let spreads: Vec<(usize, f64)> = points
        .iter()
        .enumerate()
        .filter(|(_, p)| p.phase != Region::TwoPhase.as_str())
        .filter_map(|(i, p)| p.spread_pct.map(|s| (i, s)))
        .collect();
    let (imax, max) = spreads.iter().copied().max_by(|a, b| a.1.total_cmp(&b.1))?;
    let mean = spreads.iter().map(|s| s.1).sum::<f64>() / spreads.len() as f64;
    Some(Band {
        models: built
            .iter()
            .filter(|b| b.id != "ideal")
            .map(|b| b.id.clone())
            .collect(),
        mean_spread_pct: mean,
        max_spread_pct: max,
        max_at: StateAt {
            temperature_k: points[imax].temperature_k,
            pressure_pa: points[imax].pressure_pa,
        },
    })
}

/// The ideal-gas map from the reference model, or from the most complete real-gas model
/// compared.
fn ideal_map_of(
    reference: &Reference,
    built: &[BuiltModel],
    results: &[PointResult],
    t: &[f64],
    p: &[f64],
    tolerances: &[f64],
) -> Option<IdealGasMap> {
    let np = p.len();
    let z_of = |i: usize, j: usize| -> f64 {
        let k = i * np + j;
        match reference {
            Reference::Model(_) => results[k]
                .ref_rho
                .map_or(f64::NAN, |rho| p[j] / (rho * R * t[i])),
            _ => f64::NAN,
        }
    };
    let (basis, z): (String, Vec<Vec<f64>>) = match reference {
        Reference::Model(b) => (
            b.id.clone(),
            (0..t.len())
                .map(|i| (0..np).map(|j| z_of(i, j)).collect())
                .collect(),
        ),
        Reference::Data { .. } => return None,
        Reference::Nothing => {
            let k = built
                .iter()
                .enumerate()
                .filter(|(_, b)| b.id != "ideal")
                .max_by_key(|(_, b)| advice::rank(&b.id).0)
                .map(|(k, _)| k)?;
            (
                built[k].id.clone(),
                (0..t.len())
                    .map(|i| {
                        (0..np)
                            .map(|j| results[i * np + j].answers[k].z().unwrap_or(f64::NAN))
                            .collect()
                    })
                    .collect(),
            )
        }
    };
    let error_pct = z
        .iter()
        .map(|row| {
            row.iter()
                .map(|&zv| Some(ideal_map::error_pct(zv)).filter(|e| e.is_finite()))
                .collect()
        })
        .collect();
    Some(IdealGasMap {
        basis_model: basis,
        error_pct,
        tolerances: ideal_map::build(t, p, &z, tolerances),
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn tolerances_are_read_sorted_and_checked() {
        let t = parse_tolerances("5, 1%,2 %,1").unwrap();
        assert_eq!(t, vec![1.0, 2.0, 5.0]);
        for bad in ["", "x", "0", "-1", "inf"] {
            assert!(parse_tolerances(bad).is_err(), "{bad}");
        }
    }
}
