import { useEffect, useRef, useState } from 'react';

/** How long results may lag an edit before the page says they are being updated, ms (no flicker while typing on a small plan). */
const NOTICE_AFTER_MS = 250;

/**
 * While a worker computes newer results, the ones on screen are the last ones: once that takes
 * longer than a moment, say so (a polite status line) and mark the view (`is-updating` on the
 * element that holds this note; the view's style dims its results).
 */
export function UpdatingNote({ updating, text }: { updating: boolean; text: string }) {
  const [shown, setShown] = useState(false);
  const note = useRef<HTMLParagraphElement>(null);
  useEffect(() => {
    if (!updating) {
      setShown(false);
      return;
    }
    const timer = setTimeout(() => setShown(true), NOTICE_AFTER_MS);
    return () => clearTimeout(timer);
  }, [updating]);
  useEffect(() => {
    const view = note.current?.parentElement;
    view?.classList.toggle('is-updating', shown);
    return () => view?.classList.remove('is-updating');
  }, [shown]);
  return (
    <p ref={note} className="updating-note" role="status" data-updating={updating ? 'true' : 'false'}>
      {shown ? (
        <span className="updating-note__body">
          <span className="updating-note__mark" aria-hidden="true" />
          {text}
        </span>
      ) : null}
    </p>
  );
}
