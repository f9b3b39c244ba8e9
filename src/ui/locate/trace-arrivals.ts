/**
 * Arrival times from a digitiser file with one channel per sensor: which channel belongs to which
 * sensor (by name unless the person chose otherwise), and the picks turned into sensor arrivals (with the picker's sd as the sensor's timing sd).
 * Pure: the panel (LocateTraces.tsx) and the store (locate-slice.ts) call these.
 */
import { LOCATE_ARRIVAL_RANGE_S, LOCATE_ARRIVAL_SD_RANGE_S } from '../../io/locate-csv';
import type { PickerKind } from '../../physics';
import { PICKER_FIELD_SPECS } from '../fields/picker-specs';
import type { Polarity } from '../converter/trace/trace-protocol';
// Types only: the store imports this file, and must not start the trace worker's module.
import { plain } from '../units/format-number';
import type { PickState } from '../converter/trace/trace-picks';
import type { LocateRowInput } from './locate-inputs';

/**
 * What the person chose for each channel, by channel name: a sensor's row key, or null for "not
 * used". A channel not in the record (or whose chosen sensor is gone) is matched by name.
 */
export type ChannelChoice = Readonly<Record<string, string | null>>;

/** One channel and the sensor it gives an arrival to (null: not used). */
export interface ChannelMatch {
  channel: string;
  row: LocateRowInput | null;
  /** Matched by name (no choice made, or the chosen sensor was removed). */
  byName: boolean;
}

/** The picker and its settings (SI); every number has passed its field's check. */
export interface TracePickerSettings {
  picker: PickerKind;
  polarity: Polarity;
  /** Threshold picker: noise sd. */
  threshold: number;
  /** Fraction picker: fraction of the peak. */
  fraction: number;
  /** Search window on the file's clock, s; null: from t = 0 / to the end of the record. */
  from_s: number | null;
  to_s: number | null;
}

/**
 * The panel starts with the fraction-of-peak picker at half height: unlike a threshold in noise
 * sd, it finds the same point of the pulse on a near sensor and a far one, whatever their heights.
 */
export const DEFAULT_TRACE_PICKER: TracePickerSettings = {
  picker: 'fraction',
  polarity: 'auto',
  threshold: PICKER_FIELD_SPECS.threshold.initial,
  fraction: PICKER_FIELD_SPECS.fraction.initial,
  from_s: null,
  to_s: null,
};

const folded = (s: string) => s.trim().toLowerCase();
/** A message as a sentence: ends with a full stop. */
const sentence = (s: string) => (/[.!?]$/.test(s.trim()) ? s.trim() : `${s.trim()}.`);

/** The sensor whose label is the channel's name: the same text first, else the same but for case. */
export function sensorNamed(channel: string, rows: readonly LocateRowInput[]): LocateRowInput | null {
  return rows.find((r) => r.label === channel) ?? rows.find((r) => folded(r.label) === folded(channel)) ?? null;
}

/** Each channel with its sensor: the person's choice where one stands, else the sensor of the same name. */
export function matchChannels(channels: readonly string[], rows: readonly LocateRowInput[], choice: ChannelChoice): ChannelMatch[] {
  return channels.map((channel) => {
    const chosen = choice[channel];
    if (chosen === null) return { channel, row: null, byName: false };
    const row = chosen === undefined ? undefined : rows.find((r) => r.key === chosen);
    return row ? { channel, row, byName: false } : { channel, row: sensorNamed(channel, rows), byName: true };
  });
}

/** Sensors that more than one channel would write to, each as a sentence naming the channels. */
export function matchConflicts(matches: readonly ChannelMatch[]): string[] {
  const bySensor = new Map<string, { label: string; channels: string[] }>();
  for (const m of matches) {
    if (!m.row) continue;
    const entry = bySensor.get(m.row.key) ?? { label: m.row.label, channels: [] };
    entry.channels.push(m.channel);
    bySensor.set(m.row.key, entry);
  }
  return [...bySensor.values()]
    .filter((e) => e.channels.length > 1)
    .map((e) => `Channels ${e.channels.map((c) => `“${c}”`).join(' and ')} are all matched to sensor ${e.label}: choose one, and set the others to “not used”.`);
}

/** A sensor's new arrival and timing sd, s. */
export interface ArrivalUpdate {
  key: string;
  arrival_s: number;
  arrivalSd_s: number;
}

/**
 * The arrivals the matched channels give, and a sentence for each matched channel that gives none
 * (its pick failed or is out of range). Channels still being picked give neither.
 */
export function arrivalsFromPicks(matches: readonly ChannelMatch[], picks: ReadonlyMap<string, PickState>): { updates: ArrivalUpdate[]; failures: string[] } {
  const updates: ArrivalUpdate[] = [];
  const failures: string[] = [];
  for (const m of matches) {
    if (!m.row) continue;
    const state = picks.get(m.channel);
    const who = `Channel “${m.channel}” (sensor ${m.row.label})`;
    if (!state || state.status === 'picking') continue;
    if (state.status === 'failed') {
      failures.push(`${who}: no arrival picked — ${sentence(state.message)}`);
      continue;
    }
    const { arrival_s, arrivalSd_s } = state.pick;
    if (!(arrival_s >= LOCATE_ARRIVAL_RANGE_S[0] && arrival_s <= LOCATE_ARRIVAL_RANGE_S[1])) {
      failures.push(`${who}: the pick at ${plain(arrival_s)} s is outside the arrival range ${plain(LOCATE_ARRIVAL_RANGE_S[0])} to ${plain(LOCATE_ARRIVAL_RANGE_S[1])} s.`);
      continue;
    }
    if (!(arrivalSd_s >= LOCATE_ARRIVAL_SD_RANGE_S[0] && arrivalSd_s <= LOCATE_ARRIVAL_SD_RANGE_S[1])) {
      failures.push(`${who}: the pick’s sd ${plain(arrivalSd_s)} s is outside the timing-sd range: above 0, up to ${plain(LOCATE_ARRIVAL_SD_RANGE_S[1])} s.`);
      continue;
    }
    updates.push({ key: m.row.key, arrival_s, arrivalSd_s });
  }
  return { updates, failures };
}

/** The rows with the given arrivals and sds written in; every other row and field as it was. */
export function withArrivals(rows: readonly LocateRowInput[], updates: readonly ArrivalUpdate[]): LocateRowInput[] {
  const byKey = new Map(updates.map((u) => [u.key, u]));
  return rows.map((r) => {
    const u = byKey.get(r.key);
    return u ? { ...r, arrival_s: u.arrival_s, arrivalSd_s: u.arrivalSd_s } : r;
  });
}
