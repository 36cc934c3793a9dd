declare module '#auth-utils' {
  interface User {
    id: string
  }
  interface UserSession {
    activeShopId?: string | null
  }
  interface SecureSessionData {
    /** Random id of this session's row in `sessions` (stored there as its sha256); never sent to the browser's script. */
    sid?: string
  }
}

export {}
