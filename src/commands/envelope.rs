//! `zfactor envelope`: the phase envelope of a mixture with one model, or the
//! vapour-pressure curve of a pure fluid, as a table and as charts.
//!
//! - Mixtures: [`eos::equilibrium::envelope::trace`] (Michelsen 1980 continuation) from a dew
//!   point at the starting pressure round the critical point to the bubble point at the same
//!   pressure; the critical point, cricondenbar and cricondentherm come with the trace.
//! - Pure fluids: the vapour pressure from the triple point on record (or, without one, from
//!   T = 0.4 Tc) up to the model's own critical point: [`eos::equilibrium::saturation`]
//!   (equal fugacity, Newton on ln P) for the models with a Helmholtz energy, and the
//!   formulation's own saturation solver ([`eos::helmholtz::HelmholtzFluid::saturation_t`],
//!   Maxwell criterion in the two densities) for the reference and 12-term equations; the
//!   model's critical point from [`eos::equilibrium::critical_point::pure`] (cubics and the
//!   like) or the formulation's published constants. With `--pv` the P-v chart adds
//!   isotherms at 0.8, 0.9, 1.0 and 1.2 Tc, each the model's stable isotherm: P(T, v) of the
//!   model outside the dome and the vapour pressure across it.

use crate::cli::EnvelopeArgs;
use crate::error::{from_eos, CliError};
use crate::exit::Exit;
use crate::feed::Feed;
use crate::feed_input;
use crate::models::{self, BuiltModel};
use crate::report::envelope::{pv_range, EnvelopeReport, EnvelopeRow, Isotherm, TpPoint};
use crate::units;
use eos::constants::R;
use eos::equilibrium::{critical_point, envelope, saturation, EnvelopeOptions, EnvelopeStop};
use eos::helmholtz::HelmholtzFluid;
use eos::Model;
use std::path::PathBuf;

/// Points on a pure fluid's vapour-pressure curve.
const CURVE_POINTS: usize = 80;
/// Reduced temperature where the curve starts when no triple point is on record.
const TR_START: f64 = 0.4;
/// Reduced temperatures of the P-v chart's isotherms.
const ISOTHERMS_TR: [f64; 4] = [0.8, 0.9, 1.0, 1.2];
/// Points per isotherm.
const ISOTHERM_POINTS: usize = 240;

/// A chart file to write, with its type from the extension.
#[derive(Debug, Clone)]
pub struct ChartFile {
    pub path: PathBuf,
    pub png: bool,
}

/// Checks a chart path: .svg or .png, not existing unless `force`.
pub fn chart_file(text: &str, option: &str, force: bool) -> Result<ChartFile, CliError> {
    let path = PathBuf::from(text);
    let ext = path
        .extension()
        .map(|e| e.to_string_lossy().to_ascii_lowercase());
    let png = match ext.as_deref() {
        Some("png") => true,
        Some("svg") => false,
        _ => {
            return Err(CliError::BadInput(format!(
                "{option} \"{text}\": the chart type is taken from the extension; use .svg or \
                 .png"
            )))
        }
    };
    if path.is_dir() {
        return Err(CliError::BadInput(format!(
            "{option} \"{text}\" is a folder; give a file name"
        )));
    }
    if path.exists() && !force {
        return Err(CliError::BadInput(format!(
            "{option} \"{text}\" exists already; pass --force to overwrite it"
        )));
    }
    Ok(ChartFile { path, png })
}

/// Runs the command: computes, writes the charts, then prints the report.
pub fn dispatch(args: &EnvelopeArgs) -> Result<Exit, CliError> {
    let chart = args
        .chart
        .as_deref()
        .map(|c| chart_file(c, "--chart", args.force))
        .transpose()?;
    let pv = args
        .pv
        .as_deref()
        .map(|c| chart_file(c, "--pv", args.force))
        .transpose()?;
    if let (Some(a), Some(b)) = (&chart, &pv) {
        if a.path == b.path {
            return Err(CliError::BadInput(
                "--chart and --pv name the same file; give two names".to_string(),
            ));
        }
    }
    let mut report = run(args)?;
    if pv.is_some() && report.kind != "pure" {
        return Err(CliError::BadInput(
            "--pv draws the saturation dome of a pure fluid (--fluid NAME); a mixture has no \
             single dome: use --chart for its P-T envelope"
                .to_string(),
        ));
    }
    if let Some(c) = &chart {
        crate::render::envelope_chart::write_pt(&report, &c.path, c.png, args.force)?;
        report.charts.push(c.path.display().to_string());
    }
    if let Some(c) = &pv {
        crate::render::envelope_chart::write_pv(&report, &c.path, c.png, args.force)?;
        report.charts.push(c.path.display().to_string());
    }
    crate::render::output::render(&report, args.format)?;
    Ok(crate::commands::exit_for(&report.warnings))
}

/// Computes the envelope or curve (and the isotherms when `--pv` is given).
pub fn run(args: &EnvelopeArgs) -> Result<EnvelopeReport, CliError> {
    let feed = feed_input::read(&args.fluid)?;
    let ids = models::resolve_ids(&args.model, &feed)?;
    if ids.len() != 1 {
        return Err(CliError::BadInput(format!(
            "--model \"{}\": the envelope is traced with one model; name one (e.g. pr)",
            args.model
        )));
    }
    let id = &ids[0];
    if crate::commands::flash::GAS_ONLY.contains(&id.as_str()) {
        return Err(CliError::BadInput(format!(
            "model {id} describes the gas only and never condenses (it has no liquid root), so \
             it has no phase envelope or vapour-pressure curve; choose a model such as pr or srk"
        )));
    }
    let built = models::build(id, &feed)?;
    let Some(m) = built.helmholtz() else {
        return Err(CliError::BadInput(format!(
            "model {id} ({}) answers at given (T, P) only and has no Helmholtz energy, so it \
             gives no phase equilibrium; choose a model with one: vdw, rk, srk, pr, pr78, \
             srk-pen, pr-pen, pr78-pen, virial (or reference for a pure fluid that has one)",
            built.name
        )));
    };
    let mut report = EnvelopeReport {
        tool: format!("zfactor {}", env!("CARGO_PKG_VERSION")),
        fluid: feed.label(),
        kind: if feed.is_pure() { "pure" } else { "mixture" },
        model: built.id.clone(),
        model_name: built.name.clone(),
        citation: built.citation.clone(),
        composition: crate::commands::state::composition_rows(&feed),
        points: Vec::new(),
        critical_point: None,
        cricondenbar: None,
        cricondentherm: None,
        stop: String::new(),
        isotherms: Vec::new(),
        charts: Vec::new(),
        notes: built.notes.clone(),
        warnings: Vec::new(),
        caution: crate::CAUTION,
    };
    if feed.is_pure() {
        pure_curve(&built, m, &feed, args.pv.is_some(), &mut report)?;
    } else {
        let ambient = units::ambient_pressure(&args.ambient)?;
        let p = units::pressure(&args.start_pressure)
            .and_then(|p| units::absolute_pressure(&args.start_pressure, p, ambient))?;
        mixture(&built, m, &feed, p, &mut report)?;
    }
    let finite = report.points.iter().all(|r| {
        [
            r.temperature_k,
            r.pressure_pa,
            r.liquid_molar_density_mol_m3,
            r.vapor_molar_density_mol_m3,
            r.liquid_mass_density_kg_m3,
            r.vapor_mass_density_kg_m3,
        ]
        .iter()
        .all(|v| v.is_finite())
    });
    if !finite || report.points.is_empty() {
        return Err(CliError::Computation(format!(
            "model {id} gave no usable envelope points for this fluid"
        )));
    }
    Ok(report)
}

fn tp(t: f64, p: f64) -> TpPoint {
    TpPoint {
        temperature_k: t,
        pressure_pa: p,
    }
}

/// The phase envelope of a mixture.
fn mixture(
    built: &BuiltModel,
    m: &dyn Model,
    feed: &Feed,
    p_start: f64,
    report: &mut EnvelopeReport,
) -> Result<(), CliError> {
    let z = &feed.mole;
    let options = EnvelopeOptions {
        p_start,
        ..EnvelopeOptions::default()
    };
    let ctx = format!("model {}: tracing the envelope", built.id);
    let env = match envelope::trace(m, z, options) {
        Ok(e) => e,
        Err(e) => {
            // A start above the cricondenbar has no dew point to start from: say so, with the
            // cricondenbar of the envelope traced from the default start.
            let default = EnvelopeOptions::default();
            if p_start > default.p_start {
                if let Ok(full) = envelope::trace(m, z, default) {
                    if p_start > full.cricondenbar.p {
                        return Err(CliError::BadInput(format!(
                            "--start-pressure {:.4} bar is above the cricondenbar of this \
                             mixture ({:.4} bar at {:.2} K with model {}): there is no dew \
                             point to start from; give a lower pressure",
                            p_start / units::PA_PER_BAR,
                            full.cricondenbar.p / units::PA_PER_BAR,
                            full.cricondenbar.t,
                            built.id
                        )));
                    }
                }
            }
            return Err(from_eos(&ctx, e));
        }
    };
    let mm = m.molar_mass(z);
    for pt in &env.points {
        let mi = m.molar_mass(&pt.incipient);
        let bubble = pt.vapor_fraction < 0.5;
        let (rl, rv, ml, mv) = if bubble {
            (pt.rho_feed, pt.rho_incipient, mm, mi)
        } else {
            (pt.rho_incipient, pt.rho_feed, mi, mm)
        };
        report.points.push(EnvelopeRow {
            temperature_k: pt.t,
            pressure_pa: pt.p,
            branch: if bubble { "bubble" } else { "dew" },
            liquid_molar_density_mol_m3: rl,
            vapor_molar_density_mol_m3: rv,
            liquid_mass_density_kg_m3: rl * ml,
            vapor_mass_density_kg_m3: rv * mv,
        });
    }
    report.critical_point = env.critical.map(|c| tp(c.t, c.p));
    // An extreme at the end of a trace that did not close is only where the trace stopped:
    // no number is given for it.
    let at_end = |e: &eos::equilibrium::envelope::TP| {
        env.stop != EnvelopeStop::Complete
            && env
                .points
                .last()
                .is_some_and(|l| (l.p - e.p).abs() <= 1e-6 * e.p && (l.t - e.t).abs() <= 1e-6 * e.t)
    };
    let extreme = |e: &eos::equilibrium::envelope::TP, name: &str, warnings: &mut Vec<String>| {
        if at_end(e) {
            warnings.push(format!(
                "no {name} is reported: the highest point of the part traced is where the \
                 trace stopped, not an extreme of the envelope"
            ));
            None
        } else {
            Some(tp(e.t, e.p))
        }
    };
    report.cricondenbar = extreme(&env.cricondenbar, "cricondenbar", &mut report.warnings);
    report.cricondentherm = extreme(&env.cricondentherm, "cricondentherm", &mut report.warnings);
    report.stop = match env.stop {
        EnvelopeStop::Complete => "complete".to_string(),
        EnvelopeStop::MaxPoints => {
            report.warnings.push(format!(
                "the trace reached its limit of {} points before closing: the envelope is \
                 incomplete",
                options.max_points
            ));
            "point limit".to_string()
        }
        EnvelopeStop::StepFailed(at) => {
            report.warnings.push(format!(
                "the trace stopped at T = {:.3} K, P = {:.4} bar where no further step \
                 converged: the envelope beyond it is missing, and the extremes are those of \
                 the part traced",
                at.t,
                at.p / units::PA_PER_BAR
            ));
            "step failed".to_string()
        }
        EnvelopeStop::LeftPhysicalRange(at) => {
            report.warnings.push(format!(
                "the trace stopped at T = {:.3} K, P = {:.1} bar: the branch climbs beyond {} \
                 MPa, where no model here describes a fluid (an artefact of the model, often of \
                 a missing k_ij or a liquid-liquid split); the envelope beyond it is not shown",
                at.t,
                at.p / units::PA_PER_BAR,
                eos::equilibrium::envelope::P_PHYSICAL_MAX / 1e6
            ));
            "left the physical range".to_string()
        }
    };
    if env.critical.is_none() {
        report.warnings.push(
            "the trace did not pass the critical point: no critical point is reported".to_string(),
        );
    }
    Ok(())
}

/// Saturation at T: (P, rho_L, rho_V).
fn saturation_at(m: &dyn Model, helm: Option<&HelmholtzFluid>, t: f64) -> eos::Result<[f64; 3]> {
    match helm {
        Some(h) => h.saturation_t(t).map(|s| [s.p, s.rho_liq, s.rho_vap]),
        None => saturation::pressure(m, t).map(|s| [s.p, s.rho_l(), s.rho_v()]),
    }
}

/// The vapour-pressure curve of a pure fluid.
fn pure_curve(
    built: &BuiltModel,
    m: &dyn Model,
    feed: &Feed,
    with_isotherms: bool,
    report: &mut EnvelopeReport,
) -> Result<(), CliError> {
    let rec = feed.records[0];
    let helm = match built.id.as_str() {
        "reference" => eos::helmholtz::reference_for(&rec.id),
        "sw12" => eos::helmholtz::technical_for(&rec.id),
        _ => None,
    };
    let ctx = format!("model {}: critical point", built.id);
    let (tc, pc, t_low) = match &helm {
        Some(h) => {
            let f = h.formulation();
            (f.tc, f.pc, f.t_triple)
        }
        None => {
            let c = critical_point::pure(m).map_err(|e| from_eos(&ctx, e))?;
            let t_low = rec
                .ttriple_k
                .filter(|&tt| tt < c.t)
                .unwrap_or(TR_START * c.t);
            (c.t, c.p, t_low)
        }
    };
    let from = if helm.is_some() || rec.ttriple_k.is_some_and(|tt| tt < tc) {
        "the triple point"
    } else {
        "T = 0.4 Tc (no triple point on record)"
    };
    report.notes.push(format!(
        "vapour-pressure curve from {from} to the model's critical point"
    ));
    let mm = rec.molar_mass_kg_mol;
    let mut failed = 0;
    let n = CURVE_POINTS;
    for k in 0..n {
        // Denser towards the critical point, where the curve bends most; the last point lies
        // (1/n)^2 of the range below Tc.
        let u = k as f64 / n as f64;
        let t = tc - (tc - t_low) * (1.0 - u).powi(2);
        match saturation_at(m, helm.as_ref(), t) {
            Ok([p, rl, rv]) if p.is_finite() && rl.is_finite() && rv.is_finite() => {
                report.points.push(EnvelopeRow {
                    temperature_k: t,
                    pressure_pa: p,
                    branch: "saturation",
                    liquid_molar_density_mol_m3: rl,
                    vapor_molar_density_mol_m3: rv,
                    liquid_mass_density_kg_m3: rl * mm,
                    vapor_mass_density_kg_m3: rv * mm,
                })
            }
            _ => failed += 1,
        }
    }
    if failed > 0 {
        report.warnings.push(format!(
            "{failed} of {n} points of the curve could not be computed with model {} and are \
             left out",
            built.id
        ));
    }
    report.critical_point = Some(tp(tc, pc));
    report.stop = "critical point".to_string();
    if with_isotherms {
        report.isotherms = isotherms(m, helm.as_ref(), tc, pc, &report.points);
    }
    Ok(())
}

/// The model's stable isotherms for the P-v chart, over the volume range of the dome shown.
fn isotherms(
    m: &dyn Model,
    helm: Option<&HelmholtzFluid>,
    tc: f64,
    pc: f64,
    points: &[EnvelopeRow],
) -> Vec<Isotherm> {
    let (v_lo, v_hi) = pv_range(points, pc);
    let x = [1.0];
    let mut out = Vec::new();
    for tr in ISOTHERMS_TR {
        let t = tr * tc;
        let sat = if tr < 1.0 {
            saturation_at(m, helm, t).ok()
        } else {
            None
        };
        let (mut vs, mut ps) = (Vec::new(), Vec::new());
        for k in 0..ISOTHERM_POINTS {
            let v = v_lo * (v_hi / v_lo).powf(k as f64 / (ISOTHERM_POINTS - 1) as f64);
            let p = match sat {
                Some([ps_, rl, rv]) if v > 1.0 / rl && v < 1.0 / rv => ps_,
                _ => {
                    let rho = 1.0 / v;
                    if rho >= m.max_density(&x) {
                        continue;
                    }
                    rho * R * t * m.residual(t, rho, &x).z()
                }
            };
            if p.is_finite() {
                vs.push(v);
                ps.push(p);
            }
        }
        out.push(Isotherm {
            temperature_k: t,
            molar_volume_m3_mol: vs,
            pressure_pa: ps,
        });
    }
    out
}
