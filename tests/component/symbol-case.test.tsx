/**
 * Titles in capitals keep their symbols and units as written: u₂ is not U₂, t₀ is not T₀, 1651 mK
 * is not 1651 MK (megakelvin). Common practice of typesetting (symbols keep their case), no source.
 */
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { symbolCase } from '../../src/ui/layout/symbol-case';

const html = (text: string) => renderToStaticMarkup(<span>{symbolCase(text)}</span>).slice(6, -7);

describe('symbolCase', () => {
  it.each([
    ['Where the measured speed meets u₂(T)', 'Where the measured speed meets <span class="symbol">u₂(T)</span>'],
    ['Path length from a sweep through 1651 mK', 'Path length from a sweep through 1651 <span class="symbol">mK</span>'],
    ['Offset t₀ in µs', 'Offset <span class="symbol">t₀</span> in <span class="symbol">µs</span>'],
    ['Flux 1 W/cm² at 20 m/s', 'Flux 1 <span class="symbol">W/cm²</span> at 20 <span class="symbol">m/s</span>'],
    ['Width Δ₀ and δf', 'Width <span class="symbol">Δ₀</span> and <span class="symbol">δf</span>'],
  ])('%s', (text, expected) => {
    expect(html(text)).toBe(expected);
  });

  it('leaves words alone, also words holding the letters of a unit', () => {
    for (const text of ['Heater and bath', 'Temperatures of the batch', 'Results per sensor', 'Sensors and source, two projections', 'Files not read (3)']) expect(html(text)).toBe(text);
  });
});
