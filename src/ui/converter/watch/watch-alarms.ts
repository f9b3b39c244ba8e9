/**
 * Alarms on a followed series, of the user's choosing: a band (the chosen temperature outside
 * [low, high]) and a rate (the temperature changing faster than a limit, in mK per minute, from a
 * least-squares line through the decided readings of the last few minutes). A row "crosses" when
 * it is in alarm and the decided row before it was not; every row in alarm is marked. Pure.
 * Common practice, no source: a bath regulator's alarm works the same way.
 */
import { chosenTemperature, type WatchRow } from '../../../io/watch-series';

export interface BandAlarm {
  low_K: number;
  high_K: number;
}

export interface RateAlarm {
  /** Largest |dT/dt| before the alarm, K/s. */
  limit_K_s: number;
  /** Readings within this time before each one give its rate, s. */
  window_s: number;
}

export interface AlarmSettings {
  band: BandAlarm | null;
  rate: RateAlarm | null;
}

export interface AlarmMark {
  kind: 'band' | 'rate';
  /** True on the first row of a stretch in alarm. */
  crossing: boolean;
  /** One line: what is out and by how much. */
  message: string;
}

export interface AlarmState {
  /** Marks by row (seq); rows without a mark are absent. */
  marks: ReadonlyMap<number, readonly AlarmMark[]>;
  /** The marks of the newest decided row (what the title shows); empty when it is fine. */
  now: readonly AlarmMark[];
  /** Rows where an alarm began, in order. */
  crossings: number[];
}

const mK = (K: number) => `${Number((K * 1e3).toPrecision(4))} mK`;
const kelvin = (K: number) => `${K.toFixed(4)} K`;

/** The least-squares slope of (t, T), K/s, or null with fewer than two distinct times. */
function slope(t: readonly number[], T: readonly number[]): number | null {
  const n = t.length;
  if (n < 2) return null;
  let mt = 0;
  let mT = 0;
  for (let i = 0; i < n; i++) {
    mt += t[i] as number;
    mT += T[i] as number;
  }
  mt /= n;
  mT /= n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    const dt = (t[i] as number) - mt;
    sxx += dt * dt;
    sxy += dt * ((T[i] as number) - mT);
  }
  return sxx > 0 ? sxy / sxx : null;
}

/** Evaluates the alarms along the series (rows in arrival order; decided rows only). */
export function evaluateAlarms(rows: readonly WatchRow[], settings: AlarmSettings): AlarmState {
  const marks = new Map<number, AlarmMark[]>();
  const crossings: number[] = [];
  let now: AlarmMark[] = [];
  const { band, rate } = settings;
  if (!band && !rate) return { marks, now, crossings };
  // Decided readings in the rate window (seconds and kelvin), oldest first.
  const wt: number[] = [];
  const wT: number[] = [];
  const was = { band: false, rate: false };
  for (const row of rows) {
    const T = chosenTemperature(row).temperature_K;
    if (T === null) continue;
    const here: AlarmMark[] = [];
    if (band && (T < band.low_K || T > band.high_K)) {
      const by = T < band.low_K ? band.low_K - T : T - band.high_K;
      here.push({ kind: 'band', crossing: !was.band, message: `${kelvin(T)} is ${mK(by)} ${T < band.low_K ? 'below' : 'above'} the band ${kelvin(band.low_K)}–${kelvin(band.high_K)}` });
    }
    was.band = here.some((m) => m.kind === 'band');
    if (rate) {
      const t = row.time_ms / 1000;
      wt.push(t);
      wT.push(T);
      while (wt.length > 0 && (wt[0] as number) < t - rate.window_s) {
        wt.shift();
        wT.shift();
      }
      const s = slope(wt, wT);
      const out = s !== null && Math.abs(s) > rate.limit_K_s;
      if (out && s !== null) {
        here.push({
          kind: 'rate',
          crossing: !was.rate,
          message: `${s < 0 ? 'cooling' : 'warming'} at ${mK(Math.abs(s) * 60)}/min over the last ${Number((rate.window_s / 60).toPrecision(3))} min (limit ${mK(rate.limit_K_s * 60)}/min)`,
        });
      }
      was.rate = out;
    }
    if (here.length > 0) {
      marks.set(row.seq, here);
      if (here.some((m) => m.crossing)) crossings.push(row.seq);
    }
    now = here;
  }
  return { marks, now, crossings };
}

/** The page title while an alarm holds on the newest reading (seen from another window), else `base`. */
export function alarmTitle(now: readonly AlarmMark[], base: string): string {
  if (now.length === 0) return base;
  return `(!) ${now.map((m) => (m.kind === 'band' ? 'Band' : 'Rate')).join(' + ')} alarm: ${now[0]?.message} · ${base}`;
}
