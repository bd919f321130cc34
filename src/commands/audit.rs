//! `zfactor audit FILE`: recompute every row of a spreadsheet of gas calculations with one
//! model, flag rows off by more than a tolerance, test the usual causes on each flagged row,
//! and write an annotated copy beside the input (never over it).
//!
//! CSV is streamed in chunks of [`CHUNK`] rows; each chunk is audited in parallel (rayon)
//! and written in order, so memory stays bounded whatever the file's length.

use crate::cli::audit_args::{AuditArgs, AUTO};
use crate::commands::audit_io::{check_output, Sink, Source};
use crate::commands::audit_row::{self, Cache, Defaults, Field, Mapping, Outcome};
use crate::commands::jobs_common as jc;
use crate::error::CliError;
use crate::models;
use crate::report::audit::{AuditReport, BadRow, FlaggedRow};
use crate::sheet_rows::{kind_of, Kind, RawRow};
use eos::jobs::audit::Quantity;
use rayon::prelude::*;
use std::collections::BTreeMap;
use std::path::{Path, PathBuf};

/// Rows per parallel chunk.
pub const CHUNK: usize = 16_384;
/// Rows listed in the summary.
const LISTED: usize = 200;
/// Columns appended to each row of the annotated copy.
pub const APPENDED: [&str; 8] = [
    "zfactor_model",
    "zfactor_value",
    "ideal_gas_value",
    "ideal_gas_error_pct",
    "deviation_pct",
    "status",
    "reconciling_causes",
    "message",
];

fn tolerance(text: &str) -> Result<f64, CliError> {
    let t = text.trim();
    let (num, pct) = match t.strip_suffix('%') {
        Some(n) => (n.trim(), true),
        None => (t, false),
    };
    let v: f64 = num.parse().map_err(|_| {
        CliError::BadInput(format!(
            "--tolerance \"{text}\" is not a number; give \"1%\" or 0.01"
        ))
    })?;
    let v = if pct { v / 100.0 } else { v };
    if !(v.is_finite() && v > 0.0 && v < 1.0) {
        return Err(CliError::BadInput(format!(
            "--tolerance \"{text}\" must be above 0 and below 100 %"
        )));
    }
    Ok(v)
}

fn default_output(input: &Path, kind: Kind) -> PathBuf {
    let stem = input
        .file_stem()
        .map_or_else(|| "sheet".into(), |s| s.to_string_lossy().to_string());
    let ext = match kind {
        Kind::Csv => "csv",
        Kind::Xlsx => "xlsx",
    };
    input.with_file_name(format!("{stem}.audit.{ext}"))
}

fn overrides(spec: Option<&str>) -> Result<Vec<(Field, String)>, CliError> {
    let Some(spec) = spec else {
        return Ok(Vec::new());
    };
    spec.split(',')
        .map(str::trim)
        .filter(|s| !s.is_empty())
        .map(|pair| {
            let (f, h) = pair.split_once('=').ok_or_else(|| {
                CliError::BadInput(format!("--columns: \"{pair}\" is not field=Header"))
            })?;
            let field = Field::parse(f).ok_or_else(|| {
                CliError::BadInput(format!(
                    "--columns: unknown field \"{f}\"; fields: fluid, temperature, pressure, \
                     value, quantity, volume, mass, basis, base"
                ))
            })?;
            Ok((field, h.trim().to_string()))
        })
        .collect()
}

/// Runs the audit.
pub fn run(args: &AuditArgs) -> Result<AuditReport, CliError> {
    let started = std::time::Instant::now();
    if args.model.trim().eq_ignore_ascii_case("all") {
        return Err(CliError::BadInput(
            "--model all: an audit recomputes with one model; give one id".to_string(),
        ));
    }
    let ids = if args.model.trim().eq_ignore_ascii_case(AUTO) {
        vec![AUTO.to_string()]
    } else {
        models::parse_ids(&args.model)?
    };
    if ids.len() != 1 {
        return Err(CliError::BadInput(format!(
            "--model \"{}\": an audit recomputes with one model; give one id",
            args.model
        )));
    }
    let tol = tolerance(&args.tolerance)?;
    let ambient = jc::ambient(&args.ambient)?;
    let base = jc::base(&args.base, ambient)?;
    let quantity = args
        .quantity
        .as_deref()
        .map(|q| {
            Quantity::parse(q).ok_or_else(|| {
                CliError::BadInput(format!(
                    "--quantity \"{q}\": give density, z, mass, volume or std_volume"
                ))
            })
        })
        .transpose()?;
    let kind = kind_of(&args.file)?;
    let output = args
        .output
        .clone()
        .unwrap_or_else(|| default_output(&args.file, kind));
    check_output(&args.file, &output, args.force)?;
    if kind_of(&output)? != kind {
        return Err(CliError::BadInput(format!(
            "--output \"{}\" must have the input's kind ({})",
            output.display(),
            if kind == Kind::Csv { ".csv" } else { ".xlsx" }
        )));
    }
    let mut source = Source::open(&args.file, args.sheet.as_deref())?;
    let headers = source.headers().to_vec();
    let mut map: Mapping = audit_row::map_headers(&headers, &overrides(args.columns.as_deref())?)
        .map_err(|e| match e {
        CliError::BadInput(m) => CliError::BadInput(format!("{}: {m}", args.file.display())),
        other => other,
    })?;
    map.prepare_units(ambient);
    let defaults = Defaults {
        quantity,
        basis: args.basis,
        base,
        ambient,
        model: ids[0].clone(),
        tolerance: tol,
        kij: crate::kij_input::read(args.kij.as_deref(), args.kij_file.as_deref(), None)?,
    };
    let mut sink = Sink::create(&output, kind)?;
    let mut head = csv::StringRecord::from(headers.clone());
    for a in APPENDED {
        head.push_field(a);
    }
    if let Err(e) = sink.write(&head, true) {
        sink.abandon();
        return Err(e);
    }
    let mut report = AuditReport {
        tool: format!("zfactor {}", env!("CARGO_PKG_VERSION")),
        input: args.file.display().to_string(),
        sheet: source.sheet().map(str::to_string),
        output: output.display().to_string(),
        model: if defaults.model == AUTO {
            "auto: each fluid's reference formulation where it has one, otherwise pr".to_string()
        } else {
            defaults.model.clone()
        },
        tolerance: tol,
        ambient_pressure_pa: ambient,
        default_base: base.id.to_string(),
        rows_read: 0,
        rows_audited: 0,
        rows_within_tolerance: 0,
        rows_flagged: 0,
        rows_bad: 0,
        largest_deviation_pct: None,
        causes: BTreeMap::new(),
        flagged_unexplained: 0,
        flagged: Vec::new(),
        bad: Vec::new(),
        elapsed_s: 0.0,
        warnings: Vec::new(),
        caution: crate::CAUTION,
    };
    let mut cache = Cache::default();
    let value_col = map.columns.get(&Field::Value).map(|c| c.index);
    let width = headers.len();
    // Reading the next chunk overlaps auditing (in parallel) and writing the current one;
    // chunks stay in order through a bounded channel.
    let written: Result<Sink, CliError> = std::thread::scope(|scope| {
        let (tx_in, rx_in) = std::sync::mpsc::sync_channel::<Vec<RawRow>>(1);
        let source = &mut source;
        scope.spawn(move || loop {
            let chunk = source.next_chunk(CHUNK);
            if chunk.is_empty() || tx_in.send(chunk).is_err() {
                break;
            }
        });
        for chunk in rx_in {
            cache.prepare(&chunk, &map, &defaults);
            let done: Vec<Done> = chunk
                .into_par_iter()
                .map(|(row, cells, problem)| {
                    let outcome = match problem {
                        Some(b) => Outcome::Bad(b),
                        None => audit_row::audit_row(row, &cells, &map, &defaults, &cache),
                    };
                    let out = annotate(cells, width, &outcome);
                    (row, outcome, out)
                })
                .collect();
            // A CSV copy is serialised on all cores, a slice at a time, and written in one
            // call per chunk; a workbook takes its rows one by one.
            let bytes: Option<Vec<Vec<u8>>> = sink.takes_bytes().then(|| {
                done.par_chunks(1024)
                    .map(|part| {
                        let mut w = csv::WriterBuilder::new()
                            .flexible(true)
                            .from_writer(Vec::with_capacity(part.len() * 96));
                        for (_, _, out) in part {
                            // Writing into memory cannot fail.
                            let _ = w.write_record(out);
                        }
                        w.into_inner().unwrap_or_default()
                    })
                    .collect()
            });
            for (row, outcome, out) in &done {
                tally(&mut report, *row, outcome, out, value_col);
            }
            let written = match &bytes {
                Some(parts) => parts.iter().try_for_each(|b| sink.write_csv_bytes(b)),
                None => done
                    .iter()
                    .try_for_each(|(_, _, out)| sink.write(out, false)),
            };
            if let Err(e) = written {
                sink.abandon();
                return Err(e);
            }
        }
        Ok(sink)
    });
    let sink = written?;
    if report.rows_read == 0 {
        sink.abandon();
        return Err(CliError::BadInput(format!(
            "\"{}\" has a header and no rows: nothing to audit",
            args.file.display()
        )));
    }
    sink.finish()?;
    if report.rows_flagged > 0 {
        report.warnings.push(format!(
            "{} row(s) differ from the recomputation by more than {}%",
            report.rows_flagged,
            100.0 * tol
        ));
    }
    if report.rows_bad > 0 {
        report.warnings.push(format!(
            "{} row(s) could not be audited (see the bad rows)",
            report.rows_bad
        ));
    }
    report.elapsed_s = started.elapsed().as_secs_f64();
    Ok(report)
}

/// A row audited: its number, the outcome and the annotated cells.
type Done = (usize, Outcome, csv::StringRecord);

/// Adds one row to the summary.
fn tally(
    report: &mut AuditReport,
    row: usize,
    outcome: &Outcome,
    out: &csv::StringRecord,
    value_col: Option<usize>,
) {
    report.rows_read += 1;
    match outcome {
        Outcome::Audited {
            model,
            value,
            deviation,
            flagged,
            causes,
            note,
            ..
        } => {
            report.rows_audited += 1;
            let pct = 100.0 * deviation;
            if !matches!(report.largest_deviation_pct, Some(m) if m.abs() >= pct.abs()) {
                report.largest_deviation_pct = Some(pct);
            }
            if *flagged {
                report.rows_flagged += 1;
                if causes.is_empty() {
                    report.flagged_unexplained += 1;
                }
                for c in causes {
                    *report.causes.entry(c.clone()).or_insert(0) += 1;
                }
                if report.flagged.len() < LISTED {
                    report.flagged.push(FlaggedRow {
                        row,
                        sheet_value: value_col
                            .and_then(|i| out.get(i))
                            .unwrap_or_default()
                            .to_string(),
                        recomputed: *value,
                        deviation_pct: pct,
                        reconciling_causes: causes.clone(),
                        model: model.clone(),
                        note: note.clone(),
                    });
                }
            } else {
                report.rows_within_tolerance += 1;
            }
        }
        Outcome::Bad(b) => {
            report.rows_bad += 1;
            if report.bad.len() < LISTED {
                report.bad.push(BadRow {
                    row: b.row,
                    column: b.column.clone(),
                    message: b.message.clone(),
                });
            }
        }
    }
}

/// The row as read with the audit's columns appended.
fn annotate(mut out: csv::StringRecord, width: usize, outcome: &Outcome) -> csv::StringRecord {
    while out.len() < width {
        out.push_field("");
    }
    match outcome {
        Outcome::Audited {
            model,
            value,
            ideal,
            deviation,
            flagged,
            causes,
            note,
        } => {
            out.push_field(model);
            out.push_field(&format!("{value:e}"));
            if ideal.is_finite() {
                out.push_field(&format!("{ideal:e}"));
                out.push_field(&crate::render::number::fixed(
                    100.0 * (ideal - value) / value,
                    6,
                ));
            } else {
                out.push_field("");
                out.push_field("");
            }
            out.push_field(&crate::render::number::fixed(100.0 * deviation, 6));
            out.push_field(if *flagged { "FLAG" } else { "ok" });
            out.push_field(&causes.join("; "));
            out.push_field(note.as_deref().unwrap_or(""));
        }
        Outcome::Bad(b) => {
            out.push_field("");
            out.push_field("");
            out.push_field("");
            out.push_field("");
            out.push_field("");
            out.push_field("bad");
            out.push_field("");
            out.push_field(&format!(
                "row {}, column {}: {}",
                b.row, b.column, b.message
            ));
        }
    }
    out
}
