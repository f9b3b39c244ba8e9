/**
 * Alarms on a followed series (src/ui/converter/watch/watch-alarms.ts): a band and a rate, the
 * rows where an alarm begins, and the page title. Invented readings with known temperatures and
 * times; the expected rates are the exact slopes of straight lines (no source needed).
 */
import { describe, expect, it } from 'vitest';
import type { WatchRow } from '../../src/io/watch-series';
import { alarmTitle, evaluateAlarms } from '../../src/ui/converter/watch/watch-alarms';

function row(seq: number, minutes: number, T: number | null): WatchRow {
  return {
    seq,
    file: `f${seq}.csv`,
    time_ms: minutes * 60_000,
    timeFrom: 'header',
    timeSource: null,
    pressure_Pa: null,
    delay_s: 0.0025,
    delaySd_s: 1e-7,
    snr: 30,
    speed_m_s: 20,
    speedSd_m_s: 0.001,
    candidates: T === null ? [] : [{ temperature_K: T, sd_K: 1e-4, sdMeasurement_K: 1e-4, sdCurve_K: 0, interval68_K: [T - 1e-4, T + 1e-4], interval95_K: [T - 2e-4, T + 2e-4], branch: 'high', kind: 'root' }],
    chosen: T === null ? null : 0,
    chosenBy: T === null ? null : 'continuity',
    ambiguous: null,
    warnings: [],
    problem: null,
  };
}

describe('evaluateAlarms', () => {
  it('marks every row outside the band and the row where each stretch outside begins; undecided rows are skipped', () => {
    const temps = [1.81, 1.804, 1.8, null, 1.796, 1.79, 1.789, 1.8, 1.806];
    const rows = temps.map((T, i) => row(i, i, T));
    const state = evaluateAlarms(rows, { band: { low_K: 1.795, high_K: 1.805 }, rate: null });
    expect([...state.marks.keys()]).toEqual([0, 5, 6, 8]);
    expect(state.crossings).toEqual([0, 5, 8]);
    expect(state.marks.get(5)?.[0]).toMatchObject({ kind: 'band', crossing: true });
    expect(state.marks.get(5)?.[0]?.message).toBe('1.7900 K is 5 mK below the band 1.7950 K–1.8050 K');
    expect(state.marks.get(6)?.[0]?.crossing).toBe(false);
    expect(state.now.map((m) => m.kind)).toEqual(['band']);
  });

  it('the rate is the least-squares slope over the window; the alarm begins where it passes the limit', () => {
    // 0.5 mK/min for 10 min, then 3 mK/min. With a 3-minute window row 11 sees rows 8–11 at
    // 0, 0.5, 1 and 4 mK: a least-squares slope of 6.25/5 = 1.25 mK/min, past the 1 mK/min limit.
    const rows: WatchRow[] = [];
    let T = 1.8;
    for (let i = 0; i <= 20; i++) {
      rows.push(row(i, i, T));
      T += (i < 10 ? 0.5 : 3) * 1e-3;
    }
    const state = evaluateAlarms(rows, { band: null, rate: { limit_K_s: 1e-3 / 60, window_s: 180 } });
    expect(state.crossings).toEqual([11]);
    // Rows 13–20 lie on a straight line at 3 mK/min over the whole window.
    expect(state.marks.get(20)?.[0]?.message).toBe('warming at 3 mK/min over the last 3 min (limit 1 mK/min)');
    expect(state.marks.has(10)).toBe(false);
    expect(state.marks.get(11)?.[0]?.message).toBe('warming at 1.25 mK/min over the last 3 min (limit 1 mK/min)');
  });

  it('no alarm chosen: nothing is marked, the title stays', () => {
    const state = evaluateAlarms([row(0, 0, 2), row(1, 1, 1)], { band: null, rate: null });
    expect(state.marks.size).toBe(0);
    expect(alarmTitle(state.now, 'Sekundo')).toBe('Sekundo');
  });

  it('the title names the alarm while the newest reading is in it', () => {
    const state = evaluateAlarms([row(0, 0, 1.9)], { band: { low_K: 1.795, high_K: 1.805 }, rate: null });
    expect(alarmTitle(state.now, 'Sekundo')).toBe('(!) Band alarm: 1.9000 K is 95 mK above the band 1.7950 K–1.8050 K · Sekundo');
  });
});
