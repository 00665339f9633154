// The session's shape, declared once for nuxt-auth-utils (server and client).
declare module '#auth-utils' {
  interface User {
    id: number
    name: string
    email: string
  }

  interface UserSession {
    /** Set for a tablet or phone that joined one shoot with a join code; such a session has no user. */
    device?: {
      codeId: number
      shootId: number
      studioId: number
      role: 'host' | 'camera'
      /** Epoch ms after which the device must join again. */
      until: number
    }
    /** The studio the member last switched to in the app shell. */
    studioId?: number
    loggedInAt?: number
    /** The account's session version at sign-in; the guard refuses the session once the account's is higher. */
    sessionVersion?: number
  }
}

export {}
