/** Shapes shared by the generator's parts. The answer-key shape is documented in README.md. */

export const FIELDS = ['vzMin', 'vzNom', 'vzMax', 'izt', 'zzt', 'izk', 'zzk', 'irMax', 'vr', 'tc', 'pdMax', 'tjMax', 'rthJA', 'izm'] as const;
export type Field = (typeof FIELDS)[number];

/** A value as a datasheet prints it, with its SI value (V, A, Ω, W, °C, K/W, V/K). */
export interface Printed {
  value: string;
  unit: string;
  si: number;
}

export interface AnswerValue extends Printed {
  page: number;
}

export interface AnswerVariant {
  mpn: string;
  package: { value: string; page: number };
  fields: Partial<Record<Field, AnswerValue>>;
}

export interface AnswerKey {
  file: string;
  vendor: string;
  title: string;
  layout: string;
  pages: number;
  variants: AnswerVariant[];
}
