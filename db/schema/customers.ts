import type { Generated } from 'kysely';

export interface CustomersTable {
  id: Generated<number>;
  locationId: number;
  name: string;
  email: string;
  phone: string;
  addressLine1: string;
  addressLine2: string;
  city: string;
  region: string;
  postalCode: string;
  notes: string;
  version: Generated<number>;
  createdAt: string;
}
