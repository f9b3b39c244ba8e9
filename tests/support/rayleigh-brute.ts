/**
 * The Rayleigh integral of a flat disk heater in a baffle, written independently of the kernel for
 * its tests: a polar grid of area elements on the disk, each contributing A_i·q₀·ṙ(t − R_i/u₂)/R_i,
 * summed and divided by 2π ρ c_p u₂² (the temperature of a baffled piston source; PHYSICS notes §4).
 */
export interface BruteDisk {
  radius_m: number;
  /** Peak heat flux q₀, W/m². */
  flux_W_m2: number;
  /** The drive's rate of change at time τ after its onset, 1/s (q̇ = q₀·rate). */
  rate: (tau_s: number) => number;
  secondSound_m_s: number;
  /** ρ c_p, J/(m³·K). */
  rhoC: number;
  /** Grid: rings and elements per ring. */
  rings: number;
  perRing: number;
}

/** Temperature at `sensor` (relative to the disk's centre, the disk in z = 0) at time `t_s`, K. */
export function bruteRayleigh(disk: BruteDisk, sensor: readonly [number, number, number], t_s: number): number {
  const { radius_m: a, rings, perRing } = disk;
  let sum = 0;
  for (let i = 0; i < rings; i++) {
    const r = ((i + 0.5) / rings) * a;
    const dA = (r * (a / rings) * 2 * Math.PI) / perRing;
    for (let j = 0; j < perRing; j++) {
      const phi = ((j + 0.5) / perRing) * 2 * Math.PI;
      const R = Math.hypot(sensor[0] - r * Math.cos(phi), sensor[1] - r * Math.sin(phi), sensor[2]);
      sum += (dA * disk.flux_W_m2 * disk.rate(t_s - R / disk.secondSound_m_s)) / R;
    }
  }
  return sum / (2 * Math.PI * disk.rhoC * disk.secondSound_m_s ** 2);
}
