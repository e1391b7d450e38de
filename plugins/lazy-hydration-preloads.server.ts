// Components that hydrate later (`hydrate-on-visible`, `hydrate-never`) should not have their code preloaded
// with the page. Nuxt 4.4.5 removes them from the rendered modules only after it has worked out, and kept, the
// page's list of files, so the preload links still named them (fixed upstream in nuxt/nuxt#35342, after 4.4.6).
// Forgetting the kept list when one is removed makes Nuxt work the preload links out again without them; the
// styles were already read before, so nothing is lost from the page.
export default defineNuxtPlugin({
  name: 'lazy-hydration-preloads',
  setup(nuxtApp) {
    const ssrContext = nuxtApp.ssrContext as (typeof nuxtApp.ssrContext & { _requestDependencies?: unknown }) | undefined
    if (!ssrContext) return
    class RenderedModules extends Set<string> {
      override delete(id: string) {
        ssrContext!._requestDependencies = undefined
        return super.delete(id)
      }
    }
    ssrContext.modules = new RenderedModules(ssrContext.modules)
  },
})
