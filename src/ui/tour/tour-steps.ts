import type { ViewId } from '../store/view-slice';

/** One step of the first-visit tour: a view (shown behind the tour) and what to know about it. */
export interface TourStep {
  title: string;
  /** The view opened behind the step; null keeps the one on screen. */
  view: ViewId | null;
  text: string;
  /** Where the cautions of this view are. */
  caution?: string;
}

export const TOUR_STEPS: readonly TourStep[] = [
  {
    title: 'Welcome to Sekundo',
    view: null,
    text: 'Sekundo helps you plan second-sound measurements in superfluid helium-4 and read a bath temperature from a time of flight. Everything is computed in this browser; nothing is sent anywhere. Four short steps show the views.',
  },
  {
    title: 'Helium properties',
    view: 'explorer',
    text: 'Choose a temperature and read every property of liquid helium-4 along the saturated vapour pressure, each with its source and, where stated, its uncertainty. The charts show where a time of flight pins the temperature poorly.',
    caution: 'Model regions and the hazards of cryogenic work are under “About and cautions” at the bottom of this view.',
  },
  {
    title: 'Plan a measurement',
    view: 'planner',
    text: 'Before a cooldown: heater–sensor spacing, pulse and digitiser. See when each wave arrives, how big the signal is, what overlaps, and how finely the delay pins the temperature.',
    caution: 'Warnings beside the timeline flag overlaps, distortion and heater power; red ones stop the plan from working as drawn.',
  },
  {
    title: 'Read the temperature',
    view: 'converter',
    text: 'During a cooldown: turn a delay, a batch of delays or a saved trace into every temperature it can mean, each with its uncertainty, and the one your evidence favours.',
    caution: 'Candidates near the u₂ minimum and maximum are marked: there a delay says little about the temperature.',
  },
  {
    title: 'Locate a source',
    view: 'locate',
    text: 'Arrival times at several sensors give the heat source’s position with 1σ and 2σ regions; the layout-quality map shows where one more sensor would help. Every field has a “?” that says what it takes.',
    caution: 'Theme and display units are in the header. Sekundo is a planning aid, not a safety system: your local codes and licensed practice come first.',
  },
];
