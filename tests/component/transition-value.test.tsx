import { act, render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { useValueInTransition } from '../../src/ui/layout/transition-value';

/*
 * A value kept outside React, taken in as a transition (src/ui/layout/transition-value.ts): the
 * results views of the planner and the locate view follow their worker's newest answer this way.
 * Common practice, no source.
 */

let store = { answer: { n: 1 }, updating: false };
const listeners = new Set<() => void>();
const subscribe = (listener: () => void) => {
  listeners.add(listener);
  return () => {
    listeners.delete(listener);
  };
};
const publish = (next: typeof store) => {
  store = next;
  for (const l of listeners) l();
};
const readAnswer = () => store.answer;

let renders = 0;
function View() {
  const answer = useValueInTransition(subscribe, readAnswer);
  renders += 1;
  return <output aria-label="answer">{answer.n}</output>;
}

const early = { n: 7 };
/** Changes the store during its own render, before its effect subscribes. */
function Late() {
  const answer = useValueInTransition(subscribe, readAnswer);
  if (store.answer !== early && answer.n !== 7) store = { ...store, answer: early };
  return <output aria-label="late">{answer.n}</output>;
}

describe('useValueInTransition', () => {
  it('shows each new value, and re-renders for nothing else the store changes', async () => {
    render(<View />);
    expect(screen.getByRole('status', { name: 'answer' })).toHaveTextContent('1');
    const before = renders;
    // The store says it is updating: the answer is the same object, the view is not drawn again.
    await act(async () => publish({ ...store, updating: true }));
    expect(renders).toBe(before);
    await act(async () => publish({ answer: { n: 2 }, updating: false }));
    expect(screen.getByRole('status', { name: 'answer' })).toHaveTextContent('2');
    expect(renders).toBeGreaterThan(before);
  });

  it('takes in a value published between its render and its subscription', async () => {
    render(<Late />);
    await act(async () => {});
    expect(screen.getByRole('status', { name: 'late' })).toHaveTextContent('7');
  });
});
