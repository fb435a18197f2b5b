// Lint for TypeScript and Vue files. Kept small: the typecheck catches type errors.
import tseslint from 'typescript-eslint'
import vue from 'eslint-plugin-vue'
import vueParser from 'vue-eslint-parser'

export default tseslint.config(
  { ignores: ['.nuxt/**', '.nuxt-*/**', '.output/**', '.output-*/**', 'node_modules/**', '.data/**', 'test-results/**', 'tests/screenshots/**', 'drizzle/**', 'coverage/**'] },
  ...tseslint.configs.recommended,
  ...vue.configs['flat/recommended'],
  {
    files: ['**/*.vue'],
    languageOptions: { parser: vueParser, parserOptions: { parser: tseslint.parser, sourceType: 'module' } },
  },
  {
    rules: {
      '@typescript-eslint/no-explicit-any': 'off',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      'vue/multi-word-component-names': 'off',
      'vue/max-attributes-per-line': 'off',
      'vue/singleline-html-element-content-newline': 'off',
      'vue/html-self-closing': 'off',
      'vue/first-attribute-linebreak': 'off',
      'vue/html-closing-bracket-newline': 'off',
      'vue/multiline-html-element-content-newline': 'off',
      'vue/html-indent': 'off',
      'vue/attributes-order': 'off',
      'vue/require-default-prop': 'off',
      'no-restricted-imports': ['error', { patterns: [{ group: ['vue', 'h3', 'nitropack*', 'drizzle-orm*', 'postgres', 'konva', '#imports'], message: 'shared/ is pure TypeScript: no Vue, Nitro, database or canvas imports.' }] }],
    },
  },
  {
    // only shared/ is restricted
    files: ['app/**', 'server/**', 'tests/**', 'scripts/**', 'bench/**', '*.ts', '*.js'],
    rules: { 'no-restricted-imports': 'off' },
  },
)
