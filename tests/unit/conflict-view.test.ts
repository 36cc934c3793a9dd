import { describe, expect, it } from 'vitest'
import { conflictTitle, conflictView } from '../../app/utils/sync/conflict-view'
import type { ConflictRow } from '../../app/utils/sync/local-db'

const conflict = (over: Partial<ConflictRow>): ConflictRow => ({
  id: 'c', shopId: 's', version: 3, deleted: false, pending: 0, tableName: 'jobs', rowId: 'j', field: 'status',
  serverValue: 'ready', clientValue: 'on-bench', serverAuthor: 'desk', clientAuthor: 'tech', serverChangedAt: '2026-12-01T09:00:00.000Z', clientChangedAt: '2026-12-01T10:00:00.000Z',
  status: 'open', note: null, ...over,
})

describe('conflict view for records other than notes', () => {
  it('names the job and shows its status as the board does, to be picked and not typed', () => {
    const job = { id: 'j', status: 'ready', ampId: 'a', customerId: 'cu' }
    const v = conflictView(conflict({}), { record: job, related: { amp: 'Two-6L6 combo', customer: 'Dana Whitlow' } })
    expect(v.title).toBe('Job \'Two-6L6 combo · Dana Whitlow\' · status')
    expect(v.question).toBe('Two people changed this job\'s status at the same time.')
    expect(v.sides.map(s => s.text)).toEqual(['Ready', 'On the bench'])
    // The raw state names go to the server, never the labels.
    expect(v.sides.map(s => s.choice.value)).toEqual(['ready', 'on-bench'])
    expect(v.mergeable).toBe(false)
    expect(v.question).not.toMatch(/note/)
  })

  it('shows a part\'s unit price as money and sends the number of cents', () => {
    const part = { id: 'p', jobId: 'j', description: 'Output transformer', unitPriceCents: 8950 }
    const v = conflictView(conflict({ tableName: 'jobParts', rowId: 'p', field: 'unitPriceCents', serverValue: 8950, clientValue: 9400 }), { record: part, currency: 'USD' })
    expect(v.title).toBe('Part \'Output transformer\' · unit price')
    // Source: Intl.NumberFormat en-US currency formatting (ECMA-402) gives "$89.50" for 89.5 USD.
    expect(v.sides.map(s => s.text)).toEqual([new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(89.5), '$94.00'])
    expect(v.sides.map(s => s.choice.value)).toEqual([8950, 9400])
    expect(v.mergeable).toBe(false)
  })

  it('offers a merge only for free text, a date as a date, and an unassigned tech as nobody', () => {
    const desc = conflictView(conflict({ tableName: 'jobParts', field: 'description', serverValue: 'OT', clientValue: 'Output transformer' }))
    expect(desc).toMatchObject({ mergeable: true, singleLine: true, mergeSeed: 'OT' })
    const complaint = conflictView(conflict({ field: 'complaint', serverValue: 'Hum', clientValue: 'Hum at idle' }))
    expect(complaint).toMatchObject({ mergeable: true, singleLine: false, mergeSeed: 'Hum\n\nHum at idle' })
    const date = conflictView(conflict({ field: 'promisedFor', serverValue: '2026-12-08', clientValue: '' }))
    expect(date.sides[0]!.text).toMatch(/8 Dec 2026/)
    expect(date.sides[1]!.text).toBe('(empty)')
    const tech = conflictView(conflict({ field: 'assignedTo', serverValue: 'u-owen', clientValue: null }), { person: id => (id === 'u-owen' ? 'Owen Pryde' : undefined) })
    expect(tech.sides.map(s => s.text)).toEqual(['Owen Pryde', 'Nobody'])
    expect(tech.mergeable).toBe(false)
  })

  it('lists a conflict by its record and field, and an edit-versus-delete of a job as keep or delete', () => {
    expect(conflictTitle({ tableName: 'jobLabour', field: 'minutes' }, { description: 'Re-bias' })).toBe('Labour \'Re-bias\' · time')
    expect(conflictTitle({ tableName: 'jobs', field: 'status' })).toBe('A job · status')
    const v = conflictView(conflict({ field: '_delete', serverValue: null, clientValue: true }))
    expect(v.question).toBe('One person edited this job while another deleted it.')
    expect(v.sides.map(s => s.choice)).toEqual([{ value: false }, { value: true }])
  })
})
