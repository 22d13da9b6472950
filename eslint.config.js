// The lint gate `npm test` runs first (scripts/test.mjs): TypeScript's recommended rules, the React hooks
// rules, and the borders between the parts of the code, so the layering in docs/architecture.md is
// checked rather than hoped for. Zero warnings: anything worth saying is an error.
import { readdirSync } from 'node:fs';
import js from '@eslint/js';
import { createTypeScriptImportResolver } from 'eslint-import-resolver-typescript';
import { importX } from 'eslint-plugin-import-x';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

const features = readdirSync('src/features', { withFileTypes: true })
  .filter((entry) => entry.isDirectory())
  .map((entry) => entry.name);

/**
 * Globals that exist only in a browser or only in Node, which the pure engine must not touch (those
 * both hosts have, such as URLSearchParams, are fine).
 */
const hostGlobals = [...new Set([...Object.keys(globals.browser), ...Object.keys(globals.node)])]
  .filter((name) => !(name in globals.es2024) && !(name in globals.browser && name in globals.node))
  .sort();

/** A server layer may import those below it, never one above it. */
function neverUp(target, above, why) {
  return { target: `./server/${target}`, from: above.map((layer) => `./server/${layer}`), message: why };
}

export default tseslint.config(
  { ignores: ['dist/', 'node_modules/', '.data/', 'tests/.results/', 'tests/e2e/artifacts/'] },
  js.configs.recommended,
  tseslint.configs.recommended,
  importX.flatConfigs.typescript,
  {
    languageOptions: {
      ecmaVersion: 2024,
      sourceType: 'module',
      globals: { ...globals.browser, ...globals.node },
    },
    settings: {
      'import-x/resolver-next': [createTypeScriptImportResolver({ project: './tsconfig.json' })],
    },
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      // TypeScript already reports unknown names, with the right globals per file.
      'no-undef': 'off',
      // `let { a, b } = …` where only one is reassigned stays one statement.
      'prefer-const': ['error', { destructuring: 'all' }],
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      'import-x/no-cycle': ['error', { ignoreExternal: true }],
      'import-x/no-self-import': 'error',
      'import-x/no-useless-path-segments': 'error',
      'import-x/no-restricted-paths': ['error', {
        zones: [
          {
            target: './shared',
            from: ['./src', './server', './tests', './scripts'],
            message: 'shared/ is the pure engine both hosts use: it imports nothing from the client or the server.',
          },
          {
            target: './src',
            from: ['./server', './tests', './scripts'],
            message: 'The client talks to the server over HTTP only; share types and schemas through shared/api.',
          },
          {
            target: './server',
            from: ['./src', './tests', './scripts'],
            message: 'The server does not import the client; share code through shared/.',
          },
          {
            target: ['./src/components', './src/lib', './src/types'],
            from: ['./src/features', './src/app'],
            message: 'The common client parts sit below the features and the app, never the other way.',
          },
          {
            target: './src/features',
            from: './src/app',
            message: 'A feature does not import the app shell; the app imports features.',
          },
          // A feature reaches another only through that feature's public index.
          ...features.map((feature) => ({
            target: `./src/features/!(${feature})/**/*`,
            from: `./src/features/${feature}`,
            except: ['./index.ts'],
            message: `Import the ${feature} feature through its index (src/features/${feature}/index.ts).`,
          })),
          // Server layers: routes → controllers → services → models, never back up. The shared HTTP
          // vocabulary (errors, handler context) lives in server/http, which every layer may use.
          neverUp('http', ['routes', 'controllers', 'services', 'models', 'middleware', 'print', 'mail', 'storage', 'db'],
            'server/http is the neutral vocabulary every layer shares; it depends on no layer.'),
          neverUp('controllers', ['routes'], 'A controller is called by a route; it does not import routes.'),
          neverUp('middleware', ['routes', 'controllers'], 'Middleware runs for routes; it does not import them or their controllers.'),
          neverUp('services', ['routes', 'controllers', 'middleware'],
            'A service knows nothing of HTTP routing: throw the errors from server/http instead.'),
          neverUp('models', ['routes', 'controllers', 'middleware', 'services', 'print', 'mail'],
            'A model is the bottom layer: it imports no route, controller, middleware or service.'),
          ...['print', 'mail', 'storage'].map((helper) =>
            neverUp(helper, ['routes', 'controllers', 'middleware', 'services'],
              `server/${helper} is a helper the services call; it does not import them.`)),
        ],
      }],
    },
  },
  {
    files: ['shared/**/*.ts'],
    rules: {
      'import-x/no-nodejs-modules': 'error',
      'no-restricted-imports': ['error', {
        patterns: [{
          regex: '^(?!\\.|zod$)',
          message: 'shared/ imports only its own files and zod: no DOM, React, canvas or Node module.',
        }],
      }],
      'no-restricted-globals': ['error', ...hostGlobals.map((name) => ({
        name,
        message: 'shared/ runs in the browser and on the server alike: no DOM or Node global here.',
      }))],
    },
  },
  {
    files: ['src/**/*.{ts,tsx}', 'tests/web/**/*.{ts,tsx}'],
    ...reactHooks.configs.flat['recommended-latest'],
  },
  {
    // Tests read JSON bodies and fake messages as loosely as supertest types them.
    files: ['tests/**/*.{ts,tsx}'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
);
