import { startTransition, useEffect, useState } from 'react';

/**
 * A value kept outside React (a worker's newest answer), taken in as a transition: React draws a
 * new value at low priority, in one pass that a keystroke interrupts. (`useSyncExternalStore`
 * draws every change at once, and a change it cannot show yet draws the views twice.) The view
 * re-renders only when `read()` gives a new value (Object.is), not on every change of the store.
 *
 * `subscribe` and `read` must be the same functions on every render (define them at module level).
 */
export function useValueInTransition<T>(subscribe: (listener: () => void) => () => void, read: () => T): T {
  const [value, setValue] = useState<T>(read);
  useEffect(() => {
    let taken: { value: T } | null = null;
    const follow = () => {
      const next = read();
      if (taken !== null && Object.is(taken.value, next)) return;
      taken = { value: next };
      startTransition(() => setValue(() => next));
    };
    // Anything that changed between this view's render and now.
    follow();
    return subscribe(follow);
  }, [subscribe, read]);
  return value;
}
