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
  readonly kind: 'band' | 'rate';
  /** True on the first row of a stretch in alarm. */
  readonly crossing: boolean;
  /** One line: what is out and by how much. */
  readonly message: string;
}

/** A mark whose words are written only when read (a long run marks thousands of rows; a page shows fifty). */
class Mark implements AlarmMark {
  constructor(
    readonly kind: 'band' | 'rate',
    readonly crossing: boolean,
    private readonly words: () => string,
  ) {}
  get message(): string {
    return this.words();
  }
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

/**
 * Running sums for the least-squares slope of (t, T) over a sliding window: O(1) per reading
 * entering or leaving. Times are counted from the first reading and temperatures from the first
 * temperature, so the sums keep their digits over a long run.
 */
class SlidingSlope {
  private t0 = Number.NaN;
  private T0 = Number.NaN;
  private n = 0;
  private st = 0;
  private sT = 0;
  private stt = 0;
  private stT = 0;
  private change(t_s: number, T_K: number, sign: 1 | -1): void {
    if (Number.isNaN(this.t0)) {
      this.t0 = t_s;
      this.T0 = T_K;
    }
    const t = t_s - this.t0;
    const T = T_K - this.T0;
    this.n += sign;
    this.st += sign * t;
    this.sT += sign * T;
    this.stt += sign * t * t;
    this.stT += sign * t * T;
  }
  add(t_s: number, T_K: number): void {
    this.change(t_s, T_K, 1);
  }
  remove(t_s: number, T_K: number): void {
    this.change(t_s, T_K, -1);
  }
  /** K/s, or null with fewer than two distinct times. */
  slope(): number | null {
    if (this.n < 2) return null;
    const sxx = this.stt - (this.st * this.st) / this.n;
    const sxy = this.stT - (this.st * this.sT) / this.n;
    // Times equal to within rounding: no slope.
    return sxx > 1e-9 * Math.max(1, this.stt) ? sxy / sxx : null;
  }
}

/** Evaluates the alarms along the series (rows in arrival order; decided rows only). */
export function evaluateAlarms(rows: readonly WatchRow[], settings: AlarmSettings): AlarmState {
  const marks = new Map<number, AlarmMark[]>();
  const crossings: number[] = [];
  let now: AlarmMark[] = [];
  const { band, rate } = settings;
  if (!band && !rate) return { marks, now, crossings };
  // Decided readings in the rate window (seconds and kelvin), oldest first, from `first` on.
  const wt: number[] = [];
  const wT: number[] = [];
  let first = 0;
  const window = new SlidingSlope();
  const was = { band: false, rate: false };
  for (const row of rows) {
    const T = chosenTemperature(row).temperature_K;
    if (T === null) continue;
    const here: AlarmMark[] = [];
    if (band && (T < band.low_K || T > band.high_K)) {
      const by = T < band.low_K ? band.low_K - T : T - band.high_K;
      here.push(new Mark('band', !was.band, () => `${kelvin(T)} is ${mK(by)} ${T < band.low_K ? 'below' : 'above'} the band ${kelvin(band.low_K)}–${kelvin(band.high_K)}`));
    }
    was.band = here.some((m) => m.kind === 'band');
    if (rate) {
      const t = row.time_ms / 1000;
      wt.push(t);
      wT.push(T);
      window.add(t, T);
      while (first < wt.length && (wt[first] as number) < t - rate.window_s) {
        window.remove(wt[first] as number, wT[first] as number);
        first += 1;
      }
      const s = window.slope();
      const out = s !== null && Math.abs(s) > rate.limit_K_s;
      if (out && s !== null) {
        const window_s = rate.window_s;
        const limit = rate.limit_K_s;
        here.push(
          new Mark('rate', !was.rate, () => `${s < 0 ? 'cooling' : 'warming'} at ${mK(Math.abs(s) * 60)}/min over the last ${Number((window_s / 60).toPrecision(3))} min (limit ${mK(limit * 60)}/min)`),
        );
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
