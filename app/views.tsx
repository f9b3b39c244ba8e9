import type { ComponentType } from 'react';
import { ConverterView } from '../src/ui/converter/ConverterView';
import { ExplorerView } from '../src/ui/explorer/ExplorerView';
import { LocateView } from '../src/ui/locate/LocateView';
import { PlannerView } from '../src/ui/planner/PlannerView';
import { ResonatorView } from '../src/ui/resonator/ResonatorView';
import type { ViewId } from '../src/ui/layout/view-slice';

/** The page's views, in tab order. A new view adds its id to ViewId and an entry here. */
export interface ViewEntry {
  id: ViewId;
  /** Tab label. */
  label: string;
  /** One line under the tabs saying what the view is for. */
  purpose: string;
  component: ComponentType;
}

export const VIEWS: readonly ViewEntry[] = [
  {
    id: 'explorer',
    label: 'Helium properties',
    purpose: 'Every property of liquid helium-4 along the saturated vapour pressure, with its source and uncertainty.',
    component: ExplorerView,
  },
  {
    id: 'planner',
    label: 'Plan a measurement',
    purpose:
      'Before a cooldown: when each wave reaches each sensor, how big the signal is, what overlaps or distorts, and how finely the delay pins the temperature.',
    component: PlannerView,
  },
  {
    id: 'converter',
    label: 'Read the temperature',
    purpose:
      'During a cooldown: a second-sound delay, a batch of delays or a saved trace → every temperature it can mean, each with its uncertainty, and the one your evidence favours.',
    component: ConverterView,
  },
  {
    id: 'locate',
    label: 'Locate a source',
    purpose:
      'Where is the heat source? Arrival times at several sensors → its position with 1σ and 2σ regions and residuals; before a cooldown, how well a sensor layout would place it.',
    component: LocateView,
  },
  {
    id: 'resonator',
    label: 'Resonator',
    purpose:
      'Standing waves: plan a second-sound resonator, read a frequency sweep into a bath temperature and a vortex line density, and follow a lock-in record over time.',
    component: ResonatorView,
  },
];
