import { describe, expect, it } from 'vitest'
import { powerTubeOf } from '../../app/utils/jobs/amp-tube'
import { BUILTIN_LIBRARY } from '../../shared/utils/tubes/library'

describe('the power tube of an amp, from its tube complement', () => {
  it('picks the output tube, not the preamp or rectifier tubes', () => {
    // Source: the demo shop's invented amps; the power tube is the one with the plate rating in watts, not a preamp triode.
    expect(powerTubeOf('2 x 12AX7, 1 x 12AT7, 2 x 6V6GT', BUILTIN_LIBRARY)?.id).toBe('6v6gt')
    expect(powerTubeOf('4 x 12AX7, 2 x 6L6GC, 5AR4', BUILTIN_LIBRARY)?.id).toBe('6l6gc')
    expect(powerTubeOf('3 x 12ax7, 4 x el84', BUILTIN_LIBRARY)?.id).toBe('el84')
    expect(powerTubeOf('3 x 12AX7, 2 × EL34', BUILTIN_LIBRARY)?.id).toBe('el34')
  })

  it('finds nothing where the complement names no library tube', () => {
    expect(powerTubeOf('', BUILTIN_LIBRARY)).toBeUndefined()
    expect(powerTubeOf('2 x mystery tubes', BUILTIN_LIBRARY)).toBeUndefined()
  })
})
