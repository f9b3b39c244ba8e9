import { DEFAULT_TEMPERATURE_K, resetSekundoStore, useSekundoStore } from '../../src/ui/store';

const store = () => useSekundoStore.getState();

describe('Sekundo store', () => {
  it('starts at the default temperature with no message', () => {
    expect(store().temperature_K).toBe(DEFAULT_TEMPERATURE_K);
    expect(store().temperatureError).toBeNull();
  });

  it('keeps the last good temperature when a typed entry is rejected', () => {
    store().setTemperature(1.5);
    store().editTemperatureDraft('9 K');
    store().commitTemperatureDraft();
    expect(store().temperature_K).toBe(1.5);
    expect(store().temperatureDraft).toBe('9 K');
    expect(store().temperatureError).toMatch(/Temperature must be 0\.3–4\.24 K/);
  });

  it('rejects an out-of-range value from a control the same way', () => {
    store().setTemperature(Number.NaN);
    expect(store().temperature_K).toBe(DEFAULT_TEMPERATURE_K);
    expect(store().temperatureError).not.toBeNull();
  });

  it('stores inputs only: no derived results in the state', () => {
    const keys = Object.keys(store());
    expect(keys).not.toContain('secondSound_m_s');
    expect(keys.filter((key) => typeof store()[key as keyof ReturnType<typeof store>] !== 'function').sort()).toEqual([
      'activeView',
      'converterBatch',
      'converterBatchError',
      'converterChoice',
      'converterDistanceError',
      'converterDistancePoints',
      'converterDistanceRows',
      'converterDistanceUnits',
      'converterErrors',
      'converterFields',
      'converterMethod',
      'converterMode',
      'converterSweepError',
      'converterSweepPoints',
      'converterSweepText',
      'converterSweepUnit',
      'converterTraceFiles',
      'converterTraceHeater',
      'converterTraceNotice',
      'converterTracePicker',
      'converterTracePolarity',
      'converterTraceProgress',
      'converterTraceSelected',
      'converterTraceSensor',
      'converterTraceView',
      'displayUnits',
      'fieldDrafts',
      'fieldUnits',
      'guidesDismissed',
      'locateDisplay',
      'locateDrafts',
      'locateErrors',
      'locateOptions',
      'locateOrigin',
      'locateRows',
      'locateStatus',
      'locateTraceChoice',
      'locateTraceFile',
      'locateTracePicker',
      'locateTraceReading',
      'plannerDrafts',
      'plannerErrors',
      'plannerMapSensorKey',
      'plannerOpenedPlan',
      'plannerPlan',
      'plannerReflectorKeys',
      'plannerSensorKeys',
      'plannerSource',
      'plannerStatus',
      'plannerTimelineView',
      'preferencesNotice',
      'resonatorFileErrors',
      'resonatorInputs',
      'resonatorLockin',
      'resonatorNote',
      'resonatorOrigin',
      'resonatorReference',
      'resonatorStatus',
      'resonatorSweep',
      'sourceDetailsShown',
      'temperatureDraft',
      'temperatureError',
      'temperature_K',
      'themeChoice',
    ]);
  });

  it('resets every slice', () => {
    store().setTemperature(3);
    store().setSourceDetailsShown(true);
    resetSekundoStore();
    expect(store().temperature_K).toBe(DEFAULT_TEMPERATURE_K);
    expect(store().sourceDetailsShown).toBe(false);
  });
});
