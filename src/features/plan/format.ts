import type { LengthUnit } from '../../../shared/weave/types';
import { formatNumber } from '../../../shared/words';

const UNIT_WORD: Record<LengthUnit, string> = { inch: 'in', cm: 'cm' };
const PER_UNIT: Record<LengthUnit, string> = { inch: 'per inch', cm: 'per cm' };

/** A number rounded for reading, with thousands separated: 1,234.5. */
export function num(value: number, decimals = 1): string {
  return formatNumber(value, decimals);
}

/** A length in the plan's unit, with yards or metres beside it when it is long. */
export function length(value: number, unit: LengthUnit, decimals = 1): string {
  return `${num(value, decimals)} ${UNIT_WORD[unit]}`;
}

/** A density (ends or picks) in the plan's unit. */
export function density(value: number, unit: LengthUnit, what: 'ends' | 'picks' = 'ends'): string {
  return `${num(value, 1)} ${what} ${PER_UNIT[unit]}`;
}

/** A fraction as a percentage: 0.085 → "8.5 %". */
export function percent(fraction: number): string {
  return `${num(fraction * 100, 1)} %`;
}
