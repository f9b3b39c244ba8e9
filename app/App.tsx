import { type KeyboardEvent, useRef } from 'react';
import { AppHeader } from '../src/ui/layout/AppHeader';
import { PanelErrorBoundary } from '../src/ui/layout/PanelErrorBoundary';
import { useSekundoStore } from '../src/ui/store';
import { VIEWS } from './views';

/** The page: header, the view tabs, the active view, and the footer. */
export function App() {
  const activeView = useSekundoStore((s) => s.activeView);
  const active = VIEWS.find((v) => v.id === activeView) ?? VIEWS[0];
  if (!active) return null;
  const View = active.component;
  return (
    <>
      <a className="skip-link" href="#view">
        Skip to the content
      </a>
      <AppHeader />
      <ViewTabs />
      <main id="view" className="page" role="tabpanel" aria-labelledby={`tab-${active.id}`} tabIndex={-1}>
        <p className="view-purpose">{active.purpose}</p>
        <PanelErrorBoundary panel={`${active.label} view`}>
          <View />
        </PanelErrorBoundary>
      </main>
      <footer className="app-footer">
        <p>
          Sekundo computes everything in your browser; it sends nothing anywhere. A planning aid, not a safety system.
        </p>
      </footer>
    </>
  );
}

/** Tabs for the views: arrow keys move between them, as a tab list should. */
function ViewTabs() {
  const activeView = useSekundoStore((s) => s.activeView);
  const setActiveView = useSekundoStore((s) => s.setActiveView);
  const refs = useRef<(HTMLButtonElement | null)[]>([]);
  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    const index = VIEWS.findIndex((v) => v.id === activeView);
    const step = event.key === 'ArrowRight' ? 1 : event.key === 'ArrowLeft' ? -1 : 0;
    if (step === 0) return;
    event.preventDefault();
    const next = VIEWS[(index + step + VIEWS.length) % VIEWS.length];
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
