import { readFileSync } from 'node:fs';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { vi } from 'vitest';
import { App } from '../../app/App';
import { type PlanFile, parsePlanFile } from '../../src/io/plan-file';
import { useSekundoStore } from '../../src/ui/store';
import { lastDraw } from './fake-plotly';

/** The demo plan file as the page fetches it. */
export const DEMO_TEXT = readFileSync('public/demo-plan.json', 'utf8');

export function demoPlan(): PlanFile {
  const parsed = parsePlanFile(DEMO_TEXT);
  if (!parsed.ok) throw new Error(parsed.errors.join('\n'));
  return parsed.plan;
}

/** Serves the demo plan to the page's fetch (or a failure), and returns the mock to inspect. */
export function serveDemo(answer: 'demo' | 'missing' | 'offline' = 'demo') {
  const fetchMock = vi.fn(async (_url: string) => {
    if (answer === 'offline') throw new TypeError('Failed to fetch');
    if (answer === 'missing') return new Response('not found', { status: 404, statusText: 'Not Found' });
    return new Response(DEMO_TEXT, { status: 200, headers: { 'content-type': 'application/json' } });
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

export const store = () => useSekundoStore.getState();

/**
 * Renders the page, opens the planner tab and waits until the plan and (unless told not to, for
 * tests that load the page's modules afresh) its timeline are shown.
 */
export async function openPlanner(answer: 'demo' | 'missing' | 'offline' = 'demo', waitForTimeline = true) {
  const fetchMock = serveDemo(answer);
  const user = userEvent.setup();
  const view = render(<App />);
  await user.click(screen.getByRole('tab', { name: 'Plan a measurement' }));
  await screen.findByRole('region', { name: 'Bath' });
  if (waitForTimeline) await waitFor(() => expect(lastDraw('planner-timeline')).toBeDefined());
  return { user, view, fetchMock };
}

/** The text box with this accessible name (exact). */
export function field(name: string | RegExp): HTMLInputElement {
  return screen.getByRole('textbox', { name }) as HTMLInputElement;
}

/** Replaces a field's text by typing, as a user would. */
export async function retype(user: ReturnType<typeof userEvent.setup>, name: string | RegExp, text: string) {
  const input = field(name);
  await user.clear(input);
  await user.type(input, text);
  return input;
}

/** Clears a field and pastes `text` in one go (one change, as a paste or an autofill makes). */
export async function repaste(user: ReturnType<typeof userEvent.setup>, name: string | RegExp, text: string) {
  const input = field(name);
  await user.clear(input);
  await user.click(input);
  await user.paste(text);
  return input;
}

/** Times (ms) of a sensor's arrivals of one kind, as marked on the last drawn timeline. */
export function arrivalTimes(sensorId: string, kind: 'first sound' | 'second sound' | 'echo'): number[] {
  const marks = lastDraw('planner-timeline')?.data.find((t) => t.name === 'Arrivals');
  if (!marks) return [];
  return (marks.text ?? []).flatMap((text, i) => (text.startsWith(`${sensorId} · ${kind}`) ? [marks.x[i] as number] : []));
}

/** What a quantity field shows: the number in its box and the unit beside it ("10 mm"). */
export function shown(name: string | RegExp): string {
  const input = field(name);
  const unit = input.parentElement?.querySelector('.quantity-field__unit, .unit-select')?.textContent ?? '';
  return unit === '' ? input.value : `${input.value} ${unit}`;
}
