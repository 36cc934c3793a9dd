import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { TubesEntry } from '#components'
import { BUILTIN_LIBRARY } from '#shared/utils/tubes/library'
import type { LibraryTube } from '#shared/types/tubes'

const builtin = (id: string) => BUILTIN_LIBRARY.find(t => t.id === id)!
const figure = (w: Awaited<ReturnType<typeof mountSuspended>>, f: string) => w.find(`[data-figure="${f}"]`)

describe('Tubes: a built-in entry', () => {
  it('shows the backing class beside each figure, and the source behind it', async () => {
    // Source: SOURCES.md: 6L6GC 30 W (S1, GE 1973 via the encyclopedia), screen 5 W (memory)
    const w = await mountSuspended(TubesEntry, { props: { tube: builtin('6l6gc'), canEdit: false } })
    expect(figure(w, 'maxPlateWatts').text()).toMatch(/30 W\s*S1/)
    expect(figure(w, 'maxPlateWatts').find('abbr').attributes('title')).toMatch(/General Electric, Essential Characteristics \(1973\)/)
    expect(figure(w, 'maxScreenWatts').text()).toMatch(/5 W\s*memory/)
    expect(w.find('[data-source="ratingSystem"]').text()).toMatch(/^Rating system: .*\(memory, unverified\)$/)
  })

  it('explains the rating system where the limits are shown', async () => {
    const w = await mountSuspended(TubesEntry, { props: { tube: builtin('6v6gt'), canEdit: false } })
    expect(w.find('[data-testid="rating-system"]').text()).toMatch(/^Design centre rating\s*memory$/)
    expect(w.find('[data-testid="rating-system-explained"]').text()).toMatch(/^Design centre: the limit holds for an average \(bogey\) tube/)
  })

  it('says the KT66 screen rating is published but not found, and the 12AX7 rating is per section', async () => {
    // Source: SOURCES.md: KT66 screen "published but not found"; 12AX7 "1 per section" (S1)
    const kt66 = await mountSuspended(TubesEntry, { props: { tube: builtin('kt66'), canEdit: false } })
    expect(figure(kt66, 'maxScreenWatts').text()).toMatch(/^Screen\s*published, not found here\s*memory$/)
    const ax7 = await mountSuspended(TubesEntry, { props: { tube: builtin('12ax7'), canEdit: false } })
    expect(figure(ax7, 'maxPlateWatts').text()).toMatch(/1 W per section\s*S1/)
    expect(figure(ax7, 'heater').text()).toContain('12.6 V 0.15 A or 6.3 V 0.3 A')
  })
})

describe('Tubes: a shop entry', () => {
  it('shows its own source line and no class', async () => {
    const tube: LibraryTube = {
      id: '0b7c1e0e-0000-4000-8000-00000000abcd', name: 'EL84 (shop sheet)', maxPlateWatts: 12, maxScreenWatts: null,
      maxPlateVolts: 300, heater: '6.3 V 0.76 A', ratingSystem: 'design-centre', source: 'Shop copy of the maker\'s sheet', kind: 'shop',
    }
    const w = await mountSuspended(TubesEntry, { props: { tube, canEdit: false } })
    expect(w.findAll('[data-testid="figure-class"]')).toHaveLength(0)
    expect(figure(w, 'maxScreenWatts').text()).toMatch(/not given/)
    expect(w.text()).toContain('Source: Shop copy of the maker\'s sheet')
  })
})
