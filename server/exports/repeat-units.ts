import { UNITS_MAX } from '../../src/shared/exports';
import { unprocessable } from '../http/errors';
import type { ExportSource } from './export-source';

/** `units` asks for a chain of a repeat unit: only a molecule with attachment points has one, 1 to UNITS_MAX units. */
export function assertUnits(s: ExportSource, units: number | undefined): void {
  if (units === undefined) return;
  if (!s.model.repeatUnit) throw unprocessable('not_a_repeat_unit', 'units applies to a repeat unit (a molecule with attachment points); this molecule has none.', { units });
  if (units < 1 || units > UNITS_MAX) throw unprocessable('units_out_of_range', `A chain has 1 to ${UNITS_MAX} units; got ${units}.`, { units, min: 1, max: UNITS_MAX });
}
