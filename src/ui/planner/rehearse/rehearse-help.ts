/**
 * The rehearsal's fields: their specs (label, kind, range in SI, help) for the one quantity field.
 * Ranges come from the same constants the kernel and the command line check against.
 */
import { MAX_FILES_AT_ONCE } from './rehearse-slice';
import { REHEARSAL_TRIALS_RANGE } from '../../../io/rehearse-run';
import { PICKER_LIMITS, RECORD_SETTING_LIMITS, SEED_RANGE } from '../../../physics';
import type { FieldSpec } from '../../fields/field-spec';
import type { HelpTopic } from '../../help/FieldHelp';
import { KINDS, LADDERS } from '../../units/ladders';

export const PICKER_HELP: HelpTopic = {
  what: 'How the arrival is found in each synthetic record, as the converter finds it with a heater channel: threshold (first crossing of k noise sd), fraction (the leading edge at a share of the peak), peak (a parabola through the top) or cross-correlation with the heater drive.',
  origin: 'Cross-correlation by default: it uses the whole pulse.',
};

export const REHEARSE_FIELDS = {
  trials: {
    label: 'Trials',
    kind: null,
    range: REHEARSAL_TRIALS_RANGE,
    integer: true,
    help: { what: 'How many synthetic records to make and pick; the spread of the picks is estimated to about 1/√(2N).', range: `${REHEARSAL_TRIALS_RANGE[0]}–${REHEARSAL_TRIALS_RANGE[1]}`, origin: '200: the sd to about 5 %.' },
  },
  seed: {
    label: 'Seed',
    kind: null,
    range: SEED_RANGE,
    integer: true,
    help: { what: 'Starts the random numbers: the same seed, plan and settings give the same records and figures, here and in `sekundo rehearse --seed`.', range: `${SEED_RANGE[0]}–${SEED_RANGE[1]}`, origin: '1' },
  },
  threshold: {
    label: 'Threshold k (noise sd)',
    kind: null,
    range: PICKER_LIMITS.thresholdSigma,
    help: { what: 'Threshold picker: the level above the baseline, in noise sd of the record.', range: `${PICKER_LIMITS.thresholdSigma[0]}–${PICKER_LIMITS.thresholdSigma[1]}`, origin: '5, as in the converter.' },
  },
  fraction: {
    label: 'Fraction of the peak',
    kind: null,
    range: PICKER_LIMITS.fraction,
    help: { what: 'Fraction picker: the share of the peak where the leading edge is timed.', range: `${PICKER_LIMITS.fraction[0]}–${PICKER_LIMITS.fraction[1]}`, origin: '0.5, as in the converter.' },
  },
  bits: {
    label: 'Digitiser resolution (bits)',
    kind: null,
    range: RECORD_SETTING_LIMITS.resolutionBits,
    integer: true,
    blank: 'no rounding',
    help: {
      what: 'Rounds every shot to the digitiser’s step, 2 × range / 2^bits, before averaging. Empty: no rounding.',
      range: `${RECORD_SETTING_LIMITS.resolutionBits[0]}–${RECORD_SETTING_LIMITS.resolutionBits[1]} bits, or empty`,
      origin: 'Empty: the plan says nothing about the digitiser’s resolution.',
    },
  },
  range: {
    label: 'Input range ±',
    // An empty field shows volts, the unit a scope's range is set in.
    kind: { ...KINDS.voltage, zero: LADDERS.voltage[0] },
    range: RECORD_SETTING_LIMITS.range_V,
    blank: 'each channel’s own',
    help: {
      what: 'Full scale of every sensor channel, ±. Empty: each channel gets the smallest 1-2-5 step that holds its peak and 5 noise sd, as one would set a scope.',
      units: 'V, mV, µV, nV',
      range: '1 nV–1 kV, or empty',
    },
  },
  pickup: {
    label: 'First-sound pickup (share of the peak)',
    kind: null,
    range: RECORD_SETTING_LIMITS.firstSoundPickup,
    help: {
      what: 'Adds a copy of the drive’s time course through the sensor lag at the first-sound arrival, this share of the direct second-sound peak high (a pressure or electrical pickup). 0: none.',
      range: `${RECORD_SETTING_LIMITS.firstSoundPickup[0]}–${RECORD_SETTING_LIMITS.firstSoundPickup[1]}`,
      origin: '0: the plan does not predict a pickup.',
    },
  },
  exportTrial: {
    label: 'Trial',
    kind: null,
    range: [1, REHEARSAL_TRIALS_RANGE[1]],
    integer: true,
    help: { what: 'Which trial’s record to download, 1 to the number of trials.', origin: '1' },
  },
  exportCount: {
    label: 'Files',
    kind: null,
    range: [1, MAX_FILES_AT_ONCE],
    integer: true,
    help: { what: `How many trials, from the first, to download as separate files (the browser may ask once to allow several downloads).`, range: `1–${MAX_FILES_AT_ONCE}` },
  },
} as const satisfies Record<string, FieldSpec>;
