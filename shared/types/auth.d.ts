declare module '#auth-utils' {
  interface User {
    id: string
  }
  interface UserSession {
    activeShopId?: string | null
  }
}

export {}
