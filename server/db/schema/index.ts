export * from './auth'
