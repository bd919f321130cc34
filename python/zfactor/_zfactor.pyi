"""Type stubs of the compiled part of zfactor (use the functions of ``zfactor`` itself)."""

from typing import Dict, List, Optional, Tuple, Any

import numpy as np
import numpy.typing as npt

__version__: str

def evaluate(
    t: npt.NDArray[np.float64],
    p: npt.NDArray[np.float64],
    model: str,
    fluid: Optional[str] = ...,
    mix: Optional[str] = ...,
    kij: Optional[str] = ...,
    everything: bool = ...,
) -> Dict[str, Any]: ...
def pressure(
    t: npt.NDArray[np.float64],
    rho: npt.NDArray[np.float64],
    model: str,
    fluid: Optional[str] = ...,
    mix: Optional[str] = ...,
    kij: Optional[str] = ...,
) -> Tuple[npt.NDArray[np.float64], List[Optional[str]]]: ...
def z_batch(
    t: npt.NDArray[np.float64],
    p: npt.NDArray[np.float64],
    model: str,
    fluid: Optional[str] = ...,
    mix: Optional[str] = ...,
    kij: Optional[str] = ...,
) -> Optional[Tuple[npt.NDArray[np.float64], List[Tuple[int, str]]]]: ...
def unit_map(quantity: str, unit: str, ambient_pa: float) -> Tuple[float, float]: ...
def ambient_pressure(text: str) -> float: ...
def model_ids() -> List[str]: ...
def call(command: str, options_json: str) -> Tuple[str, int]: ...
def audit(file: str, output: str, options_json: str) -> Tuple[str, int]: ...
