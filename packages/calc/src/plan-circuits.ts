import { conductorAmpacityA } from './ampacity.ts';
import { voltageDrop } from './conductors.ts';
import { FUSE_MAX_OF_AMPACITY, FUSE_MIN_OF_LOAD, selectFuseA } from './fuses.ts';
import type { CheckedConductor, CircuitResult, Finding, PlanCircuit, PlanInput } from './plan-types.ts';
import { selectConductor } from './select-conductor.ts';
import { conductorLabel } from './sizes.ts';

/** Allowed round-trip drop for 12 V circuits, %: critical (main feeders, electronics, charging) and other (lighting, non-critical loads). */
export const MAX_DROP_PERCENT = { critical: 3, other: 10 } as const;

const round = (x: number, digits = 0) => x.toFixed(digits);

/** Conductor and fuse of one circuit (fitted ones checked, missing ones chosen), with its findings. */
export function evaluateCircuit(circuit: PlanCircuit, index: number, plan: PlanInput): { result: CircuitResult; findings: Finding[] } {
  const { from, to, currentA, oneWayLengthM, insulationC, engineSpace, bundledConductors } = circuit;
  const findings: Finding[] = [];
  const add = (severity: Finding['severity'], code: Finding['code'], text: string) =>
    findings.push({ severity, code, message: `Circuit ${from} → ${to}: ${text}`, circuit: index });

  const maxDropPercent = circuit.critical ? MAX_DROP_PERCENT.critical : MAX_DROP_PERCENT.other;
  const rating = { insulationC, engineSpace, bundledConductors };
  const recommended = selectConductor({ currentA, oneWayLengthM, systemV: plan.systemV, maxDropPercent, gauge: plan.gauge, ...rating });
  if (!recommended)
    add('critical', 'no-conductor-fits', `no single conductor carries ${currentA} A within ${maxDropPercent} % drop; run conductors in parallel or shorten the run.`);

  const size = circuit.size ?? recommended?.size;
  let conductor: CheckedConductor | null = null;
  let maxFuseA: number | null = null;
  let recommendedFuseA: number | null = null;
  if (size) {
    const label = conductorLabel(size);
    conductor = { size, ...voltageDrop({ currentA, oneWayLengthM, size, systemV: plan.systemV }), ampacityA: conductorAmpacityA({ size, ...rating }) };
    maxFuseA = FUSE_MAX_OF_AMPACITY * conductor.ampacityA;
    const carries = conductor.ampacityA >= currentA;
    if (!carries) add('critical', 'conductor-over-ampacity', `${label} is allowed ${round(conductor.ampacityA)} A here, less than the ${currentA} A it carries.`);
    if (conductor.dropPercent > maxDropPercent) {
      const better = recommended ? ` ${conductorLabel(recommended.size)} keeps it within.` : '';
      add('warning', 'circuit-over-drop', `${label} drops ${round(conductor.dropPercent, 1)} %, over the ${maxDropPercent} % allowed.${better}`);
    }
    recommendedFuseA = carries ? selectFuseA({ loadA: currentA, conductorAmpacityA: conductor.ampacityA }) : null;
    if (carries && recommendedFuseA === null && circuit.fuseA === undefined)
      add('critical', 'no-fuse-fits', `no standard fuse lies between ${round(FUSE_MIN_OF_LOAD * currentA, 1)} A and ${round(maxFuseA, 1)} A; use a larger conductor.`);
    if (circuit.fuseA !== undefined && circuit.fuseA > maxFuseA)
      add('critical', 'fuse-does-not-protect-wire', `a ${circuit.fuseA} A fuse does not protect ${label}: at most ${round(maxFuseA, 1)} A, 150 % of its ${round(conductor.ampacityA)} A.`);
  }
  if (circuit.fuseA !== undefined && circuit.fuseA < FUSE_MIN_OF_LOAD * currentA)
    add('warning', 'fuse-below-load', `a ${circuit.fuseA} A fuse is below 125 % of the ${currentA} A load and may open in normal running.`);

  const fuseA = circuit.fuseA ?? recommendedFuseA;
  return { result: { from, to, currentA, maxDropPercent, recommended, conductor, maxFuseA, recommendedFuseA, fuseA }, findings };
}
