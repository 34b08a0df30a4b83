//! Whole counts written with thousands separators (`200,000`), for
//! messages that name a cap and a count.

/// `n` with a comma between each group of three digits.
pub fn grouped(n: u64) -> String {
    let digits = n.to_string();
    let mut out = String::with_capacity(digits.len() + digits.len() / 3);
    for (i, c) in digits.chars().enumerate() {
        if i > 0 && (digits.len() - i).is_multiple_of(3) {
            out.push(',');
        }
        out.push(c);
    }
    out
}

#[cfg(test)]
mod tests {
    use super::grouped;

    #[test]
    fn groups_of_three() {
        assert_eq!(grouped(0), "0");
        assert_eq!(grouped(999), "999");
        assert_eq!(grouped(1000), "1,000");
        assert_eq!(grouped(200_000), "200,000");
        assert_eq!(grouped(1_000_000_000), "1,000,000,000");
    }
}
