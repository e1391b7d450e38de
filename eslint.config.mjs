import withNuxt from './.nuxt/eslint.config.mjs'

export default withNuxt({
  ignores: ['server/db/migrations/**', 'tests/artifacts/**'],
}, {
  rules: {
    'vue/multi-word-component-names': 'off',
  },
}, {
  // App and server code reach shared code through `#shared/…`, never by climbing out of their folder.
  files: ['pages/**', 'components/**', 'composables/**', 'stores/**', 'layouts/**', 'middleware/**', 'plugins/**', 'server/**', 'app.vue'],
  rules: {
    'no-restricted-imports': ['error', {
      patterns: [{
        regex: '^(\\.\\./)+(shared|server|pages|components|composables|stores|layouts|middleware)(/|$)',
        message: 'Import shared code as #shared/…; app code does not import server code, and no folder climbs into another.',
      }],
    }],
  },
})
