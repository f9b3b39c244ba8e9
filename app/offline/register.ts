/**
 * Registers the offline cache (sw.js, written by the build) so the page works without a network
 * after its first load. Only in the built page, and only over http(s): a page opened from a
 * folder (file://) cannot have a service worker and simply works as it is.
 *
 * When a new build is installed while this page runs (or was installed on an earlier visit), the
 * page says so and offers to reload ({@link useUpdateOffer}); the new worker takes over only when
 * the person agrees, and the open plan is autosaved before the reload.
 */
import { create } from 'zustand';
import { autosaveNow } from '../../src/ui/workspace/persist-workspace';

interface UpdateOffer {
  /** The new build's worker, installed and waiting; null: none. */
  waiting: ServiceWorker | null;
}

/** Whether a new build waits to take over. */
export const useUpdateOffer = create<UpdateOffer>()(() => ({ waiting: null }));

let reloadWanted = false;

/** Reload into the new build: the open plan is saved, the new worker takes over, the page reloads. */
export function reloadIntoUpdate(): void {
  const worker = useUpdateOffer.getState().waiting;
  if (!worker) return;
  autosaveNow();
  reloadWanted = true;
  worker.postMessage({ type: 'sekundo-update-now' });
}

export function registerOfflineCache(): void {
  if (!import.meta.env.PROD) return;
  if (!('serviceWorker' in navigator)) return;
  if (location.protocol !== 'http:' && location.protocol !== 'https:') return;
  const container = navigator.serviceWorker;
  container.addEventListener('controllerchange', () => {
    if (reloadWanted) location.reload();
  });
  const offer = (worker: ServiceWorker | null) => {
    // The first install (nothing controls the page yet) needs no reload.
    if (worker && container.controller) useUpdateOffer.setState({ waiting: worker });
  };
  container
    .register('./sw.js')
    .then((registration) => {
      offer(registration.waiting);
      registration.addEventListener('updatefound', () => {
        const worker = registration.installing;
        worker?.addEventListener('statechange', () => {
          if (worker.state === 'installed') offer(worker);
        });
      });
    })
    .catch(() => {
      // Without it the page still works online; there is nothing more to do.
    });
}
