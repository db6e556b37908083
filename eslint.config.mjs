import nextVitals from 'eslint-config-next/core-web-vitals';
import nextTs from 'eslint-config-next/typescript';

const serverOnly = {
  patterns: [{ group: ['@/lib/server/*', '**/lib/server/*'], message: 'Browser code must not import lib/server (server-only).' }],
};

// In the browser zod must be configured before its first schema is built (lib/shared/zod.ts: the CSP).
const zodThroughShared = {
  paths: [{ name: 'zod', allowTypeImports: true, message: "Import z from '@/lib/shared/zod' (it keeps zod from probing eval under the CSP)." }],
};

const config = [
  ...nextVitals,
  ...nextTs,
  { ignores: ['.next/**', '.data/**', 'public/sw.js', 'node_modules/**', 'next-env.d.ts', 'test-results/**'] },
  {
    // The phone runs these: they must never pull in server code.
    files: ['components/**/*.{ts,tsx}', 'lib/client/**/*.{ts,tsx}', 'lib/engine/**/*.ts', 'lib/shared/**/*.ts', 'worker/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { ...serverOnly, ...zodThroughShared }] },
  },
  {
    files: ['app/**/*.{ts,tsx}'],
    ignores: ['app/api/**'],
    rules: { 'no-restricted-imports': ['error', zodThroughShared] },
  },
  { files: ['lib/shared/zod.ts'], rules: { 'no-restricted-imports': 'off' } },
  {
    rules: {
      '@typescript-eslint/no-explicit-any': 'error',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
    },
  },
];

export default config;
