//! Which vector instructions the processor running the program has, found once at run time,
//! so that the batch kernels ([`crate::batch`]) run with the widest vectors available while
//! the binary itself is built for any x86-64 processor (a plain `cargo build --release`).
//!
//! The kernels are the same Rust code compiled three times (baseline, AVX2, AVX-512); only
//! the vector width differs, never the arithmetic: every operation is the same IEEE-754
//! operation in the same order (no fused multiply-add, which the compiler does not form
//! without being asked), so the results are bit for bit the same at every level; a test
//! checks it on the machine that runs it.

use std::sync::OnceLock;

/// The instruction-set level a kernel is run at.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord)]
pub enum Level {
    /// The x86-64 baseline (SSE2), or any other architecture.
    Base,
    /// x86-64-v3: AVX2 (256-bit vectors) with FMA, BMI1/2, LZCNT, POPCNT, MOVBE.
    Avx2,
    /// x86-64-v4: v3 and AVX-512 F, DQ, CD, BW, VL (512-bit vectors).
    Avx512,
}

/// The widest level this processor runs.
pub fn level() -> Level {
    static LEVEL: OnceLock<Level> = OnceLock::new();
    *LEVEL.get_or_init(detect)
}

#[cfg(target_arch = "x86_64")]
fn detect() -> Level {
    use std::arch::is_x86_feature_detected as has;
    // The x86-64-v3 and v4 feature sets (the levels of the x86-64 psABI).
    let v3 = has!("avx2")
        && has!("fma")
        && has!("bmi1")
        && has!("bmi2")
        && has!("lzcnt")
        && has!("popcnt")
        && has!("movbe");
    let v4 = v3
        && has!("avx512f")
        && has!("avx512dq")
        && has!("avx512cd")
        && has!("avx512bw")
        && has!("avx512vl");
    if v4 {
        Level::Avx512
    } else if v3 {
        Level::Avx2
    } else {
        Level::Base
    }
}

#[cfg(not(target_arch = "x86_64"))]
fn detect() -> Level {
    Level::Base
}

/// Every level this processor runs, lowest first (for tests that compare them).
pub fn available() -> Vec<Level> {
    [Level::Base, Level::Avx2, Level::Avx512]
        .into_iter()
        .filter(|l| *l <= level())
        .collect()
}
