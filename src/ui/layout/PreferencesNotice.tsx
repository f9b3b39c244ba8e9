import { useSekundoStore } from '../store';
import { useWorkspaceStore } from '../workspace/workspace-store';

/**
 * Says once, quietly, that preferences cannot be kept (storage full or off); the page works on.
 * When the workspace has already said that this browser keeps nothing, one message is enough.
 */
export function PreferencesNotice() {
  const notice = useSekundoStore((s) => s.preferencesNotice);
  const dismiss = useSekundoStore((s) => s.setPreferencesNotice);
  const saidAlready = useWorkspaceStore((s) => !s.storageAvailable);
  if (!notice || saidAlready) return null;
  return (
    <div className="prefs-notice" role="status">
      <p>{notice}</p>
      <button type="button" className="inline-link-button" onClick={() => dismiss(null)}>
        Dismiss
      </button>
    </div>
  );
}
