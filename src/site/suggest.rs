//! "Did you mean …?" for mistyped keys: the nearest known key by edit distance.

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
        .map(|k| (levenshtein(&norm, &normalise(k)), *k))
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

/// Classic two-row dynamic programme over characters.
fn levenshtein(a: &str, b: &str) -> usize {
    let b: Vec<char> = b.chars().collect();
    let mut prev: Vec<usize> = (0..=b.len()).collect();
    let mut cur = vec![0; b.len() + 1];
    for (i, ca) in a.chars().enumerate() {
        cur[0] = i + 1;
        for (j, cb) in b.iter().enumerate() {
            let swap = if ca == *cb { 0 } else { 1 };
            cur[j + 1] = (prev[j] + swap).min(prev[j + 1] + 1).min(cur[j] + 1);
        }
        std::mem::swap(&mut prev, &mut cur);
    }
    prev[b.len()]
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
        assert_eq!(levenshtein("kitten", "sitting"), 3);
        assert_eq!(levenshtein("", "abc"), 3);
        assert_eq!(levenshtein("same", "same"), 0);
    }
}
