// A page whose data could not all be fetched still renders (with its error shown) and answers 200. It must not
// be kept (server/plugins/01.kept-pages.ts): the failure may pass without anything being written, and the next
// visit should try again.
export default defineNuxtPlugin((nuxtApp) => {
  nuxtApp.hooks.hook('app:rendered', () => {
    const failed = nuxtApp.payload.error || Object.values(nuxtApp.payload._errors ?? {}).some(Boolean)
    const event = nuxtApp.ssrContext?.event
    if (failed && event) event.context.pageNotKept = true
  })
})
