//! Charts of `zfactor envelope`, as SVG or PNG (plotters, with the embedded DejaVu Sans of
//! [`crate::render::chart`]):
//!
//! - P-T: the dew branch dashed and the bubble branch solid (a pure fluid: its vapour-pressure
//!   curve solid), the critical point as a filled circle, the cricondenbar as a filled
//!   triangle, the cricondentherm as an open square, each in the legend with its values;
//! - P-v (pure fluids): the saturated-liquid curve solid, the saturated-vapour curve dashed,
//!   the critical point, and isotherms below, at and above Tc in grey with their own dash
//!   patterns, on a logarithmic volume axis.
//!
//! Lines differ by dash pattern and markers by shape, so the charts read in black and
//! white. Files are written atomically ([`crate::output_file`]) and never over an existing
//! file without `--force`.

use crate::error::CliError;
use crate::render::chart::register_font;
use crate::render::number::sig;
use crate::report::envelope::pv_range;
use crate::report::envelope::{EnvelopeReport, TpPoint};
use crate::units::PA_PER_BAR;
use plotters::coord::Shift;
use plotters::element::DashedPathElement;
use plotters::prelude::*;
use std::path::Path;

/// Chart size in pixels.
const SIZE: (u32, u32) = (960, 680);
/// Litres per cubic metre (molar volumes are shown in L/mol).
const L_PER_M3: f64 = 1e3;

fn draw_err<E: std::fmt::Debug>(e: E) -> CliError {
    CliError::Output(format!("drawing a chart: {e:?}"))
}

/// Writes `draw` to `path` as SVG or PNG.
fn write<FS, FP>(
    path: &Path,
    png: bool,
    force: bool,
    svg_draw: FS,
    png_draw: FP,
) -> Result<(), CliError>
where
    FS: Fn(DrawingArea<SVGBackend, Shift>) -> Result<(), CliError>,
    FP: Fn(DrawingArea<BitMapBackend, Shift>) -> Result<(), CliError>,
{
    register_font()?;
    if png {
        crate::output_file::write_with(path, force, &[], |_, tmp| {
            let root = BitMapBackend::new(tmp, SIZE).into_drawing_area();
            png_draw(root)
        })
    } else {
        let mut svg = String::new();
        {
            let root = SVGBackend::with_string(&mut svg, SIZE).into_drawing_area();
            svg_draw(root)?;
        }
        crate::output_file::write(path, svg.as_bytes(), force, &[])
    }
}

/// Writes the P-T chart of the report.
pub fn write_pt(r: &EnvelopeReport, path: &Path, png: bool, force: bool) -> Result<(), CliError> {
    write(path, png, force, |a| pt_chart(r, a), |a| pt_chart(r, a))
}

/// Writes the P-v chart of a pure fluid's report.
pub fn write_pv(r: &EnvelopeReport, path: &Path, png: bool, force: bool) -> Result<(), CliError> {
    write(path, png, force, |a| pv_chart(r, a), |a| pv_chart(r, a))
}

/// A title short enough for the chart.
fn short(s: &str) -> String {
    if s.chars().count() > 60 {
        let cut: String = s.chars().take(57).collect();
        format!("{cut}...")
    } else {
        s.to_string()
    }
}

fn bar(p: &TpPoint) -> (f64, f64) {
    (p.temperature_k, p.pressure_pa / PA_PER_BAR)
}

/// What a legend entry shows.
#[derive(Clone, Copy)]
enum Key {
    /// A line: colour, dash, gap (gap 0: solid), width.
    Line(RGBColor, u32, u32, u32),
    Circle,
    Triangle,
    Square,
}

/// A legend entry: its key, its name and an optional second line (values).
struct Entry {
    key: Key,
    name: String,
    value: Option<String>,
}

fn entry(key: Key, name: &str, value: Option<String>) -> Entry {
    Entry {
        key,
        name: name.to_string(),
        value,
    }
}

/// Line height of the legend panel, pixels.
const LINE: i32 = 19;

/// The legend, drawn in its own panel beside the plot so that it never hides a curve, then
/// `extra` lines of text (the composition).
fn side_panel<DB: DrawingBackend>(
    area: &DrawingArea<DB, Shift>,
    entries: &[Entry],
    extra: &[String],
) -> Result<(), CliError> {
    let font = ("sans-serif", 15).into_font();
    let small = ("sans-serif", 14).into_font();
    let mut y = 70;
    let x = 8;
    for e in entries {
        let yc = y + 8;
        match e.key {
            Key::Line(c, dash, gap, w) => {
                let style = ShapeStyle::from(&c).stroke_width(w);
                if gap == 0 {
                    area.draw(&PathElement::new(vec![(x, yc), (x + 34, yc)], style))
                } else {
                    area.draw(&DashedPathElement::new(
                        vec![(x, yc), (x + 34, yc)],
                        dash,
                        gap,
                        style,
                    ))
                }
            }
            Key::Circle => area.draw(&Circle::new((x + 17, yc), 6, BLACK.filled())),
            Key::Triangle => area.draw(&TriangleMarker::new((x + 17, yc), 9, BLACK.filled())),
            Key::Square => area.draw(&Rectangle::new(
                [(x + 11, yc - 6), (x + 23, yc + 6)],
                ShapeStyle::from(&BLACK).stroke_width(2),
            )),
        }
        .map_err(draw_err)?;
        area.draw(&Text::new(e.name.clone(), (x + 44, y), font.clone()))
            .map_err(draw_err)?;
        y += LINE;
        if let Some(v) = &e.value {
            area.draw(&Text::new(v.clone(), (x + 44, y), small.clone()))
                .map_err(draw_err)?;
            y += LINE;
        }
        y += 8;
    }
    y += 10;
    for line in extra {
        area.draw(&Text::new(line.clone(), (x, y), small.clone()))
            .map_err(draw_err)?;
        y += LINE;
    }
    Ok(())
}

/// Most components listed beside a chart.
const LISTED: usize = 14;

/// The composition, one component a line.
fn composition_lines(r: &EnvelopeReport) -> Vec<String> {
    if r.kind == "pure" {
        return Vec::new();
    }
    let mut out = vec!["mole fractions".to_string()];
    for c in r.composition.iter().take(LISTED) {
        out.push(format!("  {} {}", c.id, sig(c.mole_fraction, 4)));
    }
    if r.composition.len() > LISTED {
        out.push(format!("  and {} more", r.composition.len() - LISTED));
    }
    out
}

fn values(p: &TpPoint) -> Option<String> {
    Some(format!(
        "{} K, {} bar",
        sig(p.temperature_k, 5),
        sig(p.pressure_pa / PA_PER_BAR, 5)
    ))
}

/// Width of the plot, pixels; the legend panel takes the rest.
const PLOT_WIDTH: u32 = 680;

const DEW: RGBColor = RGBColor(0, 90, 160);
const BUBBLE: RGBColor = RGBColor(170, 40, 0);

fn pt_chart<DB: DrawingBackend>(
    r: &EnvelopeReport,
    root: DrawingArea<DB, Shift>,
) -> Result<(), CliError> {
    root.fill(&WHITE).map_err(draw_err)?;
    let pts: Vec<(f64, f64)> = r
        .points
        .iter()
        .map(|p| (p.temperature_k, p.pressure_pa / PA_PER_BAR))
        .chain(r.critical_point.iter().map(bar))
        .chain(r.cricondenbar.iter().map(bar))
        .chain(r.cricondentherm.iter().map(bar))
        .collect();
    let t0 = pts.iter().map(|p| p.0).fold(f64::INFINITY, f64::min);
    let t1 = pts.iter().map(|p| p.0).fold(f64::NEG_INFINITY, f64::max);
    let p1 = pts.iter().map(|p| p.1).fold(f64::NEG_INFINITY, f64::max);
    if !(t0.is_finite() && t1.is_finite() && p1.is_finite() && t1 > t0) {
        return Err(CliError::Output("no envelope points to chart".to_string()));
    }
    let dt = t1 - t0;
    let (x0, x1) = (t0 - 0.04 * dt, t1 + 0.06 * dt);
    let title = if r.kind == "pure" {
        format!("Vapour pressure of {}, model {}", short(&r.fluid), r.model)
    } else {
        format!("Phase envelope, model {}", r.model)
    };
    let root = root.titled(&title, ("sans-serif", 21)).map_err(draw_err)?;
    let (plot, panel) = root.split_horizontally(PLOT_WIDTH);
    let mut chart = ChartBuilder::on(&plot)
        .margin(16)
        .x_label_area_size(50)
        .y_label_area_size(70)
        .build_cartesian_2d(x0..x1, 0.0..p1 * 1.08)
        .map_err(draw_err)?;
    chart
        .configure_mesh()
        .x_desc("temperature T [K]")
        .y_desc("pressure P [bar abs]")
        .label_style(("sans-serif", 15))
        .axis_desc_style(("sans-serif", 17))
        .light_line_style(RGBColor(235, 235, 235))
        .draw()
        .map_err(draw_err)?;
    let crit = r.critical_point.as_ref().map(bar);
    let mut entries = Vec::new();
    if r.kind == "pure" {
        let solid = ShapeStyle::from(&BLACK).stroke_width(2);
        let line: Vec<(f64, f64)> = r
            .points
            .iter()
            .map(|p| (p.temperature_k, p.pressure_pa / PA_PER_BAR))
            .chain(crit)
            .collect();
        chart
            .draw_series(LineSeries::new(line, solid))
            .map_err(draw_err)?;
        entries.push(entry(
            Key::Line(BLACK, 0, 0, 2),
            "vapour pressure",
            Some("liquid above, vapour below".to_string()),
        ));
    } else {
        let blue = ShapeStyle::from(&DEW).stroke_width(2);
        let red = ShapeStyle::from(&BUBBLE).stroke_width(2);
        let dew: Vec<(f64, f64)> = r
            .points
            .iter()
            .filter(|p| p.branch == "dew")
            .map(|p| (p.temperature_k, p.pressure_pa / PA_PER_BAR))
            .chain(crit)
            .collect();
        let bubble: Vec<(f64, f64)> = crit
            .into_iter()
            .chain(
                r.points
                    .iter()
                    .filter(|p| p.branch == "bubble")
                    .map(|p| (p.temperature_k, p.pressure_pa / PA_PER_BAR)),
            )
            .collect();
        chart
            .draw_series(DashedLineSeries::new(dew, 12, 6, blue))
            .map_err(draw_err)?;
        chart
            .draw_series(LineSeries::new(bubble, red))
            .map_err(draw_err)?;
        entries.push(entry(
            Key::Line(DEW, 12, 6, 2),
            "dew-point curve",
            Some("vapour fraction 1".to_string()),
        ));
        entries.push(entry(
            Key::Line(BUBBLE, 0, 0, 2),
            "bubble-point curve",
            Some("vapour fraction 0".to_string()),
        ));
    }
    if let Some(c) = &r.critical_point {
        chart
            .draw_series(std::iter::once(Circle::new(bar(c), 6, BLACK.filled())))
            .map_err(draw_err)?;
        entries.push(entry(Key::Circle, "critical point", values(c)));
    }
    if let Some(c) = &r.cricondenbar {
        chart
            .draw_series(std::iter::once(TriangleMarker::new(
                bar(c),
                9,
                BLACK.filled(),
            )))
            .map_err(draw_err)?;
        entries.push(entry(Key::Triangle, "cricondenbar", values(c)));
    }
    if let Some(c) = &r.cricondentherm {
        let sq = ShapeStyle::from(&BLACK).stroke_width(2);
        chart
            .draw_series(std::iter::once(
                EmptyElement::at(bar(c)) + Rectangle::new([(-6, -6), (6, 6)], sq),
            ))
            .map_err(draw_err)?;
        entries.push(entry(Key::Square, "cricondentherm", values(c)));
    }
    side_panel(&panel, &entries, &composition_lines(r))?;
    root.present().map_err(draw_err)?;
    Ok(())
}

/// Keeps the part of a line (v, P) at or below `p_max`, cut at `p_max` by interpolation in
/// (ln v, P); the stable isotherm falls monotonically with v, so that part is one piece.
fn clip(line: &[(f64, f64)], p_max: f64) -> Vec<(f64, f64)> {
    let Some(k) = line.iter().position(|&(_, p)| p <= p_max) else {
        return Vec::new();
    };
    let mut out = Vec::with_capacity(line.len() - k + 1);
    if k > 0 {
        let ((va, pa), (vb, pb)) = (line[k - 1], line[k]);
        let f = (pa - p_max) / (pa - pb);
        out.push(((va.ln() + f * (vb.ln() - va.ln())).exp(), p_max));
    }
    out.extend(line[k..].iter().copied().filter(|&(_, p)| p <= p_max));
    out
}

fn pv_chart<DB: DrawingBackend>(
    r: &EnvelopeReport,
    root: DrawingArea<DB, Shift>,
) -> Result<(), CliError> {
    root.fill(&WHITE).map_err(draw_err)?;
    let Some(c) = &r.critical_point else {
        return Err(CliError::Output(
            "the P-v chart needs the critical point".to_string(),
        ));
    };
    let pc = c.pressure_pa;
    let (v0, v1) = pv_range(&r.points, pc);
    let (x0, x1) = (v0 * L_PER_M3, v1 * L_PER_M3);
    let y1 = 1.6 * pc / PA_PER_BAR;
    if !(x0.is_finite() && x1.is_finite() && x1 > x0 && x0 > 0.0 && y1 > 0.0) {
        return Err(CliError::Output("no dome to chart".to_string()));
    }
    let title = format!(
        "Saturation dome of {}, model {}: P against v",
        short(&r.fluid),
        r.model
    );
    let root = root.titled(&title, ("sans-serif", 21)).map_err(draw_err)?;
    let (plot, panel) = root.split_horizontally(PLOT_WIDTH);
    let mut chart = ChartBuilder::on(&plot)
        .margin(16)
        .x_label_area_size(50)
        .y_label_area_size(70)
        .build_cartesian_2d((x0..x1).log_scale(), 0.0..y1)
        .map_err(draw_err)?;
    chart
        .configure_mesh()
        .x_desc("molar volume v [L/mol] (logarithmic)")
        .y_desc("pressure P [bar abs]")
        .label_style(("sans-serif", 15))
        .axis_desc_style(("sans-serif", 17))
        .light_line_style(RGBColor(235, 235, 235))
        .draw()
        .map_err(draw_err)?;
    let last = r.points.last();
    let vc_l = 1.0 / last.map_or(f64::NAN, |p| p.liquid_molar_density_mol_m3);
    let vc_v = 1.0 / last.map_or(f64::NAN, |p| p.vapor_molar_density_mol_m3);
    // The critical volume: between the last liquid and vapour volumes (geometric mean).
    let crit = ((vc_l * vc_v).sqrt() * L_PER_M3, pc / PA_PER_BAR);
    let in_range = |v: f64| v >= x0 && v <= x1;
    let branch = |liquid: bool| -> Vec<(f64, f64)> {
        r.points
            .iter()
            .map(|p| {
                let rho = if liquid {
                    p.liquid_molar_density_mol_m3
                } else {
                    p.vapor_molar_density_mol_m3
                };
                (L_PER_M3 / rho, p.pressure_pa / PA_PER_BAR)
            })
            .filter(|&(v, _)| in_range(v))
            .chain(std::iter::once(crit))
            .collect()
    };
    let solid = ShapeStyle::from(&BLACK).stroke_width(3);
    chart
        .draw_series(LineSeries::new(branch(true), solid))
        .map_err(draw_err)?;
    chart
        .draw_series(DashedLineSeries::new(branch(false), 12, 6, solid))
        .map_err(draw_err)?;
    let mut entries = vec![
        entry(Key::Line(BLACK, 0, 0, 3), "saturated liquid", None),
        entry(Key::Line(BLACK, 12, 6, 3), "saturated vapour", None),
    ];
    // Isotherms in grey, each with its own dash pattern (gap 0: solid).
    const ISO_STYLES: [(u8, u32, u32); 4] = [(70, 3, 4), (100, 8, 4), (150, 0, 0), (120, 18, 6)];
    for (k, iso) in r.isotherms.iter().enumerate() {
        let (g, dash, gap) = ISO_STYLES[k % ISO_STYLES.len()];
        let colour = RGBColor(g, g, g);
        let style = ShapeStyle::from(&colour).stroke_width(2);
        let line: Vec<(f64, f64)> = iso
            .molar_volume_m3_mol
            .iter()
            .zip(&iso.pressure_pa)
            .map(|(v, p)| (v * L_PER_M3, p / PA_PER_BAR))
            .collect();
        let line = clip(&line, y1);
        if gap == 0 {
            chart.draw_series(LineSeries::new(line, style))
        } else {
            chart.draw_series(DashedLineSeries::new(line, dash, gap, style))
        }
        .map_err(draw_err)?;
        entries.push(entry(
            Key::Line(colour, dash, gap, 2),
            &format!("isotherm {} K", sig(iso.temperature_k, 4)),
            Some(format!(
                "T/Tc = {}",
                sig(iso.temperature_k / c.temperature_k, 2)
            )),
        ));
    }
    chart
        .draw_series(std::iter::once(Circle::new(crit, 6, BLACK.filled())))
        .map_err(draw_err)?;
    entries.push(entry(Key::Circle, "critical point", values(c)));
    let note = vec![
        "isotherms: the model's stable".to_string(),
        "isotherm, flat across the dome".to_string(),
        "at the vapour pressure".to_string(),
    ];
    side_panel(&panel, &entries, &note)?;
    root.present().map_err(draw_err)?;
    Ok(())
}
