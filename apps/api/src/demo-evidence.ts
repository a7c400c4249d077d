import { demoEvidenceKinds, type Database, type Db } from '@busbar/db';
import type { Insertable } from 'kysely';
import { demoInspectionSheet, demoPhoto } from './demo-files.ts';
import { storeEvidence } from './evidence/store.ts';

/** Files made at once: the image library and the file system work on threads of their own. */
const FILES_AT_ONCE = 8;

/** Demo claims whose evidence was made ready, with who did it and when, oldest first. */
function readiedClaims(db: Db) {
  return db
    .selectFrom('warrantyClaims as w')
    .innerJoin('claimEvents as e', (join) => join.onRef('e.claimId', '=', 'w.id').on('e.toStatus', '=', 'evidence_ready'))
    .innerJoin('buildItems as i', 'i.id', 'w.buildItemId')
    .innerJoin('catalogItems as ci', 'ci.id', 'i.catalogItemId')
    .innerJoin('locations as l', 'l.id', 'w.locationId')
    .leftJoin('claimEvidence as x', 'x.claimId', 'w.id')
    .where('x.id', 'is', null)
    .select(['w.id', 'w.number', 'w.sequence', 'l.name as shopName', 'i.sku', 'ci.name as itemName', 'i.serialNumber', 'w.failedOn', 'w.failureMode', 'w.symptoms'])
    .select((eb) => [eb.fn.min('e.at').as('readyAt'), eb.fn.min('e.actorId').as('readyBy')])
    .groupBy('w.id')
    .orderBy('w.id')
    .execute();
}

/**
 * The files of the demo's claims (demoEvidenceKinds says which), stored as uploads are, by the
 * clerk who made the evidence ready, minutes before: an inspection sheet on each, a drawn photo
 * on some. A claim that has files already is left alone. Answers how many files were stored.
 */
export async function addDemoEvidence(db: Db, dataDir: string): Promise<number> {
  const claims = await readiedClaims(db);
  const jobs = claims.flatMap((claim) => demoEvidenceKinds(claim.sequence).map((kind, n) => ({ claim, kind, n })));
  const rows: Insertable<Database['claimEvidence']>[] = [];
  for (let start = 0; start < jobs.length; start += FILES_AT_ONCE) {
    const batch = await Promise.all(
      jobs.slice(start, start + FILES_AT_ONCE).map(async ({ claim, kind, n }) => {
        const photo = kind === 'photo';
        const bytes = photo ? await demoPhoto(claim) : demoInspectionSheet(claim);
        const contentType = photo ? 'image/png' : 'application/pdf';
        const stored = await storeEvidence(dataDir, bytes, contentType);
        const uploadedAt = new Date(Date.parse(claim.readyAt!) - (n + 1) * 4 * 60_000).toISOString();
        return {
          claimId: claim.id,
          fileName: `${claim.number}-${photo ? 'unit.png' : 'inspection.pdf'}`,
          storedName: stored.storedName,
          contentType,
          sizeBytes: bytes.length,
          hasThumbnail: stored.hasThumbnail ? 1 : 0,
          uploadedBy: claim.readyBy,
          uploadedAt,
        };
      }),
    );
    rows.push(...batch);
  }
  // In the order they were uploaded, as the gallery lists them.
  rows.sort((a, b) => a.claimId - b.claimId || a.uploadedAt.localeCompare(b.uploadedAt));
  await db.transaction().execute(async (trx) => {
    for (let start = 0; start < rows.length; start += 200) await trx.insertInto('claimEvidence').values(rows.slice(start, start + 200)).execute();
  });
  return rows.length;
}
