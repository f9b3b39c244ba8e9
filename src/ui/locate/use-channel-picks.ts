import { useEffect, useMemo, useState } from 'react';
import type { TracePickOptions } from '../../io/trace-pick';
import { traceEngine } from '../converter/trace/trace-engine';
import { type PickState, pickOptionsOf } from '../converter/trace/trace-picks';
import type { TracePickerSettings } from './trace-arrivals';

/** The worker's pick options for one channel: no heater, so time zero is the file's t = 0. */
export function channelPickOptions(settings: TracePickerSettings, channel: string): TracePickOptions {
  return pickOptionsOf({
    picker: settings.picker,
    heater: null,
    sensor: channel,
    polarity: settings.polarity,
    threshold: settings.threshold,
    fraction: settings.fraction,
    from_s: settings.from_s,
    to_s: settings.to_s,
  });
}

interface Asked {
  fileId: string;
  channels: readonly string[];
  settings: TracePickerSettings;
}

/**
 * The pick of every channel of a file read by the trace worker, with these settings; asked again
 * when the file, the channels or the settings change. Derived results, so held here, not in the store.
 */
export function useChannelPicks(fileId: string | null, channels: readonly string[], settings: TracePickerSettings): ReadonlyMap<string, PickState> {
  const key = fileId === null ? '' : JSON.stringify({ fileId, channels, settings } satisfies Asked);
  const [answered, setAnswered] = useState<{ key: string; picks: ReadonlyMap<string, PickState> }>({ key: '', picks: new Map() });
  useEffect(() => {
    if (key === '') return;
    const asked = JSON.parse(key) as Asked;
    let live = true;
    const settle = (channel: string, state: PickState) => {
      if (live) setAnswered((a) => (a.key === key ? { key, picks: new Map(a.picks).set(channel, state) } : a));
    };
    setAnswered({ key, picks: new Map() });
    for (const channel of asked.channels) {
      traceEngine()
        .pick(asked.fileId, channelPickOptions(asked.settings, channel))
        .then(
          (pick) => settle(channel, { status: 'picked', pick }),
          (error: unknown) => settle(channel, { status: 'failed', message: error instanceof Error ? error.message : String(error) }),
        );
    }
    return () => {
      live = false;
    };
  }, [key]);
  return useMemo(() => {
    const out = new Map<string, PickState>();
    for (const channel of channels) out.set(channel, (answered.key === key ? answered.picks.get(channel) : undefined) ?? { status: 'picking' });
    return out;
  }, [answered, key, channels]);
}
