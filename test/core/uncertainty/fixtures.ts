/** Shared inputs of the reserve Monte Carlo tests. */
import type { ReserveSpreads } from '../../../core/uncertainty/spreads.ts';

/** No spread on any input: every sample is the deterministic plan. */
export const ZERO_SPREADS: ReserveSpreads = {
  windSpeed_m_s: 0,
  windDirection_deg: 0,
  cd0: 0,
  efficiency: 0,
  fuelConsumption: 0,
  batteryCapacity: 0,
  payload_kg: 0,
};
