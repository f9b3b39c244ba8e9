import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { type PlanFile, parsePlanFile } from '../../src/io/plan-file';
import { derivePlan, type PlanOutcome } from '../../src/ui/planner/derive-plan';
import { setPulsePoints } from '../../src/ui/planner/plan-edits';
import { packPlan, type PlanReply, type PlanRequest, withoutWaveforms } from '../../src/ui/planner/plan-worker-protocol';

/*
 * The plan worker's end of the messages (src/ui/planner/plan-worker.ts), run in this thread with a
 * stand-in for the worker's global scope: a custom pulse's points are sent once, and a request
 * whose points are 'as-before' is computed with the points of the last request that carried them.
 */

type Listener = (event: MessageEvent<PlanRequest>) => void;
let listener: Listener | null = null;
const replies: PlanReply[] = [];

beforeAll(async () => {
  vi.stubGlobal('addEventListener', (type: string, l: Listener) => {
    if (type === 'message') listener = l;
  });
  vi.stubGlobal('postMessage', (reply: PlanReply) => replies.push(reply));
  await import('../../src/ui/planner/plan-worker');
});

afterAll(() => {
  vi.unstubAllGlobals();
});

function demoPlan(): PlanFile {
  const read = parsePlanFile(readFileSync('public/demo-plan.json', 'utf8'));
  if (!read.ok) throw new Error(read.errors.join('; '));
  return read.plan;
}

/** Sends a request and waits for its answer. */
async function ask(request: PlanRequest): Promise<PlanOutcome> {
  const before = replies.length;
  listener?.({ data: request } as MessageEvent<PlanRequest>);
  await vi.waitFor(() => expect(replies.length).toBeGreaterThan(before), { timeout: 30_000 });
  const reply = replies.at(-1) as PlanReply;
  expect(reply.id).toBe(request.id);
  return reply.outcome;
}

const headlineOf = (outcome: PlanOutcome) => (outcome.ok ? outcome.result.sensors.map((s) => [s.secondSoundArrival_s, s.amplitude_K, s.snrAveraged]) : outcome.message);

describe('plan worker', () => {
  it("computes an 'as-before' request with the points last sent (common practice, no source: the page's protocol)", async () => {
    expect(listener).not.toBeNull();
    const base = demoPlan();
    // A slow rise and a flat top: the arrivals and peaks depend on these points.
    const pulse = setPulsePoints(base, [
      [0, 0],
      [20e-6, 1],
      [80e-6, 1],
      [100e-6, 0],
    ]);
    const first = packPlan(pulse);
    expect(first.points).not.toBeNull();
    const sent = await ask({ id: 1, plan: first.plan, points: first.points, timeline: null });
    expect(headlineOf(sent)).toEqual(headlineOf(withoutWaveforms(derivePlan(pulse))));

    // An edit elsewhere (a sensor's noise): the points are not sent again.
    const noisier = { ...pulse, sensors: pulse.sensors.map((s, i) => (i === 0 ? { ...s, noise_V: s.noise_V * 2 } : s)) };
    const again = await ask({ id: 2, plan: packPlan(noisier).plan, points: 'as-before', timeline: null });
    const expected = derivePlan(noisier);
    expect(headlineOf(again)).toEqual(headlineOf(expected));
    // And not the demo's own pulse: the points carried over are the ones sent.
    expect(headlineOf(again)).not.toEqual(headlineOf(derivePlan({ ...noisier, heater: base.heater })));
  });
});
