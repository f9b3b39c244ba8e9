import { DEFAULT_TEMPERATURE_K, resetSekundoStore, useSekundoStore } from '../../src/ui/store';

const store = () => useSekundoStore.getState();

describe('Sekundo store', () => {
  it('starts at the default temperature with no draft', () => {
    expect(store().temperature_K).toBe(DEFAULT_TEMPERATURE_K);
    expect(store().fieldDrafts).toEqual({});
  });

  it('keeps the last good temperature when a value out of range is refused, and says why', () => {
    expect(store().setTemperature(1.5)).toBeNull();
    expect(store().setTemperature(9)).toMatch(/Temperature must be 0\.3–4\.24 K/);
    expect(store().temperature_K).toBe(1.5);
  });

  it('rejects a value that is not a number the same way', () => {
    expect(store().setTemperature(Number.NaN)).not.toBeNull();
    expect(store().temperature_K).toBe(DEFAULT_TEMPERATURE_K);
  });

  it('keeps drafts by field key and drops a feature\'s drafts by prefix', () => {
    store().setFieldDraft('planner.bath.temperature', { text: '9', unit: 'K', message: 'Bath temperature must be …' });
    store().setFieldDraft('converter.delay', { text: '2', unit: 'ms', message: null });
    store().dropFieldDrafts('planner.');
    expect(Object.keys(store().fieldDrafts)).toEqual(['converter.delay']);
    store().dropFieldDraft('converter.delay');
    expect(store().fieldDrafts).toEqual({});
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
      'converterValues',
      'displayUnits',
      'fieldDrafts',
      'fieldUnits',
      'guidesDismissed',
      'locateDisplay',
      'locateErrors',
      'locateOptions',
      'locateOrigin',
      'locateRows',
      'locateStatus',
      'locateTraceChoice',
      'locateTraceFile',
      'locateTracePicker',
      'locateTraceReading',
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
      'rehearseChartSensor',
      'rehearseExportCount',
      'rehearseExportTrial',
      'rehearseOptions',
      'rehearseRun',
      'resonatorFileErrors',
      'resonatorInputs',
      'resonatorLockin',
      'resonatorNote',
      'resonatorOrigin',
      'resonatorReference',
      'resonatorStatus',
      'resonatorSweep',
      'sourceDetailsShown',
      'temperature_K',
      'themeChoice',
      'watchAlarms',
      'watchInterval_s',
      'watchNotice',
      'watchPattern',
      'watchSource',
      'watchStatus',
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
