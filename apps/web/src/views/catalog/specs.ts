import { SPEC_SCHEMAS, type CatalogItemView, type Category } from '@busbar/shared';

/** One spec input of a category, read from the shared schema so the form and the API never disagree. */
export interface SpecField {
  key: string;
  label: string;
  unit: string;
  optional: boolean;
  /** Whole numbers only (circuits, switches). */
  whole: boolean;
  min: number | undefined;
  max: number | undefined;
  /** Set for a choice among fixed words (chemistry, tracking). */
  choices: { value: string; label: string }[] | undefined;
}

/** The parts of a zod schema the form reads (zod 4's own introspection). */
interface SchemaInfo {
  def: { type: string };
  unwrap?: () => SchemaInfo;
  options?: readonly string[];
  minValue?: number | null;
  maxValue?: number | null;
  format?: string | null;
}

const NAMES: Record<string, { label: string; unit?: string }> = {
  chemistry: { label: 'Chemistry' },
  capacityAh: { label: 'Capacity', unit: 'Ah' },
  nominalV: { label: 'Nominal voltage', unit: 'V' },
  coldCrankingA: { label: 'Cold cranking current', unit: 'A' },
  outputA: { label: 'Output current', unit: 'A' },
  watts: { label: 'Rated power', unit: 'W' },
  maxChargeA: { label: 'Largest charge current', unit: 'A' },
  tracking: { label: 'Tracking' },
  continuousW: { label: 'Continuous power', unit: 'W' },
  surgeW: { label: 'Surge power', unit: 'W' },
  efficiency: { label: 'Efficiency (0.5 to 1)' },
  circuits: { label: 'Circuits' },
  maxA: { label: 'Largest current', unit: 'A' },
  switches: { label: 'Switches' },
  shuntA: { label: 'Shunt rating', unit: 'A' },
  drawA: { label: 'Current draw', unit: 'A' },
  dutyCyclePercent: { label: 'Duty cycle', unit: '%' },
};

const CHOICE_LABELS: Record<string, string> = { lifepo4: 'LiFePO4', agm: 'AGM', flooded: 'Flooded', mppt: 'MPPT', pwm: 'PWM' };

/** The spec inputs of a category, in the schema's order; none for categories without specs. */
export function specFields(category: Category): SpecField[] {
  const shape = SPEC_SCHEMAS[category].shape as Record<string, SchemaInfo>;
  return Object.entries(shape).map(([key, schema]) => {
    const optional = schema.def.type === 'optional';
    const inner = optional && schema.unwrap ? schema.unwrap() : schema;
    const name = NAMES[key] ?? { label: key };
    return {
      key,
      label: name.label,
      unit: name.unit ?? '',
      optional,
      whole: inner.format === 'safeint',
      min: inner.minValue ?? undefined,
      max: inner.maxValue ?? undefined,
      choices: inner.def.type === 'enum' ? inner.options?.map((o) => ({ value: o, label: CHOICE_LABELS[o] ?? o })) : undefined,
    };
  });
}

/** An item's specs in a few words for tables, e.g. "LiFePO4 · 100 Ah · 12.8 V". */
export function specSummary(item: Pick<CatalogItemView, 'category' | 'specs'>): string {
  return specFields(item.category)
    .filter((f) => item.specs[f.key] !== undefined && item.specs[f.key] !== null)
    .map((f) => {
      const value = item.specs[f.key];
      if (f.choices) return CHOICE_LABELS[String(value)] ?? String(value);
      if (f.key === 'efficiency') return `${Math.round(Number(value) * 100)} % efficient`;
      if (f.unit) return `${value} ${f.unit}`;
      const counted = f.label.toLowerCase(); // "circuits", "switches"
      return `${value} ${value === 1 ? counted.replace(/e?s$/, '') : counted}`;
    })
    .join(' · ');
}
