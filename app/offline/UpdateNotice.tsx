import { reloadIntoUpdate, useUpdateOffer } from './register';

/** "A new version is ready": shown while a new build waits; reloading saves the plan first. */
export function UpdateNotice() {
  const waiting = useUpdateOffer((s) => s.waiting);
  if (!waiting) return null;
  return (
    <div className="workspace-notice" role="status">
      <p>A new version of Sekundo is ready. Reload to use it; your open plan is kept.</p>
      <button type="button" className="button button--small button--primary" onClick={reloadIntoUpdate}>
        Reload now
      </button>
    </div>
  );
}
