import type { RegulatorResponse, SearchItem, SearchPage } from '@shuntwise/contracts';

// Invented demo parts, shaped as GET /api/search answers them.
export function searchItem(id: number, mpn: string, over: Partial<SearchItem> = {}): SearchItem {
  return {
    vendorPart: { id, manufacturer: 'Brackenford Semiconductor', mpn, package: 'SOD-123', lifecycleNote: null },
    card: {
      version: 1,
      vzMin: 4.85,
      vzNom: 5.1,
      vzMax: 5.36,
      izt: 0.005,
      zzt: 28,
      izk: 0.00025,
      zzk: 480,
      irMax: 2e-6,
      vr: 2,
      tc: 0.0003,
      pdMax: 0.5,
      pdRefC: 25,
      tjMax: 150,
      rthJA: 250,
      izm: 0.089,
      tolerance: 0.051,
    },
    datasheetId: 3,
    cleared: true,
    clearances: [
      {
        housePart: { id: 7, partNumber: 'OHI-ZD-1051', description: 'Regulator diode 5.1 V, 5 V rail clamp', status: 'active' },
        standing: 'approved',
        conditions: null,
        since: '2026-10-01T09:00:00.000Z',
        decidedBy: null,
        caseId: null,
        revision: null,
        needsRecheck: false,
        recheckOpen: false,
        waivers: [],
      },
    ],
    ruledOut: [],
    qualificationOpen: false,
    score: null,
    ...over,
  };
}

export const CONDITIONAL = searchItem(12, 'TPZ15-11', {
  vendorPart: { id: 12, manufacturer: 'Tevorrow Power Devices', mpn: 'TPZ15-11', package: 'SMB', lifecycleNote: null },
  card: { ...searchItem(0, '').card!, vzMin: 10.45, vzNom: 11, vzMax: 11.55, izt: 0.034, zzt: 7, pdMax: 1.5, rthJA: 83, izm: 0.12, tolerance: 0.05 },
  clearances: [
    {
      housePart: { id: 9, partNumber: 'OHI-ZD-2110', description: '11 V clamp for the valve-driver supply', status: 'active' },
      standing: 'cleared-with-conditions',
      conditions: 'Incoming inspection measures reverse leakage on five pieces per lot.',
      since: '2026-11-05T10:00:00.000Z',
      decidedBy: { id: 3, name: 'Tomas Eklund' },
      caseId: 21,
      revision: 1,
      needsRecheck: true,
      recheckOpen: false,
      waivers: [],
    },
  ],
});

export function page(items: SearchItem[], over: Partial<SearchPage> = {}): SearchPage {
  return { items, total: items.length, pageIndex: 0, pageSize: 25, text: { mode: 'none', candidates: items.length, truncated: false, note: null }, ...over };
}

export const FACETS = {
  packages: [
    { value: 'SMB', cleared: 1, total: 3 },
    { value: 'SOD-123', cleared: 12, total: 40 },
  ],
  manufacturers: [{ value: 'Brackenford Semiconductor', cleared: 12, total: 30 }],
  houseParts: [{ id: 7, partNumber: 'OHI-ZD-1051', description: '5 V rail clamp', status: 'active' as const, cleared: 2 }],
  clearedParts: 13,
  catalogueParts: 120,
};

/** A regulator answer in the shape of POST /api/engineering/regulator (values invented, consistent with each other). */
export function regulatorAnswer(over: Partial<RegulatorResponse> = {}): RegulatorResponse {
  return {
    verdict: 'ok',
    reasons: [],
    simple: { resistance: 276, supply: 12, vz: 5.1, diodeCurrent: 0.005, loadMax: 0.02 },
    range: {
      min: 137,
      max: 244,
      kneeCurrent: 0.00125,
      allowedDiodeCurrent: 0.06,
      minReason: 'at 13.2 V supply and 0 A load the diode may carry 60.0 mA (320 mW allowed at 70 °C, max part, 70 °C), with the resistor at −5 %',
      maxReason: 'at 10.8 V supply and 20.0 mA load the diode keeps 1.25 mA at up to 5.390 V (70 °C, max part), with the resistor at +5 %',
    },
    selected: { resistance: 240, series: 'E24', tolerance: 0.05, low: 228, high: 252 },
    resistorPower: 0.266,
    diodePower: 0.162,
    diodePowerAllowed: 0.32,
    lineRegulation: 0.11,
    outputResistance: 25,
    loadRegulation: 0.49,
    outputBand: {
      vMin: 4.61,
      vMax: 5.52,
      corners: [
        {
          supply: 10.8,
          load: 0.02,
          ambientC: 70,
          corner: 'max',
          resistance: 252,
          vOut: 5.31,
          diodeCurrent: 0.0018,
          tjC: 72,
          diodePower: 0.0096,
          resistorPower: 0.12,
          belowKnee: false,
          overPower: false,
        },
        {
          supply: 13.2,
          load: 0,
          ambientC: 70,
          corner: 'max',
          resistance: 228,
          vOut: 5.52,
          diodeCurrent: 0.0337,
          tjC: 116,
          diodePower: 0.162,
          resistorPower: 0.26,
          belowKnee: false,
          overPower: false,
        },
      ],
    },
    assumptions: ['the diode may dissipate 100 % of its derated power rating', 'self-heating: Tj = Ta + RthJA·Vz·I, iterated to convergence'],
    warnings: ["the simple formula's 276 Ω lies outside the working range 137 Ω…244 Ω"],
    caution: 'Estimates from datasheet values: confirm by measurement and with the manufacturer before relying on them.',
    ...over,
  };
}
