// Lint: TypeScript rules plus the import directions of DEVELOPERS.md.
import { readdirSync } from 'node:fs';
import tseslint from 'typescript-eslint';

const features = readdirSync(new URL('./apps/web/src/features', import.meta.url), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => d.name);

const webImportPatterns = [
  { group: ['@splitcase/calc', '**/packages/calc/**'], message: 'The client never computes figures: ask the API.' },
  { group: ['**/apps/api/**', 'express', '@mikro-orm/*'], message: 'The web app talks to the API over HTTP only.' },
];
const otherFeature = (f) => `Feature "${f}" must not import another feature; compose them in a route module.`;
// Where a query key is written: a queryKey property, the key of setQueryData/getQueryData, a const named …Key or …Scope (or what its arrow returns).
const keyHolders = [
  'Property[key.name="queryKey"]',
  'CallExpression[callee.property.name=/^(get|set)Quer(y|ies)Data$/]',
  'VariableDeclarator[id.name=/(Key|Scope)$/]',
  'VariableDeclarator[id.name=/(Key|Scope)$/] > ArrowFunctionExpression',
];

const noOrmOrFrameworks = ['react', 'react-dom', 'react-router', 'express', '@mikro-orm/*', 'node:*', 'fs', 'path'];

export default tseslint.config(
  { ignores: ['**/dist/**', '**/node_modules/**', 'coverage/**', 'data/**', 'uploads/**', 'apps/api/migrations/**'] },
  ...tseslint.configs.recommended,
  {
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/no-explicit-any': 'error',
    },
  },
  {
    files: ['packages/calc/**/*.ts'],
    ignores: ['packages/calc/**/*.test.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['@splitcase/*', ...noOrmOrFrameworks], message: 'packages/calc is pure: no I/O, no frameworks, nothing of ours.' }] }],
    },
  },
  {
    files: ['packages/contracts/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['@splitcase/*', ...noOrmOrFrameworks], message: 'packages/contracts depends on nothing of ours.' }] }],
    },
  },
  {
    files: ['apps/api/**/*.ts'],
    rules: {
      'no-restricted-imports': ['error', { patterns: [{ group: ['**/apps/web/**', 'react', 'react-dom'], message: 'The API does not import the web app.' }] }],
    },
  },
  {
    files: ['apps/web/**/*.{ts,tsx}'],
    rules: { 'no-restricted-imports': ['error', { patterns: webImportPatterns }] },
  },
  // Features do not import each other, by alias or by a relative path; a route module
  // (apps/web/src/app/routes) is where two features meet. ESLint matches the import text, not the
  // file it resolves to, so each folder depth of a feature gets its own rule: from a file n folders
  // deep in the feature, n × "../" leaves it (tests/lint/web-rules.test.ts checks both forms).
  ...features.flatMap((f) =>
    [1, 2, 3, 4, 5].map((depth) => ({
      files: [`apps/web/src/features/${f}/${'*/'.repeat(depth - 1)}*.{ts,tsx}`],
      rules: {
        'no-restricted-imports': [
          'error',
          {
            patterns: [
              ...webImportPatterns,
              { group: ['@/features/*', `!@/features/${f}`, `!@/features/${f}/**`], message: otherFeature(f) },
              { regex: `^(\\./)?(\\.\\./){${depth}}(?!${f}(/|$)|\\.\\./)`, message: otherFeature(f) },
              { regex: `^(\\./)?(\\.\\./){${depth + 1},}(.*/)?features/(?!${f}(/|$))`, message: otherFeature(f) },
            ],
          },
        ],
      },
    })),
  ),
  // Query keys: every root comes from rootKeys in lib/query-keys.ts; a key written with a literal
  // first element anywhere else is refused.
  {
    files: ['apps/web/src/**/*.{ts,tsx}'],
    ignores: ['apps/web/src/lib/query-keys.ts'],
    rules: {
      'no-restricted-syntax': [
        'error',
        ...keyHolders.flatMap((holder) =>
          ['', ':matches(TSAsExpression, TSSatisfiesExpression) > '].map((cast) => ({
            selector: `${holder} > ${cast}ArrayExpression > :matches(Literal, TemplateLiteral):first-child`,
            message: 'A query key starts from rootKeys (lib/query-keys.ts), e.g. [...rootKeys.devices, "list"], never from a literal.',
          })),
        ),
      ],
    },
  },
);
