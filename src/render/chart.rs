//! Charts of a comparison, as SVG or PNG (plotters, with the DejaVu Sans font embedded; its
//! licence is in `fonts/DejaVuSans-LICENSE.txt`):
//!
//! - `isotherms`: Z against pressure on up to six isotherms, one line style per model, the
//!   reference as a solid black line (a model) or black circles (data);
//! - `deviation-<model>`: the density deviation of each model from the reference over the
//!   T-P grid, shaded by tolerance band, with the boundary of each tolerance;
//! - `ideal-gas-map`: |Z - 1| over the grid, shaded and bounded the same way.
//!
//! Every series differs by dash pattern or marker as well as by colour, and the shading is
//! grey, so the charts stay readable in black and white. Files are written atomically and
//! never over an existing file without `--force`.

use crate::cli::ChartFormat;
use crate::compare::ideal_map::boundary_pressure;
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
    emit("isotherms", &|root| isotherms(r, root), &|root| {
        isotherms(r, root)
    })?;
    if let Some(g) = &r.grid {
        let t = &g.temperatures_k;
        let p = &g.pressures_pa;
        let tolerances: Vec<f64> = r
            .ideal_gas_map
            .as_ref()
            .map(|m| m.tolerances.iter().map(|t| t.tolerance_pct).collect())
            .unwrap_or_else(|| r.advice.iter().map(|a| a.tolerance_pct).collect());
        if r.reference.kind != "none" && t.len() >= 2 && p.len() >= 2 {
            for (k, m) in r.models.iter().enumerate() {
                let err: Vec<Vec<f64>> = (0..t.len())
                    .map(|i| {
                        (0..p.len())
                            .map(|j| {
                                let pt = &r.points.held()[i * p.len() + j];
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
                    m.model,
                    r.reference.id.as_deref().unwrap_or("the reference")
                );
                let name = format!("deviation-{}", m.model);
                emit(
                    &name,
                    &|root| band_map(root, &title, t, p, &err, &tolerances),
                    &|root| band_map(root, &title, t, p, &err, &tolerances),
                )?;
            }
        }
        if let Some(m) = &r.ideal_gas_map {
            if t.len() >= 2 && p.len() >= 2 {
                let err: Vec<Vec<f64>> = m
                    .error_pct
                    .iter()
                    .map(|row| row.iter().map(|e| e.unwrap_or(f64::NAN)).collect())
                    .collect();
                let title = format!("ideal-gas error |Z - 1| (Z from {})", m.basis_model);
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

/// Z against P on up to six isotherms.
fn isotherms<DB: DrawingBackend>(
    r: &CompareReport,
    root: DrawingArea<DB, Shift>,
) -> Result<(), CliError> {
    root.fill(&WHITE).map_err(draw_err)?;
    // Temperatures present, in order, thinned evenly to MAX_ISOTHERMS.
    let mut temps: Vec<f64> = r.points.held().iter().map(|p| p.temperature_k).collect();
    temps.sort_by(f64::total_cmp);
    temps.dedup_by(|a, b| a.to_bits() == b.to_bits());
    if temps.len() > MAX_ISOTHERMS {
        let n = temps.len();
        temps = (0..MAX_ISOTHERMS)
            .map(|k| temps[k * (n - 1) / (MAX_ISOTHERMS - 1)])
            .collect();
    }
    let on = |t: f64| {
        let mut pts: Vec<&crate::report::compare_points::PointReport> = r
            .points
            .held()
            .iter()
            .filter(|p| p.temperature_k.to_bits() == t.to_bits())
            .collect();
        pts.sort_by(|a, b| a.pressure_pa.total_cmp(&b.pressure_pa));
        pts
    };
    let mut zs: Vec<f64> = Vec::new();
    let mut ps: Vec<f64> = Vec::new();
    for &t in &temps {
        for p in on(t) {
            ps.push(p.pressure_pa / PA_PER_BAR);
            zs.extend(p.values.iter().filter_map(|v| v.z));
            zs.extend(p.reference_z);
        }
    }
    let fin = |v: &[f64], f: fn(f64, f64) -> f64, init: f64| {
        v.iter().copied().filter(|x| x.is_finite()).fold(init, f)
    };
    let (pmin, pmax) = (fin(&ps, f64::min, f64::MAX), fin(&ps, f64::max, f64::MIN));
    let (zmin, zmax) = (fin(&zs, f64::min, f64::MAX), fin(&zs, f64::max, f64::MIN));
    if !(pmin.is_finite() && pmax.is_finite() && zmin.is_finite() && zmax.is_finite()) {
        return Err(CliError::Output("no values to chart".to_string()));
    }
    let pad = |lo: f64, hi: f64| {
        let d = (hi - lo).abs().max(1e-6 * hi.abs().max(1.0));
        (lo - 0.05 * d, hi + 0.05 * d)
    };
    let (x0, x1) = pad(pmin, pmax);
    let (y0, y1) = pad(zmin, zmax);
    let mut chart = ChartBuilder::on(&root)
        .caption(
            format!("Z against pressure: {}", short(&r.fluid)),
            ("sans-serif", 22),
        )
        .margin(16)
        .x_label_area_size(50)
        .y_label_area_size(70)
        .build_cartesian_2d(x0..x1 + 0.12 * (x1 - x0), y0..y1)
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
    let model_count = r.points.held().first().map_or(0, |p| p.values.len());
    for k in 0..model_count {
        let (color, dash, gap) = line_style(k);
        let name = r.points.held()[0].values[k].model.clone();
        let style = ShapeStyle::from(&color).stroke_width(2);
        for (n, &t) in temps.iter().enumerate() {
            let line: Vec<(f64, f64)> = on(t)
                .iter()
                .filter_map(|p| p.values[k].z.map(|z| (p.pressure_pa / PA_PER_BAR, z)))
                .collect();
            let series = chart
                .draw_series(DashedLineSeries::new(line, dash, gap, style))
                .map_err(draw_err)?;
            if n == 0 {
                series.label(name.clone()).legend(move |(x, y)| {
                    DashedPathElement::new(vec![(x, y), (x + 20, y)], dash, gap, style)
                });
            }
        }
    }
    let black = ShapeStyle::from(&BLACK).stroke_width(2);
    let mut labelled = false;
    for &t in &temps {
        let refs: Vec<(f64, f64)> = on(t)
            .iter()
            .filter_map(|p| p.reference_z.map(|z| (p.pressure_pa / PA_PER_BAR, z)))
            .collect();
        if refs.is_empty() {
            continue;
        }
        let label = format!(
            "reference ({})",
            r.reference.id.as_deref().unwrap_or("data")
        );
        if r.reference.kind == "model" {
            let s = chart
                .draw_series(LineSeries::new(refs.clone(), black))
                .map_err(draw_err)?;
            if !labelled {
                s.label(label)
                    .legend(move |(x, y)| PathElement::new(vec![(x, y), (x + 20, y)], black));
                labelled = true;
            }
        } else {
            let s = chart
                .draw_series(refs.iter().map(|&(x, y)| {
                    Circle::new((x, y), 4, ShapeStyle::from(&BLACK).stroke_width(2))
                }))
                .map_err(draw_err)?;
            if !labelled {
                s.label(label).legend(move |(x, y)| {
                    Circle::new((x + 10, y), 4, ShapeStyle::from(&BLACK).stroke_width(2))
                });
                labelled = true;
            }
        }
    }
    // Label each isotherm at its highest pressure.
    for &t in &temps {
        let pts = on(t);
        if let Some(last) = pts.last() {
            let z = last
                .reference_z
                .or_else(|| last.values.iter().find_map(|v| v.z));
            if let Some(z) = z {
                chart
                    .draw_series(std::iter::once(Text::new(
                        format!(" {} K", crate::render::number::sig(t, 4)),
                        (last.pressure_pa / PA_PER_BAR, z),
                        ("sans-serif", 14),
                    )))
                    .map_err(draw_err)?;
            }
        }
    }
    chart
        .configure_series_labels()
        .background_style(WHITE.mix(0.9))
        .border_style(BLACK)
        .label_font(("sans-serif", 15))
        .position(SeriesLabelPosition::LowerLeft)
        .draw()
        .map_err(draw_err)?;
    root.present().map_err(draw_err)?;
    Ok(())
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

/// A map of `err[i][j]` (percent, at t[i], p[j]) shaded by tolerance band, with the boundary
/// of each tolerance drawn across the temperatures.
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
    let mut chart = ChartBuilder::on(&root)
        .caption(title, ("sans-serif", 22))
        .margin(16)
        .x_label_area_size(50)
        .y_label_area_size(70)
        .build_cartesian_2d(x0..x1, y0..y1)
        .map_err(draw_err)?;
    let n = tolerances.len();
    let band = |e: f64| tolerances.iter().filter(|&&tol| e > tol).count();
    chart
        .draw_series(t.iter().enumerate().flat_map(|(i, _)| {
            let te = &te;
            let pe = &pe;
            p.iter().enumerate().filter_map(move |(j, _)| {
                let e = err[i][j];
                e.is_finite().then(|| {
                    Rectangle::new(
                        [(te[i].0, pe[j].0.max(y0)), (te[i].1, pe[j].1)],
                        grey(band(e), n).filled(),
                    )
                })
            })
        }))
        .map_err(draw_err)?;
    // States without a value (two-phase or not computed): a small cross.
    chart
        .draw_series(t.iter().enumerate().flat_map(|(i, &ti)| {
            let pb = &pb;
            p.iter()
                .enumerate()
                .filter(move |&(j, _)| !err[i][j].is_finite())
                .map(move |(j, _)| {
                    Cross::new((ti, pb[j]), 4, ShapeStyle::from(&BLACK).stroke_width(1))
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
    for (k, &tol) in tolerances.iter().enumerate() {
        let line: Vec<(f64, f64)> = t
            .iter()
            .zip(err)
            .filter_map(|(&ti, row)| boundary_pressure(&pb, row, tol).map(|pbar| (ti, pbar)))
            .collect();
        let (_, dash, gap) = line_style(k);
        let style = ShapeStyle::from(&BLACK).stroke_width(2);
        let s = chart
            .draw_series(DashedLineSeries::new(line, dash, gap, style))
            .map_err(draw_err)?;
        s.label(format!("{tol} % boundary")).legend(move |(x, y)| {
            DashedPathElement::new(vec![(x, y), (x + 20, y)], dash, gap, style)
        });
    }
    for b in 0..=n {
        let label = match b {
            0 => format!("<= {} %", tolerances.first().copied().unwrap_or(0.0)),
            b if b == n => format!("> {} %", tolerances[n - 1]),
            b => format!("{} to {} %", tolerances[b - 1], tolerances[b]),
        };
        let color = grey(b, n);
        chart
            .draw_series(std::iter::empty::<Rectangle<(f64, f64)>>())
            .map_err(draw_err)?
            .label(label)
            .legend(move |(x, y)| {
                EmptyElement::at((x, y))
                    + Rectangle::new([(0, -6), (20, 6)], ShapeStyle::from(&color).filled())
                    + Rectangle::new([(0, -6), (20, 6)], ShapeStyle::from(&BLACK))
            });
    }
    chart
        .configure_series_labels()
        .background_style(WHITE.mix(0.95))
        .border_style(BLACK)
        .label_font(("sans-serif", 15))
        .position(SeriesLabelPosition::UpperLeft)
        .draw()
        .map_err(draw_err)?;
    root.present().map_err(draw_err)?;
    Ok(())
}
