// Flat config for the whole workspace. Module boundaries are enforced on three tag axes
// (scope, type, platform); see DEVELOPERS.md for what each tag means.
import nx from '@nx/eslint-plugin';
import tseslint from 'typescript-eslint';
import angular from 'angular-eslint';

const nodeOnly = [
  'kysely',
  'pg',
  'express',
  'bullmq',
  'ioredis',
  'minio',
  'nodemailer',
  'pino',
  'stripe',
];

/**
 * Module-boundary rules. Test files and test configs may also use the test-only packages
 * (runners and reference libraries) that domain code itself must never import.
 */
function boundaries({ tests }) {
  const domainExternals = tests
    ? [
        'decimal.js',
        'vitest',
        'vitest/*',
        'fast-check',
        'polygon-clipping',
        '@flatten-js/core',
        'simple-statistics',
      ]
    : ['decimal.js'];
  const neutralBanned = tests ? nodeOnly : [...nodeOnly, 'node:*'];
  return [
    'error',
    {
      enforceBuildableLibDependency: true,
      allow: [],
      depConstraints: [
        // scope: a domain's libraries use their own scope and shared only
        { sourceTag: 'scope:shared', onlyDependOnLibsWithTags: ['scope:shared'] },
        { sourceTag: 'scope:takeoff', onlyDependOnLibsWithTags: ['scope:takeoff', 'scope:shared'] },
        {
          sourceTag: 'scope:identity',
          onlyDependOnLibsWithTags: ['scope:identity', 'scope:shared'],
        },
        // Stock reserves and issues for jobs and estimates from their takeoffs; jobs save takeoffs.
        {
          sourceTag: 'scope:stock',
          onlyDependOnLibsWithTags: ['scope:stock', 'scope:jobs', 'scope:takeoff', 'scope:shared'],
        },
        {
          sourceTag: 'scope:jobs',
          onlyDependOnLibsWithTags: ['scope:jobs', 'scope:takeoff', 'scope:shared'],
        },
        // type: layers depend downwards only
        {
          sourceTag: 'type:app',
          onlyDependOnLibsWithTags: [
            'type:feature',
            'type:ui',
            'type:data-access',
            'type:server',
            'type:db',
            'type:contracts',
            'type:domain',
            'type:util',
          ],
        },
        {
          sourceTag: 'type:feature',
          onlyDependOnLibsWithTags: [
            'type:feature',
            'type:ui',
            'type:data-access',
            'type:contracts',
            'type:domain',
            'type:util',
          ],
        },
        {
          sourceTag: 'type:ui',
          onlyDependOnLibsWithTags: ['type:ui', 'type:contracts', 'type:domain', 'type:util'],
        },
        {
          sourceTag: 'type:data-access',
          onlyDependOnLibsWithTags: [
            'type:data-access',
            'type:contracts',
            'type:domain',
            'type:util',
          ],
        },
        {
          sourceTag: 'type:server',
          onlyDependOnLibsWithTags: [
            'type:server',
            'type:db',
            'type:contracts',
            'type:domain',
            'type:util',
          ],
        },
        { sourceTag: 'type:db', onlyDependOnLibsWithTags: ['type:db', 'type:util'] },
        {
          sourceTag: 'type:contracts',
          onlyDependOnLibsWithTags: ['type:contracts', 'type:domain', 'type:util'],
        },
        {
          sourceTag: 'type:domain',
          onlyDependOnLibsWithTags: ['type:domain', 'type:util'],
          allowedExternalImports: domainExternals,
        },
        { sourceTag: 'type:util', onlyDependOnLibsWithTags: ['type:util'] },
        // platform: browser code never reaches server packages; neutral code neither side's
        {
          sourceTag: 'platform:web',
          onlyDependOnLibsWithTags: ['platform:web', 'platform:neutral'],
          bannedExternalImports: nodeOnly,
        },
        {
          sourceTag: 'platform:node',
          onlyDependOnLibsWithTags: ['platform:node', 'platform:neutral'],
          bannedExternalImports: ['@angular/*'],
        },
        {
          sourceTag: 'platform:neutral',
          onlyDependOnLibsWithTags: ['platform:neutral'],
          bannedExternalImports: [...neutralBanned, '@angular/*'],
        },
      ],
    },
  ];
}

const testFiles = ['**/*.test.ts', '**/*.spec.ts', '**/vitest.config.ts'];

export default tseslint.config(
  {
    ignores: [
      '**/node_modules',
      '**/dist',
      '**/tmp',
      '**/.angular',
      '**/.nx',
      '.local',
      'tests/output',
    ],
  },
  ...nx.configs['flat/base'],
  ...nx.configs['flat/typescript'],
  ...nx.configs['flat/javascript'],
  {
    files: ['**/*.ts', '**/*.mjs', '**/*.js'],
    rules: {
      '@nx/enforce-module-boundaries': boundaries({ tests: false }),
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_' },
      ],
    },
  },
  {
    files: testFiles,
    rules: { '@nx/enforce-module-boundaries': boundaries({ tests: true }) },
  },
  {
    // Cross-app tests and the start/test scripts drive the apps from outside: they may reach
    // any project's files. Nothing in a project may import them.
    files: ['tests/**', 'docker-free-dev/*.mjs'],
    rules: { '@nx/enforce-module-boundaries': 'off' },
  },
  {
    // Migrations take Kysely<any> so they never change when the Database type does.
    files: ['migrations/**'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    files: ['apps/web/**/*.ts'],
    extends: [...angular.configs.tsRecommended],
    processor: angular.processInlineTemplates,
    rules: {
      '@angular-eslint/directive-selector': [
        'error',
        { type: 'attribute', prefix: 'lw', style: 'camelCase' },
      ],
      '@angular-eslint/component-selector': [
        'error',
        { type: 'element', prefix: 'lw', style: 'kebab-case' },
      ],
    },
  },
  {
    files: ['apps/web/**/*.html'],
    extends: [...angular.configs.templateRecommended, ...angular.configs.templateAccessibility],
  },
);
