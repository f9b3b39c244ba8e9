import { useSekundoStore } from '../store';
import type { ViewId } from '../layout/view-slice';
import { VIEW_GUIDES } from './guide-texts';

/**
 * The first-visit guide of a view: a short note above the view on how to start, in the page's own
 * flow (nothing covers the page, nothing takes focus). "Got it" puts this view's guide away,
 * "Hide all guides" every view's; the footer brings them back. The choice is kept with the
 * preferences.
 */
export function ViewGuide({ view }: { view: ViewId }) {
  const dismissed = useSekundoStore((s) => s.guidesDismissed.includes(view));
  const dismiss = useSekundoStore((s) => s.dismissGuide);
  const dismissAll = useSekundoStore((s) => s.dismissAllGuides);
  if (dismissed) return null;
  const guide = VIEW_GUIDES[view];
  const titleId = `guide-${view}-title`;
  return (
    <aside className="view-guide" aria-labelledby={titleId}>
      <div className="view-guide__text">
        <h2 id={titleId} className="view-guide__title">
          First time here? {guide.lead}
        </h2>
        <ol className="view-guide__steps">
          {guide.steps.map((step) => (
            <li key={step}>{step}</li>
          ))}
        </ol>
        <p className="view-guide__caution">{guide.caution}</p>
      </div>
      <div className="view-guide__actions">
        <button type="button" className="button button--small" onClick={() => dismiss(view)}>
          Got it
        </button>
        <button type="button" className="inline-link-button" onClick={dismissAll}>
          Hide all guides
        </button>
      </div>
    </aside>
  );
}
