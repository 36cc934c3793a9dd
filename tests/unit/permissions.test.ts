import { describe, expect, it } from 'vitest'
import { can, OWN_ONLY, PERMISSIONS, rolesFor, type RecordKind, type Verb } from '../../shared/utils/permissions'
import { ROLES } from '../../shared/utils/roles'
import { ENTITY_TABLES, INSERT_ONLY } from '../../shared/utils/sync/entities'

describe('permissions table', () => {
  it('covers every synced record, and an insert-only record has no update', () => {
    for (const t of ENTITY_TABLES) {
      expect(PERMISSIONS[t], t).toBeDefined()
      expect(rolesFor(t, 'create').length, `${t} create`).toBeGreaterThan(0)
    }
    for (const t of INSERT_ONLY) expect(rolesFor(t, 'update')).toEqual([])
    expect(rolesFor('procedureGates', 'update')).toEqual([])
    expect(rolesFor('procedureGates', 'remove')).toEqual([])
  })

  it('lists an own-only role only where the verb allows that role at all', () => {
    for (const [record, verbs] of Object.entries(OWN_ONLY)) {
      for (const [verb, roles] of Object.entries(verbs!)) {
        for (const role of roles!) expect(rolesFor(record as RecordKind, verb as Verb), `${record} ${verb} ${role}`).toContain(role)
      }
    }
  })

  it('lets the desk check in jobs and customers but not touch parts; the tech the reverse', () => {
    expect(can('desk', 'jobs', 'create')).toBe(true)
    expect(can('desk', 'customers', 'update')).toBe(true)
    expect(can('desk', 'jobParts', 'create')).toBe(false)
    expect(can('tech', 'jobParts', 'create')).toBe(true)
    expect(can('tech', 'jobs', 'create')).toBe(false)
    expect(can('tech', 'jobs', 'update')).toBe(true)
    expect(can('tech', 'customers', 'update')).toBe(false)
  })

  it('keeps deleting customers, amps and jobs to the owner', () => {
    for (const record of ['customers', 'amps', 'jobs'] as const) {
      expect(ROLES.filter(r => can(r, record, 'remove', { mine: true }))).toEqual(['owner'])
    }
  })

  it('lets a player change only their own notes, and staff any note', () => {
    expect(can('player', 'notes', 'update', { mine: true })).toBe(true)
    expect(can('player', 'notes', 'update')).toBe(false)
    expect(can('player', 'notes', 'remove', { mine: false })).toBe(false)
    for (const r of ['owner', 'tech', 'desk'] as const) expect(can(r, 'notes', 'update')).toBe(true)
  })

  it('lets the owner delete any bench result and everyone else only their own; nobody edits one', () => {
    expect(can('owner', 'measurements', 'remove')).toBe(true)
    for (const r of ['tech', 'desk', 'player'] as const) {
      expect(can(r, 'measurements', 'remove')).toBe(false)
      expect(can(r, 'measurements', 'remove', { mine: true })).toBe(true)
    }
    for (const r of ROLES) expect(can(r, 'measurements', 'update', { mine: true })).toBe(false)
    expect(can('desk', 'measurements', 'create')).toBe(false)
  })

  it('lets only the person running a procedure, or an owner, change the run', () => {
    expect(can('owner', 'procedureRuns', 'update')).toBe(true)
    expect(can('tech', 'procedureRuns', 'update')).toBe(false)
    expect(can('tech', 'procedureRuns', 'update', { mine: true })).toBe(true)
    expect(can('desk', 'procedureRuns', 'update', { mine: true })).toBe(false)
  })

  it('lets a player pay an invoice but not send or void one; only the owner reads the mail outbox', () => {
    expect(can('player', 'invoices', 'pay')).toBe(true)
    expect(can('player', 'invoices', 'update')).toBe(false)
    expect(can('tech', 'invoices', 'pay')).toBe(false)
    expect(ROLES.filter(r => can(r, 'mail', 'read'))).toEqual(['owner'])
    expect(can('player', 'customers', 'read')).toBe(false)
  })

  it('lets only the bench suggest retube thresholds for a rig; the player reads them; nobody edits one', () => {
    expect(ROLES.filter(r => can(r, 'rigSuggestions', 'create', { mine: true }))).toEqual(['owner', 'tech'])
    expect(can('player', 'rigSuggestions', 'read')).toBe(true)
    expect(can('desk', 'rigSuggestions', 'read')).toBe(false)
    for (const r of ROLES) expect(can(r, 'rigSuggestions', 'update', { mine: true })).toBe(false)
    // The rig itself stays the player's: the shop never changes its thresholds.
    expect(ROLES.filter(r => can(r, 'rigs', 'update', { mine: true }))).toEqual(['player'])
  })

    it('allows nobody a verb the record does not list', () => {
    for (const r of ROLES) {
      expect(can(r, 'mail', 'remove', { mine: true })).toBe(false)
      expect(can(r, 'shopSettings', 'create', { mine: true })).toBe(false)
    }
  })
})
