// The app's start in the browser runs as several short tasks rather than one long one, so a phone can
// paint and answer a tap between them: after the scripts are evaluated (before the router and the head
// manager are set up) and before the page is hydrated, the browser gets the main thread back for a moment.
// The page's own hydration is split the same way (components/ui/UiHydrateAfterYield.vue, in the layout).
export default defineNuxtPlugin({
  name: 'yield-between-phases',
  // Before Nuxt's own router and head plugins (both at -20), after the payload is read (-30).
  order: -25,
  async setup(nuxtApp) {
    nuxtApp.hook('app:beforeMount', yieldToBrowser)
    await yieldToBrowser()
  },
})
