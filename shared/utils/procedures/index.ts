export * from './types'
export * from './gate-items'
export * from './definitions'
export * from './run'
