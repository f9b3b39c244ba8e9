import { type KeyboardEvent, useEffect, useRef } from 'react';
import { AppHeader } from '../src/ui/layout/AppHeader';
import { PanelErrorBoundary } from '../src/ui/layout/PanelErrorBoundary';
import { PreferencesNotice } from '../src/ui/layout/PreferencesNotice';
import { UpdateNotice } from './offline/UpdateNotice';
import { useSekundoStore } from '../src/ui/store';
import { useDocumentTheme } from '../src/ui/theme/use-theme';
import { ViewGuide } from '../src/ui/guide/ViewGuide';
import { useWorkspaceModal, WorkspaceNotices, WorkspaceOverlays } from '../src/ui/workspace/WorkspaceLayer';
import { VIEWS } from './views';

/** The page: header, the view tabs, the active view with its first-visit guide, and the footer. */
export function App() {
  const activeView = useSekundoStore((s) => s.activeView);
  const showGuidesAgain = useSekundoStore((s) => s.showGuidesAgain);
  // While a workspace dialog (a shared plan to confirm, the setup sheet) is open, the page behind it takes no focus or clicks.
  const blocked = useWorkspaceModal();
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
        <ViewGuide view={active.id} />
        <PanelErrorBoundary panel={`${active.label} view`}>
          <View />
        </PanelErrorBoundary>
      </main>
      <footer className="app-footer" inert={blocked}>
        <p>
          Sekundo computes everything in your browser; it sends nothing anywhere. A planning aid, not a safety system.{' '}
          <button type="button" className="inline-link-button" onClick={showGuidesAgain}>
            Show the first-visit guides again
          </button>
        </p>
      </footer>
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
  // On a narrow screen the strip scrolls: keep the chosen tab in sight without moving the page.
  useEffect(() => {
    const tab = refs.current[VIEWS.findIndex((v) => v.id === activeView)];
    const strip = tab?.parentElement;
    if (!tab || !strip) return;
    const margin = 12;
    const t = tab.getBoundingClientRect();
    const s = strip.getBoundingClientRect();
    if (t.left < s.left) strip.scrollLeft -= s.left - t.left + margin;
    else if (t.right > s.right) strip.scrollLeft += t.right - s.right + margin;
  }, [activeView]);
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
