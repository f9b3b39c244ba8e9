import { useState } from 'react';
import type { SavedPlan } from '../../io/workspace-storage';
import { useSekundoStore } from '../store';
import { adoptKept, askDeleteAllKept, splitKept } from './kept-copies';
import { deleteSaved, duplicateSaved, openSaved, renameSaved, saveCurrentAs, saveCurrentOver } from './persist-workspace';
import { useWorkspaceStore } from './workspace-store';

function when(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : date.toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' });
}

/**
 * Named plans kept in this browser: save the open plan under a name; open, duplicate, rename, delete
 * (with undo). The copies the page kept by itself before replacing work are listed apart, can be
 * moved to the user's plans, and deleted one by one or all at once (after a question, with undo).
 */
export function SavedPlansPanel({ id }: { id: string }) {
  const plans = useWorkspaceStore((s) => s.savedPlans);
  const problems = useWorkspaceStore((s) => s.savedProblems);
  const currentId = useWorkspaceStore((s) => s.currentSavedId);
  const planName = useSekundoStore((s) => s.plannerPlan.name);
  const [name, setName] = useState(planName);
  const current = plans.find((p) => p.id === currentId) ?? null;
  const { own, kept } = splitKept(plans);
  return (
    <div id={id} className="saved-plans">
      <form
        className="saved-plans__save"
        onSubmit={(event) => {
          event.preventDefault();
          saveCurrentAs(name);
        }}
      >
        <label>
          Save the open plan as <input type="text" value={name} maxLength={120} onChange={(e) => setName(e.target.value)} />
        </label>
        <button type="submit" className="button button--small">
          Save as new
        </button>
        {current ? (
          <button type="button" className="button button--small" onClick={() => saveCurrentOver(current)}>
            Save over “{current.name}”
          </button>
        ) : null}
      </form>
      {problems.length > 0 ? (
        <ul className="field-error saved-plans__problems" role="alert">
          {problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      ) : null}
      {own.length === 0 ? (
        <p className="muted">{kept.length > 0 ? 'No plans saved by you yet; the page’s kept copies are below.' : 'No saved plans yet.'}</p>
      ) : (
        <ul className="saved-plans__list" aria-label="Saved plans">
          {own.map((p) => (
            <SavedRow key={p.id} saved={p} current={p.id === currentId} />
          ))}
        </ul>
      )}
      {kept.length > 0 ? (
        <section className="saved-plans__kept" aria-labelledby={`${id}-kept`}>
          <div className="saved-plans__kept-head">
            <h4 id={`${id}-kept`} className="saved-plans__kept-title">
              Kept copies ({kept.length})
            </h4>
            <button type="button" className="button button--small button--danger" onClick={() => askDeleteAllKept(kept)}>
              Delete all kept copies…
            </button>
          </div>
          <p className="muted saved-plans__kept-lead">
            Kept by the page before a link, a file, a saved plan or the demo replaced your work, so nothing was lost. An identical plan is kept once.
          </p>
          <ul className="saved-plans__list" aria-label="Kept copies">
            {kept.map((p) => (
              <SavedRow key={p.id} saved={p} current={p.id === currentId} />
            ))}
          </ul>
        </section>
      ) : null}
    </div>
  );
}

function SavedRow({ saved, current }: { saved: SavedPlan; current: boolean }) {
  const [renaming, setRenaming] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  if (renaming !== null) {
    return (
      <li className="saved-plans__row">
        <form
          className="saved-plans__rename"
          onSubmit={(event) => {
            event.preventDefault();
            const message = renameSaved(saved, renaming);
            setProblem(message);
            if (message === null) setRenaming(null);
          }}
        >
          <label>
            New name for “{saved.name}”{' '}
            <input type="text" value={renaming} maxLength={120} onChange={(e) => setRenaming(e.target.value)} />
          </label>
          <button type="submit" className="button button--small">
            Rename
          </button>
          <button type="button" className="button button--small button--quiet" onClick={() => setRenaming(null)}>
            Cancel
          </button>
          {problem ? (
            <p className="field-error" role="alert">
              {problem}
            </p>
          ) : null}
        </form>
      </li>
    );
  }
  return (
    <li className="saved-plans__row">
      <span className="saved-plans__name">
        {saved.name}
        {current ? <span className="badge"> open</span> : null}
      </span>
      <span className="saved-plans__when muted">{when(saved.savedAt)}</span>
      <span className="saved-plans__actions">
        <button type="button" className="button button--small" onClick={() => openSaved(saved)} aria-label={`Open “${saved.name}”`}>
          Open
        </button>
        <button type="button" className="button button--small" onClick={() => duplicateSaved(saved)} aria-label={`Duplicate “${saved.name}”`}>
          Duplicate
        </button>
        {saved.kept !== undefined ? (
          <button type="button" className="button button--small" onClick={() => adoptKept(saved)} aria-label={`Move “${saved.name}” to my plans`}>
            Move to my plans
          </button>
        ) : null}
        <button type="button" className="button button--small" onClick={() => setRenaming(saved.name)} aria-label={`Rename “${saved.name}”`}>
          Rename
        </button>
        <button type="button" className="button button--small button--danger" onClick={() => deleteSaved(saved)} aria-label={`Delete “${saved.name}”`}>
          Delete
        </button>
      </span>
    </li>
  );
}
