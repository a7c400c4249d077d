import type { Generated } from 'kysely';

export interface RegionsTable {
  id: Generated<number>;
  code: string;
  name: string;
}
