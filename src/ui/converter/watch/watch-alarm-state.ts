/**
 * The alarms of the run as they stand: evaluated once per change of the series or of the alarm
 * inputs (shared by the chart, the table and the title), shown in the page title while the newest
 * reading is in alarm (seen from another window or tab), and, only when the person asked for it,
 * a short tone when an alarm begins. No sound by default.
 */
import { useMemo } from 'react';
import { useSekundoStore } from '../../store';
import { type AlarmSettings, type AlarmState, alarmTitle, evaluateAlarms } from './watch-alarms';
import { useWatchLive, type WatchLiveSnapshot, watchLive } from './watch-live';
import type { WatchAlarmInputs } from './watch-slice';

/** The alarm inputs in the evaluator's terms (SI). */
export function alarmSettingsOf(a: WatchAlarmInputs): AlarmSettings {
  return {
    band: a.bandOn ? { low_K: a.low_K, high_K: a.high_K } : null,
    rate: a.rateOn ? { limit_K_s: a.rate_mK_min / 1000 / 60, window_s: a.window_min * 60 } : null,
  };
}

let cache: { version: number; inputs: WatchAlarmInputs; state: AlarmState } | null = null;

/** The alarms for this snapshot and these inputs (computed once for both). */
export function alarmsFor(snapshot: WatchLiveSnapshot, inputs: WatchAlarmInputs): AlarmState {
  if (cache && cache.version === snapshot.version && cache.inputs === inputs) return cache.state;
  const state = evaluateAlarms(snapshot.rows, alarmSettingsOf(inputs));
  cache = { version: snapshot.version, inputs, state };
  return state;
}

/** The alarms for a component. */
export function useWatchAlarms(): AlarmState {
  const live = useWatchLive();
  const inputs = useSekundoStore((s) => s.watchAlarms);
  return useMemo(() => alarmsFor(live, inputs), [live, inputs]);
}

let started = false;
let baseTitle = '';
let lastCrossing = -1;
let audio: AudioContext | null = null;

/** A short two-note tone (only when the person ticked "Sound"). */
function tone(): void {
  const Context = (globalThis as { AudioContext?: typeof AudioContext }).AudioContext;
  if (!Context) return;
  audio ??= new Context();
  const at = audio.currentTime;
  for (const [i, f] of [660, 880].entries()) {
    const osc = audio.createOscillator();
    const gain = audio.createGain();
    osc.frequency.value = f;
    gain.gain.setValueAtTime(0.15, at + i * 0.18);
    gain.gain.exponentialRampToValueAtTime(0.001, at + i * 0.18 + 0.16);
    osc.connect(gain).connect(audio.destination);
    osc.start(at + i * 0.18);
    osc.stop(at + i * 0.18 + 0.17);
  }
}

function update(): void {
  const inputs = useSekundoStore.getState().watchAlarms;
  const state = alarmsFor(watchLive.get(), inputs);
  document.title = alarmTitle(state.now, baseTitle);
  const newest = state.crossings[state.crossings.length - 1] ?? -1;
  if (newest > lastCrossing && inputs.sound) tone();
  lastCrossing = newest;
}

/** Keeps the page title (and the optional tone) in step with the alarms, from the first run on. */
export function followAlarms(): void {
  if (started || typeof document === 'undefined') return;
  started = true;
  baseTitle = document.title;
  watchLive.onPublish(update);
  useSekundoStore.subscribe((s, before) => {
    if (s.watchAlarms !== before.watchAlarms) update();
  });
}
