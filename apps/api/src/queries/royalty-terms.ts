import type { Db } from '@busbar/db';
import type { RoyaltyTermsBody, RoyaltyTermsView } from '@busbar/shared';

/** A location's royalty terms, the latest month first, with who set them. */
export function listRoyaltyTerms(db: Db, locationId: number): Promise<RoyaltyTermsView[]> {
  return db
    .selectFrom('royaltyTerms as t')
    .leftJoin('users as u', 'u.id', 't.createdBy')
    .select(['t.id', 't.appliesFrom', 't.royaltyBasisPoints', 't.marketingBasisPoints', 't.createdAt', 'u.name as createdByName'])
    .where('t.locationId', '=', locationId)
    .orderBy('t.appliesFrom', 'desc')
    .execute();
}

/** Sets terms from a month on, replacing terms already set from that month; answers the ones replaced. */
export async function setRoyaltyTerms(db: Db, locationId: number, terms: RoyaltyTermsBody, by: { id: number; at: string }) {
  const before = await db.selectFrom('royaltyTerms').select(['royaltyBasisPoints', 'marketingBasisPoints']).where('locationId', '=', locationId).where('appliesFrom', '=', terms.appliesFrom).executeTakeFirst();
  await db
    .insertInto('royaltyTerms')
    .values({ locationId, ...terms, createdBy: by.id, createdAt: by.at })
    .onConflict((oc) => oc.columns(['locationId', 'appliesFrom']).doUpdateSet({ royaltyBasisPoints: terms.royaltyBasisPoints, marketingBasisPoints: terms.marketingBasisPoints, createdBy: by.id, createdAt: by.at }))
    .execute();
  return before ?? null;
}
