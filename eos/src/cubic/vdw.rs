//! van der Waals (1873): P = RT/(v - b) - a/v^2, a and b constant.
//! J. D. van der Waals, *Over de Continuiteit van den Gas- en Vloeistoftoestand*, Leiden (1873).

use super::{Alpha, CubicSpec};

pub const SPEC: CubicSpec = CubicSpec {
    id: "vdw",
    name: "van der Waals",
    citation:
        "J. D. van der Waals, Over de Continuiteit van den Gas- en Vloeistoftoestand, Leiden (1873)",
    d1: 0.0,
    d2: 0.0,
    alpha: Alpha::Constant,
};
