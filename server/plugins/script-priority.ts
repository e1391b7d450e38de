// A rendered page is whole before its scripts run: on a slow phone connection the markup, styles and fonts
// should arrive first and the scripts that make it interactive after them, not compete with them. The page's
// module scripts and their preloads are fetched at low priority (`fetchpriority`), which browsers without it
// ignore. See docs/performance.md.
const MODULE_TAG = /<(link\b[^>]*\brel="modulepreload"|script\b[^>]*\btype="module")(?![^>]*\bfetchpriority=)/g

export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('render:html', (html) => {
    for (const section of ['head', 'bodyAppend'] as const) {
      html[section] = html[section].map(piece => typeof piece === 'string' ? piece.replace(MODULE_TAG, '<$1 fetchpriority="low"') : piece)
    }
  })
})
