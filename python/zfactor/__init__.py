"""zfactor: real-gas properties from equations of state, on NumPy arrays.

The same engine as the ``zfactor`` command line: the fluid is read as ``--fluid`` or
``--mix`` read it, the model built from the same catalogue, and every state goes through the
same path as ``zfactor table``: a mixture is flashed where it may split (a split state gets
no single-phase value), the stable root is computed for what is asked, and a state outside
the model's range or in the solid region is flagged. Values are SI (K, Pa, kg/m3, J/mol,
J/(mol K), m/s, K/Pa) unless a unit is given for the inputs.

Example::

    >>> import numpy as np, zfactor
    >>> t = np.array([273.15, 300.0])
    >>> zfactor.z(t, 50e5, fluid="methane", model="pr")      # doctest: +SKIP
    array([0.8850..., 0.9162...])

Caution: zfactor is a screening and design-support tool; pressure equipment, cylinders and
relief systems must be designed to the applicable local codes and checked by a licensed
engineer.
"""

from __future__ import annotations

import warnings
import json
from typing import Any, Dict, List, Optional

import numpy as np

from . import _zfactor

__all__ = [
    "ZFactorWarning",
    "properties",
    "z",
    "density",
    "frame",
    "pressure",
    "model_ids",
    "report",
    "state",
    "saturation",
    "flash",
    "envelope",
    "compare",
    "audit",
]

__version__ = _zfactor.__version__

# Properties computed only when asked for (the rest come from Z alone).
_CALORIC = ("h", "s", "cp", "cv", "w", "jt", "phi")


class ZFactorWarning(UserWarning):
    """States outside a model's range, in the solid region, or without a single-phase value."""


def model_ids() -> list:
    """The model ids, as ``zfactor models`` lists them."""
    return list(_zfactor.model_ids())


def _flat(a: np.ndarray) -> np.ndarray:
    # One contiguous, aligned float64 block (arrays from a pickle, as Dask workers receive
    # them, can be misaligned).
    return np.require(a, dtype=np.float64, requirements=["C", "A"]).ravel()


def _to_si(values: Any, unit: Optional[str], quantity: str, ambient: str) -> np.ndarray:
    arr = np.asarray(values, dtype=float)
    if unit is None:
        return arr
    a, b = _zfactor.unit_map(quantity, unit, _zfactor.ambient_pressure(ambient))
    return a * arr + b


def properties(
    t: Any,
    p: Any,
    *,
    fluid: Optional[str] = None,
    mix: Optional[str] = None,
    model: str = "pr",
    kij: Optional[str] = None,
    t_unit: Optional[str] = None,
    p_unit: Optional[str] = None,
    ambient: str = "101.325 kPa",
    everything: bool = True,
    warn: bool = True,
) -> Dict[str, Any]:
    """Properties of a fluid at every (T, P), as a dict of arrays of the broadcast shape.

    ``t`` and ``p`` broadcast against each other (NumPy rules); in K and Pa unless
    ``t_unit``/``p_unit`` name a unit the command line accepts ("degC", "degF", "bar", "barg",
    "psig", "MPa", ...; gauge units refer to ``ambient``). Give one of ``fluid`` (a component
    name, alias, formula or CAS number) or ``mix`` ("methane=0.9,ethane=0.1"); ``kij`` sets
    interaction parameters over the built-in ones ("methane-co2=0.1"). ``model`` is one id of
    :func:`model_ids`.

    Keys: ``z``, ``density`` (kg/m3), ``molar_density`` (mol/m3); with ``everything`` also
    ``h``, ``s`` (J/mol, J/(mol K), on the fluid's zero), ``cp``, ``cv``, ``w``, ``jt`` and
    ``phi`` (fugacity coefficients, one column per component); and per state ``phase``
    ("vapor", "liquid", "supercritical", "gas", "two-phase"), ``flag`` (None inside the
    model's range) and ``error`` (why a state has no value: NaN there). The basis is under
    ``model``, ``model_name``, ``citation``, ``fluid``, ``components``, ``notes`` and
    ``caution``. Flagged states and states without a value raise a :class:`ZFactorWarning`
    (one for the call) unless ``warn`` is False.

    A temperature or pressure that is NaN, infinite or not above zero raises ``ValueError``
    naming its index; so do an unknown fluid or model, with the command line's message.

    >>> r = properties(300.0, [1e5, 50e5], fluid="nitrogen", model="pr")   # doctest: +SKIP
    >>> r["z"], r["phase"]                                                  # doctest: +SKIP
    """
    tk = _to_si(t, t_unit, "temperature", ambient)
    pa = _to_si(p, p_unit, "pressure", ambient)
    tk, pa = np.broadcast_arrays(tk, pa)
    shape = tk.shape
    flat_t = _flat(tk)
    flat_p = _flat(pa)
    raw = _zfactor.evaluate(
        flat_t, flat_p, model, fluid=fluid, mix=mix, kij=kij, everything=everything
    )
    out: Dict[str, Any] = {}
    for key in ("z", "density", "molar_density") + (_CALORIC if everything else ()):
        v = raw[key]
        out[key] = v.reshape(shape + v.shape[1:])
    for key in ("phase", "flag", "error"):
        out[key] = np.array(raw[key], dtype=object).reshape(shape)
    for key in ("model", "model_name", "citation", "fluid", "components", "notes", "caution"):
        out[key] = raw[key]
    if warn:
        _warn(raw, flat_t, flat_p)
    return out


def _warn(raw: Dict[str, Any], t: np.ndarray, p: np.ndarray) -> None:
    for key, what in (("flag", "flagged"), ("error", "without a value")):
        marked = [i for i, v in enumerate(raw[key]) if v]
        if marked:
            i = marked[0]
            warnings.warn(
                f"{len(marked)} of {len(t)} states {what} by model {raw['model']}; the first, "
                f"T = {t[i]} K, P = {p[i]} Pa: {raw[key][i]}",
                ZFactorWarning,
                stacklevel=3,
            )


def z(t: Any, p: Any, **kwargs: Any) -> np.ndarray:
    """Compression factor Z at every (T, P); only Z is computed (for a pure fluid with a
    cubic model by the batch kernel, the same Z to round-off).

    Arguments as :func:`properties`. NaN where a state has no single-phase value (a mixture
    that splits), with a :class:`ZFactorWarning`.

    >>> z([250.0, 300.0], 100e5, fluid="methane", model="pr")   # doctest: +SKIP
    """
    fast = _z_batch(t, p, **kwargs)
    if fast is not None:
        return fast
    return properties(t, p, everything=False, **kwargs)["z"]


def _z_batch(
    t: Any,
    p: Any,
    *,
    fluid: Optional[str] = None,
    mix: Optional[str] = None,
    model: str = "pr",
    kij: Optional[str] = None,
    t_unit: Optional[str] = None,
    p_unit: Optional[str] = None,
    ambient: str = "101.325 kPa",
    warn: bool = True,
) -> Optional[np.ndarray]:
    # A pure fluid with a member of the cubic family: the batch kernel (eight states at a
    # time; Z equal to the per-state path to round-off), with the same range flags.
    tk = _to_si(t, t_unit, "temperature", ambient)
    pa = _to_si(p, p_unit, "pressure", ambient)
    tk, pa = np.broadcast_arrays(tk, pa)
    found = _zfactor.z_batch(_flat(tk), _flat(pa), model, fluid=fluid, mix=mix, kij=kij)
    if found is None:
        return None
    z_values, flagged = found
    if warn and flagged:
        i, flag = flagged[0]
        ft, fp = _flat(tk), _flat(pa)
        warnings.warn(
            f"{len(flagged)} of {ft.size} states flagged by model {model}; the first, "
            f"T = {ft[i]} K, P = {fp[i]} Pa: {flag}",
            ZFactorWarning,
            stacklevel=3,
        )
    return z_values.reshape(tk.shape)


def density(t: Any, p: Any, **kwargs: Any) -> np.ndarray:
    """Mass density (kg/m3) at every (T, P); arguments as :func:`properties`."""
    return properties(t, p, everything=False, **kwargs)["density"]


def pressure(
    t: Any,
    molar_density: Any,
    *,
    fluid: Optional[str] = None,
    mix: Optional[str] = None,
    model: str = "pr",
    kij: Optional[str] = None,
    warn: bool = True,
) -> np.ndarray:
    """Pressure (Pa) at every (T in K, molar density in mol/m3), broadcast; NaN where the
    model has no single-phase state there (inside the two-phase region), with a
    :class:`ZFactorWarning`. The inverse of :func:`properties`' ``molar_density``.

    >>> rho = properties(300.0, 50e5, fluid="methane", model="pr")["molar_density"]  # doctest: +SKIP
    >>> pressure(300.0, rho, fluid="methane", model="pr")                            # doctest: +SKIP
    """
    tk, rho = np.broadcast_arrays(np.asarray(t, dtype=float), np.asarray(molar_density, dtype=float))
    shape = tk.shape
    p, errors = _zfactor.pressure(
        _flat(tk),
        _flat(rho),
        model,
        fluid=fluid,
        mix=mix,
        kij=kij,
    )
    missing = [i for i, e in enumerate(errors) if e]
    if warn and missing:
        warnings.warn(
            f"{len(missing)} of {len(errors)} states without a value: {errors[missing[0]]}",
            ZFactorWarning,
            stacklevel=2,
        )
    return p.reshape(shape)


def frame(t: Any, p: Any, **kwargs: Any):
    """The properties of :func:`properties` as a pandas DataFrame (one row per state, T and P
    in K and Pa first), with the basis (model, citation, fluid, notes, caution) in
    ``DataFrame.attrs``. Needs pandas (``pip install pandas``)."""
    import pandas as pd

    r = properties(t, p, **kwargs)
    tk = _to_si(t, kwargs.get("t_unit"), "temperature", kwargs.get("ambient", "101.325 kPa"))
    pa = _to_si(p, kwargs.get("p_unit"), "pressure", kwargs.get("ambient", "101.325 kPa"))
    tk, pa = np.broadcast_arrays(tk, pa)
    cols: Dict[str, Any] = {"T": tk.ravel(), "P": pa.ravel()}
    for key in ("z", "density", "molar_density") + _CALORIC:
        if key not in r:
            continue
        v = r[key]
        if key == "phi":
            flat = v.reshape(-1, v.shape[-1])
            for j, comp in enumerate(r["components"]):
                cols[f"phi_{comp}"] = flat[:, j]
        else:
            cols[key] = v.ravel()
    for key in ("phase", "flag", "error"):
        cols[key] = r[key].ravel()
    df = pd.DataFrame(cols)
    for key in ("model", "model_name", "citation", "fluid", "components", "notes", "caution"):
        df.attrs[key] = r[key]
    return df


# --- the commands, as frames -------------------------------------------------------------


def report(command: str, **options: Any) -> Dict[str, Any]:
    """The JSON report of a command of the command line (``state``, ``saturation``,
    ``flash``, ``envelope``, ``compare``, ``table``) as a dict, for the options given as
    keyword arguments named like the command's long options (``_`` for ``-``; a flag is
    ``True``): the same validation, units, messages and warnings as the command line, whose
    ``--format json`` output this is. Its warnings are also issued as
    :class:`ZFactorWarning`. Options that name files are not taken.

    >>> r = zfactor.report("state", fluid="methane", temperature="25 degC",
    ...                    pressure="70 barg", model="pr,srk")          # doctest: +SKIP
    >>> [x["z"] for x in r["results"]]                                  # doctest: +SKIP
    [0.886..., 0.905...]

    Refused input raises ``ValueError`` and a failed computation ``RuntimeError``, with the
    command line's message.
    """
    opts = {k.replace("_", "-"): v for k, v in options.items() if v is not None}
    text, _exit = _zfactor.call(command, json.dumps(opts))
    rep = json.loads(text)
    for w in rep.get("warnings", []):
        warnings.warn(w, ZFactorWarning, stacklevel=3)
    return rep


def _table(rows: List[Dict[str, Any]], rep: Dict[str, Any], rows_key: str):
    """A pandas DataFrame of ``rows`` with the rest of the report (the basis: models,
    citations, k_ij notes, warnings, caution) in ``attrs``; without pandas, a dict of
    columns (NumPy arrays where numeric) with the basis under ``"attrs"``."""
    basis = {k: v for k, v in rep.items() if k != rows_key}
    try:
        import pandas as pd
    except ImportError:
        keys: List[str] = []
        for r in rows:
            keys.extend(k for k in r if k not in keys)
        cols: Dict[str, Any] = {}
        for k in keys:
            col = [r.get(k) for r in rows]
            numeric = all(isinstance(v, (int, float)) or v is None for v in col)
            cols[k] = np.array([np.nan if v is None else v for v in col]) if numeric else col
        cols["attrs"] = basis
        return cols
    df = pd.DataFrame(rows)
    df.attrs.update(basis)
    return df


def state(**options: Any):
    """One state of a fluid or mixture for one model or several (``zfactor state``): one
    row per model (Z, densities, h, s, cp, cv, speed of sound, phase, a split's phases and
    vapour fraction, warnings), the basis in ``attrs``. Options as :func:`report`.

    >>> df = zfactor.state(mix="methane=0.9,ethane=0.1", temperature="15 degC",
    ...                    pressure="70 barg", model="pr,srk,lk")       # doctest: +SKIP
    >>> df[["model", "z", "mass_density_kg_m3", "phase"]]               # doctest: +SKIP
    """
    rep = report("state", **options)
    return _table(rep["results"], rep, "results")


def saturation(**options: Any):
    """The saturation state of a pure fluid at a temperature or a pressure
    (``zfactor saturation``): one row per model. Options as :func:`report`."""
    rep = report("saturation", **options)
    return _table(rep["results"], rep, "results")


def flash(**options: Any):
    """A mixture's phase equilibrium (``zfactor flash``): at (T, P), (P, h) or (P, s), or
    its bubble or dew points (``dew_pressure=True`` and the like; both branches of a
    retrograde curve, labelled by ``branch``): one row per model and point. Options as
    :func:`report`."""
    rep = report("flash", **options)
    return _table(rep["results"], rep, "results")


def envelope(**options: Any):
    """The phase envelope of a mixture, or the vapour-pressure curve of a pure fluid
    (``zfactor envelope``): one row per point (T, P, branch, densities); the critical point,
    cricondenbar and cricondentherm in ``attrs``. Options as :func:`report`."""
    rep = report("envelope", **options)
    return _table(rep["points"], rep, "points")


def compare(**options: Any):
    """Models against a reference over a grid or list of states (``zfactor compare``, at
    most 10,000 states a call): one row per state and model (T, P, phase, the reference's Z
    and density, the model's Z, density and deviation); the statistics per model, the advice
    and the ideal-gas map in ``attrs``. Options as :func:`report`.

    >>> df = zfactor.compare(fluid="nitrogen", temperatures="150..300 K n 4",
    ...                      pressures="1..300 bar n 5", model="pr,srk")  # doctest: +SKIP
    >>> df.groupby("model")["deviation_pct"].abs().max()               # doctest: +SKIP
    """
    rep = report("compare", **options)
    rows = []
    for p in rep["points"]:
        base = {k: v for k, v in p.items() if k != "values"}
        for v in p["values"]:
            rows.append({**base, **v})
    return _table(rows, rep, "points")


def audit(data: Any, **options: Any):
    """Audit a sheet of gas calculations (``zfactor audit``): every row recomputed, flagged
    where it departs from the recomputation by more than the tolerance, with the likely
    cause named. ``data`` is a pandas DataFrame (its columns headed as the command line
    reads them, units in brackets: ``T [degC]``, ``P [barg]``, ``density [kg/m3]``, and a
    ``fluid`` column) or the path of a CSV or .xlsx file; the options are the audit's
    (``model``, ``tolerance``, ``quantity``, ``columns``, ``sheet``, ``base``, ``ambient``).

    Returns the annotated copy as a DataFrame (the sheet's columns, then ``zfactor_model``,
    ``zfactor_value``, ``ideal_gas_value``, ``deviation_pct``, ``status``,
    ``reconciling_causes``, ``message``) with the audit's summary in ``attrs``; the files
    it works on are temporary.

    >>> sheet = pd.DataFrame({"fluid": ["methane"], "T [degC]": [15], "P [barg]": [70],
    ...                       "density [kg/m3]": [55.0]})                 # doctest: +SKIP
    >>> zfactor.audit(sheet, tolerance="1%")[["status", "deviation_pct"]]  # doctest: +SKIP
    """
    import os
    import tempfile

    import pandas as pd

    opts = {k.replace("_", "-"): v for k, v in options.items() if v is not None}
    with tempfile.TemporaryDirectory() as tmp:
        if isinstance(data, pd.DataFrame):
            path = os.path.join(tmp, "sheet.csv")
            data.to_csv(path, index=False)
        else:
            path = os.fspath(data)
        out = os.path.join(tmp, "annotated.csv")
        text, _exit = _zfactor.audit(path, out, json.dumps(opts))
        summary = json.loads(text)
        annotated = pd.read_csv(out)
    for w in summary.get("warnings", []):
        warnings.warn(w, ZFactorWarning, stacklevel=2)
    annotated.attrs.update(summary)
    return annotated
