import {
  formatPercent,
  formatQuantity,
  issueMessage,
  regulatorRequestSchema,
  type EngineeringCardInput,
  type LabelledIssue,
  type RegulatorRequest,
  type RegulatorResponse,
  type RegulatorVerdict,
  type ResistorSeries,
  type SearchCard,
} from '@shuntwise/contracts';

/** What the circuit check's verdict reads as, on screen and in the CSV. */
export const VERDICT_TITLE: Record<RegulatorVerdict, string> = {
  ok: 'Works at every corner',
  'no-solution': 'No resistor works',
  'no-data': 'Cannot decide: data missing',
};

/** The circuit as the form holds it: SI numbers (null while empty, NaN while a field does not read). */
export interface CircuitValues {
  supplyMin: number | null;
  supplyNom: number | null;
  supplyMax: number | null;
  loadMin: number | null;
  loadMax: number | null;
  ambientMin: number | null;
  ambientMax: number | null;
  series: ResistorSeries;
  /** Resistor tolerance as a fraction, kept as text for the select ("0.05"). */
  tolerance: string;
  /** Lowest diode current as a multiple of izk. */
  kneeFactor: number;
  /** Largest fraction of the derated power the diode may use. */
  powerFraction: number;
  selfHeating: boolean;
}

export const RESISTOR_TOLERANCES = [
  { value: '0.001', label: '±0.1 %' },
  { value: '0.005', label: '±0.5 %' },
  { value: '0.01', label: '±1 %' },
  { value: '0.02', label: '±2 %' },
  { value: '0.05', label: '±5 %' },
  { value: '0.1', label: '±10 %' },
];

/** Supply and load are the designer's to give; the rest starts where most boards are. */
export const EMPTY_CIRCUIT: CircuitValues = {
  supplyMin: null,
  supplyNom: null,
  supplyMax: null,
  loadMin: 0,
  loadMax: null,
  ambientMin: -20,
  ambientMax: 70,
  series: 'E24',
  tolerance: '0.05',
  kneeFactor: 5,
  powerFraction: 1,
  selfHeating: true,
};

const REQUIRED: Array<[keyof CircuitValues, string]> = [
  ['supplyMin', 'Enter the lowest supply voltage'],
  ['supplyMax', 'Enter the highest supply voltage'],
  ['loadMin', 'Enter the smallest load current (0 for none)'],
  ['loadMax', 'Enter the largest load current'],
  ['ambientMin', 'Enter the lowest ambient temperature'],
  ['ambientMax', 'Enter the highest ambient temperature'],
];

const FIELD_OF_PATH: Record<string, keyof CircuitValues> = {
  'supply.min': 'supplyMin',
  'supply.nom': 'supplyNom',
  'supply.max': 'supplyMax',
  'load.min': 'loadMin',
  'load.max': 'loadMax',
  'ambient.min': 'ambientMin',
  'ambient.max': 'ambientMax',
  'resistor.tolerance': 'tolerance',
  'resistor.series': 'series',
  kneeFactor: 'kneeFactor',
  powerFraction: 'powerFraction',
};

const circuitSchema = regulatorRequestSchema.omit({ card: true });
export type CircuitRequest = Omit<RegulatorRequest, 'card'>;

/** The request's circuit half, or null while a value is missing or does not read. */
export function toCircuit(v: CircuitValues): CircuitRequest | null {
  const numbers = [v.supplyMin, v.supplyMax, v.loadMin, v.loadMax, v.ambientMin, v.ambientMax];
  if (numbers.some((n) => n === null || Number.isNaN(n)) || (v.supplyNom !== null && Number.isNaN(v.supplyNom))) return null;
  return {
    supply: { min: v.supplyMin!, ...(v.supplyNom !== null ? { nom: v.supplyNom } : {}), max: v.supplyMax! },
    load: { min: v.loadMin!, max: v.loadMax! },
    ambient: { min: v.ambientMin!, max: v.ambientMax! },
    resistor: { series: v.series, tolerance: Number(v.tolerance) },
    kneeFactor: v.kneeFactor,
    powerFraction: v.powerFraction,
    selfHeating: v.selfHeating,
  };
}

/**
 * Errors per field: what is missing or does not read, then the contract's own rules (the
 * order of min and max, ranges) with the API's wording, so the form and the server agree.
 */
export function validateCircuit(v: CircuitValues): Partial<Record<keyof CircuitValues, string>> {
  const errors: Partial<Record<keyof CircuitValues, string>> = {};
  for (const [field, message] of REQUIRED) {
    const value = v[field] as number | null;
    if (value === null) errors[field] = message;
    else if (Number.isNaN(value)) errors[field] = 'Does not read: type a number with its unit, e.g. 12 V or 20 mA';
  }
  if (v.supplyNom !== null && Number.isNaN(v.supplyNom)) errors.supplyNom = 'Does not read: type a number with its unit, e.g. 12 V';
  if (Object.keys(errors).length > 0) return errors;
  const parsed = circuitSchema.safeParse(toCircuit(v));
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = FIELD_OF_PATH[issue.path.map(String).join('.')];
      if (field && !errors[field]) errors[field] = issueMessage(issue as LabelledIssue);
    }
  }
  return errors;
}

/**
 * The engineering card of a search result. The API built it with the one card mapping
 * (contracts' toEngineeringCard); here only the display figures are set aside, nothing is read anew.
 */
export function engineeringCard(card: SearchCard): EngineeringCardInput {
  const { version: _version, tolerance: _tolerance, ...engineering } = card;
  return engineering;
}

export function regulatorRequest(circuit: CircuitRequest, card: SearchCard): RegulatorRequest {
  return { ...circuit, card: engineeringCard(card) };
}

/** Fills min and max from the nominal supply and a ± fraction (12 V, 0.1 → 10.8 V … 13.2 V). */
export function supplyAround(nominal: number, fraction: number): { min: number; max: number } {
  return { min: Number((nominal * (1 - fraction)).toPrecision(12)), max: Number((nominal * (1 + fraction)).toPrecision(12)) };
}

export type SimpleVerdict = 'inside' | 'too-high' | 'too-low' | 'no-range' | 'none';

export interface SimpleFinding {
  verdict: SimpleVerdict;
  /** One sentence on what the simple resistor would do in this circuit. */
  message: string;
}

/**
 * What the textbook formula's resistor would do against the working range the corners
 * allow: above the largest value the diode drops below its knee at the lowest supply and
 * largest load; below the smallest it overheats at the highest supply and smallest load.
 */
export function simpleFinding(result: RegulatorResponse): SimpleFinding {
  const r = result.simple.resistance;
  const { min, max, kneeCurrent, allowedDiodeCurrent } = result.range;
  const ohms = (x: number) => formatQuantity(x, 'resistance');
  if (r === null) return { verdict: 'none', message: `The nominal supply is not above VZ: the formula gives no resistor.` };
  if (min === null || max === null || min > max) {
    return { verdict: 'no-range', message: `No resistor keeps every corner working, so ${ohms(r)} cannot either.` };
  }
  if (r > max) {
    return {
      verdict: 'too-high',
      message: `${ohms(r)} is above the largest working value ${ohms(max)}: at the lowest supply and the largest load the diode current falls below ${formatQuantity(kneeCurrent, 'current')} and the output leaves regulation.`,
    };
  }
  if (r < min) {
    return {
      verdict: 'too-low',
      message: `${ohms(r)} is below the smallest working value ${ohms(min)}: at the highest supply and the smallest load the diode would carry more than ${formatQuantity(allowedDiodeCurrent, 'current')}, beyond its derated power.`,
    };
  }
  return {
    verdict: 'inside',
    message: `${ohms(r)} happens to lie inside the working range ${ohms(min)} … ${ohms(max)} here; the formula alone could not tell.`,
  };
}

const celsius = (c: number) => formatQuantity(c, 'temperature', { trim: true });

/** What the simple formula leaves out, for this circuit and part. */
export function simpleOmissions(circuit: CircuitRequest, card: SearchCard): string[] {
  const out = [
    `the supply range: it uses ${formatQuantity(circuit.supply.nom ?? (circuit.supply.min + circuit.supply.max) / 2, 'voltage')} only, not ${formatQuantity(circuit.supply.min, 'voltage')} … ${formatQuantity(circuit.supply.max, 'voltage')}`,
    `the smallest load (${formatQuantity(circuit.load.min, 'current')}), where all the current flows through the diode`,
  ];
  if (card.tolerance !== null) out.push(`the diode's tolerance of ±${formatPercent(card.tolerance, { digits: 2 })} on VZ`);
  if (card.tc !== null)
    out.push(
      `the drift of VZ with temperature (${formatQuantity(card.tc, 'tempCoVoltage')}) over ${celsius(circuit.ambient.min)} … ${celsius(circuit.ambient.max)} and self-heating`,
    );
  out.push(`the resistor's own tolerance (±${formatPercent(circuit.resistor.tolerance)}) and its standard values`);
  out.push(`the knee: the diode needs a minimum current to regulate`);
  out.push(`the diode's power rating, derated at the highest ambient`);
  return out;
}

/** The working range as text: "143 Ω … 211 Ω", or why there is none. */
export function describeRange(range: RegulatorResponse['range']): string {
  const ohms = (x: number) => formatQuantity(x, 'resistance');
  const { min, max } = range;
  // No largest value: the lowest supply does not lift the diode above its knee (regulator.ts, step 2).
  if (max === null) return "none: the lowest supply does not reach the diode's voltage at the knee current";
  if (min !== null && min > max) return `none: power needs ≥ ${ohms(min)}, the knee ≤ ${ohms(max)}`;
  // No smallest value: the card gives no power limit at some ambient (regulator.ts, step 3).
  if (min === null) return `up to ${ohms(max)}; no lower end, as the card gives no power limit`;
  return `${ohms(min)} … ${ohms(max)}`;
}
