import drizzle from 'eslint-plugin-drizzle';
import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';
import tseslint from 'typescript-eslint';

const productFeatures = [
  'accounts',
  'jobs',
  'mailbox',
  'plans',
  'practice',
  'reports',
  'review',
  'runner',
  'settings',
  'specs',
  'tool-crib',
];
// Shared by every feature: the engine and the UI primitives.
const shared = ['torque-plan', 'ui', 'bolt-circle'];

// One deliberate, one-way exception: practice runs the runner itself (its events, reducer and
// screens), so apprentices learn on the very code technicians use. The runner never imports practice.
const builtOn = { practice: ['runner'] };

const featureIslands = productFeatures.map((name) => ({
  target: `./features/${name}`,
  from: './features',
  except: [
    `./${name}`,
    ...shared.map((s) => `./${s}`),
    ...(builtOn[name] ?? []).map((s) => `./${s}`),
  ],
  message: 'Product features do not import each other; they meet in app/.',
}));

const config = [
  {
    ignores: [
      '.next/**',
      '.next-e2e/**',
      '.next-bench/**',
      'node_modules/**',
      '.data/**',
      'next-env.d.ts',
      'db/migrations/**',
      'test-results/**',
      'playwright-report/**',
    ],
  },
  ...nextVitals,
  ...nextTs,
  {
    files: ['**/*.ts', '**/*.tsx'],
    languageOptions: {
      parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname },
    },
    plugins: { drizzle, '@typescript-eslint': tseslint.plugin },
    rules: {
      '@typescript-eslint/no-floating-promises': 'error',
      '@typescript-eslint/no-misused-promises': [
        'error',
        { checksVoidReturn: { attributes: false } },
      ],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      // Import cycles are found by madge in `npm run lint` (.madgerc): this rule walked the whole
      // import graph again for every file and took three quarters of the lint step's time.
      'drizzle/enforce-delete-with-where': [
        'error',
        { drizzleObjectName: ['db', 'tx', 'getDb()'] },
      ],
      'drizzle/enforce-update-with-where': [
        'error',
        { drizzleObjectName: ['db', 'tx', 'getDb()'] },
      ],
      'import/no-restricted-paths': [
        'error',
        {
          zones: [
            ...featureIslands,
            { target: './features', from: './app', message: 'features must not import app/.' },
            { target: './server', from: './app', message: 'server must not import app/.' },
            { target: './db', from: './app', message: 'db must not import app/.' },
            {
              target: './server',
              from: './features',
              message: 'server must not import features/.',
            },
            // The one exception: the demo seed's self-check runs the engine, which is pure (no I/O,
            // no React), so the seed can prove every demo job can be finished before it commits.
            {
              target: './db',
              from: './features',
              except: ['./torque-plan'],
              message: 'db must not import features/.',
            },
            {
              target: './db/!(seed-check).ts',
              from: './features/torque-plan',
              message: 'Only the demo seed self-check (db/seed-check.ts) runs the engine.',
            },
            {
              target: './db/*/**',
              from: './features/torque-plan',
              message: 'Only the demo seed self-check (db/seed-check.ts) runs the engine.',
            },
            {
              target: './features/torque-plan',
              from: './server',
              message: 'The engine is pure: no server code.',
            },
            {
              target: './features/torque-plan',
              from: './db',
              message: 'The engine is pure: no database.',
            },
          ],
        },
      ],
    },
  },
];
export default config;
