import { describe, expect, it } from 'vitest'
import { registerSchema, loginSchema } from '../../shared/utils/schemas/auth'
import { zodMessage } from '../../shared/utils/validation'

describe('auth payload schemas', () => {
  it('normalises e-mail to lower case and trims it', () => {
    const r = loginSchema.parse({ email: '  Tech@Larkspur.Example ', password: 'x' })
    expect(r.email).toBe('tech@larkspur.example')
  })

  it('names the field in the first message', () => {
    const r = registerSchema.safeParse({ email: 'a@b.example', name: 'A', password: 'short' })
    expect(r.success).toBe(false)
    if (!r.success) expect(zodMessage(r.error)).toBe('password: use at least 10 characters')
  })

  it('accepts a ten-character password and refuses nine', () => {
    expect(registerSchema.safeParse({ email: 'a@b.example', name: 'A', password: '0123456789' }).success).toBe(true)
    expect(registerSchema.safeParse({ email: 'a@b.example', name: 'A', password: '012345678' }).success).toBe(false)
  })
})
