/**
 * Opening the trace file of the "from traces" panel: read in the converter's trace worker (the
 * same engine, its own file ids), with progress in the store and a cancel. A file that cannot be
 * read (too big, not a trace, cancelled) leaves everything as it was — the sensors, and the file
 * read before — and says why under the panel.
 */
import { overLimitText } from '../../io/byte-size';
import { useSekundoStore } from '../store';
import { TraceReadError, traceEngine } from '../converter/trace/trace-engine';
import { TRACE_FILE_LIMIT_BYTES } from '../converter/trace/trace-protocol';

/** Store key of messages about the trace file. */
export const TRACE_FILE_KEY = 'traces.file';
/** The demo traces beside the page (relative, so the built page works from any folder). */
export const DEMO_TRACES_URL = 'demo-locate-traces.csv';

let counter = 0;
/** The id of the file being read, or null. */
let reading: string | null = null;

function kept(): string {
  return useSekundoStore.getState().locateTraceFile ? 'the traces shown before are kept' : 'nothing was changed';
}

/** Reads a trace file; a file read replaces the one before, a refused one changes nothing. */
export async function openLocateTrace(file: Blob & { name: string }): Promise<void> {
  const store = useSekundoStore.getState();
  if (file.size > TRACE_FILE_LIMIT_BYTES) {
    store.refuseLocate(TRACE_FILE_KEY, `${file.name} is ${overLimitText(file.size, TRACE_FILE_LIMIT_BYTES)} for a trace file; ${kept()}.`);
    return;
  }
  if (reading !== null) traceEngine().cancel(reading);
  counter += 1;
  const id = `locate-trace-${counter}`;
  reading = id;
  store.clearLocateMessage(TRACE_FILE_KEY);
  store.setLocateTraceReading({ id, name: file.name, bytes: 0, totalBytes: file.size, rows: 0 });
  try {
    const info = await traceEngine().parse(id, file, (p) => {
      if (reading === id) useSekundoStore.getState().setLocateTraceReading({ id, name: file.name, ...p });
    });
    if (reading !== id) {
      traceEngine().forget(id);
      return;
    }
    const before = useSekundoStore.getState().locateTraceFile;
    if (before) traceEngine().forget(before.id);
    useSekundoStore.getState().setLocateTraceFile({ id, name: file.name, size: file.size, info });
  } catch (error) {
    if (reading !== id) return;
    const now = useSekundoStore.getState();
    now.setLocateTraceReading(null);
    const cancelled = error instanceof TraceReadError && error.cancelled;
    const why = (error instanceof Error ? error.message : String(error)).replace(/\.$/, '');
    now.refuseLocate(TRACE_FILE_KEY, cancelled ? `Reading ${file.name} was cancelled; ${kept()}.` : `${file.name} could not be read as a trace: ${why}. ${capital(kept())}.`);
  } finally {
    if (reading === id) reading = null;
  }
}

function capital(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** Stops the file being read; the panel keeps what it showed before. */
export function cancelLocateTrace(): void {
  if (reading !== null) traceEngine().cancel(reading);
}

/** Fetches the invented demo traces (Linnet-1) from beside the page and reads them. */
export async function openLocateDemoTraces(fetchFile: (url: string) => Promise<Response> = (url) => fetch(url)): Promise<void> {
  try {
    const response = await fetchFile(DEMO_TRACES_URL);
    if (!response.ok) throw new Error(`the server answered ${response.status}`);
    const bytes = await response.arrayBuffer();
    await openLocateTrace(new File([bytes], DEMO_TRACES_URL, { type: 'text/csv' }));
  } catch (error) {
    const why = error instanceof Error ? error.message : String(error);
    useSekundoStore.getState().refuseLocate(TRACE_FILE_KEY, `The demo traces could not be loaded (${why}); ${kept()}.`);
  }
}
