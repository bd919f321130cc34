//! Timing for the speed report (`.ci/speed-report`): Peng-Robinson Z (largest root) over the
//! yardstick's two 1000 x 1000 workloads (shared/bench/yardstick_pr.py: a methane-like pure
//! fluid and a 10-component gas, T 200-400 K outer, P 1-300 bar inner), with
//!
//! - kernel `per-state`: `ZBatch::z_tp`, a(T) recomputed for every state, as the yardstick
//!   does;
//! - kernel `isotherm`: `ZBatch::z_grid`, a(T) once per temperature;
//!
//! each on one core (the plain call, no thread pool) and on all cores (`z_tp_par`,
//! `z_grid_par`, rayon's global pool). Every case is checked against the yardstick's
//! checksum (sum of Z, 1e-9 relative) before anything is timed; each case then has one
//! untimed call (after 50 ms idle, reported as `cold_s`: it includes waking the pool's
//! threads) and its timed runs back to back, of which the median is reported. One line per
//! case, `key=value` separated by spaces:
//!
//! `zfactor build=release workload=pure kernel=per-state threads=1 states=1000000 median_s=...
//! states_per_s=... runs=7 cold_s=... checksum=...` (`--build LABEL` names the build).
//!
//! Run: `cargo run --release -p eos --example speed_report -- [--runs N] [--case W/K/T]
//! [--build LABEL]`;
//! `--case pure/isotherm/1` (workload, kernel, 1 or all threads) times that case alone, for
//! profiling or CPU-time comparisons.

#[path = "../tests/support/yardstick.rs"]
mod yardstick;

use eos::batch::{BatchRoot, ZBatch};
use std::time::Instant;
use yardstick as y;

const N: usize = 1000;

#[derive(Clone, Copy, PartialEq)]
enum Kernel {
    PerState,
    Isotherm,
}

impl Kernel {
    fn name(self) -> &'static str {
        match self {
            Kernel::PerState => "per-state",
            Kernel::Isotherm => "isotherm",
        }
    }
}

struct Case {
    workload: &'static str,
    kernel: Kernel,
    parallel: bool,
    batch: ZBatch,
    want: f64,
    cold: f64,
    times: Vec<f64>,
}

struct Grid {
    t: Vec<f64>,
    p: Vec<f64>,
    t_axis: Vec<f64>,
    p_axis: Vec<f64>,
}

impl Case {
    fn run(&self, g: &Grid, z: &mut [f64]) -> eos::Result<()> {
        let r = BatchRoot::Largest;
        match (self.kernel, self.parallel) {
            (Kernel::PerState, false) => self.batch.z_tp(&g.t, &g.p, r, z),
            (Kernel::PerState, true) => self.batch.z_tp_par(&g.t, &g.p, r, z),
            (Kernel::Isotherm, false) => self.batch.z_grid(&g.t_axis, &g.p_axis, r, z),
            (Kernel::Isotherm, true) => self.batch.z_grid_par(&g.t_axis, &g.p_axis, r, z),
        }
    }
}

fn median(v: &[f64]) -> f64 {
    let mut s = v.to_vec();
    s.sort_by(f64::total_cmp);
    let n = s.len();
    if n % 2 == 1 {
        s[n / 2]
    } else {
        0.5 * (s[n / 2 - 1] + s[n / 2])
    }
}

struct Options {
    runs: usize,
    case: Option<String>,
    build: String,
}

fn parse_options() -> Result<Options, String> {
    let mut o = Options {
        runs: 7,
        case: None,
        build: "release".to_string(),
    };
    let mut args = std::env::args().skip(1);
    while let Some(flag) = args.next() {
        let value = args.next().ok_or_else(|| format!("{flag} needs a value"))?;
        match flag.as_str() {
            "--runs" => {
                o.runs = value
                    .parse::<usize>()
                    .ok()
                    .filter(|n| *n > 0)
                    .ok_or_else(|| format!("--runs takes a positive whole number, got '{value}'"))?
            }
            "--case" => o.case = Some(value),
            "--build" => o.build = value,
            _ => {
                return Err(format!(
                    "usage: speed_report [--runs N] [--case W/K/T] [--build LABEL]; got {flag}"
                ))
            }
        }
    }
    Ok(o)
}

fn main() {
    let (runs, only, build) = match parse_options() {
        Ok(o) => (o.runs, o.case, o.build),
        Err(e) => {
            eprintln!("{e}");
            std::process::exit(2);
        }
    };
    let (t, p) = y::grid(N, N);
    let g = Grid {
        t_axis: t.iter().step_by(N).copied().collect(),
        p_axis: p[..N].to_vec(),
        t,
        p,
    };
    let mut cases = Vec::new();
    for (workload, (m, x), want) in [
        ("pure", y::pure(), y::SUM_PURE),
        ("mix10", y::mix(), y::SUM_MIX_LARGEST),
    ] {
        let batch = ZBatch::new(&m, &x).expect("the yardstick's fluids are valid");
        for kernel in [Kernel::PerState, Kernel::Isotherm] {
            for parallel in [false, true] {
                let name = format!(
                    "{workload}/{}/{}",
                    kernel.name(),
                    if parallel { "all" } else { "1" }
                );
                if only.as_ref().is_some_and(|o| *o != name) {
                    continue;
                }
                cases.push(Case {
                    workload,
                    kernel,
                    parallel,
                    batch: batch.clone(),
                    want,
                    cold: 0.0,
                    times: Vec::with_capacity(runs),
                });
            }
        }
    }
    if cases.is_empty() {
        eprintln!("no case matches; cases are W/K/T with W pure or mix10, K per-state or isotherm, T 1 or all");
        std::process::exit(2);
    }
    let mut z = vec![0.0; g.t.len()];
    // Checksums first (this also starts rayon's thread pool before any timing).
    let mut sums = Vec::with_capacity(cases.len());
    for c in &cases {
        if let Err(e) = c.run(&g, &mut z) {
            eprintln!("{}: {e}", c.workload);
            std::process::exit(1);
        }
        let sum = y::fsum(&z);
        if ((sum - c.want) / c.want).abs() >= 1e-9 {
            eprintln!(
                "{}: checksum {sum} differs from the yardstick's {} by more than 1e-9",
                c.workload, c.want
            );
            std::process::exit(1);
        }
        sums.push(sum);
    }
    // Each case: one untimed call, then its timed runs back to back. The untimed call wakes
    // the thread pool's workers (an idle virtual CPU can take a millisecond or more to
    // resume), so the runs measure steady throughput; one cold call is reported apart.
    for c in &mut cases {
        std::thread::sleep(std::time::Duration::from_millis(50));
        let start = Instant::now();
        let cold = c.run(&g, &mut z);
        c.cold = start.elapsed().as_secs_f64();
        if cold.is_err() {
            std::process::exit(1);
        }
        for _ in 0..runs {
            let start = Instant::now();
            let r = c.run(&g, &mut z);
            let dt = start.elapsed().as_secs_f64();
            if r.is_err() {
                std::process::exit(1);
            }
            c.times.push(dt);
        }
    }
    let all = rayon::current_num_threads();
    for (c, sum) in cases.iter().zip(sums) {
        let med = median(&c.times);
        let kernel = c.kernel.name();
        println!(
            "zfactor build={build} workload={} kernel={kernel} threads={} states={} \
             median_s={med:.6e} states_per_s={:.0} runs={runs} cold_s={:.6e} checksum={sum:.10}",
            c.workload,
            if c.parallel { all } else { 1 },
            g.t.len(),
            g.t.len() as f64 / med,
            c.cold,
        );
    }
}
