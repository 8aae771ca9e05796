import type { HousePartStatus, PutRatingCardRequest, SpecInput } from '@shuntwise/contracts';
import type TestAgent from 'supertest/lib/agent';

/** Invented values of the usual size for a 5.1 V, 500 mW small-signal regulator diode (common practice, no source). */
export function demoSpec(overrides: Partial<SpecInput> = {}): SpecInput {
  return {
    iRef: 5e-3,
    vz: { min: 4.85, nom: 5.1, max: 5.36 },
    zdMax: 60,
    knee: { iKnee: 0.25e-3, maxRatio: 20, maxSpan: null },
    leakage: { irMax: 2e-6, vr: 2 },
    tc: { min: -1e-3, max: 3e-3 },
    power: { pdMin: 0.3, deratingFraction: 0.5 },
    packages: ['SOD-123', 'SOD-323'],
    envelope: { iMin: 1e-3, iMax: 20e-3, taMin: -40, taMax: 85 },
    outputWindow: null,
    marginalBandPercent: 5,
    ...overrides,
  };
}

const entered = { source: 'entered' as const };

/** A complete card of a 5.1 V part, every value typed in (provenance `entered`). */
export function demoCardFields(overrides: Record<string, unknown> = {}): PutRatingCardRequest['fields'] {
  return {
    vzMin: { value: 4.85, printed: '4.85 V', provenance: entered },
    vzNom: { value: 5.1, printed: '5.1 V', provenance: entered },
    vzMax: { value: 5.36, printed: '5.36 V', provenance: entered },
    izt: { value: 5e-3, printed: '5 mA', provenance: entered },
    zzt: { value: 40, printed: '40 Ω', provenance: entered },
    izk: { value: 0.25e-3, printed: '0.25 mA', provenance: entered },
    zzk: { value: 500, printed: '500 Ω', provenance: entered },
    irMax: { value: 1e-6, printed: '1 µA', provenance: entered },
    vr: { value: 2, printed: '2 V', provenance: entered },
    tc: { value: 0.3, unit: 'mV/K', printed: '+0.3 mV/K', provenance: entered },
    pdMax: { value: 0.5, printed: '500 mW', provenance: entered },
    pdRefC: { value: 25, printed: '25 °C', provenance: entered },
    tjMax: { value: 150, printed: '150 °C', provenance: entered },
    rthJA: { value: 250, printed: '250 K/W', provenance: entered },
    izm: { value: 89e-3, printed: '89 mA', provenance: entered },
    ...overrides,
  } as PutRatingCardRequest['fields'];
}

export async function createVendorPart(http: TestAgent, token: string, body: { manufacturer: string; mpn: string; package?: string }): Promise<number> {
  const res = await http.post('/api/vendor-parts').set('Authorization', `Bearer ${token}`).send(body);
  if (res.status !== 201) throw new Error(`create vendor part failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.id as number;
}

export async function createHousePart(http: TestAgent, token: string, partNumber: string, description = '', status?: HousePartStatus): Promise<number> {
  const res = await http
    .post('/api/house-parts')
    .set('Authorization', `Bearer ${token}`)
    .send({ partNumber, description, ...(status ? { status } : {}) });
  if (res.status !== 201) throw new Error(`create house part failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.id as number;
}
