import type { CustomerBody, CustomerUpdate, CustomerView, Page, VehicleBody, VehicleView } from '@busbar/shared';
import { request } from './client.ts';

export interface CustomerFilter {
  locationId?: number;
  regionId?: number;
  q?: string;
  page?: number;
  pageSize?: number;
}

export type CustomerWithVehicles = CustomerView & { vehicles: VehicleView[] };
export type VehicleUpdate = Omit<VehicleBody, 'customerId'> & { version: number };

export const listCustomers = (filter: CustomerFilter) =>
  request<Page<CustomerView>>('/customers', { query: { ...filter } });

export const getCustomer = (id: number) => request<CustomerWithVehicles>(`/customers/${id}`);

export const createCustomer = (body: CustomerBody) => request<CustomerView>('/customers', { method: 'POST', body });

export const updateCustomer = (id: number, body: CustomerUpdate) =>
  request<CustomerView>(`/customers/${id}`, { method: 'PUT', body });

export const createVehicle = (body: VehicleBody) => request<VehicleView>('/vehicles', { method: 'POST', body });

export const updateVehicle = (id: number, body: VehicleUpdate) =>
  request<VehicleView>(`/vehicles/${id}`, { method: 'PUT', body });
