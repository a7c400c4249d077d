import type { Migration } from 'kysely';
import * as createFoundation from './001-create-foundation.ts';
import * as createBuilds from './002-create-builds.ts';
import * as createPowerPlans from './003-create-power-plans.ts';
import * as indexLists from './004-index-lists.ts';
import * as createBuildSearch from './005-create-build-search.ts';
import * as dropPlanResults from './006-drop-plan-results.ts';
import * as createClaims from './007-create-claims.ts';
import * as indexBuildNumbers from './008-index-build-numbers.ts';
import * as createCustomerSearch from './009-create-customer-search.ts';
import * as createClaimEvidence from './010-create-claim-evidence.ts';
import * as indexCustomerEmails from './011-index-customer-emails.ts';
import * as addUnitReplacement from './012-add-unit-replacement.ts';
import * as addClaimDueDates from './013-add-claim-due-dates.ts';
import * as indexBuildStatusSorts from './014-index-build-status-sorts.ts';
import * as addSearchPlaces from './015-add-search-places.ts';
import * as indexClaimFilters from './016-index-claim-filters.ts';
import * as indexLocationStatusSorts from './017-index-location-status-sorts.ts';
import * as addClaimCatalogItems from './018-add-claim-catalog-items.ts';
import * as createUnitExposure from './019-create-unit-exposure.ts';
import * as fillPlanMargins from './020-fill-plan-margins.ts';
import * as createRollups from './021-create-rollups.ts';
import * as createAccessChanges from './022-create-access-changes.ts';
import * as indexBuildsDeliveredOn from './023-index-builds-delivered-on.ts';
import * as addWeeklyDigest from './024-add-weekly-digest.ts';
import * as createRoyaltyTerms from './025-create-royalty-terms.ts';
import * as createMonthCloses from './026-create-month-closes.ts';
import * as indexClaimsLoggedOn from './027-index-claims-logged-on.ts';
import * as createExports from './028-create-exports.ts';
import * as createSalesTaxRates from './029-create-sales-tax-rates.ts';
import * as createSignInAttempts from './030-create-sign-in-attempts.ts';
import * as createPasswordResets from './031-create-password-resets.ts';
import * as createMailSends from './032-create-mail-sends.ts';
import * as indexAuditFilters from './033-index-audit-filters.ts';
import * as addVehicleIdentity from './034-add-vehicle-identity.ts';
import * as indexUnfinishedExports from './035-index-unfinished-exports.ts';
import * as createUnitExposureRegions from './036-create-unit-exposure-regions.ts';
import * as indexClaimsItemLocation from './037-index-claims-item-location.ts';
import * as createUnitExposureLifetime from './038-create-unit-exposure-lifetime.ts';
import * as indexClaimDaysInQueueOrder from './039-index-claim-days-in-queue-order.ts';
import * as indexUnitFailuresLocation from './040-index-unit-failures-location.ts';
import * as indexUnitFailureAges from './041-index-unit-failure-ages.ts';
import * as createRollupSums from './042-create-rollup-sums.ts';
import * as createUnitFailureSums from './043-create-unit-failure-sums.ts';
import * as indexClaimReplacements from './044-index-claim-replacements.ts';
import * as indexDeliveredBuildSums from './045-index-delivered-build-sums.ts';
import * as createWorkmanshipCounts from './046-create-workmanship-counts.ts';
import * as indexLoggedClaimSums from './047-index-logged-claim-sums.ts';
import * as searchBuildsByVinAndPlate from './048-search-builds-by-vin-and-plate.ts';
import * as createShopBuildSearch from './049-create-shop-build-search.ts';
import * as createShopCustomerSearch from './050-create-shop-customer-search.ts';
import * as indexDueClaimsByLocation from './051-index-due-claims-by-location.ts';
import * as installOnTheShopsDay from './052-install-on-the-shops-day.ts';
import * as dropSerialNocaseIndex from './053-drop-serial-nocase-index.ts';
import * as importedLinesFromDelivery from './054-imported-lines-from-delivery.ts';
import * as flagChangedFinalMonths from './055-flag-changed-final-months.ts';
import * as createMonthCloseSums from './056-create-month-close-sums.ts';
import * as indexShopDeliveryDays from './057-index-shop-delivery-days.ts';
import * as coverDeliveryDays from './058-cover-delivery-days.ts';
import * as indexLoggedClaimsByShop from './059-index-logged-claims-by-shop.ts';
import * as claimDaysWithShop from './060-claim-days-with-shop.ts';
import * as createBuildCounts from './061-create-build-counts.ts';
import * as coverSerialsByBuild from './062-cover-serials-by-build.ts';

/** Every migration, in order. A new one is added here by hand: nothing is discovered from the disk. */
export const migrations: Record<string, Migration> = {
  '001-create-foundation': createFoundation,
  '002-create-builds': createBuilds,
  '003-create-power-plans': createPowerPlans,
  '004-index-lists': indexLists,
  '005-create-build-search': createBuildSearch,
  '006-drop-plan-results': dropPlanResults,
  '007-create-claims': createClaims,
  '008-index-build-numbers': indexBuildNumbers,
  '009-create-customer-search': createCustomerSearch,
  '010-create-claim-evidence': createClaimEvidence,
  '011-index-customer-emails': indexCustomerEmails,
  '012-add-unit-replacement': addUnitReplacement,
  '013-add-claim-due-dates': addClaimDueDates,
  '014-index-build-status-sorts': indexBuildStatusSorts,
  '015-add-search-places': addSearchPlaces,
  '016-index-claim-filters': indexClaimFilters,
  '017-index-location-status-sorts': indexLocationStatusSorts,
  '018-add-claim-catalog-items': addClaimCatalogItems,
  '019-create-unit-exposure': createUnitExposure,
  '020-fill-plan-margins': fillPlanMargins,
  '021-create-rollups': createRollups,
  '022-create-access-changes': createAccessChanges,
  '023-index-builds-delivered-on': indexBuildsDeliveredOn,
  '024-add-weekly-digest': addWeeklyDigest,
  '025-create-royalty-terms': createRoyaltyTerms,
  '026-create-month-closes': createMonthCloses,
  '027-index-claims-logged-on': indexClaimsLoggedOn,
  '028-create-exports': createExports,
  '029-create-sales-tax-rates': createSalesTaxRates,
  '030-create-sign-in-attempts': createSignInAttempts,
  '031-create-password-resets': createPasswordResets,
  '032-create-mail-sends': createMailSends,
  '033-index-audit-filters': indexAuditFilters,
  '034-add-vehicle-identity': addVehicleIdentity,
  '035-index-unfinished-exports': indexUnfinishedExports,
  '036-create-unit-exposure-regions': createUnitExposureRegions,
  '037-index-claims-item-location': indexClaimsItemLocation,
  '038-create-unit-exposure-lifetime': createUnitExposureLifetime,
  '039-index-claim-days-in-queue-order': indexClaimDaysInQueueOrder,
  '040-index-unit-failures-location': indexUnitFailuresLocation,
  '041-index-unit-failure-ages': indexUnitFailureAges,
  '042-create-rollup-sums': createRollupSums,
  '043-create-unit-failure-sums': createUnitFailureSums,
  '044-index-claim-replacements': indexClaimReplacements,
  '045-index-delivered-build-sums': indexDeliveredBuildSums,
  '046-create-workmanship-counts': createWorkmanshipCounts,
  '047-index-logged-claim-sums': indexLoggedClaimSums,
  '048-search-builds-by-vin-and-plate': searchBuildsByVinAndPlate,
  '049-create-shop-build-search': createShopBuildSearch,
  '050-create-shop-customer-search': createShopCustomerSearch,
  '051-index-due-claims-by-location': indexDueClaimsByLocation,
  '052-install-on-the-shops-day': installOnTheShopsDay,
  '053-drop-serial-nocase-index': dropSerialNocaseIndex,
  '054-imported-lines-from-delivery': importedLinesFromDelivery,
  '055-flag-changed-final-months': flagChangedFinalMonths,
  '056-create-month-close-sums': createMonthCloseSums,
  '057-index-shop-delivery-days': indexShopDeliveryDays,
  '058-cover-delivery-days': coverDeliveryDays,
  '059-index-logged-claims-by-shop': indexLoggedClaimsByShop,
  '060-claim-days-with-shop': claimDaysWithShop,
  '061-create-build-counts': createBuildCounts,
  '062-cover-serials-by-build': coverSerialsByBuild,
};
