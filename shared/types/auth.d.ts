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
}

export {}
