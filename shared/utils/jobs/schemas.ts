// Moved to shared/utils/schemas/jobs.ts; this path still resolves for existing imports.
export * from '../schemas/jobs'
