import withNuxt from './.nuxt/eslint.config.mjs'

export default withNuxt({
  ignores: ['server/db/migrations/**', 'tests/artifacts/**'],
}, {
  rules: {
    'vue/multi-word-component-names': 'off',
  },
})
