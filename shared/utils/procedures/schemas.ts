// Moved to shared/utils/schemas/procedures.ts; this path still resolves for existing imports.
export * from '../schemas/procedures'
