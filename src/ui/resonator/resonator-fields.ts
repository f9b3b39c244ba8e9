/**
 * The resonator view's typed fields: one FieldSpec each (label, kind of quantity, valid range in
 * SI, help with units, typical values and where the default comes from). The QuantityField of
 * src/ui/fields shows and reads them.
 */
import { MUTUAL_FRICTION_RANGE_K, RESONANCE_LIMITS, RESONATOR_LIMITS, VAPOUR_PRESSURE_RANGE_PA } from '../../physics';
import type { FieldSpec } from '../fields';
import { KINDS } from '../units/ladders';
import type { ResonatorInputs } from './resonator-slice';

export type ResonatorFieldKey = Exclude<keyof ResonatorInputs, 'spacerId' | 'geometry'>;

export const RESONATOR_FIELDS: Readonly<Record<ResonatorFieldKey, FieldSpec>> = {
  gap_m: {
    label: 'Plate gap',
    kind: KINDS.length,
    range: RESONATOR_LIMITS.gap_m,
    help: {
      what: 'Distance between the heater plate and the sensor plate. Measured warm when a spacer is chosen below (it is then contracted to 4 K), else taken as the cold gap.',
      units: 'the length unit shown (a bare number), or type one: “2 mm”, “0.2 cm”',
      range: 'typically 1–20 mm; 10 µm – 1 m accepted',
      origin: '2 mm, or the demo resonator’s 10.00 mm',
    },
  },
  gapSd_m: {
    label: 'Gap sd',
    kind: KINDS.lengthSd,
    role: 'sd',
    range: RESONATOR_LIMITS.gapSd_m,
    help: { what: 'One-sigma uncertainty of the gap as measured (the contraction’s own sd is added when a spacer is chosen).', units: 'µm or mm', range: '0–10 mm', origin: '0' },
  },
  plateDiameter_m: {
    label: 'Plate diameter',
    kind: KINDS.length,
    range: RESONATOR_LIMITS.plateDiameter_m,
    blank: 'no Fresnel number',
    help: { what: 'Diameter of the smaller plate: gives each mode’s Fresnel number a²/(λd); below about 1 diffraction limits the quality factor.', units: 'the length unit shown, or type one', range: '0.1 mm – 1 m; empty: no Fresnel number', origin: 'empty, or the demo’s 25 mm' },
  },
  temperature_K: {
    label: 'Bath temperature',
    kind: KINDS.temperature,
    range: [RESONATOR_LIMITS.temperature_K[0], RESONATOR_LIMITS.temperature_K[1]],
    rangeNote: 'He II only',
    help: {
      what: 'Bath temperature T90 for the plan; when a sweep is read, the expected temperature that chooses among the candidates (a vapour pressure, if typed, decides instead).',
      units: 'K or mK',
      range: '0.3 K to just below Tλ = 2.1768 K',
      origin: '1.8 K, or the demo’s 1.85 K',
    },
  },
  modes: {
    label: 'Modes listed',
    kind: null,
    integer: true,
    range: RESONATOR_LIMITS.modes,
    help: { what: 'How many modes n = 1 … N the plan lists.', range: 'a whole number 1–500', origin: '10' },
  },
  targetSd_K: {
    label: 'Target resolution',
    kind: KINDS.temperatureDifference,
    role: 'sd',
    range: RESONATOR_LIMITS.targetSd_K,
    blank: 'no frequency step',
    help: { what: 'The temperature step you want to resolve: the plan gives the frequency step it makes at each mode (what the readout must resolve).', units: 'µK, mK or K', range: '1 nK – 0.1 K', origin: '10 µK' },
  },
  width0_Hz: {
    label: 'Expected width Δ₀',
    kind: KINDS.frequency,
    range: RESONATOR_LIMITS.width0_Hz,
    blank: 'no smallest line density',
    help: { what: 'Full width at half power of a vortex-free resonance you expect (f/Q). With the amplitude noise it gives the smallest line density you can see.', units: 'Hz, kHz', range: '0.1 mHz – 100 kHz', origin: 'empty, or the demo’s 2.4 Hz' },
  },
  amplitudeNoise: {
    label: 'Amplitude noise σA/A₀',
    kind: null,
    range: RESONATOR_LIMITS.amplitudeNoise,
    blank: 'no smallest line density',
    help: { what: 'Noise of the peak amplitude as a fraction of the vortex-free peak (1e-3: 0.1 %).', range: '1e-7 – 0.5', origin: 'empty, or the demo’s 0.005' },
  },
  mode: {
    label: 'Mode number n',
    kind: null,
    integer: true,
    range: RESONANCE_LIMITS.mode,
    blank: 'from the neighbouring resonance',
    help: { what: 'Which mode the sweep crossed: u₂ = 2 d f₀/n. Leave empty and give the neighbouring resonance to find n from the spacing.', range: 'a whole number 1–100 000', origin: 'empty, or the demo’s 8' },
  },
  neighbour_Hz: {
    label: 'Neighbouring resonance',
    kind: KINDS.frequency,
    range: RESONANCE_LIMITS.frequency_Hz,
    blank: 'none',
    help: { what: 'Centre of the next mode up or down: the spacing u₂/2d gives n when the mode number is empty (only when the data decide it).', units: 'Hz, kHz', range: '1 mHz – 100 MHz', origin: 'empty' },
  },
  pressure_Pa: {
    label: 'Bath vapour pressure',
    kind: KINDS.pressure,
    range: VAPOUR_PRESSURE_RANGE_PA,
    blank: 'use the bath temperature',
    help: {
      what: 'A vapour-pressure reading of the bath (ITS-90): chooses among the candidate temperatures and sets the temperature of B(T). Read the gauge at the bath, not the pump line.',
      units: 'the pressure unit shown, or type one: “2.27 kPa”, “17 torr”',
      range: 'the vapour curve from 0.5 K to 5 K',
      origin: 'empty',
    },
  },
  drive_Hz: {
    label: 'Drive frequency',
    kind: KINDS.frequency,
    range: RESONANCE_LIMITS.frequency_Hz,
    blank: 'the reference’s centre',
    help: { what: 'The fixed frequency the lock-in record was driven at. Empty: the vortex-free reference’s fitted centre f₀.', units: 'Hz, kHz', range: '1 mHz – 100 MHz', origin: 'empty (the reference centre)' },
  },
};

/** The temperatures where a line density can be given (the published B), for notes. */
export const LINE_DENSITY_RANGE_K = MUTUAL_FRICTION_RANGE_K;
