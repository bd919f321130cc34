//! The comparison report as a terminal text and as CSV (one row per point, SI units).

use crate::error::CliError;
use crate::render::number::sig;
use crate::report::compare::{CompareReport, StateAt};
use crate::report::compare_points::PointReport;
use crate::units::PA_PER_BAR;
use comfy_table::{CellAlignment, ContentArrangement, Table};
use std::io::Write;

/// Points printed in the terminal table; more go to CSV or JSON.
pub const MAX_TABLE_POINTS: usize = 60;

fn new_table(header: Vec<String>) -> Table {
    let mut t = Table::new();
    t.load_style(crate::render::house_table::STYLE)
        .set_content_arrangement(ContentArrangement::Disabled)
        .set_header(header);
    t
}

fn right_align(t: &mut Table, from: usize) {
    let n = t.column_count();
    for i in from..n {
        if let Some(c) = t.column_mut(i) {
            c.set_cell_alignment(CellAlignment::Right);
        }
    }
}

fn at(s: &StateAt) -> String {
    format!(
        "{} K, {} bar",
        sig(s.temperature_k, 5),
        sig(s.pressure_pa / PA_PER_BAR, 5)
    )
}

fn opt(v: Option<f64>, n: usize) -> String {
    v.map_or_else(|| "-".to_string(), |v| sig(v, n))
}

/// A table whose first `lead` columns are the state and whose other columns come in pairs,
/// one pair per model: as many models side by side as fit in
/// [`crate::render::model_grid::WIDTH`] columns, the rest in further parts one under the
/// other, each with the state's columns.
fn in_parts(header: &[String], rows: &[Vec<String>], lead: usize) -> String {
    let models = header.len().saturating_sub(lead) / 2;
    let part = |from: usize, to: usize| -> String {
        let pick = |r: &[String]| -> Vec<String> {
            r[..lead]
                .iter()
                .chain(&r[lead + 2 * from..(lead + 2 * to).min(r.len())])
                .cloned()
                .collect()
        };
        let mut t = new_table(pick(header));
        for r in rows {
            t.add_row(pick(r));
        }
        right_align(&mut t, 0);
        // One space between right-aligned numbers reads as well as two and fits a model more.
        for c in t.column_iter_mut() {
            c.set_padding((1, 0));
        }
        format!("{t}\n")
    };
    let split = |k: usize| -> Vec<String> {
        let k = k.max(1);
        (0..models.div_ceil(k).max(1))
            .map(|i| part(i * k, ((i + 1) * k).min(models)))
            .collect()
    };
    let fits = (1..=models.max(1))
        .rev()
        .find(|&k| {
            split(k).iter().all(|p| {
                p.lines()
                    .all(|l| l.chars().count() <= crate::render::model_grid::WIDTH)
            })
        })
        .unwrap_or(1);
    split(fits).concat()
}

/// The report for the terminal.
pub fn text(r: &CompareReport) -> String {
    let mut out = String::new();
    out.push_str(&format!("{}\n", r.fluid));
    let reference = match (&r.reference.id, r.reference.kind) {
        (Some(id), "model") => format!("model {id}"),
        (Some(id), _) => format!("data {id}"),
        _ => "none (the spread between the models is shown)".to_string(),
    };
    out.push_str(&format!(
        "reference: {reference}; states: {} ({} points",
        r.states_from,
        r.points.len()
    ));
    if r.excluded_two_phase > 0 {
        out.push_str(&format!(
            ", {} two-phase excluded from the statistics",
            r.excluded_two_phase
        ));
    }
    out.push_str(")\n");
    if r.composition.len() > 1 {
        out.push_str(&format!("phase check: {}\n", r.phase_check));
    }
    if let Some(c) = &r.reference.citation {
        out.push_str(&format!("reference source: {c}\n"));
    }
    if r.reference.kind != "none" {
        out.push_str("\ndensity deviation from the reference, percent\n");
        let mut t = new_table(
            [
                "model",
                "region",
                "points",
                "mean |dev|",
                "max |dev|",
                "bias",
                "max at",
            ]
            .map(String::from)
            .to_vec(),
        );
        for m in &r.models {
            t.add_row(vec![
                m.model.clone(),
                "all".to_string(),
                m.points_used.to_string(),
                opt(m.mean_abs_dev_pct, 4),
                opt(m.max_abs_dev_pct, 4),
                opt(m.bias_pct, 4),
                m.max_at.as_ref().map_or_else(|| "-".to_string(), at),
            ]);
            if m.regions.len() > 1 {
                for g in &m.regions {
                    t.add_row(vec![
                        String::new(),
                        g.region.to_string(),
                        g.points.to_string(),
                        sig(g.mean_abs_dev_pct, 4),
                        sig(g.max_abs_dev_pct, 4),
                        sig(g.bias_pct, 4),
                        at(&g.max_at),
                    ]);
                }
            }
        }
        right_align(&mut t, 2);
        out.push_str(&format!("{t}\n"));
    }
    if let Some(b) = &r.band {
        out.push_str(&format!(
            "\nspread between {}: mean {} %, max {} % at {}\n",
            b.models.join(", "),
            sig(b.mean_spread_pct, 3),
            sig(b.max_spread_pct, 3),
            at(&b.max_at)
        ));
    }
    if let Some(m) = &r.ideal_gas_map {
        out.push_str(&format!(
            "\nideal-gas map (|Z - 1| from {}):\n",
            m.basis_model
        ));
        for tm in &m.tolerances {
            out.push_str(&format!("  {}\n", tm.verdict));
        }
        let mut header = vec!["T [K]".to_string()];
        header.extend(
            m.tolerances
                .iter()
                .map(|t| format!("fails above ({} %) [bar]", t.tolerance_pct)),
        );
        let mut t = new_table(header);
        let n = m.tolerances.first().map_or(0, |t| t.boundary.len());
        for i in 0..n.min(MAX_TABLE_POINTS) {
            let mut row = vec![sig(m.tolerances[0].boundary[i].temperature_k, 5)];
            for tm in &m.tolerances {
                let b = &tm.boundary[i];
                row.push(match b.fails_above_pa {
                    None => "holds".to_string(),
                    Some(p) if b.below_grid => format!("<= {}", sig(p / PA_PER_BAR, 4)),
                    Some(p) => sig(p / PA_PER_BAR, 4),
                });
            }
            t.add_row(row);
        }
        right_align(&mut t, 0);
        out.push_str(&format!("{t}\n"));
    }
    if !r.advice.is_empty() {
        out.push_str("\nadvice:\n");
        for a in &r.advice {
            out.push_str(&format!("  {}\n", a.summary));
            if !a.rejected.is_empty() {
                out.push_str(&format!("    simpler models: {}\n", a.rejected.join("; ")));
            }
        }
    }
    if !r.weaknesses.is_empty() {
        out.push_str("\nknown weaknesses:\n");
        for w in &r.weaknesses {
            out.push_str(&format!("  - {} [{}]\n", w.text, w.basis));
        }
    }
    if r.points.len() <= MAX_TABLE_POINTS && r.points.holds_all() {
        out.push_str("\npoints (density in kg/m3, deviation in %):\n");
        let mut header = vec![
            "T [K]".to_string(),
            "P [bar]".to_string(),
            "phase".to_string(),
        ];
        if r.reference.kind != "none" {
            header.push("ref Z".to_string());
            header.push("ref density".to_string());
        }
        for m in &r.models {
            let v = m;
            header.push(format!("{} Z", v.model));
            if r.reference.kind != "none" {
                header.push(format!("{} dev", v.model));
            } else {
                header.push(format!("{} density", v.model));
            }
        }
        let mut rows = Vec::new();
        for p in r.points.held() {
            let mut row = vec![
                sig(p.temperature_k, 5),
                sig(p.pressure_pa / PA_PER_BAR, 5),
                p.phase.to_string(),
            ];
            if r.reference.kind != "none" {
                row.push(opt(p.reference_z, 6));
                row.push(opt(p.reference_density_kg_m3, 5));
            }
            for v in &p.values {
                row.push(opt(v.z, 5));
                if r.reference.kind != "none" {
                    row.push(opt(v.deviation_pct, 3));
                } else {
                    row.push(opt(v.mass_density_kg_m3, 5));
                }
            }
            rows.push(row);
        }
        let lead = if r.reference.kind != "none" { 5 } else { 3 };
        out.push_str(&in_parts(&header, &rows, lead));
    } else {
        out.push_str(&format!(
            "\n({} points: use --format csv or json for every point)\n",
            r.points.len()
        ));
    }
    if r.skipped_rows > 0 {
        out.push_str(&format!("\nskipped rows ({}):\n", r.skipped_rows));
        for s in &r.skipped {
            out.push_str(&format!("  {s}\n"));
        }
    }
    if !r.charts.is_empty() {
        out.push_str(&format!("\ncharts: {}\n", r.charts.join(", ")));
    }
    out.push_str(&format!("\ncaution: {}\n", r.caution));
    out
}

fn full(v: Option<f64>) -> String {
    v.map(|v| format!("{v:e}")).unwrap_or_default()
}

/// The cells of one point's CSV row (in the order of [`csv_header`]).
pub fn csv_cells(p: &PointReport) -> Vec<String> {
    let mut row = vec![
        format!("{:e}", p.temperature_k),
        format!("{:e}", p.pressure_pa),
        p.phase.to_string(),
        full(p.reference_z),
        full(p.reference_density_kg_m3),
        full(p.spread_pct),
    ];
    for v in &p.values {
        row.push(full(v.z));
        row.push(full(v.mass_density_kg_m3));
        row.push(full(v.deviation_pct));
    }
    row
}

/// The CSV header: the state, the reference, then three columns per model.
fn csv_header(r: &CompareReport) -> Vec<String> {
    let mut header: Vec<String> = [
        "temperature_k",
        "pressure_pa",
        "phase",
        "reference_z",
        "reference_density_kg_m3",
        "spread_pct",
    ]
    .map(String::from)
    .to_vec();
    for m in &r.models {
        header.push(format!("{}_z", m.model));
        header.push(format!("{}_mass_density_kg_m3", m.model));
        header.push(format!("{}_deviation_pct", m.model));
    }
    header
}

/// One row per point, SI units, written to `out` (points spilled to a temporary file are
/// copied from it).
pub fn csv(r: &CompareReport, out: &mut dyn Write) -> Result<(), CliError> {
    let e = |e: csv::Error| CliError::Output(e.to_string());
    let mut w = csv::Writer::from_writer(&mut *out);
    w.write_record(csv_header(r)).map_err(e)?;
    if !r.points.holds_all() {
        w.flush().map_err(|e| CliError::Output(e.to_string()))?;
        drop(w);
        return if r.points.copy_spilled_csv(out).map_err(CliError::Output)? {
            Ok(())
        } else {
            Err(CliError::Output(
                "the points were not kept for CSV output".to_string(),
            ))
        };
    }
    for p in r.points.held() {
        w.write_record(csv_cells(p)).map_err(e)?;
    }
    w.flush().map_err(|e| CliError::Output(e.to_string()))
}

/// Prints the report in `format`: data on stdout, warnings (and, for CSV and JSON, the
/// caution) on stderr.
pub fn render(r: &CompareReport, format: crate::cli::Format) -> Result<(), CliError> {
    use crate::cli::Format;
    match format {
        Format::Table => crate::render::emit(&crate::render::wrap::fold(&text(r)))?,
        Format::Csv => {
            let stdout = std::io::stdout();
            let mut w = std::io::BufWriter::with_capacity(1 << 20, stdout.lock());
            csv(r, &mut w)?;
            w.flush().map_err(|e| CliError::Output(e.to_string()))?;
        }
        Format::Json => crate::render::json::to_stdout(r)?,
    }
    match format {
        Format::Table => crate::render::side_notes(&r.warnings, None),
        _ => crate::render::side_notes(&r.warnings, Some(r.caution)),
    }
    Ok(())
}
