export * from './auth'
export * from './tubes'
