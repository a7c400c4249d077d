import { conductorAmpacityA } from './ampacity.ts';
import { voltageDrop, type ConductorCondition } from './conductors.ts';
import { FUSE_MAX_OF_AMPACITY, FUSE_MIN_OF_LOAD, fuseForLoadA, selectFuseA } from './fuses.ts';
import { linkedCurrentA, type PlanParts } from './plan-parts.ts';
import type { CheckedConductor, CircuitResult, Finding, PlanCircuit, PlanInput } from './plan-types.ts';
import { MIN_RECOMMENDED_SIZE, selectConductor } from './select-conductor.ts';
import { conductorLabel } from './sizes.ts';

/** Allowed round-trip drop for 12 V circuits, %: critical (main feeders, electronics, charging) and other (lighting, non-critical loads). */
export const MAX_DROP_PERCENT = { critical: 3, other: 10 } as const;

const round = (x: number, digits = 0) => x.toFixed(digits);

/** The current a circuit carries: computed for a linked circuit, else as typed (validatePlan sees that one of them is there). */
export function circuitCurrentA(circuit: PlanCircuit, plan: PlanInput, parts: PlanParts): number {
  return circuit.link ? linkedCurrentA(plan, parts, circuit.link)! : circuit.currentA!;
}

/** Conductor and fuse of one circuit (fitted ones checked, missing ones chosen), with its findings. */
export function evaluateCircuit(circuit: PlanCircuit, index: number, plan: PlanInput, parts: PlanParts): { result: CircuitResult; findings: Finding[] } {
  const { from, to, oneWayLengthM, insulationC, engineSpace, bundledConductors } = circuit;
  const currentA = circuitCurrentA(circuit, plan, parts);
  const amps = round(currentA, currentA < 10 ? 1 : 0);
  const findings: Finding[] = [];
  const add = (severity: Finding['severity'], code: Finding['code'], text: string) =>
    findings.push({ severity, code, message: `Circuit ${from} → ${to}: ${text}`, circuit: index });

  const maxDropPercent = circuit.critical ? MAX_DROP_PERCENT.critical : MAX_DROP_PERCENT.other;
  const rating = { insulationC, engineSpace, bundledConductors };
  const condition: ConductorCondition = { temperatureC: plan.conductorTemperatureC, tinned: plan.tinnedCopper };
  const recommended = selectConductor({ currentA, oneWayLengthM, systemV: plan.systemV, maxDropPercent, gauge: plan.gauge, ...rating, ...condition });
  if (!recommended)
    add('critical', 'no-conductor-fits', `no single conductor carries ${amps} A and its fuse within ${maxDropPercent} % drop; run conductors in parallel or shorten the run.`);

  const size = circuit.size ?? recommended?.size;
  let conductor: CheckedConductor | null = null;
  let maxFuseA: number | null = null;
  let recommendedFuseA: number | null = null;
  if (size) {
    const label = conductorLabel(size);
    conductor = { size, ...voltageDrop({ currentA, oneWayLengthM, size, systemV: plan.systemV, ...condition }), ampacityA: conductorAmpacityA({ size, ...rating }) };
    const wireA = round(conductor.ampacityA);
    maxFuseA = FUSE_MAX_OF_AMPACITY * conductor.ampacityA;
    const carries = conductor.ampacityA >= currentA;
    if (!carries) add('critical', 'conductor-over-ampacity', `${label} is allowed ${wireA} A here, less than the ${amps} A it carries.`);
    if (conductor.dropPercent > maxDropPercent) {
      const better = recommended ? ` ${conductorLabel(recommended.size)} keeps it within.` : '';
      add('warning', 'circuit-over-drop', `${label} drops ${round(conductor.dropPercent, 1)} %, over the ${maxDropPercent} % allowed.${better}`);
    }
    if ('awg' in size && size.awg === '18' && !circuit.sheathed)
      add('warning', 'conductor-below-minimum', `18 AWG run on its own is below the ${conductorLabel(MIN_RECOMMENDED_SIZE.awg)} a conductor installed separately should be.`);
    recommendedFuseA = carries ? selectFuseA({ loadA: currentA, conductorAmpacityA: conductor.ampacityA }) : null;
    if (carries && recommendedFuseA === null && circuit.fuseA === undefined) {
      const fuseA = fuseForLoadA(currentA);
      add('critical', 'no-fuse-fits', `the ${fuseA ?? round(FUSE_MIN_OF_LOAD * currentA)} A fuse the load needs is above the ${wireA} A ${label} is allowed; use a larger conductor.`);
    }
    if (circuit.fuseA !== undefined && circuit.fuseA > maxFuseA)
      add('critical', 'fuse-does-not-protect-wire', `a ${circuit.fuseA} A fuse does not protect ${label}: at most ${round(maxFuseA, 1)} A, 150 % of its ${wireA} A.`);
    else if (circuit.fuseA !== undefined && circuit.fuseA > conductor.ampacityA)
      add('warning', 'fuse-above-wire-rating', `a ${circuit.fuseA} A fuse is above the ${wireA} A ${label} is allowed (within the 150 % ceiling); a larger conductor or a smaller fuse leaves margin.`);
  }
  if (circuit.fuseA !== undefined && circuit.fuseA < FUSE_MIN_OF_LOAD * currentA)
    add('warning', 'fuse-below-load', `a ${circuit.fuseA} A fuse is below 125 % of the ${amps} A load and may open in normal running.`);

  const fuseA = circuit.fuseA ?? recommendedFuseA;
  const link = circuit.link ?? null;
  return { result: { from, to, currentA, link, maxDropPercent, recommended, conductor, maxFuseA, recommendedFuseA, fuseA }, findings };
}
