import type { PlanResult } from '../../physics';
import type { CsvTableData } from '../export/csv-export';

/**
 * The per-sensor results as a CSV table: SI units named in each header, numbers unrounded, empty
 * cells where a quantity does not exist (no second sound in He I, no signal to time).
 */
export function resultsCsv(result: PlanResult): CsvTableData {
  return {
    header: [
      'sensor_id',
      'label',
      'pathLength_m',
      'pathLengthSd_m',
      'firstSoundArrival_s',
      'secondSoundArrival_s',
      'amplitude_K',
      'signal_V',
      'snrSingle',
      'snrAveraged',
      'pulsesForTargetSnr',
      'timingSd_s',
      'timingSdThreshold_s',
      'timingSdFraction_s',
      'timingSdPeak_s',
      'timingSdXcorr_s',
      'timingLowerLimit',
      'temperatureSd_K',
      'temperatureChangeSd_K',
      'temperatureSdWithModel_K',
      'targetKind',
      'meetsTarget',
      'shortestDistanceForTarget_m',
      'shortestDistanceNote',
      'insensitive',
    ],
    rows: result.sensors.map((s) => [
      s.id,
      s.label,
      s.pathLength_m,
      s.pathLengthSd_m,
      s.firstSoundArrival_s,
      s.secondSoundArrival_s,
      s.amplitude_K,
      s.signal_V,
      s.snrSingle,
      s.snrAveraged,
      s.pulsesForTargetSnr,
      s.timingSd_s,
      s.timingSdByPicker_s?.threshold ?? null,
      s.timingSdByPicker_s?.fraction ?? null,
      s.timingSdByPicker_s?.peak ?? null,
      s.timingSdByPicker_s?.xcorr ?? null,
      s.timingLowerLimit,
      s.temperatureSd_K,
      s.temperatureChangeSd_K,
      s.temperatureSdWithModel_K,
      s.targetKind,
      s.meetsTarget,
      s.shortestDistanceForTarget_m,
      s.shortestDistanceNote,
      s.secondSoundArrival_s === null ? null : s.insensitive,
    ]),
  };
}
