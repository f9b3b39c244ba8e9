import { screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { MAX_NOTES_CHARS, parsePlanFile, serializePlanFile } from '../../src/io/plan-file';
import { listPlans, memoryStore } from '../../src/io/workspace-storage';
import { useSekundoStore } from '../../src/ui/store';
import { startWorkspace } from '../../src/ui/workspace/persist-workspace';
import { resetWorkspaceStore } from '../../src/ui/workspace/workspace-store';
import { field, openPlanner } from './planner-helpers';

/*
 * The user's own plan (common practice, no source): "New plan" starts from sensible defaults with
 * no demo text, the description is the user's to write, and the setup sheet prints it or nothing.
 */

const main = () => useSekundoStore.getState();
let browser = memoryStore();
let stop: (() => void) | null = null;

beforeEach(() => {
  resetWorkspaceStore();
  browser = memoryStore();
  useSekundoStore.setState({ guidesDismissed: ['explorer', 'planner', 'converter', 'locate'] });
  stop = startWorkspace(browser, { delayMs: 5, hash: '' });
});

afterEach(() => {
  stop?.();
  stop = null;
  vi.unstubAllGlobals();
});

function description(): HTMLTextAreaElement {
  return screen.getByRole('textbox', { name: 'Plan description' }) as HTMLTextAreaElement;
}

describe('the user’s own plan', () => {
  it('"New plan" opens a plan with no demo text that computes, and keeps no copy of the untouched demo', async () => {
    const { user } = await openPlanner();
    expect(main().plannerSource.kind).toBe('demo');
    await user.click(screen.getByRole('button', { name: 'New plan' }));
    expect(field('Plan name').value).toBe('New plan');
    expect(main().plannerSource.kind).toBe('new');
    expect(main().plannerPlan.notes).toBeUndefined();
    expect(description().value).toBe('');
    expect(screen.getByText('About this plan (no description yet)')).toBeInTheDocument();
    // Nothing of the user's was replaced, so nothing was kept.
    expect(listPlans(browser).plans).toEqual([]);
    // The new plan is a valid plan the page computes.
    expect(parsePlanFile(serializePlanFile(main().plannerPlan)).ok).toBe(true);
    await waitFor(() => expect(screen.getByRole('table', { name: /predicted arrivals/i })).toHaveTextContent('Sensor 1'));
  });

  it('the description is edited like any field: applied as typed and printed on the setup sheet', async () => {
    vi.stubGlobal('print', vi.fn());
    const { user } = await openPlanner();
    await user.click(screen.getByRole('button', { name: 'New plan' }));
    await user.click(description());
    await user.type(description(), 'Cooldown 14: bolometer check before the cavity test.');
    await user.tab();
    expect(main().plannerPlan.notes).toBe('Cooldown 14: bolometer check before the cavity test.');
    await user.click(screen.getByRole('button', { name: 'Print setup sheet' }));
    const sheet = await screen.findByRole('article', { name: 'Setup sheet' });
    expect(within(sheet).getByText('Cooldown 14: bolometer check before the cavity test.')).toBeInTheDocument();
  });

  it('an empty description is no description: the file leaves it out and the sheet prints nothing for it', async () => {
    vi.stubGlobal('print', vi.fn());
    const { user } = await openPlanner();
    const demoNotes = main().plannerPlan.notes ?? '';
    expect(demoNotes.length).toBeGreaterThan(0);
    expect(description().value).toBe(demoNotes);
    await user.clear(description());
    await user.tab();
    expect(main().plannerPlan.notes).toBeUndefined();
    expect(serializePlanFile(main().plannerPlan)).not.toContain('"notes"');
    await user.click(screen.getByRole('button', { name: 'Print setup sheet' }));
    const sheet = await screen.findByRole('article', { name: 'Setup sheet' });
    expect(sheet.querySelector('.sheet-notes')).toBeNull();
    expect(sheet).not.toHaveTextContent(demoNotes.slice(0, 40));
  });

  it('typing too long a description in the box says so and keeps the plan', async () => {
    const { user } = await openPlanner();
    const before = main().plannerPlan.notes;
    expect(before?.length).toBeGreaterThan(0);
    await user.click(description());
    await user.paste('y'.repeat(MAX_NOTES_CHARS + 1));
    expect(await screen.findByRole('alert')).toHaveTextContent(`Description: at most ${MAX_NOTES_CHARS} characters`);
    expect(main().plannerPlan.notes).toBe(before);
    await user.keyboard('{Escape}');
    expect(description().value).toBe(before);
  });
});
