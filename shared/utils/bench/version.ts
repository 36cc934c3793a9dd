// Bump the major version whenever a formula changes what a saved result means.
export const ENGINE_VERSION = '1.0.0'
