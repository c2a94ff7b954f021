// The house rules (DEVELOPERS.md, "Layers" and "Lint"): typescript-eslint with types, the rules of
// hooks, no import cycles, and the layering routes → features → db as an import-boundary rule.
// Formatting is Prettier's alone (eslint-config-prettier last).
import path from "node:path";
import { fileURLToPath } from "node:url";
import js from "@eslint/js";
import prettier from "eslint-config-prettier";
import boundaries from "eslint-plugin-boundaries";
import { createNodeResolver, importX } from "eslint-plugin-import-x";
import reactHooks from "eslint-plugin-react-hooks";
import { defineConfig, globalIgnores } from "eslint/config";
import globals from "globals";
import tseslint from "typescript-eslint";
import { featureCycles } from "./scripts/lint/feature-cycles.js";

const root = path.dirname(fileURLToPath(import.meta.url));
// The resolver both plugins use: TypeScript's own rules, from tsconfig.json ("~/…" is app/).
const resolverFile = path.join(root, "scripts/lint/resolver.cjs");
const resolver = (await import(resolverFile)).default;
const house = {
  rules: {
    "no-feature-cycle": featureCycles({
      appDir: path.join(root, "app"),
      resolve: (source, file) => resolver.resolve(source, file).path ?? null,
    }),
  },
};

// What each layer may import (anything not listed is refused). Packages from node_modules are not checked.
const LAYERS = {
  // root.tsx, routes.ts, entry.server.tsx, security.server.ts: the shell React Router starts from;
  // worker.server.ts: the worker's shell (scripts/worker.ts), which joins each queue to its feature's handler.
  entry: ["entry", "route", "component", "feature", "domain", "utils", "platform", "db"],
  route: ["component", "feature", "domain", "utils", "platform", "db"],
  // Components run in the browser too: no `db/`, no `*.server` module (checked below), no platform.
  component: ["component", "feature", "domain", "utils"],
  // Features may use one another, never in a circle (import-x/no-cycle).
  feature: ["feature", "domain", "utils", "platform", "db"],
  // config.server.ts and db.server.ts: read once, used by features and routes.
  platform: ["platform", "utils", "domain", "db"],
  utils: ["utils", "domain", "platform", "db"],
  // The trade's vocabulary: imports nothing of the app.
  domain: ["domain"],
  db: ["db", "domain"],
  // Migrations are frozen in time: they never import app or schema code.
  migration: [],
  // Scripts, tests, seeds and fakes drive the app from outside and may use any of it.
  tooling: ["entry", "route", "component", "feature", "domain", "utils", "platform", "db", "migration", "tooling"],
};

const FILE_LAYERS = new Set(["entry", "platform"]);
/** The boundaries selector of a layer: a folder (element) or a single file of app/ (file category). */
const layer = (name) => (FILE_LAYERS.has(name) ? { file: { categories: name } } : { element: { type: name } });

export default defineConfig(
  globalIgnores([
    "build/",
    ".react-router/",
    "node_modules/",
    ".data/",
    "test-results/",
    "public/",
    "fonts/",
    "**/*.d.ts.map",
  ]),
  js.configs.recommended,
  tseslint.configs.recommendedTypeChecked,
  {
    languageOptions: {
      parserOptions: { projectService: true, tsconfigRootDir: root },
      globals: { ...globals.node },
    },
    rules: {
      // A variable declared early so a callback can see it, assigned once later, stays `let`.
      "prefer-const": ["error", { ignoreReadBeforeAssign: true }],
      // `_name` marks a parameter or element kept for its position (a callback's signature, a tuple).
      "@typescript-eslint/no-unused-vars": [
        "error",
        {
          argsIgnorePattern: "^_",
          varsIgnorePattern: "^_",
          caughtErrorsIgnorePattern: "^_",
          destructuredArrayIgnorePattern: "^_",
          ignoreRestSiblings: true,
        },
      ],
      "@typescript-eslint/consistent-type-imports": ["error", { fixStyle: "inline-type-imports" }],
      // A route's loader and action may be async without awaiting (React Router awaits them);
      // event handlers may return promises (React ignores them; forms show their own errors).
      "@typescript-eslint/require-await": "off",
      "@typescript-eslint/no-misused-promises": ["error", { checksVoidReturn: { attributes: false } }],
      // React Router's way to end a loader or action early is to throw a Response or data(…).
      "@typescript-eslint/only-throw-error": [
        "error",
        {
          allow: [
            { from: "lib", name: "Response" },
            { from: "package", package: "react-router", name: "DataWithResponseInit" },
          ],
        },
      ],
      // Numbers and booleans read fine in messages and URLs.
      "@typescript-eslint/restrict-template-expressions": ["error", { allowNumber: true, allowBoolean: true }],
    },
  },
  {
    // Migrations take Kysely<any>: they are frozen in time and must not depend on today's schema types.
    files: ["migrations/**/*.ts"],
    rules: { "@typescript-eslint/no-explicit-any": "off" },
  },
  {
    // Tests read JSON bodies from the served app (typed `any` by fetch) and check their shape with
    // assertions; typing every body first would only restate the assertions.
    files: ["tests/**/*.ts"],
    rules: {
      "@typescript-eslint/no-unsafe-assignment": "off",
      "@typescript-eslint/no-unsafe-member-access": "off",
      "@typescript-eslint/no-unsafe-argument": "off",
      "@typescript-eslint/no-unsafe-call": "off",
      "@typescript-eslint/no-unsafe-return": "off",
    },
  },
  {
    files: ["**/*.{js,cjs,mjs}"],
    extends: [tseslint.configs.disableTypeChecked],
  },
  {
    files: ["**/*.cjs"],
    languageOptions: { sourceType: "commonjs" },
    rules: { "@typescript-eslint/no-require-imports": "off" },
  },
  {
    files: ["app/**/*.tsx"],
    extends: [reactHooks.configs.flat["recommended-latest"]],
    languageOptions: { globals: { ...globals.browser } },
    rules: {
      // Warns that the React Compiler would skip a component; the build does not use the compiler.
      "react-hooks/incompatible-library": "off",
      // A missing dependency is a stale value on screen: an error, like the other rules of hooks.
      "react-hooks/exhaustive-deps": "error",
    },
  },
  {
    files: ["app/**/*.{ts,tsx}", "db/**/*.ts", "migrations/**/*.ts"],
    plugins: { "import-x": importX, boundaries, bayproof: house },
    settings: {
      // import-x reads the imported files itself: with TypeScript's parser, or it sees no imports in them.
      "import-x/parsers": { "@typescript-eslint/parser": [".ts", ".tsx"] },
      "import-x/extensions": [".ts", ".tsx", ".js", ".cjs", ".mjs"],
      "import-x/resolver-next": [createNodeResolver(resolver.options)],
      "import/resolver": { [resolverFile]: {} },
      "boundaries/root-path": root,
      "boundaries/elements": [
        { type: "route", pattern: "app/routes", partialMatch: false },
        { type: "component", pattern: "app/components", partialMatch: false },
        { type: "domain", pattern: "app/domain", partialMatch: false },
        { type: "utils", pattern: "app/utils", partialMatch: false },
        // Every other folder of app/ is a feature: auth, reports, moderation, stats, feed, air, catalogue,
        // search, jobs, storage, bench, exposure… (the logic of one concern each).
        { type: "feature", pattern: "app/*", capture: ["feature"], partialMatch: false },
        { type: "db", pattern: "db", partialMatch: false },
        { type: "migration", pattern: "migrations", partialMatch: false },
        { type: "tooling", pattern: "{scripts,tests,seeds,fakes}", partialMatch: false },
      ],
      // Single files of app/ that form a layer of their own, and the server-only modules.
      "boundaries/files": [
        { category: "entry", pattern: "app/{root.tsx,routes.ts,entry.server.tsx,security.server.ts,worker.server.ts}" },
        { category: "platform", pattern: "app/{config,db}.server.ts" },
        { category: "server", pattern: "**/*.server.{ts,tsx}" },
      ],
    },
    rules: {
      "import-x/no-cycle": ["error", { ignoreExternal: true }],
      "import-x/no-self-import": "error",
      "bayproof/no-feature-cycle": "error",
      "import-x/no-duplicates": ["error", { "prefer-inline": true }],
      "boundaries/no-unknown-files": "error",
      "boundaries/dependencies": [
        "error",
        {
          default: "disallow",
          message:
            "{{from.element.type}}{{from.file.categories}} may not import {{to.element.type}}{{to.file.categories}} (DEVELOPERS.md, Layers)",
          policies: [
            ...Object.entries(LAYERS)
              .filter(([, to]) => to.length > 0)
              .map(([from, to]) => ({ from: layer(from), allow: { to: to.map(layer) } })),
            {
              // A type import is erased from the bundle; a value import would ship server code to the browser.
              from: { element: { type: "component" } },
              disallow: { to: { file: { categories: "server" } }, dependency: { kind: "value" } },
              message: "components run in the browser: no value from a *.server module (DEVELOPERS.md, Layers)",
            },
          ],
        },
      ],
    },
  },
  prettier,
);
