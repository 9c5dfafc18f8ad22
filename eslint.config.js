import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import { readdirSync } from 'node:fs';

/**
 * No imports between features: `<app>/src/features/a` may use `lib`, `components`, `hooks`, `config`
 * and its own files, never `features/b`. Shared code moves to `lib` (or `components`).
 */
function featureBoundaries(app) {
  const features = readdirSync(new URL(`./${app}/src/features`, import.meta.url), { withFileTypes: true })
    .filter((entry) => entry.isDirectory())
    .map((entry) => entry.name);
  const message = 'Features do not import each other: move what both need to lib (or components).';
  const otherFeature = (feature) => ({ regex: `^@/features/(?!${feature}(/|$))`, message });
  // A relative path may not climb out of its feature either (`../b/...` or `../../features/b/...`).
  const leaves = (depth) => ({
    regex: `^(\\.\\./){${depth}}`,
    message: `${message} Use '@/...' to leave it.`,
  });
  return features.flatMap((feature) => [
    {
      files: [`${app}/src/features/${feature}/*.{ts,tsx}`],
      rules: { 'no-restricted-imports': ['error', { patterns: [otherFeature(feature), leaves(1)] }] },
    },
    {
      files: [`${app}/src/features/${feature}/*/**/*.{ts,tsx}`],
      rules: { 'no-restricted-imports': ['error', { patterns: [otherFeature(feature), leaves(2)] }] },
    },
  ]);
}

export default tseslint.config(
  { ignores: ['**/dist/**', '**/node_modules/**', 'data/**', 'server/drizzle/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
  {
    files: ['board/src/**/*.{ts,tsx}', 'kiosk/src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    languageOptions: { globals: { ...globals.browser } },
    rules: reactHooks.configs.recommended.rules,
  },
  ...featureBoundaries('board'),
  ...featureBoundaries('kiosk'),
);
