//! Reading a viscometer CSV for `rheoside fit`: header `rpm,dial` or `shear_rate,shear_stress`.

use crate::instrument::DialReading;
use crate::rheology::Point;
use crate::units::{self, Dimension};
use anyhow::{Context, Result, bail};
use std::path::Path;

/// What the CSV held, in SI.
#[derive(Debug, Clone, PartialEq)]
pub enum Readings {
    Dial(Vec<DialReading>),
    Direct(Vec<Point>),
}

/// The CSV's rows plus any temperature column (kelvin, one per row).
#[derive(Debug, Clone, PartialEq)]
pub struct CsvData {
    pub readings: Readings,
    pub temperatures_k: Option<Vec<f64>>,
}

const ACCEPTED_HEADERS: &str = "'rpm,dial' (needs --geometry or --site/--viscometer) or 'shear_rate,shear_stress' (1/s, Pa), \
     each optionally with 'temperature' (bare numbers in °C, or with a unit: '25 C', '77 F', '298 K'); \
     or plant readings 'flow,pressure_drop' (with --diameter D --length L or --line ID)";

pub fn read(path: &Path) -> Result<CsvData> {
    let text = std::fs::read_to_string(path)
        .with_context(|| format!("cannot read '{}'", path.display()))?;
    parse(&text).with_context(|| format!("in '{}'", path.display()))
}

pub fn parse(text: &str) -> Result<CsvData> {
    let (mut reader, headers) = super::fit_csv::reader_with_headers(text)?;
    let layout = Layout::from_headers(&headers)?;
    let mut first = Vec::new();
    let mut second = Vec::new();
    let mut temps = Vec::new();
    for (i, record) in reader.records().enumerate() {
        let line = i + 2;
        let record = record.map_err(|e| row_error(&e, line, headers.len()))?;
        first.push(number(&record, layout.first, line, &headers)?);
        second.push(number(&record, layout.second, line, &headers)?);
        if let Some(col) = layout.temperature {
            temps.push(temperature(&record, col, line)?);
        }
    }
    if first.is_empty() {
        bail!("no readings after the header");
    }
    let readings = if layout.dial {
        Readings::Dial(
            first
                .iter()
                .zip(&second)
                .map(|(&rpm, &dial)| DialReading { rpm, dial })
                .collect(),
        )
    } else {
        Readings::Direct(
            first
                .iter()
                .zip(&second)
                .map(|(&shear_rate, &shear_stress)| Point {
                    shear_rate,
                    shear_stress,
                })
                .collect(),
        )
    };
    Ok(CsvData {
        readings,
        temperatures_k: layout.temperature.map(|_| temps),
    })
}

/// Column positions found in the header.
struct Layout {
    dial: bool,
    first: usize,
    second: usize,
    temperature: Option<usize>,
}

impl Layout {
    fn from_headers(headers: &[String]) -> Result<Layout> {
        let find = |name: &str| headers.iter().position(|h| h == name);
        if let Some((i, h)) = headers
            .iter()
            .enumerate()
            .find(|(i, h)| headers[..*i].contains(h))
        {
            bail!(
                "column '{h}' appears twice (columns {} and {}); give each column once",
                headers.iter().position(|x| x == h).map_or(0, |p| p + 1),
                i + 1
            );
        }
        let temperature = find("temperature");
        if let Some(unknown) = headers.iter().find(|h| {
            !matches!(
                h.as_str(),
                "rpm" | "dial" | "shear_rate" | "shear_stress" | "temperature"
            )
        }) {
            bail!("unknown column '{unknown}'; accepted headers: {ACCEPTED_HEADERS}");
        }
        match (
            find("rpm"),
            find("dial"),
            find("shear_rate"),
            find("shear_stress"),
        ) {
            (Some(a), Some(b), None, None) => Ok(Layout {
                dial: true,
                first: a,
                second: b,
                temperature,
            }),
            (None, None, Some(a), Some(b)) => Ok(Layout {
                dial: false,
                first: a,
                second: b,
                temperature,
            }),
            _ => bail!(
                "header '{}' is not one of the accepted layouts: {ACCEPTED_HEADERS}",
                headers.join(",")
            ),
        }
    }
}

/// A row with the wrong number of cells is usually a decimal comma ("600,12,5").
fn row_error(e: &csv::Error, line: usize, columns: usize) -> anyhow::Error {
    match e.kind() {
        csv::ErrorKind::UnequalLengths { len, .. } => anyhow::anyhow!(
            "line {line}: {len} cells where the header has {columns}; a comma separates \
             cells and cannot be a decimal point: write 12.5, not 12,5"
        ),
        _ => anyhow::anyhow!("line {line}: not a valid CSV row ({e})"),
    }
}

fn number(record: &csv::StringRecord, col: usize, line: usize, headers: &[String]) -> Result<f64> {
    let name = &headers[col];
    let raw = record.get(col).unwrap_or("");
    let value: f64 = raw.parse().map_err(|_| {
        anyhow::anyhow!("line {line}, column '{name}': '{raw}' is not a number (use a plain decimal such as 12.5)")
    })?;
    if !value.is_finite() {
        bail!("line {line}, column '{name}': '{raw}' is not a finite number");
    }
    Ok(value)
}

fn temperature(record: &csv::StringRecord, col: usize, line: usize) -> Result<f64> {
    let raw = record.get(col).unwrap_or("");
    units::parse(raw, Dimension::Temperature)
        .map_err(|e| anyhow::anyhow!("line {line}, column 'temperature': {e}"))
}

/// A CSV reader over `text` (cells trimmed, `#` lines skipped) and its header names in
/// lower case; shared by every CSV the command line reads.
pub(super) fn reader_with_headers(text: &str) -> Result<(csv::Reader<&[u8]>, Vec<String>)> {
    let mut reader = csv::ReaderBuilder::new()
        .trim(csv::Trim::All)
        .comment(Some(b'#'))
        .from_reader(text.as_bytes());
    let headers: Vec<String> = reader
        .headers()
        .context("the first line must be a header")?
        .iter()
        .map(|h| h.to_ascii_lowercase())
        .collect();
    Ok((reader, headers))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn reads_dial_layout_with_temperature() {
        let data = parse("rpm,dial,temperature\n600, 52, 25\n300,34,25\n").unwrap();
        assert_eq!(
            data.readings,
            Readings::Dial(vec![
                DialReading {
                    rpm: 600.0,
                    dial: 52.0
                },
                DialReading {
                    rpm: 300.0,
                    dial: 34.0
                }
            ])
        );
        let t = data.temperatures_k.unwrap();
        assert!((t[0] - 298.15).abs() < 1e-9);
    }

    #[test]
    fn rejects_mixed_or_unknown_headers() {
        let err = parse("rpm,shear_stress\n1,2\n").unwrap_err().to_string();
        assert!(err.contains("not one of the accepted layouts"), "{err}");
        let err = parse("rpm,dail\n1,2\n").unwrap_err().to_string();
        assert!(err.contains("unknown column 'dail'"), "{err}");
    }

    #[test]
    fn names_the_line_and_column_of_a_bad_number() {
        let err = parse("rpm,dial\n600,52\n300,abc\n")
            .unwrap_err()
            .to_string();
        assert_eq!(
            err,
            "line 3, column 'dial': 'abc' is not a number (use a plain decimal such as 12.5)"
        );
    }

    // Regressions: a repeated column silently used the first; a decimal comma gave only
    // "not a valid CSV row".
    #[test]
    fn repeated_columns_and_decimal_commas_are_named() {
        let err = parse("rpm,dial,dial\n600,52,53\n").unwrap_err().to_string();
        assert!(
            err.contains("column 'dial' appears twice (columns 2 and 3)"),
            "{err}"
        );
        let err = parse("rpm,dial\n600,52\n600,12,5\n")
            .unwrap_err()
            .to_string();
        assert!(
            err.starts_with("line 3: 3 cells where the header has 2"),
            "{err}"
        );
        assert!(err.contains("cannot be a decimal point"), "{err}");
    }

    #[test]
    fn empty_file_after_header_is_an_error() {
        let err = parse("shear_rate,shear_stress\n").unwrap_err().to_string();
        assert!(err.contains("no readings"), "{err}");
    }
}
