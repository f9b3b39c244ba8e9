/**
 * Runs a followed folder in the page: the follow loop (src/io/folder-watch.ts) looks at the source
 * every few seconds; each file that has settled is opened and read by the trace worker through the
 * same calls as a dropped trace (traceEngine().parse, then .pick with the trace lab's picker
 * settings), its samples dropped at once (forget), and its pick added to the live series
 * (watch-live.ts), converted with the converter's distance, offset and choice of candidate. A file
 * that cannot be read or picked is listed with its message and the run goes on. Nothing is written
 * to the source: a folder is opened read-only.
 */
import { type FolderPoller, followFolder, realSleep } from '../../../io/folder-watch';
import { FolderPoller as Poller } from '../../../io/folder-poll';
import type { WatchSettings } from '../../../io/watch-series';
import { compileWatchPattern } from '../../../io/watch-pattern';
import { useSekundoStore } from '../../store';
import type { SekundoState } from '../../store/state';
import { choiceRuleOf } from '../converter-checks';
import { defaultChannels } from '../trace/trace-loader';
import { traceEngine } from '../trace/trace-engine';
import { pickOptionsOf } from '../trace/trace-picks';
import { HeldUntilTypingPauses, watchTyping } from '../../layout/typing-pause';
import { watchLive } from './watch-live';
import { filesSource, type WatchSource } from './watch-sources';

interface Run {
  source: WatchSource;
  controller: AbortController;
  poller: FolderPoller;
}

let run: Run | null = null;
let lastSource: WatchSource | null = null;
let fileCounter = 0;
let followingSettings = false;

/** Distance, offset and start rule from the converter's inputs (SI). */
export function watchSettingsOf(s: SekundoState): WatchSettings {
  const v = s.converterValues;
  return {
    distance_m: v.distance ?? 0.05,
    distanceSd_m: v.distanceSd ?? 0,
    offset_s: v.offset ?? 0,
    offsetSd_s: v.offsetSd ?? 0,
    start: choiceRuleOf(s.converterChoice, v),
  };
}

/**
 * New settings once typing pauses: a distance typed converts every file read so far again
 * (0.2–0.6 s at 10 000 files), which is not done on each keystroke.
 */
const settingsAfterTyping = new HeldUntilTypingPauses<WatchSettings>((next) => watchLive.configure(next));

/** Keeps the live series built with the converter's current settings (from the first run on). */
function followSettings(): void {
  settingsAfterTyping.drop();
  watchLive.configure(watchSettingsOf(useSekundoStore.getState()));
  if (followingSettings) return;
  followingSettings = true;
  watchTyping();
  useSekundoStore.subscribe((s) => settingsAfterTyping.offer(watchSettingsOf(s)));
}

function pickOptionsNow() {
  const s = useSekundoStore.getState();
  const v = s.converterValues;
  return pickOptionsOf({
    picker: s.converterTracePicker,
    heater: s.converterTraceHeater,
    sensor: s.converterTraceSensor,
    polarity: s.converterTracePolarity,
    threshold: v.threshold,
    fraction: v.fraction,
    from_s: v.searchFrom,
    to_s: v.searchTo,
  });
}

function intervalOf(source: WatchSource): number {
  return source.interval_ms ?? useSekundoStore.getState().watchInterval_s * 1000;
}

function messageOf(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

/** Reads one file through the trace worker and adds it to the series (or to the unreadable files). */
async function readFile(source: WatchSource, name: string, modified_ms: number, again: boolean): Promise<void> {
  let blob: Blob;
  try {
    blob = await source.open(name);
  } catch (error) {
    watchLive.fail(name, `It went away before it could be read (${messageOf(error)}).`);
    return;
  }
  fileCounter += 1;
  const id = `watch-${fileCounter}`;
  const engine = traceEngine();
  try {
    const info = await engine.parse(id, blob, () => undefined);
    watchLive.seen(info.channels);
    const store = useSekundoStore.getState();
    if (store.converterTraceHeater === null && store.converterTraceSensor === null && watchLive.get().rows.length === 0) {
      store.setConverterTraceChannels(defaultChannels(info.channels));
    }
    let pick: Awaited<ReturnType<typeof engine.pick>>;
    try {
      pick = await engine.pick(id, pickOptionsNow());
    } catch (error) {
      watchLive.fail(name, `No arrival picked: ${messageOf(error)}`);
      return;
    }
    watchLive.add(
      {
        file: name,
        fields: info.fields,
        modified_ms: blob instanceof File ? blob.lastModified : modified_ms,
        pick: { delay_s: pick.delay_s, delaySd_s: pick.delaySd_s, snr: pick.snr, sensor: pick.sensor, picker: pick.picker },
        problem: null,
      },
      again,
      info.channels,
    );
  } catch (error) {
    watchLive.fail(name, messageOf(error));
  } finally {
    engine.forget(id);
  }
}

/**
 * Starts following `source` (stopping any run before): the series starts empty. Returns false with
 * a notice in the store when the pattern cannot be read.
 */
export function startWatch(source: WatchSource): boolean {
  const store = useSekundoStore.getState();
  let matches: (name: string) => boolean;
  try {
    matches = compileWatchPattern(store.watchPattern);
  } catch (error) {
    store.setWatchNotice(`File pattern: ${messageOf(error)}.`);
    return false;
  }
  stopWatch();
  followSettings();
  watchLive.clear();
  const controller = new AbortController();
  const poller = new Poller(matches);
  const current: Run = { source, controller, poller };
  lastSource = source;
  run = current;
  store.setWatchNotice(null);
  store.setWatchSource({ kind: source.kind, name: source.name });
  store.setWatchStatus('running');
  void followFolder({
    source,
    poller,
    interval_ms: intervalOf(source),
    // The interval is read at each wait, so a new setting takes effect at once.
    sleep: (_ms, signal) => realSleep(intervalOf(source), signal),
    signal: controller.signal,
    paused: () => useSekundoStore.getState().watchStatus === 'paused',
    onEvent: async (event) => {
      if (event.kind === 'renamed') watchLive.rename(event.from, event.to);
      else if (event.kind === 'ready') await readFile(source, event.entry.name, event.entry.modified_ms, event.again);
      if (!controller.signal.aborted) watchLive.looked(poller.waiting(), null, Date.now());
    },
    onListError: (error) => watchLive.looked(poller.waiting(), `The folder could not be looked at (${messageOf(error)}); trying again.`, Date.now()),
  }).then(() => {
    if (run !== current) return;
    watchLive.looked(poller.waiting(), null, Date.now());
    watchLive.flush();
  });
  return true;
}

/** Pauses: the folder is not looked at until resumed (the series stays). */
export function pauseWatch(): void {
  if (run) useSekundoStore.getState().setWatchStatus('paused');
}

export function resumeWatch(): void {
  if (run) useSekundoStore.getState().setWatchStatus('running');
}

/** Stops following (the series stays, to read and export). */
export function stopWatch(): void {
  if (!run) return;
  run.controller.abort();
  run = null;
  useSekundoStore.getState().setWatchStatus('idle');
  watchLive.flush();
}

/** Reads every file of the source again, with the settings of now (the picker too). */
export function startOver(): boolean {
  return lastSource ? startWatch(lastSource) : false;
}

let given: Promise<void> = Promise.resolve();

/**
 * Reads files given at once (dropped or chosen, where no folder can be followed) through the same
 * path, one after another, adding them to the series of earlier dropped files; a file dropped again
 * under the same name replaces its row.
 */
export function readGivenFiles(files: readonly File[]): void {
  const store = useSekundoStore.getState();
  const keep = store.watchSource?.kind === 'files';
  stopWatch();
  followSettings();
  if (!keep) watchLive.clear();
  lastSource = null;
  store.setWatchNotice(null);
  store.setWatchSource({ kind: 'files', name: 'dropped files' });
  store.setWatchStatus('running');
  const source = filesSource(files);
  given = given.then(async () => {
    for (const f of files) {
      const again = watchLive.get().rows.some((r) => r.file === f.name);
      await readFile(source, f.name, f.lastModified, again);
    }
    watchLive.flush();
    if (useSekundoStore.getState().watchSource?.kind === 'files' && run === null) useSekundoStore.getState().setWatchStatus('idle');
  });
}

/** Whether a run is going (running or paused). */
export function watchRunning(): boolean {
  return run !== null;
}
