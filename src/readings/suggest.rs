//! "Did you mean …?" for a misspelt reading name: the nearest catalogue name or alias.

use super::CATALOGUE;

/// The catalogue name nearest to `typed`, if it is near enough to be a plausible slip:
/// a Levenshtein distance of at most a third of the typed length (at least 1), or the typed
/// text being the start of exactly one name.
pub fn nearest_name(typed: &str) -> Option<&'static str> {
    let typed = typed.trim().to_ascii_lowercase().replace('_', "-");
    if typed.is_empty() {
        return None;
    }
    let limit = (typed.chars().count() / 3).max(1);
    let candidates = CATALOGUE.iter().flat_map(|k| {
        std::iter::once(k.name)
            .chain(k.aliases.iter().copied())
            .map(move |n| (k.name, n))
    });
    let best = candidates
        .map(|(name, spelling)| (levenshtein(&typed, spelling), name))
        .filter(|(d, _)| *d <= limit)
        .min_by_key(|(d, _)| *d)
        .map(|(_, name)| name);
    best.or_else(|| {
        let mut starting = CATALOGUE.iter().filter(|k| k.name.starts_with(&typed));
        match (starting.next(), starting.next()) {
            (Some(k), None) => Some(k.name),
            _ => None,
        }
    })
}

/// Classic two-row dynamic programme over characters (Levenshtein 1966).
fn levenshtein(a: &str, b: &str) -> usize {
    let b: Vec<char> = b.chars().collect();
    let mut prev: Vec<usize> = (0..=b.len()).collect();
    let mut cur = vec![0; b.len() + 1];
    for (i, ca) in a.chars().enumerate() {
        cur[0] = i + 1;
        for (j, cb) in b.iter().enumerate() {
            let swap = usize::from(ca != *cb);
            cur[j + 1] = (prev[j] + swap).min(prev[j + 1] + 1).min(cur[j] + 1);
        }
        std::mem::swap(&mut prev, &mut cur);
    }
    prev[b.len()]
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn slips_get_the_nearest_name_and_nonsense_gets_none() {
        assert_eq!(
            nearest_name("dischrage-pressure"),
            Some("discharge-pressure")
        );
        assert_eq!(nearest_name("temprature"), Some("temperature"));
        assert_eq!(nearest_name("sucton"), Some("suction-pressure"));
        assert_eq!(nearest_name("rest"), Some("rest-time"));
        assert_eq!(nearest_name("xyzzy"), None);
    }
}
