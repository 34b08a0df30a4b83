//! The scenario file a report was made from: its name and the SHA-256 of
//! its bytes, so a reader can tell whether the file on their desk is the
//! one the report checked.

use sha2::{Digest, Sha256};

/// A scenario file as the report names it.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct SourceFile {
    /// The file's name as given on the command line.
    pub name: String,
    /// SHA-256 of the file's bytes, 64 lower-case hex digits (FIPS 180-4).
    pub sha256: String,
}

impl SourceFile {
    /// The name and the digest of `bytes`, the file exactly as read.
    pub fn new(name: impl Into<String>, bytes: &[u8]) -> SourceFile {
        SourceFile { name: name.into(), sha256: sha256_hex(bytes) }
    }
}

/// SHA-256 of `bytes` as lower-case hex, the form `sha256sum` prints.
pub fn sha256_hex(bytes: &[u8]) -> String {
    Sha256::digest(bytes).iter().map(|b| format!("{b:02x}")).collect()
}

#[cfg(test)]
mod tests {
    use super::sha256_hex;

    /// The FIPS 180-4 example digests (NIST CSRC "Example Algorithms",
    /// SHA256.pdf): "abc" and the empty message.
    #[test]
    fn published_example_digests() {
        assert_eq!(sha256_hex(b"abc"), "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
        assert_eq!(sha256_hex(b""), "e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
    }
}
