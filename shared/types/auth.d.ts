declare module '#auth-utils' {
  interface User {
    id: number
    name: string
    email: string
  }
  interface UserSession {
    teamId: number
    role: 'head_coach' | 'coach' | 'athlete'
  }
  interface SecureSessionData {
    /** The random id of this sign-in; its hash is a row in `auth_sessions`. */
    sid: string
  }
}

export {}
