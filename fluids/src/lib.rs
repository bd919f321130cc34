//! Component data (in progress).
