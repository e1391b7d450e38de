declare module '#app' {
  interface PageMeta {
    coachOnly?: boolean
    public?: boolean
  }
}

export {}
