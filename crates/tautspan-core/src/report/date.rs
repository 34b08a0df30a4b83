//! The report's date stamp: seconds since the Unix epoch to a civil date.
//! Pure (the caller reads the clock), so the core stays free of IO.

/// `YYYY-MM-DD` (UTC) for `unix_secs` seconds after 1970-01-01T00:00Z, by
/// H. Hinnant's civil-from-days algorithm (proleptic Gregorian calendar).
pub fn civil_date(unix_secs: u64) -> String {
    let z = (unix_secs / 86_400) as i64 + 719_468;
    let era = z.div_euclid(146_097);
    let doe = z - era * 146_097;
    let yoe = (doe - doe / 1460 + doe / 36_524 - doe / 146_096) / 365;
    let doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
    let mp = (5 * doy + 2) / 153;
    let day = doy - (153 * mp + 2) / 5 + 1;
    let month = if mp < 10 { mp + 3 } else { mp - 9 };
    let year = yoe + era * 400 + i64::from(month <= 2);
    format!("{year:04}-{month:02}-{day:02}")
}

#[cfg(test)]
mod tests {
    use super::civil_date;

    // Known instants (POSIX time, leap days of 2000 and 2024 included): exact.
    #[test]
    fn known_dates() {
        for (secs, date) in [
            (0, "1970-01-01"),
            (951_782_400, "2000-02-29"),
            (951_868_800, "2000-03-01"),
            (1_709_164_800, "2024-02-29"),
            (1_796_169_600, "2026-12-02"),
        ] {
            assert_eq!(civil_date(secs), date, "{secs}");
        }
    }
}
