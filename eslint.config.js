// The lint keeps the layers of DEVELOPERS.md ("Layout" and "Layers"): which folder may import
// which, and no import cycles. `npm run lint`; `npm test` runs it before the tests.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import { importX } from 'eslint-plugin-import-x';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';

/** A zone: files under `target` may not import from `from` (except `except`, relative to `from`). */
const zone = (target, from, message, except) => ({ target, from, message, ...(except ? { except } : {}) });

const layers = [
  // shared/ is pure and used by both sides.
  zone('./shared', './server', 'shared/ imports nothing from server/.'),
  zone('./shared', './src', 'shared/ imports nothing from src/.'),
  zone('./shared', './seed', 'shared/ imports nothing from seed/.'),
  // The client never imports the server (or the demo data).
  zone('./src', './server', 'The client never imports the server: share through shared/.'),
  zone('./src', './seed', 'The client never imports the demo data.'),
  // seed/ sits above the server: only the process entry (server/index.ts) hands its loader to boot().
  zone(['./server/!(index).ts', './server/*/**'], './seed', 'seed/ sits above the server: pass the demo-data loader in from the entry (server/index.ts) or a script.'),
  // Models know nothing above them.
  zone('./server/models', ['./server/commands', './server/queries', './server/presenters', './server/routes', './server/middleware'], 'Models know no commands, queries, presenters, routes or middleware.'),
  // Queries return data; routes present it.
  zone('./server/queries', ['./server/presenters', './server/routes', './server/commands', './server/middleware'], 'Queries return data: routes present it (and queries call no commands, routes or middleware).'),
  // Commands know no HTTP layer.
  zone('./server/commands', ['./server/routes', './server/middleware', './server/presenters'], 'Commands know no routes, middleware or presenters.'),
  // Middleware knows no commands or queries (the one cache helper, kept-until, is not a query of data).
  zone('./server/middleware', ['./server/commands', './server/queries', './server/routes'], 'Middleware knows no commands, queries or routes.', ['./kept-until.ts']),
  // Presenters shape what leaves the server from what they are given.
  zone('./server/presenters', ['./server/commands', './server/queries', './server/routes', './server/middleware'], 'Presenters shape what they are given: they call no commands, queries, routes or middleware.'),
];

export default tseslint.config(
  { ignores: ['dist/**', 'dist-server/**', 'node_modules/**', 'public/**', 'coverage/**', '**/*.js', '**/*.mjs'] },
  {
    files: ['**/*.{ts,tsx}'],
    extends: [js.configs.recommended, ...tseslint.configs.recommended],
    plugins: { 'import-x': importX },
    languageOptions: { parserOptions: { ecmaVersion: 'latest', sourceType: 'module' } },
    settings: {
      'import-x/parsers': { '@typescript-eslint/parser': ['.ts', '.tsx'] },
      'import-x/extensions': ['.ts', '.tsx', '.js'],
      'import-x/resolver-next': [createTypeScriptImportResolver({ project: './tsconfig.json' })],
    },
    rules: {
      'import-x/no-restricted-paths': ['error', { basePath: import.meta.dirname, zones: layers }],
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      // The rules below are the recommended sets' own; these few are relaxed where the code's
      // habits differ on purpose (non-null assertions after checks, `_`-prefixed unused names).
      '@typescript-eslint/no-non-null-assertion': 'off',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', destructuredArrayIgnorePattern: '^_', caughtErrors: 'none' }],
      'no-empty': ['error', { allowEmptyCatch: true }],
      '@typescript-eslint/no-unused-expressions': ['error', { allowTernary: true, allowShortCircuit: true }],
      // Validated input is typed by its schema through route() (server/middleware/validate.ts):
      // a cast of it would let the types drift from the schemas again.
      'no-restricted-syntax': [
        'error',
        {
          selector: ':matches(TSAsExpression, TSTypeAssertion, TSSatisfiesExpression) > MemberExpression.expression[object.property.name="valid"]',
          message: 'Read validated input through route({ params, query, body }, handler): req.valid is typed by the schemas; do not cast it.',
        },
        {
          selector: ':matches(TSAsExpression, TSTypeAssertion) > MemberExpression.expression[property.name="valid"]',
          message: 'Read validated input through route({ params, query, body }, handler): req.valid is typed by the schemas; do not cast it.',
        },
      ],
    },
  },
  {
    // Routes are thin: auth → validate → can() → command or query → presenter. They name model
    // types (req.user as User) but call no model; the change events a kept answer follows are fine.
    files: ['server/routes/**/*.ts'],
    rules: {
      '@typescript-eslint/no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              regex: '(^|/)models(/(?!write-events$)[^/]+)?$',
              allowTypeImports: true,
              message: 'Routes call a command or query, not a model (type imports are fine).',
            },
          ],
        },
      ],
    },
  },
);
