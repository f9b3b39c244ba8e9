import { useMemo } from 'react';
import { useSekundoStore } from '../store';
import { chosenLadders, type ShownLadders } from './ladders';

/** The planner's display ladders with the header's chosen units (see chosenLadders). */
export function useShownLadders(): ShownLadders {
  const units = useSekundoStore((s) => s.displayUnits);
  return useMemo(() => chosenLadders(units), [units]);
}
