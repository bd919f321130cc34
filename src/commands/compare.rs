//! `zfactor compare`: every selected model over a T-P grid or a list of states, against a
//! reference model, the built-in ISO 6976 data set or the user's reference data; statistics
//! per model and region, the spread between models where there is no reference, the
//! ideal-gas map and the model advice.

use crate::cli::CompareArgs;
use crate::compare::advice::{self, Candidate};
use crate::compare::data_file::{self, Need, Options, RefValue, Row, Skipped};
use crate::compare::engine::{self, Against, Answer, PointInput, PointResult, Screens};
use crate::compare::grid;
use crate::compare::ideal_map;
use crate::compare::iso6976;
use crate::compare::iso6976_sum;
use crate::compare::region::Region;
use crate::compare::stats::Accumulator;
use crate::error::CliError;
use crate::feed::Feed;
use crate::feed_input;
use crate::models::{self, BuiltModel};
use crate::range::StateCheck;
use crate::report::compare::{
    Band, CompareReport, GridAxes, IdealGasMap, ModelStats, ReferenceInfo, RegionStats, StateAt,
};
use crate::report::compare_points::{Encoding, PointReport, PointStore, PointValue, Policy};
use crate::units;
use eos::constants::R;

/// What the models are compared against.
enum Reference {
    Model(BuiltModel),
    Data { id: String, citation: String },
    Nothing,
}

/// States evaluated and written per chunk: memory holds one chunk's results, whatever the
/// size of the grid or the file.
pub const CHUNK: usize = 16_384;

/// Where a point came from in a file.
#[derive(Debug, Clone, Default)]
struct PointMeta {
    line: Option<usize>,
    source: Option<String>,
}

/// Where the states come from, read a chunk at a time.
enum Rows {
    /// A T-P grid, temperature-major; `next` is the index of the next state.
    Grid {
        t: Vec<f64>,
        p: Vec<f64>,
        next: usize,
    },
    /// A states or reference file, read row by row.
    File {
        reader: Box<data_file::Reader<std::io::BufReader<std::fs::File>>>,
        /// For a pure fluid: rows whose component column names another fluid are left out.
        only: Option<String>,
        /// A states file: its Z or density column is not a reference.
        states_only: bool,
    },
    /// Rows already read (the built-in data set).
    Listed(std::vec::IntoIter<Row>),
}

/// The states and their origin.
struct States {
    rows: Rows,
    grid: Option<(Vec<f64>, Vec<f64>)>,
    /// (origin, T column, P column) of a file.
    file: Option<(String, String, String)>,
    /// The number of states, when known beforehand (a grid, the data set), or an estimate
    /// from the file's lines (for the progress bar).
    expected: usize,
    skipped: Skipped,
    from: &'static str,
}

impl States {
    /// Up to `n` more states with their origin; none at the end.
    fn next_chunk(&mut self, n: usize) -> Result<Vec<(PointInput, PointMeta)>, CliError> {
        let point = |r: Row, keep_value: bool| {
            (
                PointInput {
                    t: r.t,
                    p: r.p,
                    data: if keep_value { r.value } else { None },
                    two_phase: r.two_phase,
                },
                PointMeta {
                    line: (r.line > 0).then_some(r.line),
                    source: (!r.source.is_empty()).then_some(r.source),
                },
            )
        };
        match &mut self.rows {
            Rows::Grid { t, p, next } => {
                let total = t.len() * p.len();
                let end = (*next + n).min(total);
                let out = (*next..end)
                    .map(|k| {
                        (
                            PointInput {
                                t: t[k / p.len()],
                                p: p[k % p.len()],
                                data: None,
                                two_phase: false,
                            },
                            PointMeta::default(),
                        )
                    })
                    .collect();
                *next = end;
                Ok(out)
            }
            Rows::Listed(it) => Ok(it.by_ref().take(n).map(|r| point(r, true)).collect()),
            Rows::File {
                reader,
                only,
                states_only,
            } => {
                let mut out = Vec::new();
                // Rows of other fluids are left out; read on until the chunk has rows or the
                // file ends.
                loop {
                    let rows = reader
                        .next_rows(n - out.len(), &mut self.skipped)
                        .map_err(|e| CliError::BadInput(e.to_string()))?;
                    if rows.is_empty() {
                        return Ok(out);
                    }
                    out.extend(
                        rows.into_iter()
                            .filter(|r| match (only.as_deref(), r.component.as_deref()) {
                                (Some(id), Some(name)) => {
                                    fluids::find(name).is_ok_and(|f| f.id == id)
                                }
                                _ => true,
                            })
                            .map(|r| point(r, !*states_only)),
                    );
                    if out.len() == n {
                        return Ok(out);
                    }
                }
            }
        }
    }
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

/// Opens a states or reference file for reading row by row.
fn open_file(
    path: &str,
    feed: &Feed,
    ambient: f64,
    need: Need,
    skip_bad_rows: bool,
    from: &'static str,
) -> Result<States, CliError> {
    let open = || {
        std::fs::File::open(path)
            .map_err(|e| CliError::BadInput(format!("cannot read \"{path}\": {e}")))
    };
    let reader = data_file::Reader::new(
        std::io::BufReader::with_capacity(1 << 20, open()?),
        path,
        Options {
            need,
            molar_mass: feed.molar_mass(),
            ambient_pa: ambient,
            skip_bad_rows,
        },
    )
    .map_err(|e| CliError::BadInput(e.to_string()))?;
    let file = (
        path.to_string(),
        reader.t_column.clone(),
        reader.p_column.clone(),
    );
    Ok(States {
        rows: Rows::File {
            reader: Box::new(reader),
            only: feed.is_pure().then(|| feed.records[0].id.clone()),
            states_only: need == Need::States,
        },
        grid: None,
        file: Some(file),
        expected: count_lines(open()?).saturating_sub(1),
        skipped: Skipped::default(),
        from,
    })
}

/// Lines of a file (for the progress bar), read in blocks without keeping them.
fn count_lines(f: std::fs::File) -> usize {
    use std::io::Read;
    let mut r = std::io::BufReader::with_capacity(1 << 20, f);
    let mut buf = vec![0u8; 1 << 20];
    let mut n = 0;
    while let Ok(k) = r.read(&mut buf) {
        if k == 0 {
            break;
        }
        n += buf[..k].iter().filter(|&&b| b == b'\n').count();
    }
    n
}

/// The grid or the states file.
fn states_of(args: &CompareArgs, feed: &Feed, ambient: f64) -> Result<States, CliError> {
    if let Some(path) = &args.states {
        // A states file carries no reference values even when it has a Z column.
        return open_file(
            path,
            feed,
            ambient,
            Need::States,
            args.skip_bad_rows,
            "states file",
        );
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
    Ok(States {
        rows: Rows::Grid {
            t: t.clone(),
            p: p.clone(),
            next: 0,
        },
        expected: t.len() * p.len(),
        grid: Some((t, p)),
        file: None,
        skipped: Skipped::default(),
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
        return summation_states(feed);
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
    let origin = "built-in data set iso6976".to_string();
    Ok(States {
        expected: rows.len(),
        rows: Rows::Listed(rows.into_iter()),
        grid: None,
        file: Some((origin, all.t_column, all.p_column)),
        skipped: Skipped::default(),
        from: "reference data",
    })
}

/// A mixture against the ISO 6976 summation method at its three reference temperatures.
fn summation_states(feed: &Feed) -> Result<States, CliError> {
    let ids = feed.ids();
    let values = iso6976_sum::all_temperatures(&ids, &feed.mole)
        .map_err(|e| CliError::BadInput(format!("--reference iso6976: {e}")))?;
    let rows: Vec<Row> = values
        .iter()
        .map(|s| Row {
            line: 0,
            t: s.t,
            p: iso6976_sum::P_REF,
            value: Some(RefValue::Z(s.z)),
            source: format!(
                "ISO 6976 summation method (lowest confidence of the factors used: {})",
                s.confidence
            ),
            two_phase: false,
            component: None,
        })
        .collect();
    Ok(States {
        expected: rows.len(),
        rows: Rows::Listed(rows.into_iter()),
        grid: None,
        file: Some((
            "the ISO 6976 summation method".to_string(),
            "T".to_string(),
            "P".to_string(),
        )),
        skipped: Skipped::default(),
        from: "reference data",
    })
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
            let citation = if feed.is_pure() {
                iso6976::CITATION
            } else {
                iso6976_sum::METHOD
            };
            Ok((
                Reference::Data {
                    id: iso6976::ID.to_string(),
                    citation: citation.to_string(),
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
            Ok((
                Reference::Data {
                    id: path.clone(),
                    citation: "the source column of the file, per point".to_string(),
                },
                open_file(
                    path,
                    feed,
                    ambient,
                    Need::Reference,
                    args.skip_bad_rows,
                    "reference data",
                )?,
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
        let curves = chart_curves(args, &report)?;
        let maps = chart_maps(args, &report)?;
        report.charts = crate::render::chart::write_all(
            &report,
            curves.as_ref(),
            maps.as_ref(),
            std::path::Path::new(dir),
            args.chart_format,
            args.force,
            &inputs,
        )?;
    }
    crate::render::compare::render(&report, args.format)?;
    Ok(super::exit_for(&report.warnings))
}

/// Points per isotherm of the charts, whatever grid the comparison used.
pub const CHART_POINTS: usize = 200;

/// The isotherms of the charts sampled on a grid of their own: the comparison's models (and
/// its reference model) at [`CHART_POINTS`] pressures spanning the user's, on the chart's
/// temperatures ([`crate::render::chart::chart_temperatures`]); `None` for a list of states
/// (the chart then draws the states themselves).
fn chart_curves(
    args: &CompareArgs,
    report: &CompareReport,
) -> Result<Option<CompareReport>, CliError> {
    let Some(grid) = &report.grid else {
        return Ok(None);
    };
    let p = &grid.pressures_pa;
    let (lo, hi) = p
        .iter()
        .fold((f64::MAX, f64::MIN), |(a, b), &x| (a.min(x), b.max(x)));
    if lo >= hi || !lo.is_finite() || !hi.is_finite() {
        return Ok(None);
    }
    let temps = crate::render::chart::chart_temperatures(&grid.temperatures_k);
    let temps: Vec<String> = temps.iter().map(|t| format!("{t:e} K")).collect();
    resampled(
        args,
        report,
        temps.join(","),
        format!("{lo:e}..{hi:e} Pa n {CHART_POINTS}"),
    )
}

/// The comparison of `args` re-run on the given temperatures and pressures, for charts:
/// reference data (drawn as the points they are) are left out of the re-run.
fn resampled(
    args: &CompareArgs,
    report: &CompareReport,
    temperatures: String,
    pressures: String,
) -> Result<Option<CompareReport>, CliError> {
    let mut sampled = args.clone();
    sampled.temperatures = Some(temperatures);
    sampled.pressures = Some(pressures);
    sampled.states = None;
    if report.reference.kind != "model" {
        sampled.reference = None;
        sampled.reference_file = None;
    }
    run(&sampled).map(Some)
}

/// Points per axis of the charts' maps.
pub const MAP_POINTS: usize = 200;

/// The deviation and ideal-gas maps sampled on a grid of their own: [`MAP_POINTS`] x
/// [`MAP_POINTS`] states over the user's temperatures and pressures, with the comparison's
/// models and reference; `None` for a list of states or a grid of one row or column.
fn chart_maps(
    args: &CompareArgs,
    report: &CompareReport,
) -> Result<Option<CompareReport>, CliError> {
    let Some(grid) = &report.grid else {
        return Ok(None);
    };
    let span = |v: &[f64]| {
        v.iter()
            .fold((f64::MAX, f64::MIN), |(a, b), &x| (a.min(x), b.max(x)))
    };
    let ((t0, t1), (p0, p1)) = (span(&grid.temperatures_k), span(&grid.pressures_pa));
    if t0 >= t1 || p0 >= p1 || !(t0.is_finite() && p1.is_finite()) {
        return Ok(None);
    }
    resampled(
        args,
        report,
        format!("{t0:e}..{t1:e} K n {MAP_POINTS}"),
        format!("{p0:e}..{p1:e} Pa n {MAP_POINTS}"),
    )
}

/// What the points are kept for: the chosen output, and charts when asked.
fn policy(args: &CompareArgs) -> Policy {
    use crate::cli::Format;
    if args.charts.is_some() {
        return Policy::HoldAll;
    }
    match args.format {
        Format::Table => Policy::HoldUpTo(crate::render::compare::MAX_TABLE_POINTS),
        Format::Json => Policy::Spill {
            after: CHUNK,
            encoding: Encoding::Json,
        },
        Format::Csv => Policy::Spill {
            after: CHUNK,
            encoding: Encoding::Csv(crate::render::compare::csv_cells),
        },
    }
}

/// Per-region accumulators of one model.
type RegionAccumulators = Vec<(Region, Accumulator<StateAt>)>;

/// Everything summed over the points as they go by, so that no point need be kept.
struct Tally {
    /// Per model: all points, per region, failures.
    all: Vec<Accumulator<StateAt>>,
    per: Vec<RegionAccumulators>,
    failed: Vec<usize>,
    points: usize,
    ref_failed: usize,
    excluded_two_phase: usize,
    flagged: usize,
    reference_flagged: usize,
    regions: Vec<Region>,
    /// Spread between models: count, sum, maximum and where.
    spreads: usize,
    spread_sum: f64,
    spread_max: Option<(f64, StateAt)>,
    /// Z of the ideal-gas map's basis at each grid state, in grid order.
    map_z: Vec<f64>,
}

impl Tally {
    fn new(models: usize) -> Self {
        let regions = || {
            Region::ALL
                .iter()
                .filter(|r| r.is_used())
                .map(|&r| (r, Accumulator::new()))
                .collect()
        };
        Self {
            all: vec![Accumulator::new(); models],
            per: (0..models).map(|_| regions()).collect(),
            failed: vec![0; models],
            points: 0,
            ref_failed: 0,
            excluded_two_phase: 0,
            flagged: 0,
            reference_flagged: 0,
            regions: Vec::new(),
            spreads: 0,
            spread_sum: 0.0,
            spread_max: None,
            map_z: Vec::new(),
        }
    }

    /// Adds one point.
    fn add(&mut self, r: &PointResult, report: &PointReport) {
        let at = StateAt {
            temperature_k: report.temperature_k,
            pressure_pa: report.pressure_pa,
        };
        self.points += 1;
        if !self.regions.contains(&r.region) {
            self.regions.push(r.region);
        }
        if r.ref_error.is_some() {
            self.ref_failed += 1;
        }
        if r.region == Region::TwoPhase {
            self.excluded_two_phase += 1;
        }
        if report.values.iter().any(|v| v.flag.is_some()) {
            self.flagged += 1;
        }
        if report.reference_flag.is_some() {
            self.reference_flagged += 1;
        }
        for (k, a) in r.answers.iter().enumerate() {
            if matches!(a, Answer::Failed(_)) {
                self.failed[k] += 1;
            }
            if !r.region.is_used() {
                continue;
            }
            if let Some(d) = r.dev_pct[k] {
                self.all[k].add(at, d);
                if let Some((_, acc)) = self.per[k].iter_mut().find(|(g, _)| *g == r.region) {
                    acc.add(at, d);
                }
            }
        }
        if r.region != Region::TwoPhase {
            if let Some(sp) = report.spread_pct {
                self.spreads += 1;
                self.spread_sum += sp;
                if !self.spread_max.is_some_and(|(m, _)| sp <= m) {
                    self.spread_max = Some((sp, at));
                }
            }
        }
    }
}

/// Runs the comparison.
pub fn run(args: &CompareArgs) -> Result<CompareReport, CliError> {
    let feed = feed_input::read(&args.fluid)?;
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
    let reference_model = match &reference {
        Reference::Model(b) => Some(b),
        _ => None,
    };
    let checks = Checks::new(&built, reference_model, &feed);
    // The ideal-gas map's Z: the reference model's, or (without a reference) the most
    // complete real-gas model's; none against data.
    let map_basis: Option<Option<usize>> = match (&states.grid, &reference) {
        (None, _) | (_, Reference::Data { .. }) => None,
        (Some(_), Reference::Model(_)) => Some(None),
        (Some(_), Reference::Nothing) => built
            .iter()
            .enumerate()
            .filter(|(_, b)| b.id != "ideal")
            .max_by_key(|(_, b)| advice::rank(&b.id).0)
            .map(|(k, _)| Some(k)),
    };
    // A grid's phase screens are made once for the whole grid; a file's per chunk.
    let grid_screens = states.grid.as_ref().map(|(t, p)| {
        let p_low = p.iter().copied().fold(f64::INFINITY, f64::min);
        Screens::new(
            &dyn_models,
            &against,
            &namer,
            &feed.mole,
            t,
            t.len() * p.len(),
            p_low,
        )
    });
    let mut screened = grid_screens.as_ref().is_some_and(Screens::is_active);

    let step = (dyn_models.len() + 1) as u64;
    let bar = crate::progress::bar(states.expected * (dyn_models.len() + 1), "comparing");
    let mut tally = Tally::new(built.len());
    let mut store = PointStore::new(policy(args));
    loop {
        let chunk = states.next_chunk(CHUNK)?;
        if chunk.is_empty() {
            break;
        }
        let (inputs, metas): (Vec<PointInput>, Vec<PointMeta>) = chunk.into_iter().unzip();
        let tick = || crate::progress::inc(&bar, step);
        let results = match &grid_screens {
            Some(sc) => engine::evaluate_screened(
                &dyn_models,
                &against,
                &namer,
                &feed.mole,
                &inputs,
                sc,
                tick,
            ),
            None => {
                let (r, sc) =
                    engine::evaluate(&dyn_models, &against, &namer, &feed.mole, &inputs, tick);
                screened |= sc;
                r
            }
        };
        for ((r, pt), meta) in results.iter().zip(&inputs).zip(metas) {
            // Rows of a file that a model cannot compute: refused, or skipped with
            // --skip-bad-rows.
            if let Some((origin, tcol, pcol)) = &states.file {
                let failure = r.ref_error.clone().or_else(|| {
                    r.answers.iter().find_map(|a| match a {
                        Answer::Failed(e) => Some(e.clone()),
                        Answer::Ok { .. } => None,
                    })
                });
                if let Some(e) = failure {
                    let line = meta.line.unwrap_or(0);
                    let msg = format!(
                        "{origin}, line {line}, columns \"{tcol}\" and \"{pcol}\": the state \
                         is outside a model's range: {e}"
                    );
                    if !args.skip_bad_rows {
                        return Err(CliError::BadInput(format!(
                            "{msg} (pass --skip-bad-rows to leave such rows out)"
                        )));
                    }
                    states.skipped.push(msg);
                    continue;
                }
            }
            let report = point_report(&built, &dyn_models, &checks, r, pt, meta, &feed);
            if let Some(basis) = map_basis {
                tally.map_z.push(match basis {
                    None => r.ref_rho.map_or(f64::NAN, |rho| pt.p / (rho * R * pt.t)),
                    Some(k) => r.answers[k].z().unwrap_or(f64::NAN),
                });
            }
            tally.add(r, &report);
            store.push(report).map_err(CliError::Output)?;
        }
    }
    crate::progress::finish(bar);
    store.finish().map_err(CliError::Output)?;

    if store.is_empty() {
        let why = if states.skipped.count > 0 {
            format!(
                "every row was skipped: {}",
                states.skipped.messages.join("; ")
            )
        } else {
            format!(
                "no row is for {} (see its component column)",
                feed.records[0].name
            )
        };
        let origin = states.file.as_ref().map_or("the states", |f| f.0.as_str());
        return Err(CliError::BadInput(format!("{origin}: {why}")));
    }
    if states.skipped.count > 0 {
        let listed = if states.skipped.count > states.skipped.messages.len() {
            format!(
                "; the first {} are listed in \"skipped\"",
                states.skipped.messages.len()
            )
        } else {
            "; see \"skipped\"".to_string()
        };
        warnings.push(format!(
            "{} row(s) skipped (--skip-bad-rows){listed}",
            states.skipped.count
        ));
    }

    let has_reference = !matches!(reference, Reference::Nothing);
    let stats: Vec<ModelStats> = built
        .iter()
        .enumerate()
        .map(|(k, b)| model_stats(k, b, &tally, has_reference))
        .collect();
    let n = tally.points;
    for s in &stats {
        if s.points_failed > 0 {
            warnings.push(format!(
                "{} could not compute {} of {n} states (see the points' \"error\")",
                s.model, s.points_failed,
            ));
        }
    }
    if tally.ref_failed > 0 {
        warnings.push(format!(
            "the reference could not compute {} of {n} states; they are left out",
            tally.ref_failed
        ));
    }
    if tally.flagged > 0 {
        warnings.push(format!(
            "at {} of {n} states a model is outside its range or in the solid region \
             (see the points' \"flag\"): its values there are extrapolations",
            tally.flagged
        ));
    }
    if tally.reference_flagged > 0 {
        warnings.push(format!(
            "at {} of {n} states the reference itself is outside its range or in the solid \
             region (see the points' \"reference_flag\"): deviations there are measured \
             against an extrapolation",
            tally.reference_flagged
        ));
    }
    let band = if has_reference {
        None
    } else {
        tally.spread_max.map(|(max, at)| Band {
            models: built
                .iter()
                .filter(|b| b.id != "ideal")
                .map(|b| b.id.clone())
                .collect(),
            mean_spread_pct: tally.spread_sum / tally.spreads as f64,
            max_spread_pct: max,
            max_at: at,
        })
    };
    let ideal_gas_map = match (&states.grid, map_basis) {
        (Some((t, p)), Some(basis)) => {
            let id = match (basis, &reference) {
                (Some(k), _) => built[k].id.clone(),
                (None, Reference::Model(b)) => b.id.clone(),
                (None, _) => String::new(),
            };
            Some(ideal_map_of(
                id,
                std::mem::take(&mut tally.map_z),
                t,
                p,
                &tolerances,
            ))
        }
        _ => None,
    };
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
    let mut regions = tally.regions.clone();
    regions.sort();
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
            name: Some(b.name.clone()),
        },
        Reference::Data { id, citation } => ReferenceInfo {
            kind: "data",
            id: Some(id.clone()),
            citation: Some(citation.clone()),
            name: None,
        },
        Reference::Nothing => ReferenceInfo {
            kind: "none",
            id: None,
            citation: None,
            name: None,
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
        excluded_two_phase: tally.excluded_two_phase,
        points: store,
        band,
        ideal_gas_map,
        advice,
        weaknesses,
        skipped_rows: states.skipped.count,
        skipped: states.skipped.messages,
        charts: Vec::new(),
        warnings,
        caution: crate::CAUTION,
    })
}

/// Statistics of model `k` over every point and per region.
fn model_stats(k: usize, b: &BuiltModel, tally: &Tally, has_reference: bool) -> ModelStats {
    let s = tally.all[k].finish().filter(|_| has_reference);
    ModelStats {
        model: b.id.clone(),
        model_name: b.name.clone(),
        citation: b.citation.clone(),
        mean_abs_dev_pct: s.map(|s| s.mean_abs_dev_pct),
        max_abs_dev_pct: s.map(|s| s.max_abs_dev_pct),
        bias_pct: s.map(|s| s.bias_pct),
        max_at: s.map(|s| s.max_at),
        points_used: s.map_or(0, |s| s.points),
        points_failed: tally.failed[k],
        regions: tally.per[k]
            .iter()
            .filter_map(|(reg, acc)| {
                acc.finish().map(|s| RegionStats {
                    region: reg.as_str(),
                    points: s.points,
                    mean_abs_dev_pct: s.mean_abs_dev_pct,
                    max_abs_dev_pct: s.max_abs_dev_pct,
                    bias_pct: s.bias_pct,
                    max_at: s.max_at,
                })
            })
            .collect(),
        notes: b.notes.clone(),
    }
}

/// The range and solid checks of the compared models and the reference model.
struct Checks {
    models: Vec<StateCheck>,
    reference: Option<StateCheck>,
}

impl Checks {
    fn new(built: &[BuiltModel], reference: Option<&BuiltModel>, feed: &Feed) -> Self {
        Self {
            models: built.iter().map(|b| StateCheck::new(b, feed)).collect(),
            reference: reference.map(|b| StateCheck::new(b, feed)),
        }
    }
}

/// The report of one point.
fn point_report(
    built: &[BuiltModel],
    dyn_models: &[&BuiltModel],
    checks: &Checks,
    r: &PointResult,
    pt: &PointInput,
    meta: PointMeta,
    feed: &Feed,
) -> PointReport {
    let mm = feed.molar_mass();
    let reference_z = match pt.data {
        Some(RefValue::Z(z)) => Some(z),
        _ => r.ref_rho.map(|rho| pt.p / (rho * R * pt.t)),
    };
    PointReport {
        temperature_k: pt.t,
        pressure_pa: pt.p,
        phase: r.region.as_str(),
        line: meta.line,
        source: meta.source,
        reference_z,
        reference_density_kg_m3: r.ref_rho.map(|rho| rho * mm),
        reference_flag: checks
            .reference
            .as_ref()
            .zip(r.ref_rho)
            .and_then(|(c, rho)| c.flag(pt.t, pt.p, rho)),
        values: built
            .iter()
            .zip(&checks.models)
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
}

/// The ideal-gas map from the Z of model `basis` at every grid state (grid order).
fn ideal_map_of(
    basis: String,
    z_flat: Vec<f64>,
    t: &[f64],
    p: &[f64],
    tolerances: &[f64],
) -> IdealGasMap {
    let z: Vec<Vec<f64>> = z_flat.chunks(p.len()).map(<[f64]>::to_vec).collect();
    drop(z_flat);
    let error_pct = z
        .iter()
        .map(|row| {
            row.iter()
                .map(|&zv| Some(ideal_map::error_pct(zv)).filter(|e| e.is_finite()))
                .collect()
        })
        .collect();
    IdealGasMap {
        basis_model: basis,
        error_pct,
        tolerances: ideal_map::build(t, p, &z, tolerances),
    }
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
