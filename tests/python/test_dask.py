"""Scale-out: a Dask data frame of logged (T, P) rows through map_partitions on a local
two-worker cluster (loopback only) gives exactly the single-process result.

The rows are a demo scenario of our own: two years of 30-second readings of the fuel-gas
meter at a fictional compressor station, temperature logged to 0.1 K and pressure to 1 kPa.
"""

import time

import numpy as np
import pytest

import zfactor

dd = pytest.importorskip("dask.dataframe")
distributed = pytest.importorskip("distributed")
pd = pytest.importorskip("pandas")

GAS = "methane=0.9,ethane=0.05,propane=0.02,nitrogen=0.02,co2=0.01"
ROWS = 2_000_000


def logged_rows() -> "pd.DataFrame":
    rng = np.random.default_rng(20261205)
    t = np.round(rng.uniform(278.15, 318.15, ROWS), 1)
    p = np.round(rng.uniform(30e5, 80e5, ROWS), -3)
    return pd.DataFrame({"T": t, "P": p})


def z_of(part: "pd.DataFrame") -> "pd.Series":
    return pd.Series(
        zfactor.z(part["T"].to_numpy(), part["P"].to_numpy(), mix=GAS, model="pr"),
        index=part.index,
        name="z",
    )


def test_a_dask_frame_on_a_local_cluster_equals_the_single_process_call():
    frame = logged_rows()
    single = zfactor.z(frame["T"].to_numpy(), frame["P"].to_numpy(), mix=GAS, model="pr")
    assert np.isfinite(single).all()
    started = time.monotonic()
    with distributed.LocalCluster(
        n_workers=2,
        threads_per_worker=1,
        processes=True,
        host="127.0.0.1",
        dashboard_address=None,
    ) as cluster, distributed.Client(cluster) as client:
        assert client.scheduler_info()["address"].startswith("tcp://127.0.0.1")
        ddf = dd.from_pandas(frame, npartitions=8)
        z = ddf.map_partitions(z_of, meta=("z", "f8")).compute()
    elapsed = time.monotonic() - started
    np.testing.assert_array_equal(z.to_numpy(), single)
    # The target: under 60 s on the 2-core machine.
    assert elapsed < 60.0, elapsed
