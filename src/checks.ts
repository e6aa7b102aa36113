/**
 * The one record of a physical self-check of a computed result (energy
 * conservation, reciprocity identities, passivity, model validity), shared by
 * every module that reports checks as data.
 * @module
 */
import { displayable } from './display/attach.js';

/**
 * One physical check of a result, as plain data.
 *
 * @remarks
 * `passed` is `value ≤ limit` when `comparison` is `'atMost'` and
 * `value ≥ limit` when it is `'atLeast'`. A failed check means the figures it
 * names are not trustworthy (conventions, "result checks"; docs/conventions.md);
 * they are still returned so that a report can show them, marked.
 * @category Checks
 */
export interface PhysicalCheck {
  /** Stable identifier, e.g. `'radiationEfficiency'`, `'twissResidual'`, `'impedancePassivity'`, `'elementModel.electricalLength'`. */
  readonly name: string;
  /** The measured quantity (its unit is stated in `meaning`). */
  readonly value: number;
  /** The bound the value is compared with (same unit as `value`). */
  readonly limit: number;
  /** How `value` is compared with `limit`. */
  readonly comparison: 'atMost' | 'atLeast';
  /** True when the value lies on the allowed side of the limit. */
  readonly passed: boolean;
  /** One sentence: what is measured, in which unit, and what a failure means. */
  readonly meaning: string;
  /** Names of the result fields whose trust depends on this check (e.g. `['radiationEfficiency', 'directivity']`). */
  readonly figures: readonly string[];
}

/**
 * Builds a {@link PhysicalCheck}, deciding `passed` from the comparison (a NaN value fails).
 * @param name - Identifier.
 * @param value - Measured value.
 * @param comparison - `'atMost'` (value ≤ limit) or `'atLeast'` (value ≥ limit).
 * @param limit - Bound.
 * @param meaning - What is measured, its unit, and what a failure means.
 * @param figures - Result fields guarded by the check.
 * @returns The check record.
 * @example
 * ```ts
 * physicalCheck('radiationEfficiency', 1.02, 'atMost', 1.001, 'largest beam η_rad (linear)', ['radiationEfficiency']).passed; // false
 * ```
 * @category Checks
 */
export function physicalCheck(
  name: string, value: number, comparison: 'atMost' | 'atLeast', limit: number, meaning: string, figures: readonly string[],
): PhysicalCheck {
  const passed = comparison === 'atMost' ? value <= limit : value >= limit;
  return displayable<PhysicalCheck>({ name, value, limit, comparison, passed, meaning, figures }, 'PhysicalCheck');
}

/**
 * The checks of a list that failed.
 * @param checks - Check records.
 * @returns The failed ones, in order.
 * @category Checks
 */
export function failedChecks(checks: ReadonlyArray<PhysicalCheck>): PhysicalCheck[] {
  return checks.filter((c) => !c.passed);
}
