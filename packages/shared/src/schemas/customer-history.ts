import { z } from 'zod';
import type { BuildStatus } from './builds.ts';
import { pagingOf } from './common.ts';
import type { PlanView } from './plans.ts';

/** A page of a customer's builds or plans. */
export const customerHistoryQuery = z.strictObject(pagingOf(50, 10));
export type CustomerHistoryQuery = z.infer<typeof customerHistoryQuery>;

/** One of a customer's builds as their page lists it; money only for people who read prices. */
export interface CustomerBuildRow {
  id: number;
  number: string;
  locationId: number;
  vehicleId: number;
  vehicleLabel: string;
  status: BuildStatus;
  bookedFor: string | null;
  deliveredAt: string | null;
  createdAt: string;
  totalCents?: number;
}

/** The plan of one of a customer's builds, with its verdict evaluated now. */
export interface CustomerPlanRow {
  id: number;
  buildId: number;
  buildNumber: string;
  name: string;
  version: number;
  updatedAt: string;
  verdict: PlanView['result']['verdict'];
}
