import { useId, useState } from 'react';
import { useSekundoStore } from '../store';
import { redoPlan, undoPlan } from './plan-history';
import { SavedPlansPanel } from './SavedPlansPanel';
import { printSetupSheet } from './SetupSheet';
import { shareUrl } from './share-actions';
import { useWorkspaceStore } from './workspace-store';

const isMac = typeof navigator !== 'undefined' && /Mac|iPhone|iPad/.test(navigator.platform);
const MOD = isMac ? '⌘' : 'Ctrl+';

/** Undo and redo, saved plans, the share link and the setup sheet, above the planner's editors. */
export function WorkspaceBar() {
  const canUndo = useWorkspaceStore((s) => s.past.length > 0);
  const canRedo = useWorkspaceStore((s) => s.future.length > 0);
  const savedCount = useWorkspaceStore((s) => s.savedPlans.length);
  const kept = useWorkspaceStore((s) => s.storageAvailable && s.storageNotice === null);
  const [panelOpen, setPanelOpen] = useState(false);
  const [link, setLink] = useState<{ url: string; copied: boolean } | null>(null);
  const panelId = useId();

  const copyLink = async () => {
    const url = shareUrl(useSekundoStore.getState().plannerPlan);
    let copied = false;
    try {
      await navigator.clipboard.writeText(url);
      copied = true;
    } catch {
      copied = false;
    }
    setLink({ url, copied });
  };

  return (
    <section className="card workspace-bar" aria-label="Workspace">
      <div className="workspace-bar__row">
        <div className="workspace-bar__group">
          <button type="button" className="button button--small" onClick={() => undoPlan()} disabled={!canUndo} aria-keyshortcuts="Control+Z Meta+Z" title={`Undo (${MOD}Z)`}>
            ↶ Undo
          </button>
          <button
            type="button"
            className="button button--small"
            onClick={() => redoPlan()}
            disabled={!canRedo}
            aria-keyshortcuts="Control+Shift+Z Meta+Shift+Z Control+Y"
            title={`Redo (${MOD}Shift+Z)`}
          >
            ↷ Redo
          </button>
        </div>
        <div className="workspace-bar__group">
          <button type="button" className="button button--small" aria-expanded={panelOpen} aria-controls={panelId} onClick={() => setPanelOpen((o) => !o)}>
            Saved plans ({savedCount})
          </button>
          <button type="button" className="button button--small" onClick={() => void copyLink()}>
            Copy share link
          </button>
          <button type="button" className="button button--small button--primary" onClick={printSetupSheet}>
            Print setup sheet
          </button>
        </div>
        <p className="workspace-bar__hint muted">
          {kept ? 'Every change is kept in this browser as you type.' : 'Changes are not being kept in this browser; save a plan file to keep them.'}
        </p>
      </div>
      {link ? (
        <div className="workspace-bar__link" role="status">
          <label>
            {link.copied ? 'Link copied. ' : 'Copy this link: '}It carries the whole plan in its “#” part, which browsers never send to a server.
            <input type="text" readOnly value={link.url} onFocus={(e) => e.currentTarget.select()} className="workspace-bar__link-input" aria-label="Share link" />
          </label>
          <button type="button" className="inline-link-button" onClick={() => setLink(null)}>
            Hide
          </button>
        </div>
      ) : null}
      {panelOpen ? <SavedPlansPanel id={panelId} /> : null}
    </section>
  );
}
