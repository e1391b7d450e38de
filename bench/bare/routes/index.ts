export default defineEventHandler(() => ({ ok: true, name: 'bare', at: 1 }))
