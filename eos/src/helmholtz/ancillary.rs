//! Ancillary equations for the saturation curve, used only as starting values.
//!
//! With theta = 1 - T/Tc and y_c the critical value (pc or rhoc), the papers use three forms:
//!
//! ```text
//! ln_tc:  ln(y / y_c) = (Tc/T) sum n_i theta^e_i    (every vapour-pressure equation here;
//!                                                  Span et al. (2000) saturated vapour)
//! ln:     ln(y / y_c) = sum n_i theta^e_i
//! linear: y / y_c = 1 + sum n_i theta^e_i           (Wagner & Pruss (1993) saturated liquid)
//! ```

/// Which of the forms above.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum AncillaryForm {
    /// ln(y/y_c) = (Tc/T) sum n theta^e.
    LnTc,
    /// ln(y/y_c) = sum n theta^e.
    Ln,
    /// y/y_c = 1 + sum n theta^e.
    Linear,
}

/// One ancillary equation y(T).
#[derive(Debug, Clone, PartialEq)]
pub struct Ancillary {
    /// The form.
    pub form: AncillaryForm,
    /// Coefficients n_i and exponents e_i.
    pub terms: Vec<(f64, f64)>,
}

impl Ancillary {
    /// y/y_c at T for critical temperature tc (T < tc; theta is clamped at zero above).
    pub fn reduced(&self, t: f64, tc: f64) -> f64 {
        let theta = (1.0 - t / tc).max(0.0);
        let sum: f64 = self.terms.iter().map(|&(n, e)| n * theta.powf(e)).sum();
        match self.form {
            AncillaryForm::LnTc => (tc / t * sum).exp(),
            AncillaryForm::Ln => sum.exp(),
            AncillaryForm::Linear => 1.0 + sum,
        }
    }
}
