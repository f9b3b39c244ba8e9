import type { StateCreator } from 'zustand';
import type { PlanFile } from '../../io/plan-file';
import { BUILT_IN_PLAN } from '../planner/default-plan';
import { planProblem } from '../planner/derive-plan';
import {
  addReflector,
  addSensor,
  duplicateSensor,
  MAX_REFLECTORS,
  MAX_SENSORS,
  removeReflector,
  removeSensor,
} from '../planner/plan-edits';
import type { PlanEdit } from '../planner/plan-fields';
import { markPlanEdit } from '../planner/recompute-timer';
import type { SekundoState } from './state';

/** Where the plan on screen came from. */
export interface PlannerSource {
  /** restored: the autosave of the last visit; saved: a named plan kept in the browser; link: a share link; new: "New plan". */
  kind: 'demo' | 'built-in' | 'new' | 'file' | 'restored' | 'saved' | 'link';
  /** What to tell the user about it (e.g. why the demo did not load); null for nothing. */
  note: string | null;
}

/** What the timeline shows: the direct arrivals, the whole record, or the heater and first sound. */
export type TimelineView = 'arrivals' | 'record' | 'early';

/** A change made from text: the plan it gives, or why it is refused. */
export type TextEdit = (plan: PlanFile, text: string) => PlanEdit;

/**
 * The measurement planner's inputs: the plan file (always one the schema and kernel accept), the
 * text of fields being typed or refused, and which sensor the resolution map follows. Results are
 * derived from the plan with the kernel (src/ui/planner/derive-plan.ts), never stored.
 */
export interface PlannerSlice {
  plannerPlan: PlanFile;
  /** 'idle' until the planner first opens, 'loading' while the demo is fetched, then 'ready'. */
  plannerStatus: 'idle' | 'loading' | 'ready';
  plannerSource: PlannerSource;
  /** The plan as it was opened (same object as plannerPlan until the first edit): unchanged work needs no keeping. */
  plannerOpenedPlan: PlanFile;
  /** Text typed into fields, by field key, until the field is left with a good value. */
  plannerDrafts: Readonly<Record<string, string>>;
  /** Why a field's text was refused (the plan keeps its last good value), by field key. */
  plannerErrors: Readonly<Record<string, string>>;
  /** Stable keys of the sensor rows and plane rows (React keys and field keys), in plan order. */
  plannerSensorKeys: readonly string[];
  plannerReflectorKeys: readonly string[];
  /** Row key of the sensor whose timing the resolution map uses; null: the first sensor. */
  plannerMapSensorKey: string | null;
  plannerTimelineView: TimelineView;
  beginPlannerLoad: () => void;
  /** Replaces the whole plan (demo, built-in, file); clears drafts and messages. */
  loadPlannerPlan: (plan: PlanFile, source: PlannerSource) => void;
  /** Text typed into a field: kept as the draft; applied when it gives a good plan, otherwise refused with a message. */
  typePlannerField: (key: string, text: string, edit: TextEdit) => void;
  /** Leaving a field: a good draft gives way to the plan's value; a refused one stays with its message. */
  leavePlannerField: (key: string) => void;
  /** Drops a field's draft and message (Escape): the field shows the plan's value again. */
  discardPlannerDraft: (key: string) => void;
  /**
   * A change from a control (select, checkbox, button); a refusal is shown under `key`. Drafts and
   * messages of fields starting with `clearPrefix` go when the change is made (renumbered rows).
   */
  editPlanner: (key: string, change: (plan: PlanFile) => PlanEdit | PlanFile, clearPrefix?: string) => void;
  addPlannerSensor: () => void;
  duplicatePlannerSensor: (index: number) => void;
  removePlannerSensor: (index: number) => void;
  addPlannerReflector: () => void;
  removePlannerReflector: (index: number) => void;
  setPlannerMapSensor: (key: string) => void;
  setPlannerTimelineView: (view: TimelineView) => void;
}

let keyCounter = 0;
function newKey(prefix: string): string {
  keyCounter += 1;
  return `${prefix}${keyCounter}`;
}

function freshKeys(plan: PlanFile): Pick<PlannerSlice, 'plannerSensorKeys' | 'plannerReflectorKeys'> {
  return { plannerSensorKeys: plan.sensors.map(() => newKey('sensor-')), plannerReflectorKeys: plan.reflectors.map(() => newKey('plane-')) };
}

function without(record: Readonly<Record<string, string>>, key: string): Record<string, string> {
  if (!(key in record)) return record as Record<string, string>;
  const copy = { ...record };
  delete copy[key];
  return copy;
}

/** Drops drafts and messages whose key starts with one of the prefixes (rows removed or renumbered). */
function withoutPrefixes(record: Readonly<Record<string, string>>, prefixes: readonly string[]): Record<string, string> {
  return Object.fromEntries(Object.entries(record).filter(([key]) => !prefixes.some((p) => key.startsWith(p))));
}

const STRUCTURE_ERROR_KEY = 'structure';

export const createPlannerSlice: StateCreator<SekundoState, [], [], PlannerSlice> = (set, get) => {
  /** Checks a changed plan; on success it becomes the plan (and the edit is timed). Returns the refusal, or null. */
  const commit = (plan: PlanFile, extra: Partial<PlannerSlice> = {}): string | null => {
    const problem = planProblem(plan);
    if (problem !== null) return problem;
    markPlanEdit();
    set({ plannerPlan: plan, ...extra });
    return null;
  };

  const refuse = (key: string, message: string): void => set({ plannerErrors: { ...get().plannerErrors, [key]: message } });

  return {
    plannerPlan: BUILT_IN_PLAN,
    plannerStatus: 'idle',
    plannerSource: { kind: 'built-in', note: null },
    plannerOpenedPlan: BUILT_IN_PLAN,
    plannerDrafts: {},
    plannerErrors: {},
    ...freshKeys(BUILT_IN_PLAN),
    plannerMapSensorKey: null,
    plannerTimelineView: 'arrivals',

    beginPlannerLoad: () => set({ plannerStatus: 'loading' }),

    loadPlannerPlan: (plan, source) => {
      set({ plannerPlan: plan, plannerOpenedPlan: plan, plannerSource: source, plannerStatus: 'ready', plannerDrafts: {}, plannerErrors: {}, plannerMapSensorKey: null, ...freshKeys(plan) });
    },

    typePlannerField: (key, text, edit) => {
      // One store update per keystroke: every field's selectors run on each update, and a plan of
      // 64 sensors has hundreds of fields.
      const state = get();
      const plannerDrafts = { ...state.plannerDrafts, [key]: text };
      const result = edit(state.plannerPlan, text);
      const problem = result.ok ? planProblem(result.plan) : result.message;
      if (problem !== null || !result.ok) {
        set({ plannerDrafts, plannerErrors: { ...state.plannerErrors, [key]: problem ?? '' } });
        return;
      }
      markPlanEdit();
      set({ plannerDrafts, plannerPlan: result.plan, plannerErrors: without(state.plannerErrors, key) });
    },

    leavePlannerField: (key) => {
      const { plannerErrors, plannerDrafts } = get();
      if (key in plannerErrors || !(key in plannerDrafts)) return;
      set({ plannerDrafts: without(plannerDrafts, key) });
    },

    discardPlannerDraft: (key) => set({ plannerDrafts: without(get().plannerDrafts, key), plannerErrors: without(get().plannerErrors, key) }),

    editPlanner: (key, change, clearPrefix) => {
      const { plannerPlan, plannerDrafts, plannerErrors } = get();
      const result = change(plannerPlan);
      const edit: PlanEdit = 'ok' in result ? result : { ok: true, plan: result };
      const prefixes = clearPrefix === undefined ? [] : [clearPrefix];
      const extra = { plannerErrors: withoutPrefixes(without(plannerErrors, key), prefixes), plannerDrafts: withoutPrefixes(plannerDrafts, prefixes) };
      const problem = edit.ok ? commit(edit.plan, extra) : edit.message;
      if (problem !== null) refuse(key, problem);
    },

    addPlannerSensor: () => {
      const { plannerPlan, plannerSensorKeys } = get();
      if (plannerPlan.sensors.length >= MAX_SENSORS) return refuse(STRUCTURE_ERROR_KEY, `A plan has at most ${MAX_SENSORS} sensors.`);
      const problem = commit(addSensor(plannerPlan), { plannerSensorKeys: [...plannerSensorKeys, newKey('sensor-')] });
      if (problem !== null) refuse(STRUCTURE_ERROR_KEY, problem);
    },

    duplicatePlannerSensor: (index) => {
      const { plannerPlan, plannerSensorKeys } = get();
      if (plannerPlan.sensors.length >= MAX_SENSORS) return refuse(STRUCTURE_ERROR_KEY, `A plan has at most ${MAX_SENSORS} sensors.`);
      const keys = [...plannerSensorKeys.slice(0, index + 1), newKey('sensor-'), ...plannerSensorKeys.slice(index + 1)];
      const problem = commit(duplicateSensor(plannerPlan, index), { plannerSensorKeys: keys });
      if (problem !== null) refuse(STRUCTURE_ERROR_KEY, problem);
    },

    removePlannerSensor: (index) => {
      const { plannerPlan, plannerSensorKeys, plannerDrafts, plannerErrors, plannerMapSensorKey } = get();
      if (plannerPlan.sensors.length <= 1) return refuse(STRUCTURE_ERROR_KEY, 'A plan needs at least one sensor.');
      const removed = plannerSensorKeys[index];
      const prefixes = removed === undefined ? [] : [`sensor.${removed}.`];
      const problem = commit(removeSensor(plannerPlan, index), {
        plannerSensorKeys: plannerSensorKeys.filter((_, i) => i !== index),
        plannerDrafts: withoutPrefixes(plannerDrafts, prefixes),
        plannerErrors: withoutPrefixes(without(plannerErrors, STRUCTURE_ERROR_KEY), prefixes),
        plannerMapSensorKey: plannerMapSensorKey === removed ? null : plannerMapSensorKey,
      });
      if (problem !== null) refuse(STRUCTURE_ERROR_KEY, problem);
    },

    addPlannerReflector: () => {
      const { plannerPlan, plannerReflectorKeys } = get();
      if (plannerPlan.reflectors.length >= MAX_REFLECTORS) return refuse(STRUCTURE_ERROR_KEY, `A plan has at most ${MAX_REFLECTORS} reflecting planes.`);
      const problem = commit(addReflector(plannerPlan), { plannerReflectorKeys: [...plannerReflectorKeys, newKey('plane-')] });
      if (problem !== null) refuse(STRUCTURE_ERROR_KEY, problem);
    },

    removePlannerReflector: (index) => {
      const { plannerPlan, plannerReflectorKeys, plannerDrafts, plannerErrors } = get();
      const removed = plannerReflectorKeys[index];
      const prefixes = removed === undefined ? [] : [`plane.${removed}.`];
      const problem = commit(removeReflector(plannerPlan, index), {
        plannerReflectorKeys: plannerReflectorKeys.filter((_, i) => i !== index),
        plannerDrafts: withoutPrefixes(plannerDrafts, prefixes),
        plannerErrors: withoutPrefixes(plannerErrors, prefixes),
      });
      if (problem !== null) refuse(STRUCTURE_ERROR_KEY, problem);
    },

    setPlannerMapSensor: (key) => set({ plannerMapSensorKey: key }),
    setPlannerTimelineView: (view) => set({ plannerTimelineView: view }),
  };
};

/** Store key of messages about adding and removing rows. */
export const PLANNER_STRUCTURE_KEY = STRUCTURE_ERROR_KEY;
