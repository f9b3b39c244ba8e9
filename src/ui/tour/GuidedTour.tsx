import { type KeyboardEvent, useEffect, useId, useRef, useState } from 'react';
import { useSekundoStore } from '../store';
import type { ViewId } from '../store/view-slice';
import { TOUR_STEPS } from './tour-steps';

const FOCUSABLE = 'button:not([disabled]), [href], input:not([disabled]), select:not([disabled]), textarea:not([disabled]), [tabindex]:not([tabindex="-1"])';

/**
 * The first-visit tour: a few steps over the views, in a modal dialog. The page behind is inert
 * while it is open (App); Tab stays inside; Escape, "Close" or "Finish" close it for good (the
 * store remembers, preferences keep it), and the footer opens it again. The view on screen before
 * the tour comes back when it closes.
 */
export function GuidedTour() {
  const open = useSekundoStore((s) => s.tourOpen);
  return open ? <TourDialog /> : null;
}

function TourDialog() {
  const close = useSekundoStore((s) => s.closeTour);
  const setView = useSekundoStore((s) => s.setActiveView);
  const [index, setIndex] = useState(0);
  const titleId = useId();
  const textId = useId();
  const dialog = useRef<HTMLDivElement>(null);
  const heading = useRef<HTMLHeadingElement>(null);
  const next = useRef<HTMLButtonElement>(null);
  const startView = useRef<ViewId>(useSekundoStore.getState().activeView);
  const returnFocus = useRef<Element | null>(typeof document === 'undefined' ? null : document.activeElement);
  const step = TOUR_STEPS[index] ?? TOUR_STEPS[0];
  const last = index === TOUR_STEPS.length - 1;

  // The heading takes focus once, when the tour opens; later steps are announced (aria-live).
  useEffect(() => heading.current?.focus(), []);
  useEffect(() => {
    if (step?.view) setView(step.view);
  }, [step, setView]);

  const finish = () => {
    setView(startView.current);
    close();
    const target = returnFocus.current;
    // Back where the reader was; else the selected tab (the page's first landmark after the header).
    queueMicrotask(() => {
      if (target instanceof HTMLElement && target.isConnected && target !== document.body) target.focus();
      else document.querySelector<HTMLElement>('[role="tab"][aria-selected="true"]')?.focus();
    });
  };

  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    if (event.key === 'Escape') {
      event.preventDefault();
      finish();
      return;
    }
    if (event.key !== 'Tab' || !dialog.current) return;
    const items = [...dialog.current.querySelectorAll<HTMLElement>(FOCUSABLE)];
    const first = items[0];
    const lastItem = items.at(-1);
    if (!first || !lastItem) return;
    const active = document.activeElement;
    if (event.shiftKey && (active === first || active === heading.current)) {
      event.preventDefault();
      lastItem.focus();
    } else if (!event.shiftKey && active === lastItem) {
      event.preventDefault();
      first.focus();
    }
  };

  if (!step) return null;
  return (
    <div className="tour-backdrop">
      <div ref={dialog} className="tour" role="dialog" aria-modal="true" aria-labelledby={titleId} aria-describedby={textId} onKeyDown={onKeyDown}>
        <p className="tour__progress">
          Tour · step {index + 1} of {TOUR_STEPS.length}
        </p>
        <h2 id={titleId} ref={heading} className="tour__title" tabIndex={-1} aria-live="polite">
          {step.title}
        </h2>
        <div id={textId} className="tour__body" aria-live="polite">
          <p>{step.text}</p>
          {step.caution ? (
            <p className="tour__caution">
              <strong>Cautions:</strong> {step.caution}
            </p>
          ) : null}
        </div>
        <ol className="tour__dots" aria-hidden="true">
          {TOUR_STEPS.map((s, i) => (
            <li key={s.title} className={i === index ? 'is-current' : undefined} />
          ))}
        </ol>
        <div className="tour__actions">
          <button type="button" className="button button--small tour__close" onClick={finish}>
            Close the tour
          </button>
          <span className="tour__nav">
            <button
              type="button"
              className="button button--small"
              disabled={index === 0}
              onClick={() => {
                // Leaving the first step's Back disabled under the focus would drop focus to the page.
                if (index === 1) next.current?.focus();
                setIndex((i) => Math.max(0, i - 1));
              }}
            >
              Back
            </button>
            <button
              ref={next}
              type="button"
              className="button button--small button--primary"
              onClick={() => (last ? finish() : setIndex((i) => Math.min(TOUR_STEPS.length - 1, i + 1)))}
            >
              {last ? 'Finish' : 'Next'}
            </button>
          </span>
        </div>
      </div>
    </div>
  );
}
