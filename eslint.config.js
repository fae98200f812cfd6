// @ts-check
// Lints TypeScript and React, and enforces the layers described in DEVELOPERS.md: a forbidden
// import fails `npm test`, so the boundaries hold without anyone having to remember them.
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import jsxA11y from 'eslint-plugin-jsx-a11y';
import globals from 'globals';

/** Import patterns that resolve into a folder of src/, by alias or by relative path. */
const into = (...folders) => folders.flatMap((f) => [`~/${f}`, `~/${f}/**`, `**/${f}/**`]);

const restrict = (message, patterns, packages = []) => ({
  'no-restricted-imports': [
    'error',
    {
      patterns: [
        ...(patterns.length ? [{ group: patterns, message }] : []),
        // Deep relative imports hide where a module lives; "~/" names it.
        { group: ['../../*'], message: 'Use the ~/ alias instead of ../../ imports.' },
      ],
      ...(packages.length ? { paths: packages.map((name) => ({ name, message })) } : {}),
    },
  ],
});

export default tseslint.config(
  { ignores: ['dist/**', 'dist-*/**', '.astro/**', 'node_modules/**', 'data/**', 'uploads/**', 'public/**', 'tests/.tmp/**', 'backups/**'] },
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx,mjs,js}'],
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      ...restrict('', []),
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks, 'jsx-a11y': jsxA11y },
    rules: {
      ...reactHooks.configs.recommended.rules,
      ...jsxA11y.flatConfigs.recommended.rules,
      // autoFocus appears only where a person's own action opened a dialog or a form; moving
      // focus into it is what the WAI-ARIA dialog pattern asks for.
      'jsx-a11y/no-autofocus': 'off',
      // A scrolling region must take focus so a keyboard can scroll it (WCAG 2.1.1; axe's
      // scrollable-region-focusable); it is named by aria-label and has role="region".
      'jsx-a11y/no-noninteractive-tabindex': ['error', { roles: ['tabpanel', 'region'] }],
    },
  },
  { files: ['src/env.d.ts'], rules: { '@typescript-eslint/triple-slash-reference': 'off', '@typescript-eslint/consistent-type-imports': 'off' } },
  {
    files: ['src/lib/**/*.ts'],
    ignores: ['src/lib/**/*.test.ts'],
    rules: restrict(
      'src/lib is pure TypeScript: no framework, database or server imports (DEVELOPERS.md).',
      [...into('server', 'db', 'components', 'pages', 'layouts'), 'astro', 'astro:*', 'astro/*', 'react', 'react-dom', 'react/*', 'drizzle-orm', 'drizzle-orm/*', '@libsql/*'],
    ),
  },
  {
    files: ['src/db/**/*.ts'],
    rules: restrict('src/db holds the schema and client; it may not reach into src/server or the UI.', into('server', 'components', 'pages', 'layouts')),
  },
  {
    files: ['src/components/**/*.{ts,tsx}'],
    ignores: ['src/components/**/*.test.ts'],
    rules: restrict('Components talk to the server over HTTP (~/components/api), never to src/server or src/db.', [...into('server', 'db'), 'drizzle-orm', 'drizzle-orm/*', '@libsql/*']),
  },
);
