import { ref, watch } from 'vue';
import { listTechnicians, type TechnicianOption } from '../api/admin.ts';
import { messageOf } from '../api/client.ts';

/** The people who may lead builds at the given locations, one entry per person, by name. */
export function useTechnicians(locationIds: () => number[]) {
  const technicians = ref<TechnicianOption[]>([]);
  const loading = ref(false);
  const error = ref<string | null>(null);
  let latest = 0;

  async function load(ids: number[]) {
    const ticket = ++latest;
    error.value = null;
    if (ids.length === 0) {
      technicians.value = [];
      return;
    }
    loading.value = true;
    const answers = await Promise.allSettled(ids.map((id) => listTechnicians(id)));
    if (ticket !== latest) return;
    const byId = new Map<number, TechnicianOption>();
    for (const answer of answers) {
      if (answer.status === 'fulfilled') for (const person of answer.value) byId.set(person.id, person);
      else error.value ??= messageOf(answer.reason);
    }
    technicians.value = [...byId.values()].sort((a, b) => a.name.localeCompare(b.name));
    loading.value = false;
  }

  watch(() => locationIds().join(','), () => void load(locationIds()), { immediate: true });

  return { technicians, loading, error };
}
