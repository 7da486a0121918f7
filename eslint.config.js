// Lint: TypeScript rules plus the import directions of DEVELOPERS.md.
import { readdirSync } from 'node:fs';
import tseslint from 'typescript-eslint';

const features = readdirSync(new URL('./apps/web/src/features', import.meta.url), { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => d.name);

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
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['@splitcase/calc', '**/packages/calc/**'], message: 'The client never computes figures: ask the API.' },
            { group: ['**/apps/api/**', 'express', '@mikro-orm/*'], message: 'The web app talks to the API over HTTP only.' },
          ],
        },
      ],
    },
  },
  // Features do not import each other; a route module (apps/web/src/app/routes) is where two features meet.
  ...features.map((f) => ({
    files: [`apps/web/src/features/${f}/**/*.{ts,tsx}`],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['@splitcase/calc'], message: 'The client never computes figures: ask the API.' },
            { group: ['@/features/*', `!@/features/${f}`, `!@/features/${f}/**`], message: `Feature "${f}" must not import another feature; compose them in a route module.` },
          ],
        },
      ],
    },
  })),
);
