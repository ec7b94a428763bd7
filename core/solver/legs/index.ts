/** One entry for every leg kind: flies `leg` from `start` (see the per-kind files). */
import type { Leg } from '../../plan/schema.ts';
import type { MissionState } from '../segment.ts';
import { flyAllowance } from './allowance.ts';
import { flyClimb } from './climb.ts';
import type { LegContext, LegOutcome } from './common.ts';
import { flyCruise } from './cruise.ts';
import { flyDescent } from './descent.ts';
import { flyLoiter } from './loiter.ts';

export type { LegContext, LegOutcome, LegCheckData } from './common.ts';

/** `loiterConsume`: the amount an "until reserve" loiter uses (chosen by the solver). */
export function flyLeg(
  ctx: LegContext,
  leg: Leg,
  start: MissionState,
  loiterConsume = 0,
): LegOutcome {
  switch (leg.kind) {
    case 'takeoff':
    case 'landing':
      return flyAllowance(ctx, leg, start);
    case 'climb':
      return flyClimb(ctx, leg, start);
    case 'cruise':
      return flyCruise(ctx, leg, start);
    case 'loiter':
      return flyLoiter(ctx, leg, start, loiterConsume);
    case 'descent':
      return flyDescent(ctx, leg, start);
  }
}
