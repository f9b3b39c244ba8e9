import { screen, waitFor, within } from '@testing-library/react';
import { lastShape } from './fake-plotly';
import { arrivalTimes, field, openPlanner, store } from './planner-helpers';

function warningItems(code: string): HTMLElement[] {
  const list = screen.getByRole('list', { name: 'Plan warnings' });
  return within(list)
    .getAllByRole('listitem')
    .filter((item) => item.getAttribute('data-code') === code);
}

async function replaceText(user: Awaited<ReturnType<typeof openPlanner>>['user'], name: string, text: string) {
  const input = field(name);
  await user.clear(input);
  await user.paste(text);
}

describe('planner warnings', () => {
  it('warns of an echo overlapping the pulse when a sensor moves close to the lid', async () => {
    const { user } = await openPlanner();
    expect(warningItems('echo-overlap')).toHaveLength(0);
    await replaceText(user, 'Sensor 4 distance', '59.9 mm');
    expect(store().plannerPlan.sensors[3]?.distance_m).toBeCloseTo(0.0599, 12);
    const [overlap] = warningItems('echo-overlap');
    expect(overlap).toBeDefined();
    const item = overlap as HTMLElement;
    expect(within(item).getByText('Caution')).toBeInTheDocument();
    expect(item).toHaveTextContent(/Sensor Bolometer D, 50 mm \(b50\)/);
    expect(item).toHaveTextContent(/echo after the pulse 0\.0\d+ ms · pulse lasts 0\.185 ms/); // 101 µs pulse + the heater edges’ spread + 3 lags
    // The timeline marks the echo right after the direct arrival.
    await waitFor(() => {
      const [direct = Number.NaN] = arrivalTimes('b50', 'second sound');
      const echoes = arrivalTimes('b50', 'echo');
      expect(echoes.some((echo) => echo - direct > 0 && echo - direct < 0.161)).toBe(true);
    });
    // Back to 50 mm: the warning goes.
    await replaceText(user, 'Sensor 4 distance', '50 mm');
    expect(warningItems('echo-overlap')).toHaveLength(0);
  });

  it('warns that the record is too short, and the shaded record window follows', async () => {
    const { user } = await openPlanner();
    await replaceText(user, 'Record length', '2 ms');
    expect(store().plannerPlan.digitiser.recordLength_s).toBe(0.002);
    const short = warningItems('record-too-short');
    expect(short.map((i) => i.textContent)).toEqual([
      expect.stringContaining('(b25)'),
      expect.stringContaining('(b35x)'),
      expect.stringContaining('(b50)'),
    ]);
    expect(short[0]).toHaveTextContent(/record ends 1(\.0+)? ms · pulse passes 1\.49\d* ms/);
    await waitFor(() => expect(lastShape('planner-timeline', 'record-window')?.x1).toBeCloseTo(1, 9));
  });

  it('warns, as a stop with its own mark and word, when the bath is He I', async () => {
    const { user } = await openPlanner();
    await user.click(screen.getByRole('radio', { name: 'Temperature' }));
    await replaceText(user, 'Bath temperature', '2.5 K');
    const [stop] = warningItems('no-second-sound');
    expect(within(stop as HTMLElement).getByText('Stop')).toBeInTheDocument();
    expect((stop as HTMLElement).querySelector('svg.severity-mark--stop')).not.toBeNull();
    // The tally in the warnings card and the one in the plan bar read the same.
    const tallies = [...document.querySelectorAll('.severity-tally')];
    expect(tallies).toHaveLength(2);
    for (const tally of tallies) expect(tally.textContent).toMatch(/^1 stop · \d+ cautions? · \d+ notes?$/);
    expect(screen.getByRole('link', { name: /^Warnings: 1 stop · \d+ cautions? · \d+ notes?$/ })).toHaveAttribute('href', '#planner-warnings-title');
    expect(tallies[0]?.querySelector('.severity-tally__part--stop')).toHaveAttribute('data-empty', 'false');
    // Results show no second sound; the timeline still draws first sound.
    const table = screen.getByRole('table', { name: /predicted arrivals/i });
    expect(within(table).getAllByText('—').length).toBeGreaterThan(0);
    await waitFor(() => expect(arrivalTimes('b10', 'first sound')).toHaveLength(1));
    expect(arrivalTimes('b10', 'second sound')).toHaveLength(0);
  });
});
