/**
 * The typed inputs of "Follow a folder", in the shape of the house's one quantity field
 * (src/ui/fields): the look interval and the alarms' band and rate. Ranges in SI (the rate and its
 * window are plain numbers in mK/min and minutes, named in their labels).
 */
import { WATCH_INTERVAL_RANGE_MS } from '../../../io/folder-watch';
import { PROPERTIES_RANGE_K } from '../../../physics';
import type { FieldSpec } from '../../fields';
import { KINDS } from '../../units/ladders';

export const WATCH_FIELDS = {
  interval: {
    label: 'Look every',
    kind: KINDS.timeConstant,
    range: [WATCH_INTERVAL_RANGE_MS[0] / 1000, WATCH_INTERVAL_RANGE_MS[1] / 1000],
    help: {
      what: 'Time between two looks into the folder. A file is read once two looks in a row find the same size and time, so it is read one to two looks after the digitiser has finished it.',
      units: 'a bare number is in the unit shown (s), or type 500 ms',
      range: 'Typical 2–10 s; valid 0.1–600 s',
      origin: '3 s: quick enough for a trace every few seconds, light on a network share (common practice, no source)',
    },
  },
  bandLow: {
    label: 'Band from',
    kind: KINDS.temperature,
    range: PROPERTIES_RANGE_K,
    rangeNote: 'and below the band’s upper edge',
    help: { what: 'Lower edge of the band the bath should stay in.', units: 'K or mK; a bare number is in the unit shown', range: `Valid ${PROPERTIES_RANGE_K[0]}–${PROPERTIES_RANGE_K[1]} K, below the upper edge`, origin: '1.795 K: an example band of ±5 mK around 1.8 K' },
  },
  bandHigh: {
    label: 'Band to',
    kind: KINDS.temperature,
    range: PROPERTIES_RANGE_K,
    rangeNote: 'and above the band’s lower edge',
    help: { what: 'Upper edge of the band the bath should stay in.', units: 'K or mK; a bare number is in the unit shown', range: `Valid ${PROPERTIES_RANGE_K[0]}–${PROPERTIES_RANGE_K[1]} K, above the lower edge`, origin: '1.805 K: an example band of ±5 mK around 1.8 K' },
  },
  rate: {
    label: 'Rate limit (mK/min)',
    kind: null,
    range: [0.001, 1000],
    help: {
      what: 'Largest change of the bath temperature, up or down, before the alarm: the slope of a straight line through the readings of the window.',
      units: 'mK per minute (a plain number)',
      range: 'Valid 0.001–1000 mK/min',
      origin: '1 mK/min: an example; a regulated bath drifts far less (common practice, no source)',
    },
  },
  window: {
    label: 'Over the last (min)',
    kind: null,
    range: [0.1, 600],
    help: { what: 'The readings within this time before each one give its rate; a longer window averages the scatter of single readings away.', units: 'minutes (a plain number)', range: 'Valid 0.1–600 min', origin: '5 min: an example' },
  },
} as const satisfies Record<string, FieldSpec>;
