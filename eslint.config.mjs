// Lint rules for the whole workspace, including the layer rules of the architecture:
//   contracts imports nothing of ours;
//   web and roster-model import only contracts;
//   api imports contracts and roster-model.
// Relative imports that climb out of a project into another are forbidden everywhere,
// so the path aliases (and therefore these rules) cannot be bypassed.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';

const crossProjectRelative = {
  group: ['**/apps/**', '**/libs/**', '../../../*'],
  message: 'Import other projects through their @rotaplex/* alias, never by relative path.',
};

/** @param {string[]} allowed aliases this layer may import */
function layer(allowed, extraGroups = []) {
  return {
    'no-restricted-imports': [
      'error',
      {
        patterns: [
          {
            group: ['@rotaplex/*', ...allowed.map((a) => `!@rotaplex/${a}`)],
            message: `This layer may import only: ${allowed.length ? allowed.join(', ') : 'nothing of ours'} (see STYLE layers in DEVELOPERS.md).`,
          },
          crossProjectRelative,
          ...extraGroups,
        ],
      },
    ],
  };
}

const noServerCode = {
  group: ['@nestjs/*', 'typeorm', 'better-sqlite3', 'express'],
  message: 'Server frameworks belong in apps/api only.',
};
const noBrowserCode = {
  group: ['react', 'react-dom', 'react/*', '@fluentui/*', '@tanstack/*'],
  message: 'Browser code belongs in apps/web only.',
};

export default tseslint.config(
  {
    ignores: ['**/node_modules/**', '**/dist/**', '**/tmp/**', '**/coverage/**', '.nx/**', '**/*.d.ts'],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      '@typescript-eslint/consistent-type-imports': [
        'error',
        { fixStyle: 'inline-type-imports', disallowTypeAnnotations: false },
      ],
    },
  },
  {
    files: ['**/*.js', '**/*.cjs'],
    rules: { '@typescript-eslint/no-require-imports': 'off' },
  },
  {
    files: ['libs/contracts/**/*.ts'],
    rules: layer([], [noServerCode, noBrowserCode]),
  },
  {
    files: ['libs/roster-model/**/*.ts'],
    rules: layer(['contracts'], [noServerCode, noBrowserCode]),
  },
  {
    files: ['apps/web/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: {
      ...layer(['contracts'], [noServerCode]),
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
    },
  },
  {
    files: ['apps/api/**/*.ts'],
    rules: {
      ...layer(['contracts', 'roster-model'], [noBrowserCode]),
      // NestJS injects constructor parameters by their runtime type: type-only imports break it.
      '@typescript-eslint/consistent-type-imports': 'off',
    },
  },
  {
    files: ['apps/web-e2e/**/*.ts'],
    rules: layer(['contracts']),
  },
);
