import { createDefu } from 'defu'
import { createRouter, toRouteMatcher, type RouteMatcher } from 'radix3'

type Rules = Record<string, unknown> & { headers?: Record<string, unknown> }

// As nuxt-security merges the rules of every pattern a path matches: arrays replace, they do not add up.
const mergeReplacingArrays = createDefu((object, key, value) => {
  const merged = object as Record<PropertyKey, unknown>
  if (Array.isArray(merged[key]) || Array.isArray(value)) {
    merged[key] = value
    return true
  }
})

// nuxt-security works out a request's rules by building a router over a structuredClone of all its options,
// on every request and every internal fetch of a rendered page (7–10 % of a small JSON route's CPU). Its
// options are final once its plugin has started, so the rules are merged here once per set of matching
// patterns, in the module's own order, and set on the request before the module looks (it keeps what it
// finds). Each request gets its own copy of the rules and their headers: the module writes the page's CSP
// with that response's nonce into `rules.headers`.
export default defineNitroPlugin((nitroApp) => {
  let options: Record<string, Rules> | undefined
  let matcher: RouteMatcher | undefined
  const merged = new Map<string, Rules>()
  nitroApp.hooks.hook('nuxt-security:routeRules', (rules) => {
    options = rules as Record<string, Rules>
  })
  nitroApp.hooks.hook('request', (event) => {
    if (!options || event.context.security?.rules) return
    matcher ??= toRouteMatcher(createRouter({ routes: Object.fromEntries(Object.keys(options).map(pattern => [pattern, { pattern }])) }))
    const path = event.path.split('?')[0]
    const matches = (path ? matcher.matchAll(path) : []) as { pattern: string }[]
    const key = matches.map(match => match.pattern).join('\n')
    let rules = merged.get(key)
    if (!rules) {
      rules = mergeReplacingArrays({}, ...matches.reverse().map(match => structuredClone(options![match.pattern]!))) as Rules
      merged.set(key, rules)
    }
    event.context.security = { ...event.context.security, rules: { ...rules, headers: rules.headers && { ...rules.headers } } }
  })
})
