/**
 * The thrust an engine at idle gives, as implied by the idle fuel flow the solver charges: the
 * engine models tie fuel flow to thrust or shaft power (core/propulsion; TSFC and BSFC as
 * defined in Anderson, Aircraft Performance and Design, ch. 3, from memory), so the same idle
 * setting gives both:
 *
 * - jet: fuel = TSFC·T, so the idle flow TSFC·f_idle·T_ref is the flow of the thrust
 *   T_idle = f_idle·T_ref (power.ts `jetIdleReference_N`); thrust power T_idle·V;
 * - propeller: fuel = BSFC·P_shaft, so the idle flow BSFC·f_idle·P_max is the flow of the shaft
 *   power f_idle·P_max, turned into thrust power by the propeller's efficiency η(V) there;
 * - electric: the motor is off at idle (no drain, no thrust).
 *
 * An idle fraction of 0 is an engine giving no thrust (a feathered or stopped propeller); the
 * drag of a windmilling propeller is not modelled (it would need the propeller's geometry).
 * A glide at idle then sinks at ḣ = −(D·V − P_idle)/(W·k_a), the energy equation of point.ts
 * with the idle thrust (Anderson, Introduction to Flight, ch. 6: sin γ = (T − D)/W).
 */
import { curveEfficiency } from '../propulsion/propellerCurve.ts';
import { jetIdleReference_N, type EngineAir, type PowerConstants } from './power.ts';

/** Thrust power (W) at idle at TAS V. */
export function idleThrustPower_W(
  c: PowerConstants,
  air: EngineAir,
  V_m_s: number,
  rho_kg_m3: number,
): number {
  if (c.idleFraction === 0) return 0;
  switch (c.type) {
    case 'jet':
      return c.idleFraction * jetIdleReference_N(c, air) * V_m_s;
    case 'propeller': {
      const shaft = c.idleFraction * air.engineMax;
      return curveEfficiency(c.prop, shaft, V_m_s, rho_kg_m3) * shaft;
    }
    case 'electric':
      return 0;
  }
}
