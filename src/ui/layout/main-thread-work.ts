/**
 * Work the page's workers normally do, done on the calling thread instead (where no worker runs):
 * noted in the performance timeline under its name, so a browser test can check that the page's
 * main thread did none of it. Quietly nothing where the timeline cannot take measures.
 */
export function noteThreadWork(name: string, start_ms: number): void {
  try {
    performance.measure(name, { start: start_ms, end: performance.now() });
  } catch {
    // No user timing here (an old browser, a test environment): nothing to note.
  }
}
