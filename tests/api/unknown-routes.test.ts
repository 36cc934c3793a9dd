import { describe, expect, it } from 'vitest'
import { BASE, DEMO, login } from './helpers/client'

describe('an /api path no route answers', () => {
  it('answers a JSON 404 for any method, also to a browser asking for HTML', async () => {
    for (const [method, accept] of [['GET', 'text/html'], ['GET', '*/*'], ['POST', 'application/json'], ['DELETE', '*/*']] as const) {
      const res = await fetch(`${BASE}/api/no-such-thing`, { method, headers: { accept, 'content-type': 'application/json' }, body: method === 'POST' ? '{}' : undefined })
      expect(res.status, `${method} ${accept}`).toBe(404)
      expect(res.headers.get('content-type')).toMatch(/^application\/json/)
      expect(await res.json()).toMatchObject({ statusCode: 404, message: 'No such API route' })
    }
    const deep = await fetch(`${BASE}/api/jobs/not-a-route/at/all`, { method: 'PUT' })
    expect(deep.status).toBe(404)
  })

  it('leaves the real routes and the app pages alone', async () => {
    expect((await fetch(`${BASE}/api/health`)).status).toBe(200)
    const desk = await login(DEMO.desk)
    const jobs = await desk.get('/api/jobs')
    expect(jobs.status).toBe(200)
    expect(Array.isArray(jobs.body.items)).toBe(true)
    const page = await fetch(`${BASE}/jobs`, { headers: { accept: 'text/html' } })
    expect(page.status).toBe(200)
    expect(page.headers.get('content-type')).toMatch(/text\/html/)
  })
})
