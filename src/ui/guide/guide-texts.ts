import type { ViewId } from '../layout/view-slice';

/** What a first-time visitor needs to start in one view: a few steps and where its cautions are. */
export interface ViewGuideText {
  /** One line: what to do first. */
  lead: string;
  steps: readonly string[];
  /** Where this view's cautions are, or the caution itself. */
  caution: string;
}

/** The inline first-visit guide of each view, shown above it until the visitor puts it away. */
export const VIEW_GUIDES: Readonly<Record<ViewId, ViewGuideText>> = {
  explorer: {
    lead: 'Start with the bath temperature.',
    steps: [
      'Type a temperature (“1.8”, “1800 mK”) or drag the slider: every property of helium-4 along the saturated vapour pressure follows, with its source and uncertainty.',
      'The third chart shades where a time of flight pins the temperature poorly (near the u₂ minimum and maximum).',
      'Every field has a “?” that says what it takes; the header sets the theme and the display units.',
    ],
    caution: 'Model regions and the hazards of cryogenic work are under “About and cautions” at the bottom of this view.',
  },
  planner: {
    lead: 'Edit the demo plan, or start a plan of your own.',
    steps: [
      'Describe the bath, the heater, the sensors and the digitiser on the left; the timeline, the signal per sensor and the temperature resolution follow as you type.',
      'The warning tally beside the plan name counts stops, cautions and notes; each warning gives the number behind it.',
      'Your plan is kept in this browser; save it as a file, share it as a link or print the setup sheet for the cryostat.',
    ],
    caution: 'Heaters in a cryogenic bath: the cautions beside the heater inputs and on the setup sheet apply; local codes and licensed practice come first.',
  },
  converter: {
    lead: 'Type the distance and the delay you read off the scope.',
    steps: [
      'Every temperature the delay can mean is listed with its uncertainty; a vapour-pressure reading, an expected temperature or a range chooses among them.',
      '“Batch file” converts a column of delays; “Trace lab” picks arrivals from saved digitiser traces, read in the background; “Follow a folder” reads new traces as the digitiser writes them, live.',
      'Results copy and export as CSV in the display units.',
    ],
    caution: 'Near the u₂ minimum (1.12 K) and maximum (1.65 K) a delay says little about the temperature: such candidates are marked.',
  },
  locate: {
    lead: 'Type or load the sensors’ positions and arrival times.',
    steps: [
      'The heat source’s position comes with 1σ and 2σ regions and the residual of each sensor; outliers are marked.',
      'Arrival times can also be picked from a digitiser file in “Arrival times from traces”.',
      'Before a cooldown, the layout map shows how well a sensor layout would place a source and where one more sensor would help.',
    ],
    caution: 'Sekundo is a planning and analysis aid, not a safety system.',
  },
  resonator: {
    lead: 'Open the demo resonator, or type your gap and bath temperature.',
    steps: [
      'The plan lists the modes f_n = n u₂/2d with their temperature slope, the frequency step your target resolution needs and the plates’ Fresnel number.',
      'Drop a sweep CSV (frequency_Hz with x and y, or amplitude): the resonance is fitted with sds; with the mode number it gives every candidate temperature, and against a vortex-free reference the vortex line density.',
      'Drop a lock-in record (time_s, x, y) to follow the line density and the drift of f₀ over time; export it as CSV.',
    ],
    caution: 'Heaters in a cryogenic bath and counterflow runs: the cautions under the heater panel of this view apply; local codes and licensed practice come first.',
  },
};
