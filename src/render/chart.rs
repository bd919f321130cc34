//! Charts of a comparison, as SVG or PNG (plotters, with the DejaVu Sans font embedded; its
//! licence is in `fonts/DejaVuSans-LICENSE.txt`):
//!
//! - `isotherms`: Z against pressure on up to six isotherms, one line style per model, the
//!   reference as a solid black line (a model) or black circles (data), each curve sampled
//!   at 200 pressures (the comparison re-run on the chart's own grid), the legend beside the
//!   plot;
//! - `deviation-<model>`: the density deviation of each model from the reference over a
//!   200 x 200 sampling of the envelope, shaded by tolerance band, with each tolerance's
//!   contour in the same field ([`contour`]);
//! - `ideal-gas-map`: |Z - 1| over the same sampling, shaded and contoured the same way.
//!
//! Every series differs by dash pattern or marker as well as by colour, and the shading is
//! grey, so the charts stay readable in black and white. Files are written atomically and
//! never over an existing file without `--force`.

use crate::cli::ChartFormat;
use crate::error::CliError;
use crate::report::compare::CompareReport;
use crate::units::PA_PER_BAR;
use plotters::coord::Shift;
use plotters::element::DashedPathElement;
use plotters::prelude::*;
use std::path::Path;
use std::sync::Once;

/// The embedded font.
const FONT: &[u8] = include_bytes!("fonts/DejaVuSans.ttf");
/// Chart size in pixels.
const SIZE: (u32, u32) = (960, 680);
/// Most isotherms drawn.
const MAX_ISOTHERMS: usize = 6;

static FONT_ONCE: Once = Once::new();

/// A drawing of one chart on an SVG area.
type SvgDraw<'a> = &'a dyn Fn(DrawingArea<SVGBackend, Shift>) -> Result<(), CliError>;
/// The same drawing on a bitmap area.
type PngDraw<'a> = &'a dyn Fn(DrawingArea<BitMapBackend, Shift>) -> Result<(), CliError>;

pub(crate) fn register_font() -> Result<(), CliError> {
    let mut ok = true;
    FONT_ONCE.call_once(|| {
        ok = plotters::style::register_font("sans-serif", FontStyle::Normal, FONT).is_ok();
    });
    if ok {
        Ok(())
    } else {
        Err(CliError::Output(
            "the embedded chart font cannot be read".to_string(),
        ))
    }
}

fn draw_err<E: std::fmt::Debug>(e: E) -> CliError {
    CliError::Output(format!("drawing a chart: {e:?}"))
}

/// Line style of model number `k`: (colour, dash length, gap) in pixels; a gap of zero is a
/// solid line.
fn line_style(k: usize) -> (RGBColor, u32, u32) {
    const STYLES: [(RGBColor, u32, u32); 7] = [
        (RGBColor(0, 114, 178), 10, 5),
        (RGBColor(213, 94, 0), 3, 4),
        (RGBColor(0, 158, 115), 14, 4),
        (RGBColor(204, 121, 167), 6, 3),
        (RGBColor(86, 180, 233), 2, 7),
        (RGBColor(230, 159, 0), 18, 8),
        (RGBColor(120, 120, 120), 8, 2),
    ];
    STYLES[k % STYLES.len()]
}

/// Writes every chart the report allows into `dir`; returns the paths written.
pub fn write_all(
    r: &CompareReport,
    curves: Option<&CompareReport>,
    maps: Option<&CompareReport>,
    dir: &Path,
    format: ChartFormat,
    force: bool,
    inputs: &[&Path],
) -> Result<Vec<String>, CliError> {
    if !r.points.holds_all() {
        return Err(CliError::Output(
            "the charts need every point, and the comparison did not keep them".to_string(),
        ));
    }
    register_font()?;
    std::fs::create_dir_all(dir)
        .map_err(|e| CliError::Output(format!("{}: {e}", dir.display())))?;
    let mut written = Vec::new();
    let mut emit = |name: &str, draw: SvgDraw, draw_png: PngDraw| -> Result<(), CliError> {
        let path = dir.join(format!("{name}.{}", format.extension()));
        match format {
            ChartFormat::Svg => {
                let mut svg = String::new();
                {
                    let root = SVGBackend::with_string(&mut svg, SIZE).into_drawing_area();
                    draw(root)?;
                }
                crate::output_file::write(&path, svg.as_bytes(), force, inputs)?;
            }
            ChartFormat::Png => {
                crate::output_file::write_with(&path, force, inputs, |_, tmp| {
                    let root = BitMapBackend::new(tmp, SIZE).into_drawing_area();
                    draw_png(root)
                })?;
            }
        }
        written.push(path.display().to_string());
        Ok(())
    };
    emit("isotherms", &|root| isotherms(r, curves, root), &|root| {
        isotherms(r, curves, root)
    })?;
    // The maps shade, and draw the tolerance contours of, the field sampled on their own
    // grid; without one (a list of states), the comparison's own grid.
    let m = maps.unwrap_or(r);
    if let Some(g) = &m.grid {
        let t = &g.temperatures_k;
        let p = &g.pressures_pa;
        let tolerances: Vec<f64> = r
            .ideal_gas_map
            .as_ref()
            .map(|m| m.tolerances.iter().map(|t| t.tolerance_pct).collect())
            .unwrap_or_else(|| r.advice.iter().map(|a| a.tolerance_pct).collect());
        let held = m.points.held();
        if m.reference.kind != "none"
            && t.len() >= 2
            && p.len() >= 2
            && held.len() == t.len() * p.len()
        {
            for (k, model) in m.models.iter().enumerate() {
                let err: Vec<Vec<f64>> = (0..t.len())
                    .map(|i| {
                        (0..p.len())
                            .map(|j| {
                                let pt = &held[i * p.len() + j];
                                if pt.phase == "two-phase" {
                                    f64::NAN
                                } else {
                                    pt.values[k].deviation_pct.map_or(f64::NAN, f64::abs)
                                }
                            })
                            .collect()
                    })
                    .collect();
                let title = format!(
                    "|density deviation| of {} from {}",
                    model.model,
                    m.reference
                        .name
                        .as_deref()
                        .or(m.reference.id.as_deref())
                        .unwrap_or("the reference")
                );
                let name = format!("deviation-{}", model.model);
                emit(
                    &name,
                    &|root| band_map(root, &title, t, p, &err, &tolerances),
                    &|root| band_map(root, &title, t, p, &err, &tolerances),
                )?;
            }
        }
        if let Some(im) = &m.ideal_gas_map {
            if t.len() >= 2 && p.len() >= 2 {
                let err: Vec<Vec<f64>> = im
                    .error_pct
                    .iter()
                    .map(|row| row.iter().map(|e| e.unwrap_or(f64::NAN)).collect())
                    .collect();
                let title = format!("ideal-gas error |Z - 1| (Z from {})", im.basis_model);
                emit(
                    "ideal-gas-map",
                    &|root| band_map(root, &title, t, p, &err, &tolerances),
                    &|root| band_map(root, &title, t, p, &err, &tolerances),
                )?;
            }
        }
    }
    Ok(written)
}

/// The temperatures the isotherm chart draws: those of the grid, in order, thinned evenly to
/// [`MAX_ISOTHERMS`].
pub fn chart_temperatures(t: &[f64]) -> Vec<f64> {
    let mut temps: Vec<f64> = t.to_vec();
    temps.sort_by(f64::total_cmp);
    temps.dedup_by(|a, b| a.to_bits() == b.to_bits());
    if temps.len() > MAX_ISOTHERMS {
        let n = temps.len();
        temps = (0..MAX_ISOTHERMS)
            .map(|k| temps[k * (n - 1) / (MAX_ISOTHERMS - 1)])
            .collect();
    }
    temps
}

/// Width of the legend to the right of the plot, pixels.
const LEGEND_WIDTH: u32 = 250;
/// Least vertical distance between two isotherm labels, pixels.
const LABEL_GAP: i32 = 17;

/// Z against P on up to six isotherms: each model's curve sampled on `curves` (the
/// comparison re-run on [`crate::commands::compare::CHART_POINTS`] pressures per isotherm)
/// or, for a list of states, through the states; the reference as a solid black line (a
/// model) or black circles (data). The axes end at the data; the legend, naming the
/// reference formulation, sits beside the plot; the isotherms are labelled at their right
/// ends, moved apart where they would overlap.
fn isotherms<DB: DrawingBackend>(
    r: &CompareReport,
    curves: Option<&CompareReport>,
    root: DrawingArea<DB, Shift>,
) -> Result<(), CliError> {
    root.fill(&WHITE).map_err(draw_err)?;
    let src = curves.unwrap_or(r);
    let all_t: Vec<f64> = src.points.held().iter().map(|p| p.temperature_k).collect();
    let temps = chart_temperatures(&all_t);
    fn on(from: &CompareReport, t: f64) -> Vec<&crate::report::compare_points::PointReport> {
        let mut pts: Vec<&crate::report::compare_points::PointReport> = from
            .points
            .held()
            .iter()
            .filter(|p| (p.temperature_k - t).abs() <= 1e-9 * t)
            .collect();
        pts.sort_by(|a, b| a.pressure_pa.total_cmp(&b.pressure_pa));
        pts
    }
    let mut zs: Vec<f64> = Vec::new();
    let mut ps: Vec<f64> = Vec::new();
    for &t in &temps {
        for p in on(src, t) {
            ps.push(p.pressure_pa / PA_PER_BAR);
            zs.extend(p.values.iter().filter_map(|v| v.z));
            zs.extend(p.reference_z.filter(|_| r.reference.kind == "model"));
        }
        if r.reference.kind == "data" {
            zs.extend(on(r, t).iter().filter_map(|p| p.reference_z));
        }
    }
    let fin = |v: &[f64], f: fn(f64, f64) -> f64, init: f64| {
        v.iter().copied().filter(|x| x.is_finite()).fold(init, f)
    };
    let (x0, x1) = (fin(&ps, f64::min, f64::MAX), fin(&ps, f64::max, f64::MIN));
    let (zmin, zmax) = (fin(&zs, f64::min, f64::MAX), fin(&zs, f64::max, f64::MIN));
    if !(x0.is_finite() && x1.is_finite() && zmin.is_finite() && zmax.is_finite()) {
        return Err(CliError::Output("no values to chart".to_string()));
    }
    let x1 = if x1 > x0 { x1 } else { x0 + 1.0 };
    let dz = (zmax - zmin).abs().max(1e-6);
    let (y0, y1) = (zmin - 0.04 * dz, zmax + 0.04 * dz);
    let (plot, side) = root.split_horizontally(SIZE.0 - LEGEND_WIDTH);
    let mut chart = ChartBuilder::on(&plot)
        .caption(
            format!("Z against pressure: {}", short(&r.fluid)),
            ("sans-serif", 22),
        )
        .margin(16)
        .margin_right(72)
        .x_label_area_size(50)
        .y_label_area_size(70)
        .build_cartesian_2d(x0..x1, y0..y1)
        .map_err(draw_err)?;
    chart
        .configure_mesh()
        .x_desc("pressure P [bar]")
        .y_desc("compression factor Z [-]")
        .label_style(("sans-serif", 15))
        .axis_desc_style(("sans-serif", 17))
        .light_line_style(RGBColor(235, 235, 235))
        .draw()
        .map_err(draw_err)?;
    // The legend's entries: (name, how to draw its sample).
    let mut legend: Vec<(String, Sample)> = Vec::new();
    let models: Vec<String> = src
        .points
        .held()
        .first()
        .map(|p| p.values.iter().map(|v| v.model.clone()).collect())
        .unwrap_or_default();
    for (k, name) in models.iter().enumerate() {
        let (color, dash, gap) = line_style(k);
        let style = ShapeStyle::from(&color).stroke_width(2);
        for &t in &temps {
            // A curve is broken where the model gives no value (a failed or two-phase state).
            let mut run: Vec<(f64, f64)> = Vec::new();
            let mut runs: Vec<Vec<(f64, f64)>> = Vec::new();
            for p in on(src, t) {
                match p.values.get(k).and_then(|v| v.z) {
                    Some(z) if p.phase != "two-phase" => run.push((p.pressure_pa / PA_PER_BAR, z)),
                    _ => runs.push(std::mem::take(&mut run)),
                }
            }
            runs.push(run);
            for line in runs.into_iter().filter(|l| l.len() > 1) {
                chart
                    .draw_series(DashedLineSeries::new(line, dash, gap, style))
                    .map_err(draw_err)?;
            }
        }
        legend.push((name.clone(), Sample::Dashed(color, dash, gap)));
    }
    let reference_name = r
        .reference
        .name
        .clone()
        .or_else(|| r.reference.id.clone())
        .unwrap_or_else(|| "reference".to_string());
    let black = ShapeStyle::from(&BLACK).stroke_width(2);
    if r.reference.kind == "model" {
        for &t in &temps {
            let line: Vec<(f64, f64)> = on(src, t)
                .iter()
                .filter(|p| p.phase != "two-phase")
                .filter_map(|p| p.reference_z.map(|z| (p.pressure_pa / PA_PER_BAR, z)))
                .collect();
            chart
                .draw_series(LineSeries::new(line, black))
                .map_err(draw_err)?;
        }
        legend.push((format!("reference: {reference_name}"), Sample::Solid));
    } else if r.reference.kind == "data" {
        for &t in &temps {
            let dots: Vec<(f64, f64)> = on(r, t)
                .iter()
                .filter_map(|p| p.reference_z.map(|z| (p.pressure_pa / PA_PER_BAR, z)))
                .collect();
            chart
                .draw_series(dots.into_iter().map(|(x, y)| Circle::new((x, y), 4, black)))
                .map_err(draw_err)?;
        }
        legend.push((format!("reference data: {reference_name}"), Sample::Dot));
    }
    // Each isotherm labelled at its right end, in the margin beside the plot; labels that
    // would overlap are pushed apart, keeping their order.
    let mut labels: Vec<(i32, i32, String)> = Vec::new();
    for &t in &temps {
        let pts = on(src, t);
        let last = pts.iter().rev().find_map(|p| {
            let z = p
                .reference_z
                .filter(|_| r.reference.kind == "model")
                .or_else(|| p.values.iter().find_map(|v| v.z))?;
            Some((p.pressure_pa / PA_PER_BAR, z))
        });
        if let Some((x, z)) = last {
            let (px, py) = chart.backend_coord(&(x, z));
            labels.push((
                px + 6,
                py,
                format!("{} K", crate::render::number::sig(t, 4)),
            ));
        }
    }
    labels.sort_by_key(|l| l.1);
    for i in 1..labels.len() {
        if labels[i].1 - labels[i - 1].1 < LABEL_GAP {
            labels[i].1 = labels[i - 1].1 + LABEL_GAP;
        }
    }
    for (x, y, text) in labels {
        root.draw(&Text::new(text, (x, y - 7), ("sans-serif", 14)))
            .map_err(draw_err)?;
    }
    // The legend, beside the plot: each name on up to two lines.
    side.fill(&WHITE).map_err(draw_err)?;
    let mut y = 70;
    for (name, sample) in &legend {
        let (a, b) = ((8, y), (40, y));
        match *sample {
            Sample::Dashed(color, dash, gap) => side
                .draw(&DashedPathElement::new(
                    vec![a, b],
                    dash,
                    gap,
                    ShapeStyle::from(&color).stroke_width(2),
                ))
                .map_err(draw_err)?,
            Sample::Solid => side
                .draw(&PathElement::new(vec![a, b], black))
                .map_err(draw_err)?,
            Sample::Dot => side
                .draw(&Circle::new((24, y), 4, black))
                .map_err(draw_err)?,
        }
        for line in legend_lines(name, 26) {
            side.draw(&Text::new(line, (48, y - 8), ("sans-serif", 15)))
                .map_err(draw_err)?;
            y += 18;
        }
        y += 8;
    }
    root.present().map_err(draw_err)?;
    Ok(())
}

/// How a legend entry's sample is drawn.
#[derive(Debug, Clone, Copy)]
enum Sample {
    Dashed(RGBColor, u32, u32),
    Solid,
    Dot,
}

/// `s` in lines of at most `n` characters, broken at spaces, two lines at most (the second
/// ends in an ellipsis when more is left).
fn legend_lines(s: &str, n: usize) -> Vec<String> {
    let mut lines: Vec<String> = vec![String::new()];
    for word in s.split_whitespace() {
        let last = lines.len() - 1;
        if !lines[last].is_empty() && lines[last].chars().count() + 1 + word.chars().count() > n {
            lines.push(String::new());
        }
        let last = lines.len() - 1;
        if !lines[last].is_empty() {
            lines[last].push(' ');
        }
        lines[last].push_str(word);
    }
    if lines.len() > 2 {
        let rest = lines[1..].join(" ");
        let cut: String = rest.chars().take(n.saturating_sub(3)).collect();
        lines.truncate(1);
        lines.push(format!("{cut}..."));
    }
    lines
}

/// A fluid label short enough for a title.
fn short(s: &str) -> String {
    if s.chars().count() > 70 {
        let cut: String = s.chars().take(67).collect();
        format!("{cut}...")
    } else {
        s.to_string()
    }
}

/// Grey level of band `b` of `n + 1` bands (0 = within the smallest tolerance = white).
fn grey(b: usize, n: usize) -> RGBColor {
    let level = 255 - (b * 170 / n.max(1)) as u8;
    RGBColor(level, level, level)
}

/// Cell edges around grid values: half-way between neighbours, half a step beyond the ends.
fn edges(v: &[f64]) -> Vec<(f64, f64)> {
    let n = v.len();
    (0..n)
        .map(|i| {
            let lo = if i == 0 {
                v[0] - 0.5 * (v[1] - v[0])
            } else {
                0.5 * (v[i - 1] + v[i])
            };
            let hi = if i == n - 1 {
                v[n - 1] + 0.5 * (v[n - 1] - v[n - 2])
            } else {
                0.5 * (v[i] + v[i + 1])
            };
            (lo.min(hi), lo.max(hi))
        })
        .collect()
}

/// The segments where the field `f[i][j]` (at x[i], y[j]) crosses `level`, by marching
/// squares: every crossing, in every cell whose four corners have values (a saddle cell is
/// split by the mean of its corners).
pub fn contour(x: &[f64], y: &[f64], f: &[Vec<f64>], level: f64) -> Vec<[(f64, f64); 2]> {
    let mut out = Vec::new();
    let cross = |a: (f64, f64, f64), b: (f64, f64, f64)| {
        let s = (level - a.2) / (b.2 - a.2);
        (a.0 + s * (b.0 - a.0), a.1 + s * (b.1 - a.1))
    };
    for i in 0..x.len().saturating_sub(1) {
        for j in 0..y.len().saturating_sub(1) {
            // Corners counter-clockwise: (i,j), (i+1,j), (i+1,j+1), (i,j+1).
            let c = [
                (x[i], y[j], f[i][j]),
                (x[i + 1], y[j], f[i + 1][j]),
                (x[i + 1], y[j + 1], f[i + 1][j + 1]),
                (x[i], y[j + 1], f[i][j + 1]),
            ];
            if c.iter().any(|k| !k.2.is_finite()) {
                continue;
            }
            let above: Vec<bool> = c.iter().map(|k| k.2 > level).collect();
            let edges: Vec<(f64, f64)> = (0..4)
                .filter(|&e| above[e] != above[(e + 1) % 4])
                .map(|e| cross(c[e], c[(e + 1) % 4]))
                .collect();
            match edges.len() {
                2 => out.push([edges[0], edges[1]]),
                4 => {
                    let mean = c.iter().map(|k| k.2).sum::<f64>() / 4.0;
                    // Edges 0-1-2-3 in order; pair them so the centre's side is respected.
                    if (mean > level) == above[0] {
                        out.push([edges[0], edges[1]]);
                        out.push([edges[2], edges[3]]);
                    } else {
                        out.push([edges[3], edges[0]]);
                        out.push([edges[1], edges[2]]);
                    }
                }
                _ => {}
            }
        }
    }
    out
}

/// A map of `err[i][j]` (percent, at t[i], p[j]) shaded by tolerance band, with the contour
/// of each tolerance in the same field (every crossing), and the legend beside the plot.
fn band_map<DB: DrawingBackend>(
    root: DrawingArea<DB, Shift>,
    title: &str,
    t: &[f64],
    p: &[f64],
    err: &[Vec<f64>],
    tolerances: &[f64],
) -> Result<(), CliError> {
    root.fill(&WHITE).map_err(draw_err)?;
    let pb: Vec<f64> = p.iter().map(|x| x / PA_PER_BAR).collect();
    let te = edges(t);
    let pe = edges(&pb);
    let x0 = te.iter().map(|e| e.0).fold(f64::MAX, f64::min);
    let x1 = te.iter().map(|e| e.1).fold(f64::MIN, f64::max);
    let y0 = pe.iter().map(|e| e.0).fold(f64::MAX, f64::min).max(0.0);
    let y1 = pe.iter().map(|e| e.1).fold(f64::MIN, f64::max);
    let (plot, side) = root.split_horizontally(SIZE.0 - LEGEND_WIDTH);
    let mut chart = ChartBuilder::on(&plot)
        .caption(short(title), ("sans-serif", 20))
        .margin(16)
        .x_label_area_size(50)
        .y_label_area_size(70)
        .build_cartesian_2d(x0..x1, y0..y1)
        .map_err(draw_err)?;
    let n = tolerances.len();
    let band = |e: f64| -> Option<usize> {
        e.is_finite()
            .then(|| tolerances.iter().filter(|&&tol| e > tol).count())
    };
    // Cells of one band in a column are one rectangle.
    let mut cells: Vec<Rectangle<(f64, f64)>> = Vec::new();
    for i in 0..t.len() {
        let mut j = 0;
        while j < p.len() {
            let b = band(err[i][j]);
            let mut k = j;
            while k + 1 < p.len() && band(err[i][k + 1]) == b {
                k += 1;
            }
            let fill = match b {
                Some(b) => grey(b, n).filled(),
                None => WHITE.filled(),
            };
            cells.push(Rectangle::new(
                [(te[i].0, pe[j].0.max(y0)), (te[i].1, pe[k].1)],
                fill,
            ));
            j = k + 1;
        }
    }
    chart.draw_series(cells).map_err(draw_err)?;
    // States without a value (two-phase, or not computed): a sparse pattern of crosses, which
    // reads in black and white where a shade could be mistaken for a band.
    let stride = (t.len().max(p.len()) / 25).max(1);
    chart
        .draw_series((0..t.len()).step_by(stride).flat_map(|i| {
            let pb = &pb;
            (0..p.len())
                .step_by(stride)
                .filter(move |&j| !err[i][j].is_finite())
                .map(move |j| {
                    Cross::new((t[i], pb[j]), 3, ShapeStyle::from(&BLACK).stroke_width(1))
                })
        }))
        .map_err(draw_err)?;
    chart
        .configure_mesh()
        .x_desc("temperature T [K]")
        .y_desc("pressure P [bar]")
        .label_style(("sans-serif", 15))
        .axis_desc_style(("sans-serif", 17))
        .disable_mesh()
        .draw()
        .map_err(draw_err)?;
    let widths = [1u32, 2, 4, 5, 6];
    for (k, &tol) in tolerances.iter().enumerate() {
        let style = ShapeStyle::from(&BLACK).stroke_width(widths[k.min(widths.len() - 1)]);
        let segments = contour(t, &pb, err, tol);
        chart
            .draw_series(
                segments
                    .into_iter()
                    .map(|s| PathElement::new(s.to_vec(), style)),
            )
            .map_err(draw_err)?;
    }
    // The legend, beside the plot: the bands, then the contours.
    side.fill(&WHITE).map_err(draw_err)?;
    let mut y = 70;
    let text = |side: &DrawingArea<DB, Shift>, s: String, y: i32| {
        side.draw(&Text::new(s, (48, y - 8), ("sans-serif", 15)))
            .map_err(draw_err)
    };
    for b in 0..=n {
        let label = match b {
            0 => format!("<= {} %", tolerances.first().copied().unwrap_or(0.0)),
            b if b == n => format!("> {} %", tolerances[n - 1]),
            b => format!("{} to {} %", tolerances[b - 1], tolerances[b]),
        };
        side.draw(&Rectangle::new(
            [(8, y - 7), (40, y + 7)],
            grey(b, n).filled(),
        ))
        .map_err(draw_err)?;
        side.draw(&Rectangle::new([(8, y - 7), (40, y + 7)], BLACK))
            .map_err(draw_err)?;
        text(&side, label, y)?;
        y += 26;
    }
    side.draw(&Rectangle::new([(8, y - 7), (40, y + 7)], BLACK))
        .map_err(draw_err)?;
    side.draw(&Cross::new(
        (24, y),
        3,
        ShapeStyle::from(&BLACK).stroke_width(1),
    ))
    .map_err(draw_err)?;
    text(&side, "no value (two-phase)".to_string(), y)?;
    y += 34;
    for (k, &tol) in tolerances.iter().enumerate() {
        let style = ShapeStyle::from(&BLACK).stroke_width(widths[k.min(widths.len() - 1)]);
        side.draw(&PathElement::new(vec![(8, y), (40, y)], style))
            .map_err(draw_err)?;
        text(&side, format!("{tol} % contour"), y)?;
        y += 26;
    }
    root.present().map_err(draw_err)?;
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Every crossing of the level is found, on both sides of a maximum: a field that rises
    /// and falls again along each column (as |Z - 1| does along an isotherm, coming back
    /// towards 0 at high pressure) gives two crossings per column.
    #[test]
    fn contours_follow_every_crossing() {
        let x: Vec<f64> = (0..11).map(|i| i as f64).collect();
        let y: Vec<f64> = (0..41)
            .map(|j| j as f64 * std::f64::consts::PI / 40.0)
            .collect();
        let f: Vec<Vec<f64>> = x
            .iter()
            .map(|_| y.iter().map(|v| v.sin()).collect())
            .collect();
        let segs = contour(&x, &y, &f, 0.5);
        // Two horizontal lines, at y = pi/6 and 5 pi/6, each across the ten cells.
        assert_eq!(segs.len(), 20);
        for s in &segs {
            for &(_, yy) in s {
                let near = [std::f64::consts::PI / 6.0, 5.0 * std::f64::consts::PI / 6.0]
                    .iter()
                    .any(|c| (yy - c).abs() < 0.01);
                assert!(near, "{yy}");
            }
        }
        // A plane crosses each level along a straight line x + y = level.
        let g: Vec<Vec<f64>> = x
            .iter()
            .map(|a| y.iter().map(|b| a + b).collect())
            .collect();
        for s in contour(&x, &y, &g, 5.0) {
            for (a, b) in s {
                assert!((a + b - 5.0).abs() < 1e-12);
            }
        }
        // Cells with a corner without a value give no segment.
        let mut h = g.clone();
        h[5][5] = f64::NAN;
        assert!(contour(&x, &y, &h, 5.0).len() < contour(&x, &y, &g, 5.0).len());
    }
}
