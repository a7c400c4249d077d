import { evaluatePlan, SAFETY_CAUTION, type PlanInput } from '@busbar/calc';
import type { BuildDetail, PlanView } from '@busbar/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIds, startHarness, type Agent, type Harness } from '../support/api-harness.ts';
import { createBuild, moveThrough } from '../support/build-fixtures.ts';
import { auditOf } from '../support/catalog-fixtures.ts';
import { SIGN_INS } from '../support/staff-fixtures.ts';

// 40 Wh a day of lights, which the starter battery carries, and a 20 A feeder run 3 m each way with
// 105 °C insulation. Round trip 6 m at 20 A allows 3 % of 12 V = 0.36 V, so at most 3.0 mΩ/m: 10 AWG
// has 1.24 Ω/kft (4.07 mΩ/m, 4.07 % drop), 8 AWG 0.778 Ω/kft (2.55 mΩ/m, 2.55 % drop; 80 A at 105 °C).
// The fuse is the smallest standard rating from 125 % of 20 A = 25 A, within the wire's 80 A: 25 A.
const input: PlanInput = {
  systemV: 12,
  gauge: 'awg',
  loads: [{ name: 'LED lights', watts: 10, hoursPerDay: 4, activeHours: [19, 20, 21, 22] }],
  starterBattery: { capacityAh: 70 },
  trip: { daysParked: 2, daysDriving: 1, driveHoursPerDay: 3 },
  circuits: [{ from: 'Starter battery', to: 'Fuse block', oneWayLengthM: 3, currentA: 20, critical: true, insulationC: 105 }],
};
const withTen: PlanInput = { ...input, circuits: [{ ...input.circuits[0]!, size: { awg: '10' } }] };

let h: Harness;
let ids: Awaited<ReturnType<typeof demoIds>>;
let lead: Agent;
let tech: Agent;
beforeAll(async () => {
  h = await startHarness();
  ids = await demoIds(h.db);
  lead = await h.signedIn(SIGN_INS.lead);
  tech = await h.signedIn(SIGN_INS.tech);
});
afterAll(() => h.close());

const techBuild = () => createBuild(h.db, lead, ids.location('DEN'), { leadTechnicianId: ids.user(SIGN_INS.tech), bookedFor: '2026-06-20' });
const stored = (buildId: number) => h.db.selectFrom('powerPlans').selectAll().where('buildId', '=', buildId).executeTakeFirstOrThrow();
const revisionsOf = async (agent: Agent, build: BuildDetail) => (await agent.get(`/api/builds/${build.id}/plan/revisions`)).body;

describe("a build's plan, saved in versions", () => {
  it("stores the inputs with the server's own evaluation of them, the caution included", async () => {
    const build = await techBuild();
    const res = await tech.put(`/api/builds/${build.id}/plan`).send({ version: 0, input });
    expect(res.status).toBe(200);
    const plan = res.body as PlanView;
    expect(plan.result.dailyWattHours).toBeCloseTo(40, 9);
    expect(plan.result.circuits[0]).toMatchObject({ conductor: { size: { awg: '8' }, ampacityA: 80 }, fuseA: 25, maxDropPercent: 3 });
    expect(plan.result.circuits[0]!.conductor!.dropPercent).toBeCloseTo((20 * 6 * 0.778) / 304.8 / 12 * 100, 6);
    expect(plan.result.caution).toBe(SAFETY_CAUTION);
    const row = await stored(build.id);
    expect(row).toMatchObject({ id: plan.id, locationId: ids.location('DEN'), name: build.number, version: 1, createdBy: ids.user(SIGN_INS.tech) });
    expect(JSON.parse(row.input)).toEqual(input);
    expect(row).not.toHaveProperty('result');
    expect(plan.result).toEqual(evaluatePlan(input));
  });

  it('evaluates the stored inputs whenever the plan is read, so no stale result is ever served', async () => {
    const build = await techBuild();
    const saved = (await tech.put(`/api/builds/${build.id}/plan`).send({ version: 0, input })).body as PlanView;
    const changed = { ...input, loads: input.loads.map((load) => ({ ...load, watts: load.watts * 2 })) };
    await h.db.updateTable('powerPlans').set({ input: JSON.stringify(changed) }).where('id', '=', saved.id).execute();
    const read = (await tech.get(`/api/builds/${build.id}/plan`)).body.plan as PlanView;
    expect(read.result).toEqual(evaluatePlan(changed));
    expect(read.result.dailyWattHours).toBeCloseTo(2 * saved.result.dailyWattHours, 9);
  });

  it('takes no result from the client: the server always computes it', async () => {
    const build = await techBuild();
    const forged = { ...evaluatePlan(input), dailyWattHours: 1 };
    const res = await tech.put(`/api/builds/${build.id}/plan`).send({ version: 0, input, result: forged });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ result: 'Unknown field' });
    expect(await h.db.selectFrom('powerPlans').select('id').where('buildId', '=', build.id).execute()).toEqual([]);
  });

  it('moves to the next version on each save, keeps every revision, and answers 409 to a stale one', async () => {
    const build = await techBuild();
    const first = (await tech.put(`/api/builds/${build.id}/plan`).send({ version: 0, input: withTen })).body as PlanView;
    // 20 A × 6 m × 1.24 Ω / 304.8 m = 0.488 V, 4.07 % of 12 V: over the 3 % a feeder may drop.
    expect(first.result.findings.map((f) => f.code)).toEqual(['circuit-over-drop']);
    expect(first.result.findings[0]!.message).toContain('10 AWG drops 4.1 %');
    h.clock.now = new Date('2026-06-15T16:00:00Z');
    const fixed = await lead.put(`/api/builds/${build.id}/plan`).send({ version: 1, input });
    expect(fixed.status).toBe(200);
    expect(fixed.body).toMatchObject({ version: 2, updatedAt: '2026-06-15T16:00:00.000Z', updatedByName: 'Priya Halvorsen', result: { findings: [], caution: SAFETY_CAUTION } });

    for (const version of [1, 0]) {
      const late = await tech.put(`/api/builds/${build.id}/plan`).send({ version, input: withTen });
      expect(late.status).toBe(409);
      expect(late.body.error.code).toBe('stale');
    }
    const row = await stored(build.id);
    expect([row.version, JSON.parse(row.input)]).toEqual([2, input]);
    expect(await revisionsOf(tech, build)).toEqual([
      { version: 2, savedAt: '2026-06-15T16:00:00.000Z', savedByName: 'Priya Halvorsen', note: '' },
      { version: 1, savedAt: '2026-06-15T15:00:00.000Z', savedByName: 'Dmitri Castellanos', note: '' },
    ]);
    const revisionInputs = await h.db.selectFrom('powerPlanRevisions').select('input').where('planId', '=', row.id).orderBy('version').execute();
    expect(revisionInputs.map((r) => JSON.parse(r.input))).toEqual([withTen, input]);
    expect((await auditOf(h.db, 'plan', row.id)).map((a) => [a.action, a.actorId, a.before, a.after])).toEqual([
      ['plan.create', ids.user(SIGN_INS.tech), null, { buildId: build.id, version: 1, verdict: 'no-second-battery', note: '' }],
      ['plan.update', ids.user(SIGN_INS.lead), { version: 1 }, { buildId: build.id, version: 2, verdict: 'no-second-battery', note: '' }],
    ]);
  });

  it('answers 409 stale to an update of a plan that was never saved', async () => {
    const build = await techBuild();
    const res = await tech.put(`/api/builds/${build.id}/plan`).send({ version: 1, input });
    expect([res.status, res.body.error.code]).toEqual([409, 'stale']);
  });
});

describe('plans of closed builds', () => {
  it('takes a change after delivery only from the lead, with a reason kept on the revision and the timeline', async () => {
    const build = await moveThrough(lead, await techBuild(), ['quoted', 'booked', 'in_bay']);
    expect((await tech.put(`/api/builds/${build.id}/plan`).send({ version: 0, input: withTen })).status).toBe(200);
    const delivered = await moveThrough(tech, build, ['quality_check', 'delivered']);

    const byTech = await tech.put(`/api/builds/${build.id}/plan`).send({ version: 1, input, correctionNote: 'Fitted 8 AWG' });
    expect(byTech.status).toBe(403);
    const noReason = await lead.put(`/api/builds/${build.id}/plan`).send({ version: 1, input });
    expect(noReason.status).toBe(400);
    expect(Object.keys(noReason.body.error.fields)).toEqual(['correctionNote']);
    expect((await stored(build.id)).version).toBe(1);

    const note = 'Feeder rewired in 8 AWG when the customer came back';
    const corrected = await lead.put(`/api/builds/${build.id}/plan`).send({ version: 1, input, correctionNote: note });
    expect(corrected.status).toBe(200);
    expect(corrected.body).toMatchObject({ version: 2, result: { findings: [], caution: SAFETY_CAUTION } });
    expect((await revisionsOf(lead, build))[0]).toMatchObject({ version: 2, savedByName: 'Priya Halvorsen', note });
    const detail = (await lead.get(`/api/builds/${build.id}`)).body as BuildDetail;
    expect(detail.events.at(-1)).toMatchObject({ kind: 'correction', note: `Power plan: ${note}`, actorName: 'Priya Halvorsen' });
    // The plan is versioned on its own: the build keeps the version its editors hold.
    expect(detail.version).toBe(delivered.version);
    expect((await auditOf(h.db, 'plan', corrected.body.id)).at(-1)).toMatchObject({ action: 'plan.correct', after: { version: 2, note } });
  });

  it('closes the plan of a cancelled build', async () => {
    const build = await moveThrough(lead, await techBuild(), ['cancelled']);
    const res = await lead.put(`/api/builds/${build.id}/plan`).send({ version: 0, input, correctionNote: 'late' });
    expect(res.status).toBe(409);
    expect(await h.db.selectFrom('powerPlans').select('id').where('buildId', '=', build.id).execute()).toEqual([]);
  });
});
