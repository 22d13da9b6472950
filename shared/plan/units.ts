import type { LengthUnit } from '../weave/types';

/** Exact by definition of the international inch (1959). */
export const CM_PER_INCH = 2.54;
/** Exact: 1 yd = 0.9144 m. */
export const METRES_PER_YARD = 0.9144;
/** Exact: 1 lb = 0.45359237 kg. */
export const KG_PER_POUND = 0.45359237;
export const GRAMS_PER_OUNCE = (KG_PER_POUND * 1000) / 16;

/** Converts a length between inches and centimetres. */
export function convertLength(value: number, from: LengthUnit, to: LengthUnit): number {
  if (from === to) return value;
  return from === 'inch' ? value * CM_PER_INCH : value / CM_PER_INCH;
}

/**
 * Converts a density (ends or picks per unit length) between per inch and per cm.
 * A density is the reciprocal of a length, so it converts the other way round.
 */
export function convertDensity(perUnit: number, from: LengthUnit, to: LengthUnit): number {
  return convertLength(perUnit, to, from);
}

/** A length in inches or cm → metres. */
export function toMetres(value: number, unit: LengthUnit): number {
  return convertLength(value, unit, 'cm') / 100;
}

/** Metres → yards. */
export function metresToYards(metres: number): number {
  return metres / METRES_PER_YARD;
}
