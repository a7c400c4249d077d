import type { BatteryName, CircuitLink, CircuitResult, Finding, PlanCircuit, PlanInput, ProtectionPoint } from './plan-types.ts';

/** Overcurrent protection within this distance of the battery terminal, mm: 7 in, or 40 in when the conductor is sheathed (33 CFR 183.455(a)–(b)). */
export const MAX_PROTECTION_DISTANCE_MM = { open: 178, sheathed: 1016 } as const;

const BATTERY_LABEL: Record<BatteryName, string> = { house: 'house battery', starter: 'starter battery' };

// A linked circuit leaves the battery its part is fed from, unless the plan says otherwise.
const IMPLIED_ENDS: Record<CircuitLink, { from?: BatteryName; to?: BatteryName }> = {
  'inverter-feed': { from: 'house' },
  'dcdc-input': { from: 'starter' },
  'dcdc-output': { to: 'house' },
};

function pointsOf(circuit: PlanCircuit, index: number, fuseA: number | null): ProtectionPoint[] {
  const implied = circuit.link ? IMPLIED_ENDS[circuit.link] : {};
  const maxDistanceMm = circuit.sheathed ? MAX_PROTECTION_DISTANCE_MM.sheathed : MAX_PROTECTION_DISTANCE_MM.open;
  const ends = [
    { end: 'from' as const, battery: circuit.fromBattery ?? implied.from, distanceMm: circuit.fuseFromBatteryMm },
    { end: 'to' as const, battery: circuit.toBattery ?? implied.to, distanceMm: circuit.fuseToBatteryMm },
  ];
  return ends.flatMap(({ end, battery, distanceMm }) =>
    battery
      ? [{ circuit: index, from: circuit.from, to: circuit.to, battery, end, maxDistanceMm, distanceMm: distanceMm ?? null, fuseA, ok: distanceMm !== undefined && distanceMm <= maxDistanceMm }]
      : [],
  );
}

/** Every place a circuit leaves a battery (both ends of a link between batteries), where it must be protected, with a critical finding for each that is not. */
export function protectionPoints(plan: PlanInput, circuits: CircuitResult[]): { points: ProtectionPoint[]; findings: Finding[] } {
  const points = plan.circuits.flatMap((circuit, i) => pointsOf(circuit, i, circuits[i]!.fuseA));
  const findings = points
    .filter((point) => !point.ok)
    .map((point): Finding => {
      const where = `within ${point.maxDistanceMm} mm (${point.maxDistanceMm === MAX_PROTECTION_DISTANCE_MM.open ? 7 : 40} in) of the ${BATTERY_LABEL[point.battery]}`;
      const drawn = point.distanceMm === null ? 'no fuse or breaker is drawn' : `the fuse is drawn ${point.distanceMm} mm away`;
      return { severity: 'critical', code: 'source-not-protected', circuit: point.circuit, message: `Circuit ${point.from} → ${point.to}: it needs a fuse or breaker ${where}; ${drawn}.` };
    });
  if (plan.inverter && !plan.circuits.some((circuit) => circuit.link === 'inverter-feed'))
    findings.push({
      severity: 'critical',
      code: 'inverter-feed-missing',
      message: `No circuit feeds the ${plan.inverter.ratedW} W inverter: add the inverter feed, so its conductor and fuse are sized for the current at cutoff.`,
    });
  return { points, findings };
}
