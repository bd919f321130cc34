"""Shared helpers of the Python tests: where the reference data and the command line are."""

import os
import pathlib

import pytest

ROOT = pathlib.Path(__file__).resolve().parents[2]
SHARED = ROOT.parent / "shared"


@pytest.fixture(scope="session")
def cli() -> pathlib.Path:
    """The zfactor binary built by `cargo test` or `cargo build` (ZFACTOR_BIN overrides)."""
    candidates = [os.environ.get("ZFACTOR_BIN")] + [
        str(ROOT / "target" / kind / "zfactor") for kind in ("release", "debug")
    ]
    for c in candidates:
        if c and pathlib.Path(c).is_file():
            return pathlib.Path(c)
    pytest.fail("no zfactor binary: run `cargo build` first or set ZFACTOR_BIN")


@pytest.fixture(scope="session")
def shared() -> pathlib.Path:
    """The shared reference data beside the repository."""
    if not SHARED.is_dir():
        pytest.fail(f"the shared reference data are not at {SHARED}")
    return SHARED
