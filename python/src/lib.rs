//! The Python binding: a thin layer over the command-line tool's library calls. The fluid is
//! read by the same reader as `--fluid`/`--mix` (with `--kij`), the model built by the same
//! catalogue, and every state goes through the same per-state path as `zfactor table`
//! (`zfactor::state_arrays`): a mixture is flashed where the phase screen says so, the stable
//! root is computed for what is asked, and states outside the model's range are flagged. The
//! work runs on all cores with the interpreter released. Errors are `ValueError`s with the
//! command line's messages.

use eos::state::RootChoice;
use numpy::{PyArray1, PyArrayMethods, PyReadonlyArray1};
use pyo3::exceptions::PyValueError;
use pyo3::prelude::*;
use pyo3::types::PyDict;
use rayon::prelude::*;
use zfactor::cli::{Basis, FluidArgs};
use zfactor::error::CliError;
use zfactor::feed::Feed;
use zfactor::models::BuiltModel;
use zfactor::state_arrays::StatePlan;

fn value_error(e: CliError) -> PyErr {
    PyValueError::new_err(e.to_string())
}

/// The fluid options as the command line takes them.
fn fluid_args(fluid: Option<&str>, mix: Option<&str>, kij: Option<&str>) -> FluidArgs {
    FluidArgs {
        fluid: fluid.map(str::to_string),
        mix: mix.map(str::to_string),
        mix_file: None,
        basis: Basis::Mole,
        normalize: false,
        kij: kij.map(str::to_string),
        kij_file: None,
    }
}

/// The fluid and the one model, as the command line reads and builds them.
fn fluid_and_model(
    model: &str,
    fluid: Option<&str>,
    mix: Option<&str>,
    kij: Option<&str>,
) -> PyResult<(Feed, BuiltModel)> {
    let feed = zfactor::feed_input::read(&fluid_args(fluid, mix, kij)).map_err(value_error)?;
    let ids = zfactor::models::resolve_ids(model, &feed).map_err(value_error)?;
    if ids.len() != 1 || model.trim().eq_ignore_ascii_case("all") {
        return Err(PyValueError::new_err(format!(
            "model \"{model}\": give one model id ({})",
            zfactor::models::ALL_IDS.join(", ")
        )));
    }
    let built = zfactor::models::build(&ids[0], &feed).map_err(value_error)?;
    Ok((feed, built))
}

/// Rejects a value that is not a finite number above zero, naming its index.
fn check_positive(what: &str, unit: &str, v: &[f64]) -> PyResult<()> {
    match first_bad(v) {
        Some(i) => Err(PyValueError::new_err(format!(
            "{what} at index {i} is {}: give finite values above zero, in {unit}",
            v[i]
        ))),
        None => Ok(()),
    }
}

/// The index of the first value that is not a finite number above zero.
fn first_bad(v: &[f64]) -> Option<usize> {
    v.iter().position(|x| !(x.is_finite() && *x > 0.0))
}

/// Every state (t[i], p[i]) (K, Pa) of the fluid with one model: a dict of arrays (SI,
/// molar), the phase, flag and error of each state as lists. `everything` asks for the
/// caloric properties and fugacity coefficients as well as Z and density.
#[pyfunction]
#[pyo3(signature = (t, p, model, fluid=None, mix=None, kij=None, everything=false))]
#[allow(clippy::too_many_arguments)]
fn evaluate<'py>(
    py: Python<'py>,
    t: PyReadonlyArray1<'py, f64>,
    p: PyReadonlyArray1<'py, f64>,
    model: &str,
    fluid: Option<&str>,
    mix: Option<&str>,
    kij: Option<&str>,
    everything: bool,
) -> PyResult<Bound<'py, PyDict>> {
    let (t, p) = (t.as_slice()?, p.as_slice()?);
    if t.len() != p.len() {
        return Err(PyValueError::new_err(format!(
            "{} temperatures and {} pressures: give arrays of one shape (or that broadcast)",
            t.len(),
            p.len()
        )));
    }
    check_positive("temperature", "K", t)?;
    check_positive("pressure", "Pa", p)?;
    let (feed, built) = fluid_and_model(model, fluid, mix, kij)?;
    let need = if everything {
        eos::need::Need::All
    } else {
        eos::need::Need::Volumetric
    };
    let p_low = p.iter().copied().fold(f64::INFINITY, f64::min);
    let (t, p) = (t.to_vec(), p.to_vec());
    let outcomes = py.detach(|| {
        let plan = StatePlan::new(&built, &feed, &t, t.len(), p_low, need);
        plan.all(&built, &feed, &t, &p)
    });
    let n = outcomes.len();
    let comps = feed.records.len();
    let col = |f: &dyn Fn(&eos::properties::Properties) -> Option<f64>| -> Vec<f64> {
        outcomes
            .iter()
            .map(|o| o.props.as_ref().and_then(f).unwrap_or(f64::NAN))
            .collect()
    };
    let out = PyDict::new(py);
    out.set_item("z", PyArray1::from_vec(py, col(&|s| Some(s.z))))?;
    out.set_item(
        "molar_density",
        PyArray1::from_vec(py, col(&|s| Some(s.rho))),
    )?;
    out.set_item(
        "density",
        PyArray1::from_vec(py, col(&|s| Some(s.mass_density()))),
    )?;
    if everything {
        out.set_item("h", PyArray1::from_vec(py, col(&|s| Some(s.h))))?;
        out.set_item("s", PyArray1::from_vec(py, col(&|s| Some(s.s))))?;
        out.set_item("cp", PyArray1::from_vec(py, col(&|s| s.cp)))?;
        out.set_item("cv", PyArray1::from_vec(py, col(&|s| Some(s.cv))))?;
        out.set_item("w", PyArray1::from_vec(py, col(&|s| s.w)))?;
        out.set_item("jt", PyArray1::from_vec(py, col(&|s| s.jt)))?;
        let mut ln_phi = vec![f64::NAN; n * comps];
        for (i, o) in outcomes.iter().enumerate() {
            if let Some(s) = o.props.as_ref().filter(|s| s.ln_phi.len() == comps) {
                ln_phi[i * comps..(i + 1) * comps].copy_from_slice(&s.ln_phi);
            }
        }
        let phi: Vec<f64> = ln_phi.iter().map(|v| v.exp()).collect();
        let phi = PyArray1::from_vec(py, phi).reshape([n, comps])?;
        out.set_item("phi", phi)?;
    }
    let phase: Vec<&str> = outcomes.iter().map(|o| o.phase.unwrap_or("")).collect();
    out.set_item("phase", phase)?;
    let flag: Vec<Option<String>> = outcomes.iter().map(|o| o.flag.clone()).collect();
    out.set_item("flag", flag)?;
    let error: Vec<Option<String>> = outcomes.iter().map(|o| o.error.clone()).collect();
    out.set_item("error", error)?;
    out.set_item("model", built.id.clone())?;
    out.set_item("model_name", built.name.clone())?;
    out.set_item("citation", built.citation.clone())?;
    out.set_item("fluid", feed.label())?;
    let ids: Vec<String> = feed.records.iter().map(|r| r.id.clone()).collect();
    out.set_item("components", ids)?;
    out.set_item("notes", built.notes.clone())?;
    out.set_item("caution", zfactor::CAUTION)?;
    Ok(out)
}

/// Z and flags of a pure fluid from the batch kernel of the cubic family (as `zfactor table`
/// takes it for a Z-only table of a pure fluid: the root of lowest Gibbs energy is the stable
/// phase), or `None` where that kernel does not serve the model or the fluid is a mixture
/// (which is flashed state by state through [`evaluate`]).
#[pyfunction]
#[pyo3(signature = (t, p, model, fluid=None, mix=None, kij=None))]
fn z_batch<'py>(
    py: Python<'py>,
    t: PyReadonlyArray1<'py, f64>,
    p: PyReadonlyArray1<'py, f64>,
    model: &str,
    fluid: Option<&str>,
    mix: Option<&str>,
    kij: Option<&str>,
) -> PyResult<Option<ZAndFlags<'py>>> {
    let (t, p) = (t.as_slice()?, p.as_slice()?);
    if t.len() != p.len() {
        return Ok(None);
    }
    let (feed, built) = fluid_and_model(model, fluid, mix, kij)?;
    if !feed.is_pure() {
        return Ok(None);
    }
    let Some(batch) = zfactor::zgrid::batch_model(&built.id, &feed) else {
        return Ok(None);
    };
    // The output is allocated by NumPy, which asks the kernel for huge pages for large arrays
    // (a million states then cost a few page faults rather than thousands).
    let out = PyArray1::<f64>::zeros(py, t.len(), false);
    // SAFETY: the array was created just above and no Python code holds a reference to it
    // until this function returns, so nothing else reads or writes it while the GIL is
    // released; it is a contiguous, one-dimensional float64 array.
    #[allow(unsafe_code)]
    let z = unsafe { out.as_slice_mut()? };
    let found = INPUTS.with_borrow_mut(|(tv, pv)| {
        // Copies, so that no Python thread can change the input while the GIL is released,
        // into buffers this thread keeps for its next call.
        tv.clear();
        tv.extend_from_slice(t);
        pv.clear();
        pv.extend_from_slice(p);
        let found = py.detach(|| {
            batch
                .z_tp_par(tv, pv, eos::batch::BatchRoot::LowestGibbs, z)
                .map(|()| {
                    // Only the flagged states, as (index, flag): a list of a million Nones
                    // would cost the caller more than the kernel.
                    zfactor::range::StateCheck::new(&built, &feed).flags(tv, pv, z)
                })
        });
        if tv.capacity() > INPUTS_KEPT {
            *tv = Vec::new();
            *pv = Vec::new();
        }
        found
    });
    match found {
        Ok(flags) => Ok(Some((out, flags))),
        Err(e) => {
            // The kernel screens every state as it goes; name the first bad one as
            // `evaluate` does.
            check_positive("temperature", "K", t)?;
            check_positive("pressure", "Pa", p)?;
            Err(value_error(zfactor::error::from_eos(
                &format!("model {}", built.id),
                e,
            )))
        }
    }
}

/// The most states whose input copies a thread keeps between calls of [`z_batch`] (16 bytes
/// a state: 64 MB at most).
const INPUTS_KEPT: usize = 4 << 20;

thread_local! {
    /// The copies of the temperatures and pressures of [`z_batch`], kept between calls on
    /// the same thread so that a repeated large call does not pay for fresh pages each time.
    static INPUTS: std::cell::RefCell<(Vec<f64>, Vec<f64>)> =
        const { std::cell::RefCell::new((Vec::new(), Vec::new())) };
}

/// Z of every state, and the flagged states as (index, flag).
type ZAndFlags<'py> = (Bound<'py, PyArray1<f64>>, Vec<(usize, String)>);

/// Pressures (Pa) and, per state, why there is none.
type PressuresAndErrors<'py> = (Bound<'py, PyArray1<f64>>, Vec<Option<String>>);

/// The pressure (Pa) of the model at every (t[i], rho[i]) (K, mol/m3); NaN where the
/// model has no single-phase state there, with the reason in the second list.
#[pyfunction]
#[pyo3(signature = (t, rho, model, fluid=None, mix=None, kij=None))]
fn pressure<'py>(
    py: Python<'py>,
    t: PyReadonlyArray1<'py, f64>,
    rho: PyReadonlyArray1<'py, f64>,
    model: &str,
    fluid: Option<&str>,
    mix: Option<&str>,
    kij: Option<&str>,
) -> PyResult<PressuresAndErrors<'py>> {
    let (t, rho) = (t.as_slice()?.to_vec(), rho.as_slice()?.to_vec());
    if t.len() != rho.len() {
        return Err(PyValueError::new_err(
            "give temperatures and densities of one shape (or that broadcast)",
        ));
    }
    check_positive("temperature", "K", &t)?;
    check_positive("molar density", "mol/m3", &rho)?;
    let (feed, built) = fluid_and_model(model, fluid, mix, kij)?;
    let results: Vec<Result<f64, String>> = py.detach(|| {
        t.par_iter()
            .zip(rho.par_iter())
            .map(|(&t, &r)| {
                built
                    .at_trho(t, r, &feed.mole, RootChoice::LowestGibbs)
                    .map(|s| s.props.p)
                    .map_err(|e| format!("model {}: {e}", built.id))
            })
            .collect()
    });
    let p: Vec<f64> = results
        .iter()
        .map(|r| *r.as_ref().unwrap_or(&f64::NAN))
        .collect();
    let errors = results.into_iter().map(|r| r.err()).collect();
    Ok((PyArray1::from_vec(py, p), errors))
}

/// The affine map (a, b) that takes values in `unit` to SI (K or absolute Pa): si = a v + b,
/// found by the command line's own parser (so "degC", "barg", "psig" mean what they mean
/// there; gauge pressures refer to `ambient_pa`).
#[pyfunction]
fn unit_map(quantity: &str, unit: &str, ambient_pa: f64) -> PyResult<(f64, f64)> {
    let read = |v: f64| -> Result<f64, CliError> {
        let text = format!("{v} {unit}");
        match quantity {
            "temperature" => Ok(zfactor::units::temperature(&text)?),
            "pressure" => Ok(zfactor::units::pressure_reading(&text, ambient_pa)?.0),
            _ => Err(CliError::BadInput(format!(
                "unknown quantity \"{quantity}\": temperature or pressure"
            ))),
        }
    };
    let (one, two) = (
        read(1.0).map_err(value_error)?,
        read(2.0).map_err(value_error)?,
    );
    Ok((two - one, 2.0 * one - two))
}

/// The ambient pressure (Pa) of a text such as "101.325 kPa", by the command line's parser.
#[pyfunction]
fn ambient_pressure(text: &str) -> PyResult<f64> {
    zfactor::units::ambient_pressure(text).map_err(|e| value_error(e.into()))
}

/// The model ids, as `zfactor models` lists them.
/// Runs a command (state, saturation, flash, envelope, compare, table) from a JSON object of
/// its long options, as the web API does (`zfactor::json_call`): the command line's JSON
/// report and exit code (0, or 3 with warnings). Refused input is a `ValueError`, a failed
/// computation a `RuntimeError`, each with the command line's message.
#[pyfunction]
fn call(py: Python<'_>, command: &str, options_json: &str) -> PyResult<(String, u8)> {
    let (command, body) = (command.to_string(), options_json.as_bytes().to_vec());
    let out = py.detach(move || zfactor::json_call::call(&command, &body));
    match out {
        Ok(a) => Ok((a.json, a.exit as u8)),
        Err(f) if f.exit == zfactor::exit::Exit::BadInput => Err(PyValueError::new_err(f.message)),
        Err(f) => Err(pyo3::exceptions::PyRuntimeError::new_err(f.message)),
    }
}

/// Audits the sheet at `file` with the options of `options_json` and writes the annotated
/// copy to `output` (`zfactor::json_call::audit`): the audit's JSON summary and exit code.
#[pyfunction]
fn audit(py: Python<'_>, file: &str, output: &str, options_json: &str) -> PyResult<(String, u8)> {
    let (file, output, body) = (
        std::path::PathBuf::from(file),
        std::path::PathBuf::from(output),
        options_json.as_bytes().to_vec(),
    );
    let out = py.detach(move || zfactor::json_call::audit(&file, &output, &body));
    match out {
        Ok(a) => Ok((a.json, a.exit as u8)),
        Err(f) if f.exit == zfactor::exit::Exit::BadInput => Err(PyValueError::new_err(f.message)),
        Err(f) => Err(pyo3::exceptions::PyRuntimeError::new_err(f.message)),
    }
}

#[pyfunction]
fn model_ids() -> Vec<&'static str> {
    zfactor::models::ALL_IDS.to_vec()
}

#[pymodule]
fn _zfactor(m: &Bound<'_, PyModule>) -> PyResult<()> {
    m.add_function(wrap_pyfunction!(evaluate, m)?)?;
    m.add_function(wrap_pyfunction!(pressure, m)?)?;
    m.add_function(wrap_pyfunction!(z_batch, m)?)?;
    m.add_function(wrap_pyfunction!(unit_map, m)?)?;
    m.add_function(wrap_pyfunction!(ambient_pressure, m)?)?;
    m.add_function(wrap_pyfunction!(model_ids, m)?)?;
    m.add_function(wrap_pyfunction!(call, m)?)?;
    m.add_function(wrap_pyfunction!(audit, m)?)?;
    m.add("__version__", env!("CARGO_PKG_VERSION"))?;
    Ok(())
}
