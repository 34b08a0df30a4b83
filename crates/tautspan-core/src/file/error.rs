//! The error a scenario file can give: where (file, line, column, field)
//! and what is wrong, in words a person can act on.

use super::locate::Location;
use std::fmt;

/// One problem found in a scenario file.
#[derive(Debug, Clone, PartialEq)]
pub struct FileError {
    /// The file's name as the user gave it, when known.
    pub file: Option<String>,
    /// Line and column, when known.
    pub location: Option<Location>,
    /// The field, as a path (`members[2].area`), when known.
    pub field: Option<String>,
    /// What is wrong and, where it helps, what would be right.
    pub message: String,
}

impl FileError {
    /// A problem with a message only.
    pub fn new(message: impl Into<String>) -> FileError {
        FileError { file: None, location: None, field: None, message: message.into() }
    }

    /// Name the file.
    pub fn in_file(mut self, file: impl Into<String>) -> FileError {
        self.file = Some(file.into());
        self
    }
}

impl fmt::Display for FileError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        if let Some(file) = &self.file {
            write!(f, "{file}:")?;
        }
        if let Some(at) = self.location {
            write!(f, "{}:{}:", at.line, at.column)?;
        }
        if self.file.is_some() || self.location.is_some() {
            f.write_str(" ")?;
        }
        if let Some(field) = &self.field {
            write!(f, "{field}: ")?;
        }
        f.write_str(&self.message)
    }
}

/// All the problems found in one file (at least one).
#[derive(Debug, Clone, PartialEq)]
pub struct FileErrors(pub Vec<FileError>);

impl FileErrors {
    /// Name the file on every error.
    pub fn in_file(self, file: &str) -> FileErrors {
        FileErrors(self.0.into_iter().map(|e| e.in_file(file)).collect())
    }
}

impl fmt::Display for FileErrors {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        for (i, e) in self.0.iter().enumerate() {
            if i > 0 {
                writeln!(f)?;
            }
            write!(f, "{e}")?;
        }
        Ok(())
    }
}

impl std::error::Error for FileErrors {}
impl std::error::Error for FileError {}
