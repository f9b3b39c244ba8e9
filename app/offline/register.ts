/**
 * Registers the offline cache (sw.js, written by the build) so the page works without a network
 * after its first load. Only in the built page, and only over http(s): a page opened from a
 * folder (file://) cannot have a service worker and simply works as it is.
 */
export function registerOfflineCache(): void {
  if (!import.meta.env.PROD) return;
  if (!('serviceWorker' in navigator)) return;
  if (location.protocol !== 'http:' && location.protocol !== 'https:') return;
  navigator.serviceWorker.register('./sw.js').catch(() => {
    // Without it the page still works online; there is nothing more to do.
  });
}
