//! "Did you mean …?" for mistyped keys: the nearest known key by edit distance.

use crate::text::edit_distance;

/// The known key closest to `typed`, if it is near enough to be a plausible typo.
///
/// Case and `-`/`_` are ignored first (`Inner-Diameter` → `inner_diameter`); otherwise the
/// Levenshtein distance may be at most a third of the key's length (at least 1), so short keys
/// only match single slips and unrelated words get no suggestion.
pub(crate) fn closest<'k>(typed: &str, known: &[&'k str]) -> Option<&'k str> {
    let norm = normalise(typed);
    if let Some(k) = known.iter().find(|k| normalise(k) == norm) {
        return Some(k);
    }
    let limit = (norm.chars().count() / 3).max(1);
    known
        .iter()
        .map(|k| (edit_distance(&norm, &normalise(k)), *k))
        .filter(|(d, _)| *d <= limit)
        .min_by_key(|(d, _)| *d)
        .map(|(_, k)| k)
}

fn normalise(s: &str) -> String {
    s.chars()
        .map(|c| {
            if c == '-' {
                '_'
            } else {
                c.to_ascii_lowercase()
            }
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;

    const KEYS: &[&str] = &[
        "id",
        "diameter",
        "inner_diameter",
        "liquid_height",
        "product",
    ];

    #[test]
    fn suggests_near_keys() {
        assert_eq!(closest("diamter", KEYS), Some("diameter"));
        assert_eq!(closest("Inner-Diameter", KEYS), Some("inner_diameter"));
        assert_eq!(closest("liquid_hieght", KEYS), Some("liquid_height"));
        assert_eq!(closest("ids", KEYS), Some("id"));
    }

    #[test]
    fn stays_quiet_for_unrelated_words() {
        assert_eq!(closest("colour", KEYS), None);
        assert_eq!(closest("x", &["id"]), None);
    }

    #[test]
    fn distance_is_the_textbook_one() {
        // kitten → sitting is the standard example with distance 3.
        assert_eq!(edit_distance("kitten", "sitting"), 3);
        assert_eq!(edit_distance("", "abc"), 3);
        assert_eq!(edit_distance("same", "same"), 0);
    }
}
