import { type KeyboardEvent, type ReactNode, useEffect, useRef } from 'react';
import { useSekundoStore } from '../store';
import { SetupSheetHost } from './SetupSheet';
import { answerQuestion } from './keep-plan';
import { acceptSharedPlan, declineSharedPlan } from './share-actions';
import { dismissToast, useWorkspaceStore } from './workspace-store';

/** Whether a workspace dialog (shared plan, setup sheet) holds the page; the page behind is then inert. */
export function useWorkspaceModal(): boolean {
  return useWorkspaceStore((s) => s.sharePrompt !== null || s.sheetOpen || s.question !== null);
}

/** Storage and link notices under the header. */
export function WorkspaceNotices() {
  const notice = useWorkspaceStore((s) => s.storageNotice);
  const linkProblem = useWorkspaceStore((s) => s.linkProblem);
  return (
    <>
      {notice ? (
        <div className="workspace-notice" role="status">
          <p>{notice}</p>
          <button type="button" className="inline-link-button" onClick={() => useWorkspaceStore.setState({ storageNotice: null })}>
            Dismiss
          </button>
        </div>
      ) : null}
      {linkProblem ? (
        <div className="workspace-notice workspace-notice--error" role="alert">
          <div>
            <p>The plan link could not be opened; nothing was changed.</p>
            <ul>
              {linkProblem.map((m) => (
                <li key={m}>{m}</li>
              ))}
            </ul>
          </div>
          <button type="button" className="inline-link-button" onClick={() => useWorkspaceStore.setState({ linkProblem: null })}>
            Dismiss
          </button>
        </div>
      ) : null}
    </>
  );
}

/** Toasts, the shared-plan question and the setup sheet: above the page, outside its inert parts. */
export function WorkspaceOverlays() {
  return (
    <>
      <Toasts />
      <SharePromptDialog />
      <QuestionDialog />
      <SetupSheetHost />
    </>
  );
}

function Toasts() {
  const toasts = useWorkspaceStore((s) => s.toasts);
  return (
    <div className="toasts" aria-live="polite">
      {toasts.map((t) => (
        <div key={t.id} className="toast">
          <span>{t.text}</span>
          {t.action ? (
            <button
              type="button"
              className="button button--small"
              onClick={() => {
                t.action?.run();
                dismissToast(t.id);
              }}
            >
              {t.action.label}
            </button>
          ) : null}
          <button type="button" className="toast__close" aria-label="Dismiss" onClick={() => dismissToast(t.id)}>
            ×
          </button>
        </div>
      ))}
    </div>
  );
}

function SharePromptDialog() {
  const prompt = useWorkspaceStore((s) => s.sharePrompt);
  const keep = useRef<HTMLButtonElement>(null);
  const open = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    if (prompt) open.current?.focus();
  }, [prompt]);
  if (!prompt) return null;
  const current = useSekundoStore.getState();
  const replacing = current.plannerStatus === 'ready' ? current.plannerPlan.name : null;
  return (
    <ConfirmDialog
      idBase="share-confirm"
      onKeyDown={(event) => {
        if (event.key === 'Escape') declineSharedPlan();
        if (event.key === 'Tab') {
          event.preventDefault();
          (document.activeElement === open.current ? keep : open).current?.focus();
        }
      }}
    >
        <h2 id="share-confirm-title">Open the shared plan?</h2>
        <div id="share-confirm-text">
          <p>
            This link carries the plan <strong className="workspace-confirm__name">“{prompt.plan.name}”</strong> with {prompt.plan.sensors.length}{' '}
            {prompt.plan.sensors.length === 1 ? 'sensor' : 'sensors'}.
          </p>
          <p>
            {replacing !== null ? (
              <>
                It replaces the plan you are editing, <span className="workspace-confirm__name">“{replacing}”</span>, which is kept in Saved plans first
                (unless it is unchanged or already saved there).
              </>
            ) : (
              'It opens in the planner.'
            )}
          </p>
        </div>
        <div className="modal__actions">
          <button ref={open} type="button" className="button button--primary" onClick={acceptSharedPlan}>
            Open shared plan
          </button>
          <button ref={keep} type="button" className="button" onClick={declineSharedPlan}>
            Keep my plan
          </button>
        </div>
    </ConfirmDialog>
  );
}

/** A question before work could be lost: two tabs saved one plan, or the open plan cannot be kept. */
function QuestionDialog() {
  const question = useWorkspaceStore((s) => s.question);
  const first = useRef<HTMLButtonElement>(null);
  useEffect(() => {
    if (question) first.current?.focus();
  }, [question]);
  if (!question) return null;
  const last = question.choices.length - 1;
  return (
    <ConfirmDialog
      idBase="workspace-question"
      onKeyDown={(event) => {
        if (event.key === 'Escape') answerQuestion(last);
      }}
    >
        <h2 id="workspace-question-title">{question.title}</h2>
        <p id="workspace-question-text">{question.text}</p>
        <div className="modal__actions">
          {question.choices.map((choice, i) => (
            <button key={choice.label} ref={i === 0 ? first : undefined} type="button" className={i === 0 ? 'button button--primary' : 'button'} onClick={() => answerQuestion(i)}>
              {choice.label}
            </button>
          ))}
        </div>
    </ConfirmDialog>
  );
}

/**
 * The workspace's question before work could be lost, as a modal alert dialog: its title is the
 * element with id `<idBase>-title`, its text `<idBase>-text`.
 */
function ConfirmDialog({ idBase, onKeyDown, children }: { idBase: string; onKeyDown: (event: KeyboardEvent<HTMLDivElement>) => void; children: ReactNode }) {
  return (
    <div className="modal-backdrop">
      <div className="modal workspace-confirm" role="alertdialog" aria-modal="true" aria-labelledby={`${idBase}-title`} aria-describedby={`${idBase}-text`} onKeyDown={onKeyDown}>
        {children}
      </div>
    </div>
  );
}
