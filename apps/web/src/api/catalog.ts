import type { Category, CatalogItemBody, CatalogItemUpdate, CatalogItemView, Page, VendorBody, VendorView } from '@busbar/shared';
import { request } from './client.ts';

export interface CatalogFilter {
  category?: Category;
  vendorId?: number;
  q?: string;
  active?: 'true' | 'false' | 'all';
  page?: number;
  pageSize?: number;
}

export type VendorUpdate = VendorBody & { version: number };

/** Every vendor: they are few, one page of the largest size holds them. */
export const listVendors = async () => (await request<Page<VendorView>>('/vendors', { query: { pageSize: 200 } })).items;

export const createVendor = (body: VendorBody) => request<VendorView>('/vendors', { method: 'POST', body });

export const updateVendor = (id: number, body: VendorUpdate) =>
  request<VendorView>(`/vendors/${id}`, { method: 'PUT', body });

export const listCatalog = (filter: CatalogFilter) =>
  request<Page<CatalogItemView>>('/catalog', { query: { ...filter } });

export const getCatalogItem = (id: number) => request<CatalogItemView>(`/catalog/${id}`);

export const createCatalogItem = (body: CatalogItemBody) =>
  request<CatalogItemView>('/catalog', { method: 'POST', body });

export const updateCatalogItem = (id: number, body: CatalogItemUpdate) =>
  request<CatalogItemView>(`/catalog/${id}`, { method: 'PUT', body });
