import { useEffect, useId } from 'react';
import { PanelErrorBoundary } from '../../layout/PanelErrorBoundary';
import { useSekundoStore } from '../../store';
import { ChoiceCard } from '../ChoiceCard';
import { DropZone } from '../DropZone';
import { SetupCard } from '../SetupCard';
import { PickerCard } from '../trace/TraceMode';
import { followAlarms } from './watch-alarm-state';
import { demoSource } from './watch-demo';
import { useWatchLive } from './watch-live';
import { pauseWatch, readGivenFiles, resumeWatch, startOver, startWatch, stopWatch } from './watch-runner';
import { canFollowFolders, folderSource, pickFolder } from './watch-sources';
import { compileWatchPattern } from '../../../io/watch-pattern';
import { QuantityField, TextField } from '../../fields';
import { WATCH_FIELDS } from './watch-fields';
import { WatchResults } from './WatchResults';

/** "Follow a folder": the trace files of a running cooldown, read as they arrive, into a live temperature. */
export function WatchMode() {
  useEffect(() => followAlarms(), []);
  const live = useWatchLive();
  return (
    <div className="converter-grid">
      <div className="converter-inputs">
        <PanelErrorBoundary panel="folder to follow">
          <FolderCard />
        </PanelErrorBoundary>
        <PanelErrorBoundary panel="picker options">
          <PickerCard channels={live.channels} lead="Files are picked as the trace lab picks them. A change applies to the files read after it; “Read all again” reads every file with it." />
        </PanelErrorBoundary>
        <SetupCard title="Distance and offset" pairs={['distance', 'offset']} lead="A change converts every file read so far again." />
        <PanelErrorBoundary panel="choice of candidate">
          <ChoiceCard series />
        </PanelErrorBoundary>
        <PanelErrorBoundary panel="alarms">
          <AlarmCard />
        </PanelErrorBoundary>
      </div>
      <div className="converter-results">
        <PanelErrorBoundary panel="live temperature">
          <WatchResults />
        </PanelErrorBoundary>
      </div>
    </div>
  );
}

const STATUS_WORDS = { idle: 'Not following', running: 'Following', paused: 'Paused' } as const;

function FolderCard() {
  const headingId = useId();
  const status = useSekundoStore((s) => s.watchStatus);
  const source = useSekundoStore((s) => s.watchSource);
  const notice = useSekundoStore((s) => s.watchNotice);
  const pattern = useSekundoStore((s) => s.watchPattern);
  const setPattern = useSekundoStore((s) => s.setWatchPattern);
  const interval_s = useSekundoStore((s) => s.watchInterval_s);
  const setInterval_s = useSekundoStore((s) => s.setWatchInterval);
  const setNotice = useSekundoStore((s) => s.setWatchNotice);
  const supported = canFollowFolders();
  const live = useWatchLive();
  const applyPattern = (text: string): string | null => {
    try {
      compileWatchPattern(text);
      setPattern(text.trim());
      return null;
    } catch (error) {
      return `File pattern: ${error instanceof Error ? error.message : String(error)}. The pattern ${pattern} stays in effect.`;
    }
  };
  const choose = async () => {
    try {
      const handle = await pickFolder();
      if (!handle) return;
      startWatch(folderSource(handle, compileWatchPattern(useSekundoStore.getState().watchPattern)));
    } catch (error) {
      setNotice(`The folder could not be opened: ${error instanceof Error ? error.message : String(error)}.`);
    }
  };
  const running = status !== 'idle';
  return (
    <section className="card converter-card" aria-labelledby={headingId}>
      <h2 id={headingId} className="card-title">
        Folder to follow
      </h2>
      <p className="muted converter-card__lead">
        Pick the folder your oscilloscope or digitiser saves its traces into. Sekundo looks into it every few seconds and reads each new file once its
        size has stopped changing between two looks (a file still being written waits), in the background, as the trace lab reads a dropped file. It
        only reads the folder; it never writes there.
      </p>
      {supported ? (
        <div className="watch-actions">
          <button type="button" className="button" onClick={() => void choose()}>
            Choose a folder to follow
          </button>
          <button type="button" className="button button--small" onClick={() => startWatch(demoSource())}>
            Replay the invented demo run
          </button>
        </div>
      ) : (
        <>
          <p className="watch-unsupported" role="status">
            This browser cannot follow a folder: it has no folder picker for web pages (the File System Access API; Chromium-based browsers such as
            Chrome and Edge have it). Drop the trace files here as they arrive instead: each is read, picked and added to the series the same way.
          </p>
          <DropZone buttonLabel="Choose trace files" multiple onFiles={readGivenFiles}>
            <div className="drop-zone__extra">
              <button type="button" className="button button--small" onClick={() => startWatch(demoSource())}>
                Replay the invented demo run
              </button>
            </div>
          </DropZone>
        </>
      )}
      <div className="watch-settings">
        <TextField
          fieldKey="converter.watchPattern"
          label="File pattern"
          value={pattern}
          apply={applyPattern}
          range="a file-name pattern: * any text, ? one character, [0-9] a set, {csv,txt} alternatives"
          hint={
            <>
              Names of the files to read: * any text, ? one character, [0-9] one of a set, {'{csv,txt}'} one of a few; any case. Applies from the next
              folder chosen.
            </>
          }
        />
        <QuantityField
          fieldKey="converter.watch.interval"
          spec={WATCH_FIELDS.interval}
          value={interval_s}
          apply={(v) => {
            if (v !== null) setInterval_s(v);
            return null;
          }}
        />
      </div>
      {notice ? (
        <p className="field-error" role="alert">
          {notice}
        </p>
      ) : null}
      <div className="watch-status" aria-live="polite">
        <p>
          <strong>{STATUS_WORDS[status]}</strong>
          {source ? ` ${source.kind === 'folder' ? `folder “${source.name}”` : source.name}` : ''}
          {source ? ` · ${live.rows.length.toLocaleString('en')} read` : ''}
          {live.failedCount > 0 ? ` · ${live.failedCount.toLocaleString('en')} not read` : ''}
          {live.waiting.length > 0 ? ` · ${live.waiting.length.toLocaleString('en')} waiting (still being written or not yet looked at twice)` : ''}
          {live.lastLook_ms !== null && status !== 'idle' ? ` · last look ${new Date(live.lastLook_ms).toLocaleTimeString('en-GB')}` : ''}
        </p>
        {live.listError ? <p className="field-error">{live.listError}</p> : null}
      </div>
      <div className="watch-actions">
        {status === 'running' ? (
          <button type="button" className="button button--small" onClick={pauseWatch}>
            Pause
          </button>
        ) : null}
        {status === 'paused' ? (
          <button type="button" className="button button--small" onClick={resumeWatch}>
            Resume
          </button>
        ) : null}
        {running ? (
          <button type="button" className="button button--small" onClick={stopWatch}>
            Stop following
          </button>
        ) : null}
        {source ? (
          <button type="button" className="button button--small" onClick={() => startOver()}>
            Read all again
          </button>
        ) : null}
      </div>
    </section>
  );
}

function AlarmCard() {
  const headingId = useId();
  const a = useSekundoStore((s) => s.watchAlarms);
  const set = useSekundoStore((s) => s.setWatchAlarms);
  /** Takes a good value (these fields allow no empty value: null never comes); the field shows no refusal. */
  const applied = (change: Partial<Record<'low_K' | 'high_K' | 'rate_mK_min' | 'window_min', number | null>>): null => {
    const values = Object.fromEntries(Object.entries(change).filter(([, v]) => v !== null)) as Partial<Record<string, number>>;
    set(values);
    return null;
  };
  return (
    <section className="card converter-card" aria-labelledby={headingId}>
      <h2 id={headingId} className="card-title">
        Alarms
      </h2>
      <p className="muted converter-card__lead">
        An alarm marks the chart and the table where it begins, and the page’s title shows it while the newest reading is in alarm, so it is seen from
        another window. It watches the chosen temperature (not its interval). Silent unless you ask for a tone.
      </p>
      <fieldset className="watch-alarm">
        <legend>
          <label>
            <input type="checkbox" checked={a.bandOn} onChange={(e) => set({ bandOn: e.target.checked })} /> Band: alarm outside
          </label>
        </legend>
        <div className="watch-alarm__pair">
          <QuantityField
            fieldKey="converter.watch.band-low"
            spec={WATCH_FIELDS.bandLow}
            value={a.low_K}
            apply={(low_K) => (low_K !== null && low_K >= a.high_K ? `Band from must be below the upper edge, ${a.high_K} K.` : applied({ low_K }))}
          />
          <QuantityField
            fieldKey="converter.watch.band-high"
            spec={WATCH_FIELDS.bandHigh}
            value={a.high_K}
            apply={(high_K) => (high_K !== null && high_K <= a.low_K ? `Band to must be above the lower edge, ${a.low_K} K.` : applied({ high_K }))}
          />
        </div>
      </fieldset>
      <fieldset className="watch-alarm">
        <legend>
          <label>
            <input type="checkbox" checked={a.rateOn} onChange={(e) => set({ rateOn: e.target.checked })} /> Rate: alarm when the bath changes faster than
          </label>
        </legend>
        <div className="watch-alarm__pair">
          <QuantityField
            fieldKey="converter.watch.rate"
            spec={WATCH_FIELDS.rate}
            value={a.rate_mK_min}
            apply={(rate_mK_min) => applied({ rate_mK_min })}
          />
          <QuantityField
            fieldKey="converter.watch.window"
            spec={WATCH_FIELDS.window}
            value={a.window_min}
            apply={(window_min) => applied({ window_min })}
          />
        </div>
      </fieldset>
      <label className="watch-sound">
        <input type="checkbox" checked={a.sound} onChange={(e) => set({ sound: e.target.checked })} /> Play a short tone when an alarm begins
      </label>
    </section>
  );
}
