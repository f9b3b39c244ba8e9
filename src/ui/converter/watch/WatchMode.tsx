import { useEffect, useId, useState } from 'react';
import { WATCH_INTERVAL_RANGE_MS } from '../../../io/folder-watch';
import { PROPERTIES_RANGE_K } from '../../../physics';
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
import { WatchField } from './WatchField';
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
  const patternId = useId();
  const status = useSekundoStore((s) => s.watchStatus);
  const source = useSekundoStore((s) => s.watchSource);
  const notice = useSekundoStore((s) => s.watchNotice);
  const pattern = useSekundoStore((s) => s.watchPattern);
  const setPattern = useSekundoStore((s) => s.setWatchPattern);
  const interval_s = useSekundoStore((s) => s.watchInterval_s);
  const setInterval_s = useSekundoStore((s) => s.setWatchInterval);
  const setNotice = useSekundoStore((s) => s.setWatchNotice);
  const [patternText, setPatternText] = useState(pattern);
  const [patternError, setPatternError] = useState<string | null>(null);
  const supported = canFollowFolders();
  const live = useWatchLive();
  const applyPattern = () => {
    try {
      compileWatchPattern(patternText);
      setPattern(patternText.trim());
      setPatternError(null);
    } catch (error) {
      setPatternError(`File pattern: ${error instanceof Error ? error.message : String(error)}. The pattern ${pattern} stays in effect.`);
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
        <div className="converter-field">
          <label className="field-label" htmlFor={patternId}>
            File pattern
          </label>
          <input
            id={patternId}
            className="text-input"
            type="text"
            value={patternText}
            spellCheck={false}
            autoComplete="off"
            aria-invalid={patternError ? true : undefined}
            aria-describedby={`${patternId}-hint`}
            onChange={(e) => setPatternText(e.target.value)}
            onBlur={applyPattern}
            onKeyDown={(e) => {
              if (e.key === 'Enter') {
                e.preventDefault();
                applyPattern();
              }
            }}
          />
          <p id={`${patternId}-hint`} className="field-hint">
            Names of the files to read: * any text, ? one character, [0-9] one of a set, {'{csv,txt}'} one of a few; any case. Applies from the next
            folder chosen.
          </p>
          {patternError ? (
            <p className="field-error" role="alert">
              {patternError}
            </p>
          ) : null}
        </div>
        <WatchField
          label="Look every"
          value={interval_s}
          dimension="time"
          unit="s"
          range={[WATCH_INTERVAL_RANGE_MS[0] / 1000, WATCH_INTERVAL_RANGE_MS[1] / 1000]}
          onValue={setInterval_s}
          help={{
            what: 'Time between two looks into the folder. A file is read once two looks in a row find the same size and time, so it is read one to two looks after the digitiser has finished it.',
            units: 's; a bare number is seconds, or type 500 ms',
            range: 'Typical 2–10 s; valid 0.1–600 s',
            origin: '3 s: quick enough for a trace every few seconds, light on a network share (common practice, no source)',
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
  const [lo, hi] = PROPERTIES_RANGE_K;
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
          <WatchField
            label="Band from"
            value={a.low_K}
            dimension="temperature"
            unit="K"
            range={[lo, a.high_K]}
            onValue={(low_K) => set({ low_K })}
            help={{ what: 'Lower edge of the band the bath should stay in.', units: 'K; a bare number is kelvin, or type 1795 mK', range: `Valid ${lo} K up to the upper edge`, origin: '1.795 K: an example band of ±5 mK around 1.8 K' }}
          />
          <WatchField
            label="Band to"
            value={a.high_K}
            dimension="temperature"
            unit="K"
            range={[a.low_K, hi]}
            onValue={(high_K) => set({ high_K })}
            help={{ what: 'Upper edge of the band the bath should stay in.', units: 'K; a bare number is kelvin, or type 1805 mK', range: `Valid from the lower edge up to ${hi} K`, origin: '1.805 K: an example band of ±5 mK around 1.8 K' }}
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
          <WatchField
            label="Rate limit"
            value={a.rate_mK_min}
            dimension="number"
            unit="mK/min"
            range={[0.001, 1000]}
            onValue={(rate_mK_min) => set({ rate_mK_min })}
            help={{ what: 'Largest change of the bath temperature, up or down, before the alarm: the slope of a straight line through the readings of the window.', units: 'mK per minute', range: 'Valid 0.001–1000 mK/min', origin: '1 mK/min: an example; a regulated bath drifts far less (common practice, no source)' }}
          />
          <WatchField
            label="Rate over the last"
            value={a.window_min}
            dimension="number"
            unit="min"
            range={[0.1, 600]}
            onValue={(window_min) => set({ window_min })}
            help={{ what: 'The readings within this time before each one give its rate; a longer window averages the scatter of single readings away.', units: 'minutes', range: 'Valid 0.1–600 min', origin: '5 min: an example' }}
          />
        </div>
      </fieldset>
      <label className="watch-sound">
        <input type="checkbox" checked={a.sound} onChange={(e) => set({ sound: e.target.checked })} /> Play a short tone when an alarm begins
      </label>
    </section>
  );
}
