import { claimCreate, COVERAGES, COVERAGE_LABELS, FAILURE_MODES, FAILURE_MODE_LABELS, type ClaimCreate } from '@busbar/shared';

export const failureModeOptions = FAILURE_MODES.map((value) => ({ value, label: FAILURE_MODE_LABELS[value] }));
export const coverageOptions = COVERAGES.map((value) => ({ value, label: COVERAGE_LABELS[value] }));

/** Dollars as typed, to the integer cents the API takes. */
export const toCents = (dollars: number | null | undefined) => (dollars === null || dollars === undefined ? undefined : Math.round(dollars * 100));

/** The form's fields as typed; money in dollars. */
export function emptyClaimDraft() {
  return {
    buildItemId: undefined as number | undefined,
    failedOn: undefined as string | undefined,
    failureMode: undefined as ClaimCreate['failureMode'] | undefined,
    coverage: 'vendor_defect' as ClaimCreate['coverage'],
    symptoms: '',
    foundHow: '',
    laborHours: undefined as number | undefined,
    creditRequestedDollars: undefined as number | undefined,
  };
}
export type ClaimDraft = ReturnType<typeof emptyClaimDraft>;

/** The draft checked with the shared schema the API uses. */
export function parseClaimDraft({ creditRequestedDollars, laborHours, ...draft }: ClaimDraft) {
  return claimCreate.safeParse({ ...draft, laborHours: laborHours ?? undefined, creditRequestedCents: toCents(creditRequestedDollars) });
}

/** The API refuses a unit past its warranty with this wording on `coverage` (or a 403 for people who may not allow goodwill). */
export const isWarrantyEnded = (message: string | null | undefined) => Boolean(message?.includes('warranty ended'));
