import { useSekundoStore } from '../store';

/** Says once, quietly, that preferences cannot be kept (storage full or off); the page works on. */
export function PreferencesNotice() {
  const notice = useSekundoStore((s) => s.preferencesNotice);
  const dismiss = useSekundoStore((s) => s.setPreferencesNotice);
  if (!notice) return null;
  return (
    <div className="prefs-notice" role="status">
      <p>{notice}</p>
      <button type="button" className="inline-link-button" onClick={() => dismiss(null)}>
        Dismiss
      </button>
    </div>
  );
}
