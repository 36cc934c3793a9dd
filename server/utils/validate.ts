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

export const validBody = <S extends z.ZodType>(event: H3Event, schema: S) => readValidatedBody(event, parser(schema))
export const validParams = <S extends z.ZodType>(event: H3Event, schema: S) => getValidatedRouterParams(event, parser(schema))
export const validQuery = <S extends z.ZodType>(event: H3Event, schema: S) => getValidatedQuery(event, parser(schema))
