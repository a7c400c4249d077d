import type { PlanStock } from '@busbar/calc';
import { request } from './client.ts';

/** The bank and charger sizes the catalog offers, which the planner rounds its recommendations to. */
export const getPlanStock = () => request<PlanStock>('/plans/stock');
