/**
 * Kept copies (the page keeps the open plan before a link, a file, a saved plan or the demo
 * replaces it): the same plan is kept once (compared by content), kept copies are marked as such
 * in storage and listed apart in Saved plans, one can be moved to the user's plans, and all can
 * be deleted after a question that names them, with an undo that brings every one back. Kept
 * copies of earlier versions (marked only in their name) are recognised.
 */
import { act, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { serializePlanFile } from '../../src/io/plan-file';
import { type KeyValueStore, listPlans, memoryStore, savePlan } from '../../src/io/workspace-storage';
import { useSekundoStore } from '../../src/ui/store';
import { answerQuestion } from '../../src/ui/workspace/keep-plan';
import { openSaved, saveCurrentAs, startWorkspace } from '../../src/ui/workspace/persist-workspace';
import { SavedPlansPanel } from '../../src/ui/workspace/SavedPlansPanel';
import { resetWorkspaceStore, useWorkspaceStore } from '../../src/ui/workspace/workspace-store';
import { demoPlan } from './planner-helpers';

const main = () => useSekundoStore.getState();
const ws = () => useWorkspaceStore.getState();

let stop: (() => void) | null = null;
function start(store: KeyValueStore) {
  stop = startWorkspace(store, { delayMs: 5, listen: false, hash: '' });
}

beforeEach(() => resetWorkspaceStore());
afterEach(() => {
  stop?.();
  stop = null;
});

/** A saved plan "Cooldown 7", then the open plan edited to `name` and replaced by opening the saved plan. */
function editThenOpenSaved(name: string) {
  const saved = ws().savedPlans.find((p) => p.name === 'Cooldown 7');
  if (!saved) throw new Error('no saved plan');
  main().editPlanner('x', (p) => ({ ...p, name }));
  openSaved(saved);
}

function setUp(): KeyValueStore {
  const store = memoryStore();
  start(store);
  main().loadPlannerPlan(demoPlan(), { kind: 'demo', note: null });
  saveCurrentAs('Cooldown 7');
  return store;
}

describe('kept copies', () => {
  it('keeps replaced work once, compared by content, and marks it as a kept copy', () => {
    const store = setUp();
    editThenOpenSaved('Spacing study');
    editThenOpenSaved('Spacing study');
    const kept = listPlans(store).plans.filter((p) => p.kept !== undefined);
    expect(kept).toHaveLength(1);
    expect(kept[0]?.plan.name).toBe('Spacing study');
    expect(kept[0]?.kept).toBe('before opening “Cooldown 7”');
    // The same work is in Saved plans already: the note says where rather than keeping it again.
    expect(main().plannerSource.note).toContain(`is in Saved plans as “${kept[0]?.name}”`);
    // A different plan is a new copy.
    editThenOpenSaved('Echo study');
    expect(listPlans(store).plans.filter((p) => p.kept !== undefined).map((p) => p.plan.name).sort()).toEqual(['Echo study', 'Spacing study']);
    expect(listPlans(store).plans.filter((p) => p.kept === undefined).map((p) => p.name)).toEqual(['Cooldown 7']);
  });

  it('lists kept copies apart; "Delete all" asks, naming them, and deletes only them; Undo brings every one back', async () => {
    const store = setUp();
    editThenOpenSaved('Spacing study');
    editThenOpenSaved('Echo study');
    const user = userEvent.setup();
    render(<SavedPlansPanel id="saved" />);
    const own = screen.getByRole('list', { name: 'Saved plans' });
    expect(within(own).getAllByRole('listitem').map((li) => li.querySelector('.saved-plans__name')?.textContent)).toEqual(['Cooldown 7 open']);
    const keptList = screen.getByRole('list', { name: 'Kept copies' });
    expect(within(keptList).getAllByRole('listitem')).toHaveLength(2);
    expect(screen.getByRole('heading', { name: 'Kept copies (2)' })).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Delete all kept copies…' }));
    const question = ws().question;
    expect(question?.title).toBe('Delete 2 kept copies?');
    expect(question?.text).toContain('Spacing study (kept');
    expect(question?.text).toContain('Echo study (kept');
    expect(question?.text).toContain('Your own saved plans stay');
    // "Keep them" (the way out) deletes nothing.
    act(() => answerQuestion((question?.choices.length ?? 1) - 1));
    expect(listPlans(store).plans).toHaveLength(3);

    await user.click(screen.getByRole('button', { name: 'Delete all kept copies…' }));
    expect(ws().question?.choices[0]?.label).toBe('Delete 2 kept copies');
    act(() => answerQuestion(0));
    expect(listPlans(store).plans.map((p) => p.name)).toEqual(['Cooldown 7']);
    expect(screen.queryByRole('list', { name: 'Kept copies' })).toBeNull();
    const toast = ws().toasts.at(-1);
    expect(toast?.text).toBe('Deleted 2 kept copies.');
    act(() => toast?.action?.run());
    expect(listPlans(store).plans.filter((p) => p.kept !== undefined).map((p) => p.plan.name).sort()).toEqual(['Echo study', 'Spacing study']);
    expect(await screen.findByRole('list', { name: 'Kept copies' })).toBeInTheDocument();
  });

  it('deletes one kept copy, and moves another to the user’s plans without its "(kept …)" suffix', async () => {
    const store = setUp();
    editThenOpenSaved('Spacing study');
    editThenOpenSaved('Echo study');
    const user = userEvent.setup();
    render(<SavedPlansPanel id="saved" />);
    const [echo, spacing] = ['Echo study', 'Spacing study'].map((n) => listPlans(store).plans.find((p) => p.plan.name === n));
    if (!echo || !spacing) throw new Error('copies missing');
    await user.click(screen.getByRole('button', { name: `Delete “${echo.name}”` }));
    expect(listPlans(store).plans.some((p) => p.id === echo.id)).toBe(false);
    await user.click(screen.getByRole('button', { name: `Move “${spacing.name}” to my plans` }));
    const moved = listPlans(store).plans.find((p) => p.id === spacing.id);
    expect(moved?.kept).toBeUndefined();
    expect(moved?.name).toBe('Spacing study');
    expect(within(screen.getByRole('list', { name: 'Saved plans' })).getByText('Spacing study')).toBeInTheDocument();
    expect(screen.queryByRole('list', { name: 'Kept copies' })).toBeNull();
  });

  it('recognises a kept copy of an earlier version by its name alone', () => {
    const store = memoryStore();
    savePlan(store, 'Cell B (kept 2 Dec 2026, 10:04, before opening a shared link)', demoPlan());
    savePlan(store, 'Cell B, my own', demoPlan());
    const plans = listPlans(store).plans;
    expect(plans.find((p) => p.name.startsWith('Cell B (kept'))?.kept).toBe('before opening a shared link');
    expect(plans.find((p) => p.name === 'Cell B, my own')?.kept).toBeUndefined();
    // Older readers ignore the mark: the record is the same shape plus one field.
    const raw = JSON.parse(store.getItem(`sekundo.plan.${plans[0]?.id}`) ?? '{}') as Record<string, unknown>;
    expect(raw.plan).toBe(serializePlanFile(demoPlan()));
  });
});
