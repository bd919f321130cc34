//! `zfactor table`: a design-basis table of one model over the user's temperatures and
//! pressures, with the basis (tool version, model and citation, k_ij, component sources,
//! composition as entered and normalised, units, caution).
//!
//! When every property asked for follows from Z alone and the model is served by the batch
//! kernel, the grid takes the fast path ([`crate::zgrid`]); otherwise every state is computed
//! with `eos::state::State::at_tp` (lowest Gibbs energy root), in parallel and in order.

use crate::cli::{TableArgs, TableFormat};
use crate::compare::grid;
use crate::error::{from_eos, CliError};
use crate::exit::Exit;
use crate::feed::{self, Feed};
use crate::feed_input;
use crate::models::{self, BuiltModel};
use crate::phase_screen;
use crate::range::StateCheck;
use crate::report::table::{ComponentSource, TableBasis, TableColumn, TableRow, UnitNote};
use crate::state_arrays::StatePlan;
use crate::table_property::{self, Selection};
use crate::units;
use eos::need::Need;
use rayon::prelude::*;
use std::path::Path;

/// Rows of an .xlsx worksheet at most, the header row included (the format's limit).
const XLSX_MAX_ROWS: usize = 1_048_576;

/// Runs the command and writes the table.
pub fn run(args: &TableArgs) -> Result<Exit, CliError> {
    if args.format == TableFormat::Xlsx && args.output.is_none() {
        return Err(CliError::BadInput(
            "--format xlsx writes a workbook: give --output FILE.xlsx".to_string(),
        ));
    }
    if let Some(path) = &args.output {
        check_extension(Path::new(path), args.format)?;
    }
    stream(args)
}

/// Refuses an output name whose extension says another format than the one written (a CSV
/// text named .xlsx opens as a broken workbook).
fn check_extension(path: &Path, format: TableFormat) -> Result<(), CliError> {
    let ext = path
        .extension()
        .map(|e| e.to_string_lossy().to_ascii_lowercase());
    let said = match ext.as_deref() {
        Some("csv") => TableFormat::Csv,
        Some("json") => TableFormat::Json,
        Some("md" | "markdown") => TableFormat::Markdown,
        Some("xlsx" | "xlsm" | "xls") => TableFormat::Xlsx,
        _ => return Ok(()),
    };
    if said == format {
        return Ok(());
    }
    let name = |f: TableFormat| match f {
        TableFormat::Table => "table",
        TableFormat::Csv => "csv",
        TableFormat::Json => "json",
        TableFormat::Markdown => "markdown",
        TableFormat::Xlsx => "xlsx",
    };
    Err(CliError::BadInput(format!(
        "--output \"{}\" names a {} file but --format is {}; use --format {} or a name that \
         matches the format",
        path.display(),
        name(said),
        name(format),
        name(said)
    )))
}

/// States per chunk: a few megabytes of output, whatever the grid's size.
const CHUNK: usize = 1 << 16;

/// Computes the table a chunk of states at a time (in grid order, each chunk on all cores)
/// and writes it in the chosen format as it goes, so that memory does not grow with the
/// grid.
fn stream(args: &TableArgs) -> Result<Exit, CliError> {
    let warnings = match &args.output {
        Some(path) => {
            // The table reads no file, so there is no input it could overwrite.
            let mut warnings = Vec::new();
            crate::output_file::write_with(Path::new(path), args.force, &[], |f, tmp| {
                let mut w = std::io::BufWriter::with_capacity(1 << 20, f);
                warnings = write(args, &mut w, Some(tmp))?;
                Ok(())
            })?;
            eprintln!("wrote {path}");
            warnings
        }
        None => {
            let stdout = std::io::stdout();
            let mut w = std::io::BufWriter::with_capacity(1 << 20, stdout.lock());
            write(args, &mut w, None)?
        }
    };
    for w in &warnings {
        crate::render::warn(w);
    }
    if args.format != TableFormat::Table {
        eprintln!("caution: {}", crate::CAUTION);
    }
    Ok(super::exit_for(&warnings))
}

/// Computes the table of `args` and writes it to `out` in `args.format` (an .xlsx workbook
/// to the file `xlsx`); returns the warnings of the run. The web API writes its tables here.
pub fn write(
    args: &TableArgs,
    out: &mut dyn std::io::Write,
    xlsx: Option<&Path>,
) -> Result<Vec<String>, CliError> {
    let plan = Plan::new(args)?;
    let total = plan.total();
    if args.format == TableFormat::Xlsx && total >= XLSX_MAX_ROWS {
        return Err(CliError::BadInput(format!(
            "the grid has {total} states and an .xlsx sheet holds {} rows below its header; \
             use --format csv for this grid, or fewer temperatures or pressures",
            XLSX_MAX_ROWS - 1
        )));
    }
    let phase = plan.sel.phase;
    let columns = plan.columns();
    let bar = crate::progress::bar(total, "computing");
    let mut tally = Tally::default();
    let first_end = CHUNK.min(total);
    let first = plan.rows(0..first_end, &bar);
    tally.add(&first);
    let mut w = crate::render::grid_table::TableWriter::new(
        args.format,
        &plan.basis,
        &columns,
        phase,
        &first,
        first_end == total,
        out,
    )?;
    w.rows(&first, out)?;
    drop(first);
    let mut start = first_end;
    while start < total {
        let end = (start + CHUNK).min(total);
        let rows = plan.rows(start..end, &bar);
        tally.add(&rows);
        w.rows(&rows, out)?;
        start = end;
    }
    let warnings = tally.warnings(total);
    w.finish(&warnings, out, xlsx)?;
    out.flush().map_err(|e| CliError::Output(e.to_string()))?;
    crate::progress::finish(bar);
    Ok(warnings)
}

/// Counts of the rows that need a warning.
#[derive(Default)]
struct Tally {
    failed: usize,
    flagged: usize,
}

impl Tally {
    fn add(&mut self, rows: &[TableRow]) {
        self.failed += rows.iter().filter(|r| r.error.is_some()).count();
        self.flagged += rows.iter().filter(|r| r.flag.is_some()).count();
    }

    fn warnings(&self, total: usize) -> Vec<String> {
        let mut warnings = Vec::new();
        if self.flagged > 0 {
            warnings.push(format!(
                "{} of {total} states are outside the model's range or in the solid region \
                 (see the flag column): their values are extrapolations",
                self.flagged
            ));
        }
        if self.failed > 0 {
            warnings.push(format!(
                "{} of {total} states could not be computed (see their error)",
                self.failed
            ));
        }
        warnings
    }
}

/// Everything a table's rows need, prepared once: the model, the grid, the Z of the fast
/// path, the phase screen and the range checks.
struct Plan {
    sel: Selection,
    feed: Feed,
    built: BuiltModel,
    t: Vec<f64>,
    p: Vec<f64>,
    /// Z of every state, temperature outer, when the batch kernel serves the table.
    z: Option<Vec<f64>>,
    basis: TableBasis,
    /// The per-state path: range checks, phase screen, and what it computes (Z and density
    /// only when every column comes from Z).
    states: StatePlan,
}

impl Plan {
    fn new(args: &TableArgs) -> Result<Plan, CliError> {
        let feed = feed_input::read_gas(&args.fluid, &args.gravity)?;
        let ambient = units::ambient_pressure(&args.ambient)?;
        let sel = table_property::parse(&args.properties)?;
        let ids = models::resolve_ids(&args.model, &feed)?;
        if ids.len() != 1 || args.model.trim().eq_ignore_ascii_case("all") {
            return Err(CliError::BadInput(format!(
                "--model \"{}\": a table is for one model; give one id ({})",
                args.model,
                models::ALL_IDS.join(", ")
            )));
        }
        let built = models::build(&ids[0], &feed)?;
        if !feed.energy_known() {
            let energy: Vec<&str> = sel
                .properties
                .iter()
                .filter(|p| !p.from_z)
                .map(|p| p.id)
                .collect();
            if !energy.is_empty() {
                return Err(CliError::BadInput(format!(
                    "--properties {}: these need the gas's ideal-gas heat capacity, which a \
                     --gravity alone does not give; ask for what follows from Z (z, density, \
                     molar_density, volume, ideal_gas_error), or give the composition with --mix",
                    energy.join(",")
                )));
            }
        }
        let t = grid::parse_axis(&args.temperatures, units::temperature)
            .map_err(|e| CliError::BadInput(format!("--temperatures: {e}")))?;
        let p = grid::parse_axis(&args.pressures, |s| {
            units::pressure_reading(s, ambient).map(|r| r.0)
        })
        .map_err(|e| CliError::BadInput(format!("--pressures: {e}")))?;
        grid::check_size(t.len(), p.len()).map_err(CliError::BadInput)?;
        let total = t.len() * p.len();
        // A mixture's states are phase-checked where the envelope screen says so.
        let need = if sel.properties.iter().all(|p| p.from_z) {
            Need::Volumetric
        } else {
            Need::All
        };
        let p_low = p.iter().copied().fold(f64::INFINITY, f64::min);
        let states = StatePlan::new(&built, &feed, &t, total, p_low, need);
        let screen = &states.screen;
        // The Z-only batch kernel has no phase check: it serves pure fluids, whose root of
        // lowest Gibbs energy is the stable phase, and the states of a mixture that the
        // envelope screen finds clearly one phase; every other mixture state takes the
        // per-state path with its flash.
        let fast = (feed.is_pure() || screen.is_active())
            && !sel.phase
            && sel.properties.iter().all(|p| p.from_z);
        let batch = if fast {
            crate::zgrid::batch_model(&built.id, &feed)
        } else {
            None
        };
        let (z, method) = match &batch {
            Some(b) => {
                let bar = crate::progress::bar(total, "computing Z");
                let z = crate::zgrid::z_grid(b, &t, &p, |n| crate::progress::inc(&bar, n))
                    .map_err(|e| from_eos(&format!("model {}", built.id), e))?;
                crate::progress::finish(bar);
                let mut method = "Z from the cubic in Z for each state (batch kernel, root of \
                                  lowest Gibbs energy); density from P/(Z R T)"
                    .to_string();
                if !feed.is_pure() {
                    method.push_str(&format!(
                        "; {} (a state that splits into two phases is flagged)",
                        phase_screen::method_note(true)
                    ));
                }
                (Some(z), method)
            }
            None if !feed.is_pure() && (built.helmholtz().is_none() || built.id == "ideal") => {
                let method = format!(
                    "each state from (T, P) with the root of lowest Gibbs energy; model {} has \
                     no phase equilibrium: every state is the feed as one phase, not flashed; \
                     every property from the model",
                    built.id
                );
                (None, method)
            }
            None => {
                let method = format!(
                    "each state from (T, P) with the root of lowest Gibbs energy; {} (a state \
                     that splits into two phases is flagged); every property from the model",
                    phase_screen::method_note(screen.is_active())
                );
                (None, method)
            }
        };
        let basis = basis(args, &feed, &built, &sel, ambient, method);
        Ok(Plan {
            states,
            sel,
            feed,
            built,
            t,
            p,
            z,
            basis,
        })
    }

    fn total(&self) -> usize {
        self.t.len() * self.p.len()
    }

    fn columns(&self) -> Vec<TableColumn> {
        self.sel
            .properties
            .iter()
            .map(|p| TableColumn {
                key: p.key,
                name: p.name,
                unit_si: p.unit_si,
            })
            .collect()
    }

    /// The rows of states `range` (index k is temperature k / np, pressure k % np), computed
    /// in parallel, in order.
    fn rows(
        &self,
        range: std::ops::Range<usize>,
        bar: &Option<indicatif::ProgressBar>,
    ) -> Vec<TableRow> {
        let np = self.p.len();
        let at = |k: usize| (self.t[k / np], self.p[k % np]);
        match &self.z {
            Some(z) => {
                // A mixture state the screen cannot clear takes the per-state path, flash
                // first; every other state takes the batch kernel's Z.
                let mixture = !self.feed.is_pure();
                let rows = range
                    .into_par_iter()
                    .map(|k| {
                        let (t, p) = at(k);
                        if mixture && self.states.screen.needs_test(t, p) {
                            row_from_state(self, t, p)
                        } else {
                            row_from_z(&self.sel, &self.feed, &self.states.check, t, p, z[k])
                        }
                    })
                    .collect::<Vec<_>>();
                crate::progress::inc(bar, rows.len() as u64);
                rows
            }
            None => range
                .into_par_iter()
                .map(|k| {
                    let (t, p) = at(k);
                    let row = row_from_state(self, t, p);
                    crate::progress::inc(bar, 1);
                    row
                })
                .collect(),
        }
    }
}

fn row_from_z(
    sel: &Selection,
    feed: &Feed,
    check: &StateCheck,
    t: f64,
    p: f64,
    z: f64,
) -> TableRow {
    let mm = feed.molar_mass();
    let ok = z.is_finite() && z > 0.0;
    TableRow {
        temperature_k: t,
        pressure_pa: p,
        phase: None,
        values: sel
            .properties
            .iter()
            .map(|pr| {
                if ok {
                    table_property::from_z(pr, z, t, p, mm)
                } else {
                    None
                }
            })
            .collect(),
        flag: ok
            .then(|| check.flag(t, p, p / (z * eos::constants::R * t)))
            .flatten(),
        error: (!ok).then(|| format!("no physical root (Z = {z})")),
    }
}

/// One state of the per-state path ([`StatePlan::at`]) as a row of the table.
fn row_from_state(plan: &Plan, t: f64, p: f64) -> TableRow {
    let sel = &plan.sel;
    let o = plan.states.at(&plan.built, &plan.feed, t, p);
    TableRow {
        temperature_k: t,
        pressure_pa: p,
        phase: o.phase.filter(|_| sel.phase),
        values: match &o.props {
            Some(props) => sel
                .properties
                .iter()
                .map(|pr| table_property::from_state(pr, props))
                .collect(),
            None => vec![None; sel.properties.len()],
        },
        flag: o.flag,
        error: o.error,
    }
}

fn basis(
    args: &TableArgs,
    feed: &Feed,
    built: &BuiltModel,
    sel: &Selection,
    ambient: f64,
    method: String,
) -> TableBasis {
    let display = args.format != TableFormat::Csv && args.format != TableFormat::Json;
    let mut units_list = vec![
        UnitNote {
            quantity: "temperature".to_string(),
            unit: "K".to_string(),
        },
        UnitNote {
            quantity: "pressure (absolute)".to_string(),
            unit: if display { "bar" } else { "Pa" }.to_string(),
        },
    ];
    for p in &sel.properties {
        units_list.push(UnitNote {
            quantity: p.name.to_string(),
            unit: if display { p.unit_display } else { p.unit_si }.to_string(),
        });
    }
    TableBasis {
        tool: format!("zfactor {}", env!("CARGO_PKG_VERSION")),
        model: built.id.clone(),
        model_name: built.name.clone(),
        citation: built.citation.clone(),
        kij: if built.notes.is_empty() {
            vec!["none needed (pure fluid)".to_string()]
        } else {
            built.notes.clone()
        },
        fluid: feed.label(),
        entered_basis: feed::basis_name(feed.basis),
        entered_in_percent: feed.percent,
        normalized_from: feed.normalized_from,
        composition: super::state::composition_rows(feed),
        component_sources: feed
            .records
            .iter()
            .map(|r| ComponentSource {
                id: r.id.clone(),
                name: r.name.clone(),
                constants_source: r.source.clone(),
                confidence: format!("{:?}", r.confidence).to_ascii_lowercase(),
                cp_source: r.cp_source.clone(),
            })
            .collect(),
        temperatures_entered: args.temperatures.clone(),
        pressures_entered: args.pressures.clone(),
        ambient_pressure_pa: ambient,
        root: "stable (lowest Gibbs energy)",
        method,
        units: units_list,
        caution: crate::CAUTION,
    }
}
