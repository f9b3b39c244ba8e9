/*
 * Continuity along a series, one reading at a time (src/physics/choose-candidate.ts, seriesChooser).
 * The readings are made from the kernel's own u₂(T): each temperature's speed and its candidates,
 * so the true temperature is known. Invariants, no published numbers: the tolerances are the
 * kernel's root-finding accuracy (1e-9 K, as tests/unit/converter.test.ts) with room.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  type ChoiceRule,
  chooseAlongSeries,
  chooseCandidate,
  OutOfRangeError,
  secondSound,
  seriesChooser,
  T_LAMBDA_K,
  type TemperatureCandidate,
  temperatureCandidates,
  vapourPressure,
} from '../../src/physics';

const candidatesAt = (T: number): TemperatureCandidate[] => temperatureCandidates(secondSound(T), 1e-4);

/**
 * A drift above the u₂ maximum (1.65 K). Up to about 1.93 K each speed there has three candidates
 * more than 0.1 K apart (above it, where u₂ is below its minimum of 18.3 m/s, only one): the choice
 * must follow the drift either way.
 */
const drift = fc
  .record({ start: fc.double({ min: 1.7, max: 2.05, noNaN: true }), steps: fc.array(fc.double({ min: -1e-3, max: 1e-3, noNaN: true }), { minLength: 1, maxLength: 40 }) })
  .map(({ start, steps }) => {
    const temps = [start];
    for (const step of steps) temps.push(Math.min(2.1, Math.max(1.68, (temps[temps.length - 1] as number) + step)));
    return temps;
  });

describe('seriesChooser: continuity one reading at a time', () => {
  it('follows a slow drift from its start rule, reading by reading (property test)', () => {
    fc.assert(
      fc.property(drift, (temps) => {
        const next = seriesChooser({ kind: 'near', temperature_K: temps[0] as number });
        temps.forEach((T, i) => {
          const candidates = candidatesAt(T);
          const choice = next(candidates);
          expect(choice.by).toBe(i === 0 ? 'start' : 'continuity');
          expect(Math.abs((candidates[choice.index as number]?.temperature_K ?? Number.NaN) - T)).toBeLessThan(1e-6);
        });
      }),
      { numRuns: 60 },
    );
  });

  it('each continuity choice is the candidate nearest the last decided temperature, and says so in its rule (property test)', () => {
    const reading = fc.oneof(fc.double({ min: 0.5, max: T_LAMBDA_K * 0.999, noNaN: true }).map(candidatesAt), fc.constant([] as TemperatureCandidate[]));
    fc.assert(
      fc.property(fc.array(reading, { minLength: 2, maxLength: 20 }), (series) => {
        const next = seriesChooser({ kind: 'range', min_K: 0, max_K: T_LAMBDA_K });
        let previous: number | null = null;
        for (const candidates of series) {
          const choice = next(candidates);
          if (previous !== null) {
            expect(choice.by).toBe('continuity');
            expect(choice.rule).toEqual({ kind: 'near', temperature_K: previous });
            if (choice.ambiguous) {
              // Past a turn of u2 continuity does not choose: both continuations, on the two branches meeting there.
              expect(choice.index).toBeNull();
              const branches = choice.ambiguous.alternatives.map((i) => candidates[i]?.branch).sort();
              expect(branches).toEqual(choice.ambiguous.turn === 'maximum' ? ['high', 'middle'] : ['low', 'middle']);
            } else if (candidates.length > 0) {
              const best = Math.min(...candidates.map((c) => Math.abs(c.temperature_K - (previous as number))));
              expect(Math.abs((candidates[choice.index as number] as TemperatureCandidate).temperature_K - previous)).toBe(best);
            } else expect(choice.index).toBeNull();
          }
          if (choice.index !== null) previous = (candidates[choice.index] as TemperatureCandidate).temperature_K;
        }
      }),
    );
  });

  it('a reading with its own rule is decided by that rule alone, whatever came before (property test)', () => {
    fc.assert(
      fc.property(drift, fc.double({ min: 1.3, max: 2.1, noNaN: true }), (history, T) => {
        const next = seriesChooser({ kind: 'near', temperature_K: history[0] as number });
        for (const h of history) next(candidatesAt(h));
        const own: ChoiceRule = { kind: 'pressure', pressure_Pa: vapourPressure(T).pressure_Pa };
        const candidates = candidatesAt(T);
        const choice = next(candidates, own);
        expect(choice).toMatchObject({ ...chooseCandidate(candidates, own), rule: own, by: 'own', ambiguous: null });
        // And the readings after it follow it; next to a turn of u2 (its 95 % interval reaching the
        // maximum) continuity cannot, and keeps it as one of the two continuations instead.
        const after = next(candidatesAt(T));
        if (after.ambiguous) expect(after.ambiguous.alternatives).toContain(choice.index);
        else expect(after.index).toBe(choice.index);
      }),
      { numRuns: 40 },
    );
  });

  it('a reading without candidates passes the last decided temperature on', () => {
    const next = seriesChooser({ kind: 'near', temperature_K: 1.8 });
    const first = next(candidatesAt(1.8));
    expect(next([])).toMatchObject({ index: null, reason: 'no candidate temperature', by: 'continuity' });
    const third = next(candidatesAt(1.801));
    expect(third.rule).toEqual({ kind: 'near', temperature_K: candidatesAt(1.8)[first.index as number]?.temperature_K });
  });

  it('until a reading is decided, the start rule decides each one', () => {
    // 1.7–2.1 K holds only the high-branch root of 1.8 K's speed, while 0–2.1 K holds all three.
    const next = seriesChooser({ kind: 'range', min_K: 1.7, max_K: 2.1 });
    expect(next([])).toMatchObject({ index: null, by: 'start' });
    expect(next(candidatesAt(1.8))).toMatchObject({ index: 2, by: 'start' });
    expect(next(candidatesAt(1.8)).by).toBe('continuity');
  });

  it('a bad own rule throws the kernel’s range error, and the series goes on from where it was', () => {
    const next = seriesChooser({ kind: 'near', temperature_K: 1.8 });
    next(candidatesAt(1.8));
    expect(() => next(candidatesAt(1.8), { kind: 'pressure', pressure_Pa: 1e9 })).toThrow(OutOfRangeError);
    expect(next(candidatesAt(1.8001))).toMatchObject({ index: 2, by: 'continuity' });
  });

  it('chooseAlongSeries follows a slow drift on the branch the series started on', () => {
    // 1.9 K down to 1.856 K in 4 mK steps: three candidates at each speed (the other two well
    // below 1.6 K), so only continuity keeps the series on the true temperatures.
    const temps = Array.from({ length: 12 }, (_, i) => 1.9 - i * 0.004);
    const series = temps.map(candidatesAt);
    expect(series.every((c) => c.length === 3)).toBe(true);
    const choices = chooseAlongSeries(series, { kind: 'near', temperature_K: 1.9 });
    choices.forEach((choice, i) => {
      const chosen = choice.index === null ? undefined : series[i]?.[choice.index];
      expect(chosen?.temperature_K).toBeCloseTo(temps[i] as number, 6);
    });
  });
});
