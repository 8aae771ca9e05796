import {
  fieldName,
  isGenericIssueMessage,
  issueMessage,
  plausibilityWarning,
  specSchema,
  type LabelledIssue,
  type QuantityKind,
  type Spec,
  type SpecInput,
  type UsualRange,
} from '@shuntwise/contracts';

/**
 * The spec editor's values: the spec's own shape, so the API's error paths
 * (`spec.vz.min`) land on the inputs, with null for an empty input, NaN for text that
 * does not read, and the derating fraction shown as a percentage.
 */
export interface SpecFormValues {
  iRef: number | null;
  vz: { min: number | null; nom: number | null; max: number | null };
  zdMax: number | null;
  knee: { iKnee: number | null; maxRatio: number | string; maxSpan: number | null };
  leakage: { irMax: number | null; vr: number | null };
  tc: { min: number | null; max: number | null };
  power: { pdMin: number | null; deratingPercent: number | string };
  packages: string[];
  envelope: { iMin: number | null; iMax: number | null; taMin: number | null; taMax: number | null };
  outputWindow: { vMin: number | null; vMax: number | null };
  marginalBandPercent: number | string;
  note: string;
}

/** The quantity kind behind each form path (limits in messages are formatted with it). */
export const SPEC_FIELD_KINDS: Record<string, QuantityKind> = {
  iRef: 'current',
  'vz.min': 'voltage',
  'vz.nom': 'voltage',
  'vz.max': 'voltage',
  zdMax: 'resistance',
  'knee.iKnee': 'current',
  'knee.maxSpan': 'voltage',
  'leakage.irMax': 'current',
  'leakage.vr': 'voltage',
  'tc.min': 'tempCoVoltage',
  'tc.max': 'tempCoVoltage',
  'power.pdMin': 'power',
  'envelope.iMin': 'current',
  'envelope.iMax': 'current',
  'envelope.taMin': 'temperature',
  'envelope.taMax': 'temperature',
  'outputWindow.vMin': 'voltage',
  'outputWindow.vMax': 'voltage',
};

/** The fields checked against the usual ranges of regulator diodes (contracts' USUAL_RANGES): a warning, never a block. */
const PLAUSIBLE: Record<string, UsualRange> = {
  iRef: 'testCurrent',
  'vz.min': 'zenerVoltage',
  'vz.nom': 'zenerVoltage',
  'vz.max': 'zenerVoltage',
  'power.pdMin': 'powerRating',
};

/** The warning of each field whose value lies outside its usual range (path → sentence). */
export function specWarnings(values: SpecFormValues): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [path, range] of Object.entries(PLAUSIBLE)) {
    const value = at(values, path);
    const warning = typeof value === 'number' ? plausibilityWarning(range, value) : null;
    if (warning) out[path] = warning;
  }
  return out;
}

/**
 * What "Use at most" will store, said beside the input: the number is a percentage, so
 * 0.5 stores 0.5 %, not 50 %; a value below 1 % may be a fraction typed by habit, and
 * the sentence offers the percentage it would be. Null while empty or unreadable.
 */
export function deratingReading(input: number | string): { stores: string; fractionMeant: number | null } | null {
  const value = typeof input === 'number' ? input : input.trim() === '' ? NaN : Number(input);
  if (!Number.isFinite(value)) return null;
  const pct = (x: number) => `${Number(x.toPrecision(6))} %`;
  return {
    stores: `stores ${pct(value)} of the derated rating (fraction ${Number((value / 100).toPrecision(6))})`,
    fractionMeant: value > 0 && value < 1 ? Number((value * 100).toPrecision(6)) : null,
  };
}

export function emptySpecForm(): SpecFormValues {
  return {
    iRef: null,
    vz: { min: null, nom: null, max: null },
    zdMax: null,
    knee: { iKnee: null, maxRatio: '', maxSpan: null },
    leakage: { irMax: null, vr: null },
    tc: { min: null, max: null },
    power: { pdMin: null, deratingPercent: '' },
    packages: [],
    envelope: { iMin: null, iMax: null, taMin: null, taMax: null },
    outputWindow: { vMin: null, vMax: null },
    marginalBandPercent: 5,
    note: '',
  };
}

export function specToForm(spec: Spec): SpecFormValues {
  return {
    iRef: spec.iRef,
    vz: { ...spec.vz },
    zdMax: spec.zdMax,
    knee: { iKnee: spec.knee?.iKnee ?? null, maxRatio: spec.knee?.maxRatio ?? '', maxSpan: spec.knee?.maxSpan ?? null },
    leakage: { irMax: spec.leakage?.irMax ?? null, vr: spec.leakage?.vr ?? null },
    tc: { min: spec.tc?.min ?? null, max: spec.tc?.max ?? null },
    power: {
      pdMin: spec.power?.pdMin ?? null,
      deratingPercent: spec.power ? Number((spec.power.deratingFraction * 100).toPrecision(10)) : '',
    },
    packages: [...spec.packages],
    envelope: { ...spec.envelope },
    outputWindow: { vMin: spec.outputWindow?.vMin ?? null, vMax: spec.outputWindow?.vMax ?? null },
    marginalBandPercent: spec.marginalBandPercent,
    note: '',
  };
}

const num = (v: number | string | null): number | null => (v === '' || v === null ? null : Number(v));
const given = (...values: Array<number | string | null>) => values.some((v) => v !== null && v !== '');

/** The spec the form describes; optional groups left empty become null. */
export function formToSpec(values: SpecFormValues): SpecInput {
  const knee = given(values.knee.iKnee, values.knee.maxRatio, values.knee.maxSpan)
    ? { iKnee: values.knee.iKnee, maxRatio: num(values.knee.maxRatio), maxSpan: values.knee.maxSpan }
    : null;
  return {
    iRef: values.iRef as number,
    vz: values.vz as Spec['vz'],
    zdMax: values.zdMax,
    knee,
    leakage: given(values.leakage.irMax, values.leakage.vr) ? (values.leakage as Spec['leakage']) : null,
    tc: given(values.tc.min, values.tc.max) ? (values.tc as Spec['tc']) : null,
    power: given(values.power.pdMin, values.power.deratingPercent)
      ? { pdMin: values.power.pdMin as number, deratingFraction: (num(values.power.deratingPercent) as number) / 100 }
      : null,
    packages: values.packages,
    envelope: values.envelope as Spec['envelope'],
    outputWindow: given(values.outputWindow.vMin, values.outputWindow.vMax) ? (values.outputWindow as Spec['outputWindow']) : null,
    marginalBandPercent: num(values.marginalBandPercent) ?? 5,
  };
}

const REQUIRED: Array<[string, string]> = [
  ['iRef', 'Give the reference current'],
  ['vz.min', 'Give the lowest Zener voltage'],
  ['vz.nom', 'Give the nominal Zener voltage'],
  ['vz.max', 'Give the highest Zener voltage'],
  ['envelope.iMin', 'Give the lowest operating current'],
  ['envelope.iMax', 'Give the highest operating current'],
  ['envelope.taMin', 'Give the lowest ambient'],
  ['envelope.taMax', 'Give the highest ambient'],
];

/** Groups whose members only make sense together. */
const PAIRS: Array<[string, string, string]> = [
  ['leakage.irMax', 'leakage.vr', 'The leakage limit needs both the current and its reverse voltage'],
  ['tc.min', 'tc.max', 'The coefficient window needs both ends'],
  ['power.pdMin', 'power.deratingPercent', 'The power rule needs both the rating and the derating policy'],
  ['outputWindow.vMin', 'outputWindow.vMax', 'The output window needs both ends'],
];

function at(values: SpecFormValues, path: string): unknown {
  return path.split('.').reduce<unknown>((o, key) => (o as Record<string, unknown> | null)?.[key], values);
}

/** Form path of a spec path: the form shows the derating fraction as a percentage. */
export function formPath(specPath: string): string {
  const path = specPath.replace(/^spec\./, '').replace('power.deratingFraction', 'power.deratingPercent');
  // Errors about a whole group go to its first input.
  return path === 'knee' ? 'knee.maxRatio' : path;
}

/** A message an engineer reads: the form's labels and limits in the field's unit (contracts' one map). */
function messageOf(issue: LabelledIssue, path: string): string {
  // Under its own input the label is already shown: "Must be above 0 V".
  const text = issueMessage({ ...issue, path: ['spec', ...path.replace('power.deratingPercent', 'power.deratingFraction').split('.')] });
  const label = fieldName(['spec', ...path.replace('power.deratingPercent', 'power.deratingFraction').split('.')]);
  return isGenericIssueMessage(issue.message) && text.startsWith(`${label} `) ? text.slice(label.length + 1).replace(/^./, (c) => c.toUpperCase()) : text;
}

/** The editor's validation: what is missing or unreadable, then the contracts' own spec rules. */
export function validateSpecForm(values: SpecFormValues): Record<string, string> {
  const errors: Record<string, string> = {};
  for (const path of Object.keys(SPEC_FIELD_KINDS)) {
    if (Number.isNaN(at(values, path))) errors[path] = 'Does not read: give a number with its unit';
  }
  for (const [path, message] of REQUIRED) if (at(values, path) === null && !errors[path]) errors[path] = message;
  for (const [a, b, message] of PAIRS) {
    const va = at(values, a);
    const vb = at(values, b);
    const empty = (v: unknown) => v === null || v === '';
    if (empty(va) !== empty(vb)) errors[empty(va) ? a : b] ??= message;
  }
  if (values.knee.maxRatio !== '' && values.knee.iKnee === null) errors['knee.iKnee'] ??= 'A knee ratio is stated at a knee current: give it';
  if (Object.keys(errors).length > 0) return errors;

  const parsed = specSchema.safeParse(formToSpec(values));
  if (!parsed.success) {
    for (const issue of parsed.error.issues as unknown as LabelledIssue[]) {
      const path = formPath(issue.path.map(String).join('.'));
      errors[path] ??= messageOf(issue, path);
    }
  }
  return errors;
}
