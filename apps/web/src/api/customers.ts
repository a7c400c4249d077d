import type { CustomerBody, CustomerBuildRow, CustomerPlanRow, CustomerUpdate, CustomerView, Page, VehicleBody, VehicleUpdate, VehicleView } from '@busbar/shared';
import { request } from './client.ts';

export interface CustomerFilter {
  locationId?: number;
  regionId?: number;
  q?: string;
  page?: number;
  pageSize?: number;
}

export type CustomerWithVehicles = CustomerView & { vehicles: VehicleView[] };

export const listCustomers = (filter: CustomerFilter) =>
  request<Page<CustomerView>>('/customers', { query: { ...filter } });

export const getCustomer = (id: number) => request<CustomerWithVehicles>(`/customers/${id}`);

export const createCustomer = (body: CustomerBody) => request<CustomerView>('/customers', { method: 'POST', body });

export const updateCustomer = (id: number, body: CustomerUpdate) =>
  request<CustomerView>(`/customers/${id}`, { method: 'PUT', body });

export const createVehicle = (body: VehicleBody) => request<VehicleView>('/vehicles', { method: 'POST', body });

export const updateVehicle = (id: number, body: VehicleUpdate) =>
  request<VehicleView>(`/vehicles/${id}`, { method: 'PUT', body });

export interface HistoryPaging {
  page: number;
  pageSize: number;
}

/** The customer's builds at the shops the person sees, newest first. */
export const listCustomerBuilds = (id: number, paging: HistoryPaging) =>
  request<Page<CustomerBuildRow>>(`/customers/${id}/builds`, { query: { ...paging } });

/** The plans of the customer's builds at the shops the person sees, last saved first. */
export const listCustomerPlans = (id: number, paging: HistoryPaging) =>
  request<Page<CustomerPlanRow>>(`/customers/${id}/plans`, { query: { ...paging } });
