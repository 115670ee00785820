//! "Did you mean …?" for a misspelt reading name: the nearest catalogue name or alias.

use super::CATALOGUE;
use crate::text::edit_distance;

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
        .map(|(name, spelling)| (edit_distance(&typed, spelling), name))
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
