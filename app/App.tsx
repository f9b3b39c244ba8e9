import { type KeyboardEvent, useRef } from 'react';
import { AppHeader } from '../src/ui/layout/AppHeader';
import { PanelErrorBoundary } from '../src/ui/layout/PanelErrorBoundary';
import { PreferencesNotice } from '../src/ui/layout/PreferencesNotice';
import { UpdateNotice } from './offline/UpdateNotice';
import { useSekundoStore } from '../src/ui/store';
import { useDocumentTheme } from '../src/ui/theme/use-theme';
import { GuidedTour } from '../src/ui/tour/GuidedTour';
import { useWorkspaceModal, WorkspaceNotices, WorkspaceOverlays } from '../src/ui/workspace/WorkspaceLayer';
import { VIEWS } from './views';

/** The page: header, the view tabs, the active view, and the footer; the tour over them on a first visit. */
export function App() {
  const activeView = useSekundoStore((s) => s.activeView);
  // While the tour (a modal dialog) is open, the page behind it takes no focus or clicks.
  const tourOpen = useSekundoStore((s) => s.tourOpen);
  const openTour = useSekundoStore((s) => s.openTour);
  // So is it while a workspace dialog (a shared plan to confirm, the setup sheet) is open.
  const workspaceModal = useWorkspaceModal();
  const blocked = tourOpen || workspaceModal;
  useDocumentTheme();
  const active = VIEWS.find((v) => v.id === activeView) ?? VIEWS[0];
  if (!active) return null;
  const View = active.component;
  return (
    <>
      <a className="skip-link" href="#view" inert={blocked}>
        Skip to the content
      </a>
      <div className="app-top" inert={blocked}>
        <AppHeader />
        <ViewTabs />
        <PreferencesNotice />
        <UpdateNotice />
        <WorkspaceNotices />
      </div>
      <main id="view" className="page" role="tabpanel" aria-labelledby={`tab-${active.id}`} tabIndex={-1} inert={blocked}>
        <p className="view-purpose">{active.purpose}</p>
        <PanelErrorBoundary panel={`${active.label} view`}>
          <View />
        </PanelErrorBoundary>
      </main>
      <footer className="app-footer" inert={blocked}>
        <p>
          Sekundo computes everything in your browser; it sends nothing anywhere. A planning aid, not a safety system.{' '}
          <button type="button" className="inline-link-button" onClick={openTour}>
            Show the tour again
          </button>
        </p>
      </footer>
      <PanelErrorBoundary panel="tour">
        <GuidedTour />
      </PanelErrorBoundary>
      <PanelErrorBoundary panel="workspace">
        <WorkspaceOverlays />
      </PanelErrorBoundary>
    </>
  );
}

/** Tabs for the views: arrow keys move between them, Home and End to the first and last, as a tab list should. */
function ViewTabs() {
  const activeView = useSekundoStore((s) => s.activeView);
  const setActiveView = useSekundoStore((s) => s.setActiveView);
  const refs = useRef<(HTMLButtonElement | null)[]>([]);
  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    const index = VIEWS.findIndex((v) => v.id === activeView);
    const target =
      event.key === 'ArrowRight' ? index + 1 : event.key === 'ArrowLeft' ? index - 1 : event.key === 'Home' ? 0 : event.key === 'End' ? VIEWS.length - 1 : null;
    if (target === null) return;
    event.preventDefault();
    const next = VIEWS[(target + VIEWS.length) % VIEWS.length];
    if (!next) return;
    setActiveView(next.id);
    refs.current[VIEWS.indexOf(next)]?.focus();
  };
  return (
    <nav className="view-tabs" aria-label="Views">
      <div role="tablist" aria-label="Sekundo views" className="view-tabs__list" onKeyDown={onKeyDown}>
        {VIEWS.map((view, i) => (
          <button
            key={view.id}
            ref={(el) => {
              refs.current[i] = el;
            }}
            id={`tab-${view.id}`}
            type="button"
            role="tab"
            aria-selected={view.id === activeView}
            aria-controls="view"
            tabIndex={view.id === activeView ? 0 : -1}
            className="view-tabs__tab"
            onClick={() => setActiveView(view.id)}
          >
            {view.label}
          </button>
        ))}
      </div>
    </nav>
  );
}
