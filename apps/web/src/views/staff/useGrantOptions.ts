import { ROLES, ROLE_LABELS, ROLE_SCOPES, type AppAbility, type LocationView, type RegionView, type Role } from '@busbar/shared';
import { subject } from '@casl/ability';
import { useAbility } from '@casl/vue';
import { computed, type Ref } from 'vue';

/** The form value that stands for "the whole network" in a region choice. */
const WHOLE_NETWORK = 'network';

/** A role and where it applies, as the invite and grant forms hold it. */
export interface RoleScopeDraft {
  role: Role | undefined;
  locationId: number | undefined;
  regionId: number | typeof WHOLE_NETWORK | undefined;
}

export type ScopeField = 'locationId' | 'regionId';

interface Option<T> {
  value: T;
  label: string;
}

/** Which field names the scope of a role; none for a role held only network-wide (owner). */
export function scopeFieldOf(role: Role): ScopeField | null {
  const scopes = ROLE_SCOPES[role];
  if (scopes.includes('location')) return 'locationId';
  if (scopes.includes('region')) return 'regionId';
  return null;
}

/** The request body for a draft: only the id its role's scope needs. */
export function scopeBody(draft: RoleScopeDraft) {
  const field = draft.role ? scopeFieldOf(draft.role) : null;
  return {
    role: draft.role,
    locationId: field === 'locationId' ? draft.locationId : undefined,
    regionId: field === 'regionId' && draft.regionId !== WHOLE_NETWORK ? draft.regionId : undefined,
  };
}

/** A plain message for a scope the person has not chosen yet (the shared schema only says it is wrong). */
export function missingScope(draft: RoleScopeDraft): { field: ScopeField; message: string } | null {
  const field = draft.role ? scopeFieldOf(draft.role) : null;
  if (field === null || draft[field] !== undefined) return null;
  if (field === 'locationId') return { field, message: 'Choose a location' };
  const orNetwork = draft.role && ROLE_SCOPES[draft.role].includes('network') ? ' or the whole network' : '';
  return { field, message: `Choose a region${orNetwork}` };
}

/** The roles, locations and regions this person may grant, asked of the ability one by one. */
export function useGrantOptions(locations: Ref<LocationView[]>, regions: Ref<RegionView[]>) {
  const ability = useAbility<AppAbility>();
  const canGrant = (role: Role, locationId: number | null, regionId: number | null) =>
    ability.can('create', subject('RoleAssignment', { role, locationId, regionId }));

  function locationOptions(role: Role): Option<number>[] {
    return locations.value
      .filter((l) => canGrant(role, l.id, null))
      .map((l) => ({ value: l.id, label: `${l.code} ${l.name}` }));
  }

  function regionOptions(role: Role): Option<number | typeof WHOLE_NETWORK>[] {
    const options: Option<number | typeof WHOLE_NETWORK>[] = regions.value
      .filter((r) => canGrant(role, null, r.id))
      .map((r) => ({ value: r.id, label: r.name }));
    if (ROLE_SCOPES[role].includes('network') && canGrant(role, null, null)) {
      options.unshift({ value: WHOLE_NETWORK, label: 'Whole network' });
    }
    return options;
  }

  function grantable(role: Role): boolean {
    const field = scopeFieldOf(role);
    if (field === 'locationId') return locationOptions(role).length > 0;
    if (field === 'regionId') return regionOptions(role).length > 0;
    return canGrant(role, null, null);
  }

  const roleOptions = computed(() => ROLES.filter(grantable).map((role) => ({ value: role, label: ROLE_LABELS[role] })));

  /** Technician is the role most often given; otherwise the person picks. */
  const defaultRole = computed(() => roleOptions.value.find((o) => o.value === 'technician')?.value);

  /** After the role changes, keeps a still-valid scope or picks the only (or the widest) one offered. */
  function fitScope(draft: RoleScopeDraft) {
    if (!draft.role) return;
    const field = scopeFieldOf(draft.role);
    if (field === 'locationId') {
      const options = locationOptions(draft.role);
      if (!options.some((o) => o.value === draft.locationId)) draft.locationId = options.length === 1 ? options[0]?.value : undefined;
    }
    if (field === 'regionId') {
      const options = regionOptions(draft.role);
      if (!options.some((o) => o.value === draft.regionId)) {
        draft.regionId = options[0]?.value === WHOLE_NETWORK || options.length === 1 ? options[0]?.value : undefined;
      }
    }
  }

  return { roleOptions, defaultRole, locationOptions, regionOptions, fitScope };
}
