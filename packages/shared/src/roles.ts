/** The roles of DESIGN.md; each is held at one kind of scope (accountant: network or region). */
export const ROLES = [
  'owner',
  'regional_manager',
  'location_lead',
  'technician',
  'warranty_clerk',
  'accountant',
] as const;
export type Role = (typeof ROLES)[number];

export const SCOPES = ['network', 'region', 'location'] as const;
export type Scope = (typeof SCOPES)[number];

/** Which scopes each role may be held at. */
export const ROLE_SCOPES: Record<Role, readonly Scope[]> = {
  owner: ['network'],
  regional_manager: ['region'],
  location_lead: ['location'],
  technician: ['location'],
  warranty_clerk: ['location'],
  accountant: ['network', 'region'],
};

/** Plain display names, used by the web app and in e-mails. */
export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Network owner',
  regional_manager: 'Regional manager',
  location_lead: 'Location lead',
  technician: 'Technician',
  warranty_clerk: 'Warranty clerk',
  accountant: 'Accountant',
};

/** The scope a role is held at when a request names a region, a location or neither. */
export function scopeFor(role: Role, ids: { regionId?: number | null; locationId?: number | null }): Scope | null {
  const scope: Scope = ids.locationId != null ? 'location' : ids.regionId != null ? 'region' : 'network';
  if (ids.locationId != null && ids.regionId != null) return null;
  return ROLE_SCOPES[role].includes(scope) ? scope : null;
}
