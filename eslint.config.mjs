import withNuxt from './.nuxt/eslint.config.mjs'

export default withNuxt({
  // AssemblyScript (decorators on declarations, i32/f64 types): compiled by npm run build:kernels, not linted as TypeScript
  ignores: ['scripts/kernels/**']
}, {
  rules: {
    'vue/multi-word-component-names': 'off',
    'vue/max-attributes-per-line': 'off'
  }
})
