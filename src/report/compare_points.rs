//! The points of a comparison (every model's value at one state), kept so that memory does
//! not grow with the grid.
//!
//! A comparison over millions of states has millions of points, each with every model's
//! values: far more than memory should hold. The store keeps what the chosen output needs:
//! - the terminal table prints a few points, so only those are held;
//! - JSON and CSV print every point, so past a chunk the points are written, already encoded
//!   in the output's format, to an unnamed temporary file (deleted by the system when it is
//!   closed, even after a crash), and copied to the output once the report is complete.
//!   Nothing reaches stdout before the whole comparison has succeeded;
//! - charts draw from every point, so they hold them all (charts are the one exception to
//!   the bounded memory, and say so in the README).

use serde::ser::{Error as _, SerializeSeq};
use serde::{Serialize, Serializer};
use std::fs::File;
use std::io::{BufRead, BufReader, BufWriter, Seek, SeekFrom, Write};

/// One model at one point.
#[derive(Debug, Clone, Serialize)]
pub struct PointValue {
    pub model: String,
    pub z: Option<f64>,
    pub molar_density_mol_m3: Option<f64>,
    pub mass_density_kg_m3: Option<f64>,
    /// Density deviation from the reference, percent.
    pub deviation_pct: Option<f64>,
    /// Why the model has no value here.
    pub error: Option<String>,
    /// "outside range", "solid", "solid may form" where the state is so for this model.
    pub flag: Option<String>,
}

/// One point.
#[derive(Debug, Clone, Serialize)]
pub struct PointReport {
    pub temperature_k: f64,
    pub pressure_pa: f64,
    /// Region: gas, liquid, supercritical, near-critical or two-phase (excluded).
    pub phase: &'static str,
    /// Line of the states or reference file.
    pub line: Option<usize>,
    /// Source of the reference value.
    pub source: Option<String>,
    pub reference_z: Option<f64>,
    pub reference_density_kg_m3: Option<f64>,
    /// Where the reference model itself is outside its range or in the solid region: the
    /// deviations at this point are measured against an extrapolation.
    pub reference_flag: Option<String>,
    /// Every model's value and deviation.
    pub values: Vec<PointValue>,
    /// Spread of the real-gas models' densities, percent of their mean.
    pub spread_pct: Option<f64>,
}

/// How spilled points are encoded: one point per line.
#[derive(Clone, Copy)]
pub enum Encoding {
    /// One compact JSON object per line.
    Json,
    /// One CSV record per line, from the cells the given function makes.
    Csv(fn(&PointReport) -> Vec<String>),
}

/// What the store keeps.
#[derive(Clone, Copy)]
pub enum Policy {
    /// Every point, in memory.
    HoldAll,
    /// The points while there are at most this many; past that, only the count.
    HoldUpTo(usize),
    /// In memory up to `after` points, then every point encoded into a temporary file.
    Spill { after: usize, encoding: Encoding },
}

/// The points of a comparison (see the module documentation).
pub struct PointStore {
    policy: Policy,
    held: Vec<PointReport>,
    count: usize,
    spill: Option<Spill>,
}

/// The temporary file and its writer.
enum Spill {
    Json(BufWriter<File>),
    Csv(Box<csv::Writer<File>>, fn(&PointReport) -> Vec<String>),
}

impl Spill {
    fn create(encoding: Encoding) -> Result<Self, String> {
        let file = tempfile::tempfile().map_err(io_error)?;
        Ok(match encoding {
            Encoding::Json => Spill::Json(BufWriter::with_capacity(1 << 20, file)),
            Encoding::Csv(cells) => Spill::Csv(
                Box::new(
                    csv::WriterBuilder::new()
                        .buffer_capacity(1 << 20)
                        .from_writer(file),
                ),
                cells,
            ),
        })
    }

    fn write(&mut self, p: &PointReport) -> Result<(), String> {
        match self {
            Spill::Json(w) => {
                serde_json::to_writer(&mut *w, p).map_err(io_error)?;
                w.write_all(b"\n").map_err(io_error)
            }
            Spill::Csv(w, cells) => w.write_record(cells(p)).map_err(io_error),
        }
    }

    fn flush(&mut self) -> Result<(), String> {
        match self {
            Spill::Json(w) => w.flush(),
            Spill::Csv(w, _) => w.flush(),
        }
        .map_err(io_error)
    }

    /// The file, rewound.
    fn rewound(&self) -> Result<&File, String> {
        let mut f = match self {
            Spill::Json(w) => w.get_ref(),
            Spill::Csv(w, _) => w.get_ref(),
        };
        f.seek(SeekFrom::Start(0)).map_err(io_error)?;
        Ok(f)
    }
}

impl std::fmt::Debug for PointStore {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("PointStore")
            .field("count", &self.count)
            .field("held", &self.held.len())
            .field("spilled", &self.spill.is_some())
            .finish()
    }
}

fn io_error(e: impl std::fmt::Display) -> String {
    format!("the temporary file of points: {e}")
}

impl PointStore {
    /// An empty store.
    pub fn new(policy: Policy) -> Self {
        Self {
            policy,
            held: Vec::new(),
            count: 0,
            spill: None,
        }
    }

    /// Adds a point, in order.
    pub fn push(&mut self, point: PointReport) -> Result<(), String> {
        self.count += 1;
        match self.policy {
            Policy::HoldAll => self.held.push(point),
            Policy::HoldUpTo(n) => {
                if self.count <= n {
                    self.held.push(point);
                } else {
                    self.held = Vec::new();
                }
            }
            Policy::Spill { after, encoding } => {
                if self.spill.is_none() && self.count > after {
                    let mut spill = Spill::create(encoding)?;
                    for p in std::mem::take(&mut self.held) {
                        spill.write(&p)?;
                    }
                    self.spill = Some(spill);
                }
                match &mut self.spill {
                    Some(w) => w.write(&point)?,
                    None => self.held.push(point),
                }
            }
        }
        Ok(())
    }

    /// Finishes writing: flushes the temporary file and rewinds it for reading.
    pub fn finish(&mut self) -> Result<(), String> {
        match &mut self.spill {
            Some(w) => w.flush(),
            None => Ok(()),
        }
    }

    /// Number of points.
    pub fn len(&self) -> usize {
        self.count
    }

    /// True when there is no point.
    pub fn is_empty(&self) -> bool {
        self.count == 0
    }

    /// The points held in memory: every point unless the store counts or spills past its
    /// limit (then the first ones, or none).
    pub fn held(&self) -> &[PointReport] {
        &self.held
    }

    /// True when every point is in [`PointStore::held`].
    pub fn holds_all(&self) -> bool {
        self.held.len() == self.count
    }

    /// Copies the spilled CSV records to `out`; false when nothing was spilled as CSV (the
    /// caller writes the held points itself).
    pub fn copy_spilled_csv(&self, out: &mut dyn Write) -> Result<bool, String> {
        match &self.spill {
            Some(w @ Spill::Csv(..)) => {
                let mut f = w.rewound()?;
                std::io::copy(&mut f, out).map_err(io_error)?;
                Ok(true)
            }
            _ => Ok(false),
        }
    }
}

impl Serialize for PointStore {
    /// The points as a JSON array: the held ones, or the spilled JSON lines as they are.
    fn serialize<S: Serializer>(&self, s: S) -> Result<S::Ok, S::Error> {
        let Some(w) = &self.spill else {
            return self.held.serialize(s);
        };
        if !matches!(w, Spill::Json(_)) {
            return Err(S::Error::custom(
                "the points were kept as CSV and cannot be written as JSON",
            ));
        }
        let f = w.rewound().map_err(S::Error::custom)?;
        let mut seq = s.serialize_seq(Some(self.count))?;
        for line in BufReader::with_capacity(1 << 20, f).lines() {
            let line = line.map_err(|e| S::Error::custom(io_error(e)))?;
            let raw: &serde_json::value::RawValue =
                serde_json::from_str(&line).map_err(|e| S::Error::custom(io_error(e)))?;
            seq.serialize_element(raw)?;
        }
        seq.end()
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn point(t: f64) -> PointReport {
        PointReport {
            temperature_k: t,
            pressure_pa: 1e5,
            phase: "gas",
            line: None,
            source: None,
            reference_z: Some(0.99),
            reference_density_kg_m3: None,
            reference_flag: None,
            values: Vec::new(),
            spread_pct: None,
        }
    }

    #[test]
    fn spilled_json_reads_back_as_the_same_array() {
        let mut held = PointStore::new(Policy::HoldAll);
        let mut spilled = PointStore::new(Policy::Spill {
            after: 3,
            encoding: Encoding::Json,
        });
        for k in 0..10 {
            held.push(point(300.0 + k as f64)).unwrap();
            spilled.push(point(300.0 + k as f64)).unwrap();
        }
        held.finish().unwrap();
        spilled.finish().unwrap();
        assert!(held.holds_all());
        assert!(spilled.held().is_empty());
        assert_eq!(spilled.len(), 10);
        let a: serde_json::Value = serde_json::to_value(&held).unwrap();
        let b: serde_json::Value =
            serde_json::from_str(&serde_json::to_string(&spilled).unwrap()).unwrap();
        assert_eq!(a, b);
        // Serialising twice gives the same text (the file is rewound each time).
        assert_eq!(
            serde_json::to_string(&spilled).unwrap(),
            serde_json::to_string(&spilled).unwrap()
        );
    }

    #[test]
    fn a_bounded_store_keeps_only_the_count_past_its_limit() {
        let mut s = PointStore::new(Policy::HoldUpTo(2));
        s.push(point(300.0)).unwrap();
        s.push(point(301.0)).unwrap();
        assert!(s.holds_all());
        s.push(point(302.0)).unwrap();
        assert_eq!(s.len(), 3);
        assert!(s.held().is_empty());
        assert!(!s.holds_all());
    }

    #[test]
    fn spilled_csv_is_copied_row_by_row() {
        fn cells(p: &PointReport) -> Vec<String> {
            vec![p.temperature_k.to_string(), "a,b".to_string()]
        }
        let mut s = PointStore::new(Policy::Spill {
            after: 1,
            encoding: Encoding::Csv(cells),
        });
        for k in 0..3 {
            s.push(point(300.0 + k as f64)).unwrap();
        }
        s.finish().unwrap();
        let mut out = Vec::new();
        assert!(s.copy_spilled_csv(&mut out).unwrap());
        assert_eq!(
            String::from_utf8(out).unwrap(),
            "300,\"a,b\"\n301,\"a,b\"\n302,\"a,b\"\n"
        );
    }
}
