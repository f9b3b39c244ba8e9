import '@testing-library/jest-dom/vitest';
import { cleanup } from '@testing-library/react';
import { afterEach, beforeEach, vi } from 'vitest';
import { resetSekundoStore } from '../../src/ui/store';
import { fakePlotly } from './fake-plotly';

// jsdom cannot draw Plotly: every chart draws into the recording stand-in instead.
vi.mock('../../src/ui/plot/load-plotly', async () => {
  const { fakePlotlyApi } = await import('./fake-plotly');
  return { loadPlotly: () => Promise.resolve(fakePlotlyApi) };
});

beforeEach(() => {
  resetSekundoStore();
  fakePlotly.reset();
});

afterEach(() => {
  cleanup();
});
