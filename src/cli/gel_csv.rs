//! Reading rested-gel readings for `rheoside restart --gel-readings FILE.csv`: header
//! `rest_time,gel_stress` (yield stresses from any geometry) or `rest_time,dial` (peak dial at
//! 3 rpm on the standard six-speed viscometer, converted by the instrument module).

use crate::instrument::Geometry;
use crate::line::restart::GelReading;
use crate::units::{self, Dimension};
use anyhow::{Context, Result, bail};
use std::path::Path;

const ACCEPTED: &str = "'rest_time,gel_stress' (bare numbers: s, Pa; or with units, e.g. \
     '10 min,180 Pa') or 'rest_time,dial' (peak dial at 3 rpm on the standard six-speed \
     viscometer, degrees)";

/// Which second column the file has.
#[derive(Clone, Copy)]
enum Column {
    Stress,
    Dial,
}

pub fn read(path: &Path) -> Result<Vec<GelReading>> {
    let text = std::fs::read_to_string(path)
        .with_context(|| format!("cannot read '{}'", path.display()))?;
    parse(&text).with_context(|| format!("in '{}'", path.display()))
}

pub fn parse(text: &str) -> Result<Vec<GelReading>> {
    let (mut reader, headers) = super::fit_csv::reader_with_headers(text)?;
    let column = match headers
        .iter()
        .map(String::as_str)
        .collect::<Vec<_>>()
        .as_slice()
    {
        ["rest_time", "gel_stress"] => Column::Stress,
        ["rest_time", "dial"] => Column::Dial,
        _ => bail!(
            "header '{}' not recognised; accepted: {ACCEPTED}",
            headers.join(",")
        ),
    };
    let mut out = Vec::new();
    for (i, row) in reader.records().enumerate() {
        let row = row.with_context(|| format!("row {}", i + 2))?;
        let cell = |j: usize| row.get(j).unwrap_or("");
        out.push(reading(cell(0), cell(1), column).with_context(|| format!("row {}", i + 2))?);
    }
    Ok(out)
}

fn reading(time: &str, value: &str, column: Column) -> Result<GelReading> {
    let rest_s = units::parse_with_default(time, Dimension::Time, "s")
        .map_err(|e| anyhow::anyhow!("rest_time: {e}"))?;
    let stress_pa = match column {
        Column::Stress => units::parse_with_default(value, Dimension::Stress, "Pa")
            .map_err(|e| anyhow::anyhow!("gel_stress: {e}"))?,
        Column::Dial => {
            let dial: f64 = value.parse().map_err(|_| {
                anyhow::anyhow!("dial '{value}': give the peak dial in degrees, e.g. 12")
            })?;
            dial * Geometry::StandardSixSpeed.stress_per_dial_pa()
        }
    };
    Ok(GelReading { rest_s, stress_pa })
}

#[cfg(test)]
mod tests {
    use super::*;

    // Source: API RP 13B-1 dial convention as used by the instrument module, 0.511 Pa per
    // degree on the standard geometry; 10 min = 600 s.
    #[test]
    fn dial_readings_become_stress() {
        let got = parse("rest_time,dial\n10 s,8\n10 min,14\n").unwrap();
        assert_eq!(got[1].rest_s, 600.0);
        assert!((got[0].stress_pa - 8.0 * 0.511).abs() < 1e-12);
        assert!(parse("time,gel\n1,2\n").is_err());
    }
}
