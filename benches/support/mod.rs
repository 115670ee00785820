//! A year of invented journals for the bundled demo site (an invented plant), for benchmarks.
//!
//! Three eight-hour shifts a day; each session holds about 450 records, the mix a plant
//! box sees: a spot reading every minute or so, three viscometer sets (one per product),
//! a few notes, now and then a finding. The chilli sauce's consistency index drifts over
//! the year and crosses its upper limit, so a trend has out-of-limit sessions to mark.
//! Deterministic: the same `days` always gives the same records.

#![allow(dead_code)]

use chrono::{DateTime, Duration, FixedOffset, TimeZone, Utc};
use rheoside::instrument::Geometry;
use rheoside::journal::{DialRow, Payload, Record, Severity, session_file_name};
use rheoside::readings::parse_reading_arg;
use rheoside::site::Site;
use std::io::{self, BufWriter, Write};
use std::path::Path;

pub const SESSIONS_PER_DAY: u32 = 3;
/// Spot readings per session: one every ~65 s over an eight-hour shift.
pub const READINGS_PER_SESSION: u32 = 440;
const OPERATORS: [&str; 3] = ["J. Ferreira", "K. Amundsen", "T. Oduya"];

/// (reading name, equipment, nominal value, unit, relative spread).
const SPOTS: [(&str, &str, f64, &str, f64); 8] = [
    ("discharge-pressure", "P-1", 6.2, "bar", 0.05),
    ("suction-pressure", "P-1", 0.4, "bar", 0.2),
    ("flow", "L-1", 14.0, "m3/h", 0.08),
    ("line-pressure", "L-2", 9.5, "bar", 0.05),
    ("pump-speed", "P-2", 210.0, "rpm", 0.03),
    ("motor-current", "TK-1", 5.1, "A", 0.06),
    ("temperature", "TK-1", 24.0, "C", 0.04),
    ("liquid-level", "TK-2", 1.9, "m", 0.03),
];

/// Small deterministic generator (xorshift64*), so no dependency is needed.
pub struct Rng(u64);

impl Rng {
    pub fn new(seed: u64) -> Rng {
        Rng(seed.wrapping_mul(0x9E37_79B9_7F4A_7C15) | 1)
    }
    /// Uniform in [0, 1).
    pub fn unit(&mut self) -> f64 {
        self.0 ^= self.0 >> 12;
        self.0 ^= self.0 << 25;
        self.0 ^= self.0 >> 27;
        (self.0.wrapping_mul(0x2545_F491_4F6C_DD1D) >> 11) as f64 / (1u64 << 53) as f64
    }
    /// Uniform in [-1, 1).
    pub fn sym(&mut self) -> f64 {
        2.0 * self.unit() - 1.0
    }
}

/// Local offset: +02:00 from April to October, +01:00 otherwise (an invented plant's rule).
fn offset_for(day: u32) -> FixedOffset {
    let secs = if (90..304).contains(&day) { 7200 } else { 3600 };
    FixedOffset::east_opt(secs).unwrap_or(FixedOffset::east_opt(0).unwrap())
}

/// 2026-01-01T00:00:00Z, the first day of the invented year.
pub fn year_start() -> DateTime<Utc> {
    Utc.with_ymd_and_hms(2026, 1, 1, 0, 0, 0).unwrap()
}

/// One past the last generated moment, for a `now` that includes every session.
pub fn year_end(days: u32) -> DateTime<Utc> {
    year_start() + Duration::days(i64::from(days) + 1)
}

/// Every session of `days` days, in time order.
pub fn sessions(site: &Site, days: u32) -> impl Iterator<Item = Vec<Record>> + '_ {
    (0..days * SESSIONS_PER_DAY).map(move |i| session(site, i))
}

struct Ctx {
    session: String,
    operator: &'static str,
    offset: FixedOffset,
    t: DateTime<Utc>,
    seq: u64,
    out: Vec<Record>,
}

impl Ctx {
    fn push(&mut self, equipment: Option<&str>, payload: Payload, step_s: i64) {
        self.seq += 1;
        self.out.push(Record {
            seq: self.seq,
            session: self.session.clone(),
            utc: self.t,
            offset: self.offset,
            operator: self.operator.to_string(),
            equipment: equipment.map(str::to_string),
            payload,
            version: "0.1.0".to_string(),
        });
        self.t += Duration::seconds(step_s);
    }
}

/// Session `index` (0 = first shift of the first day).
pub fn session(site: &Site, index: u32) -> Vec<Record> {
    let day = index / SESSIONS_PER_DAY;
    let shift = index % SESSIONS_PER_DAY;
    let offset = offset_for(day);
    let local_start = 6 * 3600 + 8 * 3600 * i64::from(shift);
    let start = year_start() + Duration::days(i64::from(day)) + Duration::seconds(local_start)
        - Duration::seconds(i64::from(offset.local_minus_utc()));
    let mut rng = Rng::new(u64::from(index) + 1);
    let mut c = Ctx {
        session: format!("{:08x}", 0x5e55_0000u32 + index),
        operator: OPERATORS[(index % 3) as usize],
        offset,
        t: start,
        seq: 0,
        out: Vec::with_capacity(READINGS_PER_SESSION as usize + 12),
    };
    let start_payload = Payload::SessionStart {
        site_id: site.id.clone(),
        site_source: "bundled demo site (invented plant)".to_string(),
    };
    c.push(None, start_payload, 20);
    let set_at = [
        READINGS_PER_SESSION / 6,
        READINGS_PER_SESSION / 2,
        READINGS_PER_SESSION * 5 / 6,
    ];
    for k in 0..READINGS_PER_SESSION {
        let (name, equipment, nominal, unit, spread) = SPOTS[(k as usize) % SPOTS.len()];
        let value = nominal * (1.0 + spread * rng.sym());
        if let Ok(r) = parse_reading_arg(&format!("{name}={value:.3} {unit}")) {
            c.push(Some(equipment), r.payload(), 64);
        }
        if let Some(which) = set_at.iter().position(|&at| at == k) {
            let (equipment, payload) = viscometer_set(site, which, day, &mut rng);
            c.push(Some(equipment), payload, 90);
        }
        if k % 110 == 55 {
            let text = format!(
                "walked the line at {}; no leaks, guards in place",
                c.t.format("%H:%M")
            );
            c.push(Some(equipment), Payload::Note { text }, 30);
        }
    }
    if index % 5 == 2 {
        let text = "P-1 seal weeping slightly; check at the next stop".to_string();
        let finding = Payload::Finding {
            severity: Severity::Caution,
            text,
        };
        c.push(Some("P-1"), finding, 30);
    }
    c.push(None, Payload::SessionEnd, 0);
    c.out
}

/// Consistency index of the chilli sauce on `day`: a slow drift 10 → 20 Pa·sⁿ and back.
pub fn chilli_k(day: u32) -> f64 {
    let phase = f64::from(day) / 365.0 * std::f64::consts::TAU;
    15.0 - 5.0 * phase.cos()
}

/// (product, viscometer, τ0 Pa, K Pa·sⁿ, n, speeds rpm) for set `which` of a session.
fn recipe(which: usize, day: u32) -> (&'static str, &'static str, f64, f64, f64, &'static [f64]) {
    const SIX: &[f64] = &[600.0, 300.0, 200.0, 100.0, 6.0, 3.0];
    const SLOW: &[f64] = &[10.0, 6.0, 3.0, 1.5, 0.6, 0.3];
    match which {
        0 => ("chilli-sauce", "VIS-A", 4.0, chilli_k(day), 0.36, SIX),
        1 => ("filler-paste", "VIS-B", 120.0, 30.0, 0.45, SLOW),
        _ => ("chalk-slurry", "VIS-A", 30.0, 0.05, 1.0, SIX),
    }
}

fn viscometer_set(site: &Site, which: usize, day: u32, rng: &mut Rng) -> (&'static str, Payload) {
    let (product, viscometer, tau0, k, n, speeds) = recipe(which, day);
    let geometry = site
        .viscometer(viscometer)
        .map_or(Geometry::StandardSixSpeed, |v| v.geometry.clone());
    let per_rpm = geometry.newtonian_rate_per_rpm();
    let per_dial = geometry.stress_per_dial_pa();
    let rows = speeds
        .iter()
        .map(|&rpm| {
            let stress = tau0 + k * (rpm * per_rpm).powf(n);
            // Read to the nearest half division, with a little scatter.
            let dial = (stress / per_dial * (1.0 + 0.01 * rng.sym()) * 2.0).round() / 2.0;
            DialRow {
                rpm_raw: format!("{rpm}"),
                rpm,
                dial_raw: format!("{dial}"),
                dial,
            }
        })
        .collect();
    let payload = Payload::ViscometerSet {
        viscometer: viscometer.to_string(),
        product: product.to_string(),
        temperature_raw: Some("25 C".to_string()),
        temperature_k: Some(298.15),
        rows,
    };
    (viscometer, payload)
}

/// Write `days` days of sessions into `dir`, one file per session; returns (files, records, bytes).
pub fn write_days(site: &Site, dir: &Path, days: u32) -> io::Result<(usize, usize, u64)> {
    std::fs::create_dir_all(dir)?;
    let (mut files, mut records, mut bytes) = (0, 0, 0u64);
    for s in sessions(site, days) {
        let Some(first) = s.first() else { continue };
        let name = session_file_name(&site.id, first.utc, &first.session)
            .map_err(|e| io::Error::other(e.to_string()))?;
        let path = dir.join(name);
        let mut w = BufWriter::new(std::fs::File::create(&path)?);
        for r in &s {
            serde_json::to_writer(&mut w, r)?;
            w.write_all(b"\n")?;
        }
        w.flush()?;
        files += 1;
        records += s.len();
        bytes += std::fs::metadata(&path)?.len();
    }
    Ok((files, records, bytes))
}
