import type { ComponentType } from 'react';
import { ExplorerView } from '../src/ui/explorer/ExplorerView';
import type { ViewId } from '../src/ui/store/view-slice';

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
];
