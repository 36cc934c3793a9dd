// Typed test-point fields read into SI, with a message per field.
import { readQuantity } from '#shared/utils/units'
import type { TestPoint } from '~/stores/stock'

export interface TestPointForm { plateVolts: string, gridVolts: string, testedOn: string, testedBy: string }

export const localDay = (d = new Date()) => `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`

export const emptyTestPoint = (testedBy = ''): TestPointForm => ({ plateVolts: '', gridVolts: '', testedOn: localDay(), testedBy })

/** Grid bias is negative; phone keypads often have no minus sign, so "45" reads as -45 V. */
export function readTestPoint(f: TestPointForm): { ok: true, value: TestPoint } | { ok: false, errors: Record<string, string> } {
  const errors: Record<string, string> = {}
  const plate = readQuantity(f.plateVolts, { defaultUnit: 'V', dimension: 'V' })
  const grid = readQuantity(f.gridVolts, { defaultUnit: 'V', dimension: 'V' })
  if (!plate.ok) errors.plateVolts = plate.error
  else if (plate.value <= 0) errors.plateVolts = 'the plate voltage must be above zero'
  if (!grid.ok) errors.gridVolts = grid.error
  if (!/^\d{4}-\d{2}-\d{2}$/.test(f.testedOn)) errors.testedOn = 'use a date like 2026-12-08'
  if (Object.keys(errors).length || !plate.ok || !grid.ok) return { ok: false, errors }
  return { ok: true, value: { plateVolts: plate.value, gridVolts: -Math.abs(grid.value), testedOn: f.testedOn, testedBy: f.testedBy.trim() } }
}
