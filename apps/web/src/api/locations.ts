import type { LocationSettings, LocationUpdate, Page, RoyaltyTermsBody, RoyaltyTermsView, SalesTaxBody, SalesTaxView } from '@busbar/shared';
import { request } from './client.ts';

export interface LocationFilter {
  q?: string | undefined;
  regionId?: number | undefined;
  page?: number;
  pageSize?: number;
}

/** One page of the locations the person may see, with their region and approval limit. */
export const listLocationSettings = (filter: LocationFilter) => request<Page<LocationSettings>>('/locations/settings', { query: { ...filter } });

export const updateLocation = (id: number, body: LocationUpdate) => request<LocationSettings>(`/locations/${id}`, { method: 'PATCH', body });

/** A location's royalty terms, the latest month first (the owner and the accountant). */
export const listRoyaltyTerms = (id: number) => request<RoyaltyTermsView[]>(`/locations/${id}/royalty-terms`);

/** The owner sets terms from a month on; answers the location's terms after it. */
export const setRoyaltyTerms = (id: number, body: RoyaltyTermsBody) => request<RoyaltyTermsView[]>(`/locations/${id}/royalty-terms`, { method: 'POST', body });

/** A location's sales tax rates, the latest month first (whoever reads the shop's revenue). */
export const listSalesTax = (id: number) => request<SalesTaxView[]>(`/locations/${id}/sales-tax`);

/** The owner sets a rate from a month on; answers the location's rates after it. */
export const addSalesTax = (id: number, body: SalesTaxBody) => request<SalesTaxView[]>(`/locations/${id}/sales-tax`, { method: 'POST', body });
