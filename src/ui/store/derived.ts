import { useMemo } from 'react';
import { type HeliumProperties, heliumProperties } from '../../physics';
import { useSekundoStore } from './sekundo-store';

/** Properties at the chosen temperature, derived from the store's input with the kernel. */
export function useHeliumProperties(): HeliumProperties {
  const temperature_K = useSekundoStore((state) => state.temperature_K);
  return useMemo(() => heliumProperties(temperature_K), [temperature_K]);
}
