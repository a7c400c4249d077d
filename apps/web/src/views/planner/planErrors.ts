import { computed, inject, provide, type ComputedRef, type InjectionKey } from 'vue';

/** Messages by field path as zod names it: `loads.0.watts`, `trip`, `circuits.1.size`. */
export type FieldMessages = Record<string, string>;

const key: InjectionKey<ComputedRef<FieldMessages>> = Symbol('plan field messages');

const capitalised = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** Field messages from zod issues; the first message of a field wins. */
export function messagesFromIssues(issues: readonly { path: PropertyKey[]; message: string }[]): FieldMessages {
  const messages: FieldMessages = {};
  for (const issue of issues) {
    const path = issue.path.filter((p) => typeof p === 'string' || typeof p === 'number').join('.');
    messages[path || 'plan'] ??= issue.message;
  }
  return messages;
}

/**
 * The computation's refusal as a field message: its message starts with the field it names
 * (`loads[0].hoursPerDay must fit in its 6 active hours; got 8`, `circuits[1].link: the plan has no inverter to feed`).
 */
export function messageFromRangeError(error: RangeError): FieldMessages {
  const [name = '', ...rest] = error.message.split(' ');
  const field = name.replace(/:$/, '').replace(/\[(\d+)\]/g, '.$1');
  const most = error.message.match(/at most (-?[\d.]+)/)?.[1];
  return { [field]: LIMITS_OF_OTHER_INPUTS[field]?.(Number(most).toLocaleString('en-US')) ?? capitalised(rest.join(' ')) };
}

// Limits that follow from another input, which the shared schema cannot check field by field.
const LIMITS_OF_OTHER_INPUTS: Record<string, (most: string) => string> = {
  'trip.highestC': () => 'The highest temperature cannot be below the lowest',
  'inverter.cutoffV': (most) => `Inverter cutoff must be at most ${most} V for this system voltage`,
  'inverter.idleW': (most) => `Inverter idle draw must be at most ${most} W, the inverter's rating`,
  'dcdcCharger.minInputV': (most) => `Lowest input voltage must be at most ${most} V for this system voltage`,
};

/** The server's field messages about the plan's input, without the `input.` its body wraps them in. */
export function messagesFromServer(fields: Record<string, string>): FieldMessages {
  return Object.fromEntries(Object.entries(fields).map(([field, message]) => [field.replace(/^input\./, ''), message]));
}

export function providePlanMessages(messages: ComputedRef<FieldMessages>): void {
  provide(key, messages);
}

/**
 * The message for a field or for anything inside it (`circuits.0.size` also finds
 * `circuits.0.size.awg`); `exact` for a message about a whole group (`trip`, `inverter`).
 */
export function usePlanMessages() {
  const messages = inject(key, computed<FieldMessages>(() => ({})));
  return (field: string, exact = false): string | undefined => {
    const all = messages.value;
    if (all[field] || exact) return all[field];
    const inside = Object.keys(all).find((k) => k.startsWith(`${field}.`));
    return inside ? all[inside] : undefined;
  };
}

const PART_NAMES: Record<string, string> = {
  systemV: 'System voltage',
  gauge: 'Conductor sizes',
  conductorTemperatureC: 'Conductors',
  tinnedCopper: 'Conductors',
  bank: 'House battery',
  starterBattery: 'Starter battery',
  inverter: 'Inverter',
  alternator: 'Alternator',
  dcdcCharger: 'DC-DC charger',
  solar: 'Solar',
  shoreCharger: 'Shore charger',
  trip: 'Trip',
};

/** Each message with the part of the plan it is about, for a summary away from the fields: "Load 2: Power must be more than 0 W". */
export function describeMessages(messages: FieldMessages): string[] {
  return Object.entries(messages).map(([field, message]) => {
    const [part = '', index] = field.split('.');
    const listed = part === 'loads' || part === 'circuits';
    const noun = part === 'loads' ? 'Load' : 'Circuit';
    const where = listed ? (index === undefined ? `${noun}s` : `${noun} ${Number(index) + 1}`) : PART_NAMES[part];
    return where ? `${where}: ${message}` : message;
  });
}
