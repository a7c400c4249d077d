import type { Db } from '@busbar/db';
import type { EvidenceView } from '@busbar/shared';

/** Every file of a claim in upload order, deleted ones included (marked). */
export async function claimEvidence(db: Db, claimId: number): Promise<EvidenceView[]> {
  const rows = await db
    .selectFrom('claimEvidence as e')
    .leftJoin('users as u', 'u.id', 'e.uploadedBy')
    .leftJoin('users as d', 'd.id', 'e.deletedBy')
    .select(['e.id', 'e.fileName', 'e.contentType', 'e.sizeBytes', 'e.hasThumbnail', 'e.uploadedAt', 'u.name as uploadedByName', 'e.deletedAt', 'd.name as deletedByName', 'e.deleteReason'])
    .where('e.claimId', '=', claimId)
    .orderBy('e.id')
    .execute();
  return rows.map((row) => ({ ...row, hasThumbnail: row.hasThumbnail === 1 }));
}

/** A file of a claim that has not been deleted. */
export function liveEvidence(db: Db, claimId: number, evidenceId: number) {
  return db
    .selectFrom('claimEvidence')
    .selectAll()
    .where('id', '=', evidenceId)
    .where('claimId', '=', claimId)
    .where('deletedAt', 'is', null)
    .executeTakeFirst();
}

export async function countLiveEvidence(db: Db, claimId: number): Promise<number> {
  const row = await db.selectFrom('claimEvidence').select((eb) => eb.fn.countAll<number>().as('n')).where('claimId', '=', claimId).where('deletedAt', 'is', null).executeTakeFirstOrThrow();
  return Number(row.n);
}
