import type { H3Event } from 'h3'
import type { z } from 'zod'

function parser<S extends z.ZodType>(schema: S) {
  return (data: unknown): z.infer<S> => {
    const r = schema.safeParse(data)
    // h3 turns a thrown error into a 400 that keeps this message.
    if (!r.success) throw new Error(zodMessage(r.error))
    return r.data
  }
}

// A JSON body only: a form posted from another site (text/plain, urlencoded, multipart) is
// refused before it is read, whatever it holds.
const JSON_TYPE = /^application\/([\w.+-]+\+)?json\s*(;|$)/i

export async function validBody<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.infer<S>> {
  const type = getRequestHeader(event, 'content-type')
  if (type && !JSON_TYPE.test(type)) throw createError({ statusCode: 415, message: 'Send the body as JSON (Content-Type: application/json).' })
  return readValidatedBody(event, parser(schema))
}
export const validParams = <S extends z.ZodType>(event: H3Event, schema: S) => getValidatedRouterParams(event, parser(schema))
export const validQuery = <S extends z.ZodType>(event: H3Event, schema: S) => getValidatedQuery(event, parser(schema))
