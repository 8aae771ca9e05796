import { engineeringCardContradictions, formatQuantity, type CardIssue, type EngineeringCardInput } from '@shuntwise/contracts';
import { mechanismSignWarning } from './mechanism';

const celsius = (x: number) => formatQuantity(x, 'temperature', { trim: true });

/**
 * Sanity checks on a card for the card editor and the core: contradictions are errors
 * (the core refuses the card), implausible or missing values are warnings. Each names its
 * field.
 */
export function checkCard(card: EngineeringCardInput): CardIssue[] {
  const issues: CardIssue[] = engineeringCardContradictions(card).map((p) => ({ field: p.field, severity: 'error', message: p.message }));
  const warn = (field: string, message: string) => issues.push({ field, severity: 'warning', message });
  const { vzNom, izt } = card;

  if (vzNom < 1.8 || vzNom > 200) warn('vzNom', `VZ nom ${volts(vzNom)} lies outside the usual 1.8…200 V of regulator diodes`);
  if (card.vzMin == null || card.vzMax == null) {
    warn(card.vzMin == null ? 'vzMin' : 'vzMax', 'no tolerance window: results use the nominal voltage for the missing end');
  } else if ((card.vzMax - card.vzMin) / (2 * vzNom) > 0.2) {
    warn('vzMax', `the tolerance window ${volts(card.vzMin)}…${volts(card.vzMax)} is wider than ±20 %: check the values`);
  }
  if (izt < 50e-6 || izt > 2) warn('izt', `IZT ${amps(izt)} lies outside the usual 50 µA…2 A`);
  if (card.zzt == null) warn('zzt', 'no dynamic impedance at IZT: Zd comes from the knee point or is no data');
  else if (card.zzt < 0.1 || card.zzt > 2000) warn('zzt', `ZZT ${ohms(card.zzt)} lies outside the usual 0.1 Ω…2 kΩ`);
  if (card.izk != null && card.zzk == null) warn('zzk', 'IZK given without ZZK: the knee point is not used');
  if (card.zzk != null && card.izk == null) warn('izk', 'ZZK given without IZK: the knee point is not used');
  if (card.zzk != null && card.zzt != null && card.zzk < card.zzt) {
    warn('zzk', `ZZK (${ohms(card.zzk)}) is below ZZT (${ohms(card.zzt)}): a junction's impedance falls with current; the knee point is ignored`);
  }

  if (card.tc == null) warn('tc', 'no temperature coefficient: Vz is taken as constant with temperature');
  else {
    const alpha = card.tc;
    const percentPerK = (alpha / vzNom) * 100;
    if (Math.abs(percentPerK) > 0.2) {
      warn(
        'tc',
        `tc ${formatQuantity(alpha, 'tempCoVoltage')} is ${formatQuantity(percentPerK, 'tempCoPercent')} of VZ, beyond the usual ±0.1 %/K: check the unit (mV/K or %/K)`,
      );
    }
    const sign = mechanismSignWarning(vzNom, alpha);
    if (sign !== null) warn('tc', sign);
  }

  if (card.irMax != null && card.vr == null) warn('vr', 'IR max given without its test voltage VR');
  if (card.irMax != null && card.izk != null && card.irMax >= card.izk) {
    warn('irMax', `IR max (${amps(card.irMax)}) is not below IZK (${amps(card.izk)}): leakage that large is implausible`);
  }

  if (card.tjMax != null && (card.tjMax < 100 || card.tjMax > 200)) warn('tjMax', `TJ max ${celsius(card.tjMax)} lies outside the usual 100…200 °C`);
  if (card.rthJA != null && (card.rthJA < 1 || card.rthJA > 1000))
    warn('rthJA', `RthJA ${formatQuantity(card.rthJA, 'thermalResistance', { trim: true })} lies outside the usual 1…1000 K/W`);
  if (card.pdMax != null) {
    if (card.tjMax == null) warn('tjMax', 'PD max given without TJ max: the rating cannot be derated above its reference temperature');
    if (card.izm != null && card.izm * vzNom > 1.25 * card.pdMax) {
      warn('izm', `IZM × VZ nom = ${watts(card.izm * vzNom)} exceeds PD max (${watts(card.pdMax)}) by more than 25 %`);
    }
    if (izt * vzNom > card.pdMax) warn('izt', `the test point dissipates ${watts(izt * vzNom)}, more than PD max (${watts(card.pdMax)})`);
    if (card.rthJA != null && card.tjMax != null) {
      const fromRth = (card.tjMax - (card.pdRefC ?? 25)) / card.rthJA;
      if (Math.abs(fromRth - card.pdMax) > 0.25 * card.pdMax) {
        warn(
          'rthJA',
          `(TJ max − ${celsius(card.pdRefC ?? 25)})/RthJA = ${watts(fromRth)} disagrees with PD max (${watts(card.pdMax)}) by more than 25 %: derating uses the lower`,
        );
      }
    }
  } else if (card.rthJA == null || card.tjMax == null) {
    warn('pdMax', 'no power rating (PD max, or TJ max with RthJA): power checks are no data');
  }
  if (card.rthJA == null) warn('rthJA', 'no RthJA: self-heating is left out (Tj = Ta)');
  return issues;
}

function volts(x: number): string {
  return formatQuantity(x, 'voltage');
}
function amps(x: number): string {
  return formatQuantity(x, 'current');
}
function ohms(x: number): string {
  return formatQuantity(x, 'resistance');
}
function watts(x: number): string {
  return formatQuantity(x, 'power');
}
